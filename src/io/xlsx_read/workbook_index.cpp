/// @brief Package relationships -> workbook part -> sheets and shared strings.
#include "io/xlsx_read/workbook_index.hpp"

#include <algorithm>
#include <cctype>
#include <map>

#include "io/xlsx_read/xml_part.hpp"

namespace rotaweave::io::xlsx_read {
namespace {

constexpr size_t kSmallPart = 8u << 20;  // relationships and the workbook part are a few KiB

struct Relationship {
  std::string type;  ///< the last segment of the type URI: "officeDocument", "worksheet", ...
  std::string target;
};

/// Relationships of `sourcePart` (its _rels/NAME.rels part), by id; empty when there is none.
std::map<std::string, Relationship> readRelationships(ZipArchive& zip, const std::string& sourcePart) {
  const size_t slash = sourcePart.rfind('/');
  const std::string folder = slash == std::string::npos ? "" : sourcePart.substr(0, slash + 1);
  const std::string file = slash == std::string::npos ? sourcePart : sourcePart.substr(slash + 1);
  const std::string relsPart = folder + "_rels/" + file + ".rels";
  std::map<std::string, Relationship> out;
  if (!zip.has(relsPart)) return out;
  const std::string text = zip.read(relsPart, kSmallPart);
  XmlHandlers h;
  h.start = [&](std::string_view local, const XmlAttributes& a) {
    if (local != "Relationship") return;
    const char* id = a.get("Id");
    const char* type = a.get("Type");
    const char* target = a.get("Target");
    const char* mode = a.get("TargetMode");
    if (!id || !type || !target || (mode && std::string_view(mode) == "External")) return;
    std::string t = type;
    const size_t cut = t.rfind('/');
    if (cut != std::string::npos) t = t.substr(cut + 1);
    out[id] = Relationship{t, resolvePartName(sourcePart, target)};
  };
  parseXml(relsPart, text, h);
  return out;
}

bool sameIgnoringCase(const std::string& a, const std::string& b) {
  return a.size() == b.size() && std::equal(a.begin(), a.end(), b.begin(), [](char x, char y) {
           return std::tolower(static_cast<unsigned char>(x)) == std::tolower(static_cast<unsigned char>(y));
         });
}

}  // namespace

std::string resolvePartName(const std::string& sourcePart, const std::string& target) {
  std::string path;
  if (!target.empty() && target[0] == '/') {
    path = target.substr(1);
  } else {
    const size_t slash = sourcePart.rfind('/');
    path = (slash == std::string::npos ? "" : sourcePart.substr(0, slash + 1)) + target;
  }
  // Collapse "." and ".." segments.
  std::vector<std::string> parts;
  size_t at = 0;
  while (at <= path.size()) {
    const size_t next = std::min(path.find('/', at), path.size());
    const std::string seg = path.substr(at, next - at);
    if (seg == "..") {
      if (!parts.empty()) parts.pop_back();
    } else if (!seg.empty() && seg != ".") {
      parts.push_back(seg);
    }
    at = next + 1;
  }
  std::string out;
  for (const auto& p : parts) out += (out.empty() ? "" : "/") + p;
  return out;
}

const SheetEntry* WorkbookIndex::find(const std::string& name) const {
  for (const auto& s : sheets)
    if (sameIgnoringCase(s.name, name)) return &s;
  return nullptr;
}

WorkbookIndex readWorkbookIndex(ZipArchive& zip) {
  // The package names the workbook part; most writers use xl/workbook.xml, which is the fallback.
  std::string workbookPart;
  for (const auto& [id, rel] : readRelationships(zip, "")) {
    (void)id;
    if (rel.type == "officeDocument") workbookPart = rel.target;
  }
  if (workbookPart.empty()) workbookPart = "xl/workbook.xml";
  if (!zip.has(workbookPart))
    throw ZipError{"it holds no workbook part (" + workbookPart + "); it is a zip file but not an xlsx workbook"};
  const auto rels = readRelationships(zip, workbookPart);

  WorkbookIndex index;
  const std::string text = zip.read(workbookPart, kSmallPart);
  std::string missingSheet;
  XmlHandlers h;
  h.start = [&](std::string_view local, const XmlAttributes& a) {
    if (local == "workbookPr") {
      const char* d = a.get("date1904");
      index.date1904 = d && (std::string_view(d) == "1" || std::string_view(d) == "true");
    } else if (local == "sheet") {
      const char* name = a.get("name");
      const char* rid = a.get("id");
      if (!name || !rid) return;
      auto it = rels.find(rid);
      if (it == rels.end()) {
        if (missingSheet.empty()) missingSheet = name;
        return;
      }
      index.sheets.push_back(SheetEntry{name, it->second.target});
    }
  };
  parseXml(workbookPart, text, h);
  for (const auto& [id, rel] : rels) {
    (void)id;
    if (rel.type == "sharedStrings") index.sharedStrings = rel.target;
  }
  if (index.sheets.empty())
    throw ZipError{missingSheet.empty() ? "the workbook lists no sheets"
                                        : "the workbook lists the sheet '" + missingSheet + "' but not where it is stored"};
  return index;
}

}  // namespace rotaweave::io::xlsx_read

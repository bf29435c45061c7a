/// @brief The workbook: opening, the shared helpers, the sheets in order, atomic commit.
#include "io/xlsx_writer.hpp"

#include <cmath>
#include <cstdio>
#include <iostream>

#include "io/atomic_file.hpp"
#include "io/input_error.hpp"
#include "io/xlsx_sheets.hpp"

namespace rotaweave::io {
namespace xlsx {

void check(lxw_error err, const char* what) {
  if (err != LXW_NO_ERROR) throw OutputError(std::string("cannot build roster.xlsx (") + what + "): " + lxw_strerror(err));
}

void addTable(lxw_worksheet* ws, Formats& formats, const char* name, const std::vector<const char*>& headers,
              lxw_row_t headRow, lxw_row_t lastRow) {
  Style head;
  head.bold = true;
  head.fill = kHeaderFill;
  head.font = 0xFFFFFF;
  std::vector<lxw_table_column> columns(headers.size());
  std::vector<lxw_table_column*> list;
  for (size_t c = 0; c < headers.size(); ++c) {
    columns[c].header = const_cast<char*>(headers[c]);
    columns[c].header_format = formats.get(head);
    list.push_back(&columns[c]);
  }
  list.push_back(nullptr);
  lxw_table_options options{};
  options.name = const_cast<char*>(name);
  options.style_type = LXW_TABLE_STYLE_TYPE_LIGHT;
  options.style_type_number = 9;
  options.columns = list.data();
  const auto lastColumn = static_cast<lxw_col_t>(headers.size() - 1);
  check(worksheet_add_table(ws, headRow, 0, lastRow, lastColumn, &options), name);
}

lxw_format* Formats::get(const Style& s) {
  auto it = cache_.find(s);
  if (it != cache_.end()) return it->second;
  lxw_format* f = workbook_add_format(book_);
  if (!f) throw OutputError("cannot build roster.xlsx: out of memory");
  format_set_font_size(f, 10);
  if (s.fill != kNoColour) {
    if (s.hatched) {
      format_set_pattern(f, LXW_PATTERN_LIGHT_UP);
      format_set_fg_color(f, 0xA6A6A6);
      format_set_bg_color(f, s.fill);
    } else {
      format_set_bg_color(f, s.fill);
    }
  }
  if (s.font != kNoColour) format_set_font_color(f, s.font);
  if (s.bold) format_set_bold(f);
  if (s.italic) format_set_italic(f);
  if (s.wrap) format_set_text_wrap(f);
  if (s.center) format_set_align(f, LXW_ALIGN_CENTER);
  if (s.left) format_set_align(f, LXW_ALIGN_LEFT);
  format_set_align(f, s.top ? LXW_ALIGN_VERTICAL_TOP : LXW_ALIGN_VERTICAL_CENTER);
  if (s.border) {
    format_set_border(f, static_cast<uint8_t>(s.border));
    if (s.borderColour != kNoColour) format_set_border_color(f, s.borderColour);
  }
  if (s.numFormat) format_set_num_format(f, s.numFormat);
  if (s.rotation) format_set_rotation(f, static_cast<int16_t>(s.rotation));
  cache_.emplace(s, f);
  return f;
}

namespace {

/// Our default shift palette: soft, distinct tints that keep dark text readable.
constexpr lxw_color_t kPalette[] = {0xF6D38B, 0x9ED6C0, 0xB8B0E8, 0xF2A99E, 0x9CCBEA,
                                    0xD9C2A5, 0xC6E29A, 0xE6B3D6, 0xF0C9A0, 0xB5D3D8};

lxw_color_t parseColour(const std::string& text) {
  if (text.size() != 7 || text[0] != '#') return kNoColour;
  unsigned value = 0;
  if (std::sscanf(text.c_str() + 1, "%6x", &value) != 1) return kNoColour;
  return value;
}

}  // namespace

lxw_color_t shiftColour(const model::Problem& p, ShiftIdx shift) {
  const lxw_color_t given = parseColour(p.shifts[static_cast<size_t>(shift)].colour);
  if (given != kNoColour) return given;
  return kPalette[static_cast<size_t>(shift) % (sizeof kPalette / sizeof kPalette[0])];
}

double colourDistance(lxw_color_t a, lxw_color_t b) {
  const double dr = static_cast<double>((a >> 16) & 0xFF) - static_cast<double>((b >> 16) & 0xFF);
  const double dg = static_cast<double>((a >> 8) & 0xFF) - static_cast<double>((b >> 8) & 0xFF);
  const double db = static_cast<double>(a & 0xFF) - static_cast<double>(b & 0xFF);
  return std::sqrt(dr * dr + dg * dg + db * db);
}

std::vector<std::string> colourClashes(const model::Problem& p) {
  std::vector<std::string> out;
  for (size_t s = 0; s < p.shifts.size(); ++s) {
    const lxw_color_t c = parseColour(p.shifts[s].colour);
    if (c == kNoColour || colourDistance(c, kAbsenceFill) >= kClashDistance) continue;
    char fill[8];
    std::snprintf(fill, sizeof fill, "#%06X", kAbsenceFill);
    out.push_back("shift '" + p.shifts[s].id + "' colour " + p.shifts[s].colour + " is close to the absence fill " + fill +
                  " of the workbook; choose a lighter or more saturated colour so that absences stand out (absence cells "
                  "also carry a code such as LV or SK)");
  }
  return out;
}

lxw_color_t textColourOn(lxw_color_t fill) {
  const double r = (fill >> 16) & 0xFF, g = (fill >> 8) & 0xFF, b = fill & 0xFF;
  return 0.299 * r + 0.587 * g + 0.114 * b < 140 ? 0xFFFFFF : 0x000000;
}

std::string weekdayLabel(int weekday) {
  static const char* names[] = {"Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"};
  return names[weekday % 7];
}

lxw_datetime excelDate(const model::Problem& p, DayIdx d) {
  const std::string iso = p.dateText(d);  // YYYY-MM-DD
  lxw_datetime dt{};
  dt.year = std::stoi(iso.substr(0, 4));
  dt.month = std::stoi(iso.substr(5, 2));
  dt.day = std::stoi(iso.substr(8, 2));
  return dt;
}

std::string shiftDescription(const model::ShiftType& s) {
  char buf[64];
  std::snprintf(buf, sizeof buf, " %s-%s%s, %.1f h paid", model::formatClockTime(s.start).c_str(),
                model::formatClockTime(s.end).c_str(), s.end > kMinutesPerDay ? " (next day)" : "", s.paidMinutes() / 60.0);
  return (s.label.empty() ? s.id : s.label) + buf;
}

}  // namespace xlsx

namespace {

/// Closes (and so frees) an unfinished workbook and removes its temporary file on any error.
struct WorkbookGuard {
  lxw_workbook* book;
  std::filesystem::path temporary;
  ~WorkbookGuard() {
    if (!book) return;
    workbook_close(book);
    std::error_code ec;
    std::filesystem::remove(temporary, ec);
  }
};

}  // namespace

void XlsxWriter::write(const std::filesystem::path& dir, const OutputBundle& bundle) const {
  const std::filesystem::path target = dir / "roster.xlsx";
  const std::filesystem::path temporary = temporaryPathFor(target);
  lxw_workbook_options options{};
  options.constant_memory = LXW_FALSE;
  WorkbookGuard guard{workbook_new_opt(temporary.c_str(), &options), temporary};
  if (!guard.book) throw OutputError("cannot write '" + target.string() + "'; check that the folder is writable");

  lxw_doc_properties props{};
  std::string title = "Roster: " + bundle.problem.name;
  props.title = title.data();
  std::string note = "Made by rotaweave";
  props.comments = note.data();
  xlsx::check(workbook_set_properties(guard.book, &props), "properties");

  for (const std::string& clash : xlsx::colourClashes(bundle.problem)) std::cerr << "warning: " << clash << "\n";

  xlsx::Formats formats(guard.book);
  const xlsx::ListsPlan lists = xlsx::planLists(bundle.problem);
  xlsx::Book book{guard.book, formats, bundle, lists};
  xlsx::writeRosterSheet(book);
  xlsx::writeCoverSheet(book);
  xlsx::writeViolationsSheet(book);
  xlsx::writeSummarySheet(book);
  xlsx::writeChangesSheet(book);
  xlsx::writeBaselineSheet(book);
  xlsx::writeListsSheet(book);

  lxw_workbook* finished = guard.book;
  guard.book = nullptr;
  const lxw_error err = workbook_close(finished);
  if (err != LXW_NO_ERROR) {
    std::error_code ec;
    std::filesystem::remove(temporary, ec);
    throw OutputError("cannot write '" + target.string() + "': " + lxw_strerror(err));
  }
  commitTemporary(temporary, target);
}

}  // namespace rotaweave::io

/// @brief expat behind XmlPart.
#include "io/xlsx_read/xml_part.hpp"

#include <expat.h>

namespace rotaweave::io::xlsx_read {

std::string_view localName(std::string_view name) {
  const size_t cut = name.find_last_of(":|");
  return cut == std::string_view::npos ? name : name.substr(cut + 1);
}

const char* XmlAttributes::get(std::string_view local) const {
  for (const char** a = list_; a && *a; a += 2)
    if (localName(a[0]) == local) return a[1];
  return nullptr;
}

struct XmlCallbacks {
  static void start(void* self, const XML_Char* name, const XML_Char** attrs) {
    auto* p = static_cast<XmlPart*>(self);
    if (p->handlers_.start) p->handlers_.start(localName(name), XmlAttributes(attrs));
  }
  static void end(void* self, const XML_Char* name) {
    auto* p = static_cast<XmlPart*>(self);
    if (p->handlers_.end) p->handlers_.end(localName(name));
  }
  static void text(void* self, const XML_Char* s, int len) {
    auto* p = static_cast<XmlPart*>(self);
    if (p->handlers_.text) p->handlers_.text(std::string_view(s, static_cast<size_t>(len)));
  }
  static void doctype(void* self, const XML_Char*, const XML_Char*, const XML_Char*, int) {
    auto* p = static_cast<XmlPart*>(self);
    p->stopped_ = true;
    XML_StopParser(static_cast<XML_Parser>(p->parser_), XML_FALSE);
    p->doctype_ = true;
  }
};

XmlPart::XmlPart(std::string partName, XmlHandlers handlers)
    : part_(std::move(partName)), handlers_(std::move(handlers)), parser_(XML_ParserCreateNS(nullptr, '|')) {
  if (!parser_) throw XmlError{"out of memory reading " + part_};
  auto* p = static_cast<XML_Parser>(parser_);
  XML_SetUserData(p, this);
  XML_SetElementHandler(p, &XmlCallbacks::start, &XmlCallbacks::end);
  XML_SetCharacterDataHandler(p, &XmlCallbacks::text);
  XML_SetStartDoctypeDeclHandler(p, &XmlCallbacks::doctype);
}

XmlPart::~XmlPart() { XML_ParserFree(static_cast<XML_Parser>(parser_)); }

void XmlPart::fail(const std::string& why) {
  auto* p = static_cast<XML_Parser>(parser_);
  throw XmlError{"the part " + part_ + " is not well-formed XML (line " + std::to_string(XML_GetCurrentLineNumber(p)) + ", column " +
                 std::to_string(XML_GetCurrentColumnNumber(p) + 1) + ": " + why + ")"};
}

void XmlPart::stop() {
  if (stopped_) return;
  stopped_ = true;
  XML_StopParser(static_cast<XML_Parser>(parser_), XML_FALSE);
}

bool XmlPart::feed(std::string_view chunk) {
  if (stopped_) return false;
  auto* p = static_cast<XML_Parser>(parser_);
  const XML_Status status = XML_Parse(p, chunk.data(), static_cast<int>(chunk.size()), XML_FALSE);
  if (doctype_) throw XmlError{"the part " + part_ + " declares a document type, which workbooks never do; refused"};
  if (status == XML_STATUS_ERROR && !stopped_) fail(XML_ErrorString(XML_GetErrorCode(p)));
  return !stopped_;
}

void XmlPart::finish() {
  if (stopped_) return;
  auto* p = static_cast<XML_Parser>(parser_);
  const XML_Status status = XML_Parse(p, nullptr, 0, XML_TRUE);
  if (doctype_) throw XmlError{"the part " + part_ + " declares a document type, which workbooks never do; refused"};
  if (status == XML_STATUS_ERROR && !stopped_) fail(XML_ErrorString(XML_GetErrorCode(p)));
}

void parseXml(const std::string& partName, std::string_view text, XmlHandlers handlers) {
  XmlPart part(partName, std::move(handlers));
  constexpr size_t kSlice = 1 << 20;  // expat takes an int length
  for (size_t at = 0; at < text.size(); at += kSlice)
    if (!part.feed(text.substr(at, kSlice))) return;
  part.finish();
}

}  // namespace rotaweave::io::xlsx_read

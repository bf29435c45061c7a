/// @brief Event-driven XML reading of one workbook part with expat: element starts and ends by
/// local name (namespace prefixes dropped, so "x:c" and "c" are the same), attributes by local
/// name, and character data. Document type declarations are refused (no entity expansion).
#pragma once
#include <functional>
#include <string>
#include <string_view>

namespace rotaweave::io::xlsx_read {

/// A malformed part; the caller adds the file name.
struct XmlError {
  std::string message;
};

/// Attributes of one element as expat hands them: name, value, name, value, ..., null.
class XmlAttributes {
 public:
  explicit XmlAttributes(const char** list) : list_(list) {}
  /// The value of the attribute with this local name, or nullptr.
  const char* get(std::string_view local) const;

 private:
  const char** list_;
};

struct XmlHandlers {
  std::function<void(std::string_view local, const XmlAttributes&)> start;
  std::function<void(std::string_view local)> end;
  std::function<void(std::string_view text)> text;
};

/// Feeds chunks of one part to expat. Throws XmlError with the part name, line and column on
/// malformed XML or a DOCTYPE. stop() from a handler ends the parse without an error.
class XmlPart {
 public:
  XmlPart(std::string partName, XmlHandlers handlers);
  ~XmlPart();
  XmlPart(const XmlPart&) = delete;
  XmlPart& operator=(const XmlPart&) = delete;

  /// Parses the next chunk; returns false once the parse was stopped.
  bool feed(std::string_view chunk);
  /// Ends the document (checks it is complete) unless it was stopped.
  void finish();
  /// Stops the parse from inside a handler.
  void stop();
  bool stopped() const { return stopped_; }

 private:
  void fail(const std::string& why);
  std::string part_;
  XmlHandlers handlers_;
  void* parser_;  ///< XML_Parser
  bool stopped_ = false;
  bool doctype_ = false;
  friend struct XmlCallbacks;
};

/// Parses a whole part held in memory.
void parseXml(const std::string& partName, std::string_view text, XmlHandlers handlers);

/// The local part of a name: "x:c" -> "c", "uri|c" -> "c".
std::string_view localName(std::string_view name);

}  // namespace rotaweave::io::xlsx_read

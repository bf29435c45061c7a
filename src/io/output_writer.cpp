/// @brief The standard output set and the plain-text writers (CSV, JSON, text report).
#include "io/output_writer.hpp"

#include <future>

#include "io/atomic_file.hpp"
#include "io/changes_csv.hpp"
#include "io/ics_writer.hpp"
#include "io/report_json.hpp"
#include "io/roster_csv.hpp"
#include "io/xlsx_writer.hpp"
#include "report/text.hpp"

namespace rotaweave::io {
namespace {

class CsvWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& b) const override {
    writeFileAtomic(dir / "roster.csv", rosterCsvText(b.roster, b.problem));
  }
};

class JsonWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& b) const override {
    writeFileAtomic(dir / "report.json", reportJson(b.report, b.problem));
  }
};

class TextWriter final : public OutputWriter {
 public:
  void write(const std::filesystem::path& dir, const OutputBundle& b) const override {
    writeFileAtomic(dir / "report.txt", report::renderText(b.report, b.problem));
  }
};

}  // namespace

std::vector<std::unique_ptr<OutputWriter>> standardWriters() {
  std::vector<std::unique_ptr<OutputWriter>> writers;
  writers.push_back(std::make_unique<CsvWriter>());
  writers.push_back(std::make_unique<ChangesCsvWriter>());
  writers.push_back(std::make_unique<JsonWriter>());
  writers.push_back(std::make_unique<TextWriter>());
  writers.push_back(std::make_unique<XlsxWriter>());
  writers.push_back(std::make_unique<IcsWriter>());
  return writers;
}

void writeStandardOutputs(const std::filesystem::path& dir, const OutputBundle& bundle) {
  ensureDirectory(dir);
  // The workbook takes as long as the rest together on a large roster: it is written on a
  // thread of its own. Writers only read the bundle, and each writes its own files.
  std::vector<std::unique_ptr<OutputWriter>> writers = standardWriters();
  std::future<void> workbook;
  for (auto& writer : writers)
    if (dynamic_cast<const XlsxWriter*>(writer.get()))
      workbook = std::async(std::launch::async, [&dir, &bundle, w = std::move(writer)] { w->write(dir, bundle); });
  try {
    for (const auto& writer : writers)
      if (writer) writer->write(dir, bundle);
  } catch (...) {
    if (workbook.valid()) workbook.wait();
    throw;
  }
  if (workbook.valid()) workbook.get();  // rethrows the workbook's error, if any
}

}  // namespace rotaweave::io

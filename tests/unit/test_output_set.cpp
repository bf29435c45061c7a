/// @brief The output set: written whole into a staging folder and swapped in, the previous set
/// kept on any failure, one run at a time per folder, and --out checked before anything is read.
#include <doctest/doctest.h>
#include <sys/stat.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <sstream>

#include "io/input_error.hpp"
#include "io/output_folder.hpp"
#include "io/output_lock.hpp"

using namespace rotaweave;
namespace fs = std::filesystem;

namespace {

/// A fresh, empty folder for one test case.
fs::path scratch(const std::string& name) {
  const fs::path dir = fs::temp_directory_path() / ("rotaweave-output-set-" + std::to_string(::getpid())) / name;
  fs::remove_all(dir);
  fs::create_directories(dir);
  return dir;
}

void put(const fs::path& file, const std::string& text) {
  fs::create_directories(file.parent_path());
  std::ofstream(file, std::ios::binary) << text;
}

std::string read(const fs::path& file) {
  std::ifstream in(file, std::ios::binary);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

/// Every file and folder under `dir`, relative, sorted.
std::vector<std::string> listing(const fs::path& dir) {
  std::vector<std::string> out;
  if (!fs::exists(dir)) return out;
  for (const auto& e : fs::recursive_directory_iterator(dir)) out.push_back(fs::relative(e.path(), dir).string());
  std::sort(out.begin(), out.end());
  return out;
}

/// Writes a small set: roster.csv, report.txt and one calendar per name.
void writeSet(const fs::path& out, const std::string& tag, const std::vector<std::string>& calendars) {
  io::OutputFolder folder(out);
  folder.writeSet([&](const fs::path& dir) {
    put(dir / "roster.csv", "roster " + tag + "\n");
    put(dir / "report.txt", "report " + tag + "\n");
    for (const auto& c : calendars) put(dir / "calendars" / (c + ".ics"), "calendar " + tag + "\n");
  });
}

/// The OutputError message of constructing an OutputFolder on `out`, or "" if none.
std::string refusal(const fs::path& out) {
  try {
    io::OutputFolder folder(out);
  } catch (const io::OutputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST_SUITE("output set") {
  TEST_CASE("a new set is written whole, and nothing is left beside it") {
    const fs::path root = scratch("new");
    writeSet(root / "deep" / "out", "1", {"ana", "ben"});
    CHECK(listing(root / "deep" / "out") ==
          std::vector<std::string>{"calendars", "calendars/ana.ics", "calendars/ben.ics", "report.txt", "roster.csv"});
    CHECK(listing(root / "deep") == std::vector<std::string>{"out", "out/calendars", "out/calendars/ana.ics",
                                                             "out/calendars/ben.ics", "out/report.txt", "out/roster.csv"});
  }

  TEST_CASE("a new set replaces the whole previous one") {
    const fs::path root = scratch("replace");
    writeSet(root / "out", "1", {"ana", "ben", "old-person"});
    writeSet(root / "out", "2", {"ana"});
    CHECK(listing(root / "out") == std::vector<std::string>{"calendars", "calendars/ana.ics", "report.txt", "roster.csv"});
    CHECK(read(root / "out" / "roster.csv") == "roster 2\n");
    CHECK(read(root / "out" / "calendars" / "ana.ics") == "calendar 2\n");
    CHECK(listing(root) == std::vector<std::string>{"out", "out/calendars", "out/calendars/ana.ics", "out/report.txt", "out/roster.csv"});
  }

  TEST_CASE("the new set keeps the folder's permissions") {
    const fs::path root = scratch("mode");
    writeSet(root / "out", "1", {});
    ::chmod((root / "out").c_str(), 0700);
    writeSet(root / "out", "2", {});
    struct stat st{};
    REQUIRE(::stat((root / "out").c_str(), &st) == 0);
    CHECK((st.st_mode & 07777) == 0700);
    CHECK(read(root / "out" / "roster.csv") == "roster 2\n");
  }

  TEST_CASE("a failed write keeps the previous set untouched and says so") {
    const fs::path root = scratch("keep");
    writeSet(root / "out", "1", {"ana", "ben"});
    const auto before = listing(root / "out");
    std::string message;
    try {
      io::OutputFolder folder(root / "out");
      folder.writeSet([&](const fs::path& dir) {
        put(dir / "roster.csv", "roster 2\n");
        put(dir / "calendars" / "ana.ics", "calendar 2\n");
        throw io::OutputError("cannot write '" + (dir / "calendars" / "ben.ics").string() + "': No space left on device");
      });
    } catch (const io::OutputError& e) {
      message = e.what();
    }
    CAPTURE(message);
    CHECK(message.find("kept as they were") != std::string::npos);
    // The file is named as it would have been in the output folder, not in the staging folder.
    CHECK(message.find((root / "out" / "calendars" / "ben.ics").string()) != std::string::npos);
    CHECK(message.find(".new-") == std::string::npos);
    CHECK(listing(root / "out") == before);
    CHECK(read(root / "out" / "roster.csv") == "roster 1\n");
    CHECK(read(root / "out" / "calendars" / "ana.ics") == "calendar 1\n");
    CHECK(listing(root).size() == before.size() + 1);  // out itself, nothing beside it
  }

  TEST_CASE("a failed first run writes nothing, not even the folders above --out") {
    const fs::path root = scratch("first");
    std::string message;
    try {
      io::OutputFolder folder(root / "a" / "b" / "out");
      folder.writeSet([](const fs::path& dir) {
        put(dir / "roster.csv", "x\n");
        throw io::OutputError("disk full");
      });
    } catch (const io::OutputError& e) {
      message = e.what();
    }
    CHECK(message.find("no outputs were written") != std::string::npos);
    CHECK(listing(root).empty());
  }

  TEST_CASE("a second run into the same folder is refused at once, naming the first") {
    const fs::path root = scratch("lock");
    io::OutputFolder first(root / "out");
    CHECK(fs::exists(io::OutputLock::lockPathFor(first.target())));
    const std::string message = refusal(root / "out");
    CAPTURE(message);
    CHECK(message.find("another rotaweave run (process " + std::to_string(::getpid()) + ")") != std::string::npos);
    CHECK(message.find("--out") != std::string::npos);
    // Another spelling of the same folder takes the same lock.
    CHECK(!refusal(root / "." / "out" / "").empty());
    CHECK(refusal(root / "other").empty());  // another folder is free
  }

  TEST_CASE("the lock is released and its file removed when a run ends") {
    const fs::path root = scratch("unlock");
    { io::OutputFolder first(root / "out"); }
    CHECK(listing(root).empty());
    CHECK(refusal(root / "out").empty());
  }

  TEST_CASE("--out is checked before anything is read") {
    const fs::path root = scratch("checks");
    SUBCASE("files rotaweave did not write are never deleted: the run is refused") {
      put(root / "out" / "roster.csv", "old\n");
      put(root / "out" / "notes.txt", "mine\n");
      put(root / "out" / "calendars" / "ana.ics", "old\n");
      put(root / "out" / "calendars" / "photo.jpg", "mine\n");
      const std::string message = refusal(root / "out");
      CAPTURE(message);
      CHECK(message.find("holds files rotaweave did not write (calendars/photo.jpg, notes.txt)") != std::string::npos);
      CHECK(read(root / "out" / "notes.txt") == "mine\n");
      CHECK(listing(root).size() == 6);  // nothing added beside it
    }
    SUBCASE("a read-only folder is refused, even where the system would allow writing (root)") {
      fs::create_directories(root / "out");
      ::chmod((root / "out").c_str(), 0555);
      const std::string message = refusal(root / "out");
      ::chmod((root / "out").c_str(), 0755);
      CHECK(message.find("is read-only") != std::string::npos);
      CHECK(listing(root) == std::vector<std::string>{"out"});
    }
    SUBCASE("a file in the way") {
      put(root / "out", "a file\n");
      CHECK(refusal(root / "out").find("a file of that name is in the way") != std::string::npos);
      CHECK(refusal(root / "out" / "below").find("a file is in the way") != std::string::npos);
      CHECK(read(root / "out") == "a file\n");
      CHECK(listing(root) == std::vector<std::string>{"out"});
    }
    SUBCASE("an empty folder, or one with an earlier set, is fine") {
      fs::create_directories(root / "out");
      CHECK(refusal(root / "out").empty());
      put(root / "out" / "roster.csv", "old\n");
      put(root / "out" / ".report.json.tmp123", "left by an old version\n");
      CHECK(refusal(root / "out").empty());
    }
  }

  TEST_CASE("what a killed run left beside --out is cleaned up, and a set it moved aside put back") {
    const fs::path root = scratch("leftovers");
    put(root / ".out.new-999999" / "roster.csv", "half\n");
    put(root / ".out.old-999998" / "roster.csv", "previous\n");
    put(root / ".other.new-1" / "roster.csv", "not ours\n");
    { io::OutputFolder folder(root / "out"); }
    CHECK(read(root / "out" / "roster.csv") == "previous\n");
    CHECK(listing(root) == std::vector<std::string>{".other.new-1", ".other.new-1/roster.csv", "out", "out/roster.csv"});
  }

  TEST_CASE("output names") {
    CHECK(io::OutputFolder::isOutputName("roster.xlsx"));
    CHECK(io::OutputFolder::isOutputName("calendars"));
    CHECK(io::OutputFolder::isOutputName(".roster.csv.tmp4711"));
    CHECK_FALSE(io::OutputFolder::isOutputName("roster.csv.bak"));
    CHECK_FALSE(io::OutputFolder::isOutputName(".~lock.roster.xlsx#"));
  }
}

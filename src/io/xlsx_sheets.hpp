/// @brief Shared pieces of the workbook writer: error checks, cached formats, the shift palette
/// and one function per sheet. Internal to the xlsx_*.cpp files.
#pragma once
#include <xlsxwriter.h>

#include <map>
#include <string>
#include <vector>

#include "io/output_writer.hpp"
#include "io/xlsx_formulas.hpp"
#include "io/xlsx_layout.hpp"

namespace rotaweave::io::xlsx {

/// Throws OutputError naming `what` unless `err` is LXW_NO_ERROR.
void check(lxw_error err, const char* what);

/// No colour set.
inline constexpr lxw_color_t kNoColour = 0xFFFFFFFFu;

/// Cell styles, created once per distinct look and owned by the workbook.
struct Style {
  lxw_color_t fill = kNoColour;
  lxw_color_t font = kNoColour;
  bool bold = false;
  bool italic = false;
  bool wrap = false;
  bool center = false;
  bool left = false;
  int border = 0;  ///< an LXW_BORDER_* value, 0 for none
  lxw_color_t borderColour = kNoColour;
  const char* numFormat = nullptr;
  int rotation = 0;
  bool hatched = false;  ///< light diagonal stripes over the fill
  bool top = false;      ///< align to the top (wrapped text)
  auto operator<=>(const Style&) const = default;
};

class Formats {
 public:
  explicit Formats(lxw_workbook* book) : book_(book) {}
  lxw_format* get(const Style& style);

 private:
  lxw_workbook* book_;
  std::map<Style, lxw_format*> cache_;
};

/// Everything a sheet function needs.
struct Book {
  lxw_workbook* workbook;
  Formats& formats;
  const OutputBundle& data;
  const ListsPlan& lists;
};

/// Shades used across the sheets.
inline constexpr lxw_color_t kHeaderFill = 0x2F4858;   // dark slate, white text
inline constexpr lxw_color_t kWeekendFill = 0xE4E9ED;  // pale blue-grey
inline constexpr lxw_color_t kHolidayFill = 0xF3E3C8;  // pale sand
/// Absence cells: a dark grey with white text, far from every pastel shift colour (a scenario
/// colour closer than kClashDistance gets a warning, see colourClashes).
inline constexpr lxw_color_t kAbsenceFill = 0x6E6E6E;
inline constexpr lxw_color_t kHardColour = 0xC0392B;   // red
inline constexpr lxw_color_t kSoftColour = 0xE08E0B;   // amber
inline constexpr lxw_color_t kShortFill = 0xF8D7D3;    // pale red
inline constexpr lxw_color_t kTargetFill = 0xFCEBC7;   // pale amber
inline constexpr lxw_color_t kChangedColour = 0x1F5FBF; // blue: a cell changed by replan

/// The fill colour of a shift: its scenario colour, or one of our defaults.
lxw_color_t shiftColour(const model::Problem& p, ShiftIdx shift);
/// Euclidean distance of two colours in RGB (0..441).
double colourDistance(lxw_color_t a, lxw_color_t b);
/// Closer than this to the absence fill, a shift colour could be taken for an absence.
inline constexpr double kClashDistance = 80.0;
/// One warning per scenario shift colour too close to the absence fill ("" if none).
std::vector<std::string> colourClashes(const model::Problem& p);

/// Black or white, whichever reads better on `fill`.
lxw_color_t textColourOn(lxw_color_t fill);
/// "Mon", "Tue", ...
std::string weekdayLabel(int weekday);
/// The date of period day `d` as an Excel date-time value.
lxw_datetime excelDate(const model::Problem& p, DayIdx d);
/// "Early 07:00-15:00 (7.5 h paid)".
std::string shiftDescription(const model::ShiftType& shift);

void writeRosterSheet(Book& book);

/// Column widths of the Roster sheet, in Excel's character units.
struct RosterWidths {
  double name = 10, id = 6, day = 5.5;
};
/// Roster sheet, xlsx_roster_live.cpp: a drop-down list on every roster cell of the codes the
/// person may take (from the Lists sheet), rejecting anything else.
void addRosterValidation(Book& book, lxw_worksheet* ws);
/// Shift colours, the absence fill and the day-off fills follow what a cell holds, so an
/// edited cell looks like one we wrote.
void addRosterConditionalFormats(Book& book, lxw_worksheet* ws, const RosterLayout& layout);
/// Hours outside the contract bounds in red (hard contract) or amber, inside in black, as the
/// Hours formula changes.
void addHoursConditionalFormats(Book& book, lxw_worksheet* ws, const RosterLayout& layout);
/// Landscape A4, one or two weeks a page (column breaks), headers and name columns repeated,
/// scaled to fit the page height where the type stays readable.
void setRosterPrint(Book& book, lxw_worksheet* ws, const RosterLayout& layout, const RosterWidths& widths, lxw_row_t lastRow);
void writeCoverSheet(Book& book);
void writeViolationsSheet(Book& book);
void writeSummarySheet(Book& book);
/// Only when the report carries re-plan changes.
void writeChangesSheet(Book& book);
/// Only when the report carries a baseline comparison (check --baseline).
void writeBaselineSheet(Book& book);
/// The hidden Lists sheet: shift hours, absence codes, each person's drop-down codes.
void writeListsSheet(Book& book);

/// Turns rows headRow..lastRow into a filterable table named `name` with our header style.
/// A table needs one data row, so an empty one spans headRow + 1.
void addTable(lxw_worksheet* ws, Formats& formats, const char* name, const std::vector<const char*>& headers,
              lxw_row_t headRow, lxw_row_t lastRow);

}  // namespace rotaweave::io::xlsx

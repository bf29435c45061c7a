/// @brief Options for each command; solver options come from the shared parameter table.
#include "io/replan_loader.hpp"
#include "cli/options.hpp"

#include <boost/program_options.hpp>
#include <sstream>

#include "version.hpp"

namespace rotaweave::cli {
namespace po = boost::program_options;
namespace {

const char* kUsage =
    "usage:\n"
    "  rotaweave solve  SCENARIO.yaml [--out DIR] [--time-limit SEC] [--generations N] [--seed N]\n"
    "                                 [--threads N] [--islands N] [--quiet]\n"
    "  rotaweave check  SCENARIO.yaml --roster ROSTER.csv|ROSTER.xlsx [--baseline ORIGINAL.csv|.xlsx] [--out DIR]\n"
    "  rotaweave replan SCENARIO.yaml --roster PUBLISHED.csv|PUBLISHED.xlsx --from DATE\n"
    "                                 [--absence STAFF:DATE[..DATE][:REASON]]... [--out DIR] [solve options]\n"
    "  rotaweave --help | --version\n";

po::options_description solverOptions() {
  po::options_description d("Solver options");
  for (const auto& p : search::parameterTable()) {
    std::ostringstream help;
    help << p.help << " (default " << p.defaultValue << ")";
    d.add_options()(p.name, po::value<double>(), help.str().c_str());
  }
  d.add_options()("selection", po::value<std::string>(), "parent selection: tournament, rank, sus or roulette (default tournament)");
  d.add_options()("quiet,q", "no progress output on stderr");
  return d;
}

po::variables_map parse(const std::vector<std::string>& args, const po::options_description& desc, const char* command) {
  po::positional_options_description pos;
  pos.add("scenario", 1);
  po::variables_map vm;
  try {
    po::store(po::command_line_parser(args).options(desc).positional(pos).run(), vm);
    po::notify(vm);
  } catch (const po::error& e) {
    throw UsageError(std::string(command) + ": " + e.what() + "\n" + kUsage);
  }
  if (!vm.count("scenario")) throw UsageError(std::string(command) + ": give the scenario file, e.g. samples/clinic-ward/scenario.yaml\n" + kUsage);
  return vm;
}

search::SolverOptions readSolverOptions(const po::variables_map& vm) {
  search::SolverOptions o;
  try {
    for (const auto& p : search::parameterTable())
      if (vm.count(p.name)) search::setParameter(o, p.name, vm[p.name].as<double>());
    if (vm.count("selection")) o.selection = search::parseSelection(vm["selection"].as<std::string>());
  } catch (const std::invalid_argument& e) {
    throw UsageError(e.what());
  }
  o.quiet = vm.count("quiet") > 0;
  return o;
}

po::options_description common() {
  po::options_description d("Options");
  d.add_options()("scenario", po::value<std::string>(), "scenario YAML file")(
      "out,o", po::value<std::string>()->default_value("out"), "output folder");
  return d;
}

std::string helpText() {
  std::ostringstream out;
  out << "rotaweave " << kVersion << ": shift rosters from YAML scenarios\n\n" << kUsage << "\n";
  po::options_description all;
  all.add(common()).add(solverOptions());
  all.add_options()("roster", "check, replan: the roster to check or the published roster (CSV or xlsx workbook)")(
      "baseline", "check: the roster --roster was edited from; the report lists new and gone breaches and changed cells")(
      "from", "replan: first date to re-plan (YYYY-MM-DD)")("absence", "replan: STAFF:DATE, STAFF:DATE..DATE or either with :REASON, repeatable");
  out << all;
  out << "\nExit status: 0 done, no hard violation; 1 hard violations remain; 2 bad input or usage; 3 internal error.\n";
  return out.str();
}

}  // namespace

std::string optionsMarkdown() {
  using D = io::ChangesDefaults;  // replan's default stability weights, one source
  std::ostringstream out;
  out << "# Solver options\n\n"
      << "Generated from the parameter table in `src/search/solver_options.cpp` by `rotaweave --options-markdown`;\n"
      << "a test keeps this page equal to it. The same table drives `--help` and the range checks.\n\n"
      << "| option | meaning | default | range |\n| --- | --- | --- | --- |\n";
  for (const auto& p : search::parameterTable())
    out << "| `--" << p.name << "` | " << p.help << " | " << p.defaultValue << " | " << p.min << " to " << p.max << " |\n";
  out << "| `--selection` | parent selection: tournament, rank, sus (stochastic universal sampling) or roulette | tournament | |\n"
      << "| `--quiet` | no progress output on stderr | off | |\n"
      << "\n# Check options\n\n"
      << "| option | meaning |\n| --- | --- |\n"
      << "| `--roster FILE` | the roster to check (required) |\n"
      << "| `--baseline FILE` | the roster `--roster` was edited from, read the same way; report.txt (BASELINE), report.json "
         "(`baseline`) and the workbook's Baseline sheet list the changed cells and the breaches that are new, gone or changed in "
         "amount |\n"
      << "| `--out DIR` | output folder (default `out`) |\n"

      << "\n`replan` takes the solve options above. What a change to the published roster costs is not an option but\n"
      << "the `changes` rule's weights: without a `changes` rule in the scenario, replan adds\n"
      << "`{id: changes, kind: changes, severity: soft, weight: " << D::weight / kWeightScale << ", early_days: " << D::earlyDays
      << ", early_weight: " << D::earlyWeight / kWeightScale << ", near_days: " << D::nearDays
      << ", far_weight: " << D::farWeight / kWeightScale << "}`\n"
      << "(see [rules/changes.md](rules/changes.md)); list your own to change them.\n";
  return out.str();
}

Parsed parseCommandLine(int argc, char** argv) {
  std::vector<std::string> args(argv + 1, argv + argc);
  if (args.empty()) throw UsageError(std::string("no command given\n") + kUsage);
  const std::string command = args.front();
  args.erase(args.begin());
  if (command == "--help" || command == "-h" || command == "help") return HelpArgs{helpText()};
  if (command == "--version") return HelpArgs{std::string("rotaweave ") + kVersion + "\n"};
  if (command == "--options-markdown") return HelpArgs{optionsMarkdown()};

  if (command == "check") {
    auto desc = common();
    desc.add_options()("roster", po::value<std::string>()->required(), "roster to check (CSV or xlsx workbook)")(
        "baseline", po::value<std::string>(), "the roster this one was edited from: report new, gone and changed breaches and changed cells");
    const auto vm = parse(args, desc, "check");
    return CheckArgs{vm["scenario"].as<std::string>(), vm["roster"].as<std::string>(), vm["out"].as<std::string>(),
                     vm.count("baseline") ? vm["baseline"].as<std::string>() : std::string()};
  }
  if (command == "solve" || command == "replan") {
    auto desc = common();
    desc.add(solverOptions());
    if (command == "replan")
      desc.add_options()("roster", po::value<std::string>()->required(), "published roster (CSV or xlsx workbook)")(
          "from", po::value<std::string>()->required(), "first date to re-plan")(
          "absence", po::value<std::vector<std::string>>()->composing(), "STAFF:DATE[..DATE][:REASON], repeatable");
    const auto vm = parse(args, desc, command.c_str());
    app::SolveRequest solve{vm["scenario"].as<std::string>(), vm["out"].as<std::string>(), readSolverOptions(vm)};
    if (command == "solve") return solve;
    app::ReplanRequest replan{solve, vm["roster"].as<std::string>(), vm["from"].as<std::string>(), {}};
    if (vm.count("absence")) replan.absences = vm["absence"].as<std::vector<std::string>>();
    return replan;
  }
  throw UsageError("unknown command '" + command + "'\n" + kUsage);
}

}  // namespace rotaweave::cli

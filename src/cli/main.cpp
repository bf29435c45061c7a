/// @brief rotaweave entry point: parse, run, and turn every error into a message and exit code.
#include <iostream>

#include "cli/commands.hpp"
#include "io/input_error.hpp"
#include "search/stop_signal.hpp"

int main(int argc, char** argv) {
  using namespace rotaweave;
  // From the start, so that Ctrl-C while a large scenario loads still ends with outputs.
  search::installStopSignals();
  try {
    return cli::run(cli::parseCommandLine(argc, argv));
  } catch (const cli::UsageError& e) {
    std::cerr << "rotaweave: " << e.what() << "\n";
    return 2;
  } catch (const io::InputError& e) {
    std::cerr << "rotaweave: error: " << e.what() << "\n";
    return 2;
  } catch (const io::OutputError& e) {
    std::cerr << "rotaweave: error: " << e.what() << "\n";
    return 2;
  } catch (const std::exception& e) {
    std::cerr << "rotaweave: internal error: " << e.what() << "\n"
              << "Please report this with the scenario that caused it.\n";
    return 3;
  }
}

/// @brief The modes of rotaweave-bench, one source file each (mode_*.cpp); main.cpp dispatches.
/// Each takes the arguments after the mode's name, prints its results on stdout and returns
/// the process exit status. Bad arguments throw std::invalid_argument.
#pragma once
#include <string>
#include <vector>

namespace rotaweave::bench {

using Args = std::vector<std::string>;

int speedMode(const Args& args);      ///< evaluation and generation rates per scenario
int convertMode(const Args& args);    ///< a benchmark instance as a scenario YAML
int runMode(const Args& args);        ///< one benchmark instance solved in-process, with the published figures
int limitsMode(const Args& args);     ///< does `rotaweave solve` keep its time limit, and at what memory
int interruptMode(const Args& args);  ///< how fast `rotaweave solve` stops on SIGINT, and what it leaves
int scalingMode(const Args& args);    ///< one item at several thread counts
int tableMode(const Args& args);      ///< the benchmark instances over seeds, as a markdown table

}  // namespace rotaweave::bench

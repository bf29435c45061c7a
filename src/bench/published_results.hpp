/// @brief Published optima and bounds (total soft penalty) for benchmark instances 1-24.
#pragma once

#include <array>
#include <optional>

namespace rotaweave::bench {

/// Where a published figure comes from.
enum class ResultSource {
    none,          ///< no figure found
    changesLog,    ///< [C] the benchmark's changes log, http://www.schedulingbenchmarks.org/changes.html
    literatureRuns ///< [R] GitHub ORProjects/NRP, ComputationalResults/README.md (commit 018b89e5),
                   ///<     a secondary literature comparison of time-limited runs; used only for
                   ///<     upper bounds [C] does not give
};

/// Best known results of one instance; lower is better.
struct PublishedResult {
    int instance = 0;
    std::optional<int> optimum;     ///< set when a lower bound equals a reported solution value
    int bestUpper = 0;              ///< best reported solution value
    ResultSource upperSource = ResultSource::none;
    std::optional<int> bestLower;   ///< best reported lower bound, if any was found
    ResultSource lowerSource = ResultSource::none;
};

// Instances: T. Curtois and R. Qu, "Computational results on new staff scheduling benchmark
// instances" (2014), http://www.schedulingbenchmarks.org/nrp/instances1_24.html.
// Figures: [C] = ResultSource::changesLog (a stored, undated snapshot; only its first part could
// be read, so most column-generation lower bounds are missing and the live page may list better
// bounds, especially for 20-24); [R] = ResultSource::literatureRuns. Lower bounds for 1-7 are
// column generation [C] (1: integer programming, Strandmark); 8, 9, 13-19 are integer
// programming by Smet [C]; 20-24 are Strandmark [C] (branch and price upper bounds).
inline constexpr std::array<PublishedResult, 24> kPublishedResults = {{
    // {instance, optimum, best upper bound, its source, best lower bound, its source}
    {1, 607, 607, ResultSource::literatureRuns, 607, ResultSource::changesLog},
    {2, 828, 828, ResultSource::literatureRuns, 828, ResultSource::changesLog},
    {3, 1001, 1001, ResultSource::literatureRuns, 1001, ResultSource::changesLog},
    {4, 1716, 1716, ResultSource::literatureRuns, 1716, ResultSource::changesLog},
    {5, std::nullopt, 1143, ResultSource::literatureRuns, 1141, ResultSource::changesLog},
    {6, std::nullopt, 1950, ResultSource::literatureRuns, 1949, ResultSource::changesLog},
    {7, std::nullopt, 1056, ResultSource::literatureRuns, 1055, ResultSource::changesLog},
    {8, 1300, 1300, ResultSource::changesLog, 1300, ResultSource::changesLog},
    {9, 439, 439, ResultSource::changesLog, 439, ResultSource::changesLog},
    {10, std::nullopt, 4631, ResultSource::literatureRuns, std::nullopt, ResultSource::none},
    {11, std::nullopt, 3443, ResultSource::literatureRuns, std::nullopt, ResultSource::none},
    {12, std::nullopt, 4040, ResultSource::literatureRuns, std::nullopt, ResultSource::none},
    {13, 1348, 1348, ResultSource::changesLog, 1348, ResultSource::changesLog},
    {14, 1278, 1278, ResultSource::changesLog, 1278, ResultSource::changesLog},
    {15, std::nullopt, 3834, ResultSource::changesLog, 3823, ResultSource::changesLog},
    {16, 3225, 3225, ResultSource::changesLog, 3225, ResultSource::changesLog},
    {17, 5746, 5746, ResultSource::changesLog, 5746, ResultSource::changesLog},
    {18, 4459, 4459, ResultSource::changesLog, 4459, ResultSource::changesLog},
    {19, std::nullopt, 3149, ResultSource::changesLog, 3148, ResultSource::changesLog},
    {20, std::nullopt, 4943, ResultSource::changesLog, 4091, ResultSource::changesLog},
    {21, std::nullopt, 21159, ResultSource::changesLog, 11898, ResultSource::changesLog},
    {22, std::nullopt, 33155, ResultSource::changesLog, 24064, ResultSource::changesLog},
    {23, std::nullopt, 17428, ResultSource::changesLog, 2765, ResultSource::changesLog},
    {24, std::nullopt, 48777, ResultSource::changesLog, std::nullopt, ResultSource::none},
}};

/// The entry of instance `number` (1-24), or nullptr when there is none.
constexpr const PublishedResult* publishedResult(int number) {
    for (const PublishedResult& result : kPublishedResults)
        if (result.instance == number) return &result;
    return nullptr;
}

static_assert(publishedResult(1)->optimum == 607 && publishedResult(24)->bestUpper == 48777);

}  // namespace rotaweave::bench

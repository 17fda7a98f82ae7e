// The verdict on a scenario (model layer), typed: every option evaluated, ranked by annual cost and,
// where economics apply, appraised and ranked by life-cycle cost, with the price draws; the json layer
// only writes it.
#pragma once
#include <cstddef>
#include <functional>
#include <optional>
#include <vector>

#include "model/appraisal.hpp"

namespace fw {

/// Indices of `values` in ascending order, ties kept in their given order (a stable ranking).
std::vector<std::size_t> ranked_ascending(const std::vector<double>& values);

/// Whether the verdict includes the costs over the years: economics or price draws asked for, or an option
/// with an installed cost or marked as the system in the house now.
bool economics_wanted(const scenario& input);

struct scenario_verdict {
    evaluation evaluated;
    std::vector<std::size_t> by_annual_cost;       ///< indices into evaluated.results, cheapest first
    std::optional<economics_settings> economics;   ///< the settings used, when the economics apply
    std::optional<std::size_t> baseline;           ///< the existing option's index
    std::vector<option_economics> appraised;       ///< parallel to evaluated.results
    std::vector<std::size_t> by_life_cycle_cost;   ///< indices, lowest life-cycle cost first
    std::optional<uncertainty_result> uncertainty; ///< the price draws, when asked for
    std::vector<issue> warnings;                   ///< the verdict's own (assumed economics, no baseline, draws cancelled)
};

/// Evaluates, ranks and (when wanted and `clean`, i.e. the scenario was read without errors) appraises a
/// scenario; `progress(done_fraction)` follows the price draws and may cancel them by returning false.
scenario_verdict judge(const scenario& input, bool clean, const std::function<bool(double)>& progress);

}  // namespace fw

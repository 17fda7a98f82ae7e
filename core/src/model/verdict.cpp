#include "model/verdict.hpp"

#include <algorithm>
#include <numeric>
#include <string>

#include "base/units.hpp"

namespace fw {

std::vector<std::size_t> ranked_ascending(const std::vector<double>& values) {
    std::vector<std::size_t> order(values.size());
    std::iota(order.begin(), order.end(), std::size_t{0});
    std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return values[a] < values[b]; });
    return order;
}

bool economics_wanted(const scenario& input) {
    bool wanted = input.economics.has_value() || input.uncertainty.has_value();
    for (const auto& option : input.options) wanted = wanted || option.existing || option.installed_cost > 0;
    return wanted;
}

scenario_verdict judge(const scenario& input, bool clean, const std::function<bool(double)>& progress) {
    scenario_verdict out;
    out.evaluated = evaluate_scenario(input);
    const auto& results = out.evaluated.results;
    std::vector<double> annual;
    for (const auto& r : results) annual.push_back(r.annual_cost);
    out.by_annual_cost = ranked_ascending(annual);
    if (!economics_wanted(input) || !clean || !out.evaluated.errors.empty()) return out;
    const auto economics = input.economics.value_or(economics_settings{});
    out.economics = economics;
    if (!economics.given)
        out.warnings.push_back({"/economics", "no economics given: " + std::to_string(economics.analysis_years) + " years, " +
                                                  format_number(100 * economics.discount_rate) +
                                                  " % real discount rate, no price escalation (assumptions)"});
    out.baseline = baseline_index(out.evaluated);
    if (!out.baseline)
        out.warnings.push_back({"/options", "no option is marked existing: savings, payback and NPV need the system in "
                                            "the house now as the baseline"});
    out.appraised = appraise(input, out.evaluated, economics, out.baseline);
    std::vector<double> life_cycle;
    for (const auto& x : out.appraised) life_cycle.push_back(x.life_cycle_cost);
    out.by_life_cycle_cost = ranked_ascending(life_cycle);
    if (input.uncertainty) {
        out.uncertainty = monte_carlo(input, out.evaluated, out.appraised, *input.uncertainty, progress);
        if (out.uncertainty->cancelled)
            out.warnings.push_back({"/uncertainty", "cancelled after " + std::to_string(out.uncertainty->draws) + " draws"});
    }
    return out;
}

}  // namespace fw

// Appraisal (economics layer on top of the evaluated options): life-cycle cost, payback, NPV
// against the existing system, levelized cost of heat, Monte Carlo over prices, break-even
// prices and efficiencies, sweeps and tornado data.
#pragma once
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "model/economics.hpp"
#include "model/scenario.hpp"

namespace fw {

/// Every option of a scenario evaluated, with the errors that stopped any of them.
struct evaluation {
    std::vector<option_result> results;
    std::vector<const scenario_option*> options;  ///< parallel to results
    std::vector<issue> errors;
};
evaluation evaluate_scenario(const scenario& input);

struct option_economics {
    double net_installed_cost = 0;     ///< installed - incentives, at t = 0
    double replacement_pv = 0, residual_pv = 0;
    double energy_fixed_pv = 0, maintenance_pv = 0;
    double life_cycle_cost = 0;
    double lcoh_per_kwh = 0;
    std::optional<double> annual_saving, simple_payback_years, discounted_payback_years, npv;
    std::string payback_reason, discounted_payback_reason;
    std::optional<double> co2e_saved_kg_life, cost_per_tonne_co2e_avoided;
    std::vector<double> part_upw;      ///< UPW* of each cost part (its fuel's escalation)
    std::optional<double> life_years;  ///< service life used [years]: as entered, else the catalog record's median
    bool life_from_catalog = false;    ///< whether `life_years` is the catalog's, not entered
    std::vector<std::string> trace;
};

/// Life-cycle economics of every evaluated option; `baseline` is the index of the existing option.
std::vector<option_economics> appraise(const scenario& input, const evaluation& evaluated,
                                       const economics_settings& economics, std::optional<std::size_t> baseline);

/// Whether the option is evaluated on temperature bins (an air-source heat pump with a climate).
bool input_has_bins(const scenario& input, const scenario_option& option);

/// The index of the option marked existing, if it was evaluated.
std::optional<std::size_t> baseline_index(const evaluation& evaluated);

struct option_uncertainty {
    std::string id;
    double p_cheapest = 0;
    double annual_cost_p10 = 0, annual_cost_p50 = 0, annual_cost_p90 = 0;
    double life_cycle_cost_p10 = 0, life_cycle_cost_p50 = 0, life_cycle_cost_p90 = 0;
    double life_cycle_cost_mean = 0, life_cycle_cost_standard_error = 0;
};

struct uncertainty_result {
    int draws = 0;
    std::uint64_t seed = 0;
    bool cancelled = false;
    std::vector<option_uncertainty> options;
    std::vector<std::string> notes;
};

/// Monte Carlo: per draw one price factor per fuel (lognormal with median 1, or triangular), held over
/// the analysis period, and a demand factor where the demand method gives a standard error.
/// `progress(done_fraction)` is called about 100 times; returning false cancels.
uncertainty_result monte_carlo(const scenario& input, const evaluation& evaluated,
                               const std::vector<option_economics>& economics, const uncertainty_settings& uncertainty,
                               const std::function<bool(double)>& progress);

}  // namespace fw

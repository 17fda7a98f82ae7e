// What-if analyses (model layer), typed: the scenario evaluated again with one input changed —
// the break-even of two options, every option's cost over a range (sweep), and each input's sway on
// the winner's margin (tornado). The json layer reads the requests and writes the answers.
#pragma once
#include <cstddef>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "model/appraisal.hpp"

namespace fw {

enum class cost_basis { annual, life_cycle };
enum class variable_kind { price, efficiency, demand };

/// "price", "efficiency" or "demand", as requests and answers spell the kind.
const char* variable_kind_name(variable_kind kind);

/// What is varied: one option's price, one fuel's price in every option, one option's efficiency, or demand.
struct analysis_variable {
    variable_kind kind = variable_kind::price;
    std::vector<std::size_t> options;  ///< the options whose price or efficiency changes
    double current = 0;                ///< in `unit`
    std::string unit;
    std::string label;                 ///< "the price of propane", ...
    std::string of;                    ///< the option id or fuel id named (or the default option's id)
};

struct analysis_context {
    scenario input;
    economics_settings economics;
    cost_basis basis = cost_basis::annual;
    std::vector<issue> warnings;
    std::vector<double> today_costs;  ///< every option's annual or life-cycle cost at today's inputs [currency]
};

/// The scenario evaluated as it is; throws input_error (path under /scenario) for an option that cannot be.
evaluation evaluate_for_analysis(const scenario& input);

/// The context of an analysis on `basis`: today's costs of every option (and a warning for assumed economics).
analysis_context make_analysis_context(scenario input, const evaluation& evaluated, cost_basis basis);

/// The index of option `id`; throws input_error at `path` naming the known ids.
std::size_t option_index(const scenario& input, const std::string& id, const std::string& path);

/// The variable of `kind` for option or fuel `of` (else option `default_option`); throws input_error at /of.
analysis_variable variable_for(const analysis_context& context, variable_kind kind, const std::optional<std::string>& of,
                               std::size_t default_option);

/// [currency] Annual or life-cycle cost of every option of `input`.
std::vector<double> option_costs(const analysis_context& context, const scenario& input);

/// [currency] Annual or life-cycle cost of option k alone.
double option_cost(const analysis_context& context, const scenario& input, std::size_t k);

/// The scenario with the variable set to x (prices and block rates scaled together).
scenario with_value(const scenario& input, const analysis_variable& v, double x);

/// Whether option k's cost can change with the variable.
bool depends_on(const scenario& input, const analysis_variable& v, std::size_t k);

/// The largest value the option's rating allows (percent ratings), or infinity.
double upper_limit(const scenario_option& option);

struct crossing {
    std::optional<double> value;
    std::string reason;
};

/// Where cost(a) = cost(b) as the variable changes; linear in price (in 1/efficiency), polished by the
/// Illinois method where it is not.
crossing find_crossing(const analysis_context& context, const analysis_variable& v, std::size_t a, std::size_t b);

struct break_even_result {
    crossing found;
    double cost_a = 0, cost_b = 0;          ///< [currency] at the break-even
    std::size_t cheaper_above = 0, cheaper_below = 0;
    std::string statement;
};
/// The break-even of options a and b for the variable, with the costs there and which is cheaper either side.
break_even_result break_even(const analysis_context& context, const analysis_variable& v, std::size_t a, std::size_t b);

struct sweep_result {
    std::vector<double> x;
    std::vector<std::vector<double>> cost;                     ///< per option, per x [currency]
    std::vector<std::pair<std::size_t, double>> crossings;     ///< option crossed by the varied one, at x
};
/// Every option's cost at n values from `from` to `to` (exact lines where the cost is linear in the variable).
sweep_result sweep(const analysis_context& context, const analysis_variable& v, double from, double to, int n);

/// One what-if: every option's cost with the variable set to one value, ranked, and each option's
/// saving against the existing system (when the scenario marks one).
struct what_if_result {
    double value = 0;                         ///< in the variable's unit
    std::vector<double> cost;                 ///< per option [currency a year, or over the life cycle]
    std::vector<std::size_t> ranking;         ///< option indexes, cheapest first (ties keep the scenario's order)
    std::optional<std::size_t> existing;      ///< the option marked existing
    std::vector<std::optional<double>> saving; ///< per option: the existing option's cost less its own [currency]
};
/// Every option's cost with the variable at `value` (options it cannot reach keep today's cost).
what_if_result what_if(const analysis_context& context, const analysis_variable& v, double value);

struct tornado_row {
    analysis_variable variable;
    double margin_low = 0, margin_high = 0;  ///< [currency] the runner-up's cost less the winner's
    double swing = 0;                        ///< |margin_high - margin_low|
};
struct tornado_result {
    std::size_t winner = 0, runner_up = 0;
    double margin = 0;
    std::vector<tornado_row> rows;  ///< largest swing first
};
/// Each price, efficiency and the demand moved by -/+`step`: the winner's margin over the runner-up.
tornado_result tornado(const analysis_context& context, double step);

}  // namespace fw

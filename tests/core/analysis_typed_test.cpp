// The what-if analyses typed (model/analysis.hpp): a scenario read once, then the tornado, the sweep and
// the break-even called and checked as values, with no JSON between them. The example is invented.
#include <gtest/gtest.h>

#include <cmath>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>

#include "json/scenario_reader.hpp"
#include "model/analysis.hpp"

namespace {

fw::analysis_context context_of(const std::string& file, fw::cost_basis basis) {
    std::ifstream in(file);
    std::stringstream text;
    text << in.rdbuf();
    std::vector<fw::issue> errors, warnings;
    auto input = fw::read_scenario(nlohmann::json::parse(text.str()), errors, warnings);
    EXPECT_TRUE(errors.empty());
    const auto evaluated = fw::evaluate_for_analysis(input);
    return fw::make_analysis_context(std::move(input), evaluated, basis);
}

TEST(analysis_typed, tornado_rows_are_sorted_by_swing_and_the_margin_is_the_runner_ups_lead) {
    const auto context = context_of("data/examples/maple-hollow-gas-vs-heat-pump.json", fw::cost_basis::annual);
    const auto result = fw::tornado(context, 0.2);
    ASSERT_GE(result.rows.size(), 3u);
    EXPECT_NEAR(result.margin, context.today_costs[result.runner_up] - context.today_costs[result.winner], 1e-9);
    for (std::size_t i = 1; i < result.rows.size(); ++i) EXPECT_GE(result.rows[i - 1].swing, result.rows[i].swing);
    for (const auto& row : result.rows) EXPECT_DOUBLE_EQ(row.swing, std::fabs(row.margin_high - row.margin_low));
}

TEST(analysis_typed, a_price_sweep_is_a_line_and_its_crossing_is_the_break_even) {
    const auto context = context_of("data/examples/maple-hollow-gas-vs-heat-pump.json", fw::cost_basis::annual);
    const auto v = fw::variable_for(context, fw::variable_kind::price, std::nullopt, 0);
    const auto sweep = fw::sweep(context, v, 0.5 * v.current, 1.5 * v.current, 11);
    ASSERT_EQ(sweep.x.size(), 11u);
    // option 0's cost is linear in its own price: equal steps between equal steps of price
    const auto& own = sweep.cost[0];
    for (std::size_t i = 2; i < own.size(); ++i) EXPECT_NEAR(own[i] - own[i - 1], own[1] - own[0], 1e-9 * std::fabs(own[0]));
    ASSERT_FALSE(sweep.crossings.empty()) << "the gas price crosses the heat pump's cost within half to one and a half times today's";
    for (const auto& [k, x] : sweep.crossings) {
        const auto even = fw::break_even(context, v, 0, k);
        ASSERT_TRUE(even.found.value.has_value());
        EXPECT_NEAR(*even.found.value, x, 1e-12 * x);
        EXPECT_NEAR(even.cost_a, even.cost_b, 1e-6 * even.cost_a);
    }
}

TEST(analysis_typed, a_what_if_is_the_sweep_at_that_value_ranked_with_savings_against_the_existing_system) {
    const auto context = context_of("data/examples/maple-hollow-heat-pump-bins.json", fw::cost_basis::annual);
    const auto v = fw::variable_for(context, fw::variable_kind::price, std::string("electricity"), 0);
    const auto sweep = fw::sweep(context, v, 0.5 * v.current, 1.5 * v.current, 11);
    const auto at = fw::what_if(context, v, sweep.x[3]);
    ASSERT_EQ(at.cost.size(), sweep.cost.size());
    for (std::size_t k = 0; k < at.cost.size(); ++k) EXPECT_NEAR(at.cost[k], sweep.cost[k][3], 1e-9 * sweep.cost[k][3]);
    for (std::size_t r = 1; r < at.ranking.size(); ++r) EXPECT_LE(at.cost[at.ranking[r - 1]], at.cost[at.ranking[r]]);
    ASSERT_TRUE(at.existing.has_value());
    EXPECT_EQ(context.input.options[*at.existing].id, "gas-furnace");
    for (std::size_t k = 0; k < at.cost.size(); ++k) EXPECT_DOUBLE_EQ(*at.saving[k], at.cost[*at.existing] - at.cost[k]);
    // At today's value the what-if gives today's costs.
    const auto today = fw::what_if(context, v, v.current);
    for (std::size_t k = 0; k < today.cost.size(); ++k)
        EXPECT_NEAR(today.cost[k], context.today_costs[k], 1e-9 * context.today_costs[k]);
}

}  // namespace

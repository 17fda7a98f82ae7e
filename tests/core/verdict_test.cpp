// The verdict's ranking and its choice of economics, typed (model/verdict.hpp), without JSON.
#include <memory>
#include <gtest/gtest.h>

#include "model/verdict.hpp"

namespace {

TEST(verdict, ranking_is_ascending_and_keeps_ties_in_their_order) {
    EXPECT_EQ(fw::ranked_ascending({1200.5, 980.0, 1200.5, 640.25}), (std::vector<std::size_t>{3, 1, 0, 2}));
    EXPECT_TRUE(fw::ranked_ascending({}).empty());
}

TEST(verdict, economics_apply_when_asked_for_or_when_a_cost_or_the_existing_system_is_given) {
    fw::scenario input;
    input.options.resize(2);
    EXPECT_FALSE(fw::economics_wanted(input)) << "running costs only";
    input.options[1].installed_cost = 9000;
    EXPECT_TRUE(fw::economics_wanted(input)) << "an installed cost";
    input.options[1].installed_cost = 0;
    input.options[0].existing = true;
    EXPECT_TRUE(fw::economics_wanted(input)) << "the system in the house now is the baseline";
    input.options[0].existing = false;
    input.economics.emplace();
    EXPECT_TRUE(fw::economics_wanted(input)) << "economics asked for";
}

TEST(verdict, a_scenario_read_with_errors_is_ranked_but_not_appraised) {
    const auto input = std::make_unique<fw::scenario>();
    input->economics.emplace();
    const auto verdict = fw::judge(*input, false, [](double) { return true; });
    EXPECT_FALSE(verdict.economics.has_value());
    EXPECT_TRUE(verdict.appraised.empty());
    EXPECT_TRUE(verdict.warnings.empty());
}

}  // namespace

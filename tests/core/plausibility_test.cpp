// Plausibility warnings: entries the hard limits accept but no house has are questioned at their field
// with the range a house has, and the scenario is still evaluated.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "fw/api.hpp"

namespace {

using nlohmann::json;
using strings = std::vector<std::string>;

/// A one-option gas-furnace scenario (60 MMBtu direct demand, electricity priced for the blower) with
/// `patch` merged into the option and `top` into the scenario.
json gas_scenario(const json& patch, const json& top = json::object()) {
    json option = {{"id", "gas"},
                   {"fuel", "natural-gas"},
                   {"price", {{"amount", 1.45}, {"per", "therm"}}},
                   {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 95}, {"rating", "AFUE"}}}}}};
    option.merge_patch(patch);
    json scenario = {{"schema", "fuelwright.scenario/1"},
                     {"settings", {{"units", "us"}, {"currency", "USD"}, {"electricity", {{"price", {{"amount", 0.16}, {"per", "kWh"}}}}}}},
                     {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 60}, {"unit", "MMBtu"}}}}},
                     {"options", json::array({option})}};
    scenario.merge_patch(top);
    return scenario;
}

/// The plausibility warnings of an evaluation ("path: message"); the evaluation must have no errors.
strings questions_of(const json& scenario) {
    const auto result = json::parse(fw::evaluate_json(scenario.dump()));
    EXPECT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_FALSE(result.at("options").empty());
    strings out;
    for (const auto& w : result.at("warnings")) {
        const auto path = w.at("path").get<std::string>();
        if (path.find("/price/amount") != std::string::npos || path.find("/efficiency/value") != std::string::npos ||
            path.find("/capacity/value") != std::string::npos || path.rfind("/economics/", 0) == 0 ||
            path.find("/fixed_charges/") != std::string::npos)
            out.push_back(path + ": " + w.at("message").get<std::string>());
    }
    return out;
}

TEST(plausibility, a_house_as_quoted_raises_no_question) {
    EXPECT_EQ(questions_of(gas_scenario(json::object(), {{"economics", {{"discount_rate", 0.03}, {"escalation", 0.02}}}})),
              strings{});
}

TEST(plausibility, a_price_no_household_pays_is_questioned_with_the_range_in_its_unit) {
    // 1,000 USD a therm is 34 USD per kWh (1 therm = 29.3071 kWh, NIST SP 811); the band is 0.003-2 USD/kWh
    // (common practice), 0.088-59 USD a therm.
    EXPECT_EQ(questions_of(gas_scenario({{"price", {{"amount", 1000}}}})),
              strings{"/options/0/price/amount: 1000 USD per therm is above what households pay for Natural gas (about "
                      "0.088 to 59 USD per therm, 0.003 to 2 USD per kWh of heat in the fuel); check the price and its unit"});
    // A price typed in dollars for a unit priced in cents: 0.0145 USD a therm.
    EXPECT_EQ(questions_of(gas_scenario({{"price", {{"amount", 0.0145}}}})),
              strings{"/options/0/price/amount: 0.0145 USD per therm is below what households pay for Natural gas (about "
                      "0.088 to 59 USD per therm, 0.003 to 2 USD per kWh of heat in the fuel); check the price and its unit"});
    // Kronor: the band is ten times the dollar's; 14.5 SEK a therm (0.49 SEK/kWh) is ordinary.
    EXPECT_EQ(questions_of(gas_scenario({{"price", {{"amount", 14.5}}}}, {{"settings", {{"currency", "SEK"}}}})), strings{});
    // A currency the band does not know is not questioned.
    EXPECT_EQ(questions_of(gas_scenario({{"price", {{"amount", 1000}}}}, {{"settings", {{"currency", "JPY"}}}})), strings{});
}

TEST(plausibility, a_free_fuel_and_a_fixed_charge_no_household_pays_are_questioned) {
    EXPECT_EQ(questions_of(gas_scenario({{"price", {{"amount", 0}}}})),
              strings{"/options/0/price/amount: a price of 0 counts Natural gas as free; check the price"});
    // A fixed charge typed a thousand times over; residential customer charges are about 5-50 USD a month (common practice).
    EXPECT_EQ(questions_of(gas_scenario({{"fixed_charges", json::array({{{"label", "customer charge"}, {"amount_per_month", 1500}}})}})),
              strings{"/options/0/fixed_charges/0/amount_per_month: 1500 USD a month is more than a household's service costs to "
                      "keep (at most about 300 USD a month); check the amount and whether it is per month or per year"});
    // 180 a year is 15 a month: no question.
    EXPECT_EQ(questions_of(gas_scenario({{"fixed_charges", json::array({{{"label", "customer charge"}, {"amount_per_year", 180}}})}})),
              strings{});
}

TEST(plausibility, an_efficiency_below_any_appliance_in_use_is_questioned) {
    EXPECT_EQ(questions_of(gas_scenario({{"system", {{"efficiency", {{"value", 9.5}}}}}})),
              strings{"/options/0/system/efficiency/value: AFUE 9.5 % is below any furnace, boiler or stove in use (the "
                      "oldest still running rate about 50-60 %); check the data sheet"});
    EXPECT_EQ(questions_of(gas_scenario({{"system", {{"efficiency", {{"value", 55}}}}}})), strings{});
}

TEST(plausibility, a_condensing_rating_on_a_non_condensing_type_is_questioned) {
    // Non-condensing furnaces rate about 78-85 % AFUE, condensing ones 90 % and more (common practice).
    EXPECT_EQ(questions_of(gas_scenario({{"system", {{"catalog", "gas-furnace-standard"}}}})),
              strings{"/options/0/system/efficiency/value: AFUE 95 % is a condensing rating; a non-condensing furnace rates at most "
                      "about 88 %: check the rating, or choose the condensing type"});
    EXPECT_EQ(questions_of(gas_scenario({{"system", {{"catalog", "gas-furnace-condensing"}}}})), strings{});
    EXPECT_EQ(questions_of(gas_scenario({{"system", {{"catalog", "gas-furnace-standard"}, {"efficiency", {{"value", 80}}}}}})), strings{});
}

TEST(plausibility, a_heat_pump_of_a_few_btu_per_hour_is_questioned_at_its_capacity) {
    const json heat_pump = {{"id", "hp"},
                            {"fuel", "electricity"},
                            {"price", {{"amount", 0.16}, {"per", "kWh"}}},
                            {"system",
                             {{"kind", "air-source-heat-pump"},
                              {"efficiency", {{"value", 9}, {"rating", "HSPF2"}}},
                              {"capacity", {{"value", 3}, {"unit", "Btu/h"}}}}}};
    // 3 Btu/h = 0.000879 kW (1 W = 3.412 Btu/h, NIST SP 811).
    EXPECT_EQ(questions_of(gas_scenario(heat_pump)),
              strings{"/options/0/system/capacity/value: a heat pump of 0.000879 kW (3 Btu/h) is smaller than any sold for a "
                      "house (about 1.5 to 60 kW, 5,000 to 200,000 Btu/h); check the capacity and its unit"});
    json three_tons = heat_pump;
    three_tons["system"]["capacity"]["value"] = 36000;
    EXPECT_EQ(questions_of(gas_scenario(three_tons)), strings{});
}

TEST(plausibility, economics_outside_a_households_rates_are_questioned) {
    EXPECT_EQ(questions_of(gas_scenario(json::object(), {{"economics", {{"discount_rate", -0.5}}}})),
              strings{"/economics/discount_rate: a discount rate of -50 % a year is outside what a household uses (0 to 15 "
                      "%; 3 % real is usual); it makes future costs weigh more than today's"});
    EXPECT_EQ(questions_of(gas_scenario(json::object(), {{"economics", {{"discount_rate", 0.4}}}})),
              strings{"/economics/discount_rate: a discount rate of 40 % a year is outside what a household uses (0 to 15 "
                      "%; 3 % real is usual); it all but ignores costs after the first years"});
    EXPECT_EQ(questions_of(gas_scenario(json::object(), {{"economics", {{"escalation", {{"natural-gas", 0.5}}}}}})),
              strings{"/economics/escalation/natural-gas: an escalation of 50 % a year is outside any published price "
                      "outlook (-10 to +15 % a year)"});
}

}  // namespace

// Findings of the structure-aware scenario fuzzer (tools/fuzz, target `scenario`): each input that
// gave an "internal error", a crash or a hang, reduced to the field that caused it, with the message
// the user now gets at that field.
#include <gtest/gtest.h>

#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "fw/api.hpp"

namespace {

using nlohmann::json;
using strings = std::vector<std::string>;

/// A one-option gas-furnace scenario (60 MMBtu direct demand) with `patch` merged into the option.
json gas_scenario(const json& patch) {
    json option = {{"id", "gas"},
                   {"fuel", "natural-gas"},
                   {"price", {{"amount", 1.4}, {"per", "therm"}}},
                   {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 95}, {"rating", "AFUE"}}}}}};
    option.merge_patch(patch);
    return {{"schema", "fuelwright.scenario/1"},
            {"settings", {{"units", "us"}, {"currency", "USD"}}},
            {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 60}, {"unit", "MMBtu"}}}}},
            {"options", json::array({option})}};
}

/// The errors of evaluating a scenario as "path: message" lines.
strings errors_of(const json& scenario) {
    const auto result = json::parse(fw::evaluate_json(scenario.dump()));
    strings out;
    for (const auto& error : result.at("errors"))
        out.push_back(error.at("path").get<std::string>() + ": " + error.at("message").get<std::string>());
    return out;
}

TEST(fuzz_findings, a_tiny_percentage_efficiency_is_refused_at_its_field) {
    // Found: an oil boiler at 1e-300 AFUE burned 1e304 kWh, and its CH4 came out as Infinity.
    EXPECT_EQ(errors_of(gas_scenario({{"system", {{"efficiency", {{"value", 1e-300}}}}}})),
              strings{"/options/0/system/efficiency/value: AFUE must be from 1 to 100 % (95 for 95 %), got 1e-300"});
    EXPECT_EQ(errors_of(gas_scenario({{"system", {{"efficiency", {{"value", 0.95}, {"rating", "thermal"}}}}}})),
              strings{"/options/0/system/efficiency/value: thermal must be from 1 to 100 % (95 for 95 %), got 0.95"});
    EXPECT_EQ(errors_of(gas_scenario({{"system", {{"efficiency", {{"value", 0.9}, {"rating", "seasonal-ncv"}}}}}})),
              strings{"/options/0/system/efficiency/value: seasonal-ncv must be at least 1 % (95 for 95 %), got 0.9"});
    // The lowest accepted value still evaluates: 60 MMBtu / 0.01 = 6000 MMBtu = 60000 therm.
    const auto result = json::parse(fw::evaluate_json(gas_scenario({{"system", {{"efficiency", {{"value", 1}}}}}}).dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_NEAR(result.at("options")[0].at("fuel_quantity").at("value").get<double>(), 60000.0, 1e-6);
}

}  // namespace

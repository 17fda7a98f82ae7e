// Findings of the structure-aware scenario fuzzer (tools/fuzz, target `scenario`): each input that
// gave an "internal error", a crash or a hang, reduced to the field that caused it, with the message
// the user now gets at that field.
#include <gtest/gtest.h>

#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
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
    const auto result =
        json::parse(fw::evaluate_json(gas_scenario({{"system", {{"efficiency", {{"value", 1}}}}}}).dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_NEAR(result.at("options")[0].at("fuel_quantity").at("value").get<double>(), 60000.0, 1e-6);
}

TEST(fuzz_findings, an_annual_heat_out_of_range_is_refused_at_its_field) {
    // Found: 2.2e-308 MMBtu of useful heat with a 16 USD/month charge gave an Infinity cost per useful GJ.
    auto scenario = gas_scenario(json::object());
    scenario["demand"]["annual_useful_heat"]["value"] = 2.2250738585072014e-308;
    EXPECT_EQ(errors_of(scenario), strings{"/demand/annual_useful_heat/value: must be from 1 kWh to 5,000 MWh a year "
                                           "(0.00341214 to 17060.7 MMBtu), got 2.22507e-308 MMBtu"});
    scenario["demand"]["annual_useful_heat"] = {{"value", 60}, {"unit", "MMBtu"}};
    // 1e300 MMBtu of hot water is Infinity in kWh; it was written into the result before it was refused.
    scenario["demand"]["hot_water"] = {{"value", 1e300}, {"unit", "MMBtu"}};
    EXPECT_EQ(errors_of(scenario), strings{"/demand/hot_water/value: 1e+300 MMBtu is too large to convert to kWh"});
    scenario["demand"]["hot_water"] = {{"value", 1e300}, {"unit", "kWh"}};
    EXPECT_EQ(errors_of(scenario), strings{"/demand/hot_water/value: must be from 0 to 5,000 MWh a year "
                                           "(0 to 5e+06 kWh), got 1e+300 kWh"});
    // Worked out from a heat loss: 0.001 W/K x 2900 K day x 24 h / 1000 = 0.0696 kWh a year.
    scenario["demand"] = {{"method", "heat-loss"}, {"ua", {{"value", 0.001}, {"unit", "W/K"}}}};
    scenario["climate"] = {
        {"unit", "degC"}, {"annual_hdd", 2900}, {"design_temperature", {{"value", -10}, {"unit", "degC"}}}};
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand: the annual useful heat works out at 0.0696 kWh; it must be from 1 kWh "
                      "to 5,000 MWh a year: check the demand inputs"});
}

/// An example scenario of data/examples/ as JSON.
json example(const std::string& name) {
    std::ifstream file("data/examples/" + name);
    std::stringstream text;
    text << file.rdbuf();
    return json::parse(text.str());
}

/// The bills example (data/examples/fjordvik-oil-bills.json, twelve monthly oil bills) as JSON.
json bills_example() {
    return example("fjordvik-oil-bills.json");
}

TEST(fuzz_findings, a_bill_of_many_years_is_refused_instead_of_hanging) {
    // Near-hang: a bill from 0001-01-01 made the weather fit walk its 739,282 days for each of its 141
    // trial base temperatures (about 5 s in the fuzz build); a later end date makes it longer still.
    auto scenario = bills_example();
    ASSERT_EQ(errors_of(scenario), strings{});
    scenario["demand"]["bills"][0]["start"] = "0001-01-01";
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand/bills/0/end: the period 0001-01-01 to 2025-01-31 spans 739281 days; a "
                      "bill covers at most a year (split a longer period)"});
    // A year's bill in a leap year is accepted, whether its end date is the last day or the next reading.
    for (const char* end : {"2024-12-31", "2025-01-01"}) {
        scenario["demand"]["bills"] =
            json::array({{{"start", "2024-01-01"}, {"end", end}, {"quantity", 2400}, {"unit", "L"}}});
        EXPECT_EQ(errors_of(scenario), strings{}) << end;
    }
    scenario["demand"]["bills"][0]["end"] = "2025-01-02";
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand/bills/0/end: the period 2024-01-01 to 2025-01-02 spans 367 days; a bill "
                      "covers at most a year (split a longer period)"});
}

TEST(fuzz_findings, an_amount_of_money_above_a_billion_is_refused_at_its_field) {
    // Found: a price of 1e300 (and 1.8e308) per kWh gave an Infinity annual cost and Monte Carlo mean.
    const std::string range = "must be from 0 to 1000000000 (a billion), got 1e+300";
    EXPECT_EQ(errors_of(gas_scenario({{"price", {{"amount", 1e300}}}})), strings{"/options/0/price/amount: " + range});
    EXPECT_EQ(
        errors_of(gas_scenario(
            {{"price", {{"tiers", {{{"from", 0}, {"to", 50}, {"amount", 1}}, {{"from", 50}, {"amount", 1e300}}}}}}})),
        strings{"/options/0/price/tiers/1/amount: " + range});
    EXPECT_EQ(errors_of(gas_scenario({{"fixed_charges", {{{"amount_per_month", 1e300}}}}})),
              strings{"/options/0/fixed_charges/0/amount_per_month: " + range});
    EXPECT_EQ(errors_of(gas_scenario({{"fixed_charges", {{{"amount_per_year", 1e300}}}}})),
              strings{"/options/0/fixed_charges/0/amount_per_year: " + range});
    EXPECT_EQ(errors_of(gas_scenario({{"installed_cost", 1e300}})), strings{"/options/0/installed_cost: " + range});
    EXPECT_EQ(errors_of(gas_scenario({{"annual_maintenance", 1e300}})),
              strings{"/options/0/annual_maintenance: " + range});
    // A billion itself is accepted: 631.579 therm x 1e9 USD.
    const auto result = json::parse(fw::evaluate_json(gas_scenario({{"price", {{"amount", 1e9}}}}).dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_NEAR(result.at("options")[0].at("annual_cost").get<double>(), 631.578947368421e9, 1e3);
}

TEST(fuzz_findings, an_option_id_that_is_not_a_string_does_not_break_a_bills_demand) {
    // Found: a bills demand naming its option looked through the options with json::value("id", ""),
    // which throws on an id that is an array: "internal error: [json.exception.type_error.302] ...".
    auto scenario = bills_example();
    scenario["options"].push_back(scenario["options"][0]);
    scenario["options"].back()["id"] = json::array();
    EXPECT_EQ(errors_of(scenario), strings{"/options/4/id: must be a string, got array"});
}

TEST(fuzz_findings, a_heating_value_far_from_the_catalog_is_refused_at_its_field) {
    // Found by the fuzzer (tools/fuzz --runs 1000000 scenario, after 10,625 runs): 1.8e308 MJ/m3 in the
    // metric-boiler example gave an Infinity heating value per unit. Found by a targeted probe beside it:
    // 1e300 Btu/therm came back as "value must be a finite
    // number, got Infinity" at the empty path, not at the field; 1e-300 Btu/therm gave 6e307 therm a year;
    // 1e308 MJ/m3 is Infinity in J.
    EXPECT_EQ(errors_of(gas_scenario({{"heating_value", {{"value", 1e300}, {"unit", "Btu/therm"}}}})),
              strings{"/options/0/heating_value/value: must be within a factor of 2 of the catalog's 100000 Btu/therm "
                      "(HHV): from 50000 to 200000, got 1e+300"});
    EXPECT_EQ(errors_of(gas_scenario({{"heating_value", {{"value", 1e-300}, {"unit", "Btu/therm"}}}})),
              strings{"/options/0/heating_value/value: must be within a factor of 2 of the catalog's 100000 Btu/therm "
                      "(HHV): from 50000 to 200000, got 1e-300"});
    EXPECT_EQ(errors_of(gas_scenario({{"heating_value", {{"value", 1e308}, {"unit", "MJ/m3"}}}})),
              strings{"/options/0/heating_value/value: must be within a factor of 2 of the catalog's 38.6746 MJ/m3 "
                      "(HHV): from 19.3373 to 77.3491, got 1e+308"});
    // A value of the right size in another unit of the fuel is still taken: 1.05 MJ/ft3 for gas priced per therm.
    const auto result =
        json::parse(fw::evaluate_json(gas_scenario({{"heating_value", {{"value", 1.05}, {"unit", "MJ/ft3"}}}}).dump()));
    EXPECT_TRUE(result.at("errors").empty()) << result.dump();
}

TEST(fuzz_findings, a_rate_below_minus_50_percent_is_refused_at_its_field) {
    // Found by a targeted probe beside the fuzzer: a discount rate of -0.999999999 gave an LCOH of NaN
    // ((1 + e) / (1 + d) to the 15th power overflows).
    auto scenario = gas_scenario({{"installed_cost", 5000}});
    scenario["economics"] = {{"discount_rate", -0.999999999}};
    EXPECT_EQ(errors_of(scenario),
              strings{"/economics/discount_rate: a rate must be from -50 % to 100 % per year (-0.5 to 1 "
                      "as fractions), got -1"});
    scenario["economics"] = {{"discount_rate", -0.5}, {"escalation", 1}, {"analysis_years", 50}};
    EXPECT_EQ(errors_of(scenario), strings{});
}

/// The scenario with a pellet stove priced per bag (or a cordwood stove per face cord) added.
json with_wood_option(const json& patch) {
    json option = {{"id", "wood"},
                   {"fuel", "wood-pellets"},
                   {"price", {{"amount", 6}, {"per", "bag"}}},
                   {"bag_mass", {{"value", 40}, {"unit", "lb"}}},
                   {"system", {{"kind", "stove"}, {"efficiency", {{"value", 80}, {"rating", "thermal"}}}}}};
    option.merge_patch(patch);
    auto scenario = gas_scenario(json::object());
    scenario["options"].push_back(option);
    return scenario;
}

TEST(fuzz_findings, a_bag_or_face_cord_of_almost_nothing_is_refused_at_its_field) {
    // Found by a targeted probe beside the fuzzer: a 1e-300 kg bag at 1e9 USD a bag, and 1e-300 of a
    // cord at 1e9 USD a face cord, gave an Infinity annual cost.
    EXPECT_EQ(
        errors_of(with_wood_option({{"bag_mass", {{"value", 1e-300}, {"unit", "kg"}}}, {"price", {{"amount", 1e9}}}})),
        strings{"/options/1/bag_mass/value: a bag must hold from 1 to 2000 kg (1 to 2000 kg), got 1e-300 kg"});
    EXPECT_EQ(
        errors_of(with_wood_option({{"bag_mass", {{"value", 1e-300}, {"unit", "lb"}}}})),
        strings{"/options/1/bag_mass/value: a bag must hold from 1 to 2000 kg (2.20462 to 4409.25 lb), got 1e-300 lb"});
    EXPECT_EQ(
        errors_of(with_wood_option({{"fuel", "cordwood"},
                                    {"price", {{"amount", 1e9}, {"per", "face_cord"}}},
                                    {"bag_mass", nullptr},
                                    {"face_cord_fraction", 1e-300}})),
        strings{"/options/1/face_cord_fraction: must be a fraction of a cord from 0.1 to 1 (a face cord is usually 1/3 "
                "of a cord), got 1e-300"});
    EXPECT_EQ(errors_of(with_wood_option(json::object())), strings{});
}

TEST(fuzz_findings, an_electricity_emission_factor_above_10_kg_per_kwh_is_refused_at_its_field) {
    // Found by the fuzzer (tools/fuzz --runs 1000000 scenario, after 3,575 runs): 1.8e308 kg/kWh in the
    // heat-pump bins example gave an Infinity fossil CO2 for the heat pump.
    auto scenario = gas_scenario(json::object());
    scenario["settings"]["electricity_co2e_kg_per_kwh"] = 1.7976931348623157e308;
    EXPECT_EQ(errors_of(scenario),
              strings{"/settings/electricity_co2e_kg_per_kwh: must be from 0 to 10 kg CO2e per kWh "
                      "(coal-fired power emits about 1), got 1.79769e+308"});
    scenario["settings"]["electricity_co2e_kg_per_kwh"] = 10;
    EXPECT_EQ(errors_of(scenario), strings{});
}

TEST(fuzz_findings, a_bill_of_more_fuel_than_a_house_burns_is_refused_at_its_field) {
    // Found by a targeted probe beside the fuzzer: 1e300 L on one oil bill gave an R^2 of NaN for the fit.
    auto scenario = bills_example();
    scenario["demand"]["bills"][0]["quantity"] = 1e300;
    // 10,000 MWh of heating oil at 10.72 kWh/L (the catalog's) is 932,589 L.
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand/bills/0/quantity: is more fuel than a house burns in a year: at most "
                      "10,000 MWh (932589 L), got 1e+300 L"});
}

TEST(fuzz_findings, a_custom_fuel_emission_factor_above_1_kg_per_mmbtu_is_refused_at_its_field) {
    // Found by the fuzzer (tools/fuzz --runs 1000000 scenario, after 6,296 runs): farm biogas with
    // 1.8e308 kg N2O per MMBtu gave an Infinity CO2e.
    const json biogas = {{"id", "farm-biogas"}, {"mixture", "CH4:0.60,CO2:0.39,N2:0.01"}, {"sale_unit", "m3"}};
    auto fuel = biogas;
    fuel["n2o_kg_per_mmbtu"] = 1.7976931348623157e308;
    EXPECT_EQ(
        errors_of(gas_scenario({{"fuel", fuel}, {"price", {{"per", "m3"}}}})),
        strings{"/options/0/fuel/n2o_kg_per_mmbtu: must be from 0 to 1 kg per MMBtu (the catalog's largest is 0.0036), "
                "got 1.79769e+308"});
    fuel = biogas;
    fuel["ch4_kg_per_mmbtu"] = 1;
    EXPECT_EQ(errors_of(gas_scenario({{"fuel", fuel}, {"price", {{"per", "m3"}}}})), strings{});
}

TEST(fuzz_findings, a_quantity_too_large_to_convert_is_refused_at_its_field) {
    // Found by a sweep of every number in the examples set to 1e300 and 1.8e308 (a targeted probe beside
    // the fuzzer): the conversion to the core's unit overflowed to Infinity, which reached the result.
    auto scenario = example("maple-hollow-gas-vs-heat-pump.json");
    scenario["demand"]["annual_useful_heat"]["value"] = 1e300;
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand/annual_useful_heat/value: 1e+300 MMBtu is too large to convert to kWh"});
    scenario = example("maple-hollow-heat-pump-bins.json");
    // A base temperature of 1.8e308 degF converts, but the degree-days of the year came out as Infinity.
    scenario["climate"]["base"]["value"] = 1.7976931348623157e308;
    EXPECT_EQ(errors_of(scenario),
              (strings{"/climate/base/value: is not a plausible temperature: it must lie from -100 to "
                       "100 degC (-148 to 212 degF), got 1.79769e+308 degF",
                       "/climate: is required for the heat-loss method (degree-days come from it)"}));
    // So did a design heat loss of 1.8e308 Btu/h (the annual heat), and a UA of 1e300 W/K.
    scenario = example("maple-hollow-heat-pump-bins.json");
    scenario["demand"]["design_heat_loss"]["value"] = 1.7976931348623157e308;
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand/design_heat_loss/value: a house's design heat loss is at most 1000 kW "
                      "(3.41214e+06 Btu/h), got 5.26852e+304 kW"});
    scenario["demand"].erase("design_heat_loss");
    scenario["demand"]["ua"] = {{"value", 1e300}, {"unit", "W/K"}};
    EXPECT_EQ(errors_of(scenario),
              strings{"/demand/ua/value: a house's UA is at most 200000 W/K (379000 Btu/h/degF), got "
                      "1e+300 W/K"});
}

TEST(fuzz_findings, heat_pump_data_sheet_points_out_of_range_are_refused_at_their_field) {
    // Found by the same sweep: a data-sheet COP of 1.8e308 gave an Infinity bin COP, and a capacity of
    // 1.8e308 Btu/h a NaN annual cost.
    auto scenario = example("maple-hollow-heat-pump-bins.json");
    scenario["options"][1]["system"]["ratings"][0]["cop"] = 1.7976931348623157e308;
    EXPECT_EQ(errors_of(scenario),
              strings{"/options/1/system/ratings/0/cop: must be from 1 to 15 (data sheets give 1.5 to 6), "
                      "got 1.79769e+308"});
    scenario = example("maple-hollow-heat-pump-bins.json");
    scenario["options"][1]["system"]["ratings"][0]["capacity"]["value"] = 1e300;
    EXPECT_EQ(errors_of(scenario),
              strings{"/options/1/system/ratings/0/capacity/value: a house's heat pump delivers at most "
                      "1000 kW (3.41214e+06 Btu/h), got 1e+300 Btu/h"});
    scenario["options"][1]["system"]["ratings"][0]["capacity"]["value"] = 1.7976931348623157e308;
    EXPECT_EQ(errors_of(scenario),
              strings{"/options/1/system/ratings/0/capacity/value: a house's heat pump delivers at most "
                      "1000 kW (3.41214e+06 Btu/h), got 1.79769e+308 Btu/h"});
}

TEST(fuzz_findings, a_custom_fuel_density_out_of_range_is_refused_at_its_field) {
    // Found by the same sweep: a density of 1.8e308 kg/L gave an Infinity heating value per litre.
    auto scenario = example("custom-fuels.json");
    ASSERT_TRUE(scenario["options"][2]["fuel"].contains("density_kg_per_l"));
    scenario["options"][2]["fuel"]["density_kg_per_l"] = 1.7976931348623157e308;
    EXPECT_EQ(errors_of(scenario),
              strings{"/options/2/fuel/density_kg_per_l: must be from 0.1 to 5 kg/L (liquid fuels are 0.5 "
                      "to 1), got 1.79769e+308"});
}

TEST(fuzz_findings, options_that_are_not_an_array_do_not_break_a_bills_demand) {
    // Found by the fuzzer (tools/fuzz --runs 1000000 scenario, after 16,599 runs): "options": 0 with a
    // bills demand naming its option gave "internal error: [json.exception.type_error.305] cannot use
    // operator[] with a numeric argument with number".
    auto scenario = bills_example();
    scenario["options"] = 0;
    EXPECT_EQ(errors_of(scenario), (strings{"/options: needs at least one option (a fuel, its price and a system)",
                                            "/demand/option: no option has id \"oil-boiler\""}));
}

}  // namespace

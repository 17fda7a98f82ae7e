// Water heating as its own service (demand.water_heating, the house's heater and an option's water_heater),
// time-of-use electricity (a price schedule placed on each bin's months and hours), gas metered by volume
// at a utility's heating value or pressure base, and gas appliances at elevation.
#include <gtest/gtest.h>

#include <cmath>
#include <nlohmann/json.hpp>
#include <string>

#include "fw/api.hpp"
#include "model/tariff.hpp"
#include "supply/systems.hpp"

namespace {

using nlohmann::json;

json gas_furnace(double afue = 80) {
    return {{"id", "furnace"}, {"fuel", "natural-gas"}, {"price", {{"amount", 1.50}, {"per", "therm"}}},
            {"fixed_charges", {{{"label", "gas customer charge"}, {"amount_per_month", 15}}}},
            {"heating_value", {{"value", 100000}, {"unit", "Btu/therm"}}},
            {"system", {{"kind", "furnace"}, {"efficiency", {{"value", afue}, {"rating", "AFUE"}}}}}};
}

json scenario(const json& options, const json& demand_extra = json::object(), const json& settings = json::object()) {
    json s = {{"schema", "fuelwright.scenario/1"},
              {"settings", {{"units", "us"}, {"currency", "USD"}, {"electricity_co2e_kg_per_kwh", 0.4},
                            {"electricity", {{"price", {{"amount", 0.15}, {"per", "kWh"}}}}}}},
              {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 50}, {"unit", "MMBtu"}}}}},
              {"options", options}};
    s["demand"].merge_patch(demand_extra);
    s["settings"].merge_patch(settings);
    return s;
}

json evaluate(const json& input) {
    json request = input;
    request["detail"] = {"all"};
    const json out = json::parse(fw::evaluate_json(request.dump()));
    EXPECT_TRUE(out.at("errors").empty()) << out.at("errors").dump();
    return out;
}

json errors_of(const json& input) { return json::parse(fw::evaluate_json(input.dump())).at("errors"); }

const json& option(const json& out, const std::string& id) {
    for (const auto& o : out.at("options"))
        if (o.at("id") == id) return o;
    throw std::runtime_error("no option " + id);
}

constexpr double kwh_per_mmbtu = 293.07107017222222;  // 10^6 Btu (IT) / 3,412.14 Btu/kWh

/// The services add up to the option's totals (the rule).
void expect_services_sum(const json& o) {
    EXPECT_NEAR(o.at("space_heating").at("annual_cost").get<double>() + o.at("water_heating").at("annual_cost").get<double>(),
                o.at("annual_cost").get<double>(), 1e-9);
    EXPECT_NEAR(o.at("space_heating").at("co2e_kg").get<double>() + o.at("water_heating").at("co2e_kg").get<double>(),
                o.at("co2e_kg").get<double>(), 1e-9);
}

TEST(water_heating, a_gas_storage_heater_uses_heat_over_uef_as_the_uef_test_counts_it) {
    // 10 CFR 430 Subpart B Appendix E, estimated annual energy (from memory): 365 x V x rho x Cp x 67 degF / UEF,
    // medium draw pattern V = 55 gal/day, rho = 8.24 lb/gal, Cp = 1.00 Btu/(lb degF).
    const double heat_btu = 365 * 55 * 8.24 * 1.00 * 67;  // 11,083,006 Btu
    ASSERT_NEAR(heat_btu, 11083006, 1);
    const double uef = 0.64;
    const json water = {{"annual_heat", {{"value", heat_btu / 1e6}, {"unit", "MMBtu"}}},
                        {"heater", {{"kind", "storage"}, {"fuel", "natural-gas"}, {"uef", uef}, {"location", "unconditioned"}}}};
    const auto out = evaluate(scenario(json::array({gas_furnace()}), {{"water_heating", water}}));
    const auto& o = option(out, "furnace");
    const auto& w = o.at("water_heating");
    // Hand-worked: 11.083006 MMBtu / 0.64 = 17.317197 MMBtu = 173.17197 therm, x 1.50 USD = 259.76 USD.
    EXPECT_NEAR(w.at("fuel_quantity").at("value").get<double>(), 173.17197, 1e-4);
    EXPECT_EQ(w.at("fuel_quantity").at("unit"), "therm");
    EXPECT_NEAR(w.at("annual_cost").get<double>(), 173.17197 * 1.50, 1e-3);
    EXPECT_EQ(w.at("made_by"), "storage");
    EXPECT_NEAR(w.at("efficiency").get<double>(), 0.64, 1e-12);
    // The furnace's space heating stays 50 MMBtu / 0.80 = 625 therm, and its fixed charges stay with it.
    EXPECT_NEAR(o.at("space_heating").at("fuel_quantity").at("value").get<double>(), 625, 1e-9);
    EXPECT_NEAR(o.at("fuel_quantity").at("value").get<double>(), 625 + 173.17197, 1e-4);
    // ... with the furnace's own electricity (its catalog default, at settings.electricity.price).
    EXPECT_NEAR(o.at("space_heating").at("annual_cost").get<double>(), 625 * 1.5 + 180 + o.at("auxiliary_cost").get<double>(), 1e-6);
    expect_services_sum(o);
}

TEST(water_heating, the_need_from_people_litres_and_rise) {
    // Hand-worked: 3 people x 50 L x 365 days x 4.186 kJ/(L K) x 37.2222 K (67 degF) / 3600 = 2,369.64 kWh.
    const json water = {{"people", 3},
                        {"volume_per_person_day", {{"value", 50}, {"unit", "L"}}},
                        {"temperature_rise", {{"value", 67}, {"unit", "degF"}}},
                        {"heater", {{"kind", "tankless"}, {"fuel", "natural-gas"}, {"uef", 0.93}}}};
    const auto out = evaluate(scenario(json::array({gas_furnace()}), {{"water_heating", water}}));
    const double expected = 3 * 50 * 365 * 4.186 * (67.0 * 5 / 9) / 3600;
    EXPECT_NEAR(expected, 2369.64, 0.01);
    EXPECT_NEAR(out.at("demand").at("water_heating_kwh").get<double>(), expected, 1e-9);
    EXPECT_NEAR(option(out, "furnace").at("water_heating").at("useful_heat_kwh").get<double>(), expected, 1e-9);
}

TEST(water_heating, a_heat_pump_water_heater_in_the_heated_space_takes_its_heat_from_the_house) {
    // No climate: the house is taken to need heat half the year (stated). By the first law the heater moves
    // Q - Q/UEF out of the room: 3,000 kWh with UEF 3.0 -> 2,000 kWh, of which half (1,000 kWh) the furnace
    // makes up at 80 % AFUE.
    const json heater = {{"kind", "heat-pump-water-heater"}, {"fuel", "electricity"}, {"uef", 3.0}, {"location", "conditioned"}};
    const json water = {{"annual_heat", {{"value", 3000}, {"unit", "kWh"}}}, {"heater", heater}};
    const auto out = evaluate(scenario(json::array({gas_furnace()}), {{"water_heating", water}}));
    const auto& o = option(out, "furnace");
    const auto& w = o.at("water_heating");
    EXPECT_NEAR(w.at("fuel_quantity").at("value").get<double>(), 1000, 1e-9);  // 3,000 kWh / 3.0
    EXPECT_NEAR(w.at("annual_cost").get<double>(), 1000 * 0.15, 1e-9);          // at settings.electricity.price
    EXPECT_NEAR(w.at("heat_taken_from_space_kwh").get<double>(), 1000, 1e-9);
    const double space_kwh = 50 * kwh_per_mmbtu + 1000;
    EXPECT_NEAR(o.at("space_heating").at("useful_heat_kwh").get<double>(), space_kwh, 1e-6);
    EXPECT_NEAR(o.at("space_heating").at("fuel_quantity").at("value").get<double>(), space_kwh / 0.8 / kwh_per_mmbtu * 10, 1e-6);
    expect_services_sum(o);
    // In an unconditioned basement it takes nothing from the heated space.
    json outside = water;
    outside["heater"]["location"] = "unconditioned";
    const auto out2 = evaluate(scenario(json::array({gas_furnace()}), {{"water_heating", outside}}));
    const auto& o2 = option(out2, "furnace");
    EXPECT_FALSE(o2.at("water_heating").contains("heat_taken_from_space_kwh"));
    EXPECT_NEAR(o2.at("space_heating").at("fuel_quantity").at("value").get<double>(), 625, 1e-9);
}

/// A heat pump on a climate, priced flat or by `price`.
json heat_pump(const std::string& id, const std::string& backup, const json& price = {{"amount", 0.15}, {"per", "kWh"}}) {
    json ratings = json::array();
    for (const auto& [t, q, cop] : {std::tuple{47, 36000, 3.8}, std::tuple{17, 24000, 2.5}, std::tuple{5, 19000, 1.9}})
        ratings.push_back({{"outdoor", {{"value", t}, {"unit", "degF"}}}, {"capacity", {{"value", q}, {"unit", "Btu/h"}}}, {"cop", cop}});
    return {{"id", id}, {"fuel", "electricity"}, {"price", price},
            {"system", {{"kind", "air-source-heat-pump"}, {"backup", backup}, {"ratings", ratings},
                        {"cutoff", {{"value", -10}, {"unit", "degF"}}}}}};
}

json climate() {
    return {{"unit", "degF"}, {"monthly_mean", {26, 29, 38, 49, 59, 68, 73, 71, 63, 52, 41, 30}}, {"daily_range", 18},
            {"design_temperature", {{"value", 5}, {"unit", "degF"}}}};
}

TEST(water_heating, a_dual_fuel_heat_pump_keeping_the_gas_water_heater) {
    json s = scenario(json::array({gas_furnace(95), heat_pump("dual", "furnace")}),
                      {{"balance_point", {{"value", 60}, {"unit", "degF"}}},
                       {"water_heating", {{"annual_heat", {{"value", 12}, {"unit", "MMBtu"}}},
                                          {"heater", {{"kind", "storage"}, {"fuel", "natural-gas"}, {"uef", 0.60}}}}}});
    s["climate"] = climate();
    const auto out = evaluate(s);
    const auto& o = option(out, "dual");
    const auto& w = o.at("water_heating");
    // The gas water heater burns 12 / 0.60 = 20 MMBtu = 200 therm on the backup furnace's meter at 1.50 USD;
    // the furnace's customer charge is paid once, with the heating.
    EXPECT_EQ(w.at("fuel"), "natural-gas");
    EXPECT_NEAR(w.at("fuel_quantity").at("value").get<double>(), 200, 1e-9);
    EXPECT_NEAR(w.at("annual_cost").get<double>(), 300, 1e-9);
    EXPECT_NEAR(w.at("co2e_kg").get<double>(), 20 * (53.06 + 1.0e-3 * 28 + 1.0e-4 * 265), 1e-6);  // EPA Table C-1/C-2, GWP AR5
    // The heat pump makes no hot water: its electricity is the space heating's alone.
    EXPECT_NEAR(o.at("electricity_kwh").get<double>(), o.at("space_heating").at("fuel_quantity").at("value").get<double>(), 1e-9);
    EXPECT_NEAR(o.at("fixed_cost").get<double>(), 180, 1e-9);
    expect_services_sum(o);
}

TEST(water_heating, the_older_hot_water_on_a_dual_fuel_heat_pump_is_charged_at_the_heat_pumps_own_cop_and_questioned) {
    json s = scenario(json::array({gas_furnace(95), heat_pump("dual", "furnace")}),
                      {{"balance_point", {{"value", 60}, {"unit", "degF"}}}, {"hot_water", {{"value", 15}, {"unit", "MMBtu"}}}});
    s["climate"] = climate();
    const json out = json::parse(fw::evaluate_json(s.dump()));
    const auto& o = option(out, "dual");
    // Served by the heat pump at its own seasonal COP (the fuel backup makes no hot water), not at the COP of
    // heat over electricity with the fuel-fired hours left in.
    EXPECT_NEAR(o.at("water_heating").at("efficiency").get<double>(), o.at("seasonal_cop").get<double>(), 1e-9);
    EXPECT_GT(o.at("water_heating").at("efficiency").get<double>(), 2.0);
    bool named = false;
    for (const auto& w : out.at("warnings"))
        named = named || (w.at("path") == "/options/1" && w.at("message").get<std::string>().find("option dual heats with an "
                                                                                                  "air-source-heat-pump, which cannot make hot water") == 0);
    EXPECT_TRUE(named) << out.at("warnings").dump();
}

TEST(water_heating, an_indirect_tank_needs_a_boiler_and_its_standby_loss_is_the_boilers) {
    const json boiler = {{"id", "boiler"}, {"fuel", "natural-gas"}, {"price", {{"amount", 1.50}, {"per", "therm"}}},
                         {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 85}, {"rating", "AFUE"}}}}}};
    const json water = {{"annual_heat", {{"value", 10}, {"unit", "MMBtu"}}},
                        {"heater", {{"kind", "indirect"}, {"standby_loss", {{"value", 60}, {"unit", "W"}}}}}};
    const auto out = evaluate(scenario(json::array({boiler}), {{"water_heating", water}}));
    // Hand-worked: (10 MMBtu + 60 W x 8,760 h = 525.6 kWh) / 0.85.
    const double fuel_kwh = (10 * kwh_per_mmbtu + 525.6) / 0.85;
    EXPECT_NEAR(option(out, "boiler").at("water_heating").at("fuel_quantity").at("value").get<double>(), fuel_kwh / kwh_per_mmbtu * 10, 1e-6);
    const auto errors = errors_of(scenario(json::array({gas_furnace()}), {{"water_heating", water}}));
    ASSERT_EQ(errors.size(), 1u);
    EXPECT_EQ(errors[0].at("path"), "/options/0/water_heater");
    EXPECT_EQ(errors[0].at("message"),
              "the house's indirect water heater is heated by a boiler, and option furnace heats with a furnace: give option "
              "furnace a water_heater of its own (a storage, tankless or heat-pump water heater)");
}

TEST(water_heating, a_fuel_kept_for_the_water_heater_alone_at_its_own_price) {
    // An oil boiler against a ground-source heat pump, the house's propane water heater priced on its own:
    // 12 MMBtu / 0.60 = 20 MMBtu of propane = 20e6 / 91,452 Btu/gal (EIA, the catalog) = 218.69 gal x 2.90 USD + 85 USD tank rental.
    const json oil = {{"id", "oil"}, {"fuel", "heating-oil-2"}, {"price", {{"amount", 3.5}, {"per", "gal"}}},
                      {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 85}, {"rating", "AFUE"}}}}}};
    const json water = {{"annual_heat", {{"value", 12}, {"unit", "MMBtu"}}},
                        {"heater", {{"kind", "storage"}, {"fuel", "propane"}, {"uef", 0.60},
                                    {"price", {{"amount", 2.90}, {"per", "gal"}}},
                                    {"fixed_charges", {{{"label", "tank rental"}, {"amount_per_year", 85}}}}}}};
    const auto out = evaluate(scenario(json::array({oil}), {{"water_heating", water}}));
    const auto& w = option(out, "oil").at("water_heating");
    EXPECT_NEAR(w.at("fuel_quantity").at("value").get<double>(), 20e6 / 91452, 1e-6);
    EXPECT_NEAR(w.at("annual_cost").get<double>(), 20e6 / 91452 * 2.90 + 85, 1e-6);
    // Without its price, the message says what to give.
    json unpriced = water;
    unpriced["heater"].erase("price");
    unpriced["heater"].erase("fixed_charges");
    const auto errors = errors_of(scenario(json::array({oil}), {{"water_heating", unpriced}}));
    ASSERT_EQ(errors.size(), 1u);
    EXPECT_EQ(errors[0].at("path"), "/demand/water_heating/heater/fuel");
    EXPECT_EQ(errors[0].at("message"), "no price for propane: give the water heater its price ({amount, per}), or add an option that burns propane");
}

TEST(water_heating, block_rates_shared_with_the_water_heater_keep_the_life_cycle_on_the_annual_cost) {
    // One year at 0 % discount: the life-cycle cost is the year's cost (NIST Handbook 135 conventions, end-of-year flows).
    const json baseboard = {{"id", "baseboard"}, {"fuel", "electricity"},
                            {"price", {{"per", "kWh"}, {"tiers", {{{"from", 0}, {"to", 5000}, {"amount", 0.10}}, {{"from", 5000}, {"amount", 0.30}}}}}},
                            {"system", {{"kind", "electric-resistance"}, {"efficiency", {{"value", 1}, {"rating", "COP"}}}}}};
    const json water = {{"annual_heat", {{"value", 10}, {"unit", "MMBtu"}}},
                        {"heater", {{"kind", "storage"}, {"fuel", "electricity"}, {"uef", 0.92}}}};
    json s = scenario(json::array({baseboard}), {{"water_heating", water}});
    s["settings"].erase("electricity");
    s["economics"] = {{"analysis_years", 1}, {"discount_rate", 0}};
    const auto out = evaluate(s);
    const auto& o = option(out, "baseboard");
    EXPECT_NEAR(o.at("life_cycle_cost").get<double>(), o.at("annual_cost").get<double>(), 1e-6);
    // Hand-worked: 50 MMBtu + 10 MMBtu / 0.92 on one meter = 14,653.55 + 3,185.56 kWh; the first 5,000 at 0.10, the rest at 0.30.
    const double space = 50 * kwh_per_mmbtu, hot = 10 * kwh_per_mmbtu / 0.92, whole = 500 + (space + hot - 5000) * 0.30;
    EXPECT_NEAR(o.at("energy_cost").get<double>(), whole, 1e-6);
    EXPECT_NEAR(o.at("water_heating").at("annual_cost").get<double>(), whole * hot / (space + hot), 1e-6);
    // The option serves the house's whole need, space heat and hot water.
    EXPECT_NEAR(o.at("useful_heat_kwh").get<double>(), out.at("demand").at("annual_useful_heat_kwh").get<double>(), 1e-9);
    EXPECT_NEAR(o.at("useful_heat_kwh").get<double>(), 60 * kwh_per_mmbtu, 1e-6);
}

TEST(water_heating, an_electric_heater_priced_on_its_own_and_a_gas_heater_metered_at_a_pressure_base) {
    const json water = {{"annual_heat", {{"value", 3000}, {"unit", "kWh"}}},
                        {"heater", {{"kind", "storage"}, {"fuel", "electricity"}, {"uef", 0.92}, {"price", {{"amount", 0.2}, {"per", "kWh"}}}}}};
    json s = scenario(json::array({gas_furnace()}), {{"water_heating", water}});
    s["settings"].erase("electricity");
    const auto out = evaluate(s);
    EXPECT_NEAR(option(out, "furnace").at("water_heating").at("annual_cost").get<double>(), 3000 / 0.92 * 0.2, 1e-9);
    // A gas water heater's own price per ccf, metered at 12 psia against the catalog's 14.696: more ccf for the same heat.
    const json oil = {{"id", "oil"}, {"fuel", "heating-oil-2"}, {"price", {{"amount", 3.5}, {"per", "gal"}}},
                      {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 85}, {"rating", "AFUE"}}}}}};
    const json gas = {{"annual_heat", {{"value", 10}, {"unit", "MMBtu"}}},
                      {"heater", {{"kind", "storage"}, {"fuel", "natural-gas"}, {"uef", 0.64}, {"price", {{"amount", 1.5}, {"per", "ccf"}}}}}};
    const auto at = [&](const json& settings) {
        return option(evaluate(scenario(json::array({oil}), {{"water_heating", gas}}, settings)), "oil").at("water_heating").at("fuel_quantity").at("value").get<double>();
    };
    EXPECT_NEAR(at({{"gas_pressure_base", {{"value", 12}, {"unit", "psia"}}}}) / at(json::object()), 14.696 / 12, 1e-9);
}

TEST(water_heating, ratings_as_typed_get_a_message_at_their_field) {
    const auto error_for = [](const json& heater) {
        const json water = {{"annual_heat", {{"value", 10}, {"unit", "MMBtu"}}}, {"heater", heater}};
        const auto errors = errors_of(scenario(json::array({gas_furnace()}), {{"water_heating", water}}));
        return errors.empty() ? json() : errors[0];
    };
    auto e = error_for({{"kind", "storage"}, {"fuel", "natural-gas"}, {"uef", 64}});
    EXPECT_EQ(e.at("path"), "/demand/water_heating/heater/uef");
    EXPECT_EQ(e.at("message"), "a UEF is a ratio below 1 for a storage water heater (0.64, not 64); got 64");
    e = error_for({{"kind", "storage"}, {"fuel", "natural-gas"}});
    EXPECT_EQ(e.at("path"), "/demand/water_heating/heater/uef");
    e = error_for({{"kind", "storage"}, {"fuel", "electricity"}, {"efficiency", {{"value", 0.38}, {"rating", "eta_wh"}}}});
    EXPECT_EQ(e.at("path"), "/demand/water_heating/heater/efficiency/value");
    EXPECT_EQ(e.at("message"), "eta_wh is a percentage as the EU label prints it (e.g. 65 or 130), got 0.38");
    e = error_for({{"kind", "storage"}, {"fuel", "natural-gas"}, {"efficiency", {{"value", 300}, {"rating", "eta_wh"}}}});
    EXPECT_EQ(e.at("message"), "a fuel-fired storage water heater's eta_wh is at most 100 % (on the gross calorific value); above it only a heat pump "
                               "reaches, got 300");
    e = error_for({{"kind", "storage"}, {"fuel", "electricity"}, {"efficiency", {{"value", 95}, {"rating", "eta_wh"}}}});
    EXPECT_EQ(e.at("message"), "an electric storage water heater's eta_wh is at most 40 % (its electricity counted x CC 2.5); above it only a heat "
                               "pump reaches, got 95");
    e = error_for({{"kind", "heat-pump-water-heater"}, {"fuel", "natural-gas"}, {"uef", 3}});
    EXPECT_EQ(e.at("message"), "a heat-pump water heater runs on electricity, not natural-gas");
    e = error_for({{"kind", "kettle"}, {"fuel", "natural-gas"}, {"uef", 0.6}});
    EXPECT_EQ(e.at("message"), "unknown water heater kind \"kettle\"; known kinds: storage, tankless, heat-pump-water-heater, indirect, combi");
}

TEST(water_heating, an_electric_heater_by_the_eu_label_counts_electricity_at_cc_2_5) {
    // Regulation (EU) 812/2013: eta_wh counts electricity as primary energy x CC 2.5 (from memory), so an
    // eta_wh of 38 % is 0.95 heat per kWh at the meter.
    const json water = {{"annual_heat", {{"value", 2850}, {"unit", "kWh"}}},
                        {"heater", {{"kind", "storage"}, {"fuel", "electricity"}, {"efficiency", {{"value", 38}, {"rating", "eta_wh"}}}}}};
    const auto out = evaluate(scenario(json::array({gas_furnace()}), {{"water_heating", water}}));
    EXPECT_NEAR(option(out, "furnace").at("water_heating").at("fuel_quantity").at("value").get<double>(), 2850 / 0.95, 1e-9);
}

// ---- Time of use ----

/// A three-bin climate whose months each sit in one bin (day-to-day spread 0.01 K, no daily range), so the
/// month-hours of each bin are known by hand: -5 degC in Dec-Feb (90 days), 5 degC in Mar, Apr, Oct, Nov
/// (122 days), 20 degC May-Sep (153 days).
json three_bin_climate() {
    json means = json::array(), sd = json::array();
    for (double t : {-5, -5, 5, 5, 20, 20, 20, 20, 20, 5, 5, -5}) means.push_back(t), sd.push_back(0.01);
    return {{"unit", "degC"}, {"monthly_mean", means}, {"monthly_sd", sd}, {"daily_range", 0}, {"bin_width", 5},
            {"bins", {{{"t", -5}, {"hours", 2160}}, {{"t", 5}, {"hours", 2928}}, {{"t", 20}, {"hours", 3672}}}}};
}

/// Three periods: peak weekdays 16-21 in Dec-Feb, off-peak 23-7 every day, mid-peak every other hour (three rows).
json three_period_price() {
    return {{"per", "kWh"},
            {"schedule",
             {{{"name", "peak"}, {"amount", 0.40}, {"hours", {{16, 21}}}, {"days", "weekdays"}, {"months", {12, 1, 2}}},
              {{"name", "off-peak"}, {"amount", 0.10}, {"hours", {23, 7}}},
              {{"name", "mid-peak"}, {"amount", 0.20}, {"hours", {{7, 16}, {21, 23}}}, {"days", "weekdays"}},
              {{"name", "mid-peak"}, {"amount", 0.20}, {"hours", {{16, 21}}}, {"days", "weekdays"}, {"months", {3, 4, 5, 6, 7, 8, 9, 10, 11}}},
              {{"name", "mid-peak"}, {"amount", 0.20}, {"hours", {{7, 23}}}, {"days", "weekends"}}}}};
}

TEST(time_of_use, three_periods_on_three_bins_by_hand) {
    json s = scenario(json::array({heat_pump("hp", "electric-resistance", three_period_price())}),
                      {{"annual_useful_heat", {{"value", 12000}, {"unit", "kWh"}}}, {"balance_point", {{"value", 15}, {"unit", "degC"}}}},
                      {{"units", "metric"}});
    s["climate"] = three_bin_climate();
    const auto out = evaluate(s);
    const auto& o = option(out, "hp");
    const auto& bins = o.at("bins");
    ASSERT_EQ(bins.size(), 2u);  // the 20 degC bin needs no heat
    const double cold = bins[0].at("heat_pump_kwh").get<double>() + bins[0].at("backup_heat_kwh").get<double>();
    const double mild = bins[1].at("heat_pump_kwh").get<double>() + bins[1].at("backup_heat_kwh").get<double>();
    // Hand-worked shares: in Dec-Feb peak is 5 of 24 hours on 5 of 7 days (25/168), off-peak 8/24 (56/168),
    // mid-peak the rest (87/168); in the mild months off-peak 8/24 and mid-peak 16/24.
    const double peak = cold * 25 / 168, off = cold * 56 / 168 + mild * 8 / 24, mid = cold * 87 / 168 + mild * 16 / 24;
    const auto& periods = o.at("electricity_periods");
    ASSERT_EQ(periods.size(), 3u);
    EXPECT_EQ(periods[0].at("name"), "peak");
    EXPECT_EQ(periods[1].at("name"), "off-peak");
    EXPECT_EQ(periods[2].at("name"), "mid-peak");
    EXPECT_NEAR(periods[0].at("kwh").get<double>(), peak, 1e-6);
    EXPECT_NEAR(periods[1].at("kwh").get<double>(), off, 1e-6);
    EXPECT_NEAR(periods[2].at("kwh").get<double>(), mid, 1e-6);
    double kwh = 0, cost = 0;
    for (const auto& p : periods) kwh += p.at("kwh").get<double>(), cost += p.at("cost").get<double>();
    EXPECT_NEAR(kwh, o.at("electricity_kwh").get<double>(), 1e-9 * kwh);
    EXPECT_NEAR(kwh, cold + mild, 1e-9 * kwh);
    EXPECT_NEAR(cost, 0.40 * peak + 0.10 * off + 0.20 * mid, 1e-6);
    EXPECT_NEAR(o.at("energy_cost").get<double>(), cost, 1e-6);
}

TEST(time_of_use, the_periods_add_up_to_the_electricity_with_hot_water_and_a_model_climate) {
    json s = scenario(json::array({heat_pump("hp", "electric-resistance", three_period_price())}),
                      {{"balance_point", {{"value", 60}, {"unit", "degF"}}},
                       {"water_heating", {{"people", 4}, {"heater", {{"kind", "storage"}, {"fuel", "electricity"}, {"uef", 0.92}}}}}});
    s["climate"] = climate();
    const auto out = evaluate(s);
    const auto& o = option(out, "hp");
    double kwh = 0, cost = 0;
    for (const auto& p : o.at("electricity_periods")) kwh += p.at("kwh").get<double>(), cost += p.at("cost").get<double>();
    EXPECT_NEAR(kwh, o.at("electricity_kwh").get<double>(), 1e-9 * kwh);
    EXPECT_NEAR(o.at("electricity_kwh").get<double>(),
                o.at("space_heating").at("fuel_quantity").at("value").get<double>() +
                    o.at("water_heating").at("fuel_quantity").at("value").get<double>(), 1e-9 * kwh);
    EXPECT_NEAR(o.at("energy_cost").get<double>(), cost, 1e-6);
    expect_services_sum(o);
}

TEST(time_of_use, a_what_if_on_a_time_of_use_price_moves_every_period_and_a_kept_water_heater_follows_its_fuel) {
    json s = scenario(json::array({gas_furnace(95), heat_pump("hp", "electric-resistance", three_period_price())}),
                      {{"balance_point", {{"value", 60}, {"unit", "degF"}}},
                       {"water_heating", {{"annual_heat", {{"value", 12}, {"unit", "MMBtu"}}},
                                          {"heater", {{"kind", "storage"}, {"fuel", "natural-gas"}, {"uef", 0.60}}}}}});
    s["climate"] = climate();
    const auto out = evaluate(s);
    const auto& hp = option(out, "hp");
    const double mean = hp.at("price").at("amount").get<double>();  // today's mean price over every kWh
    const auto cost_at = [&](const std::string& of, double value) {
        const json answer = json::parse(fw::what_if_json(json{{"scenario", s}, {"vary", "price"}, {"of", of}, {"value", value}}.dump()));
        EXPECT_TRUE(answer.at("errors").empty()) << answer.at("errors").dump();
        for (const auto& o : answer.at("options"))
            if (o.at("id") == "hp") return o.at("cost").get<double>();
        return std::nan("");
    };
    // Every period's price scaled together (to nothing here) takes the electricity's cost with it; the gas water
    // heater's stays, and a gas price twice today's adds its 200 therm again.
    double electricity_cost = 0;
    for (const auto& period : hp.at("electricity_periods")) electricity_cost += period.at("cost").get<double>();
    EXPECT_NEAR(cost_at("electricity", 0) , hp.at("annual_cost").get<double>() - electricity_cost, 1e-6);
    EXPECT_NEAR(cost_at("natural-gas", 3.0), hp.at("annual_cost").get<double>() + 200 * 1.5, 1e-6);  // 200 therm at 1.50 more
    EXPECT_GT(mean, 0);
}

TEST(time_of_use, a_schedule_as_typed_gets_a_message_at_its_field) {
    const auto error_for = [](const json& schedule) {
        json s = scenario(json::array({heat_pump("hp", "electric-resistance", {{"per", "kWh"}, {"schedule", schedule}})}));
        s["climate"] = climate();
        const auto errors = errors_of(s);
        return errors.empty() ? json() : errors[0];
    };
    auto e = error_for({{{"name", "day"}, {"amount", 0.2}, {"hours", {{7, 22}}}}, {{"name", "night"}, {"amount", 0.1}, {"hours", {{22, 6}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule");
    EXPECT_EQ(e.at("message"), "each time of day must fall in exactly one period: weekdays 06:00-07:00 in January is in none");
    e = error_for({{{"name", "day"}, {"amount", 0.2}, {"hours", {{6, 22}}}}, {{"name", "night"}, {"amount", 0.1}, {"hours", {{21, 7}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule/1");
    EXPECT_EQ(e.at("message"), "each time of day must fall in exactly one period: weekdays 06:00-07:00 in January is in both \"day\" and \"night\"");
    e = error_for({{{"name", "all"}, {"amount", 21}, {"hours", {{0, 24}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule/0/amount");
    EXPECT_EQ(e.at("message"), "must be a price per kWh below 10, got 21 (cents? 21 cents is 0.21)");
    e = error_for({{{"name", ""}, {"amount", 0.2}, {"hours", {{0, 24}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule/0/name");
    EXPECT_EQ(e.at("message"), "is required: the period's name as the tariff gives it (peak, off-peak…)");
    e = error_for({{{"name", "all"}, {"amount", 0.2}, {"hours", {{0, 16.25}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule/0/hours/0/1");
    EXPECT_EQ(e.at("message"), "must fall on the hour or the half hour, from 0 to 24 (16.5 is 16:30), got 16.25 (16:15)");
    // A gap is named over its whole length, to the half hour.
    e = error_for({{{"name", "all"}, {"amount", 0.2}, {"hours", {{0, 16.5}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule");
    EXPECT_EQ(e.at("message"), "each time of day must fall in exactly one period: weekdays 16:30-24:00 in January is in none");
    e = error_for({{{"name", "peak"}, {"amount", 0.3}, {"hours", {{16, 21}}}, {"days", "weekdays"}},
                   {{"name", "other"}, {"amount", 0.1}, {"hours", {{21, 16}}}}});
    EXPECT_EQ(e.at("message"), "each time of day must fall in exactly one period: weekends 16:00-21:00 in January is in none");
    // A gap over midnight is named from where it begins the evening before.
    e = error_for({{{"name", "day"}, {"amount", 0.2}, {"hours", {{1, 23}}}}});
    EXPECT_EQ(e.at("message"), "each time of day must fall in exactly one period: weekdays 23:00-01:00 in January is in none");
    e = error_for({{{"name", "day"}, {"amount", 0.2}, {"hours", {{7, 7}}}}});
    EXPECT_EQ(e.at("path"), "/options/0/price/schedule/0/hours/0/1");
    EXPECT_EQ(e.at("message"), "ends where it starts: a period needs at least half an hour (0 to 24 is the whole day)");
    // One pair typed without the outer brackets is that pair; 22 to 6 runs past midnight.
    const auto accepted = error_for({{{"name", "day"}, {"amount", 0.2}, {"hours", {6, 22}}}, {{"name", "night"}, {"amount", 0.1}, {"hours", {22, 6}}}});
    EXPECT_TRUE(accepted.is_null()) << accepted.dump();
}

TEST(time_of_use, split_by_period_gives_every_kwh_to_one_period) {
    fw::price_schedule schedule(2);
    schedule[0] = {"day", 0.3, {}, fw::day_set::all, {}};
    schedule[1] = {"night", 0.1, {}, fw::day_set::all, {}};
    for (int h = 0; h < 48; ++h) (h >= 14 && h < 46 ? schedule[0] : schedule[1]).half_hours[static_cast<std::size_t>(h)] = true;
    schedule[0].months.fill(true);
    schedule[1].months.fill(true);
    ASSERT_FALSE(fw::schedule_coverage_problem(schedule));
    const auto uses = fw::split_by_period(schedule, fw::flat_profile(8760, false));
    EXPECT_NEAR(uses[0].kwh, 8760.0 * 16 / 24, 1e-9);
    EXPECT_NEAR(uses[1].kwh, 8760.0 * 8 / 24, 1e-9);
    EXPECT_NEAR(uses[0].cost + uses[1].cost, 8760.0 * (16 * 0.3 + 8 * 0.1) / 24, 1e-9);
    double shape = 0;
    for (double share : fw::hot_water_day_shape()) shape += share;
    EXPECT_NEAR(shape, 1.0, 1e-12);
}

TEST(time_of_use, every_row_of_a_tariff_is_read_before_any_is_refused) {
    // A tariff typed row by row: the second row's price and the third row's end hour are both said at once.
    json s = scenario(json::array({heat_pump("hp", "electric-resistance",
                                             {{"per", "kWh"},
                                              {"schedule", json::array({{{"name", "off-peak"}, {"amount", 0.12}, {"hours", {21, 16}}},
                                                                        {{"name", "peak"}, {"hours", {16, 21}}},
                                                                        {{"name", "shoulder"}, {"amount", 0.2}, {"hours", {{16, 16.2}}}}})}})}));
    s["climate"] = climate();
    const auto errors = errors_of(s);
    ASSERT_EQ(errors.size(), 2u) << errors.dump();
    EXPECT_EQ(errors[0].at("path"), "/options/0/price/schedule/1/amount");
    EXPECT_EQ(errors[0].at("message"), "is required (a number)");
    EXPECT_EQ(errors[1].at("path"), "/options/0/price/schedule/2/hours/0/1");
    EXPECT_EQ(errors[1].at("message"),
              "must fall on the hour or the half hour, from 0 to 24 (16.5 is 16:30), got 16.2 (16:12)");
}

TEST(time_of_use, a_half_hour_boundary_splits_the_hour_it_falls_in) {
    // A UK Economy 7 tariff as printed, night 00:30-07:30 (invented prices): 7 of the day's 24 hours are night.
    json s = scenario(json::array({heat_pump("hp", "electric-resistance",
                                             {{"per", "kWh"},
                                              {"schedule", json::array({{{"name", "night"}, {"amount", 0.08}, {"hours", {0.5, 7.5}}},
                                                                        {{"name", "day"}, {"amount", 0.30}, {"hours", {{7.5, 24}, {0, 0.5}}}}})}})}));
    s["climate"] = climate();
    EXPECT_TRUE(errors_of(s).empty()) << errors_of(s).dump();
    fw::price_schedule schedule(2);
    schedule[0] = {"night", 0.08, {}, fw::day_set::all, {}};
    schedule[1] = {"day", 0.30, {}, fw::day_set::all, {}};
    for (int h = 0; h < 48; ++h) (h >= 1 && h < 15 ? schedule[0] : schedule[1]).half_hours[static_cast<std::size_t>(h)] = true;
    schedule[0].months.fill(true);
    schedule[1].months.fill(true);
    ASSERT_FALSE(fw::schedule_coverage_problem(schedule));
    // By hand: a flat 8760 kWh gives night 8760 x 7/24 = 2555 kWh; the mean price is (7 x 0.08 + 17 x 0.30) / 24.
    const auto flat = fw::split_by_period(schedule, fw::flat_profile(8760, false));
    EXPECT_NEAR(flat[0].kwh, 2555, 1e-9);
    EXPECT_NEAR(flat[1].kwh, 8760 - 2555, 1e-9);
    EXPECT_NEAR(fw::mean_price_per_kwh(schedule), (7 * 0.08 + 17 * 0.30) / 24, 1e-12);
    // Use only from 0:00 to 1:00 (steady within the hour): half of it before 0:30 (day), half after (night).
    fw::month_hour_kwh midnight{};
    for (auto& month : midnight) month[0] = 10;
    const auto split = fw::split_by_period(schedule, midnight);
    EXPECT_NEAR(split[0].kwh, 60, 1e-9);
    EXPECT_NEAR(split[1].kwh, 60, 1e-9);
    EXPECT_NEAR(split[0].cost + split[1].cost, 60 * 0.08 + 60 * 0.30, 1e-9);
}

// ---- Gas by volume and altitude ----

/// Twelve monthly gas bills in ccf (as printed), with an optional therm factor on each.
json ccf_bills(const json& heating_value) {
    const int days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    const double ccf[] = {160, 140, 110, 70, 35, 20, 18, 18, 25, 60, 105, 150};
    json bills = json::array();
    int start = 0;
    for (int m = 0; m < 12; ++m) {
        char first[11], last[11];
        std::snprintf(first, sizeof first, "2025-%02d-01", m + 1);
        std::snprintf(last, sizeof last, "2025-%02d-%02d", m + 1, days[m]);
        json bill = {{"start", first}, {"end", last}, {"quantity", ccf[m]}, {"unit", "ccf"}};
        if (!heating_value.is_null()) bill["heating_value"] = heating_value;
        bills.push_back(bill);
        start += days[m];
    }
    return bills;
}

json bills_scenario(const json& heating_value, const json& settings = json::object()) {
    json s = scenario(json::array({gas_furnace()}), json::object(), settings);
    s["demand"] = {{"method", "bills"}, {"option", "furnace"}, {"bills", ccf_bills(heating_value)}};
    s["climate"] = climate();
    return s;
}

TEST(gas_by_volume, a_ccf_bill_with_its_therm_factor) {
    // Every bill's energy scales with the heating value per ccf, so the fitted space heat does too:
    // 1.025 therm/ccf against the catalog's 1,036 Btu/ft3 at 60 degF (EIA) = 1.036 therm/ccf (hand-worked).
    const auto plain = evaluate(bills_scenario(nullptr));
    const auto factored = evaluate(bills_scenario({{"value", 1.025}, {"unit", "therm/ccf"}}));
    const double ratio = factored.at("demand").at("space_heat_kwh").get<double>() / plain.at("demand").at("space_heat_kwh").get<double>();
    EXPECT_NEAR(ratio, 1.025 / 1.036, 2e-4);  // the catalog's 60 degF / 14.696 psia reference against the 1,036 Btu/ft3 basis
}

TEST(gas_by_volume, metered_at_the_site_pressure_at_altitude) {
    // At 5,280 ft (1,609.3 m) the standard atmosphere is 101,325 (1 - 2.25577e-5 x 1609.344)^5.25588 = 83,437 Pa
    // (US Standard Atmosphere 1976, from memory): a ccf metered there holds 83,437 / 101,325 = 0.8235 of the gas.
    const double pa = 101325 * std::pow(1 - 2.25577e-5 * 1609.344, 5.25588);
    EXPECT_NEAR(pa, 83437, 10);
    const auto sea = evaluate(bills_scenario(nullptr));
    const auto mile = evaluate(bills_scenario(nullptr, {{"elevation", {{"value", 5280}, {"unit", "ft"}}}, {"gas_pressure_base", "site"}}));
    // The catalog's ft3 are at 60 degF and 14.696 psia (101,325.35 Pa).
    const double reference_pa = 14.696 * 6894.757293168361;
    EXPECT_NEAR(mile.at("demand").at("space_heat_kwh").get<double>() / sea.at("demand").at("space_heat_kwh").get<double>(),
                pa / reference_pa, 1e-9);
    // A utility's pressure base given in psia: 12.2 psia against the 14.696 psia reference.
    const auto base = evaluate(bills_scenario(nullptr, {{"gas_pressure_base", {{"value", 12.2}, {"unit", "psia"}}}}));
    EXPECT_NEAR(base.at("demand").at("space_heat_kwh").get<double>() / sea.at("demand").at("space_heat_kwh").get<double>(), 12.2 / 14.696,
                1e-9);
}

TEST(altitude, a_gas_furnace_is_derated_4_percent_per_1000_ft_above_2000_ft) {
    // NFPA 54 / ANSI Z223.1 high-altitude rule (from memory): 4 % for each 1,000 ft above sea level once above
    // 2,000 ft; at 6,000 ft a 60,000 Btu/h furnace gives 60,000 x (1 - 0.24) = 45,600 Btu/h.
    json furnace = gas_furnace();
    furnace["system"]["capacity"] = {{"value", 60000}, {"unit", "Btu/h"}};
    const auto at = [&](double feet, bool rated = false) {
        json f = furnace;
        if (rated) f["system"]["altitude_rated"] = true;
        return option(evaluate(scenario(json::array({f}), json::object(), {{"elevation", {{"value", feet}, {"unit", "ft"}}}})), "furnace");
    };
    const auto high = at(6000);
    EXPECT_NEAR(high.at("output_at_elevation").at("value").get<double>(), 45600, 1e-6);
    // The efficiency, and so the year's fuel, stays as rated.
    EXPECT_NEAR(high.at("fuel_quantity").at("value").get<double>(), 625, 1e-9);
    EXPECT_FALSE(at(1900).contains("output_at_elevation"));
    EXPECT_FALSE(at(6000, true).contains("output_at_elevation"));
    EXPECT_NEAR(fw::gas_altitude_derating(2500), 0.10, 1e-12);
}

}  // namespace

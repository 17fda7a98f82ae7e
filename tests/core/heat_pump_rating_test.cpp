// Heat pumps as rated and sold: HSPF and HSPF2 worked by hand from a 47/17 degF data sheet with the
// procedure's equations (10 CFR 430 Subpart B Appendices M and M1, from memory as stated in
// core/src/climate/heat_pump.hpp), the frost default, a variable-speed unit's bins, the same unit
// entered as HSPF 8.8 and HSPF2 7.5 in one house, and the sizing outputs.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>
#include <vector>

#include "fw/api.hpp"
#include "climate/heat_pump.hpp"

namespace {

using nlohmann::json;

double f_to_c(double f) { return (f - 32) * 5 / 9; }

/// Appendix M's steady-state capacity and power [kW] at Tj [degF] from the 47 and 17 degF tests alone:
/// the straight 17-47 line at and above 45 and at and below 17 degF; between them the frost default,
/// Q(35) = 0.90 [Q17 + 0.6 (Q47 - Q17)], P(35) = 0.985 [P17 + 0.6 (P47 - P17)], and
/// Q(Tj) = Q17 + (Q35 - Q17)(Tj - 17)/(35 - 17) for 17 < Tj < 45 (the same for P).
void appendix_m_point(double q47, double p47, double q17, double p17, double tj, double& q, double& p) {
    const auto line = [&](double t, double a17, double a47) { return a17 + (a47 - a17) * (t - 17) / 30; };
    if (tj <= 17 || tj >= 45) {
        q = line(tj, q17, q47);
        p = line(tj, p17, p47);
        return;
    }
    const double q35 = 0.90 * line(35, q17, q47), p35 = 0.985 * line(35, p17, p47);
    q = q17 + (q35 - q17) * (tj - 17) / 18;
    p = p17 + (p35 - p17) * (tj - 17) / 18;
}

/// HSPF [Btu/Wh] worked as the procedure writes it: sum n_j BL_j / sum n_j (e_j + RH_j) x 3.412, over
/// the region IV bins, BL_j = C (T_zl - Tj)/(T_zl - 5) Q47 for Tj < T_zl, X = min(1, BL/Q),
/// PLF = 1 - C_D (1 - X) with C_D 0.25, e = X P / PLF, RH = max(0, BL - Q), no cut-out.
double hand_hspf(double q47, double cop47, double q17, double cop17, double c, double zero_load_f) {
    const double bins[] = {62, 57, 52, 47, 42, 37, 32, 27, 22, 17, 12, 7, 2, -3, -8};
    const double n[] = {0.132, 0.111, 0.103, 0.093, 0.100, 0.109, 0.126, 0.087, 0.055, 0.036, 0.026, 0.013, 0.006, 0.002, 0.001};
    double load = 0, energy = 0;
    for (int j = 0; j < 15; ++j) {
        if (bins[j] >= zero_load_f) continue;
        const double bl = c * (zero_load_f - bins[j]) / (zero_load_f - 5) * q47;
        double q, p;
        appendix_m_point(q47, q47 / cop47, q17, q17 / cop17, bins[j], q, p);
        const double x = std::min(1.0, bl / q);
        const double plf = 1 - 0.25 * (1 - x);
        load += n[j] * bl;
        energy += n[j] * (x * p / plf + std::max(0.0, bl - q));
    }
    return load / energy * 3.41214163312794;
}

TEST(heat_pump_rating, hspf_and_hspf2_worked_from_a_47_17_data_sheet) {
    // A data sheet with two points: 47 degF 10 kW COP 3.6; 17 degF 6 kW COP 2.4.
    const std::vector<fw::heat_pump_point> sheet = {{f_to_c(47), 10, 3.6}, {f_to_c(17), 6, 2.4}};
    const double hspf = hand_hspf(10, 3.6, 6, 2.4, 0.77, 65);   // App. M: C = 0.77, zero load 65 degF
    const double hspf2 = hand_hspf(10, 3.6, 6, 2.4, 1.15, 55);  // App. M1: C = 1.15, zero load 55 degF
    EXPECT_NEAR(fw::procedure_seasonal_cop(sheet, fw::rating_procedure::hspf_appendix_m) * 3.41214163312794, hspf, 1e-9);
    EXPECT_NEAR(fw::procedure_seasonal_cop(sheet, fw::rating_procedure::hspf2_appendix_m1) * 3.41214163312794, hspf2, 1e-9);
    // The same machine rates lower on the heavier HSPF2 load line.
    EXPECT_LT(hspf2, hspf);
    EXPECT_GT(hspf2 / hspf, 0.80);
}

TEST(heat_pump_rating, frost_default_between_17_and_45_degF) {
    // Without a point between 17 and 45 degF: at 35 degF capacity 0.90 x and power 0.985 x the straight
    // line (App. M). 47: 10 kW COP 3.6 (2.7778 kW); 17: 6 kW COP 2.4 (2.5 kW): line at 35 = 8.4 kW,
    // 2.61111 kW -> 7.56 kW, 2.571944 kW, COP 2.93941.
    bool applied = false;
    const auto frosted = fw::with_frost_default({{f_to_c(47), 10, 3.6}, {f_to_c(17), 6, 2.4}}, applied);
    ASSERT_TRUE(applied);
    bool extrapolated = false;
    const auto at35 = fw::interpolate(frosted, f_to_c(35), extrapolated);
    EXPECT_NEAR(at35.capacity_kw, 7.56, 1e-9);
    EXPECT_NEAR(at35.cop, 7.56 / (0.985 * (2.5 + 0.6 * (10 / 3.6 - 2.5))), 1e-9);
    // No loss at 17 degF; up to 45 degF on the 17-35 line (42 degF: 6 + 1.56 x 25/18), from 45 degF on the
    // 17-47 line again; below 17 degF the 17-47 line goes on (12 degF: 6 - 4 x 5/30 kW).
    EXPECT_NEAR(fw::interpolate(frosted, f_to_c(17), extrapolated).capacity_kw, 6, 1e-9);
    EXPECT_NEAR(fw::interpolate(frosted, f_to_c(42), extrapolated).capacity_kw, 6 + 1.56 * 25.0 / 18, 1e-9);
    EXPECT_NEAR(fw::interpolate(frosted, f_to_c(45), extrapolated).capacity_kw, 6 + 4 * 28.0 / 30, 1e-9);
    EXPECT_NEAR(fw::interpolate(frosted, f_to_c(12), extrapolated).capacity_kw, 6 - 4 * 5.0 / 30, 1e-9);
    // A 35 degF point on the sheet is used as it is.
    const auto measured = fw::with_frost_default({{f_to_c(47), 10, 3.6}, {f_to_c(35), 8, 3.0}, {f_to_c(17), 6, 2.4}}, applied);
    EXPECT_FALSE(applied);
    EXPECT_NEAR(fw::interpolate(measured, f_to_c(35), extrapolated).capacity_kw, 8, 1e-12);
}

TEST(heat_pump_rating, a_variable_speed_unit_modulates_and_cycles_only_below_its_minimum) {
    // One point: 5 degC, maximum 8 kW at COP 3, minimum 2.4 kW at COP 4 (a second point at 15 degC with
    // the same values makes the curve flat). C_D 0.25; UA 0.4 kW/K, balance 16 degC.
    // Bin 10 degC (100 h): load 2.4 kW = the minimum: runs continuously at 2.4 kW / 4 = 0.6 kW -> 60 kWh.
    // Bin 12 degC (100 h): load 1.6 kW < minimum: X = 2/3, PLF = 1 - 0.25/3; 2/3 x 0.6 x 100 / PLF = 43.636 kWh.
    // Bin 0 degC (100 h): load 6.4 kW between: power = 0.6 + (6.4 - 2.4)/(8 - 2.4) x (8/3 - 0.6) = 2.07619 kW.
    // Bin -10 degC (100 h): load 10.4 kW > 8: 8/3 kW x 100 h = 266.667 kWh, backup 2.4 x 100 = 240 kWh.
    fw::heat_pump_inputs inputs;
    inputs.modulating = true;
    inputs.points = {{5, 8, 3, 2.4, 4}, {15, 8, 3, 2.4, 4}};
    const std::vector<fw::temperature_bin> bins = {{-10, 100}, {0, 100}, {10, 100}, {12, 100}};
    const auto season = fw::run_bins(bins, 0.4, 16, inputs);
    ASSERT_EQ(season.bins.size(), 4u);
    EXPECT_NEAR(season.bins[2].heat_pump_kwh, 60, 1e-9);
    EXPECT_NEAR(season.bins[3].heat_pump_kwh, (2.0 / 3) * 0.6 * 100 / (1 - 0.25 / 3), 1e-9);
    EXPECT_NEAR(season.bins[1].heat_pump_kwh, (0.6 + 4.0 / 5.6 * (8.0 / 3 - 0.6)) * 100, 1e-9);
    EXPECT_NEAR(season.bins[0].heat_pump_kwh, 8.0 / 3 * 100, 1e-9);
    EXPECT_NEAR(season.bins[0].backup_heat_kwh, 240, 1e-9);
    // The same unit as single-stage cycles at its maximum in every bin and uses more.
    inputs.modulating = false;
    EXPECT_GT(fw::run_bins(bins, 0.4, 16, inputs).heat_pump_kwh, season.heat_pump_kwh);
}

json house_with(const json& heat_pump_system, bool with_climate) {
    json scenario = {{"schema", "fuelwright.scenario/1"},
                     {"settings", {{"units", "us"}, {"currency", "USD"}, {"electricity_co2e_kg_per_kwh", 0.4}}},
                     {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 60}, {"unit", "MMBtu"}}}}},
                     {"options", json::array({{{"id", "hp"}, {"fuel", "electricity"},
                                               {"price", {{"amount", 0.16}, {"per", "kWh"}}}, {"system", heat_pump_system}}})}};
    if (with_climate)
        scenario["climate"] = {{"unit", "degF"},
                               {"monthly_mean", {26.0, 29.0, 38.0, 49.0, 59.0, 68.0, 73.0, 71.0, 64.0, 52.0, 41.0, 31.0}},
                               {"design_temperature", {{"value", 5}, {"unit", "degF"}}}};
    return scenario;
}

TEST(heat_pump_rating, the_same_unit_as_hspf_8_8_and_hspf2_7_5_in_one_house) {
    // The crosswalk of the 2023 federal standards (10 CFR 430.32(c)): split systems HSPF2 7.5 where HSPF
    // was 8.8. The same unit entered either way costs within 5 % in the same house, with or without a climate.
    for (bool climate : {false, true}) {
        const auto cost_of = [&](const char* rating, double value) {
            json system = {{"kind", "air-source-heat-pump"}, {"efficiency", {{"value", value}, {"rating", rating}}},
                           {"capacity", {{"value", 36000}, {"unit", "Btu/h"}}}};
            const auto result = json::parse(fw::evaluate_json(house_with(system, climate).dump()));
            EXPECT_TRUE(result.at("errors").empty()) << result.dump();
            return result.at("options").at(0).at("fuel_quantity").at("value").get<double>();
        };
        EXPECT_NEAR(cost_of("HSPF2", 7.5) / cost_of("HSPF", 8.8), 1.0, 0.05) << (climate ? "with" : "without") << " a climate";
    }
}

TEST(heat_pump_rating, sizing_outputs_and_a_warning_when_the_heat_pump_falls_short) {
    // 60 MMBtu in the invented climate above (99 % design 5 degF); a 2-ton rating-only unit.
    json system = {{"kind", "air-source-heat-pump"}, {"efficiency", {{"value", 8.5}, {"rating", "HSPF2"}}},
                   {"capacity", {{"value", 24000}, {"unit", "Btu/h"}}}, {"stages", "variable"}};
    const auto result = json::parse(fw::evaluate_json(house_with(system, true).dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& hp = result.at("options").at(0);
    EXPECT_EQ(hp.at("design_load").at("unit"), "Btu/h");
    const double load = hp.at("design_load").at("value").get<double>();
    const double capacity = hp.at("capacity_at_design").at("value").get<double>();
    ASSERT_LT(capacity, load);
    // Capacity at 5 degF on the default curve: 50 % of the 47 degF capacity.
    EXPECT_NEAR(capacity, 12000, 1e-6);
    // Its balance point (capacity meets load) lies between the design temperature and the house's balance point.
    const double balance = hp.at("balance_point").at("value").get<double>();
    EXPECT_GT(balance, 5.0);
    EXPECT_LT(balance, hp.at("house_balance_point").at("value").get<double>());
    const auto warnings = result.at("warnings").dump();
    EXPECT_NE(warnings.find("the backup must carry the rest"), std::string::npos) << warnings;
    EXPECT_NE(warnings.find("taken to stop below -13.0 degF (common practice)"), std::string::npos) << warnings;
}

TEST(heat_pump_rating, the_design_load_comes_from_what_the_demand_was_given) {
    // Heat-loss method with a design heat loss of 12 kW: that is the design load (the contractor's own
    // figure); with a UA of 300 W/K and indoor 21 degC it is UA x (21 - design) = 300 x 36 = 10.8 kW at -15 degC.
    json scenario = {{"schema", "fuelwright.scenario/1"},
                     {"settings", {{"units", "metric"}, {"currency", "EUR"}}},
                     {"climate", {{"unit", "degC"},
                                  {"monthly_mean", {-5.0, -3.5, 1.5, 8.0, 14.0, 19.0, 22.0, 21.0, 16.5, 10.0, 4.0, -2.0}},
                                  {"design_temperature", {{"value", -15}, {"unit", "degC"}}}}},
                     {"demand", {{"method", "heat-loss"},
                                 {"design_heat_loss", {{"value", 12}, {"unit", "kW"}}},
                                 {"indoor", {{"value", 21}, {"unit", "degC"}}},
                                 {"balance_point", {{"value", 16}, {"unit", "degC"}}}}},
                     {"options", json::array({{{"id", "hp"}, {"fuel", "electricity"}, {"price", {{"amount", 0.3}, {"per", "kWh"}}},
                                               {"system", {{"kind", "air-source-heat-pump"},
                                                           {"efficiency", {{"value", 3.8}, {"rating", "SCOP"}}},
                                                           {"capacity", {{"value", 8}, {"unit", "kW"}}}}}}})}};
    auto result = json::parse(fw::evaluate_json(scenario.dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("options").at(0).at("design_load"), (json{{"value", 12.0}, {"unit", "kW"}}));
    scenario["demand"].erase("design_heat_loss");
    scenario["demand"]["ua"] = {{"value", 300}, {"unit", "W/K"}};
    result = json::parse(fw::evaluate_json(scenario.dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_NEAR(result.at("options").at(0).at("design_load").at("value").get<double>(), 10.8, 1e-9);
}

}  // namespace

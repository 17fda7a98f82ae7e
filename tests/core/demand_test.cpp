// Heat-loss and bills demand, and heat pumps on temperature bins.
#include <gtest/gtest.h>

#include <cmath>
#include <nlohmann/json.hpp>
#include <numeric>

#include "fw/api.hpp"
#include "climate/demand.hpp"
#include "climate/heat_pump.hpp"
#include "base/units.hpp"

namespace {

using nlohmann::json;

const json mixed_climate = {{"monthly_mean", {-5.0, -3.5, 1.5, 8.0, 14.0, 19.0, 22.0, 21.0, 16.5, 10.0, 4.0, -2.0}},
                            {"unit", "degC"},
                            {"base", {{"value", 18.3}, {"unit", "degC"}}}};

json scenario_with(const json& demand, const json& options = nullptr) {
    json opts = options.is_null()
                    ? json::array({{{"id", "gas"}, {"existing", true}, {"fuel", "natural-gas"},
                                    {"price", {{"amount", 1.2}, {"per", "therm"}}},
                                    {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 80}, {"rating", "AFUE"}}}}}}})
                    : options;
    return {{"schema", "fuelwright.scenario/1"},
            {"settings", {{"units", "metric"}, {"currency", "EUR"}}},
            {"climate", mixed_climate},
            {"demand", demand},
            {"options", opts}};
}

/// The scenario's answer with every detail (trace, sources, bins): these tests read how figures were worked out.
json evaluate(json scenario) {
    scenario["detail"] = json::array({"all"});
    return json::parse(fw::evaluate_json(scenario.dump()));
}

double annual_hdd_c(double base_c) {
    const auto climate = json::parse(fw::climate_json(json{{"climate", {{"monthly_mean", mixed_climate["monthly_mean"]},
                                                                          {"unit", "degC"},
                                                                          {"base", {{"value", base_c}, {"unit", "degC"}}}}}}
                                                           .dump()));
    return climate.at("annual_hdd").get<double>();
}

TEST(demand_heat_loss, ua_times_degree_days_times_24_hours) {
    // 300 W/K, balance point 15.5 degC: Q = 300 x HDD(15.5) x 24 / 1000 kWh.
    const auto result = evaluate(scenario_with({{"method", "heat-loss"},
                                                {"ua", {{"value", 300}, {"unit", "W/K"}}},
                                                {"balance_point", {{"value", 15.5}, {"unit", "degC"}}}}));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_NEAR(result.at("demand").at("annual_useful_heat_kwh").get<double>(), 300 * annual_hdd_c(15.5) * 24 / 1000, 1e-6);
    EXPECT_NEAR(result.at("demand").at("ua_w_per_k").get<double>(), 300, 1e-12);
}

TEST(demand_heat_loss, design_load_with_internal_gains_and_hot_water) {
    // UA = 12000 W / (21 - (-15)) K = 333.33 W/K; balance point = 21 - 1000 W / 333.33 W/K = 18.0 degC.
    // 1 Btu/h/degF = 1055.05585262 / 3600 x 9/5 W/K = 0.527527926 W/K.
    const auto result = evaluate(scenario_with({{"method", "heat-loss"},
                                                {"design_heat_loss", {{"value", 12}, {"unit", "kW"}}},
                                                {"indoor", {{"value", 21}, {"unit", "degC"}}},
                                                {"design_outdoor", {{"value", -15}, {"unit", "degC"}}},
                                                {"internal_gains", {{"value", 1000}, {"unit", "W"}}},
                                                {"hot_water", {{"value", 3000}, {"unit", "kWh"}}}}));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& demand = result.at("demand");
    EXPECT_NEAR(demand.at("ua_w_per_k").get<double>(), 12000.0 / 36.0, 1e-9);
    EXPECT_NEAR(demand.at("balance_point").at("value").get<double>(), 18.0, 1e-9);
    EXPECT_NEAR(demand.at("space_heat_kwh").get<double>(), 12000.0 / 36.0 * annual_hdd_c(18.0) * 24 / 1000, 1e-6);
    EXPECT_NEAR(demand.at("annual_useful_heat_kwh").get<double>(), demand.at("space_heat_kwh").get<double>() + 3000, 1e-9);
    const auto in_us = evaluate(scenario_with({{"method", "heat-loss"}, {"ua", {{"value", 100}, {"unit", "Btu/h/degF"}}},
                                               {"balance_point", {{"value", 18}, {"unit", "degC"}}}}));
    EXPECT_NEAR(in_us.at("demand").at("ua_w_per_k").get<double>(), 52.7527926, 1e-6);
}

TEST(demand_heat_loss, a_house_without_its_heat_loss_is_told_what_to_give) {
    // The page leaves ua out while its field is empty: the message names both ways to give the heat loss.
    const auto result = evaluate(scenario_with({{"method", "heat-loss"}, {"indoor", {{"value", 21}, {"unit", "degC"}}},
                                                {"balance_point", {{"value", 15.5}, {"unit", "degC"}}}}));
    ASSERT_EQ(result.at("errors").size(), 1u) << result.dump();
    EXPECT_EQ(result.at("errors")[0].at("path"), "/demand/ua");
    EXPECT_EQ(result.at("errors")[0].at("message"),
              "is required: the house's heat-loss coefficient (UA), or its design heat loss with the indoor temperature");
    const auto no_indoor = evaluate(scenario_with({{"method", "heat-loss"}, {"design_heat_loss", {{"value", 12}, {"unit", "kW"}}}}));
    ASSERT_EQ(no_indoor.at("errors").size(), 1u) << no_indoor.dump();
    EXPECT_EQ(no_indoor.at("errors")[0].at("path"), "/demand/indoor");
    EXPECT_EQ(no_indoor.at("errors")[0].at("message"), "is required with design_heat_loss");
}

/// Monthly bills for 2025 from a known base [kWh/day], slope [kWh per K day] and tau, in kWh of gas.
json synthetic_bills(double base, double slope, double tau_c, double noise) {
    const json climate = {{"monthly_mean", mixed_climate["monthly_mean"]}, {"unit", "degC"}};
    const auto model = fw::climate_from_means({-5.0, -3.5, 1.5, 8.0, 14.0, 19.0, 22.0, 21.0, 16.5, 10.0, 4.0, -2.0},
                                              std::nullopt, false);
    static const char* starts[] = {"2025-01-01", "2025-02-01", "2025-03-01", "2025-04-01", "2025-05-01", "2025-06-01",
                                   "2025-07-01", "2025-08-01", "2025-09-01", "2025-10-01", "2025-11-01", "2025-12-01"};
    static const char* ends[] = {"2025-01-31", "2025-02-28", "2025-03-31", "2025-04-30", "2025-05-31", "2025-06-30",
                                 "2025-07-31", "2025-08-31", "2025-09-30", "2025-10-31", "2025-11-30", "2025-12-31"};
    json bills = json::array();
    for (int m = 0; m < 12; ++m) {
        const long first = fw::parse_day_number(starts[m], ""), last = fw::parse_day_number(ends[m], "");
        const double days = last - first + 1;
        double kwh = base * days + slope * fw::period_hdd(model, first, last, tau_c);
        kwh *= 1 + noise * std::sin(7.3 * m + 1.1);  // deterministic "noise"
        bills.push_back({{"start", starts[m]}, {"end", ends[m]}, {"quantity", kwh}, {"unit", "kWh"}});
    }
    return bills;
}

TEST(demand_bills, noise_free_bills_recover_base_slope_and_tau) {
    // Synthetic: 8 kWh/day base, 12 kWh per K day above tau = 15.0 degC.
    const auto result = evaluate(scenario_with({{"method", "bills"}, {"option", "gas"}, {"bills", synthetic_bills(8, 12, 15.0, 0)}}));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& fit = result.at("demand").at("fit");
    EXPECT_NEAR(fit.at("tau").get<double>(), 15.0, 1e-4);
    EXPECT_NEAR(fit.at("base_per_day").get<double>(), 8.0, 1e-4);
    EXPECT_NEAR(fit.at("slope").get<double>(), 12.0, 1e-4);
    EXPECT_NEAR(fit.at("r2").get<double>(), 1.0, 1e-9);
    // NAC = 365 x base + slope x HDD0(tau); useful heat = heating part x 0.80 AFUE.
    EXPECT_NEAR(fit.at("heating").get<double>(), 12 * annual_hdd_c(15.0), 1e-2);
    EXPECT_NEAR(fit.at("nac").get<double>(), 365 * 8 + 12 * annual_hdd_c(15.0), 1e-2);
    EXPECT_NEAR(result.at("demand").at("annual_useful_heat_kwh").get<double>(), 0.8 * 12 * annual_hdd_c(15.0), 1e-2);
    EXPECT_NEAR(result.at("demand").at("balance_point").at("value").get<double>(), 15.0, 1e-4);
}

TEST(demand_bills, noisy_bills_recover_the_house_within_tolerance) {
    const auto result = evaluate(scenario_with({{"method", "bills"}, {"option", "gas"}, {"bills", synthetic_bills(8, 12, 15.0, 0.05)}}));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& fit = result.at("demand").at("fit");
    EXPECT_NEAR(fit.at("tau").get<double>(), 15.0, 1.5);
    EXPECT_NEAR(fit.at("nac").get<double>() / (365 * 8 + 12 * annual_hdd_c(15.0)) - 1, 0.0, 0.03);
    EXPECT_GT(fit.at("r2").get<double>(), 0.95);
    EXPECT_GT(fit.at("standard_error").get<double>(), 0.0);
    EXPECT_GT(result.at("demand").at("uncertainty_kwh").get<double>(), 0.0);
}

TEST(demand_bills, warnings_for_thin_or_gappy_bills) {
    auto bills = synthetic_bills(8, 12, 15.0, 0);
    json few = json::array({bills[3], bills[5], bills[7], bills[9]});  // Apr, Jun, Aug, Oct: gaps, no winter
    const auto result = evaluate(scenario_with({{"method", "bills"}, {"option", "gas"}, {"bills", few}}));
    std::vector<std::string> messages;
    for (const auto& w : result.at("warnings")) messages.push_back(w.at("message"));
    auto has = [&](const std::string& start) {
        return std::any_of(messages.begin(), messages.end(), [&](const auto& m) { return m.rfind(start, 0) == 0; });
    };
    EXPECT_TRUE(has("fewer than 6 bills (4)")) << result.dump();
    EXPECT_TRUE(has("no bill covers the coldest months"));
    // May, July and September are not billed: each gap is named at the later bill with both bills' dates.
    EXPECT_TRUE(has("31 days (2025-05-01 to 2025-05-31) between the bill of 2025-04-01 to 2025-04-30 and the bill of "
                    "2025-06-01 to 2025-06-30 are not covered by any bill"));
    const auto& warnings = result.at("warnings");
    EXPECT_TRUE(std::any_of(warnings.begin(), warnings.end(), [](const json& w) { return w.at("path") == "/demand/bills/1/start"; }));
    EXPECT_TRUE(has("30 days (2025-09-01 to 2025-09-30) between the bill of 2025-08-01 to 2025-08-31"));
    // An annual total alone.
    const json annual = json::array({{{"start", "2025-01-01"}, {"end", "2025-12-31"}, {"quantity", 2000}, {"unit", "therm"}}});
    const auto one = evaluate(scenario_with({{"method", "bills"}, {"option", "gas"}, {"bills", annual}}));
    ASSERT_TRUE(one.at("errors").empty()) << one.dump();
    // 2000 therm x 29.3071 kWh/therm x 0.8 AFUE = 46891.4 kWh.
    EXPECT_NEAR(one.at("demand").at("annual_useful_heat_kwh").get<double>(), 2000 * 29.30710701722 * 0.8, 1e-3);
    const auto& annual_warnings = one.at("warnings");
    EXPECT_TRUE(std::any_of(annual_warnings.begin(), annual_warnings.end(), [](const json& w) {
        return w.at("message").get<std::string>().rfind("an annual total alone is not weather-normalised: ", 0) == 0;
    })) << annual_warnings.dump();
}

TEST(demand_bills, errors) {
    auto error_of = [](const json& bills) {
        const auto result = evaluate(scenario_with({{"method", "bills"}, {"option", "gas"}, {"bills", bills}}));
        const auto& e = result.at("errors").at(0);
        return e.at("path").get<std::string>() + ": " + e.at("message").get<std::string>();
    };
    const json ok = {{"start", "2025-01-01"}, {"end", "2025-01-31"}, {"quantity", 100}, {"unit", "therm"}};
    json zero = ok;
    zero["end"] = "2024-12-31";
    EXPECT_EQ(error_of(json::array({zero})),
              "/demand/bills/0/end: the period 2025-01-01 to 2024-12-31 has no days (it ends before it starts)");
    json overlap = ok;
    overlap["start"] = "2025-01-20";
    overlap["end"] = "2025-02-20";
    EXPECT_EQ(error_of(json::array({ok, overlap})),
              "/demand/bills/1/start: the bill of 2025-01-20 to 2025-02-20 overlaps the bill of 2025-01-01 to 2025-01-31 by "
              "11 days (2025-01-20 to 2025-01-30); each day may be billed once");
    json inclusive_overlap = {{"start", "2025-01-31"}, {"end", "2025-02-27"}, {"quantity", 90}, {"unit", "therm"}};
    const auto inclusive = evaluate(scenario_with(
        {{"method", "bills"}, {"option", "gas"}, {"bill_dates", "inclusive"}, {"bills", json::array({ok, inclusive_overlap})}}));
    EXPECT_EQ(inclusive.at("errors").at(0).at("message"),
              "the bill of 2025-01-31 to 2025-02-27 overlaps the bill of 2025-01-01 to 2025-01-31 by 1 day (2025-01-31 to "
              "2025-01-31); each day may be billed once");
    // The billed option's own rating: its problem is said at the option's field, where it is typed.
    const auto bad_rating = evaluate(scenario_with(
        {{"method", "bills"}, {"option", "gas"}, {"bills", json::array({ok})}},
        json::array({{{"id", "gas"}, {"existing", true}, {"fuel", "natural-gas"}, {"price", {{"amount", 1.2}, {"per", "therm"}}},
                      {"system", {{"kind", "furnace"}, {"efficiency", {{"value", -5}, {"rating", "AFUE"}}}}}}})));
    EXPECT_EQ(bad_rating.at("errors").at(0).at("path").get<std::string>().rfind("/options/0/system/efficiency", 0), 0u)
        << bad_rating.at("errors").dump();
    const auto bad_rule = evaluate(
        scenario_with({{"method", "bills"}, {"option", "gas"}, {"bill_dates", "monthly"}, {"bills", json::array({ok})}}));
    EXPECT_EQ(bad_rule.at("errors").at(0).at("path"), "/demand/bill_dates");
    EXPECT_EQ(bad_rule.at("errors").at(0).at("message"),
              "must be \"meter-reads\" (each bill runs from one meter read to the next) or \"inclusive\" (the end date is the "
              "bill's last day), got \"monthly\"");
    json negative = ok;
    negative["quantity"] = -4;
    EXPECT_EQ(error_of(json::array({negative})), "/demand/bills/0/quantity: must be >= 0, got -4");
    json bad_date = ok;
    bad_date["start"] = "2025-02-30";
    EXPECT_EQ(error_of(json::array({bad_date})), "/demand/bills/0/start: date \"2025-02-30\" does not exist");
    json bad_unit = ok;
    bad_unit["unit"] = "gal";
    EXPECT_EQ(error_of(json::array({bad_unit})),
              "/demand/bills/0/unit: natural-gas is sold in therm, ccf, Mcf, ft3, m3, GJ, kWh, MMBtu; got \"gal\"");
    EXPECT_EQ(error_of(json::array({ok})),
              "/demand/bills: needs at least 3 bills to fit against the weather, or bills covering a whole year; got 1 "
              "covering 31 days");
    const auto no_climate = [&] {
        auto s = scenario_with({{"method", "bills"}, {"option", "gas"}, {"bills", json::array({ok})}});
        s.erase("climate");
        return evaluate(s).at("errors").at(0).at("message").get<std::string>();
    }();
    EXPECT_EQ(no_climate, "is required for the bills method (the fit is against its degree-days)");
}

TEST(heat_pump_bins, hand_worked_three_bins) {
    // Bins -10 degC (100 h), 0 degC (200 h), 10 degC (300 h); balance 15 degC; UA 0.2 kW/K;
    // data sheet -10 degC: 3 kW COP 2; 10 degC: 6 kW COP 4 (at 0 degC: 4.5 kW COP 3); C_D 0.25.
    // -10: load 5 kW > 3 kW: X = 1; HP 300 kWh heat, 150 kWh electricity; backup 200 kWh.
    //   0: load 3 kW; X = 2/3, PLF = 1 - 0.25/3 = 0.916667; heat 600; electricity 2/3 x 1.5 x 200 / PLF = 218.182.
    //  10: load 1 kW; X = 1/6, PLF = 1 - 0.25 x 5/6 = 0.791667; heat 300; electricity 1/6 x 1.5 x 300 / PLF = 94.737.
    const std::vector<fw::temperature_bin> bins = {{-10, 100}, {0, 200}, {10, 300}, {20, 400}};
    fw::heat_pump_inputs inputs;
    inputs.points = {{-10, 3, 2}, {10, 6, 4}};
    const auto season = fw::run_bins(bins, 0.2, 15, inputs);
    EXPECT_NEAR(season.load_kwh, 1400, 1e-9);
    EXPECT_NEAR(season.heat_pump_heat_kwh, 1200, 1e-9);
    EXPECT_NEAR(season.backup_heat_kwh, 200, 1e-9);
    EXPECT_NEAR(season.heat_pump_kwh, 150 + 200 / 0.9166666666666666 + 75 / 0.7916666666666666, 1e-9);
    EXPECT_NEAR(season.hours_below_balance_point, 600, 1e-12);
    EXPECT_NEAR(season.seasonal_cop_with_resistance(), 1400 / (season.heat_pump_kwh + 200), 1e-12);
    // The heat pump's own seasonal COP lies between its lowest and highest bin COP.
    EXPECT_GE(season.heat_pump_cop(), season.lowest_bin_cop * (1 - inputs.cd));
    EXPECT_LE(season.heat_pump_cop(), season.highest_bin_cop);
    EXPECT_EQ(season.lowest_bin_cop, 2);
    EXPECT_EQ(season.highest_bin_cop, 4);
}

TEST(heat_pump_bins, energy_balance_closes_and_no_backup_when_capacity_suffices) {
    const auto model = fw::climate_from_means({-5.0, -3.5, 1.5, 8.0, 14.0, 19.0, 22.0, 21.0, 16.5, 10.0, 4.0, -2.0},
                                              std::nullopt, false);
    const auto bins = fw::hourly_bins(model, 1.0);
    fw::heat_pump_inputs big;
    big.points = {{-60, 25, 1.5}, {8.33, 30, 4.0}};  // covers the logistic tails (bins reach -55 degC)
    const auto season = fw::run_bins(bins, 0.25, 16, big);
    EXPECT_NEAR((season.heat_pump_heat_kwh + season.backup_heat_kwh) / season.load_kwh, 1.0, 1e-12);
    EXPECT_EQ(season.backup_heat_kwh, 0.0);
    fw::heat_pump_inputs small = big;
    small.points = {{-25, 2, 1.8}, {8.33, 5, 4.0}};
    small.cutoff_c = -15;
    const auto short_of = fw::run_bins(bins, 0.25, 16, small);
    EXPECT_NEAR((short_of.heat_pump_heat_kwh + short_of.backup_heat_kwh) / short_of.load_kwh, 1.0, 1e-12);
    EXPECT_GT(short_of.backup_heat_kwh, 0.0);
}

TEST(heat_pump_bins, default_curve_reproduces_its_rating_by_its_own_procedure) {
    // Issue 13: a rating-only heat pump's curve is fitted by the rating's procedure and, run back through
    // that procedure's bins, reproduces the rating to 1 % (here to 1e-6). HSPF and HSPF2 in Btu/Wh
    // (/ 3.412 for the seasonal COP, EIA 3,412 Btu/kWh); SCOP as it is.
    for (double rating : {7.5, 8.5, 10.0})
        for (auto procedure : {fw::rating_procedure::hspf_appendix_m, fw::rating_procedure::hspf2_appendix_m1}) {
            const auto points = fw::default_points_for_rating(rating / 3.41214163312794, procedure, 10.0);
            EXPECT_NEAR(fw::procedure_seasonal_cop(points, procedure), rating / 3.41214163312794, 1e-6) << rating;
            EXPECT_NEAR(points[1].capacity_kw / points[0].capacity_kw, 0.62, 1e-12);
        }
    for (double scop : {3.0, 4.0, 4.6}) {
        const auto points = fw::default_points_for_rating(scop, fw::rating_procedure::scop_en14825, 8.0);
        EXPECT_NEAR(fw::procedure_seasonal_cop(points, fw::rating_procedure::scop_en14825), scop, 1e-6) << scop;
    }
}

json heat_pump_scenario(const json& system_patch) {
    json hp = {{"id", "hp"}, {"fuel", "electricity"}, {"price", {{"amount", 0.30}, {"per", "kWh"}}},
               {"system", {{"kind", "air-source-heat-pump"},
                           {"ratings", {{{"outdoor", {{"value", 7}, {"unit", "degC"}}}, {"capacity", {{"value", 9}, {"unit", "kW"}}}, {"cop", 3.6}},
                                        {{"outdoor", {{"value", -7}, {"unit", "degC"}}}, {"capacity", {{"value", 6.5}, {"unit", "kW"}}}, {"cop", 2.4}},
                                        {{"outdoor", {{"value", -15}, {"unit", "degC"}}}, {"capacity", {{"value", 5}, {"unit", "kW"}}}, {"cop", 1.9}}}}}}};
    hp["system"].merge_patch(system_patch);
    json gas = {{"id", "gas"}, {"existing", true}, {"fuel", "natural-gas"}, {"price", {{"amount", 0.10}, {"per", "kWh"}}},
                {"fixed_charges", {{{"label", "standing charge"}, {"amount_per_month", 10}}}},
                {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 90}, {"rating", "seasonal-gcv"}}}}}};
    return scenario_with({{"method", "heat-loss"}, {"ua", {{"value", 250}, {"unit", "W/K"}}},
                          {"balance_point", {{"value", 16}, {"unit", "degC"}}}},
                         json::array({gas, hp}));
}

TEST(heat_pump_scenario, results_on_bins) {
    const auto result = evaluate(heat_pump_scenario(json::object()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& hp = result.at("options").at(1);
    for (const char* key : {"seasonal_cop", "heat_pump_kwh", "backup_kwh", "balance_point", "hours_below_balance_point",
                            "backup_share", "bins"})
        EXPECT_TRUE(hp.contains(key)) << key;
    // Every option serves the same annual heat; the bins' load adds up to it.
    double load = 0, delivered = 0;
    for (const auto& bin : hp.at("bins")) {
        load += bin.at("load_kw").get<double>() * bin.at("hours").get<double>();
        delivered += bin.at("heat_pump_heat_kwh").get<double>() + bin.at("backup_heat_kwh").get<double>();
    }
    EXPECT_NEAR(load / result.at("demand").at("space_heat_kwh").get<double>(), 1.0, 1e-9);
    EXPECT_NEAR(delivered / load, 1.0, 1e-9);
    // Electricity = compressor + resistance backup; seasonal COP = heat / electricity.
    EXPECT_NEAR(hp.at("fuel_quantity").at("value").get<double>(),
                hp.at("heat_pump_kwh").get<double>() + hp.at("backup_kwh").get<double>(), 1e-9);
    EXPECT_NEAR(hp.at("seasonal_cop").get<double>(),
                hp.at("useful_heat_kwh").get<double>() / hp.at("fuel_quantity").at("value").get<double>(), 1e-9);
    EXPECT_GT(hp.at("seasonal_cop").get<double>(), 1.9);
    EXPECT_LT(hp.at("seasonal_cop").get<double>(), 3.6 * 1.2);
}

TEST(heat_pump_scenario, dual_fuel_optimal_changeover_is_the_cheapest) {
    const auto optimal = evaluate(heat_pump_scenario({{"backup", "gas"}, {"changeover", "optimal"}}));
    ASSERT_TRUE(optimal.at("errors").empty()) << optimal.dump();
    const double best = optimal.at("options").at(1).at("energy_cost").get<double>();
    for (double t : {-15.0, -10.0, -5.0, -2.0, 0.0, 3.0, 6.0}) {
        const auto fixed = evaluate(heat_pump_scenario({{"backup", "gas"}, {"changeover", {{"value", t}, {"unit", "degC"}}}}));
        EXPECT_LE(best, fixed.at("options").at(1).at("energy_cost").get<double>() + 1e-9) << t;
    }
    // The backup's fixed charge belongs to the dual-fuel option too.
    EXPECT_NEAR(optimal.at("options").at(1).at("fixed_cost").get<double>(), 120, 1e-12);
    EXPECT_EQ(optimal.at("options").at(1).at("backup_fuel_quantity").at("unit"), "kWh");
}

TEST(heat_pump_scenario, a_sweep_of_the_backup_fuel_moves_the_dual_fuel_option) {
    // A sweep keeps today's cost for options the varied price cannot reach; a dual-fuel heat pump burns
    // the varied gas in its backup, so its series must equal full evaluations at each price.
    const auto base = heat_pump_scenario({{"backup", "gas"}, {"changeover", "optimal"}});
    const auto sweep = json::parse(fw::sweep_json(
        json{{"scenario", base}, {"vary", "price"}, {"of", "natural-gas"}, {"from", 0.02}, {"to", 0.30}, {"points", 8}}.dump()));
    ASSERT_TRUE(sweep.at("errors").empty()) << sweep.dump();
    const auto& hp_costs = sweep.at("series").at(1).at("cost");
    for (std::size_t i = 0; i < sweep.at("x").size(); ++i) {
        auto at = base;
        at["options"][0]["price"]["amount"] = sweep.at("x")[i];
        const auto result = evaluate(at);
        EXPECT_NEAR(hp_costs[i].get<double>() / result.at("options").at(1).at("annual_cost").get<double>() - 1, 0.0, 1e-12) << i;
    }
    EXPECT_NE(hp_costs.front(), hp_costs.back());
    // The same heat pump with resistance backup does not burn gas: its cost stays today's at every price.
    const auto alone = json::parse(fw::sweep_json(
        json{{"scenario", heat_pump_scenario(json::object())}, {"vary", "price"}, {"of", "natural-gas"}, {"points", 5}}.dump()));
    const auto today = evaluate(heat_pump_scenario(json::object())).at("options").at(1).at("annual_cost").get<double>();
    for (const auto& cost : alone.at("series").at(1).at("cost")) EXPECT_EQ(cost.get<double>(), today);
}

TEST(heat_pump_scenario, errors) {
    auto error_of = [](const json& scenario) {
        const auto result = evaluate(scenario);
        const auto& e = result.at("errors").at(0);
        return e.at("path").get<std::string>() + ": " + e.at("message").get<std::string>();
    };
    EXPECT_EQ(error_of(heat_pump_scenario({{"backup", "oil"}})),
              "/options/1/system/backup: no option has id \"oil\"; give electric-resistance or the id of a furnace or "
              "boiler option");
    EXPECT_EQ(error_of(heat_pump_scenario({{"changeover", {{"value", 0}, {"unit", "degC"}}}})),
              "/options/1/system/changeover: a changeover temperature needs a fuel backup (system.backup)");
    EXPECT_EQ(error_of(heat_pump_scenario({{"ratings", {{{"outdoor", {{"value", 7}, {"unit", "degC"}}},
                                                         {"capacity", {{"value", 9}, {"unit", "kW"}}}, {"cop", 3}}}}})),
              "/options/1/system/ratings: needs at least two data-sheet points (e.g. at 47, 17 and 5 degF)");
    EXPECT_EQ(error_of(heat_pump_scenario({{"ratings", {{{"outdoor", {{"value", 7}, {"unit", "degC"}}}, {"capacity", {{"value", 9}, {"unit", "kW"}}}, {"cop", 0.7}},
                                                        {{"outdoor", {{"value", -7}, {"unit", "degC"}}}, {"capacity", {{"value", 6}, {"unit", "kW"}}}, {"cop", 2}}}}})),
              "/options/1/system/ratings/0/cop: a heat pump's COP cannot be below 1, got 0.7");
    EXPECT_EQ(error_of(heat_pump_scenario({{"cd", 1.5}})), "/options/1/system/cd: must be from 0 to 1, got 1.5");
    // Temperatures no weather station has seen (-70 to 60 degC; WMO extremes, from memory), as a slip types them.
    EXPECT_EQ(error_of(heat_pump_scenario({{"cutoff", {{"value", 1e9}, {"unit", "degF"}}}})),
              "/options/1/system/cutoff/value: must be an outdoor temperature from -94 to 140 degF, got 1e+09 degF");
    EXPECT_EQ(error_of(heat_pump_scenario({{"ratings", {{{"outdoor", {{"value", 7}, {"unit", "degC"}}}, {"capacity", {{"value", 9}, {"unit", "kW"}}}, {"cop", 3}},
                                                        {{"outdoor", {{"value", -700}, {"unit", "degC"}}}, {"capacity", {{"value", 6}, {"unit", "kW"}}}, {"cop", 2}}}}})),
              "/options/1/system/ratings/1/outdoor/value: must be an outdoor temperature from -70 to 60 degC, got -700 degC");
}

}  // namespace

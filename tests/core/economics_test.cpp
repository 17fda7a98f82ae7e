// Economics: closed forms against published compound-interest factors, the random stream against
// the C++ standard, hand-worked NPV and payback, break-even, and the Monte Carlo properties.
#include <gtest/gtest.h>

#include <algorithm>
#include <cstdlib>
#include <filesystem>
#include <fstream>

#include <cmath>
#include <nlohmann/json.hpp>
#include <random>

#include "fw/api.hpp"
#include "model/economics.hpp"
#include "base/roots.hpp"
#include "supply/systems.hpp"

namespace {

using nlohmann::json;

TEST(economics, closed_forms_against_published_factors) {
    // Compound-interest tables (e.g. NIST Handbook 135 discount-factor tables; any engineering-economy
    // text): 5 %, 15 years: UPW = 10.3797, CRF = 0.09634; 3 %, 20 years: UPW = 14.8775, CRF = 0.06722.
    EXPECT_NEAR(fw::upw(0.05, 15), 10.3797, 5e-5);
    EXPECT_NEAR(fw::crf(0.05, 15), 0.09634, 5e-6);
    EXPECT_NEAR(fw::upw(0.03, 20), 14.8775, 5e-5);
    EXPECT_NEAR(fw::crf(0.03, 20), 0.06722, 5e-6);
    EXPECT_NEAR(fw::crf(0.05, 15) * fw::upw(0.05, 15), 1.0, 1e-12);  // CRF is 1/UPW
    // UPW* (NIST Handbook 135): (1+e)/(d-e) [1 - ((1+e)/(1+d))^N] = the explicit sum of the series.
    for (const auto& [d, e, n] : std::vector<std::tuple<double, double, int>>{{0.05, 0.02, 15}, {0.03, 0.04, 20}, {0.07, -0.01, 10}}) {
        double sum = 0;
        for (int t = 1; t <= n; ++t) sum += std::pow(1 + e, t) / std::pow(1 + d, t);
        EXPECT_NEAR(fw::upw_escalating(d, e, n), sum, 1e-12) << d << " " << e;
    }
    // d = e: every year's cost has the same present value: UPW* = N, no division by zero.
    EXPECT_DOUBLE_EQ(fw::upw_escalating(0.04, 0.04, 12), 12.0);
    EXPECT_DOUBLE_EQ(fw::upw(0.0, 12), 12.0);
    EXPECT_DOUBLE_EQ(fw::crf(0.0, 8), 0.125);
    EXPECT_EQ(fw::upw_escalating(0.04, 0.04, 12), fw::upw(0.0, 12));
}

TEST(economics, random_stream_is_the_standard_mt19937_64) {
    // [rand.predef]: the 10000th invocation of a default-constructed std::mt19937_64 yields
    // 9981545732273789042; default seed 5489.
    fw::random_stream ours(5489);
    std::mt19937_64 reference;
    for (int i = 0; i < 20000; ++i) ASSERT_EQ(ours.uniform(), (static_cast<double>(reference() >> 11) + 0.5) * 0x1.0p-53) << i;
    std::mt19937_64 standard;
    standard.discard(9999);
    EXPECT_EQ(standard(), 9981545732273789042ULL);
    // Normal variates: mean 0, SD 1 within sampling error (100,000 draws: SE of mean 0.003).
    fw::random_stream normals(42);
    double sum = 0, sq = 0;
    for (int i = 0; i < 100000; ++i) {
        const double z = normals.normal();
        sum += z;
        sq += z * z;
    }
    EXPECT_NEAR(sum / 1e5, 0.0, 0.015);
    EXPECT_NEAR(sq / 1e5, 1.0, 0.02);
}


TEST(economics, quantiles_by_selection_match_the_sorted_definition) {
    // Hyndman & Fan type 7 (R's and NumPy's default): the 0.1-quantile of 1..10 is 1.9 and the
    // median 5.5 (NumPy's numpy.quantile documentation, from memory).
    std::vector<double> ten = {7, 3, 10, 1, 9, 2, 8, 4, 6, 5};
    const auto q = fw::quantiles(ten, {0.10, 0.50, 0.90});
    EXPECT_DOUBLE_EQ(q[0], 1.9);
    EXPECT_DOUBLE_EQ(q[1], 5.5);
    EXPECT_DOUBLE_EQ(q[2], 9.1);
    // Identity with sort + quantile_sorted on random data with ties, for several sizes.
    fw::random_stream random(7);
    for (std::size_t n : {1u, 2u, 3u, 10u, 1001u}) {
        std::vector<double> values;
        for (std::size_t i = 0; i < n; ++i) values.push_back(std::floor(random.uniform() * 50));
        auto sorted = values;
        std::sort(sorted.begin(), sorted.end());
        const std::vector<double> ps = {0.0, 0.10, 0.25, 0.50, 0.90, 1.0};
        const auto selected = fw::quantiles(values, ps);
        for (std::size_t k = 0; k < ps.size(); ++k) EXPECT_EQ(selected[k], fw::quantile_sorted(sorted, ps[k])) << n << " " << ps[k];
    }
}
json switching_scenario(const json& patch = json::object()) {
    json s = {{"schema", "fuelwright.scenario/1"},
              {"settings", {{"units", "us"}, {"currency", "USD"}, {"electricity_co2e_kg_per_kwh", 0.4}}},
              {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 60}, {"unit", "MMBtu"}}}}},
              {"economics", {{"analysis_years", 15}, {"discount_rate", 0.05}, {"escalation", {{"default", 0.02}}}, {"basis", "real"}}},
              {"options",
               {{{"id", "oil"}, {"existing", true}, {"fuel", "heating-oil-2"}, {"price", {{"amount", 3.80}, {"per", "gal"}}},
                 {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 80}, {"rating", "AFUE"}}}}}},
                {{"id", "hp"}, {"fuel", "electricity"}, {"price", {{"amount", 0.14}, {"per", "kWh"}}},
                 {"installed_cost", 16000}, {"incentives", 4000},
                 {"system", {{"kind", "air-source-heat-pump"}, {"efficiency", {{"value", 9}, {"rating", "HSPF2"}}}}}},
                {{"id", "lp"}, {"fuel", "propane"}, {"price", {{"amount", 3.50}, {"per", "gal"}}}, {"installed_cost", 7000},
                 {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 95}, {"rating", "AFUE"}}}}}}}}};
    s.merge_patch(patch);
    return s;
}

const json& option_of(const json& result, const std::string& id) {
    for (const auto& o : result.at("options"))
        if (o.at("id") == id) return o;
    throw std::runtime_error("no option " + id);
}

TEST(economics, hand_worked_npv_and_payback) {
    const auto result = json::parse(fw::evaluate_json(switching_scenario().dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& oil = option_of(result, "oil");
    const auto& hp = option_of(result, "hp");
    const double saving = oil.at("annual_cost").get<double>() - hp.at("annual_cost").get<double>();
    // NPV = -C0 + S0 x UPW*(d = 5 %, e = 2 %, N = 15) (NIST Handbook 135), C0 = 16000 - 4000.
    EXPECT_NEAR(hp.at("annual_saving").get<double>(), saving, 1e-9);
    EXPECT_NEAR(hp.at("npv").get<double>(), -12000 + saving * fw::upw_escalating(0.05, 0.02, 15), 1e-6);
    EXPECT_NEAR(hp.at("simple_payback_years").get<double>(), 12000 / saving, 1e-9);
    // Discounted payback: the year in which sum S0 (1.02/1.05)^t reaches 12000, interpolated.
    double cumulative = 0, expected = -1;
    for (int t = 1; t <= 15 && expected < 0; ++t) {
        const double flow = saving * std::pow(1.02 / 1.05, t);
        if (cumulative + flow >= 12000) expected = t - 1 + (12000 - cumulative) / flow;
        cumulative += flow;
    }
    ASSERT_GT(expected, 0);
    EXPECT_NEAR(hp.at("discounted_payback_years").get<double>(), expected, 1e-9);
    // LCC = C0 + annual cost x UPW*; LCOH = LCC x CRF / useful heat (issue 13: the levelized cost and the
    // life-cycle cost tell the same story).
    const double upw_star = fw::upw_escalating(0.05, 0.02, 15);
    EXPECT_NEAR(hp.at("life_cycle_cost").get<double>(), 12000 + hp.at("annual_cost").get<double>() * upw_star, 1e-6);
    EXPECT_NEAR(hp.at("lcoh_per_kwh").get<double>(),
                (12000 * fw::crf(0.05, 15) + hp.at("annual_cost").get<double>() * upw_star * fw::crf(0.05, 15)) /
                    hp.at("useful_heat_kwh").get<double>(),
                1e-12);
    // CO2e and the cost of avoiding it.
    const double saved = (oil.at("co2e_kg").get<double>() - hp.at("co2e_kg").get<double>()) * 15;
    EXPECT_NEAR(hp.at("co2e_saved_kg_life").get<double>(), saved, 1e-6);
    EXPECT_NEAR(hp.at("cost_per_tonne_co2e_avoided").get<double>(), -hp.at("npv").get<double>() / (saved / 1000), 1e-9);
    // The baseline itself: LCC without capital; no payback.
    EXPECT_NEAR(oil.at("life_cycle_cost").get<double>(), oil.at("annual_cost").get<double>() * upw_star, 1e-6);
    EXPECT_TRUE(oil.at("simple_payback_years").is_null());
    EXPECT_EQ(result.at("ranking_life_cycle").size(), 3u);
}

TEST(economics, no_saving_gives_null_payback_with_a_reason) {
    const auto result = json::parse(fw::evaluate_json(
        switching_scenario({{"options", {{{"id", "oil"}, {"existing", true}, {"fuel", "heating-oil-2"}, {"price", {{"amount", 1.0}, {"per", "gal"}}},
                                          {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 80}, {"rating", "AFUE"}}}}}},
                                         {{"id", "lp"}, {"fuel", "propane"}, {"price", {{"amount", 3.50}, {"per", "gal"}}}, {"installed_cost", 7000},
                                          {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 95}, {"rating", "AFUE"}}}}}}}}})
            .dump()));
    const auto& lp = option_of(result, "lp");
    EXPECT_TRUE(lp.at("simple_payback_years").is_null());
    EXPECT_EQ(lp.at("simple_payback_reason").get<std::string>().rfind("no annual saving against oil (it costs ", 0), 0u);
    EXPECT_TRUE(lp.at("discounted_payback_years").is_null());
}

TEST(economics, replacement_and_residual_value) {
    // Propane furnace 7000, life 10 years, 15-year period: replaced at year 10 (7000 x 1.05^-10), and at
    // year 15 the replacement is half used: residual 7000 x 0.5 x 1.05^-15.
    const auto result = json::parse(fw::evaluate_json(switching_scenario().dump()));
    auto patched = switching_scenario();
    patched["options"][2]["life_years"] = 10;
    const auto with_life = json::parse(fw::evaluate_json(patched.dump()));
    const double difference = option_of(with_life, "lp").at("life_cycle_cost").get<double>() -
                              option_of(result, "lp").at("life_cycle_cost").get<double>();
    // Without life_years the furnace gets the catalog's median of 18 years (data/systems.json, ASHRAE's
    // table, from memory): no replacement in 15 years and 3/18 of it left at the end, residual
    // 7000 x (1 - 15/18) x 1.05^-15, which the 10-year life does not have.
    EXPECT_EQ(option_of(result, "lp").at("life_years"), 18);
    EXPECT_EQ(option_of(result, "lp").at("life_years_from"), "catalog");
    EXPECT_EQ(option_of(with_life, "lp").at("life_years_from"), "entered");
    EXPECT_NEAR(difference, 7000 * std::pow(1.05, -10) - 3500 * std::pow(1.05, -15) + 7000 * (1 - 15.0 / 18) * std::pow(1.05, -15), 1e-6);
}

TEST(economics, a_system_without_a_life_gets_its_catalog_median_service_life) {
    // A heat pump lasts 15 years and a gas furnace 18 (ASHRAE Handbook HVAC Applications, median service lives,
    // from memory): within a 20-year period the heat pump is bought again at year 15 and is 5/15 used at the end.
    const auto result = json::parse(
        fw::evaluate_json(switching_scenario({{"economics", {{"analysis_years", 20}}}, {"detail", {"trace"}}}).dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& hp = option_of(result, "hp");
    EXPECT_EQ(hp.at("life_years"), 15);
    EXPECT_EQ(hp.at("life_years_from"), "catalog");
    const auto annual = hp.at("annual_cost").get<double>();
    const double upw = fw::upw_escalating(0.05, 0.02, 20);
    EXPECT_NEAR(hp.at("life_cycle_cost").get<double>(),
                12000 + 16000 * std::pow(1.05, -15) - 16000 * (1 - 5.0 / 15) * std::pow(1.05, -20) + annual * upw, 1e-6);
    bool said = false;
    for (const auto& line : hp.at("trace"))
        said = said || line.get<std::string>().rfind("service life 15 years: the median for air-source-heat-pump (ASHRAE Handbook", 0) == 0;
    EXPECT_TRUE(said) << hp.at("trace").dump();
    // The existing oil boiler has no installed cost: its life is reported, and costs nothing.
    EXPECT_EQ(option_of(result, "oil").at("life_years"), 24);
}

TEST(economics, lcoh_is_the_life_cycle_cost_levelized_in_every_example) {
    // Issue 13: LCOH x annual heat = LCC x CRF(d, N), replacements, residual value and maintenance
    // escalation included, for every option of every example with economics (to 0.1 %), and for a
    // furnace replaced within the period.
    const char* folder = std::getenv("FUELWRIGHT_DATA_DIR");
    ASSERT_NE(folder, nullptr) << "ctest sets FUELWRIGHT_DATA_DIR";
    int checked = 0;
    for (const auto& entry : std::filesystem::directory_iterator(std::filesystem::path(folder) / "examples")) {
        if (entry.path().filename().string().rfind("supplier-", 0) == 0) continue;
        std::ifstream file(entry.path());
        const auto result = json::parse(fw::evaluate_json(json::parse(file).dump()));
        if (!result.contains("economics") || result.at("economics").is_null()) continue;
        const double d = result.at("economics").at("discount_rate").get<double>();
        const int n = result.at("economics").at("analysis_years").get<int>();
        for (const auto& option : result.at("options")) {
            const double levelized = option.at("life_cycle_cost").get<double>() * fw::crf(d, n);
            EXPECT_NEAR(option.at("lcoh_per_kwh").get<double>() * option.at("useful_heat_kwh").get<double>() / levelized, 1.0, 1e-3)
                << entry.path().filename() << " " << option.at("id");
            ++checked;
        }
    }
    EXPECT_GE(checked, 5);
    auto patched = switching_scenario();
    patched["options"][2]["life_years"] = 10;
    const auto replaced = json::parse(fw::evaluate_json(patched.dump()));
    const auto& lp = option_of(replaced, "lp");
    EXPECT_NEAR(lp.at("lcoh_per_kwh").get<double>() * lp.at("useful_heat_kwh").get<double>(),
                lp.at("life_cycle_cost").get<double>() * fw::crf(0.05, 15), 1e-9);
}

TEST(economics, break_even_price_gives_equal_costs) {
    for (const char* basis : {"annual", "life-cycle"}) {
        const json request = {{"scenario", switching_scenario()}, {"a", "hp"}, {"b", "oil"}, {"vary", "price"}, {"of", "oil"}, {"basis", basis}};
        const auto answer = json::parse(fw::break_even_json(request.dump()));
        ASSERT_TRUE(answer.at("errors").empty()) << answer.dump();
        const double price = answer.at("break_even").at("value").get<double>();
        EXPECT_EQ(answer.at("break_even").at("unit"), "USD/gal");
        // Evaluate the scenario at that oil price: the two costs are equal to 1e-9 relative.
        auto at = switching_scenario();
        at["options"][0]["price"]["amount"] = price;
        const auto result = json::parse(fw::evaluate_json(at.dump()));
        const char* key = std::string(basis) == "annual" ? "annual_cost" : "life_cycle_cost";
        const double a = option_of(result, "hp").at(key).get<double>(), b = option_of(result, "oil").at(key).get<double>();
        EXPECT_NEAR(a / b - 1, 0.0, 1e-9) << basis;
        EXPECT_EQ(answer.at("cheaper_above"), "hp");
    }
    // Lines that never cross: the same fuel at the same efficiency, different fixed charges.
    auto same = switching_scenario();
    same["options"][2] = same["options"][0];
    same["options"][2]["id"] = "oil2";
    same["options"][2]["existing"] = false;
    same["options"][2]["fixed_charges"] = {{{"label", "service plan"}, {"amount_per_year", 200}}};
    const auto never = json::parse(fw::break_even_json(json{{"scenario", same}, {"a", "oil"}, {"b", "oil2"}, {"vary", "price"}, {"of", "heating-oil-2"}}.dump()));
    EXPECT_TRUE(never.at("break_even").is_null()) << never.dump();
    EXPECT_EQ(never.at("reason"), "the two costs change equally with the price of No. 2 heating oil: the lines never cross");
    // The same fuel at two efficiencies, no fixed charges and no electricity of their own: both costs are
    // proportional to the price and meet only at zero, so there is no break-even price, and the more
    // efficient one stays cheaper.
    auto proportional = switching_scenario();
    proportional["options"][0]["system"]["auxiliary_electricity"] = {{"value", 0}, {"unit", "kWh"}};
    proportional["options"][2] = proportional["options"][0];
    proportional["options"][2]["id"] = "oil-new";
    proportional["options"][2]["label"] = "Condensing oil boiler";
    proportional["options"][2]["existing"] = false;
    proportional["options"][2]["system"]["efficiency"]["value"] = 90;
    const auto at_zero = json::parse(fw::break_even_json(
        json{{"scenario", proportional}, {"a", "oil"}, {"b", "oil-new"}, {"vary", "price"}, {"of", "heating-oil-2"}}.dump()));
    ASSERT_TRUE(at_zero.at("errors").empty()) << at_zero.dump();
    EXPECT_TRUE(at_zero.at("break_even").is_null()) << at_zero.dump();
    EXPECT_FALSE(at_zero.contains("statement"));
    EXPECT_EQ(at_zero.at("of"), "heating-oil-2");  // the fuel the request named, not one of its options
    EXPECT_EQ(at_zero.at("reason"), "the costs meet only where the price is zero: at any price above zero, Condensing oil boiler stays cheaper");
    const auto demand_zero = json::parse(fw::break_even_json(
        json{{"scenario", proportional}, {"a", "oil"}, {"b", "oil-new"}, {"vary", "demand"}}.dump()));
    EXPECT_TRUE(demand_zero.at("break_even").is_null()) << demand_zero.dump();
    EXPECT_EQ(demand_zero.at("reason"),
              "the costs meet only where the annual useful heat is zero: at any annual useful heat above zero, Condensing oil boiler "
              "stays cheaper");
    // Break-even efficiency of the oil boiler against the heat pump.
    const auto efficiency = json::parse(fw::break_even_json(
        json{{"scenario", switching_scenario()}, {"a", "oil"}, {"b", "lp"}, {"vary", "efficiency"}}.dump()));
    ASSERT_TRUE(efficiency.at("errors").empty()) << efficiency.dump();
    auto at = switching_scenario();
    at["options"][0]["system"]["efficiency"]["value"] = efficiency.at("break_even").at("value");
    const auto result = json::parse(fw::evaluate_json(at.dump()));
    EXPECT_NEAR(option_of(result, "oil").at("annual_cost").get<double>() / option_of(result, "lp").at("annual_cost").get<double>() - 1,
                0.0, 1e-9);
}

TEST(economics, sweep_and_tornado) {
    const auto sweep = json::parse(fw::sweep_json(json{{"scenario", switching_scenario()}, {"vary", "price"}, {"of", "oil"},
                                                       {"from", 2}, {"to", 6}, {"points", 5}}.dump()));
    // Oil crosses propane at 4.46 USD/gal (in range) and the heat pump at 1.72 USD/gal (below it).
    ASSERT_TRUE(sweep.at("errors").empty()) << sweep.dump();
    EXPECT_EQ(sweep.at("x").size(), 5u);
    const auto& oil = sweep.at("series").at(0).at("cost");
    EXPECT_NEAR(oil[1].get<double>() - oil[0].get<double>(), oil[4].get<double>() - oil[3].get<double>(), 1e-9);  // linear in price
    ASSERT_EQ(sweep.at("break_even").size(), 1u);
    EXPECT_EQ(sweep.at("break_even")[0].at("with"), "lp");
    const auto default_points = json::parse(fw::sweep_json(json{{"scenario", switching_scenario()}, {"of", "oil"}}.dump()));
    EXPECT_EQ(default_points.at("x").size(), 50u);
    const auto tornado = json::parse(fw::tornado_json(json{{"scenario", switching_scenario()}}.dump()));
    ASSERT_TRUE(tornado.at("errors").empty()) << tornado.dump();
    const auto& inputs = tornado.at("inputs");
    ASSERT_GE(inputs.size(), 3u);
    for (std::size_t i = 1; i < inputs.size(); ++i)
        EXPECT_GE(inputs[i - 1].at("swing").get<double>(), inputs[i].at("swing").get<double>());
    // A price is named by its fuel (each fuel here is burned by one option), not by an option's id.
    std::vector<std::string> names;
    for (const auto& input : inputs) names.push_back(input.at("input").get<std::string>());
    EXPECT_NE(std::find(names.begin(), names.end(), "the price of No. 2 heating oil"), names.end()) << tornado.dump();
}

json with_uncertainty(const json& u) {
    auto s = switching_scenario();
    s["uncertainty"] = u;
    return json::parse(fw::evaluate_json(s.dump()));
}

TEST(economics, monte_carlo_properties) {
    const auto first = with_uncertainty({{"draws", 2000}, {"seed", 11}, {"spread", {{"heating-oil-2", 0.3}, {"electricity", 0.2}}}});
    const auto again = with_uncertainty({{"draws", 2000}, {"seed", 11}, {"spread", {{"heating-oil-2", 0.3}, {"electricity", 0.2}}}});
    ASSERT_TRUE(first.at("errors").empty()) << first.dump();
    EXPECT_EQ(first.at("uncertainty"), again.at("uncertainty"));  // a fixed seed gives identical results
    double total = 0;
    for (const auto& o : first.at("uncertainty").at("options")) total += o.at("p_cheapest").get<double>();
    EXPECT_NEAR(total, 1.0, 1e-12);
    // Zero spread reproduces the deterministic result.
    const auto fixed = with_uncertainty({{"draws", 500}, {"seed", 3}, {"spread", 0}});
    for (const auto& o : fixed.at("uncertainty").at("options")) {
        const auto& det = option_of(fixed, o.at("id").get<std::string>());
        for (const char* q : {"annual_cost_p10", "annual_cost_p50", "annual_cost_p90"})
            EXPECT_NEAR(o.at(q).get<double>(), det.at("annual_cost").get<double>(), 1e-9);
        EXPECT_NEAR(o.at("life_cycle_cost_p50").get<double>(), det.at("life_cycle_cost").get<double>(), 1e-6);
    }
    // The standard error of the mean shrinks as 1/sqrt(N): 16x the draws, a quarter of the error.
    const auto small = with_uncertainty({{"draws", 1000}, {"seed", 5}});
    const auto large = with_uncertainty({{"draws", 16000}, {"seed", 5}});
    for (std::size_t i = 0; i < 3; ++i) {
        const double ratio = small.at("uncertainty").at("options")[i].at("life_cycle_cost_standard_error").get<double>() /
                             large.at("uncertainty").at("options")[i].at("life_cycle_cost_standard_error").get<double>();
        EXPECT_NEAR(ratio, 4.0, 0.5) << i;
    }
    // Triangular form: all draws within the half-width.
    const auto tri = with_uncertainty({{"draws", 1000}, {"form", "triangular"}, {"spread", 0.25}});
    const auto& oil = tri.at("uncertainty").at("options")[0];
    const double base = option_of(tri, "oil").at("annual_cost").get<double>();
    EXPECT_GE(oil.at("annual_cost_p10").get<double>(), 0.75 * base);
    EXPECT_LE(oil.at("annual_cost_p90").get<double>(), 1.25 * base);
}

TEST(economics, progress_and_cancellation) {
    auto s = switching_scenario();
    s["uncertainty"] = {{"draws", 5000}};
    int calls = 0;
    const auto done = json::parse(fw::evaluate_json_with_progress(s.dump(), [&](double) { return ++calls, true; }));
    EXPECT_GE(calls, 100);
    EXPECT_EQ(done.at("uncertainty").at("draws"), 5000);
    const auto stopped = json::parse(fw::evaluate_json_with_progress(s.dump(), [](double f) { return f < 0.5; }));
    EXPECT_TRUE(stopped.at("uncertainty").at("cancelled").get<bool>());
    EXPECT_LT(stopped.at("uncertainty").at("draws").get<int>(), 5000);
}

TEST(economics_errors, messages) {
    auto error_of = [](const json& patch) {
        const auto result = json::parse(fw::evaluate_json(switching_scenario(patch).dump()));
        const auto& e = result.at("errors").at(0);
        return e.at("path").get<std::string>() + ": " + e.at("message").get<std::string>();
    };
    EXPECT_EQ(
        error_of({{"economics", {{"discount_rate", -1.5}}}}),
        "/economics/discount_rate: a rate must be from -50 % to 100 % per year (-0.5 to 1 as fractions), got -1.5");
    EXPECT_EQ(
        error_of({{"economics", {{"escalation", {{"propane", -1}}}}}}),
        "/economics/escalation/propane: a rate must be from -50 % to 100 % per year (-0.5 to 1 as fractions), got -1");
    EXPECT_EQ(error_of({{"economics", {{"analysis_years", 0}}}}),
              "/economics/analysis_years: must be a whole number of years from 1 to 50, got 0");
    EXPECT_EQ(error_of({{"uncertainty", {{"draws", 10}}}}), "/uncertainty/draws: must be a whole number from 100 to 200000, got 10");
    EXPECT_EQ(error_of({{"uncertainty", {{"draws", 1e7}}}}),
              "/uncertainty/draws: must be a whole number from 100 to 200000, got 1e+07");
    auto s = switching_scenario();
    s["options"][1]["life_years"] = -3;
    auto result = json::parse(fw::evaluate_json(s.dump()));
    EXPECT_EQ(result.at("errors")[0].at("message"), "must be a service life from 1 to 100 years, got -3");
    s = switching_scenario();
    s["options"][1]["existing"] = true;
    result = json::parse(fw::evaluate_json(s.dump()));
    EXPECT_EQ(result.at("errors")[0].at("message"), "at most one option can be the existing system; 2 are marked existing");
    const auto missing = json::parse(fw::break_even_json(json{{"scenario", switching_scenario()}, {"a", "hp"}, {"b", "gas"}}.dump()));
    EXPECT_EQ(missing.at("errors")[0].at("message"), "no option has id \"gas\"; options: oil, hp, lp");
}

}  // namespace

namespace {

TEST(economics, tornado_and_efficiency_sweep_respect_fixed_and_limited_efficiencies) {
    // Electric resistance is COP 1 by definition: the tornado varies its price, not its efficiency.
    auto s = switching_scenario();
    s["options"].push_back({{"id", "baseboard"}, {"fuel", "electricity"}, {"price", {{"amount", 0.14}, {"per", "kWh"}}},
                            {"system", {{"kind", "electric-resistance"}, {"efficiency", {{"value", 1}, {"rating", "COP"}}}}}});
    const auto tornado = json::parse(fw::tornado_json(json{{"scenario", s}}.dump()));
    ASSERT_TRUE(tornado.at("errors").empty()) << tornado.dump();
    for (const auto& input : tornado.at("inputs"))
        EXPECT_FALSE(input.at("vary") == "efficiency" && input.at("of") == "baseboard") << input.dump();
    // A 95 % AFUE furnace swept by efficiency stops at 100 % rather than 142.5 %.
    const auto sweep = json::parse(fw::sweep_json(json{{"scenario", s}, {"vary", "efficiency"}, {"of", "lp"}}.dump()));
    ASSERT_TRUE(sweep.at("errors").empty()) << sweep.dump();
    EXPECT_DOUBLE_EQ(sweep.at("x").back().get<double>(), 100.0);
}

}  // namespace

namespace {

TEST(economics, illinois_root_keeps_its_bracket) {
    // The cube root of 2 (1.2599210498948732, to double precision) as the root of x^3 - 2 on [1, 2].
    int calls = 0;
    const auto cube = [&](double x) { ++calls; return x * x * x - 2; };
    EXPECT_NEAR(fw::illinois_root(cube, 1.0, 2.0, cube(1.0), cube(2.0)), std::cbrt(2.0), 1e-12);
    EXPECT_LT(calls, 20);  // superlinear: bisection would take about 40 steps to 1e-12
    // A piecewise-linear cost difference with a kink, as a dual-fuel changeover gives: root at 3.
    const auto kinked = [](double x) { return x < 2 ? 0.5 * (x - 2) - 1 : 2 * (x - 3); };
    EXPECT_NEAR(fw::illinois_root(kinked, 0.0, 10.0, kinked(0.0), kinked(10.0)), 3.0, 1e-12);
    // A jump across zero (no root, only a sign change at 1.5): the answer stays at the jump, inside the bracket.
    const auto jump = [](double x) { return x < 1.5 ? -1.0 : 1.0; };
    EXPECT_NEAR(fw::illinois_root(jump, 1.0, 2.0, -1.0, 1.0), 1.5, 1e-12);
    // An end that is already a root is returned as it is.
    EXPECT_EQ(fw::illinois_root(cube, std::cbrt(2.0), 2.0, 0.0, 6.0), std::cbrt(2.0));
}

}  // namespace

TEST(economics, every_catalog_system_has_a_median_service_life_with_its_source) {
    // Data-driven over data/systems.json: a life between 5 and 60 years, and the source's full citation
    // (a key of the file's sources, resolved), never the bare key.
    ASSERT_FALSE(fw::system_table().empty());
    for (const auto& record : fw::system_table()) {
        EXPECT_GE(record.service_life_years, 5) << record.id;
        EXPECT_LE(record.service_life_years, 60) << record.id;
        EXPECT_GT(record.service_life_source.size(), 40u) << record.id << ": " << record.service_life_source;
        EXPECT_NE(record.service_life_source.find("from memory"), std::string::npos) << record.id;
    }
}

// Properties that must hold for any scenario: cost rises with price and falls with efficiency,
// energy cost scales with demand, US and metric entries of the same house agree, energy balances
// close, and no output carries NaN or infinity.
#include <gtest/gtest.h>

#include <cmath>
#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>

#include "fw/api.hpp"
#include "json/json_fields.hpp"

namespace {

using nlohmann::json;

json base() {
    return {{"schema", "fuelwright.scenario/1"},
            {"settings", {{"units", "us"}, {"currency", "USD"}}},
            {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 55}, {"unit", "MMBtu"}}}}},
            {"options",
             {{{"id", "gas"}, {"fuel", "natural-gas"}, {"price", {{"amount", 1.3}, {"per", "therm"}}},
               {"fixed_charges", {{{"label", "customer charge"}, {"amount_per_month", 14}}}},
               {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 92}, {"rating", "AFUE"}}}}}},
              {{"id", "oil"}, {"fuel", "heating-oil-2"}, {"price", {{"amount", 3.6}, {"per", "gal"}}},
               {"system", {{"kind", "boiler"}, {"efficiency", {{"value", 85}, {"rating", "AFUE"}}}}}},
              {{"id", "pellets"}, {"fuel", "wood-pellets"}, {"price", {{"amount", 330}, {"per", "short_ton"}}},
               {"system", {{"kind", "stove"}, {"efficiency", {{"value", 78}, {"rating", "thermal"}}}}}},
              {{"id", "hp"}, {"fuel", "electricity"}, {"price", {{"amount", 0.15}, {"per", "kWh"}}},
               {"system", {{"kind", "air-source-heat-pump"}, {"efficiency", {{"value", 8.8}, {"rating", "HSPF2"}}}}}}}}};
}

json run(const json& scenario) {
    const auto result = json::parse(fw::evaluate_json(scenario.dump()));
    EXPECT_TRUE(result.at("errors").empty()) << result.at("errors").dump();
    return result;
}

TEST(properties, cost_rises_with_price_and_falls_with_efficiency) {
    const auto s = base();
    const auto before = run(s);
    for (std::size_t i = 0; i < s["options"].size(); ++i) {
        auto dearer = s;
        dearer["options"][i]["price"]["amount"] = s["options"][i]["price"]["amount"].get<double>() * 1.07;
        auto better = s;
        better["options"][i]["system"]["efficiency"]["value"] = s["options"][i]["system"]["efficiency"]["value"].get<double>() * 1.05;
        const double cost = before["options"][i]["annual_cost"].get<double>();
        EXPECT_GT(run(dearer)["options"][i]["annual_cost"].get<double>(), cost) << i;
        EXPECT_LT(run(better)["options"][i]["annual_cost"].get<double>(), cost) << i;
    }
}

TEST(properties, doubling_demand_doubles_energy_cost) {
    auto doubled = base();
    doubled["demand"]["annual_useful_heat"]["value"] = 110;
    const auto one = run(base()), two = run(doubled);
    for (std::size_t i = 0; i < one["options"].size(); ++i) {
        // The heating energy doubles; a furnace's auxiliary electricity given as kWh a year (its E_ae rating) does not.
        const auto heating = [](const json& option) {
            return option["energy_cost"].get<double>() - option["auxiliary_cost"].get<double>();
        };
        EXPECT_NEAR(heating(two["options"][i]) / heating(one["options"][i]), 2.0, 1e-12);
        EXPECT_EQ(two["options"][i]["fixed_cost"], one["options"][i]["fixed_cost"]);
    }
}

TEST(properties, us_and_metric_entries_of_the_same_house_agree) {
    // The same house and prices entered in metric units: 55 MMBtu = 58.0277 GJ; gas 1.3 USD/therm =
    // 1.3 / 0.105505585262 USD/GJ; oil 3.6 USD/gal = 3.6 / 3.785411784 USD/L; pellets per tonne.
    auto metric = base();
    metric["settings"]["units"] = "metric";
    metric["demand"]["annual_useful_heat"] = {{"value", 55 * 1.05505585262}, {"unit", "GJ"}};
    metric["options"][0]["price"] = {{"amount", 1.3 / 0.105505585262}, {"per", "GJ"}};
    metric["options"][1]["price"] = {{"amount", 3.6 / 3.785411784}, {"per", "L"}};
    metric["options"][2]["price"] = {{"amount", 330 / 0.90718474}, {"per", "tonne"}};
    const auto us = run(base()), si = run(metric);
    for (std::size_t i = 0; i < us["options"].size(); ++i) {
        for (const char* key : {"annual_cost", "useful_heat_kwh", "fuel_energy_hhv_kwh", "co2e_kg", "cost_per_useful_kwh"})
            EXPECT_NEAR(si["options"][i][key].get<double>() / us["options"][i][key].get<double>(), 1.0, 1e-12) << i << " " << key;
    }
}

TEST(properties, energy_balances_close) {
    const auto result = run(base());
    for (const auto& o : result["options"]) {
        // useful heat = fuel quantity x heating value per unit x seasonal efficiency.
        const double useful = o["fuel_quantity"]["value"].get<double>() * o["heating_value"]["hhv_kwh_per_unit"].get<double>() *
                              o["seasonal_efficiency_hhv"].get<double>();
        EXPECT_NEAR(useful / o["useful_heat_kwh"].get<double>(), 1.0, 1e-9) << o["id"];
    }
}

/// Every number in a JSON value is finite (a NaN would have been turned into an error by the core).
bool all_finite(const json& value) {
    if (value.is_number_float()) return std::isfinite(value.get<double>());
    if (value.is_structured())
        for (const auto& item : value) if (!all_finite(item)) return false;
    return true;
}

std::string read_text(const std::filesystem::path& path) {
    std::ifstream file(path);
    std::stringstream text;
    text << file.rdbuf();
    return text.str();
}

TEST(properties, no_output_field_is_nan_or_infinite) {
    // Every example, and every example with prices at zero, huge and tiny, and efficiencies at their limits.
    int runs = 0;
    for (const auto& entry : std::filesystem::directory_iterator("data/examples")) {
        if (entry.path().extension() != ".json" || entry.path().filename().string().rfind("supplier-", 0) == 0) continue;
        const auto doc = json::parse(read_text(entry.path()));
        std::vector<json> variants = {doc};
        for (double factor : {0.0, 1e-9, 1e6}) {
            auto v = doc;
            for (auto& o : v["options"])
                if (o.contains("price") && o["price"].contains("amount")) o["price"]["amount"] = o["price"]["amount"].get<double>() * factor;
            variants.push_back(v);
        }
        for (const auto& v : variants) {
            const auto text = fw::evaluate_json(v.dump());
            EXPECT_EQ(text.find("internal error"), std::string::npos) << entry.path() << text.substr(0, 300);
            const auto result = json::parse(text);
            EXPECT_TRUE(all_finite(result)) << entry.path();
            ++runs;
        }
    }
    EXPECT_GE(runs, 28);
    // Analyses too.
    const auto sweep = json::parse(fw::sweep_json(json{{"scenario", base()}, {"of", "gas"}, {"from", 0}, {"to", 10}}.dump()));
    EXPECT_TRUE(sweep.at("errors").empty());
    EXPECT_TRUE(all_finite(sweep));
    const auto big = json::parse(fw::convert_json(R"({"value": 1e308, "from": "GJ", "to": "J"})"));
    EXPECT_EQ(big.at("errors")[0].at("message"), "1e+308 GJ is too large to convert to J");
    EXPECT_EQ(big.at("errors")[0].at("path"), "/value");
}

TEST(properties, a_non_finite_result_is_refused_with_its_path) {
    // The guard every entry point runs on its answer before it is written.
    EXPECT_NO_THROW(fw::json_fields::require_finite_output(json{{"a", {1.5, 2}}, {"b", {{"c", "text"}}}}));
    json bad = {{"options", {{{"id", "x"}, {"cost", 1.0}}, {{"id", "y"}, {"cost", {1.0, std::nan("")}}}}}};
    try {
        fw::json_fields::require_finite_output(bad);
        ADD_FAILURE() << "a NaN passed";
    } catch (const fw::input_error& error) {
        EXPECT_EQ(error.path(), "/options/1/cost/1");
        EXPECT_EQ(error.message(), "internal error: a result came out as NaN; please report the scenario");
    }
}

TEST(properties, limits_have_clear_errors) {
    const std::string huge(fw::json_fields::max_request_bytes + 1, ' ');
    const auto result = json::parse(fw::evaluate_json(huge));
    EXPECT_EQ(result.at("errors")[0].at("message").get<std::string>().rfind("the request is 4194305 bytes; at most 4194304", 0), 0u);
    auto many = base();
    for (int i = 0; i < 30; ++i) {
        auto copy = many["options"][0];
        copy["id"] = "extra" + std::to_string(i);
        many["options"].push_back(copy);
    }
    EXPECT_EQ(json::parse(fw::evaluate_json(many.dump())).at("errors")[0].at("message"), "at most 30 options, got 34");
}

}  // namespace

// Supplier price files: the sample is clean; every bad file in tests/fixtures/prices gives its
// expected first problem; tiered prices are billed block by block in a scenario.
#include <gtest/gtest.h>

#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>

#include "fw/api.hpp"

namespace {

using nlohmann::json;

std::string read_text(const std::string& path) {
    std::ifstream file(path);
    std::stringstream text;
    text << file.rdbuf();
    return text.str();
}

TEST(prices, the_sample_file_is_clean) {
    const auto result = json::parse(fw::check_prices_json(read_text("data/examples/supplier-prices.json"), "2026-12-01"));
    EXPECT_TRUE(result.at("valid").get<bool>()) << result.dump();
    EXPECT_FALSE(result.at("expired").get<bool>());
    EXPECT_EQ(result.at("prices").size(), 5u);
    EXPECT_EQ(result.at("supplier"), "Brightwater Fuels (invented supplier)");
    // Before the effective date: valid, with a warning.
    const auto early = json::parse(fw::check_prices_json(read_text("data/examples/supplier-prices.json"), "2026-10-15"));
    EXPECT_TRUE(early.at("valid").get<bool>());
    EXPECT_EQ(early.at("warnings").at(0).at("message"), "not yet in effect: prices apply from 2026-11-01");
}

TEST(prices, every_bad_file_gives_its_message) {
    const auto expected = json::parse(read_text("tests/fixtures/prices/expected.json"));
    ASSERT_GE(expected.at("cases").size(), 15u);
    for (const auto& c : expected.at("cases")) {
        const auto name = c.at("file").get<std::string>();
        const auto text = read_text("tests/fixtures/prices/" + name);
        ASSERT_FALSE(text.empty()) << name;
        const auto result = json::parse(fw::check_prices_json(text, expected.at("today").get<std::string>()));
        EXPECT_FALSE(result.at("valid").get<bool>()) << name;
        ASSERT_FALSE(result.at("errors").empty()) << name;
        EXPECT_EQ(result.at("errors")[0].at("path"), c.at("path")) << name;
        EXPECT_EQ(result.at("errors")[0].at("message"), c.at("message")) << name;
    }
}

TEST(prices, every_problem_is_reported_not_only_the_first) {
    auto doc = json::parse(read_text("data/examples/supplier-prices.json"));
    doc["currency"] = "dollars";
    doc["prices"][1]["amount"] = -1;
    doc["prices"][2]["fuel"] = "coal";
    const auto result = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
    EXPECT_EQ(result.at("errors").size(), 3u) << result.dump();
}

TEST(prices, every_row_of_a_time_of_use_tariff_is_checked) {
    // The invented time-of-use sample with two rows spoiled: both are said, each at its row.
    auto doc = json::parse(read_text("data/examples/supplier-prices-time-of-use.json"));
    auto& schedule = doc["prices"][0]["schedule"];
    schedule[0].erase("amount");
    schedule[2]["hours"] = json::array({json::array({7, 16.25}), json::array({21, 23})});
    const auto result = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
    ASSERT_EQ(result.at("errors").size(), 2u) << result.dump();
    EXPECT_EQ(result.at("errors")[0].at("path"), "/prices/0/schedule/0/amount");
    EXPECT_EQ(result.at("errors")[1].at("path"), "/prices/0/schedule/2/hours/0/1");
}

TEST(prices, the_climate_of_the_area_is_checked_as_a_scenario_reads_it) {
    // An invented climate of the supplier's area, the same object as a scenario's climate.
    auto doc = json::parse(read_text("data/examples/supplier-prices.json"));
    doc["climate"] = {{"monthly_mean", {22, 25, 34, 46, 57, 66, 71, 69, 61, 49, 38, 27}}, {"unit", "degF"}};
    const auto good = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
    EXPECT_TRUE(good.at("valid").get<bool>()) << good.dump();
    EXPECT_EQ(good.at("climate"), doc.at("climate"));

    doc["climate"]["monthly_mean"][0] = 200;
    const auto bad = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
    EXPECT_FALSE(bad.at("valid").get<bool>());
    ASSERT_EQ(bad.at("errors").size(), 1u) << bad.dump();
    EXPECT_EQ(bad.at("errors")[0].at("path"), "/climate/monthly_mean/0");
    EXPECT_EQ(bad.at("errors")[0].at("message"), "200 degF is not a plausible monthly mean (it must lie between -94 and 122 degF)");
    EXPECT_FALSE(bad.contains("climate"));

    doc["climate"] = {{"monthly_mean", {22, 25, 34, 46, 57, 66, 71, 69, 61, 49, 38, 27}}};
    const auto no_unit = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
    EXPECT_EQ(no_unit.at("errors")[0].at("path"), "/climate/unit");
    EXPECT_EQ(no_unit.at("errors")[0].at("message"), "is required (degC or degF)");

    doc["climate"] = "cold";
    const auto not_object = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
    EXPECT_EQ(not_object.at("errors")[0].at("path"), "/climate");
    EXPECT_EQ(not_object.at("errors")[0].at("message"), "must be a JSON object, got string");
}

TEST(prices, tiered_price_in_a_scenario_is_billed_block_by_block) {
    // 60 MMBtu / 0.95 AFUE = 63.158 MMBtu / 0.091452 MMBtu/gal = 690.61 gal:
    // 500 x 2.89 + 190.61 x 2.69 = 1445 + 512.74 = 1957.74 USD.
    const json scenario = {
        {"schema", "fuelwright.scenario/1"},
        {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 60}, {"unit", "MMBtu"}}}}},
        {"options", {{{"id", "lp"}, {"fuel", "propane"},
                      {"price", {{"per", "gal"}, {"tiers", {{{"from", 0}, {"to", 500}, {"amount", 2.89}},
                                                            {{"from", 500}, {"to", 1000}, {"amount", 2.69}},
                                                            {{"from", 1000}, {"amount", 2.49}}}}}},
                      {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 95}, {"rating", "AFUE"}}}}}}}}};
    const auto result = json::parse(fw::evaluate_json(scenario.dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& lp = result.at("options")[0];
    const double gallons = lp.at("fuel_quantity").at("value").get<double>();
    EXPECT_NEAR(gallons, 690.61, 0.005);
    EXPECT_NEAR(lp.at("energy_cost").get<double>(), 500 * 2.89 + (gallons - 500) * 2.69, 1e-9);
    auto gap = scenario;
    gap["options"][0]["price"]["tiers"][1]["from"] = 600;
    const auto bad = json::parse(fw::evaluate_json(gap.dump()));
    EXPECT_EQ(bad.at("errors")[0].at("message"),
              "blocks must follow each other from 0 without gaps or overlaps; expected 500, got 600");
}

}  // namespace

TEST(prices, the_supplier_header_may_carry_a_phone_a_help_line_and_a_logo_on_this_site) {
    auto doc = json::parse(read_text("data/examples/supplier-prices.json"));
    doc["supplier"]["phone"] = "555-0163";
    doc["supplier"]["help_text"] = "Ask at the counter";
    for (const std::string logo : {"logo.svg", "images/brightwater-logo.png", "Logo_2.JPG", "data:image/png;base64,iVBORw0KGgo="}) {
        doc["supplier"]["logo"] = logo;
        const auto good = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
        EXPECT_TRUE(good.at("valid").get<bool>()) << logo << " " << good.dump();
    }
    // anything that could load from elsewhere, or is not an image, is refused at the field
    for (const std::string logo : {"https://elsewhere.example/logo.png", "//elsewhere.example/logo.png", "../logo.png", "/etc/logo.png",
                                   "javascript:alert(1)", "logo.html", "data:text/html;base64,PGI+", "data:image/png;base64,<svg>"}) {
        doc["supplier"]["logo"] = logo;
        const auto bad = json::parse(fw::check_prices_json(doc.dump(), "2026-12-01"));
        EXPECT_FALSE(bad.at("valid").get<bool>()) << logo;
        ASSERT_EQ(bad.at("errors").size(), 1u) << bad.dump();
        EXPECT_EQ(bad.at("errors")[0].at("path"), "/supplier/logo");
        EXPECT_EQ(bad.at("errors")[0].at("message"),
                  "must be an image file on this site (e.g. logo.svg or images/logo.png: .svg, .png, .jpg or .webp, no address elsewhere) "
                  "or a data:image URL");
    }
}

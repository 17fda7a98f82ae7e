// Lean answers: an evaluation carries what the verdict and the sheet show; traces, sources and bins come
// when the request's "detail" asks, or from explain_json for one option. The examples are invented.
#include <gtest/gtest.h>

#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>

#include "fw/api.hpp"

namespace {

using nlohmann::json;

json example(const std::string& name) {
    std::ifstream in("data/examples/" + name);
    std::stringstream text;
    text << in.rdbuf();
    return json::parse(text.str());
}

json evaluate(const json& scenario) { return json::parse(fw::evaluate_json(scenario.dump())); }

TEST(answer_detail, without_detail_the_answer_has_no_trace_sources_or_bins) {
    const auto result = evaluate(example("maple-hollow-heat-pump-bins.json"));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    for (const auto& option : result.at("options")) {
        EXPECT_FALSE(option.contains("trace")) << option.at("id");
        EXPECT_FALSE(option.contains("sources")) << option.at("id");
        EXPECT_FALSE(option.contains("bins")) << option.at("id");
        EXPECT_TRUE(option.contains("annual_cost"));
    }
    EXPECT_FALSE(result.at("demand").contains("trace"));
    EXPECT_FALSE(result.at("climate").contains("bins"));
    EXPECT_FALSE(result.at("climate").contains("trace"));
    // What the verdict shows of a heat pump stays: its seasonal COP and the backup's share.
    EXPECT_TRUE(result.at("options").at(1).contains("seasonal_cop"));
    EXPECT_TRUE(result.at("options").at(1).contains("backup_share"));
}

TEST(answer_detail, detail_adds_only_what_it_lists_and_changes_no_figure) {
    auto scenario = example("maple-hollow-heat-pump-bins.json");
    const auto lean = evaluate(scenario);
    scenario["detail"] = {"trace"};
    const auto traced = evaluate(scenario);
    scenario["detail"] = {"all"};
    const auto full = evaluate(scenario);
    const auto& hp = traced.at("options").at(1);
    EXPECT_TRUE(hp.contains("trace"));
    EXPECT_FALSE(hp.contains("sources"));
    EXPECT_FALSE(hp.contains("bins"));
    EXPECT_TRUE(traced.at("demand").contains("trace"));
    for (std::size_t i = 0; i < lean.at("options").size(); ++i) {
        auto stripped = full.at("options").at(i);
        for (const char* key : {"trace", "sources", "bins"}) stripped.erase(key);
        EXPECT_EQ(stripped, lean.at("options").at(i));
    }
    EXPECT_EQ(full.at("ranking"), lean.at("ranking"));
    EXPECT_GT(full.at("options").at(1).at("bins").size(), 10u);
    EXPECT_GT(full.at("climate").at("bins").size(), 10u);
}

TEST(answer_detail, an_unknown_detail_is_named_at_its_place) {
    auto scenario = example("maple-hollow-gas-vs-heat-pump.json");
    scenario["detail"] = {"trace", "charts"};
    const auto result = evaluate(scenario);
    ASSERT_EQ(result.at("errors").size(), 1u) << result.dump();
    EXPECT_EQ(result.at("errors").at(0).at("path"), "/detail/1");
    EXPECT_EQ(result.at("errors").at(0).at("message"), "unknown detail charts; accepted: trace, sources, bins, all");
    scenario["detail"] = "all";
    const auto text = evaluate(scenario);
    EXPECT_EQ(text.at("errors").at(0).at("path"), "/detail");
    EXPECT_EQ(text.at("errors").at(0).at("message"), "must be a list of \"trace\", \"sources\", \"bins\" or \"all\"");
}

TEST(answer_detail, explain_gives_one_options_full_account_as_evaluate_with_every_detail) {
    auto scenario = example("maple-hollow-heat-pump-bins.json");
    const auto explained = json::parse(fw::explain_json(json{{"scenario", scenario}, {"option", "cold-climate-hp"}}.dump()));
    ASSERT_TRUE(explained.at("errors").empty()) << explained.dump();
    scenario.erase("uncertainty");
    scenario["detail"] = {"all"};
    const auto full = evaluate(scenario);
    const auto& options = full.at("options");
    const auto hp = std::find_if(options.begin(), options.end(), [](const json& o) { return o.at("id") == "cold-climate-hp"; });
    ASSERT_NE(hp, options.end());
    EXPECT_EQ(explained.at("option"), *hp);
    EXPECT_EQ(explained.at("demand"), full.at("demand"));
    EXPECT_TRUE(explained.at("option").contains("trace"));
    EXPECT_TRUE(explained.at("option").contains("bins"));
}

TEST(answer_detail, explain_names_a_missing_option_and_the_scenarios_own_errors_at_their_place) {
    const auto scenario = example("maple-hollow-gas-vs-heat-pump.json");
    const auto missing = json::parse(fw::explain_json(json{{"scenario", scenario}, {"option", "wood-stove"}}.dump()));
    ASSERT_EQ(missing.at("errors").size(), 1u);
    EXPECT_EQ(missing.at("errors").at(0).at("path"), "/option");
    EXPECT_EQ(missing.at("errors").at(0).at("message"), "no option has id \"wood-stove\"");
    auto bad = scenario;
    bad["options"][0]["price"]["amount"] = -1;
    const auto broken = json::parse(fw::explain_json(json{{"scenario", bad}, {"option", bad["options"][0]["id"]}}.dump()));
    ASSERT_FALSE(broken.at("errors").empty());
    EXPECT_EQ(broken.at("errors").at(0).at("path").get<std::string>().rfind("/scenario/options/0/price", 0), 0u) << broken.dump();
    const auto need = json::parse(fw::explain_json(json{{"scenario", example("fjordvik-oil-bills.json")}}.dump()));
    EXPECT_TRUE(need.at("errors").empty()) << need.dump();
    EXPECT_FALSE(need.contains("option"));
    EXPECT_TRUE(need.at("demand").contains("trace"));
    EXPECT_TRUE(need.at("demand").contains("fit"));
    const auto none = json::parse(fw::explain_json("{}"));
    EXPECT_EQ(none.at("errors").at(0).at("path"), "/scenario");
    EXPECT_EQ(none.at("errors").at(0).at("message"), "is required (the scenario to explain)");
}

}  // namespace

// What an option costs beside its heating fuel: a fuel-burning system's own electricity (the furnace
// E_ae rating of 10 CFR 430 Subpart B Appendix N, or a boiler's circulator power while the burner runs),
// the fixed charges of a gas service the house keeps for other appliances, and a furnace's sizing check.
#include <gtest/gtest.h>

#include <algorithm>
#include <nlohmann/json.hpp>
#include <string>

#include "fw/api.hpp"

namespace {

using nlohmann::json;

json furnace(double afue, const json& extra = json::object()) {
    json system = {{"kind", "furnace"}, {"efficiency", {{"value", afue}, {"rating", "AFUE"}}}};
    system.merge_patch(extra);
    return {{"id", "furnace"}, {"existing", true}, {"fuel", "natural-gas"}, {"price", {{"amount", 1.45}, {"per", "therm"}}},
            {"fixed_charges", {{{"label", "gas customer charge"}, {"amount_per_month", 18}}}},
            {"heating_value", {{"value", 100000}, {"unit", "Btu/therm"}, {"basis", "HHV"}}},
            {"system", system}};
}

json heat_pump() {
    return {{"id", "hp"}, {"fuel", "electricity"}, {"price", {{"amount", 0.16}, {"per", "kWh"}}},
            {"system", {{"kind", "ground-source-heat-pump"}, {"efficiency", {{"value", 4.0}, {"rating", "COP"}}}}}};
}

json scenario(const json& options, const json& settings = json::object()) {
    json s = {{"schema", "fuelwright.scenario/1"},
              {"settings", {{"units", "us"}, {"currency", "USD"}, {"electricity_co2e_kg_per_kwh", 0.4}}},
              {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 60}, {"unit", "MMBtu"}}}}},
              {"options", options}};
    s["settings"].merge_patch(settings);
    return s;
}

/// The scenario's answer with every detail (trace, sources, bins): these tests read how figures were worked out.
json evaluate(json scenario) {
    scenario["detail"] = json::array({"all"});
    return json::parse(fw::evaluate_json(scenario.dump()));
}

const json& option(const json& result, const std::string& id) {
    for (const auto& o : result.at("options"))
        if (o.at("id") == id) return o;
    static const json none;
    ADD_FAILURE() << "no option " << id;
    return none;
}

TEST(site_costs, a_furnace_pays_for_its_own_electricity_at_the_site_tariff) {
    // E_ae 550 kWh a year as rated (10 CFR 430 App. N), priced at the electricity option's 0.16 USD/kWh:
    // 88 USD, and 550 x 0.4 = 220 kg CO2e beside the gas's.
    const auto result = evaluate(scenario(json::array(
        {furnace(80, {{"auxiliary_electricity", {{"value", 550}, {"unit", "kWh"}}}}), heat_pump()})));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& f = option(result, "furnace");
    EXPECT_NEAR(f.at("auxiliary_kwh").get<double>(), 550, 1e-12);
    EXPECT_NEAR(f.at("auxiliary_cost").get<double>(), 88, 1e-9);
    // 60 MMBtu / 0.80 = 750 therm x 1.45 = 1087.50 USD + 88 = 1175.50 energy; + 216 fixed.
    EXPECT_NEAR(f.at("energy_cost").get<double>(), 1087.5 + 88, 1e-9);
    EXPECT_NEAR(f.at("annual_cost").get<double>(), 1087.5 + 88 + 216, 1e-9);
    EXPECT_NEAR(f.at("co2e_kg").get<double>(), 75 * (53.06 + 0.001 * 28 + 0.0001 * 265) + 550 * 0.4, 1e-6);
    // settings.electricity wins over an option's price.
    const auto site = evaluate(scenario(json::array({furnace(80, {{"auxiliary_electricity", {{"value", 550}, {"unit", "kWh"}}}}),
                                                     heat_pump()}),
                                        {{"electricity", {{"price", {{"amount", 0.20}, {"per", "kWh"}}}}}}));
    EXPECT_NEAR(option(site, "furnace").at("auxiliary_cost").get<double>(), 110, 1e-9);
}

TEST(site_costs, a_boiler_circulator_in_watts_runs_with_the_burner) {
    // 80 W while the burner runs; output capacity 60,000 Btu/h = 17.5843 kW; 60 MMBtu = 17584.26 kWh of
    // heat -> 1000 burner hours -> 80 kWh, x 0.16 = 12.80 USD.
    json boiler = furnace(84, {{"kind", "boiler"},
                               {"capacity", {{"value", 60000}, {"unit", "Btu/h"}}},
                               {"auxiliary_electricity", {{"value", 80}, {"unit", "W"}}}});
    const auto result = evaluate(scenario(json::array({boiler, heat_pump()})));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_NEAR(option(result, "furnace").at("auxiliary_kwh").get<double>(), 80, 1e-9);
    EXPECT_NEAR(option(result, "furnace").at("auxiliary_cost").get<double>(), 12.8, 1e-9);
    // Without a capacity or a climate the burner hours are not known: 2,000 assumed (common practice),
    // 80 W x 2000 h = 160 kWh, and the warning says so.
    json plain = furnace(84, {{"kind", "boiler"}, {"auxiliary_electricity", {{"value", 80}, {"unit", "W"}}}});
    const auto unknown = evaluate(scenario(json::array({plain, heat_pump()})));
    EXPECT_NEAR(option(unknown, "furnace").at("auxiliary_kwh").get<double>(), 160, 1e-9);
    EXPECT_NE(unknown.at("warnings").dump().find("is counted for an assumed 2000 burner hours a year"), std::string::npos);
    // A heat pump's fans are in its rating: the field is refused there.
    json hp = heat_pump();
    hp["system"]["auxiliary_electricity"] = {{"value", 100}, {"unit", "kWh"}};
    const auto refused = evaluate(scenario(json::array({hp})));
    EXPECT_EQ(refused.at("errors").at(0).at("path"), "/options/0/system/auxiliary_electricity");
}

TEST(site_costs, an_all_electric_option_keeps_paying_for_the_gas_service_the_house_keeps) {
    // The gas range and water heater stay: the 18 USD/month gas charge is paid whatever heats the house.
    // The furnace pays it already (its own fixed charge); the heat pump gets it as a line of its own.
    const json kept = {{"kept_services", {{{"fuel", "natural-gas"},
                                           {"fixed_charges", {{{"label", "gas customer charge"}, {"amount_per_month", 18}}}}}}}};
    const auto without = evaluate(scenario(json::array({furnace(96), heat_pump()})));
    const auto with = evaluate(scenario(json::array({furnace(96), heat_pump()}), kept));
    ASSERT_TRUE(with.at("errors").empty()) << with.dump();
    EXPECT_NEAR(option(with, "hp").at("kept_services_cost").get<double>(), 216, 1e-12);
    EXPECT_NEAR(option(with, "hp").at("annual_cost").get<double>() - option(without, "hp").at("annual_cost").get<double>(), 216, 1e-9);
    EXPECT_EQ(option(with, "furnace").at("kept_services_cost").get<double>(), 0.0);
    EXPECT_NEAR(option(with, "furnace").at("annual_cost").get<double>(), option(without, "furnace").at("annual_cost").get<double>(), 1e-9);
    const auto trace = option(with, "hp").at("trace").dump();
    EXPECT_NE(trace.find("kept natural-gas service, gas customer charge: 18.00 per month x 12 = 216.00 USD"), std::string::npos) << trace;
    // An unknown fuel is refused at its field.
    const auto bad = evaluate(scenario(json::array({furnace(96)}),
                                       {{"kept_services", {{{"fuel", "town-gas"}, {"fixed_charges", json::array()}}}}}));
    EXPECT_EQ(bad.at("errors").at(0).at("path"), "/settings/kept_services/0/fuel");
}

TEST(site_costs, a_furnace_sized_outside_100_to_140_percent_of_the_design_load_is_named) {
    // ACCA Manual S furnace limits (from memory): output 100-140 % of the design heating load.
    json s = scenario(json::array({furnace(95, {{"capacity", {{"value", 120000}, {"unit", "Btu/h"}}}})}));
    s["climate"] = {{"unit", "degF"},
                    {"monthly_mean", {26.0, 29.0, 38.0, 49.0, 59.0, 68.0, 73.0, 71.0, 64.0, 52.0, 41.0, 31.0}},
                    {"design_temperature", {{"value", 5}, {"unit", "degF"}}}};
    const auto big = evaluate(s);
    ASSERT_TRUE(big.at("errors").empty()) << big.dump();
    EXPECT_NE(big.at("warnings").dump().find("oversized (more than 1.4 x, ACCA Manual S, from memory)"), std::string::npos)
        << big.at("warnings").dump();
    s["options"][0]["system"]["capacity"]["value"] = 15000;
    EXPECT_NE(evaluate(s).at("warnings").dump().find("cannot keep the house warm on the coldest days"), std::string::npos);
}

}  // namespace

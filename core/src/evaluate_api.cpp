// JSON entry points for scenarios and catalogs.
#include <algorithm>
#include <nlohmann/json.hpp>

#include "fw/api.hpp"
#include "fw/json_fields.hpp"
#include "fw/scenario.hpp"
#include "fw/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

json sources_json(const std::vector<source_note>& notes) {
    auto list = json::array();
    for (const auto& note : notes) list.push_back({{"record", note.record}, {"value", note.value}, {"citation", note.citation}});
    return list;
}

json option_json(const option_result& r) {
    const double kwh_per_mmbtu = convert(1, "MMBtu", "kWh");
    const double kwh_per_gj = convert(1, "GJ", "kWh");
    return {{"id", r.id},
            {"label", r.label},
            {"fuel", r.fuel_id},
            {"fuel_name", r.fuel_name},
            {"useful_heat_kwh", r.useful_heat_kwh},
            {"seasonal_efficiency_hhv", r.seasonal_efficiency_hhv},
            {"fuel_energy_hhv_kwh", r.fuel_energy_hhv_kwh},
            {"fuel_quantity", {{"value", r.fuel_quantity}, {"unit", r.fuel_unit}}},
            {"heating_value",
             {{"hhv_kwh_per_unit", r.hhv_kwh_per_unit}, {"lhv_kwh_per_unit", r.lhv_kwh_per_unit}, {"unit", r.fuel_unit}}},
            {"price", {{"amount", r.price_per_unit}, {"per", r.fuel_unit}}},
            {"energy_cost", r.energy_cost},
            {"fixed_cost", r.fixed_cost},
            {"annual_cost", r.annual_cost},
            {"cost_per_useful_kwh", r.cost_per_useful_kwh},
            {"cost_per_useful_mmbtu", r.cost_per_useful_kwh * kwh_per_mmbtu},
            {"cost_per_useful_gj", r.cost_per_useful_kwh * kwh_per_gj},
            {"co2e_kg", r.co2e_kg},
            {"co2_fossil_kg", r.co2_fossil_kg},
            {"co2_biogenic_kg", r.co2_biogenic_kg},
            {"ch4_kg", r.ch4_kg},
            {"n2o_kg", r.n2o_kg},
            {"trace", r.trace},
            {"sources", sources_json(r.sources)}};
}

json evaluate(const json& document) {
    std::vector<issue> errors, warnings;
    const auto input = read_scenario(document, errors, warnings);
    json options = json::array();
    std::vector<option_result> results;
    for (const auto& option : input.options) {
        try {
            auto result = evaluate_option(input, option);
            for (const auto& w : result.warnings) warnings.push_back({option.path, w});
            options.push_back(option_json(result));
            results.push_back(std::move(result));
        } catch (const input_error& error) {
            errors.push_back({error.path(), error.message()});
        }
    }
    std::vector<std::size_t> order(results.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
    std::stable_sort(order.begin(), order.end(),
                     [&](std::size_t a, std::size_t b) { return results[a].annual_cost < results[b].annual_cost; });
    json ranking = json::array();
    for (std::size_t rank = 0; rank < order.size(); ++rank)
        ranking.push_back({{"rank", rank + 1}, {"id", results[order[rank]].id}, {"annual_cost", results[order[rank]].annual_cost}});
    json settings = {{"units", input.settings.units == unit_system::us ? "us" : "metric"},
                     {"currency", input.settings.currency},
                     {"electricity_co2e_kg_per_kwh", input.settings.electricity_co2e_kg_per_kwh},
                     {"gwp", input.settings.gwp}};
    json out = {{"schema", "fuelwright.result/1"},
                {"settings", settings},
                {"demand",
                 {{"method", input.demand_method},
                  {"annual_useful_heat_kwh", input.annual_useful_heat_kwh},
                  {"trace", input.demand_trace}}},
                {"options", options},
                {"ranking", ranking},
                {"cautions", cautions()},
                {"errors", issues_json(errors)},
                {"warnings", issues_json(warnings)}};
    return out;
}

json fuel_json(const fuel_record& fuel) {
    json units = json::array();
    for (const auto& unit : fuel.sale_units) {
        const auto hv = heating_value_per_sale_unit(fuel, unit, {});
        units.push_back({{"unit", unit},
                         {"hhv_kwh", hv.hhv_j / 3.6e6},
                         {"lhv_kwh", hv.lhv_j / 3.6e6},
                         {"hhv_mj", hv.hhv_j / 1e6},
                         {"hhv_btu", convert(hv.hhv_j, "J", "Btu")},
                         {"derivation", hv.derivation}});
    }
    json groups = json::array();
    for (const auto& group : fuel.species_groups)
        groups.push_back({{"id", group.id}, {"hhv_mmbtu_per_cord", group.hhv_mmbtu_per_cord}, {"source", group.source}});
    json out = {{"id", fuel.id},
                {"name", fuel.name},
                {"category", category_name(fuel.category)},
                {"hhv", fuel.hhv_text},
                {"lhv_over_hhv", fuel.lhv_over_hhv},
                {"sale_units", units},
                {"emissions",
                 {{"co2_kg_per_mmbtu", fuel.emissions.co2_kg_per_mmbtu},
                  {"ch4_kg_per_mmbtu", fuel.emissions.ch4_kg_per_mmbtu},
                  {"n2o_kg_per_mmbtu", fuel.emissions.n2o_kg_per_mmbtu},
                  {"biogenic", fuel.emissions.biogenic},
                  {"per_kwh_setting", fuel.emissions.per_kwh_setting}}},
                {"sources", sources_json(fuel.sources)}};
    if (!groups.empty()) out["wood_species"] = groups;
    if (fuel.density_kg_per_l) out["density_kg_per_l"] = *fuel.density_kg_per_l;
    return out;
}

}  // namespace

std::string evaluate_json(const std::string& scenario_json) noexcept {
    try {
        return evaluate(parse_request(scenario_json)).dump();
    } catch (const input_error& error) {
        return error_response({{error.path(), error.message()}});
    } catch (const std::exception& error) {
        return error_response({{"", std::string("internal error: ") + error.what()}});
    } catch (...) {
        return error_response({{"", "internal error"}});
    }
}

std::string catalog_json() noexcept {
    try {
        json fuels = json::array();
        for (const auto& fuel : fuel_table()) fuels.push_back(fuel_json(fuel));
        json systems = json::array();
        for (const auto& record : system_table()) {
            json ratings = json::array();
            for (auto rating : record.ratings) ratings.push_back(rating_name(rating));
            systems.push_back({{"id", record.id},
                               {"kind", kind_name(record.kind)},
                               {"variant", record.variant},
                               {"fuels", record.fuels},
                               {"ratings", ratings},
                               {"typical", {{"value", record.typical.value}, {"rating", rating_name(record.typical.rating)}}},
                               {"minimum", {{"value", record.minimum.value}, {"rating", rating_name(record.minimum.rating)}}}});
        }
        const auto& electricity = default_electricity_emissions();
        json gwp = json::object();
        for (const char* id : {"AR4", "AR5", "AR6"}) {
            const auto& set = find_gwp_set(id);
            gwp[id] = {{"CH4", set.ch4}, {"N2O", set.n2o}, {"source", set.source}};
        }
        return json{{"fuels", fuels},
                    {"systems", systems},
                    {"gwp_sets", gwp},
                    {"default_gwp_set", default_gwp_set()},
                    {"electricity_default",
                     {{"co2e_kg_per_kwh", electricity.co2e_kg_per_kwh}, {"year", electricity.year}, {"source", electricity.source}}},
                    {"cautions", cautions()},
                    {"errors", json::array()}}
            .dump();
    } catch (const std::exception& error) {
        return error_response({{"", std::string("internal error: ") + error.what()}});
    }
}

}  // namespace fw

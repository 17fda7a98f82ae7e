// JSON entry points for scenarios and catalogs.
#include <algorithm>
#include <nlohmann/json.hpp>

#include "fw/api.hpp"
#include "base/embedded_data.hpp"
#include "json/json_fields.hpp"
#include "model/appraisal.hpp"
#include "model/verdict.hpp"
#include "json/scenario_reader.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

/// What an evaluation answer carries beyond the verdict and the sheet: the request's "detail" list.
struct answer_detail {
    bool trace = false;    ///< how each figure was worked out (options, demand, climate)
    bool sources = false;  ///< the data records each option used, with citations
    bool bins = false;     ///< each heat pump's temperature bins and the climate's hourly bins
};

/// Reads `detail`: a list of "trace", "sources", "bins" or "all"; absent is none of them.
answer_detail read_detail(const json& document) {
    answer_detail detail;
    if (!document.is_object() || !document.contains("detail")) return detail;
    const auto& list = document.at("detail");
    if (!list.is_array()) throw input_error("/detail", "must be a list of \"trace\", \"sources\", \"bins\" or \"all\"");
    for (std::size_t i = 0; i < list.size(); ++i) {
        const std::string text = list[i].is_string() ? list[i].get<std::string>() : list[i].dump();
        const bool all = text == "all";
        if (!all && text != "trace" && text != "sources" && text != "bins")
            throw input_error("/detail/" + std::to_string(i),
                              "unknown detail " + text + (list[i].is_string() ? "" : " (not a text)") +
                                  "; accepted: trace, sources, bins, all");
        detail.trace = detail.trace || all || text == "trace";
        detail.sources = detail.sources || all || text == "sources";
        detail.bins = detail.bins || all || text == "bins";
    }
    return detail;
}

json option_json(const option_result& r, const scenario& input, const answer_detail& detail) {
    const double kwh_per_mmbtu = convert(1, "MMBtu", "kWh");
    const double kwh_per_gj = convert(1, "GJ", "kWh");
    json out = {{"id", r.id},
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
            {"auxiliary_kwh", r.auxiliary_kwh},
            {"auxiliary_cost", r.auxiliary_cost},
            {"kept_services_cost", r.kept_services_cost}};
    const auto service = [&](const service_result& part) {
        json item = {{"useful_heat_kwh", part.useful_heat_kwh},
                     {"fuel", part.fuel_id},
                     {"fuel_quantity", {{"value", part.fuel_quantity}, {"unit", part.fuel_unit}}},
                     {"annual_cost", part.annual_cost},
                     {"fixed_cost", part.fixed_cost},
                     {"co2e_kg", part.co2e_kg},
                     {"made_by", part.made_by},
                     {"efficiency", part.efficiency}};
        if (part.extra_space_heat_kwh > 0) item["heat_taken_from_space_kwh"] = part.extra_space_heat_kwh;
        return item;
    };
    out["space_heating"] = service(r.space_heating);
    out["water_heating"] = service(r.water_heating);
    out["electricity_kwh"] = r.electricity_kwh;
    if (!r.electricity_periods.empty()) {
        json periods = json::array();
        for (const auto& period : r.electricity_periods)
            periods.push_back({{"name", period.name}, {"kwh", period.kwh}, {"cost", period.cost}});
        out["electricity_periods"] = periods;
    }
    if (r.derated_output_kw) {
        const bool us = input.settings.units == unit_system::us;
        out["output_at_elevation"] = us ? json{{"value", convert(*r.derated_output_kw, "kW", "Btu/h")}, {"unit", "Btu/h"}}
                                        : json{{"value", *r.derated_output_kw}, {"unit", "kW"}};
    }
    if (detail.trace) out["trace"] = r.trace;
    if (detail.sources) out["sources"] = sources_json(r.sources);
    if (r.season) {
        const bool f = input.climate->fahrenheit;
        const std::string unit = f ? "degF" : "degC";
        const auto t = [&](double c) { return json{{"value", convert(c, "degC", unit)}, {"unit", unit}}; };
        out["seasonal_cop"] = r.seasonal_cop;
        out["heat_pump_kwh"] = r.heat_pump_kwh;
        out["backup_kwh"] = r.backup_kwh;
        out["backup_share"] = r.backup_share;
        out["house_balance_point"] = t(r.balance_point_c);
        out["balance_point"] = r.capacity_balance_c ? t(*r.capacity_balance_c) : json(nullptr);
        const bool us = input.settings.units == unit_system::us;
        const auto power = [&](double kw) {
            return us ? json{{"value", convert(kw, "kW", "Btu/h")}, {"unit", "Btu/h"}} : json{{"value", kw}, {"unit", "kW"}};
        };
        out["design_load"] = power(r.design_load_kw);
        out["capacity_at_design"] = power(r.capacity_at_design_kw);
        out["hours_below_balance_point"] = r.season->hours_below_balance_point;
        out["changeover"] = r.changeover_c ? t(*r.changeover_c) : json(nullptr);
        if (!r.backup_option.empty()) {
            out["backup_option"] = r.backup_option;
            out["backup_fuel_quantity"] = {{"value", r.backup_fuel_quantity}, {"unit", r.backup_fuel_unit}};
        }
        out["bin_cop_range"] = {r.season->lowest_bin_cop, r.season->highest_bin_cop};
        // The bins where the house needs heat (below the balance point); result.climate.bins has them all.
        if (!detail.bins) return out;
        json bins = json::array();
        for (const auto& bin : r.season->bins)
            if (bin.load_kw > 0) bins.push_back({{"t", convert(bin.t_c, "degC", unit)},
                            {"hours", bin.hours},
                            {"load_kw", bin.load_kw},
                            {"capacity_kw", bin.capacity_kw},
                            {"cop", bin.cop},
                            {"heat_pump_heat_kwh", bin.heat_pump_heat_kwh},
                            {"backup_heat_kwh", bin.backup_heat_kwh},
                            {"heat_pump_kwh", bin.heat_pump_kwh},
                            {"extrapolated", bin.extrapolated},
                            {"off", bin.off}});
        out["bins"] = bins;
    }
    return out;
}

json demand_result(const scenario& input, const answer_detail& detail) {
    json out = {{"method", input.demand_method},
                {"annual_useful_heat_kwh", input.annual_useful_heat_kwh},
                {"space_heat_kwh", input.space_heat_kwh},
                {"hot_water_kwh", input.hot_water_kwh},
                {"water_heating_kwh", input.hot_water_kwh}};
    if (detail.trace) out["trace"] = input.demand_trace;
    const bool f = input.climate ? input.climate->fahrenheit : input.settings.units == unit_system::us;
    const std::string unit = f ? "degF" : "degC";
    if (input.balance_point_c)
        out["balance_point"] = {{"value", convert(*input.balance_point_c, "degC", unit)}, {"unit", unit}};
    if (input.ua_w_per_k) out["ua_w_per_k"] = *input.ua_w_per_k;
    if (input.demand_uncertainty_kwh) out["uncertainty_kwh"] = *input.demand_uncertainty_kwh;
    if (input.fit) {
        const auto& fit = *input.fit;
        const double per_k = f ? 5.0 / 9.0 : 1.0;  // kWh per K day -> kWh per degF day
        json points = json::array();
        for (const auto& [x, y] : fit.points) points.push_back({{"hdd_per_day", x / per_k}, {"use_per_day", y}});
        out["fit"] = {{"base_per_day", fit.base_kwh_per_day},
                      {"slope", fit.slope_kwh_per_k_day * per_k},
                      {"tau", convert(fit.tau_c, "degC", unit)},
                      {"r2", fit.r2},
                      {"nac", fit.nac_kwh},
                      {"heating", fit.heating_kwh},
                      {"base", fit.base_annual_kwh},
                      {"standard_error", fit.nac_standard_error_kwh},
                      {"nac_standard_error", fit.nac_standard_error_kwh},
                      {"cv_nac", fit.nac_kwh > 0 ? fit.nac_standard_error_kwh / fit.nac_kwh : 0.0},
                      {"weather", fit.weather == bill_weather::observed_daily         ? "observed-daily"
                                  : fit.weather == bill_weather::observed_period_mean ? "observed-period-mean"
                                                                                      : "normals"},
                      {"normal_hdd", fit.normal_hdd / per_k},
                      {"unit", "kWh"},
                      {"temperature_unit", unit},
                      {"points", points}};
    }
    return out;
}

/// Climate results in the input's temperature unit.
json climate_result(const climate_info& info, const answer_detail& detail) {
    const std::string unit = info.fahrenheit ? "degF" : "degC";
    const double per_k = info.fahrenheit ? 9.0 / 5.0 : 1.0;
    const auto t = [&](double c) { return convert(c, "degC", unit); };
    const auto monthly = monthly_hdd(info.model, info.base_c);
    json hdd = json::array(), means = json::array(), sd = json::array();
    double annual = 0;
    for (int m = 0; m < 12; ++m) {
        hdd.push_back(monthly[m] * per_k);
        annual += monthly[m] * per_k;
        means.push_back(t(info.model.monthly_mean_c[m]));
        sd.push_back(info.model.daily_sd_k[m] * per_k);
    }
    double hours = 0;
    for (const auto& bin : info.bins) hours += bin.hours;
    json out = {{"unit", unit},
                {"base", {{"value", t(info.base_c)}, {"unit", unit}}},
                {"monthly_mean", means},
                {"monthly_sd", sd},
                {"monthly_hdd", hdd},
                {"annual_hdd", annual},
                {"bin_width", info.bin_width_k * per_k},
                {"bins_from", info.bins_from_data ? "data" : "model"},
                {"bin_hours_total", hours},
                {"design_temperature_99", t(info.design_99_c)},
                {"design_temperature_996", t(info.design_996_c)},
                {"daily_range", info.model.daily_range_k * per_k}};
    if (detail.bins) {
        json bins = json::array();
        for (const auto& bin : info.bins) bins.push_back({{"t", t(bin.t_c)}, {"hours", bin.hours}});
        out["bins"] = bins;
    }
    if (detail.trace) out["trace"] = info.model.trace;
    return out;
}

json nullable(const std::optional<double>& value) { return value ? json(*value) : json(nullptr); }

/// Adds the economics fields of one option to its JSON result.
void add_economics(json& out, const option_economics& x) {
    const double kwh_per_mmbtu = convert(1, "MMBtu", "kWh");
    const double kwh_per_gj = convert(1, "GJ", "kWh");
    out["life_cycle_cost"] = x.life_cycle_cost;
    out["net_installed_cost"] = x.net_installed_cost;
    out["lcoh_per_kwh"] = x.lcoh_per_kwh;
    out["lcoh_per_mmbtu"] = x.lcoh_per_kwh * kwh_per_mmbtu;
    out["lcoh_per_gj"] = x.lcoh_per_kwh * kwh_per_gj;
    out["annual_saving"] = nullable(x.annual_saving);
    out["simple_payback_years"] = nullable(x.simple_payback_years);
    if (!x.simple_payback_years && !x.payback_reason.empty()) out["simple_payback_reason"] = x.payback_reason;
    out["discounted_payback_years"] = nullable(x.discounted_payback_years);
    if (!x.discounted_payback_years && !x.discounted_payback_reason.empty())
        out["discounted_payback_reason"] = x.discounted_payback_reason;
    out["npv"] = nullable(x.npv);
    out["life_years"] = nullable(x.life_years);
    if (x.life_years) out["life_years_from"] = x.life_from_catalog ? "catalog" : "entered";
    out["co2e_saved_kg_life"] = nullable(x.co2e_saved_kg_life);
    out["cost_per_tonne_co2e_avoided"] = nullable(x.cost_per_tonne_co2e_avoided);
    if (out.contains("trace"))
        for (const auto& line : x.trace) out["trace"].push_back(line);
}

json evaluate(const json& document, const std::function<bool(double)>& progress) {
    std::vector<issue> errors, warnings;
    answer_detail detail;
    collect_errors(errors, [&] { detail = read_detail(document); });
    const auto input = read_scenario(document, errors, warnings);
    const auto verdict = judge(input, errors.empty(), progress);
    const auto& evaluated = verdict.evaluated;
    const auto& results = evaluated.results;
    for (const auto& error : evaluated.errors) errors.push_back(error);
    json options = json::array();
    for (std::size_t i = 0; i < results.size(); ++i) {
        for (const auto& w : results[i].warnings) warnings.push_back({evaluated.options[i]->path, w});
        options.push_back(option_json(results[i], input, detail));
    }
    json ranking = json::array();
    for (std::size_t rank = 0; rank < verdict.by_annual_cost.size(); ++rank) {
        const auto& r = results[verdict.by_annual_cost[rank]];
        ranking.push_back({{"rank", rank + 1}, {"id", r.id}, {"annual_cost", r.annual_cost}});
    }
    json settings = {{"units", input.settings.units == unit_system::us ? "us" : "metric"},
                     {"currency", input.settings.currency},
                     {"electricity_co2e_kg_per_kwh", input.settings.electricity_co2e_kg_per_kwh},
                     {"gwp", input.settings.gwp}};
    json out = {{"schema", "fuelwright.result/1"},
                {"climate", input.climate ? climate_result(*input.climate, detail) : json(nullptr)},
                {"settings", settings},
                {"demand", demand_result(input, detail)},
                {"options", options},
                {"ranking", ranking}};
    if (verdict.economics) {
        const auto& economics = *verdict.economics;
        for (std::size_t i = 0; i < verdict.appraised.size(); ++i) add_economics(out["options"][i], verdict.appraised[i]);
        json lcc_ranking = json::array();
        for (std::size_t rank = 0; rank < verdict.by_life_cycle_cost.size(); ++rank) {
            const auto i = verdict.by_life_cycle_cost[rank];
            lcc_ranking.push_back({{"rank", rank + 1}, {"id", results[i].id}, {"life_cycle_cost", verdict.appraised[i].life_cycle_cost}});
        }
        out["ranking_life_cycle"] = lcc_ranking;
        out["economics"] = {{"analysis_years", economics.analysis_years},
                            {"discount_rate", economics.discount_rate},
                            {"basis", economics.basis},
                            {"default_escalation", economics.default_escalation},
                            {"escalation", economics.escalation},
                            {"maintenance_escalation", economics.maintenance_escalation},
                            {"baseline", verdict.baseline ? json(results[*verdict.baseline].id) : json(nullptr)},
                            {"convention", "end-of-year cash flows; cost in year t = base-year cost x (1 + e)^t / (1 + d)^t "
                                           "(NIST Handbook 135); fixed charges escalate with their fuel"}};
        if (verdict.uncertainty) {
            const auto& mc = *verdict.uncertainty;
            json list = json::array();
            for (const auto& o : mc.options)
                list.push_back({{"id", o.id},
                                {"p_cheapest", o.p_cheapest},
                                {"annual_cost_p10", o.annual_cost_p10},
                                {"annual_cost_p50", o.annual_cost_p50},
                                {"annual_cost_p90", o.annual_cost_p90},
                                {"life_cycle_cost_p10", o.life_cycle_cost_p10},
                                {"life_cycle_cost_p50", o.life_cycle_cost_p50},
                                {"life_cycle_cost_p90", o.life_cycle_cost_p90},
                                {"life_cycle_cost_mean", o.life_cycle_cost_mean},
                                {"life_cycle_cost_standard_error", o.life_cycle_cost_standard_error}});
            out["uncertainty"] = {{"draws", mc.draws}, {"seed", mc.seed}, {"cancelled", mc.cancelled},
                                  {"form", input.uncertainty->triangular ? "triangular" : "lognormal"},
                                  {"notes", mc.notes}, {"options", list}};
        }
    }
    for (const auto& w : verdict.warnings) warnings.push_back(w);
    out["cautions"] = cautions();
    out["errors"] = issues_json(errors);
    out["warnings"] = issues_json(warnings);
    return out;
}

/// The full account of one option and of the heat need (or of the heat need alone, without "option"): the
/// scenario evaluated with every detail and without its Monte Carlo, whose draws change no trace. Errors in the scenario keep its "/scenario" prefix.
json explain(const json& request) {
    require_object(request, "");
    if (!request.contains("scenario")) throw input_error("/scenario", "is required (the scenario to explain)");
    require_object(request.at("scenario"), "/scenario");
    const auto option_id = optional_string(request, "option", "");
    json scenario = request.at("scenario");
    scenario.erase("uncertainty");
    scenario["detail"] = json::array({"all"});
    json full = evaluate(scenario, nullptr);
    json errors = json::array();
    for (auto error : full.at("errors")) {
        error["path"] = "/scenario" + error.at("path").get<std::string>();
        errors.push_back(error);
    }
    json out = {{"schema", "fuelwright.explanation/1"}, {"demand", full.at("demand")}, {"climate", full.at("climate")}};
    if (option_id) {
        const auto& options = full.at("options");
        const auto found = std::find_if(options.begin(), options.end(), [&](const json& o) { return o.at("id") == *option_id; });
        if (found != options.end()) out["option"] = *found;
        else if (errors.empty()) errors.push_back({{"path", "/option"}, {"message", "no option has id \"" + *option_id + "\""}});
    }
    out["errors"] = errors;
    out["warnings"] = full.at("warnings");
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
    return evaluate_json_with_progress(scenario_json, nullptr);
}

std::string evaluate_json_with_progress(const std::string& scenario_json,
                                        const std::function<bool(double)>& progress) noexcept {
    return guarded_entry(scenario_json, [&](const json& document, std::vector<issue>&) { return evaluate(document, progress); });
}

std::string explain_json(const std::string& request_json) noexcept {
    return guarded_entry(request_json, [](const json& request, std::vector<issue>&) { return explain(request); });
}

std::string climate_json(const std::string& request_json) noexcept {
    return guarded_entry(request_json, [](const json& request, std::vector<issue>& warnings) {
        require_object(request, "");
        return climate_result(read_climate(request.contains("climate") ? request.at("climate") : request, warnings),
                              answer_detail{true, true, true});
    });
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
            // the default a fuel-burning system's own electricity takes when the scenario gives none
            if (record.auxiliary_value > 0)
                systems.back()["auxiliary_electricity"] = {{"value", record.auxiliary_value},
                                                           {"unit", record.auxiliary_watts ? "W" : "kWh"},
                                                           {"source", record.auxiliary_source}};
            // the life a system is appraised over when the scenario gives none
            if (record.service_life_years > 0)
                systems.back()["service_life"] = {{"years", record.service_life_years}, {"source", record.service_life_source}};
        }
        const auto& electricity = default_electricity_emissions();
        json gwp = json::object();
        for (const char* id : {"AR4", "AR5", "AR6"}) {
            const auto& set = find_gwp_set(id);
            gwp[id] = {{"CH4", set.ch4}, {"N2O", set.n2o}, {"source", set.source}};
        }
        return dump_text(json{{"fuels", fuels},
                    {"systems", systems},
                    {"gwp_sets", gwp},
                    {"default_gwp_set", default_gwp_set()},
                    {"electricity_default",
                     {{"co2e_kg_per_kwh", electricity.co2e_kg_per_kwh}, {"year", electricity.year}, {"source", electricity.source}}},
                    {"demo_climates", json::parse(detail::embedded_file("demo-climates.json")).at("climates")},
                    {"cautions", cautions()},
                    {"errors", json::array()},
                    {"warnings", json::array()}});
    } catch (const std::exception& error) {
        return error_response({{"", std::string("internal error: ") + error.what()}});
    }
}

}  // namespace fw

// Break-even, sweep and tornado requests read and answers written (json layer); the analyses
// themselves are typed in model/analysis.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>

#include "fw/api.hpp"
#include "model/analysis.hpp"
#include "json/json_fields.hpp"
#include "json/scenario_reader.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

/// The analysed scenario and the cost basis of a request, read in the order the problems are reported:
/// the scenario, its evaluation, then the basis.
analysis_context read_context(const json& request) {
    require_object(request, "");
    if (!request.contains("scenario")) throw input_error("/scenario", "is required (the scenario to analyse)");
    std::vector<issue> errors, warnings;
    auto input = read_scenario(request.at("scenario"), errors, warnings);
    if (!errors.empty()) {
        for (auto& error : errors) error.path = "/scenario" + error.path;
        throw input_error(errors);
    }
    const auto evaluated = evaluate_for_analysis(input);
    const auto basis_text = optional_string(request, "basis", "").value_or("annual");
    if (basis_text != "annual" && basis_text != "life-cycle")
        throw input_error("/basis", "must be annual or life-cycle, got \"" + basis_text + "\"");
    auto context = make_analysis_context(std::move(input), evaluated,
                                         basis_text == "annual" ? cost_basis::annual : cost_basis::life_cycle);
    context.warnings.insert(context.warnings.begin(), warnings.begin(), warnings.end());
    return context;
}

/// The variable a request names: `vary` (price, efficiency or demand) and `of`.
analysis_variable read_variable(const analysis_context& context, const json& request, std::size_t default_option) {
    const auto kind = optional_string(request, "vary", "").value_or("price");
    const auto of = optional_string(request, "of", "");
    if (kind == "price") return variable_for(context, variable_kind::price, of, default_option);
    if (kind == "efficiency") return variable_for(context, variable_kind::efficiency, of, default_option);
    if (kind == "demand") return variable_for(context, variable_kind::demand, of, default_option);
    throw input_error("/vary", "must be price, efficiency or demand, got \"" + kind + "\"");
}

const char* basis_name(cost_basis basis) { return basis == cost_basis::annual ? "annual" : "life-cycle"; }

json break_even_answer(const json& request, std::vector<issue>& warnings) {
    const auto context = read_context(request);
    const auto a_id = optional_string(request, "a", "");
    const auto b_id = optional_string(request, "b", "");
    if (!a_id) throw input_error("/a", "is required (an option id)");
    if (!b_id) throw input_error("/b", "is required (an option id)");
    const auto a = option_index(context.input, *a_id, "/a");
    const auto b = option_index(context.input, *b_id, "/b");
    if (a == b) throw input_error("/b", "must differ from a");
    const auto v = read_variable(context, request, a);
    const auto result = break_even(context, v, a, b);
    for (const auto& w : context.warnings) warnings.push_back(w);
    json out = {{"a", *a_id},
                {"b", *b_id},
                {"vary", variable_kind_name(v.kind)},
                {"of", v.kind == variable_kind::demand ? json(nullptr) : json(v.of)},
                {"basis", basis_name(context.basis)},
                {"current", {{"value", v.current}, {"unit", v.unit}}}};
    if (!result.found.value) {
        out["break_even"] = nullptr;
        out["reason"] = result.found.reason;
        return out;
    }
    out["break_even"] = {{"value", *result.found.value}, {"unit", v.unit}};
    out["costs_at_break_even"] = {{*a_id, result.cost_a}, {*b_id, result.cost_b}};
    out["cheaper_above"] = context.input.options[result.cheaper_above].id;
    out["cheaper_below"] = context.input.options[result.cheaper_below].id;
    out["statement"] = result.statement;
    return out;
}

json sweep_answer(const json& request, std::vector<issue>& warnings) {
    const auto context = read_context(request);
    const auto v = read_variable(context, request, 0);
    const double from = optional_number(request, "from", "").value_or(v.current * 0.5);
    // By default half to one and a half times today's value; an efficiency stops at its rating's limit.
    const double limit = v.kind == variable_kind::efficiency ? upper_limit(context.input.options[v.options.front()]) : INFINITY;
    const double to = optional_number(request, "to", "").value_or(std::min(v.current * 1.5, limit));
    const double points = optional_number(request, "points", "").value_or(50);
    if (points != std::floor(points) || points < 2 || points > 500)
        throw input_error("/points", "must be a whole number from 2 to 500, got " + format_number(points));
    if (!(from >= 0) || !(to > from)) throw input_error("/to", "the range must run upward from a value >= 0");
    if (v.kind != variable_kind::price && !(from > 0))
        throw input_error("/from", std::string("must be > 0 for ") + variable_kind_name(v.kind));
    const auto result = sweep(context, v, from, to, static_cast<int>(points));
    json list = json::array();
    for (std::size_t k = 0; k < result.cost.size(); ++k)
        list.push_back({{"id", context.input.options[k].id}, {"label", context.input.options[k].label}, {"cost", result.cost[k]}});
    json crossings = json::array();
    for (const auto& [k, x] : result.crossings) crossings.push_back({{"with", context.input.options[k].id}, {"value", x}});
    for (const auto& w : context.warnings) warnings.push_back(w);
    return {{"vary", variable_kind_name(v.kind)},
            {"of", v.kind == variable_kind::demand ? json(nullptr) : json(context.input.options[v.options.front()].id)},
            {"unit", v.unit},
            {"basis", basis_name(context.basis)},
            {"current", v.current},
            {"x", result.x},
            {"series", list},
            {"break_even", crossings}};
}

json what_if_answer(const json& request, std::vector<issue>& warnings) {
    const auto context = read_context(request);
    const auto v = read_variable(context, request, 0);
    const auto value = optional_number(request, "value", "");
    if (!value) throw input_error("/value", "is required (the value to try, in " + v.unit + ")");
    if (!(*value >= 0)) throw input_error("/value", "must be >= 0, got " + format_number(*value));
    if (v.kind != variable_kind::price && !(*value > 0))
        throw input_error("/value", std::string("must be > 0 for ") + variable_kind_name(v.kind));
    if (v.kind == variable_kind::efficiency) {
        const auto& option = context.input.options[v.options.front()];
        const double limit = upper_limit(option);
        if (*value > limit)
            throw input_error("/value", std::string(rating_name(option.system.rating)) + " is at most " + format_number(limit) +
                                            ", got " + format_number(*value));
    }
    const auto result = what_if(context, v, *value);
    json options = json::array();
    for (std::size_t k = 0; k < result.cost.size(); ++k) {
        options.push_back({{"id", context.input.options[k].id}, {"label", context.input.options[k].label}, {"cost", result.cost[k]}});
        if (result.saving[k]) options.back()["saving"] = *result.saving[k];
    }
    json ranking = json::array();
    for (std::size_t rank = 0; rank < result.ranking.size(); ++rank)
        ranking.push_back({{"rank", rank + 1}, {"id", context.input.options[result.ranking[rank]].id},
                           {"cost", result.cost[result.ranking[rank]]}});
    for (const auto& w : context.warnings) warnings.push_back(w);
    return {{"vary", variable_kind_name(v.kind)},
            {"of", v.kind == variable_kind::demand ? json(nullptr) : json(v.of)},
            {"label", v.label},
            {"unit", v.unit},
            {"basis", basis_name(context.basis)},
            {"current", v.current},
            {"value", result.value},
            {"existing", result.existing ? json(context.input.options[*result.existing].id) : json(nullptr)},
            {"options", options},
            {"ranking", ranking}};
}

json tornado_answer(const json& request, std::vector<issue>& warnings) {
    const auto context = read_context(request);
    const double step = optional_number(request, "change", "").value_or(0.2);
    if (!(step > 0 && step < 1)) throw input_error("/change", "must be a fraction from above 0 to below 1, got " + format_number(step));
    const auto result = tornado(context, step);
    json inputs = json::array();
    for (const auto& row : result.rows)
        inputs.push_back({{"input", row.variable.label},
                          {"vary", variable_kind_name(row.variable.kind)},
                          {"of", row.variable.kind == variable_kind::demand ? json(nullptr) : json(row.variable.of)},
                          {"margin_low", row.margin_low},
                          {"margin_high", row.margin_high},
                          {"change_low", row.margin_low - result.margin},
                          {"change_high", row.margin_high - result.margin},
                          {"swing", row.swing}});
    for (const auto& w : context.warnings) warnings.push_back(w);
    return {{"basis", basis_name(context.basis)},
            {"change", step},
            {"winner", context.input.options[result.winner].id},
            {"runner_up", context.input.options[result.runner_up].id},
            {"margin", result.margin},
            {"inputs", inputs}};
}

}  // namespace

std::string break_even_json(const std::string& request_json) noexcept { return guarded_entry(request_json, break_even_answer); }
std::string sweep_json(const std::string& request_json) noexcept { return guarded_entry(request_json, sweep_answer); }
std::string tornado_json(const std::string& request_json) noexcept { return guarded_entry(request_json, tornado_answer); }
std::string what_if_json(const std::string& request_json) noexcept { return guarded_entry(request_json, what_if_answer); }

}  // namespace fw

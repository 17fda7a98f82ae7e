// Break-even prices and efficiencies, sweeps and tornado data: the scenario evaluated again with
// one input changed.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>

#include "fw/api.hpp"
#include "model/appraisal.hpp"
#include "json/json_fields.hpp"
#include "json/scenario_reader.hpp"
#include "base/roots.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

enum class basis { annual, life_cycle };

/// What is varied: one option's price, one fuel's price in every option, one option's efficiency, or demand.
struct variable {
    std::string kind;          ///< "price" | "efficiency" | "demand"
    std::vector<std::size_t> options;  ///< the options whose price or efficiency changes
    double current = 0;        ///< in `unit`
    std::string unit;
    std::string label;         ///< "the price of propane", ...
    std::string of;            ///< the option id or fuel id the request named (or the default option's id)
};

struct analysis_context {
    scenario input;
    economics_settings economics;
    basis cost_basis = basis::annual;
    std::vector<issue> warnings;
    std::vector<double> today_costs;  ///< every option's annual or life-cycle cost at today's inputs [currency]
};

/// Option k's evaluated result as a cost on the context's basis: annual, or life-cycle with option k appraised
/// alone [currency].
double cost_on_basis(const analysis_context& context, const scenario& input, std::size_t k, option_result result) {
    if (context.cost_basis == basis::annual) return result.annual_cost;
    evaluation one;
    one.results.push_back(std::move(result));
    one.options.push_back(&input.options[k]);
    return appraise(input, one, context.economics, std::nullopt).front().life_cycle_cost;
}

analysis_context read_context(const json& request) {
    require_object(request, "");
    if (!request.contains("scenario")) throw input_error("/scenario", "is required (the scenario to analyse)");
    analysis_context context;
    std::vector<issue> errors;
    context.input = read_scenario(request.at("scenario"), errors, context.warnings);
    if (!errors.empty()) throw input_error("/scenario" + errors.front().path, errors.front().message);
    const auto evaluated = evaluate_scenario(context.input);
    if (!evaluated.errors.empty())
        throw input_error("/scenario" + evaluated.errors.front().path, evaluated.errors.front().message);
    const auto basis_text = optional_string(request, "basis", "").value_or("annual");
    if (basis_text != "annual" && basis_text != "life-cycle")
        throw input_error("/basis", "must be annual or life-cycle, got \"" + basis_text + "\"");
    context.cost_basis = basis_text == "annual" ? basis::annual : basis::life_cycle;
    context.economics = context.input.economics.value_or(economics_settings{});
    for (std::size_t k = 0; k < evaluated.results.size(); ++k)
        context.today_costs.push_back(cost_on_basis(context, context.input, k, evaluated.results[k]));
    if (context.cost_basis == basis::life_cycle && !context.economics.given)
        context.warnings.push_back({"/scenario/economics", "no economics given: " + std::to_string(context.economics.analysis_years) +
                                                               " years at " + format_number(100 * context.economics.discount_rate) +
                                                               " % real, no escalation (assumptions)"});
    return context;
}

std::size_t option_index(const scenario& input, const std::string& id, const std::string& path) {
    std::string known;
    for (std::size_t i = 0; i < input.options.size(); ++i) {
        if (input.options[i].id == id) return i;
        known += (known.empty() ? "" : ", ") + input.options[i].id;
    }
    throw input_error(path, "no option has id \"" + id + "\"; options: " + known);
}

/// Annual or life-cycle cost of every option [currency].
std::vector<double> costs(const analysis_context& context, const scenario& input) {
    const auto evaluated = evaluate_scenario(input);
    if (!evaluated.errors.empty()) throw input_error("/scenario" + evaluated.errors.front().path, evaluated.errors.front().message);
    std::vector<double> out;
    if (context.cost_basis == basis::annual) {
        for (const auto& r : evaluated.results) out.push_back(r.annual_cost);
    } else {
        for (const auto& x : appraise(input, evaluated, context.economics, std::nullopt)) out.push_back(x.life_cycle_cost);
    }
    return out;
}

/// Annual or life-cycle cost of option k alone [currency].
double option_cost(const analysis_context& context, const scenario& input, std::size_t k) {
    try {
        return cost_on_basis(context, input, k, evaluate_option(input, input.options[k]));
    } catch (const input_error& error) {
        throw input_error("/scenario" + error.path(), error.message());
    }
}

variable read_variable(const analysis_context& context, const json& request, std::size_t default_option) {
    const auto& input = context.input;
    variable v;
    v.kind = optional_string(request, "vary", "").value_or("price");
    const auto of = optional_string(request, "of", "");
    const auto& currency = input.settings.currency;
    if (v.kind == "price") {
        if (of && std::none_of(input.options.begin(), input.options.end(), [&](const auto& o) { return o.id == *of; })) {
            // A fuel id: that fuel's price in every option, scaled together.
            for (std::size_t i = 0; i < input.options.size(); ++i)
                if (input.options[i].fuel.id == *of) v.options.push_back(i);
            if (v.options.empty()) throw input_error("/of", "\"" + *of + "\" is neither an option id nor the fuel of an option");
        } else {
            v.options.push_back(of ? option_index(input, *of, "/of") : default_option);
        }
        const auto& first = input.options[v.options.front()];
        v.of = of.value_or(first.id);
        v.current = first.price_per_unit;
        v.unit = currency + "/" + first.price_unit;
        v.label = "the price of " + first.fuel.name;
    } else if (v.kind == "efficiency") {
        v.options.push_back(of ? option_index(input, *of, "/of") : default_option);
        const auto& option = input.options[v.options.front()];
        v.of = option.id;
        if (!option.efficiency_given || (!option.ratings.empty() && input.climate))
            throw input_error("/of", option.id + " follows a data sheet on temperature bins and has no single efficiency "
                                                 "to vary; vary its price instead");
        v.current = option.system.efficiency_value;
        v.unit = std::string(rating_name(option.system.rating));
        v.label = "the efficiency of " + option.label;
    } else if (v.kind == "demand") {
        v.current = input.annual_useful_heat_kwh;
        v.unit = "kWh";
        v.label = "the annual useful heat";
    } else {
        throw input_error("/vary", "must be price, efficiency or demand, got \"" + v.kind + "\"");
    }
    return v;
}

/// The scenario with the variable set to x.
scenario with_value(const scenario& input, const variable& v, double x) {
    scenario out = input;
    if (v.kind == "price") {
        const double factor = v.current != 0 ? x / v.current : 0.0;
        for (auto i : v.options) {
            auto& option = out.options[i];
            option.price_per_unit = v.current != 0 ? option.price_per_unit * factor : x;
            for (auto& tier : option.tiers) tier.amount = v.current != 0 ? tier.amount * factor : x;
        }
    } else if (v.kind == "efficiency") {
        out.options[v.options.front()].system.efficiency_value = x;
    } else {
        const double factor = x / v.current;
        out.annual_useful_heat_kwh *= factor;
        out.space_heat_kwh *= factor;
        out.hot_water_kwh *= factor;
    }
    return out;
}

/// Whether option k's cost can change with the variable: its own price or efficiency, that of its dual-fuel
/// backup, or the demand. An option that cannot keeps today's cost at every value.
bool depends_on(const scenario& input, const variable& v, std::size_t k) {
    if (v.kind == "demand") return true;
    const auto varied = [&](std::size_t i) { return std::find(v.options.begin(), v.options.end(), i) != v.options.end(); };
    if (varied(k)) return true;
    for (std::size_t i = 0; i < input.options.size(); ++i) {
        if (varied(i) && input.options[i].id == input.options[k].backup) return true;
        // A fuel-burning system's own electricity may be priced at an electricity option's price.
        if (varied(i) && v.kind == "price" && input.options[i].fuel.category == fuel_category::electricity &&
            input.options[k].auxiliary && !input.settings.electricity_price_per_kwh)
            return true;
    }
    return false;
}

/// The largest value the rating allows (efficiencies), or infinity.
double upper_limit(const scenario_option& option) {
    switch (option.system.rating) {
        case efficiency_rating::afue:
        case efficiency_rating::thermal:
        case efficiency_rating::seasonal_gcv: return 100.0;
        case efficiency_rating::seasonal_ncv: return 100.0 / option.fuel.lhv_over_hhv;
        default: return INFINITY;
    }
}

struct crossing {
    std::optional<double> value;
    std::string reason;
};

/// Where cost(a) = cost(b) as the variable changes; linear in price (in 1/efficiency), polished by the Illinois
/// method where it is not.
crossing find_crossing(const analysis_context& context, const variable& v, std::size_t a, std::size_t b) {
    const auto cost_of = [&](const scenario& at, std::size_t k) {
        return depends_on(context.input, v, k) ? option_cost(context, at, k) : context.today_costs[k];
    };
    const auto difference = [&](double x) {
        const auto at = with_value(context.input, v, x);
        return cost_of(at, a) - cost_of(at, b);
    };
    const bool reciprocal = v.kind == "efficiency";
    const auto to_x = [&](double y) { return reciprocal ? 1.0 / y : y; };
    const double y0 = reciprocal ? 1.0 / v.current : 0.0;
    const double y1 = reciprocal ? 1.0 / (0.8 * v.current) : (v.current > 0 ? v.current : 1.0);
    const double f0 = difference(to_x(y0)), f1 = difference(to_x(y1));
    const double scale = std::max({std::fabs(f0), std::fabs(f1), 1e-12});
    if (std::fabs(f1 - f0) <= 1e-12 * scale)
        return {std::nullopt, "the two costs change equally with " + v.label + ": the lines never cross"};
    const double y = y0 - f0 * (y1 - y0) / (f1 - f0);
    const std::string quantity = reciprocal ? "efficiency" : v.kind == "demand" ? "annual useful heat" : "price";
    if (!reciprocal && std::fabs(y) <= 1e-9 * y1) {
        // Both costs are proportional to the variable (same fuel, no fixed charges): they meet only at zero.
        const auto& cheaper = context.input.options[f1 < 0 ? a : b];
        return {std::nullopt, "the costs meet only where the " + quantity + " is zero: at any " + quantity + " above zero, " +
                                  cheaper.label + " stays cheaper"};
    }
    if (!(y > 0))
        return {std::nullopt, "the lines would cross only at a negative " + quantity + " (" + format_number(to_x(y)) + ")"};
    double x = to_x(y);
    const double limit = v.kind == "efficiency" ? upper_limit(context.input.options[v.options.front()]) : INFINITY;
    if (x > limit)
        return {std::nullopt, "it would take " + format_number(x) + " " + v.unit + ", more than the rating allows (" +
                                  format_number(limit) + ")"};
    // Polish where the cost is not exactly linear (dual-fuel changeover, bins).
    double fx = difference(x);
    if (std::fabs(fx) > 1e-11 * scale) {
        double lo = x * 0.5, hi = std::min(x * 1.5, limit);
        double flo = difference(lo), fhi = difference(hi);
        for (int i = 0; i < 20 && flo * fhi > 0; ++i) {
            lo *= 0.5;
            hi = std::min(hi * 2, limit);
            flo = difference(lo);
            fhi = difference(hi);
        }
        if (flo * fhi <= 0) x = illinois_root(difference, lo, hi, flo, fhi, 1e-12 * scale);
    }
    return {x, ""};
}

json break_even(const json& request, std::vector<issue>& warnings) {
    auto context = read_context(request);
    const auto a_id = optional_string(request, "a", "");
    const auto b_id = optional_string(request, "b", "");
    if (!a_id) throw input_error("/a", "is required (an option id)");
    if (!b_id) throw input_error("/b", "is required (an option id)");
    const auto a = option_index(context.input, *a_id, "/a");
    const auto b = option_index(context.input, *b_id, "/b");
    if (a == b) throw input_error("/b", "must differ from a");
    const auto v = read_variable(context, request, a);
    const auto found = find_crossing(context, v, a, b);
    for (const auto& w : context.warnings) warnings.push_back(w);
    json out = {{"a", *a_id},
                {"b", *b_id},
                {"vary", v.kind},
                {"of", v.kind == "demand" ? json(nullptr) : json(v.of)},
                {"basis", context.cost_basis == basis::annual ? "annual" : "life-cycle"},
                {"current", {{"value", v.current}, {"unit", v.unit}}}};
    if (!found.value) {
        out["break_even"] = nullptr;
        out["reason"] = found.reason;
        return out;
    }
    const double x = *found.value;
    out["break_even"] = {{"value", x}, {"unit", v.unit}};
    const auto at = costs(context, with_value(context.input, v, x));
    out["costs_at_break_even"] = {{*a_id, at[a]}, {*b_id, at[b]}};
    const auto above = costs(context, with_value(context.input, v, x * 1.01 + 1e-9));
    const std::string cheaper_above = above[a] < above[b] ? *a_id : *b_id;
    const std::string cheaper_below = cheaper_above == *a_id ? *b_id : *a_id;
    out["cheaper_above"] = cheaper_above;
    out["cheaper_below"] = cheaper_below;
    const auto label = [&](const std::string& id) { return context.input.options[option_index(context.input, id, "")].label; };
    out["statement"] = label(cheaper_above) + " is cheaper " + (context.cost_basis == basis::annual ? "per year" : "over its life") +
                       " while " + v.label + " is above " + format_fixed(x, v.kind == "demand" ? 0 : 3) + " " + v.unit +
                       "; below it, " + label(cheaper_below) + " is";
    return out;
}

json sweep(const json& request, std::vector<issue>& warnings) {
    auto context = read_context(request);
    const auto v = read_variable(context, request, 0);
    const double from = optional_number(request, "from", "").value_or(v.current * 0.5);
    // By default half to one and a half times today's value; an efficiency stops at its rating's limit.
    const double limit = v.kind == "efficiency" ? upper_limit(context.input.options[v.options.front()]) : INFINITY;
    const double to = optional_number(request, "to", "").value_or(std::min(v.current * 1.5, limit));
    const double points = optional_number(request, "points", "").value_or(50);
    if (points != std::floor(points) || points < 2 || points > 500)
        throw input_error("/points", "must be a whole number from 2 to 500, got " + format_number(points));
    if (!(from >= 0) || !(to > from)) throw input_error("/to", "the range must run upward from a value >= 0");
    if (v.kind != "price" && !(from > 0)) throw input_error("/from", "must be > 0 for " + v.kind);
    const auto n = static_cast<int>(points);
    json xs = json::array();
    std::vector<json> series(context.input.options.size(), json::array());
    std::vector<double> grid;
    for (int i = 0; i < n; ++i) {
        grid.push_back(from + (to - from) * i / (n - 1));
        xs.push_back(grid.back());
    }
    // Most costs are exactly linear in a price (and in 1/efficiency): check each option at four
    // points and fill the line in; evaluate the others (bins, changeovers) at every point.
    const bool reciprocal = v.kind == "efficiency";
    const auto coordinate = [&](double x) { return reciprocal ? 1.0 / x : x; };
    std::vector<scenario> probes;
    const int checks[] = {0, (n - 1) / 3, 2 * (n - 1) / 3, n - 1};
    for (int i : checks) probes.push_back(with_value(context.input, v, grid[i]));
    for (std::size_t k = 0; k < context.input.options.size(); ++k) {
        if (!depends_on(context.input, v, k)) {
            series[k] = json(std::vector<double>(static_cast<std::size_t>(n), context.today_costs[k]));
            continue;
        }
        double c[4];
        for (int j = 0; j < 4; ++j) c[j] = option_cost(context, probes[j], k);
        const double u0 = coordinate(grid[checks[0]]), u3 = coordinate(grid[checks[3]]);
        const double slope = (c[3] - c[0]) / (u3 - u0);
        const double scale = std::max({std::fabs(c[0]), std::fabs(c[3]), 1e-9});
        bool linear = true;
        for (int j = 1; j < 3; ++j)
            linear = linear && std::fabs(c[0] + slope * (coordinate(grid[checks[j]]) - u0) - c[j]) <= 1e-10 * scale;
        for (int i = 0; i < n; ++i) {
            const double value = linear ? c[0] + slope * (coordinate(grid[i]) - u0)
                                        : option_cost(context, with_value(context.input, v, grid[i]), k);
            series[k].push_back(value);
        }
    }
    json list = json::array();
    for (std::size_t k = 0; k < series.size(); ++k)
        list.push_back({{"id", context.input.options[k].id}, {"label", context.input.options[k].label}, {"cost", series[k]}});
    json crossings = json::array();
    if (v.kind != "demand") {
        const auto varied = v.options.front();
        for (std::size_t k = 0; k < context.input.options.size(); ++k) {
            if (std::find(v.options.begin(), v.options.end(), k) != v.options.end()) continue;
            const auto found = find_crossing(context, v, varied, k);
            if (found.value && *found.value >= from && *found.value <= to)
                crossings.push_back({{"with", context.input.options[k].id}, {"value", *found.value}});
        }
    }
    for (const auto& w : context.warnings) warnings.push_back(w);
    return {{"vary", v.kind},
            {"of", v.kind == "demand" ? json(nullptr) : json(context.input.options[v.options.front()].id)},
            {"unit", v.unit},
            {"basis", context.cost_basis == basis::annual ? "annual" : "life-cycle"},
            {"current", v.current},
            {"x", xs},
            {"series", list},
            {"break_even", crossings}};
}

json tornado(const json& request, std::vector<issue>& warnings) {
    auto context = read_context(request);
    const double step = optional_number(request, "change", "").value_or(0.2);
    if (!(step > 0 && step < 1)) throw input_error("/change", "must be a fraction from above 0 to below 1, got " + format_number(step));
    const auto base = costs(context, context.input);
    if (base.size() < 2) throw input_error("/scenario/options", "a tornado needs at least two options");
    std::vector<std::size_t> order(base.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
    std::stable_sort(order.begin(), order.end(), [&](auto x, auto y) { return base[x] < base[y]; });
    const auto winner = order[0], runner = order[1];
    const double margin = base[runner] - base[winner];
    json inputs = json::array();
    const auto add = [&](const variable& v) {
        const auto low = costs(context, with_value(context.input, v, v.current * (1 - step)));
        const auto high = costs(context, with_value(context.input, v, v.current * (1 + step)));
        const double m_low = low[runner] - low[winner], m_high = high[runner] - high[winner];
        inputs.push_back({{"input", v.label},
                          {"vary", v.kind},
                          {"of", v.kind == "demand" ? json(nullptr) : json(v.of)},
                          {"margin_low", m_low},
                          {"margin_high", m_high},
                          {"change_low", m_low - margin},
                          {"change_high", m_high - margin},
                          {"swing", std::fabs(m_high - m_low)}});
    };
    for (std::size_t i = 0; i < context.input.options.size(); ++i) {
        variable price{"price", {i}, context.input.options[i].price_per_unit,
                       context.input.settings.currency + "/" + context.input.options[i].price_unit,
                       "the price of " + context.input.options[i].fuel.name + " (" + context.input.options[i].id + ")",
                       context.input.options[i].id};
        if (price.current > 0) add(price);
        const auto& option = context.input.options[i];
        // Electric resistance is 100 % by definition: nothing to vary.
        if (option.efficiency_given && !input_has_bins(context.input, option) &&
            option.system.kind != system_kind::electric_resistance) {
            variable efficiency{"efficiency", {i}, option.system.efficiency_value, std::string(rating_name(option.system.rating)),
                                "the efficiency of " + option.label, option.id};
            // +20 % may exceed a percentage rating's limit: cap it there.
            const double limit = upper_limit(option);
            if (efficiency.current * (1 + step) <= limit) add(efficiency);
        }
    }
    add({"demand", {}, context.input.annual_useful_heat_kwh, "kWh", "the annual useful heat", ""});
    std::vector<json> sorted(inputs.begin(), inputs.end());
    std::stable_sort(sorted.begin(), sorted.end(),
                     [](const json& x, const json& y) { return x.at("swing").get<double>() > y.at("swing").get<double>(); });
    for (const auto& w : context.warnings) warnings.push_back(w);
    return {{"basis", context.cost_basis == basis::annual ? "annual" : "life-cycle"},
            {"change", step},
            {"winner", context.input.options[winner].id},
            {"runner_up", context.input.options[runner].id},
            {"margin", margin},
            {"inputs", sorted}};
}

}  // namespace

bool input_has_bins(const scenario& input, const scenario_option& option) {
    return input.climate.has_value() && option.system.kind == system_kind::air_source_heat_pump;
}

std::string break_even_json(const std::string& request_json) noexcept { return guarded_entry(request_json, break_even); }
std::string sweep_json(const std::string& request_json) noexcept { return guarded_entry(request_json, sweep); }
std::string tornado_json(const std::string& request_json) noexcept { return guarded_entry(request_json, tornado); }

}  // namespace fw

#include "model/analysis.hpp"

#include <algorithm>
#include <cmath>

#include "base/roots.hpp"
#include "base/units.hpp"
#include "model/verdict.hpp"

namespace fw {

const char* variable_kind_name(variable_kind kind) {
    switch (kind) {
        case variable_kind::price: return "price";
        case variable_kind::efficiency: return "efficiency";
        case variable_kind::demand: return "demand";
    }
    return "price";
}

namespace {

/// Option k's evaluated result as a cost on the context's basis: annual, or life-cycle with option k appraised
/// alone [currency].
double cost_on_basis(const analysis_context& context, const scenario& input, std::size_t k, option_result result) {
    if (context.basis == cost_basis::annual) return result.annual_cost;
    evaluation one;
    one.results.push_back(std::move(result));
    one.options.push_back(&input.options[k]);
    return appraise(input, one, context.economics, std::nullopt).front().life_cycle_cost;
}

}  // namespace

evaluation evaluate_for_analysis(const scenario& input) {
    auto evaluated = evaluate_scenario(input);
    if (!evaluated.errors.empty())
        throw input_error("/scenario" + evaluated.errors.front().path, evaluated.errors.front().message);
    return evaluated;
}

analysis_context make_analysis_context(scenario input, const evaluation& evaluated, cost_basis basis) {
    analysis_context context;
    context.input = std::move(input);
    context.basis = basis;
    context.economics = context.input.economics.value_or(economics_settings{});
    for (std::size_t k = 0; k < evaluated.results.size(); ++k)
        context.today_costs.push_back(cost_on_basis(context, context.input, k, evaluated.results[k]));
    if (context.basis == cost_basis::life_cycle && !context.economics.given)
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
std::vector<double> option_costs(const analysis_context& context, const scenario& input) {
    const auto evaluated = evaluate_scenario(input);
    if (!evaluated.errors.empty()) throw input_error("/scenario" + evaluated.errors.front().path, evaluated.errors.front().message);
    std::vector<double> out;
    if (context.basis == cost_basis::annual) {
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

analysis_variable variable_for(const analysis_context& context, variable_kind kind, const std::optional<std::string>& of,
                               std::size_t default_option) {
    const auto& input = context.input;
    analysis_variable v;
    v.kind = kind;
    const auto& currency = input.settings.currency;
    if (kind == variable_kind::price) {
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
    } else if (kind == variable_kind::efficiency) {
        v.options.push_back(of ? option_index(input, *of, "/of") : default_option);
        const auto& option = input.options[v.options.front()];
        v.of = option.id;
        if (!option.efficiency_given || (!option.ratings.empty() && input.climate))
            throw input_error("/of", option.id + " follows a data sheet on temperature bins and has no single efficiency "
                                                 "to vary; vary its price instead");
        v.current = option.system.efficiency_value;
        v.unit = std::string(rating_name(option.system.rating));
        v.label = "the efficiency of " + option.label;
    } else {
        v.current = input.annual_useful_heat_kwh;
        v.unit = "kWh";
        v.label = "the annual useful heat";
    }
    return v;
}

scenario with_value(const scenario& input, const analysis_variable& v, double x) {
    scenario out = input;
    if (v.kind == variable_kind::price) {
        const double factor = v.current != 0 ? x / v.current : 0.0;
        for (auto i : v.options) {
            auto& option = out.options[i];
            option.price_per_unit = v.current != 0 ? option.price_per_unit * factor : x;
            for (auto& tier : option.tiers) tier.amount = v.current != 0 ? tier.amount * factor : x;
            if (option.schedule)  // every period by the same factor (the flat mean is the price varied)
                for (auto& period : *option.schedule) period.amount_per_kwh = v.current != 0 ? period.amount_per_kwh * factor : x;
        }
    } else if (v.kind == variable_kind::efficiency) {
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
/// backup or of its water heater's fuel, or the demand. An option that cannot keeps today's cost at every value.
bool depends_on(const scenario& input, const analysis_variable& v, std::size_t k) {
    if (v.kind == variable_kind::demand) return true;
    const auto varied = [&](std::size_t i) { return std::find(v.options.begin(), v.options.end(), i) != v.options.end(); };
    if (varied(k)) return true;
    for (std::size_t i = 0; i < input.options.size(); ++i) {
        if (varied(i) && input.options[i].id == input.options[k].backup) return true;
        // A fuel-burning system's own electricity may be priced at an electricity option's price.
        if (varied(i) && v.kind == variable_kind::price && input.options[i].fuel.category == fuel_category::electricity &&
            input.options[k].auxiliary && !input.settings.electricity_price_per_kwh)
            return true;
        // A water heater of its own fuel is bought at the price of an option burning it.
        const auto* heater = input.hot_water_kwh > 0 ? water_heater_of(input, input.options[k]) : nullptr;
        if (varied(i) && v.kind == variable_kind::price && heater && heater->fuel && heater->fuel->id == input.options[i].fuel.id)
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

/// Where cost(a) = cost(b) as the variable changes; linear in price (in 1/efficiency), polished by the Illinois
/// method where it is not.
crossing find_crossing(const analysis_context& context, const analysis_variable& v, std::size_t a, std::size_t b) {
    const auto cost_of = [&](const scenario& at, std::size_t k) {
        return depends_on(context.input, v, k) ? option_cost(context, at, k) : context.today_costs[k];
    };
    const auto difference = [&](double x) {
        const auto at = with_value(context.input, v, x);
        return cost_of(at, a) - cost_of(at, b);
    };
    const bool reciprocal = v.kind == variable_kind::efficiency;
    const auto to_x = [&](double y) { return reciprocal ? 1.0 / y : y; };
    const double y0 = reciprocal ? 1.0 / v.current : 0.0;
    const double y1 = reciprocal ? 1.0 / (0.8 * v.current) : (v.current > 0 ? v.current : 1.0);
    const double f0 = difference(to_x(y0)), f1 = difference(to_x(y1));
    const double scale = std::max({std::fabs(f0), std::fabs(f1), 1e-12});
    if (std::fabs(f1 - f0) <= 1e-12 * scale)
        return {std::nullopt, "the two costs change equally with " + v.label + ": the lines never cross"};
    const double y = y0 - f0 * (y1 - y0) / (f1 - f0);
    const std::string quantity = reciprocal ? "efficiency" : v.kind == variable_kind::demand ? "annual useful heat" : "price";
    if (!reciprocal && std::fabs(y) <= 1e-9 * y1) {
        // Both costs are proportional to the variable (same fuel, no fixed charges): they meet only at zero.
        const auto& cheaper = context.input.options[f1 < 0 ? a : b];
        return {std::nullopt, "the costs meet only where the " + quantity + " is zero: at any " + quantity + " above zero, " +
                                  cheaper.label + " stays cheaper"};
    }
    if (!(y > 0))
        return {std::nullopt, "the lines would cross only at a negative " + quantity + " (" + format_number(to_x(y)) + ")"};
    double x = to_x(y);
    const double limit = v.kind == variable_kind::efficiency ? upper_limit(context.input.options[v.options.front()]) : INFINITY;
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

break_even_result break_even(const analysis_context& context, const analysis_variable& v, std::size_t a, std::size_t b) {
    break_even_result out;
    out.found = find_crossing(context, v, a, b);
    if (!out.found.value) return out;
    const double x = *out.found.value;
    const auto at = option_costs(context, with_value(context.input, v, x));
    out.cost_a = at[a];
    out.cost_b = at[b];
    const auto above = option_costs(context, with_value(context.input, v, x * 1.01 + 1e-9));
    out.cheaper_above = above[a] < above[b] ? a : b;
    out.cheaper_below = out.cheaper_above == a ? b : a;
    out.statement = context.input.options[out.cheaper_above].label + " is cheaper " +
                    (context.basis == cost_basis::annual ? "per year" : "over its life") + " while " + v.label + " is above " +
                    format_fixed(x, v.kind == variable_kind::demand ? 0 : 3) + " " + v.unit + "; below it, " +
                    context.input.options[out.cheaper_below].label + " is";
    return out;
}

sweep_result sweep(const analysis_context& context, const analysis_variable& v, double from, double to, int n) {
    sweep_result out;
    out.cost.assign(context.input.options.size(), {});
    for (int i = 0; i < n; ++i) out.x.push_back(from + (to - from) * i / (n - 1));
    const auto& grid = out.x;
    // Most costs are exactly linear in a price (and in 1/efficiency): check each option at four
    // points and fill the line in; evaluate the others (bins, changeovers) at every point.
    const bool reciprocal = v.kind == variable_kind::efficiency;
    const auto coordinate = [&](double x) { return reciprocal ? 1.0 / x : x; };
    std::vector<scenario> probes;
    const int checks[] = {0, (n - 1) / 3, 2 * (n - 1) / 3, n - 1};
    for (int i : checks) probes.push_back(with_value(context.input, v, grid[i]));
    for (std::size_t k = 0; k < context.input.options.size(); ++k) {
        if (!depends_on(context.input, v, k)) {
            out.cost[k].assign(static_cast<std::size_t>(n), context.today_costs[k]);
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
        for (int i = 0; i < n; ++i)
            out.cost[k].push_back(linear ? c[0] + slope * (coordinate(grid[i]) - u0)
                                         : option_cost(context, with_value(context.input, v, grid[i]), k));
    }
    if (v.kind != variable_kind::demand) {
        const auto varied = v.options.front();
        for (std::size_t k = 0; k < context.input.options.size(); ++k) {
            if (std::find(v.options.begin(), v.options.end(), k) != v.options.end()) continue;
            const auto found = find_crossing(context, v, varied, k);
            if (found.value && *found.value >= from && *found.value <= to) out.crossings.emplace_back(k, *found.value);
        }
    }
    return out;
}

tornado_result tornado(const analysis_context& context, double step) {
    const auto base = option_costs(context, context.input);
    if (base.size() < 2) throw input_error("/scenario/options", "a tornado needs at least two options");
    std::vector<std::size_t> order(base.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
    std::stable_sort(order.begin(), order.end(), [&](auto x, auto y) { return base[x] < base[y]; });
    tornado_result out;
    out.winner = order[0];
    out.runner_up = order[1];
    out.margin = base[out.runner_up] - base[out.winner];
    const auto add = [&](const analysis_variable& v) {
        const auto low = option_costs(context, with_value(context.input, v, v.current * (1 - step)));
        const auto high = option_costs(context, with_value(context.input, v, v.current * (1 + step)));
        tornado_row row{v, low[out.runner_up] - low[out.winner], high[out.runner_up] - high[out.winner], 0};
        row.swing = std::fabs(row.margin_high - row.margin_low);
        out.rows.push_back(std::move(row));
    };
    const auto& input = context.input;
    for (std::size_t i = 0; i < input.options.size(); ++i) {
        const auto& option = input.options[i];
        // named by its fuel, and by the option where two options burn that fuel
        const auto burning = std::count_if(input.options.begin(), input.options.end(),
                                           [&](const scenario_option& other) { return other.fuel.id == option.fuel.id; });
        analysis_variable price{variable_kind::price, {i}, option.price_per_unit, input.settings.currency + "/" + option.price_unit,
                                "the price of " + option.fuel.name + (burning > 1 ? " for " + option.label : std::string()), option.id};
        if (price.current > 0) add(price);
        // Electric resistance is 100 % by definition: nothing to vary.
        if (option.efficiency_given && !input_has_bins(input, option) && option.system.kind != system_kind::electric_resistance) {
            analysis_variable efficiency{variable_kind::efficiency, {i}, option.system.efficiency_value,
                                         std::string(rating_name(option.system.rating)), "the efficiency of " + option.label, option.id};
            // +20 % may exceed a percentage rating's limit: cap it there.
            if (efficiency.current * (1 + step) <= upper_limit(option)) add(efficiency);
        }
    }
    add({variable_kind::demand, {}, input.annual_useful_heat_kwh, "kWh", "the annual useful heat", ""});
    std::stable_sort(out.rows.begin(), out.rows.end(), [](const tornado_row& x, const tornado_row& y) { return x.swing > y.swing; });
    return out;
}

bool input_has_bins(const scenario& input, const scenario_option& option) {
    return input.climate.has_value() && option.system.kind == system_kind::air_source_heat_pump;
}

what_if_result what_if(const analysis_context& context, const analysis_variable& v, double value) {
    what_if_result out;
    out.value = value;
    const auto changed = with_value(context.input, v, value);
    for (std::size_t k = 0; k < context.input.options.size(); ++k)
        out.cost.push_back(depends_on(context.input, v, k) ? option_cost(context, changed, k) : context.today_costs[k]);
    out.ranking = ranked_ascending(out.cost);
    for (std::size_t k = 0; k < context.input.options.size(); ++k)
        if (context.input.options[k].existing) out.existing = k;
    for (std::size_t k = 0; k < out.cost.size(); ++k)
        out.saving.push_back(out.existing ? std::optional<double>(out.cost[*out.existing] - out.cost[k]) : std::nullopt);
    return out;
}

}  // namespace fw

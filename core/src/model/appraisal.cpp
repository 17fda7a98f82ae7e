#include "model/appraisal.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>

#include "supply/systems.hpp"
#include "base/units.hpp"

namespace fw {

namespace {

/// Base-year cost of an option [currency/year] in year t, each part escalating at its fuel's rate.
double cost_in_year(const option_result& r, const scenario_option& o, const economics_settings& e, int t) {
    double cost = o.annual_maintenance * std::pow(1 + e.maintenance_escalation, t);
    for (const auto& part : r.cost_parts)
        cost += (part.energy_cost + part.fixed_cost) * std::pow(1 + e.escalation_of(part.fuel_id), t);
    return cost;
}

/// The catalog record an option's system most likely is: its catalog type, else the nearest typical record.
const system_record* record_of(const scenario_option& o) {
    return o.system_catalog ? &find_system(*o.system_catalog)
                            : typical_system_for(o.system.kind, o.fuel.id, o.system.efficiency_value, o.system.rating);
}

}  // namespace

evaluation evaluate_scenario(const scenario& input) {
    evaluation out;
    for (const auto& option : input.options) {
        try {
            out.results.push_back(evaluate_option(input, option));
            out.options.push_back(&option);
        } catch (const input_error& error) {
            out.errors.push_back({error.path(), error.message()});
        }
    }
    return out;
}

std::optional<std::size_t> baseline_index(const evaluation& evaluated) {
    for (std::size_t i = 0; i < evaluated.options.size(); ++i)
        if (evaluated.options[i]->existing) return i;
    return std::nullopt;
}

std::vector<option_economics> appraise(const scenario& input, const evaluation& evaluated,
                                       const economics_settings& e, std::optional<std::size_t> baseline) {
    const int n = e.analysis_years;
    const double d = e.discount_rate;
    const auto& currency = input.settings.currency;
    std::vector<option_economics> out;
    for (std::size_t i = 0; i < evaluated.results.size(); ++i) {
        const auto& r = evaluated.results[i];
        const auto& o = *evaluated.options[i];
        option_economics x;
        x.net_installed_cost = o.installed_cost - o.incentives;
        for (const auto& part : r.cost_parts) {
            const double factor = upw_escalating(d, e.escalation_of(part.fuel_id), n);
            x.part_upw.push_back(factor);
            x.energy_fixed_pv += (part.energy_cost + part.fixed_cost) * factor;
        }
        x.maintenance_pv = o.annual_maintenance * upw_escalating(d, e.maintenance_escalation, n);
        // The service life: as entered, else the catalog's median for the record the system most likely is
        // (ASHRAE's table of median service lives where it has a row; data/systems.json names the source).
        x.life_years = o.life_years;
        if (!x.life_years) {
            if (const auto* record = record_of(o); record && record->service_life_years > 0) {
                x.life_years = record->service_life_years;
                x.life_from_catalog = true;
                x.trace.push_back("service life " + format_fixed(*x.life_years, 0) + " years: the median for " + record->id +
                                  " (" + record->service_life_source + "); give life_years to replace it");
            }
        }
        if (x.life_years && o.installed_cost > 0) {
            const double life = *x.life_years;
            for (double t = life; t < n - 1e-9; t += life) x.replacement_pv += o.installed_cost * spw(d, t);
            const double age_at_end = n - std::floor(n / life - 1e-12) * life;
            x.residual_pv = o.installed_cost * std::max(0.0, 1.0 - age_at_end / life) * spw(d, n);
        }
        x.life_cycle_cost = x.net_installed_cost + x.replacement_pv - x.residual_pv + x.energy_fixed_pv + x.maintenance_pv;
        // Levelized cost of heat: the life-cycle cost (capital, replacements, residual value, energy,
        // fixed charges and maintenance with their escalation) spread over the period by the capital
        // recovery factor, per unit of useful heat: LCOH = LCC x CRF(d, N) / Q (NIST Handbook 135 levelizing).
        x.lcoh_per_kwh = x.life_cycle_cost * crf(d, n) / r.useful_heat_kwh;
        x.trace.push_back("life-cycle cost over " + std::to_string(n) + " years at " + format_fixed(100 * d, 2) + " % (" + e.basis +
                          "): capital " + format_fixed(x.net_installed_cost, 0) +
                          (x.replacement_pv > 0 ? " + replacements " + format_fixed(x.replacement_pv, 0) : "") +
                          (x.residual_pv > 0 ? " - residual value " + format_fixed(x.residual_pv, 0) : "") +
                          " + energy and fixed charges " + format_fixed(x.energy_fixed_pv, 0) + " + maintenance " +
                          format_fixed(x.maintenance_pv, 0) + " = " + format_fixed(x.life_cycle_cost, 0) + " " + currency);
        std::string factors;
        for (std::size_t k = 0; k < r.cost_parts.size(); ++k)
            factors += (factors.empty() ? "" : "; ") + r.cost_parts[k].fuel_id + " escalating " +
                       format_fixed(100 * e.escalation_of(r.cost_parts[k].fuel_id), 1) + " %/yr: UPW* = " + format_fixed(x.part_upw[k], 4);
        x.trace.push_back("present worth of the yearly costs, NIST Handbook 135 UPW* = (1+e)/(d-e) [1 - ((1+e)/(1+d))^N]: " + factors);
        x.trace.push_back("levelized cost of heat = life-cycle cost x CRF(" + format_fixed(100 * d, 2) + " %, " + std::to_string(n) +
                          " yr) " + format_fixed(crf(d, n), 5) + " / useful heat = " + format_fixed(x.lcoh_per_kwh, 4) + " " +
                          currency + "/kWh (replacements, residual value and escalation included)");
        out.push_back(std::move(x));
    }
    if (!baseline) return out;
    const auto& base_r = evaluated.results[*baseline];
    const auto& base_o = *evaluated.options[*baseline];
    for (std::size_t i = 0; i < out.size(); ++i) {
        auto& x = out[i];
        const auto& r = evaluated.results[i];
        const auto& o = *evaluated.options[i];
        x.npv = out[*baseline].life_cycle_cost - x.life_cycle_cost;
        x.co2e_saved_kg_life = (base_r.co2e_kg - r.co2e_kg) * n;
        if (i == *baseline) {
            x.annual_saving = 0.0;
            x.payback_reason = "this is the existing system";
            x.discounted_payback_reason = x.payback_reason;
            continue;
        }
        const double saving = (base_r.annual_cost + base_o.annual_maintenance) - (r.annual_cost + o.annual_maintenance);
        x.annual_saving = saving;
        if (saving <= 0) {
            x.payback_reason = "no annual saving against " + base_o.id + " (it costs " + format_fixed(-saving, 2) + " " + currency +
                               " more per year)";
        } else {
            x.simple_payback_years = std::max(0.0, x.net_installed_cost) / saving;
        }
        // Discounted payback from the yearly flows, each part escalating at its own rate.
        double cumulative = 0;
        if (x.net_installed_cost <= 0) {
            if (saving > 0) x.discounted_payback_years = 0.0;
        } else {
            for (int t = 1; t <= n && !x.discounted_payback_years; ++t) {
                const double flow = (cost_in_year(base_r, base_o, e, t) - cost_in_year(r, o, e, t)) * spw(d, t);
                if (flow > 0 && cumulative + flow >= x.net_installed_cost)
                    x.discounted_payback_years = (t - 1) + (x.net_installed_cost - cumulative) / flow;
                cumulative += flow;
            }
        }
        if (!x.discounted_payback_years)
            x.discounted_payback_reason = saving <= 0 ? x.payback_reason
                                                      : "the discounted savings do not repay the cost within the " +
                                                            std::to_string(n) + "-year analysis period";
        if (*x.co2e_saved_kg_life > 0) x.cost_per_tonne_co2e_avoided = -*x.npv / (*x.co2e_saved_kg_life / 1000.0);
        x.trace.push_back("against " + base_o.id + ": annual saving " + format_fixed(saving, 2) + " " + currency + "; NPV of switching = " +
                          format_fixed(out[*baseline].life_cycle_cost, 0) + " - " + format_fixed(x.life_cycle_cost, 0) + " = " +
                          format_fixed(*x.npv, 0) + " " + currency);
    }
    return out;
}

uncertainty_result monte_carlo(const scenario& input, const evaluation& evaluated,
                               const std::vector<option_economics>& economics, const uncertainty_settings& u,
                               const std::function<bool(double)>& progress) {
    uncertainty_result out;
    out.seed = u.seed;
    // The fuels whose price is drawn, in a fixed order.
    std::vector<std::string> fuels;
    for (const auto& r : evaluated.results)
        for (const auto& part : r.cost_parts)
            if (std::find(fuels.begin(), fuels.end(), part.fuel_id) == fuels.end()) fuels.push_back(part.fuel_id);
    const double demand_cv = input.demand_uncertainty_kwh && input.space_heat_kwh > 0
                                 ? *input.demand_uncertainty_kwh / input.space_heat_kwh
                                 : 0.0;
    for (const auto& fuel : fuels)
        out.notes.push_back(fuel + ": " + (u.triangular ? "triangular price factor, half-width " : "lognormal price factor, median 1, SD of ln ") +
                            format_number(u.spread_of(fuel)) +
                            (u.spread.count(fuel) ? " (given)" : " (default, an assumption)"));
    if (demand_cv > 0)
        out.notes.push_back("demand: normal factor with the bills fit's relative standard error " + format_number(demand_cv));
    const std::size_t count = evaluated.results.size();
    std::vector<std::vector<double>> annual(count), lcc(count);
    for (std::size_t i = 0; i < count; ++i) {
        annual[i].reserve(static_cast<std::size_t>(std::max(0, u.draws)));
        lcc[i].reserve(static_cast<std::size_t>(std::max(0, u.draws)));
    }
    std::vector<int> cheapest(count, 0);
    std::vector<double> lcc_sum(count, 0), lcc_sq(count, 0);
    // Each cost part's index into `fuels`, found once rather than in every draw.
    std::vector<std::vector<std::size_t>> part_fuel(count);
    for (std::size_t i = 0; i < count; ++i)
        for (const auto& part : evaluated.results[i].cost_parts)
            part_fuel[i].push_back(static_cast<std::size_t>(std::find(fuels.begin(), fuels.end(), part.fuel_id) - fuels.begin()));
    std::vector<double> spread;
    for (const auto& fuel : fuels) spread.push_back(u.spread_of(fuel));
    random_stream random(u.seed);
    std::vector<double> factor(fuels.size());
    const int report_every = std::max(1, u.draws / 100);
    int done = 0;
    for (; done < u.draws; ++done) {
        if (done % report_every == 0 && progress && !progress(static_cast<double>(done) / u.draws)) {
            out.cancelled = true;
            break;
        }
        for (std::size_t f = 0; f < fuels.size(); ++f) {
            const double s = spread[f];
            if (u.triangular) {
                // Symmetric triangular on [1 - s, 1 + s] by inverse CDF.
                const double p = random.uniform();
                factor[f] = p < 0.5 ? 1 - s + s * std::sqrt(2 * p) : 1 + s - s * std::sqrt(2 * (1 - p));
            } else {
                factor[f] = std::exp(s * random.normal());
            }
        }
        const double demand = demand_cv > 0 ? std::max(0.05, 1 + demand_cv * random.normal()) : 1.0;
        std::size_t best = 0;
        double best_lcc = INFINITY;
        for (std::size_t i = 0; i < count; ++i) {
            const auto& r = evaluated.results[i];
            const auto& x = economics[i];
            double a = 0, pv = x.net_installed_cost + x.replacement_pv - x.residual_pv + x.maintenance_pv;
            for (std::size_t k = 0; k < r.cost_parts.size(); ++k) {
                const auto& part = r.cost_parts[k];
                const double energy = part.energy_cost * factor[part_fuel[i][k]] * demand;
                a += energy + part.fixed_cost;
                pv += (energy + part.fixed_cost) * x.part_upw[k];
            }
            annual[i].push_back(a);
            lcc[i].push_back(pv);
            lcc_sum[i] += pv;
            lcc_sq[i] += pv * pv;
            if (pv < best_lcc) {
                best_lcc = pv;
                best = i;
            }
        }
        ++cheapest[best];
    }
    if (progress && !out.cancelled) progress(1.0);
    out.draws = done;
    for (std::size_t i = 0; i < count; ++i) {
        option_uncertainty o;
        o.id = evaluated.results[i].id;
        if (done > 0) {
            o.p_cheapest = static_cast<double>(cheapest[i]) / done;
            const auto a = quantiles(annual[i], {0.10, 0.50, 0.90});
            const auto l = quantiles(lcc[i], {0.10, 0.50, 0.90});
            o.annual_cost_p10 = a[0];
            o.annual_cost_p50 = a[1];
            o.annual_cost_p90 = a[2];
            o.life_cycle_cost_p10 = l[0];
            o.life_cycle_cost_p50 = l[1];
            o.life_cycle_cost_p90 = l[2];
            o.life_cycle_cost_mean = lcc_sum[i] / done;
            const double variance = std::max(0.0, lcc_sq[i] / done - o.life_cycle_cost_mean * o.life_cycle_cost_mean);
            o.life_cycle_cost_standard_error = std::sqrt(variance / done);
        }
        out.options.push_back(o);
    }
    return out;
}

}  // namespace fw

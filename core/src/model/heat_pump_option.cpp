// A heat-pump option on the scenario's temperature bins, with resistance or dual-fuel backup.
#include <algorithm>
#include <cmath>
#include <cstdio>

#include "base/roots.hpp"
#include "model/scenario.hpp"
#include "base/units.hpp"

namespace fw {

namespace {

struct backup_system {
    const scenario_option* option = nullptr;  ///< nullptr: electric resistance
    double efficiency = 1.0;                  ///< HHV basis
    double hhv_kwh_per_unit = 1.0;
};

struct season_cost {
    heat_pump_season season;
    double electricity_kwh = 0;   ///< compressor + resistance backup + hot water
    double water_kwh = 0;         ///< of which hot water the heat pump makes
    double backup_fuel_kwh = 0;   ///< dual fuel, HHV
    double energy_cost = 0;
    double water_cost = 0;        ///< of which hot water
    month_hour_kwh profile{};     ///< the electricity by month and hour of day
};

season_cost run(const scenario& input, const scenario_option& option, const std::vector<heat_pump_point>& points,
                double ua_kw_per_k, double balance_c, std::optional<double> changeover_c, const backup_system& backup,
                double losses) {
    heat_pump_inputs inputs;
    inputs.points = points;
    inputs.modulating = option.stages != heat_pump_stages::single;
    inputs.cd = option.cd;
    inputs.cutoff_c = option.cutoff_c;
    inputs.changeover_c = changeover_c;
    season_cost out;
    out.season = run_bins(input.climate->bins, ua_kw_per_k, balance_c, inputs);
    const double hp_kwh = out.season.heat_pump_kwh * losses;
    const double backup_heat = out.season.backup_heat_kwh * losses;
    out.electricity_kwh = hp_kwh;
    if (backup.option) out.backup_fuel_kwh = backup_heat / backup.efficiency;
    else out.electricity_kwh += backup_heat;
    // Hot water the heat pump makes: at its season's COP, with resistance backup counted as COP 1 (a fuel
    // backup does not make it: then at the heat pump's own seasonal COP).
    if (input.hot_water_kwh > 0)
        out.water_kwh = input.hot_water_kwh / (backup.option && out.season.heat_pump_cop() > 0 ? out.season.heat_pump_cop()
                                                                                                 : out.season.seasonal_cop_with_resistance());
    out.electricity_kwh += out.water_kwh;
    const auto space = bins_profile(input, out.season, losses, !backup.option);
    const auto water = hot_water_profile(out.water_kwh, input.climate->model.leap_year);
    out.profile = add_profile(space, water);
    if (option.schedule) {
        const auto tariff = option_tariff(option);
        out.water_cost = tariff_cost(tariff, out.water_kwh, water);
        out.energy_cost = tariff_cost(tariff, out.electricity_kwh - out.water_kwh, space) + out.water_cost;
    } else {
        out.energy_cost = priced_cost(option, out.electricity_kwh);
        out.water_cost = out.electricity_kwh > 0 ? out.energy_cost * out.water_kwh / out.electricity_kwh : 0.0;
    }
    if (backup.option) out.energy_cost += priced_cost(*backup.option, out.backup_fuel_kwh / backup.hhv_kwh_per_unit);
    return out;
}

/// The procedure a seasonal rating comes from (a single COP is read on the HSPF procedure's load line).
rating_procedure procedure_for(efficiency_rating rating) {
    if (rating == efficiency_rating::hspf2) return rating_procedure::hspf2_appendix_m1;
    if (rating == efficiency_rating::scop) return rating_procedure::scop_en14825;
    return rating_procedure::hspf_appendix_m;
}

/// [1] A staged or variable unit's minimum capacity as a share of its maximum when its data sheet gives none:
/// 0.3 for variable speed, 0.6 for two stages (common practice); 0 for a single-stage unit.
double default_min_share(heat_pump_stages stages) {
    return stages == heat_pump_stages::variable ? 0.3 : stages == heat_pump_stages::two ? 0.6 : 0.0;
}

/// [degC] The low-ambient cut-out assumed when none is given: 0 degF for single- and two-stage units,
/// -13 degF (-25 degC) for variable-speed ones (common practice; manufacturers' limits vary).
double default_cutoff_c(heat_pump_stages stages) {
    return stages == heat_pump_stages::variable ? -25.0 : (0.0 - 32.0) * 5.0 / 9.0;
}

/// [degC] Where the heat pump's capacity meets the house's load line (its thermal balance point), if
/// it does between -50 degC and the house's balance point.
std::optional<double> capacity_balance_c(const std::vector<heat_pump_point>& points, double ua_kw_per_k, double balance_c) {
    bool unused = false;
    const auto surplus = [&](double t) { return interpolate(points, t, unused).capacity_kw - ua_kw_per_k * (balance_c - t); };
    const double lo = -50.0, hi = balance_c;
    const double s_lo = surplus(lo), s_hi = surplus(hi);
    if (s_lo >= 0 || s_hi <= 0) return std::nullopt;
    return illinois_root(surplus, lo, hi, s_lo, s_hi, 1e-9);
}

}  // namespace

option_result evaluate_heat_pump_option(const scenario& input, const scenario_option& given) {
    scenario_option option = given;
    option_result r = result_for(input, option);
    const auto& climate = *input.climate;
    const bool f = climate.fahrenheit;
    const auto temp_text = [&](double c) {
        return f ? format_fixed(convert(c, "degC", "degF"), 1) + " degF" : format_fixed(c, 1) + " degC";
    };
    const auto& currency = input.settings.currency;
    if (option.fuel.category != fuel_category::electricity)
        throw input_error(option.path + "/fuel", "a heat pump runs on electricity, not " + option.fuel.id);

    // Balance point and the building's load line on the bins.
    double balance_c = 0;
    if (input.balance_point_c) {
        balance_c = *input.balance_point_c;
    } else {
        balance_c = f ? convert(65, "degF", "degC") : 18.0;
        r.warnings.push_back("no balance point known; the load is spread over the hours below " + temp_text(balance_c) +
                             " (set demand.balance_point)");
    }
    double degree_hours = 0;
    for (const auto& bin : climate.bins)
        if (bin.t_c < balance_c) degree_hours += bin.hours * (balance_c - bin.t_c);
    if (degree_hours <= 0)
        throw input_error("/demand/balance_point", "the climate has no hours below the balance point " + temp_text(balance_c));
    const double ua_kw = input.space_heat_kwh / degree_hours;
    const double design_c = climate.given_design_c.value_or(climate.design_99_c);
    const double design_load_kw = ua_kw * std::max(0.0, balance_c - design_c);

    // Data sheet, or the default curve fitted to the rating by the rating's own procedure.
    std::vector<heat_pump_point> points = option.ratings;
    std::vector<std::string> sheet_trace;
    const double losses = 1.0 / ((1 - option.system.age_derating) * (1 - option.system.distribution_loss));
    if (points.empty()) {
        const auto rated = seasonal_efficiency_hhv(option.system, option.fuel, option.path + "/system");
        const double capacity = option.capacity_47_kw.value_or(std::max(design_load_kw, 0.5));
        const auto procedure = procedure_for(option.system.rating);
        // Rated as it will run: a staged or variable unit modulates in the procedure too (its part-load
        // behaviour is in its rating, so it is not added a second time).
        points = default_points_for_rating(rated.rated_hhv_basis, procedure, capacity, default_min_share(option.stages), option.cd);
        for (const auto& line : rated.trace) sheet_trace.push_back(line);
        sheet_trace.push_back("default curve fitted by " + std::string(procedure_name(procedure)) +
                              " (its load line and bins, frost default, C_D " + format_number(option.cd) +
                              (option.stages == heat_pump_stages::single ? "" : ", modulating down to its minimum") +
                              "): seasonal COP " +
                              format_fixed(procedure_seasonal_cop(points, procedure, option.cd, option.stages != heat_pump_stages::single), 3));
        r.warnings.push_back("no data-sheet points: a default curve (capacity 100/62/50 %, COP 100/66/55 % at 47/17/5 degF) "
                             "is fitted to the " + std::string(rating_name(option.system.rating)) + " rating by its own test "
                             "procedure; enter the data sheet's capacities and COPs for a real prediction");
        if (!option.capacity_47_kw)
            r.warnings.push_back("no capacity given: taken as the design load at " + temp_text(design_c) + " (" +
                                 format_fixed(capacity, 2) + " kW at 47 degF); equipment sizing needs a Manual J or EN 12831 "
                                 "load calculation by a professional");
        sheet_trace.push_back("default curve scaled to seasonal COP " + format_fixed(rated.rated_hhv_basis, 2) +
                              ": COP at 47 degF " + format_fixed(points[0].cop, 2) + ", capacity " + format_fixed(capacity, 2) + " kW");
    } else {
        std::string line = "data sheet:";
        auto sorted = points;
        std::sort(sorted.begin(), sorted.end(), [](auto& a, auto& b) { return a.outdoor_c > b.outdoor_c; });
        for (const auto& p : sorted)
            line += " " + temp_text(p.outdoor_c) + " " + format_fixed(p.capacity_kw, 2) + " kW COP " + format_fixed(p.cop, 2) + ";";
        line.pop_back();
        sheet_trace.push_back(line);
    }
    if (option.stages != heat_pump_stages::single) {
        // A staged or variable unit without minimum points: a stated share of the maximum (common practice).
        const double share = default_min_share(option.stages);
        bool defaulted = false;
        for (auto& p : points)
            if (p.min_capacity_kw <= 0) {
                p.min_capacity_kw = share * p.capacity_kw;
                p.min_cop = p.cop;
                defaulted = true;
            }
        if (defaulted)
            r.warnings.push_back(std::string(option.stages == heat_pump_stages::variable ? "variable-speed" : "two-stage") +
                                 " unit without minimum capacities on its data sheet: taken as " + format_fixed(100 * share, 0) +
                                 " % of the maximum at the maximum's COP (common practice); enter the data sheet's minimum capacities and their COPs");
    }
    bool frost = false;
    points = with_frost_default(points, frost);
    if (frost)
        sheet_trace.push_back("no point between 17 and 45 degF: frost default of the DOE procedure applied (at 35 degF capacity x "
                              "0.90 and power x 0.985 of the 17-47 degF line; from 17 to 45 degF on the line through 17 and 35 "
                              "degF)");

    if (!option.cutoff_c) {
        option.cutoff_c = default_cutoff_c(option.stages);
        r.warnings.push_back("no low-temperature cut-out given: the " +
                             std::string(option.stages == heat_pump_stages::variable ? "variable-speed" : "single- or two-stage") +
                             " heat pump is taken to stop below " + temp_text(*option.cutoff_c) +
                             " (common practice); enter the data sheet's low-ambient limit");
    }

    // Sizing against the load line the bins use: capacity at the design temperature, and where capacity meets load.
    {
        bool unused = false;
        r.design_load_kw = house_design_load_kw(input).value_or(design_load_kw);
        // below its cut-out the compressor has stopped: nothing at the design temperature
        const bool stopped = design_c < *option.cutoff_c;
        r.capacity_at_design_kw = stopped ? 0.0 : interpolate(points, design_c, unused).capacity_kw;
        r.capacity_balance_c = capacity_balance_c(points, ua_kw, balance_c);
        if (stopped)
            r.warnings.push_back("the design temperature " + temp_text(design_c) + " is below the heat pump's cut-out " +
                                 temp_text(*option.cutoff_c) + ": on the coldest days the backup carries all " +
                                 format_fixed(r.design_load_kw, 1) + " kW the house needs (resistance strips need their own "
                                 "circuit and may need a larger electrical service: a licensed electrician to local code)");
        else if (r.capacity_at_design_kw < r.design_load_kw)
            r.warnings.push_back("at the design temperature " + temp_text(design_c) + " the heat pump gives " +
                                 format_fixed(r.capacity_at_design_kw, 1) + " kW of the " + format_fixed(r.design_load_kw, 1) +
                                 " kW the house needs; the backup must carry the rest (resistance strips need their own "
                                 "circuit and may need a larger electrical service: a licensed electrician to local code)");
    }

    // Backup: electric resistance, or another option's furnace or boiler (dual fuel).
    backup_system backup;
    if (option.backup != "electric-resistance") {
        for (const auto& other : input.options)
            if (other.id == option.backup) backup.option = &other;
        if (!backup.option)
            throw input_error(option.path + "/system/backup", "no option has id \"" + option.backup +
                                                                  "\"; give electric-resistance or the id of a furnace or boiler option");
        if (!burns_fuel(backup.option->system.kind))
            throw input_error(option.path + "/system/backup", "the backup " + option.backup + " must burn fuel (a " +
                                                                  std::string(kind_name(backup.option->system.kind)) + " is not)");
        backup.efficiency = seasonal_efficiency_hhv(backup.option->system, backup.option->fuel,
                                                    backup.option->path + "/system").hhv_basis;
        backup.hhv_kwh_per_unit =
            heating_value_per_sale_unit(backup.option->fuel, backup.option->price_unit, backup.option->sale,
                                        backup.option->path + "/price/per").hhv_j / 3.6e6;
    } else if (option.changeover_c || option.changeover_optimal) {
        throw input_error(option.path + "/system/changeover", "a changeover temperature needs a fuel backup (system.backup)");
    }

    std::optional<double> changeover = option.changeover_c;
    if (option.changeover_optimal) {
        // A changeover at c locks the heat pump out in the bins below c. Without block rates the
        // energy cost is a sum over bins, so one season with the heat pump on and one with it off
        // give every candidate's cost by prefix sums; with block rates each candidate is run in full.
        const bool additive = option.tiers.empty() && !option.schedule && backup.option->tiers.empty() && input.hot_water_kwh == 0;
        std::vector<double> candidates;
        for (const auto& bin : climate.bins)
            if (bin.t_c <= balance_c) candidates.push_back(bin.t_c);
        std::vector<double> cost_of(candidates.size(), 0.0);
        double no_lockout = 0;
        if (additive) {
            const auto on = run(input, option, points, ua_kw, balance_c, std::nullopt, backup, losses);
            const auto off = run(input, option, points, ua_kw, balance_c, INFINITY, backup, losses);
            const double fuel_price = backup.option->price_per_unit / backup.hhv_kwh_per_unit / backup.efficiency * losses;
            const auto bin_cost = [&](const heat_pump_bin& bin) {
                return bin.heat_pump_kwh * losses * option.price_per_unit + bin.backup_heat_kwh * fuel_price;
            };
            double above = 0;
            for (const auto& bin : on.season.bins) above += bin_cost(bin);
            no_lockout = above;
            double below = 0;
            std::size_t next = 0;
            for (std::size_t j = 0; j < on.season.bins.size() && next < candidates.size(); ++j) {
                // Candidate c: bins colder than c run on the backup alone.
                while (next < candidates.size() && candidates[next] <= on.season.bins[j].t_c) cost_of[next++] = below + above;
                below += bin_cost(off.season.bins[j]);
                above -= bin_cost(on.season.bins[j]);
            }
        } else {
            for (std::size_t k = 0; k < candidates.size(); ++k)
                cost_of[k] = run(input, option, points, ua_kw, balance_c, candidates[k], backup, losses).energy_cost;
            no_lockout = run(input, option, points, ua_kw, balance_c, std::nullopt, backup, losses).energy_cost;
        }
        double best_cost = INFINITY;
        for (std::size_t k = 0; k < candidates.size(); ++k)
            if (k == 0 || cost_of[k] < best_cost - 1e-9 * std::max(1.0, std::fabs(best_cost))) {
                best_cost = cost_of[k];
                changeover = candidates[k];
            }
        if (no_lockout <= best_cost * (1 + 1e-12)) changeover.reset();
    }
    const auto result = run(input, option, points, ua_kw, balance_c, changeover, backup, losses);
    const auto& season = result.season;
    r.season = season;
    r.balance_point_c = balance_c;
    r.changeover_c = changeover;
    r.heat_pump_kwh = season.heat_pump_kwh * losses;
    r.backup_kwh = backup.option ? 0.0 : season.backup_heat_kwh * losses;
    r.backup_share = season.load_kwh > 0 ? season.backup_heat_kwh / season.load_kwh : 0.0;
    r.seasonal_cop = backup.option ? season.heat_pump_cop() / losses : season.seasonal_cop_with_resistance() / losses;
    r.fuel_energy_hhv_kwh = result.electricity_kwh + result.backup_fuel_kwh;
    r.fuel_quantity = result.electricity_kwh;
    r.hhv_kwh_per_unit = 1.0;
    r.lhv_kwh_per_unit = 1.0;
    r.seasonal_efficiency_hhv = r.useful_heat_kwh / r.fuel_energy_hhv_kwh;
    r.energy_cost = result.energy_cost;
    r.water_by_system_fuel_kwh = result.water_kwh;
    r.water_by_system_cost = result.water_cost;
    r.electricity_profile = result.profile;
    r.electricity_kwh = result.electricity_kwh;
    for (const auto& charge : option.fixed_charges) r.fixed_cost += charge.amount_per_year;
    if (backup.option)
        for (const auto& charge : backup.option->fixed_charges) r.fixed_cost += charge.amount_per_year;
    r.annual_cost = r.energy_cost + r.fixed_cost;
    r.cost_per_useful_kwh = r.energy_cost / r.useful_heat_kwh;
    {
        double own_fixed = 0, backup_fixed = 0;
        for (const auto& charge : option.fixed_charges) own_fixed += charge.amount_per_year;
        if (backup.option)
            for (const auto& charge : backup.option->fixed_charges) backup_fixed += charge.amount_per_year;
        const double electricity_cost = option.schedule ? tariff_cost(option_tariff(option), result.electricity_kwh, result.profile)
                                                        : priced_cost(option, result.electricity_kwh);
        r.cost_parts.push_back({option.fuel.id, electricity_cost, own_fixed});
        if (backup.option) r.cost_parts.push_back({backup.option->fuel.id, r.energy_cost - electricity_cost, backup_fixed});
    }
    auto emitted = emissions_of(option.fuel, result.electricity_kwh, input.settings);
    std::string emissions_text = emitted.text;
    if (backup.option) {
        r.backup_option = backup.option->id;
        r.backup_fuel_unit = backup.option->price_unit;
        r.backup_fuel_quantity = result.backup_fuel_kwh / backup.hhv_kwh_per_unit;
        const auto more = emissions_of(backup.option->fuel, result.backup_fuel_kwh, input.settings);
        emitted.co2e_kg += more.co2e_kg;
        emitted.co2_fossil_kg += more.co2_fossil_kg;
        emitted.co2_biogenic_kg += more.co2_biogenic_kg;
        emitted.ch4_kg += more.ch4_kg;
        emitted.n2o_kg += more.n2o_kg;
        emissions_text += "; backup " + more.text;
    }
    r.co2e_kg = emitted.co2e_kg;
    r.co2_fossil_kg = emitted.co2_fossil_kg;
    r.co2_biogenic_kg = emitted.co2_biogenic_kg;
    r.ch4_kg = emitted.ch4_kg;
    r.n2o_kg = emitted.n2o_kg;

    if (season.extrapolated_hours > 0) {
        double coldest = INFINITY;
        for (const auto& p : points)
            if (!p.added) coldest = std::min(coldest, p.outdoor_c);
        r.warnings.push_back(format_fixed(season.extrapolated_hours, 0) + " heating hours are colder than the data sheet's coldest "
                             "point (" + temp_text(coldest) + "); capacity and COP there are extrapolated linearly");
    }

    // Trace.
    const auto energy_text = [&](double kwh) { return fw::energy_text(kwh, input.settings.units); };
    r.trace.push_back("useful heat " + energy_text(r.useful_heat_kwh) + " (" + input.demand_method + " demand)" +
                      (input.hot_water_kwh > 0 ? ", of which hot water " + energy_text(input.hot_water_kwh) : ""));
    for (const auto& line : sheet_trace) r.trace.push_back(line);
    r.trace.push_back("temperature bins: " + std::to_string(climate.bins.size()) + " bins, " +
                      format_fixed(season.hours_below_balance_point, 0) + " h below the balance point " + temp_text(balance_c) +
                      "; load line " + format_fixed(ua_kw * 1000, 1) + " W/K x (balance point - outdoor)");
    r.trace.push_back("each bin: capacity and COP interpolated; part load X = min(1, load/capacity), PLF = 1 - " +
                      format_number(option.cd) + " (1 - X)" + (option.cd_given ? "" : " (C_D default 0.25, DOE App. M)") +
                      (option.cutoff_c ? "; off below " + temp_text(*option.cutoff_c) : "") +
                      (changeover ? "; changeover to " + option.backup + " below " + temp_text(*changeover) +
                                        (option.changeover_optimal ? " (lowest cost at these prices)" : "")
                                  : ""));
    r.trace.push_back("season: heat pump delivers " + energy_text(season.heat_pump_heat_kwh) + " using " +
                      format_fixed(season.heat_pump_kwh, 0) + " kWh (COP " + format_fixed(season.heat_pump_cop(), 2) +
                      "); backup " + energy_text(season.backup_heat_kwh) + " (" + format_fixed(100 * r.backup_share, 1) + " % of the load)");
    if (losses != 1.0) r.trace.push_back("age derating and distribution loss: energies x " + format_fixed(losses, 4));
    if (backup.option)
        r.trace.push_back("backup " + backup.option->id + ": " + energy_text(season.backup_heat_kwh * losses) + " / " +
                          format_fixed(backup.efficiency, 3) + " = " + format_fixed(r.backup_fuel_quantity, 1) + " " + r.backup_fuel_unit +
                          " x " + format_number(backup.option->price_per_unit) + " " + currency);
    else
        r.trace.push_back("resistance backup " + format_fixed(r.backup_kwh, 0) + " kWh; seasonal COP with backup " +
                          format_fixed(r.seasonal_cop, 2));
    if (result.water_kwh > 0)
        r.trace.push_back("hot water " + energy_text(input.hot_water_kwh) + " / COP " +
                          format_fixed(input.hot_water_kwh / result.water_kwh, 2) +
                          (backup.option ? " (the heat pump's own; the fuel backup does not make it)" : " (the season's, with resistance backup)") +
                          " = " + format_fixed(result.water_kwh, 0) + " kWh");
    if (option.schedule)
        r.trace.push_back(format_fixed(result.electricity_kwh, 0) + " kWh by time of use (each bin's kWh in its months and hours of "
                          "the day" + std::string(result.water_kwh > 0 ? ", hot water by the day's draws" : "") + "): " +
                          periods_text(*option.schedule, result.profile, result.electricity_kwh) + " " + currency +
                          (backup.option ? " + backup fuel" : "") + "; energy " + format_fixed(r.energy_cost, 2) + "; fixed " +
                          format_fixed(r.fixed_cost, 2) + "; annual " + format_fixed(r.annual_cost, 2) + " " + currency);
    else
        r.trace.push_back(format_fixed(result.electricity_kwh, 0) + " kWh x " + format_number(option.price_per_unit) + " " + currency +
                          "/kWh" + (backup.option ? " + backup fuel" : "") + " = " + format_fixed(r.energy_cost, 2) + " " + currency +
                          " energy; fixed " + format_fixed(r.fixed_cost, 2) + "; annual " + format_fixed(r.annual_cost, 2) + " " + currency);
    r.trace.push_back("emissions " + emissions_text);
    r.sources = option.fuel.sources;
    r.sources.push_back({"emission factors", option.fuel.id, option.fuel.emissions.source});
    r.sources.push_back({"bin method", "capacity, COP, C_D and backup per temperature bin",
                         "ASHRAE bin method; DOE 10 CFR 430 Subpart B Appendix M/M1 heating calculation (from memory)"});
    if (climate.bins_from_data)
        r.sources.push_back({"climate bins", "observed hours", "hourly temperatures of the weather file the climate came from"});
    else
        r.sources.push_back({"climate bins", "Erbs, Klein & Beckman (1983)", "ASHRAE Journal 25(6), via Duffie & Beckman (from memory)"});
    return r;
}

}  // namespace fw

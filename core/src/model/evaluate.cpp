#include "model/scenario.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <map>

#include "base/units.hpp"

namespace fw {

std::string energy_text(double kwh, unit_system units) {
    if (units == unit_system::us) return format_fixed(convert(kwh, "kWh", "MMBtu"), 2) + " MMBtu";
    return format_fixed(kwh, 0) + " kWh";
}

emissions emissions_of(const fuel_record& fuel, double fuel_kwh_hhv, const scenario_settings& settings) {
    emissions out;
    if (fuel.emissions.per_kwh_setting) {
        out.co2_fossil_kg = fuel_kwh_hhv * settings.electricity_co2e_kg_per_kwh;
        out.co2e_kg = out.co2_fossil_kg;
        out.text = format_fixed(fuel_kwh_hhv, 0) + " kWh x " + format_number(settings.electricity_co2e_kg_per_kwh) +
                   " kg CO2e/kWh (" +
                   (settings.electricity_factor_given ? std::string("scenario setting")
                                                      : "default: " + default_electricity_emissions().source + ", " +
                                                            std::to_string(default_electricity_emissions().year)) +
                   ") = " + format_fixed(out.co2e_kg, 0) + " kg CO2e";
        return out;
    }
    const auto& gwp = find_gwp_set(settings.gwp);
    const double mmbtu = convert(fuel_kwh_hhv, "kWh", "MMBtu");
    const double co2 = mmbtu * fuel.emissions.co2_kg_per_mmbtu;
    (fuel.emissions.biogenic ? out.co2_biogenic_kg : out.co2_fossil_kg) = co2;
    out.ch4_kg = mmbtu * fuel.emissions.ch4_kg_per_mmbtu;
    out.n2o_kg = mmbtu * fuel.emissions.n2o_kg_per_mmbtu;
    out.co2e_kg = out.co2_fossil_kg + out.ch4_kg * gwp.ch4 + out.n2o_kg * gwp.n2o;
    out.text = format_fixed(mmbtu, 2) + " MMBtu x (" + format_number(fuel.emissions.co2_kg_per_mmbtu) + " kg CO2" +
               (fuel.emissions.biogenic ? " biogenic, not counted in CO2e" : "") + " + " +
               format_number(fuel.emissions.ch4_kg_per_mmbtu) + " kg CH4 x " + format_number(gwp.ch4) + " + " +
               format_number(fuel.emissions.n2o_kg_per_mmbtu) + " kg N2O x " + format_number(gwp.n2o) + ", GWP " +
               gwp.id + ") per MMBtu = " + format_fixed(out.co2e_kg, 0) + " kg CO2e";
    return out;
}

double priced_cost(const scenario_option& option, double quantity) {
    if (option.tiers.empty()) return quantity * option.price_per_unit;
    double cost = 0;
    for (const auto& tier : option.tiers)
        if (quantity > tier.from) cost += (std::min(quantity, tier.to) - tier.from) * tier.amount;
    return cost;
}

option_result result_for(const scenario& input, const scenario_option& option) {
    option_result r;
    r.id = option.id;
    r.label = option.label;
    r.fuel_id = option.fuel.id;
    r.fuel_name = option.fuel.name;
    r.useful_heat_kwh = input.annual_useful_heat_kwh;
    r.fuel_unit = option.price_unit;
    r.price_per_unit = option.price_per_unit;
    return r;
}

namespace {

/// Without a climate, a seasonal COP on one basis for HSPF and HSPF2 alike: an HSPF2 rating's default
/// curve, fitted by Appendix M1, read on Appendix M's region IV load line (its HSPF / 3.412), since HSPF
/// and HSPF2 differ by their test's load line, not by the machine.
seasonal_efficiency hspf2_on_the_hspf_basis(seasonal_efficiency rated, const system_request& system) {
    const auto points = default_points_for_rating(rated.rated_hhv_basis, rating_procedure::hspf2_appendix_m1, 10.0);
    const double cop = procedure_seasonal_cop(points, rating_procedure::hspf_appendix_m);
    rated.trace.push_back("no climate: the default curve fitted to HSPF2 " + format_number(system.efficiency_value) + " by " +
                          procedure_name(rating_procedure::hspf2_appendix_m1) + " has, on " +
                          procedure_name(rating_procedure::hspf_appendix_m) + ", seasonal COP " + format_fixed(cop, 3) +
                          " (HSPF " + format_fixed(cop * btu_per_wh, 2) + "), the basis an HSPF rating is read on");
    rated.hhv_basis = rated.hhv_basis / rated.rated_hhv_basis * cop;
    rated.rated_hhv_basis = cop;
    return rated;
}

}  // namespace

namespace {

/// [h/year] Burner hours assumed when neither an output capacity nor a climate tells them (common practice:
/// about 2,000 equivalent full-load hours for a heating system sized to its house).
constexpr double assumed_burner_hours = 2000;

/// Adds what an option costs beside its heating energy: a fuel-burning system's own electricity
/// (blower, circulator, burner motor, auger) at the site's electricity price, the fixed charges of
/// services the house keeps whatever heats it, and the sizing check of a fuel-burning system's capacity.
void add_site_costs(const scenario& input, const scenario_option& option, option_result& r) {
    const auto& currency = input.settings.currency;
    const bool us = input.settings.units == unit_system::us;
    const auto power_text = [&](double kw) {
        return us ? format_fixed(convert(kw, "kW", "Btu/h"), 0) + " Btu/h" : format_fixed(kw, 1) + " kW";
    };
    const auto design_load = burns_fuel(option.system.kind) ? house_design_load_kw(input) : std::nullopt;
    // A gas appliance above 2,000 ft gives less than its nameplate: its input (and so its output) derated by the fuel gas code's rule.
    std::optional<double> output_kw = option.capacity_47_kw;
    if (burns_fuel(option.system.kind) && is_fuel_gas(option.fuel) && input.settings.elevation_m) {
        const double feet = convert(*input.settings.elevation_m, "m", "ft");
        const double derating = gas_altitude_derating(feet);
        const std::string site = format_fixed(feet, 0) + " ft (" + format_fixed(*input.settings.elevation_m, 0) + " m)";
        if (option.altitude_rated)
            r.trace.push_back("at " + site + ": rated for altitude by its maker, its output as given");
        else if (derating > 0 && output_kw) {
            output_kw = *output_kw * (1 - derating);
            r.derated_output_kw = output_kw;
            r.trace.push_back("at " + site + " the input is derated " + format_fixed(100 * derating, 0) + " % (4 % for each 1,000 ft above "
                              "sea level above 2,000 ft, NFPA 54 / ANSI Z223.1, from memory): output " + power_text(*option.capacity_47_kw) +
                              " x " + format_fixed(1 - derating, 2) + " = " + power_text(*output_kw) + "; the efficiency, and so the "
                              "fuel for a year's heat, stays as rated (a gas fitter sets the input to the code and the maker's instructions)");
        } else if (derating > 0) {
            r.trace.push_back("at " + site + " a gas appliance's input is derated " + format_fixed(100 * derating, 0) +
                              " % (NFPA 54 / ANSI Z223.1, from memory): its efficiency, and so the fuel for a year's heat, stays as rated; "
                              "give its output capacity to check its size at this elevation");
        }
    }
    if (option.auxiliary && option.auxiliary->value > 0) {
        const auto& aux = *option.auxiliary;
        std::optional<double> kwh;
        if (!aux.watts) {
            kwh = aux.value;
            r.trace.push_back("auxiliary electricity " + format_number(aux.value) + " kWh a year (" + aux.text + ")");
        } else {
            const auto capacity = output_kw ? output_kw : design_load;
            if (capacity && *capacity > 0) {
                const double hours = r.useful_heat_kwh / *capacity;
                kwh = aux.value / 1000 * hours;
                r.trace.push_back("auxiliary electricity " + format_number(aux.value) + " W while the burner runs (" + aux.text +
                                  ") x " + format_fixed(hours, 0) + " burner hours (useful heat / " +
                                  (output_kw ? "output capacity " : "the house's design load ") + power_text(*capacity) +
                                  ") = " + format_fixed(*kwh, 0) + " kWh");
            } else {
                // Neither an output capacity nor a climate: burner hours taken as 2,000 equivalent full-load hours
                // a year (common practice for a heating system sized to its house).
                kwh = aux.value / 1000 * assumed_burner_hours;
                r.trace.push_back("auxiliary electricity " + format_number(aux.value) + " W while the burner runs (" + aux.text +
                                  ") x " + format_fixed(assumed_burner_hours, 0) + " burner hours (assumed: no output capacity or "
                                  "climate given; common practice) = " + format_fixed(*kwh, 0) + " kWh");
                if (aux.text == "as given")
                    r.warnings.push_back("its auxiliary electricity of " + format_number(aux.value) + " W is counted for an assumed " +
                                         format_fixed(assumed_burner_hours, 0) + " burner hours a year: give the system's output "
                                         "capacity or a climate to count them");
            }
        }
        if (kwh) {
            r.auxiliary_kwh = *kwh;
            const auto emitted = emissions_of(find_fuel("electricity"), *kwh, input.settings);
            r.co2e_kg += emitted.co2e_kg;
            r.co2_fossil_kg += emitted.co2_fossil_kg;
            r.trace.push_back("auxiliary electricity emissions " + emitted.text);
            const auto profile = space_heat_profile(input, *kwh);
            r.electricity_profile = add_profile(r.electricity_profile, profile);
            r.electricity_kwh += *kwh;
            if (const auto tariff = site_tariff(input)) {
                r.auxiliary_cost = tariff_cost(*tariff, *kwh, profile);
                r.energy_cost += r.auxiliary_cost;
                r.cost_parts.push_back({"electricity", r.auxiliary_cost, 0.0});
                r.trace.push_back(format_fixed(*kwh, 0) + " kWh x " +
                                  (tariff->schedule ? "the time-of-use periods of " + tariff->text + " (placed in the heating hours)"
                                                    : format_number(tariff->price_per_kwh) + " " + currency + "/kWh (" + tariff->text + ")") +
                                  " = " + format_fixed(r.auxiliary_cost, 2) + " " + currency);
            } else {
                r.warnings.push_back("its auxiliary electricity (" + format_fixed(*kwh, 0) + " kWh a year) is not priced: the "
                                     "scenario has no electricity price (settings.electricity or an electricity option)");
            }
        }
    }
    // Services the house keeps: their fixed charges, unless the option already pays for that fuel.
    for (const auto& service : input.settings.kept_services) {
        // Paid already when the option (or its dual-fuel backup) burns that fuel and carries its own fixed charges.
        bool pays = option.fuel.id == service.fuel_id && !option.fixed_charges.empty();
        if (!pays && option.backup != "electric-resistance")
            for (const auto& other : input.options)
                if (other.id == option.backup) pays = other.fuel.id == service.fuel_id && !other.fixed_charges.empty();
        if (pays) continue;
        double total = 0;
        for (const auto& charge : service.charges) {
            total += charge.amount_per_year;
            r.trace.push_back("kept " + service.fuel_id + " service, " + charge.label + ": " + charge.text + " = " +
                              format_fixed(charge.amount_per_year, 2) + " " + currency);
        }
        r.kept_services_cost += total;
        r.fixed_cost += total;
        r.cost_parts.push_back({service.fuel_id, 0.0, total});
    }
    r.annual_cost = r.energy_cost + r.fixed_cost;
    // Sizing of a fuel-burning system with a given output capacity: 100-140 % of the design load
    // (ACCA Manual S furnace sizing limits, from memory; common practice for boilers too).
    if (design_load && output_kw && *design_load > 0) {
        const double ratio = *output_kw / *design_load;
        const std::string at_site = r.derated_output_kw ? " at this elevation" : "";
        if (ratio < 1.0)
            r.warnings.push_back("its output " + power_text(*output_kw) + at_site + " is below the house's design load " +
                                 power_text(*design_load) + ": it cannot keep the house warm on the coldest days (sizing "
                                 "needs a Manual J or EN 12831 load calculation by a professional)");
        else if (ratio > 1.4)
            r.warnings.push_back("its output " + power_text(*output_kw) + at_site + " is " + format_fixed(ratio, 1) +
                                 " times the house's design load " + power_text(*design_load) +
                                 ": oversized (more than 1.4 x, ACCA Manual S, from memory), it will short-cycle");
    }
}

/// The option's heating energy, cost and emissions (evaluate_option before the site's other costs).
option_result evaluate_option_energy(const scenario& input, const scenario_option& option);

}  // namespace

std::optional<double> house_design_load_kw(const scenario& input) {
    if (!input.climate) return std::nullopt;
    const auto& climate = *input.climate;
    const double design_c = climate.given_design_c.value_or(climate.design_99_c);
    if (input.design_heat_loss_kw) return *input.design_heat_loss_kw;
    if (input.ua_w_per_k && input.indoor_c) return *input.ua_w_per_k * std::max(0.0, *input.indoor_c - design_c) / 1000;
    if (input.fit && input.fit_efficiency > 0)
        return input.fit->slope_kwh_per_k_day * input.fit_efficiency * std::max(0.0, input.fit->tau_c - design_c) / 24;
    const double balance_c = input.balance_point_c.value_or(climate.fahrenheit ? convert(65, "degF", "degC") : 18.0);
    double degree_hours = 0;
    for (const auto& bin : climate.bins)
        if (bin.t_c < balance_c) degree_hours += bin.hours * (balance_c - bin.t_c);
    if (degree_hours <= 0) return std::nullopt;
    return input.space_heat_kwh / degree_hours * std::max(0.0, balance_c - design_c);
}

namespace {

/// Splits the result into space heating and water heating (space heating is the rest, so the totals are their
/// sum) and the option's electricity into the periods of its time-of-use schedule.
void finish_services(const scenario& input, const scenario& view, const scenario_option& option, option_result& r) {
    auto& space = r.space_heating;
    const auto& water = r.water_heating;
    space.useful_heat_kwh = view.space_heat_kwh;
    space.fuel_id = option.fuel.id;
    space.fuel_unit = r.fuel_unit;
    space.fuel_quantity = r.fuel_quantity - (water.fuel_id == option.fuel.id && water.fuel_unit == r.fuel_unit ? water.fuel_quantity : 0.0);
    space.annual_cost = r.annual_cost - water.annual_cost;
    space.fixed_cost = r.fixed_cost - water.fixed_cost;
    space.co2e_kg = r.co2e_kg - water.co2e_kg;
    space.efficiency = r.seasonal_efficiency_hhv;
    space.made_by = std::string(kind_name(option.system.kind));
    const auto tariff = option.fuel.category == fuel_category::electricity ? std::optional(option_tariff(option)) : site_tariff(input);
    if (tariff && tariff->schedule && r.electricity_kwh > 0) r.electricity_periods = split_by_period(*tariff->schedule, r.electricity_profile);
}

}  // namespace

option_result evaluate_option(const scenario& input, const scenario_option& option) {
    if (input.hot_water_kwh <= 0) {
        auto r = evaluate_option_energy(input, option);
        add_site_costs(input, option, r);
        finish_services(input, input, option, r);
        return r;
    }
    const scenario view = heating_system_view(input, option);
    auto r = evaluate_option_energy(view, option);
    add_site_costs(view, option, r);
    add_water_heating(input, option, r);
    finish_services(input, view, option, r);
    // The option serves the house's whole need (space heat and hot water), whatever makes each; its fuel energy is
    // the heating system's and, where it burns the same fuel, the water heater's.
    r.useful_heat_kwh = input.annual_useful_heat_kwh;
    const auto* heater = water_heater_of(input, option);
    if (heater && !heated_by_boiler(heater->kind) && heater->fuel && heater->fuel->id == option.fuel.id && r.water_heating.efficiency > 0)
        r.fuel_energy_hhv_kwh += input.hot_water_kwh / r.water_heating.efficiency;
    return r;
}

namespace {

option_result evaluate_option_energy(const scenario& input, const scenario_option& option) {
    if (option.system.kind == system_kind::air_source_heat_pump && input.climate)
        return evaluate_heat_pump_option(input, option);
    if (!option.efficiency_given)
        throw input_error(option.path + "/system/ratings",
                          "data-sheet points need a climate (for the temperature bins); without one give efficiency");
    option_result r = result_for(input, option);
    const auto units = input.settings.units;
    const auto& currency = input.settings.currency;

    fuel_record fuel = option.fuel;
    std::optional<double> moisture_scale;
    if (option.moisture_pct && fuel.moisture_pct) {
        // Wetter wood: as-received HHV per kg falls as (1 - M); a cord keeps its dry wood, so its HHV stays.
        if (fuel.basis_unit != "cord")
            moisture_scale = (1 - *option.moisture_pct / 100) / (1 - *fuel.moisture_pct / 100);
        if (*option.moisture_pct > 25)
            r.warnings.push_back("wood above 20-25 % moisture burns poorly and smokes, and builds creosote in the "
                                 "chimney (a chimney-fire risk): season it or buy dry wood");
    }
    auto efficiency = seasonal_efficiency_hhv(option.system, fuel, option.path + "/system");
    if (option.system.kind == system_kind::air_source_heat_pump && option.system.rating == efficiency_rating::hspf2)
        efficiency = hspf2_on_the_hspf_basis(efficiency, option.system);
    r.seasonal_efficiency_hhv = efficiency.hhv_basis;
    for (const auto& w : efficiency.warnings) r.warnings.push_back(w);

    auto hv = heating_value_per_sale_unit(fuel, option.price_unit, option.sale, option.path + "/price/per");
    std::string hv_text = hv.derivation;
    if (moisture_scale) {
        hv.hhv_j *= *moisture_scale;
        hv.lhv_j *= *moisture_scale;
        hv_text += "; at " + format_number(*option.moisture_pct) + " % moisture instead of " +
                   format_number(*fuel.moisture_pct) + " %: x " + format_fixed(*moisture_scale, 4) + " (wet basis)";
    }
    if (option.heating_value_override_j) {
        hv.hhv_j = *option.heating_value_override_j;
        hv.lhv_j = hv.hhv_j * fuel.lhv_over_hhv;
        hv_text = option.heating_value_override_text + " replaces the catalog value";
    }
    r.hhv_kwh_per_unit = hv.hhv_j / 3.6e6;
    r.lhv_kwh_per_unit = hv.lhv_j / 3.6e6;

    r.fuel_energy_hhv_kwh = r.useful_heat_kwh / r.seasonal_efficiency_hhv;
    r.fuel_quantity = r.fuel_energy_hhv_kwh / r.hhv_kwh_per_unit;
    r.energy_cost = priced_cost(option, r.fuel_quantity);
    r.water_by_system_fuel_kwh = input.hot_water_kwh / r.seasonal_efficiency_hhv;
    r.water_by_system_cost = r.energy_cost * input.hot_water_kwh / r.useful_heat_kwh;
    if (fuel.category == fuel_category::electricity) {
        // Electric heat in the hours the house needs it, hot water by the day's draws.
        const bool leap = input.climate && input.climate->model.leap_year;
        const auto space = space_heat_profile(input, r.fuel_energy_hhv_kwh - r.water_by_system_fuel_kwh);
        const auto water = hot_water_profile(r.water_by_system_fuel_kwh, leap);
        r.electricity_profile = add_profile(space, water);
        r.electricity_kwh = r.fuel_energy_hhv_kwh;
        if (option.schedule) {
            const auto tariff = option_tariff(option);
            r.water_by_system_cost = tariff_cost(tariff, r.water_by_system_fuel_kwh, water);
            r.energy_cost = tariff_cost(tariff, r.fuel_energy_hhv_kwh - r.water_by_system_fuel_kwh, space) + r.water_by_system_cost;
        }
    }
    for (const auto& charge : option.fixed_charges) r.fixed_cost += charge.amount_per_year;
    r.annual_cost = r.energy_cost + r.fixed_cost;
    r.cost_parts.push_back({fuel.id, r.energy_cost, r.fixed_cost});
    r.cost_per_useful_kwh = r.price_per_unit / (r.hhv_kwh_per_unit * r.seasonal_efficiency_hhv);

    const auto emitted = emissions_of(fuel, r.fuel_energy_hhv_kwh, input.settings);
    r.co2e_kg = emitted.co2e_kg;
    r.co2_fossil_kg = emitted.co2_fossil_kg;
    r.co2_biogenic_kg = emitted.co2_biogenic_kg;
    r.ch4_kg = emitted.ch4_kg;
    r.n2o_kg = emitted.n2o_kg;
    const std::string& emissions_line = emitted.text;
    const auto& gwp = find_gwp_set(input.settings.gwp);

    // Trace, in the scenario's unit system.
    r.trace.push_back("useful heat " + energy_text(r.useful_heat_kwh, units) + " (" + input.demand_method + " demand)");
    for (const auto& line : efficiency.trace) r.trace.push_back(line);
    const bool electric = fuel.category == fuel_category::electricity;
    const std::string divisor = electric || is_heat_pump(option.system.kind) ? "COP " + format_fixed(r.seasonal_efficiency_hhv, 3)
                                                                              : format_fixed(r.seasonal_efficiency_hhv, 4);
    r.trace.push_back(energy_text(r.useful_heat_kwh, units) + " useful / " + divisor + " = " +
                      energy_text(r.fuel_energy_hhv_kwh, units) + " " + fuel.name + (electric ? "" : " (HHV)"));
    r.trace.push_back("heating value: " + hv_text);
    const std::string per_unit = units == unit_system::us
                                     ? format_number(convert(r.hhv_kwh_per_unit, "kWh", "MMBtu")) + " MMBtu/" + r.fuel_unit
                                     : format_number(r.hhv_kwh_per_unit) + " kWh/" + r.fuel_unit;
    r.trace.push_back(energy_text(r.fuel_energy_hhv_kwh, units) + " / " + per_unit + " = " +
                      format_fixed(r.fuel_quantity, 1) + " " + r.fuel_unit);
    if (option.schedule) {
        r.trace.push_back(format_fixed(r.fuel_quantity, 1) + " kWh by time of use: " +
                          periods_text(*option.schedule, r.electricity_profile, r.fuel_quantity));
        r.trace.push_back(std::string("heat placed in the hours the house needs it") +
                          (input.climate ? " (degree-hours of the climate's bins by month and hour)" : " (no climate: evenly over the year)") +
                          ", hot water by the day's draws; = " + format_fixed(r.energy_cost, 2) + " " + currency + " energy");
        r.price_per_unit = r.energy_cost / r.fuel_quantity;
        r.cost_per_useful_kwh = r.energy_cost / r.useful_heat_kwh;
    } else if (option.tiers.empty()) {
        r.trace.push_back(format_fixed(r.fuel_quantity, 1) + " " + r.fuel_unit + " x " + format_number(r.price_per_unit) + " " +
                          currency + "/" + r.fuel_unit + " = " + format_fixed(r.energy_cost, 2) + " " + currency + " energy");
    } else {
        std::string blocks;
        for (const auto& tier : option.tiers)
            if (r.fuel_quantity > tier.from)
                blocks += (blocks.empty() ? "" : " + ") + format_fixed(std::min(r.fuel_quantity, tier.to) - tier.from, 1) + " x " +
                          format_number(tier.amount);
        r.trace.push_back(format_fixed(r.fuel_quantity, 1) + " " + r.fuel_unit + " in blocks: " + blocks + " = " +
                          format_fixed(r.energy_cost, 2) + " " + currency + " energy (average " +
                          format_number(r.energy_cost / r.fuel_quantity) + " " + currency + "/" + r.fuel_unit + ")");
        r.price_per_unit = r.energy_cost / r.fuel_quantity;
    }
    for (const auto& charge : option.fixed_charges)
        r.trace.push_back(charge.label + ": " + charge.text + " = " + format_fixed(charge.amount_per_year, 2) + " " + currency);
    r.trace.push_back("annual cost " + format_fixed(r.energy_cost, 2) + " + " + format_fixed(r.fixed_cost, 2) + " fixed = " +
                      format_fixed(r.annual_cost, 2) + " " + currency);
    r.trace.push_back("cost of useful heat " + format_number(r.price_per_unit) + " / (" +
                      format_number(r.hhv_kwh_per_unit) + " kWh/" + r.fuel_unit + " x " +
                      format_number(r.seasonal_efficiency_hhv) + ") = " + format_fixed(r.cost_per_useful_kwh, 4) + " " +
                      currency + "/kWh useful (energy price only, fixed charges excluded)");
    r.trace.push_back("emissions " + emissions_line);

    r.sources = fuel.sources;
    if (option.heating_value_override_j) {
        // The given heating value replaces the catalog's HHV record.
        r.sources.erase(std::remove_if(r.sources.begin(), r.sources.end(),
                                       [&](const source_note& note) { return note.record == "fuels.json " + fuel.id + " HHV"; }),
                        r.sources.end());
        r.sources.insert(r.sources.begin(), {"scenario", option.heating_value_override_text, "given in the scenario"});
    }
    r.sources.push_back({"emission factors", fuel.id, fuel.emissions.source});
    if (!fuel.emissions.per_kwh_setting) r.sources.push_back({"GWP " + gwp.id, "CH4 " + format_number(gwp.ch4) + ", N2O " + format_number(gwp.n2o), gwp.source});
    if (option.system_catalog) {
        const auto& record = find_system(*option.system_catalog);
        r.sources.push_back({"systems.json " + record.id,
                             "typical " + format_number(record.typical.value) + " " + std::string(rating_name(record.typical.rating)) +
                                 ", minimum " + format_number(record.minimum.value) + " " + std::string(rating_name(record.minimum.rating)),
                             record.minimum.source});
    }
    return r;
}

}  // namespace

const std::vector<std::string>& cautions() {
    static const std::vector<std::string> list = {
        "These figures are estimates for comparing options, not a design: actual use depends on the house, the weather, "
        "the installation and the occupants.",
        "Every fuel-burning appliance needs correct venting, combustion air and regular service, and the home needs "
        "working carbon-monoxide alarms.",
        "Fuel switching, gas lines, oil-tank removal, electrical service upgrades and equipment sizing must be done by "
        "licensed professionals to local codes and permits.",
        "Prices change: check current prices and fixed charges with each supplier before deciding.",
    };
    return list;
}

}  // namespace fw

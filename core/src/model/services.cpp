// The two services an option provides (space heating and water heating), the electricity tariff its
// electricity is priced by, and where in the day and year that electricity is used.
#include <algorithm>
#include <cmath>

#include "base/units.hpp"
#include "model/scenario.hpp"

namespace fw {

double tariff_cost(const electricity_tariff& tariff, double kwh, const month_hour_kwh& profile) {
    if (!tariff.schedule) return kwh * tariff.price_per_kwh;
    const double total = profile_total(profile);
    if (!(total > 0)) return kwh * tariff.price_per_kwh;
    double cost = 0;
    for (const auto& period : split_by_period(*tariff.schedule, profile)) cost += period.cost;
    return cost * kwh / total;
}

electricity_tariff option_tariff(const scenario_option& option) {
    return {option.price_per_unit, option.schedule ? &*option.schedule : nullptr, "option " + option.id};
}

std::optional<electricity_tariff> site_tariff(const scenario& input) {
    const auto& settings = input.settings;
    if (settings.electricity_price_per_kwh || settings.electricity_schedule)
        return electricity_tariff{settings.electricity_price_per_kwh.value_or(0.0),
                                  settings.electricity_schedule ? &*settings.electricity_schedule : nullptr,
                                  "the site's electricity price"};
    for (const auto& other : input.options)
        if (other.fuel.category == fuel_category::electricity) {
            const double kwh_per_unit = heating_value_per_sale_unit(other.fuel, other.price_unit, other.sale, {}).hhv_j / 3.6e6;
            return electricity_tariff{other.price_per_unit / kwh_per_unit, other.schedule ? &*other.schedule : nullptr,
                                      "the electricity price of option " + other.id};
        }
    return std::nullopt;
}

double bins_balance_point_c(const scenario& input) {
    const bool f = input.climate ? input.climate->fahrenheit : input.settings.units == unit_system::us;
    return input.balance_point_c.value_or(f ? convert(65, "degF", "degC") : 18.0);
}

double heating_hours_share(const scenario& input) {
    if (!input.climate) return 0.5;
    const double balance_c = bins_balance_point_c(input);
    double below = 0, total = 0;
    for (const auto& bin : input.climate->bins) {
        total += bin.hours;
        if (bin.t_c < balance_c) below += bin.hours;
    }
    return total > 0 ? below / total : 0.5;
}

month_hour_kwh space_heat_profile(const scenario& input, double kwh) {
    const bool leap = input.climate && input.climate->model.leap_year;
    if (!input.climate || input.climate->calendar.size() != input.climate->bins.size()) return flat_profile(kwh, leap);
    const auto& climate = *input.climate;
    const double balance_c = bins_balance_point_c(input);
    month_hour_kwh weights{};
    for (std::size_t k = 0; k < climate.bins.size(); ++k) {
        const double degrees = balance_c - climate.bins[k].t_c;
        if (degrees <= 0) continue;
        weights = add_profile(weights, climate.calendar[k], degrees);
    }
    const double total = profile_total(weights);
    if (!(total > 0)) return flat_profile(kwh, leap);
    month_hour_kwh out{};
    return add_profile(out, weights, kwh / total);
}

month_hour_kwh bins_profile(const scenario& input, const heat_pump_season& season, double scale, bool with_backup) {
    month_hour_kwh out{};
    const auto& climate = *input.climate;
    if (climate.calendar.size() != season.bins.size()) {
        double kwh = season.heat_pump_kwh + (with_backup ? season.backup_heat_kwh : 0.0);
        return flat_profile(kwh * scale, climate.model.leap_year);
    }
    for (std::size_t k = 0; k < season.bins.size(); ++k) {
        const auto& bin = season.bins[k];
        const double kwh = (bin.heat_pump_kwh + (with_backup ? bin.backup_heat_kwh : 0.0)) * scale;
        if (kwh <= 0 || bin.hours <= 0) continue;
        out = add_profile(out, climate.calendar[k], kwh / bin.hours);
    }
    return out;
}

bool system_makes_hot_water(system_kind kind) {
    return kind == system_kind::boiler || kind == system_kind::ground_source_heat_pump ||
           kind == system_kind::electric_resistance;
}

const water_heater_spec* water_heater_of(const scenario& input, const scenario_option& option) {
    if (option.water_heater) return &*option.water_heater;
    if (input.water_heater) return &*input.water_heater;
    return nullptr;
}

namespace {

/// [kWh/year] An indirect tank's standby loss.
double standby_kwh(const water_heater_spec& heater, const scenario& input) {
    const bool leap = input.climate && input.climate->model.leap_year;
    return heater.standby_w * (leap ? 8784 : 8760) / 1000.0;
}

/// [kWh/year] Heat a heat-pump water heater in the heated space takes from the house while it needs heat: by
/// the first law the appliance as a whole moves heat delivered - electricity = Q (1 - 1/UEF) out of the room air
/// (standby losses it gives back are netted); the house makes it up in the share of the year's hours below the
/// balance point (the rest of the year it only cools the room).
double heat_taken_from_space_kwh(const water_heater_spec& heater, const scenario& input) {
    if (heater.kind != water_heater_kind::heat_pump_water_heater || !heater.conditioned_space) return 0.0;
    const double site = water_heater_site_efficiency(heater).site;
    if (site <= 1) return 0.0;
    return input.hot_water_kwh * (1 - 1 / site) * heating_hours_share(input);
}

std::string boiler_needed_message(const water_heater_spec& heater, const scenario_option& option, bool own) {
    return std::string(own ? "this option's " : "the house's ") + std::string(water_heater_kind_name(heater.kind)) +
           " water heater is heated by a boiler, and option " + option.id + " heats with " +
           with_article(std::string(kind_name(option.system.kind))) + ": give option " + option.id +
           " a water_heater of its own (a storage, tankless or heat-pump water heater)";
}

}  // namespace

scenario heating_system_view(const scenario& input, const scenario_option& option) {
    scenario view = input;
    const auto* heater = water_heater_of(input, option);
    if (heater && heated_by_boiler(heater->kind)) {
        if (option.system.kind != system_kind::boiler)
            throw input_error(option.path + "/water_heater", boiler_needed_message(*heater, option, option.water_heater && heater == &*option.water_heater));
        if (heater->kind == water_heater_kind::indirect) view.hot_water_kwh += standby_kwh(*heater, input);
    } else if (heater) {
        view.hot_water_kwh = 0;
        view.space_heat_kwh += heat_taken_from_space_kwh(*heater, input);
    }
    view.annual_useful_heat_kwh = view.space_heat_kwh + view.hot_water_kwh;
    return view;
}

namespace {

/// The option whose price and meter a water heater's fuel is bought on: the option itself, its dual-fuel
/// backup, or the first option burning that fuel.
const scenario_option* fuel_source(const scenario& input, const scenario_option& option, const std::string& fuel_id) {
    if (option.fuel.id == fuel_id) return &option;
    if (option.backup != "electric-resistance")
        for (const auto& other : input.options)
            if (other.id == option.backup && other.fuel.id == fuel_id) return &other;
    for (const auto& other : input.options)
        if (other.fuel.id == fuel_id) return &other;
    return nullptr;
}

/// Whether the option already pays for a fuel's service (its own fuel or its backup's, or a kept service).
bool pays_service(const scenario& input, const scenario_option& option, const std::string& fuel_id) {
    if (option.fuel.id == fuel_id) return true;
    if (option.backup != "electric-resistance")
        for (const auto& other : input.options)
            if (other.id == option.backup && other.fuel.id == fuel_id) return true;
    for (const auto& kept : input.settings.kept_services)
        if (kept.fuel_id == fuel_id) return true;
    return false;
}

}  // namespace

void add_water_heating(const scenario& input, const scenario_option& option, option_result& r) {
    const auto& currency = input.settings.currency;
    const auto units = input.settings.units;
    const bool leap = input.climate && input.climate->model.leap_year;
    const auto* heater = water_heater_of(input, option);
    service_result& water = r.water_heating;
    water.useful_heat_kwh = input.hot_water_kwh;
    if (!heater || heated_by_boiler(heater->kind)) {
        // The heating system makes it: its energy and cost for hot water were counted with the space heating.
        water.made_by = heater ? std::string(water_heater_kind_name(heater->kind)) : "heating-system";
        water.fuel_id = option.fuel.id;
        water.fuel_unit = r.fuel_unit;
        const double per_unit = r.hhv_kwh_per_unit > 0 ? r.hhv_kwh_per_unit : 1.0;
        water.fuel_quantity = r.water_by_system_fuel_kwh / per_unit;
        water.annual_cost = r.water_by_system_cost;
        water.co2e_kg = emissions_of(option.fuel, r.water_by_system_fuel_kwh, input.settings).co2e_kg;
        water.efficiency = r.water_by_system_fuel_kwh > 0 ? input.hot_water_kwh / r.water_by_system_fuel_kwh : 0.0;
        if (!heater && !system_makes_hot_water(option.system.kind))
            r.warnings.push_back("option " + option.id + " heats with " + with_article(std::string(kind_name(option.system.kind))) +
                                 ", which cannot make hot water, yet demand.hot_water is charged to it (at " +
                                 format_fixed(water.efficiency, 2) + " heat per unit of energy): give the house's water heater "
                                 "(demand.water_heating.heater) or this option's water_heater");
        if (heater && heater->kind == water_heater_kind::indirect)
            r.trace.push_back("water heating by the boiler through an indirect tank: " + energy_text(input.hot_water_kwh, units) +
                              " + standby loss " + format_number(heater->standby_w) + " W x 8,760 h" +
                              (heater->standby_given ? "" : " (assumed: a well-insulated 40-50 gal tank, common practice)") +
                              " at the boiler's seasonal efficiency");
        else if (heater)
            r.trace.push_back("water heating by the combi boiler at its seasonal efficiency (no storage standby; a condensing "
                              "combi often condenses less on hot water, not modelled)");
    } else {
        const auto& fuel = *heater->fuel;
        const auto efficiency = water_heater_site_efficiency(*heater);
        const double energy_kwh = input.hot_water_kwh / efficiency.site;
        water.made_by = std::string(water_heater_kind_name(heater->kind));
        water.fuel_id = fuel.id;
        water.efficiency = efficiency.site;
        water.extra_space_heat_kwh = heat_taken_from_space_kwh(*heater, input);
        r.trace.push_back("water heating " + energy_text(input.hot_water_kwh, units) + " by a " + water.made_by + " water heater: " +
                          efficiency.text + " = " + energy_text(energy_kwh, units) + " " + fuel.name +
                          (fuel.category == fuel_category::electricity ? "" : " (HHV)"));
        if (water.extra_space_heat_kwh > 0)
            r.trace.push_back("the heat-pump water heater stands in the heated space: it takes heat delivered - electricity = " +
                              energy_text(input.hot_water_kwh * (1 - 1 / efficiency.site), units) + " a year from the room air, of which the " +
                              format_fixed(100 * heating_hours_share(input), 1) + " % in the hours below the balance point (" +
                              energy_text(water.extra_space_heat_kwh, units) +
                              ") the heating system makes up; it was added to the space heating above");
        double cost = 0, fixed = 0, quantity = 0;
        std::string unit;
        if (fuel.category == fuel_category::electricity) {
            const bool own_meter = option.fuel.category == fuel_category::electricity;
            auto tariff = own_meter ? std::optional<electricity_tariff>(option_tariff(option)) : site_tariff(input);
            if (!tariff && heater->price) {
                // the water heater's own price per kWh (the house's electricity, priced nowhere else)
                tariff = electricity_tariff{heater->price->amount / convert(1.0, heater->price->unit, "kWh"), nullptr,
                                            "the water heater's own price"};
                fixed = pays_service(input, option, fuel.id) ? 0.0 : heater->price->fixed_per_year;
            }
            if (!tariff)
                throw input_error(heater->path + "/fuel", "an electric water heater needs an electricity price: give "
                                                          "settings.electricity.price, an option that runs on electricity, or "
                                                          "the water heater its price ({amount, per})");
            quantity = energy_kwh;
            unit = "kWh";
            const auto profile = hot_water_profile(energy_kwh, leap);
            if (own_meter && !option.tiers.empty()) {
                // Block rates are on the meter's whole year: the water heater's kWh join the heating's.
                const double before = r.fuel_quantity, after = before + energy_kwh;
                const double whole = priced_cost(option, after);
                cost = whole * energy_kwh / after;
                // the heating's share of the meter's cost moves too: its change is a part of its own
                const double heating_change = whole - priced_cost(option, before) - cost;
                r.energy_cost += heating_change;
                r.cost_parts.push_back({option.fuel.id, heating_change, 0.0});
            } else {
                cost = tariff_cost(*tariff, energy_kwh, profile);
            }
            r.electricity_profile = add_profile(r.electricity_profile, profile);
            r.electricity_kwh += energy_kwh;
            if (own_meter) r.fuel_quantity += energy_kwh;
            r.trace.push_back(format_fixed(energy_kwh, 0) + " kWh at " +
                              (tariff->schedule ? "the time-of-use periods (by the hot-water day shape)" : tariff->text) + " = " +
                              format_fixed(cost, 2) + " " + currency);
        } else {
            const auto* source = fuel_source(input, option, fuel.id);
            const bool same_meter = source && (source == &option || source->id == r.backup_option);
            if (heater->price && !same_meter) {
                // Its own price: the fuel is bought for the water heater alone, with its own fixed charges.
                const auto& own = *heater->price;
                sale_options sale;
                sale.gas_pressure_pa = input.settings.gas_pressure_base_pa;
                const double per_unit = heating_value_per_sale_unit(fuel, own.unit, sale, heater->path + "/price/per").hhv_j / 3.6e6;
                quantity = energy_kwh / per_unit;
                unit = own.unit;
                cost = quantity * own.amount;
                fixed = pays_service(input, option, fuel.id) ? 0.0 : own.fixed_per_year;  // a kept service pays them already
                r.trace.push_back(format_fixed(quantity, 1) + " " + unit + " x " + format_number(own.amount) + " " + currency + "/" + unit +
                                  " (the water heater's own price) = " + format_fixed(cost, 2) + " " + currency);
                if (fixed > 0)
                    r.trace.push_back("the water heater's fixed charges (" + own.fixed_text + ") = " + format_fixed(fixed, 2) + " " + currency);
            } else if (!source) {
                throw input_error(heater->path + "/fuel", "no price for " + fuel.id + ": give the water heater its price ({amount, per}), "
                                                          "or add an option that burns " + fuel.id);
            } else {
                const double per_unit = source->heating_value_override_j
                                            ? *source->heating_value_override_j / 3.6e6
                                            : heating_value_per_sale_unit(source->fuel, source->price_unit, source->sale, heater->path + "/fuel").hhv_j / 3.6e6;
                quantity = energy_kwh / per_unit;
                unit = source->price_unit;
                if (same_meter) {
                    // Same meter as the heating: block rates on the year's total, shared by quantity.
                    const double before = source == &option ? r.fuel_quantity : r.backup_fuel_quantity;
                    const double after = before + quantity;
                    const double whole = priced_cost(*source, after);
                    cost = whole * quantity / after;
                    const double heating_change = whole - priced_cost(*source, before) - cost;
                    r.energy_cost += heating_change;
                    r.cost_parts.push_back({fuel.id, heating_change, 0.0});
                    if (source == &option) r.fuel_quantity += quantity;
                } else {
                    cost = priced_cost(*source, quantity);
                    if (!pays_service(input, option, fuel.id)) {
                        for (const auto& charge : source->fixed_charges) {
                            fixed += charge.amount_per_year;
                            r.trace.push_back("the " + fuel.id + " service stays for the water heater, " + charge.label + ": " + charge.text +
                                              " = " + format_fixed(charge.amount_per_year, 2) + " " + currency);
                        }
                    }
                }
                r.trace.push_back(format_fixed(quantity, 1) + " " + unit + " at the price of option " + source->id + " = " +
                                  format_fixed(cost, 2) + " " + currency);
            }
        }
        const auto emitted = emissions_of(fuel, energy_kwh, input.settings);
        r.trace.push_back("water heating emissions " + emitted.text);
        water.fuel_unit = unit;
        water.fuel_quantity = quantity;
        water.annual_cost = cost + fixed;
        water.fixed_cost = fixed;
        water.co2e_kg = emitted.co2e_kg;
        r.energy_cost += cost;
        r.fixed_cost += fixed;
        r.co2e_kg += emitted.co2e_kg;
        r.co2_fossil_kg += emitted.co2_fossil_kg;
        r.co2_biogenic_kg += emitted.co2_biogenic_kg;
        r.ch4_kg += emitted.ch4_kg;
        r.n2o_kg += emitted.n2o_kg;
        r.cost_parts.push_back({fuel.id, cost, fixed});
        for (const auto& note : fuel.sources)
            if (std::find_if(r.sources.begin(), r.sources.end(), [&](const source_note& s) { return s.record == note.record; }) ==
                r.sources.end())
                r.sources.push_back(note);
        r.sources.push_back({"water heater", water.made_by + " " + efficiency.text,
                             heater->rating == water_heater_rating::uef ? "10 CFR 430 Subpart B Appendix E (UEF)"
                                                                        : "Regulation (EU) 812/2013 (eta_wh)"});
    }
    r.annual_cost = r.energy_cost + r.fixed_cost;
}

}  // namespace fw

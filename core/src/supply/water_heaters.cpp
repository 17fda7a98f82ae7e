#include "supply/water_heaters.hpp"

#include "base/error.hpp"
#include "base/units.hpp"

namespace fw {

namespace {

struct kind_entry {
    water_heater_kind kind;
    std::string_view name;
};

constexpr kind_entry kinds[] = {
    {water_heater_kind::storage, "storage"},
    {water_heater_kind::tankless, "tankless"},
    {water_heater_kind::heat_pump_water_heater, "heat-pump-water-heater"},
    {water_heater_kind::indirect, "indirect"},
    {water_heater_kind::combi, "combi"},
};

}  // namespace

std::string_view water_heater_kind_name(water_heater_kind kind) {
    for (const auto& entry : kinds)
        if (entry.kind == kind) return entry.name;
    return "storage";
}

water_heater_kind parse_water_heater_kind(const std::string& text, const std::string& path) {
    std::string known;
    for (const auto& entry : kinds) {
        if (text == entry.name) return entry.kind;
        known += (known.empty() ? "" : ", ") + std::string(entry.name);
    }
    throw input_error(path, "unknown water heater kind \"" + text + "\"; known kinds: " + known);
}

bool heated_by_boiler(water_heater_kind kind) {
    return kind == water_heater_kind::indirect || kind == water_heater_kind::combi;
}

water_heater_efficiency water_heater_site_efficiency(const water_heater_spec& heater) {
    const bool electric = heater.fuel && heater.fuel->category == fuel_category::electricity;
    if (heater.rating == water_heater_rating::uef)
        return {heater.efficiency_value, "UEF " + format_number(heater.efficiency_value) +
                                             " (10 CFR 430 Subpart B App. E): energy = heat delivered / UEF"};
    if (electric)
        return {heater.efficiency_value * eu_conversion_coefficient,
                "eta_wh " + format_number(100 * heater.efficiency_value) + " % (Regulation (EU) 812/2013, electricity counted x CC " +
                    format_number(eu_conversion_coefficient) + "): heat / electricity = " +
                    format_fixed(heater.efficiency_value * eu_conversion_coefficient, 3)};
    return {heater.efficiency_value, "eta_wh " + format_number(100 * heater.efficiency_value) +
                                         " % (Regulation (EU) 812/2013, on the gross calorific value): energy = heat / " +
                                         format_fixed(heater.efficiency_value, 3)};
}

double hot_water_heat_kwh(double people, double litres_per_person_day, double rise_k, double days_per_year) {
    return people * litres_per_person_day * days_per_year * water_kj_per_litre_k * rise_k / 3600.0;
}

}  // namespace fw

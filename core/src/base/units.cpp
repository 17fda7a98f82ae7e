#include "base/units.hpp"

#include <cmath>

#include "base/error.hpp"

namespace fw {

using namespace constants;

const std::vector<unit_definition>& unit_table() {
    static const std::vector<unit_definition> table = {
        {"J", dimension::energy, 1.0, 0.0, "joule (SI)"},
        {"kJ", dimension::energy, 1e3, 0.0, "1000 J"},
        {"MJ", dimension::energy, 1e6, 0.0, "10^6 J"},
        {"GJ", dimension::energy, 1e9, 0.0, "10^9 J"},
        {"kWh", dimension::energy, joule_per_kwh, 0.0, "3.6 MJ exactly"},
        {"Btu", dimension::energy, joule_per_btu, 0.0, "International Table Btu, 1055.05585262 J"},
        {"MMBtu", dimension::energy, 1e6 * joule_per_btu, 0.0, "10^6 Btu (IT)"},
        {"therm", dimension::energy, joule_per_therm, 0.0, "100,000 Btu (IT) = 105.505585262 MJ"},
        {"kcal", dimension::energy, 1e3 * joule_per_calorie, 0.0, "International Table kilocalorie, 4186.8 J"},
        {"cal", dimension::energy, joule_per_calorie, 0.0, "International Table calorie, 4.1868 J"},
        {"kcal_th", dimension::energy, 1e3 * joule_per_calorie_th, 0.0, "thermochemical kilocalorie, 4184 J"},
        {"cal_th", dimension::energy, joule_per_calorie_th, 0.0, "thermochemical calorie, 4.184 J"},
        {"m3", dimension::volume, 1.0, 0.0, "cubic metre (SI)"},
        {"L", dimension::volume, 1e-3, 0.0, "litre, 10^-3 m^3"},
        {"gal", dimension::volume, m3_per_gallon, 0.0, "US liquid gallon, 231 in^3"},
        {"imp_gal", dimension::volume, m3_per_imperial_gallon, 0.0, "imperial gallon, 4.54609 L"},
        {"ft3", dimension::volume, m3_per_cubic_foot, 0.0, "cubic foot, (0.3048 m)^3"},
        {"ccf", dimension::volume, 100.0 * m3_per_cubic_foot, 0.0, "100 ft^3"},
        {"Mcf", dimension::volume, 1000.0 * m3_per_cubic_foot, 0.0, "1000 ft^3"},
        {"cord", dimension::volume, 128.0 * m3_per_cubic_foot, 0.0, "128 ft^3 of stacked wood"},
        {"kg", dimension::mass, 1.0, 0.0, "kilogram (SI)"},
        {"g", dimension::mass, 1e-3, 0.0, "gram"},
        {"lb", dimension::mass, kg_per_pound, 0.0, "avoirdupois pound, 0.45359237 kg"},
        {"short_ton", dimension::mass, 2000.0 * kg_per_pound, 0.0, "2000 lb"},
        {"tonne", dimension::mass, 1000.0, 0.0, "metric ton, 1000 kg"},
        {"W", dimension::power, 1.0, 0.0, "watt (SI)"},
        {"kW", dimension::power, 1e3, 0.0, "1000 W"},
        {"Btu/h", dimension::power, joule_per_btu / 3600.0, 0.0, "Btu (IT) per hour"},
        {"m", dimension::length, 1.0, 0.0, "metre (SI)"},
        {"ft", dimension::length, metre_per_foot, 0.0, "international foot, 0.3048 m"},
        {"Pa", dimension::pressure, 1.0, 0.0, "pascal (SI)"},
        {"kPa", dimension::pressure, 1e3, 0.0, "1000 Pa"},
        {"mbar", dimension::pressure, 100.0, 0.0, "millibar, 100 Pa"},
        {"psia", dimension::pressure, pascal_per_psi, 0.0, "pound-force per square inch, absolute"},
        {"inHg", dimension::pressure, inch_of_mercury_pa, 0.0, "inch of mercury (conventional, 0 degC), 3386.389 Pa"},
        {"degC", dimension::temperature, 1.0, kelvin_at_zero_celsius, "degree Celsius, K - 273.15"},
        {"degF", dimension::temperature, 5.0 / 9.0, kelvin_at_zero_celsius - 32.0 * 5.0 / 9.0,
         "degree Fahrenheit, (K x 9/5) - 459.67"},
        {"K", dimension::temperature, 1.0, 0.0, "kelvin (SI)"},
    };
    return table;
}

std::string_view dimension_name(dimension kind) {
    switch (kind) {
        case dimension::energy: return "energy";
        case dimension::volume: return "volume";
        case dimension::mass: return "mass";
        case dimension::power: return "power";
        case dimension::temperature: return "temperature";
        case dimension::length: return "length";
        case dimension::pressure: return "pressure";
    }
    return "unknown";
}

std::string accepted_units(dimension kind) {
    std::string list;
    for (const auto& unit : unit_table()) {
        if (unit.kind != kind) continue;
        if (!list.empty()) list += ", ";
        list += unit.name;
    }
    return list;
}

static std::string all_accepted_units() {
    std::string list;
    for (auto kind : {dimension::energy, dimension::volume, dimension::mass, dimension::power,
                      dimension::temperature, dimension::length, dimension::pressure}) {
        if (!list.empty()) list += "; ";
        list += std::string(dimension_name(kind)) + ": " + accepted_units(kind);
    }
    return list;
}

const unit_definition& find_unit(std::string_view name, const std::string& path) {
    for (const auto& unit : unit_table())
        if (unit.name == name) return unit;
    throw input_error(path, "unknown unit \"" + std::string(name) + "\"; accepted units (case-sensitive) are " +
                                all_accepted_units());
}

double convert(double value, std::string_view from, std::string_view to, const std::string& path) {
    const auto& source = find_unit(from, path);
    const auto& target = find_unit(to, path);
    if (!std::isfinite(value)) throw input_error(path, "value must be a finite number, got " + format_number(value));
    if (source.kind != target.kind)
        throw input_error(path, "cannot convert " + std::string(from) + " (" + std::string(dimension_name(source.kind)) +
                                    ") to " + std::string(to) + " (" + std::string(dimension_name(target.kind)) + ")");
    if (source.name == target.name) return value;
    const double si = value * source.si_factor + source.si_offset;
    if (source.kind == dimension::temperature && si < 0.0)
        throw input_error(path, format_number(value) + " " + std::string(from) + " is below absolute zero");
    const double out = (si - target.si_offset) / target.si_factor;
    if (!std::isfinite(out))
        throw input_error(
            path, format_number(value) + " " + std::string(from) + " is too large to convert to " + std::string(to));
    return out;
}

}  // namespace fw

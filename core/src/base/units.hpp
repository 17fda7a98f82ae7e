// Units of energy, volume, mass, power, temperature, length and pressure from their exact definitions
// (NIST SP 811, 2008, Appendix B). No rounded constants.
//
// Conventions (stated once, used everywhere):
// - Btu is the International Table Btu, 1055.05585262 J exactly.
// - therm is 100,000 Btu (IT) = 105.505585262 MJ, the unit gas is billed in. NIST SP 811's
//   "US therm" (10^5 Btu at 59 degF = 105.4804 MJ) is 0.024 % smaller and is not used.
// - cal and kcal are International Table calories (4.1868 J); the thermochemical calorie
//   (4.184 J) is available as cal_th and kcal_th.
// - gal is the US liquid gallon (231 in^3); imp_gal the imperial gallon (4.54609 L).
// - cord is 128 ft^3 of stacked wood (wood, bark and air), as fuelwood is sold.
#pragma once
#include <string>
#include <string_view>
#include <vector>

namespace fw {

enum class dimension { energy, volume, mass, power, temperature, length, pressure };

/// A unit: value_si = value * si_factor + si_offset, SI base J, m^3, kg, W, K, m or Pa.
struct unit_definition {
    std::string_view name;
    dimension kind;
    double si_factor;
    double si_offset;
    std::string_view definition;
};

namespace constants {
inline constexpr double joule_per_btu = 1055.05585262;         ///< [J/Btu] IT Btu, exact (NIST SP 811 B.8)
inline constexpr double joule_per_calorie = 4.1868;            ///< [J/cal] IT calorie, exact
inline constexpr double joule_per_calorie_th = 4.184;          ///< [J/cal_th] thermochemical calorie, exact
inline constexpr double joule_per_kwh = 3.6e6;                 ///< [J/kWh] exact
inline constexpr double joule_per_therm = 1.0e5 * joule_per_btu;  ///< [J/therm] 100,000 Btu (IT)
inline constexpr double joule_per_us_therm_sp811 = 1.054804e8; ///< [J] NIST SP 811 "US therm", for comparison only
inline constexpr double metre_per_inch = 0.0254;               ///< [m/in] exact
inline constexpr double metre_per_foot = 0.3048;               ///< [m/ft] exact
inline constexpr double m3_per_gallon = 231.0 * metre_per_inch * metre_per_inch * metre_per_inch;  ///< [m^3] US gallon = 231 in^3
inline constexpr double m3_per_imperial_gallon = 4.54609e-3;   ///< [m^3] exact
inline constexpr double m3_per_cubic_foot = metre_per_foot * metre_per_foot * metre_per_foot;  ///< [m^3]
inline constexpr double kg_per_pound = 0.45359237;             ///< [kg/lb] exact
inline constexpr double gas_constant = 8.314462618;            ///< [J/(mol K)] CODATA 2018, exact since 2019 SI
inline constexpr double pascal_per_psi = 6894.757293168361;    ///< [Pa/psi] lbf/in^2 from lb, g_n = 9.80665 and inch
inline constexpr double kelvin_at_zero_celsius = 273.15;       ///< [K]
inline constexpr double inch_of_mercury_pa = 3386.389;         ///< [Pa/inHg] conventional, NIST SP 811 B.8
}  // namespace constants

/// Every accepted unit, in a stable order (the order error messages list them in).
const std::vector<unit_definition>& unit_table();

/// The unit with exactly this spelling (case-sensitive); throws input_error listing the accepted ones.
const unit_definition& find_unit(std::string_view name, const std::string& path = "");

/// "energy", "volume", ...
std::string_view dimension_name(dimension kind);

/// Accepted spellings of one dimension joined by ", ".
std::string accepted_units(dimension kind);

/// Converts value between units of the same dimension; throws input_error on unknown units,
/// mixed dimensions, non-finite values or temperatures below absolute zero.
double convert(double value, std::string_view from, std::string_view to, const std::string& path = "");

}  // namespace fw

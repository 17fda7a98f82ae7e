// Water heaters (supply layer): kinds, their ratings (the US uniform energy factor, the EU water-heating
// efficiency) on the site-energy basis, the hot-water need from people, volume and temperature rise, and
// the stated defaults.
#pragma once
#include <optional>
#include <string>
#include <string_view>

#include "supply/fuels.hpp"

namespace fw {

enum class water_heater_kind { storage, tankless, heat_pump_water_heater, indirect, combi };

/// The rating a water heater's efficiency is stated by.
enum class water_heater_rating {
    uef,     ///< uniform energy factor, 10 CFR 430 Subpart B Appendix E (useful heat / site energy, HHV)
    eta_wh,  ///< EU water-heating energy efficiency eta_wh, Regulation (EU) 812/2013 (GCV, electricity x CC)
};

std::string_view water_heater_kind_name(water_heater_kind kind);
water_heater_kind parse_water_heater_kind(const std::string& text, const std::string& path = "");

/// Whether the kind is heated by the house's boiler (an indirect tank, a combi boiler) rather than by its own burner or element.
bool heated_by_boiler(water_heater_kind kind);

/// A water heater as a scenario gives it (the house's, or an option's).
struct water_heater_spec {
    water_heater_kind kind = water_heater_kind::storage;
    std::optional<fuel_record> fuel;   ///< its own fuel (absent for indirect and combi: the boiler's)
    double efficiency_value = 0;       ///< as rated (0 for indirect and combi: the boiler's)
    water_heater_rating rating = water_heater_rating::uef;
    bool conditioned_space = false;    ///< stands in the heated space (a heat-pump water heater then cools it)
    bool location_given = false;
    double standby_w = 0;              ///< [W] an indirect tank's standby loss, made up by the boiler
    bool standby_given = false;
    /// Its fuel's own price when no option burns that fuel (a propane tank kept for the water heater alone).
    struct own_price {
        double amount = 0;         ///< [currency per unit]
        std::string unit;          ///< a sale unit of the fuel
        double fixed_per_year = 0;  ///< [currency/year] its fixed charges
        std::string fixed_text;     ///< the charges as entered, for the trace
    };
    std::optional<own_price> price;
    std::string path;                  ///< JSON pointer of the heater
};

/// [1] Primary-energy conversion coefficient CC = 2.5 for electricity in Regulation (EU) 812/2013 (and 811/2013), from memory.
inline constexpr double eu_conversion_coefficient = 2.5;

/// [W] Standby loss of an indirect tank when none is given: about 50 W (1.2 kWh a day, about 0.5 degF an
/// hour on a 40-50 gal tank; common practice for a well-insulated tank).
inline constexpr double default_indirect_standby_w = 50.0;

/// Useful heat per unit of site energy (HHV; kWh for electricity) of a water heater with its own fuel, with the steps:
/// UEF as it is (10 CFR 430 Subpart B App. E: annual energy = heat delivered / UEF, the simple model);
/// eta_wh of a fuel-fired heater as it is (GCV basis), of an electric one x CC 2.5 (eta_wh counts electricity as primary energy).
struct water_heater_efficiency {
    double site = 0;
    std::string text;
};
water_heater_efficiency water_heater_site_efficiency(const water_heater_spec& heater);

/// [L/(person day)] Hot water per person a day when none is given: 50 L (13.2 gal) at the tap (common practice).
inline constexpr double default_litres_per_person_day = 50.0;

/// [K] Temperature rise when none is given: 67 degF (37.2 K), the UEF test's 58 degF inlet to 125 degF outlet
/// (10 CFR 430 Subpart B App. E, from memory).
inline constexpr double default_temperature_rise_k = 67.0 * 5.0 / 9.0;

/// [kJ/(L K)] Heat to warm a litre of water by 1 K: c_p 4.186 kJ/(kg K) x 1 kg/L (water near 20 degC, from memory).
inline constexpr double water_kj_per_litre_k = 4.186;

/// [kWh/year] Useful heat of hot water: people x litres a day x days x 4.186 kJ/(L K) x rise / 3600.
double hot_water_heat_kwh(double people, double litres_per_person_day, double rise_k, double days_per_year);

}  // namespace fw

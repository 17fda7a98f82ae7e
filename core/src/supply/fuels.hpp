// Fuels as they are sold (fuels layer): data/fuels.json, heating values per sale unit on the
// HHV and LHV basis, densities, emission factors, and custom fuels from a composition.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "thermo/combustion.hpp"

namespace fw {

enum class fuel_category { gas, liquid, solid, electricity };

std::string_view category_name(fuel_category category);

/// kg per MMBtu of HHV input (EPA 40 CFR 98 Tables C-1, C-2).
struct emission_factors {
    double co2_kg_per_mmbtu = 0;
    double ch4_kg_per_mmbtu = 0;
    double n2o_kg_per_mmbtu = 0;
    bool biogenic = false;          ///< CO2 from biomass: reported apart from fossil CO2
    bool per_kwh_setting = false;   ///< electricity: the scenario's kg CO2e/kWh applies instead
    std::string source;
};

struct wood_species_group {
    std::string id;
    double hhv_mmbtu_per_cord;
    std::string source;
};

/// One fuel: the published gross heating value per `basis_unit` and what links other sale units to it.
struct fuel_record {
    std::string id;
    std::string name;
    fuel_category category = fuel_category::solid;
    std::vector<std::string> sale_units;
    double hhv_j_per_basis_unit = 0;     ///< [J per basis unit], HHV
    std::string basis_unit;              ///< "ft3", "gal", "short_ton", "kWh", "cord", "kg", "m3", "L"
    std::string hhv_text;                ///< as published, e.g. "91452 Btu/gal"
    std::string hhv_source;
    std::string gas_reference = "60F";   ///< reference condition of a gas basis volume
    std::optional<double> density_kg_per_l;
    std::string density_text;
    double lhv_over_hhv = 1.0;           ///< from the composition (Hess's law or ultimate analysis)
    std::string lhv_text;                ///< how the ratio was reached
    std::optional<double> molar_mass_g_per_mol;  ///< gases with a composition
    std::optional<double> moisture_pct;
    std::optional<double> bag_mass_kg;
    std::optional<double> face_cord_fraction;
    std::vector<wood_species_group> species_groups;
    emission_factors emissions;
    std::optional<double> composition_hhv_mj_per_kg;  ///< recomputed from the composition, for checks
    std::optional<double> composition_co2_kg_per_mmbtu;
    std::vector<source_note> sources;
    bool custom = false;
};

/// Every catalog fuel, in file order.
const std::vector<fuel_record>& fuel_table();

/// The catalog fuel with this id; throws input_error listing the known ids.
const fuel_record& find_fuel(const std::string& id, const std::string& path = "");

/// The catalog's default electricity emission factor [kg CO2e/kWh], its year and source.
struct electricity_default {
    double co2e_kg_per_kwh;
    int year;
    std::string source;
};
const electricity_default& default_electricity_emissions();

/// A 100-year global-warming-potential set.
struct gwp_set {
    std::string id;
    double ch4, n2o;
    std::string source;
};
const gwp_set& find_gwp_set(const std::string& id, const std::string& path = "");
const std::string& default_gwp_set();

/// Per-option modifiers of a sale unit.
struct sale_options {
    std::optional<double> bag_mass_kg;
    std::optional<double> face_cord_fraction;
    std::optional<std::string> wood_species;
    std::optional<double> gas_pressure_pa;  ///< [Pa] absolute pressure gas volumes are metered at (else the reference's)
};

/// [Pa] Standard-atmosphere pressure at `elevation_m` [m]: 101,325 (1 - 2.25577e-5 h)^5.25588 (US Standard
/// Atmosphere 1976 troposphere, the form ISO 2533 tabulates; from memory).
double standard_atmosphere_pa(double elevation_m);

/// Gross heating value of one sale unit [J], with how it was derived.
struct unit_heating_value {
    double hhv_j = 0;
    double lhv_j = 0;
    std::string derivation;
};

/// HHV and LHV of one `sale_unit` of the fuel; throws input_error for a unit the fuel is not sold in.
unit_heating_value heating_value_per_sale_unit(const fuel_record& fuel, const std::string& sale_unit,
                                               const sale_options& options, const std::string& path = "");

/// A fuel defined by its composition in a scenario (formula, gas analysis or ultimate analysis).
struct custom_fuel_request {
    std::string id;
    std::string name;
    std::optional<compound_request> compound;
    std::optional<mixture_request> mixture;
    std::optional<ultimate_request> ultimate;
    std::string sale_unit;                  ///< a mass unit, or a volume unit with a density (liquids) or a gas
    std::optional<double> density_kg_per_l;
    bool biogenic = false;
    std::optional<double> ch4_kg_per_mmbtu, n2o_kg_per_mmbtu;
};
fuel_record make_custom_fuel(const custom_fuel_request& request, const std::string& path);

}  // namespace fw

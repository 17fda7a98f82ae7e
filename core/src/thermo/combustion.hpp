// Complete combustion of C, H, O, N, S fuels and heating values by Hess's law (thermo layer).
//
// Products: C -> CO2(g), H -> H2O, S -> SO2(g), N -> N2(g); He and Ar pass through.
// HHV (gross) has the water as liquid, LHV (net) as vapour, both at 298.15 K and 1 bar:
//   HHV = sum(n_p x -dHf(product, water liquid)) + dHf(fuel)   [kJ/mol]   (Hess's law)
//   LHV = HHV - n_H2O x (dHf(H2O,g) - dHf(H2O,l))
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "thermo/formula.hpp"
#include "thermo/species.hpp"

namespace fw {

/// Moles per mole of fuel for complete combustion with the stoichiometric oxygen.
struct combustion_stoichiometry {
    double o2_mol = 0;    ///< O2 needed (negative if the fuel carries surplus oxygen)
    double co2_mol = 0;
    double h2o_mol = 0;
    double so2_mol = 0;
    double n2_mol = 0;
    double ar_mol = 0;
    double he_mol = 0;
};

/// Stoichiometry of complete combustion; throws input_error for elements other than C, H, O, N, S, Ar, He.
combustion_stoichiometry combustion_of(const composition& atoms, const std::string& path = "");

/// [kJ/mol] latent heat of water at 298.15 K = dHf(H2O,g) - dHf(H2O,l) from data/species.json.
double water_latent_heat_kj_per_mol();

/// [kJ/mol] gross heating value (-dcH, water liquid) of a fuel of these atoms and formation enthalpy [kJ/mol].
double hhv_from_formation_kj_per_mol(const composition& atoms, double dhf_kj_per_mol);

/// [kJ/mol] formation enthalpy implied by a measured gross heating value [kJ/mol] (Hess's law inverted).
double formation_from_hhv_kj_per_mol(const composition& atoms, double hhv_kj_per_mol);

/// A reference condition for gas volumes (ideal gas).
struct reference_condition {
    std::string id;          ///< "15C" | "0C" | "60F"
    double temperature_k;    ///< [K]
    double pressure_pa;      ///< [Pa]
    std::string description;
};

/// "15C" (15 degC, 101.325 kPa), "0C" (0 degC, 101.325 kPa), "60F" (60 degF, 14.696 psia).
const reference_condition& find_reference(const std::string& id, const std::string& path = "");

/// [mol/m^3] ideal-gas molar density p / (R T).
double molar_density_mol_per_m3(const reference_condition& reference);

/// A data record or constant a result relied on, with its citation.
struct source_note {
    std::string record;   ///< e.g. "species.json C3H8 (gas)"
    std::string value;    ///< e.g. "dHf = -104.7 kJ/mol"
    std::string citation;
};

/// Everything the heating-value entry point reports. Per-mol and per-m3 values are absent where
/// they do not apply (ultimate analyses; non-gaseous fuels).
struct fuel_properties {
    std::optional<double> hhv_kj_per_mol, lhv_kj_per_mol;  ///< [kJ/mol]
    std::optional<double> molar_mass_g_per_mol;           ///< [g/mol]
    double hhv_mj_per_kg = 0, lhv_mj_per_kg = 0;          ///< [MJ/kg]
    std::optional<double> hhv_mj_per_m3, lhv_mj_per_m3;   ///< [MJ/m^3] at `reference`, ideal gas
    std::optional<reference_condition> reference;
    double stoich_o2_kg_per_kg = 0;   ///< [kg O2 / kg fuel]
    double stoich_air_kg_per_kg = 0;  ///< [kg dry air / kg fuel]
    double co2_kg_per_kg = 0;         ///< [kg CO2 / kg fuel]
    double water_formed_kg_per_kg = 0;  ///< [kg H2O in the flue gas / kg fuel], moisture included
    std::string equation;
    std::vector<source_note> sources;
    std::vector<std::string> warnings;
    std::string basis_note;  ///< how the numbers were reached, in words
};

/// One compound: a species id or formula, or a formula outside the table with its formation
/// enthalpy or measured HHV.
struct compound_request {
    std::string formula;
    std::optional<phase> state;
    std::optional<double> dhf_kj_per_mol;
    std::optional<double> hhv_kj_per_mol;
    std::string reference = "15C";
};
fuel_properties analyse_compound(const compound_request& request);

enum class fraction_basis { mole, mass };

struct mixture_component {
    std::string species;  ///< id or formula, as for a compound
    double fraction;
};

/// A mixture: gases by mole (= ideal volume) fraction as a gas analysis lists them, or liquids
/// and solids by mass fraction. Fractions must sum to 1 within 0.001 unless `normalise`.
struct mixture_request {
    std::vector<mixture_component> components;
    fraction_basis basis = fraction_basis::mole;
    bool normalise = false;
    std::string reference = "15C";
};
fuel_properties analyse_mixture(const mixture_request& request);

enum class analysis_basis { dry, as_received, daf };

/// Ultimate analysis in wt % (C, H, O, N, S, ash) on `basis`, with moisture in wt % as received.
/// HHV from Channiwala & Parikh (2002) unless a measured dry-basis HHV is given.
struct ultimate_request {
    double carbon_pct = 0, hydrogen_pct = 0, oxygen_pct = 0, nitrogen_pct = 0, sulfur_pct = 0, ash_pct = 0;
    double moisture_pct = 0;
    analysis_basis basis = analysis_basis::dry;
    std::optional<double> measured_hhv_dry_mj_per_kg;
};

/// Results on three bases; `as_received` is also copied into the main fields of fuel_properties.
struct ultimate_properties {
    fuel_properties as_received;
    double hhv_dry_mj_per_kg = 0, lhv_dry_mj_per_kg = 0;
    std::optional<double> hhv_daf_mj_per_kg, lhv_daf_mj_per_kg;
    double carbon_dry_pct = 0, hydrogen_dry_pct = 0, oxygen_dry_pct = 0, nitrogen_dry_pct = 0, sulfur_dry_pct = 0,
           ash_dry_pct = 0;
};
ultimate_properties analyse_ultimate(const ultimate_request& request);

/// [MJ/kg dry] Channiwala & Parikh (2002), Fuel 81:1051, eq. 3, inputs wt % dry basis.
double channiwala_parikh_hhv_mj_per_kg(double c, double h, double s, double o, double n, double ash);

}  // namespace fw

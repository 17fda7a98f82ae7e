// The species table (data/species.json): standard enthalpies of formation at 298.15 K (thermo layer).
#pragma once
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "thermo/formula.hpp"

namespace fw {

enum class phase { gas, liquid, solid };

/// "gas" | "liquid" | "solid".
std::string_view phase_name(phase state);

/// Parses "gas" | "liquid" | "solid"; throws input_error listing them.
phase parse_phase(std::string_view text, const std::string& path = "");

/// One record of data/species.json.
struct species_record {
    std::string id;
    std::string name;
    std::string formula;
    phase state;
    double dhf_kj_per_mol;                     ///< [kJ/mol] standard enthalpy of formation, 298.15 K
    std::optional<double> dhf_uncertainty_kj_per_mol;  ///< [kJ/mol] as stated by the source
    std::string source_key;                    ///< key into the file's "sources" (with any note after it)
    std::string source;                        ///< full citation text
    double stored_molar_mass_g_per_mol;        ///< [g/mol] as written in the file (derived there)
    composition atoms;
};

/// Every record, in file order.
const std::vector<species_record>& species_table();

/// The record for an id or formula: `text` matches a record id ("n-C4H10", "CH4") or, failing
/// that, any record whose formula has the same atoms ("C4H10" matches both butanes: an error
/// naming them). `wanted` picks the phase; without it gas is preferred where the species has one.
/// Returns nullptr when nothing matches (a compound outside the table); throws on ambiguity
/// or when the species exists but not in the wanted phase.
const species_record* find_species(std::string_view text, std::optional<phase> wanted, const std::string& path = "");

/// The record with this exact id and phase (used for combustion products); throws if missing.
const species_record& species_by_id(std::string_view id, phase state);

}  // namespace fw

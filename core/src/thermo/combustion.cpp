#include "thermo/combustion.hpp"

#include <cmath>
#include <cstdio>
#include <set>

#include "base/error.hpp"
#include "base/units.hpp"

namespace fw {

namespace {

/// Dry air, U.S. Standard Atmosphere 1976, Table 3 (sea level): O2 mole fraction and molar mass.
constexpr double air_o2_mole_fraction = 0.209476;
constexpr double air_molar_mass_g_per_mol = 28.9644;
const char* const air_citation =
    "U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), Table 3: dry air at sea level, O2 mole fraction 0.209476, "
    "mean molar mass 28.9644 g/mol (from memory)";
const char* const gas_constant_citation =
    "CODATA 2018 molar gas constant R = 8.314462618 J/(mol K) (exact in the 2019 SI); ideal gas assumed";

double dhf_of(std::string_view id, phase state) { return species_by_id(id, state).dhf_kj_per_mol; }

/// Up to 4 decimals, trailing zeros dropped; empty for exactly 1 (as chemists write it).
std::string count_text(double value) {
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%.4f", value);
    std::string text(buffer);
    while (!text.empty() && text.back() == '0') text.pop_back();
    if (!text.empty() && text.back() == '.') text.pop_back();
    return text == "1" ? std::string() : text;
}

std::string coefficient_text(double value) {
    const auto text = count_text(value);
    return text.empty() ? text : text + " ";
}

void append_term(std::string& side, double coefficient, const std::string& name) {
    if (std::fabs(coefficient) < 5e-5) return;
    if (!side.empty()) side += " + ";
    side += coefficient_text(coefficient) + name;
}

std::string equation_text(const std::vector<std::pair<double, std::string>>& fuels, const combustion_stoichiometry& s) {
    std::string left, right;
    for (const auto& [amount, name] : fuels) append_term(left, amount, name);
    if (s.o2_mol > 0) append_term(left, s.o2_mol, "O2");
    append_term(right, s.co2_mol, "CO2");
    append_term(right, s.h2o_mol, "H2O");
    append_term(right, s.so2_mol, "SO2");
    append_term(right, s.n2_mol, "N2");
    append_term(right, s.ar_mol, "Ar");
    append_term(right, s.he_mol, "He");
    if (s.o2_mol < 0) append_term(right, -s.o2_mol, "O2");
    return left + " -> " + right;
}

source_note species_note(const species_record& record) {
    std::string value = "dHf = " + format_number(record.dhf_kj_per_mol) + " kJ/mol";
    if (record.dhf_uncertainty_kj_per_mol) value += " +/- " + format_number(*record.dhf_uncertainty_kj_per_mol);
    return {"species.json " + record.id + " (" + std::string(phase_name(record.state)) + ")", value, record.source};
}

void add_product_sources(std::vector<source_note>& notes, const combustion_stoichiometry& s) {
    if (s.co2_mol > 0) notes.push_back(species_note(species_by_id("CO2", phase::gas)));
    notes.push_back(species_note(species_by_id("H2O", phase::liquid)));
    notes.push_back(species_note(species_by_id("H2O", phase::gas)));
    if (s.so2_mol > 0) notes.push_back(species_note(species_by_id("SO2", phase::gas)));
    notes.push_back({"elements.json", atomic_weight_edition(), "IUPAC CIAAW standard atomic weights"});
}

void require_finite(double value, const std::string& path, const std::string& what) {
    if (!std::isfinite(value)) throw input_error(path, what + " must be a finite number, got " + format_number(value));
}

/// Fills the mass-based and volume-based fields from molar ones.
void fill_from_molar(fuel_properties& out, const composition& atoms, double hhv, double molar_mass, bool gaseous,
                     const std::string& reference_id, const std::string& reference_path) {
    const auto s = combustion_of(atoms);
    const double lhv = hhv - s.h2o_mol * water_latent_heat_kj_per_mol();
    out.hhv_kj_per_mol = hhv;
    out.lhv_kj_per_mol = lhv;
    out.molar_mass_g_per_mol = molar_mass;
    out.hhv_mj_per_kg = hhv / molar_mass;  // kJ/g = MJ/kg
    out.lhv_mj_per_kg = lhv / molar_mass;
    const double o2_molar_mass = 2 * atomic_weight("O");
    const double o2_needed = std::max(0.0, s.o2_mol);
    out.stoich_o2_kg_per_kg = o2_needed * o2_molar_mass / molar_mass;
    out.stoich_air_kg_per_kg = o2_needed / air_o2_mole_fraction * air_molar_mass_g_per_mol / molar_mass;
    out.co2_kg_per_kg = s.co2_mol * (atomic_weight("C") + o2_molar_mass) / molar_mass;
    out.water_formed_kg_per_kg = s.h2o_mol * molar_mass_g_per_mol(parse_formula("H2O")) / molar_mass;
    if (s.o2_mol < 0) out.warnings.push_back("the fuel carries more oxygen than its combustion needs");
    if (gaseous) {
        const auto& reference = find_reference(reference_id, reference_path);
        const double density = molar_density_mol_per_m3(reference);
        out.hhv_mj_per_m3 = hhv * density / 1000.0;
        out.lhv_mj_per_m3 = lhv * density / 1000.0;
        out.reference = reference;
        out.sources.push_back({"reference condition " + reference.id, reference.description, gas_constant_citation});
    }
    out.sources.push_back({"dry air", "O2 mole fraction 0.209476, 28.9644 g/mol", air_citation});
}

}  // namespace

combustion_stoichiometry combustion_of(const composition& atoms, const std::string& path) {
    combustion_stoichiometry s;
    for (const auto& [symbol, count] : atoms) {
        if (symbol == "C") {
            s.co2_mol += count;
            s.o2_mol += count;
        } else if (symbol == "H") {
            s.h2o_mol += count / 2;
            s.o2_mol += count / 4;
        } else if (symbol == "S") {
            s.so2_mol += count;
            s.o2_mol += count;
        } else if (symbol == "O") {
            s.o2_mol -= count / 2;
        } else if (symbol == "N") {
            s.n2_mol += count / 2;
        } else if (symbol == "Ar") {
            s.ar_mol += count;
        } else if (symbol == "He") {
            s.he_mol += count;
        } else {
            throw input_error(path, "combustion is defined for fuels of C, H, O, N and S (Ar and He pass through); "
                                    "the formula contains " + symbol);
        }
    }
    return s;
}

double water_latent_heat_kj_per_mol() { return dhf_of("H2O", phase::gas) - dhf_of("H2O", phase::liquid); }

double hhv_from_formation_kj_per_mol(const composition& atoms, double dhf_kj_per_mol) {
    const auto s = combustion_of(atoms);
    double released = -s.co2_mol * dhf_of("CO2", phase::gas) - s.h2o_mol * dhf_of("H2O", phase::liquid);
    if (s.so2_mol > 0) released -= s.so2_mol * dhf_of("SO2", phase::gas);
    return released + dhf_kj_per_mol;
}

double formation_from_hhv_kj_per_mol(const composition& atoms, double hhv_kj_per_mol) {
    return hhv_kj_per_mol - hhv_from_formation_kj_per_mol(atoms, 0.0);
}

const reference_condition& find_reference(const std::string& id, const std::string& path) {
    static const std::vector<reference_condition> table = {
        {"15C", 288.15, 101325.0, "15 degC, 101.325 kPa (ISO 13443 standard reference conditions)"},
        {"0C", 273.15, 101325.0, "0 degC, 101.325 kPa (normal conditions)"},
        {"60F", (60.0 + 459.67) * 5.0 / 9.0, 14.696 * constants::pascal_per_psi,
         "60 degF, 14.696 psia (US gas-industry standard conditions)"},
    };
    for (const auto& reference : table)
        if (reference.id == id) return reference;
    throw input_error(path, "unknown reference condition \"" + id + "\"; accepted: 15C, 0C, 60F");
}

double molar_density_mol_per_m3(const reference_condition& reference) {
    return reference.pressure_pa / (constants::gas_constant * reference.temperature_k);
}

fuel_properties analyse_compound(const compound_request& request) {
    if (request.dhf_kj_per_mol) require_finite(*request.dhf_kj_per_mol, "/dhf_kj_per_mol", "the enthalpy of formation");
    if (request.hhv_kj_per_mol) require_finite(*request.hhv_kj_per_mol, "/hhv_kj_per_mol", "the measured HHV");
    if (request.dhf_kj_per_mol && request.hhv_kj_per_mol)
        throw input_error("/hhv_kj_per_mol", "give either the enthalpy of formation or the measured HHV, not both");
    const species_record* record = find_species(request.formula, request.state, "/formula");
    fuel_properties out;
    const composition atoms = record ? record->atoms : parse_formula(request.formula, "/formula");
    combustion_of(atoms, "/formula");
    phase state = record ? record->state : request.state.value_or(phase::gas);
    double dhf = 0;
    std::string label = record ? record->formula : request.formula;
    if (request.hhv_kj_per_mol) {
        if (*request.hhv_kj_per_mol <= 0)
            throw input_error("/hhv_kj_per_mol", "the measured HHV must be > 0, got " +
                                                     format_number(*request.hhv_kj_per_mol));
        dhf = formation_from_hhv_kj_per_mol(atoms, *request.hhv_kj_per_mol);
        out.sources.push_back({"user", "measured HHV = " + format_number(*request.hhv_kj_per_mol) + " kJ/mol",
                               "given in the request"});
    } else if (request.dhf_kj_per_mol) {
        dhf = *request.dhf_kj_per_mol;
        out.sources.push_back({"user", "dHf = " + format_number(dhf) + " kJ/mol", "given in the request"});
    } else if (record) {
        dhf = record->dhf_kj_per_mol;
        out.sources.push_back(species_note(*record));
    } else {
        throw input_error("/formula", "\"" + request.formula +
                                          "\" is not in data/species.json; give its standard enthalpy of formation "
                                          "(dhf_kj_per_mol, CLI --dhf) or its measured HHV (hhv_kj_per_mol, CLI --hhv)");
    }
    if (!record && !request.state)
        out.warnings.push_back("no phase given for " + request.formula + "; taken as gas");
    const double hhv = hhv_from_formation_kj_per_mol(atoms, dhf);
    if (!(hhv > 0))
        throw input_error("/formula", label + " releases no heat on complete combustion (HHV = " + format_number(hhv) +
                                          " kJ/mol); it is not a fuel");
    const auto s = combustion_of(atoms);
    out.equation = equation_text({{1.0, label}}, s);
    fill_from_molar(out, atoms, hhv, molar_mass_g_per_mol(atoms), state == phase::gas, request.reference, "/reference");
    add_product_sources(out.sources, s);
    out.basis_note = "Hess's law at 298.15 K: HHV with product water liquid, LHV with water vapour";
    if (out.reference) out.basis_note += "; volumes at " + out.reference->description + ", ideal gas";
    return out;
}

fuel_properties analyse_mixture(const mixture_request& request) {
    if (request.components.empty()) throw input_error("/mixture", "lists no components");
    struct part {
        const species_record* record;
        double fraction;
    };
    std::vector<part> parts;
    std::set<std::string> seen;
    double sum = 0;
    for (std::size_t i = 0; i < request.components.size(); ++i) {
        const auto& component = request.components[i];
        const std::string path = "/mixture/" + std::to_string(i);
        if (!std::isfinite(component.fraction) || component.fraction < 0)
            throw input_error(path, "fraction of " + component.species + " must be a finite number >= 0, got " +
                                        format_number(component.fraction));
        const auto* record = find_species(component.species, std::nullopt, path);
        if (!record) {
            std::string ids;
            std::set<std::string> listed;
            for (const auto& r : species_table())
                if (listed.insert(r.id).second) ids += (ids.empty() ? "" : ", ") + r.id;
            throw input_error(path, "component \"" + component.species + "\" is not in data/species.json; known: " + ids);
        }
        const std::string key = record->id + "/" + std::string(phase_name(record->state));
        if (!seen.insert(key).second) throw input_error(path, "component " + record->id + " is listed twice");
        parts.push_back({record, component.fraction});
        sum += component.fraction;
    }
    fuel_properties out;
    if (std::fabs(sum - 1.0) > 0.001) {
        if (!request.normalise)
            throw input_error("/mixture", "fractions sum to " + format_number(sum) +
                                              ", not 1 (within 0.001); correct them or ask for normalisation "
                                              "(normalise: true, CLI --normalise)");
        out.warnings.push_back("fractions summed to " + format_number(sum) + " and were normalised to 1");
    }
    if (!(sum > 0)) throw input_error("/mixture", "fractions sum to 0");
    // Mole amounts per unit of the given fractions.
    std::vector<double> moles;
    double total_moles = 0;
    for (const auto& p : parts) {
        const double n = request.basis == fraction_basis::mole ? p.fraction / sum
                                                              : p.fraction / sum / p.record->stored_molar_mass_g_per_mol;
        moles.push_back(n);
        total_moles += n;
    }
    composition atoms;
    double dhf = 0, molar_mass = 0;
    bool all_gas = true;
    std::vector<std::pair<double, std::string>> reactants;
    for (std::size_t i = 0; i < parts.size(); ++i) {
        const double x = moles[i] / total_moles;
        const auto& record = *parts[i].record;
        add_scaled(atoms, record.atoms, x);
        dhf += x * record.dhf_kj_per_mol;
        molar_mass += x * molar_mass_g_per_mol(record.atoms);
        all_gas = all_gas && record.state == phase::gas;
        reactants.push_back({x, record.formula});
        out.sources.push_back(species_note(record));
    }
    const double hhv = hhv_from_formation_kj_per_mol(atoms, dhf);
    if (!(hhv > 0)) throw input_error("/mixture", "has no combustible components (HHV = " + format_number(hhv) + ")");
    const auto s = combustion_of(atoms);
    out.equation = equation_text(reactants, s);
    fill_from_molar(out, atoms, hhv, molar_mass, all_gas, request.reference, "/reference");
    if (request.basis == fraction_basis::mass) {
        out.hhv_kj_per_mol.reset();
        out.lhv_kj_per_mol.reset();
    }
    add_product_sources(out.sources, s);
    out.basis_note = std::string("ideal mixture by ") + (request.basis == fraction_basis::mole ? "mole" : "mass") +
                     " fraction; Hess's law at 298.15 K (HHV water liquid, LHV vapour)";
    if (out.reference) out.basis_note += "; volumes at " + out.reference->description + ", ideal gas";
    return out;
}

double channiwala_parikh_hhv_mj_per_kg(double c, double h, double s, double o, double n, double ash) {
    return 0.3491 * c + 1.1783 * h + 0.1005 * s - 0.1034 * o - 0.0151 * n - 0.0211 * ash;
}

ultimate_properties analyse_ultimate(const ultimate_request& r) {
    const std::pair<const char*, double> fields[] = {{"C", r.carbon_pct},   {"H", r.hydrogen_pct}, {"O", r.oxygen_pct},
                                                     {"N", r.nitrogen_pct}, {"S", r.sulfur_pct},   {"ash", r.ash_pct}};
    double sum = 0;
    for (const auto& [name, value] : fields) {
        const std::string path = std::string("/ultimate/") + name;
        if (!std::isfinite(value) || value < 0 || value > 100)
            throw input_error(path, std::string(name) + " must be a number from 0 to 100 wt %, got " + format_number(value));
        if (std::string(name) != "ash" || r.basis != analysis_basis::daf) sum += value;
    }
    if (!std::isfinite(r.moisture_pct) || r.moisture_pct < 0 || r.moisture_pct >= 100)
        throw input_error("/moisture", "moisture must be a number from 0 to below 100 wt % (as received), got " +
                                           format_number(r.moisture_pct));
    const double expected = 100.0 - (r.basis == analysis_basis::as_received ? r.moisture_pct : 0.0);
    const char* basis_text = r.basis == analysis_basis::dry ? "dry" : r.basis == analysis_basis::daf ? "dry-ash-free"
                                                                                                      : "as-received";
    if (std::fabs(sum - expected) > 0.1)
        throw input_error("/ultimate", std::string("the ") + basis_text + "-basis analysis sums to " + format_number(sum) +
                                           " wt %, expected " + format_number(expected) +
                                           (r.basis == analysis_basis::as_received ? " (100 less moisture)" : "") +
                                           (r.basis == analysis_basis::daf ? " (C+H+O+N+S; ash is given on a dry basis)" : "") +
                                           " within 0.1");
    // Convert to the dry basis.
    double scale = 1.0;
    if (r.basis == analysis_basis::as_received) scale = 100.0 / (100.0 - r.moisture_pct);
    if (r.basis == analysis_basis::daf) scale = (100.0 - r.ash_pct) / 100.0;
    ultimate_properties out;
    out.carbon_dry_pct = r.carbon_pct * scale;
    out.hydrogen_dry_pct = r.hydrogen_pct * scale;
    out.oxygen_dry_pct = r.oxygen_pct * scale;
    out.nitrogen_dry_pct = r.nitrogen_pct * scale;
    out.sulfur_dry_pct = r.sulfur_pct * scale;
    out.ash_dry_pct = r.basis == analysis_basis::daf ? r.ash_pct : r.ash_pct * scale;
    auto& fuel = out.as_received;
    if (r.measured_hhv_dry_mj_per_kg) {
        require_finite(*r.measured_hhv_dry_mj_per_kg, "/hhv_dry_mj_per_kg", "the measured HHV");
        if (*r.measured_hhv_dry_mj_per_kg <= 0)
            throw input_error("/hhv_dry_mj_per_kg", "the measured HHV must be > 0, got " +
                                                        format_number(*r.measured_hhv_dry_mj_per_kg));
        out.hhv_dry_mj_per_kg = *r.measured_hhv_dry_mj_per_kg;
        fuel.sources.push_back({"user", "measured HHV (dry) = " + format_number(out.hhv_dry_mj_per_kg) + " MJ/kg",
                                "given in the request"});
    } else {
        out.hhv_dry_mj_per_kg = channiwala_parikh_hhv_mj_per_kg(out.carbon_dry_pct, out.hydrogen_dry_pct,
                                                                out.sulfur_dry_pct, out.oxygen_dry_pct,
                                                                out.nitrogen_dry_pct, out.ash_dry_pct);
        fuel.sources.push_back({"correlation",
                                "HHV = 0.3491 C + 1.1783 H + 0.1005 S - 0.1034 O - 0.0151 N - 0.0211 ash (MJ/kg, wt % dry)",
                                "S. A. Channiwala, P. P. Parikh, A unified correlation for estimating HHV of solid, "
                                "liquid and gaseous fuels, Fuel 81 (2002) 1051-1063, eq. 3 (from memory)"});
        const struct { const char* name; double value, low, high; } ranges[] = {
            {"C", out.carbon_dry_pct, 0, 92.25},  {"H", out.hydrogen_dry_pct, 0.43, 25.15},
            {"O", out.oxygen_dry_pct, 0, 50.0},   {"N", out.nitrogen_dry_pct, 0, 5.6},
            {"S", out.sulfur_dry_pct, 0, 94.08},  {"ash", out.ash_dry_pct, 0, 71.4}};
        for (const auto& range : ranges)
            if (range.value < range.low || range.value > range.high)
                fuel.warnings.push_back(std::string(range.name) + " = " + format_number(range.value) +
                                        " wt % (dry) lies outside the range the correlation was fitted on (" +
                                        format_number(range.low) + " to " + format_number(range.high) + ")");
        if (!(out.hhv_dry_mj_per_kg > 0))
            throw input_error("/ultimate", "the correlation gives no heating value (" +
                                               format_number(out.hhv_dry_mj_per_kg) + " MJ/kg); check the analysis");
    }
    const double water_molar_mass = molar_mass_g_per_mol(parse_formula("H2O"));
    const double latent_mj_per_kg = water_latent_heat_kj_per_mol() / water_molar_mass;
    const double water_per_kg_dry = out.hydrogen_dry_pct / 100.0 * water_molar_mass / (2 * atomic_weight("H"));
    out.lhv_dry_mj_per_kg = out.hhv_dry_mj_per_kg - latent_mj_per_kg * water_per_kg_dry;
    const double m = r.moisture_pct / 100.0;
    fuel.hhv_mj_per_kg = out.hhv_dry_mj_per_kg * (1 - m);
    fuel.lhv_mj_per_kg = out.lhv_dry_mj_per_kg * (1 - m) - latent_mj_per_kg * m;
    if (out.ash_dry_pct < 100) {
        out.hhv_daf_mj_per_kg = out.hhv_dry_mj_per_kg * 100.0 / (100.0 - out.ash_dry_pct);
        out.lhv_daf_mj_per_kg = out.lhv_dry_mj_per_kg * 100.0 / (100.0 - out.ash_dry_pct);
    }
    // Atoms per kg of dry fuel [mol/kg] for stoichiometry.
    composition per_kg_dry;
    per_kg_dry["C"] = out.carbon_dry_pct * 10.0 / atomic_weight("C");
    per_kg_dry["H"] = out.hydrogen_dry_pct * 10.0 / atomic_weight("H");
    per_kg_dry["O"] = out.oxygen_dry_pct * 10.0 / atomic_weight("O");
    per_kg_dry["N"] = out.nitrogen_dry_pct * 10.0 / atomic_weight("N");
    per_kg_dry["S"] = out.sulfur_dry_pct * 10.0 / atomic_weight("S");
    const auto s = combustion_of(per_kg_dry);
    const double o2_molar_mass = 2 * atomic_weight("O");
    const double o2_mol_per_kg = std::max(0.0, s.o2_mol) * (1 - m);
    fuel.stoich_o2_kg_per_kg = o2_mol_per_kg * o2_molar_mass / 1000.0;
    fuel.stoich_air_kg_per_kg = o2_mol_per_kg / air_o2_mole_fraction * air_molar_mass_g_per_mol / 1000.0;
    fuel.co2_kg_per_kg = s.co2_mol * (1 - m) * (atomic_weight("C") + o2_molar_mass) / 1000.0;
    fuel.water_formed_kg_per_kg = water_per_kg_dry * (1 - m) + m;
    // Equation per carbon atom: CHxOyNzSw.
    if (per_kg_dry["C"] > 0) {
        composition per_carbon;
        add_scaled(per_carbon, per_kg_dry, 1.0 / per_kg_dry["C"]);
        const auto sc = combustion_of(per_carbon);
        std::string label = "C";
        for (const char* symbol : {"H", "O", "N", "S"})
            if (per_carbon[symbol] > 5e-5) label += std::string(symbol) + count_text(per_carbon[symbol]);
        out.as_received.equation = equation_text({{1.0, label}}, sc) + " (per carbon atom of the dry fuel)";
    }
    fuel.sources.push_back({"latent heat of water", format_number(latent_mj_per_kg) + " MJ/kg at 25 degC",
                            "dHf(H2O,g) - dHf(H2O,l) from data/species.json (CODATA)"});
    fuel.sources.push_back({"dry air", "O2 mole fraction 0.209476, 28.9644 g/mol", air_citation});
    fuel.sources.push_back({"elements.json", atomic_weight_edition(), "IUPAC CIAAW standard atomic weights"});
    fuel.basis_note = std::string("ultimate analysis on a ") + basis_text +
                      " basis; results as received with " + format_number(r.moisture_pct) +
                      " wt % moisture: HHV_ar = HHV_dry x (1 - M), LHV_ar = LHV_dry x (1 - M) - " +
                      format_number(latent_mj_per_kg) + " MJ/kg x M";
    return out;
}

}  // namespace fw

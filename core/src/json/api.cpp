// JSON entry points for heating values and unit conversion.
#include "fw/api.hpp"

#include <cmath>
#include <nlohmann/json.hpp>

#include "thermo/combustion.hpp"
#include "json/json_fields.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

ultimate_request parse_ultimate(const json& request, std::vector<issue>& warnings) {
    auto out = read_ultimate_analysis(request, "");
    out.measured_hhv_dry_mj_per_kg = optional_number(request, "hhv_dry_mj_per_kg", "");
    warn_unknown_keys(request, {"ultimate", "moisture", "basis", "hhv_dry_mj_per_kg"}, "", warnings);
    return out;
}

/// [kg CO2 / MMBtu HHV] from kg CO2 / kg and MJ/kg; 1 MMBtu = 1055.05585262 MJ.
double co2_per_mmbtu(double co2_kg_per_kg, double hhv_mj_per_kg) {
    const double mj_per_mmbtu = constants::joule_per_btu;  // 10^6 Btu x J/Btu / 10^6 J/MJ
    return co2_kg_per_kg / hhv_mj_per_kg * mj_per_mmbtu;
}

json properties_json(const fuel_properties& p, std::vector<issue>& warnings) {
    json out;
    if (p.hhv_kj_per_mol) {
        out["hhv_kj_per_mol"] = *p.hhv_kj_per_mol;
        out["lhv_kj_per_mol"] = *p.lhv_kj_per_mol;
    }
    if (p.molar_mass_g_per_mol) out["molar_mass_g_per_mol"] = *p.molar_mass_g_per_mol;
    out["hhv_mj_per_kg"] = p.hhv_mj_per_kg;
    out["lhv_mj_per_kg"] = p.lhv_mj_per_kg;
    out["hhv_btu_per_lb"] = p.hhv_mj_per_kg * 1e6 * constants::kg_per_pound / constants::joule_per_btu;
    if (p.hhv_mj_per_m3 && p.reference) {
        out["hhv_mj_per_m3"] = *p.hhv_mj_per_m3;
        out["lhv_mj_per_m3"] = *p.lhv_mj_per_m3;
        const double btu_per_ft3 = 1e6 * constants::m3_per_cubic_foot / constants::joule_per_btu;
        out["hhv_btu_per_ft3"] = *p.hhv_mj_per_m3 * btu_per_ft3;
        out["lhv_btu_per_ft3"] = *p.lhv_mj_per_m3 * btu_per_ft3;
        out["reference"] = {{"id", p.reference->id},
                            {"temperature_k", p.reference->temperature_k},
                            {"pressure_kpa", p.reference->pressure_pa / 1000.0},
                            {"description", p.reference->description},
                            {"ideal_gas", true},
                            {"combustion_temperature_c", 25}};
    }
    out["hhv_lhv_ratio"] = p.hhv_mj_per_kg / p.lhv_mj_per_kg;
    out["stoich_o2_kg_per_kg"] = p.stoich_o2_kg_per_kg;
    out["stoich_air_kg_per_kg"] = p.stoich_air_kg_per_kg;
    out["co2_kg_per_kg"] = p.co2_kg_per_kg;
    out["co2_kg_per_mmbtu_hhv"] = co2_per_mmbtu(p.co2_kg_per_kg, p.hhv_mj_per_kg);
    out["co2_kg_per_gj_hhv"] = p.co2_kg_per_kg / p.hhv_mj_per_kg * 1000.0;
    out["water_formed_kg_per_kg"] = p.water_formed_kg_per_kg;
    out["equation"] = p.equation;
    out["basis"] = p.basis_note;
    out["sources"] = sources_json(p.sources);
    for (const auto& text : p.warnings) warnings.push_back({"", text});
    return out;
}

json heating_value(const json& request, std::vector<issue>& warnings) {
    require_object(request, "");
    const int kinds = int(request.contains("formula")) + int(request.contains("mixture")) + int(request.contains("ultimate"));
    if (kinds != 1)
        throw input_error("", kinds == 0 ? "give one of \"formula\", \"mixture\" or \"ultimate\""
                                         : "give only one of \"formula\", \"mixture\" or \"ultimate\"");
    const auto reference = optional_string(request, "reference", "").value_or("15C");
    find_reference(reference, "/reference");
    if (request.contains("formula")) {
        compound_request compound;
        compound.formula = optional_string(request, "formula", "").value();
        if (const auto state = optional_string(request, "phase", "")) compound.state = parse_phase(*state, "/phase");
        compound.dhf_kj_per_mol = optional_number(request, "dhf_kj_per_mol", "");
        compound.hhv_kj_per_mol = optional_number(request, "hhv_kj_per_mol", "");
        compound.reference = reference;
        warn_unknown_keys(request, {"formula", "phase", "reference", "dhf_kj_per_mol", "hhv_kj_per_mol"}, "", warnings);
        auto out = properties_json(analyse_compound(compound), warnings);
        out["input"] = {{"formula", compound.formula}};
        return out;
    }
    if (request.contains("mixture")) {
        mixture_request mixture;
        mixture.components = read_mixture_components(request.at("mixture"), "/mixture");
        const auto basis = optional_string(request, "fractions", "").value_or("mole");
        if (basis == "mole") mixture.basis = fraction_basis::mole;
        else if (basis == "mass") mixture.basis = fraction_basis::mass;
        else throw input_error("/fractions", "unknown fraction basis \"" + basis + "\"; accepted: mole, mass");
        mixture.normalise = optional_bool(request, "normalise", "").value_or(false);
        mixture.reference = reference;
        warn_unknown_keys(request, {"mixture", "fractions", "normalise", "reference"}, "", warnings);
        auto out = properties_json(analyse_mixture(mixture), warnings);
        out["input"] = {{"mixture", request.at("mixture")}, {"fractions", basis}};
        return out;
    }
    const auto ultimate = analyse_ultimate(parse_ultimate(request, warnings));
    auto out = properties_json(ultimate.as_received, warnings);
    out["hhv_dry_mj_per_kg"] = ultimate.hhv_dry_mj_per_kg;
    out["lhv_dry_mj_per_kg"] = ultimate.lhv_dry_mj_per_kg;
    if (ultimate.hhv_daf_mj_per_kg) {
        out["hhv_daf_mj_per_kg"] = *ultimate.hhv_daf_mj_per_kg;
        out["lhv_daf_mj_per_kg"] = *ultimate.lhv_daf_mj_per_kg;
    }
    out["dry_basis_pct"] = {{"C", ultimate.carbon_dry_pct},   {"H", ultimate.hydrogen_dry_pct},
                            {"O", ultimate.oxygen_dry_pct},   {"N", ultimate.nitrogen_dry_pct},
                            {"S", ultimate.sulfur_dry_pct},   {"ash", ultimate.ash_dry_pct}};
    out["moisture_pct"] = optional_number(request, "moisture", "").value_or(0.0);
    out["input"] = {{"ultimate", request.at("ultimate")}};
    return out;
}

}  // namespace

std::string heating_value_json(const std::string& request_json) noexcept {
    return guarded_entry(request_json, [](const json& request, std::vector<issue>& warnings) {
        return heating_value(request, warnings);
    });
}

std::string convert_json(const std::string& request_json) noexcept {
    try {
        const auto request = parse_request(request_json);
        require_object(request, "");
        const auto value = optional_number(request, "value", "");
        const auto from = optional_string(request, "from", "");
        const auto to = optional_string(request, "to", "");
        if (!value) throw input_error("/value", "is required (a number)");
        if (!from) throw input_error("/from", "is required (a unit)");
        if (!to) throw input_error("/to", "is required (a unit)");
        find_unit(*from, "/from");
        find_unit(*to, "/to");
        const double result = convert(*value, *from, *to, "/value");
        return dump_text(json{{"value", result}, {"unit", *to}});
    } catch (const input_error& error) {
        return error_response(error.issues());
    } catch (const std::exception& error) {
        return error_response({{"", std::string("internal error: ") + error.what()}});
    }
}

std::string units_json() noexcept {
    try {
        json out = json::object();
        for (const auto& unit : unit_table())
            out[std::string(dimension_name(unit.kind))].push_back(
                {{"name", unit.name}, {"definition", unit.definition}});
        return dump_text(out);
    } catch (...) {
        return error_response({{"", "internal error"}});
    }
}

}  // namespace fw

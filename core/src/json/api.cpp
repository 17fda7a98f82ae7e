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

std::vector<mixture_component> parse_mixture_text(const std::string& text) {
    std::vector<mixture_component> components;
    std::size_t start = 0;
    std::size_t index = 0;
    while (start <= text.size()) {
        const auto comma = text.find(',', start);
        const auto item = text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
        const std::string path = "/mixture/" + std::to_string(index);
        const auto colon = item.find(':');
        if (colon == std::string::npos || colon == 0 || colon + 1 == item.size())
            throw input_error(path, "component \"" + item + "\" is not of the form species:fraction (e.g. CH4:0.95)");
        components.push_back({item.substr(0, colon),
                              parse_number_text(item.substr(colon + 1), path, "fraction of " + item.substr(0, colon))});
        ++index;
        if (comma == std::string::npos) break;
        start = comma + 1;
    }
    return components;
}

std::vector<mixture_component> parse_mixture_value(const json& value) {
    if (value.is_string()) return parse_mixture_text(value.get<std::string>());
    std::vector<mixture_component> components;
    if (value.is_array()) {
        for (std::size_t i = 0; i < value.size(); ++i) {
            const std::string path = "/mixture/" + std::to_string(i);
            require_object(value[i], path);
            const auto species = optional_string(value[i], "species", path);
            const auto fraction = optional_number(value[i], "fraction", path);
            if (!species || !fraction) throw input_error(path, "needs \"species\" and \"fraction\"");
            components.push_back({*species, *fraction});
        }
        return components;
    }
    throw input_error("/mixture", "must be a string \"CH4:0.95,C2H6:0.03,N2:0.02\" or an array of {species, fraction}");
}

ultimate_request parse_ultimate(const json& request, std::vector<issue>& warnings) {
    ultimate_request out;
    const auto& value = request.at("ultimate");
    std::vector<std::pair<std::string, double>> items;
    if (value.is_string()) {
        const auto text = value.get<std::string>();
        std::size_t start = 0;
        while (start <= text.size()) {
            const auto comma = text.find(',', start);
            const auto item = text.substr(start, comma == std::string::npos ? std::string::npos : comma - start);
            const auto colon = item.find(':');
            if (colon == std::string::npos || colon == 0)
                throw input_error("/ultimate", "item \"" + item + "\" is not of the form element:wt% (e.g. C:50.2)");
            const auto key = item.substr(0, colon);
            items.push_back({key, parse_number_text(item.substr(colon + 1), "/ultimate/" + key, key)});
            if (comma == std::string::npos) break;
            start = comma + 1;
        }
    } else if (value.is_object()) {
        for (const auto& item : value.items()) {
            if (!item.value().is_number()) throw input_error("/ultimate/" + item.key(), "must be a number (wt %)");
            items.push_back({item.key(), item.value().get<double>()});
        }
    } else {
        throw input_error("/ultimate", "must be a string \"C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4\" or an object");
    }
    for (const auto& [key, number] : items) {
        double* target = key == "C" ? &out.carbon_pct : key == "H" ? &out.hydrogen_pct : key == "O" ? &out.oxygen_pct
                       : key == "N" ? &out.nitrogen_pct : key == "S" ? &out.sulfur_pct : key == "ash" ? &out.ash_pct
                                                                                                      : nullptr;
        if (!target) throw input_error("/ultimate/" + key, "unknown item \"" + key + "\"; accepted: C, H, O, N, S, ash");
        *target = number;
    }
    out.moisture_pct = optional_number(request, "moisture", "").value_or(0.0);
    const auto basis = optional_string(request, "basis", "").value_or("dry");
    if (basis == "dry") out.basis = analysis_basis::dry;
    else if (basis == "as-received") out.basis = analysis_basis::as_received;
    else if (basis == "daf") out.basis = analysis_basis::daf;
    else throw input_error("/basis", "unknown basis \"" + basis + "\"; accepted: dry, as-received, daf");
    out.measured_hhv_dry_mj_per_kg = optional_number(request, "hhv_dry_mj_per_kg", "");
    warn_unknown_keys(request, {"ultimate", "moisture", "basis", "hhv_dry_mj_per_kg"}, "", warnings);
    return out;
}

json sources_json(const std::vector<source_note>& notes) {
    auto list = json::array();
    for (const auto& note : notes)
        list.push_back({{"record", note.record}, {"value", note.value}, {"citation", note.citation}});
    return list;
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
        mixture.components = parse_mixture_value(request.at("mixture"));
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
        return error_response({{error.path(), error.message()}});
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

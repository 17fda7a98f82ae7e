#include "thermo/species.hpp"

#include <algorithm>
#include <nlohmann/json.hpp>

#include "base/embedded_data.hpp"
#include "base/error.hpp"

namespace fw {

std::string_view phase_name(phase state) {
    switch (state) {
        case phase::gas: return "gas";
        case phase::liquid: return "liquid";
        case phase::solid: return "solid";
    }
    return "gas";
}

phase parse_phase(std::string_view text, const std::string& path) {
    if (text == "gas") return phase::gas;
    if (text == "liquid") return phase::liquid;
    if (text == "solid") return phase::solid;
    throw input_error(path, "unknown phase \"" + std::string(text) + "\"; accepted: gas, liquid, solid");
}

const std::vector<species_record>& species_table() {
    static const std::vector<species_record> table = [] {
        std::vector<species_record> records;
        const auto doc = nlohmann::json::parse(detail::embedded_file("species.json"));
        const auto& citations = doc.at("sources");
        for (const auto& item : doc.at("species")) {
            species_record record;
            record.id = item.at("id").get<std::string>();
            record.name = item.at("name").get<std::string>();
            record.formula = item.at("formula").get<std::string>();
            record.state = parse_phase(item.at("phase").get<std::string>());
            record.dhf_kj_per_mol = item.at("dhf_kj_per_mol").get<double>();
            if (item.contains("dhf_uncertainty_kj_per_mol"))
                record.dhf_uncertainty_kj_per_mol = item.at("dhf_uncertainty_kj_per_mol").get<double>();
            record.source_key = item.at("source").get<std::string>();
            const auto key_end = record.source_key.find_first_of(" ,(");
            const auto key = record.source_key.substr(0, key_end);
            record.source = citations.contains(key) ? citations.at(key).get<std::string>() : std::string();
            if (key_end != std::string::npos) record.source += " [" + record.source_key + "]";
            record.stored_molar_mass_g_per_mol = item.at("molar_mass_g_per_mol").get<double>();
            record.atoms = parse_formula(record.formula);
            records.push_back(std::move(record));
        }
        return records;
    }();
    return table;
}

static std::string phases_of(const std::vector<const species_record*>& records) {
    std::string list;
    for (const auto* record : records) list += (list.empty() ? "" : ", ") + std::string(phase_name(record->state));
    return list;
}

const species_record* find_species(std::string_view text, std::optional<phase> wanted, const std::string& path) {
    std::vector<const species_record*> matches;
    for (const auto& record : species_table())
        if (record.id == text) matches.push_back(&record);
    if (matches.empty()) {
        const auto atoms = parse_formula(text, path);
        for (const auto& record : species_table())
            if (record.atoms == atoms) matches.push_back(&record);
        std::vector<std::string> ids;
        for (const auto* record : matches)
            if (std::find(ids.begin(), ids.end(), record->id) == ids.end()) ids.push_back(record->id);
        if (ids.size() > 1) {
            std::string list;
            for (const auto& id : ids) list += (list.empty() ? "" : ", ") + id;
            throw input_error(path, "formula \"" + std::string(text) + "\" matches several species: " + list +
                                        "; give one of these ids");
        }
    }
    if (matches.empty()) return nullptr;
    if (wanted) {
        for (const auto* record : matches)
            if (record->state == *wanted) return record;
        throw input_error(path, "species " + matches.front()->id + " has no " + std::string(phase_name(*wanted)) +
                                    " record in data/species.json; phases there: " + phases_of(matches));
    }
    for (const auto* record : matches)
        if (record->state == phase::gas) return record;
    return matches.front();
}

const species_record& species_by_id(std::string_view id, phase state) {
    for (const auto& record : species_table())
        if (record.id == id && record.state == state) return record;
    throw input_error("", "data/species.json lacks " + std::string(id) + " (" + std::string(phase_name(state)) + ")");
}

}  // namespace fw

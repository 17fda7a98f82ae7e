#include "json/json_fields.hpp"

#include <cerrno>
#include <cmath>
#include <cstdlib>

namespace fw::json_fields {

nlohmann::json parse_request(const std::string& text) {
    if (text.size() > max_request_bytes)
        throw input_error("", "the request is " + std::to_string(text.size()) + " bytes; at most " +
                                  std::to_string(max_request_bytes) + " are accepted");
    try {
        return nlohmann::json::parse(text);
    } catch (const nlohmann::json::parse_error& error) {
        std::string what = error.what();
        const auto bracket = what.find("] ");
        if (bracket != std::string::npos) what = what.substr(bracket + 2);
        throw input_error("", "malformed JSON: " + what);
    }
}

struct non_finite {
    std::string path;  ///< JSON pointer below the walked value
    double value;
};

/// The first non-finite number under `value`, if any; the path is built only on the way back from a
/// find, so a clean walk allocates nothing.
static std::optional<non_finite> first_non_finite(const nlohmann::json& value) {
    if (value.is_number_float()) {
        if (!std::isfinite(value.get<double>())) return non_finite{"", value.get<double>()};
    } else if (value.is_object()) {
        for (auto it = value.begin(); it != value.end(); ++it)
            if (auto below = first_non_finite(it.value())) return non_finite{"/" + it.key() + below->path, below->value};
    } else if (value.is_array()) {
        for (std::size_t i = 0; i < value.size(); ++i)
            if (auto below = first_non_finite(value[i])) return non_finite{"/" + std::to_string(i) + below->path, below->value};
    }
    return std::nullopt;
}

void require_finite_output(const nlohmann::json& value) {
    if (const auto bad = first_non_finite(value))
        throw input_error(bad->path, "internal error: a result came out as " + format_number(bad->value) +
                                         "; please report the scenario");
}

void require_object(const nlohmann::json& value, const std::string& path) {
    if (!value.is_object()) throw input_error(path, "must be a JSON object, got " + std::string(value.type_name()));
}

std::optional<double> optional_number(const nlohmann::json& obj, const std::string& key, const std::string& path) {
    if (!obj.contains(key)) return std::nullopt;
    const auto& value = obj.at(key);
    if (!value.is_number()) throw input_error(path + "/" + key, "must be a number, got " + std::string(value.type_name()));
    const double number = value.get<double>();
    if (!std::isfinite(number)) throw input_error(path + "/" + key, "must be a finite number");
    return number;
}

std::optional<std::string> optional_string(const nlohmann::json& obj, const std::string& key,
                                           const std::string& path) {
    if (!obj.contains(key)) return std::nullopt;
    const auto& value = obj.at(key);
    if (!value.is_string()) throw input_error(path + "/" + key, "must be a string, got " + std::string(value.type_name()));
    return value.get<std::string>();
}

std::optional<bool> optional_bool(const nlohmann::json& obj, const std::string& key, const std::string& path) {
    if (!obj.contains(key)) return std::nullopt;
    const auto& value = obj.at(key);
    if (!value.is_boolean())
        throw input_error(path + "/" + key, "must be true or false, got " + std::string(value.type_name()));
    return value.get<bool>();
}

double quantity_in(const nlohmann::json& obj, const std::string& path, dimension kind, const std::string& to) {
    require_object(obj, path);
    const auto value = optional_number(obj, "value", path);
    const auto unit = optional_string(obj, "unit", path);
    const std::string article = kind == dimension::energy ? "an " : "a ";
    const std::string what = article + std::string(dimension_name(kind)) + " unit";
    if (!value) throw input_error(path + "/value", "is required (a number)");
    if (!unit) throw input_error(path + "/unit", "is required (" + what + ": " + accepted_units(kind) + ")");
    if (find_unit(*unit, path + "/unit").kind != kind)
        throw input_error(path + "/unit", "must be " + what + ": " + accepted_units(kind));
    return convert(*value, *unit, to, path + "/value");
}

double parse_number_text(const std::string& text, const std::string& path, const std::string& what) {
    const char* begin = text.c_str();
    char* end = nullptr;
    errno = 0;
    const double value = std::strtod(begin, &end);
    const bool whole = end != begin && *end == '\0';
    const bool plain = text.find_first_of("xXnNiI") == std::string::npos;  // no hex, nan or inf spellings
    if (!whole || !plain || errno == ERANGE || !std::isfinite(value))
        throw input_error(path, what + " must be a finite decimal number, got \"" + text + "\"");
    return value;
}

void warn_unknown_keys(const nlohmann::json& obj, const std::vector<std::string>& known, const std::string& path,
                       std::vector<issue>& warnings) {
    for (const auto& item : obj.items()) {
        bool found = false;
        for (const auto& key : known) found = found || key == item.key();
        if (!found) warnings.push_back({path + "/" + item.key(), "unknown field, ignored"});
    }
}

nlohmann::json issues_json(const std::vector<issue>& items) {
    auto list = nlohmann::json::array();
    for (const auto& item : items) list.push_back({{"path", item.path}, {"message", item.message}});
    return list;
}

std::string dump_text(const nlohmann::json& value) {
    return value.dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
}

std::string error_response(const std::vector<issue>& errors) {
    return dump_text(nlohmann::json{{"errors", issues_json(errors)}, {"warnings", nlohmann::json::array()}});
}

double required_number(const nlohmann::json& obj, const std::string& key, const std::string& path) {
    const auto value = optional_number(obj, key, path);
    if (!value) throw input_error(path + "/" + key, "is required (a number)");
    return *value;
}

std::string required_string(const nlohmann::json& obj, const std::string& key, const std::string& path) {
    const auto value = optional_string(obj, key, path);
    if (!value || value->empty()) throw input_error(path + "/" + key, "is required (text)");
    return *value;
}

std::vector<std::pair<std::string, double>> read_name_number_list(const std::string& text, const std::string& path,
                                                                  const std::string& noun, const std::string& form,
                                                                  const std::string& number_prefix) {
    std::vector<std::pair<std::string, double>> out;
    std::size_t start = 0, index = 0;
    while (start <= text.size()) {
        auto comma = text.find(',', start);
        if (comma == std::string::npos) comma = text.size();
        const auto item = text.substr(start, comma - start);
        const auto colon = item.find(':');
        const std::string item_path = path + "/" + std::to_string(index);
        if (colon == std::string::npos || colon == 0 || colon + 1 == item.size())
            throw input_error(item_path, noun + " \"" + item + "\" is not of the form " + form);
        const auto name = item.substr(0, colon);
        out.push_back({name, parse_number_text(item.substr(colon + 1), item_path, number_prefix + name)});
        start = comma + 1;
        ++index;
    }
    return out;
}

std::vector<mixture_component> read_mixture_components(const nlohmann::json& value, const std::string& path) {
    std::vector<mixture_component> components;
    if (value.is_string()) {
        for (const auto& [name, fraction] :
             read_name_number_list(value.get<std::string>(), path, "component", "species:fraction (e.g. CH4:0.95)", "fraction of "))
            components.push_back({name, fraction});
        return components;
    }
    if (!value.is_array())
        throw input_error(path, "must be a string \"CH4:0.95,C2H6:0.03,N2:0.02\" or an array of {species, fraction}");
    for (std::size_t i = 0; i < value.size(); ++i) {
        const std::string item_path = path + "/" + std::to_string(i);
        require_object(value[i], item_path);
        const auto species = optional_string(value[i], "species", item_path);
        const auto fraction = optional_number(value[i], "fraction", item_path);
        if (!species || !fraction) throw input_error(item_path, "needs \"species\" and \"fraction\"");
        components.push_back({*species, *fraction});
    }
    return components;
}

ultimate_request read_ultimate_analysis(const nlohmann::json& holder, const std::string& path) {
    const std::string at = path + "/ultimate";
    const auto& value = holder.at("ultimate");
    std::vector<std::pair<std::string, double>> items;
    if (value.is_string()) {
        items = read_name_number_list(value.get<std::string>(), at, "item", "element:wt% (e.g. C:50.2)", "");
    } else if (value.is_object()) {
        for (const auto& item : value.items()) {
            if (!item.value().is_number()) throw input_error(at + "/" + item.key(), "must be a number (wt %)");
            items.push_back({item.key(), item.value().get<double>()});
        }
    } else {
        throw input_error(at, "must be a string \"C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4\" or an object");
    }
    ultimate_request out;
    for (const auto& [key, number] : items) {
        double* target = key == "C" ? &out.carbon_pct : key == "H" ? &out.hydrogen_pct : key == "O" ? &out.oxygen_pct
                       : key == "N" ? &out.nitrogen_pct : key == "S" ? &out.sulfur_pct : key == "ash" ? &out.ash_pct
                                                                                                      : nullptr;
        if (!target) throw input_error(at + "/" + key, "unknown item \"" + key + "\"; accepted: C, H, O, N, S, ash");
        *target = number;
    }
    out.moisture_pct = optional_number(holder, "moisture", path).value_or(0.0);
    const auto basis = optional_string(holder, "basis", path).value_or("dry");
    if (basis == "dry") out.basis = analysis_basis::dry;
    else if (basis == "as-received") out.basis = analysis_basis::as_received;
    else if (basis == "daf") out.basis = analysis_basis::daf;
    else throw input_error(path + "/basis", "unknown basis \"" + basis + "\"; accepted: dry, as-received, daf");
    return out;
}

nlohmann::json sources_json(const std::vector<source_note>& notes) {
    auto list = nlohmann::json::array();
    for (const auto& note : notes) list.push_back({{"record", note.record}, {"value", note.value}, {"citation", note.citation}});
    return list;
}

}  // namespace fw::json_fields

// Reading typed fields out of JSON requests with errors that name the field (used by the JSON
// entry points; lower layers never see JSON requests).
#pragma once
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <vector>

#include "base/error.hpp"
#include "base/units.hpp"
#include "thermo/combustion.hpp"

namespace fw::json_fields {

/// Parses request text; malformed JSON becomes an input_error naming line and column.
nlohmann::json parse_request(const std::string& text);

/// The value must be a JSON object (the whole request, or a nested one).
void require_object(const nlohmann::json& value, const std::string& path);

/// A finite number at obj[key], or nullopt when absent; throws when present but not a number.
std::optional<double> optional_number(const nlohmann::json& obj, const std::string& key, const std::string& path);

/// A string at obj[key], or nullopt when absent; throws when present but not a string.
std::optional<std::string> optional_string(const nlohmann::json& obj, const std::string& key, const std::string& path);

/// A boolean at obj[key], or nullopt when absent; throws when present but not a boolean.
std::optional<bool> optional_bool(const nlohmann::json& obj, const std::string& key, const std::string& path);

/// A {value, unit} quantity of `kind` converted to unit `to`; throws input_error naming the field.
double quantity_in(const nlohmann::json& obj, const std::string& path, dimension kind, const std::string& to);

/// Parses a whole string as a finite decimal number ("0.95", "-3e2"); throws input_error otherwise.
double parse_number_text(const std::string& text, const std::string& path, const std::string& what);

/// Warnings for keys of obj not in `known` ("/x: unknown field, ignored").
void warn_unknown_keys(const nlohmann::json& obj, const std::vector<std::string>& known, const std::string& path,
                       std::vector<issue>& warnings);

/// Largest request accepted [bytes]: a scenario with every option, bill and bin is far smaller.
inline constexpr std::size_t max_request_bytes = 4u << 20;

/// Throws input_error naming the first NaN or infinite number in `value` (a JSON pointer), so that
/// no result ever carries one (nlohmann would write it as null, silently).
void require_finite_output(const nlohmann::json& value);

/// JSON text of a result; bytes of user text that are not UTF-8 are written as U+FFFD, never thrown.
std::string dump_text(const nlohmann::json& value);

/// JSON array of {path, message}.
nlohmann::json issues_json(const std::vector<issue>& items);

/// {"errors": [{path, message}], "warnings": []} as text.
std::string error_response(const std::vector<issue>& errors);

/// Runs an entry point's `body(request, warnings)` on the parsed request text and returns its JSON
/// with errors[] and warnings[]; input errors and anything unexpected become errors[], never exceptions.
template <typename Body>
std::string guarded_entry(const std::string& request_text, Body body) noexcept {
    try {
        std::vector<issue> warnings;
        nlohmann::json out = body(parse_request(request_text), warnings);
        if (!out.contains("errors")) out["errors"] = nlohmann::json::array();
        if (!out.contains("warnings")) out["warnings"] = issues_json(warnings);
        require_finite_output(out);
        return dump_text(out);
    } catch (const input_error& error) {
        return error_response(error.issues());
    } catch (const std::exception& error) {
        return error_response({{"", std::string("internal error: ") + error.what()}});
    } catch (...) {
        return error_response({{"", "internal error"}});
    }
}

/// A number `key` of `obj` that must be there: refused at path/key as "is required (a number)".
double required_number(const nlohmann::json& obj, const std::string& key, const std::string& path);

/// A text `key` of `obj` that must be there and not be empty: refused at path/key as "is required (text)".
std::string required_string(const nlohmann::json& obj, const std::string& key, const std::string& path);

/// Runs `body`, and an input_error it throws becomes one of `errors` (at its path) instead of ending the reading.
template <typename Body>
void collect_errors(std::vector<issue>& errors, Body&& body) {
    try {
        body();
    } catch (const input_error& error) {
        errors.insert(errors.end(), error.issues().begin(), error.issues().end());
    }
}

/// A "name:number,name:number" list as pairs: an item not of that form is refused at `path`/index as
/// `noun` "item" is not of the form `form`; a number that does not read, at `path`/index, as
/// `number_prefix` + name.
std::vector<std::pair<std::string, double>> read_name_number_list(const std::string& text, const std::string& path,
                                                                  const std::string& noun, const std::string& form,
                                                                  const std::string& number_prefix);

/// A gas mixture's components at `path`: "CH4:0.95,C2H6:0.03,N2:0.02" or [{species, fraction}].
std::vector<mixture_component> read_mixture_components(const nlohmann::json& value, const std::string& path);

/// The ultimate analysis `holder` carries at `path`: its "ultimate" ("C:50.2,H:6.1,…" or {"C": 50.2, …} in wt %),
/// "moisture" (wt %, default 0) and "basis" (dry, as-received or daf; default dry).
ultimate_request read_ultimate_analysis(const nlohmann::json& holder, const std::string& path);

/// The data records a result used, as answers list them: [{record, value, citation}].
nlohmann::json sources_json(const std::vector<source_note>& notes);

}  // namespace fw::json_fields

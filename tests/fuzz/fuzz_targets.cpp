// libFuzzer targets for the inputs Fuelwright takes from customers and suppliers. One source,
// built once per target with FW_FUZZ_TARGET set (see tools/cmake/fuzz.cmake). Every entry point
// must return JSON with errors[] and never crash, hang or trip a sanitizer.
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <functional>
#include <nlohmann/json.hpp>
#include <string>

#include "fw/api.hpp"

namespace {

/// The output must be JSON with an errors array, whatever the input.
void require_errors_array(const std::string& output) {
    const auto result = nlohmann::json::parse(output, nullptr, false);
    if (result.is_discarded() || !result.is_object()) std::abort();
    if (result.contains("errors") && !result.at("errors").is_array()) std::abort();
}

/// JSON text of a string value (bytes that are not UTF-8 replaced).
std::string as_json_string(const std::string& text) {
    return nlohmann::json(text).dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
}

#if FW_FUZZ_TARGET == 5
/// Prints what went wrong and the entry point's output (for triage), then stops the run as a crash.
[[noreturn]] void fail(const char* entry, const char* why, const std::string& output) {
    std::fprintf(stderr, "\n%s: %s\n%.4000s\n", entry, why, output.c_str());
    std::abort();
}

/// Stops the run when the output is not a JSON object with an errors array, or when any error or
/// warning says "internal error": every input must yield a result or a message at its field.
nlohmann::json checked_output(const char* entry, const std::string& output) {
    const auto result = nlohmann::json::parse(output, nullptr, false);
    if (result.is_discarded() || !result.is_object()) fail(entry, "output is not a JSON object", output);
    if (!result.contains("errors") || !result.at("errors").is_array()) fail(entry, "no errors array", output);
    for (const char* list : {"errors", "warnings"}) {
        if (!result.contains(list)) continue;
        if (!result.at(list).is_array()) fail(entry, "warnings is not an array", output);
        for (const auto& item : result.at(list)) {
            if (!item.is_object() || !item.contains("path") || !item.contains("message") ||
                !item.at("path").is_string() || !item.at("message").is_string())
                fail(entry, "an issue is not {path, message}", output);
            if (item.at("message").get<std::string>().find("internal error") != std::string::npos)
                fail(entry, "internal error", output);
        }
    }
    return result;
}

/// Evaluates a scenario; one input in four that evaluates cleanly with two options or more also goes
/// through one of the break-even, sweep and tornado analyses on a pair of its options (each takes
/// several evaluations, so running all three on every input would cut the executions per second
/// several times). The choices follow from the input's hash, so a run is repeatable.
void check_scenario(const std::string& text) {
    const auto result = checked_output("evaluate_json", fw::evaluate_json(text));
    if (!result.at("errors").empty() || !result.contains("options") || result.at("options").size() < 2) return;
    const std::size_t hash = std::hash<std::string>{}(text);
    if (hash % 4 != 0) return;
    const auto scenario = nlohmann::json::parse(text, nullptr, false);
    if (scenario.is_discarded()) fail("evaluate_json", "gave a result for text that is not JSON", text);
    const auto& options = result.at("options");
    const std::size_t a = (hash / 4) % options.size();
    const std::size_t b = (a + 1 + (hash / 64) % (options.size() - 1)) % options.size();
    const char* kinds[] = {"price", "efficiency", "demand"};
    const std::string vary = kinds[(hash / 1024) % 3];
    const std::string basis = (hash / 8192) % 4 == 0 ? "life-cycle" : "annual";
    nlohmann::json request = {{"scenario", scenario}, {"vary", vary}, {"basis", basis}};
    if (vary != "demand" && (hash / 65536) % 2 == 0) request["of"] = options[b].at("id");
    switch ((hash / 131072) % 3) {
        case 0:
            request["a"] = options[a].at("id");
            request["b"] = options[b].at("id");
            checked_output("break_even_json", fw::break_even_json(request.dump()));
            break;
        case 1:
            request["points"] = 6;
            checked_output("sweep_json", fw::sweep_json(request.dump()));
            break;
        default:
            checked_output("tornado_json",
                           fw::tornado_json(nlohmann::json{{"scenario", scenario}, {"basis", basis}}.dump()));
    }
}
#endif

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const std::string text(reinterpret_cast<const char*>(data), size);
#if FW_FUZZ_TARGET == 1  // evaluate: whole scenarios
    require_errors_array(fw::evaluate_json(text));
#elif FW_FUZZ_TARGET == 2  // the formula parser
    require_errors_array(fw::heating_value_json("{\"formula\":" + as_json_string(text) + "}"));
#elif FW_FUZZ_TARGET == 3  // the mixture parser
    require_errors_array(fw::heating_value_json("{\"mixture\":" + as_json_string(text) + ",\"normalise\":true}"));
#elif FW_FUZZ_TARGET == 4  // supplier price files
    require_errors_array(fw::check_prices_json(text, "2026-12-01"));
#elif FW_FUZZ_TARGET == 5  // scenarios changed field by field (tests/fuzz/scenario_mutator.cpp), and the analyses
    check_scenario(text);
#else
#error "set FW_FUZZ_TARGET to 1..5"
#endif
    return 0;
}

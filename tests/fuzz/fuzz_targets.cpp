// libFuzzer targets for the inputs Fuelwright takes from customers and suppliers. One source,
// built once per target with FW_FUZZ_TARGET set (see tools/cmake/fuzz.cmake). Every entry point
// must return JSON with errors[] and never crash, hang or trip a sanitizer.
#include <cstddef>
#include <cstdint>
#include <cstdlib>
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

std::string as_json_string(const std::string& text) {
    return nlohmann::json(text).dump(-1, ' ', false, nlohmann::json::error_handler_t::replace);
}

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
#else
#error "set FW_FUZZ_TARGET to 1..4"
#endif
    return 0;
}

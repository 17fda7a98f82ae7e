// Embind glue: the only file that includes Emscripten headers. Each exported
// function takes and returns JSON text and forwards to a noexcept entry point
// of fw/api.hpp, so no C++ exception ever crosses into JavaScript; problems
// come back as {"errors": [{path, message}]}. The contract is in web/README.md.
#include <emscripten/bind.h>

#include <string>

#include "fw/api.hpp"

namespace {

std::string heating_value(const std::string& request) { return fw::heating_value_json(request); }
std::string convert(const std::string& request) { return fw::convert_json(request); }
std::string units() { return fw::units_json(); }
std::string evaluate(const std::string& scenario) { return fw::evaluate_json(scenario); }
std::string catalog() { return fw::catalog_json(); }
std::string climate(const std::string& request) { return fw::climate_json(request); }

}  // namespace

EMSCRIPTEN_BINDINGS(fuelwright_core) {
    emscripten::function("heatingValue", &heating_value);
    emscripten::function("convert", &convert);
    emscripten::function("units", &units);
    emscripten::function("evaluate", &evaluate);
    emscripten::function("catalog", &catalog);
    emscripten::function("climate", &climate);
}

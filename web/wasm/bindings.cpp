// Embind glue: the only file that includes Emscripten headers. Each exported
// function takes and returns JSON text and forwards to a noexcept entry point
// of fw/api.hpp, so no C++ exception ever crosses into JavaScript; problems
// come back as {"errors": [{path, message}]}. The contract is in web/README.md.
#include <emscripten/bind.h>
#include <emscripten/val.h>

#include <string>

#include "fw/api.hpp"

namespace {

std::string heating_value(const std::string& request) { return fw::heating_value_json(request); }
std::string convert(const std::string& request) { return fw::convert_json(request); }
std::string units() { return fw::units_json(); }
std::string evaluate(const std::string& scenario) { return fw::evaluate_json(scenario); }
std::string explain(const std::string& request) { return fw::explain_json(request); }
std::string catalog() { return fw::catalog_json(); }
std::string climate(const std::string& request) { return fw::climate_json(request); }
std::string break_even(const std::string& request) { return fw::break_even_json(request); }
std::string sweep(const std::string& request) { return fw::sweep_json(request); }
std::string tornado(const std::string& request) { return fw::tornado_json(request); }
std::string what_if(const std::string& request) { return fw::what_if_json(request); }
std::string check_prices(const std::string& text, const std::string& today) { return fw::check_prices_json(text, today); }
std::string weather(const std::string& request) { return fw::weather_json(request); }

/// evaluate with a JS progress callback: progress(fraction) is called about 100 times during a Monte
/// Carlo run; returning false cancels it (undefined or anything truthy carries on).
std::string evaluate_with_progress(const std::string& scenario, emscripten::val progress) {
    return fw::evaluate_json_with_progress(scenario, [&progress](double fraction) {
        const emscripten::val answer = progress(fraction);
        return answer.isUndefined() || answer.isNull() || answer.as<bool>();
    });
}

}  // namespace

EMSCRIPTEN_BINDINGS(fuelwright_core) {
    emscripten::function("heatingValue", &heating_value);
    emscripten::function("convert", &convert);
    emscripten::function("units", &units);
    emscripten::function("evaluate", &evaluate);
    emscripten::function("explain", &explain);
    emscripten::function("catalog", &catalog);
    emscripten::function("climate", &climate);
    emscripten::function("breakEven", &break_even);
    emscripten::function("sweep", &sweep);
    emscripten::function("tornado", &tornado);
    emscripten::function("whatIf", &what_if);
    emscripten::function("checkPrices", &check_prices);
    emscripten::function("weather", &weather);
    emscripten::function("evaluateWithProgress", &evaluate_with_progress);
}

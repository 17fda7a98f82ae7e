// Public JSON entry points of the Fuelwright core. Every function takes JSON
// text and returns JSON text, never throws, and reports problems in an
// "errors" array of {path, message}. The CLI and the WASM binding call these.
#pragma once
#include <string>

namespace fw {

/// Heating values of a formula, species id, gas mixture or ultimate analysis.
/// Request: {"formula": "CH4", "phase": "gas", "reference": "15C"}
///       or {"mixture": "CH4:0.95,C2H6:0.03,N2:0.02", "fractions": "mole", "normalise": false}
///       or {"ultimate": "C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4", "moisture": 20, "basis": "dry"}
std::string heating_value_json(const std::string& request_json) noexcept;

/// Unit conversion. Request: {"value": 1, "from": "therm", "to": "kWh"} -> {"value": 29.3…, "unit": "kWh"}
std::string convert_json(const std::string& request_json) noexcept;

/// The list of accepted unit spellings by dimension: {"energy": [...], ...}
std::string units_json() noexcept;

}  // namespace fw

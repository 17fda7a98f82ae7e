// Public JSON entry points of the Fuelwright core. Every function takes JSON
// text and returns JSON text, never throws, and reports problems in an
// "errors" array of {path, message}. The CLI and the WASM binding call these.
#pragma once
#include <functional>
#include <string>

namespace fw {

/// Heating values of a formula, species id, gas mixture or ultimate analysis.
/// Request: {"formula": "CH4", "phase": "gas", "reference": "15C"}
///       or {"mixture": "CH4:0.95,C2H6:0.03,N2:0.02", "fractions": "mole", "normalise": false}
///       or {"ultimate": "C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4", "moisture": 20, "basis": "dry"}
std::string heating_value_json(const std::string& request_json) noexcept;

/// Unit conversion. Request: {"value": 1, "from": "therm", "to": "kWh"} -> {"value": 29.3…, "unit": "kWh"}
std::string convert_json(const std::string& request_json) noexcept;

/// The list of accepted unit spellings by dimension: {"energy": [{name, definition}], ...}
std::string units_json() noexcept;

/// Evaluates a scenario (data/schema/scenario.schema.json): per option the fuel used in its sale
/// unit, annual cost, cost of useful heat and emissions; a ranking; errors[] and warnings[]. What the
/// scenario's "detail" list asks for comes too: "trace" (how each figure was worked out), "sources"
/// (the data records used), "bins" (heat pumps' and the climate's temperature bins), or "all".
std::string evaluate_json(const std::string& scenario_json) noexcept;

/// The full account of one option: {"scenario": {...}, "option": id} -> {"option": the option's answer
/// with trace, sources and bins, "demand" and "climate" with theirs, errors[], warnings[]}; without
/// "option", the heat need's account alone. The scenario's Monte Carlo is not run.
std::string explain_json(const std::string& request_json) noexcept;

/// evaluate_json with a progress callback for the Monte Carlo: called with the fraction done
/// (0..1) about 100 times; returning false cancels (the result then says so).
std::string evaluate_json_with_progress(const std::string& scenario_json,
                                        const std::function<bool(double)>& progress) noexcept;

/// Break-even between two options: {"scenario": {...}, "a": id, "b": id, "vary": "price"|"efficiency"|"demand",
/// "of": option or fuel id, "basis": "annual"|"life-cycle"} -> {"break_even": {value, unit} | null, "reason", ...}.
std::string break_even_json(const std::string& request_json) noexcept;

/// Costs of every option over a range of one input: {"scenario", "vary", "of", "from", "to", "points", "basis"}.
std::string sweep_json(const std::string& request_json) noexcept;

/// One what-if, fast enough to follow a slider: {"scenario", "vary": "price"|"efficiency"|"demand", "of", "value",
/// "basis"} -> every option's cost with the input at `value`, the ranking (cheapest first), and each option's
/// "saving" against the existing option when the scenario marks one.
std::string what_if_json(const std::string& request_json) noexcept;

/// Change in the winner's margin for -/+ `change` (default 0.2) on each price, efficiency and the demand.
std::string tornado_json(const std::string& request_json) noexcept;

/// A climate: monthly HDD, annual HDD, hourly bins and design temperatures in the input's unit.
/// Request: the climate object itself, or a scenario with a "climate".
std::string climate_json(const std::string& request_json) noexcept;

/// Checks a supplier price file (data/schema/supplier-prices.schema.json) and its domain rules;
/// `today` is "YYYY-MM-DD" (or empty to skip the expiry check).
std::string check_prices_json(const std::string& price_file_text, const std::string& today) noexcept;

/// Reads a weather file a user downloaded (daily or hourly CSV, or the TMY3 layout):
/// {"text": "...", "format": "daily"|"hourly" (optional), "unit": "degC"|"degF" (when the file does not
/// say), "columns": {"date", "time", "mean", "max", "min", "temperature"} (optional header names)} ->
/// {"format", "unit", "station", "first_date", "last_date", "days", "observed": {unit, daily_mean},
/// "climate": a scenario climate or null, "summary": {annual_hdd, design temperatures}, notes}.
std::string weather_json(const std::string& request_json) noexcept;

/// The fuel and system catalogs with heating values per sale unit, GWP sets and defaults.
std::string catalog_json() noexcept;

}  // namespace fw

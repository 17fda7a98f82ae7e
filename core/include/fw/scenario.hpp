// Scenarios (scenario layer): one house's heat need and the options to meet it, read from JSON,
// evaluated per option into fuel use, cost, cost of useful heat and emissions, with a trace.
#pragma once
#include <nlohmann/json.hpp>
#include <optional>
#include <string>
#include <vector>

#include "fw/error.hpp"
#include "fw/fuels.hpp"
#include "fw/systems.hpp"

namespace fw {

enum class unit_system { us, metric };

struct scenario_settings {
    unit_system units = unit_system::us;
    std::string currency = "USD";
    double electricity_co2e_kg_per_kwh = 0;
    bool electricity_factor_given = false;
    std::string gwp = "AR5";
};

struct fixed_charge {
    std::string label;
    double amount_per_year = 0;  ///< [currency/year]
    std::string text;            ///< as entered, for the trace
};

/// One option as parsed and resolved: the fuel record, the priced unit, the system.
struct scenario_option {
    std::string id;
    std::string label;
    fuel_record fuel;
    std::string price_unit;
    double price_per_unit = 0;      ///< [currency per price_unit]
    std::vector<fixed_charge> fixed_charges;
    system_request system;
    std::optional<std::string> system_catalog;
    sale_options sale;
    std::optional<double> heating_value_override_j;  ///< [J HHV per price_unit]
    std::string heating_value_override_text;
    std::optional<double> moisture_pct;
    std::string path;               ///< "/options/N"
};

struct scenario {
    scenario_settings settings;
    double annual_useful_heat_kwh = 0;
    std::string demand_method = "direct";
    std::vector<std::string> demand_trace;
    std::vector<scenario_option> options;
};

/// Per-option result (the names of the JSON result).
struct option_result {
    std::string id, label, fuel_id, fuel_name;
    double useful_heat_kwh = 0;
    double seasonal_efficiency_hhv = 0;
    double fuel_energy_hhv_kwh = 0;
    double fuel_quantity = 0;
    std::string fuel_unit;
    double hhv_kwh_per_unit = 0, lhv_kwh_per_unit = 0;
    double price_per_unit = 0;
    double energy_cost = 0, fixed_cost = 0, annual_cost = 0;
    double cost_per_useful_kwh = 0;
    double co2e_kg = 0, co2_fossil_kg = 0, co2_biogenic_kg = 0, ch4_kg = 0, n2o_kg = 0;
    std::vector<std::string> trace;
    std::vector<source_note> sources;
    std::vector<std::string> warnings;
};

/// Reads a scenario; problems go to `errors` (every one found, each with its JSON pointer), and
/// options with errors are left out of the returned scenario.
scenario read_scenario(const nlohmann::json& document, std::vector<issue>& errors, std::vector<issue>& warnings);

/// Evaluates one option of a scenario; throws input_error for an impossible combination.
option_result evaluate_option(const scenario& input, const scenario_option& option);

/// The cautions every verdict carries (estimates, venting and CO, licensed work, prices).
const std::vector<std::string>& cautions();

}  // namespace fw

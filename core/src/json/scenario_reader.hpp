// Scenario requests read from JSON (json layer): the climate, the observed days, the demand, an option
// and the whole scenario, each with its JSON pointer in every error.
#pragma once
#include <map>
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "model/scenario.hpp"

namespace fw {

/// Reads the climate object; throws input_error.
climate_info read_climate(const nlohmann::json& climate, std::vector<issue>& warnings);

/// At most this many observed days (20 years) in `demand.observed`.
inline constexpr std::size_t max_observed_days = 7320;

/// [degC] by day number: `demand.observed`, daily means or (max + min) / 2 of daily extremes.
std::map<long, double> read_observed(const nlohmann::json& observed, const std::string& path, std::vector<issue>& warnings);

/// Reads the demand object into the scenario (needs its climate and options for some methods).
void read_demand(const nlohmann::json& demand, scenario& out, const nlohmann::json& options_json,
                 std::vector<issue>& warnings);

/// A heating value as a bill or a utility states it ({value, unit: "Btu/ft3" | "therm/ccf" | "MJ/m3" | ...,
/// basis}), as J (HHV) per `target_unit` of the fuel, with the text for the trace.
struct given_heating_value {
    double hhv_j_per_unit = 0;
    std::string text;
};
given_heating_value read_given_heating_value(const nlohmann::json& hv, const std::string& path, const fuel_record& fuel,
                                             const std::string& target_unit, const sale_options& sale,
                                             std::vector<issue>& warnings);

/// A time-of-use price `schedule`: [{name, amount, hours: [[from, to], ...], days, months}], every hour of
/// the year in exactly one period (a clash or gap is reported at the period, with the hour).
price_schedule read_price_schedule(const nlohmann::json& list, const std::string& path, std::vector<issue>& warnings);

/// A water heater: {kind, fuel, uef | efficiency {value, rating}, location, standby_loss}.
water_heater_spec read_water_heater(const nlohmann::json& item, const std::string& path, std::vector<issue>& warnings);

/// The option's data read from JSON (also used for the fuel and system of a bills demand).
scenario_option read_option(const nlohmann::json& item, const std::string& path, std::vector<issue>& warnings);

/// Reads a scenario; problems go to `errors` (every one found, each with its JSON pointer), and
/// options with errors are left out of the returned scenario.
scenario read_scenario(const nlohmann::json& document, std::vector<issue>& errors, std::vector<issue>& warnings);

}  // namespace fw

// Heating systems (systems layer): data/systems.json, efficiency ratings and their conversion
// to one seasonal efficiency on the fuel's gross (HHV) basis.
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "supply/fuels.hpp"

namespace fw {

enum class system_kind { furnace, boiler, stove, electric_resistance, air_source_heat_pump, ground_source_heat_pump };
enum class efficiency_rating { afue, thermal, seasonal_gcv, seasonal_ncv, cop, scop, hspf, hspf2 };

std::string_view kind_name(system_kind kind);
system_kind parse_kind(const std::string& text, const std::string& path = "");
std::string_view rating_name(efficiency_rating rating);
efficiency_rating parse_rating(const std::string& text, const std::string& path = "");

bool is_heat_pump(system_kind kind);
bool burns_fuel(system_kind kind);

/// Whether a fuel burns as a fuel gas (natural gas, propane, a custom gas): what the fuel gas codes' altitude rule covers.
bool is_fuel_gas(const fuel_record& fuel);

/// [1] Input derating of a gas appliance at `elevation_ft` [ft]: none up to 2,000 ft, above it 4 % for each
/// 1,000 ft above sea level (NFPA 54 / ANSI Z223.1 National Fuel Gas Code, high-altitude input rating; from memory),
/// capped at 100 %. An appliance rated for altitude by its maker is not derated again.
double gas_altitude_derating(double elevation_ft);

struct rated_efficiency {
    double value;
    efficiency_rating rating;
    std::string source;
};

/// One record of data/systems.json.
struct system_record {
    std::string id;
    system_kind kind;
    std::string variant;
    std::vector<std::string> fuels;
    std::vector<efficiency_rating> ratings;
    rated_efficiency typical;
    rated_efficiency minimum;
    /// Auxiliary electricity of a typical unit: kWh a year, or W while the burner runs (`watts`); 0 for none.
    double auxiliary_value = 0;
    bool auxiliary_watts = false;
    std::string auxiliary_source;
    /// A typical unit's median service life [years] and its source (data/systems.json `service_life`).
    double service_life_years = 0;
    std::string service_life_source;
};

/// The catalog record a system of this kind and fuel most likely is: of those burning the fuel, the one
/// whose typical efficiency in the same rating is nearest `efficiency_value` (else the first), if any.
const system_record* typical_system_for(system_kind kind, const std::string& fuel_id, double efficiency_value,
                                        efficiency_rating rating);

const std::vector<system_record>& system_table();

/// The catalog system with this id; throws input_error listing the known ids.
const system_record& find_system(const std::string& id, const std::string& path = "");

/// A system as a scenario option describes it.
struct system_request {
    system_kind kind;
    double efficiency_value;
    efficiency_rating rating;
    double distribution_loss = 0;  ///< fraction of delivered heat lost in ducts or pipes outside the heated space
    double age_derating = 0;       ///< fraction by which the rated efficiency has fallen with age
};

/// Seasonal efficiency on the HHV basis (a fraction; a seasonal COP for heat pumps) with the steps taken.
struct seasonal_efficiency {
    double hhv_basis = 0;
    double rated_hhv_basis = 0;  ///< before distribution loss and age derating
    std::vector<std::string> trace;
    std::vector<std::string> warnings;
};

/// [Btu/Wh per W/W] HSPF to seasonal COP: 3.412 Btu per Wh (3412.14 Btu/kWh, exact from the Btu_IT).
inline constexpr double btu_per_wh = 3.41214163312794;

/// Converts a rating to the seasonal HHV-basis efficiency by the rating's own definition:
/// AFUE, thermal and seasonal-gcv are gross-basis percentages; seasonal-ncv x (LHV/HHV of the fuel);
/// COP and SCOP as they are; HSPF and HSPF2 / 3.412. Throws input_error for impossible values.
seasonal_efficiency seasonal_efficiency_hhv(const system_request& request, const fuel_record& fuel,
                                            const std::string& path);

}  // namespace fw

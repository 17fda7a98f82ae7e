// Scenarios (model layer): one house's heat need and the options to meet it as typed values (read from
// JSON in json/scenario_reader), evaluated per option into fuel use, cost, cost of useful heat and
// emissions, with a trace.
#pragma once
#include <cstdint>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "climate/climate.hpp"
#include "climate/demand.hpp"
#include "base/error.hpp"
#include "supply/fuels.hpp"
#include "climate/heat_pump.hpp"
#include "supply/systems.hpp"
#include "supply/water_heaters.hpp"
#include "model/tariff.hpp"

namespace fw {

enum class unit_system { us, metric };

struct fixed_charge {
    std::string label;
    double amount_per_year = 0;  ///< [currency/year]
    std::string text;            ///< as entered, for the trace
    std::string path;            ///< where it was entered ("/options/0/fixed_charges/1/amount_per_month")
};

/// A fuel whose service stays connected whatever heats the house (gas kept for a range and a water heater).
struct kept_service {
    std::string fuel_id;
    std::vector<fixed_charge> charges;
};

struct scenario_settings {
    unit_system units = unit_system::us;
    std::string currency = "USD";
    double electricity_co2e_kg_per_kwh = 0;
    bool electricity_factor_given = false;
    std::string gwp = "AR5";
    std::optional<double> electricity_price_per_kwh;  ///< [currency/kWh] `settings.electricity.price`
    std::optional<price_schedule> electricity_schedule;  ///< `settings.electricity.price.schedule`
    std::optional<double> elevation_m;                ///< [m] `settings.elevation`, the site above sea level
    std::optional<double> gas_pressure_base_pa;       ///< [Pa] `settings.gas_pressure_base`: the pressure gas volumes are metered at
    std::vector<kept_service> kept_services;          ///< `settings.kept_services`, and electricity's fixed charges
};

/// Scenario `economics`: rates are fractions per year on one basis (real or nominal).
struct economics_settings {
    int analysis_years = 15;
    double discount_rate = 0.03;
    double default_escalation = 0.0;
    std::map<std::string, double> escalation;  ///< by fuel id
    double maintenance_escalation = 0.0;
    std::string basis = "real";
    bool given = false;                        ///< false: defaults, stated in a warning
    double escalation_of(const std::string& fuel_id) const {
        const auto found = escalation.find(fuel_id);
        return found == escalation.end() ? default_escalation : found->second;
    }
};

/// Scenario `uncertainty`: Monte Carlo over fuel prices (and demand where the method gives an error).
struct uncertainty_settings {
    int draws = 10000;
    std::uint64_t seed = 1;
    double default_spread = 0.2;               ///< SD of ln(price factor); an assumption, stated
    std::map<std::string, double> spread;      ///< by fuel id
    bool triangular = false;                   ///< spread is then the half-width as a fraction
    double spread_of(const std::string& fuel_id) const {
        const auto found = spread.find(fuel_id);
        return found == spread.end() ? default_spread : found->second;
    }
};

/// One block of a tiered (block-rate) price: `amount` per unit for the annual quantity from `from` to `to`.
struct price_tier {
    double from = 0, to = 0;  ///< [price unit per year]; to = infinity for the last block
    double amount = 0;        ///< [currency per price unit]
};

/// One option as parsed and resolved: the fuel record, the priced unit, the system.
struct scenario_option {
    std::string id;
    std::string label;
    fuel_record fuel;
    std::string price_unit;
    double price_per_unit = 0;      ///< [currency per price_unit]; with tiers, the first block's
    std::vector<price_tier> tiers;  ///< block rates on the annual quantity (empty: one price)
    std::optional<price_schedule> schedule;  ///< electricity by time of use (then price_per_unit is its hours' mean)
    std::vector<fixed_charge> fixed_charges;
    system_request system;
    std::optional<std::string> system_catalog;
    sale_options sale;
    std::optional<double> heating_value_override_j;  ///< [J HHV per price_unit]
    std::string heating_value_override_text;
    std::optional<double> moisture_pct;
    bool efficiency_given = true;
    // Heat pumps on bins.
    std::vector<heat_pump_point> ratings;
    heat_pump_stages stages = heat_pump_stages::single;
    bool stages_given = false;
    std::optional<double> cutoff_c;
    double cd = default_cd;
    bool cd_given = false;
    std::string backup = "electric-resistance";  ///< or the id of another option (dual fuel)
    std::optional<double> changeover_c;
    bool changeover_optimal = false;
    std::optional<double> capacity_47_kw;  ///< heat pumps: capacity at 47 degF; other systems: output capacity
    /// Auxiliary electricity of a fuel-burning system: kWh a year (the E_ae rating) or W while the burner runs.
    struct auxiliary_spec {
        double value = 0;
        bool watts = false;
        std::string text;  ///< where it comes from, for the trace
    };
    std::optional<auxiliary_spec> auxiliary;
    bool altitude_rated = false;  ///< `system.altitude_rated`: no input derating at the site's elevation
    std::optional<water_heater_spec> water_heater;  ///< `water_heater`: replaces the house's for this option
    bool existing = false;
    double installed_cost = 0, incentives = 0, annual_maintenance = 0;  ///< [currency], [currency/year]
    std::optional<double> life_years;
    std::string path;               ///< "/options/N"
};

/// The scenario's climate, evaluated once: the model, its bins and design temperatures.
struct climate_info {
    climate_model model;
    bool fahrenheit = false;        ///< the input's temperature unit (results are given back in it)
    double base_c = 18.3;
    std::vector<temperature_bin> bins;  ///< 1 degC or 2 degF wide, or as given
    double bin_width_k = 1.0;           ///< [K]
    bool bins_from_data = false;        ///< bins given (observed hours) rather than from the model
    std::vector<bin_times> bins_when;   ///< observed bins: when each one's hours fell (one per bin, or none)
    double design_99_c = 0, design_996_c = 0;
    std::optional<double> given_design_c;
    std::optional<double> spread_factor;  ///< the spread's scale calibrated to the given design temperature
    std::vector<month_hour_hours> calendar;  ///< each bin's hours by month and hour of day (filled when a price has a schedule)
};

struct scenario {
    scenario_settings settings;
    std::optional<climate_info> climate;
    double annual_useful_heat_kwh = 0;  ///< space heat + hot water
    double space_heat_kwh = 0;
    double hot_water_kwh = 0;           ///< useful heat of water heating (`demand.water_heating`, or the older `demand.hot_water`)
    std::optional<water_heater_spec> water_heater;  ///< the house's water heater; none: each option's heating system makes hot water
    std::string demand_method = "direct";
    std::vector<std::string> demand_trace;
    std::optional<double> balance_point_c;  ///< for the heat-pump bins
    bool balance_point_defaulted = false;
    std::optional<double> ua_w_per_k;
    std::optional<double> design_heat_loss_kw;  ///< heat-loss method: the design heat loss as given
    std::optional<double> indoor_c;             ///< heat-loss method: the indoor temperature as given
    double fit_efficiency = 0;                  ///< bills method: the billed equipment's seasonal efficiency (HHV)
    std::optional<prism_fit> fit;
    std::string fit_unit;                   ///< energy unit of the fit's per-day figures
    std::optional<double> demand_uncertainty_kwh;  ///< standard error of the useful heat
    std::vector<scenario_option> options;
    std::optional<economics_settings> economics;
    std::optional<uncertainty_settings> uncertainty;
};

/// One service's share of an option's result (space heating or water heating): the totals are their sum.
struct service_result {
    double useful_heat_kwh = 0;     ///< [kWh/year] heat the service delivers
    std::string fuel_id, fuel_unit;  ///< the service's main fuel and its priced unit
    double fuel_quantity = 0;       ///< [fuel_unit/year]
    double annual_cost = 0;         ///< [currency/year] energy and the fixed charges that belong to it
    double fixed_cost = 0;          ///< [currency/year] of which fixed charges (a service kept for the water heater alone)
    double co2e_kg = 0;             ///< [kg/year]
    std::string made_by;            ///< water heating: the heater's kind, or "heating-system"
    double efficiency = 0;          ///< useful heat / site energy (HHV) of what makes it
    double extra_space_heat_kwh = 0;  ///< [kWh/year] water heating: heat a heat-pump water heater takes from the heated space
};

/// [currency/kWh] How an option's electricity is priced: one price, or a schedule (with where it comes from).
struct electricity_tariff {
    double price_per_kwh = 0;
    const price_schedule* schedule = nullptr;
    std::string text;
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
    /// Energy and fixed cost by fuel (a dual-fuel option has two), for escalation and price draws.
    struct cost_part {
        std::string fuel_id;
        double energy_cost;
        double fixed_cost;
    };
    std::vector<cost_part> cost_parts;
    // Heat pumps on bins (present when `season` is set).
    std::optional<heat_pump_season> season;
    double seasonal_cop = 0;
    double heat_pump_kwh = 0, backup_kwh = 0, backup_share = 0;
    std::optional<double> changeover_c;
    double balance_point_c = 0;
    double auxiliary_kwh = 0, auxiliary_cost = 0;  ///< a fuel-burning system's own electricity [kWh/yr, currency/yr]
    double kept_services_cost = 0;           ///< fixed charges of services the house keeps [currency/yr]
    double design_load_kw = 0;               ///< the house's load at the design temperature (bins' load line)
    double capacity_at_design_kw = 0;        ///< the heat pump's capacity there
    std::optional<double> capacity_balance_c;  ///< where the heat pump's capacity meets the load
    std::string backup_option;               ///< dual fuel: id of the backup option
    double backup_fuel_quantity = 0;
    std::string backup_fuel_unit;
    // Services and time of use.
    service_result space_heating, water_heating;
    double water_by_system_fuel_kwh = 0;     ///< [kWh HHV/year] the heating system's energy for hot water (it makes it)
    double water_by_system_cost = 0;         ///< [currency/year] its cost
    month_hour_kwh electricity_profile{};    ///< [kWh] the option's electricity by month and hour of day
    double electricity_kwh = 0;              ///< [kWh/year] all of the option's electricity
    std::vector<period_use> electricity_periods;  ///< by the schedule's periods, when its electricity has one
    std::optional<double> derated_output_kw;  ///< a gas appliance's output at the site's elevation
};

/// [currency/year] Cost of `quantity` price units a year at the option's price or block rates.
double priced_cost(const scenario_option& option, double quantity);

/// [currency/year] Cost of a year's electricity `kwh` used as `profile` (any scale: it is normalised) under a tariff:
/// by the schedule's periods when it has one, else kwh x the price.
double tariff_cost(const electricity_tariff& tariff, double kwh, const month_hour_kwh& profile);

/// The tariff of an option's own electricity (an electricity option), by its schedule or price.
electricity_tariff option_tariff(const scenario_option& option);

/// The site's electricity tariff for what a non-electric option uses (auxiliary electricity, an electric water
/// heater): `settings.electricity.price`, else the first electricity option's; nullopt when there is none.
std::optional<electricity_tariff> site_tariff(const scenario& input);

/// [kWh] `kwh` of space-heating energy placed in the hours the house needs heat: with a climate by the degree-hours
/// below the balance point of each bin's month-hours (the bin method's load line), without one evenly over the year.
month_hour_kwh space_heat_profile(const scenario& input, double kwh);

/// [kWh] The season's heat-pump electricity (and resistance backup when `with_backup`) x `scale` placed by each bin's month-hours.
month_hour_kwh bins_profile(const scenario& input, const heat_pump_season& season, double scale, bool with_backup);

/// [K] the balance point the bins use: the demand's, else 65 degF (US climate) or 18 degC.
double bins_balance_point_c(const scenario& input);

/// [1] Share of the year's hours the house needs heat (below the balance point); 0.5 without a climate (stated).
double heating_hours_share(const scenario& input);

/// Which systems make hot water (boilers, ground-source and electric-resistance systems) and which cannot
/// (furnaces, stoves, air-to-air heat pumps).
bool system_makes_hot_water(system_kind kind);

/// Adds the option's water heating (its own heater or the house's) to a result evaluated with the space
/// heating (and any hot water the heating system makes), and splits the result into its two services.
void add_water_heating(const scenario& input, const scenario_option& option, option_result& r);

/// The scenario as an option's heating system sees it: space heat plus what its water heater takes from the
/// heated space, and the hot water the system itself makes (none when the option has a heater of its own).
scenario heating_system_view(const scenario& input, const scenario_option& option);

/// The water heater an option uses: its own, else the house's; nullptr: the heating system makes the hot water.
const water_heater_spec* water_heater_of(const scenario& input, const scenario_option& option);

/// [kW] The house's heating load at the climate's design temperature, from what the demand was given:
/// the design heat loss as given; UA x (indoor - design); the bills fit's slope x efficiency x (tau - design)
/// / 24 h; or else the load line the bins use (space heat over the degree-hours below the balance point).
/// nullopt without a climate.
std::optional<double> house_design_load_kw(const scenario& input);

/// Energy as traces and messages say it: MMBtu to 2 decimals in a US scenario, whole kWh otherwise.
std::string energy_text(double kwh, unit_system units);

/// Evaluates one option of a scenario; throws input_error for an impossible combination.
option_result evaluate_option(const scenario& input, const scenario_option& option);

/// Emissions of burning `fuel_kwh_hhv` of a fuel [kg], with the arithmetic in words.
struct emissions {
    double co2e_kg = 0, co2_fossil_kg = 0, co2_biogenic_kg = 0, ch4_kg = 0, n2o_kg = 0;
    std::string text;
};
emissions emissions_of(const fuel_record& fuel, double fuel_kwh_hhv, const scenario_settings& settings);

/// An option's result with what it is and what it serves filled in (id, label, fuel, useful heat, price).
option_result result_for(const scenario& input, const scenario_option& option);

/// A heat-pump option on the climate's temperature bins (evaluate_option calls it when a climate is given).
option_result evaluate_heat_pump_option(const scenario& input, const scenario_option& option);

/// The cautions every verdict carries (estimates, venting and CO, licensed work, prices).
const std::vector<std::string>& cautions();

}  // namespace fw

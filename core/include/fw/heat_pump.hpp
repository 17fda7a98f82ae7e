// Heat pumps on temperature bins (climate/demand layer): capacity and COP interpolated between
// data-sheet points, part-load degradation, backup heat, cut-off and dual-fuel changeover
// (the bin method of ASHRAE and of the DOE test procedure, 10 CFR 430 Subpart B App. M/M1).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "fw/climate.hpp"

namespace fw {

/// One data-sheet point: outdoor temperature [degC], heating capacity [kW], COP [W/W].
struct heat_pump_point {
    double outdoor_c;
    double capacity_kw;
    double cop;
};

/// [1] Part-load degradation coefficient default (DOE Appendix M, AHRI 210/240: C_D = 0.25, from memory).
inline constexpr double default_cd = 0.25;

struct heat_pump_inputs {
    std::vector<heat_pump_point> points;   ///< at least two, any order
    double cd = default_cd;
    std::optional<double> cutoff_c;        ///< below this the compressor does not run
    std::optional<double> changeover_c;    ///< dual fuel: below this the backup carries the whole load
};

/// One bin's result; energies per year [kWh].
struct heat_pump_bin {
    double t_c, hours;
    double load_kw, capacity_kw, cop;
    double heat_pump_heat_kwh, heat_pump_kwh, backup_heat_kwh;
    bool extrapolated, off;
};

struct heat_pump_season {
    std::vector<heat_pump_bin> bins;
    double load_kwh = 0, heat_pump_heat_kwh = 0, heat_pump_kwh = 0, backup_heat_kwh = 0;
    double hours_below_balance_point = 0;
    double extrapolated_hours = 0;   ///< heating hours colder than the coldest data-sheet point
    double lowest_bin_cop = 0, highest_bin_cop = 0;
    /// [1] heat delivered / (compressor electricity + backup heat as resistance electricity)
    double seasonal_cop_with_resistance() const { return load_kwh / (heat_pump_kwh + backup_heat_kwh); }
    /// [1] heat the heat pump itself delivered / its electricity
    double heat_pump_cop() const { return heat_pump_kwh > 0 ? heat_pump_heat_kwh / heat_pump_kwh : 0.0; }
};

/// Capacity [kW] and COP at `t_c`, linear in temperature between points and beyond the end points
/// (COP not below 1, capacity not below 0); `extrapolated` tells whether t_c lay outside them.
heat_pump_point interpolate(const std::vector<heat_pump_point>& points, double t_c, bool& extrapolated);

/// Runs the bins: load L = ua_kw_per_k x (balance - T) below the balance point; X = min(1, L/Q);
/// PLF = 1 - C_D (1 - X); compressor energy X (Q/COP) hours / PLF; backup the rest.
heat_pump_season run_bins(const std::vector<temperature_bin>& bins, double ua_kw_per_k, double balance_point_c,
                          const heat_pump_inputs& inputs);

/// A default data sheet, normalised at 47 degF (8.33 degC): capacity 1.00 / 0.62 / 0.50 and COP
/// 1.00 / 0.66 / 0.55 at 47 / 17 / 5 degF (common practice for a single-speed split heat pump; no
/// product's data), with COP at 47 degF `cop_47` and capacity `capacity_47_kw`.
std::vector<heat_pump_point> default_points(double cop_47, double capacity_47_kw);

/// [1] Seasonal COP of a curve over the DOE Region IV heating bins with the test procedure's load
/// line BL = C (65 - T)/60 Q47, C = 0.77 (10 CFR 430 App. M, AHRI 210/240 Table 17 fractional
/// hours; from memory), no cut-off: HSPF / 3.412 of that curve.
double region_iv_seasonal_cop(const std::vector<heat_pump_point>& points);

/// The default curve whose Region IV seasonal COP equals `seasonal_cop` (HSPF / 3.412, or SCOP).
std::vector<heat_pump_point> default_points_for_seasonal_cop(double seasonal_cop, double capacity_47_kw);

}  // namespace fw

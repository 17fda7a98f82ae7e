// Heat pumps on temperature bins (climate/demand layer): capacity and COP interpolated between
// data-sheet points, part-load degradation, backup heat, cut-off and dual-fuel changeover
// (the bin method of ASHRAE and of the DOE test procedure, 10 CFR 430 Subpart B App. M/M1).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "climate/climate.hpp"

namespace fw {

/// One data-sheet point: outdoor temperature [degC], maximum heating capacity [kW] and its COP [W/W],
/// and for staged or variable-speed units the minimum capacity [kW] and its COP (0: not given).
struct heat_pump_point {
    double outdoor_c;
    double capacity_kw;
    double cop;
    double min_capacity_kw = 0;
    double min_cop = 0;
    bool added = false;  ///< added by the frost default, not on the data sheet
};

/// How the compressor meets part load: on/off at one capacity, two stages, or variable speed.
enum class heat_pump_stages { single, two, variable };

/// The rating procedures a seasonal heating rating comes from, each with its own load line and bins:
/// HSPF (10 CFR 430 Subpart B Appendix M; AHRI 210/240-2017), HSPF2 (Appendix M1; AHRI 210/240-2023),
/// SCOP (EN 14825, average climate).
enum class rating_procedure { hspf_appendix_m, hspf2_appendix_m1, scop_en14825 };

/// The procedure's name for traces.
const char* procedure_name(rating_procedure procedure);

/// [1] Part-load degradation coefficient default (DOE Appendix M, AHRI 210/240: C_D = 0.25, from memory).
inline constexpr double default_cd = 0.25;

struct heat_pump_inputs {
    std::vector<heat_pump_point> points;   ///< at least two, any order (frost default already applied)
    bool modulating = false;               ///< two-stage or variable: modulates down to the minimum capacity
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

/// Capacity [kW] and COP at `t_c` (and the minimum capacity and its COP where the points have them):
/// capacity and power linear in temperature between points and beyond the end points, as the DOE
/// procedure interpolates them (COP not below 1, capacity not below 0); `extrapolated` tells whether
/// t_c lay outside them.
heat_pump_point interpolate(const std::vector<heat_pump_point>& points, double t_c, bool& extrapolated);

/// The points with the rating procedure's frost default added where no point lies between 17 and
/// 45 degF: at 35 degF capacity x 0.90 and power x 0.985 of the straight 17-47 degF line; from 17 up to
/// 45 degF the line through 17 and that 35 degF point, from 45 degF the 17-47 line again (10 CFR 430
/// App. M/M1, AHRI 210/240 single-speed equations for 17 < Tj < 45 degF, from memory). Below a sheet's only point at or under 17 degF the 17-47 degF line goes on
/// (a point 10 degF lower is added on it). `applied` tells whether it was.
std::vector<heat_pump_point> with_frost_default(const std::vector<heat_pump_point>& points, bool& applied);

/// Runs the bins: load L = ua_kw_per_k x (balance - T) below the balance point. Single speed:
/// X = min(1, L/Q), PLF = 1 - C_D (1 - X), energy X (Q/COP) hours / PLF. Modulating: below the minimum
/// capacity it cycles there (same PLF with X = L/Q_min); between minimum and maximum its power is
/// linear in the heat delivered; above the maximum the backup takes the rest.
heat_pump_season run_bins(const std::vector<temperature_bin>& bins, double ua_kw_per_k, double balance_point_c,
                          const heat_pump_inputs& inputs);

/// [1] Seasonal COP (rating / 3.412 for HSPF and HSPF2, SCOP as it is) of a curve by a rating
/// procedure: HSPF, region IV bins, load line 0.77 (65 - T)/60 Q(47); HSPF2, region IV bins, load
/// line 1.15 (55 - T)/50 Q(47) (zero-load 55 degF; Q(47) standing for the cooling capacity a heating
/// rating uses); SCOP, the EN 14825 average-climate bins, load P_design (16 - T)/26 with the unit
/// meeting it at -7 degC. Frost default applied, C_D `cd`, no cut-out. Bin hours from memory.
double procedure_seasonal_cop(const std::vector<heat_pump_point>& points, rating_procedure procedure, double cd = default_cd,
                              bool modulating = false);

/// A default data sheet, normalised at 47 degF (8.33 degC): capacity 1.00 / 0.62 / 0.50 and COP
/// 1.00 / 0.66 / 0.55 at 47 / 17 / 5 degF (common practice for a single-speed split heat pump; no
/// product's data), with COP at 47 degF `cop_47` and capacity `capacity_47_kw`.
std::vector<heat_pump_point> default_points(double cop_47, double capacity_47_kw);

/// The default curve whose seasonal COP by `procedure` equals `seasonal_cop` (the rating / 3.412, or SCOP),
/// rated as the unit will run: with `min_share` > 0 a staged or variable unit whose minimum capacity is that
/// share of the maximum at the maximum's COP, modulating; C_D `cd`.
std::vector<heat_pump_point> default_points_for_rating(double seasonal_cop, rating_procedure procedure, double capacity_47_kw,
                                                       double min_share = 0, double cd = default_cd);

}  // namespace fw

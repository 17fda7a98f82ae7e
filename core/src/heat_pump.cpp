#include "fw/heat_pump.hpp"

#include <algorithm>
#include <cmath>

#include "fw/error.hpp"
#include "fw/roots.hpp"

namespace fw {

namespace {

double f_to_c(double f) { return (f - 32.0) * 5.0 / 9.0; }

}  // namespace

namespace {

heat_pump_point interpolate_sorted(const std::vector<heat_pump_point>& sorted, double t_c, bool& extrapolated) {
    extrapolated = t_c < sorted.front().outdoor_c || t_c > sorted.back().outdoor_c;
    std::size_t i = 0;
    while (i + 2 < sorted.size() && t_c > sorted[i + 1].outdoor_c) ++i;
    const auto& a = sorted[i];
    const auto& b = sorted[i + 1];
    const double f = (t_c - a.outdoor_c) / (b.outdoor_c - a.outdoor_c);
    return {t_c, std::max(0.0, a.capacity_kw + f * (b.capacity_kw - a.capacity_kw)),
            std::max(1.0, a.cop + f * (b.cop - a.cop))};
}

std::vector<heat_pump_point> sorted_points(const std::vector<heat_pump_point>& points) {
    auto sorted = points;
    std::sort(sorted.begin(), sorted.end(), [](const auto& a, const auto& b) { return a.outdoor_c < b.outdoor_c; });
    return sorted;
}

}  // namespace

heat_pump_point interpolate(const std::vector<heat_pump_point>& points, double t_c, bool& extrapolated) {
    return interpolate_sorted(sorted_points(points), t_c, extrapolated);
}

heat_pump_season run_bins(const std::vector<temperature_bin>& bins, double ua_kw_per_k, double balance_point_c,
                          const heat_pump_inputs& inputs) {
    heat_pump_season season;
    const auto sorted = sorted_points(inputs.points);
    bool first_cop = true;
    double coldest_c = inputs.points.front().outdoor_c;
    for (const auto& p : inputs.points) coldest_c = std::min(coldest_c, p.outdoor_c);
    for (const auto& bin : bins) {
        heat_pump_bin out{bin.t_c, bin.hours, 0, 0, 0, 0, 0, 0, false, false};
        const double load = bin.t_c < balance_point_c ? ua_kw_per_k * (balance_point_c - bin.t_c) : 0.0;
        bool extrapolated = false;
        const auto rated = interpolate_sorted(sorted, bin.t_c, extrapolated);
        out.load_kw = load;
        out.capacity_kw = rated.capacity_kw;
        out.cop = rated.cop;
        out.extrapolated = extrapolated;
        if (load > 0) {
            season.hours_below_balance_point += bin.hours;
            if (extrapolated && bin.t_c < coldest_c) season.extrapolated_hours += bin.hours;
            out.off = (inputs.cutoff_c && bin.t_c < *inputs.cutoff_c) ||
                      (inputs.changeover_c && bin.t_c < *inputs.changeover_c) || rated.capacity_kw <= 0;
            if (out.off) {
                out.backup_heat_kwh = load * bin.hours;
            } else {
                const double x = std::min(1.0, load / rated.capacity_kw);
                const double plf = 1.0 - inputs.cd * (1.0 - x);
                out.heat_pump_heat_kwh = x * rated.capacity_kw * bin.hours;
                out.heat_pump_kwh = x * (rated.capacity_kw / rated.cop) * bin.hours / plf;
                out.backup_heat_kwh = std::max(0.0, load - rated.capacity_kw) * bin.hours;
                if (first_cop) {
                    season.lowest_bin_cop = season.highest_bin_cop = rated.cop;
                    first_cop = false;
                }
                season.lowest_bin_cop = std::min(season.lowest_bin_cop, rated.cop);
                season.highest_bin_cop = std::max(season.highest_bin_cop, rated.cop);
            }
        }
        season.load_kwh += load * bin.hours;
        season.heat_pump_heat_kwh += out.heat_pump_heat_kwh;
        season.heat_pump_kwh += out.heat_pump_kwh;
        season.backup_heat_kwh += out.backup_heat_kwh;
        season.bins.push_back(out);
    }
    return season;
}

std::vector<heat_pump_point> default_points(double cop_47, double capacity_47_kw) {
    return {{f_to_c(47), capacity_47_kw, cop_47},
            {f_to_c(17), 0.62 * capacity_47_kw, 0.66 * cop_47},
            {f_to_c(5), 0.50 * capacity_47_kw, 0.55 * cop_47}};
}

double region_iv_seasonal_cop(const std::vector<heat_pump_point>& points) {
    // AHRI 210/240 Table 17 (10 CFR 430 App. M Table 19), Region IV fractional bin hours (from memory).
    static const double bin_f[] = {62, 57, 52, 47, 42, 37, 32, 27, 22, 17, 12, 7, 2, -3, -8};
    static const double fraction[] = {0.132, 0.111, 0.103, 0.093, 0.100, 0.109, 0.126, 0.087,
                                      0.055, 0.036, 0.026, 0.013, 0.006, 0.002, 0.001};
    std::vector<temperature_bin> bins;
    for (int j = 0; j < 15; ++j) bins.push_back({f_to_c(bin_f[j]), fraction[j]});
    bool unused = false;
    const double q47 = interpolate(points, f_to_c(47), unused).capacity_kw;
    // BL(T) = 0.77 (65 - T) / (65 - 5) Q47 [degF], as a UA per kelvin with balance point 65 degF.
    const double ua = 0.77 * q47 / ((65.0 - 5.0) * 5.0 / 9.0);
    heat_pump_inputs inputs;
    inputs.points = points;
    return run_bins(bins, ua, f_to_c(65), inputs).seasonal_cop_with_resistance();
}

std::vector<heat_pump_point> default_points_for_seasonal_cop(double seasonal_cop, double capacity_47_kw) {
    // The seasonal COP rises monotonically with the COP at 47 degF; solve on [1, 12].
    const auto gap = [&](double cop_47) { return region_iv_seasonal_cop(default_points(cop_47, capacity_47_kw)) - seasonal_cop; };
    const double lo = 1.0, hi = 12.0;
    const double g_lo = gap(lo), g_hi = gap(hi);
    if (g_lo >= 0) return default_points(lo, capacity_47_kw);
    if (g_hi <= 0) return default_points(hi, capacity_47_kw);
    return default_points(illinois_root(gap, lo, hi, g_lo, g_hi, 1e-13 * seasonal_cop), capacity_47_kw);
}

}  // namespace fw

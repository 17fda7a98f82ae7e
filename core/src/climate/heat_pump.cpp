#include "climate/heat_pump.hpp"

#include <algorithm>
#include <cmath>
#include <tuple>

#include "base/error.hpp"
#include "base/roots.hpp"

namespace fw {

namespace {

double f_to_c(double f) { return (f - 32.0) * 5.0 / 9.0; }

/// Linear in temperature between two points: capacity and power (capacity / COP), as the DOE
/// procedure interpolates them; the same for the minimum capacity where both points have one.
heat_pump_point between(const heat_pump_point& a, const heat_pump_point& b, double t_c) {
    const double f = (t_c - a.outdoor_c) / (b.outdoor_c - a.outdoor_c);
    const auto line = [&](double capacity_a, double cop_a, double capacity_b, double cop_b, double& capacity, double& cop) {
        capacity = std::max(0.0, capacity_a + f * (capacity_b - capacity_a));
        const double power = std::max(1e-12, capacity_a / cop_a + f * (capacity_b / cop_b - capacity_a / cop_a));
        cop = capacity > 0 ? std::max(1.0, capacity / power) : std::max(1.0, cop_a + f * (cop_b - cop_a));
    };
    heat_pump_point out{t_c, 0, 0};
    line(a.capacity_kw, a.cop, b.capacity_kw, b.cop, out.capacity_kw, out.cop);
    if (a.min_capacity_kw > 0 && b.min_capacity_kw > 0) {
        line(a.min_capacity_kw, a.min_cop, b.min_capacity_kw, b.min_cop, out.min_capacity_kw, out.min_cop);
        out.min_capacity_kw = std::min(out.min_capacity_kw, out.capacity_kw);
    }
    return out;
}

heat_pump_point interpolate_sorted(const std::vector<heat_pump_point>& sorted, double t_c, bool& extrapolated) {
    extrapolated = t_c < sorted.front().outdoor_c || t_c > sorted.back().outdoor_c;
    std::size_t i = 0;
    while (i + 2 < sorted.size() && t_c > sorted[i + 1].outdoor_c) ++i;
    return between(sorted[i], sorted[i + 1], t_c);
}

std::vector<heat_pump_point> sorted_points(const std::vector<heat_pump_point>& points) {
    auto sorted = points;
    std::sort(sorted.begin(), sorted.end(), [](const auto& a, const auto& b) { return a.outdoor_c < b.outdoor_c; });
    return sorted;
}

/// One procedure's bins [degC, weight] and load line: load = slope x (zero_load - T) / (zero_load - design) x Q_ref.
struct procedure_spec {
    std::vector<temperature_bin> bins;
    double zero_load_c, design_c, slope;
    double reference_c;     ///< where Q_ref is read from the curve
    double reference_load;  ///< the load line's value at reference_c as a fraction of Q_ref (0: Q_ref is the line's scale)
};

/// DOE region IV fractional bin hours (10 CFR 430 App. M Table 19; AHRI 210/240 Table 17), bins
/// 62..-8 degF (from memory). App. M1's region IV table is taken as the same hours (from memory; the
/// bins above its 55 degF zero-load temperature carry no load).
std::vector<temperature_bin> region_iv_bins() {
    static const double bin_f[] = {62, 57, 52, 47, 42, 37, 32, 27, 22, 17, 12, 7, 2, -3, -8};
    static const double fraction[] = {0.132, 0.111, 0.103, 0.093, 0.100, 0.109, 0.126, 0.087,
                                      0.055, 0.036, 0.026, 0.013, 0.006, 0.002, 0.001};
    std::vector<temperature_bin> bins;
    for (int j = 0; j < 15; ++j) bins.push_back({f_to_c(bin_f[j]), fraction[j]});
    return bins;
}

/// EN 14825 average reference heating season: hours per 1 K bin from -10 to 15 degC (4910 h; from memory).
std::vector<temperature_bin> en14825_average_bins() {
    static const double hours[] = {1,   25,  23,  24,  27,  68,  91,  89,  165, 173, 240, 280, 320,
                                   357, 356, 303, 330, 326, 348, 335, 315, 215, 169, 151, 105, 74};
    std::vector<temperature_bin> bins;
    for (int j = 0; j < 26; ++j) bins.push_back({-10.0 + j, hours[j]});
    return bins;
}

procedure_spec spec_of(rating_procedure procedure) {
    switch (procedure) {
        case rating_procedure::hspf_appendix_m: return {region_iv_bins(), f_to_c(65), f_to_c(5), 0.77, f_to_c(47), 0};
        case rating_procedure::hspf2_appendix_m1: return {region_iv_bins(), f_to_c(55), f_to_c(5), 1.15, f_to_c(47), 0};
        case rating_procedure::scop_en14825: return {en14825_average_bins(), 16.0, -10.0, 1.0, -7.0, 23.0 / 26.0};
    }
    return {};
}

}  // namespace

const char* procedure_name(rating_procedure procedure) {
    switch (procedure) {
        case rating_procedure::hspf_appendix_m: return "HSPF by 10 CFR 430 Subpart B Appendix M (AHRI 210/240-2017), region IV";
        case rating_procedure::hspf2_appendix_m1:
            return "HSPF2 by 10 CFR 430 Subpart B Appendix M1 (AHRI 210/240-2023), region IV";
        case rating_procedure::scop_en14825: return "SCOP by EN 14825, average climate";
    }
    return "";
}

heat_pump_point interpolate(const std::vector<heat_pump_point>& points, double t_c, bool& extrapolated) {
    return interpolate_sorted(sorted_points(points), t_c, extrapolated);
}

std::vector<heat_pump_point> with_frost_default(const std::vector<heat_pump_point>& points, bool& applied) {
    const double t17 = f_to_c(17), t35 = f_to_c(35), t45 = f_to_c(45);
    auto sorted = sorted_points(points);
    applied = false;
    const double tolerance = 1e-6;
    const bool cold = std::any_of(sorted.begin(), sorted.end(), [&](const auto& p) { return p.outdoor_c <= t17 + tolerance; });
    const bool warm = std::any_of(sorted.begin(), sorted.end(), [&](const auto& p) { return p.outdoor_c >= t45 - tolerance; });
    const bool inside = std::any_of(sorted.begin(), sorted.end(), [&](const auto& p) {
        return p.outdoor_c > t17 + tolerance && p.outdoor_c < t45 - tolerance;
    });
    if (!cold || !warm || inside) return sorted;
    bool unused = false;
    auto frosted = interpolate_sorted(sorted, t35, unused);
    const auto scale = [](double capacity, double cop) { return std::pair{0.90 * capacity, 0.90 * capacity / (0.985 * capacity / cop)}; };
    std::tie(frosted.capacity_kw, frosted.cop) = scale(frosted.capacity_kw, frosted.cop);
    if (frosted.min_capacity_kw > 0) std::tie(frosted.min_capacity_kw, frosted.min_cop) = scale(frosted.min_capacity_kw, frosted.min_cop);
    const auto given = sorted_points(points);
    frosted.added = true;
    // From 17 up to 45 degF the procedure follows the line through 17 and the frosted 35 degF point; at
    // 45 degF and above the 17-47 line again (a step at 45 degF, as the procedure's equations have it).
    const auto coldest_below_17 = std::find_if(given.rbegin(), given.rend(), [&](const auto& p) { return p.outdoor_c <= t17 + tolerance; });
    auto below_45 = between(*coldest_below_17, frosted, t45 - 1e-6);
    below_45.added = true;
    sorted.push_back(frosted);
    sorted.push_back(below_45);
    if (std::none_of(sorted.begin(), sorted.end(), [&](const auto& p) { return std::fabs(p.outdoor_c - t45) < tolerance; })) {
        sorted.push_back(interpolate_sorted(given, t45, unused));
        sorted.back().added = true;
    }
    if (std::count_if(given.begin(), given.end(), [&](const auto& p) { return p.outdoor_c <= t17 + tolerance; }) == 1) {
        sorted.push_back(interpolate_sorted(given, given.front().outdoor_c - 10.0 * 5.0 / 9.0, unused));
        sorted.back().added = true;
    }
    applied = true;
    return sorted_points(sorted);
}

heat_pump_season run_bins(const std::vector<temperature_bin>& bins, double ua_kw_per_k, double balance_point_c,
                          const heat_pump_inputs& inputs) {
    heat_pump_season season;
    const auto sorted = sorted_points(inputs.points);
    bool first_cop = true;
    // Extrapolated: outside the data sheet's own points (not those the frost default added).
    double coldest_c = INFINITY, warmest_c = -INFINITY;
    for (const auto& p : sorted)
        if (!p.added) coldest_c = std::min(coldest_c, p.outdoor_c), warmest_c = std::max(warmest_c, p.outdoor_c);
    for (const auto& bin : bins) {
        heat_pump_bin out{bin.t_c, bin.hours, 0, 0, 0, 0, 0, 0, false, false};
        const double load = bin.t_c < balance_point_c ? ua_kw_per_k * (balance_point_c - bin.t_c) : 0.0;
        bool extrapolated = false;
        const auto rated = interpolate_sorted(sorted, bin.t_c, extrapolated);
        extrapolated = bin.t_c < coldest_c || bin.t_c > warmest_c;
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
                const double max_power = rated.capacity_kw / rated.cop;
                const bool modulates = inputs.modulating && rated.min_capacity_kw > 0;
                if (modulates && load > rated.min_capacity_kw) {
                    // Between minimum and maximum the unit runs continuously, its power linear in the heat.
                    const double heat = std::min(load, rated.capacity_kw);
                    const double min_power = rated.min_capacity_kw / rated.min_cop;
                    const double span = rated.capacity_kw - rated.min_capacity_kw;
                    const double power = span > 0 ? min_power + (heat - rated.min_capacity_kw) / span * (max_power - min_power) : max_power;
                    out.heat_pump_heat_kwh = heat * bin.hours;
                    out.heat_pump_kwh = power * bin.hours;
                } else {
                    // Cycling at one capacity (the only one, or the minimum): PLF = 1 - C_D (1 - X).
                    const double capacity = modulates ? rated.min_capacity_kw : rated.capacity_kw;
                    const double power = modulates ? rated.min_capacity_kw / rated.min_cop : max_power;
                    const double x = std::min(1.0, load / capacity);
                    const double plf = 1.0 - inputs.cd * (1.0 - x);
                    out.heat_pump_heat_kwh = x * capacity * bin.hours;
                    out.heat_pump_kwh = x * power * bin.hours / plf;
                }
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

double procedure_seasonal_cop(const std::vector<heat_pump_point>& points, rating_procedure procedure, double cd,
                              bool modulating) {
    const auto spec = spec_of(procedure);
    bool unused = false;
    heat_pump_inputs inputs;
    inputs.points = with_frost_default(points, unused);
    inputs.cd = cd;
    inputs.modulating = modulating;
    const double q_ref = interpolate(inputs.points, spec.reference_c, unused).capacity_kw;
    // The load line as a UA with its zero-load temperature as the balance point.
    const double scale = spec.reference_load > 0 ? q_ref / spec.reference_load : q_ref;
    const double ua = spec.slope * scale / (spec.zero_load_c - spec.design_c);
    return run_bins(spec.bins, ua, spec.zero_load_c, inputs).seasonal_cop_with_resistance();
}

std::vector<heat_pump_point> default_points_for_rating(double seasonal_cop, rating_procedure procedure, double capacity_47_kw,
                                                       double min_share, double cd) {
    const auto curve = [&](double cop_47) {
        auto points = default_points(cop_47, capacity_47_kw);
        if (min_share > 0)
            for (auto& p : points) {
                p.min_capacity_kw = min_share * p.capacity_kw;
                p.min_cop = p.cop;
            }
        return points;
    };
    // The seasonal COP rises monotonically with the COP at 47 degF; solve on [1, 12].
    const auto gap = [&](double cop_47) { return procedure_seasonal_cop(curve(cop_47), procedure, cd, min_share > 0) - seasonal_cop; };
    const double lo = 1.0, hi = 12.0;
    const double g_lo = gap(lo), g_hi = gap(hi);
    if (g_lo >= 0) return curve(lo);
    if (g_hi <= 0) return curve(hi);
    return curve(illinois_root(gap, lo, hi, g_lo, g_hi, 1e-13 * seasonal_cop));
}

}  // namespace fw

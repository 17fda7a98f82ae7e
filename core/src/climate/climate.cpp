#include "climate/climate.hpp"

#include <algorithm>
#include <cmath>
#include <numeric>

#include "base/error.hpp"
#include "base/roots.hpp"

namespace fw {

namespace {

constexpr double pi = 3.14159265358979323846;

/// ln(1 + e^x) without overflow.
double softplus(double x) { return std::max(x, 0.0) + std::log1p(std::exp(-std::fabs(x))); }

/// [K] Logistic scale s from a standard deviation: SD = s pi / sqrt(3).
double logistic_scale(double sd) { return sd * std::sqrt(3.0) / pi; }

/// Logistic CDF at x with the scale s already worked out (logistic_scale).
double logistic_cdf_scaled(double x, double mean, double scale) { return 1.0 / (1.0 + std::exp(-(x - mean) / scale)); }

double logistic_cdf(double x, double mean, double sd) { return logistic_cdf_scaled(x, mean, logistic_scale(sd)); }

double sd_of(const std::array<double, 12>& values) {
    const double mean = std::accumulate(values.begin(), values.end(), 0.0) / 12.0;
    double sum = 0;
    for (double v : values) sum += (v - mean) * (v - mean);
    return std::sqrt(sum / 12.0);
}

/// Finds x in [lo, hi] with f(x) = target for a monotone f (increasing or decreasing).
template <typename F>
double bisect(F f, double target, double lo, double hi) {
    const bool increasing = f(hi) > f(lo);
    for (int i = 0; i < 200 && hi - lo > 1e-12 * std::max(1.0, std::fabs(lo) + std::fabs(hi)); ++i) {
        const double mid = 0.5 * (lo + hi);
        if ((f(mid) < target) == increasing) lo = mid;
        else hi = mid;
    }
    return 0.5 * (lo + hi);
}

/// Day of the year at the middle of each month.
std::array<double, 12> mid_month_days(bool leap_year) {
    const auto days = days_in_months(leap_year);
    std::array<double, 12> out{};
    double start = 0;
    for (int m = 0; m < 12; ++m) {
        out[m] = start + days[m] / 2.0;
        start += days[m];
    }
    return out;
}

}  // namespace

std::array<int, 12> days_in_months(bool leap_year) {
    return {31, leap_year ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
}

double erbs_sigma_m(double month_mean_c, double sigma_year_k) {
    // Floor at 0.3 K: the linear correlation goes to zero for very hot months.
    return std::max(0.3, 1.45 - 0.0290 * month_mean_c + 0.0664 * sigma_year_k);
}

double erbs_daily_sd(double sigma_m, int days) {
    return sigma_m * std::sqrt(static_cast<double>(days)) * pi / (std::sqrt(3.0) * 2.0 * erbs_a);
}

double logistic_hdd(double mean_c, double daily_sd_k, double base_c, int days) {
    const double s = logistic_scale(daily_sd_k);
    return days * s * softplus((base_c - mean_c) / s);
}

double logistic_cdd(double mean_c, double daily_sd_k, double base_c, int days) {
    const double s = logistic_scale(daily_sd_k);
    return days * s * softplus((mean_c - base_c) / s);
}

double normal_hdd(double mean_c, double daily_sd_k, double base_c, int days) {
    const double z = (base_c - mean_c) / daily_sd_k;
    const double cdf = 0.5 * std::erfc(-z / std::sqrt(2.0));
    const double pdf = std::exp(-0.5 * z * z) / std::sqrt(2.0 * pi);
    return daily_sd_k * days * (z * cdf + pdf);
}

climate_model climate_from_means(const std::array<double, 12>& monthly_mean_c,
                                 const std::optional<std::array<double, 12>>& daily_sd_k, bool leap_year,
                                 double daily_range_k) {
    climate_model climate;
    climate.daily_range_k = daily_range_k;
    climate.monthly_mean_c = monthly_mean_c;
    climate.leap_year = leap_year;
    const auto days = days_in_months(leap_year);
    if (daily_sd_k) {
        climate.daily_sd_k = *daily_sd_k;
        climate.trace.push_back("standard deviations of the daily means as given");
    } else {
        const double sigma_year = sd_of(monthly_mean_c);
        for (int m = 0; m < 12; ++m)
            climate.daily_sd_k[m] = erbs_daily_sd(erbs_sigma_m(monthly_mean_c[m], sigma_year), days[m]);
        climate.trace.push_back("daily-mean spread from Erbs, Klein & Beckman (1983): sigma_m = 1.45 - 0.0290 Tm + "
                                "0.0664 sigma_yr (sigma_yr = " + format_number(sigma_year) + " K)");
    }
    return climate;
}

climate_model climate_from_monthly_hdd(const std::array<double, 12>& hdd, double base_c, bool leap_year,
                                       double daily_range_k) {
    const auto days = days_in_months(leap_year);
    std::array<double, 12> means{};
    for (int m = 0; m < 12; ++m) means[m] = base_c - hdd[m] / days[m];
    for (int iteration = 0; iteration < 50; ++iteration) {
        const double sigma_year = sd_of(means);
        double change = 0;
        for (int m = 0; m < 12; ++m) {
            const double target = std::max(hdd[m], 0.05);  // a month with no HDD: the warmest mean that still gives 0.05
            const auto f = [&](double mean) {
                return logistic_hdd(mean, erbs_daily_sd(erbs_sigma_m(mean, sigma_year), days[m]), base_c, days[m]);
            };
            const double solved = bisect(f, target, -70.0, 70.0);
            change = std::max(change, std::fabs(solved - means[m]));
            means[m] = solved;
        }
        if (change < 1e-10) break;
    }
    auto climate = climate_from_means(means, std::nullopt, leap_year, daily_range_k);
    climate.trace.insert(climate.trace.begin(), "monthly means rebuilt from the monthly HDD by inverting the Erbs formula");
    return climate;
}

climate_model climate_from_annual_hdd(double annual_hdd, double base_c, double design_99_c, bool leap_year,
                                      double daily_range_k) {
    const auto mid = mid_month_days(leap_year);
    const double year_days = leap_year ? 366.0 : 365.0;
    const auto means_for = [&](double annual_mean, double amplitude) {
        std::array<double, 12> means{};
        for (int m = 0; m < 12; ++m) means[m] = annual_mean - amplitude * std::cos(2 * pi * (mid[m] - 20.0) / year_days);
        return means;
    };
    const auto annual_of = [&](const climate_model& climate) {
        const auto monthly = monthly_hdd(climate, base_c);
        return std::accumulate(monthly.begin(), monthly.end(), 0.0);
    };
    const auto model_for = [&](double amplitude) {
        const double mean = bisect(
            [&](double t) { return annual_of(climate_from_means(means_for(t, amplitude), std::nullopt, leap_year, daily_range_k)); },
            annual_hdd, base_c - 60.0, base_c + 40.0);
        return climate_from_means(means_for(mean, amplitude), std::nullopt, leap_year, daily_range_k);
    };
    const auto design_for = [&](double amplitude) { return design_temperature(model_for(amplitude), 0.01); };
    if (design_for(0.0) < design_99_c || design_for(40.0) > design_99_c)
        throw input_error("/climate/design_temperature",
                          "no climate has annual HDD " + format_number(annual_hdd) + " and a 99 % design temperature of " +
                              format_number(design_99_c) + " degC; check both values");
    const double amplitude = bisect(design_for, design_99_c, 0.0, 40.0);
    auto climate = model_for(amplitude);
    climate.trace.insert(climate.trace.begin(),
                         "monthly means rebuilt from annual HDD and the design temperature: an annual cosine with "
                         "amplitude " + format_number(amplitude) + " K, coldest on 20 January (northern hemisphere)");
    return climate;
}

std::array<double, 12> monthly_hdd(const climate_model& climate, double base_c) {
    const auto days = days_in_months(climate.leap_year);
    std::array<double, 12> out{};
    for (int m = 0; m < 12; ++m) out[m] = logistic_hdd(climate.monthly_mean_c[m], climate.daily_sd_k[m], base_c, days[m]);
    return out;
}

double diurnal_fraction(int hour) {
    const double t = 2 * pi * (hour - 1) / 24.0;
    return 0.4632 * std::cos(t - 3.805) + 0.0984 * std::cos(2 * t - 0.360) + 0.0168 * std::cos(3 * t - 0.822) +
           0.0138 * std::cos(4 * t - 3.513);
}

namespace {

/// [K] The offset of each hour of the day (1..24) from the daily mean, for a daily range [K].
std::array<double, 24> diurnal_offsets_k(double daily_range_k) {
    std::array<double, 24> out{};
    for (int h = 1; h <= 24; ++h) out[h - 1] = daily_range_k * diurnal_fraction(h);
    return out;
}

}  // namespace

std::vector<temperature_bin> hourly_bins(const climate_model& climate, double width_k) {
    const double daily_range_k = climate.daily_range_k;
    const auto days = days_in_months(climate.leap_year);
    double low = 1e9, high = -1e9;
    for (int m = 0; m < 12; ++m) {
        low = std::min(low, climate.monthly_mean_c[m] - 6 * climate.daily_sd_k[m] - daily_range_k);
        high = std::max(high, climate.monthly_mean_c[m] + 6 * climate.daily_sd_k[m] + daily_range_k);
    }
    const long first = static_cast<long>(std::floor(low / width_k));
    const long last = static_cast<long>(std::ceil(high / width_k));
    const auto bin_count = static_cast<std::size_t>(last - first + 1);
    // Hours below each inner edge centre +/- width/2, summed over every month and hour of the day;
    // a bin's hours are the difference of its two edges (the outer bins take the tails).
    std::vector<double> below(bin_count + 1, 0.0);
    below.back() = 24.0 * std::accumulate(days.begin(), days.end(), 0);
    const auto offset_k = diurnal_offsets_k(daily_range_k);
    for (int m = 0; m < 12; ++m) {
        const double scale = logistic_scale(climate.daily_sd_k[m]);
        for (double offset : offset_k) {
            const double mean = climate.monthly_mean_c[m] + offset;
            for (std::size_t e = 1; e < bin_count; ++e) {
                const double edge = (first + static_cast<long>(e)) * width_k - width_k / 2;
                below[e] += days[m] * logistic_cdf_scaled(edge, mean, scale);
            }
        }
    }
    std::vector<temperature_bin> bins;
    bins.reserve(bin_count);
    for (std::size_t k = 0; k < bin_count; ++k)
        bins.push_back({(first + static_cast<long>(k)) * width_k, below[k + 1] - below[k]});
    // Drop empty tails (the outermost bins carry the tails of the distribution).
    while (bins.size() > 1 && bins.front().hours < 1e-6) {
        bins[1].hours += bins.front().hours;
        bins.erase(bins.begin());
    }
    while (bins.size() > 1 && bins.back().hours < 1e-6) {
        bins[bins.size() - 2].hours += bins.back().hours;
        bins.pop_back();
    }
    return bins;
}

month_hour_hours fit_to_sums(month_hour_hours table, const bin_times& sums) {
    double total = 0;
    for (double hours : sums.by_month) total += hours;
    if (total <= 0) return month_hour_hours{};
    const double floor = 1e-3 * total / (12 * 24);
    for (auto& month : table)
        for (auto& cell : month) cell = std::max(cell, floor);
    // Alternate column and row scaling; 200 rounds bring every sum within 1e-9 of its target on tables
    // like these (the error shrinks geometrically; Deming & Stephan 1940, Fienberg 1970).
    for (int round = 0; round < 200; ++round) {
        for (std::size_t h = 0; h < 24; ++h) {
            double column = 0;
            for (const auto& month : table) column += month[h];
            const double scale = column > 0 ? sums.by_hour[h] / column : 0.0;
            for (auto& month : table) month[h] *= scale;
        }
        double worst = 0;
        for (std::size_t m = 0; m < 12; ++m) {
            double row = 0;
            for (double cell : table[m]) row += cell;
            const double scale = row > 0 ? sums.by_month[m] / row : 0.0;
            for (double& cell : table[m]) cell *= scale;
        }
        for (std::size_t h = 0; h < 24; ++h) {
            double column = 0;
            for (const auto& month : table) column += month[h];
            worst = std::max(worst, std::fabs(column - sums.by_hour[h]));
        }
        if (worst <= 1e-9 * total) break;
    }
    return table;
}

std::vector<month_hour_hours> bin_calendar(const climate_model& climate, const std::vector<temperature_bin>& bins,
                                           double width_k, const std::vector<bin_times>& observed) {
    const auto days = days_in_months(climate.leap_year);
    const double year_hours = 24.0 * std::accumulate(days.begin(), days.end(), 0);
    const auto offset_k = diurnal_offsets_k(climate.daily_range_k);
    std::vector<month_hour_hours> out(bins.size());
    for (std::size_t k = 0; k < bins.size(); ++k) {
        const double lower = k == 0 ? -INFINITY : bins[k].t_c - width_k / 2;
        const double upper = k + 1 == bins.size() ? INFINITY : bins[k].t_c + width_k / 2;
        double total = 0;
        for (std::size_t m = 0; m < 12; ++m)
            for (std::size_t h = 1; h <= 24; ++h) {
                const double mean = climate.monthly_mean_c[m] + offset_k[h - 1];
                const double below_upper = std::isinf(upper) ? 1.0 : logistic_cdf(upper, mean, climate.daily_sd_k[m]);
                const double below_lower = std::isinf(lower) ? 0.0 : logistic_cdf(lower, mean, climate.daily_sd_k[m]);
                const double hours = days[m] * std::max(0.0, below_upper - below_lower);
                // the temperature at h:00 stands for the half hours either side: half in the hour before, half in the hour after
                out[k][m][(h - 1) % 24] += hours / 2;
                out[k][m][h % 24] += hours / 2;
                total += hours;
            }
        for (std::size_t m = 0; m < 12; ++m)
            for (auto& hours : out[k][m])
                hours = total > 0 ? hours * bins[k].hours / total : bins[k].hours * days[m] / year_hours;
        if (k < observed.size()) {
            // fitted to when the hours fell, then held to the bin's own hours (the sums may differ from them by rounding)
            out[k] = fit_to_sums(out[k], observed[k]);
            double fitted = 0;
            for (const auto& month : out[k])
                for (double hours : month) fitted += hours;
            for (auto& month : out[k])
                for (double& hours : month) hours = fitted > 0 ? hours * bins[k].hours / fitted : bins[k].hours / (12 * 24);
        }
    }
    return out;
}

double design_temperature(const climate_model& climate, double fraction) {
    const double daily_range_k = climate.daily_range_k;
    const auto days = days_in_months(climate.leap_year);
    const double total = 24.0 * std::accumulate(days.begin(), days.end(), 0);
    const auto offset_k = diurnal_offsets_k(daily_range_k);
    const auto share_below = [&](double t) {
        double hours = 0;
        for (int m = 0; m < 12; ++m)
            for (double offset : offset_k) hours += days[m] * logistic_cdf(t, climate.monthly_mean_c[m] + offset, climate.daily_sd_k[m]);
        return hours / total;
    };
    return bisect(share_below, fraction, -90.0, 60.0);
}

double design_temperature_from_bins(const std::vector<temperature_bin>& bins, double width_k, double fraction) {
    double total = 0;
    for (const auto& bin : bins) total += bin.hours;
    const double target = fraction * total;
    double below = 0;
    for (const auto& bin : bins) {
        // A share of the hours that ends exactly on a bin's top edge (87.6 h of 8760) is that edge,
        // whatever the rounding of fraction x total.
        if (bin.hours > 0 && below + bin.hours >= target - 1e-9 * total)
            return bin.t_c - width_k / 2 + width_k * std::min(1.0, (target - below) / bin.hours);
        below += bin.hours;
    }
    return bins.empty() ? 0.0 : bins.back().t_c + width_k / 2;
}

std::optional<double> spread_factor_for_design(const climate_model& climate, double design_99_c) {
    const auto miss = [&](double factor) {
        climate_model scaled = climate;
        for (double& sd : scaled.daily_sd_k) sd *= factor;
        return design_temperature(scaled, 0.01) - design_99_c;
    };
    const double lo = 0.2, hi = 4.0;
    const double f_lo = miss(lo), f_hi = miss(hi);
    if ((f_lo < 0) == (f_hi < 0) && f_lo != 0 && f_hi != 0) return std::nullopt;
    return illinois_root(miss, lo, hi, f_lo, f_hi, 1e-6);
}

}  // namespace fw

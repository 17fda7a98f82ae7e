#include "climate/demand.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <limits>
#include <numeric>

#include "base/error.hpp"
#include "base/units.hpp"

namespace fw {

namespace {

/// Days since 1970-01-01 (H. Hinnant, "chrono-compatible low-level date algorithms").
long days_from_civil(long y, unsigned m, unsigned d) {
    y -= m <= 2;
    const long era = (y >= 0 ? y : y - 399) / 400;
    const unsigned yoe = static_cast<unsigned>(y - era * 400);
    const unsigned doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
    const unsigned doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
    return era * 146097 + static_cast<long>(doe) - 719468;
}

void civil_from_days(long z, long& y, unsigned& m, unsigned& d) {
    z += 719468;
    const long era = (z >= 0 ? z : z - 146096) / 146097;
    const unsigned doe = static_cast<unsigned>(z - era * 146097);
    const unsigned yoe = (doe - doe / 1460 + doe / 36524 - doe / 146096) / 365;
    y = static_cast<long>(yoe) + era * 400;
    const unsigned doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    const unsigned mp = (5 * doy + 2) / 153;
    d = doy - (153 * mp + 2) / 5 + 1;
    m = mp < 10 ? mp + 3 : mp - 9;
    y += m <= 2;
}

struct weighted_line {
    double intercept, slope, r2, residual_variance;
    double var_intercept, var_slope, cov;
};

weighted_line fit_line(const std::vector<double>& x, const std::vector<double>& y, const std::vector<double>& w) {
    double sw = 0, sx = 0, sy = 0;
    for (std::size_t i = 0; i < x.size(); ++i) {
        sw += w[i];
        sx += w[i] * x[i];
        sy += w[i] * y[i];
    }
    const double mx = sx / sw, my = sy / sw;
    double sxx = 0, sxy = 0, syy = 0;
    for (std::size_t i = 0; i < x.size(); ++i) {
        sxx += w[i] * (x[i] - mx) * (x[i] - mx);
        sxy += w[i] * (x[i] - mx) * (y[i] - my);
        syy += w[i] * (y[i] - my) * (y[i] - my);
    }
    weighted_line line{};
    line.slope = sxx > 0 ? sxy / sxx : 0.0;
    line.intercept = my - line.slope * mx;
    double sse = 0;
    for (std::size_t i = 0; i < x.size(); ++i) {
        const double r = y[i] - line.intercept - line.slope * x[i];
        sse += w[i] * r * r;
    }
    line.r2 = syy > 0 ? 1.0 - sse / syy : 1.0;
    // Weights are days: scale them to an average of 1 for the variance of a typical day's reading.
    const double n = static_cast<double>(x.size());
    const double scale = n / sw;
    line.residual_variance = n > 2 ? sse * scale / (n - 2) : 0.0;
    const double sxx_scaled = sxx * scale;
    line.var_slope = sxx_scaled > 0 ? line.residual_variance / sxx_scaled : 0.0;
    line.var_intercept = line.residual_variance * (1.0 / n + mx * mx / std::max(sxx_scaled, 1e-300));
    line.cov = -mx * line.var_slope;
    return line;
}

}  // namespace

bool is_leap_year(int year) { return (year % 4 == 0 && year % 100 != 0) || year % 400 == 0; }

long parse_day_number(const std::string& text, const std::string& path) {
    const bool shape = text.size() == 10 && text[4] == '-' && text[7] == '-';
    bool digits = shape;
    for (std::size_t i = 0; digits && i < text.size(); ++i)
        if (i != 4 && i != 7) digits = std::isdigit(static_cast<unsigned char>(text[i])) != 0;
    if (!digits) throw input_error(path, "date \"" + text + "\" must be written YYYY-MM-DD");
    const int year = std::stoi(text.substr(0, 4)), month = std::stoi(text.substr(5, 2)), day = std::stoi(text.substr(8, 2));
    static const int month_days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    if (month < 1 || month > 12 || day < 1 || day > month_days[month - 1] + (month == 2 && is_leap_year(year)))
        throw input_error(path, "date \"" + text + "\" does not exist");
    return days_from_civil(year, static_cast<unsigned>(month), static_cast<unsigned>(day));
}

int month_of_day(long day_number) {
    long y;
    unsigned m, d;
    civil_from_days(day_number, y, m, d);
    return static_cast<int>(m) - 1;
}

double period_hdd(const climate_model& climate, long first_day, long last_day, double base_c) {
    const auto monthly = monthly_hdd(climate, base_c);
    const auto days = days_in_months(climate.leap_year);
    double total = 0;
    for (long day = first_day; day <= last_day; ++day) {
        const int m = month_of_day(day);
        total += monthly[m] / days[m];
    }
    return total;
}

std::string day_text(long day_number) {
    long y;
    unsigned m, d;
    civil_from_days(day_number, y, m, d);
    char text[16];
    std::snprintf(text, sizeof text, "%04ld-%02u-%02u", y, m, d);
    return text;
}

double bill_hdd(const bill_period& bill, const climate_model& climate, double base_c) {
    const double days = static_cast<double>(bill.last_day - bill.first_day + 1);
    switch (bill.weather) {
        case bill_weather::observed_daily: {
            double total = 0;
            for (double t : bill.daily_mean_c) total += std::max(0.0, base_c - t);
            return bill.daily_mean_c.empty() ? 0.0 : total * days / static_cast<double>(bill.daily_mean_c.size());
        }
        case bill_weather::observed_period_mean: {
            double total = 0;
            for (long day = bill.first_day; day <= bill.last_day; ++day)
                total += logistic_hdd(bill.mean_c, climate.daily_sd_k[month_of_day(day)], base_c, 1);
            return total;
        }
        case bill_weather::normals: break;
    }
    return period_hdd(climate, bill.first_day, bill.last_day, base_c);
}

prism_fit fit_prism(const std::vector<bill_period>& bills, const climate_model& climate, double tau_low_c,
                    double tau_high_c) {
    std::vector<double> use(bills.size()), weight(bills.size());
    for (std::size_t i = 0; i < bills.size(); ++i) {
        weight[i] = static_cast<double>(bills[i].last_day - bills[i].first_day + 1);
        use[i] = bills[i].fuel_kwh / weight[i];
    }
    const auto hdd_per_day = [&](double tau) {
        std::vector<double> x(bills.size());
        for (std::size_t i = 0; i < bills.size(); ++i)
            x[i] = bill_hdd(bills[i], climate, tau) / weight[i];
        return x;
    };
    const auto r2_at = [&](double tau) { return fit_line(hdd_per_day(tau), use, weight).r2; };
    // Coarse scan, then golden-section refinement around the best point.
    double best_tau = tau_low_c, best_r2 = -std::numeric_limits<double>::infinity();
    const int steps = 60;
    for (int i = 0; i <= steps; ++i) {
        const double tau = tau_low_c + (tau_high_c - tau_low_c) * i / steps;
        const double r2 = r2_at(tau);
        if (r2 > best_r2) {
            best_r2 = r2;
            best_tau = tau;
        }
    }
    const double step = (tau_high_c - tau_low_c) / steps;
    double lo = std::max(tau_low_c, best_tau - step), hi = std::min(tau_high_c, best_tau + step);
    const double golden = (std::sqrt(5.0) - 1) / 2;
    double c = hi - golden * (hi - lo), d = lo + golden * (hi - lo);
    double fc = r2_at(c), fd = r2_at(d);
    for (int i = 0; i < 80 && hi - lo > 1e-9; ++i) {
        if (fc > fd) {
            hi = d;
            d = c;
            fd = fc;
            c = hi - golden * (hi - lo);
            fc = r2_at(c);
        } else {
            lo = c;
            c = d;
            fc = fd;
            d = lo + golden * (hi - lo);
            fd = r2_at(d);
        }
    }
    const double tau = r2_at(0.5 * (lo + hi)) >= best_r2 ? 0.5 * (lo + hi) : best_tau;
    const auto x = hdd_per_day(tau);
    const auto line = fit_line(x, use, weight);
    prism_fit fit;
    fit.tau_c = tau;
    fit.base_kwh_per_day = line.intercept;
    fit.slope_kwh_per_k_day = line.slope;
    fit.r2 = line.r2;
    const auto monthly = monthly_hdd(climate, tau);
    for (double h : monthly) fit.normal_hdd += h;
    const double year_days = climate.leap_year ? 366.0 : 365.0;
    fit.heating_kwh = line.slope * fit.normal_hdd;
    fit.base_annual_kwh = year_days * line.intercept;
    fit.nac_kwh = fit.base_annual_kwh + fit.heating_kwh;
    fit.nac_standard_error_kwh = std::sqrt(std::max(
        0.0, year_days * year_days * line.var_intercept + fit.normal_hdd * fit.normal_hdd * line.var_slope +
                 2 * year_days * fit.normal_hdd * line.cov));
    for (std::size_t i = 0; i < x.size(); ++i) fit.points.push_back({x[i], use[i]});
    // The least exact weather of any bill: normals, then period means, then daily means.
    const auto rank = [](bill_weather w) { return w == bill_weather::normals ? 2 : w == bill_weather::observed_period_mean ? 1 : 0; };
    fit.weather = bill_weather::observed_daily;
    for (const auto& bill : bills)
        if (rank(bill.weather) > rank(fit.weather)) fit.weather = bill.weather;
    return fit;
}

double ua_from_design_heat_loss_w_per_k(double design_heat_loss_w, double indoor_c, double design_outdoor_c) {
    return design_heat_loss_w / (indoor_c - design_outdoor_c);
}

double balance_point_from_gains_c(double indoor_c, double internal_gains_w, double ua_w_per_k) {
    return indoor_c - internal_gains_w / ua_w_per_k;
}

degree_day_heat degree_day_space_heat(const climate_model& climate, double ua_w_per_k, double balance_point_c,
                                      double degree_day_correction) {
    const auto monthly = monthly_hdd(climate, balance_point_c);
    degree_day_heat heat;
    heat.hdd_k_day = std::accumulate(monthly.begin(), monthly.end(), 0.0);
    heat.uncorrected_kwh = ua_w_per_k * heat.hdd_k_day * 24.0 / 1000.0;
    heat.space_heat_kwh = heat.uncorrected_kwh * degree_day_correction;
    return heat;
}

std::vector<std::size_t> bills_in_date_order(const std::vector<bill_period>& bills) {
    std::vector<std::size_t> order(bills.size());
    std::iota(order.begin(), order.end(), 0);
    std::sort(order.begin(), order.end(), [&](auto a, auto b) { return bills[a].first_day < bills[b].first_day; });
    return order;
}

bool bills_share_a_day(const std::vector<bill_period>& bills) {
    const auto order = bills_in_date_order(bills);
    for (std::size_t k = 1; k < order.size(); ++k)
        if (bills[order[k]].first_day <= bills[order[k - 1]].last_day) return true;
    return false;
}

std::vector<bill_seam> bill_seams(const std::vector<bill_period>& bills) {
    const auto order = bills_in_date_order(bills);
    std::vector<bill_seam> seams;
    for (std::size_t k = 1; k < order.size(); ++k) {
        const auto& earlier = bills[order[k - 1]];
        const auto& later = bills[order[k]];
        bill_seam seam;
        seam.earlier = order[k - 1];
        seam.later = order[k];
        seam.overlap_days = std::max(0L, earlier.last_day - later.first_day + 1);
        seam.gap_days = std::max(0L, later.first_day - earlier.last_day - 1);
        seams.push_back(seam);
    }
    return seams;
}

observed_cover observed_days_of(const bill_period& bill, const std::map<long, double>& observed_c) {
    observed_cover cover;
    cover.period_days = bill.last_day - bill.first_day + 1;
    for (long day = bill.first_day; day <= bill.last_day; ++day) {
        const auto found = observed_c.find(day);
        if (found == observed_c.end()) ++cover.missing_days;
        else cover.daily_mean_c.push_back(found->second);
    }
    return cover;
}

billed_total billed_total_of(const std::vector<bill_period>& bills) {
    billed_total total;
    for (const auto& bill : bills) {
        total.days += bill.last_day - bill.first_day + 1;
        total.fuel_kwh += bill.fuel_kwh;
    }
    return total;
}

std::pair<double, double> prism_tau_range_c(bool fahrenheit) {
    if (fahrenheit) return {convert(40, "degF", "degC"), convert(75, "degF", "degC")};
    return {5.0, 24.0};
}

fit_doubts doubts_about(const prism_fit& fit, double tau_low_c, double tau_high_c) {
    fit_doubts doubts;
    doubts.poor_fit = fit.r2 < 0.7;
    doubts.tau_at_edge = fit.tau_c - tau_low_c < 0.5 || tau_high_c - fit.tau_c < 0.5;
    doubts.least_hdd_per_day = std::numeric_limits<double>::infinity();
    for (const auto& point : fit.points) doubts.least_hdd_per_day = std::min(doubts.least_hdd_per_day, point.first);
    doubts.every_period_heated = doubts.least_hdd_per_day > 1.0;
    return doubts;
}

bool bills_cover_coldest_months(const std::vector<bill_period>& bills, const climate_model& climate) {
    std::array<int, 12> by_cold{};
    std::iota(by_cold.begin(), by_cold.end(), 0);
    std::sort(by_cold.begin(), by_cold.end(),
              [&](int a, int b) { return climate.monthly_mean_c[a] < climate.monthly_mean_c[b]; });
    for (const auto& bill : bills)
        for (long day = bill.first_day; day <= bill.last_day; ++day) {
            const int month = month_of_day(day);
            if (month == by_cold[0] || month == by_cold[1] || month == by_cold[2]) return true;
        }
    return false;
}

}  // namespace fw

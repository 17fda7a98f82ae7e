// Heat demand (climate/demand layer): heat loss with degree-days, and the PRISM fit of fuel
// bills against degree-days (Fels 1986, Energy and Buildings 9:5-18).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "climate/climate.hpp"

namespace fw {

/// Days since 1970-01-01 of a "YYYY-MM-DD" date; throws input_error for a malformed or impossible date.
long parse_day_number(const std::string& text, const std::string& path);

/// Month (0..11) and year of a day number.
int month_of_day(long day_number);
bool is_leap_year(int year);

/// [K day] Expected HDD to `base_c` over days first..last inclusive: each day carries its
/// month's HDD / days in the month.
double period_hdd(const climate_model& climate, long first_day, long last_day, double base_c);

/// "YYYY-MM-DD" of a day number.
std::string day_text(long day_number);

/// Where a bill's degree-days come from.
enum class bill_weather {
    normals,               ///< the climate's normal monthly means (not weather-normalised)
    observed_daily,        ///< the daily mean temperatures of the period
    observed_period_mean,  ///< the period's average temperature with the climate's day-to-day spread
};

/// One bill: the period (inclusive day numbers) and the fuel it used, as gross energy [kWh HHV],
/// with the weather the house saw in the period where it is known.
struct bill_period {
    long first_day = 0;
    long last_day = 0;
    double fuel_kwh = 0;
    bill_weather weather = bill_weather::normals;
    std::vector<double> daily_mean_c;  ///< [degC] observed_daily: the days that were observed
    double mean_c = 0;                 ///< [degC] observed_period_mean: the period's average
};

/// [K day] HDD of a bill's period to `base_c` from the weather it carries: the sum of (base - T)+
/// over observed days (scaled to the whole period when some days are missing), the logistic
/// expectation about the period's mean with the climate's daily spread of each day's month, or the
/// climate's normals (period_hdd).
double bill_hdd(const bill_period& bill, const climate_model& climate, double base_c);

/// The PRISM fit: use per day = base + slope x HDD per day at reference temperature tau.
struct prism_fit {
    double base_kwh_per_day = 0;
    double slope_kwh_per_k_day = 0;
    double tau_c = 0;
    double r2 = 0;
    double nac_kwh = 0;            ///< normalised annual consumption = 365 base + slope x HDD0(tau)
    double heating_kwh = 0;        ///< slope x HDD0(tau)
    double base_annual_kwh = 0;    ///< 365.25... days x base; the part that does not follow the weather
    double nac_standard_error_kwh = 0;
    double normal_hdd = 0;         ///< [K day] annual HDD of the climate to tau
    bill_weather weather = bill_weather::normals;  ///< the least exact weather any bill was fitted with
    std::vector<std::pair<double, double>> points;  ///< (HDD per day, use per day [kWh/day]) per bill
};

/// Least-squares fit weighted by days, tau chosen for the best R^2 over [tau_low_c, tau_high_c], each
/// bill's HDD from its own weather (bill_hdd); the annual figures are normalised with the climate's
/// normal HDD at the fitted tau (PRISM, Fels 1986). Needs at least 3 periods.
prism_fit fit_prism(const std::vector<bill_period>& bills, const climate_model& climate, double tau_low_c,
                    double tau_high_c);

}  // namespace fw

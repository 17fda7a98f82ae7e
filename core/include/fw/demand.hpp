// Heat demand (climate/demand layer): heat loss with degree-days, and the PRISM fit of fuel
// bills against degree-days (Fels 1986, Energy and Buildings 9:5-18).
#pragma once
#include <optional>
#include <string>
#include <vector>

#include "fw/climate.hpp"

namespace fw {

/// Days since 1970-01-01 of a "YYYY-MM-DD" date; throws input_error for a malformed or impossible date.
long parse_day_number(const std::string& text, const std::string& path);

/// Month (0..11) and year of a day number.
int month_of_day(long day_number);
bool is_leap_year(int year);

/// [K day] Expected HDD to `base_c` over days first..last inclusive: each day carries its
/// month's HDD / days in the month.
double period_hdd(const climate_model& climate, long first_day, long last_day, double base_c);

/// One bill: the period (inclusive day numbers) and the fuel it used, as gross energy [kWh HHV].
struct bill_period {
    long first_day;
    long last_day;
    double fuel_kwh;
};

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
    std::vector<std::pair<double, double>> points;  ///< (HDD per day, use per day [kWh/day]) per bill
};

/// Least-squares fit weighted by days, tau chosen for the best R^2 over [tau_low_c, tau_high_c].
/// Needs at least 3 periods.
prism_fit fit_prism(const std::vector<bill_period>& bills, const climate_model& climate, double tau_low_c,
                    double tau_high_c);

}  // namespace fw

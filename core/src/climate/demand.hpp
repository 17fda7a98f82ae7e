// Heat demand (climate/demand layer): heat loss with degree-days, and the PRISM fit of fuel
// bills against degree-days (Fels 1986, Energy and Buildings 9:5-18).
#pragma once
#include <cstddef>
#include <map>
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

/// [W/K] The house's heat-loss coefficient from its design heat loss [W] between the indoor and the design
/// outdoor temperature [degC]: UA = Q_design / (T_in - T_design) (steady state, ASHRAE Handbook—Fundamentals,
/// residential heating load chapter).
double ua_from_design_heat_loss_w_per_k(double design_heat_loss_w, double indoor_c, double design_outdoor_c);

/// [degC] Balance point = T_in - internal gains / UA: the outdoor temperature below which the house needs
/// heat (ASHRAE Handbook—Fundamentals, degree-day and bin methods chapter).
double balance_point_from_gains_c(double indoor_c, double internal_gains_w, double ua_w_per_k);

/// The degree-day method: annual space heat = UA x HDD(balance point) x 24 h x C_D.
struct degree_day_heat {
    double hdd_k_day = 0;        ///< [K day] the climate's annual HDD to the balance point
    double uncorrected_kwh = 0;  ///< [kWh] UA x HDD x 24 h
    double space_heat_kwh = 0;   ///< [kWh] x the degree-day correction C_D (1 when none is given)
};

/// [kWh/year] The degree-day method on the climate's normal monthly HDD to `balance_point_c` (ASHRAE
/// Handbook—Fundamentals 1985-1993, degree-day method; C_D as entered, 1 for none).
degree_day_heat degree_day_space_heat(const climate_model& climate, double ua_w_per_k, double balance_point_c,
                                      double degree_day_correction);

/// Indexes of `bills` in the order of their first days.
std::vector<std::size_t> bills_in_date_order(const std::vector<bill_period>& bills);

/// Whether any bill starts on or before the last day of the bill before it (in date order): the sign of
/// dates written as meter reads, where one bill's end date is the next one's start.
bool bills_share_a_day(const std::vector<bill_period>& bills);

/// Where two bills meet, in date order: the days both count, or the days neither does.
struct bill_seam {
    std::size_t earlier = 0, later = 0;  ///< indexes into the bills
    long overlap_days = 0;                ///< days billed twice (0 when none)
    long gap_days = 0;                    ///< days between them no bill covers (0 when none)
};

/// The seams of consecutive bills in date order.
std::vector<bill_seam> bill_seams(const std::vector<bill_period>& bills);

/// A bill's days found in observed daily means [degC], and how many of its days were not.
struct observed_cover {
    std::vector<double> daily_mean_c;  ///< [degC] the days observed, in order
    long missing_days = 0;
    long period_days = 0;
    /// Enough to fit on: every day, or at most a tenth missing (the degree-days are then scaled up).
    bool usable() const { return missing_days == 0 || (missing_days * 10 <= period_days && !daily_mean_c.empty()); }
};

/// The observed days [degC by day number] of one bill's period.
observed_cover observed_days_of(const bill_period& bill, const std::map<long, double>& observed_c);

/// Days billed and the fuel [kWh HHV] on them, over all bills.
struct billed_total {
    long days = 0;
    double fuel_kwh = 0;
    /// [kWh/year] The fuel a year at the billed rate: fuel x 365 / days (not weather-normalised).
    double annual_fuel_kwh() const { return days > 0 ? fuel_kwh * 365.0 / static_cast<double>(days) : 0.0; }
};
billed_total billed_total_of(const std::vector<bill_period>& bills);

/// [degC] The range PRISM searches for the reference temperature: 40 to 75 degF where the climate is in
/// degF, else 5 to 24 degC (Fels 1986 searches a similar span; the bounds are common practice).
std::pair<double, double> prism_tau_range_c(bool fahrenheit);

/// What makes a PRISM fit's split between base use and heating uncertain.
struct fit_doubts {
    bool poor_fit = false;               ///< R^2 < 0.7
    bool tau_at_edge = false;            ///< the reference temperature within 0.5 K of the range searched
    bool every_period_heated = false;    ///< the warmest period still above 1 K day a day of HDD
    double least_hdd_per_day = 0;        ///< [K] the warmest period's HDD a day to tau
};

/// The doubts about `fit` searched over [tau_low_c, tau_high_c] (thresholds are common practice).
fit_doubts doubts_about(const prism_fit& fit, double tau_low_c, double tau_high_c);

/// Whether some bill's period touches one of the climate's three coldest months (by normal monthly mean).
bool bills_cover_coldest_months(const std::vector<bill_period>& bills, const climate_model& climate);

}  // namespace fw

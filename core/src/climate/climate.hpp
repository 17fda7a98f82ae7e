// Climate (climate/demand layer): monthly mean temperatures to degree-days and hourly bins by
// the method of Erbs, Klein & Beckman (1983), design temperatures from the bins, and climates
// rebuilt from monthly or annual degree-days. All temperatures here are in degC; the JSON layer
// converts.
#pragma once
#include <array>
#include <optional>
#include <string>
#include <vector>

namespace fw {

/// [days] Days in each month, January first.
std::array<int, 12> days_in_months(bool leap_year);

/// Erbs, Klein & Beckman (1983), ASHRAE Journal 25(6):60, as given in Duffie & Beckman, Solar
/// Engineering of Thermal Processes (from memory): the daily mean temperatures of a month follow a
/// logistic distribution; sigma_m = 1.45 - 0.0290 Tm + 0.0664 sigma_yr [degC];
/// DD = sigma_m N^1.5 [h/2 + ln(e^-ah + e^ah)/(2a)], h = (Tb - Tm)/(sigma_m sqrt N), a = 1.698.
inline constexpr double erbs_a = 1.698;

/// [K] Erbs's monthly sigma_m from the month's mean [degC] and the SD of the 12 monthly means [K].
double erbs_sigma_m(double month_mean_c, double sigma_year_k);

/// [K] Standard deviation of the daily mean temperatures the Erbs logistic implies:
/// sigma_m sqrt(N) x pi / (sqrt(3) x 2a).
double erbs_daily_sd(double sigma_m, int days);

/// [K day] Heating degree-days of a month whose daily means are logistic with mean `mean_c` and
/// standard deviation `daily_sd_k`, to base `base_c` (the Erbs formula written with the daily SD).
double logistic_hdd(double mean_c, double daily_sd_k, double base_c, int days);

/// [K day] Cooling degree-days, same distribution: CDD = HDD - N (Tb - Tm).
double logistic_cdd(double mean_c, double daily_sd_k, double base_c, int days);

/// [K day] Degree-days with normally distributed daily means (Thom; Krarti, Energy Audit of
/// Building Systems): DD = sigma N [Z Phi(Z) + phi(Z)], Z = (Tb - Tm)/sigma.
double normal_hdd(double mean_c, double daily_sd_k, double base_c, int days);

/// One temperature bin: centre [degC] and hours per year.
struct temperature_bin {
    double t_c;
    double hours;
};

/// A climate in model form: 12 monthly means with the SD of their daily means.
struct climate_model {
    std::array<double, 12> monthly_mean_c{};
    std::array<double, 12> daily_sd_k{};
    bool leap_year = false;
    double daily_range_k = 10.0;  ///< [K] mean daily max - min, for the hourly profile
    std::vector<std::string> trace;
};

/// [K] Default daily range when none is given: an assumption typical of mid-latitude inland sites.
inline constexpr double default_daily_range_k = 10.0;

/// Builds the model from monthly means; `daily_sd_k` given per month or from Erbs's correlation.
climate_model climate_from_means(const std::array<double, 12>& monthly_mean_c,
                                 const std::optional<std::array<double, 12>>& daily_sd_k, bool leap_year,
                                 double daily_range_k = default_daily_range_k);

/// Rebuilds monthly means from monthly HDD [K day] to `base_c` by inverting the Erbs formula.
climate_model climate_from_monthly_hdd(const std::array<double, 12>& monthly_hdd, double base_c, bool leap_year,
                                       double daily_range_k = default_daily_range_k);

/// Rebuilds a climate from annual HDD [K day] to `base_c` and the 99 % design temperature [degC]:
/// monthly means on an annual cosine (coldest on 20 January, northern hemisphere) whose mean and
/// amplitude are solved so the model reproduces both.
climate_model climate_from_annual_hdd(double annual_hdd, double base_c, double design_99_c, bool leap_year,
                                      double daily_range_k = default_daily_range_k);

/// [K day] Monthly HDD of the model to `base_c`.
std::array<double, 12> monthly_hdd(const climate_model& climate, double base_c);

/// Hourly temperature bins of `width_k` [K] centred on multiples of the width: the daily means'
/// logistic distribution combined with the Erbs diurnal profile of the climate's daily range.
/// Hours sum to 8760 (8784 in a leap year).
std::vector<temperature_bin> hourly_bins(const climate_model& climate, double width_k);

/// [h] Hours by month (January first) and hour of the day (0 = 0:00-1:00).
using month_hour_hours = std::array<std::array<double, 24>, 12>;

/// [h] When an observed bin's hours fell: by hour of the day (0 = 0:00-1:00) and by month (January first),
/// each adding up to the bin's hours.
struct bin_times {
    std::array<double, 24> by_hour{};
    std::array<double, 12> by_month{};
};

/// Each bin's hours by month and hour of the day: the model's hours in the bin (each month's daily means
/// logistic, each hour offset by Erbs's diurnal profile, Erbs hour h read as the temperature at clock time h:00,
/// hour 24 as 0:00, standing for the half hours either side of it), scaled to the bin's own hours (so observed bins keep theirs); the outermost bins take the tails.
/// A bin the model puts no hours in is spread evenly over the year. Bins in ascending order, `width_k` wide.
/// Where `observed` (one per bin, or empty) gives when a bin's hours fell, the model's month-by-hour table is
/// fitted to those two sums by iterative proportional fitting (Deming & Stephan 1940), the model keeping
/// only how hours of the day and months go together.
std::vector<month_hour_hours> bin_calendar(const climate_model& climate, const std::vector<temperature_bin>& bins,
                                           double width_k, const std::vector<bin_times>& observed = {});

/// [h] `table` scaled by rows and columns (iterative proportional fitting, Deming & Stephan 1940) until its
/// months add up to `by_month` and its hours of the day to `by_hour` (both with the same total); every cell
/// starts at least at a thousandth of the mean cell, so that hours the seed has none of can be placed.
month_hour_hours fit_to_sums(month_hour_hours table, const bin_times& sums);

/// [degC] Temperature below which `fraction` of the year's hours lie (0.01 -> the 99 % design value).
double design_temperature(const climate_model& climate, double fraction);

/// [degC] Temperature below which `fraction` of the bins' hours lie, the hours of each bin spread
/// evenly over its width `width_k` [K] (bins in ascending order).
double design_temperature_from_bins(const std::vector<temperature_bin>& bins, double width_k, double fraction);

/// [1] The factor on every month's daily-mean spread that makes the model's 99 % design temperature
/// `design_99_c` (Illinois root of design(factor) - design_99_c; the design temperature falls as the spread
/// widens), searched over [0.2, 4]; nullopt when no factor in that range reaches it.
std::optional<double> spread_factor_for_design(const climate_model& climate, double design_99_c);

/// [1] Erbs's diurnal profile: the hour's departure from the daily mean as a fraction of the daily
/// range, hour 1..24: 0.4632 cos(t - 3.805) + 0.0984 cos(2t - 0.360) + 0.0168 cos(3t - 0.822)
/// + 0.0138 cos(4t - 3.513), t = 2 pi (hour - 1) / 24 (Duffie & Beckman, from memory).
double diurnal_fraction(int hour);

}  // namespace fw

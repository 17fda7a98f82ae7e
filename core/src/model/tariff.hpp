// Time-of-use electricity (model layer): a price schedule's periods by hour, day type and month, the
// year's electricity placed in the hours it is used (month x hour of the day), and its kWh and cost by period.
#pragma once
#include <array>
#include <optional>
#include <string>
#include <vector>

namespace fw {

/// Which days of the week a period applies to.
enum class day_set { all, weekdays, weekends };

/// One period of a time-of-use price: `amount_per_kwh` [currency/kWh] in its hours, days and months.
struct schedule_period {
    std::string name;
    double amount_per_kwh = 0;
    std::array<bool, 48> half_hours{};  ///< half hour s covers s/2 h to (s+1)/2 h local time (slot 33 is 16:30-17:00)
    day_set days = day_set::all;
    std::array<bool, 12> months{};  ///< January first
};

/// [1] Half hours in a day: a period's boundaries fall on whole or half hours (as UK half-hourly settlement and
/// tariffs such as 0:30-7:30 have them).
inline constexpr int half_hours_per_day = 48;

/// A time-of-use price: its rows cover every half hour of every day of the year once; rows may share a name (and then a price).
using price_schedule = std::vector<schedule_period>;

/// [kWh] Electricity by month (January first) and hour of the day (0 = 0:00-1:00), over all days of the month.
using month_hour_kwh = std::array<std::array<double, 24>, 12>;

/// [1] The share of a month's days that are weekdays: 5/7, the week's own share (a given month has at
/// most 2 weekdays more or fewer than 5/7 of its days; stated, not a calendar of one year).
inline constexpr double weekday_share = 5.0 / 7.0;

/// A half hour of the week no period covers (`second` < 0) or two periods cover.
struct schedule_clash {
    int month = 0;      ///< 0 = January
    int half_hour = 0;  ///< where it starts: 0 = 0:00-0:30 (a run over midnight starts the evening before)
    int half_hours = 1;  ///< how long it lasts: the following half hours in the same periods (or none)
    bool weekend = false;
    int first = -1, second = -1;  ///< period indices; first < 0: no period
};

/// The first run of half hours (by month, weekday before weekend, time of day) in no period or in two, as long
/// as the same periods (or none) cover it; nullopt when every half hour of every day type and month falls in
/// exactly one period.
std::optional<schedule_clash> schedule_coverage_problem(const price_schedule& schedule);

/// "16:15" for 16.25 h (minutes rounded); `two_digit_hour` gives "06:00" for 6 h.
std::string clock_text(double hours, bool two_digit_hour = false);

/// "weekdays 14:00-16:30 in July" for messages.
std::string clash_text(const schedule_clash& clash);

/// One period's share of a year's electricity.
struct period_use {
    std::string name;
    double kwh = 0;   ///< [kWh/year]
    double cost = 0;  ///< [currency/year]
};

/// kWh and cost by period: each month-hour's kWh split 5/7 weekdays, 2/7 weekends and evenly between the
/// hour's two halves (use is taken as steady within an hour), then summed into the period covering each half (rows of one name are one period, in the order their names first appear). The periods'
/// kWh add up to the profile's total.
std::vector<period_use> split_by_period(const price_schedule& schedule, const month_hour_kwh& kwh);

/// "812 kWh peak x 0.31 + ..." for traces: the profile's kWh by period, scaled to `kwh`, with each period's price.
std::string periods_text(const price_schedule& schedule, const month_hour_kwh& profile, double kwh);

/// [currency/kWh] A schedule's mean price over every hour of the year (what a flat load pays a kWh).
double mean_price_per_kwh(const price_schedule& schedule);

/// [kWh] `kwh` spread evenly over every hour of the year (each month by its days).
month_hour_kwh flat_profile(double kwh, bool leap_year);

/// [1] Share of a day's hot-water draws in each hour (0 = 0:00-1:00): morning and evening peaks,
/// a stated shape (common practice), summing to 1.
const std::array<double, 24>& hot_water_day_shape();

/// [kWh] `kwh` spread over the year by the days of each month and the hot-water day shape.
month_hour_kwh hot_water_profile(double kwh, bool leap_year);

/// [kWh] The sum of a profile.
double profile_total(const month_hour_kwh& kwh);

/// [kWh] a + scale x b, hour by hour.
month_hour_kwh add_profile(const month_hour_kwh& a, const month_hour_kwh& b, double scale = 1.0);

}  // namespace fw

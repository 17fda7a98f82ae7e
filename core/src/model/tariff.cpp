#include "model/tariff.hpp"

#include <cmath>

#include "base/error.hpp"
#include "climate/climate.hpp"

namespace fw {

namespace {

bool covers(const schedule_period& period, int month, int half_hour, bool weekend) {
    if (!period.months[static_cast<std::size_t>(month)] || !period.half_hours[static_cast<std::size_t>(half_hour)]) return false;
    return period.days == day_set::all || (period.days == day_set::weekends) == weekend;
}

const char* const month_names[12] = {"January", "February", "March",     "April",   "May",      "June",
                                     "July",    "August",   "September", "October", "November", "December"};

}  // namespace

std::optional<schedule_clash> schedule_coverage_problem(const price_schedule& schedule) {
    // The first two periods covering a half hour (-1: none).
    const auto covering = [&](int month, int half_hour, bool weekend) {
        std::pair<int, int> found{-1, -1};
        for (std::size_t p = 0; p < schedule.size() && found.second < 0; ++p)
            if (covers(schedule[p], month, half_hour, weekend)) (found.first < 0 ? found.first : found.second) = static_cast<int>(p);
        return found;
    };
    for (int month = 0; month < 12; ++month)
        for (const bool weekend : {false, true})
            for (int half_hour = 0; half_hour < half_hours_per_day; ++half_hour) {
                const auto found = covering(month, half_hour, weekend);
                if (found.first >= 0 && found.second < 0) continue;
                schedule_clash clash{month, half_hour, 1, weekend, found.first, found.second};
                while (half_hour + clash.half_hours < half_hours_per_day && covering(month, half_hour + clash.half_hours, weekend) == found)
                    ++clash.half_hours;
                // a run from 0:00 may have begun the evening before (23:00-01:00)
                if (half_hour == 0)
                    while (clash.half_hours < half_hours_per_day &&
                           covering(month, (clash.half_hour + half_hours_per_day - 1) % half_hours_per_day, weekend) == found) {
                        clash.half_hour = (clash.half_hour + half_hours_per_day - 1) % half_hours_per_day;
                        ++clash.half_hours;
                    }
                return clash;
            }
    return std::nullopt;
}

std::string clock_text(double hours, bool two_digit_hour) {
    const long minutes = std::lround(hours * 60);
    const long h = minutes / 60, m = minutes % 60;
    return (two_digit_hour && h < 10 ? "0" : "") + std::to_string(h) + (m < 10 ? ":0" : ":") + std::to_string(m);
}

std::string clash_text(const schedule_clash& clash) {
    const auto clock = [](int half_hour) { return clock_text(half_hour / 2.0, true); };
    return std::string(clash.weekend ? "weekends " : "weekdays ") + clock(clash.half_hour) + "-" +
           clock(clash.half_hour + clash.half_hours > half_hours_per_day ? clash.half_hour + clash.half_hours - half_hours_per_day
                                                                         : clash.half_hour + clash.half_hours) +
           " in " + month_names[clash.month];
}

std::vector<period_use> split_by_period(const price_schedule& schedule, const month_hour_kwh& kwh) {
    // Rows of the same name are one period (one price in several seasons or hours).
    std::vector<period_use> out;
    std::vector<std::size_t> group_of(schedule.size());
    for (std::size_t p = 0; p < schedule.size(); ++p) {
        std::size_t g = 0;
        while (g < out.size() && out[g].name != schedule[p].name) ++g;
        if (g == out.size()) out.push_back({schedule[p].name, 0.0, 0.0});
        group_of[p] = g;
    }
    for (int month = 0; month < 12; ++month)
        for (int hour = 0; hour < 24; ++hour)
            for (const bool weekend : {false, true})
                for (const int half_hour : {2 * hour, 2 * hour + 1}) {
                    const double share = (weekend ? 1 - weekday_share : weekday_share) / 2;
                    for (std::size_t p = 0; p < schedule.size(); ++p)
                        if (covers(schedule[p], month, half_hour, weekend)) {
                            const double used = kwh[static_cast<std::size_t>(month)][static_cast<std::size_t>(hour)] * share;
                            out[group_of[p]].kwh += used;
                            out[group_of[p]].cost += used * schedule[p].amount_per_kwh;
                            break;
                        }
                }
    return out;
}

std::string periods_text(const price_schedule& schedule, const month_hour_kwh& profile, double kwh) {
    const double total = profile_total(profile);
    const double scale = total > 0 ? kwh / total : 0.0;
    const auto uses = split_by_period(schedule, profile);
    std::string out;
    for (const auto& use : uses)
        out += (out.empty() ? "" : " + ") + format_fixed(use.kwh * scale, 0) + " kWh " + use.name + " x " +
               format_number(use.kwh > 0 ? use.cost / use.kwh : 0.0);
    double cost = 0;
    for (const auto& use : uses) cost += use.cost * scale;
    return out + " = " + format_fixed(cost, 2);
}

double mean_price_per_kwh(const price_schedule& schedule) {
    double cost = 0;
    for (const auto& use : split_by_period(schedule, flat_profile(1.0, false))) cost += use.cost;
    return cost;
}

month_hour_kwh flat_profile(double kwh, bool leap_year) {
    const auto days = days_in_months(leap_year);
    const double year_hours = 24.0 * (leap_year ? 366 : 365);
    month_hour_kwh out{};
    for (std::size_t m = 0; m < 12; ++m)
        for (auto& hour : out[m]) hour = kwh * days[m] / year_hours;
    return out;
}

const std::array<double, 24>& hot_water_day_shape() {
    // Percent of the day's draws by hour: low at night, a morning peak (7-9 h) and a longer evening one (18-21 h).
    static const std::array<double, 24> shape = [] {
        const std::array<double, 24> percent = {1.0, 0.5, 0.5, 0.5, 0.5, 1.5, 5.5, 8.0, 8.0, 6.0, 5.0, 4.5,
                                                5.5, 4.0, 3.5, 3.5, 4.0, 5.0, 7.0, 7.0, 7.0, 5.5, 4.0, 2.5};
        std::array<double, 24> out{};
        for (std::size_t h = 0; h < 24; ++h) out[h] = percent[h] / 100.0;
        return out;
    }();
    return shape;
}

month_hour_kwh hot_water_profile(double kwh, bool leap_year) {
    const auto days = days_in_months(leap_year);
    const double year_days = leap_year ? 366 : 365;
    month_hour_kwh out{};
    for (std::size_t m = 0; m < 12; ++m)
        for (std::size_t h = 0; h < 24; ++h) out[m][h] = kwh * days[m] / year_days * hot_water_day_shape()[h];
    return out;
}

double profile_total(const month_hour_kwh& kwh) {
    double total = 0;
    for (const auto& month : kwh)
        for (double hour : month) total += hour;
    return total;
}

month_hour_kwh add_profile(const month_hour_kwh& a, const month_hour_kwh& b, double scale) {
    month_hour_kwh out = a;
    for (std::size_t m = 0; m < 12; ++m)
        for (std::size_t h = 0; h < 24; ++h) out[m][h] += scale * b[m][h];
    return out;
}

}  // namespace fw

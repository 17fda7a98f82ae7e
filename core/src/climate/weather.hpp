// Weather files (climate layer): daily or hourly temperatures as a user downloads them from a
// national weather service (CSV with named columns, or the two-header-line TMY3 layout), read into
// daily means, and the climate they imply where they span whole years: monthly means, the spread of
// daily means, the daily range, annual degree-days, and for hourly files the hourly bins and the
// 99 % / 99.6 % design temperatures taken from the hours themselves.
#pragma once
#include <array>
#include <optional>
#include <string>
#include <vector>

#include "climate/climate.hpp"
#include "base/error.hpp"

namespace fw {

enum class weather_format { daily, hourly };

/// The columns to read, by header name (case-insensitive); empty: recognised from the header.
struct weather_columns {
    std::string date, time, mean, max, min, temperature;
};

/// How to read a weather file: the format and unit when the file does not make them plain.
struct weather_read_options {
    std::optional<weather_format> format;
    std::optional<bool> fahrenheit;  ///< the temperatures' unit when the header does not name it
    weather_columns columns;
};

/// One day of observed weather [degC].
struct weather_day {
    long day = 0;  ///< days since 1970-01-01
    double mean_c = 0;
    std::optional<double> range_k;  ///< [K] daily max - min, where the file gives it
};

/// A weather file as read: daily means (and, from an hourly file, every hour).
struct weather_series {
    weather_format format = weather_format::daily;
    bool fahrenheit = false;  ///< the file's temperature unit
    std::string station;
    std::vector<weather_day> days;  ///< ascending, one per observed day
    std::vector<double> hourly_c;   ///< hourly files: every hour read [degC]
    std::vector<long> hourly_day;   ///< hourly files: each reading's day (days since 1970-01-01)
    std::vector<double> hourly_clock;  ///< hourly files: each reading's clock time [h, 0 to 24] (13:51 is 13.85)
    std::vector<std::string> notes; ///< what was read: layout, columns, unit, rules applied
    std::vector<issue> warnings;    ///< rows skipped and why
};

/// [bytes] The largest weather file read.
inline constexpr std::size_t max_weather_bytes = 32u << 20;

/// Reads a weather CSV; throws input_error (path "/text" with the line, "/unit", "/format" or
/// "/columns/...") when the file cannot be read as asked.
weather_series read_weather_csv(const std::string& text, const weather_read_options& options);

/// The climate of a weather file that spans whole years (every calendar month observed on at least
/// 20 days): monthly means and the spread of daily means about them, daily range, annual HDD, and
/// from hourly files the bins (hours a year) and design temperatures.
struct weather_climate {
    std::array<double, 12> monthly_mean_c{};
    std::array<double, 12> monthly_sd_k{};
    std::optional<double> daily_range_k;
    double annual_hdd_k_day = 0;  ///< to base_c, per year of observed days
    double base_c = 18.3;
    double years = 0;             ///< observed days / 365.25
    std::vector<temperature_bin> bins;  ///< hourly files only
    std::vector<bin_times> bins_when;   ///< hourly files only: when each bin's hours fell (a reading stands for the
                                        ///< half hours either side of its time), scaled as the bins are
    double bin_width_k = 1;
    std::optional<double> design_99_c, design_996_c;  ///< hourly files only
};

/// The climate of the series, or nullopt with the reason in `why_not` when it does not span whole years.
std::optional<weather_climate> climate_of_weather(const weather_series& series, double base_c, double bin_width_k,
                                                  std::string& why_not);

/// [degC] The temperature below which `fraction` of the hours lie: the empirical quantile, linear
/// between order statistics at position fraction x (n - 1) (Hyndman & Fan 1996, type 7).
double hourly_quantile(std::vector<double> hours_c, double fraction);

}  // namespace fw

// Weather files as users download them: invented files in the layouts national weather services
// export (a daily CSV with DATE/TAVG/TMAX/TMIN, a daily CSV with "Max Temp (°C)" headers and flag
// columns, a semicolon CSV with decimal commas, the two-header-line TMY3 layout, an hourly CSV with
// several readings in some hours), read into daily means and the climate they imply. Every expected
// value is worked out in the test from the rows it wrote.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "fw/api.hpp"
#include "climate/demand.hpp"
#include "climate/weather.hpp"

namespace {

using nlohmann::json;

json weather(const std::string& text, const json& options = json::object()) {
    json request = options;
    request["text"] = text;
    return json::parse(fw::weather_json(request.dump()));
}

/// An invented year of daily highs and lows [degF] at an invented station: a seasonal cosine and a
/// fixed wobble, so every day differs.
struct invented_day {
    std::string date;
    double high, low;
};
std::vector<invented_day> invented_year(int year) {
    std::vector<invented_day> out;
    const long first = fw::parse_day_number(std::to_string(year) + "-01-01", "");
    const long last = fw::parse_day_number(std::to_string(year) + "-12-31", "");
    for (long day = first; day <= last; ++day) {
        const double phase = 2 * 3.14159265358979 * static_cast<double>(day - first - 20) / 365.0;
        const double mean = 52 - 22 * std::cos(phase) + 7 * std::sin(0.9 * static_cast<double>(day));
        const double range = 16 + 4 * std::cos(1.7 * static_cast<double>(day));
        // Whole degrees, as the US daily summaries print them.
        out.push_back({fw::day_text(day), std::round(mean + range / 2), std::round(mean - range / 2)});
    }
    return out;
}

TEST(weather_file, a_daily_summary_with_quoted_station_names) {
    // DATE, TAVG (mostly empty, as it often is), TMAX, TMIN; the station name holds a comma inside quotes.
    std::string csv = "\"STATION\",\"NAME\",\"DATE\",\"TAVG\",\"TMAX\",\"TMIN\"\n";
    const auto year = invented_year(2023);
    double hdd65 = 0;
    for (const auto& d : year) {
        csv += "\"USW00099999\",\"INVENTED FIELD AIRPORT, ZZ US\",\"" + d.date + "\",\"\",\"" +
               std::to_string(static_cast<int>(d.high)) + "\",\"" + std::to_string(static_cast<int>(d.low)) + "\"\n";
        hdd65 += std::max(0.0, 65 - (d.high + d.low) / 2);
    }
    const auto result = weather(csv, {{"unit", "degF"}});
    ASSERT_TRUE(result.at("errors").empty()) << result.at("errors").dump();
    EXPECT_EQ(result.at("format"), "daily");
    EXPECT_EQ(result.at("unit"), "degF");
    EXPECT_EQ(result.at("station"), "USW00099999");
    EXPECT_EQ(result.at("days"), 365);
    EXPECT_EQ(result.at("first_date"), "2023-01-01");
    // HDD to 65 degF from (max + min) / 2, summed by hand above.
    EXPECT_NEAR(result.at("summary").at("annual_hdd").get<double>(), hdd65, 1e-9);
    EXPECT_EQ(result.at("summary").at("design_basis"), "model");
    const auto& observed = result.at("observed").at("daily_mean");
    EXPECT_EQ(observed.at(10).at(0), "2023-01-11");
    EXPECT_NEAR(observed.at(10).at(1).get<double>(), (year[10].high + year[10].low) / 2, 1e-9);
    // January's mean and spread of daily means, by hand.
    double sum = 0, squares = 0;
    for (int i = 0; i < 31; ++i) sum += (year[i].high + year[i].low) / 2;
    const double mean = sum / 31;
    for (int i = 0; i < 31; ++i) squares += std::pow((year[i].high + year[i].low) / 2 - mean, 2);
    const auto& climate = result.at("climate");
    EXPECT_NEAR(climate.at("monthly_mean").at(0).get<double>(), mean, 1e-9);
    EXPECT_NEAR(climate.at("monthly_sd").at(0).get<double>(), std::sqrt(squares / 31), 1e-9);
    // The climate evaluates as a scenario climate as it is.
    const auto check = json::parse(fw::climate_json(climate.dump()));
    EXPECT_TRUE(check.at("errors").empty()) << check.dump();
    // Without a unit the file cannot be read: a message at the unit.
    const auto no_unit = weather(csv);
    EXPECT_EQ(no_unit.at("errors").at(0).at("path"), "/unit");
    EXPECT_EQ(no_unit.at("errors").at(0).at("message"),
              "the file does not say whether its temperatures are in degC or degF; choose the unit");
}

TEST(weather_file, headers_that_name_their_unit_and_flag_columns) {
    // "Max Temp (°C)" with a flag column beside each value; the mean column used where max/min are missing.
    std::string csv = "\"Station Name\",\"Climate ID\",\"Date/Time\",\"Year\",\"Month\",\"Day\",\"Max Temp (\xC2\xB0" "C)\","
                      "\"Max Temp Flag\",\"Min Temp (\xC2\xB0" "C)\",\"Min Temp Flag\",\"Mean Temp (\xC2\xB0" "C)\",\"Mean Temp Flag\"\n"
                      "\"INVENTED HARBOUR\",\"0000001\",\"2024-01-01\",\"2024\",\"01\",\"01\",\"-2.5\",\"\",\"-9.5\",\"\",\"-6.0\",\"\"\n"
                      "\"INVENTED HARBOUR\",\"0000001\",\"2024-01-02\",\"2024\",\"01\",\"02\",\"\",\"M\",\"\",\"M\",\"-3.2\",\"E\"\n"
                      "\"INVENTED HARBOUR\",\"0000001\",\"2024-01-03\",\"2024\",\"01\",\"03\",\"\",\"M\",\"\",\"M\",\"\",\"M\"\n";
    const auto result = weather(csv, {{"unit", "degF"}});
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("unit"), "degC");  // the header says so; the chosen unit gives way, with a warning
    const auto& daily = result.at("observed").at("daily_mean");
    ASSERT_EQ(daily.size(), 2u);
    EXPECT_NEAR(daily.at(0).at(1).get<double>(), -6.0, 1e-12);  // (-2.5 + -9.5) / 2
    EXPECT_NEAR(daily.at(1).at(1).get<double>(), -3.2, 1e-12);
    EXPECT_TRUE(result.at("climate").is_null());
    std::vector<std::string> warnings;
    for (const auto& w : result.at("warnings")) warnings.push_back(w.at("message"));
    EXPECT_NE(std::find(warnings.begin(), warnings.end(), "1 row has no temperature and was skipped"), warnings.end());
    EXPECT_NE(std::find(warnings.begin(), warnings.end(),
                        "the file says its temperatures are in degC (column \"Mean Temp (\xC2\xB0" "C)\"); they are read so, "
                        "not in the unit chosen"),
              warnings.end());
}

TEST(weather_file, semicolons_and_decimal_commas) {
    const std::string csv = "STATIONS_ID;MESS_DATUM;QN_4;TXK;TNK;TMK;eor\n"
                            "9999;20240101;10;4,5;-1,5;1,2;eor\n"
                            "9999;20240102;10;-999;-999;-999;eor\n"
                            "9999;20240103;10;2,0;-3,0;-0,4;eor\n";
    const auto result = weather(csv);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("unit"), "degC");
    const auto& daily = result.at("observed").at("daily_mean");
    ASSERT_EQ(daily.size(), 2u);
    EXPECT_NEAR(daily.at(0).at(1).get<double>(), 1.5, 1e-12);  // (4.5 - 1.5) / 2
    EXPECT_NEAR(daily.at(1).at(1).get<double>(), -0.5, 1e-12);
}

TEST(weather_file, a_typical_year_in_the_tmy3_layout_gives_bins_and_design_temperatures_from_its_hours) {
    // Invented TMY3-layout year: 8760 hours, hour-ending 01:00..24:00, dry-bulb in column "Dry-bulb (C)".
    std::string csv = "999999,\"INVENTED CAPE\",ZZ,-5.0,40.000,-70.000,10\n"
                      "Date (MM/DD/YYYY),Time (HH:MM),ETR (W/m^2),Dry-bulb (C),Dew-point (C)\n";
    std::vector<double> hours;
    double hdd = 0;
    const long first = fw::parse_day_number("2001-01-01", "");
    for (long day = first; day < first + 365; ++day) {
        const auto date = fw::day_text(day);
        const std::string us = date.substr(5, 2) + "/" + date.substr(8, 2) + "/" + date.substr(0, 4);
        double sum = 0;
        for (int h = 1; h <= 24; ++h) {
            const double t = std::round(10 * (8 - 9 * std::cos(2 * 3.14159265358979 * static_cast<double>(day - first - 20) / 365.0) +
                                              4 * std::sin(2 * 3.14159265358979 * (h - 9) / 24.0) + 3 * std::sin(1.3 * static_cast<double>(day)))) /
                             10;
            hours.push_back(t);
            sum += t;
            char line[96];
            std::snprintf(line, sizeof line, "%s,%02d:00,0,%.1f,-20.0\n", us.c_str(), h, t);
            csv += line;
        }
        hdd += std::max(0.0, 18.3 - sum / 24);
    }
    const auto result = weather(csv);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("format"), "hourly");
    EXPECT_EQ(result.at("hours"), 8760);
    EXPECT_EQ(result.at("station"), "INVENTED CAPE, ZZ");
    EXPECT_NEAR(result.at("summary").at("annual_hdd").get<double>(), hdd, 1e-9);
    // 99 % and 99.6 % design temperatures: the 1 % and 0.4 % quantiles of the hours (linear between
    // order statistics, position p (n - 1)), worked out here from the sorted hours.
    std::sort(hours.begin(), hours.end());
    const auto quantile = [&](double p) {
        const double position = p * (hours.size() - 1);
        const auto below = static_cast<std::size_t>(position);
        return hours[below] + (position - below) * (hours[below + 1] - hours[below]);
    };
    EXPECT_NEAR(result.at("summary").at("design_temperature_99").get<double>(), quantile(0.01), 1e-9);
    EXPECT_NEAR(result.at("summary").at("design_temperature_996").get<double>(), quantile(0.004), 1e-9);
    const auto& climate = result.at("climate");
    EXPECT_EQ(climate.at("bin_width"), 1.0);
    double total = 0, below_zero = 0;
    for (const auto& bin : climate.at("bins")) {
        total += bin.at("hours").get<double>();
        if (bin.at("t").get<double>() < 0) below_zero += bin.at("hours").get<double>();
    }
    EXPECT_NEAR(total, 8760, 1e-9);
    // Hours in the bins centred below 0 degC are the hours below -0.5 degC.
    EXPECT_NEAR(below_zero, static_cast<double>(std::count_if(hours.begin(), hours.end(), [](double t) { return t < -0.5; })), 1e-9);
    // The climate with its bins evaluates: its design temperature is the hours' own.
    const auto check = json::parse(fw::climate_json(climate.dump()));
    ASSERT_TRUE(check.at("errors").empty()) << check.dump();
    EXPECT_EQ(check.at("bins_from"), "data");
}

TEST(weather_file, each_bin_keeps_when_its_hours_fell_and_time_of_use_uses_it) {
    // Invented TMY3-layout year, cold only before dawn: -10 degC at 01:00..06:00, 15 degC at the other hours.
    std::string csv = "999999,\"INVENTED HOLLOW\",ZZ,-5.0,40.000,-70.000,10\n"
                      "Date (MM/DD/YYYY),Time (HH:MM),Dry-bulb (C)\n";
    const long first = fw::parse_day_number("2001-01-01", "");
    for (long day = first; day < first + 365; ++day) {
        const auto date = fw::day_text(day);
        for (int h = 1; h <= 24; ++h) {
            char line[64];
            std::snprintf(line, sizeof line, "%s/%s/%s,%02d:00,%.1f\n", date.substr(5, 2).c_str(), date.substr(8, 2).c_str(),
                          date.substr(0, 4).c_str(), h, h <= 6 ? -10.0 : 15.0);
            csv += line;
        }
    }
    const auto result = weather(csv);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& bins = result.at("climate").at("bins");
    ASSERT_EQ(bins.size(), 2u);
    // A reading at h:00 stands for the half hours either side: the cold bin's 6 x 365 hours fall half an hour
    // a day in 0:00-1:00 and 6:00-7:00, a whole hour in 1:00-2:00 .. 5:00-6:00; by month, 6 hours a day.
    const auto& cold = bins[0];
    EXPECT_EQ(cold.at("t"), -10);
    EXPECT_NEAR(cold.at("hours").get<double>(), 2190, 1e-9);
    for (int slot = 0; slot < 24; ++slot)
        EXPECT_NEAR(cold.at("by_hour")[slot].get<double>(), slot == 0 || slot == 6 ? 182.5 : slot <= 5 ? 365 : 0, 1e-9) << slot;
    const int days[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    for (int m = 0; m < 12; ++m) EXPECT_NEAR(cold.at("by_month")[m].get<double>(), 6.0 * days[m], 1e-9) << m;

    // Electric resistance heat by degree-hours below 18 degC, night 0:00-6:00 and day 6:00-24:00. By hand, from
    // the bins' times: the cold bin has 2007.5 night hours of 2190 at 28 K, the warm one 182.5 (its 24:00
    // readings) of 6570 at 3 K, so night = (28 x 2007.5 + 3 x 182.5) / (28 x 2190 + 3 x 6570) of the heat.
    const json scenario = {
        {"schema", "fuelwright.scenario/1"},
        {"settings", {{"units", "metric"}, {"currency", "EUR"}}},
        {"climate", result.at("climate")},
        {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 10000}, {"unit", "kWh"}}}, {"balance_point", {{"value", 18}, {"unit", "degC"}}}}},
        {"options", json::array({{{"id", "r"}, {"fuel", "electricity"},
                                  {"price", {{"per", "kWh"}, {"schedule", json::array({{{"name", "night"}, {"amount", 0.1}, {"hours", {0, 6}}},
                                                                                        {{"name", "day"}, {"amount", 0.3}, {"hours", {6, 24}}}})}}},
                                  {"system", {{"kind", "electric-resistance"}, {"efficiency", {{"value", 1}, {"rating", "COP"}}}}}}})}};
    const auto answer = json::parse(fw::evaluate_json(scenario.dump()));
    ASSERT_TRUE(answer.at("errors").empty()) << answer.at("errors").dump();
    const auto& option = answer.at("options")[0];
    const double night_share = (28 * 2007.5 + 3 * 182.5) / (28 * 2190.0 + 3 * 6570.0);
    EXPECT_NEAR(option.at("electricity_periods")[0].at("kwh").get<double>(), 10000 * night_share, 1e-4);
    EXPECT_NEAR(option.at("electricity_periods")[1].at("kwh").get<double>(), 10000 * (1 - night_share), 1e-4);
    // Without the times the model's calendar places the cold hours where its climate puts them (elsewhere).
    json untimed = scenario;
    for (auto& bin : untimed["climate"]["bins"]) {
        bin.erase("by_hour");
        bin.erase("by_month");
    }
    const auto model = json::parse(fw::evaluate_json(untimed.dump()));
    EXPECT_GT(std::fabs(model.at("options")[0].at("electricity_periods")[0].at("kwh").get<double>() - 10000 * night_share), 1000);
}

TEST(weather_file, a_reading_at_51_minutes_past_stands_for_the_half_hours_around_it) {
    // An invented hourly export with its readings at hh:51 (as airport reports come), -10 degC at 1:51..6:51.
    std::string csv = "DATE,HourlyDryBulbTemperature\n";
    const long first = fw::parse_day_number("2023-01-01", "");
    for (long day = first; day < first + 365; ++day)
        for (int h = 0; h < 24; ++h) {
            char line[64];
            std::snprintf(line, sizeof line, "%sT%02d:51:00,%d\n", fw::day_text(day).c_str(), h, h >= 1 && h <= 6 ? -10 : 15);
            csv += line;
        }
    const auto result = weather(csv, {{"unit", "degC"}});
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& cold = result.at("climate").at("bins")[0];
    ASSERT_EQ(cold.at("t"), -10);
    // 1:51 stands for 1:21-2:21: 0.65 h in 1-2 h and 0.35 h in 2-3 h; so 1-2 h gets 0.65 a day, 2-3 .. 6-7 h a
    // whole hour, 7-8 h 0.35 (6:51 stands for 6:21-7:21).
    for (int slot = 0; slot < 24; ++slot) {
        const double per_day = slot == 1 ? 0.65 : slot >= 2 && slot <= 6 ? 1.0 : slot == 7 ? 0.35 : 0.0;
        EXPECT_NEAR(cold.at("by_hour")[slot].get<double>(), 365 * per_day, 1e-9) << slot;
    }
}

TEST(weather_file, bin_times_are_checked_where_they_are_given) {
    const auto error_for = [](json bins) {
        const json scenario = {{"schema", "fuelwright.scenario/1"},
                               {"settings", {{"units", "metric"}, {"currency", "EUR"}}},
                               {"climate", {{"unit", "degC"}, {"monthly_mean", json::array({-2, -1, 3, 8, 13, 17, 19, 18, 14, 9, 4, 0})},
                                            {"bin_width", 1}, {"bins", bins}}},
                               {"demand", {{"method", "direct"}, {"annual_useful_heat", {{"value", 10000}, {"unit", "kWh"}}}}},
                               {"options", json::array({{{"id", "r"}, {"fuel", "electricity"}, {"price", {{"amount", 0.2}, {"per", "kWh"}}},
                                                         {"system", {{"kind", "electric-resistance"}, {"efficiency", {{"value", 1}, {"rating", "COP"}}}}}}})}};
        const auto errors = json::parse(fw::evaluate_json(scenario.dump())).at("errors");
        return errors.empty() ? json() : errors[0];
    };
    json even_hour = json::array(), even_month = json::array();
    for (int h = 0; h < 24; ++h) even_hour.push_back(4380.0 / 24);
    for (int m = 0; m < 12; ++m) even_month.push_back(4380.0 / 12);
    json bins = json::array({{{"t", 0}, {"hours", 4380}, {"by_hour", even_hour}, {"by_month", even_month}},
                             {{"t", 10}, {"hours", 4380}, {"by_hour", even_hour}, {"by_month", even_month}}});
    EXPECT_TRUE(error_for(bins).is_null()) << error_for(bins).dump();
    auto e = bins;
    e[1].erase("by_month");
    EXPECT_EQ(error_for(e).at("path"), "/climate/bins/1/by_month");
    EXPECT_EQ(error_for(e).at("message"), "is required with by_hour");
    e = bins;
    e[1].erase("by_month");
    e[1].erase("by_hour");
    EXPECT_EQ(error_for(e).at("path"), "/climate/bins/1");
    EXPECT_EQ(error_for(e).at("message"), "needs by_hour and by_month as the bins before it have them: give them on every bin or on none");
    e = bins;
    e[0]["by_hour"][3] = 0;
    EXPECT_EQ(error_for(e).at("path"), "/climate/bins/0/by_hour");
    EXPECT_EQ(error_for(e).at("message"), "adds up to 4197.5 hours; the bin has 4380");
    e = bins;
    e[0]["by_month"].erase(11);
    EXPECT_EQ(error_for(e).at("message"), "must be 12 numbers, the bin's hours by month from January");
}

TEST(weather_file, several_readings_in_one_hour_count_once) {
    // ISO timestamps with a special report at :51 and :56 in the same hour: one reading an hour.
    std::string csv = "DATE,HourlyDryBulbTemperature\n";
    for (int d = 1; d <= 2; ++d)
        for (int h = 0; h < 24; ++h) {
            char line[64];
            std::snprintf(line, sizeof line, "2024-02-%02dT%02d:51:00,%d\n", d, h, 30 + h % 5);
            csv += line;
            if (h == 6) {
                std::snprintf(line, sizeof line, "2024-02-%02dT%02d:56:00,%ds\n", d, h, 99);
                csv += line;
            }
        }
    const auto result = weather(csv, {{"unit", "degF"}});
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("format"), "hourly");
    EXPECT_EQ(result.at("hours"), 48);
    // 30..34 repeating over 24 hours: (5 x (30+31+32+33+34) - 33 - 34 + ... ) / 24; worked: hours 0..23 give
    // h % 5 = 0,1,2,3,4 four times and 0,1,2,3 once more: sum = 4 x 160 + 126 = 766.
    EXPECT_NEAR(result.at("observed").at("daily_mean").at(0).at(1).get<double>(), 766.0 / 24, 1e-9);
    const auto notes = result.at("notes").dump();
    EXPECT_NE(notes.find("2 extra readings within an hour already read were left out"), std::string::npos) << notes;
}

TEST(weather_file, twelve_hour_clocks_and_a_time_column_holding_the_timestamps) {
    // A time column on a 12-hour clock (12:00 AM is hour 0, 1:00 PM hour 13): 24 distinct hours a day.
    std::string csv = "DATE,TIME,TEMP\n";
    double sum = 0;
    for (int h = 0; h < 24; ++h) {
        const int twelve = h % 12 == 0 ? 12 : h % 12;
        csv += "2024-01-01," + std::to_string(twelve) + ":00 " + (h < 12 ? "AM" : "PM") + "," + std::to_string(20 + h) + "\n";
        sum += 20 + h;
    }
    const auto ampm = weather(csv, {{"unit", "degF"}, {"format", "hourly"}});
    ASSERT_TRUE(ampm.at("errors").empty()) << ampm.dump();
    EXPECT_EQ(ampm.at("hours"), 24);
    EXPECT_NEAR(ampm.at("observed").at("daily_mean").at(0).at(1).get<double>(), sum / 24, 1e-9);
    // An hourly export whose timestamps are in a column named "time", its unit in the header.
    std::string stamps = "time,temperature_2m (\xC2\xB0" "C)\n";
    for (int h = 0; h < 24; ++h) stamps += "2024-01-02T" + std::string(h < 10 ? "0" : "") + std::to_string(h) + ":00," + std::to_string(h % 5) + "\n";
    const auto iso = weather(stamps);
    ASSERT_TRUE(iso.at("errors").empty()) << iso.dump();
    EXPECT_EQ(iso.at("unit"), "degC");
    EXPECT_EQ(iso.at("first_date"), "2024-01-02");
    // A day with only a maximum is skipped, and the warning says why.
    const auto one_sided = weather("DATE,TMAX,TMIN\n2024-01-01,40,30\n2024-01-02,41,\n", {{"unit", "degF"}});
    EXPECT_EQ(one_sided.at("warnings").at(0).at("message"),
              "1 row has no temperature and was skipped (1 of them only a maximum or only a minimum: a daily mean needs both)");
}

TEST(weather_file, messages_at_the_field) {
    const auto error_of = [](const std::string& csv, const json& options = json::object()) {
        const auto result = weather(csv, options);
        const auto& e = result.at("errors").at(0);
        return e.at("path").get<std::string>() + ": " + e.at("message").get<std::string>();
    };
    EXPECT_EQ(error_of(""), "/text: the file is empty");
    EXPECT_EQ(error_of("a,b,c\n1,2,3\n"),
              "/text: no header line names a date column and a temperature column (such as DATE with TAVG, TMAX and TMIN, or "
              "a date and a dry-bulb temperature); give the columns to read");
    EXPECT_EQ(error_of("DATE,TAVG\n2024-01-01,30\n2024-13-01,31\n", {{"unit", "degF"}}),
              "/text: line 3: \"2024-13-01\": date \"2024-13-01\" does not exist");
    EXPECT_EQ(error_of("DATE,TAVG\n25/01/2024,30\n", {{"unit", "degF"}}),
              "/text: line 2: \"25/01/2024\": date \"2024-25-01\" does not exist (dates with slashes are read month first, "
              "MM/DD/YYYY)");
    EXPECT_EQ(error_of("DATE,TAVG\n2024-01-01,30\n2024-01-01,31\n", {{"unit", "degF"}}),
              "/text: line 3: the day 2024-01-01 appears again (first on line 2); a daily file has one row a day");
    EXPECT_EQ(error_of("STATION,DATE,TAVG\nA,2024-01-01,30\nB,2024-01-01,31\n", {{"unit", "degF"}}),
              "/text: the file holds 2 stations (A, B); export one station at a time");
    EXPECT_EQ(error_of("DATE,TAVG\n2024-01-01,30\n", {{"unit", "kelvin"}}), "/unit: must be degC or degF, got \"kelvin\"");
    EXPECT_EQ(error_of("DATE,TAVG\n2024-01-01,30\n", {{"unit", "degF"}, {"columns", {{"mean", "T_MEAN"}}}}),
              "/columns/mean: no column is named \"T_MEAN\"; the header has DATE, TAVG");
    EXPECT_EQ(error_of("DATE,TAVG\n2024-01-01,\n", {{"unit", "degF"}}), "/text: no row has a temperature (1 row was empty)");
    // A column named by the user is read even when its header is not one this reader recognises.
    const auto named = weather("day,t_avg_f\n2024-01-01,30\n2024-01-02,40\n",
                               {{"unit", "degF"}, {"columns", {{"date", "day"}, {"mean", "t_avg_f"}}}});
    ASSERT_TRUE(named.at("errors").empty()) << named.dump();
    EXPECT_EQ(named.at("days"), 2);
}

TEST(weather_file, imported_daily_means_feed_the_bills_fit) {
    // The answer's observed block goes into demand.observed as it is.
    const auto year = invented_year(2023);
    std::string csv = "DATE,TMAX,TMIN\n";
    for (const auto& d : year) csv += d.date + "," + std::to_string(static_cast<int>(d.high)) + "," + std::to_string(static_cast<int>(d.low)) + "\n";
    const auto imported = weather(csv, {{"unit", "degF"}});
    ASSERT_TRUE(imported.at("errors").empty());
    // Monthly meter-read bills of a house using 1 therm a day plus 0.3 therm per degF day below 62 degF.
    json bills = json::array();
    const long first = fw::parse_day_number("2023-01-05", "");
    for (int b = 0; b < 11; ++b) {
        const long start = first + 30 * b, end = first + 30 * (b + 1);
        double therms = 0;
        for (long day = start; day < end; ++day) {
            const auto& d = year[static_cast<std::size_t>(day - fw::parse_day_number("2023-01-01", ""))];
            therms += 1 + 0.3 * std::max(0.0, 62 - (d.high + d.low) / 2);
        }
        bills.push_back({{"start", fw::day_text(start)}, {"end", fw::day_text(end)}, {"quantity", therms}, {"unit", "therm"}});
    }
    const json scenario = {
        {"schema", "fuelwright.scenario/1"},
        {"climate", imported.at("climate")},
        {"demand", {{"method", "bills"}, {"option", "gas"}, {"bills", bills}, {"observed", imported.at("observed")}}},
        {"options", json::array({{{"id", "gas"}, {"existing", true}, {"fuel", "natural-gas"},
                                  {"price", {{"amount", 1.45}, {"per", "therm"}}},
                                  {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 80}, {"rating", "AFUE"}}}}},
                                  {"heating_value", {{"value", 100000}, {"unit", "Btu/therm"}, {"basis", "HHV"}}}}})}};
    const auto result = json::parse(fw::evaluate_json(scenario.dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.at("errors").dump();
    const auto& fit = result.at("demand").at("fit");
    EXPECT_EQ(fit.at("weather"), "observed-daily");
    EXPECT_NEAR(fit.at("tau").get<double>(), 62.0, 0.62);
    EXPECT_NEAR(fit.at("slope").get<double>() / (0.3 * 29.30710701722), 1.0, 0.01);
}

}  // namespace

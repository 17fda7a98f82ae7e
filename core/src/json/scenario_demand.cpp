// Scenario climate and demand: reading the JSON and working out the house's annual useful heat.
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <map>

#include "json/json_fields.hpp"
#include "json/scenario_reader.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

/// [degC] from a {value, unit} temperature, which must lie from -100 to 100 degC (no weather or room is outside it).
double temperature_c(const json& obj, const std::string& path) {
    const double c = quantity_in(obj, path, dimension::temperature, "degC");
    if (c < -100 || c > 100)
        throw input_error(path + "/value",
                          "is not a plausible temperature: it must lie from -100 to 100 degC (-148 to 212 degF), got " +
                              format_number(obj.at("value").get<double>()) + " " + obj.at("unit").get<std::string>());
    return c;
}

std::array<double, 12> twelve_numbers(const json& obj, const std::string& key, const std::string& path) {
    const auto& value = obj.at(key);
    if (!value.is_array()) throw input_error(path + "/" + key, "must be an array of 12 numbers, January first");
    if (value.size() != 12)
        throw input_error(path + "/" + key, "needs 12 values (January first), got " + std::to_string(value.size()));
    std::array<double, 12> out{};
    for (std::size_t m = 0; m < 12; ++m) {
        if (!value[m].is_number())
            throw input_error(path + "/" + key + "/" + std::to_string(m), "must be a number, got " + std::string(value[m].type_name()));
        out[m] = value[m].get<double>();
    }
    return out;
}

/// [kWh] Useful heat a year above which a demand is refused as not a house's (5 GWh, a large
/// apartment block), and the range outside which it is questioned (common practice: about 1.5 to 300 MWh).
constexpr double max_house_heat_kwh = 5e6;
constexpr double large_house_heat_kwh = 3e5;
constexpr double small_house_heat_kwh = 1500;

/// [K per input degree]: 1 for degC and K, 5/9 for degF.
double degree_size(bool fahrenheit) { return fahrenheit ? 5.0 / 9.0 : 1.0; }

/// The trace line saying which weather the bills were fitted against.
std::string weather_text(bill_weather weather) {
    switch (weather) {
        case bill_weather::observed_daily:
            return "degree-days of each billing period from the observed daily mean temperatures";
        case bill_weather::observed_period_mean:
            return "degree-days of each billing period from its average outdoor temperature, with the climate's "
                   "day-to-day spread for the months it covers (logistic daily means, Erbs et al. 1983)";
        case bill_weather::normals: break;
    }
    return "degree-days of each billing period from the climate's normal monthly means (no observed weather given)";
}

/// [degC] A daily temperature list [["YYYY-MM-DD", number], ...] in `unit`, by day number; `path` is the list's.
std::map<long, double> read_daily_list(const json& list, const std::string& unit, const std::string& path) {
    if (!list.is_array()) throw input_error(path, "must be an array of [\"YYYY-MM-DD\", temperature] pairs");
    if (list.size() > max_observed_days)
        throw input_error(path, "at most " + std::to_string(max_observed_days) + " days (20 years), got " + std::to_string(list.size()));
    std::map<long, double> out;
    for (std::size_t i = 0; i < list.size(); ++i) {
        const std::string item = path + "/" + std::to_string(i);
        const auto& pair = list[i];
        if (!pair.is_array() || pair.size() != 2 || !pair[0].is_string() || !pair[1].is_number())
            throw input_error(item, "must be a pair [\"YYYY-MM-DD\", temperature]");
        const long day = parse_day_number(pair[0].get<std::string>(), item + "/0");
        const double t = convert(pair[1].get<double>(), unit, "degC", item + "/1");
        if (!(t >= -70 && t <= 50))
            throw input_error(item + "/1", format_number(pair[1].get<double>()) + " " + unit +
                                               " is not a plausible daily temperature (it must lie between " +
                                               (unit == "degF" ? "-94 and 122 degF" : "-70 and 50 degC") + ")");
        if (!out.emplace(day, t).second)
            throw input_error(item + "/0", "the day " + pair[0].get<std::string>() + " is listed twice");
    }
    return out;
}

/// Refuses observed temperatures whose monthly means sit far from the climate's normals when the other
/// temperature unit would fit them: a file in degF labelled degC, or the reverse (more than 8 K off on
/// average, and under half that read in the other unit).
void check_observed_unit(const std::map<long, double>& observed, const json& block, const climate_model& climate) {
    std::array<double, 12> sum{}, count{};
    for (const auto& [day, t] : observed) {
        const int m = month_of_day(day);
        sum[m] += t;
        count[m] += 1;
    }
    const bool fahrenheit = block.value("unit", "") == "degF";
    double off = 0, off_other = 0, months = 0;
    for (int m = 0; m < 12; ++m) {
        if (count[m] < 10) continue;
        const double mean_c = sum[m] / count[m];
        // The same numbers read in the other unit.
        const double raw = fahrenheit ? mean_c * 9 / 5 + 32 : mean_c;
        const double other_c = fahrenheit ? raw : (raw - 32) * 5 / 9;
        off += std::fabs(mean_c - climate.monthly_mean_c[m]);
        off_other += std::fabs(other_c - climate.monthly_mean_c[m]);
        months += 1;
    }
    if (months == 0) return;
    off /= months;
    off_other /= months;
    if (off > 8 && off_other < off / 2)
        throw input_error("/demand/observed/unit",
                          std::string("the observed temperatures read in ") + (fahrenheit ? "degF" : "degC") + " lie " +
                              format_fixed(off, 1) + " K from the climate's normals month by month; read in " +
                              (fahrenheit ? "degC" : "degF") + " they would lie " + format_fixed(off_other, 1) +
                              " K from them: check the unit");
}

}  // namespace

std::map<long, double> read_observed(const json& observed, const std::string& path, std::vector<issue>& warnings) {
    require_object(observed, path);
    const auto unit = optional_string(observed, "unit", path);
    if (!unit) throw input_error(path + "/unit", "is required (degC or degF)");
    if (*unit != "degC" && *unit != "degF") throw input_error(path + "/unit", "must be degC or degF, got \"" + *unit + "\"");
    std::map<long, double> out;
    if (observed.contains("daily_mean")) {
        out = read_daily_list(observed.at("daily_mean"), *unit, path + "/daily_mean");
    } else if (observed.contains("daily_max") || observed.contains("daily_min")) {
        if (!observed.contains("daily_max") || !observed.contains("daily_min"))
            throw input_error(path + (observed.contains("daily_max") ? "/daily_min" : "/daily_max"),
                              "is required with the other (the daily mean is (max + min) / 2)");
        const auto highs = read_daily_list(observed.at("daily_max"), *unit, path + "/daily_max");
        const auto lows = read_daily_list(observed.at("daily_min"), *unit, path + "/daily_min");
        for (const auto& [day, high] : highs) {
            const auto low = lows.find(day);
            if (low == lows.end()) continue;
            if (low->second > high)
                throw input_error(path + "/daily_min", "the minimum of " + day_text(day) + " is above its maximum");
            out.emplace(day, 0.5 * (high + low->second));
        }
    } else {
        throw input_error(path, "give daily_mean, or daily_max and daily_min ([\"YYYY-MM-DD\", temperature] pairs)");
    }
    if (out.empty()) throw input_error(path, "has no days");
    warn_unknown_keys(observed, {"unit", "daily_mean", "daily_max", "daily_min", "station", "source"}, path, warnings);
    return out;
}

namespace {

/// The warning for a spread that comes from Erbs's correlation alone.
issue spread_warning(const std::string& path) {
    return {path + "/monthly_sd",
            "the day-to-day spread of daily temperatures comes from a correlation (Erbs, Klein & Beckman 1983) fitted "
            "to inland sites; maritime climates are its weak case (it overstates their spread, so design temperatures "
            "and hours in the cold come out too cold): give the 99 % design temperature or monthly_sd"};
}

/// [h] A bin's `key` (by_hour: 24 numbers, by_month: 12) into `out`: hours a year, each >= 0, adding up to the
/// bin's `hours` (to 0.1 %, or 0.01 h).
template <std::size_t N>
void read_bin_sums(const json& bin, const char* key, const std::string& item, double hours, std::array<double, N>& out) {
    const std::string path = item + "/" + key;
    const auto& list = bin.at(key);
    const char* what = N == 24 ? "24 numbers, the bin's hours by hour of the day from 0:00-1:00" : "12 numbers, the bin's hours by month from January";
    if (!list.is_array() || list.size() != N) throw input_error(path, std::string("must be ") + what);
    double sum = 0;
    for (std::size_t i = 0; i < N; ++i) {
        if (!list[i].is_number() || !(list[i].get<double>() >= 0))
            throw input_error(path + "/" + std::to_string(i), "must be a number of hours >= 0");
        out[i] = list[i].get<double>();
        sum += out[i];
    }
    if (std::fabs(sum - hours) > std::max(0.01, 1e-3 * hours))
        throw input_error(path, "adds up to " + format_number(sum) + " hours; the bin has " + format_number(hours));
}

/// Reads `bins` [{t, hours, by_hour?, by_month?}] with `bin_width` (observed hourly bins, e.g. from a weather file) into `info`.
void read_observed_bins(const json& climate, const std::string& unit, bool leap, climate_info& info) {
    const std::string path = "/climate";
    const double k = degree_size(unit == "degF");
    const auto width = optional_number(climate, "bin_width", path);
    if (!width) throw input_error(path + "/bin_width", "is required with bins (the width of each bin, in " + unit + ")");
    if (!(*width > 0 && *width * k <= 5))
        throw input_error(path + "/bin_width", "must be above 0 and at most " + format_number(5 / k) + " " + unit +
                                                   ", got " + format_number(*width));
    const auto& list = climate.at("bins");
    if (!list.is_array() || list.empty()) throw input_error(path + "/bins", "must be a non-empty array of {t, hours}");
    if (list.size() > 400) throw input_error(path + "/bins", "at most 400 bins, got " + std::to_string(list.size()));
    info.bin_width_k = *width * k;
    info.bins.clear();
    info.bins_when.clear();
    double total = 0;
    for (std::size_t i = 0; i < list.size(); ++i) {
        const std::string item = path + "/bins/" + std::to_string(i);
        require_object(list[i], item);
        const auto t = optional_number(list[i], "t", item);
        const auto hours = optional_number(list[i], "hours", item);
        if (!t) throw input_error(item + "/t", "is required (the bin's centre temperature)");
        if (!hours) throw input_error(item + "/hours", "is required (hours a year in the bin)");
        const double t_c = convert(*t, unit, "degC", item + "/t");
        if (t_c < -70 || t_c > 60) throw input_error(item + "/t", "is not a plausible outdoor temperature");
        if (*hours < 0) throw input_error(item + "/hours", "must be >= 0, got " + format_number(*hours));
        if (!info.bins.empty() && t_c <= info.bins.back().t_c)
            throw input_error(item + "/t", "bins must be in ascending order of temperature");
        info.bins.push_back({t_c, *hours});
        total += *hours;
        // when the bin's hours fell, from a weather file: both sums or neither, on every bin or none
        const bool timed = list[i].contains("by_hour") || list[i].contains("by_month");
        if (i > 0 && timed != !info.bins_when.empty())
            throw input_error(item, timed ? "has by_hour and by_month where the bins before it have none: give them on every bin or on none"
                                          : "needs by_hour and by_month as the bins before it have them: give them on every bin or on none");
        if (timed) {
            for (const char* key : {"by_hour", "by_month"})
                if (!list[i].contains(key)) throw input_error(item + "/" + key, std::string("is required with ") + (std::string(key) == "by_hour" ? "by_month" : "by_hour"));
            bin_times when;
            read_bin_sums(list[i], "by_hour", item, *hours, when.by_hour);
            read_bin_sums(list[i], "by_month", item, *hours, when.by_month);
            info.bins_when.push_back(when);
        }
    }
    const double year_hours = leap ? 8784 : 8760;
    if (std::fabs(total - year_hours) > 24)
        throw input_error(path + "/bins", "the bins' hours add up to " + format_fixed(total, 1) + "; a year of hourly bins has " +
                                              format_fixed(year_hours, 0) + " (within a day)");
    info.bins_from_data = true;
}

}  // namespace

climate_info read_climate(const json& climate, std::vector<issue>& warnings) {
    const std::string path = "/climate";
    require_object(climate, path);
    climate_info info;
    const auto unit = optional_string(climate, "unit", path);
    if (!unit) throw input_error(path + "/unit", "is required (degC or degF)");
    if (*unit != "degC" && *unit != "degF")
        throw input_error(path + "/unit", "must be degC or degF, got \"" + *unit + "\"");
    info.fahrenheit = *unit == "degF";
    const double k = degree_size(info.fahrenheit);
    const auto to_c = [&](double t) { return convert(t, *unit, "degC"); };
    info.base_c = climate.contains("base") ? temperature_c(climate.at("base"), path + "/base") : (info.fahrenheit ? to_c(65) : 18.3);
    const bool leap = optional_bool(climate, "leap_year", path).value_or(false);
    double range_k = default_daily_range_k;
    bool range_given = false;
    if (const auto range = optional_number(climate, "daily_range", path)) {
        if (*range < 0 || *range > 40 / k)
            throw input_error(path + "/daily_range", "must be a daily temperature range from 0 to " + format_fixed(40 / k, 0) +
                                                         " " + *unit + ", got " + format_number(*range));
        range_k = *range * k;
        range_given = true;
    }
    if (climate.contains("design_temperature"))
        info.given_design_c = temperature_c(climate.at("design_temperature"), path + "/design_temperature");
    if (climate.contains("monthly_mean")) {
        auto means = twelve_numbers(climate, "monthly_mean", path);
        for (std::size_t m = 0; m < 12; ++m) {
            const std::string item = path + "/monthly_mean/" + std::to_string(m);
            means[m] = convert(means[m], *unit, "degC", item);
            if (means[m] < -70 || means[m] > 50)
                throw input_error(item, format_number(climate.at("monthly_mean")[m].get<double>()) + " " + *unit +
                                            " is not a plausible monthly mean (it must lie between " +
                                            (info.fahrenheit ? "-94 and 122 degF" : "-70 and 50 degC") + ")");
        }
        std::optional<std::array<double, 12>> sd;
        if (climate.contains("monthly_sd")) {
            auto values = twelve_numbers(climate, "monthly_sd", path);
            for (std::size_t m = 0; m < 12; ++m) {
                if (!(values[m] > 0) || values[m] * k > 25)
                    throw input_error(path + "/monthly_sd/" + std::to_string(m),
                                      "the standard deviation of daily means must be > 0 and at most " + format_fixed(25 / k, 0) +
                                          " " + *unit + ", got " + format_number(values[m]));
                values[m] *= k;
            }
            sd = values;
        }
        info.model = climate_from_means(means, sd, leap, range_k);
        if (!sd && info.given_design_c && !climate.contains("bins")) {
            const auto factor = spread_factor_for_design(info.model, *info.given_design_c);
            if (!factor)
                throw input_error(path + "/design_temperature",
                                  "no day-to-day spread of these monthly means gives a 99 % design temperature of " +
                                      format_number(climate.at("design_temperature").at("value").get<double>()) + " " +
                                      climate.at("design_temperature").at("unit").get<std::string>() +
                                      " (the spread would have to be scaled by less than 0.2 or more than 4); check both, "
                                      "or give monthly_sd");
            for (double& value : info.model.daily_sd_k) value *= *factor;
            info.spread_factor = *factor;
            info.model.trace.push_back("day-to-day spread calibrated to the given design temperature: every month's "
                                       "spread scaled by " + format_fixed(*factor, 3) + " so that the model's 99 % design "
                                       "temperature equals it (Illinois root on the scale factor)");
        } else if (!sd) {
            warnings.push_back(spread_warning(path));
        }
    } else if (climate.contains("monthly_hdd")) {
        auto hdd = twelve_numbers(climate, "monthly_hdd", path);
        for (std::size_t m = 0; m < 12; ++m) {
            if (hdd[m] < 0 || hdd[m] * k > 31 * 80)
                throw input_error(path + "/monthly_hdd/" + std::to_string(m),
                                  "must be from 0 to a plausible monthly total, got " + format_number(hdd[m]));
            hdd[m] *= k;
        }
        info.model = climate_from_monthly_hdd(hdd, info.base_c, leap, range_k);
        warnings.push_back(spread_warning(path));
    } else if (climate.contains("annual_hdd")) {
        const auto annual = optional_number(climate, "annual_hdd", path);
        if (!annual || *annual <= 0 || *annual * k > 15000)
            throw input_error(path + "/annual_hdd", "must be a positive annual total of heating degree-days");
        if (!info.given_design_c)
            throw input_error(path + "/design_temperature", "is required with annual_hdd (the 99 % heating design temperature)");
        try {
            info.model = climate_from_annual_hdd(*annual * k, info.base_c, *info.given_design_c, leap, range_k);
        } catch (const input_error&) {
            // said in the climate's own unit, with the base the degree-days are counted to
            const auto in_unit = [&](double c) { return format_number(std::round(100 * convert(c, "degC", *unit)) / 100) + " " + *unit; };
            throw input_error(path + "/design_temperature",
                              "no climate has " + format_number(*annual) + " heating degree-days (" + *unit + " day) to a base of " +
                                  in_unit(info.base_c) + " and a 99 % design temperature of " + in_unit(*info.given_design_c) +
                                  "; check the three values");
        }
    } else {
        throw input_error(path, "give monthly_mean (12 values), monthly_hdd (12 values), or annual_hdd with design_temperature");
    }
    info.model.trace.push_back(range_given ? "daily range " + format_number(range_k / k) + " " + *unit + " as given"
                                           : "daily range " + format_fixed(range_k / k, 0) + " " + *unit +
                                                 " assumed (typical of inland mid-latitude sites; give daily_range)");
    if (climate.contains("bins")) {
        read_observed_bins(climate, *unit, leap, info);
        info.design_99_c = design_temperature_from_bins(info.bins, info.bin_width_k, 0.01);
        info.design_996_c = design_temperature_from_bins(info.bins, info.bin_width_k, 0.004);
        info.model.trace.push_back("hourly bins and design temperatures from observed hours as given (" +
                                   std::to_string(info.bins.size()) + " bins of " + format_number(info.bin_width_k / k) + " " +
                                   *unit + ")");
    } else {
        info.bin_width_k = info.fahrenheit ? 2 * k : 1.0;
        info.bins = hourly_bins(info.model, info.bin_width_k);
        info.design_99_c = design_temperature(info.model, 0.01);
        info.design_996_c = design_temperature(info.model, 0.004);
    }
    warn_unknown_keys(climate, {"unit", "base", "leap_year", "daily_range", "design_temperature", "monthly_mean", "monthly_sd",
                                "monthly_hdd", "annual_hdd", "bins", "bin_width", "name", "source"},
                      path, warnings);
    return info;
}

namespace {

/// [kWh/year] The annual heat a scenario is evaluated for: below 1 kWh there is nothing to heat (and
/// costs per unit of heat divide by almost zero); above 5,000 MWh it is not a house's.
constexpr double min_annual_heat_kwh = 1, max_annual_heat_kwh = 5e6;

/// Refuses an annual heat {value, unit} of `kwh` outside the range (from 0 when `zero_allowed`), naming it in the unit.
void require_annual_heat(double kwh, const json& heat, const std::string& path, bool zero_allowed) {
    const double low = zero_allowed ? 0 : min_annual_heat_kwh;
    if (kwh >= low && kwh <= max_annual_heat_kwh) return;
    const auto unit = heat.at("unit").get<std::string>();
    throw input_error(path + "/value", "must be from " + std::string(zero_allowed ? "0" : "1 kWh") +
                                           " to 5,000 MWh a year (" + format_number(convert(low, "kWh", unit)) +
                                           " to " + format_number(convert(max_annual_heat_kwh, "kWh", unit)) + " " +
                                           unit + "), got " + format_number(heat.at("value").get<double>()) + " " +
                                           unit);
}

/// [kWh] The most fuel one bill may hold (HHV): more than a house burns in a year, whatever the efficiency.
constexpr double max_bill_fuel_kwh = 1e7;

/// Refuses a bill holding more than max_bill_fuel_kwh (its quantity in its own unit is named).
void require_bill_size(const bill_period& bill, const json& item, const scenario_option& equipment,
                       const std::string& path) {
    if (bill.fuel_kwh <= max_bill_fuel_kwh) return;
    const auto unit = item.at("unit").get<std::string>();
    const double kwh_per_unit =
        heating_value_per_sale_unit(equipment.fuel, unit, equipment.sale, path + "/unit").hhv_j / 3.6e6;
    throw input_error(path + "/quantity", "is more fuel than a house burns in a year: at most 10,000 MWh (" +
                                              format_number(max_bill_fuel_kwh / kwh_per_unit) + " " + unit + "), got " +
                                              format_number(item.at("quantity").get<double>()) + " " + unit);
}

}  // namespace

namespace {

/// [K] A temperature rise {value, unit: K | degC | degF} (a difference, not a temperature).
double temperature_rise_k(const json& rise, const std::string& path) {
    require_object(rise, path);
    const double value = required_number(rise, "value", path);
    const auto unit = required_string(rise, "unit", path);
    double k = 0;
    if (unit == "K" || unit == "degC") k = value;
    else if (unit == "degF") k = value * 5.0 / 9.0;
    else throw input_error(path + "/unit", "must be K or degF (a temperature rise), got \"" + unit + "\"");
    if (!(k >= 5 && k <= 90))
        throw input_error(path + "/value", "must be a rise from cold inlet to hot outlet of 5 to 90 K (9 to 162 degF), got " +
                                               format_number(value) + " " + unit);
    return k;
}

/// `demand.water_heating`: the useful heat (given, or from people, litres and rise) and the house's water heater.
void read_water_heating(const json& water, scenario& out, std::vector<issue>& warnings) {
    const std::string path = "/demand/water_heating";
    require_object(water, path);
    const bool us = out.settings.units == unit_system::us;
    const double days = out.climate && out.climate->model.leap_year ? 366 : 365;
    if (water.contains("annual_heat") && water.contains("people"))
        throw input_error(path + "/people", "give annual_heat or people, not both");
    if (water.contains("annual_heat")) {
        const double kwh = quantity_in(water.at("annual_heat"), path + "/annual_heat", dimension::energy, "kWh");
        require_annual_heat(kwh, water.at("annual_heat"), path + "/annual_heat", false);
        // a household's hot water is about 1,000-10,000 kWh (3.4-34 MMBtu) a year: 50 L a person a day for 1 to 8 people
        if (kwh > 30000 || kwh < 300)
            warnings.push_back({path + "/annual_heat/value", energy_text(kwh, out.settings.units) + " of hot water a year is " +
                                                             (kwh > 30000 ? "far above" : "far below") +
                                                             " what a household uses (about 1,000 to 10,000 kWh, 3.4 to 34 MMBtu): check the value and its unit"});
        out.hot_water_kwh = kwh;
        out.demand_trace.push_back("water heating " + energy_text(kwh, out.settings.units) + " useful a year, as given");
        for (const char* key : {"volume_per_person_day", "temperature_rise"})
            if (water.contains(key))
                warnings.push_back({path + "/" + key, "not used: the yearly heat is given (annual_heat); give people instead to use it"});
    } else if (water.contains("people")) {
        const auto people = optional_number(water, "people", path);
        if (!people || !(*people > 0 && *people <= 30))
            throw input_error(path + "/people", "must be the number of people in the house, above 0 and at most 30");
        double litres = default_litres_per_person_day;
        std::string litres_text = us ? "13.2 gal (50 L) per person a day (assumed, common practice; give volume_per_person_day)"
                                     : "50 L per person a day (assumed, common practice; give volume_per_person_day)";
        if (water.contains("volume_per_person_day")) {
            const auto& volume = water.at("volume_per_person_day");
            litres = quantity_in(volume, path + "/volume_per_person_day", dimension::volume, "L");
            if (!(litres >= 5 && litres <= 400))
                throw input_error(path + "/volume_per_person_day/value",
                                  "must be 5 to 400 L (1.3 to 106 gal) of hot water per person a day, got " +
                                      format_number(volume.at("value").get<double>()) + " " + volume.at("unit").get<std::string>());
            litres_text = format_number(volume.at("value").get<double>()) + " " + volume.at("unit").get<std::string>() + " per person a day";
        }
        double rise_k = default_temperature_rise_k;
        std::string rise_text = "rise 67 degF (37.2 K), the UEF test's 58 to 125 degF (10 CFR 430 App. E, from memory; give temperature_rise)";
        if (water.contains("temperature_rise")) {
            rise_k = temperature_rise_k(water.at("temperature_rise"), path + "/temperature_rise");
            rise_text = "rise " + format_number(water.at("temperature_rise").at("value").get<double>()) + " " +
                        water.at("temperature_rise").at("unit").get<std::string>();
        }
        out.hot_water_kwh = hot_water_heat_kwh(*people, litres, rise_k, days);
        out.demand_trace.push_back("water heating: " + format_number(*people) + " people x " + litres_text + " x " +
                                   format_fixed(days, 0) + " days x 4.186 kJ/(L K) x " + rise_text + " = " +
                                   energy_text(out.hot_water_kwh, out.settings.units) + " useful a year");
    } else {
        throw input_error(path + "/annual_heat", "give annual_heat {value, unit}, or people (with volume_per_person_day and temperature_rise)");
    }
    if (water.contains("heater")) out.water_heater = read_water_heater(water.at("heater"), path + "/heater", warnings);
    else
        warnings.push_back({path + "/heater", "no water heater given: each option's heating system is taken to make the hot water; "
                                              "give the house's water heater"});
    warn_unknown_keys(water, {"annual_heat", "people", "volume_per_person_day", "temperature_rise", "heater"}, path, warnings);
}

}  // namespace

void read_demand(const json& demand, scenario& out, const json& options_json, std::vector<issue>& warnings) {
    require_object(demand, "/demand");
    out.demand_method = optional_string(demand, "method", "/demand").value_or("direct");
    const auto& method = out.demand_method;
    const bool us = out.settings.units == unit_system::us;
    const auto energy_text = [&](double kwh) { return fw::energy_text(kwh, out.settings.units); };
    const auto temp_text = [&](double c) {
        const bool f = out.climate ? out.climate->fahrenheit : us;
        return f ? format_fixed(convert(c, "degC", "degF"), 1) + " degF" : format_fixed(c, 1) + " degC";
    };
    const auto need_climate = [&](const char* what) {
        if (!out.climate) throw input_error("/climate", std::string("is required for ") + what);
    };
    if (demand.contains("balance_point")) out.balance_point_c = temperature_c(demand.at("balance_point"), "/demand/balance_point");
    if (method == "direct") {
        if (!demand.contains("annual_useful_heat"))
            throw input_error("/demand/annual_useful_heat", "is required ({\"value\": ..., \"unit\": \"MMBtu\"})");
        const auto& heat = demand.at("annual_useful_heat");
        require_object(heat, "/demand/annual_useful_heat");
        const double kwh = quantity_in(heat, "/demand/annual_useful_heat", dimension::energy, "kWh");
        if (kwh <= 0)
            throw input_error("/demand/annual_useful_heat/value", "must be > 0, got " + format_number(heat.at("value").get<double>()));
        if (kwh > max_house_heat_kwh)
            throw input_error("/demand/annual_useful_heat/value",
                              format_number(heat.at("value").get<double>()) + " " + heat.at("unit").get<std::string>() +
                                  " is not the yearly heat of a house: at most " + energy_text(max_house_heat_kwh) +
                                  " (5,000 MWh) is taken");
        if (kwh > large_house_heat_kwh || kwh < small_house_heat_kwh)
            warnings.push_back({"/demand/annual_useful_heat/value",
                                energy_text(kwh) + " a year is " + (kwh > large_house_heat_kwh ? "far above" : "far below") +
                                    " what a house needs (about 1.5 to 300 MWh, 5 to 1,000 MMBtu); check the value and its unit"});
        out.space_heat_kwh = kwh;
        out.demand_trace.push_back("annual useful heat given directly: " + format_number(heat.at("value").get<double>()) +
                                   " " + heat.at("unit").get<std::string>() + " = " + format_fixed(kwh, 1) + " kWh");
        warn_unknown_keys(demand, {"method", "annual_useful_heat", "balance_point", "hot_water", "water_heating"}, "/demand", warnings);
    } else if (method == "heat-loss") {
        need_climate("the heat-loss method (degree-days come from it)");
        double ua = 0;
        std::optional<double> indoor_c;
        if (demand.contains("indoor")) indoor_c = temperature_c(demand.at("indoor"), "/demand/indoor");
        if (demand.contains("ua")) {
            const auto& value = demand.at("ua");
            require_object(value, "/demand/ua");
            const auto number = optional_number(value, "value", "/demand/ua");
            const auto unit = optional_string(value, "unit", "/demand/ua").value_or("");
            if (!number) throw input_error("/demand/ua/value", "is required (a number)");
            if (unit != "W/K" && unit != "Btu/h/degF")
                throw input_error("/demand/ua/unit", "must be W/K or Btu/h/degF, got \"" + unit + "\"");
            ua = unit == "W/K" ? *number : *number * constants::joule_per_btu / 3600.0 * 9.0 / 5.0;
            if (ua <= 0) throw input_error("/demand/ua/value", "must be > 0, got " + format_number(*number));
            if (ua > 2e5)
                throw input_error("/demand/ua/value", "a house's UA is at most 200000 W/K (379000 Btu/h/degF), got " +
                                                          format_number(*number) + " " + unit);
            out.demand_trace.push_back("UA " + format_number(*number) + " " + unit + " = " + format_fixed(ua, 1) + " W/K");
        } else if (demand.contains("design_heat_loss")) {
            const double watts = quantity_in(demand.at("design_heat_loss"), "/demand/design_heat_loss", dimension::power, "W");
            if (watts <= 0) throw input_error("/demand/design_heat_loss/value", "must be > 0");
            if (watts > 1e6)
                throw input_error("/demand/design_heat_loss/value",
                                  "a house's design heat loss is at most 1000 kW (3.41214e+06 Btu/h), got " +
                                      format_number(watts / 1000) + " kW");
            if (!indoor_c) throw input_error("/demand/indoor", "is required with design_heat_loss");
            const double outdoor_c = demand.contains("design_outdoor")
                                         ? temperature_c(demand.at("design_outdoor"), "/demand/design_outdoor")
                                         : out.climate->given_design_c.value_or(out.climate->design_99_c);
            if (*indoor_c - outdoor_c < 5)
                throw input_error("/demand/design_outdoor", "the design outdoor temperature must be at least 5 K below indoor (" +
                                                                temp_text(*indoor_c) + "), got " + temp_text(outdoor_c));
            ua = ua_from_design_heat_loss_w_per_k(watts, *indoor_c, outdoor_c);
            out.demand_trace.push_back("UA = design heat loss " + format_fixed(watts, 0) + " W / (" + temp_text(*indoor_c) + " - " +
                                       temp_text(outdoor_c) + ") = " + format_fixed(ua, 1) + " W/K" +
                                       (demand.contains("design_outdoor") ? "" : " (design outdoor temperature from the climate, 99 %)"));
        } else {
            throw input_error("/demand/ua", "is required: the house's heat-loss coefficient (UA), or its design heat loss with the indoor temperature");
        }
        out.ua_w_per_k = ua;
        out.indoor_c = indoor_c;
        if (demand.contains("design_heat_loss") && !demand.contains("ua"))
            out.design_heat_loss_kw = quantity_in(demand.at("design_heat_loss"), "/demand/design_heat_loss", dimension::power, "kW");
        if (out.balance_point_c) {
            out.demand_trace.push_back("balance point " + temp_text(*out.balance_point_c) + " as given");
        } else if (demand.contains("internal_gains")) {
            if (!indoor_c) throw input_error("/demand/indoor", "is required with internal_gains");
            const double gains = quantity_in(demand.at("internal_gains"), "/demand/internal_gains", dimension::power, "W");
            if (gains < 0) throw input_error("/demand/internal_gains/value", "must be >= 0");
            out.balance_point_c = balance_point_from_gains_c(*indoor_c, gains, ua);
            out.demand_trace.push_back("balance point = indoor " + temp_text(*indoor_c) + " - gains " + format_fixed(gains, 0) +
                                       " W / UA = " + temp_text(*out.balance_point_c));
        } else {
            out.balance_point_c = out.climate->base_c;
            out.balance_point_defaulted = true;
            warnings.push_back({"/demand/balance_point", "no balance point or internal gains given; using the climate's "
                                                         "degree-day base " + temp_text(out.climate->base_c)});
        }
        const auto cd = optional_number(demand, "degree_day_correction", "/demand");
        if (cd && (*cd <= 0 || *cd > 1.2))
            throw input_error("/demand/degree_day_correction", "C_D must be from above 0 to 1.2, got " + format_number(*cd));
        const auto heat = degree_day_space_heat(out.climate->model, ua, *out.balance_point_c, cd.value_or(1.0));
        out.demand_trace.push_back("annual space heat = UA x HDD x 24 h = " + format_fixed(ua, 1) + " W/K x " +
                                   format_fixed(heat.hdd_k_day, 0) + " K day (base " + temp_text(*out.balance_point_c) +
                                   ") x 24 h = " + format_fixed(heat.uncorrected_kwh, 0) + " kWh");
        if (cd)
            out.demand_trace.push_back("x C_D " + format_number(*cd) +
                                       " (degree-day correction factor as entered; ASHRAE Handbook—Fundamentals (1985-1993 "
                                       "editions) gives 0.6-0.8 for a 65 degF base, from memory) = " +
                                       format_fixed(heat.space_heat_kwh, 0) + " kWh");
        out.space_heat_kwh = heat.space_heat_kwh;
        warn_unknown_keys(demand, {"method", "ua", "design_heat_loss", "indoor", "design_outdoor", "balance_point",
                                   "internal_gains", "degree_day_correction", "hot_water", "water_heating"},
                          "/demand", warnings);
    } else if (method == "bills") {
        need_climate("the bills method (the fit is against its degree-days)");
        // The equipment that used the fuel: an option of the scenario, or its own fuel and system.
        scenario_option equipment;
        if (const auto id = optional_string(demand, "option", "/demand")) {
            bool found = false;
            for (std::size_t i = 0; i < options_json.size() && !found; ++i)
                if (options_json.is_array() && options_json[i].is_object() && options_json[i].contains("id") &&
                    options_json[i].at("id") == *id) {
                    equipment = read_option(options_json[i], "/options/" + std::to_string(i), warnings);
                    found = true;
                }
            if (!found) throw input_error("/demand/option", "no option has id \"" + *id + "\"");
        } else {
            if (!demand.contains("fuel") || !demand.contains("system"))
                throw input_error("/demand/option", "give the id of the existing option, or fuel and system");
            json pseudo = {{"id", "bills"}, {"fuel", demand.at("fuel")}, {"system", demand.at("system")},
                           {"price", {{"amount", 0}, {"per", ""}}}};
            // The price unit is only needed to check it; take the bills' unit.
            if (demand.contains("bills") && demand.at("bills").is_array() && !demand.at("bills").empty() &&
                demand.at("bills")[0].is_object())
                pseudo["price"]["per"] = demand.at("bills")[0].value("unit", "");
            std::vector<issue> ignored;
            try {
                equipment = read_option(pseudo, "/demand", ignored);
            } catch (const input_error& error) {
                std::string path = error.path();
                if (path.rfind("/demand/price", 0) == 0) path = "/demand/bills/0/unit";
                throw input_error(path, error.message());
            }
        }
        equipment.sale.gas_pressure_pa = out.settings.gas_pressure_base_pa;
        const auto efficiency = seasonal_efficiency_hhv(equipment.system, equipment.fuel, equipment.path.empty() || equipment.path == "/demand" ? "/demand/system" : equipment.path + "/system");
        if (!demand.contains("bills") || !demand.at("bills").is_array() || demand.at("bills").empty())
            throw input_error("/demand/bills", "needs at least one bill {start, end, quantity, unit}");
        const auto& list = demand.at("bills");
        if (list.size() > 120) throw input_error("/demand/bills", "at most 120 bills, got " + std::to_string(list.size()));
        const auto observed = demand.contains("observed") ? read_observed(demand.at("observed"), "/demand/observed", warnings)
                                                          : std::map<long, double>{};
        struct bill_dates_read {
            long start_day, end_day;
            std::string start, end;
        };
        std::vector<bill_dates_read> dates;
        std::vector<bill_period> bills;
        for (std::size_t i = 0; i < list.size(); ++i) {
            const std::string path = "/demand/bills/" + std::to_string(i);
            const auto& item = list[i];
            require_object(item, path);
            const auto start = optional_string(item, "start", path);
            const auto end = optional_string(item, "end", path);
            if (!start) throw input_error(path + "/start", "is required (YYYY-MM-DD)");
            if (!end) throw input_error(path + "/end", "is required (YYYY-MM-DD)");
            const long first = parse_day_number(*start, path + "/start");
            const long last = parse_day_number(*end, path + "/end");
            if (last < first)
                throw input_error(path + "/end", "the period " + *start + " to " + *end + " has no days (it ends before it starts)");
            if (last - first > 366)
                throw input_error(path + "/end", "the period " + *start + " to " + *end + " spans " +
                                                     std::to_string(last - first) +
                                                     " days; a bill covers at most a year (split a longer period)");
            const auto amount = optional_number(item, "quantity", path);
            if (!amount) throw input_error(path + "/quantity", "is required (a number)");
            if (*amount < 0) throw input_error(path + "/quantity", "must be >= 0, got " + format_number(*amount));
            const auto unit = optional_string(item, "unit", path);
            if (!unit) throw input_error(path + "/unit", "is required (the unit the bill is in)");
            // The bill's own heating value (a utility's therm factor) where it prints one, else the equipment's
            // given heating value scaled to the bill's unit, else the catalog's.
            double hhv_j = heating_value_per_sale_unit(equipment.fuel, *unit, equipment.sale, path + "/unit").hhv_j;
            if (item.contains("heating_value")) {
                const auto given = read_given_heating_value(item.at("heating_value"), path + "/heating_value", equipment.fuel, *unit,
                                                            equipment.sale, warnings);
                hhv_j = given.hhv_j_per_unit;
                out.demand_trace.push_back("bill of " + *start + " to " + *end + ": heating value " + given.text);
            } else if (equipment.heating_value_override_j) {
                const double catalog = heating_value_per_sale_unit(equipment.fuel, equipment.price_unit, equipment.sale, {}).hhv_j;
                hhv_j *= *equipment.heating_value_override_j / catalog;
                if (i == 0) out.demand_trace.push_back("bills at the heating value given for the equipment: " +
                                                       equipment.heating_value_override_text);
            }
            bill_period bill;
            bill.first_day = first;
            bill.last_day = last;
            bill.fuel_kwh = *amount * hhv_j / 3.6e6;
            if (item.contains("mean_temperature")) {
                bill.mean_c = temperature_c(item.at("mean_temperature"), path + "/mean_temperature");
                if (bill.mean_c < -60 || bill.mean_c > 45)
                    throw input_error(path + "/mean_temperature/value",
                                      "is not a plausible average outdoor temperature for a billing period (it must lie "
                                      "between -76 and 113 degF, -60 and 45 degC)");
                bill.weather = bill_weather::observed_period_mean;
            }
            bills.push_back(bill);
            dates.push_back({first, last, *start, *end});
            warn_unknown_keys(item, {"start", "end", "quantity", "unit", "mean_temperature", "heating_value"}, path, warnings);
        }
        for (std::size_t i = 0; i < bills.size(); ++i)
            require_bill_size(bills[i], list[i], equipment, "/demand/bills/" + std::to_string(i));
        // The date rule: meter reads (a bill covers end - start days; the next may start on its end day)
        // or inclusive (the end date is the bill's last day). A file without the rule whose periods never
        // share a day keeps its old meaning (inclusive).
        const auto rule = optional_string(demand, "bill_dates", "/demand");
        if (rule && *rule != "meter-reads" && *rule != "inclusive")
            throw input_error("/demand/bill_dates", "must be \"meter-reads\" (each bill runs from one meter read to the next) "
                                                    "or \"inclusive\" (the end date is the bill's last day), got \"" + *rule + "\"");
        const bool meter_reads = rule ? *rule == "meter-reads" : bills_share_a_day(bills);
        if (meter_reads) {
            for (std::size_t i = 0; i < bills.size(); ++i) {
                if (bills[i].last_day == bills[i].first_day)
                    throw input_error("/demand/bills/" + std::to_string(i) + "/end",
                                      "the period " + dates[i].start + " to " + dates[i].end +
                                          " has no days (meter reads: a bill covers the days from its start up to its end)");
                bills[i].last_day -= 1;
            }
        }
        out.demand_trace.push_back(
            meter_reads ? std::string("bill dates read as meter reads: a bill covers the days from its start date up to "
                                      "its end date, which starts the next bill") +
                              (rule ? "" : " (the bills share boundary days)")
                        : std::string("bill dates read as inclusive: the end date is the bill's last day") +
                              (rule ? "" : " (no bill_dates given and no two bills share a day)"));
        const auto period_text = [&](std::size_t i) { return dates[i].start + " to " + dates[i].end; };
        for (const auto& seam : bill_seams(bills)) {
            const auto previous = seam.earlier, current = seam.later;
            const long overlap = seam.overlap_days, gap = seam.gap_days;
            const std::string at = "/demand/bills/" + std::to_string(current) + "/start";
            if (overlap > 0)
                throw input_error(at, "the bill of " + period_text(current) + " overlaps the bill of " + period_text(previous) +
                                          " by " + std::to_string(overlap) + (overlap == 1 ? " day" : " days") + " (" +
                                          day_text(bills[current].first_day) + " to " +
                                          day_text(std::min(bills[previous].last_day, bills[current].last_day)) +
                                          "); each day may be billed once");
            if (gap > 0)
                warnings.push_back({at, std::to_string(gap) + (gap == 1 ? " day" : " days") + " (" +
                                            day_text(bills[previous].last_day + 1) + " to " +
                                            day_text(bills[current].first_day - 1) + ") between the bill of " +
                                            period_text(previous) + " and the bill of " + period_text(current) +
                                            " are not covered by any bill"});
        }
        // Observed daily weather: every bill's days, or the bill's own average temperature.
        if (!observed.empty()) check_observed_unit(observed, demand.at("observed"), out.climate->model);
        if (!observed.empty()) {
            for (std::size_t i = 0; i < bills.size(); ++i) {
                auto& bill = bills[i];
                auto cover = observed_days_of(bill, observed);
                const long missing = cover.missing_days, length = cover.period_days;
                const std::string path = "/demand/bills/" + std::to_string(i);
                if (cover.usable()) {
                    if (missing > 0)
                        warnings.push_back({path, "the observed weather lacks " + std::to_string(missing) + " of the " +
                                                      std::to_string(length) + " days of the bill of " + period_text(i) +
                                                      "; its degree-days are scaled up from the days observed"});
                    bill.daily_mean_c = std::move(cover.daily_mean_c);
                    bill.weather = bill_weather::observed_daily;
                } else if (bill.weather != bill_weather::observed_period_mean) {
                    throw input_error(path, "the observed daily temperatures (/demand/observed) lack " + std::to_string(missing) +
                                                " of the " + std::to_string(length) + " days of the bill of " + period_text(i) +
                                                "; import weather that covers it or give the bill's average temperature");
                }
            }
        }
        std::size_t with_weather = 0;
        for (const auto& bill : bills) with_weather += bill.weather != bill_weather::normals;
        if (with_weather > 0 && with_weather < bills.size())
            for (std::size_t i = 0; i < bills.size(); ++i)
                if (bills[i].weather == bill_weather::normals)
                    throw input_error("/demand/bills/" + std::to_string(i) + "/mean_temperature",
                                      "is needed on every bill once one bill has it (the bill of " + period_text(i) +
                                          " has none): a fit mixing observed and normal weather is biased");
        const auto total = billed_total_of(bills);
        const double eta = efficiency.hhv_basis;
        out.fit_efficiency = eta;
        out.demand_trace.push_back("current equipment: " + equipment.fuel.name + ", " + efficiency.trace.front());
        if (bills.size() < 3) {
            if (total.days < 300)
                throw input_error("/demand/bills", "needs at least 3 bills to fit against the weather, or bills covering a "
                                                   "whole year; got " + std::to_string(bills.size()) + " covering " +
                                                   std::to_string(total.days) + " days");
            const double annual = total.annual_fuel_kwh();
            out.space_heat_kwh = annual * eta;
            warnings.push_back({"/demand/bills", "an annual total alone is not weather-normalised: a mild or a cold year "
                                                 "moves it directly"});
            out.demand_trace.push_back("annual fuel " + energy_text(annual) + " (HHV) x " + format_fixed(eta, 3) + " = " +
                                       energy_text(out.space_heat_kwh) + " useful (hot water and cooking, if any, included)");
        } else {
            const bool f = out.climate->fahrenheit;
            const auto [tau_low, tau_high] = prism_tau_range_c(f);
            const auto fit = fit_prism(bills, out.climate->model, tau_low, tau_high);
            out.fit = fit;
            out.fit_unit = "kWh";
            out.balance_point_c = fit.tau_c;
            out.space_heat_kwh = fit.heating_kwh * eta;
            out.demand_uncertainty_kwh = fit.nac_standard_error_kwh * eta;
            out.demand_trace.push_back(weather_text(fit.weather));
            if (fit.weather == bill_weather::normals)
                warnings.push_back({"/demand/observed",
                                    "the bills are fitted against the climate's normal weather, not the weather of the "
                                    "billing periods, so the result is not weather-normalised (a mild or a cold winter "
                                    "moves it); give each bill's average outdoor temperature or import the daily weather"});
            out.demand_trace.push_back("PRISM fit (Fels 1986) of " + std::to_string(bills.size()) + " bills: use per day = " +
                                       format_fixed(fit.base_kwh_per_day, 2) + " kWh + " + format_fixed(fit.slope_kwh_per_k_day, 3) +
                                       " kWh per K day x HDD per day to tau = " + temp_text(fit.tau_c) +
                                       ", R^2 = " + format_fixed(fit.r2, 3));
            out.demand_trace.push_back("normalised with the climate's normal year: " + format_fixed(fit.normal_hdd / degree_size(f), 0) +
                                       (f ? " degF" : " K") + " day of HDD to tau");
            out.demand_trace.push_back("normalised annual consumption " + energy_text(fit.nac_kwh) + " = base " +
                                       energy_text(fit.base_annual_kwh) + " + heating " + energy_text(fit.heating_kwh) +
                                       " (HHV; standard error " + energy_text(fit.nac_standard_error_kwh) + ")");
            out.demand_trace.push_back("useful space heat = heating part x " + format_fixed(eta, 3) + " = " +
                                       energy_text(out.space_heat_kwh) + "; the base part (hot water, cooking) is not counted");
            const auto doubts = doubts_about(fit, tau_low, tau_high);
            if (doubts.poor_fit)
                warnings.push_back({"/demand/bills", "poor fit (R^2 = " + format_fixed(fit.r2, 2) + " < 0.7): the bills do not follow "
                                                     "the weather well; check the readings and the climate"});
            if (doubts.tau_at_edge)
                warnings.push_back({"/demand/bills",
                                    "the reference temperature the fit found, " + temp_text(fit.tau_c) + ", lies at the edge of "
                                    "the range searched (" + temp_text(tau_low) + " to " + temp_text(tau_high) + "): the bills "
                                    "do not show where heating starts, so the split between base use and heating is uncertain; "
                                    "bills from both winter and summer help"});
            if (doubts.every_period_heated)
                warnings.push_back({"/demand/bills",
                                    "every billing period needed heat (the warmest averaged " +
                                        format_fixed(doubts.least_hdd_per_day / degree_size(f), 1) + (f ? " degF" : " K") +
                                        " below the reference temperature a day), so the bills cannot tell the base use (hot "
                                        "water, cooking) from heating: the split between them, and the useful space heat, "
                                        "is uncertain; add summer bills"});
            if (fit.slope_kwh_per_k_day <= 0)
                throw input_error("/demand/bills", "the bills show no heating use that rises with the cold (slope " +
                                                       format_number(fit.slope_kwh_per_k_day) + ")");
        }
        if (bills.size() < 6)
            warnings.push_back({"/demand/bills", "fewer than 6 bills (" + std::to_string(bills.size()) +
                                                 "); 12 monthly bills give the most reliable fit"});
        if (!bills_cover_coldest_months(bills, out.climate->model)) warnings.push_back({"/demand/bills", "no bill covers the coldest months; the heating slope is uncertain"});
        warn_unknown_keys(demand, {"method", "bills", "option", "fuel", "system", "balance_point", "hot_water", "water_heating", "bill_dates",
                                   "observed"},
                          "/demand", warnings);
    } else {
        throw input_error("/demand/method", "unknown demand method \"" + method + "\"; accepted: direct, heat-loss, bills");
    }
    if (demand.contains("hot_water") && demand.contains("water_heating"))
        throw input_error("/demand/hot_water", "give the hot water once: demand.water_heating replaces demand.hot_water");
    if (demand.contains("hot_water")) {
        const double hot_water_kwh = quantity_in(demand.at("hot_water"), "/demand/hot_water", dimension::energy, "kWh");
        if (hot_water_kwh < 0) throw input_error("/demand/hot_water/value", "must be >= 0");
        require_annual_heat(hot_water_kwh, demand.at("hot_water"), "/demand/hot_water", true);
        out.hot_water_kwh = hot_water_kwh;
        out.demand_trace.push_back("plus domestic hot water " + energy_text(out.hot_water_kwh) +
                                   " useful per year, made by each option's heating system (demand.hot_water)");
    }
    if (demand.contains("water_heating")) read_water_heating(demand.at("water_heating"), out, warnings);
    out.annual_useful_heat_kwh = out.space_heat_kwh + out.hot_water_kwh;
    if (method == "direct")
        require_annual_heat(out.space_heat_kwh, demand.at("annual_useful_heat"), "/demand/annual_useful_heat", false);
    if (!(out.annual_useful_heat_kwh >= min_annual_heat_kwh && out.annual_useful_heat_kwh <= max_annual_heat_kwh))
        throw input_error("/demand", "the annual useful heat works out at " +
                                         format_number(out.annual_useful_heat_kwh) +
                                         " kWh; it must be from 1 kWh to 5,000 MWh a year: check the demand inputs");
    // A worked-out heat need outside what houses need is questioned at the inputs it came from.
    if (method != "direct" && (out.space_heat_kwh > large_house_heat_kwh || out.space_heat_kwh < small_house_heat_kwh))
        warnings.push_back({method == "bills" ? "/demand/bills" : demand.contains("ua") ? "/demand/ua" : "/demand/design_heat_loss",
                            "the yearly space heat works out at " + energy_text(out.space_heat_kwh) + ", " +
                                (out.space_heat_kwh > large_house_heat_kwh ? "far above" : "far below") +
                                " what a house needs (about 1.5 to 300 MWh, 5 to 1,000 MMBtu); check the " +
                                (method == "bills" ? "bills' quantities and units" : "heat loss and its unit")});
}

}  // namespace fw

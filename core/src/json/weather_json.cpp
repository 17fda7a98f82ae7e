// The weather entry point: a weather file's text in, its observed daily means and the climate it
// implies out, ready to paste into a scenario (`demand.observed`, `climate`).
#include <nlohmann/json.hpp>

#include "fw/api.hpp"
#include "climate/demand.hpp"
#include "json/json_fields.hpp"
#include "base/units.hpp"
#include "climate/weather.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

/// The read options of a weather request: format, unit and column names.
weather_read_options read_weather_options(const json& request) {
    weather_read_options options;
    if (const auto format = optional_string(request, "format", "")) {
        if (*format == "daily") options.format = weather_format::daily;
        else if (*format == "hourly") options.format = weather_format::hourly;
        else if (*format != "auto" && !format->empty())
            throw input_error("/format", "must be daily, hourly or auto, got \"" + *format + "\"");
    }
    if (const auto unit = optional_string(request, "unit", "")) {
        if (*unit == "degF") options.fahrenheit = true;
        else if (*unit == "degC") options.fahrenheit = false;
        else if (!unit->empty()) throw input_error("/unit", "must be degC or degF, got \"" + *unit + "\"");
    }
    if (request.contains("columns")) {
        const auto& columns = request.at("columns");
        require_object(columns, "/columns");
        const auto name = [&](const char* key) { return optional_string(columns, key, "/columns").value_or(""); };
        options.columns = {name("date"), name("time"), name("mean"), name("max"), name("min"), name("temperature")};
    }
    return options;
}

/// The answer: what was read, the observed daily means and, over whole years, the climate.
json weather_answer(const weather_series& series, std::vector<issue>& warnings) {
    const std::string unit = series.fahrenheit ? "degF" : "degC";
    const auto t = [&](double c) { return convert(c, "degC", unit); };
    const double per_k = series.fahrenheit ? 9.0 / 5.0 : 1.0;
    json daily = json::array();
    for (const auto& day : series.days) daily.push_back({day_text(day.day), t(day.mean_c)});
    for (const auto& w : series.warnings) warnings.push_back(w);
    const double base_c = series.fahrenheit ? convert(65, "degF", "degC") : 18.3;
    std::string why_not;
    const auto climate = climate_of_weather(series, base_c, series.fahrenheit ? 2 * 5.0 / 9.0 : 1.0, why_not);
    const std::string period = day_text(series.days.front().day) + " to " + day_text(series.days.back().day);
    const std::string source = "weather file" + (series.station.empty() ? std::string() : " of " + series.station) + ", " + period;
    json out = {{"format", series.format == weather_format::daily ? "daily" : "hourly"},
                {"unit", unit},
                {"station", series.station.empty() ? json(nullptr) : json(series.station)},
                {"first_date", day_text(series.days.front().day)},
                {"last_date", day_text(series.days.back().day)},
                {"days", series.days.size()},
                {"observed", {{"unit", unit}, {"daily_mean", daily}, {"source", source}}},
                {"notes", series.notes}};
    if (series.format == weather_format::hourly) out["hours"] = series.hourly_c.size();
    json summary = {{"annual_hdd", nullptr},
                    {"hdd_base", {{"value", t(base_c)}, {"unit", unit}}},
                    {"design_temperature_99", nullptr},
                    {"design_temperature_996", nullptr},
                    {"design_basis", nullptr}};
    if (!climate) {
        out["climate"] = nullptr;
        warnings.push_back({"/text", "no climate: " + why_not + "; the daily means can still serve the bills' weather"});
        out["summary"] = summary;
        return out;
    }
    json means = json::array(), spread = json::array();
    for (int m = 0; m < 12; ++m) {
        means.push_back(t(climate->monthly_mean_c[m]));
        spread.push_back(climate->monthly_sd_k[m] * per_k);
    }
    json c = {{"unit", unit}, {"monthly_mean", means}, {"monthly_sd", spread}, {"name", series.station}, {"source", source}};
    if (climate->daily_range_k) c["daily_range"] = *climate->daily_range_k * per_k;
    summary["annual_hdd"] = climate->annual_hdd_k_day * per_k;
    if (climate->design_99_c) {
        c["design_temperature"] = {{"value", t(*climate->design_99_c)}, {"unit", unit}};
        json bins = json::array();
        for (std::size_t k = 0; k < climate->bins.size(); ++k)
            bins.push_back({{"t", t(climate->bins[k].t_c)},
                            {"hours", climate->bins[k].hours},
                            {"by_hour", climate->bins_when[k].by_hour},
                            {"by_month", climate->bins_when[k].by_month}});
        c["bins"] = bins;
        c["bin_width"] = climate->bin_width_k * per_k;
        summary["design_temperature_99"] = t(*climate->design_99_c);
        summary["design_temperature_996"] = t(*climate->design_996_c);
        summary["design_basis"] = "hours";
    } else {
        // A daily file has no hours: the design temperatures of the climate model its means, spread
        // and range give (Erbs's hourly profile about logistic daily means).
        climate_model model = climate_from_means(climate->monthly_mean_c, climate->monthly_sd_k, false,
                                                 climate->daily_range_k.value_or(default_daily_range_k));
        summary["design_temperature_99"] = t(design_temperature(model, 0.01));
        summary["design_temperature_996"] = t(design_temperature(model, 0.004));
        summary["design_basis"] = "model";
    }
    out["climate"] = c;
    out["summary"] = summary;
    return out;
}

}  // namespace

std::string weather_json(const std::string& request_json) noexcept {
    try {
        if (request_json.size() > max_weather_bytes + 4096)
            return error_response({{"/text", "the file is larger than " + std::to_string(max_weather_bytes >> 20) +
                                                 " MB; export fewer years or columns"}});
        json request;
        try {
            request = json::parse(request_json);
        } catch (const json::parse_error&) {
            return error_response({{"", "malformed JSON request"}});
        }
        std::vector<issue> warnings;
        require_object(request, "");
        const auto text = optional_string(request, "text", "");
        if (!text) throw input_error("/text", "is required (the weather file's text)");
        const auto options = read_weather_options(request);
        warn_unknown_keys(request, {"text", "format", "unit", "columns"}, "", warnings);
        auto out = weather_answer(read_weather_csv(*text, options), warnings);
        require_finite_output(out);
        out["errors"] = json::array();
        out["warnings"] = issues_json(warnings);
        return dump_text(out);
    } catch (const input_error& error) {
        return error_response(error.issues());
    } catch (const std::exception& error) {
        return error_response({{"", std::string("internal error: ") + error.what()}});
    }
}

}  // namespace fw

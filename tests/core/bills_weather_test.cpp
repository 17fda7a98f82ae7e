// Bills as utilities print them (meter reads that share their boundary day) and the PRISM fit on
// the weather the house actually saw: observed daily means or each bill's average temperature.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "fw/api.hpp"
#include "climate/demand.hpp"

namespace {

using nlohmann::json;

/// An invented site's normal climate [degF]; the scenario's normals for weather-normalising.
const json normal_climate = {{"unit", "degF"},
                             {"monthly_mean", {26.0, 29.0, 38.0, 49.0, 59.0, 68.0, 73.0, 71.0, 64.0, 52.0, 41.0, 31.0}}};

/// Invented daily mean temperatures [degF] from `first` for `days` days: an annual cosine (coldest
/// about 20 January) plus AR(1) weather noise from a fixed linear congruential stream, so every
/// "year" differs as real winters do.
std::vector<double> invented_daily_weather(long first, int days, std::uint64_t seed, double offset_f) {
    std::vector<double> out;
    std::uint64_t state = seed;
    const auto uniform = [&] {
        state = state * 6364136223846793005ULL + 1442695040888963407ULL;
        return static_cast<double>(state >> 11) / 9007199254740992.0;
    };
    double anomaly = 0;
    for (int i = 0; i < days; ++i) {
        const long day = first + i;
        const double doy = static_cast<double>((day % 365 + 365) % 365);
        const double normal = 50.0 + offset_f - 24.0 * std::cos(2 * 3.14159265358979 * (doy - 20.0) / 365.0);
        const double shock = std::sqrt(-2 * std::log(uniform() + 1e-300)) * std::cos(2 * 3.14159265358979 * uniform());
        anomaly = 0.7 * anomaly + 6.0 * shock;
        out.push_back(normal + anomaly);
    }
    return out;
}

struct house {
    double base_therm_per_day, slope_therm_per_f_day, tau_f;
};

/// [therm] The gas a house uses over days [first, end) of the weather that starts on `weather_first`.
double therms_used(const house& h, const std::vector<double>& weather, long weather_first, long first, long end) {
    double total = 0;
    for (long day = first; day < end; ++day)
        total += h.base_therm_per_day + h.slope_therm_per_f_day * std::max(0.0, h.tau_f - weather[day - weather_first]);
    return total;
}

/// A bills scenario: meter-read bills (each starts on the day the previous one ended) from `reads`.
json bills_scenario(const std::vector<std::string>& reads, const std::vector<double>& therms, const json& extra) {
    json bills = json::array();
    for (std::size_t i = 0; i + 1 < reads.size(); ++i)
        bills.push_back({{"start", reads[i]}, {"end", reads[i + 1]}, {"quantity", therms[i]}, {"unit", "therm"}});
    json demand = {{"method", "bills"}, {"option", "gas"}, {"bills", bills}};
    for (const auto& [key, value] : extra.items()) demand[key] = value;
    return {{"schema", "fuelwright.scenario/1"},
            {"settings", {{"units", "us"}, {"currency", "USD"}}},
            {"climate", normal_climate},
            {"demand", demand},
            {"options", json::array({{{"id", "gas"}, {"existing", true}, {"fuel", "natural-gas"},
                                      {"price", {{"amount", 1.45}, {"per", "therm"}}},
                                      {"system", {{"kind", "furnace"}, {"efficiency", {{"value", 80}, {"rating", "AFUE"}}}}},
                                      {"heating_value", {{"value", 100000}, {"unit", "Btu/therm"}, {"basis", "HHV"}}}}})}};
}

/// The scenario's answer with every detail (trace, sources, bins): these tests read how figures were worked out.
json evaluate(json scenario) {
    scenario["detail"] = json::array({"all"});
    return json::parse(fw::evaluate_json(scenario.dump()));
}

/// Twelve meter reads about a month apart, on the days a utility might read, from `year`-11-12.
std::vector<std::string> meter_reads(int year) {
    const int offsets[] = {0, 29, 62, 93, 121, 152, 182, 213, 243, 274, 305, 335, 365};
    const long first = fw::parse_day_number(std::to_string(year) + "-11-12", "");
    std::vector<std::string> out;
    for (int offset : offsets) out.push_back(fw::day_text(first + offset));
    return out;
}

TEST(bills_weather, utility_printed_bills_sharing_boundary_days_evaluate) {
    // 11/12-12/11, then 12/11-1/13, ...: the normal case on a utility bill (issue 12). Without
    // bill_dates these share days, so they are read as meter reads; the trace says so.
    const auto reads = meter_reads(2024);
    const std::vector<double> therms = {95, 160, 180, 150, 110, 60, 30, 22, 21, 25, 50, 90};
    const auto result = evaluate(bills_scenario(reads, therms, json::object()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& trace = result.at("demand").at("trace");
    EXPECT_NE(std::find(trace.begin(), trace.end(),
                        "bill dates read as meter reads: a bill covers the days from its start date up to its end date, "
                        "which starts the next bill (the bills share boundary days)"),
              trace.end())
        << trace.dump();
    EXPECT_EQ(result.at("demand").at("fit").at("weather"), "normals");
    EXPECT_GT(result.at("options").at(0).at("annual_cost").get<double>(), 0);
    // No option is left without a result and no message speaks of an internal error.
    EXPECT_EQ(result.dump().find("internal error"), std::string::npos);
}

TEST(bills_weather, old_files_without_the_rule_keep_their_inclusive_meaning) {
    // Periods that never share a day (1/1-1/31, 2/1-2/28, ...) are read as before: 31 days, 28 days...
    json bills = json::array();
    const char* months[][2] = {{"2025-01-01", "2025-01-31"}, {"2025-02-01", "2025-02-28"}, {"2025-03-01", "2025-03-31"}};
    for (auto& m : months) bills.push_back({{"start", m[0]}, {"end", m[1]}, {"quantity", 100}, {"unit", "therm"}});
    auto scenario = bills_scenario({}, {}, json::object());
    scenario["demand"]["bills"] = bills;
    const auto result = evaluate(scenario);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& points = result.at("demand").at("fit").at("points");
    // 100 therm = 2930.71 kWh over 31, 28 and 31 days.
    EXPECT_NEAR(points.at(0).at("use_per_day").get<double>(), 100 * 29.30710701722 / 31, 1e-9);
    EXPECT_NEAR(points.at(1).at("use_per_day").get<double>(), 100 * 29.30710701722 / 28, 1e-9);
    // The same dates declared as meter reads leave a day out between bills (a message, not a silent change).
    scenario["demand"]["bill_dates"] = "meter-reads";
    const auto read = evaluate(scenario);
    EXPECT_NEAR(read.at("demand").at("fit").at("points").at(0).at("use_per_day").get<double>(), 100 * 29.30710701722 / 30, 1e-9);
    const auto& warnings = read.at("warnings");
    EXPECT_TRUE(std::any_of(warnings.begin(), warnings.end(), [](const json& w) {
        return w.at("path") == "/demand/bills/1/start" &&
               w.at("message") == "1 day (2025-01-31 to 2025-01-31) between the bill of 2025-01-01 to 2025-01-31 and the bill "
                                  "of 2025-02-01 to 2025-02-28 are not covered by any bill";
    })) << warnings.dump();
}

TEST(bills_weather, observed_daily_weather_recovers_the_house_whatever_the_year) {
    // A house with 1.1 therm/day of base use, 0.35 therm per degF day below 61 degF, billed by meter
    // reads over four different invented winters: PRISM on the degree-days of each period (Fels 1986)
    // recovers base, slope and tau to 1 %, and the normalised annual consumption is the same each year.
    const house h{1.1, 0.35, 61.0};
    double nac_expected = 0;
    for (int year = 2019; year <= 2022; ++year) {
        const auto reads = meter_reads(year);
        const long first = fw::parse_day_number(reads.front(), "");
        const auto weather = invented_daily_weather(first, 400, 1000 + static_cast<std::uint64_t>(year),
                                                    (year % 2 ? 3.0 : -3.0));
        std::vector<double> therms;
        for (std::size_t i = 0; i + 1 < reads.size(); ++i)
            therms.push_back(therms_used(h, weather, first, fw::parse_day_number(reads[i], ""),
                                         fw::parse_day_number(reads[i + 1], "")));
        json daily = json::array();
        for (std::size_t i = 0; i < weather.size(); ++i) daily.push_back({fw::day_text(first + static_cast<long>(i)), weather[i]});
        const auto result = evaluate(bills_scenario(
            reads, therms, {{"bill_dates", "meter-reads"}, {"observed", {{"unit", "degF"}, {"daily_mean", daily}}}}));
        ASSERT_TRUE(result.at("errors").empty()) << result.dump();
        const auto& fit = result.at("demand").at("fit");
        EXPECT_EQ(fit.at("weather"), "observed-daily");
        const double kwh_per_therm = 29.30710701722;
        EXPECT_NEAR(fit.at("tau").get<double>() / h.tau_f, 1.0, 0.01) << year;
        EXPECT_NEAR(fit.at("base_per_day").get<double>() / (h.base_therm_per_day * kwh_per_therm), 1.0, 0.01) << year;
        EXPECT_NEAR(fit.at("slope").get<double>() / (h.slope_therm_per_f_day * kwh_per_therm), 1.0, 0.01) << year;
        EXPECT_NEAR(fit.at("r2").get<double>(), 1.0, 1e-6);
        // Normalised with the climate's normal HDD at the fitted tau: the same house, the same NAC.
        const double nac = fit.at("nac").get<double>();
        if (nac_expected == 0) nac_expected = nac;
        EXPECT_NEAR(nac / nac_expected, 1.0, 0.01) << year;
        EXPECT_NEAR(fit.at("cv_nac").get<double>(), fit.at("nac_standard_error").get<double>() / nac, 1e-12);
    }
}

TEST(bills_weather, a_year_that_always_needs_heat_cannot_split_base_use_from_heating) {
    // In a cold or maritime climate where every day is below the house's reference temperature, base
    // use and the reference temperature trade off exactly (base + slope x (tau - T)): the fit says so.
    const house h{1.1, 0.35, 61.0};
    const auto reads = meter_reads(2021);
    const long first = fw::parse_day_number(reads.front(), "");
    const auto weather = invented_daily_weather(first, 400, 11, -32.0);
    std::vector<double> therms;
    for (std::size_t i = 0; i + 1 < reads.size(); ++i)
        therms.push_back(therms_used(h, weather, first, fw::parse_day_number(reads[i], ""), fw::parse_day_number(reads[i + 1], "")));
    json daily = json::array();
    for (std::size_t i = 0; i < weather.size(); ++i) daily.push_back({fw::day_text(first + static_cast<long>(i)), weather[i]});
    auto scenario = bills_scenario(reads, therms, {{"observed", {{"unit", "degF"}, {"daily_mean", daily}}}});
    for (auto& mean : scenario["climate"]["monthly_mean"]) mean = mean.get<double>() - 32.0;  // a climate that cold
    const auto result = evaluate(scenario);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& warnings = result.at("warnings");
    EXPECT_TRUE(std::any_of(warnings.begin(), warnings.end(), [](const json& w) {
        return w.at("path") == "/demand/bills" && w.at("message").get<std::string>().rfind("every billing period needed heat", 0) == 0;
    })) << warnings.dump();
}

TEST(bills_weather, observed_temperatures_in_the_other_unit_are_caught_at_the_unit) {
    // Daily means in degC labelled degF would double the heat need without a word: the monthly means
    // are compared with the climate's normals, and the other unit fits them.
    const auto reads = meter_reads(2024);
    const long first = fw::parse_day_number(reads.front(), "");
    const auto weather = invented_daily_weather(first, 370, 5, 0);
    json daily = json::array();
    for (std::size_t i = 0; i < weather.size(); ++i)
        daily.push_back({fw::day_text(first + static_cast<long>(i)), (weather[i] - 32) * 5 / 9});  // in degC
    const std::vector<double> therms = {95, 160, 180, 150, 110, 60, 30, 22, 21, 25, 50, 90};
    const auto wrong = evaluate(bills_scenario(reads, therms, {{"observed", {{"unit", "degF"}, {"daily_mean", daily}}}}));
    ASSERT_EQ(wrong.at("errors").size(), 1u) << wrong.at("errors").dump();
    EXPECT_EQ(wrong.at("errors").at(0).at("path"), "/demand/observed/unit");
    EXPECT_EQ(wrong.at("errors").at(0).at("message").get<std::string>().rfind("the observed temperatures read in degF lie ", 0), 0u);
    const auto right = evaluate(bills_scenario(reads, therms, {{"observed", {{"unit", "degC"}, {"daily_mean", daily}}}}));
    EXPECT_TRUE(right.at("errors").empty()) << right.at("errors").dump();
}

TEST(bills_weather, a_gas_bill_in_ccf_uses_the_therm_factor_it_prints) {
    // 100 ccf at a therm factor of 1.037 therm/ccf (as a utility prints it) = 103.7 therm = 103.7 x
    // 29.30710701722 kWh (1 therm = 100,000 Btu_IT); without it the catalog's 1036 Btu/ft3 (EIA) gives 103.6 therm.
    const auto reads = meter_reads(2024);
    json bills = json::array();
    const double ccf[] = {100, 170, 180};  // more gas in the colder periods
    for (int i = 0; i < 3; ++i)
        bills.push_back({{"start", reads[i]}, {"end", reads[i + 1]}, {"quantity", ccf[i]}, {"unit", "ccf"},
                         {"heating_value", {{"value", 1.037}, {"unit", "therm/ccf"}}}});
    auto scenario = bills_scenario({}, {}, json::object());
    scenario["options"][0].erase("heating_value");
    scenario["demand"]["bills"] = bills;
    const auto result = evaluate(scenario);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const long days = fw::parse_day_number(reads[1], "") - fw::parse_day_number(reads[0], "");
    EXPECT_NEAR(result.at("demand").at("fit").at("points").at(0).at("use_per_day").get<double>(), 103.7 * 29.30710701722 / days, 1e-9);
    scenario["demand"]["bills"][0].erase("heating_value");
    const auto catalog = evaluate(scenario);
    EXPECT_NEAR(catalog.at("demand").at("fit").at("points").at(0).at("use_per_day").get<double>(), 103.6 * 29.30710701722 / days, 1e-9);
    // A therm factor typed in the wrong unit (1.037 MJ/ccf) is refused at its field.
    scenario["demand"]["bills"][1]["heating_value"]["unit"] = "MJ/ccf";
    const auto wrong = evaluate(scenario);
    EXPECT_EQ(wrong.at("errors").at(0).at("path"), "/demand/bills/1/heating_value/value");
}

TEST(bills_weather, a_bill_the_observed_weather_does_not_cover_gets_a_message) {
    const auto reads = meter_reads(2024);
    const long first = fw::parse_day_number(reads.front(), "");
    // 200 days from 2024-11-12: observed up to 2025-05-30. Bill 6 runs 2025-05-13 up to its 2025-06-13
    // read (31 days, 2025-05-13 to 2025-06-12), of which 13 are not observed.
    const auto weather = invented_daily_weather(first, 200, 7, 0);
    json daily = json::array();
    for (std::size_t i = 0; i < weather.size(); ++i) daily.push_back({fw::day_text(first + static_cast<long>(i)), weather[i]});
    const std::vector<double> therms(12, 100.0);
    const auto result = evaluate(bills_scenario(reads, therms, {{"observed", {{"unit", "degF"}, {"daily_mean", daily}}}}));
    ASSERT_FALSE(result.at("errors").empty());
    EXPECT_EQ(result.at("errors").at(0).at("path"), "/demand/bills/6");
    EXPECT_EQ(result.at("errors").at(0).at("message"),
              "the observed daily temperatures (/demand/observed) lack 13 of the 31 days of the bill of 2025-05-13 to "
              "2025-06-13; import weather that covers it or give the bill's average temperature");
    EXPECT_TRUE(result.at("options").empty());
}

TEST(bills_weather, period_mean_temperatures_fit_with_the_climate_spread) {
    // Bills printing each period's average temperature: the fit uses the logistic expectation of the
    // period's HDD about that mean. Bills generated with the same expectation are recovered exactly.
    const auto reads = meter_reads(2024);
    const double means_f[] = {42, 33, 24, 27, 36, 47, 57, 66, 72, 70, 62, 50};
    json bills = json::array();
    auto model = fw::climate_from_means({-3.333333333333333, -1.666666666666667, 3.333333333333333, 9.444444444444445,
                                         15.0, 20.0, 22.77777777777778, 21.66666666666667, 17.77777777777778,
                                         11.11111111111111, 5.0, -0.5555555555555556},
                                        std::nullopt, false);
    const double tau_c = (60.0 - 32) * 5 / 9, base_kwh = 30, slope_kwh_per_k = 18;
    for (std::size_t i = 0; i + 1 < reads.size(); ++i) {
        fw::bill_period bill;
        bill.first_day = fw::parse_day_number(reads[i], "");
        bill.last_day = fw::parse_day_number(reads[i + 1], "") - 1;
        bill.weather = fw::bill_weather::observed_period_mean;
        bill.mean_c = (means_f[i] - 32) * 5 / 9;
        const double days = bill.last_day - bill.first_day + 1;
        const double kwh = base_kwh * days + slope_kwh_per_k * fw::bill_hdd(bill, model, tau_c);
        bills.push_back({{"start", reads[i]}, {"end", reads[i + 1]}, {"quantity", kwh}, {"unit", "kWh"},
                         {"mean_temperature", {{"value", means_f[i]}, {"unit", "degF"}}}});
    }
    auto scenario = bills_scenario({}, {}, json::object());
    scenario["demand"]["bills"] = bills;
    const auto result = evaluate(scenario);
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    const auto& fit = result.at("demand").at("fit");
    EXPECT_EQ(fit.at("weather"), "observed-period-mean");
    EXPECT_NEAR(fit.at("tau").get<double>(), 60.0, 0.01);
    EXPECT_NEAR(fit.at("slope").get<double>(), slope_kwh_per_k * 5 / 9, 0.01);
    EXPECT_NEAR(fit.at("base_per_day").get<double>(), base_kwh, 0.05);
    // One bill without its average temperature: a message at that bill.
    scenario["demand"]["bills"][3].erase("mean_temperature");
    const auto mixed = evaluate(scenario);
    EXPECT_EQ(mixed.at("errors").at(0).at("path"), "/demand/bills/3/mean_temperature");
}

TEST(bills_weather, a_demand_problem_stops_before_any_option_is_computed) {
    // Issue 12: bills that overlap used to surface as "internal error: a result came out as NaN" at a
    // heat pump's cost per GJ. The message is now the demand's own, and no option is computed.
    auto scenario = bills_scenario(meter_reads(2024), std::vector<double>(12, 100.0), {{"bill_dates", "inclusive"}});
    scenario["options"].push_back({{"id", "hp"},
                                   {"fuel", "electricity"},
                                   {"price", {{"amount", 0.16}, {"per", "kWh"}}},
                                   {"system", {{"kind", "air-source-heat-pump"}, {"efficiency", {{"value", 9}, {"rating", "HSPF"}}}}}});
    const auto result = evaluate(scenario);
    ASSERT_EQ(result.at("errors").size(), 1u) << result.dump();
    EXPECT_EQ(result.at("errors").at(0).at("path"), "/demand/bills/1/start");
    EXPECT_EQ(result.at("errors").at(0).at("message"),
              "the bill of 2024-12-11 to 2025-01-13 overlaps the bill of 2024-11-12 to 2024-12-11 by 1 day (2024-12-11 to "
              "2024-12-11); each day may be billed once");
    EXPECT_TRUE(result.at("options").empty());
    // An empty, zero or negative yearly heat need: a message at the field, never an internal error.
    for (const json& value : {json(0), json(-5), json(nullptr)}) {
        json direct = scenario;
        direct["demand"] = {{"method", "direct"}, {"annual_useful_heat", {{"value", value}, {"unit", "MMBtu"}}}};
        const auto answer = evaluate(direct);
        ASSERT_EQ(answer.at("errors").size(), 1u) << answer.dump();
        EXPECT_EQ(answer.at("errors").at(0).at("path").get<std::string>().rfind("/demand/annual_useful_heat", 0), 0u);
        EXPECT_EQ(answer.dump().find("internal error"), std::string::npos);
    }
    // An absurd one (1e12 MMBtu typed for 120): refused at the field, with the range taken.
    json absurd = scenario;
    absurd["demand"] = {{"method", "direct"}, {"annual_useful_heat", {{"value", 1e12}, {"unit", "MMBtu"}}}};
    const auto refused = evaluate(absurd);
    ASSERT_EQ(refused.at("errors").size(), 1u);
    EXPECT_EQ(refused.at("errors").at(0).at("path"), "/demand/annual_useful_heat/value");
    EXPECT_EQ(refused.at("errors").at(0).at("message"),
              "1e+12 MMBtu is not the yearly heat of a house: at most 17060.71 MMBtu (5,000 MWh) is taken");
    // A large but possible one is evaluated, with a question at the field (5,000 MMBtu = 1,465 MWh).
    absurd["demand"]["annual_useful_heat"]["value"] = 5000;
    const auto questioned = evaluate(absurd);
    ASSERT_TRUE(questioned.at("errors").empty()) << questioned.dump();
    const auto& warnings = questioned.at("warnings");
    EXPECT_NE(std::find(warnings.begin(), warnings.end(),
                        json{{"path", "/demand/annual_useful_heat/value"},
                             {"message", "5000.00 MMBtu a year is far above what a house needs (about 1.5 to 300 MWh, 5 to 1,000 "
                                         "MMBtu); check the value and its unit"}}),
              warnings.end())
        << warnings.dump();
}

}  // namespace

// Degree-days and temperature bins: identities, the Erbs form against the normal form, and the
// published multi-base degree-day tables of the Western Regional Climate Center.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>
#include <numeric>

#include "fw/api.hpp"
#include "climate/climate.hpp"
#include "base/units.hpp"

namespace {

using nlohmann::json;

const std::array<double, 12> mixed_means_c = {-5.0, -3.5, 1.5, 8.0, 14.0, 19.0, 22.0, 21.0, 16.5, 10.0, 4.0, -2.0};

TEST(climate, hdd_minus_cdd_is_days_times_base_minus_mean_every_month) {
    // Identity of any distribution symmetric about its mean: E[(Tb-T)+] - E[(T-Tb)+] = Tb - Tm.
    const auto climate = fw::climate_from_means(mixed_means_c, std::nullopt, false);
    const auto days = fw::days_in_months(false);
    for (double base : {10.0, 15.5, 18.3, 21.0})
        for (int m = 0; m < 12; ++m) {
            const double hdd = fw::logistic_hdd(climate.monthly_mean_c[m], climate.daily_sd_k[m], base, days[m]);
            const double cdd = fw::logistic_cdd(climate.monthly_mean_c[m], climate.daily_sd_k[m], base, days[m]);
            EXPECT_NEAR(hdd - cdd, days[m] * (base - climate.monthly_mean_c[m]), 1e-9) << m;
        }
}

TEST(climate, erbs_formula_as_printed_equals_the_logistic_written_with_the_daily_sd) {
    // DD = sigma_m N^1.5 [h/2 + ln(e^-ah + e^ah)/(2a)], h = (Tb - Tm)/(sigma_m sqrt N), a = 1.698.
    for (double mean : {-10.0, 0.0, 8.0, 15.0})
        for (double sigma_m : {1.5, 2.2, 3.0}) {
            const int n = 31;
            const double h = (18.3 - mean) / (sigma_m * std::sqrt(n));
            const double a = fw::erbs_a;
            const double printed = sigma_m * std::pow(n, 1.5) * (h / 2 + std::log(std::exp(-a * h) + std::exp(a * h)) / (2 * a));
            EXPECT_NEAR(fw::logistic_hdd(mean, fw::erbs_daily_sd(sigma_m, n), 18.3, n), printed, 1e-9 * printed);
        }
}

TEST(climate, erbs_estimate_against_the_normal_distribution_form) {
    // Normal form (Thom; Krarti, Energy Audit of Building Systems): DD = sigma N [Z Phi(Z) + phi(Z)].
    // With the same daily SD the logistic and the normal differ only in their tails: within 3 %
    // of a month's HDD, or 0.03 x sigma x N where the HDD is small.
    const auto climate = fw::climate_from_means(mixed_means_c, std::nullopt, false);
    const auto days = fw::days_in_months(false);
    for (int m = 0; m < 12; ++m) {
        const double sd = climate.daily_sd_k[m];
        const double logistic = fw::logistic_hdd(climate.monthly_mean_c[m], sd, 18.3, days[m]);
        const double normal = fw::normal_hdd(climate.monthly_mean_c[m], sd, 18.3, days[m]);
        EXPECT_NEAR(logistic, normal, std::max(0.03 * normal, 0.03 * sd * days[m])) << m;
    }
}

TEST(climate, wrcc_multi_base_tables_from_the_base_65_column) {
    // Western Regional Climate Center, Period of Record General Climate Summary - Heating Degree
    // Days, station 057167 ROCKY FORD 2 SE, Colorado (1893-2012), degF days. Rebuilding the climate
    // from the base-65 column alone, the model must predict the base-60 and base-50 columns: the
    // spread of daily temperatures (Erbs's sigma_m) is what moves degree-days between bases.
    const std::array<double, 12> base65 = {1082, 854, 689, 377, 147, 17, 1, 2, 68, 348, 743, 1050};
    const std::array<double, 12> base60 = {927, 713, 535, 244, 69, 4, 0, 0, 27, 215, 593, 895};
    const std::array<double, 12> base50 = {619, 434, 256, 69, 9, 0, 0, 0, 4, 52, 305, 586};
    std::array<double, 12> base65_k{};
    for (int m = 0; m < 12; ++m) base65_k[m] = base65[m] * 5.0 / 9.0;
    const auto climate = fw::climate_from_monthly_hdd(base65_k, fw::convert(65, "degF", "degC"), false);
    const auto at60 = fw::monthly_hdd(climate, fw::convert(60, "degF", "degC"));
    const auto at50 = fw::monthly_hdd(climate, fw::convert(50, "degF", "degC"));
    double total60 = 0, total50 = 0;
    for (int m = 0; m < 12; ++m) {
        total60 += at60[m] * 1.8;
        total50 += at50[m] * 1.8;
        // Month by month within 8 % or 15 degF-days (the station's own year-to-year noise is larger).
        EXPECT_NEAR(at60[m] * 1.8, base60[m], std::max(0.08 * base60[m], 15.0)) << "base 60, month " << m;
        EXPECT_NEAR(at50[m] * 1.8, base50[m], std::max(0.08 * base50[m], 15.0)) << "base 50, month " << m;
    }
    EXPECT_NEAR(total60 / 4222 - 1, 0.0, 0.01);  // published annual 4222 (model: 4245)
    EXPECT_NEAR(total50 / 2334 - 1, 0.0, 0.03);  // published annual 2334 (model: 2390)
}

TEST(climate, bins_sum_to_the_hours_of_the_year_and_carry_the_degree_hours) {
    for (bool leap : {false, true}) {
        const auto climate = fw::climate_from_means(mixed_means_c, std::nullopt, leap);
        for (double width : {1.0, 10.0 / 9.0}) {
            const auto bins = fw::hourly_bins(climate, width);
            double hours = 0, mean = 0;
            for (const auto& bin : bins) {
                hours += bin.hours;
                mean += bin.hours * bin.t_c;
            }
            EXPECT_NEAR(hours, leap ? 8784 : 8760, 1e-6);
            // The diurnal profile averages to zero: the bins' mean is the year's mean (to the bin width).
            const auto days = fw::days_in_months(leap);
            double year_mean = 0;
            for (int m = 0; m < 12; ++m) year_mean += climate.monthly_mean_c[m] * days[m] * 24;
            EXPECT_NEAR(mean / hours, year_mean / hours, 0.02);
        }
    }
}

TEST(climate, design_temperatures_from_the_bins) {
    const auto climate = fw::climate_from_means(mixed_means_c, std::nullopt, false);
    const double t99 = fw::design_temperature(climate, 0.01);
    const double t996 = fw::design_temperature(climate, 0.004);
    EXPECT_LT(t996, t99);
    // 1 % of 8760 h = 87.6 h lie below the 99 % value: count them in 0.1 K bins.
    double below = 0;
    for (const auto& bin : fw::hourly_bins(climate, 0.1))
        if (bin.t_c < t99) below += bin.hours;
    EXPECT_NEAR(below, 87.6, 2.0);
}

TEST(climate, rebuilt_climates_reproduce_what_they_were_given) {
    const auto original = fw::climate_from_means(mixed_means_c, std::nullopt, false);
    const auto monthly = fw::monthly_hdd(original, 18.3);
    const auto rebuilt = fw::climate_from_monthly_hdd(monthly, 18.3, false);
    for (int m = 0; m < 12; ++m) EXPECT_NEAR(rebuilt.monthly_mean_c[m], original.monthly_mean_c[m], 1e-6) << m;
    const double annual = std::accumulate(monthly.begin(), monthly.end(), 0.0);
    const auto from_annual = fw::climate_from_annual_hdd(annual, 18.3, -15.0, false);
    const auto again = fw::monthly_hdd(from_annual, 18.3);
    EXPECT_NEAR(std::accumulate(again.begin(), again.end(), 0.0), annual, 1e-3);
    EXPECT_NEAR(fw::design_temperature(from_annual, 0.01), -15.0, 1e-3);
}

TEST(climate, cli_climate_output_in_the_input_unit) {
    const json request = {{"climate", {{"monthly_mean", {22, 26, 35, 46, 57, 66, 71, 69, 61, 50, 39, 28}},
                                       {"unit", "degF"},
                                       {"base", {{"value", 65}, {"unit", "degF"}}}}}};
    const auto result = json::parse(fw::climate_json(request.dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("unit"), "degF");
    EXPECT_EQ(result.at("monthly_hdd").size(), 12u);
    double sum = 0;
    for (const auto& v : result.at("monthly_hdd")) sum += v.get<double>();
    EXPECT_NEAR(result.at("annual_hdd").get<double>(), sum, 1e-9);
    EXPECT_NEAR(result.at("bin_hours_total").get<double>(), 8760, 1e-6);
    EXPECT_EQ(result.at("bin_width"), 2);
    // 2 degF bins centred on even degF values.
    const double t = result.at("bins").at(0).at("t").get<double>();
    EXPECT_NEAR(std::fmod(std::fabs(t) + 1e-9, 2.0), 0.0, 1e-6);
    EXPECT_TRUE(result.contains("design_temperature_99"));
}

TEST(climate_errors, messages) {
    auto error_of = [](const json& climate) {
        const auto result = json::parse(fw::climate_json(json{{"climate", climate}}.dump()));
        const auto& e = result.at("errors").at(0);
        return e.at("path").get<std::string>() + ": " + e.at("message").get<std::string>();
    };
    EXPECT_EQ(error_of({{"monthly_mean", {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11}}, {"unit", "degC"}}),
              "/climate/monthly_mean: needs 12 values (January first), got 11");
    EXPECT_EQ(error_of({{"monthly_mean", {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12}}, {"unit", "kelvin"}}),
              "/climate/unit: must be degC or degF, got \"kelvin\"");
    EXPECT_EQ(error_of({{"monthly_mean", {-120, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12}}, {"unit", "degC"}}),
              "/climate/monthly_mean/0: -120 degC is not a plausible monthly mean (it must lie between -70 and 50 degC)");
    EXPECT_EQ(error_of({{"monthly_mean", {-500, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12}}, {"unit", "degF"}}),
              "/climate/monthly_mean/0: -500 degF is below absolute zero");
    EXPECT_EQ(error_of({{"annual_hdd", 3000}, {"unit", "degC"}}),
              "/climate/design_temperature: is required with annual_hdd (the 99 % heating design temperature)");
    EXPECT_EQ(error_of({{"unit", "degC"}}),
              "/climate: give monthly_mean (12 values), monthly_hdd (12 values), or annual_hdd with design_temperature");
    // A base typed as -5 degF for 65: no climate has 10,550 degF-days below -5 degF; said in the quote's degF.
    EXPECT_EQ(error_of({{"annual_hdd", 10550}, {"unit", "degF"}, {"base", {{"value", -5}, {"unit", "degF"}}},
                        {"design_temperature", {{"value", -14}, {"unit", "degF"}}}}),
              "/climate/design_temperature: no climate has 10550 heating degree-days (degF day) to a base of -5 degF and a 99 % "
              "design temperature of -14 degF; check the three values");
    EXPECT_EQ(error_of({{"monthly_hdd", {100, 100, 100, -4, 0, 0, 0, 0, 0, 10, 50, 90}}, {"unit", "degC"}}),
              "/climate/monthly_hdd/3: must be from 0 to a plausible monthly total, got -4");
}

}  // namespace

namespace {

using nlohmann::json;

/// An invented mild maritime site [degF]: small seasonal swing, winters near 40 degF.
const json maritime_means = {40.0, 41.0, 43.0, 46.0, 51.0, 55.0, 59.0, 60.0, 57.0, 51.0, 45.0, 41.0};

TEST(climate_spread, calibrated_to_the_given_design_temperature) {
    // Issue 12: with monthly means and a 99 % design temperature, the spread is scaled so the model's
    // 99 % design temperature reproduces the given one (to 0.5 degF, the tolerance).
    for (double design_f : {22.0, 27.0, 31.0}) {
        const auto result = json::parse(fw::climate_json(
            json{{"unit", "degF"}, {"monthly_mean", maritime_means}, {"design_temperature", {{"value", design_f}, {"unit", "degF"}}}}
                .dump()));
        ASSERT_TRUE(result.at("errors").empty()) << result.dump();
        EXPECT_NEAR(result.at("design_temperature_99").get<double>(), design_f, 0.5);
        EXPECT_TRUE(result.at("warnings").empty()) << result.dump();
        const auto& trace = result.at("trace");
        EXPECT_TRUE(std::any_of(trace.begin(), trace.end(), [](const json& line) {
            return line.get<std::string>().rfind("day-to-day spread calibrated to the given design temperature", 0) == 0;
        })) << trace.dump();
    }
    // Without a design temperature (or the spread) the correlation stands, with a warning saying so.
    const auto plain = json::parse(fw::climate_json(json{{"unit", "degF"}, {"monthly_mean", maritime_means}}.dump()));
    ASSERT_EQ(plain.at("warnings").size(), 1u);
    EXPECT_EQ(plain.at("warnings")[0].at("path"), "/climate/monthly_sd");
    EXPECT_EQ(plain.at("warnings")[0].at("message").get<std::string>().substr(0, 98),
              "the day-to-day spread of daily temperatures comes from a correlation (Erbs, Klein & Beckman 1983) ");
    // monthly_sd wins over the design temperature: no calibration, the spread as given.
    const auto given = json::parse(fw::climate_json(json{{"unit", "degF"},
                                                         {"monthly_mean", maritime_means},
                                                         {"monthly_sd", json::array({5, 5, 5, 5, 5, 5, 5, 5, 5, 5, 5, 5})},
                                                         {"design_temperature", {{"value", 20}, {"unit", "degF"}}}}
                                                        .dump()));
    EXPECT_NEAR(given.at("monthly_sd")[0].get<double>(), 5.0, 1e-12);
    // A design temperature no spread can reach: a message at the field.
    const auto impossible = json::parse(fw::climate_json(
        json{{"unit", "degF"}, {"monthly_mean", maritime_means}, {"design_temperature", {{"value", 45}, {"unit", "degF"}}}}.dump()));
    EXPECT_EQ(impossible.at("errors").at(0).at("path"), "/climate/design_temperature");
    EXPECT_EQ(impossible.at("errors").at(0).at("message"),
              "no day-to-day spread of these monthly means gives a 99 % design temperature of 45 degF (the spread would "
              "have to be scaled by less than 0.2 or more than 4); check both, or give monthly_sd");
}

TEST(climate_bins, observed_bins_replace_the_model_and_give_the_design_temperatures) {
    // Three bins of 2 degF holding a year: 87.6 h (1 %) in the 10 degF bin [9, 11), the rest above.
    // The 99 % design temperature is the top of that bin, 11 degF; 99.6 % lies 0.4 of the way in:
    // 35.04 h of 87.6 -> 9 + 2 x 0.4 = 9.8 degF (hours spread evenly within a bin).
    const json bins = json::array({{{"t", 10}, {"hours", 87.6}}, {{"t", 30}, {"hours", 4000}}, {{"t", 60}, {"hours", 4672.4}}});
    const auto result = json::parse(fw::climate_json(
        json{{"unit", "degF"}, {"monthly_mean", maritime_means}, {"bins", bins}, {"bin_width", 2}}.dump()));
    ASSERT_TRUE(result.at("errors").empty()) << result.dump();
    EXPECT_EQ(result.at("bins_from"), "data");
    EXPECT_NEAR(result.at("design_temperature_99").get<double>(), 11.0, 1e-9);
    EXPECT_NEAR(result.at("design_temperature_996").get<double>(), 9.8, 1e-9);
    EXPECT_EQ(result.at("bins").size(), 3u);
    auto short_year = bins;
    short_year[2]["hours"] = 1000;
    const auto bad = json::parse(fw::climate_json(
        json{{"unit", "degF"}, {"monthly_mean", maritime_means}, {"bins", short_year}, {"bin_width", 2}}.dump()));
    EXPECT_EQ(bad.at("errors").at(0).at("path"), "/climate/bins");
    EXPECT_EQ(bad.at("errors").at(0).at("message"),
              "the bins' hours add up to 5087.6; a year of hourly bins has 8760 (within a day)");
}

}  // namespace

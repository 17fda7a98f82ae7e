// The demand arithmetic typed (climate/demand.hpp): heat loss by degree-days, the bills' dates, seams
// and weather, and the doubts about a PRISM fit, called as values with no JSON between them.
#include <gtest/gtest.h>

#include <array>
#include <cmath>
#include <map>

#include "climate/demand.hpp"

namespace {

/// A bill of `days` days from `first_day` holding `fuel_kwh`.
fw::bill_period bill(long first_day, long days, double fuel_kwh = 100) {
    fw::bill_period b;
    b.first_day = first_day;
    b.last_day = first_day + days - 1;
    b.fuel_kwh = fuel_kwh;
    return b;
}

TEST(demand_typed, ua_from_a_design_heat_loss_is_the_load_over_the_design_difference) {
    // Hand-worked: 12 kW between 21 degC inside and -15 degC outside is 12000 / 36 = 333.3 W/K.
    EXPECT_NEAR(fw::ua_from_design_heat_loss_w_per_k(12000, 21, -15), 333.333333, 1e-6);
}

TEST(demand_typed, balance_point_falls_by_the_gains_over_ua) {
    // Hand-worked: 800 W of gains in a 250 W/K house lower a 20 degC balance by 3.2 K.
    EXPECT_NEAR(fw::balance_point_from_gains_c(20, 800, 250), 16.8, 1e-12);
}

TEST(demand_typed, degree_day_heat_is_ua_times_hdd_times_24_hours_times_cd) {
    // A climate rebuilt from monthly HDD to 18 degC gives those HDD back at 18 degC; 3000 K day in all.
    const std::array<double, 12> hdd = {500, 450, 380, 250, 120, 30, 0, 0, 60, 220, 420, 570};
    const auto climate = fw::climate_from_monthly_hdd(hdd, 18, false);
    const auto heat = fw::degree_day_space_heat(climate, 200, 18, 0.7);
    EXPECT_NEAR(heat.hdd_k_day, 3000, 30);  // the rebuild inverts a model: within 1 %
    EXPECT_NEAR(heat.uncorrected_kwh, 200 * heat.hdd_k_day * 24 / 1000, 1e-9);
    EXPECT_NEAR(heat.space_heat_kwh, 0.7 * heat.uncorrected_kwh, 1e-9);
    EXPECT_NEAR(heat.uncorrected_kwh, 14400, 150);  // 200 W/K x 3000 K day x 24 h = 14,400 kWh
}

TEST(demand_typed, meter_read_dates_share_a_day_and_inclusive_ones_do_not) {
    // Meter reads: 1 Jan to 1 Feb, then 1 Feb to 1 Mar (the end date starts the next bill).
    const std::vector<fw::bill_period> meter = {bill(31, 29), bill(0, 32)};
    EXPECT_TRUE(fw::bills_share_a_day(meter));
    const std::vector<fw::bill_period> inclusive = {bill(0, 31), bill(31, 28)};
    EXPECT_FALSE(fw::bills_share_a_day(inclusive));
    EXPECT_EQ(fw::bills_in_date_order(meter), (std::vector<std::size_t>{1, 0}));
}

TEST(demand_typed, seams_count_the_days_billed_twice_and_the_days_not_billed) {
    const std::vector<fw::bill_period> bills = {bill(0, 31), bill(41, 10), bill(28, 10)};
    const auto seams = fw::bill_seams(bills);
    ASSERT_EQ(seams.size(), 2u);
    // Days 0-30, then 28-37: days 28, 29, 30 twice.
    EXPECT_EQ(seams[0].earlier, 0u);
    EXPECT_EQ(seams[0].later, 2u);
    EXPECT_EQ(seams[0].overlap_days, 3);
    EXPECT_EQ(seams[0].gap_days, 0);
    // Days 28-37, then 41-50: days 38, 39, 40 not billed.
    EXPECT_EQ(seams[1].overlap_days, 0);
    EXPECT_EQ(seams[1].gap_days, 3);
}

TEST(demand_typed, observed_weather_is_usable_with_at_most_a_tenth_of_the_days_missing) {
    std::map<long, double> observed;
    for (long day = 0; day < 30; ++day) observed[day] = static_cast<double>(day);
    const auto full = fw::observed_days_of(bill(0, 30), observed);
    EXPECT_EQ(full.missing_days, 0);
    EXPECT_EQ(full.daily_mean_c.size(), 30u);
    EXPECT_DOUBLE_EQ(full.daily_mean_c[7], 7.0);
    EXPECT_TRUE(full.usable());
    EXPECT_TRUE(fw::observed_days_of(bill(3, 30), observed).usable());    // 3 of 30 missing
    EXPECT_FALSE(fw::observed_days_of(bill(4, 30), observed).usable());   // 4 of 30 missing
    EXPECT_FALSE(fw::observed_days_of(bill(100, 5), observed).usable());  // none observed
}

TEST(demand_typed, an_annual_total_scales_the_billed_rate_to_365_days) {
    const std::vector<fw::bill_period> bills = {bill(0, 200, 8000), bill(200, 165, 2000)};
    const auto total = fw::billed_total_of(bills);
    EXPECT_EQ(total.days, 365);
    EXPECT_DOUBLE_EQ(total.annual_fuel_kwh(), 10000);
    EXPECT_DOUBLE_EQ(fw::billed_total_of({bill(0, 73, 2000)}).annual_fuel_kwh(), 10000);
}

TEST(demand_typed, prism_searches_40_to_75_degf_or_5_to_24_degc) {
    const auto [low_f, high_f] = fw::prism_tau_range_c(true);
    EXPECT_NEAR(low_f, 4.444444, 1e-6);
    EXPECT_NEAR(high_f, 23.888889, 1e-6);
    EXPECT_EQ(fw::prism_tau_range_c(false), std::make_pair(5.0, 24.0));
}

TEST(demand_typed, doubts_name_a_poor_fit_a_tau_at_the_edge_and_bills_that_all_needed_heat) {
    fw::prism_fit fit;
    fit.r2 = 0.65;
    fit.tau_c = 5.3;
    fit.points = {{12.0, 40.0}, {2.5, 12.0}, {6.0, 20.0}};
    const auto doubts = fw::doubts_about(fit, 5, 24);
    EXPECT_TRUE(doubts.poor_fit);
    EXPECT_TRUE(doubts.tau_at_edge);
    EXPECT_TRUE(doubts.every_period_heated);
    EXPECT_DOUBLE_EQ(doubts.least_hdd_per_day, 2.5);
    fit.r2 = 0.95;
    fit.tau_c = 15;
    fit.points.push_back({0.2, 3.0});
    const auto clean = fw::doubts_about(fit, 5, 24);
    EXPECT_FALSE(clean.poor_fit || clean.tau_at_edge || clean.every_period_heated);
}

TEST(demand_typed, a_winter_bill_touches_one_of_the_three_coldest_months) {
    // Northern climate: January, February and December are the coldest (day 0 is 1970-01-01).
    const std::array<double, 12> means = {-5, -4, 1, 8, 14, 19, 22, 21, 16, 10, 4, -2};
    const auto climate = fw::climate_from_means(means, std::nullopt, false);
    EXPECT_FALSE(fw::bills_cover_coldest_months({bill(120, 150)}, climate));  // May to September
    EXPECT_TRUE(fw::bills_cover_coldest_months({bill(120, 150), bill(334, 5)}, climate));  // 1-5 December
}

}  // namespace

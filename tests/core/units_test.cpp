// Unit conversions: exact definitions (NIST SP 811, 2008, Appendix B) and error messages.
#include <gtest/gtest.h>

#include <cmath>

#include "base/error.hpp"
#include "base/units.hpp"

namespace {

using fw::convert;

TEST(units, therm_is_100000_international_table_btu) {
    // NIST SP 811 B.8: Btu_IT = 1055.05585262 J exactly; therm here = 10^5 Btu_IT.
    EXPECT_DOUBLE_EQ(convert(1, "therm", "MJ"), 105.505585262);
    EXPECT_DOUBLE_EQ(convert(1, "therm", "Btu"), 100000.0);
    // NIST SP 811's "US therm" is 105.4804 MJ: 0.024 % smaller than the billing therm used here.
    const double difference = convert(1, "therm", "J") / fw::constants::joule_per_us_therm_sp811 - 1;
    EXPECT_NEAR(difference, 2.4e-4, 0.05e-4);
}

TEST(units, kilowatt_hour_and_btu) {
    // 1 kWh = 3.6 MJ exactly; EIA quotes 3,412 Btu/kWh; exact 3412.14163 (scipy.constants, Btu_IT).
    EXPECT_NEAR(convert(1, "kWh", "Btu"), 3412.14163, 1e-5);
    EXPECT_DOUBLE_EQ(convert(1, "MMBtu", "GJ"), 1.05505585262);
}

TEST(units, calories_international_table_and_thermochemical) {
    EXPECT_DOUBLE_EQ(convert(1, "kcal", "kJ"), 4.1868);     // IT calorie, NIST SP 811 B.8
    EXPECT_DOUBLE_EQ(convert(1, "kcal_th", "kJ"), 4.184);   // thermochemical calorie, NIST SP 811 B.8
    EXPECT_DOUBLE_EQ(convert(1000, "cal", "kcal"), 1.0);
    EXPECT_DOUBLE_EQ(convert(1, "cal_th", "J"), 4.184);
}

TEST(units, volumes) {
    EXPECT_DOUBLE_EQ(convert(1, "gal", "L"), 3.785411784);       // 231 in^3, NIST SP 811 B.8
    EXPECT_DOUBLE_EQ(convert(1, "imp_gal", "L"), 4.54609);       // NIST SP 811 B.8
    EXPECT_DOUBLE_EQ(convert(1, "ft3", "m3"), 0.028316846592);   // (0.3048 m)^3
    EXPECT_DOUBLE_EQ(convert(1, "ccf", "ft3"), 100.0);
    EXPECT_DOUBLE_EQ(convert(1, "Mcf", "ccf"), 10.0);
    EXPECT_DOUBLE_EQ(convert(1, "cord", "ft3"), 128.0);          // 4 ft x 4 ft x 8 ft stacked
}

TEST(units, masses_and_power) {
    EXPECT_DOUBLE_EQ(convert(1, "lb", "kg"), 0.45359237);        // NIST SP 811 B.8
    EXPECT_DOUBLE_EQ(convert(1, "short_ton", "kg"), 907.18474);
    EXPECT_DOUBLE_EQ(convert(1, "tonne", "g"), 1e6);
    EXPECT_NEAR(convert(1, "kW", "Btu/h"), 3412.14163, 1e-5);
}

TEST(units, temperatures) {
    EXPECT_NEAR(convert(32, "degF", "degC"), 0.0, 1e-12);
    EXPECT_NEAR(convert(212, "degF", "degC"), 100.0, 1e-12);
    EXPECT_NEAR(convert(-40, "degC", "degF"), -40.0, 1e-12);
    EXPECT_NEAR(convert(0, "K", "degF"), -459.67, 1e-12);
    EXPECT_DOUBLE_EQ(convert(25, "degC", "K"), 298.15);
}

TEST(units, round_trips_are_exact_to_rounding) {
    for (const auto& unit : fw::unit_table()) {
        for (const auto& other : fw::unit_table()) {
            if (unit.kind != other.kind) continue;
            const double there = convert(37.5, unit.name, other.name);
            EXPECT_NEAR(convert(there, other.name, unit.name), 37.5, 1e-12) << unit.name << " <-> " << other.name;
        }
    }
}

TEST(units, unknown_unit_lists_accepted_spellings) {
    try {
        convert(1, "Therm", "kWh", "/from");
        FAIL() << "expected an error";
    } catch (const fw::input_error& error) {
        EXPECT_EQ(error.path(), "/from");
        EXPECT_EQ(error.message(),
                  "unknown unit \"Therm\"; accepted units (case-sensitive) are energy: J, kJ, MJ, GJ, kWh, Btu, "
                  "MMBtu, therm, kcal, cal, kcal_th, cal_th; volume: m3, L, gal, imp_gal, ft3, ccf, Mcf, cord; "
                  "mass: kg, g, lb, short_ton, tonne; power: W, kW, Btu/h; temperature: degC, degF, K; length: m, ft; "
                  "pressure: Pa, kPa, mbar, psia, inHg");
    }
}

TEST(units, mixed_dimensions_and_impossible_values_are_errors) {
    EXPECT_THROW(
        {
            try {
                convert(1, "therm", "L");
            } catch (const fw::input_error& error) {
                EXPECT_EQ(error.message(), "cannot convert therm (energy) to L (volume)");
                throw;
            }
        },
        fw::input_error);
    try {
        convert(-500, "degC", "K");
        FAIL();
    } catch (const fw::input_error& error) {
        EXPECT_EQ(error.message(), "-500 degC is below absolute zero");
    }
    try {
        convert(std::nan(""), "kWh", "MJ");
        FAIL();
    } catch (const fw::input_error& error) {
        EXPECT_EQ(error.message(), "value must be a finite number, got NaN");
    }
}

}  // namespace

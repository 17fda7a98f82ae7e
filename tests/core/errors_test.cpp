// Bad input: every message is part of the interface, so the tests pin the text.
#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <fstream>
#include <nlohmann/json.hpp>

#include "fw/api.hpp"
#include "model/economics.hpp"
#include "base/error.hpp"

namespace {

using nlohmann::json;

/// The single error of a heating-value request, as "path: message".
std::string heating_value_error(const json& request) {
    const auto result = json::parse(fw::heating_value_json(request.dump()));
    if (result.at("errors").size() != 1) return "expected one error, got: " + result.dump();
    const auto& error = result.at("errors").at(0);
    return error.at("path").get<std::string>() + ": " + error.at("message").get<std::string>();
}

TEST(errors, malformed_formulas) {
    EXPECT_EQ(heating_value_error({{"formula", "C3H)"}}), "/formula: formula \"C3H)\": unmatched ')' at character 4");
    EXPECT_EQ(heating_value_error({{"formula", "(CH3"}}), "/formula: formula \"(CH3\": unmatched '(' at character 1");
    EXPECT_EQ(heating_value_error({{"formula", "2CH4"}}),
              "/formula: formula \"2CH4\": count with no element before it at character 1");
    EXPECT_EQ(heating_value_error({{"formula", "c2h6"}}),
              "/formula: formula \"c2h6\": lower-case letter 'c' at character 1; element symbols start with a "
              "capital letter, as in C, Cl or He");
    EXPECT_EQ(heating_value_error({{"formula", "CH4 "}}), "/formula: formula \"CH4 \": unexpected character ' ' at character 4");
    EXPECT_EQ(heating_value_error({{"formula", "C0H4"}}), "/formula: formula \"C0H4\": count of zero at character 2");
    EXPECT_EQ(heating_value_error({{"formula", ""}}), "/formula: formula is empty; give a formula such as CH4 or C2H5OH");
}

TEST(errors, unknown_element_lists_the_known_ones) {
    EXPECT_EQ(heating_value_error({{"formula", "Xy2"}}),
              "/formula: formula \"Xy2\": unknown element \"Xy\" at character 1; known elements are H, He, Li, B, C, "
              "N, O, F, Ne, Na, Mg, Al, Si, P, S, Cl, Ar, K, Ca, Fe");
}

TEST(errors, ambiguous_formula_names_the_isomers) {
    EXPECT_EQ(heating_value_error({{"formula", "C4H10"}}),
              "/formula: formula \"C4H10\" matches several species: n-C4H10, i-C4H10; give one of these ids");
    EXPECT_EQ(heating_value_error({{"formula", "C5H12"}}),
              "/formula: formula \"C5H12\" matches several species: n-C5H12, i-C5H12; give one of these ids");
}

TEST(errors, phase_and_compounds_outside_the_table) {
    EXPECT_EQ(heating_value_error({{"formula", "CH4"}, {"phase", "liquid"}}),
              "/formula: species CH4 has no liquid record in data/species.json; phases there: gas");
    EXPECT_EQ(heating_value_error({{"formula", "CH4"}, {"phase", "plasma"}}),
              "/phase: unknown phase \"plasma\"; accepted: gas, liquid, solid");
    EXPECT_EQ(heating_value_error({{"formula", "C7H8"}}),
              "/formula: \"C7H8\" is not in data/species.json; give its standard enthalpy of formation "
              "(dhf_kj_per_mol, CLI --dhf) or its measured HHV (hhv_kj_per_mol, CLI --hhv)");
    EXPECT_EQ(heating_value_error({{"formula", "NaCl"}, {"dhf_kj_per_mol", -411.1}}),
              "/formula: combustion is defined for fuels of C, H, O, N and S (Ar and He pass through); the formula "
              "contains Cl");
    EXPECT_EQ(heating_value_error({{"formula", "CO2"}}),
              "/formula: CO2 releases no heat on complete combustion (HHV = 0 kJ/mol); it is not a fuel");
    EXPECT_EQ(heating_value_error({{"formula", "C7H8"}, {"hhv_kj_per_mol", -5}}),
              "/hhv_kj_per_mol: the measured HHV must be > 0, got -5");
    EXPECT_EQ(heating_value_error({{"formula", "C7H8"}, {"hhv_kj_per_mol", 3910}, {"dhf_kj_per_mol", 12}}),
              "/hhv_kj_per_mol: give either the enthalpy of formation or the measured HHV, not both");
}

TEST(errors, mixtures) {
    EXPECT_EQ(heating_value_error({{"mixture", "CH4:0.95,C2H6:0.03"}}),
              "/mixture: fractions sum to 0.98, not 1 (within 0.001); correct them or ask for normalisation "
              "(normalise: true, CLI --normalise)");
    EXPECT_EQ(heating_value_error({{"mixture", "CH4:0.95,C2H6:-0.03,N2:0.08"}}),
              "/mixture/1: fraction of C2H6 must be a finite number >= 0, got -0.03");
    EXPECT_EQ(heating_value_error({{"mixture", "CH4:nan,N2:1"}}),
              "/mixture/0: fraction of CH4 must be a finite decimal number, got \"nan\"");
    EXPECT_EQ(heating_value_error({{"mixture", "CH4=1"}}),
              "/mixture/0: component \"CH4=1\" is not of the form species:fraction (e.g. CH4:0.95)");
    EXPECT_EQ(heating_value_error({{"mixture", "CH4:0.5,CH4:0.5"}}), "/mixture/1: component CH4 is listed twice");
    EXPECT_EQ(heating_value_error({{"mixture", "N2:0.8,CO2:0.2"}}),
              "/mixture: has no combustible components (HHV = 0)");
    EXPECT_EQ(heating_value_error({{"mixture", "CH4:1"}, {"fractions", "volume"}}),
              "/fractions: unknown fraction basis \"volume\"; accepted: mole, mass");
    const auto unknown = heating_value_error({{"mixture", "CH4:0.9,C7H8:0.1"}});
    EXPECT_EQ(unknown.rfind("/mixture/1: component \"C7H8\" is not in data/species.json; known: C, H2, O2, N2,", 0), 0u)
        << unknown;
}

TEST(errors, normalised_mixture_reports_a_warning) {
    const auto result = json::parse(fw::heating_value_json(R"({"mixture":"CH4:0.95,C2H6:0.03","normalise":true})"));
    EXPECT_TRUE(result.at("errors").empty());
    ASSERT_EQ(result.at("warnings").size(), 1u);
    EXPECT_EQ(result.at("warnings")[0].at("message"), "fractions summed to 0.98 and were normalised to 1");
}

TEST(errors, ultimate_analyses) {
    EXPECT_EQ(heating_value_error({{"ultimate", "C:50,H:6"}}),
              "/ultimate: the dry-basis analysis sums to 56 wt %, expected 100 within 0.1");
    EXPECT_EQ(heating_value_error({{"ultimate", "C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4"}, {"moisture", -5}}),
              "/moisture: moisture must be a number from 0 to below 100 wt % (as received), got -5");
    EXPECT_EQ(heating_value_error({{"ultimate", "C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4"}, {"moisture", 100}}),
              "/moisture: moisture must be a number from 0 to below 100 wt % (as received), got 100");
    EXPECT_EQ(heating_value_error({{"ultimate", "C:50.2,H:6.1,O:43.2,Cl:0.5"}}),
              "/ultimate/Cl: unknown item \"Cl\"; accepted: C, H, O, N, S, ash");
    EXPECT_EQ(heating_value_error({{"ultimate", "C:150,H:-50"}}), "/ultimate/C: C must be a number from 0 to 100 wt %, got 150");
    EXPECT_EQ(heating_value_error({{"ultimate", "C:50.2,H:6.1,O:43.2,N:0.1,ash:0.4"}, {"basis", "wet"}}),
              "/basis: unknown basis \"wet\"; accepted: dry, as-received, daf");
}

TEST(errors, request_shape) {
    EXPECT_EQ(heating_value_error(json::object()), ": give one of \"formula\", \"mixture\" or \"ultimate\"");
    EXPECT_EQ(heating_value_error({{"formula", "CH4"}, {"mixture", "CH4:1"}}),
              ": give only one of \"formula\", \"mixture\" or \"ultimate\"");
    EXPECT_EQ(heating_value_error({{"formula", 4}}), "/formula: must be a string, got number");
    EXPECT_EQ(heating_value_error({{"formula", "CH4"}, {"reference", "20C"}}),
              "/reference: unknown reference condition \"20C\"; accepted: 15C, 0C, 60F");
    const auto malformed = json::parse(fw::heating_value_json("{\"formula\": \"CH4\",\n \"phase\" gas}"));
    EXPECT_EQ(malformed.at("errors")[0].at("message"),
              "malformed JSON: parse error at line 2, column 10: syntax error while parsing object separator - "
              "invalid literal; last read: '\"phase\" g'; expected ':'");
}

TEST(errors, text_that_is_not_utf8_comes_back_as_an_error_not_a_crash) {
    // Found by the formula, mixture, evaluate and price-file fuzzers: a message quoting invalid
    // UTF-8 used to throw while the result was written. Bytes 0x86 and 0xC5 are not UTF-8 here.
    const std::string formula = "{\"formula\": \"CH\x86\x86" "C4\"}";
    const auto result = json::parse(fw::heating_value_json(formula));
    ASSERT_EQ(result.at("errors").size(), 1u);
    EXPECT_EQ(result.at("errors")[0].at("message").get<std::string>().rfind("malformed JSON: ", 0), 0u);
    const auto mixture = json::parse(fw::heating_value_json(json{{"mixture", "CH4:0.98,H2O:0.02"}}.dump()));
    EXPECT_TRUE(mixture.at("errors").empty());
    const auto prices = json::parse(fw::check_prices_json("{\"schema\": \"fuelwright.prices/\xc5\"}", "2026-12-01"));
    EXPECT_FALSE(prices.at("valid").get<bool>());
    const auto scenario = json::parse(fw::evaluate_json("{\"schema\": \"x\xc5" "y\"}"));
    EXPECT_FALSE(scenario.at("errors").empty());
}

TEST(errors, unknown_fields_are_warned_not_silently_dropped) {
    const auto result = json::parse(fw::heating_value_json(R"({"formula":"CH4","phaze":"gas"})"));
    EXPECT_TRUE(result.at("errors").empty());
    ASSERT_EQ(result.at("warnings").size(), 1u);
    EXPECT_EQ(result.at("warnings")[0].at("path"), "/phaze");
    EXPECT_EQ(result.at("warnings")[0].at("message"), "unknown field, ignored");
}

TEST(errors, conversions) {
    auto convert_error = [](const json& request) {
        const auto result = json::parse(fw::convert_json(request.dump()));
        const auto& error = result.at("errors").at(0);
        return error.at("path").get<std::string>() + ": " + error.at("message").get<std::string>();
    };
    EXPECT_EQ(convert_error({{"value", 1}, {"from", "therm"}, {"to", "litre"}}).substr(0, 35),
              "/to: unknown unit \"litre\"; accepted");
    EXPECT_EQ(convert_error({{"value", 1}, {"from", "kWh"}, {"to", "kg"}}), "/value: cannot convert kWh (energy) to kg (mass)");
    EXPECT_EQ(convert_error({{"value", -300}, {"from", "degC"}, {"to", "K"}}), "/value: -300 degC is below absolute zero");
    EXPECT_EQ(convert_error({{"from", "degC"}, {"to", "K"}}), "/value: is required (a number)");
    const auto good = json::parse(fw::convert_json(R"({"value": 1, "from": "therm", "to": "kWh"})"));
    EXPECT_EQ(good.at("unit"), "kWh");
    EXPECT_DOUBLE_EQ(good.at("value").get<double>(), 105505585.262 / 3.6e6);
}

}  // namespace

namespace {

TEST(errors, numbers_in_messages_are_printed_as_printf_would) {
    // The C library's printf (%.*f, %.6g) is the reference the message text was written against.
    const auto printf_text = [](const char* format, auto... args) {
        char buffer[512];
        std::snprintf(buffer, sizeof buffer, format, args...);
        return std::string(buffer);
    };
    fw::random_stream random(11);
    std::vector<double> values = {0.0, -0.0, 0.5, 1.5, 2.5, 0.125, 1e-7, 123456.5, 999999.5, 1e21, -3.75, 1e300, 5e-324};
    for (int i = 0; i < 2000; ++i) values.push_back((random.uniform() - 0.5) * std::pow(10.0, std::floor(random.uniform() * 30 - 12)));
    for (double v : values) {
        for (int decimals : {0, 1, 2, 3, 6}) EXPECT_EQ(fw::format_fixed(v, decimals), printf_text("%.*f", decimals, v)) << v;
        EXPECT_EQ(fw::format_number(v), printf_text("%.6g", v)) << v;
    }
    EXPECT_EQ(fw::format_number(std::nan("")), "NaN");
    EXPECT_EQ(fw::format_number(-INFINITY), "-Infinity");
}

TEST(errors, one_reader_for_mixtures_and_ultimate_analyses_in_requests_and_scenarios) {
    // The heating-value request and a scenario's custom fuel read "name:number" lists with the same words,
    // and a scenario takes the object and array forms the request takes.
    std::ifstream file("data/examples/custom-fuels.json");
    const auto scenario = json::parse(file);
    const auto evaluate = [](const json& s) { return json::parse(fw::evaluate_json(s.dump())); };
    const auto as_given = evaluate(scenario);
    ASSERT_TRUE(as_given.at("errors").empty()) << as_given.dump();
    auto objects = scenario;
    objects["options"][0]["fuel"]["mixture"] = json::array({{{"species", "CH4"}, {"fraction", 0.60}},
                                                            {{"species", "CO2"}, {"fraction", 0.39}},
                                                            {{"species", "N2"}, {"fraction", 0.01}}});
    objects["options"][1]["fuel"]["ultimate"] = {{"C", 50.2}, {"H", 6.1}, {"O", 43.2}, {"N", 0.1}, {"S", 0}, {"ash", 0.4}};
    const auto from_objects = evaluate(objects);
    ASSERT_TRUE(from_objects.at("errors").empty()) << from_objects.dump();
    for (std::size_t i = 0; i < 2; ++i)
        EXPECT_DOUBLE_EQ(from_objects.at("options").at(i).at("annual_cost").get<double>(),
                         as_given.at("options").at(i).at("annual_cost").get<double>());
    auto bad = scenario;
    bad["options"][0]["fuel"]["mixture"] = "CH4=1";
    bad["options"][1]["fuel"]["ultimate"] = "C:50.2,Cl:0.5";
    const auto errors = evaluate(bad).at("errors");
    ASSERT_EQ(errors.size(), 2u) << errors.dump();
    EXPECT_EQ(errors.at(0).at("path"), "/options/0/fuel/mixture/0");
    EXPECT_EQ(errors.at(0).at("message"), "component \"CH4=1\" is not of the form species:fraction (e.g. CH4:0.95)");
    EXPECT_EQ(errors.at(1).at("path"), "/options/1/fuel/ultimate/Cl");
    EXPECT_EQ(errors.at(1).at("message"), "unknown item \"Cl\"; accepted: C, H, O, N, S, ash");
}

}  // namespace

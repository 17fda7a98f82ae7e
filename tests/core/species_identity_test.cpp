// Identity checks over every record of data/species.json and data/elements.json.
#include <gtest/gtest.h>

#include <cmath>
#include <nlohmann/json.hpp>
#include <set>

#include "thermo/combustion.hpp"
#include "base/embedded_data.hpp"
#include "thermo/species.hpp"

namespace {

TEST(species_identity, every_record_names_a_known_source) {
    const auto doc = nlohmann::json::parse(fw::detail::embedded_file("species.json"));
    ASSERT_FALSE(doc.at("description").get<std::string>().empty());
    for (const auto& record : fw::species_table()) {
        EXPECT_FALSE(record.source.empty()) << record.id << ": source \"" << record.source_key
                                            << "\" is not a key of the file's sources";
    }
}

TEST(species_identity, ids_and_phases_are_unique) {
    std::set<std::string> seen;
    for (const auto& record : fw::species_table())
        EXPECT_TRUE(seen.insert(record.id + "/" + std::string(fw::phase_name(record.state))).second) << record.id;
}

TEST(species_identity, stored_molar_mass_is_the_one_derived_from_the_formula) {
    for (const auto& record : fw::species_table())
        EXPECT_NEAR(record.stored_molar_mass_g_per_mol, fw::molar_mass_g_per_mol(record.atoms), 5e-6) << record.id;
}

TEST(species_identity, heating_values_of_every_combustible_record) {
    const double latent = fw::water_latent_heat_kj_per_mol();
    for (const auto& record : fw::species_table()) {
        const double hhv = fw::hhv_from_formation_kj_per_mol(record.atoms, record.dhf_kj_per_mol);
        if (hhv <= 0) continue;  // products, inert gases and the reference states
        fw::compound_request request;
        request.formula = record.id;
        request.state = record.state;
        const auto result = fw::analyse_compound(request);
        const auto s = fw::combustion_of(record.atoms);
        // HHV - LHV = moles of water formed x latent heat of water at 25 degC.
        EXPECT_NEAR(*result.hhv_kj_per_mol - *result.lhv_kj_per_mol, s.h2o_mol * latent, 1e-9) << record.id;
        EXPECT_GE(*result.hhv_kj_per_mol, *result.lhv_kj_per_mol) << record.id;
        // Per kg x molar mass = per mol (kJ/g = MJ/kg).
        EXPECT_NEAR(result.hhv_mj_per_kg * *result.molar_mass_g_per_mol, *result.hhv_kj_per_mol, 1e-9) << record.id;
        EXPECT_NEAR(result.lhv_mj_per_kg * *result.molar_mass_g_per_mol, *result.lhv_kj_per_mol, 1e-9) << record.id;
        // Hess's law inverted gives back the record's formation enthalpy.
        EXPECT_NEAR(fw::formation_from_hhv_kj_per_mol(record.atoms, hhv), record.dhf_kj_per_mol, 1e-9) << record.id;
        // Per m3 = per mol x p / (R T) for gases only.
        if (record.state == fw::phase::gas) {
            ASSERT_TRUE(result.hhv_mj_per_m3.has_value()) << record.id;
            EXPECT_NEAR(*result.hhv_mj_per_m3, *result.hhv_kj_per_mol * 101325.0 / (8.314462618 * 288.15) / 1000.0,
                        1e-9)
                << record.id;
        } else {
            EXPECT_FALSE(result.hhv_mj_per_m3.has_value()) << record.id;
        }
        // Carbon balance: CO2 per kg = n_C x M(CO2) / M(fuel).
        const double n_carbon = record.atoms.count("C") ? record.atoms.at("C") : 0.0;
        EXPECT_NEAR(result.co2_kg_per_kg * *result.molar_mass_g_per_mol,
                    n_carbon * fw::molar_mass_g_per_mol(fw::parse_formula("CO2")), 1e-9)
            << record.id;
    }
}

TEST(species_identity, latent_heat_of_water_at_25_c) {
    // CODATA: dHf H2O(g) -241.826, H2O(l) -285.830 kJ/mol -> 44.004 kJ/mol.
    EXPECT_NEAR(fw::water_latent_heat_kj_per_mol(), 44.004, 1e-9);
}

TEST(element_identity, every_element_has_a_positive_weight_and_one_record) {
    const auto doc = nlohmann::json::parse(fw::detail::embedded_file("elements.json"));
    ASSERT_FALSE(doc.at("source").get<std::string>().empty());
    std::set<std::string> seen;
    for (const auto& record : doc.at("elements")) {
        const auto symbol = record.at("symbol").get<std::string>();
        EXPECT_TRUE(seen.insert(symbol).second) << symbol;
        EXPECT_GT(record.at("atomic_weight").get<double>(), 0.0) << symbol;
        EXPECT_EQ(fw::parse_formula(symbol).size(), 1u) << symbol;
    }
}

TEST(formula, parses_groups_and_counts) {
    const auto acetone = fw::parse_formula("(CH3)2CO");
    EXPECT_EQ(acetone.at("C"), 3);
    EXPECT_EQ(acetone.at("H"), 6);
    EXPECT_EQ(acetone.at("O"), 1);
    EXPECT_EQ(fw::hill_formula(fw::parse_formula("C2H5OH")), "C2H6O");
    EXPECT_EQ(fw::hill_formula(fw::parse_formula("CH3OH")), "CH4O");
    // IUPAC 2021 abridged: 3 x 12.011 + 6 x 1.0080 + 15.999 = 58.080 g/mol.
    EXPECT_NEAR(fw::molar_mass_g_per_mol(acetone), 58.080, 1e-9);
}

TEST(combustion, balanced_equations) {
    auto equation = [](const char* formula, std::optional<fw::phase> state = std::nullopt) {
        fw::compound_request request;
        request.formula = formula;
        request.state = state;
        return fw::analyse_compound(request).equation;
    };
    EXPECT_EQ(equation("CH3OH", fw::phase::liquid), "CH3OH + 1.5 O2 -> CO2 + 2 H2O");
    EXPECT_EQ(equation("CH4"), "CH4 + 2 O2 -> CO2 + 2 H2O");
    EXPECT_EQ(equation("H2S"), "H2S + 1.5 O2 -> H2O + SO2");
    EXPECT_EQ(equation("NH3"), "NH3 + 0.75 O2 -> 1.5 H2O + 0.5 N2");
    EXPECT_EQ(equation("n-C4H10"), "C4H10 + 6.5 O2 -> 4 CO2 + 5 H2O");
}

TEST(combustion, stoichiometric_air_for_methane) {
    // 2 mol O2 per mol CH4; dry air 20.9476 % O2 by mole, 28.9644 g/mol (U.S. Standard Atmosphere 1976):
    // 2 / 0.209476 x 28.9644 / 16.043 = 17.237 kg air per kg. Textbooks quote 17.2 (from memory).
    fw::compound_request request;
    request.formula = "CH4";
    const auto result = fw::analyse_compound(request);
    EXPECT_NEAR(result.stoich_air_kg_per_kg, 2 / 0.209476 * 28.9644 / 16.043, 1e-9);
    EXPECT_NEAR(result.stoich_air_kg_per_kg, 17.2, 0.05);
}

TEST(combustion, compound_outside_the_table_by_formation_enthalpy_or_measured_hhv) {
    // Acetone (CH3)2CO, liquid: dHf = -248.4 kJ/mol (NIST WebBook, from memory).
    // Hess: 3 x 393.51 + 3 x 285.83 - 248.4 = 1789.62 kJ/mol; WebBook dcH(liquid) -1790 (from memory).
    fw::compound_request request;
    request.formula = "(CH3)2CO";
    request.state = fw::phase::liquid;
    request.dhf_kj_per_mol = -248.4;
    const auto by_formation = fw::analyse_compound(request);
    EXPECT_NEAR(*by_formation.hhv_kj_per_mol, 1789.62, 1e-9);
    EXPECT_NEAR(*by_formation.hhv_kj_per_mol, 1790, 1.0);
    request.dhf_kj_per_mol.reset();
    request.hhv_kj_per_mol = 1789.62;
    EXPECT_NEAR(*fw::analyse_compound(request).hhv_kj_per_mol, 1789.62, 1e-9);
}

}  // namespace

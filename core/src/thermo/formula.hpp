// Chemical formulas and molar masses (thermo layer).
#pragma once
#include <map>
#include <string>
#include <string_view>

namespace fw {

/// Atoms per formula unit by element symbol; fractional counts appear for mixture averages.
using composition = std::map<std::string, double>;

/// Standard atomic weight [g/mol] from data/elements.json; throws input_error for an unknown symbol.
double atomic_weight(std::string_view symbol, const std::string& path = "");

/// Symbols known to data/elements.json, joined by ", ".
std::string known_elements();

/// Edition of the atomic-weight table in use (e.g. "IUPAC CIAAW 2021 abridged").
std::string atomic_weight_edition();

/// Parses "CH4", "CH3OH", "C2H5OH", "(CH3)2CO"; throws input_error naming the fault and its position.
composition parse_formula(std::string_view text, const std::string& path = "");

/// Molar mass [g/mol] = sum of atoms x atomic weight.
double molar_mass_g_per_mol(const composition& atoms);

/// Hill-order formula text (C, H, then alphabetical), counts shown when not 1.
std::string hill_formula(const composition& atoms);

/// a + b (element by element), scaled: result = a + factor x b.
void add_scaled(composition& sum, const composition& part, double factor);

}  // namespace fw

#include "supply/fuels.hpp"

#include <algorithm>
#include <cmath>
#include <nlohmann/json.hpp>

#include "base/embedded_data.hpp"
#include "base/error.hpp"
#include "base/units.hpp"

namespace fw {

namespace {

using nlohmann::json;

const json& fuels_document() {
    static const json doc = json::parse(detail::embedded_file("fuels.json"));
    return doc;
}

std::string citation(const std::string& keys) {
    // "EPA-C1; EPA-C2" -> the citations of both keys; text after a key in parentheses is kept.
    const auto& sources = fuels_document().at("sources");
    std::string out;
    std::size_t start = 0;
    while (start < keys.size()) {
        auto end = keys.find(';', start);
        if (end == std::string::npos) end = keys.size();
        std::string part = keys.substr(start, end - start);
        while (!part.empty() && part.front() == ' ') part.erase(part.begin());
        const auto key = part.substr(0, part.find(' '));
        const std::string text = sources.contains(key) ? sources.at(key).get<std::string>() : part;
        out += (out.empty() ? "" : " ") + text + (part.size() > key.size() ? " " + part.substr(key.size() + 1) : "");
        start = end + 1;
    }
    return out;
}

/// Splits "Btu/gal" into ("Btu", "gal").
std::pair<std::string, std::string> split_per(const std::string& text, const std::string& path) {
    const auto slash = text.find('/');
    if (slash == std::string::npos || slash == 0 || slash + 1 == text.size())
        throw input_error(path, "unit \"" + text + "\" must be energy per sale unit, e.g. Btu/gal or MJ/m3");
    return {text.substr(0, slash), text.substr(slash + 1)};
}

/// "CH4:0.95,N2:0.05" as written in the catalog (trusted text: the catalog tests read every record).
std::vector<std::pair<std::string, double>> catalog_pairs(const std::string& text) {
    std::vector<std::pair<std::string, double>> out;
    std::size_t start = 0;
    while (start < text.size()) {
        auto comma = text.find(',', start);
        if (comma == std::string::npos) comma = text.size();
        const auto item = text.substr(start, comma - start);
        const auto colon = item.find(':');
        out.push_back({item.substr(0, colon), std::stod(item.substr(colon + 1))});
        start = comma + 1;
    }
    return out;
}

/// LHV/HHV ratio and recomputed HHV of a composition, as data/fuels.json describes it.
void apply_composition(fuel_record& fuel, const json& composition, std::optional<double> moisture_override) {
    const auto type = composition.at("type").get<std::string>();
    fuel_properties properties;
    if (type == "formula") {
        compound_request request;
        request.formula = composition.at("formula").get<std::string>();
        if (composition.contains("phase")) request.state = parse_phase(composition.at("phase").get<std::string>());
        properties = analyse_compound(request);
    } else if (type == "mixture") {
        mixture_request request;
        for (const auto& [name, fraction] : catalog_pairs(composition.at("components").get<std::string>()))
            request.components.push_back({name, fraction});
        properties = analyse_mixture(request);
        fuel.molar_mass_g_per_mol = properties.molar_mass_g_per_mol;
    } else {
        ultimate_request request;
        for (const auto& [key, value] : catalog_pairs(composition.at("analysis").get<std::string>())) {
            if (key == "C") request.carbon_pct = value;
            else if (key == "H") request.hydrogen_pct = value;
            else if (key == "O") request.oxygen_pct = value;
            else if (key == "N") request.nitrogen_pct = value;
            else if (key == "S") request.sulfur_pct = value;
            else if (key == "ash") request.ash_pct = value;
        }
        request.moisture_pct = moisture_override.value_or(composition.value("moisture", 0.0));
        properties = analyse_ultimate(request).as_received;
    }
    fuel.lhv_over_hhv = properties.lhv_mj_per_kg / properties.hhv_mj_per_kg;
    fuel.composition_hhv_mj_per_kg = properties.hhv_mj_per_kg;
    fuel.composition_co2_kg_per_mmbtu = properties.co2_kg_per_kg / properties.hhv_mj_per_kg * constants::joule_per_btu;
    fuel.lhv_text = "LHV/HHV = " + format_number(fuel.lhv_over_hhv) + " from the composition (" + type + ": " +
                    (type == "formula" ? composition.at("formula").get<std::string>()
                     : type == "mixture" ? composition.at("components").get<std::string>()
                                         : composition.at("analysis").get<std::string>()) +
                    ")";
}

fuel_record load_fuel(const json& item) {
    fuel_record fuel;
    fuel.id = item.at("id").get<std::string>();
    fuel.name = item.at("name").get<std::string>();
    const auto category = item.at("category").get<std::string>();
    fuel.category = category == "gas"           ? fuel_category::gas
                    : category == "liquid"      ? fuel_category::liquid
                    : category == "electricity" ? fuel_category::electricity
                                                : fuel_category::solid;
    fuel.sale_units = item.at("sale_units").get<std::vector<std::string>>();
    const auto& hhv = item.at("hhv");
    const auto [energy_unit, basis] = split_per(hhv.at("unit").get<std::string>(), "");
    fuel.basis_unit = basis;
    fuel.hhv_j_per_basis_unit = convert(hhv.at("value").get<double>(), energy_unit, "J");
    fuel.hhv_text = format_number(hhv.at("value").get<double>()) + " " + hhv.at("unit").get<std::string>();
    fuel.hhv_source = citation(hhv.at("source").get<std::string>());
    if (hhv.contains("reference")) fuel.gas_reference = hhv.at("reference").get<std::string>();
    fuel.sources.push_back({"fuels.json " + fuel.id + " HHV", fuel.hhv_text, fuel.hhv_source});
    if (item.contains("density")) {
        const auto& density = item.at("density");
        fuel.density_kg_per_l = density.at("kg_per_l").get<double>();
        fuel.density_text = format_number(*fuel.density_kg_per_l) + " kg/L at " + density.at("temperature").get<std::string>();
        fuel.sources.push_back({"fuels.json " + fuel.id + " density", fuel.density_text,
                                citation(density.at("source").get<std::string>())});
    }
    if (item.contains("moisture_pct")) fuel.moisture_pct = item.at("moisture_pct").get<double>();
    if (item.contains("bag_mass")) {
        const auto& bag = item.at("bag_mass");
        fuel.bag_mass_kg = convert(bag.at("value").get<double>(), bag.at("unit").get<std::string>(), "kg");
    }
    if (item.contains("face_cord_fraction")) fuel.face_cord_fraction = item.at("face_cord_fraction").at("value").get<double>();
    if (item.contains("species_groups"))
        for (const auto& group : item.at("species_groups"))
            fuel.species_groups.push_back({group.at("id").get<std::string>(), group.at("hhv_mmbtu_per_cord").get<double>(),
                                           citation(group.at("source").get<std::string>())});
    if (item.contains("composition")) {
        apply_composition(fuel, item.at("composition"), std::nullopt);
        fuel.sources.push_back({"fuels.json " + fuel.id + " composition", fuel.lhv_text,
                                citation(item.at("composition").at("source").get<std::string>())});
    } else {
        fuel.lhv_text = "LHV = HHV (no combustion water)";
    }
    const auto& emissions = item.at("emissions");
    fuel.emissions.co2_kg_per_mmbtu = emissions.value("co2_kg_per_mmbtu", 0.0);
    fuel.emissions.ch4_kg_per_mmbtu = emissions.value("ch4_kg_per_mmbtu", 0.0);
    fuel.emissions.n2o_kg_per_mmbtu = emissions.value("n2o_kg_per_mmbtu", 0.0);
    if (emissions.contains("ch4_kg_per_tj_ncv")) {
        // IPCC factors are per TJ of net (NCV) energy: per MMBtu of HHV input = factor x LHV/HHV x TJ per MMBtu.
        const double tj_per_mmbtu = 1.05505585262e-3;
        fuel.emissions.ch4_kg_per_mmbtu = emissions.at("ch4_kg_per_tj_ncv").get<double>() * fuel.lhv_over_hhv * tj_per_mmbtu;
        fuel.emissions.n2o_kg_per_mmbtu = emissions.at("n2o_kg_per_tj_ncv").get<double>() * fuel.lhv_over_hhv * tj_per_mmbtu;
    }
    fuel.emissions.biogenic = emissions.value("biogenic", false);
    fuel.emissions.per_kwh_setting = fuel.category == fuel_category::electricity;
    fuel.emissions.source = citation(emissions.at("source").get<std::string>());
    return fuel;
}

std::string joined(const std::vector<std::string>& items) {
    std::string out;
    for (const auto& item : items) out += (out.empty() ? "" : ", ") + item;
    return out;
}

/// [mol] ideal-gas amount in one unit of `volume_unit` at reference `reference_id`.
double gas_moles_per_unit(const std::string& volume_unit, const std::string& reference_id) {
    return convert(1.0, volume_unit, "m3") * molar_density_mol_per_m3(find_reference(reference_id));
}

}  // namespace

double standard_atmosphere_pa(double elevation_m) { return 101325.0 * std::pow(1 - 2.25577e-5 * elevation_m, 5.25588); }

std::string_view category_name(fuel_category category) {
    switch (category) {
        case fuel_category::gas: return "gas";
        case fuel_category::liquid: return "liquid";
        case fuel_category::solid: return "solid";
        case fuel_category::electricity: return "electricity";
    }
    return "solid";
}

const std::vector<fuel_record>& fuel_table() {
    static const std::vector<fuel_record> table = [] {
        std::vector<fuel_record> records;
        for (const auto& item : fuels_document().at("fuels")) records.push_back(load_fuel(item));
        return records;
    }();
    return table;
}

const fuel_record& find_fuel(const std::string& id, const std::string& path) {
    std::vector<std::string> ids;
    for (const auto& fuel : fuel_table()) {
        if (fuel.id == id) return fuel;
        ids.push_back(fuel.id);
    }
    throw input_error(path, "unknown fuel \"" + id + "\"; known fuels: " + joined(ids) +
                                "; or define a custom fuel by composition");
}

const electricity_default& default_electricity_emissions() {
    static const electricity_default value = [] {
        const auto& item = fuels_document().at("electricity_default");
        return electricity_default{item.at("co2e_kg_per_kwh").get<double>(), item.at("year").get<int>(),
                                   citation(item.at("source").get<std::string>())};
    }();
    return value;
}

const gwp_set& find_gwp_set(const std::string& id, const std::string& path) {
    static const std::vector<gwp_set> sets = [] {
        std::vector<gwp_set> out;
        for (const auto& item : fuels_document().at("gwp_sets").items())
            out.push_back({item.key(), item.value().at("CH4").get<double>(), item.value().at("N2O").get<double>(),
                           item.value().at("source").get<std::string>()});
        return out;
    }();
    std::vector<std::string> ids;
    for (const auto& set : sets) {
        if (set.id == id) return set;
        ids.push_back(set.id);
    }
    throw input_error(path, "unknown GWP set \"" + id + "\"; known: " + joined(ids));
}

const std::string& default_gwp_set() {
    static const std::string id = fuels_document().at("default_gwp_set").get<std::string>();
    return id;
}

unit_heating_value heating_value_per_sale_unit(const fuel_record& fuel, const std::string& sale_unit,
                                               const sale_options& options, const std::string& path) {
    if (std::find(fuel.sale_units.begin(), fuel.sale_units.end(), sale_unit) == fuel.sale_units.end())
        throw input_error(path, fuel.id + " is sold in " + joined(fuel.sale_units) + "; got \"" + sale_unit + "\"");
    double hhv_per_basis = fuel.hhv_j_per_basis_unit;
    std::string basis_text = fuel.hhv_text;
    if (options.wood_species) {
        const auto group = std::find_if(fuel.species_groups.begin(), fuel.species_groups.end(),
                                        [&](const auto& g) { return g.id == *options.wood_species; });
        if (group == fuel.species_groups.end()) {
            std::vector<std::string> ids;
            for (const auto& g : fuel.species_groups) ids.push_back(g.id);
            throw input_error(path, fuel.species_groups.empty()
                                        ? fuel.id + " has no wood species groups"
                                        : "unknown wood species \"" + *options.wood_species + "\"; known: " + joined(ids));
        }
        hhv_per_basis = convert(group->hhv_mmbtu_per_cord, "MMBtu", "J");
        basis_text = format_number(group->hhv_mmbtu_per_cord) + " MMBtu/cord (" + group->id + ", air-dry)";
    }
    unit_heating_value out;
    double basis_units = 0;
    std::string how;
    if (sale_unit == "bag") {
        const double bag_kg = options.bag_mass_kg.value_or(fuel.bag_mass_kg.value_or(0.0));
        if (!(bag_kg > 0)) throw input_error(path, "a bag needs its mass (bag_mass)");
        basis_units = convert(bag_kg, "kg", fuel.basis_unit);
        how = "1 bag = " + format_number(bag_kg) + " kg";
    } else if (sale_unit == "face_cord") {
        const double fraction = options.face_cord_fraction.value_or(fuel.face_cord_fraction.value_or(1.0 / 3.0));
        basis_units = fraction * convert(1.0, "cord", fuel.basis_unit);
        how = "1 face cord = " + format_number(fraction) + " cord";
    } else {
        const auto& sale = find_unit(sale_unit, path);
        const auto& basis = find_unit(fuel.basis_unit);
        if (sale.kind == dimension::energy && basis.kind != dimension::energy) {
            // Energy-denominated sale units (therm, GJ, kWh) are gross energy, as utilities bill them.
            out.hhv_j = convert(1.0, sale_unit, "J");
            out.lhv_j = out.hhv_j * fuel.lhv_over_hhv;
            out.derivation = "1 " + sale_unit + " = " + format_number(out.hhv_j / 1e6) +
                             " MJ of gross (HHV) energy, as billed; LHV x " + format_number(fuel.lhv_over_hhv);
            return out;
        }
        if (sale.kind == basis.kind) {
            if (fuel.category == fuel_category::gas && sale.kind == dimension::volume) {
                // Gas volumes: metric units at 15 degC, US units at 60 degF (custom gases: their own reference).
                const std::string sale_reference =
                    fuel.custom ? fuel.gas_reference : (sale_unit == "m3" || sale_unit == "L" ? "15C" : "60F");
                basis_units = gas_moles_per_unit(sale_unit, sale_reference) /
                              gas_moles_per_unit(fuel.basis_unit, fuel.gas_reference);
                how = "1 " + sale_unit + " at " + sale_reference + " = " + format_number(basis_units) + " " +
                      fuel.basis_unit + " at " + fuel.gas_reference + " (ideal gas)";
                if (options.gas_pressure_pa) {
                    // Metered at another pressure: the moles in a volume scale with the absolute pressure (ideal gas).
                    const double reference_pa = find_reference(sale_reference).pressure_pa;
                    const double ratio = *options.gas_pressure_pa / reference_pa;
                    basis_units *= ratio;
                    how += "; metered at " + format_fixed(convert(*options.gas_pressure_pa, "Pa", "psia"), 3) + " psia (" +
                           format_fixed(*options.gas_pressure_pa / 1000, 2) + " kPa) instead of " +
                           format_fixed(reference_pa / 1000, 3) + " kPa: x " + format_fixed(ratio, 4);
                }
            } else {
                basis_units = convert(1.0, sale_unit, fuel.basis_unit);
                // sold in the unit its heating value is given per: nothing to convert, nothing to say
                if (sale_unit != fuel.basis_unit)
                    how = "1 " + sale_unit + " = " + format_number(basis_units) + " " + fuel.basis_unit;
            }
        } else if (fuel.density_kg_per_l && ((sale.kind == dimension::mass && basis.kind == dimension::volume) ||
                                             (sale.kind == dimension::volume && basis.kind == dimension::mass))) {
            const double litres = sale.kind == dimension::mass ? convert(1.0, sale_unit, "kg") / *fuel.density_kg_per_l
                                                               : convert(1.0, sale_unit, "L");
            basis_units = sale.kind == dimension::mass ? convert(litres, "L", fuel.basis_unit)
                                                       : convert(litres * *fuel.density_kg_per_l, "kg", fuel.basis_unit);
            how = "1 " + sale_unit + " = " + format_number(basis_units) + " " + fuel.basis_unit + " at " +
                  format_number(*fuel.density_kg_per_l) + " kg/L";
        } else if (fuel.category == fuel_category::gas && fuel.molar_mass_g_per_mol && sale.kind == dimension::mass &&
                   basis.kind == dimension::volume) {
            const double moles = convert(1.0, sale_unit, "g") / *fuel.molar_mass_g_per_mol;
            basis_units = moles / gas_moles_per_unit(fuel.basis_unit, fuel.gas_reference);
            how = "1 " + sale_unit + " = " + format_number(basis_units) + " " + fuel.basis_unit + " (molar mass " +
                  format_number(*fuel.molar_mass_g_per_mol) + " g/mol)";
        } else {
            throw input_error(path, "cannot relate " + sale_unit + " to " + fuel.basis_unit + " for " + fuel.id +
                                        " (a density is needed)");
        }
    }
    out.hhv_j = hhv_per_basis * basis_units;
    out.lhv_j = out.hhv_j * fuel.lhv_over_hhv;
    out.derivation = basis_text + (how.empty() ? "" : "; " + how) + "; LHV = HHV x " + format_number(fuel.lhv_over_hhv);
    return out;
}

fuel_record make_custom_fuel(const custom_fuel_request& request, const std::string& path) {
    fuel_record fuel;
    fuel.custom = true;
    fuel.id = request.id;
    fuel.name = request.name.empty() ? request.id : request.name;
    fuel.sale_units = {request.sale_unit};
    const auto& sale = find_unit(request.sale_unit, path + "/sale_unit");
    if (sale.kind != dimension::mass && sale.kind != dimension::volume)
        throw input_error(path + "/sale_unit", "a custom fuel is sold by mass or volume; got " + request.sale_unit);
    fuel_properties properties;
    bool gaseous = false;
    std::string what;
    try {
        if (request.compound) {
            properties = analyse_compound(*request.compound);
            gaseous = properties.hhv_mj_per_m3.has_value();
            what = "formula " + request.compound->formula;
        } else if (request.mixture) {
            properties = analyse_mixture(*request.mixture);
            gaseous = properties.hhv_mj_per_m3.has_value();
            what = "mixture";
        } else if (request.ultimate) {
            properties = analyse_ultimate(*request.ultimate).as_received;
            what = "ultimate analysis";
        } else {
            throw input_error(path, "a custom fuel needs \"formula\", \"mixture\" or \"ultimate\"");
        }
    } catch (const input_error& error) {
        throw input_error(path + error.path(), error.message());
    }
    fuel.sources = properties.sources;
    fuel.lhv_over_hhv = properties.lhv_mj_per_kg / properties.hhv_mj_per_kg;
    fuel.lhv_text = "LHV/HHV = " + format_number(fuel.lhv_over_hhv) + " from the " + what;
    fuel.composition_hhv_mj_per_kg = properties.hhv_mj_per_kg;
    fuel.composition_co2_kg_per_mmbtu = properties.co2_kg_per_kg / properties.hhv_mj_per_kg * constants::joule_per_btu;
    if (gaseous) {
        fuel.category = fuel_category::gas;
        fuel.gas_reference = properties.reference->id;
        fuel.basis_unit = "m3";
        fuel.hhv_j_per_basis_unit = *properties.hhv_mj_per_m3 * 1e6;
        fuel.hhv_text = format_number(*properties.hhv_mj_per_m3) + " MJ/m3 at " + fuel.gas_reference;
        fuel.molar_mass_g_per_mol = properties.molar_mass_g_per_mol;
    } else {
        fuel.category = request.density_kg_per_l ? fuel_category::liquid : fuel_category::solid;
        fuel.basis_unit = "kg";
        fuel.hhv_j_per_basis_unit = properties.hhv_mj_per_kg * 1e6;
        fuel.hhv_text = format_number(properties.hhv_mj_per_kg) + " MJ/kg";
        if (request.density_kg_per_l) {
            if (!(*request.density_kg_per_l > 0) || !std::isfinite(*request.density_kg_per_l))
                throw input_error(path + "/density_kg_per_l", "must be > 0, got " + format_number(*request.density_kg_per_l));
            if (*request.density_kg_per_l < 0.1 || *request.density_kg_per_l > 5)
                throw input_error(path + "/density_kg_per_l",
                                  "must be from 0.1 to 5 kg/L (liquid fuels are 0.5 to 1), got " +
                                      format_number(*request.density_kg_per_l));
            fuel.density_kg_per_l = request.density_kg_per_l;
            fuel.density_text = format_number(*request.density_kg_per_l) + " kg/L (given)";
        } else if (sale.kind == dimension::volume) {
            throw input_error(path + "/density_kg_per_l",
                              "a liquid or solid custom fuel sold by volume needs its density (density_kg_per_l)");
        }
    }
    fuel.hhv_source = "computed by Fuelwright from the " + what;
    fuel.emissions.co2_kg_per_mmbtu = *fuel.composition_co2_kg_per_mmbtu;
    fuel.emissions.ch4_kg_per_mmbtu = request.ch4_kg_per_mmbtu.value_or(0.0);
    fuel.emissions.n2o_kg_per_mmbtu = request.n2o_kg_per_mmbtu.value_or(0.0);
    fuel.emissions.biogenic = request.biogenic;
    fuel.emissions.source = "CO2 from the carbon content (complete combustion); CH4 and N2O as given";
    return fuel;
}

}  // namespace fw

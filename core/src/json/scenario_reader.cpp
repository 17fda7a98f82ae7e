#include "json/scenario_reader.hpp"

#include <cmath>
#include <cstdio>
#include <algorithm>
#include <cctype>
#include <map>

#include "json/json_fields.hpp"
#include "model/plausibility.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

/// Letters, digits, '.', '_' and '-', starting with a letter or digit, 1 to 64 characters.
bool is_option_id(const std::string& id) {
    if (id.empty() || id.size() > 64 || !std::isalnum(static_cast<unsigned char>(id[0]))) return false;
    return std::all_of(id.begin(), id.end(), [](char c) {
        return std::isalnum(static_cast<unsigned char>(c)) || c == '.' || c == '_' || c == '-';
    });
}

/// Three capital letters, as ISO 4217 codes are.
bool is_currency_code(const std::string& code) {
    return code.size() == 3 && std::all_of(code.begin(), code.end(), [](char c) { return c >= 'A' && c <= 'Z'; });
}

/// [currency] The most any one amount of money in an option may be: above it is a slip of the keyboard
/// or the unit, and sums over years and draws could overflow.
constexpr double max_amount = 1e9;

/// Refuses an amount of money above max_amount at its field (negative amounts have their own message).
void require_at_most_max_amount(double amount, const std::string& path) {
    if (amount > max_amount)
        throw input_error(path, "must be from 0 to 1000000000 (a billion), got " + format_number(amount));
}

/// Refuses a given heating value more than twice or less than half the catalog's (both in the given unit
/// and basis): a slip of the unit (Btu for kBtu, per litre for per gallon, MJ for therm), never the same
/// fuel (a utility's gas varies by about a tenth).
void require_near_catalog(double value, double catalog, const std::string& unit, const std::string& path) {
    if (value >= catalog / 2 && value <= catalog * 2) return;
    throw input_error(path, "must be within a factor of 2 of the catalog's " + format_number(catalog) + " " + unit +
                                ": from " + format_number(catalog / 2) + " to " + format_number(catalog * 2) +
                                ", got " + format_number(value));
}

/// Reads "Btu/therm" style text: energy unit / sale unit.
std::pair<std::string, std::string> energy_per_unit(const std::string& text, const std::string& path) {
    const auto slash = text.find('/');
    if (slash == std::string::npos || slash == 0 || slash + 1 == text.size())
        throw input_error(path, "unit \"" + text + "\" must be energy per sale unit, e.g. Btu/therm, Btu/gal or MJ/m3");
    const auto energy = text.substr(0, slash);
    if (find_unit(energy, path).kind != dimension::energy)
        throw input_error(path, "\"" + energy + "\" in \"" + text + "\" is not an energy unit; accepted: " +
                                    accepted_units(dimension::energy));
    return {energy, text.substr(slash + 1)};
}

fuel_record read_custom_fuel(const json& fuel, const std::string& path, std::vector<issue>& warnings) {
    require_object(fuel, path);
    custom_fuel_request request;
    request.id = required_string(fuel, "id", path);
    request.name = optional_string(fuel, "name", path).value_or(request.id);
    request.sale_unit = required_string(fuel, "sale_unit", path);
    request.density_kg_per_l = optional_number(fuel, "density_kg_per_l", path);
    request.biogenic = optional_bool(fuel, "biogenic", path).value_or(false);
    request.ch4_kg_per_mmbtu = optional_number(fuel, "ch4_kg_per_mmbtu", path);
    request.n2o_kg_per_mmbtu = optional_number(fuel, "n2o_kg_per_mmbtu", path);
    for (const char* key : {"ch4_kg_per_mmbtu", "n2o_kg_per_mmbtu"})
        if (const auto value = optional_number(fuel, key, path); value && *value < 0)
            throw input_error(path + "/" + key, "must be >= 0, got " + format_number(*value));
    for (const auto& [key, largest] : {std::pair{"ch4_kg_per_mmbtu", "0.011"}, std::pair{"n2o_kg_per_mmbtu", "0.0036"}})
        if (const auto value = optional_number(fuel, key, path); value && *value > 1)
            throw input_error(path + "/" + key,
                              std::string("must be from 0 to 1 kg per MMBtu (the catalog's largest is ") + largest +
                                  "), got " + format_number(*value));
    const auto reference = optional_string(fuel, "reference", path).value_or("15C");
    find_reference(reference, path + "/reference");
    const int kinds = int(fuel.contains("formula")) + int(fuel.contains("mixture")) + int(fuel.contains("ultimate"));
    if (kinds != 1)
        throw input_error(path, "a custom fuel needs exactly one of \"formula\", \"mixture\" or \"ultimate\"");
    if (fuel.contains("formula")) {
        compound_request compound;
        compound.formula = required_string(fuel, "formula", path);
        if (const auto state = optional_string(fuel, "phase", path)) compound.state = parse_phase(*state, path + "/phase");
        compound.dhf_kj_per_mol = optional_number(fuel, "dhf_kj_per_mol", path);
        compound.hhv_kj_per_mol = optional_number(fuel, "hhv_kj_per_mol", path);
        compound.reference = reference;
        request.compound = compound;
    } else if (fuel.contains("mixture")) {
        mixture_request mixture;
        mixture.components = read_mixture_components(fuel.at("mixture"), path + "/mixture");
        const auto basis = optional_string(fuel, "fractions", path).value_or("mole");
        if (basis != "mole" && basis != "mass")
            throw input_error(path + "/fractions", "unknown fraction basis \"" + basis + "\"; accepted: mole, mass");
        mixture.basis = basis == "mole" ? fraction_basis::mole : fraction_basis::mass;
        mixture.normalise = optional_bool(fuel, "normalise", path).value_or(false);
        mixture.reference = reference;
        request.mixture = mixture;
    } else {
        request.ultimate = read_ultimate_analysis(fuel, path);
    }
    if (!request.ultimate)
        for (const char* key : {"moisture", "basis"})
            if (fuel.contains(key)) throw input_error(path + "/" + key, std::string(key) + " applies to an ultimate analysis only");
    if (!request.compound)
        for (const char* key : {"phase", "dhf_kj_per_mol", "hhv_kj_per_mol"})
            if (fuel.contains(key)) throw input_error(path + "/" + key, std::string(key) + " applies to a formula only");
    if (!request.mixture)
        for (const char* key : {"fractions", "normalise"})
            if (fuel.contains(key)) throw input_error(path + "/" + key, std::string(key) + " applies to a mixture only");
    warn_unknown_keys(fuel, {"id", "name", "formula", "phase", "dhf_kj_per_mol", "hhv_kj_per_mol", "mixture", "fractions",
                             "normalise", "ultimate", "moisture", "basis", "sale_unit", "density_kg_per_l", "reference",
                             "biogenic", "ch4_kg_per_mmbtu", "n2o_kg_per_mmbtu"},
                      path, warnings);
    auto record = make_custom_fuel(request, path);
    if (!request.ch4_kg_per_mmbtu || !request.n2o_kg_per_mmbtu)
        warnings.push_back({path, "no CH4 or N2O emission factor given for custom fuel " + request.id +
                                      "; counted as zero (CO2 is computed from its carbon)"});
    return record;
}

/// Fixed charges [{label, amount_per_month | amount_per_year}] at `path`.
std::vector<fixed_charge> read_fixed_charges(const json& charges, const std::string& path) {
    if (!charges.is_array()) throw input_error(path, "must be an array");
    std::vector<fixed_charge> out;
    for (std::size_t i = 0; i < charges.size(); ++i) {
        const std::string charge_path = path + "/" + std::to_string(i);
        const auto& charge = charges[i];
        require_object(charge, charge_path);
        fixed_charge entry;
        entry.label = optional_string(charge, "label", charge_path).value_or("fixed charge");
        const auto monthly = optional_number(charge, "amount_per_month", charge_path);
        const auto yearly = optional_number(charge, "amount_per_year", charge_path);
        if (bool(monthly) == bool(yearly)) throw input_error(charge_path, "give either amount_per_month or amount_per_year");
        const double amount = monthly ? *monthly : *yearly;
        if (amount < 0)
            throw input_error(charge_path + (monthly ? "/amount_per_month" : "/amount_per_year"), "must be >= 0, got " + format_number(amount));
        require_at_most_max_amount(amount, charge_path + (monthly ? "/amount_per_month" : "/amount_per_year"));
        entry.amount_per_year = monthly ? *monthly * 12 : *yearly;
        entry.text = monthly ? format_fixed(*monthly, 2) + " per month x 12" : format_fixed(*yearly, 2) + " per year";
        entry.path = charge_path + (monthly ? "/amount_per_month" : "/amount_per_year");
        out.push_back(entry);
    }
    return out;
}

/// A temperature {value, unit} in degC.
double read_temperature_c(const json& value, const std::string& path) {
    return quantity_in(value, path, dimension::temperature, "degC");
}

/// An outdoor temperature {value, unit} in degC, refused outside -70 to 60 degC (-94 to 140 degF), where
/// no weather station has recorded one (World Meteorological Organization extremes, from memory).
double read_outdoor_c(const json& value, const std::string& path) {
    const double c = read_temperature_c(value, path);
    if (!(c >= -70 && c <= 60)) {
        const auto unit = value.is_object() && value.contains("unit") && value.at("unit").is_string() ? value.at("unit").get<std::string>() : "degC";
        const bool f = unit == "degF";
        throw input_error(path + "/value", std::string("must be an outdoor temperature from ") + (f ? "-94 to 140 degF" : "-70 to 60 degC") +
                                               ", got " + format_number(f ? c * 9 / 5 + 32 : c) + (f ? " degF" : " degC"));
    }
    return c;
}

/// A power {value, unit} in kW.
double read_power_kw(const json& value, const std::string& path) {
    return quantity_in(value, path, dimension::power, "kW");
}

/// Refuses a data-sheet capacity {value, unit} above 1000 kW (no house's; sums over bins could overflow).
void require_heat_pump_capacity(double kw, const json& capacity, const std::string& path) {
    if (kw <= 1000) return;
    const auto unit = capacity.at("unit").get<std::string>();
    throw input_error(path, "a house's heat pump delivers at most 1000 kW (" +
                                format_number(convert(1000, "kW", unit)) + " " + unit + "), got " +
                                format_number(capacity.at("value").get<double>()) + " " + unit);
}

void read_heat_pump_fields(const json& system, const std::string& path, scenario_option& option) {
    const bool heat_pump = is_heat_pump(option.system.kind);
    for (const char* key : {"ratings", "cutoff", "cd", "backup", "changeover", "stages"}) {
        if (system.contains(key) && !heat_pump)
            throw input_error(path + "/" + key, std::string(key) + " applies to heat pumps only");
        if (system.contains(key) && option.system.kind == system_kind::ground_source_heat_pump)
            throw input_error(path + "/" + key, std::string(key) + " applies to air-source heat pumps: a ground-source heat "
                                                "pump's COP follows its ground loop, not the outdoor air; give its COP or SCOP");
    }
    if (const auto stages = optional_string(system, "stages", path)) {
        if (*stages == "single") option.stages = heat_pump_stages::single;
        else if (*stages == "two") option.stages = heat_pump_stages::two;
        else if (*stages == "variable") option.stages = heat_pump_stages::variable;
        else throw input_error(path + "/stages", "must be single, two or variable, got \"" + *stages + "\"");
        option.stages_given = true;
    }
    if (const auto ratings = system.find("ratings"); ratings != system.end()) {
        if (!ratings->is_array() || ratings->size() < 2)
            throw input_error(path + "/ratings", "needs at least two data-sheet points (e.g. at 47, 17 and 5 degF)");
        for (std::size_t i = 0; i < ratings->size(); ++i) {
            const std::string point_path = path + "/ratings/" + std::to_string(i);
            const auto& point = (*ratings)[i];
            require_object(point, point_path);
            if (!point.contains("outdoor") || !point.contains("capacity"))
                throw input_error(point_path, "needs \"outdoor\", \"capacity\" and \"cop\"");
            heat_pump_point entry{read_outdoor_c(point.at("outdoor"), point_path + "/outdoor"),
                                  read_power_kw(point.at("capacity"), point_path + "/capacity"),
                                  required_number(point, "cop", point_path)};
            if (entry.capacity_kw <= 0)
                throw input_error(point_path + "/capacity/value", "must be > 0, got " + format_number(entry.capacity_kw));
            if (entry.cop > 15)
                throw input_error(point_path + "/cop",
                                  "must be from 1 to 15 (data sheets give 1.5 to 6), got " + format_number(entry.cop));
            require_heat_pump_capacity(entry.capacity_kw, point.at("capacity"), point_path + "/capacity/value");
            if (entry.cop < 1)
                throw input_error(point_path + "/cop", "a heat pump's COP cannot be below 1, got " + format_number(entry.cop));
            if (point.contains("min_capacity") || point.contains("min_cop")) {
                if (!point.contains("min_capacity") || !point.contains("min_cop"))
                    throw input_error(point_path + (point.contains("min_capacity") ? "/min_cop" : "/min_capacity"),
                                      "is required with the other (the minimum capacity and its COP)");
                if (option.stages == heat_pump_stages::single)
                    throw input_error(point_path + "/min_capacity",
                                      "a minimum capacity needs system.stages \"two\" or \"variable\" (a single-stage unit "
                                      "has one capacity)");
                entry.min_capacity_kw = read_power_kw(point.at("min_capacity"), point_path + "/min_capacity");
                entry.min_cop = required_number(point, "min_cop", point_path);
                if (!(entry.min_capacity_kw > 0 && entry.min_capacity_kw <= entry.capacity_kw))
                    throw input_error(point_path + "/min_capacity/value",
                                      "must be above 0 and at most the point's capacity, got " +
                                          format_number(point.at("min_capacity").value("value", 0.0)));
                if (entry.min_cop < 1)
                    throw input_error(point_path + "/min_cop", "a heat pump's COP cannot be below 1, got " + format_number(entry.min_cop));
                if (entry.min_cop > 15)
                    throw input_error(point_path + "/min_cop",
                                      "must be from 1 to 15 (data sheets give 1.5 to 6), got " + format_number(entry.min_cop));
            }
            for (const auto& other : option.ratings)
                if (std::fabs(other.outdoor_c - entry.outdoor_c) < 1e-9)
                    throw input_error(point_path + "/outdoor", "two data-sheet points at the same outdoor temperature");
            option.ratings.push_back(entry);
        }
    }
    if (system.contains("cutoff")) option.cutoff_c = read_outdoor_c(system.at("cutoff"), path + "/cutoff");
    if (const auto cd = optional_number(system, "cd", path)) {
        if (*cd < 0 || *cd > 1) throw input_error(path + "/cd", "must be from 0 to 1, got " + format_number(*cd));
        option.cd = *cd;
        option.cd_given = true;
    }
    if (const auto backup = optional_string(system, "backup", path)) option.backup = *backup;
    if (const auto changeover = system.find("changeover"); changeover != system.end()) {
        if (changeover->is_string()) {
            if (changeover->get<std::string>() != "optimal")
                throw input_error(path + "/changeover", "must be {value, unit} or \"optimal\"");
            option.changeover_optimal = true;
        } else {
            option.changeover_c = read_outdoor_c(*changeover, path + "/changeover");
        }
    }
    if (system.contains("capacity")) {
        if (option.system.kind == system_kind::ground_source_heat_pump)
            throw input_error(path + "/capacity", "capacity applies to air-source heat pumps and fuel-burning systems");
        option.capacity_47_kw = read_power_kw(system.at("capacity"), path + "/capacity");
        if (*option.capacity_47_kw <= 0) throw input_error(path + "/capacity/value", "must be > 0");
        if (*option.capacity_47_kw > 300)
            throw input_error(path + "/capacity/value", "is more than any house's heating system (at most 300 kW, 1,023,000 Btu/h)");
    }
    if (system.contains("auxiliary_electricity")) {
        if (!burns_fuel(option.system.kind))
            throw input_error(path + "/auxiliary_electricity", "applies to fuel-burning systems (a heat pump's fans and pumps are "
                                                               "in its rating; electric heat has none)");
        const auto& aux = system.at("auxiliary_electricity");
        require_object(aux, path + "/auxiliary_electricity");
        const auto value = optional_number(aux, "value", path + "/auxiliary_electricity");
        const auto unit = optional_string(aux, "unit", path + "/auxiliary_electricity").value_or("");
        if (!value) throw input_error(path + "/auxiliary_electricity/value", "is required");
        if (unit != "kWh" && unit != "W")
            throw input_error(path + "/auxiliary_electricity/unit", "must be kWh (a year, the E_ae rating) or W (while the burner "
                                                                    "runs), got \"" + unit + "\"");
        const double limit = unit == "kWh" ? 5000 : 2000;
        if (!(*value >= 0 && *value <= limit))
            throw input_error(path + "/auxiliary_electricity/value", "must be from 0 to " + format_number(limit) + " " + unit +
                                                                         ", got " + format_number(*value));
        option.auxiliary = scenario_option::auxiliary_spec{*value, unit == "W", "as given"};
    } else if (burns_fuel(option.system.kind)) {
        const auto* typical = option.system_catalog ? &find_system(*option.system_catalog) : typical_system_for(option.system.kind, option.fuel.id, option.system.efficiency_value, option.system.rating);
        if (typical && typical->auxiliary_value > 0)
            option.auxiliary = scenario_option::auxiliary_spec{typical->auxiliary_value, typical->auxiliary_watts,
                                                               "default of " + typical->id + ": " + typical->auxiliary_source};
    }
}

}  // namespace

given_heating_value read_given_heating_value(const json& hv, const std::string& path, const fuel_record& fuel,
                                             const std::string& target_unit, const sale_options& sale, std::vector<issue>& warnings) {
    require_object(hv, path);
    const double value = required_number(hv, "value", path);
    if (value <= 0) throw input_error(path + "/value", "must be > 0, got " + format_number(value));
    const auto unit_text = required_string(hv, "unit", path);
    const auto [energy_unit, sale_unit] = energy_per_unit(unit_text, path + "/unit");
    const auto basis = optional_string(hv, "basis", path).value_or("HHV");
    warn_unknown_keys(hv, {"value", "unit", "basis"}, path, warnings);
    if (basis != "HHV" && basis != "LHV") throw input_error(path + "/basis", "unknown basis \"" + basis + "\"; accepted: HHV, LHV");
    const auto given_unit = heating_value_per_sale_unit(fuel, sale_unit, sale, path + "/unit");
    const auto target = heating_value_per_sale_unit(fuel, target_unit, sale, path);
    const double catalog_j = given_unit.hhv_j * (basis == "LHV" ? fuel.lhv_over_hhv : 1.0);
    require_near_catalog(value, convert(catalog_j, "J", energy_unit), unit_text + " (" + basis + ")", path + "/value");
    double j_per_given = convert(value, energy_unit, "J", path + "/value");
    if (basis == "LHV") j_per_given /= fuel.lhv_over_hhv;
    given_heating_value out;
    out.hhv_j_per_unit = j_per_given * target.hhv_j / given_unit.hhv_j;
    out.text = format_number(value) + " " + unit_text + " (" + basis + ", given)";
    if (basis == "LHV") out.text += " / LHV/HHV " + format_number(fuel.lhv_over_hhv) + " = HHV";
    return out;
}

namespace {

/// One [from, to] pair of local hours, whole or half (16.5 is 16:30), into the period's half hours (to < from runs past midnight).
void read_hour_span(const json& pair, const std::string& path, std::array<bool, 48>& half_hours) {
    if (!pair.is_array() || pair.size() != 2)
        throw input_error(path, "must be a pair of hours [from, to], e.g. [16, 21] for 16:00 to 21:00");
    int ends[2] = {0, 0};  // in half hours
    for (std::size_t e = 0; e < 2; ++e) {
        if (!pair[e].is_number())
            throw input_error(path + "/" + std::to_string(e), std::string("is required: the hour the period ") +
                                                                  (e == 0 ? "starts" : "ends") + ", from 0 to 24 (16.5 for 16:30)");
        const double value = pair[e].get<double>();
        if (!(value >= 0 && value <= 24) || 2 * value != std::floor(2 * value))
            throw input_error(path + "/" + std::to_string(e), "must fall on the hour or the half hour, from 0 to 24 (16.5 is 16:30), got " + format_number(value) +
                                                              (value >= 0 && value <= 24 ? " (" + clock_text(value) + ")" : ""));
        ends[e] = static_cast<int>(2 * value);
    }
    if (ends[0] == ends[1] || (ends[0] == half_hours_per_day && ends[1] == 0))
        throw input_error(path + "/1", "ends where it starts: a period needs at least half an hour (0 to 24 is the whole day)");
    // [from, to) in local time; to < from runs past midnight ([22, 6] is 22:00 to 6:00).
    for (int s = ends[0]; s < (ends[0] < ends[1] ? ends[1] : half_hours_per_day); ++s) half_hours[static_cast<std::size_t>(s)] = true;
    if (ends[0] > ends[1])
        for (int s = 0; s < ends[1]; ++s) half_hours[static_cast<std::size_t>(s)] = true;
}

}  // namespace

price_schedule read_price_schedule(const json& list, const std::string& path, std::vector<issue>& warnings) {
    if (!list.is_array() || list.empty())
        throw input_error(path, "needs at least one period (name, price per kWh, hours): add one, or price electricity by one amount");
    if (list.size() > 24) throw input_error(path, "at most 24 periods, got " + std::to_string(list.size()));
    price_schedule schedule;
    // Every row is read and its problem said before any is refused: a tariff is typed row by row.
    std::vector<issue> row_errors;
    for (std::size_t i = 0; i < list.size(); ++i) collect_errors(row_errors, [&] {
        const std::string item = path + "/" + std::to_string(i);
        const auto& period_json = list[i];
        require_object(period_json, item);
        schedule_period period;
        if (!period_json.contains("name") || (period_json.at("name").is_string() && period_json.at("name").get<std::string>().empty()))
            throw input_error(item + "/name", "is required: the period's name as the tariff gives it (peak, off-peak…)");
        period.name = required_string(period_json, "name", item);
        if (period.name.empty() || period.name.size() > 40) throw input_error(item + "/name", "must be 1 to 40 characters");
        period.amount_per_kwh = required_number(period_json, "amount", item);
        for (const auto& earlier : schedule)
            if (earlier.name == period.name && earlier.amount_per_kwh != period.amount_per_kwh)
                throw input_error(item + "/amount", "period \"" + period.name + "\" costs " + format_number(earlier.amount_per_kwh) +
                                                        " in an earlier row: rows of one name are one period with one price");
        if (period.amount_per_kwh < 0) throw input_error(item + "/amount", "must be >= 0, got " + format_number(period.amount_per_kwh));
        if (period.amount_per_kwh >= 10)
            throw input_error(item + "/amount", "must be a price per kWh below 10, got " + format_number(period.amount_per_kwh) +
                                                    (period.amount_per_kwh < 100 ? " (cents? " + format_number(period.amount_per_kwh) + " cents is " +
                                                                                       format_number(period.amount_per_kwh / 100) + ")"
                                                                                 : ""));
        if (!period_json.contains("hours")) throw input_error(item + "/hours", "is required: [[from, to], ...] in local hours, e.g. [[16, 21]] or [[0.5, 7.5]] for 0:30 to 7:30");
        const auto& hours = period_json.at("hours");
        if (hours.is_array() && hours.size() == 2 && !hours[0].is_array() && !hours[1].is_array()) {
            read_hour_span(hours, item + "/hours", period.half_hours);  // one pair, written without the outer brackets
        } else {
            if (!hours.is_array() || hours.empty())
                throw input_error(item + "/hours", "must be a list of [from, to] pairs in local hours, e.g. [[7, 11], [17, 21]]");
            for (std::size_t k = 0; k < hours.size(); ++k) read_hour_span(hours[k], item + "/hours/" + std::to_string(k), period.half_hours);
        }
        const auto days = optional_string(period_json, "days", item).value_or("all");
        if (days == "all") period.days = day_set::all;
        else if (days == "weekdays") period.days = day_set::weekdays;
        else if (days == "weekends") period.days = day_set::weekends;
        else throw input_error(item + "/days", "must be all, weekdays or weekends, got \"" + days + "\"");
        if (const auto months = period_json.find("months"); months != period_json.end()) {
            if (!months->is_array() || months->empty())
                throw input_error(item + "/months", "must be a list of month numbers 1-12, e.g. [6, 7, 8, 9]");
            for (std::size_t k = 0; k < months->size(); ++k) {
                const auto& month = (*months)[k];
                const double value = month.is_number() ? month.get<double>() : 0.0;
                if (!month.is_number() || value < 1 || value > 12 || value != std::floor(value))
                    throw input_error(item + "/months/" + std::to_string(k), "must be a month number from 1 (January) to 12");
                period.months[static_cast<std::size_t>(value) - 1] = true;
            }
        } else {
            period.months.fill(true);
        }
        warn_unknown_keys(period_json, {"name", "amount", "hours", "days", "months"}, item, warnings);
        schedule.push_back(period);
    });
    if (!row_errors.empty()) throw input_error(row_errors);
    if (const auto clash = schedule_coverage_problem(schedule)) {
        if (clash->second < 0)
            throw input_error(path, "each time of day must fall in exactly one period: " + clash_text(*clash) + " is in none");
        throw input_error(path + "/" + std::to_string(clash->second),
                          "each time of day must fall in exactly one period: " + clash_text(*clash) + " is in both \"" +
                              schedule[static_cast<std::size_t>(clash->first)].name + "\" and \"" +
                              schedule[static_cast<std::size_t>(clash->second)].name + "\"");
    }
    return schedule;
}

water_heater_spec read_water_heater(const json& item, const std::string& path, std::vector<issue>& warnings) {
    require_object(item, path);
    water_heater_spec heater;
    heater.path = path;
    heater.kind = parse_water_heater_kind(required_string(item, "kind", path), path + "/kind");
    const bool by_boiler = heated_by_boiler(heater.kind);
    const std::string kind_text(water_heater_kind_name(heater.kind));
    if (const auto fuel = optional_string(item, "fuel", path)) {
        if (by_boiler)
            warnings.push_back({path + "/fuel", with_article(kind_text) + " water heater burns the boiler's fuel; this fuel is not used"});
        else
            heater.fuel = find_fuel(*fuel, path + "/fuel");
    } else if (!by_boiler) {
        throw input_error(path + "/fuel", "is required: the fuel the water heater runs on");
    }
    if (heater.kind == water_heater_kind::heat_pump_water_heater && heater.fuel && heater.fuel->category != fuel_category::electricity)
        throw input_error(path + "/fuel", "a heat-pump water heater runs on electricity, not " + heater.fuel->id);
    if (heater.fuel && heater.fuel->category == fuel_category::solid)
        throw input_error(path + "/fuel", "a water heater burning " + heater.fuel->id + " is not modelled; give gas, oil, propane or electricity");
    const bool uef_given = item.contains("uef"), efficiency_given = item.contains("efficiency");
    if (uef_given && efficiency_given) throw input_error(path + "/efficiency", "give uef or efficiency, not both");
    if (by_boiler) {
        if (uef_given || efficiency_given)
            warnings.push_back({path + (uef_given ? "/uef" : "/efficiency"),
                                with_article(kind_text) + " water heater is heated by the boiler at the boiler's efficiency; this rating is not used"});
    } else if (uef_given) {
        const auto value = optional_number(item, "uef", path);
        heater.efficiency_value = *value;
        heater.rating = water_heater_rating::uef;
    } else if (efficiency_given) {
        const auto& efficiency = item.at("efficiency");
        require_object(efficiency, path + "/efficiency");
        heater.efficiency_value = required_number(efficiency, "value", path + "/efficiency");
        const auto rating = required_string(efficiency, "rating", path + "/efficiency");
        if (rating == "UEF" || rating == "uef") heater.rating = water_heater_rating::uef;
        else if (rating == "eta_wh") heater.rating = water_heater_rating::eta_wh;
        else throw input_error(path + "/efficiency/rating", "must be UEF or eta_wh, got \"" + rating + "\"");
        warn_unknown_keys(efficiency, {"value", "rating"}, path + "/efficiency", warnings);
    } else {
        throw input_error(path + "/uef", "is required: the uniform energy factor on the label or data sheet (typical: gas storage "
                                         "0.58-0.70, gas tankless 0.81-0.97, electric storage 0.90-0.95, heat-pump 2.0-4.0), or "
                                         "efficiency {value, rating: eta_wh}");
    }
    if (!by_boiler) {
        const std::string value_path = path + (uef_given ? "/uef" : "/efficiency/value");
        const double value = heater.efficiency_value;
        const bool heat_pump = heater.kind == water_heater_kind::heat_pump_water_heater;
        if (heater.rating == water_heater_rating::uef) {
            if (!(value > 0)) throw input_error(value_path, "must be > 0, got " + format_number(value));
            if (!heat_pump && value > 1 && value <= 100)
                throw input_error(value_path, "a UEF is a ratio below 1 for a " + kind_text + " water heater (0.64, not 64); got " + format_number(value));
            if (!heat_pump && value > 1) throw input_error(value_path, "must be a UEF from 0.3 to 1, got " + format_number(value));
            if (heat_pump && (value < 1 || value > 6))
                throw input_error(value_path, "a heat-pump water heater's UEF lies from 1 to 6 (typically 2.0-4.0), got " + format_number(value));
            if (value < 0.3) throw input_error(value_path, "must be a UEF from 0.3 to 1, got " + format_number(value));
        } else {
            if (value > 0 && value <= 3)
                throw input_error(value_path, "eta_wh is a percentage as the EU label prints it (e.g. 65 or 130), got " + format_number(value));
            if (!(value > 3 && value <= 500)) throw input_error(value_path, "must be a percentage from 3 to 500, got " + format_number(value));
            // above these only a heat pump (or solar input) reaches: a burner on the gross calorific value 100 %,
            // a resistance element 100 % / CC 2.5 = 40 %
            const bool electric = heater.fuel && heater.fuel->category == fuel_category::electricity;
            const double limit = heat_pump ? 500.0 : electric ? 100.0 / eu_conversion_coefficient : 100.0;
            if (value > limit)
                throw input_error(value_path, std::string(electric ? "an electric " : "a fuel-fired ") + kind_text + " water heater's eta_wh is at most " +
                                                  format_number(limit) + " % (" +
                                                  (electric ? "its electricity counted x CC 2.5" : "on the gross calorific value") +
                                                  "); above it only a heat pump reaches, got " + format_number(value));
            heater.efficiency_value = value / 100;
        }
    }
    if (const auto location = optional_string(item, "location", path)) {
        if (*location == "conditioned") heater.conditioned_space = true;
        else if (*location != "unconditioned")
            throw input_error(path + "/location", "must be conditioned (inside the heated space) or unconditioned, got \"" + *location + "\"");
        heater.location_given = true;
    } else if (heater.kind == water_heater_kind::heat_pump_water_heater) {
        warnings.push_back({path + "/location", "no location given: taken as unconditioned (a basement or garage outside the heated "
                                                "space); in the heated space it takes heat from the house, which the heating must make up"});
    }
    if (item.contains("standby_loss")) {
        if (heater.kind != water_heater_kind::indirect)
            throw input_error(path + "/standby_loss", "applies to an indirect tank (the boiler makes up its loss)");
        const double w = quantity_in(item.at("standby_loss"), path + "/standby_loss", dimension::power, "W");
        if (!(w >= 0 && w <= 500)) throw input_error(path + "/standby_loss/value", "must be a standby loss from 0 to 500 W");
        heater.standby_w = w;
        heater.standby_given = true;
    } else if (heater.kind == water_heater_kind::indirect) {
        heater.standby_w = default_indirect_standby_w;
    }
    if (item.contains("price")) {
        if (!heater.fuel) throw input_error(path + "/price", with_article(kind_text) + " water heater burns the boiler's fuel at its price");
        const auto& price = item.at("price");
        require_object(price, path + "/price");
        water_heater_spec::own_price own;
        own.amount = required_number(price, "amount", path + "/price");
        if (own.amount < 0) throw input_error(path + "/price/amount", "must be >= 0, got " + format_number(own.amount));
        require_at_most_max_amount(own.amount, path + "/price/amount");
        own.unit = required_string(price, "per", path + "/price");
        heating_value_per_sale_unit(*heater.fuel, own.unit, {}, path + "/price/per");  // a unit the fuel is sold in
        warn_unknown_keys(price, {"amount", "per"}, path + "/price", warnings);
        if (item.contains("fixed_charges"))
            for (const auto& charge : read_fixed_charges(item.at("fixed_charges"), path + "/fixed_charges")) {
                own.fixed_per_year += charge.amount_per_year;
                own.fixed_text += (own.fixed_text.empty() ? "" : "; ") + charge.label + ": " + charge.text;
            }
        heater.price = own;
    } else if (item.contains("fixed_charges")) {
        throw input_error(path + "/fixed_charges", "go with the water heater's own price (price {amount, per})");
    }
    warn_unknown_keys(item, {"kind", "fuel", "uef", "efficiency", "location", "standby_loss", "label", "price", "fixed_charges"}, path,
                      warnings);
    return heater;
}

scenario_option read_option(const json& item, const std::string& path, std::vector<issue>& warnings) {
    require_object(item, path);
    scenario_option option;
    option.path = path;
    option.id = required_string(item, "id", path);
    if (!is_option_id(option.id))
        throw input_error(path + "/id", "option id \"" + option.id +
                                            "\" must start with a letter or digit and use only letters, digits, . _ - "
                                            "(at most 64 characters)");
    option.label = optional_string(item, "label", path).value_or(option.id);
    option.existing = optional_bool(item, "existing", path).value_or(false);
    for (const auto& [key, target] : std::initializer_list<std::pair<const char*, double*>>{
             {"installed_cost", &option.installed_cost}, {"incentives", &option.incentives},
             {"annual_maintenance", &option.annual_maintenance}}) {
        *target = optional_number(item, key, path).value_or(0.0);
        if (*target < 0) throw input_error(path + "/" + key, "must be >= 0, got " + format_number(*target));
        require_at_most_max_amount(*target, path + "/" + key);
    }
    if (option.incentives > option.installed_cost)
        throw input_error(path + "/incentives", "incentives (" + format_number(option.incentives) +
                                                    ") exceed the installed cost (" + format_number(option.installed_cost) + ")");
    option.life_years = optional_number(item, "life_years", path);
    if (option.life_years && !(*option.life_years >= 1 && *option.life_years <= 100))
        throw input_error(path + "/life_years", "must be a service life from 1 to 100 years, got " +
                                                    format_number(*option.life_years));
    if (!item.contains("fuel")) throw input_error(path + "/fuel", "is required (a fuel id or a custom fuel object)");
    const auto& fuel = item.at("fuel");
    if (fuel.is_string()) option.fuel = find_fuel(fuel.get<std::string>(), path + "/fuel");
    else if (fuel.is_object()) option.fuel = read_custom_fuel(fuel, path + "/fuel", warnings);
    else throw input_error(path + "/fuel", "must be a fuel id or a custom fuel object");

    if (!item.contains("price")) throw input_error(path + "/price", "is required ({\"amount\": ..., \"per\": unit})");
    const auto& price = item.at("price");
    require_object(price, path + "/price");
    const bool scheduled = price.contains("schedule");
    if (scheduled && price.contains("amount"))
        throw input_error(path + "/price/amount", "give amount (one price) or schedule (time of use), not both");
    if (scheduled && price.contains("tiers"))
        throw input_error(path + "/price/schedule", "give tiers (block rates) or a schedule (time of use), not both");
    option.price_per_unit = (price.contains("tiers") || scheduled) && !price.contains("amount") ? 0.0 : required_number(price, "amount", path + "/price");
    if (option.price_per_unit < 0)
        throw input_error(path + "/price/amount", "must be >= 0, got " + format_number(option.price_per_unit));
    require_at_most_max_amount(option.price_per_unit, path + "/price/amount");
    option.price_unit = required_string(price, "per", path + "/price");
    if (const auto tiers = price.find("tiers"); tiers != price.end()) {
        if (!tiers->is_array() || tiers->empty()) throw input_error(path + "/price/tiers", "must be a non-empty array of {from, to, amount}");
        double previous = 0;
        for (std::size_t i = 0; i < tiers->size(); ++i) {
            const std::string tier_path = path + "/price/tiers/" + std::to_string(i);
            const auto& tier = (*tiers)[i];
            require_object(tier, tier_path);
            price_tier entry;
            entry.from = required_number(tier, "from", tier_path);
            entry.to = tier.contains("to") && !tier.at("to").is_null() ? required_number(tier, "to", tier_path) : INFINITY;
            entry.amount = required_number(tier, "amount", tier_path);
            if (entry.amount < 0) throw input_error(tier_path + "/amount", "must be >= 0, got " + format_number(entry.amount));
            require_at_most_max_amount(entry.amount, tier_path + "/amount");
            if (entry.from != previous)
                throw input_error(tier_path + "/from", "blocks must follow each other from 0 without gaps or overlaps; expected " +
                                                           format_number(previous) + ", got " + format_number(entry.from));
            if (!(entry.to > entry.from)) throw input_error(tier_path + "/to", "must be above from");
            if (std::isinf(entry.to) && i + 1 < tiers->size()) throw input_error(tier_path + "/to", "only the last block may be open-ended");
            previous = entry.to;
            option.tiers.push_back(entry);
        }
        if (!std::isinf(option.tiers.back().to))
            option.tiers.back().to = INFINITY;  // use beyond the last block is billed at its rate
        if (!price.contains("amount")) option.price_per_unit = option.tiers.front().amount;
    }
    if (scheduled) {
        if (option.fuel.category != fuel_category::electricity)
            throw input_error(path + "/price/schedule", "a time-of-use schedule prices electricity; " + option.fuel.id + " is priced by amount");
        if (option.price_unit != "kWh") throw input_error(path + "/price/per", "must be kWh with a schedule, got "" + option.price_unit + """);
        option.schedule = read_price_schedule(price.at("schedule"), path + "/price/schedule", warnings);
        option.price_per_unit = mean_price_per_kwh(*option.schedule);
    }
    warn_unknown_keys(price, {"amount", "per", "tiers", "schedule"}, path + "/price", warnings);

    if (const auto bag = item.find("bag_mass"); bag != item.end()) {
        require_object(*bag, path + "/bag_mass");
        const double value = required_number(*bag, "value", path + "/bag_mass");
        const auto unit = required_string(*bag, "unit", path + "/bag_mass");
        if (find_unit(unit, path + "/bag_mass/unit").kind != dimension::mass)
            throw input_error(path + "/bag_mass/unit", "must be a mass unit: " + accepted_units(dimension::mass));
        if (value <= 0) throw input_error(path + "/bag_mass/value", "must be > 0, got " + format_number(value));
        const double kg = convert(value, unit, "kg", path + "/bag_mass/value");
        if (kg < 1 || kg > 2000)
            throw input_error(path + "/bag_mass/value", "a bag must hold from 1 to 2000 kg (" +
                                                            format_number(convert(1, "kg", unit)) + " to " +
                                                            format_number(convert(2000, "kg", unit)) + " " + unit +
                                                            "), got " + format_number(value) + " " + unit);
        option.sale.bag_mass_kg = kg;
    }
    if (const auto fraction = optional_number(item, "face_cord_fraction", path)) {
        if (!(*fraction >= 0.1 && *fraction <= 1))
            throw input_error(path + "/face_cord_fraction",
                              "must be a fraction of a cord from 0.1 to 1 (a face cord is "
                              "usually 1/3 of a cord), got " +
                                  format_number(*fraction));
        option.sale.face_cord_fraction = fraction;
    }
    option.sale.wood_species = optional_string(item, "wood_species", path);
    if (option.sale.wood_species && option.fuel.species_groups.empty())
        throw input_error(path + "/wood_species", "applies to cordwood only; " + option.fuel.id + " has no wood species");
    option.moisture_pct = optional_number(item, "moisture_pct", path);
    if (option.moisture_pct && !(*option.moisture_pct >= 0 && *option.moisture_pct < 100))
        throw input_error(path + "/moisture_pct", "must be from 0 to below 100 %, got " + format_number(*option.moisture_pct));
    // Validates the priced unit now so the error points at the price.
    heating_value_per_sale_unit(option.fuel, option.price_unit, option.sale, path + "/price/per");

    if (item.contains("fixed_charges")) option.fixed_charges = read_fixed_charges(item.at("fixed_charges"), path + "/fixed_charges");

    if (!item.contains("system")) throw input_error(path + "/system", "is required");
    const auto& system = item.at("system");
    const std::string system_path = path + "/system";
    require_object(system, system_path);
    const auto catalog = optional_string(system, "catalog", system_path);
    const system_record* record = catalog ? &find_system(*catalog, system_path + "/catalog") : nullptr;
    if (record) option.system_catalog = record->id;
    const auto kind_text = optional_string(system, "kind", system_path);
    if (!kind_text && !record) throw input_error(system_path + "/kind", "is required (or give a catalog system)");
    option.system.kind = kind_text ? parse_kind(*kind_text, system_path + "/kind") : record->kind;
    if (record && record->kind != option.system.kind)
        throw input_error(system_path + "/kind", "catalog system " + record->id + " is a " +
                                                     std::string(kind_name(record->kind)) + ", not a " + *kind_text);
    if (const auto efficiency = system.find("efficiency"); efficiency != system.end()) {
        require_object(*efficiency, system_path + "/efficiency");
        option.system.efficiency_value = required_number(*efficiency, "value", system_path + "/efficiency");
        option.system.rating =
            parse_rating(required_string(*efficiency, "rating", system_path + "/efficiency"), system_path + "/efficiency/rating");
        warn_unknown_keys(*efficiency, {"value", "rating"}, system_path + "/efficiency", warnings);
    } else if (system.contains("ratings") && is_heat_pump(option.system.kind)) {
        option.efficiency_given = false;
        option.system.efficiency_value = 1.0;  // replaced by the bin model's seasonal COP
        option.system.rating = efficiency_rating::cop;
    } else if (record) {
        option.system.efficiency_value = record->typical.value;
        option.system.rating = record->typical.rating;
        warnings.push_back({system_path + "/efficiency", "no efficiency given; using the typical " +
                                                             format_number(record->typical.value) + " " +
                                                             std::string(rating_name(record->typical.rating)) + " of " +
                                                             record->id + " — enter the nameplate rating"});
    } else {
        throw input_error(system_path + "/efficiency", "is required ({\"value\": ..., \"rating\": ...})");
    }
    read_heat_pump_fields(system, system_path, option);
    warn_unknown_keys(system, {"kind", "catalog", "efficiency", "distribution_loss", "age_derating", "ratings", "cutoff",
                               "cd", "backup", "changeover", "capacity", "stages", "auxiliary_electricity", "altitude_rated"},
                      system_path, warnings);
    option.system.distribution_loss = optional_number(system, "distribution_loss", system_path).value_or(0.0);
    option.system.age_derating = optional_number(system, "age_derating", system_path).value_or(0.0);
    // Losses are shares of the heat: read here for every kind of system (a heat pump's too).
    for (const auto& [key, share] : {std::pair{"distribution_loss", option.system.distribution_loss},
                                     std::pair{"age_derating", option.system.age_derating}})
        if (!(share >= 0 && share < 1))
            throw input_error(system_path + "/" + key, "must be a fraction from 0 to below 1 (0 % to below 100 %), got " +
                                                          format_number(share) + " (" + format_number(100 * share) + " %)");
    if (record && !option.fuel.custom &&
        std::find(record->fuels.begin(), record->fuels.end(), option.fuel.id) == record->fuels.end())
        warnings.push_back({system_path + "/catalog", record->id + " is not usually fired with " + option.fuel.id});

    if (const auto hv = item.find("heating_value"); hv != item.end()) {
        const auto given = read_given_heating_value(*hv, path + "/heating_value", option.fuel, option.price_unit, option.sale, warnings);
        option.heating_value_override_j = given.hhv_j_per_unit;
        option.heating_value_override_text = given.text;
    }
    if (const auto heater = item.find("water_heater"); heater != item.end())
        option.water_heater = read_water_heater(*heater, path + "/water_heater", warnings);
    option.altitude_rated = optional_bool(system, "altitude_rated", system_path).value_or(false);
    warn_unknown_keys(item, {"id", "label", "fuel", "price", "fixed_charges", "system", "heating_value", "wood_species",
                             "moisture_pct", "bag_mass", "face_cord_fraction", "existing", "installed_cost",
                             "incentives", "annual_maintenance", "life_years", "equipment", "water_heater"},
                      path, warnings);
    optional_string(item, "equipment", path);  // make and model, for the quote sheet
    return option;
}

namespace {

scenario_settings read_settings(const json& document, std::vector<issue>& warnings) {
    scenario_settings settings;
    settings.electricity_co2e_kg_per_kwh = default_electricity_emissions().co2e_kg_per_kwh;
    settings.gwp = default_gwp_set();
    if (!document.contains("settings")) return settings;
    const auto& s = document.at("settings");
    require_object(s, "/settings");
    if (const auto units = optional_string(s, "units", "/settings")) {
        if (*units == "us") settings.units = unit_system::us;
        else if (*units == "metric") settings.units = unit_system::metric;
        else throw input_error("/settings/units", "unknown unit system \"" + *units + "\"; accepted: us, metric");
    }
    if (const auto currency = optional_string(s, "currency", "/settings")) {
        if (!is_currency_code(*currency))
            throw input_error("/settings/currency", "must be an ISO 4217 code of three capital letters (USD, CAD, EUR), got \"" +
                                                        *currency + "\"");
        settings.currency = *currency;
    }
    if (const auto factor = optional_number(s, "electricity_co2e_kg_per_kwh", "/settings")) {
        if (*factor < 0)
            throw input_error("/settings/electricity_co2e_kg_per_kwh", "must be >= 0, got " + format_number(*factor));
        if (*factor > 10)
            throw input_error(
                "/settings/electricity_co2e_kg_per_kwh",
                "must be from 0 to 10 kg CO2e per kWh (coal-fired power emits about 1), got " + format_number(*factor));
        if (*factor > 2) warnings.push_back({"/settings/electricity_co2e_kg_per_kwh",
                                             "above 2 kg/kWh is more than any grid emits; check the value"});
        settings.electricity_co2e_kg_per_kwh = *factor;
        settings.electricity_factor_given = true;
    }
    if (const auto gwp = optional_string(s, "gwp", "/settings")) {
        find_gwp_set(*gwp, "/settings/gwp");
        settings.gwp = *gwp;
    }
    if (s.contains("electricity")) {
        const auto& electricity = s.at("electricity");
        const std::string path = "/settings/electricity";
        require_object(electricity, path);
        if (electricity.contains("price")) {
            const auto& price = electricity.at("price");
            require_object(price, path + "/price");
            const auto per = optional_string(price, "per", path + "/price").value_or("kWh");
            if (per != "kWh") throw input_error(path + "/price/per", "must be kWh, got \"" + per + "\"");
            if (price.contains("schedule")) {
                if (price.contains("amount"))
                    throw input_error(path + "/price/amount", "give amount (one price) or schedule (time of use), not both");
                settings.electricity_schedule = read_price_schedule(price.at("schedule"), path + "/price/schedule", warnings);
                settings.electricity_price_per_kwh = mean_price_per_kwh(*settings.electricity_schedule);
            } else {
                const auto amount = optional_number(price, "amount", path + "/price");
                if (!amount) throw input_error(path + "/price/amount", "is required (the price of a kWh), or a schedule");
                if (!(*amount > 0 && *amount < 10))
                    throw input_error(path + "/price/amount", "must be a price per kWh above 0 and below 10, got " + format_number(*amount));
                settings.electricity_price_per_kwh = *amount;
            }
            warn_unknown_keys(price, {"amount", "per", "schedule"}, path + "/price", warnings);
        }
        if (electricity.contains("fixed_charges"))
            settings.kept_services.push_back({"electricity", read_fixed_charges(electricity.at("fixed_charges"), path + "/fixed_charges")});
        warn_unknown_keys(electricity, {"price", "fixed_charges"}, path, warnings);
    }
    if (s.contains("kept_services")) {
        const auto& kept = s.at("kept_services");
        if (!kept.is_array()) throw input_error("/settings/kept_services", "must be an array of {fuel, fixed_charges}");
        for (std::size_t i = 0; i < kept.size(); ++i) {
            const std::string path = "/settings/kept_services/" + std::to_string(i);
            require_object(kept[i], path);
            const auto fuel = optional_string(kept[i], "fuel", path);
            if (!fuel) throw input_error(path + "/fuel", "is required (the id of the fuel whose service stays connected)");
            find_fuel(*fuel, path + "/fuel");
            for (const auto& earlier : settings.kept_services)
                if (earlier.fuel_id == *fuel)
                    throw input_error(path + "/fuel", *fuel + " is kept already (once in kept_services, or electricity's "
                                                              "fixed charges under settings.electricity)");
            if (!kept[i].contains("fixed_charges"))
                throw input_error(path + "/fixed_charges", "is required (the charges the service costs whatever it supplies)");
            settings.kept_services.push_back({*fuel, read_fixed_charges(kept[i].at("fixed_charges"), path + "/fixed_charges")});
            warn_unknown_keys(kept[i], {"fuel", "fixed_charges", "label"}, path, warnings);
        }
    }
    if (s.contains("elevation")) {
        const double m = quantity_in(s.at("elevation"), "/settings/elevation", dimension::length, "m");
        if (!(m >= -500 && m <= 5500))
            throw input_error("/settings/elevation/value", "must be a site elevation from -500 to 5,500 m (-1,640 to 18,045 ft), got " +
                                                               format_number(s.at("elevation").at("value").get<double>()) + " " +
                                                               s.at("elevation").at("unit").get<std::string>());
        settings.elevation_m = m;
    }
    if (s.contains("gas_pressure_base")) {
        const auto& base = s.at("gas_pressure_base");
        if (base.is_string() && base.get<std::string>() == "site") {
            if (!settings.elevation_m)
                throw input_error("/settings/gas_pressure_base", "\"site\" needs settings.elevation (the pressure there is the site's air pressure)");
            settings.gas_pressure_base_pa = standard_atmosphere_pa(*settings.elevation_m);
        } else if (base.is_object()) {
            const double pa = quantity_in(base, "/settings/gas_pressure_base", dimension::pressure, "Pa");
            if (!(pa >= 40000 && pa <= 130000))
                throw input_error("/settings/gas_pressure_base/value", "must be an absolute pressure from 40 to 130 kPa (5.8 to 18.9 psia)");
            settings.gas_pressure_base_pa = pa;
        } else {
            throw input_error("/settings/gas_pressure_base", "must be {value, unit: psia | kPa | inHg | mbar} or \"site\"");
        }
    }
    warn_unknown_keys(s, {"units", "currency", "electricity_co2e_kg_per_kwh", "gwp", "locale", "electricity", "kept_services",
                          "elevation", "gas_pressure_base"},
                      "/settings", warnings);
    return settings;
}

/// A rate per year as a fraction, from -50 % to 100 %.
double read_rate(const json& obj, const std::string& key, const std::string& path, double fallback) {
    const auto value = optional_number(obj, key, path);
    if (!value) return fallback;
    if (*value < -0.5)
        throw input_error(path + "/" + key,
                          "a rate must be from -50 % to 100 % per year (-0.5 to 1 as "
                          "fractions), got " +
                              format_number(*value));
    if (*value > 1) throw input_error(path + "/" + key, "rates are fractions per year (0.05 for 5 %); got " + format_number(*value));
    return *value;
}

economics_settings read_economics(const json& e, std::vector<issue>& warnings) {
    const std::string path = "/economics";
    require_object(e, path);
    economics_settings out;
    out.given = true;
    if (const auto years = optional_number(e, "analysis_years", path)) {
        if (*years != std::floor(*years) || *years < 1 || *years > 50)
            throw input_error(path + "/analysis_years", "must be a whole number of years from 1 to 50, got " + format_number(*years));
        out.analysis_years = static_cast<int>(*years);
    }
    out.discount_rate = read_rate(e, "discount_rate", path, out.discount_rate);
    out.maintenance_escalation = read_rate(e, "maintenance_escalation", path, 0.0);
    if (const auto basis = optional_string(e, "basis", path)) {
        if (*basis != "real" && *basis != "nominal")
            throw input_error(path + "/basis", "must be \"real\" or \"nominal\", got \"" + *basis + "\"");
        out.basis = *basis;
    }
    if (const auto esc = e.find("escalation"); esc != e.end()) {
        if (esc->is_number()) {
            out.default_escalation = read_rate(e, "escalation", path, 0.0);
        } else {
            require_object(*esc, path + "/escalation");
            for (const auto& item : esc->items()) {
                const double rate = read_rate(*esc, item.key(), path + "/escalation", 0.0);
                if (item.key() == "default") out.default_escalation = rate;
                else {
                    find_fuel(item.key(), path + "/escalation/" + item.key());
                    out.escalation[item.key()] = rate;
                }
            }
        }
    }
    warn_unknown_keys(e, {"analysis_years", "discount_rate", "escalation", "basis", "maintenance_escalation"}, path, warnings);
    return out;
}

uncertainty_settings read_uncertainty(const json& u, std::vector<issue>& warnings) {
    const std::string path = "/uncertainty";
    require_object(u, path);
    uncertainty_settings out;
    if (const auto draws = optional_number(u, "draws", path)) {
        if (*draws != std::floor(*draws) || *draws < 100 || *draws > 200000)
            throw input_error(path + "/draws", "must be a whole number from 100 to 200000, got " + format_number(*draws));
        out.draws = static_cast<int>(*draws);
    }
    if (const auto seed = optional_number(u, "seed", path)) {
        if (*seed != std::floor(*seed) || *seed < 0 || *seed > 9007199254740991.0)
            throw input_error(path + "/seed", "must be a whole number from 0 to 2^53 - 1, got " + format_number(*seed));
        out.seed = static_cast<std::uint64_t>(*seed);
    }
    if (const auto form = optional_string(u, "form", path)) {
        if (*form != "lognormal" && *form != "triangular")
            throw input_error(path + "/form", "must be \"lognormal\" or \"triangular\", got \"" + *form + "\"");
        out.triangular = *form == "triangular";
    }
    const auto check_spread = [&](double value, const std::string& where) {
        if (!(value >= 0) || value > (out.triangular ? 0.95 : 2.0))
            throw input_error(where, out.triangular ? "a triangular half-width must be a fraction from 0 to 0.95, got " + format_number(value)
                                                    : "a spread (SD of ln price) must be from 0 to 2, got " + format_number(value));
        return value;
    };
    if (const auto spread = u.find("spread"); spread != u.end()) {
        if (spread->is_number()) {
            out.default_spread = check_spread(spread->get<double>(), path + "/spread");
        } else {
            require_object(*spread, path + "/spread");
            for (const auto& item : spread->items()) {
                if (!item.value().is_number()) throw input_error(path + "/spread/" + item.key(), "must be a number");
                const double value = check_spread(item.value().get<double>(), path + "/spread/" + item.key());
                if (item.key() == "default") out.default_spread = value;
                else {
                    find_fuel(item.key(), path + "/spread/" + item.key());
                    out.spread[item.key()] = value;
                }
            }
        }
    }
    warn_unknown_keys(u, {"draws", "seed", "spread", "form"}, path, warnings);
    return out;
}

}  // namespace

namespace {

/// Checks the quote's company block and financing (for the sheet; the evaluation does not use them):
/// `company` {name, address, phone, email, licence, logo (a data: URL of an image)}, `financing` {rate
/// (a fraction a year, 0 to 0.5), years (1 to 40)}.
void read_quote_extras(const json& quote, std::vector<issue>& warnings) {
    if (const auto company = quote.find("company"); company != quote.end()) {
        require_object(*company, "/quote/company");
        const std::vector<std::string> keys{"name", "address", "phone", "email", "licence", "logo"};
        for (const auto& key : keys) optional_string(*company, key, "/quote/company");
        if (const auto logo = optional_string(*company, "logo", "/quote/company"); logo && !logo->empty() &&
                                                                                     logo->rfind("data:image/", 0) != 0)
            throw input_error("/quote/company/logo", "must be an image kept in the file (a data:image/... URL)");
        warn_unknown_keys(*company, keys, "/quote/company", warnings);
    }
    if (const auto financing = quote.find("financing"); financing != quote.end()) {
        require_object(*financing, "/quote/financing");
        if (const auto rate = optional_number(*financing, "rate", "/quote/financing"); rate && !(*rate >= 0 && *rate <= 0.5))
            throw input_error("/quote/financing/rate",
                              "must be a fraction a year from 0 to 0.5 (0.079 for 7.9 %), got " + format_number(*rate));
        if (const auto years = optional_number(*financing, "years", "/quote/financing");
            years && !(*years >= 1 && *years <= 40))
            throw input_error("/quote/financing/years", "must be from 1 to 40 years, got " + format_number(*years));
        warn_unknown_keys(*financing, {"rate", "years"}, "/quote/financing", warnings);
    }
}

/// Removes every issue that repeats an earlier one (same path and message), keeping the order.
void drop_repeated(std::vector<issue>& issues) {
    std::vector<issue> kept;
    for (auto& item : issues)
        if (std::none_of(kept.begin(), kept.end(), [&](const issue& e) { return e.path == item.path && e.message == item.message; }))
            kept.push_back(std::move(item));
    issues = std::move(kept);
}

}  // namespace

scenario read_scenario(const json& document, std::vector<issue>& errors, std::vector<issue>& warnings) {
    scenario out;
    const auto attempt = [&](auto&& body) { collect_errors(errors, body); };
    attempt([&] {
        require_object(document, "");
        const auto schema = optional_string(document, "schema", "");
        if (!schema) warnings.push_back({"/schema", "missing; read as fuelwright.scenario/1"});
        else if (*schema != "fuelwright.scenario/1")
            throw input_error("/schema", "unsupported schema \"" + *schema + "\"; this version reads fuelwright.scenario/1");
        if (document.contains("quote")) {
            const auto& quote = document.at("quote");
            require_object(quote, "/quote");
            for (const char* key : {"customer", "site", "date", "prepared_by", "notes", "number", "valid_until", "terms"})
                optional_string(quote, key, "/quote");
            std::optional<long> quote_day;
            if (const auto date = optional_string(quote, "date", "/quote"); date && !date->empty())
                quote_day = parse_day_number(*date, "/quote/date");
            if (const auto until = optional_string(quote, "valid_until", "/quote"); until && !until->empty()) {
                const long until_day = parse_day_number(*until, "/quote/valid_until");
                if (quote_day && until_day < *quote_day)
                    throw input_error("/quote/valid_until", "is before the quote's date (" + *until + ")");
            }
            read_quote_extras(quote, warnings);
            warn_unknown_keys(quote, {"customer", "site", "date", "prepared_by", "notes", "number", "valid_until", "terms",
                                      "company", "financing"},
                              "/quote", warnings);
        }
        // `other_fuels` (priced fuels no option uses) and `results` (the verdict as exported) travel with a
        // quote file for people and other programs; the evaluation does not read them.
        if (document.contains("other_fuels") && !document.at("other_fuels").is_array())
            throw input_error("/other_fuels", "must be a list of fuels with their prices");
        if (document.contains("results") && !document.at("results").is_object())
            throw input_error("/results", "must be an object (the verdict as exported)");
        warn_unknown_keys(document, {"schema", "title", "description", "quote", "settings", "demand", "options", "climate",
                                     "economics", "uncertainty", "other_fuels", "results", "detail"},
                          "", warnings);
    });
    if (!errors.empty()) return out;
    const std::size_t errors_before_settings = errors.size();
    attempt([&] { out.settings = read_settings(document, warnings); });
    const bool settings_read = errors.size() == errors_before_settings;
    attempt([&] {
        if (document.contains("economics")) out.economics = read_economics(document.at("economics"), warnings);
    });
    attempt([&] {
        if (document.contains("uncertainty")) out.uncertainty = read_uncertainty(document.at("uncertainty"), warnings);
    });
    const std::size_t errors_before_climate = errors.size();
    attempt([&] {
        if (document.contains("climate")) out.climate = read_climate(document.at("climate"), warnings);
    });
    const bool climate_read = errors.size() == errors_before_climate;
    attempt([&] {
        if (!document.contains("options") || !document.at("options").is_array() || document.at("options").empty())
            throw input_error("/options", "needs at least one option (a fuel, its price and a system)");
        const auto& options = document.at("options");
        if (options.size() > 30) throw input_error("/options", "at most 30 options, got " + std::to_string(options.size()));
        std::map<std::string, std::string> seen;
        for (std::size_t i = 0; i < options.size(); ++i) {
            const std::string path = "/options/" + std::to_string(i);
            attempt([&] {
                auto option = read_option(options[i], path, warnings);
                option.sale.gas_pressure_pa = out.settings.gas_pressure_base_pa;
                if (const auto found = seen.find(option.id); found != seen.end())
                    throw input_error(path + "/id", "duplicate option id \"" + option.id + "\" (also at " + found->second + ")");
                seen[option.id] = path;
                out.options.push_back(std::move(option));
            });
        }
        int existing = 0;
        for (const auto& option : out.options) existing += option.existing;
        if (existing > 1) throw input_error("/options", "at most one option can be the existing system; " +
                                                            std::to_string(existing) + " are marked existing");
    });
    const std::size_t errors_before_demand = errors.size();
    attempt([&] {
        if (!document.contains("demand")) throw input_error("/demand", "is required (how much useful heat the house needs)");
        read_demand(document.at("demand"), out,
                    document.contains("options") ? document.at("options") : json::array(), warnings);
    });
    // Without the settings (prices of the site, services kept), a climate or a demand there is nothing to
    // evaluate the options against: the problem is reported at its own path and no option is computed.
    if (!settings_read || !climate_read || errors.size() != errors_before_demand) out.options.clear();
    // The bills' option is read again for the fit: a problem or a note of it is said once.
    drop_repeated(errors);
    drop_repeated(warnings);
    // A water heater with no hot water asked for is not used: said at it.
    if (out.hot_water_kwh <= 0)
        for (const auto& option : out.options)
            if (option.water_heater)
                warnings.push_back({option.path + "/water_heater", "no hot water is asked for (demand.water_heating): this water "
                                                                   "heater is not used"});
    // Time of use places each bin's kWh in its months and hours of the day.
    bool scheduled = out.settings.electricity_schedule.has_value();
    for (const auto& option : out.options) scheduled = scheduled || option.schedule.has_value();
    if (scheduled && out.climate) out.climate->calendar = bin_calendar(out.climate->model, out.climate->bins, out.climate->bin_width_k, out.climate->bins_when);
    for (auto& warning : plausibility_warnings(out)) warnings.push_back(std::move(warning));
    return out;
}

}  // namespace fw

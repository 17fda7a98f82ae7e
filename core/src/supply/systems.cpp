#include "supply/systems.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>

#include "base/embedded_data.hpp"
#include "base/error.hpp"

namespace fw {

namespace {

struct kind_entry {
    system_kind kind;
    const char* name;
};
constexpr kind_entry kinds[] = {{system_kind::furnace, "furnace"},
                                {system_kind::boiler, "boiler"},
                                {system_kind::stove, "stove"},
                                {system_kind::electric_resistance, "electric-resistance"},
                                {system_kind::air_source_heat_pump, "air-source-heat-pump"},
                                {system_kind::ground_source_heat_pump, "ground-source-heat-pump"}};

struct rating_entry {
    efficiency_rating rating;
    const char* name;
};
constexpr rating_entry ratings[] = {{efficiency_rating::afue, "AFUE"},       {efficiency_rating::thermal, "thermal"},
                                    {efficiency_rating::seasonal_gcv, "seasonal-gcv"},
                                    {efficiency_rating::seasonal_ncv, "seasonal-ncv"},
                                    {efficiency_rating::cop, "COP"},          {efficiency_rating::scop, "SCOP"},
                                    {efficiency_rating::hspf, "HSPF"},        {efficiency_rating::hspf2, "HSPF2"}};

/// Ratings that apply to each kind.
std::vector<efficiency_rating> ratings_for(system_kind kind) {
    using r = efficiency_rating;
    switch (kind) {
        case system_kind::furnace:
        case system_kind::boiler: return {r::afue, r::thermal, r::seasonal_gcv, r::seasonal_ncv};
        case system_kind::stove: return {r::thermal, r::seasonal_gcv, r::seasonal_ncv};
        case system_kind::electric_resistance: return {r::cop, r::thermal};
        case system_kind::air_source_heat_pump: return {r::hspf2, r::hspf, r::scop, r::cop};
        case system_kind::ground_source_heat_pump: return {r::cop, r::scop, r::hspf2, r::hspf};
    }
    return {};
}

std::string percent(double fraction) { return format_fixed(fraction * 100.0, 1) + " %"; }

rated_efficiency load_rated(const nlohmann::json& item) {
    return {item.at("value").get<double>(), parse_rating(item.at("rating").get<std::string>()),
            item.at("source").get<std::string>()};
}

}  // namespace

std::string_view kind_name(system_kind kind) {
    for (const auto& entry : kinds)
        if (entry.kind == kind) return entry.name;
    return "furnace";
}

system_kind parse_kind(const std::string& text, const std::string& path) {
    std::string known;
    for (const auto& entry : kinds) {
        if (text == entry.name) return entry.kind;
        known += (known.empty() ? "" : ", ") + std::string(entry.name);
    }
    throw input_error(path, "unknown system kind \"" + text + "\"; known kinds: " + known);
}

std::string_view rating_name(efficiency_rating rating) {
    for (const auto& entry : ratings)
        if (entry.rating == rating) return entry.name;
    return "AFUE";
}

efficiency_rating parse_rating(const std::string& text, const std::string& path) {
    std::string known;
    for (const auto& entry : ratings) {
        if (text == entry.name) return entry.rating;
        known += (known.empty() ? "" : ", ") + std::string(entry.name);
    }
    throw input_error(path, "unknown efficiency rating \"" + text + "\"; accepted: " + known);
}

bool is_heat_pump(system_kind kind) {
    return kind == system_kind::air_source_heat_pump || kind == system_kind::ground_source_heat_pump;
}

bool is_fuel_gas(const fuel_record& fuel) { return fuel.category == fuel_category::gas || fuel.id == "propane"; }

double gas_altitude_derating(double elevation_ft) {
    if (elevation_ft <= 2000) return 0.0;
    return std::min(1.0, 0.04 * elevation_ft / 1000.0);
}

bool burns_fuel(system_kind kind) { return !is_heat_pump(kind) && kind != system_kind::electric_resistance; }

const std::vector<system_record>& system_table() {
    static const std::vector<system_record> table = [] {
        std::vector<system_record> records;
        const auto doc = nlohmann::json::parse(detail::embedded_file("systems.json"));
        for (const auto& item : doc.at("systems")) {
            system_record record{item.at("id").get<std::string>(),
                                 parse_kind(item.at("kind").get<std::string>()),
                                 item.at("variant").get<std::string>(),
                                 item.at("fuels").get<std::vector<std::string>>(),
                                 {},
                                 load_rated(item.at("typical")),
                                 load_rated(item.at("minimum")),
                                 0.0,
                                 false,
                                 {},
                                 0.0,
                                 {}};
            for (const auto& rating : item.at("ratings")) record.ratings.push_back(parse_rating(rating.get<std::string>()));
            if (item.contains("auxiliary_electricity")) {
                const auto& aux = item.at("auxiliary_electricity");
                record.auxiliary_value = aux.at("value").get<double>();
                record.auxiliary_watts = aux.at("unit").get<std::string>() == "W";
                const auto key = aux.at("source").get<std::string>();
                record.auxiliary_source = doc.at("sources").contains(key) ? doc.at("sources").at(key).get<std::string>() : key;
            }
            if (item.contains("service_life")) {
                const auto& life = item.at("service_life");
                record.service_life_years = life.at("years").get<double>();
                const auto key = life.at("source").get<std::string>();
                record.service_life_source = doc.at("sources").contains(key) ? doc.at("sources").at(key).get<std::string>() : key;
            }
            records.push_back(std::move(record));
        }
        return records;
    }();
    return table;
}

const system_record* typical_system_for(system_kind kind, const std::string& fuel_id, double efficiency_value,
                                        efficiency_rating rating) {
    const system_record* best = nullptr;
    double best_gap = INFINITY;
    for (const auto& record : system_table()) {
        if (record.kind != kind || std::find(record.fuels.begin(), record.fuels.end(), fuel_id) == record.fuels.end()) continue;
        const double gap = record.typical.rating == rating ? std::fabs(record.typical.value - efficiency_value) : 1e9;
        if (!best || gap < best_gap) {
            best = &record;
            best_gap = gap;
        }
    }
    return best;
}

const system_record& find_system(const std::string& id, const std::string& path) {
    std::string known;
    for (const auto& record : system_table()) {
        if (record.id == id) return record;
        known += (known.empty() ? "" : ", ") + record.id;
    }
    throw input_error(path, "unknown system \"" + id + "\"; known systems: " + known);
}

seasonal_efficiency seasonal_efficiency_hhv(const system_request& request, const fuel_record& fuel,
                                            const std::string& path) {
    const std::string value_path = path + "/efficiency/value";
    const std::string rating_path = path + "/efficiency/rating";
    const double v = request.efficiency_value;
    const auto rating = std::string(rating_name(request.rating));
    const auto kind = std::string(kind_name(request.kind));
    const auto allowed = ratings_for(request.kind);
    if (std::find(allowed.begin(), allowed.end(), request.rating) == allowed.end()) {
        std::string list;
        for (auto r : allowed) list += (list.empty() ? "" : ", ") + std::string(rating_name(r));
        throw input_error(rating_path, rating + " does not apply to " + with_article(kind) + "; " + with_article(kind) +
                                          " is rated by " + list);
    }
    if (!std::isfinite(v) || v <= 0)
        throw input_error(value_path, "efficiency must be a positive number, got " + format_number(v));
    const bool electric_fuel = fuel.category == fuel_category::electricity;
    if (!burns_fuel(request.kind) && !electric_fuel)
        throw input_error(path + "/kind", with_article(kind) + " runs on electricity, not " + fuel.id);
    if (burns_fuel(request.kind) && electric_fuel)
        throw input_error(path + "/kind", with_article(kind) + " burns fuel; electricity needs an electric-resistance or "
                                          "heat-pump system");
    seasonal_efficiency out;
    switch (request.rating) {
        case efficiency_rating::afue:
        case efficiency_rating::thermal:
        case efficiency_rating::seasonal_gcv: {
            if (request.kind == system_kind::electric_resistance) {
                if (v != 100)
                    throw input_error(value_path, "electric resistance turns each kWh into one kWh of heat: thermal "
                                                  "efficiency is 100 % by definition, got " + format_number(v));
            } else if (v > 100) {
                throw input_error(value_path, rating + " cannot exceed 100 % on the gross (HHV) basis, got " +
                                                  format_number(v) + " %");
            } else if (v < 1) {
                throw input_error(value_path,
                                  rating + " must be from 1 to 100 % (95 for 95 %), got " + format_number(v));
            }
            out.rated_hhv_basis = v / 100.0;
            if (request.rating == efficiency_rating::afue)
                out.trace.push_back(format_number(v) + " % AFUE = " + format_fixed(out.rated_hhv_basis, 3) +
                                    " seasonal efficiency (AFUE is annual output over annual fuel input on the HHV "
                                    "basis, cycling losses included, fan and pump electricity excluded)");
            else if (request.rating == efficiency_rating::thermal) {
                out.trace.push_back(format_number(v) + " % steady-state thermal efficiency (HHV basis) taken as seasonal");
                if (burns_fuel(request.kind))
                    out.warnings.push_back("steady-state thermal efficiency omits cycling and standby losses; the "
                                           "seasonal efficiency is lower");
            } else
                out.trace.push_back(format_number(v) + " % seasonal efficiency on the gross (GCV = HHV) basis");
            break;
        }
        case efficiency_rating::seasonal_ncv: {
            if (v < 1)
                throw input_error(value_path, rating + " must be at least 1 % (95 for 95 %), got " + format_number(v));
            const double gross = v / 100.0 * fuel.lhv_over_hhv;
            out.trace.push_back(format_number(v) + " % seasonal (net, NCV basis) x LHV/HHV " +
                                format_fixed(fuel.lhv_over_hhv, 4) + " of " + fuel.id + " = " + percent(gross) +
                                " on the gross (HHV) basis (a net-basis efficiency omits the latent heat of the flue "
                                "water, so condensing appliances can exceed 100 % on it)");
            if (gross > 1.0)
                throw input_error(value_path, format_number(v) + " % on the net basis is " + percent(gross) +
                                                  " on the gross basis for " + fuel.id +
                                                  "; more than 100 % of the HHV is impossible");
            out.rated_hhv_basis = gross;
            break;
        }
        case efficiency_rating::cop:
        case efficiency_rating::scop: {
            if (request.kind == system_kind::electric_resistance) {
                if (v != 1)
                    throw input_error(value_path, "electric resistance has a COP of 1 by definition, got " + format_number(v));
                out.trace.push_back("electric resistance: 1 kWh of electricity = 1 kWh of heat (COP 1)");
            } else {
                if (v < 1)
                    throw input_error(value_path, "a heat pump's " + rating + " cannot be below 1 (it would deliver "
                                                  "less heat than resistance heating), got " + format_number(v));
                out.trace.push_back(request.rating == efficiency_rating::scop
                                        ? "SCOP " + format_number(v) + " (EN 14825 seasonal COP) taken as the seasonal COP"
                                        : "COP " + format_number(v) + " taken as the seasonal COP (one COP for the "
                                          "whole season; a rating at one test point overstates it in cold weather)");
            }
            if (v > 8) out.warnings.push_back(rating + " " + format_number(v) + " is unusually high; check the data sheet");
            out.rated_hhv_basis = v;
            break;
        }
        case efficiency_rating::hspf:
        case efficiency_rating::hspf2: {
            const double cop = v / btu_per_wh;
            if (cop < 1)
                throw input_error(value_path, rating + " " + format_number(v) + " Btu/Wh is a seasonal COP of " +
                                                  format_fixed(cop, 2) + "; a heat pump cannot be below COP 1 (" + rating +
                                                  " 3.41)");
            std::string line = rating + " " + format_number(v) + " Btu/Wh / 3.412 Btu/Wh = seasonal COP " + format_fixed(cop, 2);
            if (request.rating == efficiency_rating::hspf2)
                line += " (HSPF2 comes from the 2023 test procedure, 10 CFR 430 Appendix M1, with higher external "
                        "static pressure and a colder load line than HSPF; for split systems HSPF2 is about 0.85 x HSPF)";
            out.trace.push_back(line);
            if (v > 15) out.warnings.push_back(rating + " " + format_number(v) + " is unusually high; check the data sheet");
            out.rated_hhv_basis = cop;
            break;
        }
    }
    if (!(request.distribution_loss >= 0 && request.distribution_loss < 1))
        throw input_error(path + "/distribution_loss",
                          "must be a fraction from 0 to below 1, got " + format_number(request.distribution_loss));
    if (!(request.age_derating >= 0 && request.age_derating < 1))
        throw input_error(path + "/age_derating",
                          "must be a fraction from 0 to below 1, got " + format_number(request.age_derating));
    out.hhv_basis = out.rated_hhv_basis * (1 - request.age_derating) * (1 - request.distribution_loss);
    if (request.age_derating > 0)
        out.trace.push_back("age derating " + percent(request.age_derating) + ": x " + format_fixed(1 - request.age_derating, 3));
    if (request.distribution_loss > 0)
        out.trace.push_back("distribution loss " + percent(request.distribution_loss) + " (ducts or pipes): x " +
                            format_fixed(1 - request.distribution_loss, 3));
    if (request.age_derating > 0 || request.distribution_loss > 0)
        out.trace.push_back("delivered seasonal efficiency " + (is_heat_pump(request.kind) || !burns_fuel(request.kind)
                                                                   ? "COP " + format_fixed(out.hhv_basis, 3)
                                                                   : percent(out.hhv_basis)));
    return out;
}

}  // namespace fw

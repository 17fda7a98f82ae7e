#include "fw/api.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <nlohmann/json.hpp>

#include "climate/demand.hpp"
#include "base/error.hpp"
#include "supply/fuels.hpp"
#include "json/json_fields.hpp"
#include "json/scenario_reader.hpp"
#include "supply/systems.hpp"
#include "base/units.hpp"

namespace fw {

using nlohmann::json;
using namespace json_fields;

namespace {

/// Collects every problem instead of stopping at the first.
struct checker {
    std::vector<issue> errors, warnings;
    void error(const std::string& path, const std::string& message) { errors.push_back({path, message}); }
    template <typename Body>
    void attempt(Body body) {
        collect_errors(errors, body);
    }
};

void only_keys(const json& obj, const std::vector<std::string>& known, const std::string& path, checker& c) {
    for (const auto& item : obj.items())
        if (std::find(known.begin(), known.end(), item.key()) == known.end()) {
            std::string list;
            for (const auto& k : known) list += (list.empty() ? "" : ", ") + k;
            c.error(path + "/" + item.key(), "unknown field; accepted here: " + list);
        }
}

double positive_amount(const json& obj, const std::string& key, const std::string& path, bool allow_zero = false) {
    const auto value = optional_number(obj, key, path);
    if (!value) throw input_error(path + "/" + key, "is required (a number)");
    if (allow_zero ? *value < 0 : *value <= 0)
        throw input_error(path + "/" + key, std::string("must be ") + (allow_zero ? ">= 0" : "> 0") + ", got " + format_number(*value));
    return *value;
}

/** Whether `logo` names an image on the kiosk's own site (a relative path to .svg/.png/.jpg/.jpeg/.webp) or is a data:image URL. */
bool is_site_image(const std::string& logo) {
    for (const std::string prefix : {"data:image/png;base64,", "data:image/jpeg;base64,", "data:image/webp;base64,", "data:image/svg+xml;base64,"}) {
        if (logo.rfind(prefix, 0) != 0) continue;
        // checked character by character (a regex over a long data URL would recurse once per character)
        return logo.size() > prefix.size() && logo.size() <= 200000 &&
               std::all_of(logo.begin() + static_cast<std::ptrdiff_t>(prefix.size()), logo.end(),
                           [](char ch) { return std::isalnum(static_cast<unsigned char>(ch)) || ch == '+' || ch == '/' || ch == '='; });
    }
    // a relative path of letters, digits, '_', '-', '.' and '/' (not starting with one of "./-", no "..", no "//")
    // ending in an image extension; checked by hand (std::regex would add about 100 kB to the WebAssembly module)
    if (logo.empty() || logo.size() > 200 || logo.find("..") != std::string::npos || logo.find("//") != std::string::npos) return false;
    const auto ok_char = [](char ch) { return std::isalnum(static_cast<unsigned char>(ch)) || ch == '_' || ch == '-' || ch == '.' || ch == '/'; };
    if (!std::isalnum(static_cast<unsigned char>(logo[0])) && logo[0] != '_') return false;
    if (!std::all_of(logo.begin(), logo.end(), ok_char)) return false;
    std::string lower(logo);
    std::transform(lower.begin(), lower.end(), lower.begin(), [](unsigned char ch) { return static_cast<char>(std::tolower(ch)); });
    for (const std::string ext : {".svg", ".png", ".jpg", ".jpeg", ".webp"})
        if (lower.size() > ext.size() && lower.compare(lower.size() - ext.size(), ext.size(), ext) == 0) return true;
    return false;
}

void check_price(const json& item, const std::string& path, const std::string& currency, checker& c, json& summary) {
    require_object(item, path);
    only_keys(item, {"fuel", "unit", "amount", "tiers", "schedule", "fixed_charges", "delivery_minimum", "note"}, path, c);
    const auto fuel_id = required_string(item, "fuel", path);
    const auto& fuel = find_fuel(fuel_id, path + "/fuel");
    const auto unit = required_string(item, "unit", path);
    heating_value_per_sale_unit(fuel, unit, {}, path + "/unit");
    const bool tiered = item.contains("tiers");
    const bool scheduled = item.contains("schedule");
    if (scheduled) {
        // Time of use, read as a scenario's electricity price reads it.
        if (fuel.category != fuel_category::electricity)
            throw input_error(path + "/schedule", "a time-of-use schedule prices electricity; " + fuel_id + " is priced by amount");
        if (unit != "kWh") throw input_error(path + "/unit", "must be kWh with a schedule, got \"" + unit + "\"");
        if (tiered) throw input_error(path + "/schedule", "give tiers (block rates) or a schedule (time of use), not both");
        if (item.contains("amount")) throw input_error(path + "/amount", "give amount (one price) or schedule (time of use), not both");
        read_price_schedule(item.at("schedule"), path + "/schedule", c.warnings);
    }
    double amount = 0;
    if (!scheduled && (!tiered || item.contains("amount"))) amount = positive_amount(item, "amount", path);
    if (tiered) {
        const auto& tiers = item.at("tiers");
        if (!tiers.is_array() || tiers.empty()) throw input_error(path + "/tiers", "must be a non-empty array of {from, to, amount}");
        double previous_to = 0;
        for (std::size_t i = 0; i < tiers.size(); ++i) {
            const std::string tier_path = path + "/tiers/" + std::to_string(i);
            const auto& tier = tiers[i];
            require_object(tier, tier_path);
            only_keys(tier, {"from", "to", "amount"}, tier_path, c);
            const double from = positive_amount(tier, "from", tier_path, true);
            const bool open = !tier.contains("to") || tier.at("to").is_null();
            const double to = open ? INFINITY : positive_amount(tier, "to", tier_path);
            positive_amount(tier, "amount", tier_path);
            if (i == 0 && from != 0) c.error(tier_path + "/from", "the first tier must start at 0, got " + format_number(from));
            if (i > 0 && from < previous_to)
                c.error(tier_path + "/from", "tiers overlap: this tier starts at " + format_number(from) +
                                                 " but the one before ends at " + format_number(previous_to));
            else if (i > 0 && from > previous_to)
                c.error(tier_path + "/from", "a gap between tiers: this tier starts at " + format_number(from) +
                                                 " but the one before ends at " + format_number(previous_to));
            if (!(to > from)) c.error(tier_path + "/to", "must be above from (" + format_number(from) + "), got " + format_number(to));
            if (open && i + 1 < tiers.size()) c.error(tier_path + "/to", "only the last tier may be open-ended");
            previous_to = to;
        }
    }
    if (item.contains("fixed_charges")) {
        const auto& charges = item.at("fixed_charges");
        if (!charges.is_array()) throw input_error(path + "/fixed_charges", "must be an array");
        for (std::size_t i = 0; i < charges.size(); ++i) {
            const std::string charge_path = path + "/fixed_charges/" + std::to_string(i);
            require_object(charges[i], charge_path);
            only_keys(charges[i], {"label", "amount_per_month", "amount_per_year"}, charge_path, c);
            required_string(charges[i], "label", charge_path);
            const bool monthly = charges[i].contains("amount_per_month"), yearly = charges[i].contains("amount_per_year");
            if (monthly == yearly) throw input_error(charge_path, "give either amount_per_month or amount_per_year");
            positive_amount(charges[i], monthly ? "amount_per_month" : "amount_per_year", charge_path, true);
        }
    }
    if (item.contains("delivery_minimum")) {
        const auto& minimum = item.at("delivery_minimum");
        require_object(minimum, path + "/delivery_minimum");
        only_keys(minimum, {"value", "unit"}, path + "/delivery_minimum", c);
        positive_amount(minimum, "value", path + "/delivery_minimum");
        const auto minimum_unit = required_string(minimum, "unit", path + "/delivery_minimum");
        heating_value_per_sale_unit(fuel, minimum_unit, {}, path + "/delivery_minimum/unit");
    }
    if (amount > 0 && fuel.category == fuel_category::electricity && amount > 5)
        c.warnings.push_back({path + "/amount", "electricity above 5 " + currency + "/kWh looks like a typing error"});
    json entry = item;
    entry["tiered"] = tiered;
    entry["scheduled"] = scheduled;
    summary.push_back(entry);
}

}  // namespace

std::string check_prices_json(const std::string& text, const std::string& today) noexcept {
    checker c;
    json out = {{"valid", false}, {"expired", false}};
    try {
        const auto doc = parse_request(text);
        require_object(doc, "");
        only_keys(doc, {"schema", "supplier", "currency", "effective", "expires", "prices", "offer", "climate", "notes"}, "", c);
        c.attempt([&] {
            const auto schema = optional_string(doc, "schema", "");
            if (!schema) throw input_error("/schema", "is required: \"fuelwright.prices/1\"");
            if (*schema != "fuelwright.prices/1")
                throw input_error("/schema", "unsupported schema \"" + *schema + "\"; this version reads fuelwright.prices/1");
        });
        c.attempt([&] {
            if (!doc.contains("supplier")) throw input_error("/supplier", "is required ({name, contact})");
            const auto& supplier = doc.at("supplier");
            require_object(supplier, "/supplier");
            only_keys(supplier, {"name", "contact", "quote_text", "phone", "help_text", "logo"}, "/supplier", c);
            out["supplier"] = required_string(supplier, "name", "/supplier");
            optional_string(supplier, "contact", "/supplier");
            optional_string(supplier, "quote_text", "/supplier");
            optional_string(supplier, "phone", "/supplier");
            optional_string(supplier, "help_text", "/supplier");
            if (const auto logo = optional_string(supplier, "logo", "/supplier"); logo && !is_site_image(*logo))
                throw input_error("/supplier/logo",
                                  "must be an image file on this site (e.g. logo.svg or images/logo.png: .svg, .png, .jpg or .webp, "
                                  "no address elsewhere) or a data:image URL");
        });
        std::string currency = "USD";
        c.attempt([&] {
            currency = required_string(doc, "currency", "");
            const bool code = currency.size() == 3 &&
                              std::all_of(currency.begin(), currency.end(), [](char ch) { return ch >= 'A' && ch <= 'Z'; });
            if (!code) throw input_error("/currency", "must be an ISO 4217 code of three capital letters, got \"" + currency + "\"");
            out["currency"] = currency;
        });
        long effective = 0, expires = 0;
        bool dates = true;
        c.attempt([&] {
            try {
                const auto text_effective = required_string(doc, "effective", "");
                effective = parse_day_number(text_effective, "/effective");
                out["effective"] = text_effective;
            } catch (...) {
                dates = false;
                throw;
            }
        });
        c.attempt([&] {
            try {
                const auto text_expires = required_string(doc, "expires", "");
                expires = parse_day_number(text_expires, "/expires");
                out["expires"] = text_expires;
            } catch (...) {
                dates = false;
                throw;
            }
        });
        if (dates && expires <= effective)
            c.error("/expires", "the expiry date " + out["expires"].get<std::string>() + " must come after the effective date " +
                                    out["effective"].get<std::string>());
        if (dates && !today.empty()) {
            c.attempt([&] {
                const long now = parse_day_number(today, "/today");
                if (now > expires) {
                    out["expired"] = true;
                    throw input_error("/expires", "this price file expired on " + out["expires"].get<std::string>() +
                                                      "; publish a current one");
                }
                if (now < effective)
                    c.warnings.push_back({"/effective", "not yet in effect: prices apply from " + out["effective"].get<std::string>()});
            });
        }
        json summary = json::array();
        c.attempt([&] {
            if (!doc.contains("prices") || !doc.at("prices").is_array() || doc.at("prices").empty())
                throw input_error("/prices", "needs at least one price {fuel, unit, amount}");
            const auto& prices = doc.at("prices");
            std::vector<std::string> seen;
            for (std::size_t i = 0; i < prices.size(); ++i) {
                const std::string path = "/prices/" + std::to_string(i);
                c.attempt([&] {
                    check_price(prices[i], path, currency, c, summary);
                    const auto key = prices[i].value("fuel", "") + " per " + prices[i].value("unit", "");
                    if (std::find(seen.begin(), seen.end(), key) != seen.end())
                        throw input_error(path, "a second price for " + key);
                    seen.push_back(key);
                });
            }
        });
        out["prices"] = summary;
        c.attempt([&] {
            if (!doc.contains("offer")) return;
            const auto& offer = doc.at("offer");
            require_object(offer, "/offer");
            only_keys(offer, {"fuels", "systems"}, "/offer", c);
            if (offer.contains("fuels")) {
                if (!offer.at("fuels").is_array()) throw input_error("/offer/fuels", "must be an array of fuel ids");
                for (std::size_t i = 0; i < offer.at("fuels").size(); ++i) {
                    const auto& id = offer.at("fuels")[i];
                    if (!id.is_string()) throw input_error("/offer/fuels/" + std::to_string(i), "must be a fuel id");
                    find_fuel(id.get<std::string>(), "/offer/fuels/" + std::to_string(i));
                }
            }
            if (offer.contains("systems")) {
                if (!offer.at("systems").is_array()) throw input_error("/offer/systems", "must be an array of system ids");
                for (std::size_t i = 0; i < offer.at("systems").size(); ++i) {
                    const auto& id = offer.at("systems")[i];
                    if (!id.is_string()) throw input_error("/offer/systems/" + std::to_string(i), "must be a system id");
                    find_system(id.get<std::string>(), "/offer/systems/" + std::to_string(i));
                }
            }
        });
        // The climate of the supplier's area, the same object as a scenario's climate, read as a scenario reads it.
        c.attempt([&] {
            if (!doc.contains("climate")) return;
            read_climate(doc.at("climate"), c.warnings);
            out["climate"] = doc.at("climate");
        });
    } catch (const input_error& e) {
        for (const auto& found : e.issues()) c.error(found.path, found.message);
    } catch (const std::exception& e) {
        c.error("", std::string("internal error: ") + e.what());
    }
    out["valid"] = c.errors.empty();
    out["errors"] = issues_json(c.errors);
    out["warnings"] = issues_json(c.warnings);
    return dump_text(out);
}

}  // namespace fw

// Plausibility warnings: the slips a user makes (a fraction typed for a percentage, a price or a
// capacity in the wrong unit) that the hard limits still let through.
#include "model/plausibility.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <string_view>

#include "base/units.hpp"

namespace fw {
namespace {

/// [%] Below this a furnace, boiler or stove burns more fuel than any in use (common practice: the
/// oldest gravity furnaces and boilers still running rate about 50-60 % AFUE).
constexpr double lowest_fuel_efficiency_pct = 50;
/// [%] Above this a furnace or boiler condenses its flue gas (common practice: non-condensing appliances rate
/// about 78-85 % AFUE, condensing ones 90 % and more; 88 leaves room for the best non-condensing boilers).
constexpr double highest_non_condensing_pct = 88;
/// [kW] The smallest and largest heat pumps sold for one house, at 47 degF (common practice: the
/// smallest ductless heads are about 1.5 kW / 5,000 Btu/h; residential units stop at about 5 tons).
constexpr double smallest_heat_pump_kw = 1.5;
constexpr double largest_heat_pump_kw = 60;
/// [1/year] Households' real discount rates (common practice: 0-15 %; US federal energy appraisals
/// use about 3 % real).
constexpr double highest_discount_rate = 0.15;
/// [1/year] Real energy price escalation outside this band is no forecast any agency publishes (common practice).
constexpr double lowest_escalation = -0.10, highest_escalation = 0.15;

/// [currency/month] Above this a fixed charge is more than any household's service costs to keep (common
/// practice: residential customer charges are about 5-50 USD a month; in dollar-like currencies, ten times
/// that in crowns).
constexpr double highest_fixed_charge_per_month = 300;

/// `value` rounded to `digits` significant digits, for ranges in messages.
double round_to_significant(double value, int digits) {
    if (value == 0 || !std::isfinite(value)) return value;
    const double scale = std::pow(10.0, digits - 1 - std::floor(std::log10(std::fabs(value))));
    return std::round(value * scale) / scale;
}

bool is_percent_rating(efficiency_rating r) {
    return r == efficiency_rating::afue || r == efficiency_rating::thermal || r == efficiency_rating::seasonal_gcv ||
           r == efficiency_rating::seasonal_ncv;
}

std::string percent_text(double fraction) { return format_number(fraction * 100) + " %"; }

void check_efficiency(const scenario_option& o, std::vector<issue>& out) {
    if (!o.efficiency_given || !burns_fuel(o.system.kind) || !is_percent_rating(o.system.rating)) return;
    const double v = o.system.efficiency_value;
    // A non-condensing burner keeps its flue gas above the dew point, which caps it below condensing ratings.
    if (o.system_catalog && o.system.rating != efficiency_rating::seasonal_ncv) {
        const auto& record = find_system(*o.system_catalog);
        if (record.variant == "non-condensing" && v > highest_non_condensing_pct) {
            out.push_back({o.path + "/system/efficiency/value",
                           std::string(rating_name(o.system.rating)) + " " + format_number(v) + " % is a condensing rating; a non-condensing " +
                               std::string(o.system.kind == system_kind::boiler ? "boiler" : "furnace") + " rates at most about " +
                               format_number(highest_non_condensing_pct) + " %: check the rating, or choose the condensing type"});
            return;
        }
    }
    if (v >= lowest_fuel_efficiency_pct) return;
    const std::string text = std::string(rating_name(o.system.rating)) + " " + format_number(v) +
                       " % is below any furnace, boiler or stove in use (the oldest still running rate about 50-60 %)";
    out.push_back({o.path + "/system/efficiency/value", text + "; check the data sheet"});
}

void check_price(const scenario_option& o, const std::string& currency, std::vector<issue>& out) {
    const auto band = household_price_band(currency);
    if (o.price_per_unit == 0 && o.tiers.empty() && !o.schedule) {
        out.push_back({o.path + "/price/amount", "a price of 0 counts " + o.fuel.name + " as free; check the price"});
        return;
    }
    if (!band || !(o.price_per_unit > 0)) return;
    double hhv_j = 0;
    try {
        hhv_j = o.heating_value_override_j ? *o.heating_value_override_j
                                           : heating_value_per_sale_unit(o.fuel, o.price_unit, o.sale).hhv_j;
    } catch (const input_error&) {
        return;  // the priced unit is refused at its own field
    }
    if (!(hhv_j > 0)) return;
    const double per_kwh = o.price_per_unit / (hhv_j / 3.6e6);
    if (per_kwh >= band->low_per_kwh && per_kwh <= band->high_per_kwh) return;
    const double low = band->low_per_kwh * hhv_j / 3.6e6, high = band->high_per_kwh * hhv_j / 3.6e6;
    out.push_back({o.path + "/price/amount",
                   format_number(o.price_per_unit) + " " + currency + " per " + o.price_unit + " is " +
                       (per_kwh < band->low_per_kwh ? "below" : "above") + " what households pay for " + o.fuel.name +
                       " (about " + format_number(round_to_significant(low, 2)) + " to " +
                       format_number(round_to_significant(high, 2)) + " " + currency + " per " + o.price_unit + ", " +
                       format_number(band->low_per_kwh) + " to " + format_number(band->high_per_kwh) + " " + currency +
                       " per kWh of heat in the fuel); check the price and its unit"});
}

void check_fixed_charges(const scenario_option& o, const std::string& currency, std::vector<issue>& out) {
    const auto band = household_price_band(currency);
    if (!band) return;
    const double limit = highest_fixed_charge_per_month * band->money_scale;
    for (const auto& charge : o.fixed_charges)
        if (charge.amount_per_year / 12 > limit)
            out.push_back({charge.path, format_number(round_to_significant(charge.amount_per_year / 12, 3)) + " " + currency +
                                            " a month is more than a household's service costs to keep (at most about " +
                                            format_number(limit) + " " + currency + " a month); check the amount and whether it is per month or per year"});
}

void check_heat_pump_size(const scenario_option& o, std::vector<issue>& out) {
    if (!is_heat_pump(o.system.kind)) return;
    std::optional<double> kw = o.capacity_47_kw;
    std::string path = o.path + "/system/capacity/value";
    if (!kw && !o.ratings.empty()) {
        kw = std::max_element(o.ratings.begin(), o.ratings.end(), [](const auto& a, const auto& b) {
                 return a.capacity_kw < b.capacity_kw;
             })->capacity_kw;
        path = o.path + "/system/ratings";
    }
    if (!kw || (*kw >= smallest_heat_pump_kw && *kw <= largest_heat_pump_kw)) return;
    out.push_back({path, "a heat pump of " + format_number(round_to_significant(*kw, 3)) + " kW (" +
                             format_number(round_to_significant(convert(*kw, "kW", "Btu/h"), 3)) + " Btu/h) is " +
                             (*kw < smallest_heat_pump_kw ? "smaller" : "larger") +
                             " than any sold for a house (about 1.5 to 60 kW, 5,000 to 200,000 Btu/h); check the "
                             "capacity and its unit"});
}

void check_economics(const economics_settings& e, std::vector<issue>& out) {
    if (!e.given) return;
    if (e.discount_rate < 0 || e.discount_rate > highest_discount_rate)
        out.push_back({"/economics/discount_rate",
                       "a discount rate of " + percent_text(e.discount_rate) + " a year is outside what a household "
                       "uses (0 to 15 %; 3 % real is usual); it " +
                           (e.discount_rate < 0 ? "makes future costs weigh more than today's" : "all but ignores costs "
                                                                                                 "after the first years")});
    auto escalation = [&](double rate, const std::string& path) {
        if (rate < lowest_escalation || rate > highest_escalation)
            out.push_back({path, "an escalation of " + percent_text(rate) +
                                     " a year is outside any published price outlook (-10 to +15 % a year)"});
    };
    escalation(e.default_escalation, "/economics/escalation");
    for (const auto& [fuel, rate] : e.escalation) escalation(rate, "/economics/escalation/" + fuel);
}

}  // namespace

std::optional<price_band> household_price_band(const std::string& currency) {
    static constexpr std::array<std::string_view, 7> dollar_like{"USD", "CAD", "EUR", "GBP", "CHF", "AUD", "NZD"};
    static constexpr std::array<std::string_view, 3> krone_like{"SEK", "NOK", "DKK"};
    // [currency/kWh] Firewood bought by the cord is about 0.01 USD per kWh of heat in it, resistance heat at the
    // dearest tariffs about 0.7 (common practice); the band leaves room on both sides.
    const price_band dollar{0.003, 2.0};
    if (std::find(dollar_like.begin(), dollar_like.end(), currency) != dollar_like.end()) return dollar;
    if (std::find(krone_like.begin(), krone_like.end(), currency) != krone_like.end())
        return price_band{dollar.low_per_kwh * 10, dollar.high_per_kwh * 10, 10};
    return std::nullopt;
}

std::vector<issue> plausibility_warnings(const scenario& s) {
    std::vector<issue> out;
    for (const auto& o : s.options) {
        check_efficiency(o, out);
        check_price(o, s.settings.currency, out);
        check_fixed_charges(o, s.settings.currency, out);
        check_heat_pump_size(o, out);
    }
    if (s.economics) check_economics(*s.economics, out);
    return out;
}

}  // namespace fw

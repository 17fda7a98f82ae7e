// Plausibility (model layer): entries a scenario accepts but no house has, questioned rather than
// refused, each at the field it came from with the range a house has and why.
#pragma once
#include <vector>

#include "base/error.hpp"
#include "model/scenario.hpp"

namespace fw {

/// [currency/kWh of HHV] The range of energy prices households pay, for a currency of about a US dollar's
/// value (USD, CAD, EUR, GBP, CHF, AUD, NZD; SEK, NOK and DKK x 10); empty for other currencies.
struct price_band {
    double low_per_kwh = 0, high_per_kwh = 0;
    double money_scale = 1;  ///< [1] the currency's amounts against a dollar's (10 for crowns)
};
std::optional<price_band> household_price_band(const std::string& currency);

/// Warnings for entries outside what any house could have: a fuel-burning efficiency below 50 %, a price
/// per kWh of heating value outside the household band, a heat pump smaller than 1.5 kW or larger than
/// 60 kW at 47 degF, a discount rate below 0 or above 15 %, an escalation outside -10 to +15 % a year.
std::vector<issue> plausibility_warnings(const scenario& s);

}  // namespace fw

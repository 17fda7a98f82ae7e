// Life-cycle economics (economics layer): present-worth factors, capital recovery, payback,
// and the Monte Carlo draw engine. Conventions of NIST Handbook 135 (Fuller & Petersen, Life-Cycle
// Costing Manual for the Federal Energy Management Program, 1995): end-of-year cash flows, costs
// in year t = base-year cost x (1 + e)^t, discounted by (1 + d)^t.
#pragma once
#include <cstdint>
#include <functional>
#include <string>
#include <vector>

namespace fw {

/// [1] Uniform present worth: UPW = [1 - (1+d)^-N] / d; N when d = 0 (NIST Handbook 135).
double upw(double discount_rate, int years);

/// [1] Uniform present worth with escalation e: UPW* = (1+e)/(d-e) [1 - ((1+e)/(1+d))^N];
/// N when d = e (the series is then N equal present values) (NIST Handbook 135).
double upw_escalating(double discount_rate, double escalation, int years);

/// [1] Single present worth: SPW = (1+d)^-t.
double spw(double discount_rate, double years);

/// [1/year] Capital recovery factor CRF = d (1+d)^N / ((1+d)^N - 1); 1/N when d = 0.
double crf(double discount_rate, double years);

/// [years] First time the cumulative discounted savings (escalating at `escalation`) repay `net_cost`,
/// interpolated within the year; negative when not within `years`.
double discounted_payback_years(double net_cost, double annual_saving, double discount_rate, double escalation,
                                int years);

/// A reproducible random stream: std::mt19937_64 (its output is fixed by the C++ standard), turned
/// into uniform and standard-normal variates without implementation-defined distributions.
class random_stream {
public:
    explicit random_stream(std::uint64_t seed);
    double uniform();   ///< (0, 1)
    double normal();    ///< standard normal, Box-Muller
private:
    std::uint64_t state_[312];
    int index_;
    bool has_spare_ = false;
    double spare_ = 0;
    std::uint64_t next();
};

/// [value] The p-quantile (0..1) of sorted data, linear between order statistics (Hyndman & Fan type 7).
double quantile_sorted(const std::vector<double>& sorted, double p);

/// [value] The same quantiles of unsorted data for ascending p, found by selection (multiselect over std::nth_element) rather
/// than a full sort: O(n) per quantile; `values` is reordered.
std::vector<double> quantiles(std::vector<double>& values, const std::vector<double>& ascending_p);

}  // namespace fw

#include "fw/economics.hpp"

#include <algorithm>
#include <cmath>

namespace fw {

double upw(double d, int n) {
    if (std::fabs(d) < 1e-12) return n;
    return (1.0 - std::pow(1.0 + d, -n)) / d;
}

double upw_escalating(double d, double e, int n) {
    if (std::fabs(d - e) < 1e-12) return n * (1.0 + e) / (1.0 + d);
    const double r = (1.0 + e) / (1.0 + d);
    return (1.0 + e) / (d - e) * (1.0 - std::pow(r, n));
}

double spw(double d, double t) { return std::pow(1.0 + d, -t); }

double crf(double d, double n) {
    if (std::fabs(d) < 1e-12) return 1.0 / n;
    const double g = std::pow(1.0 + d, n);
    return d * g / (g - 1.0);
}

double discounted_payback_years(double net_cost, double saving, double d, double e, int years) {
    if (net_cost <= 0) return 0.0;
    double cumulative = 0;
    for (int t = 1; t <= years; ++t) {
        const double flow = saving * std::pow(1.0 + e, t) / std::pow(1.0 + d, t);
        if (cumulative + flow >= net_cost && flow > 0) return (t - 1) + (net_cost - cumulative) / flow;
        cumulative += flow;
    }
    return -1.0;
}

// MT19937-64 (Matsumoto & Nishimura), the parameters of std::mt19937_64.
random_stream::random_stream(std::uint64_t seed) : index_(312) {
    state_[0] = seed;
    for (int i = 1; i < 312; ++i)
        state_[i] = 6364136223846793005ULL * (state_[i - 1] ^ (state_[i - 1] >> 62)) + static_cast<std::uint64_t>(i);
}

std::uint64_t random_stream::next() {
    constexpr std::uint64_t upper = 0xFFFFFFFF80000000ULL, lower = 0x7FFFFFFFULL;
    if (index_ >= 312) {
        for (int i = 0; i < 312; ++i) {
            const std::uint64_t x = (state_[i] & upper) | (state_[(i + 1) % 312] & lower);
            std::uint64_t xa = x >> 1;
            if (x & 1ULL) xa ^= 0xB5026F5AA96619E9ULL;
            state_[i] = state_[(i + 156) % 312] ^ xa;
        }
        index_ = 0;
    }
    std::uint64_t x = state_[index_++];
    x ^= (x >> 29) & 0x5555555555555555ULL;
    x ^= (x << 17) & 0x71D67FFFEDA60000ULL;
    x ^= (x << 37) & 0xFFF7EEE000000000ULL;
    x ^= x >> 43;
    return x;
}

double random_stream::uniform() { return (static_cast<double>(next() >> 11) + 0.5) * 0x1.0p-53; }

double random_stream::normal() {
    if (has_spare_) {
        has_spare_ = false;
        return spare_;
    }
    const double u1 = uniform(), u2 = uniform();
    const double radius = std::sqrt(-2.0 * std::log(u1));
    const double angle = 6.283185307179586476925 * u2;
    spare_ = radius * std::sin(angle);
    has_spare_ = true;
    return radius * std::cos(angle);
}

double quantile_sorted(const std::vector<double>& sorted, double p) {
    if (sorted.empty()) return 0.0;
    const double h = (sorted.size() - 1) * p;
    const auto lo = static_cast<std::size_t>(std::floor(h));
    const auto hi = std::min(lo + 1, sorted.size() - 1);
    return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}

std::vector<double> quantiles(std::vector<double>& values, const std::vector<double>& ascending_p) {
    std::vector<double> out;
    if (values.empty()) return std::vector<double>(ascending_p.size(), 0.0);
    // After each selection the values from the p-th order statistic on lie at or after it.
    auto from = values.begin();
    for (double p : ascending_p) {
        const double h = (values.size() - 1) * p;
        const auto lo = static_cast<std::ptrdiff_t>(std::floor(h));
        const auto nth = values.begin() + lo;
        std::nth_element(from, nth, values.end());
        const double a = *nth;
        const double b = nth + 1 == values.end() ? a : *std::min_element(nth + 1, values.end());
        out.push_back(a + (h - static_cast<double>(lo)) * (b - a));
        from = nth;
    }
    return out;
}

}  // namespace fw

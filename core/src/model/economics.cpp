#include "model/economics.hpp"

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

namespace {

/// Puts the order statistics at the sorted indices [first, last) of `values` in place, within [lo, hi):
/// selects the middle one, then the others in the part below or above it (Hoare's multiselect).
void multiselect(std::vector<double>& values, std::size_t lo, std::size_t hi, const std::size_t* first, const std::size_t* last) {
    if (first == last || hi - lo < 2) return;
    const std::size_t* middle = first + (last - first) / 2;
    std::nth_element(values.begin() + static_cast<std::ptrdiff_t>(lo), values.begin() + static_cast<std::ptrdiff_t>(*middle),
                     values.begin() + static_cast<std::ptrdiff_t>(hi));
    multiselect(values, lo, *middle, first, middle);
    multiselect(values, *middle + 1, hi, middle + 1, last);
}

}  // namespace

std::vector<double> quantiles(std::vector<double>& values, const std::vector<double>& ascending_p) {
    if (values.empty()) return std::vector<double>(ascending_p.size(), 0.0);
    // Each quantile needs the order statistics k = floor(h) and k + 1, h = (n - 1) p: the k are selected,
    // and each k + 1 is the smallest value between its k and the next selected one.
    const std::size_t n = values.size();
    std::vector<std::size_t> ks;
    for (double p : ascending_p) ks.push_back(static_cast<std::size_t>(std::floor((n - 1) * p)));
    std::vector<std::size_t> distinct = ks;
    distinct.erase(std::unique(distinct.begin(), distinct.end()), distinct.end());
    multiselect(values, 0, n, distinct.data(), distinct.data() + distinct.size());
    std::vector<double> out;
    for (std::size_t i = 0; i < ks.size(); ++i) {
        const std::size_t k = ks[i];
        const auto next = std::upper_bound(distinct.begin(), distinct.end(), k);
        const std::size_t end = next == distinct.end() ? n : *next;
        const auto begin = values.begin() + static_cast<std::ptrdiff_t>(k + 1);
        const double a = values[k];
        const double b = k + 1 >= n ? a : k + 1 == end ? values[end] : *std::min_element(begin, values.begin() + static_cast<std::ptrdiff_t>(end));
        out.push_back(a + ((n - 1) * ascending_p[i] - static_cast<double>(k)) * (b - a));
    }
    return out;
}

}  // namespace fw

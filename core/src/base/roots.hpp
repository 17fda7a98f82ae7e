// One-dimensional root finding shared by the layers above (no dependencies).
#pragma once

#include <algorithm>
#include <cmath>

namespace fw {

/// A root of f in [lo, hi], given f(lo) and f(hi) of opposite signs (or one of them zero), by the Illinois
/// method (modified regula falsi: Dowell & Jarratt, BIT 11 (1971) 168-174). The bracket is kept, so it
/// converges wherever bisection would, and in a few steps on smooth or piecewise-linear f. Stops when
/// |f| <= f_tolerance, the bracket is 1e-13 relative wide, or no double lies between the ends.
template <typename F>
double illinois_root(F f, double lo, double hi, double f_lo, double f_hi, double f_tolerance = 0.0) {
    if (f_lo == 0) return lo;
    if (f_hi == 0) return hi;
    int kept = 0;  // +1: hi kept by the last step, -1: lo kept
    for (int i = 0; i < 200 && hi - lo > 1e-13 * std::max(std::fabs(lo), std::fabs(hi)); ++i) {
        double x = lo - f_lo * (hi - lo) / (f_hi - f_lo);
        if (!(x > lo && x < hi)) x = 0.5 * (lo + hi);
        if (x <= lo || x >= hi) break;
        const double fx = f(x);
        if (std::fabs(fx) <= f_tolerance) return x;
        if ((fx < 0) == (f_lo < 0)) {
            lo = x;
            f_lo = fx;
            if (kept == 1) f_hi *= 0.5;
            kept = 1;
        } else {
            hi = x;
            f_hi = fx;
            if (kept == -1) f_lo *= 0.5;
            kept = -1;
        }
    }
    return 0.5 * (lo + hi);
}

}  // namespace fw

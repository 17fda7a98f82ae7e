#include "base/error.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>

namespace fw {

input_error::input_error(std::string path, std::string message)
    : std::runtime_error(path.empty() ? message : path + ": " + message), issues_{{std::move(path), std::move(message)}} {}

input_error::input_error(std::vector<issue> issues)
    : std::runtime_error(issues.empty() ? std::string("input error") : format_issue(issues.front())),
      issues_(issues.empty() ? std::vector<issue>{{"", "input error"}} : std::move(issues)) {}

std::string format_issue(const issue& item) {
    return item.path.empty() ? item.message : item.path + ": " + item.message;
}

// std::to_chars gives the same digits as printf's %.*f and %.*g (C++17 [charconv.to.chars]) and is
// several times faster; where the standard library lacks it for floating point (__cpp_lib_to_chars
// unset, as in Emscripten 3.1.6's libc++), printf itself is used.

std::string format_fixed(double value, int decimals) {
    char buffer[400];  // DBL_MAX has 309 integer digits
    decimals = std::clamp(decimals, 0, 60);
#if defined(__cpp_lib_to_chars)
    const auto done = std::to_chars(buffer, buffer + sizeof buffer, value, std::chars_format::fixed, decimals);
    return std::string(buffer, done.ptr);
#else
    std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
    return buffer;
#endif
}

std::string format_number(double value) {
    if (std::isnan(value)) return "NaN";
    if (std::isinf(value)) return value > 0 ? "Infinity" : "-Infinity";
    char buffer[64];
#if defined(__cpp_lib_to_chars)
    const auto done = std::to_chars(buffer, buffer + sizeof buffer, value, std::chars_format::general, 6);
    return std::string(buffer, done.ptr);
#else
    std::snprintf(buffer, sizeof buffer, "%.6g", value);
    return buffer;
#endif
}

std::string with_article(const std::string& noun) {
    const bool vowel = !noun.empty() && std::string("aeiou").find(noun[0]) != std::string::npos;
    return (vowel ? "an " : "a ") + noun;
}

}  // namespace fw

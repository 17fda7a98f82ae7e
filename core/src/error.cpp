#include "fw/error.hpp"

#include <cmath>
#include <cstdio>

namespace fw {

input_error::input_error(std::string path, std::string message)
    : std::runtime_error(path.empty() ? message : path + ": " + message),
      path_(std::move(path)),
      message_(std::move(message)) {}

std::string format_issue(const issue& item) {
    return item.path.empty() ? item.message : item.path + ": " + item.message;
}

std::string format_fixed(double value, int decimals) {
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.*f", decimals, value);
    return buffer;
}

std::string format_number(double value) {
    if (std::isnan(value)) return "NaN";
    if (std::isinf(value)) return value > 0 ? "Infinity" : "-Infinity";
    char buffer[64];
    std::snprintf(buffer, sizeof buffer, "%.6g", value);
    return buffer;
}

}  // namespace fw

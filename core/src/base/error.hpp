// One error shape for the whole core: where in the input (a JSON pointer) and what is wrong.
#pragma once
#include <stdexcept>
#include <string>
#include <vector>

namespace fw {

/// A problem found in an input: `path` is a JSON pointer into the request ("/options/2/price/amount").
struct issue {
    std::string path;
    std::string message;
};

/// Thrown inside the core for invalid input; entry points catch it and return its `issues()`.
class input_error : public std::runtime_error {
public:
    input_error(std::string path, std::string message);
    /// Several problems found together (every row of a list read before any is refused); at least one.
    explicit input_error(std::vector<issue> issues);
    const std::string& path() const noexcept { return issues_.front().path; }
    const std::string& message() const noexcept { return issues_.front().message; }
    /// Every problem this error carries, the first being path() and message().
    const std::vector<issue>& issues() const noexcept { return issues_; }

private:
    std::vector<issue> issues_;
};

/// "path: message", or the message alone when the path is empty.
std::string format_issue(const issue& item);

/// A number with exactly `decimals` digits after the point ("%.*f"), for traces.
std::string format_fixed(double value, int decimals);

/// Shortest decimal text of a number that reads well in a message (up to 6 significant digits).
std::string format_number(double value);

/// "a furnace", "an air-source-heat-pump": a noun with its indefinite article (by its first letter).
std::string with_article(const std::string& noun);

}  // namespace fw

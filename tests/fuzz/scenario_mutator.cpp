// Structure-aware mutations of scenario JSON for the `scenario` fuzz target (FW_FUZZ_TARGET 5): the
// input is parsed, one node picked at random and changed the way a user could change it (a number
// scaled or its sign flipped, a date shifted or malformed, a unit or id swapped, a key removed or
// copied into a sibling object, an array emptied or an element duplicated or removed, a value
// replaced by null, true, {} or []), and the document written back. An input that does not parse
// as a JSON object is replaced by one of the seeds: the *.json files in the directories given on
// the command line (tools/fuzz gives data/examples), or a small built-in scenario.
#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstring>
#include <filesystem>
#include <fstream>
#include <limits>
#include <nlohmann/json.hpp>
#include <random>
#include <sstream>
#include <string>
#include <vector>

namespace {

using nlohmann::json;
using pointer = json::json_pointer;
using random_engine = std::mt19937_64;

/// The seed scenarios the mutator falls back on (filled once by LLVMFuzzerInitialize).
std::vector<json>& seed_documents() {
    static std::vector<json> seeds;
    return seeds;
}

/// A minimal scenario used when no seed file was found.
json built_in_seed() {
    return json::parse(R"({"schema":"fuelwright.scenario/1","settings":{"units":"us","currency":"USD"},
        "demand":{"method":"direct","annual_useful_heat":{"value":60,"unit":"MMBtu"}},
        "options":[{"id":"gas","fuel":"natural-gas","price":{"amount":1.4,"per":"therm"},
                    "system":{"kind":"furnace","efficiency":{"value":95,"rating":"AFUE"}}},
                   {"id":"hp","fuel":"electricity","price":{"amount":0.16,"per":"kWh"},
                    "system":{"kind":"air-source-heat-pump","efficiency":{"value":8.5,"rating":"HSPF2"}}}]})");
}

/// Reads every *.json file that parses as a JSON object in the directories named by `args`.
void load_seeds(const std::vector<std::string>& args) {
    namespace fs = std::filesystem;
    for (const auto& arg : args) {
        std::error_code error;
        if (arg.empty() || arg[0] == '-' || !fs::is_directory(arg, error)) continue;
        for (const auto& entry : fs::directory_iterator(arg, error)) {
            if (entry.path().extension() != ".json") continue;
            std::ifstream file(entry.path());
            std::stringstream text;
            text << file.rdbuf();
            auto document = json::parse(text.str(), nullptr, false);
            if (!document.is_discarded() && document.is_object()) seed_documents().push_back(std::move(document));
        }
    }
    if (seed_documents().empty()) seed_documents().push_back(built_in_seed());
}

/// A uniformly drawn index below `n` (n > 0).
std::size_t pick(random_engine& rng, std::size_t n) {
    return std::uniform_int_distribution<std::size_t>(0, n - 1)(rng);
}

/// One of the listed values, drawn uniformly.
template <typename T>
const T& pick_from(random_engine& rng, const std::vector<T>& values) {
    return values[pick(rng, values.size())];
}

/// Every node of the document (the root too) as a JSON pointer, in document order.
void collect_nodes(const json& node, const pointer& at, std::vector<pointer>& out) {
    out.push_back(at);
    if (node.is_object()) {
        for (const auto& item : node.items()) collect_nodes(item.value(), at / item.key(), out);
    } else if (node.is_array()) {
        for (std::size_t i = 0; i < node.size(); ++i) collect_nodes(node[i], at / i, out);
    }
}

/// Every string value in the document, for swapping ids, fuels and units with each other.
void collect_strings(const json& node, std::vector<std::string>& out) {
    if (node.is_string()) out.push_back(node.get<std::string>());
    if (node.is_structured())
        for (const auto& item : node.items()) collect_strings(item.value(), out);
}

/// The unit spellings a user might type (and some a user might mistype), beside those in the document.
const std::vector<std::string>& known_units() {
    static const std::vector<std::string> units = {
        "therm",      "ccf",      "Ccf",        "mcf",          "m3",
        "kWh",        "MWh",      "Wh",         "gal",          "L",
        "l",          "MMBtu",    "Btu",        "kBtu",         "MJ",
        "GJ",         "J",        "degF",       "degC",         "K",
        "F",          "C",        "USD",        "EUR",          "CAD",
        "usd",        "cord",     "face-cord",  "ton",          "tonne",
        "kg",         "lb",       "bag",        "short-ton",    "Btu/therm",
        "MJ/m3",      "Btu/gal",  "kWh/kg",     "kW",           "Btu/h",
        "W/K",        "month",    "year",       "HSPF",         "HSPF2",
        "COP",        "AFUE",     "thermal",    "seasonal-ncv", "seasonal-gcv",
        "us",         "metric",   "mole",       "mass",         "HHV",
        "LHV",        "annual",   "life-cycle", "real",         "nominal",
        "triangular", "lognormal"};
    return units;
}

/// Malformed or edge-of-calendar dates.
const std::vector<std::string>& odd_dates() {
    static const std::vector<std::string> dates = {
        "2026-02-29", "2024-02-29", "2026-02-30",  "2026-13-01", "2026-00-10",  "2026-04-31", "2026-1-5",
        "26-01-01",   "0000-00-00", "9999-12-31",  "1900-01-01", "2026/01/05",  "2026-01",    "2026-01-01T00:00",
        "",           "2026-12-32", "-2026-01-01", "20260105",   "2026-01-01 ", "1969-12-31"};
    return dates;
}

/// Whether text is YYYY-MM-DD with a year from 1 to 9999, a month from 1 to 12 and a day from 1 to 31
/// (shift_date needs them in range; "2026-00-10" is not a date to shift but one of odd_dates).
bool is_date(const std::string& text) {
    int y = 0, m = 0, d = 0;
    return text.size() == 10 && std::sscanf(text.c_str(), "%4d-%2d-%2d", &y, &m, &d) == 3 && y >= 1 && m >= 1 &&
           m <= 12 && d >= 1 && d <= 31;
}

/// A valid date `days` after YYYY-MM-DD, or `months` months later keeping the day (which may overflow the month).
std::string shift_date(const std::string& text, int days, int months) {
    int y = 0, m = 0, d = 0;
    std::sscanf(text.c_str(), "%4d-%2d-%2d", &y, &m, &d);
    const int month_index = std::max(12, y * 12 + (m - 1) + months);  // never before year 1
    y = month_index / 12;
    m = month_index % 12 + 1;
    d += days;
    static const int lengths[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
    const auto length = [&](int year, int month) {
        const bool leap = (year % 4 == 0 && year % 100 != 0) || year % 400 == 0;
        return lengths[month - 1] + (month == 2 && leap);
    };
    while (days != 0 && d > length(y, m)) {
        d -= length(y, m);
        if (++m > 12) m = 1, ++y;
    }
    while (days != 0 && d < 1) {
        if (--m < 1) m = 12, --y;
        d += length(y, m);
    }
    char buffer[32];
    std::snprintf(buffer, sizeof buffer, "%04d-%02d-%02d", y, m, d);
    return buffer;
}

/// A number changed the way a typing user or a wrong unit would change it.
json mutate_number(const json& value, random_engine& rng) {
    const double x = value.get<double>();
    switch (pick(rng, 20)) {
        case 0:
            return 0;
        case 1:
            return -x;
        case 2:
            return x * 1e-9;
        case 3:
            return x * 1e9;
        case 4:
            return x * 10;
        case 5:
            return x * 0.01;
        case 6:
            return x + 1;
        case 7:
            return x - 1;
        case 8:
            return pick_from(rng, std::vector<double>{1e300, 1.7976931348623157e308, 1e18, 2147483648.0, 9.3e15});
        case 9:
            return pick_from(rng, std::vector<double>{1e-300, 4.9e-324, 1e-12, 2.2250738585072014e-308});
        case 10:
            return x / 100;  // a percentage typed as a fraction (95 -> 0.95)
        case 11:
            return x * 100;  // a fraction typed as a percentage (0.95 -> 95)
        case 12:
            return std::floor(x);
        case 13:
            return x + 0.5;
        case 14:
            return -1e-9;
        case 15:
            return static_cast<std::int64_t>(pick(rng, 500)) - 50;
        case 16:
            return x * (1 + 1e-12);
        case 17:
            return std::nextafter(x, pick(rng, 2) ? 1e308 : -1e308);
        case 18:
            return -0.0;
        default:
            return x * 1e-3;
    }
}

/// A string changed to another plausible (or plausibly wrong) value.
json mutate_string(const json& value, const std::vector<std::string>& document_strings, random_engine& rng) {
    const auto text = value.get<std::string>();
    if (is_date(text) && pick(rng, 4) != 0) {
        switch (pick(rng, 4)) {
            case 0:
                return shift_date(text, static_cast<int>(pick(rng, 800)) - 400, 0);
            case 1:
                return shift_date(text, 0, static_cast<int>(pick(rng, 48)) - 24);
            case 2:
                return shift_date(text, pick(rng, 2) ? 1 : -1, 0);
            default:
                return pick_from(rng, odd_dates());
        }
    }
    switch (pick(rng, 12)) {
        case 0:
        case 1:
        case 2:
            return pick_from(rng, document_strings);  // ids, fuels and units of this scenario swapped
        case 3:
        case 4:
            return pick_from(rng, known_units());
        case 5:
            return "";
        case 6:
            return text.substr(0, pick(rng, text.size() + 1));
        case 7:
            return text + text;
        case 8: {  // a digit inside changed ("CH4:0.95" -> "CH4:9.95", "2026-01-05" -> "2026-01-95")
            auto out = text;
            std::vector<std::size_t> digits;
            for (std::size_t i = 0; i < out.size(); ++i)
                if (std::isdigit(static_cast<unsigned char>(out[i]))) digits.push_back(i);
            if (!digits.empty()) out[pick_from(rng, digits)] = static_cast<char>('0' + pick(rng, 10));
            return out;
        }
        case 9:
            return pick_from(rng, odd_dates());
        case 10: {
            auto out = text;
            for (auto& c : out) c = static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
            return out;
        }
        default:
            return pick_from(rng, std::vector<std::string>{"0", "-1", "1e400", "NaN", " ", "x", "0.95"});
    }
}

/// An object elsewhere in the document of the same depth as the one at `parent` (a sibling), or the same object.
pointer sibling_object(const json& document, const pointer& parent, const std::vector<pointer>& nodes,
                       random_engine& rng) {
    std::vector<pointer> candidates;
    const auto depth = [](const pointer& p) {
        const auto text = p.to_string();
        return std::count(text.begin(), text.end(), '/');
    };
    const auto wanted = depth(parent);
    for (const auto& p : nodes)
        if (p != parent && document.at(p).is_object() && depth(p) == wanted) candidates.push_back(p);
    return candidates.empty() ? parent : pick_from(rng, candidates);
}

/// Applies one structural mutation at a random node of the document; false when nothing changed.
bool mutate_once(json& document, random_engine& rng) {
    std::vector<pointer> nodes;
    collect_nodes(document, pointer(), nodes);
    std::vector<std::string> strings;
    collect_strings(document, strings);
    if (strings.empty()) strings.push_back("");
    const auto at = nodes[pick(rng, nodes.size())];
    json& node = document.at(at);
    const json before = node;
    const int action = static_cast<int>(pick(rng, 10));
    if (action == 0 && !at.empty()) {  // replaced by another kind of value
        node = pick_from(rng, std::vector<json>{nullptr, true, false, json::object(), json::array(), 0, ""});
    } else if (action == 1 && !at.empty() && document.at(at.parent_pointer()).is_object()) {  // key removed
        document.at(at.parent_pointer()).erase(at.back());
        return true;
    } else if (action == 2 && !at.empty() && document.at(at.parent_pointer()).is_object()) {
        // Key duplicated into a sibling object (or another object of the same depth).
        const auto target = sibling_object(document, at.parent_pointer(), nodes, rng);
        if (target == at.parent_pointer()) return false;
        document.at(target)[at.back()] = before;
        return true;
    } else if (node.is_number()) {
        node = mutate_number(node, rng);
    } else if (node.is_string()) {
        node = mutate_string(node, strings, rng);
    } else if (node.is_boolean()) {
        node = !node.get<bool>();
    } else if (node.is_array() && !node.empty()) {
        const auto i = pick(rng, node.size());
        switch (pick(rng, 3)) {
            case 0:
                node = json::array();
                break;
            case 1:
                node.insert(node.begin() + static_cast<std::ptrdiff_t>(i), node[i]);
                break;
            default:
                node.erase(i);
                break;
        }
    } else if (node.is_object() && !node.empty()) {
        // A key renamed to a neighbouring spelling (a user's typo or a field of another version).
        auto item = node.begin();
        std::advance(item, static_cast<std::ptrdiff_t>(pick(rng, node.size())));
        const auto key = item.key();
        json value = item.value();
        node.erase(key);
        node[pick(rng, 2) ? key + "s" : pick_from(rng, strings)] = std::move(value);
    } else {
        return false;
    }
    return node != before;
}

/// The document's compact JSON text.
std::string to_text(const json& document) {
    return document.dump(-1, ' ', false, json::error_handler_t::replace);
}

/// Writes text into the fuzzer's buffer if it fits; the new size, or 0 when it does not fit.
std::size_t write_back(const std::string& text, std::uint8_t* data, std::size_t max_size) {
    if (text.size() > max_size) return 0;
    std::memcpy(data, text.data(), text.size());
    return text.size();
}

/// The input as a JSON object, or a copy of a random seed when it is not one.
json parsed_or_seed(const std::uint8_t* data, std::size_t size, random_engine& rng) {
    auto document = json::parse(data, data + size, nullptr, false);
    if (document.is_discarded() || !document.is_object()) return pick_from(rng, seed_documents());
    return document;
}

/// Whether `document` has a node at `p`; false where nlohmann's contains() throws (a key of the other
/// document read as an array index too large for size_type, found by this fuzzer).
bool contains_safely(const json& document, const pointer& p) {
    try {
        return document.contains(p);
    } catch (const json::exception&) {
        return false;
    }
}

}  // namespace

extern "C" int LLVMFuzzerInitialize(int* argc, char*** argv) {
    std::vector<std::string> args((*argv) + 1, (*argv) + *argc);
    load_seeds(args);
    return 0;
}

extern "C" std::size_t LLVMFuzzerCustomMutator(std::uint8_t* data, std::size_t size, std::size_t max_size,
                                               unsigned int seed) {
    random_engine rng(seed);
    auto document = parsed_or_seed(data, size, rng);
    // Mostly one change at a time, sometimes a few, so that pairs of changes are reached too.
    const std::size_t changes = pick(rng, 4) == 0 ? 2 + pick(rng, 3) : 1;
    for (std::size_t i = 0, tries = 0; i < changes && tries < 20; ++tries) i += mutate_once(document, rng);
    const auto written = write_back(to_text(document), data, max_size);
    return written ? written : write_back(to_text(pick_from(rng, seed_documents())), data, max_size);
}

extern "C" std::size_t LLVMFuzzerCustomCrossOver(const std::uint8_t* data1, std::size_t size1,
                                                 const std::uint8_t* data2, std::size_t size2, std::uint8_t* out,
                                                 std::size_t max_out_size, unsigned int seed) {
    random_engine rng(seed);
    auto first = parsed_or_seed(data1, size1, rng);
    const auto second = parsed_or_seed(data2, size2, rng);
    // A subtree of the second document moved to the same place in the first (an option, a demand, a climate).
    std::vector<pointer> nodes;
    collect_nodes(second, pointer(), nodes);
    std::vector<pointer> shared;
    for (const auto& p : nodes)
        if (!p.empty() && contains_safely(first, p)) shared.push_back(p);
    if (!shared.empty()) {
        const auto& p = pick_from(rng, shared);
        first.at(p) = second.at(p);
    }
    return write_back(to_text(first), out, max_out_size);
}

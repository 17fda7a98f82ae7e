#include "thermo/formula.hpp"

#include <cctype>
#include <cmath>
#include <nlohmann/json.hpp>
#include <vector>

#include "base/embedded_data.hpp"
#include "base/error.hpp"

namespace fw {

namespace {

struct element_table {
    std::map<std::string, double, std::less<>> weights;
    std::vector<std::string> order;
    std::string edition;
};

const element_table& elements() {
    static const element_table table = [] {
        element_table result;
        const auto doc = nlohmann::json::parse(detail::embedded_file("elements.json"));
        result.edition = doc.at("edition").get<std::string>();
        for (const auto& record : doc.at("elements")) {
            const auto symbol = record.at("symbol").get<std::string>();
            result.weights[symbol] = record.at("atomic_weight").get<double>();
            result.order.push_back(symbol);
        }
        return result;
    }();
    return table;
}

std::string quote_text(std::string_view text) { return "\"" + std::string(text) + "\""; }

// Recursive-descent parser: group := (element | '(' group ')') count? ...
class formula_parser {
public:
    formula_parser(std::string_view text, const std::string& path) : text_(text), path_(path) {}

    composition parse() {
        if (text_.empty()) throw input_error(path_, "formula is empty; give a formula such as CH4 or C2H5OH");
        auto atoms = parse_group(0);
        if (pos_ < text_.size()) {
            if (text_[pos_] == ')') fail("unmatched ')'", pos_);
            fail("unexpected character '" + std::string(1, text_[pos_]) + "'", pos_);
        }
        return atoms;
    }

private:
    composition parse_group(int depth) {
        composition atoms;
        bool any = false;
        while (pos_ < text_.size() && text_[pos_] != ')') {
            const char c = text_[pos_];
            if (c == '(') {
                const std::size_t open = pos_++;
                if (depth > 8) fail("parentheses nested too deeply", open);
                auto inner = parse_group(depth + 1);
                if (pos_ >= text_.size() || text_[pos_] != ')') fail("unmatched '('", open);
                if (inner.empty()) fail("empty parentheses", open);
                ++pos_;
                add_scaled(atoms, inner, parse_count());
            } else if (std::isupper(static_cast<unsigned char>(c))) {
                const std::size_t start = pos_++;
                while (pos_ < text_.size() && std::islower(static_cast<unsigned char>(text_[pos_]))) ++pos_;
                const std::string symbol(text_.substr(start, pos_ - start));
                if (!elements().weights.count(symbol))
                    fail("unknown element " + quote_text(symbol), start, "known elements are " + known_elements());
                atoms[symbol] += parse_count();
            } else if (std::islower(static_cast<unsigned char>(c))) {
                fail("lower-case letter '" + std::string(1, c) + "'", pos_,
                     "element symbols start with a capital letter, as in C, Cl or He");
            } else if (std::isdigit(static_cast<unsigned char>(c))) {
                fail("count with no element before it", pos_);
            } else {
                fail("unexpected character '" + std::string(1, c) + "'", pos_);
            }
            any = true;
        }
        if (!any && depth == 0) fail("no elements", pos_);
        return atoms;
    }

    double parse_count() {
        if (pos_ >= text_.size() || !std::isdigit(static_cast<unsigned char>(text_[pos_]))) return 1.0;
        const std::size_t start = pos_;
        long value = 0;
        while (pos_ < text_.size() && std::isdigit(static_cast<unsigned char>(text_[pos_]))) {
            value = value * 10 + (text_[pos_] - '0');
            if (value > 100000) fail("count larger than 100000", start);
            ++pos_;
        }
        if (value == 0) fail("count of zero", start);
        return static_cast<double>(value);
    }

    [[noreturn]] void fail(const std::string& what, std::size_t position, const std::string& hint = "") const {
        throw input_error(path_, "formula " + quote_text(text_) + ": " + what + " at character " +
                                     std::to_string(position + 1) + (hint.empty() ? "" : "; " + hint));
    }

    std::string_view text_;
    const std::string& path_;
    std::size_t pos_ = 0;
};

}  // namespace

double atomic_weight(std::string_view symbol, const std::string& path) {
    const auto& table = elements().weights;
    const auto found = table.find(symbol);
    if (found == table.end())
        throw input_error(path, "unknown element " + quote_text(symbol) + "; known elements are " + known_elements());
    return found->second;
}

std::string known_elements() {
    std::string list;
    for (const auto& symbol : elements().order) list += (list.empty() ? "" : ", ") + symbol;
    return list;
}

std::string atomic_weight_edition() { return elements().edition; }

composition parse_formula(std::string_view text, const std::string& path) {
    return formula_parser(text, path).parse();
}

double molar_mass_g_per_mol(const composition& atoms) {
    double total = 0.0;
    for (const auto& [symbol, count] : atoms) total += count * atomic_weight(symbol);
    return total;
}

void add_scaled(composition& sum, const composition& part, double factor) {
    for (const auto& [symbol, count] : part) sum[symbol] += factor * count;
}

static std::string count_text(double count) {
    if (count == 1.0) return "";
    if (count == std::floor(count) && count < 1e6) return std::to_string(static_cast<long>(count));
    return format_number(count);
}

std::string hill_formula(const composition& atoms) {
    std::string text;
    const bool has_carbon = atoms.count("C") && atoms.at("C") > 0;
    if (has_carbon) {
        text += "C" + count_text(atoms.at("C"));
        if (atoms.count("H") && atoms.at("H") > 0) text += "H" + count_text(atoms.at("H"));
    }
    for (const auto& [symbol, count] : atoms) {
        if (count <= 0) continue;
        if (has_carbon && (symbol == "C" || symbol == "H")) continue;
        text += symbol + count_text(count);
    }
    return text;
}

}  // namespace fw

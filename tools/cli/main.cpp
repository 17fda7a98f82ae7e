// fuelwright: the command-line face of the core. Every command builds a JSON request, calls the
// same entry point the WASM module calls, prints the JSON result on stdout, and exits 2 with one
// line per error on stderr when the result carries errors.
#include <algorithm>
#include <atomic>
#include <cstdio>
#include <ctime>
#include <fstream>
#include <optional>
#include <iostream>
#include <iterator>
#include <map>
#include <nlohmann/json.hpp>
#include <string>
#include <thread>
#include <vector>

#include "fw/api.hpp"

namespace {

using nlohmann::json;

constexpr const char* usage_text = R"(usage: fuelwright COMMAND [ARGS]

commands:
  heating-value --formula F [--phase gas|liquid|solid] [--dhf KJ_PER_MOL | --hhv KJ_PER_MOL] [--reference 15C|0C|60F]
  heating-value --mixture "CH4:0.95,C2H6:0.03,N2:0.02" [--fractions mole|mass] [--normalise] [--reference R]
  heating-value --ultimate "C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4" [--moisture PCT] [--basis dry|as-received|daf]
                [--hhv-dry MJ_PER_KG]
  evaluate FILE [--detail trace,sources,bins|all]
                               evaluate a scenario (FILE or - for standard input); the details say how each
                               figure was worked out, from which data, and the temperature bins
  explain FILE [--option ID]   the full account of one option (trace, sources, bins) and of the heat need
  evaluate --ndjson [--jobs N] FILE
                               one scenario per line in, one answer per line out (with its "line"), N at once
  break-even FILE --a ID --b ID --vary price|efficiency|demand [--of ID] [--basis annual|life-cycle]
                               the price (or efficiency) at which two options cost the same
  sweep FILE [--vary price|efficiency|demand] [--of ID] [--from X] [--to X] [--points N] [--basis B]
                               every option's cost over a range of one input
  what-if FILE --vary price|efficiency|demand [--of ID] --value X [--basis B]
                               every option's cost and the ranking with one input set to X
  tornado FILE [--basis annual|life-cycle] [--change 0.2]
                               the winner's margin for -/+20 % on each input
  check-prices FILE [--today YYYY-MM-DD]
                               check a supplier price file before publishing it (exit 0 when clean, 2 otherwise)
  climate FILE                 degree-days, hourly bins and design temperatures of a climate (or scenario) file
  weather FILE [--format daily|hourly] [--unit degC|degF] [--date|--time|--mean|--max|--min|--temperature NAME]
                               a downloaded weather CSV (daily, hourly or TMY3) as observed daily means and the
                               climate it implies, ready to paste into a scenario
  catalog                      fuels with heating values per sale unit, systems, GWP sets
  convert VALUE FROM TO        e.g. convert 1 therm kWh
  units                        list the accepted unit spellings
  help                         this text
Results are JSON on stdout. Bad input: exit 2, errors on stderr and as {"errors": [...]} on stdout.
)";

/// Prints the result and returns the exit code: 0 without errors, 2 with.
int finish(const std::string& result_text) {
    std::cout << result_text << "\n";
    const auto result = json::parse(result_text);
    if (!result.contains("errors") || result["errors"].empty()) return 0;
    for (const auto& error : result["errors"]) {
        const auto path = error.value("path", "");
        std::cerr << "fuelwright: " << (path.empty() ? "" : path + ": ") << error.value("message", "") << "\n";
    }
    return 2;
}

int usage_error(const std::string& path, const std::string& message) {
    json out = {{"errors", json::array({{{"path", path}, {"message", message}}})}, {"warnings", json::array()}};
    return finish(out.dump(-1, ' ', false, json::error_handler_t::replace));
}

struct flag_spec {
    const char* name;
    const char* key;   ///< request key
    bool takes_value;
    bool numeric;
};

int heating_value_command(const std::vector<std::string>& args) {
    static const flag_spec flags[] = {
        {"--formula", "formula", true, false},     {"--phase", "phase", true, false},
        {"--dhf", "dhf_kj_per_mol", true, true},    {"--hhv", "hhv_kj_per_mol", true, true},
        {"--reference", "reference", true, false}, {"--mixture", "mixture", true, false},
        {"--fractions", "fractions", true, false}, {"--normalise", "normalise", false, false},
        {"--ultimate", "ultimate", true, false},   {"--moisture", "moisture", true, true},
        {"--basis", "basis", true, false},         {"--hhv-dry", "hhv_dry_mj_per_kg", true, true},
    };
    json request = json::object();
    for (std::size_t i = 0; i < args.size(); ++i) {
        const flag_spec* spec = nullptr;
        for (const auto& flag : flags)
            if (args[i] == flag.name) spec = &flag;
        if (!spec) {
            std::string known;
            for (const auto& flag : flags) known += (known.empty() ? "" : ", ") + std::string(flag.name);
            return usage_error(args[i], "unknown option for heating-value; accepted: " + known);
        }
        if (!spec->takes_value) {
            request[spec->key] = true;
            continue;
        }
        if (i + 1 >= args.size()) return usage_error(args[i], "needs a value");
        const std::string& value = args[++i];
        if (spec->numeric) {
            // The core validates numbers; hand it the text as a JSON number when it is one.
            char* end = nullptr;
            const double number = std::strtod(value.c_str(), &end);
            const bool plain = value.find_first_of("xXnNiI") == std::string::npos;
            if (end == value.c_str() || *end != '\0' || !plain || number != number)
                return usage_error(spec->name, std::string(spec->name) + " must be a finite decimal number, got \"" +
                                                   value + "\"");
            request[spec->key] = number;
        } else {
            request[spec->key] = value;
        }
    }
    return finish(fw::heating_value_json(request.dump(-1, ' ', false, json::error_handler_t::replace)));
}

int convert_command(const std::vector<std::string>& args) {
    if (args.size() != 3) return usage_error("", "convert takes VALUE FROM TO, e.g. fuelwright convert 1 therm kWh");
    char* end = nullptr;
    const double number = std::strtod(args[0].c_str(), &end);
    const bool plain = args[0].find_first_of("xXnNiI") == std::string::npos;
    if (end == args[0].c_str() || *end != '\0' || !plain || number != number)
        return usage_error("/value", "VALUE must be a finite decimal number, got \"" + args[0] + "\"");
    return finish(fw::convert_json(json{{"value", number}, {"from", args[1]}, {"to", args[2]}}.dump()));
}

/// Reads FILE, or standard input for "-"; nullopt when the file cannot be read.
std::optional<std::string> read_input(const std::string& name) {
    if (name == "-") return std::string(std::istreambuf_iterator<char>(std::cin), std::istreambuf_iterator<char>());
    std::ifstream file(name, std::ios::binary);
    if (!file) return std::nullopt;
    return std::string(std::istreambuf_iterator<char>(file), std::istreambuf_iterator<char>());
}

/// Runs `entry` on the text of the one FILE argument.
int file_command(const std::vector<std::string>& args, const char* name, std::string (*entry)(const std::string&) noexcept) {
    if (args.size() != 1) return usage_error("", std::string(name) + " takes one FILE (or - for standard input)");
    const auto text = read_input(args[0]);
    if (!text) return usage_error(args[0], "cannot read file \"" + args[0] + "\"");
    return finish(entry(*text));
}

/// `evaluate FILE [--detail trace,sources,bins|all]`: the scenario's answer, with the details listed
/// (the flag's list replaces any "detail" in the file).
int evaluate_command(const std::vector<std::string>& args) {
    std::string name, detail;
    bool detail_given = false;
    for (std::size_t i = 0; i < args.size(); ++i) {
        if (args[i] == "--detail" && i + 1 < args.size()) {
            detail = args[++i];
            detail_given = true;
        } else if (name.empty() && (args[i] == "-" || args[i].rfind("--", 0) != 0)) {
            name = args[i];
        } else {
            return usage_error(args[i], "unknown option for evaluate; accepted: --detail LIST, --ndjson, --jobs N and one FILE (or -)");
        }
    }
    if (name.empty()) return usage_error("", "evaluate takes one FILE (or - for standard input)");
    const auto text = read_input(name);
    if (!text) return usage_error(name, "cannot read file \"" + name + "\"");
    if (!detail_given) return finish(fw::evaluate_json(*text));
    json scenario;
    try {
        scenario = json::parse(*text);
    } catch (const json::parse_error&) {
        return finish(fw::evaluate_json(*text));  // reports the malformed JSON with line and column
    }
    if (!scenario.is_object()) return finish(fw::evaluate_json(*text));
    json list = json::array();
    for (std::size_t start = 0; start <= detail.size();) {
        const auto end = std::min(detail.find(',', start), detail.size());
        if (end > start) list.push_back(detail.substr(start, end - start));
        start = end + 1;
    }
    scenario["detail"] = list;
    return finish(fw::evaluate_json(scenario.dump(-1, ' ', false, json::error_handler_t::replace)));
}

/// `evaluate --ndjson [--jobs N] FILE|-`: one scenario per line in, one answer per line out, in input
/// order, each with the input's line number as "line"; a bad line gets its errors and the batch goes on.
/// Blank lines are skipped. Exit 0 when every answer is clean, 2 when any has errors (counted on stderr).
int evaluate_batch(const std::vector<std::string>& args) {
    std::string name;
    unsigned jobs = 1;
    for (std::size_t i = 0; i < args.size(); ++i) {
        if (args[i] == "--ndjson") continue;
        if (args[i] == "--jobs" && i + 1 < args.size()) {
            const std::string& value = args[++i];
            char* end = nullptr;
            const long n = std::strtol(value.c_str(), &end, 10);
            if (end == value.c_str() || *end != '\0' || n < 1 || n > 256)
                return usage_error("--jobs", "--jobs must be a whole number from 1 to 256, got \"" + value + "\"");
            jobs = static_cast<unsigned>(n);
        } else if (name.empty() && (args[i] == "-" || args[i].rfind("--", 0) != 0)) {
            name = args[i];
        } else {
            return usage_error(args[i], "unknown option for evaluate --ndjson; accepted: --jobs N and one FILE (or -)");
        }
    }
    if (name.empty()) return usage_error("", "evaluate --ndjson takes one FILE (or - for standard input)");
    const auto text = read_input(name);
    if (!text) return usage_error(name, "cannot read file \"" + name + "\"");
    std::vector<std::pair<std::size_t, std::string>> lines;  // (line number, text)
    std::size_t start = 0, number = 0;
    while (start <= text->size()) {
        const auto end = std::min(text->find('\n', start), text->size());
        ++number;
        std::string line = text->substr(start, end - start);
        if (!line.empty() && line.back() == '\r') line.pop_back();
        if (line.find_first_not_of(" \t") != std::string::npos) lines.push_back({number, std::move(line)});
        start = end + 1;
    }
    std::vector<std::string> answers(lines.size());
    std::atomic<std::size_t> next{0};
    const auto work = [&] {
        for (std::size_t i = next++; i < lines.size(); i = next++) {
            auto answer = json::parse(fw::evaluate_json(lines[i].second));
            answer["line"] = lines[i].first;
            answers[i] = answer.dump(-1, ' ', false, json::error_handler_t::replace);
        }
    };
    std::vector<std::thread> workers;
    for (unsigned k = 1; k < std::min<std::size_t>(jobs, lines.size()); ++k) workers.emplace_back(work);
    work();
    for (auto& worker : workers) worker.join();
    std::size_t with_errors = 0;
    for (const auto& answer : answers) {
        std::cout << answer << "\n";
        with_errors += answer.find("\"errors\":[]") == std::string::npos;
    }
    if (with_errors > 0)
        std::cerr << "fuelwright: " << with_errors << " of " << answers.size() << " scenarios have errors\n";
    return with_errors > 0 ? 2 : 0;
}

/// Commands that read a scenario FILE and take --flags into the request beside it.
int analysis_command(const std::vector<std::string>& args, const char* name,
                     const std::vector<std::pair<std::string, bool>>& flags,  // flag, numeric
                     std::string (*entry)(const std::string&) noexcept) {
    if (args.empty()) return usage_error("", std::string(name) + " takes a scenario FILE (or -) and options");
    const auto text = read_input(args[0]);
    if (!text) return usage_error(args[0], "cannot read file \"" + args[0] + "\"");
    json scenario;
    try {
        scenario = json::parse(*text);
    } catch (const json::parse_error&) {
        return finish(fw::evaluate_json(*text));  // reports the malformed JSON with line and column
    }
    json request = {{"scenario", scenario}};
    for (std::size_t i = 1; i < args.size(); ++i) {
        const auto found = std::find_if(flags.begin(), flags.end(), [&](const auto& f) { return f.first == args[i]; });
        if (found == flags.end()) {
            std::string known;
            for (const auto& f : flags) known += (known.empty() ? "" : ", ") + f.first;
            return usage_error(args[i], "unknown option for " + std::string(name) + "; accepted: " + known);
        }
        if (i + 1 >= args.size()) return usage_error(args[i], "needs a value");
        const std::string key = found->first.substr(2);
        const std::string& value = args[++i];
        if (found->second) {
            char* end = nullptr;
            const double number = std::strtod(value.c_str(), &end);
            const bool plain = value.find_first_of("xXnNiI") == std::string::npos;
            if (end == value.c_str() || *end != '\0' || !plain)
                return usage_error(found->first, found->first + " must be a finite decimal number, got \"" + value + "\"");
            request[key] = number;
        } else {
            request[key] = value;
        }
    }
    return finish(entry(request.dump(-1, ' ', false, json::error_handler_t::replace)));
}

/// Today's date (UTC) as YYYY-MM-DD.
std::string today_utc() {
    const std::time_t now = std::time(nullptr);
    std::tm parts{};
    gmtime_r(&now, &parts);
    char buffer[16];
    std::strftime(buffer, sizeof buffer, "%Y-%m-%d", &parts);
    return buffer;
}

int check_prices_command(const std::vector<std::string>& args) {
    if (args.empty()) return usage_error("", "check-prices takes a price FILE (or -)");
    std::string today = today_utc();
    for (std::size_t i = 1; i < args.size(); ++i) {
        if (args[i] == "--today" && i + 1 < args.size()) today = args[++i];
        else return usage_error(args[i], "unknown option for check-prices; accepted: --today YYYY-MM-DD");
    }
    const auto text = read_input(args[0]);
    if (!text) return usage_error(args[0], "cannot read file \"" + args[0] + "\"");
    return finish(fw::check_prices_json(*text, today));
}

/// `weather FILE [--format daily|hourly] [--unit degC|degF] [--date NAME] [--time NAME] [--mean NAME] [--max NAME]
/// [--min NAME] [--temperature NAME]`: the climate and observed daily means of a weather file.
int weather_command(const std::vector<std::string>& args) {
    if (args.empty()) return usage_error("", "weather takes a weather FILE (CSV, or - for standard input)");
    json request = json::object();
    const std::vector<std::string> column_flags = {"--date", "--time", "--mean", "--max", "--min", "--temperature"};
    for (std::size_t i = 1; i < args.size(); ++i) {
        const bool column = std::find(column_flags.begin(), column_flags.end(), args[i]) != column_flags.end();
        if ((args[i] == "--format" || args[i] == "--unit" || column) && i + 1 < args.size()) {
            if (column) request["columns"][args[i].substr(2)] = args[i + 1];
            else request[args[i].substr(2)] = args[i + 1];
            ++i;
        } else {
            return usage_error(args[i], "unknown option for weather; accepted: --format daily|hourly, --unit degC|degF, and "
                                        "column names --date, --time, --mean, --max, --min, --temperature");
        }
    }
    const auto text = read_input(args[0]);
    if (!text) return usage_error(args[0], "cannot read file \"" + args[0] + "\"");
    request["text"] = *text;
    return finish(fw::weather_json(request.dump(-1, ' ', false, json::error_handler_t::replace)));
}

}  // namespace

int main(int argc, char** argv) {
    std::vector<std::string> args(argv + 1, argv + argc);
    if (args.empty() || args[0] == "help" || args[0] == "--help" || args[0] == "-h") {
        std::cout << usage_text;
        return args.empty() ? 2 : 0;
    }
    const std::string command = args[0];
    const std::vector<std::string> rest(args.begin() + 1, args.end());
    if (command == "heating-value") return heating_value_command(rest);
    if (command == "convert") return convert_command(rest);
    if (command == "units") return finish(fw::units_json());
    if (command == "evaluate" && std::find(rest.begin(), rest.end(), "--ndjson") != rest.end()) return evaluate_batch(rest);
    if (command == "evaluate") return evaluate_command(rest);
    if (command == "explain") return analysis_command(rest, "explain", {{"--option", false}}, fw::explain_json);
    if (command == "climate") return file_command(rest, "climate", fw::climate_json);
    if (command == "check-prices") return check_prices_command(rest);
    if (command == "weather") return weather_command(rest);
    if (command == "break-even")
        return analysis_command(rest, "break-even",
                                {{"--a", false}, {"--b", false}, {"--vary", false}, {"--of", false}, {"--basis", false}},
                                fw::break_even_json);
    if (command == "sweep")
        return analysis_command(rest, "sweep",
                                {{"--vary", false}, {"--of", false}, {"--from", true}, {"--to", true}, {"--points", true},
                                 {"--basis", false}},
                                fw::sweep_json);
    if (command == "what-if")
        return analysis_command(rest, "what-if", {{"--vary", false}, {"--of", false}, {"--value", true}, {"--basis", false}},
                                fw::what_if_json);
    if (command == "tornado")
        return analysis_command(rest, "tornado", {{"--basis", false}, {"--change", true}}, fw::tornado_json);
    if (command == "catalog") return finish(fw::catalog_json());
    std::cerr << usage_text;
    return usage_error(command, "unknown command \"" + command + "\"; commands: heating-value, evaluate, break-even, sweep, tornado, check-prices, climate, weather, catalog, convert, units, help");
}

// Native benchmark of the heavy reference scenario: evaluate (12 options, heat pumps on 1 degC
// bins, 10,000-draw Monte Carlo) plus a 100-point price sweep, timed over repeated runs.
// Prints {"native_heavy_ms": median, "runs": [...]} on stdout. With --serve in place of REPEATS it makes
// its two untimed runs, then times one run for each line read on standard input and prints its
// milliseconds on a line (tools/benchmark/bench.mjs interleaves these with the WASM runs).
#include <algorithm>
#include <chrono>
#include <fstream>
#include <iostream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>
#include <vector>

#include "fw/api.hpp"

int main(int argc, char** argv) {
    if (argc < 2) {
        std::cerr << "usage: fuelwright_bench SCENARIO [REPEATS | --serve]\n";
        return 2;
    }
    std::ifstream file(argv[1]);
    std::stringstream text;
    text << file.rdbuf();
    const std::string scenario = text.str();
    const bool serve = argc > 2 && std::string(argv[2]) == "--serve";
    const int repeats = argc > 2 && !serve ? std::atoi(argv[2]) : 9;
    const auto scenario_json = nlohmann::json::parse(scenario);
    const std::string sweep = nlohmann::json{{"scenario", scenario_json}, {"vary", "price"}, {"of", "gas"},
                                             {"from", 0.5}, {"to", 2.0}, {"points", 100}}.dump();
    // [ms] One run: the two calls returning their JSON text; negative when the scenario did not evaluate cleanly.
    const auto run = [&] {
        const auto start = std::chrono::steady_clock::now();
        const auto evaluated = fw::evaluate_json(scenario);
        const auto swept = fw::sweep_json(sweep);
        const auto stop = std::chrono::steady_clock::now();
        if (evaluated.find("\"errors\":[]") == std::string::npos || swept.find("\"errors\":[]") == std::string::npos) return -1.0;
        return std::chrono::duration<double, std::milli>(stop - start).count();
    };
    std::vector<double> runs;
    for (int i = -2; i < (serve ? 0 : repeats); ++i) {  // two untimed runs first, as in the WASM benchmark
        const double ms = run();
        if (ms < 0) {
            std::cerr << "the heavy scenario did not evaluate cleanly\n";
            return 1;
        }
        if (i >= 0) runs.push_back(ms);
    }
    if (serve) {
        for (std::string line; std::getline(std::cin, line);) std::cout << run() << std::endl;
        return 0;
    }
    auto sorted = runs;
    std::sort(sorted.begin(), sorted.end());
    std::cout << nlohmann::json{{"native_heavy_ms", sorted[sorted.size() / 2]}, {"runs", runs}}.dump() << "\n";
    return 0;
}

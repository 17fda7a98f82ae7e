// The fuelwright CLI as a process: JSON on stdout, exit codes, one line per error on stderr.
#include <gtest/gtest.h>
#include <sys/wait.h>

#include <array>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>

namespace {

struct run_result {
    int exit_code;
    std::string out;
    std::string err;
};

run_result run_cli(const std::string& arguments) {
    const char* cli = std::getenv("FUELWRIGHT_CLI");
    if (!cli) return {-1, "", "FUELWRIGHT_CLI is not set"};
    const std::string err_file = testing::TempDir() + "fuelwright_cli_stderr.txt";
    const std::string command = std::string("'") + cli + "' " + arguments + " 2>'" + err_file + "'";
    run_result result{-1, "", ""};
    FILE* pipe = popen(command.c_str(), "r");
    if (!pipe) return result;
    std::array<char, 4096> buffer{};
    std::size_t count;
    while ((count = fread(buffer.data(), 1, buffer.size(), pipe)) > 0) result.out.append(buffer.data(), count);
    const int status = pclose(pipe);
    result.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
    std::ifstream err(err_file);
    std::stringstream text;
    text << err.rdbuf();
    result.err = text.str();
    return result;
}

TEST(cli, propane_heating_value) {
    const auto run = run_cli("heating-value --formula C3H8");
    ASSERT_EQ(run.exit_code, 0) << run.err;
    const auto result = nlohmann::json::parse(run.out);
    // NIST WebBook propane -dcH = 2219.2 +/- 0.46 kJ/mol; the issue asks for 2219 +/- 1.
    EXPECT_NEAR(result.at("hhv_kj_per_mol").get<double>(), 2219.0, 1.0);
    for (const char* key : {"lhv_kj_per_mol", "hhv_mj_per_kg", "lhv_mj_per_kg", "hhv_mj_per_m3", "lhv_mj_per_m3",
                            "reference", "stoich_air_kg_per_kg", "co2_kg_per_kg", "equation", "sources"})
        EXPECT_TRUE(result.contains(key)) << key;
    EXPECT_EQ(result.at("equation"), "C3H8 + 5 O2 -> 3 CO2 + 4 H2O");
    EXPECT_EQ(result.at("reference").at("id"), "15C");
    EXPECT_TRUE(run.err.empty());
}

TEST(cli, mixture_and_ultimate_and_reference) {
    auto run = run_cli("heating-value --mixture 'CH4:0.95,C2H6:0.03,N2:0.02' --reference 60F");
    ASSERT_EQ(run.exit_code, 0) << run.err;
    auto result = nlohmann::json::parse(run.out);
    EXPECT_EQ(result.at("reference").at("id"), "60F");
    // Per-m3 = per-mol x p/(RT) at 60 degF (288.7056 K), 14.696 psia (101.3253 kPa).
    EXPECT_NEAR(result.at("hhv_mj_per_m3").get<double>(),
                result.at("hhv_kj_per_mol").get<double>() * 14.696 * 6894.757293168361 /
                    (8.314462618 * (60 + 459.67) * 5 / 9) / 1000,
                1e-9);
    run = run_cli("heating-value --ultimate 'C:50.2,H:6.1,O:43.2,N:0.1,S:0,ash:0.4' --moisture 20");
    ASSERT_EQ(run.exit_code, 0) << run.err;
    result = nlohmann::json::parse(run.out);
    EXPECT_NEAR(result.at("hhv_mj_per_kg").get<double>(), 20.23562 * 0.8, 1e-5);  // Channiwala & Parikh by hand
    EXPECT_FALSE(result.contains("hhv_kj_per_mol"));
}

TEST(cli, convert_prints_value_and_unit) {
    const auto run = run_cli("convert 1 therm kWh");
    ASSERT_EQ(run.exit_code, 0) << run.err;
    const auto result = nlohmann::json::parse(run.out);
    EXPECT_EQ(result.at("unit"), "kWh");
    EXPECT_NEAR(result.at("value").get<double>(), 29.30710701722, 1e-11);  // 105.505585262 MJ / 3.6 MJ
}

TEST(cli, bad_input_exits_2_with_errors_on_stdout_and_stderr) {
    auto run = run_cli("heating-value --formula Xy2");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_EQ(nlohmann::json::parse(run.out).at("errors").at(0).at("path"), "/formula");
    EXPECT_EQ(run.err.rfind("fuelwright: /formula: formula \"Xy2\": unknown element \"Xy\" at character 1;", 0), 0u)
        << run.err;
    run = run_cli("convert 1 therm furlongs");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_NE(run.err.find("unknown unit \"furlongs\"; accepted units (case-sensitive) are energy: J,"), std::string::npos);
    run = run_cli("convert nan therm kWh");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_EQ(run.err, "fuelwright: /value: VALUE must be a finite decimal number, got \"nan\"\n");
    run = run_cli("heating-value --formula CH4 --dhf inf");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_EQ(run.err, "fuelwright: --dhf: --dhf must be a finite decimal number, got \"inf\"\n");
    run = run_cli("heating-value --formula CH4 --colour blue");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_EQ(run.err.rfind("fuelwright: --colour: unknown option for heating-value; accepted: --formula,", 0), 0u);
    run = run_cli("heating-value --formula");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_EQ(run.err, "fuelwright: --formula: needs a value\n");
    run = run_cli("frobnicate");
    EXPECT_EQ(run.exit_code, 2);
    EXPECT_NE(run.err.find("unknown command \"frobnicate\""), std::string::npos);
}

}  // namespace

namespace {

TEST(cli, a_batch_of_scenarios_one_per_line_answers_every_line_in_order) {
    // Issue 15: a supplier re-prices stored quotes; a bad line gets its errors and the batch goes on.
    const char* data = std::getenv("FUELWRIGHT_DATA_DIR");
    ASSERT_NE(data, nullptr);
    std::ifstream file(std::string(data) + "/examples/maple-hollow-gas-vs-heat-pump.json");
    const auto scenario = nlohmann::json::parse(file);
    const std::string path = testing::TempDir() + "fuelwright_batch.ndjson";
    {
        std::ofstream out(path);
        out << scenario.dump() << "\n" << "{\"schema\": \"fuelwright.scenario/1\"}\n\n" << scenario.dump() << "\r\n";
    }
    for (const char* jobs : {"1", "3"}) {
        const auto run = run_cli(std::string("evaluate --ndjson --jobs ") + jobs + " '" + path + "'");
        EXPECT_EQ(run.exit_code, 2) << run.err;
        EXPECT_EQ(run.err, "fuelwright: 1 of 3 scenarios have errors\n");
        std::istringstream lines(run.out);
        std::vector<nlohmann::json> answers;
        for (std::string line; std::getline(lines, line);) answers.push_back(nlohmann::json::parse(line));
        ASSERT_EQ(answers.size(), 3u);
        EXPECT_EQ(answers[0].at("line"), 1);
        EXPECT_EQ(answers[1].at("line"), 2);
        EXPECT_EQ(answers[2].at("line"), 4);  // the blank line 3 is skipped
        EXPECT_EQ(answers[1].at("errors").at(0).at("path"), "/options");
        // Each answer is what `evaluate FILE` gives for that scenario, with its line number beside it.
        auto single = nlohmann::json::parse(run_cli("evaluate " + std::string(data) + "/examples/maple-hollow-gas-vs-heat-pump.json").out);
        single["line"] = 4;
        EXPECT_EQ(answers[2], single);
    }
    const auto bad = run_cli("evaluate --ndjson --jobs 0 -");
    EXPECT_EQ(bad.exit_code, 2);
    EXPECT_EQ(bad.err, "fuelwright: --jobs: --jobs must be a whole number from 1 to 256, got \"0\"\n");
}

TEST(cli, evaluate_lists_details_on_request_and_explain_gives_one_options_account) {
    const char* data = std::getenv("FUELWRIGHT_DATA_DIR");
    ASSERT_NE(data, nullptr);
    const std::string file = std::string(data) + "/examples/maple-hollow-heat-pump-bins.json";
    const auto lean = nlohmann::json::parse(run_cli("evaluate '" + file + "'").out);
    EXPECT_FALSE(lean.at("options").at(0).contains("trace"));
    const auto traced = run_cli("evaluate '" + file + "' --detail trace,sources");
    EXPECT_EQ(traced.exit_code, 0) << traced.err;
    const auto with = nlohmann::json::parse(traced.out);
    EXPECT_TRUE(with.at("options").at(0).contains("trace"));
    EXPECT_TRUE(with.at("options").at(0).contains("sources"));
    EXPECT_FALSE(with.at("options").at(1).contains("bins"));
    const auto bad = run_cli("evaluate '" + file + "' --detail charts");
    EXPECT_EQ(bad.exit_code, 2);
    EXPECT_EQ(bad.err, "fuelwright: /detail/0: unknown detail charts; accepted: trace, sources, bins, all\n");
    const auto explained = run_cli("explain '" + file + "' --option cold-climate-hp");
    EXPECT_EQ(explained.exit_code, 0) << explained.err;
    const auto account = nlohmann::json::parse(explained.out);
    EXPECT_EQ(account.at("option").at("id"), "cold-climate-hp");
    EXPECT_GT(account.at("option").at("bins").size(), 10u);
    EXPECT_EQ(account.at("option").at("annual_cost"), lean.at("options").at(1).at("annual_cost"));
}

TEST(cli, what_if_ranks_the_options_with_one_input_changed_and_refuses_an_impossible_value_at_value) {
    const char* data = std::getenv("FUELWRIGHT_DATA_DIR");
    ASSERT_NE(data, nullptr);
    const std::string file = std::string(data) + "/examples/maple-hollow-gas-vs-heat-pump.json";
    const auto run = run_cli("what-if '" + file + "' --vary price --of electricity --value 0.08");
    EXPECT_EQ(run.exit_code, 0) << run.err;
    const auto answer = nlohmann::json::parse(run.out);
    EXPECT_EQ(answer.at("unit"), "USD/kWh");
    EXPECT_EQ(answer.at("value"), 0.08);
    EXPECT_EQ(answer.at("ranking").at(0).at("id"), "heat-pump");
    EXPECT_EQ(answer.at("existing"), nullptr);
    const auto high = run_cli("what-if '" + file + "' --vary efficiency --of gas-furnace --value 120");
    EXPECT_EQ(high.exit_code, 2);
    EXPECT_EQ(high.err, "fuelwright: /value: AFUE is at most 100, got 120\n");
    const auto none = run_cli("what-if '" + file + "' --vary price --of electricity");
    EXPECT_EQ(none.err, "fuelwright: /value: is required (the value to try, in USD/kWh)\n");
}

}  // namespace

// Runs the mudepth binary for end-to-end tests and captures what it prints.
#pragma once

#include <string>
#include <vector>

#include <nlohmann/json.hpp>

namespace mudepth::test {

struct RunResult {
    int status = -1;  ///< exit status, or -1 if the process did not exit normally
    std::string out;
    std::string err;
};

/// Runs the built mudepth with the arguments (no shell involved).
RunResult run_mudepth(const std::vector<std::string>& args);

/// Runs mudepth, expects exit 0 and parses stdout as JSON.
nlohmann::json run_json(const std::vector<std::string>& args);

/// Checks a refusal: the exit status, nothing on stdout, exactly one stderr line
/// "mudepth: error: ..." containing `message`.
void expect_refusal(const RunResult& r, const std::string& message, int status = 2);

/// Runs a shell command line (for README examples), capturing stdout and stderr.
RunResult run_shell(const std::string& command_line);

}  // namespace mudepth::test

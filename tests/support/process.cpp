// Process helpers for end-to-end tests (POSIX fork/exec).
#include "support/process.hpp"

#include <fcntl.h>
#include <sys/wait.h>
#include <unistd.h>

#include <algorithm>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <stdexcept>

#include <gtest/gtest.h>

namespace mudepth::test {

namespace {

std::string slurp(const std::string& path) {
    std::ifstream in(path, std::ios::binary);
    std::ostringstream s;
    s << in.rdbuf();
    return s.str();
}

std::string temp_path(const char* tag) {
    char name[] = "/tmp/mudepth-test-XXXXXX";
    const int fd = mkstemp(name);
    if (fd < 0) throw std::runtime_error("mkstemp failed");
    close(fd);
    return std::string(name) + tag;
}

RunResult run_argv(const std::vector<std::string>& argv) {
    const std::string out_path = temp_path(".out");
    const std::string err_path = temp_path(".err");
    const pid_t pid = fork();
    if (pid == 0) {
        const int out_fd = open(out_path.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0600);
        const int err_fd = open(err_path.c_str(), O_WRONLY | O_CREAT | O_TRUNC, 0600);
        const int null_fd = open("/dev/null", O_RDONLY);
        dup2(out_fd, 1);
        dup2(err_fd, 2);
        dup2(null_fd, 0);
        std::vector<char*> args;
        for (const auto& a : argv) args.push_back(const_cast<char*>(a.c_str()));
        args.push_back(nullptr);
        execv(args[0], args.data());
        _exit(127);
    }
    int wstatus = 0;
    waitpid(pid, &wstatus, 0);
    RunResult r;
    r.status = WIFEXITED(wstatus) ? WEXITSTATUS(wstatus) : -1;
    r.out = slurp(out_path);
    r.err = slurp(err_path);
    std::remove(out_path.c_str());
    std::remove(err_path.c_str());
    return r;
}

}  // namespace

RunResult run_mudepth(const std::vector<std::string>& args) {
    std::vector<std::string> argv{MUDEPTH_BINARY};
    argv.insert(argv.end(), args.begin(), args.end());
    return run_argv(argv);
}

nlohmann::json run_json(const std::vector<std::string>& args) {
    const RunResult r = run_mudepth(args);
    EXPECT_EQ(r.status, 0) << r.err;
    try {
        return nlohmann::json::parse(r.out);
    } catch (const std::exception& e) {
        ADD_FAILURE() << "not JSON: " << e.what() << "\n" << r.out;
        return {};
    }
}

void expect_refusal(const RunResult& r, const std::string& message, int status) {
    EXPECT_EQ(r.status, status) << r.err;
    EXPECT_TRUE(r.out.empty()) << r.out;
    EXPECT_EQ(r.err.rfind("mudepth: error: ", 0), 0u) << r.err;
    EXPECT_EQ(std::count(r.err.begin(), r.err.end(), '\n'), 1) << r.err;
    EXPECT_NE(r.err.find(message), std::string::npos) << r.err;
}

RunResult run_shell(const std::string& command_line) {
    return run_argv({"/bin/sh", "-c", command_line});
}

}  // namespace mudepth::test

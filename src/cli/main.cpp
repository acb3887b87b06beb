// The mudepth command line: one binary, one subcommand per job. This list is
// also the index that `mudepth --help` prints.
#include <boost/version.hpp>
#include <cstdio>
#include <iostream>
#include <nlohmann/json.hpp>
#include <toml++/toml.h>

#include <CLI/CLI.hpp>

#include "cli/commands.hpp"
#include "mudepth/cross_section.hpp"
#include "mudepth/elements.hpp"
#include "mudepth/error.hpp"
#include "mudepth/version.hpp"

namespace {

struct Command {
    const char* name;
    const char* description;
    void (*register_command)(CLI::App&);
};

const Command kCommands[] = {
    {"mu", "Attenuation of a sample at one energy: mu/rho and its parts, mu, 1/mu, edges, refraction",
     mudepth::cli::register_mu},
    {"scan", "Attenuation versus energy over a range, with the edges crossed",
     mudepth::cli::register_scan},
    {"depth", "Depth probed versus 2-theta: symmetric, fixed and grazing incidence, tilts, the inverse",
     mudepth::cli::register_depth},
    {"film", "Layered films on a substrate: each layer's share of the diffracted signal",
     mudepth::cli::register_film},
    {"plate", "Flat-plate absorption factors: finite-thickness reflection, transmission, windows",
     mudepth::cli::register_plate},
    {"cylinder", "Capillary absorption factors A and A*, with the container wall (Paalman & Pings)",
     mudepth::cli::register_cylinder},
    {"correct", "Correct measured patterns for absorption; container subtraction; batches",
     mudepth::cli::register_correct},
    {"plan", "Sample planning: capillary diameter, dilution, plate thickness, powder mass, anode choice",
     mudepth::cli::register_plan},
    {"filter", "Kb filter foils: the element, the thickness for a Kb/Ka ratio, the Ka transmission",
     mudepth::cli::register_filter},
    {"materials", "List the built-in compositions, or show one", mudepth::cli::register_materials},
};

std::string version_text() {
    std::string text = "mudepth " + std::string(mudepth::kVersion) + "\n";
    text += "compiler: " MUDEPTH_CXX_COMPILER "\n";
    text += "libraries: CLI11 " CLI11_VERSION ", Boost " + std::to_string(BOOST_VERSION / 100000) + "." +
            std::to_string(BOOST_VERSION / 100 % 1000) + ", nlohmann-json " +
            std::to_string(NLOHMANN_JSON_VERSION_MAJOR) + "." + std::to_string(NLOHMANN_JSON_VERSION_MINOR) +
            ", toml++ " + std::to_string(TOML_LIB_MAJOR) + "." + std::to_string(TOML_LIB_MINOR) + "\n";
    text += "element data: " + std::string(mudepth::element_data_source()) + "\n";
    text += "cross sections: " + std::string(mudepth::cross_section_data_source());
    return text;
}

/// The error as one line: control characters (a newline inside an option value) are escaped.
int report(const std::string& message, int status) {
    std::string line;
    for (const char c : message) {
        const auto u = static_cast<unsigned char>(c);
        if (u < 0x20 || u == 0x7f) {
            char escaped[8];
            std::snprintf(escaped, sizeof escaped, "\\x%02x", u);
            line += escaped;
        } else {
            line += c;
        }
    }
    std::cerr << "mudepth: error: " << line << '\n';
    return status;
}

}  // namespace

int main(int argc, char** argv) {
    CLI::App app{"mudepth: X-ray attenuation, depth probed and absorption factors for powder and "
                 "thin-film diffraction.",
                 "mudepth"};
    app.set_version_flag("--version", version_text());
    app.require_subcommand(1);
    app.fallthrough(false);
    for (const auto& command : kCommands)
        command.register_command(*app.add_subcommand(command.name, command.description));
    app.footer("Run `mudepth COMMAND --help` for a command's options.");

    if (argc > 1 && argv[1][0] != '-') {
        bool known = false;
        std::string names;
        for (const auto& command : kCommands) {
            known = known || std::string_view(argv[1]) == command.name;
            names += (names.empty() ? "" : ", ") + std::string(command.name);
        }
        if (!known) return report("unknown command '" + std::string(argv[1]) + "'; commands: " + names, 2);
    }
    try {
        app.parse(argc, argv);
    } catch (const CLI::ParseError& e) {
        if (e.get_exit_code() == 0) return app.exit(e);  // --help, --version
        if (dynamic_cast<const CLI::RequiredError*>(&e) && app.get_subcommands().empty())
            return report("no command given; run `mudepth --help` for the list", 2);
        return report(e.what(), 2);
    } catch (const mudepth::InputError& e) {
        return report(e.what(), 2);
    } catch (const mudepth::FileError& e) {
        return report(e.what(), 3);
    } catch (const std::exception& e) {
        return report(std::string("internal error: ") + e.what(), 1);
    }
    return 0;
}

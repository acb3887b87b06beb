// Printing helpers of the command line: numbers with their units, aligned
// tables, CSV, and the cautions that go with transmissions.
#pragma once

#include <iosfwd>
#include <string>
#include <vector>

namespace mudepth::cli {

/// A number with `digits` significant digits, %g style: 231.4, 0.01234, 1.2e-05.
std::string fmt(double value, int digits = 5);

/// A number with a fixed count of decimals.
std::string fixed(double value, int decimals);

/// A length given in µm, printed in the unit that reads best (nm, µm, mm).
std::string length_from_um(double length_um, int digits = 4);

/// A table with a header row, printed with columns aligned (numbers right-aligned).
class Table {
public:
    explicit Table(std::vector<std::string> header) : header_(std::move(header)) {}
    void add(std::vector<std::string> row) { rows_.push_back(std::move(row)); }
    void print(std::ostream& out, const std::string& indent = "  ") const;
    /// The same data as CSV (header first).
    void print_csv(std::ostream& out) const;

private:
    std::vector<std::string> header_;
    std::vector<std::vector<std::string>> rows_;
};

/// Two-column "label  value" lines.
void print_field(std::ostream& out, const std::string& label, const std::string& value);

/// Prints a report as JSON, CSV or the human table, as the command's flags choose.
template <class Report, class Json, class Csv, class Human>
void print_report(const Report& report, bool json, bool csv, Json print_json, Csv print_csv, Human print_human) {
    if (json)
        print_json(report);
    else if (csv)
        print_csv(report);
    else
        print_human(report);
}

/// SPEC §5 cautions, for the README and the --help of commands printing transmissions.
extern const char* const kCautions;

}  // namespace mudepth::cli

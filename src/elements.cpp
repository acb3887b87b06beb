// Element lookup over the generated tables in src/data/element_data.cpp.
#include "mudepth/elements.hpp"

#include <string>
#include <vector>

#include "data/tables.hpp"
#include "mudepth/error.hpp"

namespace mudepth {

namespace {

std::string_view sv(const char* s) { return s ? std::string_view{s} : std::string_view{}; }

void check_atomic_number(int Z) {
    if (Z < 1 || Z > kMaxAtomicNumber)
        throw InputError("atomic number " + std::to_string(Z) + " is outside 1.." +
                         std::to_string(kMaxAtomicNumber));
}

struct Tables {
    std::array<ElementInfo, data::kElementCount> elements{};
    std::array<std::vector<EdgeInfo>, data::kElementCount> edges;
    std::array<std::vector<LineInfo>, data::kElementCount> lines;

    Tables() {
        for (int i = 0; i < data::kElementCount; ++i) {
            const auto& row = data::kElements[static_cast<std::size_t>(i)];
            elements[static_cast<std::size_t>(i)] =
                ElementInfo{row.Z, sv(row.symbol), row.molar_mass_g_mol, row.density_g_cm3};
            for (auto k = data::kEdgeBegin[static_cast<std::size_t>(i)];
                 k < data::kEdgeBegin[static_cast<std::size_t>(i) + 1]; ++k) {
                const auto& e = data::kEdges[k];
                edges[static_cast<std::size_t>(i)].push_back(
                    EdgeInfo{sv(e.level), e.energy_keV, e.fluorescence_yield, e.jump_ratio});
            }
            for (auto k = data::kLineBegin[static_cast<std::size_t>(i)];
                 k < data::kLineBegin[static_cast<std::size_t>(i) + 1]; ++k) {
                const auto& l = data::kLines[k];
                lines[static_cast<std::size_t>(i)].push_back(
                    LineInfo{sv(l.iupac), sv(l.siegbahn), sv(l.initial_level), sv(l.final_level),
                             l.energy_keV, l.relative_intensity});
            }
        }
    }
};

const Tables& tables() {
    static const Tables t;
    return t;
}

std::size_t index(int Z) {
    check_atomic_number(Z);
    return static_cast<std::size_t>(Z - 1);
}

}  // namespace

const ElementInfo& element(int Z) { return tables().elements[index(Z)]; }

std::optional<int> atomic_number(std::string_view symbol) {
    for (const auto& e : tables().elements)
        if (e.symbol == symbol) return e.Z;
    return std::nullopt;
}

std::span<const EdgeInfo> edges(int Z) { return tables().edges[index(Z)]; }

const EdgeInfo* find_edge(int Z, std::string_view level) {
    for (const auto& e : edges(Z))
        if (e.level == level) return &e;
    return nullptr;
}

std::span<const LineInfo> lines(int Z) { return tables().lines[index(Z)]; }

const LineInfo* find_line(int Z, std::string_view name) {
    for (const auto& l : lines(Z))
        if (l.iupac == name || l.siegbahn == name) return &l;
    return nullptr;
}

std::string_view element_data_source() { return data::kElementDataSource; }

}  // namespace mudepth

# Writes a C++ file holding the text of every compositions/*.toml file, so the
# built-in library needs no data file at run time. Called at build time with
# -DOUTPUT=... -DSOURCE_DIR=...
file(GLOB files "${SOURCE_DIR}/*.toml")
list(SORT files)
set(body "// GENERATED at build time by cmake/embed_compositions.cmake from compositions/*.toml.\n")
string(APPEND body "#include <string_view>\n#include <utility>\n#include <vector>\n\n")
string(APPEND body "namespace mudepth::data {\n\n")
string(APPEND body "const std::vector<std::pair<std::string_view, std::string_view>>& builtin_composition_texts() {\n")
string(APPEND body "    static const std::vector<std::pair<std::string_view, std::string_view>> texts = {\n")
foreach(f IN LISTS files)
  get_filename_component(stem "${f}" NAME_WLE)
  file(READ "${f}" text)
  # A raw string literal with a delimiter that cannot appear in the files.
  string(APPEND body "        {\"${stem}\", R\"mudepth(${text})mudepth\"},\n")
endforeach()
string(APPEND body "    };\n    return texts;\n}\n\n}  // namespace mudepth::data\n")
file(WRITE "${OUTPUT}.tmp" "${body}")
file(COPY_FILE "${OUTPUT}.tmp" "${OUTPUT}" ONLY_IF_DIFFERENT)
file(REMOVE "${OUTPUT}.tmp")

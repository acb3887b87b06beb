// Placeholder: being written.
#include "mudepth/cross_section.hpp"

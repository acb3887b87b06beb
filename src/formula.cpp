// Placeholder: being written.
#include "mudepth/formula.hpp"

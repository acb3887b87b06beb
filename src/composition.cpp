// Placeholder: being written.
#include "mudepth/composition.hpp"

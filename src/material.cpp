// Placeholder: being written.
#include "mudepth/material.hpp"

// The check every unit test of a refusal makes: the call throws InputError and
// the message holds the expected text.
#pragma once

#include <gtest/gtest.h>

#include <string>

#include "mudepth/error.hpp"

namespace mudepth::test {

inline void expect_input_error(auto f, const std::string& text) {
    try {
        f();
        ADD_FAILURE() << "no error; expected: " << text;
    } catch (const InputError& e) {
        EXPECT_NE(std::string(e.what()).find(text), std::string::npos) << e.what();
    }
}

}  // namespace mudepth::test

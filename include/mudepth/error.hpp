// The error types mudepth throws. The library never prints and never exits:
// the command line maps InputError to exit status 2 and FileError to 3.
#pragma once

#include <stdexcept>
#include <string>

namespace mudepth {

/// Base of every error mudepth throws on purpose.
class Error : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

/// The user gave something the program cannot accept (bad formula, value out of range).
class InputError : public Error {
public:
    using Error::Error;
};

/// A file could not be read or written.
class FileError : public Error {
public:
    using Error::Error;
};

}  // namespace mudepth

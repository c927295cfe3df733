// Catch2 v2 (the version Debian ships) test runner.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>

#include "reference_csv.hpp"

namespace colligate_test {
// COLLIGATE_REFERENCE_DIR is defined for this file only (tests/cpp/CMakeLists.txt).
const char* reference_dir() { return COLLIGATE_REFERENCE_DIR; }
}  // namespace colligate_test

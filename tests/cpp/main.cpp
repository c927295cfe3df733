// Catch2 v2 (the version Debian ships) test runner.
#define CATCH_CONFIG_MAIN
#include <catch2/catch.hpp>

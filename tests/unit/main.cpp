/// @brief The doctest main; the test cases live in the other files of this folder.
#define DOCTEST_CONFIG_IMPLEMENT_WITH_MAIN
#include <doctest/doctest.h>

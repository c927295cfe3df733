#pragma once
/// \file errors.hpp
/// Typed errors. Caller mistakes throw; solvers that fail to converge return a status.
///
/// - invalid_input: a caller mistake (negative amount, unknown solute, fractions above 1).
///   Derives from std::invalid_argument, so Python sees ValueError.
/// - out_of_validity_range: a model asked outside its validated range under the
///   `raise` policy. Derives from std::domain_error (never std::out_of_range, which
///   pybind11 maps to IndexError).
/// - convergence_error: thrown only by convenience wrappers that promise a value.

#include <sstream>
#include <stdexcept>
#include <string>

namespace colligate {

class invalid_input : public std::invalid_argument {
 public:
  using std::invalid_argument::invalid_argument;
};

class out_of_validity_range : public std::domain_error {
 public:
  using std::domain_error::domain_error;
};

class convergence_error : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

namespace detail {

/// Formats "function: field = value: reason".
inline std::string describe(const std::string& where, const std::string& field, double value,
                            const std::string& reason) {
  std::ostringstream os;
  os.precision(10);
  os << where << ": " << field << " = " << value << ": " << reason;
  return os.str();
}

}  // namespace detail
}  // namespace colligate

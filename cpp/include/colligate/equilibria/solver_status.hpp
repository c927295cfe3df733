#pragma once
/// \file solver_status.hpp
/// Status of an equilibrium solve. Non-convergence is a status, not an exception.

namespace colligate::equilibria {

enum class solve_status {
  converged,          ///< root found to tolerance
  not_frozen,         ///< no ice at this temperature (above the freezing point)
  below_search_limit, ///< the solution does not freeze above the lowest temperature searched
  max_iterations,     ///< the root finder stopped before reaching the tolerance
  below_eutectic      ///< a salt would crystallise from the unfrozen phase (below the eutectic)
};

inline const char* to_string(solve_status s) {
  switch (s) {
    case solve_status::converged: return "converged";
    case solve_status::not_frozen: return "not_frozen";
    case solve_status::below_search_limit: return "below_search_limit";
    case solve_status::max_iterations: return "max_iterations";
    case solve_status::below_eutectic: return "below_eutectic";
  }
  return "unknown";
}

}  // namespace colligate::equilibria

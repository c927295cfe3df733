#pragma once
/// \file seawater_freezing_points.hpp
/// Freezing points of seawater of the Reference Composition given by absolute salinity
/// alone, over arrays: the salinities on the model's freezing line
/// (equilibria/seawater_freezing_line.hpp) are read from it, a few rows side by side so
/// that their Clenshaw recurrences overlap; the others (above the line's range) go through
/// the exact batch path (kernels.hpp freezing_points on solution::seawater rows). A row's
/// value does not depend on the thread count nor on its neighbours, and equals the scalar
/// line's (or the scalar exact path's) bit for bit.

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdint>
#include <exception>
#include <optional>
#include <string>
#include <thread>
#include <vector>

#include "colligate/batch/kernels.hpp"
#include "colligate/batch/solution_batch.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/equilibria/seawater_freezing_line.hpp"

namespace colligate::batch {

namespace detail {

/// Rows read from the line at a time (independent recurrences the processor overlaps).
inline constexpr std::size_t line_block_rows = 4;

/// out[i] = line(SA[i]) for rows [lo, hi) with flag[i] set, block by block. Each row's
/// arithmetic is that of seawater_freezing_line::operator() (variable(), then series()).
inline void read_line(const equilibria::seawater_freezing_line& line, const double* SA,
                      const std::uint8_t* on_line, std::size_t lo, std::size_t hi, double* out) {
  constexpr std::size_t B = line_block_rows;
  constexpr int n = equilibria::seawater_freezing_line::nodes;
  const auto& c = line.coefficients();
  std::size_t i = lo;
  for (; i + B <= hi; i += B) {
    std::array<double, B> u{}, u2{}, b1{}, b2{};
    for (std::size_t r = 0; r < B; ++r) {
      // Rows off the line or at SA = 0 run the recurrence on a harmless u and are
      // overwritten below.
      u[r] = on_line[i + r] && SA[i + r] > 0.0 ? equilibria::seawater_freezing_line::variable(SA[i + r]) : 0.0;
      u2[r] = 2.0 * u[r];
    }
    for (int j = n - 1; j >= 1; --j)
      for (std::size_t r = 0; r < B; ++r) {
        const double b0 = c[j] + u2[r] * b1[r] - b2[r];
        b2[r] = b1[r];
        b1[r] = b0;
      }
    for (std::size_t r = 0; r < B; ++r) {
      if (!on_line[i + r]) continue;
      out[i + r] = SA[i + r] == 0.0 ? constants::ice_point : c[0] + u[r] * b1[r] - b2[r];
    }
  }
  for (; i < hi; ++i)
    if (on_line[i]) out[i] = line(SA[i]);
}

/// Rows `which` of SA solved by the exact batch path (kernels.hpp freezing_points) on the
/// molalities of solution::seawater(SA) under model `m`.
inline void seawater_rows_exact(const models::model_choice& m, const double* SA,
                                const std::vector<std::size_t>& which, const options& opt,
                                double* out, std::uint8_t* status) {
  if (which.empty()) return;
  const solution ref = solution::seawater(35.0);
  std::vector<std::string> species;
  for (const auto& r : ref.species()) species.push_back(r.id);
  std::vector<double> molalities;
  molalities.reserve(which.size() * species.size());
  for (std::size_t i : which) {
    const solution s = solution::seawater(SA[i]);
    for (std::size_t k = 0; k < s.size(); ++k) molalities.push_back(s.molality(k));
  }
  const auto b = solution_batch::from_molalities(species, molalities.data(), which.size());
  std::vector<double> v(which.size());
  std::vector<std::uint8_t> st(which.size());
  freezing_points(b, m, opt, v.data(), st.data());
  for (std::size_t k = 0; k < which.size(); ++k) {
    out[which[k]] = v[k];
    status[which[k]] = st[k];
  }
}

}  // namespace detail

/// Freezing points (first solid; ice for every salinity on the line) of
/// solution::seawater(SA[i]) for `rows` absolute salinities in g/kg, K, into out[i], with a
/// row_status per row (a salinity that is not finite or outside [0, 120) g/kg: NaN,
/// invalid_input). Rows with SA <= seawater_freezing_line::max_salinity are read from
/// `line`, the others solved by the exact batch path under line.model() with the options'
/// range policy and threads. The line rows are in the model's validated range (the line
/// checks that when built).
inline void seawater_freezing_points(const equilibria::seawater_freezing_line& line, const double* SA,
                                     std::size_t rows, const options& opt, double* out,
                                     std::uint8_t* status) {
  std::vector<std::uint8_t> on_line(rows, 0);
  std::vector<std::size_t> exact_rows;
  for (std::size_t i = 0; i < rows; ++i) {
    const double v = SA[i];
    out[i] = detail::nan;
    if (!(std::isfinite(v) && v >= 0.0 && v < equilibria::seawater_salinity_limit)) {
      status[i] = static_cast<std::uint8_t>(row_status::invalid_input);
    } else if (v <= equilibria::seawater_freezing_line::max_salinity) {
      on_line[i] = 1;
      status[i] = static_cast<std::uint8_t>(row_status::ok);
    } else {
      exact_rows.push_back(i);
    }
  }
  // The line rows: contiguous shares, one per thread, in whole blocks.
  const std::size_t blocks = (rows + detail::line_block_rows - 1) / detail::line_block_rows;
  const unsigned T = detail::thread_count(opt.threads, std::max<std::size_t>(blocks / 4096, 1));
  if (T <= 1) {
    detail::read_line(line, SA, on_line.data(), 0, rows, out);
  } else {
    const std::size_t share = (blocks + T - 1) / T * detail::line_block_rows;
    std::vector<std::thread> pool;
    for (unsigned t = 1; t < T; ++t) {
      const std::size_t lo = std::min(rows, t * share), hi = std::min(rows, lo + share);
      if (lo < hi)
        pool.emplace_back([&, lo, hi] { detail::read_line(line, SA, on_line.data(), lo, hi, out); });
    }
    detail::read_line(line, SA, on_line.data(), 0, std::min(rows, share), out);
    for (auto& th : pool) th.join();
  }
  detail::seawater_rows_exact(line.model(), SA, exact_rows, opt, out, status);
}

/// The same with the default line (Pitzer, default parameter set).
inline void seawater_freezing_points(const double* SA, std::size_t rows, const options& opt,
                                     double* out, std::uint8_t* status) {
  seawater_freezing_points(equilibria::default_seawater_freezing_line(), SA, rows, opt, out, status);
}

/// The same under model `m`: 'pitzer' or 'auto' without a parameter set read the default
/// line; another set builds its own line (a few milliseconds) and, when it has none (a salt
/// before ice, or the set's validated range missed on the line: invalid_input from the
/// line), every row goes through the exact path.
inline void seawater_freezing_points(const models::model_choice& m, const double* SA,
                                     std::size_t rows, const options& opt, double* out,
                                     std::uint8_t* status) {
  if ((m.id() == "pitzer" || m.is_auto()) && m.options().parameter_set.empty()) {
    seawater_freezing_points(SA, rows, opt, out, status);
    return;
  }
  std::optional<equilibria::seawater_freezing_line> line;
  try {
    line.emplace(m);
  } catch (const invalid_input&) {
    std::vector<std::size_t> all;
    for (std::size_t i = 0; i < rows; ++i) {
      out[i] = detail::nan;
      if (std::isfinite(SA[i]) && SA[i] >= 0.0 && SA[i] < equilibria::seawater_salinity_limit)
        all.push_back(i);
      else
        status[i] = static_cast<std::uint8_t>(row_status::invalid_input);
    }
    detail::seawater_rows_exact(m, SA, all, opt, out, status);
    return;
  }
  seawater_freezing_points(*line, SA, rows, opt, out, status);
}

}  // namespace colligate::batch

#pragma once
/// \file kernels.hpp
/// Multi-threaded batch kernels over a solution_batch: freezing point, water activity and
/// ice fraction at a list of temperatures. Each thread reuses one solution workspace and one
/// prepared ln a_w evaluator (no heap allocation per row for Pitzer or Norrish rows inside
/// the validated range); rows are independent and
/// each is computed by the same scalar code as a single call, so results are bit-identical
/// whatever the thread count. A row that fails gets NaN and a row_status; it never aborts
/// the batch.
///
/// Interruption. A caller may give options::interrupted, a hook called from the calling
/// thread about every 50 ms while the rows run (the Python bindings check for Ctrl-C
/// there). When it returns true the workers stop after their current row (or
/// temperature), every thread is joined and batch::interrupted is thrown; the outputs are
/// then incomplete. The hook may also throw: the workers are stopped the same way and its
/// exception reaches the caller.

#include <algorithm>
#include <atomic>
#include <chrono>
#include <cmath>
#include <condition_variable>
#include <cstdint>
#include <exception>
#include <functional>
#include <limits>
#include <memory>
#include <mutex>
#include <optional>
#include <stdexcept>
#include <thread>
#include <vector>

#include "colligate/batch/solution_batch.hpp"
#include "colligate/core/bound_water.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/solution_workspace.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_curve.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/equilibria/salt_equilibrium.hpp"
#include "colligate/models/water_activity.hpp"

namespace colligate::batch {

struct options {
  unsigned threads = 0;  ///< 0: all hardware threads
  range_policy policy = range_policy::extrapolate;
  /// Water that cannot freeze, kg per kg of each row's water (core/bound_water.hpp), in [0, 1).
  double bound_water_fraction_of_water = 0.0;
  /// Called from the calling thread between pieces of work (about every 50 ms); true
  /// stops the batch (batch::interrupted). Empty: never interrupted.
  std::function<bool()> interrupted;
  /// water_activities: a row above a salt's solubility gives the a_w of its equilibrium
  /// state, salt crystallised (equilibria/salt_equilibrium.hpp), as the scalar default;
  /// false gives the metastable value of the row as one liquid.
  bool salts_crystallise = true;
};

/// A batch stopped by options::interrupted; its outputs are incomplete.
class interrupted : public std::runtime_error {
 public:
  interrupted() : std::runtime_error("batch calculation interrupted") {}
};

namespace detail {

/// A thread's rows: one solution overwritten row by row (core/solution_workspace.hpp) and
/// the evaluator and ice curve prepared for its species.
class workspace {
 public:
  workspace(const solution_batch& b, const std::atomic<bool>* stop)
      : rows_(b.species()), s_(rows_.get()), stop_(stop) {}
  /// Row i of the batch (its amounts and water, as the scalar factory builds them).
  const solution& load(const solution_batch& b, std::size_t i) {
    return rows_.load(b.row(i), b.water(i));
  }
  /// True once the batch was interrupted: a long row stops early (its outputs are lost).
  bool stopped() const noexcept { return stop_ && stop_->load(std::memory_order_relaxed); }
  /// ln a_w evaluator for model `m` on this workspace's solution, prepared on first use
  /// (the species list is the same for every row; the evaluator reads each row's amounts).
  models::ln_water_activity_evaluator& evaluator(const models::model_choice& m) {
    if (evaluator_ && last_requested_ == &m) return *evaluator_;  // the same choice as the last row
    if (!evaluator_ || !(requested_ == m)) {
      evaluator_.emplace(m, s_);
      requested_ = m;
    }
    last_requested_ = &m;
    return *evaluator_;
  }
  /// The ice curve of the row loaded last (prepared on first use for the species list,
  /// reset for each row's amounts).
  equilibria::ice_curve& curve(const models::model_choice& m, double bound_water_kg) {
    if (curve_ && last_curve_requested_ == &m) {  // the same choice as the last row
      curve_->reset(bound_water_kg);
      return *curve_;
    }
    last_curve_requested_ = &m;
    if (!curve_ || !(curve_model_ == m)) {
      // A non-owning view of this workspace's solution: the curve follows its amounts.
      curve_.emplace(std::shared_ptr<const solution>(&s_, [](const solution*) {}), m,
                     bound_water_kg, equilibria::crystallisation_path::equilibrium);
      curve_model_ = m;
    } else {
      curve_->reset(bound_water_kg);
    }
    return *curve_;
  }

 private:
  solution_workspace rows_;
  const solution& s_;
  const std::atomic<bool>* stop_ = nullptr;
  std::optional<models::ln_water_activity_evaluator> evaluator_;
  models::model_choice requested_ = "auto";
  const models::model_choice* last_requested_ = nullptr;  ///< the object asked for last (a batch passes one)
  std::optional<equilibria::ice_curve> curve_;
  models::model_choice curve_model_ = "auto";
  const models::model_choice* last_curve_requested_ = nullptr;  ///< as last_requested_
};

/// Most threads a batch call starts: eight per hardware thread (at least 8), never more
/// than rows. A larger request is capped, not refused (more threads than that only add
/// start-up cost).
inline unsigned max_threads() {
  return 8u * std::max(1u, std::thread::hardware_concurrency());
}

inline unsigned thread_count(unsigned requested, std::size_t rows) {
  unsigned n = requested ? requested : std::max(1u, std::thread::hardware_concurrency());
  n = std::min(n, max_threads());
  return static_cast<unsigned>(std::min<std::size_t>(n, std::max<std::size_t>(rows, 1)));
}

/// Rows whose one-byte status entries fill a 64-byte cache line: the row ranges given to
/// threads start at multiples of it, so two threads never write the same line of a status
/// column (nor, beyond its first and last line, of an 8-byte value column); writes to a
/// line shared between two cores' caches were a cause of poor 2-thread scaling.
inline constexpr std::size_t rows_per_line = 64;

/// A thread's contiguous share of the rows, rounded up to whole lines when that moves
/// little work between threads (a share of 256 rows or more).
inline std::size_t round_up_to_lines(std::size_t rows) {
  if (rows < 4 * rows_per_line) return rows;
  return (rows + rows_per_line - 1) / rows_per_line * rows_per_line;
}

/// Rows per piece handed out from the shared counter (interruptible path): about 32 pieces
/// per thread for load balance, in whole multiples of rows_per_line once there are enough
/// rows (fewer, cheaper pieces also touch the shared counter less often); small batches keep
/// pieces of at least one row so that every thread gets work.
inline std::size_t piece_rows(std::size_t rows, unsigned threads) {
  const std::size_t target = rows / (32 * static_cast<std::size_t>(std::max(1u, threads)));
  if (target >= rows_per_line) return target / rows_per_line * rows_per_line;
  return std::max<std::size_t>(1, std::min<std::size_t>(target, 16));
}

/// Runs body(workspace&, lo, hi) over all rows, in blocks [lo, hi) of `block_rows` rows
/// (the last one shorter), each block given to one thread whole. Without an interruption
/// hook: contiguous chunks of blocks, one per thread, of round_up_to_lines() blocks (the
/// calling thread alone when one thread is asked). With one: the blocks go out in pieces of
/// piece_rows() blocks to worker threads while the calling thread waits and calls the hook
/// about every 50 ms; a stopped batch ends after the block under way. Rows are independent,
/// so the results do not depend on how they are split. An exception in a worker (a caller
/// mistake found while preparing the model, say) reaches the caller as the same exception
/// the serial path throws: each worker keeps its first one (std::exception_ptr), every
/// started thread is joined, then the first is rethrown.
template <class BlockBody>
void parallel_row_blocks(const solution_batch& b, unsigned threads,
                         const std::function<bool()>& interrupted_hook, std::size_t block_rows,
                         BlockBody body) {
  const std::size_t rows = b.rows();
  const std::size_t N = (rows + block_rows - 1) / block_rows;  // blocks
  const auto rows_of = [rows, block_rows](std::size_t k, std::size_t& lo, std::size_t& hi) {
    lo = k * block_rows;
    hi = std::min(rows, lo + block_rows);
  };
  const unsigned T = thread_count(threads, N);
  std::atomic<bool> stop{false};
  if (!interrupted_hook) {
    auto run = [&](std::size_t lo, std::size_t hi) {
      workspace ws(b, nullptr);
      for (std::size_t k = lo; k < hi; ++k) {
        std::size_t r0, r1;
        rows_of(k, r0, r1);
        body(ws, r0, r1);
      }
    };
    if (T <= 1) {
      run(0, N);
      return;
    }
    std::vector<std::exception_ptr> errors(T);
    std::vector<std::thread> pool;
    pool.reserve(T);
    const std::size_t chunk = round_up_to_lines((N + T - 1) / T);
    std::exception_ptr start_error;
    for (unsigned t = 0; t < T; ++t) {
      const std::size_t lo = t * chunk, hi = std::min(N, lo + chunk);
      if (lo >= hi) break;
      try {
        pool.emplace_back([&run, &errors, t, lo, hi] {
          try {
            run(lo, hi);
          } catch (...) {
            errors[t] = std::current_exception();
          }
        });
      } catch (...) {  // the system refused a thread: finish what started, then report
        start_error = std::current_exception();
        break;
      }
    }
    for (auto& th : pool) th.join();
    for (const auto& e : errors)
      if (e) std::rethrow_exception(e);
    if (start_error) std::rethrow_exception(start_error);
    return;
  }
  // With the hook: workers take pieces of rows from a shared counter.
  const std::size_t piece = piece_rows(N, T);
  std::atomic<std::size_t> next{0};
  std::mutex mutex;
  std::condition_variable done_cv;
  unsigned running = 0;
  std::vector<std::exception_ptr> errors(T);
  std::vector<std::thread> pool;
  pool.reserve(T);
  auto worker = [&](unsigned t) {
    try {
      workspace ws(b, &stop);
      for (;;) {
        if (stop.load(std::memory_order_relaxed)) break;
        const std::size_t lo = next.fetch_add(piece);
        if (lo >= N) break;
        const std::size_t hi = std::min(N, lo + piece);
        for (std::size_t k = lo; k < hi && !stop.load(std::memory_order_relaxed); ++k) {
          std::size_t r0, r1;
          rows_of(k, r0, r1);
          body(ws, r0, r1);
        }
      }
    } catch (...) {
      errors[t] = std::current_exception();
      stop = true;
    }
    std::lock_guard<std::mutex> lock(mutex);
    --running;
    done_cv.notify_all();
  };
  std::exception_ptr caller_error;
  bool was_interrupted = false;
  for (unsigned t = 0; t < T; ++t) {
    try {
      {
        std::lock_guard<std::mutex> lock(mutex);
        ++running;
      }
      pool.emplace_back(worker, t);
    } catch (...) {
      std::lock_guard<std::mutex> lock(mutex);
      --running;
      if (pool.empty()) caller_error = std::current_exception();
      break;
    }
  }
  for (;;) {
    {
      std::unique_lock<std::mutex> lock(mutex);
      if (done_cv.wait_for(lock, std::chrono::milliseconds(50), [&] { return running == 0; }))
        break;
    }
    if (caller_error || was_interrupted) continue;
    try {
      if (interrupted_hook()) {
        was_interrupted = true;
        stop = true;
      }
    } catch (...) {
      caller_error = std::current_exception();
      stop = true;
    }
  }
  for (auto& th : pool) th.join();
  if (caller_error) std::rethrow_exception(caller_error);
  if (was_interrupted) throw interrupted();
  for (const auto& e : errors)
    if (e) std::rethrow_exception(e);
}

/// Runs body(workspace&, row) over all rows (parallel_row_blocks with blocks of one row).
template <class Body>
void parallel_rows(const solution_batch& b, unsigned threads,
                   const std::function<bool()>& interrupted_hook, Body body) {
  parallel_row_blocks(b, threads, interrupted_hook, 1,
                      [&body](workspace& ws, std::size_t lo, std::size_t) { body(ws, lo); });
}

constexpr double nan = std::numeric_limits<double>::quiet_NaN();

inline double policy_value(double value, bool in_range, range_policy policy, row_status& st) {
  if (in_range) return value;
  st = row_status::out_of_range;
  return policy == range_policy::nan ? nan : value;
}

/// Rows a thread takes at a time where a kernel runs its rows by stages.
inline constexpr std::size_t ice_line_block_rows = 8;

/// Freezing points of rows [lo, hi) (at most ice_line_block_rows) under a model whose ln a_w
/// does not depend on T, by the steps of equilibria::freezing_point for such models run
/// row by row, one step at a time: ln a_w at the ice point of each row, then the ice line
/// read backwards for each (equilibria::temperature_on_ice_line_searched), then each row's
/// validity (equilibria::freezing_point_on_ice_line, the row loaded again). A row's
/// arithmetic is that of the scalar call, so its result is the same bit for bit; what
/// changes is the order: the rows' latency chains (a logarithm, a Clenshaw recurrence, a
/// Newton step, each waiting on the last) are independent and overlap in the processor,
/// where one row alone leaves it waiting. `store(i, status, result)` writes a row.
template <class Store>
void freezing_points_on_ice_line(const solution_batch& b, workspace& ws,
                                 models::ln_water_activity_evaluator& ln_aw, const options& opt,
                                 std::size_t lo, std::size_t hi, const Store& store) {
  constexpr std::size_t B = ice_line_block_rows;
  double water[B], ln_aw_0[B], T[B];
  bool solve[B];
  for (std::size_t i = lo; i < hi; ++i) {
    const std::size_t k = i - lo;
    solve[k] = false;
    const row_status st = b.input_status(i);
    if (st != row_status::ok) {
      store(i, st, equilibria::freezing_point_result{});
      continue;
    }
    const solution& s = ws.load(b, i);
    water[k] = equilibria::detail::freezable_water(
        "freezing_point", s, bound_water_kg(s, opt.bound_water_fraction_of_water));
    if (equilibria::detail::without_solutes(s)) {
      equilibria::freezing_point_result r;
      r.temperature = constants::ice_point;
      store(i, st, r);
      continue;
    }
    ln_aw_0[k] = ln_aw(water[k], constants::ice_point);
    solve[k] = true;
  }
  for (std::size_t k = 0; k < hi - lo; ++k)
    if (solve[k]) T[k] = equilibria::temperature_on_ice_line_searched(ln_aw_0[k]);
  for (std::size_t i = lo; i < hi; ++i) {
    const std::size_t k = i - lo;
    if (!solve[k]) continue;
    ws.load(b, i);
    store(i, row_status::ok, equilibria::freezing_point_on_ice_line(T[k], water[k], ln_aw));
  }
}

}  // namespace detail

/// Initial freezing points, K (the first solid: for a row richer in salt than its eutectic
/// composition, the salt's crystallisation temperature unless opt.salts_crystallise is
/// false). `out` and `status` hold rows() entries.
inline void freezing_points(const solution_batch& b, const models::model_choice& m, const options& opt,
                            double* out, std::uint8_t* status) {
  if (opt.policy == range_policy::raise)
    throw invalid_input("batch kernels: range_policy 'raise' is not available for batches; "
                        "use 'extrapolate' or 'nan' and read the row status");
  check_bound_water_fraction_of_water("freezing_points", opt.bound_water_fraction_of_water);
  // One species list for every row: whether a salt may form first is decided once.
  const bool salt_path = opt.salts_crystallise && b.has_electrolytes();
  // A row's result as its value and status.
  const auto store = [&](std::size_t i, row_status st, const equilibria::freezing_point_result& r) {
    double v = detail::nan;
    if (st == row_status::ok) {
      if (r.status == equilibria::solve_status::below_search_limit) st = row_status::no_freezing_point;
      else if (r.check.code == validity_code::outside_physical_bounds) st = row_status::no_physical_value;
      else if (!r.success()) st = row_status::not_converged;
      else v = detail::policy_value(r.temperature, r.check.in_range(), opt.policy, st);
    }
    out[i] = v;
    status[i] = static_cast<std::uint8_t>(st);
  };
  detail::parallel_row_blocks(b, opt.threads, opt.interrupted, detail::ice_line_block_rows,
                              [&](detail::workspace& ws, std::size_t lo, std::size_t hi) {
    if (!salt_path) {
      // The model is prepared on the block's first valid row, as the scalar call prepares
      // it on its solution; one whose ln a_w does not depend on T is solved by stages.
      for (std::size_t i = lo; i < hi; ++i) {
        if (b.input_status(i) != row_status::ok) continue;
        ws.load(b, i);
        if (!ws.evaluator(m).model().traits.temperature_dependent) {
          detail::freezing_points_on_ice_line(b, ws, ws.evaluator(m), opt, lo, hi, store);
          return;
        }
        break;
      }
    }
    for (std::size_t i = lo; i < hi; ++i) {
      row_status st = b.input_status(i);
      equilibria::freezing_point_result r;
      if (st == row_status::ok) {
        const solution& s = ws.load(b, i);
        const double bound = bound_water_kg(s, opt.bound_water_fraction_of_water);
        if (salt_path) {
          // As the scalar default: a salt that forms before ice gives its crystallisation
          // temperature (equilibria::ice_curve::salt_first, on the same curve and evaluator).
          auto& curve = ws.curve(m, bound);
          const auto first = curve.salt_first();
          if (first.phase != nullptr) {
            double v = detail::nan;
            if (std::isnan(first.temperature)) st = row_status::out_of_range;
            else v = detail::policy_value(first.temperature, first.check.in_range(), opt.policy, st);
            out[i] = v;
            status[i] = static_cast<std::uint8_t>(st);
            continue;
          }
          r = curve.initial_freezing_point();  // ice first: the curve's freezing point
        } else {
          r = equilibria::freezing_point(s, m, bound, ws.evaluator(m));
        }
      }
      store(i, st, r);
    }
  });
}

/// Water activity at temperature T (K), no ice.
inline void water_activities(const solution_batch& b, double temperature, const models::model_choice& m,
                             const options& opt, double* out, std::uint8_t* status) {
  models::check_temperature_argument("water_activities", temperature);
  if (opt.policy == range_policy::raise)
    throw invalid_input("batch kernels: range_policy 'raise' is not available for batches");
  detail::parallel_rows(b, opt.threads, opt.interrupted, [&](detail::workspace& ws, std::size_t i) {
    row_status st = b.input_status(i);
    double v = detail::nan;
    if (st == row_status::ok) {
      const solution& s = ws.load(b, i);
      if (opt.salts_crystallise) {
        // The scalar equilibria::water_activity_at_equilibrium on the same evaluator.
        const auto r = equilibria::water_activity_at_equilibrium(ws.evaluator(m), s, temperature,
                                                                 range_policy::extrapolate);
        if (r.check.code == validity_code::outside_physical_bounds)
          st = row_status::no_physical_value;
        else if (r.check.code == validity_code::not_converged)
          st = row_status::not_converged;
        else
          v = detail::policy_value(r.value, r.check.in_range(), opt.policy, st);
      } else {
        const double aw = std::exp(ws.evaluator(m)(s.water_mass(), temperature));
        if (!(aw > 0.0 && aw <= 1.0))
          st = row_status::no_physical_value;
        else
          v = detail::policy_value(aw, ws.evaluator(m).check(s.water_mass(), temperature).in_range(),
                                   opt.policy, st);
      }
    }
    out[i] = v;
    status[i] = static_cast<std::uint8_t>(st);
  });
}

/// Ice fraction (ice / total water) at each of `n_temperatures` temperatures (K):
/// `out` and `status` are rows() x n_temperatures, row-major.
inline void ice_fractions(const solution_batch& b, const double* temperatures,
                          std::size_t n_temperatures, const models::model_choice& m, const options& opt,
                          double* out, std::uint8_t* status) {
  for (std::size_t k = 0; k < n_temperatures; ++k)
    models::check_temperature_argument("ice_fractions", temperatures[k]);
  if (opt.policy == range_policy::raise)
    throw invalid_input("batch kernels: range_policy 'raise' is not available for batches");
  check_bound_water_fraction_of_water("ice_fractions", opt.bound_water_fraction_of_water);
  detail::parallel_rows(b, opt.threads, opt.interrupted, [&](detail::workspace& ws, std::size_t i) {
    const row_status input = b.input_status(i);
    const solution* s = input == row_status::ok ? &ws.load(b, i) : nullptr;
    equilibria::ice_curve* curve =
        s ? &ws.curve(m, bound_water_kg(*s, opt.bound_water_fraction_of_water)) : nullptr;
    for (std::size_t k = 0; k < n_temperatures; ++k) {
      row_status st = input;
      double v = detail::nan;
      if (curve && !ws.stopped()) {
        const auto u = curve->at(temperatures[k]);
        if (u.status == equilibria::solve_status::below_eutectic) st = row_status::below_curve_end;
        else if (u.check.code == validity_code::outside_physical_bounds) st = row_status::no_physical_value;
        else if (!u.success()) st = row_status::not_converged;
        else v = detail::policy_value(u.ice_fraction(), u.check.in_range(), opt.policy, st);
      }
      out[i * n_temperatures + k] = v;
      status[i * n_temperatures + k] = static_cast<std::uint8_t>(st);
    }
  });
}

}  // namespace colligate::batch

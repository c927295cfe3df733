#pragma once
/// \file uncertainty_kernels.hpp
/// A prediction with its standard uncertainty for every row of a solution_batch: value,
/// standard uncertainty u and effective degrees of freedom per row, by the linear
/// propagation of equilibria/prediction_uncertainty.hpp (closed-form sensitivities, models
/// 'norrish', 'pitzer' and 'ross'), on the threads of batch/kernels.hpp.
///
/// What depends on the species list alone (the constants' covariance, which closed form
/// each takes, the Pitzer rows) is prepared once for the batch (equilibria::detail::
/// linear_plan, read by every thread); each thread keeps its prepared evaluator and ice
/// curve (batch::detail::workspace) and runs the one implementation the scalar path runs
/// (equilibria::detail::propagate_linear_prepared), so values and uncertainties equal the
/// scalar ones bit for bit whatever the thread count. A row allocates nothing for up to
/// max_stack_constants uncertain constants (its sensitivities live on the stack); a batch
/// with more takes one buffer per row.
///
/// A batch whose species carry no stated uncertainty gets u = 0 ("nothing propagated").
/// A model without closed-form sensitivities to the batch's uncertain constants is a caller
/// mistake and throws before any row runs (use the scalar Monte Carlo propagation). A row
/// whose state has no closed form (a salt crystallises: an ice fraction below a salt's
/// saturation, a brine that forms a salt before ice, an a_w above a salt's solubility;
/// opt.salts_crystallise false asks for the metastable values, which keep their closed
/// forms) keeps the plain batch call's value and gets u = NaN; its status is unchanged, so the
/// caller tells it from a failed row by the finite value.

#include <cmath>
#include <cstdint>
#include <limits>
#include <optional>
#include <vector>

#include "colligate/batch/kernels.hpp"
#include "colligate/core/bound_water.hpp"
#include "colligate/equilibria/prediction_uncertainty.hpp"

namespace colligate::batch {

/// Uncertain constants whose sensitivities a row keeps on the stack: two salts with all
/// eight Pitzer constants each.
inline constexpr std::size_t max_stack_constants = 16;

/// `quantity` of every row at `temperature` (K; unused for the freezing point) under model
/// `m`: value, standard uncertainty and effective degrees of freedom (0: normal law),
/// each rows() entries, and the row status.
inline void predictions_with_uncertainty(const solution_batch& b, equilibria::predicted_quantity quantity,
                                         double temperature, const models::model_choice& m,
                                         const options& opt, double* value, double* standard_uncertainty,
                                         std::int32_t* degrees_of_freedom, std::uint8_t* status) {
  namespace eq = equilibria;
  const char* where = eq::to_string(quantity);
  if (opt.policy == range_policy::raise)
    throw invalid_input("batch kernels: range_policy 'raise' is not available for batches; "
                        "use 'extrapolate' or 'nan' and read the row status");
  if (quantity != eq::predicted_quantity::freezing_point)
    models::check_temperature_argument(where, temperature);
  check_bound_water_fraction_of_water(where, opt.bound_water_fraction_of_water);
  // The plan of the species list, built on the first valid row (every row has the same
  // species; a row's amounts do not enter it). It refuses a model without closed forms.
  std::optional<eq::detail::linear_plan> plan;
  {
    detail::workspace ws(b, nullptr);
    for (std::size_t i = 0; i < b.rows(); ++i) {
      if (b.input_status(i) != row_status::ok) continue;
      try {
        plan.emplace(ws.load(b, i), m);
      } catch (const invalid_input& e) {
        throw invalid_input(std::string("batch ") + where + " with uncertainty: " + e.what());
      }
      break;
    }
  }
  detail::parallel_rows(
      b, opt.threads, opt.interrupted, [&](detail::workspace& ws, std::size_t i) {
        row_status st = b.input_status(i);
        double v = detail::nan, u = detail::nan;
        std::int32_t dof = 0;
        if (st == row_status::ok) {
          const solution& s = ws.load(b, i);
          const double bound = bound_water_kg(s, opt.bound_water_fraction_of_water);
          const auto state_at = [&](double T) { return ws.curve(m, bound).at(T); };
          const auto salt_first = [&]() { return ws.curve(m, bound).salt_first(); };
          double on_stack[max_stack_constants];
          std::vector<double> on_heap;
          double* dy = on_stack;
          if (plan->size() > max_stack_constants) {
            on_heap.resize(plan->size());
            dy = on_heap.data();
          }
          try {
            const auto r = eq::detail::propagate_linear_prepared(*plan, quantity, s, temperature, m, bound,
                                                                 ws.evaluator(m), state_at, salt_first,
                                                                 opt.salts_crystallise, dy);
            v = r.value;
            u = r.standard_uncertainty;
            dof = r.degrees_of_freedom;
            if (r.check.code == validity_code::outside_physical_bounds) {
              st = row_status::no_physical_value;
              v = u = detail::nan;
            } else if (r.check.code == validity_code::no_freezing_point) {
              st = row_status::no_freezing_point;
              v = u = detail::nan;
            } else if (!std::isfinite(v)) {
              st = row_status::not_converged;
              u = detail::nan;
              if (quantity == eq::predicted_quantity::ice_fraction ||
                  quantity == eq::predicted_quantity::unfrozen_water) {
                // as ice_fractions(): the end of the curve (final eutectic) is its own status
                const auto at = ws.curve(m, bound).at(temperature);
                if (at.status == eq::solve_status::below_eutectic) st = row_status::below_curve_end;
              }
            } else {
              v = detail::policy_value(v, r.check.in_range(), opt.policy, st);
              if (std::isnan(v)) u = detail::nan;
            }
          } catch (const invalid_input&) {
            // No closed form for this row's state (a salt crystallised): the value without u.
            v = eq::predict(quantity, s, temperature, m, bound, opt.salts_crystallise);
            if (!std::isfinite(v)) st = row_status::not_converged;
          } catch (const convergence_error&) {
            st = row_status::not_converged;
            v = u = detail::nan;
          }
        }
        value[i] = v;
        standard_uncertainty[i] = u;
        degrees_of_freedom[i] = dof;
        status[i] = static_cast<std::uint8_t>(st);
      });
}

}  // namespace colligate::batch

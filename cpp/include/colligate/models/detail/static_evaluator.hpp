#pragma once
/// \file static_evaluator.hpp
/// activity_evaluator for a model written as a struct of static functions
/// `ln_water_activity(solution, water_kg, T)` and `check(solution, water_kg, T)` with
/// nothing to prepare (ideal, Raoult, Norrish).

#include "colligate/core/solution.hpp"
#include "colligate/models/evaluator.hpp"

namespace colligate::models::detail {

template <class Model>
class static_model_evaluator final : public activity_evaluator {
 public:
  explicit static_model_evaluator(const solution& s) : s_(&s) {}
  double ln_water_activity(double water_kg, double temperature) override {
    return Model::ln_water_activity(*s_, water_kg, temperature);
  }
  validity check(double water_kg, double temperature) override {
    return Model::check(*s_, water_kg, temperature);
  }

 private:
  const solution* s_;
};

}  // namespace colligate::models::detail

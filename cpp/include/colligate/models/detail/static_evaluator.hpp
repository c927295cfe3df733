#pragma once
/// \file static_evaluator.hpp
/// activity_evaluator for a model written as a struct of static functions
/// `ln_water_activity(solution, water_kg, T)` and `check(solution, water_kg, T)` with
/// nothing to prepare (ideal, Raoult, Norrish).

#include <functional>
#include <memory>
#include <string>
#include <type_traits>
#include <utility>

#include "colligate/core/solution.hpp"
#include "colligate/models/detail/describe_constants.hpp"
#include "colligate/models/evaluator.hpp"
#include "colligate/models/registry.hpp"

namespace colligate::models::detail {

/// Whether Model has `ln_water_activity_with_slope(solution, water_kg, T, ln_aw, slope)`.
template <class Model, class = void>
struct has_water_slope : std::false_type {};
template <class Model>
struct has_water_slope<Model, std::void_t<decltype(Model::ln_water_activity_with_slope(
                                  std::declval<const solution&>(), 0.0, 0.0,
                                  std::declval<double&>(), std::declval<double&>()))>>
    : std::true_type {};

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
  bool ln_water_activity_with_slope(double water_kg, double temperature, double& ln_aw,
                                    double& slope) override {
    if constexpr (has_water_slope<Model>::value) {
      Model::ln_water_activity_with_slope(*s_, water_kg, temperature, ln_aw, slope);
      return true;
    } else {
      static_cast<void>(water_kg), static_cast<void>(temperature), static_cast<void>(ln_aw),
          static_cast<void>(slope);
      return false;
    }
  }

 private:
  const solution* s_;
};

/// The registry entry of a static-function model: id, summary and traits, which solutions
/// 'auto' gives it (nullptr: never), and the text describing one solute's constants.
template <class Model>
model_descriptor static_model_descriptor(std::string summary, model_traits traits,
                                         std::function<int(const solution&)> auto_rank,
                                         std::string (*describe_solute)(const data::solute_record&)) {
  model_descriptor d;
  d.id = Model::id;
  d.summary = std::move(summary);
  d.traits = traits;
  d.auto_rank = std::move(auto_rank);
  d.prepare = [](const solution& s, const model_options&) -> std::unique_ptr<activity_evaluator> {
    return std::make_unique<static_model_evaluator<Model>>(s);
  };
  d.describe = [describe_solute](const solution& s, const model_options&) {
    return describe_each(s, describe_solute);
  };
  return d;
}

}  // namespace colligate::models::detail

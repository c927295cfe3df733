#pragma once
/// \file registry.hpp
/// The activity models colligate knows, as data: one descriptor per model (id, traits,
/// how to prepare it for a solution, how to describe the constants it uses, which
/// solutions 'auto' gives it) in one registry. Every caller looks models up here; no code
/// outside the model headers switches over model names.
///
/// Adding a model: one header (models/ID.hpp, with a `descriptor()`), one line in
/// builtin_models() below, one test. A caller may also extend a registry at run time
/// (model_registry::with) without touching this file; registries are values, so there is
/// no global mutable state.

#include <algorithm>
#include <functional>
#include <memory>
#include <string>
#include <utility>
#include <vector>

#include "colligate/core/errors.hpp"
#include "colligate/core/solution.hpp"
#include "colligate/core/validity.hpp"
#include "colligate/models/evaluator.hpp"

namespace colligate::models {

/// What a model can do.
struct model_traits {
  /// ln a_w depends on temperature (false: the constants are used unchanged at every T,
  /// so the freezing point inverts the ice equilibrium directly).
  bool temperature_dependent = false;
  /// The prepared model offers ion activities (activity_evaluator::ions()), so salt
  /// saturation and the salt phases of the ice curve can be evaluated.
  bool ion_activities = false;
  /// prepare() reads model_options::parameter_set (a Pitzer parameter set for the ions).
  bool parameter_sets = false;
};

/// What a caller asks of a model beyond its id, handed to prepare() and describe(). A model
/// reads the options its traits name and ignores the others.
struct model_options {
  /// Id of the Pitzer parameter set for the electrolytes (data/pitzer_parameters.hpp,
  /// data::pitzer_parameter_set_ids()); empty: the model's default set.
  std::string parameter_set;
  bool operator==(const model_options& o) const noexcept { return parameter_set == o.parameter_set; }
};

/// One activity model.
struct model_descriptor {
  std::string id;       ///< lower-snake id used in C++, Python, data and messages
  std::string summary;  ///< one line: the equation and its sources
  model_traits traits;
  /// How well the model suits a solution when the caller asks for 'auto': 0 never, the
  /// highest rank wins (ties: the first registered).
  std::function<int(const solution&)> auto_rank;
  /// Prepares the model for the species of a solution (which must outlive the result) with
  /// the caller's options (a model with traits.parameter_sets reads the parameter set).
  std::function<std::unique_ptr<activity_evaluator>(const solution&, const model_options&)> prepare;
  /// Which constants and sources the model uses for each solute of a solution.
  std::function<std::string(const solution&, const model_options&)> describe;
  /// The validated range: every limit the model's check() applies, with its basis and
  /// source (the check builds its out-of-range records from these same objects).
  std::vector<range_limit> validated_range;
};

/// The id that asks the registry to choose.
inline constexpr const char* automatic_model_id = "auto";

/// An immutable list of models.
class model_registry {
 public:
  explicit model_registry(std::vector<model_descriptor> models) {
    for (auto& d : models) add(std::move(d));
  }

  /// This registry plus one more model (a copy; the original is unchanged).
  model_registry with(model_descriptor d) const {
    model_registry out = *this;
    out.add(std::move(d));
    return out;
  }

  /// The model with this id, or nullptr.
  const model_descriptor* find(const std::string& id) const noexcept {
    for (const auto& d : models_)
      if (d.id == id) return &d;
    return nullptr;
  }

  /// The model a caller asks for by id ('auto' chooses for the solution).
  const model_descriptor& resolve(const std::string& id, const solution& s) const {
    if (id == automatic_model_id) {
      const model_descriptor* best = nullptr;
      int best_rank = 0;
      for (const auto& d : models_) {
        const int r = d.auto_rank ? d.auto_rank(s) : 0;
        if (r > best_rank) {
          best = &d;
          best_rank = r;
        }
      }
      if (best == nullptr)
        throw invalid_input("model = 'auto': no registered model accepts this solution");
      return *best;
    }
    if (const auto* d = find(id)) return *d;
    throw invalid_input("model = '" + id + "': valid models are " + valid_ids());
  }

  /// Throws invalid_input unless `id` is 'auto' or a registered model.
  void require(const std::string& id) const {
    if (id != automatic_model_id && find(id) == nullptr)
      throw invalid_input("model = '" + id + "': valid models are " + valid_ids());
  }

  /// 'auto' followed by the registered ids, in registration order.
  std::vector<std::string> ids() const {
    std::vector<std::string> out{automatic_model_id};
    for (const auto& d : models_) out.push_back(d.id);
    return out;
  }

  const std::vector<model_descriptor>& models() const noexcept { return models_; }

 private:
  void add(model_descriptor d) {
    if (d.id.empty() || d.id == automatic_model_id || !d.prepare)
      throw invalid_input("model_registry: model id '" + d.id +
                          "' must be non-empty, not 'auto', and have a prepare function");
    if (find(d.id) != nullptr)
      throw invalid_input("model_registry: model id '" + d.id + "' is already registered");
    models_.push_back(std::move(d));
  }

  std::string valid_ids() const {
    std::string out;
    for (const auto& id : ids()) out += std::string(out.empty() ? "'" : ", '") + id + "'";
    return out;
  }

  std::vector<model_descriptor> models_;
};

}  // namespace colligate::models

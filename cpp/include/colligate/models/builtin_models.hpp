#pragma once
/// \file builtin_models.hpp
/// The registry of the models shipped with colligate, and the handle callers use to name
/// a model (an id plus the registry to look it up in). One line per model below.

#include <string>
#include <utility>

#include "colligate/models/ideal.hpp"
#include "colligate/models/mixing.hpp"
#include "colligate/models/norrish.hpp"
#include "colligate/models/pitzer.hpp"
#include "colligate/models/raoult.hpp"
#include "colligate/models/registry.hpp"
#include "colligate/models/starzak_peacock.hpp"

namespace colligate::models {

/// The built-in models (immutable; built once, thread-safe initialisation).
inline const model_registry& builtin_models() {
  static const model_registry registry({
      ideal::descriptor(),
      raoult::descriptor(),
      norrish::descriptor(),
      pitzer::descriptor(),
      ross::descriptor(),
      starzak_peacock::descriptor(),
  });
  return registry;
}

/// A model named by id ('auto' by default) in a registry (the built-in one by default),
/// with the caller's options (model_options: the Pitzer parameter set). Cheap to copy; the
/// registry must outlive it.
class model_choice {
 public:
  model_choice(const char* id) : model_choice(std::string(id)) {}  // NOLINT: implicit by design
  model_choice(std::string id) : model_choice(std::move(id), builtin_models()) {}  // NOLINT
  model_choice(std::string id, const model_registry& registry)
      : model_choice(std::move(id), model_options{}, registry) {}
  /// A model with options. A parameter set must be one of data::pitzer_parameter_set_ids()
  /// and the model, unless 'auto', one that takes parameter sets (traits.parameter_sets);
  /// otherwise invalid_input names the option and the valid values.
  model_choice(std::string id, model_options options,
               const model_registry& registry = builtin_models())
      : id_(std::move(id)), options_(std::move(options)), registry_(&registry) {
    registry_->require(id_);
    if (!options_.parameter_set.empty()) {
      data::find_pitzer_parameter_set(options_.parameter_set);  // throws for an unknown id
      if (id_ != automatic_model_id && !registry_->find(id_)->traits.parameter_sets) {
        std::string takers;
        for (const auto& d : registry_->models())
          if (d.traits.parameter_sets) takers += "'" + d.id + "', ";
        throw invalid_input("parameter_set = '" + options_.parameter_set + "': model '" + id_ +
                            "' has no Pitzer parameter sets; the models that take one are " +
                            takers + "and 'auto'");
      }
    }
  }
  const std::string& id() const noexcept { return id_; }
  const model_options& options() const noexcept { return options_; }
  bool is_auto() const noexcept { return id_ == automatic_model_id; }
  const model_registry& registry() const noexcept { return *registry_; }
  /// The concrete model for this solution ('auto' resolved).
  const model_descriptor& resolve(const solution& s) const { return registry_->resolve(id_, s); }
  bool operator==(const model_choice& o) const noexcept {
    return id_ == o.id_ && options_ == o.options_ && registry_ == o.registry_;
  }

 private:
  std::string id_;
  model_options options_;
  const model_registry* registry_;
};

}  // namespace colligate::models

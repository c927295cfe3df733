#pragma once
/// \file model_id.hpp
/// Model ids: one lower-snake id per activity model, used in C++, data, Python, error
/// messages and test tags. To add a model: add an enumerator here, a header beside this
/// one, a case in water_activity.hpp, a test in tests/cpp/models/, and it appears in
/// Python through colligate.models().

#include <string>
#include <vector>

#include "colligate/core/errors.hpp"

namespace colligate::models {

enum class model_id { automatic, ideal, raoult, norrish, pitzer, ross };

inline const char* to_string(model_id m) {
  switch (m) {
    case model_id::automatic: return "auto";
    case model_id::ideal: return "ideal";
    case model_id::raoult: return "raoult";
    case model_id::norrish: return "norrish";
    case model_id::pitzer: return "pitzer";
    case model_id::ross: return "ross";
  }
  return "unknown";
}

inline std::vector<model_id> all_models() {
  return {model_id::automatic, model_id::ideal, model_id::raoult, model_id::norrish,
          model_id::pitzer, model_id::ross};
}

inline model_id model_from_string(const std::string& s) {
  for (auto m : all_models())
    if (s == to_string(m)) return m;
  std::string valid;
  for (auto m : all_models()) valid += std::string(valid.empty() ? "'" : ", '") + to_string(m) + "'";
  throw invalid_input("model = '" + s + "': valid models are " + valid);
}

}  // namespace colligate::models

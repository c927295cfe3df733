#pragma once
/// \file validity.hpp
/// Validity ranges of models and the caller's run-time policy for leaving them.
///
/// Every model declares the temperatures and concentrations over which its constants
/// were validated, and the citation key that sets those limits. A result carries a
/// `validity` record: its code is in_range when inside, otherwise it names the limit. The caller
/// chooses what happens outside the range (range_policy); the C++ core never prints.

#include <cmath>
#include <cstdint>
#include <cstdio>
#include <limits>
#include <memory>
#include <string>
#include <utility>

#include "colligate/core/errors.hpp"

namespace colligate {

/// What to do when an input lies outside a model's validated range.
enum class range_policy {
  extrapolate,  ///< compute anyway and report the reason (default)
  nan,          ///< return NaN and report the reason
  raise         ///< throw out_of_validity_range
};

inline range_policy range_policy_from_string(const std::string& s) {
  if (s == "extrapolate") return range_policy::extrapolate;
  if (s == "nan") return range_policy::nan;
  if (s == "raise") return range_policy::raise;
  throw invalid_input("range_policy = '" + s +
                      "': valid values are 'extrapolate', 'nan' and 'raise'");
}

/// What kind of limit a result crossed (in_range when none).
enum class validity_code : std::uint8_t {
  in_range = 0,
  temperature_out_of_range,    ///< temperature outside the range of the constants
  concentration_out_of_range,  ///< molality, mass fraction or ionic strength above the range
  missing_constants,           ///< a solute without constants for the model (counted ideal)
  rules_disagree,              ///< two combining rules differ by more than accepted
  below_curve_end,             ///< below the end of the ice curve (eutectic, data limit)
  no_freezing_point,           ///< does not freeze above the lowest temperature searched
  not_converged,               ///< a solver stopped before its tolerance
  outside_physical_bounds      ///< the formulation gives no physical value here (a_w > 1,
                               ///< ice fraction outside [0, 1], T <= 0): never returned as a value
};

inline const char* to_string(validity_code c) {
  switch (c) {
    case validity_code::in_range: return "in_range";
    case validity_code::temperature_out_of_range: return "temperature_out_of_range";
    case validity_code::concentration_out_of_range: return "concentration_out_of_range";
    case validity_code::missing_constants: return "missing_constants";
    case validity_code::rules_disagree: return "rules_disagree";
    case validity_code::below_curve_end: return "below_curve_end";
    case validity_code::no_freezing_point: return "no_freezing_point";
    case validity_code::not_converged: return "not_converged";
    case validity_code::outside_physical_bounds: return "outside_physical_bounds";
  }
  return "unknown";
}

/// Outcome of a validity check as a record: the code, which quantity, its value, the
/// limit it crossed (and the validated range when there is one), and the citation key
/// that sets the limit. Text is made from it only on request (reason()), at the edge.
/// A check that passes is a code and four numbers: its words are held behind a shared
/// pointer that stays null, so passing, copying and merging it allocates nothing.
struct validity {
  /// The words of a record outside its range.
  struct words_t {
    std::string where;     ///< the model or function that checked ("model 'norrish'")
    std::string quantity;  ///< "temperature", "molality of 'sodium_chloride' (mol/kg)"
    std::string unit;      ///< unit of the limits in the text (" K", " mol/kg"), may be empty
    std::string note;      ///< what the limit means or what happens beyond it
    std::string source;    ///< citation key of the limit (data/citation.hpp), may be empty
  };

  validity_code code = validity_code::in_range;
  double value = std::numeric_limits<double>::quiet_NaN();
  double limit = std::numeric_limits<double>::quiet_NaN();  ///< the bound crossed
  double range_low = std::numeric_limits<double>::quiet_NaN();   ///< validated range, if any
  double range_high = std::numeric_limits<double>::quiet_NaN();
  std::shared_ptr<const words_t> words;  ///< null when in range

  bool in_range() const noexcept { return code == validity_code::in_range; }
  /// Keeps the first limit found.
  void merge(const validity& other) {
    if (in_range()) *this = other;
  }
  const std::string& where() const noexcept { return words ? words->where : empty(); }
  const std::string& quantity() const noexcept { return words ? words->quantity : empty(); }
  const std::string& unit() const noexcept { return words ? words->unit : empty(); }
  const std::string& note() const noexcept { return words ? words->note : empty(); }
  const std::string& source() const noexcept { return words ? words->source : empty(); }

  /// Readable text: "" when in range.
  std::string reason() const {
    if (in_range()) return {};
    const std::string src = source().empty() ? "" : " [" + source() + "]";
    const bool has_limit = code == validity_code::temperature_out_of_range ||
                           code == validity_code::concentration_out_of_range ||
                           (code == validity_code::outside_physical_bounds &&
                            !std::isnan(range_low));
    if (!has_limit) {
      if (std::isnan(value))
        return where() + ": " + quantity() + (note().empty() ? "" : ": " + note()) + src;
      return colligate::detail::describe(where(), quantity(), value, note() + src);
    }
    std::string why;
    if (!std::isnan(range_low) && !std::isnan(range_high))
      why = "outside " + fmt(range_low) + "-" + fmt(range_high) + unit();
    else if (!std::isnan(limit))
      why = std::string(value < limit ? "below " : "above ") + fmt(limit) + unit();
    if (!note().empty()) why += (why.empty() ? "" : ", ") + note();
    return colligate::detail::describe(where(), quantity(), value, why + src);
  }

  static std::string fmt(double x) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", x);
    return buf;
  }

 private:
  static const std::string& empty() noexcept {
    static const std::string e;
    return e;
  }
};

/// Factories for the common records (they allocate only when called, i.e. out of range).
inline validity outside_range(std::string where, std::string quantity, double value, double low,
                              double high, std::string unit, std::string note,
                              std::string source = {},
                              validity_code code = validity_code::temperature_out_of_range) {
  validity v;
  v.code = code;
  v.value = value;
  v.limit = value < low ? low : high;
  v.range_low = low;
  v.range_high = high;
  v.words = std::make_shared<const validity::words_t>(validity::words_t{
      std::move(where), std::move(quantity), std::move(unit), std::move(note), std::move(source)});
  return v;
}

inline validity beyond_limit(std::string where, std::string quantity, double value, double limit,
                             std::string unit, std::string note, std::string source = {},
                             validity_code code = validity_code::concentration_out_of_range) {
  validity v;
  v.code = code;
  v.value = value;
  v.limit = limit;
  v.words = std::make_shared<const validity::words_t>(validity::words_t{
      std::move(where), std::move(quantity), std::move(unit), std::move(note), std::move(source)});
  return v;
}

/// A limit without a number (a solute without constants, a rule comparison).
inline validity flagged(validity_code code, std::string where, std::string what, std::string note,
                        std::string source = {}) {
  validity v;
  v.code = code;
  v.words = std::make_shared<const validity::words_t>(validity::words_t{
      std::move(where), std::move(what), std::string(), std::move(note), std::move(source)});
  return v;
}

/// One limit of a model's validated range, as data. A model's registry descriptor lists
/// its limits (models/registry.hpp; the "which model when" page and Python read them) and
/// its check() builds its out-of-range records from the same objects, so the range a reader
/// is shown and the range a result is checked against cannot differ.
struct range_limit {
  std::string quantity;  ///< what is limited: "temperature", "ionic strength", ...
  std::string unit;      ///< SI unit ("K", "mol/kg"); "" for a fraction
  double low = std::numeric_limits<double>::quiet_NaN();   ///< NaN: no lower limit
  double high = std::numeric_limits<double>::quiet_NaN();  ///< NaN: no upper limit
  std::string basis;   ///< why this limit (printed in the out-of-range reason)
  std::string source;  ///< citation key that sets it; "" when the basis says where it comes from
  /// "" when the numbers hold for every solution; otherwise where the limit of each solute
  /// or salt is kept (e.g. the solute table's Norrish range), the numbers then being NaN.
  std::string per_solute;

  /// `value` above `high`: quantity "name (unit)", as the checks have always printed it.
  validity above(std::string where, double value, const std::string& extra_note = {}) const {
    return beyond_limit(std::move(where), unit.empty() ? quantity : quantity + " (" + unit + ")",
                        value, high, unit.empty() ? "" : " " + unit,
                        extra_note.empty() ? basis : basis + extra_note, source);
  }

  /// `value` outside [low, high] (a temperature).
  validity outside(std::string where, double value, const std::string& extra_note = {}) const {
    return outside_range(std::move(where), quantity, value, low, high,
                         unit.empty() ? "" : " " + unit,
                         extra_note.empty() ? basis : basis + extra_note, source);
  }

  /// True when `value` lies inside [low, high] (a missing side does not limit; 1e-9 slack
  /// for temperatures given in Celsius and converted).
  bool contains(double value) const {
    return !(value < low - 1e-9) && !(value > high + 1e-9);
  }
};

/// A value together with its validity.
struct checked_value {
  double value = std::numeric_limits<double>::quiet_NaN();
  validity check;
};

/// A value outside the physical bounds of its quantity: the record that says so.
/// `quantity` names it ("water activity"), [low, high] is the physical range.
inline validity outside_physical_bounds(std::string where, std::string quantity, double value,
                                        double low, double high, std::string note) {
  return outside_range(std::move(where), std::move(quantity), value, low, high, "", std::move(note),
                       {}, validity_code::outside_physical_bounds);
}

/// Applies the policy: raise throws, nan replaces the value, extrapolate keeps it. A
/// record outside the physical bounds (or beyond a formulation's hard limit) never keeps
/// its value: raise throws, the other policies give NaN with the reason.
inline checked_value apply_policy(double value, validity v, range_policy policy) {
  if (!v.in_range()) {
    if (policy == range_policy::raise) throw out_of_validity_range(v.reason());
    if (policy == range_policy::nan || v.code == validity_code::outside_physical_bounds)
      value = std::numeric_limits<double>::quiet_NaN();
  }
  return {value, std::move(v)};
}

/// Applies the policy to a value that must lie in [low, high] (low_open: (low, high]): a
/// value outside (or NaN) gets the record `outside_physical_bounds` in place of `v` and
/// is never returned, whatever the policy.
inline checked_value apply_policy_within(double value, validity v, range_policy policy,
                                         const char* where, const char* quantity, double low,
                                         double high, bool low_open, const char* note) {
  const bool inside = low_open ? (value > low && value <= high) : (value >= low && value <= high);
  if (!inside)
    v = outside_physical_bounds(where, quantity, value, low, high, note);
  return apply_policy(value, std::move(v), policy);
}

}  // namespace colligate

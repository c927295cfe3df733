// libFuzzer target: builds a solution from fuzzed bytes (species, amounts, factory) and
// evaluates it (one of: freezing point, ice fraction, water activity, osmotic coefficient,
// unfrozen phase, enthalpy) at a fuzzed temperature, model and range policy, asserting
// the physical bounds of DESIGN section 5:
//   0 < a_w <= 1, 0 <= ice fraction <= 1, T > 0, osmotic coefficient >= 0,
// a NaN only with a reason, and no exception other than colligate's own errors
// (invalid_input, out_of_validity_range, convergence_error). A violation aborts, which
// libFuzzer reports with the input that caused it. Build and run: fuzz/run.sh.
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <vector>

#include "colligate/colligate.hpp"

using namespace colligate;

namespace {

/// Reads the fuzzed bytes front to back; past the end every read gives zeros.
class byte_reader {
 public:
  byte_reader(const std::uint8_t* data, std::size_t size) : p_(data), n_(size) {}
  std::uint8_t byte() { return i_ < n_ ? p_[i_++] : 0; }
  std::uint16_t u16() { return static_cast<std::uint16_t>(byte() | (byte() << 8)); }
  double raw_double() {
    std::uint8_t b[8];
    for (auto& x : b) x = byte();
    double d;
    std::memcpy(&d, b, sizeof d);
    return d;
  }
  /// A number in [0, scale], quadratic so small values are as likely as large ones, or
  /// (one time in eight) any bit pattern: NaN, infinities, negatives, huge values.
  double amount(double scale) {
    if ((byte() & 7) == 0) return raw_double();
    const double u = u16() / 65535.0;
    return scale * u * u;
  }

 private:
  const std::uint8_t* p_;
  std::size_t n_;
  std::size_t i_ = 0;
};

[[noreturn]] void violation(const char* what, double value, const std::string& reason) {
  std::fprintf(stderr, "bound violated: %s = %.17g (reason: '%s')\n", what, value, reason.c_str());
  std::abort();
}

/// A value is either inside [lo, hi] (lo excluded when lo_open) or NaN with a reason.
void check_value(const char* what, const checked_value& v, double lo, double hi, bool lo_open) {
  if (std::isnan(v.value)) {
    if (v.check.in_range()) violation(what, v.value, "NaN without a reason");
    return;
  }
  const bool inside = lo_open ? (v.value > lo && v.value <= hi) : (v.value >= lo && v.value <= hi);
  if (!inside) violation(what, v.value, v.check.reason());
}

void check_state(const equilibria::ice_curve_state& st) {
  if (st.success()) {
    if (!(st.ice >= 0.0 && st.ice <= st.total_water)) violation("ice (kg)", st.ice, st.check.reason());
    if (!(st.unfrozen_water >= 0.0)) violation("unfrozen water", st.unfrozen_water, st.check.reason());
    if (!(st.water_activity > 0.0 && st.water_activity <= 1.0))
      violation("a_w of the unfrozen phase", st.water_activity, st.check.reason());
    const double f = st.ice_fraction();
    if (!(f >= 0.0 && f <= 1.0)) violation("ice fraction of the state", f, st.check.reason());
  } else if (st.check.in_range()) {
    violation("unsolved state", st.ice, "no reason");
  } else if (!std::isnan(st.ice) && !(st.ice >= 0.0 && st.ice <= st.total_water)) {
    violation("ice of an unsolved state", st.ice, st.check.reason());
  }
}

/// Runs f; colligate's own errors are outcomes, anything else is a finding.
template <class F>
void guarded(F&& f) {
  try {
    f();
  } catch (const invalid_input&) {
  } catch (const out_of_validity_range&) {
  } catch (const convergence_error&) {
  } catch (const std::exception& e) {
    std::fprintf(stderr, "foreign exception: %s\n", e.what());
    std::abort();
  }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  byte_reader in(data, size);
  const auto& records = data::builtin_solutes().records();
  const auto ids = models::builtin_models().ids();

  const int n_species = in.byte() % 4;  // 0 to 3 solutes
  const int factory = in.byte() % 3;    // masses, molalities, mass fractions
  std::vector<named_amount> amounts;
  for (int k = 0; k < n_species; ++k) {
    const auto& rec = records[in.byte() % records.size()];
    const double scale = factory == 0 ? 1.0 : factory == 1 ? 8.0 : 0.45;
    amounts.emplace_back(rec.id, in.amount(scale));
  }
  const double water = in.amount(2.0);
  const std::string model = ids[in.byte() % ids.size()];
  const double T = (in.byte() & 7) == 0 ? in.raw_double() : 200.0 + 120.0 * in.u16() / 65535.0;
  const range_policy policy = static_cast<range_policy>(in.byte() % 3);
  // Which evaluation to run: one per input keeps an execution short (a salt path or the
  // enthalpy's -40 C reference state costs milliseconds), so a run reaches 1e6 inputs.
  const int op = in.byte() % 8;

  // Construction: caller mistakes (unknown, duplicate, negative, non-finite, too large,
  // fractions >= 1) are invalid_input; everything else gives a solution.
  solution s = solution::from_molalities({});
  bool built = false;
  guarded([&] {
    if (factory == 0) s = solution::from_masses(water, amounts);
    else if (factory == 1) s = solution::from_molalities(amounts, water);
    else s = solution::from_mass_fractions(amounts);
    built = true;
  });
  if (!built) return 0;
  if (!(std::isfinite(s.water_mole_fraction()) && s.water_mole_fraction() > 0.0 &&
        s.water_mole_fraction() <= 1.0))
    violation("water mole fraction", s.water_mole_fraction(), "");
  for (std::size_t i = 0; i < s.size(); ++i)
    if (!(s.mole_fraction(i) >= 0.0 && s.mole_fraction(i) <= 1.0))
      violation("mole fraction", s.mole_fraction(i), s.species()[i].id);

  if (op == 0) guarded([&] {
    const auto fp = equilibria::freezing_point_checked(s, model, policy);
    check_value("freezing point (K)", fp, 0.0, constants::ice_point, true);
  });
  if (op == 1 || op == 2) guarded([&] {
    check_value("water activity", models::water_activity(s, T, model, policy), 0.0, 1.0, true);
  });
  if (op == 3) guarded([&] {
    const auto phi = models::osmotic_coefficient(s, T, model, policy);
    check_value("osmotic coefficient", phi, 0.0, 1e300, false);
  });
  if (op == 4 || op == 5) guarded([&] {
    check_value("ice fraction", equilibria::ice_fraction(s, T, model, policy), 0.0, 1.0, false);
  });
  if (op == 6) guarded([&] { check_state(equilibria::unfrozen_phase_at(s, T, model)); });
  if (op == 7) guarded([&] {
    const double x_w = s.water_mass_fraction();
    thermal::food_composition x;
    x.water = x_w;
    x.carbohydrate = 1.0 - x_w;
    const thermal::food f(x, s, 0.0, model);
    const auto h = thermal::enthalpy(f, T, policy);
    if (!std::isnan(h.value) && !std::isfinite(h.value)) violation("enthalpy", h.value, h.check.reason());
    if (std::isnan(h.value) && h.check.in_range()) violation("enthalpy", h.value, "NaN without a reason");
  });
  return 0;
}

// A small program embedding colligate: an (invented demo) fruit syrup for a sorbet base,
// its freezing point, its ice curve, and one caller mistake handled. Built two ways, against
// an installed colligate (installed/) and from the source tree with FetchContent
// (fetch_content/); scripts/examples.sh builds and runs both and compares the printed
// freezing point with the Python package's.
#include <colligate/colligate.hpp>

#include <cstdio>
#include <vector>

int main() {
  using namespace colligate;
  // Invented demo scenario: 18 % sucrose, 4 % glucose, 0.5 % citric acid, the rest water.
  const std::vector<named_amount> recipe = {
      {"sucrose", 0.18}, {"glucose", 0.04}, {"citric_acid", 0.005}};
  const auto syrup = solution::from_mass_fractions(recipe);
  std::printf("mass_fractions");
  for (const auto& [name, fraction] : recipe) std::printf(" %s=%.17g", name.c_str(), fraction);
  std::printf("\n");

  const auto fp = freezing_point(syrup);  // a result with a solver status, not an exception
  if (!fp.success()) {
    std::printf("freezing point: the solver did not converge\n");
    return 1;
  }
  std::printf("freezing_point_K %.17g\n", fp.temperature);

  // The ice curve: one prepared object answers any temperature.
  ice_curve curve(syrup);  // caches the path as it is asked (not shared across threads)
  for (double t_c = -2.0; t_c >= -20.0; t_c -= 3.0) {
    const auto state = curve.at(constants::celsius_offset + t_c);
    std::printf("ice_fraction_at_C %6.1f %.6f%s%s\n", t_c, state.ice_fraction(),
                state.check.in_range() ? "" : "  ",
                state.check.reason().c_str());
  }

  // A caller mistake throws invalid_input naming the field, its value and the valid range.
  try {
    solution::from_mass_fractions({{"sucrose", 1.5}});
    std::printf("error_not_raised\n");
    return 1;
  } catch (const invalid_input& e) {
    std::printf("rejected_input %s\n", e.what());
  }
  return 0;
}

// Embeds colligate as an engineer's C++ tool would: 42 wt% sucrose freezing point.
#include <colligate/colligate.hpp>

#include <cmath>
#include <cstdio>

int main() {
  const auto s = colligate::solution::from_mass_fractions({{"sucrose", 0.42}});
  const auto r = colligate::freezing_point(s);
  const double depression = 273.15 - r.temperature;
  std::printf("42 wt%% sucrose freezes at %.3f C\n", r.temperature - 273.15);
  // CRC Handbook (2021), concentrative properties table: 4.93 K at 42 wt% sucrose.
  // Tolerance 0.2 K: the limitation of one Norrish constant over the CRC sucrose rows
  // (worst row 0.18 K); without the Norrish term this row misses by about 0.8 K (at
  // 20 wt% both would pass, so that row does not show the model works).
  return (r.success() && std::abs(depression - 4.93) < 0.2) ? 0 : 1;
}

// Embeds colligate as an engineer's C++ tool would: 20 wt% sucrose freezing point.
#include <colligate/colligate.hpp>

#include <cmath>
#include <cstdio>

int main() {
  const auto s = colligate::solution::from_mass_fractions({{"sucrose", 0.20}});
  const auto r = colligate::freezing_point(s);
  const double depression = colligate::constants::ice_point - r.temperature;
  std::printf("20 wt%% sucrose freezes at %.3f C\n", r.temperature - 273.15);
  // CRC Handbook (2021), concentrative properties table: 1.47 K at 20 wt% sucrose.
  return (r.success() && std::abs(depression - 1.47) < 0.2) ? 0 : 1;
}

#pragma once
// Gibbs-Duhem for one salt in water, shared by the Pitzer tests: ln gamma_pm(m) =
// (phi(m) - 1) + integral_0^m (phi - 1)/m' dm'. With m' = u^2 the integrand 2 (phi - 1)/u is
// smooth; Simpson in u with `panels` panels (even). Near u = 0, phi - 1 ~ -c u, so the
// integrand tends to -2c: taken from u = 1e-6.
#include <cmath>

namespace colligate_test {

/// ln gamma_pm at molality m from phi_minus_1(m') = phi(m') - 1 of the same salt.
template <class PhiMinusOne>
double ln_gamma_from_osmotic(const PhiMinusOne& phi_minus_1, double m, int panels = 4000) {
  const double U = std::sqrt(m), h = U / panels;
  double integral = 0.0;
  for (int k = 0; k <= panels; ++k) {
    const double u = k * h;
    const double f = k == 0 ? 2.0 * phi_minus_1(1e-12) / 1e-6 : 2.0 * phi_minus_1(u * u) / u;
    integral += f * (k == 0 || k == panels ? 1.0 : (k % 2 ? 4.0 : 2.0));
  }
  return phi_minus_1(m) + integral * h / 3.0;
}

}  // namespace colligate_test

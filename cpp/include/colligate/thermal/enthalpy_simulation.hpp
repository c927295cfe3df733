#pragma once
/// \file enthalpy_simulation.hpp
/// One-dimensional freezing and thawing by the implicit enthalpy method (slab, infinite
/// cylinder, sphere; convective surface; medium temperature varying in time).
///
/// Heat equation in enthalpy form, per unit volume,  dH/dt = r^-m d/dr (r^m k(T) dT/dr),
/// m = 0, 1, 2 for slab, cylinder, sphere; symmetry at the centre r = 0 and
/// -k dT/dr = h (T_s - T_medium(t)) at the surface r = R (R = half thickness or radius).
///
/// Discretisation: a vertex-centred finite-volume mesh of N + 1 nodes (the centre and the
/// surface are nodes), implicit Euler in time. The nonlinear step is solved by the
/// enthalpy-linearisation iteration of Voller & Swaminathan (1991), Numer. Heat Transfer B
/// 19, 175 (source key voller_swaminathan_1991): with the iterate T*, H^{n+1} is replaced
/// by H(T*) + C*(T - T*), C* = dH/dT at T*, the tridiagonal system for T is solved (Thomas
/// algorithm on Eigen vectors), the enthalpy is updated by the same linearisation and mapped
/// back to T through the material's H(T); repeated until the temperatures change by less
/// than 1e-7 K. Energy is conserved to that tolerance at every step. Conductivities are taken
/// at the iterate (harmonic mean on each face).
///
/// The material is a table of volumetric enthalpy H(T) (J/m^3, increasing) and conductivity
/// k(T) on an increasing temperature grid, interpolated linearly; material_of_food builds it
/// from a food's ice curve (enthalpy.hpp, conductivity.hpp) with the density held at its
/// value at the initial temperature (fixed mass per volume; the expansion on freezing is
/// neglected, as in the methods this is compared with).

#include <algorithm>
#include <cmath>
#include <limits>
#include <string>
#include <utility>
#include <vector>

#include <Eigen/Core>

#include "colligate/core/constants.hpp"
#include "colligate/core/errors.hpp"
#include "colligate/thermal/freezing_time.hpp"

namespace colligate::thermal {

/// Tabulated material: volumetric enthalpy and conductivity against temperature.
class material_table {
 public:
  material_table(std::vector<double> temperature, std::vector<double> enthalpy,
                 std::vector<double> conductivity)
      : T_(std::move(temperature)), H_(std::move(enthalpy)), k_(std::move(conductivity)) {
    const char* where = "material_table";
    if (T_.size() < 2 || H_.size() != T_.size() || k_.size() != T_.size())
      throw invalid_input(std::string(where) +
                          ": temperature, enthalpy and conductivity need the same length >= 2");
    for (std::size_t i = 0; i < T_.size(); ++i) {
      if (!std::isfinite(T_[i]) || !std::isfinite(H_[i]))
        throw invalid_input(colligate::detail::describe(where, "temperature/enthalpy row", double(i),
                                                        "must be finite"));
      if (!(k_[i] > 0.0) || !std::isfinite(k_[i]))
        throw invalid_input(colligate::detail::describe(where, "conductivity", k_[i],
                                                        "must be finite and > 0 W/(m K)"));
      if (i > 0 && !(T_[i] > T_[i - 1]))
        throw invalid_input(colligate::detail::describe(where, "temperature", T_[i],
                                                        "must increase strictly along the table"));
      if (i > 0 && !(H_[i] > H_[i - 1]))
        throw invalid_input(colligate::detail::describe(where, "enthalpy", H_[i],
                                                        "must increase strictly with temperature"));
    }
  }

  double min_temperature() const noexcept { return T_.front(); }
  double max_temperature() const noexcept { return T_.back(); }

  /// Volumetric enthalpy at T, J/m^3 (linear beyond the table with the end slopes).
  double enthalpy(double T) const { return interp(T_, H_, T); }
  /// Temperature at volumetric enthalpy H, K.
  double temperature(double H) const { return interp(H_, T_, H); }
  /// Conductivity at T, W/(m K) (held constant beyond the table).
  double conductivity(double T) const {
    return interp(T_, k_, std::clamp(T, T_.front(), T_.back()));
  }
  /// dH/dT at T: the slope of the table segment holding T.
  double capacity(double T) const {
    const std::size_t i = segment(T_, T);
    return (H_[i + 1] - H_[i]) / (T_[i + 1] - T_[i]);
  }

 private:
  static std::size_t segment(const std::vector<double>& x, double v) {
    const auto it = std::upper_bound(x.begin(), x.end(), v);
    std::size_t i = it == x.begin() ? 0 : static_cast<std::size_t>(it - x.begin()) - 1;
    return std::min(i, x.size() - 2);
  }
  static double interp(const std::vector<double>& x, const std::vector<double>& y, double v) {
    const std::size_t i = segment(x, v);
    return y[i] + (y[i + 1] - y[i]) * (v - x[i]) / (x[i + 1] - x[i]);
  }
  std::vector<double> T_, H_, k_;
};

/// The medium temperature over time: piecewise linear through (time, temperature) points,
/// constant before the first and after the last.
struct medium_schedule {
  std::vector<double> time;         ///< s, increasing
  std::vector<double> temperature;  ///< K

  static medium_schedule constant(double T) { return {{0.0}, {T}}; }

  double at(double t) const {
    if (time.size() == 1 || t <= time.front()) return temperature.front();
    if (t >= time.back()) return temperature.back();
    const auto it = std::upper_bound(time.begin(), time.end(), t);
    const std::size_t i = static_cast<std::size_t>(it - time.begin()) - 1;
    return temperature[i] + (temperature[i + 1] - temperature[i]) * (t - time[i]) / (time[i + 1] - time[i]);
  }

  void validate(const char* where) const {
    if (time.empty() || time.size() != temperature.size())
      throw invalid_input(std::string(where) +
                          ": medium schedule needs as many times as temperatures (at least one)");
    for (std::size_t i = 0; i < time.size(); ++i) {
      if (!std::isfinite(temperature[i]) || !(temperature[i] > 0.0))
        throw invalid_input(colligate::detail::describe(where, "T_medium", temperature[i],
                                                        "must be a finite absolute temperature > 0 K"));
      if (!std::isfinite(time[i]) || (i > 0 && !(time[i] > time[i - 1])))
        throw invalid_input(colligate::detail::describe(where, "medium time", time[i],
                                                        "must be finite and increase strictly"));
    }
  }
};

/// What to simulate.
struct simulation_setup {
  body_shape shape = body_shape::slab;
  double size = 0.0;                  ///< full thickness or diameter, m
  double initial_temperature = 0.0;   ///< uniform, K
  medium_schedule medium;             ///< medium temperature over time
  double h = 0.0;                     ///< surface heat-transfer coefficient, W/(m^2 K)
  double target_temperature = std::numeric_limits<double>::quiet_NaN();  ///< centre target, K (NaN: none)
  double max_time = 0.0;              ///< s; the run stops here at the latest
  int intervals = 40;                 ///< N mesh intervals from centre to surface
  double time_step = 0.0;             ///< s; 0 picks 0.05 R^2 C / k of the coldest table row
  int record_every = 1;               ///< keep every n-th step in the histories
};

enum class simulation_status { reached_target, reached_max_time, not_converged };

inline const char* to_string(simulation_status s) {
  switch (s) {
    case simulation_status::reached_target: return "reached_target";
    case simulation_status::reached_max_time: return "reached_max_time";
    case simulation_status::not_converged: return "not_converged";
  }
  return "unknown";
}

/// Histories and the final state.
struct simulation_result {
  simulation_status status = simulation_status::reached_max_time;
  double time_to_target = std::numeric_limits<double>::quiet_NaN();  ///< s
  std::vector<double> time;                ///< s
  std::vector<double> centre_temperature;  ///< K
  std::vector<double> surface_temperature; ///< K
  std::vector<double> medium_temperature;  ///< K
  std::vector<double> heat_flux;           ///< W/m^2 leaving through the surface (> 0 when cooling)
  std::vector<double> mean_enthalpy;       ///< J/m^3, volume average
  std::vector<double> positions;           ///< node radii, m (0 = centre)
  std::vector<double> final_temperature;   ///< K at the nodes
  std::vector<double> final_enthalpy;      ///< J/m^3 at the nodes
  double volume_per_area = 0.0;            ///< V / A_surface, m (R / (m + 1))
  int steps = 0;
  int max_iterations_used = 0;
};

namespace detail {

inline void thomas_solve(const Eigen::VectorXd& a, Eigen::VectorXd& b, const Eigen::VectorXd& c,
                         Eigen::VectorXd& d) {
  // a: sub-diagonal (a[0] unused), b: diagonal, c: super-diagonal, d: right side -> solution.
  const Eigen::Index n = b.size();
  for (Eigen::Index i = 1; i < n; ++i) {
    const double w = a[i] / b[i - 1];
    b[i] -= w * c[i - 1];
    d[i] -= w * d[i - 1];
  }
  d[n - 1] /= b[n - 1];
  for (Eigen::Index i = n - 2; i >= 0; --i) d[i] = (d[i] - c[i] * d[i + 1]) / b[i];
}

}  // namespace detail

/// Runs the simulation. Freezing when the medium starts colder than the food, thawing when
/// warmer; the target is reached when the centre falls to (freezing) or rises to (thawing)
/// `target_temperature`.
inline simulation_result simulate(const material_table& mat, const simulation_setup& in) {
  const char* where = "simulate_freezing";
  detail::require_positive(where, "size", in.size, "m (full thickness or diameter)");
  detail::require_positive(where, "h", in.h, "W/(m^2 K)");
  detail::require_temperature(where, "T_initial", in.initial_temperature);
  if (!std::isfinite(in.time_step) || in.time_step < 0.0)
    throw invalid_input(colligate::detail::describe(where, "time_step", in.time_step,
                                                    "must be finite and > 0 s (or 0 for automatic)"));
  detail::require_positive(where, "max_time", in.max_time, "s");
  in.medium.validate(where);
  if (in.intervals < 2 || in.intervals > 100000)
    throw invalid_input(colligate::detail::describe(where, "intervals", in.intervals,
                                                    "must be between 2 and 100000"));
  if (in.record_every < 1)
    throw invalid_input(colligate::detail::describe(where, "record_every", in.record_every, "must be >= 1"));
  const double T0 = in.initial_temperature;
  const double Tm0 = in.medium.at(0.0);
  const bool freezing = Tm0 < T0;
  const bool has_target = !std::isnan(in.target_temperature);
  if (has_target) {
    detail::require_temperature(where, "T_target", in.target_temperature);
    if (freezing && !(in.medium.at(in.max_time) < in.target_temperature) && !(Tm0 < in.target_temperature))
      throw invalid_input(colligate::detail::describe(
          where, "T_medium", Tm0,
          "must be colder than the target T_target (" + std::to_string(in.target_temperature) +
              " K) for freezing"));
    if (!freezing && !(Tm0 > in.target_temperature))
      throw invalid_input(colligate::detail::describe(
          where, "T_medium", Tm0,
          "must be warmer than the target T_target (" + std::to_string(in.target_temperature) +
              " K) for thawing"));
    if (freezing && !(in.target_temperature < T0))
      throw invalid_input(colligate::detail::describe(where, "T_target", in.target_temperature,
                                                      "must lie below T_initial for freezing"));
    if (!freezing && !(in.target_temperature > T0))
      throw invalid_input(colligate::detail::describe(where, "T_target", in.target_temperature,
                                                      "must lie above T_initial for thawing"));
  }

  const int N = in.intervals;
  const int n = N + 1;
  const double R = in.size / 2.0;
  const double dr = R / N;
  const int m = in.shape == body_shape::slab ? 0 : (in.shape == body_shape::infinite_cylinder ? 1 : 2);
  auto rpow = [m](double r) { return m == 0 ? 1.0 : (m == 1 ? r : r * r); };
  auto vol = [m](double lo, double hi) {
    const int p = m + 1;
    return (std::pow(hi, p) - std::pow(lo, p)) / p;
  };

  simulation_result out;
  out.volume_per_area = R / (m + 1);
  out.positions.resize(n);
  Eigen::VectorXd V(n), Aface(n), T(n), H(n), Hold(n), Tstar(n), kk(n);
  for (int j = 0; j < n; ++j) {
    out.positions[j] = j * dr;
    const double lo = std::max(0.0, (j - 0.5) * dr), hi = std::min(R, (j + 0.5) * dr);
    V[j] = vol(lo, hi);
    Aface[j] = rpow((j + 0.5) * dr);  // face between j and j+1
  }
  const double A_surface = rpow(R);
  const double V_total = V.sum();
  T.setConstant(T0);
  for (int j = 0; j < n; ++j) H[j] = mat.enthalpy(T[j]);

  auto record = [&](double t, double Tm) {
    out.time.push_back(t);
    out.centre_temperature.push_back(T[0]);
    out.surface_temperature.push_back(T[n - 1]);
    out.medium_temperature.push_back(Tm);
    out.heat_flux.push_back(in.h * (T[n - 1] - Tm));
    out.mean_enthalpy.push_back(H.dot(V) / V_total);
  };
  record(0.0, Tm0);

  Eigen::VectorXd a(n), b(n), c(n), d(n);
  // automatic step: a twentieth of the diffusion time R^2 / alpha of the frozen end of the
  // table (the fastest diffusion), which the refinement test shows is within 1 % of converged
  const double T_cold = mat.min_temperature();
  const double dt = in.time_step > 0.0 ? in.time_step
                                       : 0.05 * R * R * mat.capacity(T_cold) / mat.conductivity(T_cold);
  double t = 0.0;
  const int max_iter = 200;
  out.status = simulation_status::reached_max_time;
  int step = 0;
  while (t < in.max_time * (1.0 - 1e-12)) {
    const double step_dt = std::min(dt, in.max_time - t);
    const double t_new = t + step_dt;
    const double Tm = in.medium.at(t_new);
    Hold = H;
    Tstar = T;
    bool converged = false;
    for (int it = 0; it < max_iter; ++it) {
      for (int j = 0; j < n; ++j) kk[j] = mat.conductivity(Tstar[j]);
      // H(T*) + C*(T - T*) is the linearised new enthalpy; H holds H(T*) consistently.
      for (int j = 0; j < n; ++j) {
        const double C = mat.capacity(Tstar[j]);
        const double cap = V[j] * C / step_dt;
        a[j] = 0.0;
        c[j] = 0.0;
        b[j] = cap;
        d[j] = cap * Tstar[j] - V[j] * (H[j] - Hold[j]) / step_dt;
      }
      for (int j = 0; j + 1 < n; ++j) {
        const double kf = 2.0 * kk[j] * kk[j + 1] / (kk[j] + kk[j + 1]);
        const double G = Aface[j] * kf / dr;
        b[j] += G;
        b[j + 1] += G;
        c[j] -= G;
        a[j + 1] -= G;
      }
      b[n - 1] += A_surface * in.h;
      d[n - 1] += A_surface * in.h * Tm;
      Eigen::VectorXd Tnew = d;
      detail::thomas_solve(a, b, c, Tnew);
      double change = 0.0;
      for (int j = 0; j < n; ++j) {
        const double Hnew = H[j] + mat.capacity(Tstar[j]) * (Tnew[j] - Tstar[j]);
        const double Tj = mat.temperature(Hnew);
        change = std::max(change, std::abs(Tj - Tstar[j]));
        H[j] = Hnew;
        Tstar[j] = Tj;
      }
      if (change < 1e-7) {
        converged = true;
        out.max_iterations_used = std::max(out.max_iterations_used, it + 1);
        break;
      }
    }
    const double centre_before = T[0];
    T = Tstar;
    ++step;
    if (!converged) {
      out.status = simulation_status::not_converged;
      record(t_new, Tm);
      t = t_new;
      break;
    }
    if (has_target) {
      const bool hit = freezing ? T[0] <= in.target_temperature : T[0] >= in.target_temperature;
      if (hit) {
        const double f = (in.target_temperature - centre_before) / (T[0] - centre_before);
        out.time_to_target = t + std::clamp(f, 0.0, 1.0) * step_dt;
        out.status = simulation_status::reached_target;
        record(t_new, Tm);
        t = t_new;
        break;
      }
    }
    t = t_new;
    if (step % in.record_every == 0) record(t, Tm);
  }
  if (out.time.back() < t) record(t, in.medium.at(t));
  out.steps = step;
  out.final_temperature.assign(T.data(), T.data() + n);
  out.final_enthalpy.assign(H.data(), H.data() + n);
  return out;
}

}  // namespace colligate::thermal

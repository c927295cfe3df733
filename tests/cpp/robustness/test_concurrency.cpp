// Threads, interruption and batch-equals-scalar (issue 16). Identity tests: no literature
// values; results are compared bit for bit (== or memcmp), never with a tolerance.
#include <catch2/catch.hpp>
#include <atomic>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <cstring>
#include <random>
#include <stdexcept>
#include <thread>
#include <vector>

#include "colligate/batch/kernels.hpp"
#include "colligate/equilibria/freezing_point.hpp"
#include "colligate/equilibria/ice_fraction.hpp"
#include "colligate/models/water_activity.hpp"
#include "colligate/thermal/enthalpy.hpp"

using namespace colligate;

namespace {

/// Mass-fraction rows of sucrose, glucose and NaCl (each row summing below 0.6).
std::vector<double> mass_fraction_rows(std::size_t rows, unsigned seed) {
  std::mt19937 gen(seed);
  std::uniform_real_distribution<double> u(0.0, 0.2);
  std::vector<double> w;
  for (std::size_t i = 0; i < rows; ++i) {
    w.push_back(u(gen));
    w.push_back(u(gen));
    w.push_back(0.2 * u(gen));
  }
  return w;
}

const std::vector<std::string> species = {"sucrose", "glucose", "NaCl"};

solution scalar_row(const double* w) {
  return solution::from_mass_fractions(
      {{species[0], w[0]}, {species[1], w[1]}, {species[2], w[2]}});
}

/// Everything one solution answers, as bits.
std::vector<double> results_of(const solution& s) {
  std::vector<double> out;
  out.push_back(equilibria::freezing_point(s).temperature);
  out.push_back(models::water_activity(s, 298.15).value);
  out.push_back(models::osmotic_coefficient(s, 298.15).value);
  equilibria::ice_curve curve(s);
  for (double T : {270.0, 262.0, 255.0}) {
    const auto st = curve.at(T);
    out.push_back(st.ice);
    out.push_back(st.water_activity);
  }
  thermal::food_composition x;
  x.water = s.water_mass_fraction();
  x.carbohydrate = 1.0 - x.water;
  const thermal::food f(x, s);
  out.push_back(thermal::enthalpy(f, 263.15).value);
  return out;
}

bool same_bits(const std::vector<double>& a, const std::vector<double>& b) {
  return a.size() == b.size() && std::memcmp(a.data(), b.data(), a.size() * sizeof(double)) == 0;
}

}  // namespace

TEST_CASE("batches from mass fractions equal scalar calls bit for bit", "[batch][robustness]") {
  // The batch holds each row as solution::from_mass_fractions builds it (water 1 - sum kg,
  // moles w / M), so every kernel result equals the scalar one with ==.
  const std::size_t N = 40;
  const auto w = mass_fraction_rows(N, 7);
  const auto b = batch::solution_batch::from_mass_fractions(species, w.data(), N);
  std::vector<double> tf(N), aw(N), ice(N * 2);
  std::vector<std::uint8_t> s1(N), s2(N), s3(N * 2);
  const double temps[2] = {268.0, 258.0};
  batch::options o;
  o.threads = 2;
  batch::freezing_points(b, "auto", o, tf.data(), s1.data());
  batch::water_activities(b, 298.15, "auto", o, aw.data(), s2.data());
  batch::ice_fractions(b, temps, 2, "auto", o, ice.data(), s3.data());
  for (std::size_t i = 0; i < N; ++i) {
    INFO("row " << i);
    const auto s = scalar_row(w.data() + 3 * i);
    const auto fp = equilibria::freezing_point(s);
    CHECK(fp.temperature == tf[i]);
    CHECK(std::exp(models::ln_water_activity("auto", s, s.water_mass(), 298.15)) == aw[i]);
    equilibria::ice_curve curve(s);
    for (std::size_t k = 0; k < 2; ++k) {
      const auto st = curve.at(temps[k]);
      if (st.success()) {
        CHECK(st.ice_fraction() == ice[i * 2 + k]);
      } else {
        CHECK(std::isnan(ice[i * 2 + k]));
      }
    }
  }
}

TEST_CASE("8 threads calling concurrently give the bits of a serial run", "[threads][robustness]") {
  // No mutable global state: every call prepares its own evaluator and curve.
  const std::size_t N = 24;
  const auto w = mass_fraction_rows(N, 11);
  std::vector<std::vector<double>> serial(N);
  for (std::size_t i = 0; i < N; ++i) serial[i] = results_of(scalar_row(w.data() + 3 * i));
  std::vector<std::vector<std::vector<double>>> par(8, std::vector<std::vector<double>>(N));
  std::vector<std::thread> pool;
  std::atomic<int> ready{0};
  for (unsigned t = 0; t < 8; ++t)
    pool.emplace_back([&, t] {
      ++ready;
      while (ready.load() < 8) std::this_thread::yield();  // start together
      for (std::size_t k = 0; k < N; ++k) {
        const std::size_t i = (k + 3 * t) % N;  // each thread in its own order
        par[t][i] = results_of(scalar_row(w.data() + 3 * i));
      }
    });
  for (auto& th : pool) th.join();
  for (unsigned t = 0; t < 8; ++t)
    for (std::size_t i = 0; i < N; ++i) {
      INFO("thread " << t << " row " << i);
      CHECK(same_bits(serial[i], par[t][i]));
    }
}

TEST_CASE("a batch stops when its interruption hook says so", "[batch][robustness]") {
  // Large enough that the batch outlasts the hook's first poll (50 ms) on a fast machine:
  // the hook is only asked while workers are still running.
  const std::size_t N = 400000;
  std::vector<double> m(N);
  for (std::size_t i = 0; i < N; ++i) m[i] = 0.1 + 1e-4 * static_cast<double>(i % 1000);
  const auto b = batch::solution_batch::from_molalities({"NaCl"}, m.data(), N);
  std::vector<double> out(N);
  std::vector<std::uint8_t> st(N);
  const double temps[3] = {270.0, 265.0, 260.0};
  std::vector<double> ice(N * 3);
  std::vector<std::uint8_t> sti(N * 3);

  SECTION("true: batch::interrupted, soon") {
    int calls = 0;
    batch::options o;
    o.threads = 2;
    o.interrupted = [&calls] { return ++calls >= 1; };
    const auto t0 = std::chrono::steady_clock::now();
    CHECK_THROWS_AS(batch::ice_fractions(b, temps, 3, "pitzer", o, ice.data(), sti.data()),
                    batch::interrupted);
    const double s = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    CHECK(calls == 1);
    CHECK(s < 5.0);  // one poll after 50 ms plus one row per worker; generous on a loaded machine
  }
  SECTION("a hook that throws: its exception, workers joined") {
    batch::options o;
    o.threads = 3;
    o.interrupted = [] () -> bool { throw std::runtime_error("hook"); };
    CHECK_THROWS_WITH(batch::ice_fractions(b, temps, 3, "pitzer", o, ice.data(), sti.data()),
                      "hook");
  }
  SECTION("false: the same bits as without a hook, any thread count") {
    const std::size_t n = 300;
    const auto small = batch::solution_batch::from_molalities({"NaCl"}, m.data(), n);
    std::vector<double> ref(n), got(n);
    std::vector<std::uint8_t> s_ref(n), s_got(n);
    batch::freezing_points(small, "pitzer", {}, ref.data(), s_ref.data());
    for (unsigned threads : {1u, 2u, 5u}) {
      batch::options o;
      o.threads = threads;
      o.interrupted = [] { return false; };
      batch::freezing_points(small, "pitzer", o, got.data(), s_got.data());
      CHECK(std::memcmp(ref.data(), got.data(), n * sizeof(double)) == 0);
      CHECK(s_ref == s_got);
    }
  }
}

TEST_CASE("batch rows whose model gives a_w > 1 get no value", "[batch][robustness]") {
  // K2SO4 2.75 mol/kg at 240 K: far beyond the Pitzer parameters (see
  // test_physical_bounds.cpp); the row is NaN with its own status, never a_w > 1.
  std::vector<double> m = {0.5, 2.75};
  const auto b = batch::solution_batch::from_molalities({"K2SO4"}, m.data(), 2);
  std::vector<double> aw(2);
  std::vector<std::uint8_t> st(2);
  batch::water_activities(b, 240.0, "pitzer", {}, aw.data(), st.data());
  for (std::size_t i = 0; i < 2; ++i) {
    INFO("row " << i << " a_w " << aw[i] << " status " << int(st[i]));
    CHECK((std::isnan(aw[i]) || (aw[i] > 0.0 && aw[i] <= 1.0)));
    if (std::isnan(aw[i])) CHECK(st[i] != 0);
  }
}

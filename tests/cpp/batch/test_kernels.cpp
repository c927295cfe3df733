// Batch kernels: equal to scalar calls bit for bit, independent of the thread count,
// robust to bad rows.
#include <catch2/catch.hpp>
#include <cmath>
#include <cstdint>
#include <cstring>
#include <random>
#include <vector>

#include "colligate/batch/kernels.hpp"
#include "colligate/equilibria/freezing_point.hpp"

using namespace colligate;

namespace {
std::vector<double> random_molalities(std::size_t rows, std::size_t species, unsigned seed) {
  std::mt19937 gen(seed);
  std::uniform_real_distribution<double> u(0.0, 0.3);
  std::vector<double> m(rows * species);
  for (auto& x : m) x = u(gen);
  return m;
}
}  // namespace

TEST_CASE("batch freezing points equal scalar ones bit for bit", "[batch]") {
  const std::vector<std::string> species = {"sucrose", "glucose", "glycerol"};
  const auto m = random_molalities(64, species.size(), 1);
  const auto b = batch::solution_batch::from_molalities(species, m.data(), 64);
  std::vector<double> out(64);
  std::vector<std::uint8_t> st(64);
  batch::freezing_points(b, models::model_id::automatic, {}, out.data(), st.data());
  for (std::size_t i = 0; i < 64; ++i) {
    const auto s = solution::from_molalities(
        {{species[0], m[i * 3]}, {species[1], m[i * 3 + 1]}, {species[2], m[i * 3 + 2]}});
    CHECK(equilibria::freezing_point(s).temperature == out[i]);
  }
}

TEST_CASE("thread count does not change batch results", "[batch]") {
  const std::vector<std::string> species = {"sucrose", "fructose"};
  const std::size_t N = 5000;
  const auto m = random_molalities(N, 2, 2);
  const auto b = batch::solution_batch::from_molalities(species, m.data(), N);
  std::vector<double> one(N), four(N), ice1(N * 2), ice4(N * 2);
  std::vector<std::uint8_t> s1(N), s4(N), is1(N * 2), is4(N * 2);
  batch::options o1;
  o1.threads = 1;
  batch::options o4;
  o4.threads = 4;
  batch::freezing_points(b, models::model_id::norrish, o1, one.data(), s1.data());
  batch::freezing_points(b, models::model_id::norrish, o4, four.data(), s4.data());
  CHECK(std::memcmp(one.data(), four.data(), N * sizeof(double)) == 0);
  const double temps[2] = {265.0, 250.0};
  batch::ice_fractions(b, temps, 2, models::model_id::norrish, o1, ice1.data(), is1.data());
  batch::ice_fractions(b, temps, 2, models::model_id::norrish, o4, ice4.data(), is4.data());
  CHECK(std::memcmp(ice1.data(), ice4.data(), N * 2 * sizeof(double)) == 0);
}

TEST_CASE("bad rows get NaN and a status, good rows are untouched", "[batch]") {
  const std::vector<std::string> species = {"sucrose"};
  std::vector<double> m = {0.5, -1.0, std::nan(""), 0.8};
  const auto b = batch::solution_batch::from_molalities(species, m.data(), 4);
  std::vector<double> out(4);
  std::vector<std::uint8_t> st(4);
  batch::freezing_points(b, models::model_id::automatic, {}, out.data(), st.data());
  CHECK(st[0] == 0);
  CHECK(st[1] == static_cast<std::uint8_t>(batch::row_status::invalid_input));
  CHECK(st[2] == static_cast<std::uint8_t>(batch::row_status::invalid_input));
  CHECK(std::isnan(out[1]));
  CHECK(std::isnan(out[2]));
  CHECK(out[0] == equilibria::freezing_point(solution::from_molalities({{"sucrose", 0.5}})).temperature);
  std::vector<double> w = {0.6, 0.5};  // mass fractions summing above 1
  const auto bw = batch::solution_batch::from_mass_fractions({"sucrose", "glucose"}, w.data(), 1);
  CHECK_FALSE(bw.valid(0));
  CHECK_THROWS_AS(batch::solution_batch::from_molalities({"sucrse"}, m.data(), 1), invalid_input);
}

// Batch kernels: equal to scalar calls bit for bit, independent of the thread count,
// robust to bad rows.
#include <catch2/catch.hpp>
#include <algorithm>
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
  batch::freezing_points(b, "auto", {}, out.data(), st.data());
  for (std::size_t i = 0; i < 64; ++i) {
    const auto s = solution::from_molalities(
        {{species[0], m[i * 3]}, {species[1], m[i * 3 + 1]}, {species[2], m[i * 3 + 2]}});
    CHECK(equilibria::freezing_point(s).temperature == out[i]);
  }
}

TEST_CASE("batch results with bound water equal scalar ones bit for bit", "[batch]") {
  // Identity test (no literature value): both paths turn the share of the water into kg
  // with core/bound_water.hpp and solve the same equations.
  const std::vector<std::string> species = {"sucrose", "lactose"};
  const auto m = random_molalities(32, species.size(), 7);
  const auto b = batch::solution_batch::from_molalities(species, m.data(), 32);
  batch::options o;
  o.bound_water_fraction_of_water = 0.07;
  std::vector<double> tf(32), ice(32);
  std::vector<std::uint8_t> st(32), ist(32);
  const double T = 263.15;
  batch::freezing_points(b, "auto", o, tf.data(), st.data());
  batch::ice_fractions(b, &T, 1, "auto", o, ice.data(), ist.data());
  for (std::size_t i = 0; i < 32; ++i) {
    const auto s = solution::from_molalities({{species[0], m[i * 2]}, {species[1], m[i * 2 + 1]}});
    const double bound = bound_water_kg(s, 0.07);
    CHECK(equilibria::freezing_point(s, "auto", bound).temperature == tf[i]);
    CHECK(equilibria::ice_fraction(s, T, "auto", range_policy::extrapolate, bound).value == ice[i]);
  }
  o.bound_water_fraction_of_water = 1.0;
  CHECK_THROWS_WITH(batch::freezing_points(b, "auto", o, tf.data(), st.data()),
                    Catch::Contains("bound_water_fraction_of_water"));
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
  batch::freezing_points(b, "norrish", o1, one.data(), s1.data());
  batch::freezing_points(b, "norrish", o4, four.data(), s4.data());
  CHECK(std::memcmp(one.data(), four.data(), N * sizeof(double)) == 0);
  const double temps[2] = {265.0, 250.0};
  batch::ice_fractions(b, temps, 2, "norrish", o1, ice1.data(), is1.data());
  batch::ice_fractions(b, temps, 2, "norrish", o4, ice4.data(), is4.data());
  CHECK(std::memcmp(ice1.data(), ice4.data(), N * 2 * sizeof(double)) == 0);
}

TEST_CASE("bad rows get NaN and a status, good rows are untouched", "[batch]") {
  const std::vector<std::string> species = {"sucrose"};
  std::vector<double> m = {0.5, -1.0, std::nan(""), 0.8};
  const auto b = batch::solution_batch::from_molalities(species, m.data(), 4);
  std::vector<double> out(4);
  std::vector<std::uint8_t> st(4);
  batch::freezing_points(b, "auto", {}, out.data(), st.data());
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

namespace {
/// Seawater compositions (TEOS-10 Reference Composition as built by solution::seawater)
/// for absolute salinities from 5 to 40 g/kg: the species list and the molality rows.
std::vector<double> seawater_rows(std::size_t rows, std::vector<std::string>& species) {
  species.clear();
  const auto reference = solution::seawater(35.0);
  for (const auto& r : reference.species()) species.push_back(r.id);
  std::vector<double> m;
  for (std::size_t i = 0; i < rows; ++i) {
    const auto s = solution::seawater(5.0 + 35.0 * static_cast<double>(i) / (rows - 1));
    for (std::size_t j = 0; j < s.size(); ++j) m.push_back(s.molality(j));
  }
  return m;
}

solution row_solution(const std::vector<std::string>& species, const double* m) {
  std::vector<named_amount> amounts;
  for (std::size_t j = 0; j < species.size(); ++j) amounts.emplace_back(species[j], m[j]);
  return solution::from_molalities(amounts);
}
}  // namespace

TEST_CASE("Pitzer seawater batch equals scalar calls bit for bit", "[batch][pitzer]") {
  // Identity (no literature value): each row of a batch is computed by the scalar code,
  // so freezing points and water activities are equal with == (no tolerance), for the
  // 5-salt / 6-ion seawater of the Pitzer model and for 'auto' (which resolves to it).
  std::vector<std::string> species;
  const std::size_t N = 48;
  const auto m = seawater_rows(N, species);
  const auto b = batch::solution_batch::from_molalities(species, m.data(), N);
  for (auto model : {"pitzer", "auto"}) {
    std::vector<double> tf(N), aw(N);
    std::vector<std::uint8_t> st(N), sa(N);
    batch::freezing_points(b, model, {}, tf.data(), st.data());
    batch::water_activities(b, 271.15, model, {}, aw.data(), sa.data());
    for (std::size_t i = 0; i < N; ++i) {
      const auto s = row_solution(species, m.data() + i * species.size());
      const auto r = equilibria::freezing_point(s, model);
      INFO("row " << i);
      CHECK(st[i] == static_cast<std::uint8_t>(batch::row_status::ok));
      CHECK(r.success());
      CHECK(r.temperature == tf[i]);
      CHECK(std::exp(models::ln_water_activity(model, s, s.water_mass(), 271.15)) == aw[i]);
    }
  }
}

TEST_CASE("Pitzer seawater batch does not depend on the thread count", "[batch][pitzer]") {
  // Identity: rows are independent and each thread prepares its own evaluator, so 1, 2 and
  // 4 threads give the same bits (memcmp), for freezing points and ice fractions.
  std::vector<std::string> species;
  const std::size_t N = 301;
  const auto m = seawater_rows(N, species);
  const auto b = batch::solution_batch::from_molalities(species, m.data(), N);
  const double temps[2] = {271.0, 265.0};
  std::vector<std::vector<double>> tf, ice;
  for (unsigned threads : {1u, 2u, 4u}) {
    batch::options o;
    o.threads = threads;
    std::vector<double> t(N), f(N * 2);
    std::vector<std::uint8_t> st(N), sf(N * 2);
    batch::freezing_points(b, "pitzer", o, t.data(), st.data());
    batch::ice_fractions(b, temps, 2, "pitzer", o, f.data(), sf.data());
    tf.push_back(t);
    ice.push_back(f);
  }
  for (std::size_t k = 1; k < tf.size(); ++k) {
    CHECK(std::memcmp(tf[0].data(), tf[k].data(), N * sizeof(double)) == 0);
    CHECK(std::memcmp(ice[0].data(), ice[k].data(), N * 2 * sizeof(double)) == 0);
  }
}

TEST_CASE("Pitzer batch: bad rows and salts beyond their range in a seawater batch", "[batch][pitzer]") {
  // A NaN row is invalid input; a brine above the CaCl2 eutectic composition (4.5 mol/kg
  // CaCl2, beyond the -50 C search limit; eutectic about 4 mol/kg, docs/electrolytes.md)
  // has no freezing point; the other rows still equal their scalar values.
  std::vector<std::string> species;
  auto m = seawater_rows(4, species);
  const std::size_t S = species.size();
  m[1 * S] = std::nan("");
  for (std::size_t j = 0; j < S; ++j) m[2 * S + j] = species[j] == "calcium_chloride" ? 4.5 : 0.0;
  const auto b = batch::solution_batch::from_molalities(species, m.data(), 4);
  std::vector<double> tf(4);
  std::vector<std::uint8_t> st(4);
  batch::freezing_points(b, "pitzer", {}, tf.data(), st.data());
  CHECK(st[1] == static_cast<std::uint8_t>(batch::row_status::invalid_input));
  CHECK(st[2] == static_cast<std::uint8_t>(batch::row_status::no_freezing_point));
  CHECK(std::isnan(tf[1]));
  CHECK(std::isnan(tf[2]));
  for (std::size_t i : {0u, 3u})
    CHECK(tf[i] == equilibria::freezing_point(row_solution(species, m.data() + i * S),
                                              "pitzer")
                       .temperature);
}

TEST_CASE("NaCl + sucrose batch (Ross rule) equals scalar calls bit for bit", "[batch][ross]") {
  // Identity (no literature value): 'auto' resolves to the Ross rule for salt + sugar; a
  // batch row is computed by the scalar code with one evaluator prepared per thread, so
  // freezing points, water activities and the row status (which includes the Ross/ZSR
  // comparison of the check) equal the scalar calls with == and memcmp, for 1 and 2
  // threads. Rows: sucrose 0-2 mol/kg and NaCl 0-1.5 mol/kg on a 9 x 7 grid (some rows
  // beyond the 0.005 a_w Ross/ZSR limit, so both statuses occur).
  const std::vector<std::string> species = {"sucrose", "NaCl"};
  std::vector<double> m;
  for (int i = 0; i < 9; ++i)
    for (int j = 0; j < 7; ++j) {
      m.push_back(0.25 * i);
      m.push_back(0.25 * j);
    }
  const std::size_t N = m.size() / 2;
  const auto b = batch::solution_batch::from_molalities(species, m.data(), N);
  std::vector<std::vector<double>> tf, aw;
  std::size_t flagged = 0;
  for (unsigned threads : {1u, 2u}) {
    batch::options o;
    o.threads = threads;
    std::vector<double> t(N), a(N);
    std::vector<std::uint8_t> st(N), sa(N);
    batch::freezing_points(b, "auto", o, t.data(), st.data());
    batch::water_activities(b, 268.15, "auto", o, a.data(), sa.data());
    for (std::size_t i = 0; i < N; ++i) {
      const auto s = row_solution(species, m.data() + i * 2);
      INFO("row " << i << ", " << threads << " thread(s)");
      const auto r = equilibria::freezing_point(s);
      CHECK(r.success());
      CHECK(r.temperature == t[i]);
      CHECK(st[i] == static_cast<std::uint8_t>(r.check.in_range() ? batch::row_status::ok
                                                                  : batch::row_status::out_of_range));
      const auto w = models::water_activity(s, 268.15);
      CHECK(w.value == a[i]);
      CHECK(sa[i] == static_cast<std::uint8_t>(w.check.in_range() ? batch::row_status::ok
                                                                  : batch::row_status::out_of_range));
      if (threads == 1 && !r.check.in_range()) ++flagged;
    }
    tf.push_back(t);
    aw.push_back(a);
  }
  CHECK(flagged > 0);
  CHECK(std::memcmp(tf[0].data(), tf[1].data(), N * sizeof(double)) == 0);
  CHECK(std::memcmp(aw[0].data(), aw[1].data(), N * sizeof(double)) == 0);
}

TEST_CASE("Norrish freezing points by stages: every kind of row equals its scalar call", "[batch][norrish]") {
  // Identity test (no literature value). The kernel runs rows of a temperature-independent
  // model in blocks of batch::detail::ice_line_block_rows, one stage at a time; each row
  // must still give the scalar result and status, whatever its neighbours in the block,
  // the thread count and the interruption hook. Rows (mol/kg, invented): ordinary ones;
  // no solute (ice point); a negative amount (invalid); sucrose 14 mol/kg (ln a_w below the
  // interpolated ice line: the Newton inverse, out of range); 20 mol/kg (no freezing
  // point above -50 C); glycerol past its Norrish range (out of range). 203 rows: the last
  // block is short.
  const std::vector<std::string> species = {"sucrose", "glycerol", "citric_acid"};
  const std::size_t N = 203;
  auto m = random_molalities(N, species.size(), 11);
  for (std::size_t i = 0; i < N; i += 7) m[i * 3] = m[i * 3 + 1] = m[i * 3 + 2] = 0.0;
  for (std::size_t i = 3; i < N; i += 11) m[i * 3 + 1] = -1.0;
  for (std::size_t i = 5; i < N; i += 13) m[i * 3] = 14.0;
  for (std::size_t i = 6; i < N; i += 17) m[i * 3] = 20.0;
  for (std::size_t i = 9; i < N; i += 19) m[i * 3 + 1] = 12.0;
  const auto b = batch::solution_batch::from_molalities(species, m.data(), N);
  const double bound_fraction = 0.05;
  std::vector<double> expected(N);
  std::vector<std::uint8_t> expected_status(N);
  for (std::size_t i = 0; i < N; ++i) {
    if (!b.valid(i)) {
      expected[i] = std::nan("");
      expected_status[i] = static_cast<std::uint8_t>(batch::row_status::invalid_input);
      continue;
    }
    const auto s = solution::from_molalities(
        {{species[0], m[i * 3]}, {species[1], m[i * 3 + 1]}, {species[2], m[i * 3 + 2]}});
    const auto r = equilibria::freezing_point(s, "norrish", bound_water_kg(s, bound_fraction));
    auto st = batch::row_status::ok;
    double v = r.temperature;
    if (r.status == equilibria::solve_status::below_search_limit) {
      st = batch::row_status::no_freezing_point;
      v = std::nan("");
    } else if (!r.check.in_range()) {
      st = batch::row_status::out_of_range;
    }
    expected[i] = v;
    expected_status[i] = static_cast<std::uint8_t>(st);
  }
  // Every kind of row is present.
  for (auto st : {batch::row_status::ok, batch::row_status::out_of_range,
                  batch::row_status::invalid_input, batch::row_status::no_freezing_point})
    CHECK(std::count(expected_status.begin(), expected_status.end(),
                     static_cast<std::uint8_t>(st)) > 0);
  for (unsigned threads : {1u, 3u}) {
    for (bool hook : {false, true}) {
      batch::options o;
      o.threads = threads;
      o.bound_water_fraction_of_water = bound_fraction;
      if (hook) o.interrupted = [] { return false; };
      std::vector<double> out(N);
      std::vector<std::uint8_t> st(N);
      batch::freezing_points(b, "norrish", o, out.data(), st.data());
      for (std::size_t i = 0; i < N; ++i) {
        INFO("row " << i << ", " << threads << " threads, hook " << hook);
        CHECK(st[i] == expected_status[i]);
        if (std::isnan(expected[i]))
          CHECK(std::isnan(out[i]));
        else
          CHECK(out[i] == expected[i]);
      }
    }
  }
}

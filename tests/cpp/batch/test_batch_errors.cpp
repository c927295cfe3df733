// Batch calls and worker threads: an exception in a worker reaches the caller as the same
// error the serial path raises, and an absurd thread count is capped.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <vector>

#include "colligate/batch/kernels.hpp"
#include "colligate/fit/pitzer_fitter.hpp"

using namespace colligate;

namespace {

/// A table with two NaCl records carrying different Pitzer parameters for Na+ Cl- (a
/// caller mistake: one ion pair can have one set of parameters). Invented parameters.
data::solute_table conflicting_table() {
  const auto nacl = data::builtin_solutes().find("NaCl");
  fit::pitzer_salt_parameters a, b;
  a.beta0 = 0.0765;
  b.beta0 = 0.05;
  const auto r1 = fit::pitzer_salt_record(nacl, "salt_a", "", a, 6.0, 250.0, 303.15, "", "");
  const auto r2 = fit::pitzer_salt_record(nacl, "salt_b", "", b, 6.0, 250.0, 303.15, "", "");
  return fit::extend_table(data::builtin_solutes(), {r1, r2});
}

}  // namespace

TEST_CASE("a worker's exception reaches the caller as the serial one", "[batch][errors]") {
  const auto table = conflicting_table();
  const std::vector<double> m = {0.5, 0.5, 1.0, 1.0, 0.2, 0.3, 0.7, 0.1};
  const auto b = batch::solution_batch::from_molalities({"salt_a", "salt_b"}, m.data(), 4, table);
  std::vector<double> out(4);
  std::vector<std::uint8_t> st(4);
  for (unsigned threads : {1u, 2u, 4u}) {
    INFO(threads << " thread(s)");
    batch::options o;
    o.threads = threads;
    CHECK_THROWS_AS(batch::freezing_points(b, "pitzer", o, out.data(), st.data()), invalid_input);
    const double T = 263.15;
    CHECK_THROWS_AS(batch::ice_fractions(b, &T, 1, "pitzer", o, out.data(), st.data()),
                    invalid_input);
  }
}

TEST_CASE("an absurd thread count is capped, results unchanged", "[batch][errors]") {
  std::vector<double> m;
  for (int i = 0; i < 50; ++i) m.push_back(0.01 * (i + 1));
  const auto b = batch::solution_batch::from_molalities({"sucrose"}, m.data(), 50);
  std::vector<double> one(50), many(50);
  std::vector<std::uint8_t> st(50);
  batch::options o;
  o.threads = 1;
  batch::freezing_points(b, "auto", o, one.data(), st.data());
  o.threads = 40000;
  CHECK(batch::detail::thread_count(40000, 50) <= 50u);
  CHECK(batch::detail::thread_count(40000, 1000000) == batch::detail::max_threads());
  batch::freezing_points(b, "auto", o, many.data(), st.data());
  CHECK(one == many);  // bit-identical whatever the thread count
}

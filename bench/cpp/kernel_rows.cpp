// The batch kernels of bench_kernels.py on one thread, for instruction counts under
// valgrind (bench_instructions.py builds it against two checkouts and runs both). Rows are
// invented sweeps of the same kind as bench_kernels.py's (six sugar / polyol / acid solutes
// at 0-5 wt% each, or NaCl + sucrose), drawn here with std::mt19937 (seed 1).
//
//   kernel_rows KERNEL ROWS [CALLS]     KERNEL: freezing_point | ice_fraction | ross | seawater
//
// seawater: the Pitzer freezing point of solution::seawater's composition scaled to
// absolute salinities 5-40 g/kg (bench_kernels.seawater_batch's sweep).
//
// Calls the kernel CALLS times (default 1); prints the CPU time per row (best call) and a
// checksum of the outputs, so two builds can be seen to give the same numbers.
#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <ctime>
#include <random>
#include <string>
#include <vector>

#include "colligate/batch/kernels.hpp"

using namespace colligate;

int main(int argc, char** argv) {
  if (argc < 3) {
    std::fprintf(stderr, "usage: %s freezing_point|ice_fraction|ross|seawater ROWS [REPEATS]\n", argv[0]);
    return 2;
  }
  const std::string kernel = argv[1];
  const std::size_t rows = std::strtoul(argv[2], nullptr, 10);
  const int calls = argc > 3 ? std::atoi(argv[3]) : 1;
  std::vector<std::string> species;
  std::vector<double> x;
  if (kernel == "ross") {  // as bench_kernels.mixture_fractions
    species = {"sucrose", "NaCl"};
    for (std::size_t k = 0; k < rows; ++k) {
      x.push_back(0.05 + 0.25 * static_cast<double>(k % 101) / 100.0);
      x.push_back(0.005 + 0.045 * static_cast<double>(k % 37) / 36.0);
    }
  } else if (kernel == "seawater") {  // as bench_kernels.seawater_batch: molalities
    const solution ref = solution::seawater(35.0);
    for (const auto& r : ref.species()) species.push_back(r.id);
    for (std::size_t k = 0; k < rows; ++k) {
      const double SA = 5.0 + 35.0 * static_cast<double>(k) / static_cast<double>(rows > 1 ? rows - 1 : 1);
      const double scale = (SA / (1000.0 - SA)) / (35.0 / 965.0);
      for (std::size_t j = 0; j < ref.size(); ++j) x.push_back(ref.moles()[j] / ref.water_mass() * scale);
    }
  } else if (kernel == "freezing_point" || kernel == "ice_fraction") {
    species = {"sucrose", "glucose", "fructose", "lactose", "glycerol", "citric_acid"};
    std::mt19937 gen(1);
    std::uniform_real_distribution<double> u(0.0, 0.05);
    x.resize(rows * species.size());
    for (auto& v : x) v = u(gen);
  } else {
    std::fprintf(stderr, "unknown kernel '%s'\n", kernel.c_str());
    return 2;
  }
  const auto b = kernel == "seawater" ? batch::solution_batch::from_molalities(species, x.data(), rows)
                                      : batch::solution_batch::from_mass_fractions(species, x.data(), rows);
  std::vector<double> out(rows);
  std::vector<std::uint8_t> status(rows);
  batch::options o;
  o.threads = 1;
  const models::model_choice m(kernel == "ross" ? "ross" : kernel == "seawater" ? "pitzer" : "norrish");
  const double T = 263.15;  // K, bench_kernels.T_ICE
  double best = 1e300;
  for (int r = 0; r < calls; ++r) {
    timespec t0, t1;
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &t0);
    if (kernel == "ice_fraction")
      batch::ice_fractions(b, &T, 1, m, o, out.data(), status.data());
    else
      batch::freezing_points(b, m, o, out.data(), status.data());
    clock_gettime(CLOCK_THREAD_CPUTIME_ID, &t1);
    best = std::min(best, (t1.tv_sec - t0.tv_sec) * 1e9 + (t1.tv_nsec - t0.tv_nsec));
  }
  double sum = 0.0;
  for (double v : out) sum += v;
  std::printf("%s rows=%zu cpu_ns_per_row=%.1f checksum=%.17g\n", kernel.c_str(), rows,
              best / static_cast<double>(rows), sum);
  return 0;
}

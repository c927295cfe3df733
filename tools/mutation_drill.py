#!/usr/bin/env python3
"""Mutation drill: do the published checks catch a wrong number?

Plants one plausible bug at a time in the core formulas of a scratch copy of this
checkout, rebuilds only the C++ validation target (`colligate_validation`,
tests/cpp/validation/: published magnitudes and held-out rows, one translation unit) with
ccache, runs it, and prints which bugs were caught. The checkout itself is never touched.

    python3 tools/mutation_drill.py                 # every mutation
    python3 tools/mutation_drill.py --list          # the planted bugs
    python3 tools/mutation_drill.py --only ice_point_plus_10mK beta1_sign
    python3 tools/mutation_drill.py --scratch DIR   # where the copy goes (default: a temp dir)

A baseline run without any mutation must pass first. A mutation whose text is no longer
found in its file stops the drill (the drill needs updating with the code). Exit status:
0 when every mutation was caught, 1 otherwise.
"""
from __future__ import annotations

import argparse
import dataclasses
import os
import shutil
import subprocess
import sys
import tempfile
import time
import xml.etree.ElementTree as ET
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
TARGET = "colligate_validation"
INC = "cpp/include/colligate"


@dataclasses.dataclass(frozen=True)
class Mutation:
    name: str
    what: str
    path: str
    old: str
    new: str


MUTATIONS = [
    Mutation("heat_load_latent_at_0C", "heat_load: latent heat of each ice increment taken at 0 C, not at T",
             f"{INC}/thermal/enthalpy.hpp",
             "detail::latent_heat(std::min(mid, constants::ice_point))",
             "detail::latent_heat(constants::ice_point)"),
    Mutation("latent_heat_plus_2pct", "thermal latent heat 2 % high",
             f"{INC}/thermal/enthalpy.hpp",
             "  return water::enthalpy_of_fusion(T) / constants::molar_mass_water;",
             "  return 1.02 * water::enthalpy_of_fusion(T) / constants::molar_mass_water;"),
    Mutation("latent_heat_minus_2pct", "thermal latent heat 2 % low",
             f"{INC}/thermal/enthalpy.hpp",
             "  return water::enthalpy_of_fusion(T) / constants::molar_mass_water;",
             "  return 0.98 * water::enthalpy_of_fusion(T) / constants::molar_mass_water;"),
    Mutation("beta1_sign", "Pitzer B^phi: sign of the beta1 term flipped",
             f"{INC}/models/detail/pitzer_system.hpp",
             "double Bphi = beta0 + beta1 *",
             "double Bphi = beta0 - beta1 *"),
    Mutation("beta1_sign_along_temperature",
             "Pitzer osmotic sum along temperature (freezing-point Newton): sign of the beta1 weight flipped",
             f"{INC}/models/detail/pitzer_system.hpp",
             "      add(mm * (row.alpha1 == 0 ? q.e2 : q.e14));",
             "      add(-mm * (row.alpha1 == 0 ? q.e2 : q.e14));"),
    Mutation("ice_point_plus_10mK", "ice point 273.16 K instead of 273.15 K",
             f"{INC}/core/constants.hpp",
             "inline constexpr double ice_point = 273.15;",
             "inline constexpr double ice_point = 273.16;"),
    Mutation("ice_point_minus_10mK", "ice point 273.14 K instead of 273.15 K",
             f"{INC}/core/constants.hpp",
             "inline constexpr double ice_point = 273.15;",
             "inline constexpr double ice_point = 273.14;"),
    Mutation("norrish_term_dropped", "Norrish: the -(sum sqrt(K_i) x_i)^2 term left out",
             f"{INC}/models/norrish.hpp",
             "return -std::log1p(P / nw) - sqrt_sum * sqrt_sum + extra;",
             "return -std::log1p(P / nw) + extra;"),
    Mutation("glucose_molar_mass_hydrate", "glucose molar mass of the monohydrate (198.17) for the anhydrous sugar (factor 1.1)",
             f"{INC}/data/detail/builtin_solutes.inc",
             '{"dextrose", "d-glucose", "grape sugar"}, 180.1559,',
             '{"dextrose", "d-glucose", "grape sugar"}, 198.1712,'),
    Mutation("delta_cp_sign", "heat-capacity difference of fusion with the wrong sign (ice minus liquid)",
             f"{INC}/water/ice.hpp",
             "constants::heat_capacity_water_0c - constants::heat_capacity_ice_0c,  // 38.25",
             "constants::heat_capacity_ice_0c - constants::heat_capacity_water_0c,  // 38.25"),
    Mutation("solids_sensible_heat_dropped", "enthalpy: the sensible heat of the solid components left out",
             f"{INC}/thermal/components.hpp",
             "inline double solids_sensible_enthalpy(const food_composition& x, double t1, double t2) {",
             "inline double solids_sensible_enthalpy(const food_composition& x, double t1, double t2) {\n"
             "  if (t1 == t1) return 0.0;  // planted"),
    Mutation("propylene_glycol_k3_dropped", "propylene glycol: the fitted cubic Norrish constant K3 left out",
             f"{INC}/data/detail/builtin_solutes.inc",
             'norrish(4.23023, "colligate_fit_melinder", -9.94711, 0.0, "colligate_fit_melinder", 0.40,',
             'norrish(4.23023, "colligate_fit_melinder", 0.0, 0.0, "colligate_fit_melinder", 0.40,'),
    Mutation("dissolved_salts_as_ash", "thermal: dissolved salts counted as Choi & Okos ash, their apparent specific heat ignored",
             f"{INC}/thermal/dissolved_solutes.hpp",
             "if (!r.heat_capacity.available || !(W > 0.0)) continue;",
             "if (true || !(W > 0.0)) continue;  // planted"),
    Mutation("apparent_heat_capacity_sign", "a dissolved solute's apparent specific heat with the wrong sign",
             f"{INC}/data/dissolved_heat_capacity.hpp",
             "return 1e3 * (c.a1 * std::exp(alpha) + c.a5 * std::pow(w, c.a6));",
             "return -1e3 * (c.a1 * std::exp(alpha) + c.a5 * std::pow(w, c.a6));"),
    # salts (issue 12): the 2:2 term, unsymmetrical mixing, a hydrate's water, the single-salt
    # edge conversion and a fitted food-salt constant
    Mutation("beta2_term_dropped", "Pitzer B^phi: the beta2 term of 2:2 salts left out",
             f"{INC}/models/detail/pitzer_system.hpp",
             "      if (beta2) Bphi += beta2v * e12;",
             "      if (false) Bphi += beta2v * e12;"),
    Mutation("e_theta_dropped", "Pitzer: unsymmetrical mixing E-theta and E-theta' left out",
             f"{INC}/models/detail/pitzer_kernel.hpp",
             "  et = zz / (4.0 * I) * (J_ij - 0.5 * J_ii - 0.5 * J_jj);\n"
             "  etp = -et / I + zz / (8.0 * I * I) * (xdJ_ij - 0.5 * xdJ_ii - 0.5 * xdJ_jj);",
             "  et = 0.0 * (zz + I + J_ij + J_ii + J_jj + xdJ_ij + xdJ_ii + xdJ_jj);  // planted\n"
             "  etp = 0.0;"),
    Mutation("hydrohalite_water_dropped", "hydrohalite NaCl.2H2O counted without its two waters in the IAP",
             f"{INC}/equilibria/salt_solubility.hpp",
             '{"hydrohalite", "NaCl.2H2O", {{"Na+", 1}, {"Cl-", 1}}, 2,',
             '{"hydrohalite", "NaCl.2H2O", {{"Na+", 1}, {"Cl-", 1}}, 0,'),
    Mutation("single_salt_molality_per_solution", "single-salt molality per kg of solution, w / M, not per kg of water",
             f"{INC}/models/pitzer_single_salt.hpp",
             "  return mass_fraction / (p.molar_mass * (1.0 - mass_fraction));",
             "  return mass_fraction / p.molar_mass;"),
    Mutation("potassium_acetate_k3_dropped", "potassium acetate: the fitted cubic Norrish constant K3 left out",
             f"{INC}/data/detail/builtin_solutes.inc",
             'norrish(6.3308, "colligate_fit_melinder", 143.455, 0.0,',
             'norrish(6.3308, "colligate_fit_melinder", 0.0, 0.0,'),
]


def run(cmd, cwd, log, env=None) -> int:
    with open(log, "a") as fh:
        fh.write(f"\n$ {' '.join(map(str, cmd))}\n")
        fh.flush()
        return subprocess.run(cmd, cwd=cwd, stdout=fh, stderr=subprocess.STDOUT, env=env).returncode


def copy_checkout(dest: Path) -> None:
    """Tracked and untracked (not ignored) files of the checkout, as they are now."""
    files = subprocess.run(["git", "ls-files", "-co", "--exclude-standard", "-z"], cwd=ROOT,
                           capture_output=True, check=True).stdout.decode().split("\0")
    for f in filter(None, files):
        src = ROOT / f
        if src.is_file():
            (dest / f).parent.mkdir(parents=True, exist_ok=True)
            shutil.copy2(src, dest / f)


def build_and_test(scratch: Path, build: Path, log: Path) -> tuple[str, list[str], int]:
    """('pass' | 'fail' | 'build failed', names of the failing test cases, test cases run)."""
    if run(["cmake", "--build", str(build), "--target", TARGET, "-j2"], scratch, log) != 0:
        return "build failed", [], 0
    out = subprocess.run([str(build / "tests" / "cpp" / TARGET), "--reporter", "junit"], cwd=scratch,
                         capture_output=True, text=True)
    with open(log, "a") as fh:
        fh.write(out.stdout[-50000:] + out.stderr[-5000:])
    try:
        cases = ET.fromstring(out.stdout).iter("testcase")
    except ET.ParseError:
        return ("pass" if out.returncode == 0 else "fail"), ["(unreadable test output)"], 0
    names, failed = [], []
    for c in cases:
        names.append(c.get("name", "?"))
        if c.find("failure") is not None or c.find("error") is not None:
            failed.append(c.get("name", "?"))
    status = "pass" if out.returncode == 0 and not failed else "fail"
    return status, sorted(set(failed)), len(set(names))


def main(argv=None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--list", action="store_true", help="print the planted bugs and exit")
    ap.add_argument("--only", nargs="+", metavar="NAME", help="run only these mutations")
    ap.add_argument("--scratch", type=Path, help="directory for the scratch copy (default: a new temp dir)")
    ap.add_argument("--keep", action="store_true", help="keep the scratch copy afterwards")
    args = ap.parse_args(argv)
    chosen = [m for m in MUTATIONS if not args.only or m.name in args.only]
    if args.list:
        for m in MUTATIONS:
            print(f"{m.name:28s} {m.what}  [{m.path}]")
        return 0
    unknown = set(args.only or []) - {m.name for m in MUTATIONS}
    if unknown:
        ap.error(f"unknown mutation(s): {', '.join(sorted(unknown))}; see --list")

    scratch = args.scratch or Path(tempfile.mkdtemp(prefix="colligate-drill-"))
    scratch.mkdir(parents=True, exist_ok=True)
    copy_checkout(scratch)
    build = scratch / "build" / "drill"
    log = scratch / "drill.log"
    print(f"scratch copy: {scratch} (log: {log})")
    for m in chosen:  # every mutation site must exist exactly once before anything runs
        text = (scratch / m.path).read_text()
        if text.count(m.old) != 1:
            print(f"mutation {m.name}: its text occurs {text.count(m.old)} times in {m.path}; "
                  "update tools/mutation_drill.py", file=sys.stderr)
            return 2
    env = dict(os.environ)
    if run(["cmake", "-S", ".", "-B", str(build), "-G", "Ninja", "-DCOLLIGATE_BUILD_TESTS=ON",
            "-DCMAKE_CXX_COMPILER_LAUNCHER=ccache"], scratch, log, env) != 0:
        print("configure failed; see the log", file=sys.stderr)
        return 2
    t = time.time()
    status, failed, n_cases = build_and_test(scratch, build, log)
    print(f"baseline (no mutation): {status}, {n_cases} test cases"
          + (f", failing: {'; '.join(failed)}" if failed else "") + f" [{time.time() - t:.0f} s]")
    if status != "pass":
        print("the validation suite must pass before bugs are planted; see the log", file=sys.stderr)
        return 2

    results = []
    for m in chosen:
        path = scratch / m.path
        original = path.read_text()
        path.write_text(original.replace(m.old, m.new))
        t = time.time()
        try:
            status, failed, _ = build_and_test(scratch, build, log)
        finally:
            path.write_text(original)
        caught = status == "fail"
        results.append((m, status, caught, failed))
        print(f"  {m.name:28s} {'caught' if caught else status.upper():12s} [{time.time() - t:.0f} s]"
              + (f" by: {'; '.join(failed)}" if failed else ""), flush=True)

    print("\nmutation drill: validation target", TARGET)
    print(f"{'mutation':28s} | {'result':6s} | failing test cases")
    print("-" * 28 + "-+-" + "-" * 6 + "-+-" + "-" * 40)
    for m, status, caught, failed in results:
        res = "caught" if caught else ("MISSED" if status == "pass" else status.upper())
        print(f"{m.name:28s} | {res:6s} | {'; '.join(failed)}")
    n = sum(c for _, _, c, _ in results)
    print(f"\n{n} of {len(results)} planted bugs caught")
    if not args.keep and args.scratch is None:
        shutil.rmtree(scratch, ignore_errors=True)
    return 0 if n == len(results) else 1


if __name__ == "__main__":
    raise SystemExit(main())

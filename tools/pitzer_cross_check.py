"""Write tests/reference/pitzer_cross_check_25c.csv: mean activity and osmotic
coefficients at 25 °C of single salts computed by an independent implementation of the
Pitzer equations (the ``pytzer`` package, Humphreys et al.) with the same parameters as
colligate's ``harvie_1984`` set (Harvie, Møller & Weare 1984, Table 1; pytzer's
``bC_<cation>_<anion>_HMW84`` functions).

Why: the 2:2 sulfates miss the handbook mean activity coefficients (CRC, built on
Robinson & Stokes / Goldberg) by 10-20 % even with parameters fitted to those salts. If
colligate's equations for 2:2 electrolytes (alpha1 = 1.4, alpha2 = 12, the beta2 term)
were wrong, an independent implementation with identical parameters would disagree with
colligate; it agrees (tests/python/test_pitzer_cross_check.py), so the difference lies
in the tables' and the parameters' treatment of the dilute region, not in the kernel.

pytzer is not a colligate dependency; run this by hand in an environment that has it:

    python -m venv /tmp/pz && /tmp/pz/bin/pip install pytzer==0.6.0
    /tmp/pz/bin/python tools/pitzer_cross_check.py
"""

from __future__ import annotations

import csv
import pathlib

import jax

jax.config.update("jax_enable_x64", True)  # pytzer computes in float32 otherwise

import numpy as np  # noqa: E402
import pytzer  # noqa: E402
import pytzer.parameters as prm  # noqa: E402

OUT = pathlib.Path(__file__).resolve().parent.parent / "tests" / "reference" / "pitzer_cross_check_25c.csv"

# salt, cation, anion, nu+, nu-, molalities (mol/kg) inside the harvie_1984 set's validated range
SALTS = [
    ("NaCl", "Na", "Cl", 1, 1, [0.1, 0.5, 1.0, 2.0, 4.0, 6.0]),
    ("KCl", "K", "Cl", 1, 1, [0.1, 0.5, 1.0, 2.0, 4.0]),
    ("CaCl2", "Ca", "Cl", 1, 2, [0.1, 0.5, 1.0, 2.0, 4.0, 6.0]),
    ("MgCl2", "Mg", "Cl", 1, 2, [0.1, 0.5, 1.0, 2.0, 4.0, 5.0]),
    ("Na2SO4", "Na", "SO4", 2, 1, [0.1, 0.5, 1.0, 1.5]),
    ("K2SO4", "K", "SO4", 2, 1, [0.1, 0.3, 0.6]),
    ("MgSO4", "Mg", "SO4", 1, 1, [0.01, 0.05, 0.1, 0.2, 0.5, 1.0, 2.0, 3.0]),
]
# colligate's harvie_1984 set keeps the Pitzer & Mayorga (1973) NaCl beta1 = 0.2664 where
# pytzer's HMW84 copy prints 0.2644 (see cpp/include/colligate/data/pitzer_parameters.hpp);
# the cross-check uses the same numbers on both sides.
NACL_BETA1_PITZER_MAYORGA_1973 = 0.2664


def bC_Na_Cl_PM73(T, P):  # noqa: N802 (pytzer's naming)
    b0, _, b2, C0, C1, a1, a2, omega, valid = prm.bC_Na_Cl_HMW84(T, P)
    return b0, NACL_BETA1_PITZER_MAYORGA_1973, b2, C0, C1, a1, a2, omega, valid
T = 298.15
P_DBAR = 10.1325  # one standard atmosphere, in pytzer's pressure unit (dbar)


def main() -> None:
    pz = pytzer.set_library(pytzer, "HWT22")
    lib = pz.library
    for _, c, a, *_ in SALTS:
        lib.update_ca(c, a, getattr(prm, f"bC_{c}_{a}_HMW84"))
    lib.update_ca("Na", "Cl", bC_Na_Cl_PM73)
    ions = list(lib.cations) + list(lib.anions) + list(lib.neutrals)
    rows = []
    for salt, c, a, nc, na, molalities in SALTS:
        for m in molalities:
            sol = {i: 0.0 for i in ions}
            sol[c], sol[a] = nc * m, na * m
            lg = pz.log_activity_coefficients(sol, T, P_DBAR)
            ln_gamma = (nc * float(lg[c]) + na * float(lg[a])) / (nc + na)
            phi = float(pz.osmotic_coefficient(sol, T, P_DBAR))
            rows.append({"salt": salt, "molality_mol_per_kg": m, "temperature_K": T,
                         "mean_activity_coefficient": f"{np.exp(ln_gamma):.10g}",
                         "osmotic_coefficient": f"{phi:.10g}",
                         "used_in_fit": "no",
                         "source": f"pytzer {pytzer.__version__} (float64) with bC_{c}_{a}_HMW84 "
                                   "(Harvie, Moller & Weare 1984, Table 1)"
                                   + (" but beta1 = 0.2664 (Pitzer & Mayorga 1973)" if salt == "NaCl" else "")
                                   + "; A_phi of Moller (1988)"})
    with OUT.open("w", newline="", encoding="utf-8") as fh:
        w = csv.DictWriter(fh, fieldnames=list(rows[0]))
        w.writeheader()
        w.writerows(rows)
    print(f"wrote {len(rows)} rows to {OUT}")


if __name__ == "__main__":
    main()

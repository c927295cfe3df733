#!/usr/bin/env python3
"""Validation gallery: colligate against every published table in tests/reference.

For each check of tests/reference/tolerances.toml (the tolerances shared with the tests)
this computes the model value of every selected row, draws the model against the
published values with the residuals inside the tolerance band and the source named under
the plot, and writes one PNG per check plus `gallery.md` (a page for the documentation
site). Tables that are shown but not checked (the `[[shown]]` entries) are drawn or listed
with the reason.

Exit status 1 when any point leaves its tolerance, or when a reference table is neither
checked nor listed as shown, so the gallery cannot drift from the tests.

    python tools/validation_gallery.py --out build/gallery
    python tools/validation_gallery.py --no-plots            # checks only
    python tools/validation_gallery.py --reference-dir DIR   # another copy of the tables
"""
from __future__ import annotations

import argparse
import pathlib
import sys
import tomllib
import warnings
from dataclasses import dataclass, field
from typing import Callable

import numpy as np
import pandas as pd

ROOT = pathlib.Path(__file__).resolve().parents[1]
REFERENCE = ROOT / "tests" / "reference"
# Celsius offset of the SI definition (not the model's ice point, so that a wrong ice
# point shows up as a wrong temperature).
CELSIUS = 273.15
STANDARD_SEAWATER_SA = 35.16504  # g/kg, Millero et al. (2008)


def _cg():
    import colligate

    return colligate


def _depression(row) -> float:
    cg = _cg()
    s = cg.Solution.from_mass_fractions({row.solute: row.mass_percent / 100.0})
    return CELSIUS - cg.freezing_point(s)


def _freezing_point_c(row) -> float:
    cg = _cg()
    s = cg.Solution.from_mass_fractions({row.solute: row.mass_percent / 100.0})
    return cg.freezing_point(s) - CELSIUS


def _osmotic(solute: str, model: str) -> Callable:
    def f(row) -> float:
        cg = _cg()
        s = cg.Solution.from_molalities({solute: row.molality_mol_per_kg})
        return cg.osmotic_coefficient(s, T=row.temperature_K, model=model)

    return f


def _seawater_freezing_point_c(row) -> float:
    cg = _cg()
    return cg.freezing_point(cg.Solution.seawater(row.absolute_salinity_g_per_kg)) - CELSIUS


def _seawater_ice_fraction(row) -> float:
    cg = _cg()
    return cg.ice_fraction(cg.Solution.seawater(STANDARD_SEAWATER_SA), row.temperature_C + CELSIUS)


def _seawater_heat(part: str) -> Callable:
    def f(row) -> float:
        cg = _cg()
        SA = STANDARD_SEAWATER_SA
        comp = {"water": 1.0 - SA / 1000.0, "ash": SA / 1000.0}
        q = cg.heat_load(comp, cg.Solution.seawater(SA), row.from_temperature_C + CELSIUS,
                         row.to_temperature_C + CELSIUS)
        return q[part]

    return f


def _food_composition(row) -> dict[str, float]:
    fibre = row.fibre_percent / 100.0
    return {"water": row.water_percent / 100.0, "protein": row.protein_percent / 100.0,
            "fat": row.fat_percent / 100.0, "fibre": fibre,
            "carbohydrate": row.carbohydrate_total_percent / 100.0 - fibre,
            "ash": row.ash_percent / 100.0}


def _food_cp_above(row) -> float:
    # At 0 C a food whose table freezing point is below 0 C holds no ice, so the apparent
    # specific heat is the Choi & Okos sum whatever the solutes; a glucose solution with the
    # dilute-limit depression of the table's freezing point stands for the aqueous phase.
    cg = _cg()
    comp = _food_composition(row)
    m = -row.initial_freezing_point_C / cg._core.CRYOSCOPIC_CONSTANT
    s = cg.Solution.from_molalities({"glucose": m})
    return cg.apparent_specific_heat(comp, s, CELSIUS) / 1e3


def _food_cp_below_chen(row) -> float:
    cg = _cg()
    xw = row.water_percent / 100.0
    return cg.frozen_specific_heat_chen(xw, 1.0 - xw, row.initial_freezing_point_C + CELSIUS,
                                        CELSIUS - 40.0) / 1e3


# --- 25 C mean activity coefficients (CRC Handbook table) -----------------------------------

def _gamma_harvie(row) -> float:
    cg = _cg()
    s = cg.Solution.from_molalities({row.salt: row.molality_mol_per_kg})
    return cg.mean_activity_coefficient(s, row.salt, row.temperature_K, parameter_set="harvie_1984")


def _gamma_default(row) -> float:
    cg = _cg()
    s = cg.Solution.from_molalities({row.salt: row.molality_mol_per_kg})
    return cg.mean_activity_coefficient(s, row.salt, row.temperature_K)


def _gamma_single_salt(row) -> float:
    cg = _cg()
    table = cg.single_salt_activity(row.salt, row.molality_mol_per_kg, row.temperature_K)
    return float(table.mean_activity_coefficient.iloc[0])


def _depression_single_salt(row) -> float:
    cg = _cg()
    return float(cg.single_salt_freezing_point(row.solute, row.molality_mol_per_kg).depression_K.iloc[0])


def _freezing_point_c_single_salt(row) -> float:
    """Freezing point, C, of a single salt given by mass % (cg.single_salt_molality)."""
    cg = _cg()
    out = cg.single_salt_freezing_point(row.solute, cg.single_salt_molality(row.solute, row.mass_percent / 100.0))
    return float(out.freezing_point_K.iloc[0]) - CELSIUS


def _osmotic_set(parameter_set) -> Callable:
    """Osmotic coefficient of a binary salt solution at the row's temperature, Pitzer with a
    named set (None: the default set)."""
    def f(row) -> float:
        cg = _cg()
        s = cg.Solution.from_molalities({row.salt: row.molality_mol_per_kg})
        return cg.osmotic_coefficient(s, T=row.temperature_K, model="pitzer", parameter_set=parameter_set)

    return f


def _gamma_ratio_harvie(row, rows: pd.DataFrame) -> float:
    # gamma(m) / gamma(0.1 mol/kg) of the model, scaled by the table's gamma(0.1 mol/kg): the
    # residual against the table's gamma(m) is then the residual of the ratio times the
    # table's gamma(0.1), so a relative tolerance on it is one on the ratio.
    cg = _cg()
    first = rows[(rows.salt == row.salt) & (rows.molality_mol_per_kg == 0.1)]
    if len(first) != 1:
        raise SystemExit(f"{row.salt}: the ratio check needs the 0.1 mol/kg row of the table")
    g01 = _gamma_harvie(first.iloc[0])
    return _gamma_harvie(row) / g01 * float(first.iloc[0].mean_activity_coefficient)


def _gamma_ratio_default(row, rows: pd.DataFrame) -> float:
    # as _gamma_ratio_harvie, through the default parameter set
    first = rows[(rows.salt == row.salt) & (rows.molality_mol_per_kg == 0.1)]
    if len(first) != 1:
        raise SystemExit(f"{row.salt}: the ratio check needs the 0.1 mol/kg row of the table")
    g01 = _gamma_default(first.iloc[0])
    return _gamma_default(row) / g01 * float(first.iloc[0].mean_activity_coefficient)


# --- seawater: where each salt starts to crystallise --------------------------------------

_SEAWATER_CURVES: dict = {}


def _seawater_salt_onset_c(row) -> float:
    cg = _cg()
    path = "fractional" if row.pathway.startswith("fractional") else "equilibrium"
    if path not in _SEAWATER_CURVES:
        _SEAWATER_CURVES[path] = cg.IceCurve(cg.Solution.seawater(STANDARD_SEAWATER_SA), path=path)
    for salt in _SEAWATER_CURVES[path].salts:
        if salt["name"] == row.phase:
            return salt["onset_temperature_K"] - CELSIUS
    return float("nan")  # the phase does not form: fails its check


# --- saturated salt solutions, sugar solubility, propylene glycol by volume ------------------

# Molality well above saturation at 25 C (NaCl saturates near 6.1, KCl near 4.8 mol/kg): the
# equilibrium state is the saturated liquid whatever the excess (the same choice as
# tests/cpp/equilibria/test_salt_equilibrium.cpp).
ABOVE_SATURATION = {"NaCl": 8.0, "KCl": 6.5, "MgCl2": 7.0}


def _saturated_water_activity(row) -> float:
    cg = _cg()
    s = cg.Solution.from_molalities({row.salt: ABOVE_SATURATION[row.salt]})
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", cg.SupersaturatedWarning)
        state = cg.salt_equilibrium(s, row.temperature_K)
    if state["phase"] != row.phase:
        raise SystemExit(f"{row.salt}: the model crystallises {state['phase']}, the table {row.phase}")
    return state["water_activity"]


def _salt_solubility(salt: str) -> Callable:
    """Saturation molality of one salt: the liquid left when a solution well above
    saturation (ABOVE_SATURATION) reaches equilibrium with the salt at the row's temperature
    (default parameter set)."""
    def f(row) -> float:
        cg = _cg()
        m = ABOVE_SATURATION[salt]
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", cg.SupersaturatedWarning)
            state = cg.salt_equilibrium(cg.Solution.from_molalities({salt: m}), row.temperature_C + CELSIUS)
        return (m - state["precipitated_mol"]) / state["liquid_water_kg"]
    return f


def _sugar_solubility_g_per_100g(row) -> float:
    cg = _cg()
    w = float(cg.solubility(row.solute, row.temperature_c + CELSIUS))
    return 100.0 * w / (1.0 - w)


# Specific gravity of propylene glycol at 60/60 F (from memory; +-0.002 moves the mass
# fraction by 0.2 %), as in tests/cpp/validation/test_published_checks.cpp.
PROPYLENE_GLYCOL_SG = 1.038


def _glycol_freezing_point_f_from_volume(row) -> float:
    # "% by volume" taken as glycol volume per solution volume: w = phi SG_glycol / SG_solution.
    cg = _cg()
    w = row.volume_percent / 100.0 * PROPYLENE_GLYCOL_SG / row.specific_gravity_60F
    t = cg.freezing_point(cg.Solution.from_mass_fractions({row.solute: w}))
    return 32.0 + 1.8 * (t - CELSIUS)


# --- an ice-cream mix: the ice curve against the dairy method and Goff & Hartel's table ------

def goff_hartel_mix():
    """Goff & Hartel (2013) Example Problem 13 mix as a recipe: 10 % MSNF, 2 % whey solids,
    12 % sucrose, 4 % 42DE corn syrup solids, 60 % water, 12 % fat (the same mix as
    tests/python/test_ingredients.py). Whey solids: lactose 76.5 % (Goff & Hartel 2013), milk
    salts 0.099 as in MSNF; corn syrup solids: DP1 19, DP2 14, DP3 12, DP4+ 55 % (the
    library's glucose_syrup_de42; from memory)."""
    cg = _cg()
    css = {"glucose": 0.19 * 0.04, "maltose": 0.14 * 0.04, "maltotriose": 0.12 * 0.04,
           "higher_saccharides": 0.55 * 0.04}
    mix = cg.Ingredient("Goff & Hartel example mix", water=0.60, fat=0.12, msnf=0.10,
                        sugars={"sucrose": 0.12, "lactose": 0.765 * 0.02, **css},
                        salts={"milk_salts": 0.099 * 0.02}, protein=0.02 * (1 - 0.765 - 0.099))
    return cg.Recipe(ingredients={mix: 1.0})


def _ice_cream_ice_percent(row) -> float:
    return 100.0 * goff_hartel_mix().ice_fraction(CELSIUS - row.depression_K)


def _dairy_method_ice_percent(row) -> float:
    return 100.0 * goff_hartel_mix().leighton_ice_fraction(CELSIUS - row.depression_K)


def _dairy_method_curve(x: np.ndarray) -> np.ndarray:
    """The dairy method's ice curve of the same mix, drawn beside the model (x: depression, K)."""
    r = goff_hartel_mix()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return np.array([100.0 * r.leighton_ice_fraction(CELSIUS - d) for d in x])


def _food_latent_heat(row) -> float:
    # x_w L(0 C), the quantity of ASHRAE's latent heat column (thermal::latent_heat_of_fusion)
    cg = _cg()
    return row.water_percent / 100.0 * cg._core.enthalpy_of_fusion(CELSIUS) / cg._core.MOLAR_MASS_WATER / 1e3


def _food_mean_cp_20_to_0(row) -> float:
    # Heat to cool from 20 C to 0 C over 20 K; above 0 C no ice forms, so the water phase only
    # has to be valid: its sugars as glucose (as tests/cpp/validation/test_published_checks.cpp).
    cg = _cg()
    comp = _food_composition(row)
    sugars = comp["carbohydrate"] / (comp["water"] + comp["carbohydrate"])
    s = cg.Solution.from_mass_fractions({"glucose": sugars})
    return cg.heat_load(comp, s, CELSIUS + 20.0, CELSIUS)["total"] / 20.0 / 1e3


@dataclass(frozen=True)
class Quantity:
    compute: Callable
    x: str            # column on the horizontal axis
    x_label: str
    group: str = ""   # column that splits the rows into curves ("" for one curve)
    curve: bool = True  # False: separate items (foods), the model drawn as markers
    with_rows: bool = False  # compute(row, selected_rows): a value relative to other rows
    # extra curves drawn over the x range of the table: label -> function of an x array
    overlays: tuple = ()
    log_y: bool = False
    relative: bool = False  # residuals and tolerance drawn relative to the published value


QUANTITIES: dict[str, Quantity] = {
    "depression_from_mass_percent": Quantity(_depression, "mass_percent", "mass %", "solute"),
    "freezing_point_C_from_mass_percent": Quantity(_freezing_point_c, "mass_percent", "mass %", "solute"),
    "nacl_osmotic_coefficient": Quantity(_osmotic("NaCl", "pitzer"), "molality_mol_per_kg", "molality, mol/kg"),
    "sucrose_osmotic_coefficient": Quantity(_osmotic("sucrose", "norrish"), "molality_mol_per_kg",
                                            "molality, mol/kg"),
    "seawater_freezing_point_C": Quantity(_seawater_freezing_point_c, "absolute_salinity_g_per_kg",
                                          "absolute salinity, g/kg"),
    "seawater_ice_fraction": Quantity(_seawater_ice_fraction, "temperature_C", "temperature, C"),
    "seawater_heat_total": Quantity(_seawater_heat("total"), "to_temperature_C", "cooled to, C",
                                    "from_temperature_C"),
    "seawater_heat_latent": Quantity(_seawater_heat("latent"), "to_temperature_C", "cooled to, C",
                                     "from_temperature_C"),
    "food_specific_heat_above_freezing": Quantity(_food_cp_above, "water_percent", "water, mass %",
                                                  curve=False),
    "food_specific_heat_below_freezing_chen": Quantity(_food_cp_below_chen, "water_percent", "water, mass %",
                                                       curve=False),
    "food_latent_heat": Quantity(_food_latent_heat, "water_percent", "water, mass %", curve=False),
    "food_mean_specific_heat_20_to_0": Quantity(_food_mean_cp_20_to_0, "water_percent", "water, mass %",
                                                curve=False),
    "seawater_salt_onset_C": Quantity(_seawater_salt_onset_c, "onset_temperature_C",
                                      "published onset, C", "phase", curve=False),
    "mean_activity_coefficient_harvie_1984": Quantity(_gamma_harvie, "molality_mol_per_kg", "molality, mol/kg",
                                                      "salt", log_y=True, relative=True),
    "mean_activity_coefficient_default_set": Quantity(_gamma_default, "molality_mol_per_kg",
                                                      "molality, mol/kg", "salt", log_y=True,
                                                      relative=True),
    "mean_activity_coefficient_single_salt": Quantity(_gamma_single_salt, "molality_mol_per_kg",
                                                      "molality, mol/kg", "salt", log_y=True,
                                                      relative=True),
    "depression_single_salt_ice_line": Quantity(_depression_single_salt, "molality_mol_per_kg",
                                                "molality, mol/kg", "solute"),
    "freezing_point_C_single_salt_ice_line": Quantity(_freezing_point_c_single_salt, "mass_percent",
                                                      "mass %", "solute"),
    "osmotic_coefficient_harvie_1984": Quantity(_osmotic_set("harvie_1984"), "molality_mol_per_kg",
                                                "molality, mol/kg", "salt", relative=True),
    "osmotic_coefficient_default_set": Quantity(_osmotic_set(None), "molality_mol_per_kg",
                                                "molality, mol/kg", "salt", relative=True),
    "mean_activity_coefficient_ratio_harvie_1984": Quantity(_gamma_ratio_harvie, "molality_mol_per_kg",
                                                            "molality, mol/kg", "salt", with_rows=True,
                                                            relative=True),
    "mean_activity_coefficient_ratio_default_set": Quantity(_gamma_ratio_default, "molality_mol_per_kg",
                                                            "molality, mol/kg", "salt", with_rows=True,
                                                            relative=True),
    "saturated_salt_water_activity": Quantity(_saturated_water_activity, "water_activity",
                                              "published a_w of the saturated solution", "salt", curve=False),
    "nacl_solubility_mol_per_kg": Quantity(_salt_solubility("NaCl"), "temperature_C", "temperature, C"),
    "mgcl2_solubility_mol_per_kg": Quantity(_salt_solubility("MgCl2"), "temperature_C", "temperature, C"),
    "sugar_solubility_g_per_100g_water": Quantity(_sugar_solubility_g_per_100g, "temperature_c",
                                                  "temperature, C", "solute"),
    "propylene_glycol_freezing_point_F_from_volume_percent": Quantity(
        _glycol_freezing_point_f_from_volume, "volume_percent", "propylene glycol, volume %"),
    "ice_cream_ice_percent_of_water": Quantity(
        _ice_cream_ice_percent, "depression_K", "freezing-point depression, K (Table 6.2)",
        overlays=(("dairy method (Leighton 1927, Goff & Hartel Table 6.1)", _dairy_method_curve),)),
    "dairy_method_ice_percent_of_water": Quantity(
        _dairy_method_ice_percent, "depression_K", "freezing-point depression, K (Table 6.2)"),
}


@dataclass
class CheckResult:
    id: str
    title: str
    file: str
    unit: str
    basis: str
    table: pd.DataFrame          # selected rows plus model, residual, tolerance, passed
    quantity: Quantity
    published: str
    checked: bool = True
    failures: list[str] = field(default_factory=list)

    @property
    def beyond(self) -> int:
        """Points computed outside a validated range (the model warned)."""
        return int(self.table["beyond_validated_range"].sum())


def load_config(reference_dir: pathlib.Path) -> dict:
    with open(reference_dir / "tolerances.toml", "rb") as fh:
        config = tomllib.load(fh)
    if config.get("format") != 1:
        raise SystemExit(f"tolerances.toml: format {config.get('format')!r}, expected 1")
    return config


def _select(df: pd.DataFrame, rows: str) -> pd.DataFrame:
    return df.query(rows, engine="python") if rows else df


def evaluate(entry: dict, reference_dir: pathlib.Path, checked: bool = True) -> CheckResult:
    """Model values, residuals and (for a check) tolerances of one table entry."""
    quantity = QUANTITIES[entry["quantity"]]
    df = pd.read_csv(reference_dir / entry["file"], keep_default_na=False)
    rows = _select(df, entry.get("rows", "")).copy()
    if rows.empty:
        raise SystemExit(f"{entry.get('id', entry['file'])}: the row query selects no row")
    published = entry["published"]
    rows[published] = pd.to_numeric(rows[published])
    beyond = []
    with warnings.catch_warnings(record=True) as caught:
        warnings.simplefilter("always")
        values = []
        for r in rows.itertuples(index=False):
            before = len(caught)
            values.append(quantity.compute(r, rows) if quantity.with_rows else quantity.compute(r))
            beyond.append(len(caught) > before)
    rows["model"] = values
    rows["beyond_validated_range"] = beyond
    rows["residual"] = rows["model"] - rows[published]
    result = CheckResult(id=entry.get("id", pathlib.Path(entry["file"]).stem),
                         title=entry.get("title", entry["file"]), file=entry["file"],
                         unit=entry.get("unit", ""), basis=entry.get("basis", entry.get("reason", "")),
                         table=rows, quantity=quantity, published=published, checked=checked)
    if checked:
        tol = np.broadcast_to(np.asarray(rows.eval(entry["tolerance"], engine="python"), dtype=float),
                              len(rows)).copy()
        plus = entry.get("tolerance_plus")
        if plus:
            looked_up = rows[plus["column"]].map(plus["values"])
            if looked_up.isna().any():
                raise SystemExit(f"{entry['id']}: tolerance_plus has no value for "
                                 f"{sorted(set(rows[plus['column']][looked_up.isna()]))}")
            tol += looked_up.to_numpy(dtype=float)
        rows["tolerance"] = tol
        rows["passed"] = rows["residual"].abs() <= rows["tolerance"]
        rows["counted"] = True
        if not entry.get("check_beyond_range", True):
            # points the model flags as outside its validated range are drawn, not checked
            rows["counted"] = ~rows["beyond_validated_range"]
            rows["passed"] |= rows["beyond_validated_range"]
        for r in rows[~rows["passed"]].itertuples(index=False):
            label = ", ".join(f"{c}={getattr(r, c)}" for c in (quantity.group, quantity.x) if c)
            result.failures.append(
                f"{result.id}: {entry['file']} row {label} [{r.source_key}]: model {r.model:.6g}, "
                f"published {getattr(r, published):.6g}, |residual| {abs(r.residual):.3g} > "
                f"tolerance {r.tolerance:.3g} {result.unit}")
    return result


def _source_line(keys) -> str:
    cg = _cg()
    out = []
    for key in sorted(set(keys)):
        c = cg.citation(key)
        out.append(f"{c.get('authors', '')} ({c.get('year', '')}), {c.get('title', key)}".strip())
    return "Source: " + "; ".join(out)


def plot(result: CheckResult, path: pathlib.Path) -> None:
    import matplotlib

    matplotlib.use("Agg")
    import matplotlib.pyplot as plt

    t, q = result.table.copy(), result.quantity
    if q.relative:  # residual and tolerance as fractions of the published value
        scale = t[result.published].abs()
        t["residual"] = t["residual"] / scale
        if result.checked:
            t["tolerance"] = t["tolerance"] / scale
    fig, (top, bottom) = plt.subplots(2, 1, figsize=(7.0, 6.2), sharex=True,
                                      gridspec_kw={"height_ratios": [2, 1]})
    groups = t.groupby(q.group, sort=False) if q.group else [("", t)]
    for name, g in groups:
        g = g.sort_values(q.x)
        line, = top.plot(g[q.x], g["model"], "-" if q.curve else "x", lw=1.4,
                         label=f"colligate {name}".strip())
        top.plot(g[q.x], g[result.published], "o", ms=4, mfc="none", color=line.get_color(),
                 label=f"published {name}".strip())
        bottom.plot(g[q.x], g["residual"], "o", ms=4, color=line.get_color())
        if result.checked and q.curve:
            band = g[g["counted"]]
            bottom.fill_between(band[q.x], -band["tolerance"], band["tolerance"], color=line.get_color(),
                                alpha=0.15, lw=0)
        elif result.checked:  # separate items: the tolerance of each as a bar about zero
            bottom.errorbar(g[q.x], np.zeros(len(g)), yerr=g["tolerance"], fmt="none",
                            ecolor=line.get_color(), alpha=0.25, lw=6)
    if result.checked and not t["counted"].all():
        # points beyond the validated range are drawn, not checked: scale to the checked ones
        c = t[t["counted"]]
        span = 1.3 * max(float(c["residual"].abs().max()), float(c["tolerance"].max()))
        bottom.set_ylim(-span, span)
    if len(q.overlays):
        lo, hi = float(t[q.x].min()), float(t[q.x].max())
        grid = np.linspace(lo, hi, 60)
        for (label, f), style in zip(q.overlays, ("--", ":")):
            top.plot(grid, f(grid), style, lw=1.2, color="black" if style == "--" else "grey", label=label)
    if result.beyond:
        out = t[t["beyond_validated_range"]]
        bottom.plot(out[q.x], out["residual"], "s", mfc="none", color="grey", ms=7,
                    label="beyond the validated range")
    if q.log_y:
        top.set_yscale("log")
    if result.checked and not t["passed"].all():
        bad = t[~t["passed"]]
        bottom.plot(bad[q.x], bad["residual"], "x", color="black", ms=8, label="outside tolerance")
    bottom.axhline(0.0, color="grey", lw=0.8)
    if result.beyond or (result.checked and not t["passed"].all()):
        bottom.legend(fontsize=7)
    top.set_ylabel(f"{result.published} [{result.unit}]" if result.unit else result.published)
    bottom.set_ylabel("(model - published) / published" if q.relative else "model - published")
    bottom.set_xlabel(q.x_label)
    top.set_title(result.title, fontsize=10)
    top.legend(fontsize=7, ncol=2)
    band = "shaded: tolerance" if result.checked else "not a check: no tolerance"
    if result.beyond:
        band += f"; {result.beyond} points beyond a validated range"
        if result.checked and not t["counted"].all():
            band += " (not checked; off the residual scale when far out)"
    caption = f"{_source_line(t['source_key'])}\n{band}. {result.basis}"
    fig.text(0.01, 0.01, caption, fontsize=6.5, wrap=True, va="bottom")
    # room under the axes for the wrapped caption (about 150 characters a line at this size)
    lines = sum(-(-len(part) // 150) for part in caption.split("\n"))
    fig.tight_layout(rect=(0, min(0.3, 0.03 + 0.022 * lines), 1, 1))
    fig.savefig(path, dpi=110)
    plt.close(fig)


def run(reference_dir: pathlib.Path, out: pathlib.Path | None) -> tuple[list[CheckResult], list[str]]:
    """Every check and shown table; returns the results and the problems found."""
    config = load_config(reference_dir)
    results, problems = [], []
    for entry in config.get("check", []):
        r = evaluate(entry, reference_dir)
        results.append(r)
        problems.extend(r.failures)
    for entry in config.get("shown", []):
        if "quantity" in entry:
            results.append(evaluate(entry, reference_dir, checked=False))
    covered = {e["file"] for e in config.get("check", []) + config.get("shown", [])}
    for path in sorted(reference_dir.glob("*.csv")):
        if path.name not in covered:
            problems.append(f"{path.name}: neither checked nor listed as shown in tolerances.toml")
    if out is not None:
        out.mkdir(parents=True, exist_ok=True)
        for r in results:
            plot(r, out / f"{r.id}.png")
        write_page(config, results, out / "gallery.md")
    return results, problems


def write_page(config: dict, results: list[CheckResult], path: pathlib.Path) -> None:
    lines = ["# Validation gallery", "",
             "Generated by `tools/validation_gallery.py` from the published tables in "
             "`tests/reference/` and the tolerances in `tests/reference/tolerances.toml`, the "
             "same file the tests read. The build fails when a point leaves its tolerance.", "",
             "Predictions are estimates: verify by measurement, and defer to local codes and "
             "licensed practice where a result decides food safety.", ""]
    for r in results:
        t = r.table
        c = t[t["counted"]] if r.checked else t
        status = (f"{int(c['passed'].sum())} of {len(c)} points within tolerance; worst "
                  f"|residual| {c['residual'].abs().max():.3g} {r.unit}" if r.checked
                  else f"{len(t)} points shown, not checked")
        if r.checked and len(c) < len(t):
            status += f"; {len(t) - len(c)} beyond the model's validated range drawn, not checked"
        if r.beyond:
            status += f" ({r.beyond} computed outside a validated range, with a warning)"
        lines += [f"## {r.title}", "", f"![{r.title}]({r.id}.png)", "",
                  f"`{r.file}`: {status}. {'Tolerance basis' if r.checked else 'Why not checked'}: {r.basis}", ""]
    listed = [e for e in config.get("shown", []) if "quantity" not in e]
    if listed:
        lines += ["## Tables not drawn", ""]
        lines += [f"- `{e['file']}`: {e['reason']}" for e in listed]
        lines.append("")
    path.write_text("\n".join(lines), encoding="utf-8")


def main(argv=None) -> int:
    p = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    p.add_argument("--out", type=pathlib.Path, default=ROOT / "build" / "gallery",
                   help="folder for the PNGs and gallery.md (default build/gallery)")
    p.add_argument("--no-plots", action="store_true", help="run the checks only")
    p.add_argument("--reference-dir", type=pathlib.Path, default=REFERENCE,
                   help="the reference tables and tolerances.toml (default tests/reference)")
    args = p.parse_args(argv)
    results, problems = run(args.reference_dir, None if args.no_plots else args.out)
    for r in results:
        t = r.table
        if r.checked:
            c = t[t["counted"]]
            print(f"{r.id}: {int(c['passed'].sum())}/{len(c)} within tolerance, worst "
                  f"{c['residual'].abs().max():.3g} {r.unit}"
                  + (f" ({len(t) - len(c)} beyond the validated range, not checked)" if len(c) < len(t) else ""))
        else:
            print(f"{r.id}: {len(t)} points shown (not a check)")
    for line in problems:
        print("FAIL " + line, file=sys.stderr)
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())

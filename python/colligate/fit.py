"""Fit model constants to your own data, with confidence intervals, and use the result.

All inputs SI: molality in mol/kg, temperatures in K, fractions in kg/kg. The fits run in
the C++ core (Levenberg-Marquardt on Eigen, Student-t intervals from Boost.Math).

    >>> res = fit_norrish(m, water_activity=aw, T=298.15)          # doctest: +SKIP
    >>> res.summary()                                               # doctest: +SKIP
    >>> lib = SoluteLibrary([res.as_solute("my syrup", molar_mass=0.342)])  # doctest: +SKIP
    >>> s = Solution.from_mass_fractions({"my syrup": 0.3}, table=lib)     # doctest: +SKIP

Fitted solutes never enter a global registry: a :class:`SoluteLibrary` (the built-in
solutes plus yours) is passed explicitly with ``table=`` to the Solution factories, and
the resulting Solution carries its constants into every calculation.

Models
------
``fit_norrish``: ln a_w = ln x_w - K x_s^2 (- K3 x_s^3), our sign convention (K > 0 for
sugars), from water activities at one temperature or from initial freezing points.

``fit_effective_solute``: an unknown food's dissolved solids as one ideal solute of
apparent molar mass M (kg/mol) plus unfreezable water b (kg per kg of food solids), from
initial freezing points at several water contents or from an ice-fraction curve.

``fit_pitzer``: Pitzer beta0, beta1 (kg/mol), C-phi (kg^2/mol^2) of one salt (beta2 of a
2:2 salt on request; optionally d/dT of each at 298.15 K), from osmotic coefficients, water
activities or initial freezing points of its binary solutions. ``as_solute`` gives a salt
record carrying the fitted parameters as its own Pitzer row: in a :class:`SoluteLibrary`
it sits beside the built-in salt, and solutions made from it use the fitted parameters.
"""
from __future__ import annotations

import datetime as _dt
import hashlib
import math
import os
from typing import Any, Iterable, Optional, Sequence

import numpy as np

from . import _core
from ._files import InputFileError, OutputSet, atomic_write, atomic_write_text, read_input_bytes
from .uncertainty import PoorlyDeterminedFitWarning

__all__ = [
    "FitResult",
    "FittedSolute",
    "SoluteLibrary",
    "curve_fit",
    "fit_norrish",
    "fit_effective_solute",
    "fit_pitzer",
    "fit_single_salt",
    "load_solute",
    "solute_from_entry",
]

_UNITS = {
    "norrish_k": "1",
    "norrish_k3": "1",
    "molar_mass": "kg/mol",
    "bound_water_per_solids": "kg/kg solids",
    "beta0": "kg/mol",
    "beta1": "kg/mol",
    "beta2": "kg/mol",
    "cphi": "kg^2/mol^2",
    "dbeta0_dT": "kg/(mol K)",
    "dbeta1_dT": "kg/(mol K)",
    "dbeta2_dT": "kg/(mol K)",
    "dcphi_dT": "kg^2/(mol^2 K)",
}
FORMAT_NAME = "colligate-fitted-solute"
FORMAT_VERSION = 3  # 2 adds [solute.pitzer] (fitted salts), 3 [solute.uncertainty] (a fit's covariance);
# a file is written with the lowest version that holds it
_PITZER_KEYS = ("beta0", "beta1", "beta2", "cphi", "dbeta0_dT", "dbeta1_dT", "dbeta2_dT", "dcphi_dT")
# Widening of a fitted salt's temperature range beyond its data, K: the same 5 K as
# colligate::fit::pitzer_fit_temperature_margin (the 25 C harvie_1984 set is used at 298.15 +/- 5 K).
_PITZER_T_MARGIN = 5.0
#: |correlation| above which two fitted constants are reported as strongly correlated: the
#: data then fix one combination of them, not each (a common rule of thumb, no source).
CORRELATION_LIMIT = 0.99
#: Confidence level of the intervals checked for spanning zero or a bound of the fit.
_CHECK_LEVEL = 0.95


def _column(value: Any, data: Any, name: str) -> Optional[np.ndarray]:
    """An array from an array-like, a pandas Series, or a column name of ``data``."""
    if value is None:
        return None
    if isinstance(value, str):
        if data is None:
            raise _core.InvalidInputError(
                f"{name} = '{value}' is a column name, but no data= table was given")
        if value not in data:
            raise _core.InvalidInputError(
                f"{name}: column '{value}' is not in the data; columns are {list(data.columns)}")
        value = data[value]
    arr = np.asarray(value, dtype=float)
    if arr.ndim == 0:
        arr = arr.reshape(1)
    if arr.ndim != 1:
        raise _core.InvalidInputError(f"{name} must be one-dimensional, got shape {arr.shape}")
    return np.ascontiguousarray(arr)


class FitResult:
    """Result of a fit: parameters, uncertainties, residuals, plots and a fitted solute.

    Attributes
    ----------
    params : dict
        Fitted parameters by name (units in :meth:`summary`).
    stderr : dict
        Standard errors by name (NaN when the parameters are not identifiable).
    covariance : pandas.DataFrame
        Parameter covariance, scaled by chi^2/dof.
    residuals : numpy.ndarray
        Data minus model, in the unit of the fitted quantity.
    status : str
        Fit status (non-convergence is a status, not an error).
    success : bool
        Whether the fit converged.
    message : str
        The status in words.
    """

    def __init__(self, core: Any, *, model: str, x: np.ndarray, y: np.ndarray,
                 x_label: str, y_label: str, source: Optional[dict] = None,
                 extra: Optional[dict] = None) -> None:
        self._core = core
        self.model = model
        self.x = x
        self.y = y
        self.x_label = x_label
        self.y_label = y_label
        self.source = dict(source or {})
        self.extra = dict(extra or {})
        names = list(core.parameter_names) or [f"p{j}" for j in range(len(core.params))]
        self.names = names
        self.params = {n: float(v) for n, v in zip(names, core.params)}
        self.stderr = {n: float(v) for n, v in zip(names, core.standard_errors)}
        self.residuals = np.asarray(core.residuals)
        self.fitted = np.asarray(core.fitted)
        self.status: str = core.status
        self.success: bool = core.success
        self.message: str = core.message
        self.chi_square: float = core.chi_square
        self.degrees_of_freedom: int = core.degrees_of_freedom
        self.r_squared: float = core.r_squared
        self.contradictory_duplicates = [list(g) for g in core.contradictory_duplicates]

    @property
    def covariance(self):
        import pandas as pd

        return pd.DataFrame(np.asarray(self._core.covariance), index=self.names, columns=self.names)

    @property
    def correlation(self):
        """Parameter correlation matrix r_ij = u_ij / (u_i u_j), a DataFrame (NaN when the
        covariance is not defined)."""
        import pandas as pd

        r = np.asarray(_core.correlation_matrix(np.asarray(self._core.covariance)))
        return pd.DataFrame(r, index=self.names, columns=self.names)

    def poorly_determined(self, level: float = _CHECK_LEVEL) -> list:
        """Reasons the data do not pin the constants down, one sentence each (empty if none):
        a pair correlated beyond :data:`CORRELATION_LIMIT`, a ``level`` interval that spans
        zero, a constant that ended on a bound of the fit (a physical limit)."""
        if not self.success:
            return []
        out = []
        corr = np.asarray(_core.correlation_matrix(np.asarray(self._core.covariance)))
        k = len(self.names)
        for i in range(k):
            for j in range(i + 1, k):
                if np.isfinite(corr[i, j]) and abs(corr[i, j]) > CORRELATION_LIMIT:
                    out.append(f"{self.names[i]} and {self.names[j]} are correlated at r = {corr[i, j]:+.4f} "
                               f"(|r| > {CORRELATION_LIMIT}): the data fix a combination of them, not each; "
                               "add data of another kind or range, or fix one of them")
        lim = np.asarray(self._core.confidence_intervals(float(level)))
        for j, n in enumerate(self.names):
            lo, hi = lim[j]
            if np.isfinite(lo) and np.isfinite(hi) and lo < 0.0 < hi:
                out.append(f"the {100 * level:g} % interval of {n} spans zero ({lo:.4g} to {hi:.4g}): "
                           "the data do not show that this constant is needed")
            if bool(self._core.at_bound[j]):
                out.append(f"{n} = {self.params[n]:.6g} ended on a bound of the fit: its interval is "
                           "one-sided and its standard error does not describe it")
        return out

    def _warn_if_poorly_determined(self) -> None:
        import warnings

        reasons = self.poorly_determined()
        if reasons:
            warnings.warn(f"fit ({self.model}): " + "; ".join(reasons), PoorlyDeterminedFitWarning, stacklevel=3)

    def ci(self, level: float = 0.95):
        """Confidence intervals at ``level`` (Student t, n - k degrees of freedom), a DataFrame
        with columns ``lower`` and ``upper`` indexed by parameter."""
        import pandas as pd

        lim = np.asarray(self._core.confidence_intervals(float(level)))
        return pd.DataFrame(lim, index=self.names, columns=["lower", "upper"])

    def raise_if_failed(self) -> "FitResult":
        """Raise :class:`colligate.ConvergenceError` unless the fit converged."""
        if not self.success:
            raise _core.ConvergenceError(
                f"fit ({self.model}): status = '{self.status}' after {int(self._core.iterations)} iteration(s): "
                f"{self.message}; a usable fit needs status 'converged'")
        return self

    def summary(self, level: float = 0.95):
        """One row per parameter: value, standard error, confidence limits, unit. The fit
        statistics are in ``.attrs`` (status, chi_square, dof, r_squared, n_points)."""
        import pandas as pd

        ci = self.ci(level)
        pct = f"{100 * level:g}"
        df = pd.DataFrame({
            "value": [self.params[n] for n in self.names],
            "stderr": [self.stderr[n] for n in self.names],
            f"ci{pct}_lower": ci["lower"].to_numpy(),
            f"ci{pct}_upper": ci["upper"].to_numpy(),
            "unit": [_UNITS.get(n, "") for n in self.names],
        }, index=pd.Index(self.names, name="parameter"))
        df.attrs.update({
            "model": self.model, "status": self.status, "message": self.message,
            "chi_square": self.chi_square, "degrees_of_freedom": self.degrees_of_freedom,
            "r_squared": self.r_squared, "n_points": int(self._core.n_points),
            "iterations": int(self._core.iterations),
            "contradictory_duplicates": self.contradictory_duplicates,
        })
        return df

    def __repr__(self) -> str:
        parts = ", ".join(f"{n}={self.params[n]:.6g}±{self.stderr[n]:.2g}" for n in self.names)
        return f"FitResult({self.model}: {parts}; status={self.status})"

    def plot(self, path: str | os.PathLike[str], *, inputs: Iterable[Any] = (),
             outputs: Optional[OutputSet] = None) -> str:
        """Data and fitted curve, with a residual panel, as PNG (written atomically; with
        ``outputs``, into that set of a command's files). Returns the path written."""
        from matplotlib.backends.backend_agg import FigureCanvasAgg
        from matplotlib.figure import Figure

        fig = Figure(figsize=(6.4, 6.0))
        FigureCanvasAgg(fig)
        ax, axr = fig.subplots(2, 1, sharex=True, gridspec_kw={"height_ratios": [3, 1]})
        order = np.argsort(self.x)
        ax.plot(self.x, self.y, "o", label="data")
        ax.plot(self.x[order], self.fitted[order], "-", label="fit")
        ax.set_ylabel(self.y_label)
        ax.legend(loc="best")
        title = ", ".join(f"{n} = {self.params[n]:.4g} ± {self.stderr[n]:.2g}" for n in self.names)
        ax.set_title(f"{self.model}: {title}", fontsize=9)
        axr.axhline(0.0, color="0.5", lw=0.8)
        axr.plot(self.x, self.residuals, "o")
        axr.set_xlabel(self.x_label)
        axr.set_ylabel("residual")
        fig.tight_layout()
        fig.align_ylabels([ax, axr])
        fig.subplots_adjust(left=0.17)

        def write(fh):
            fig.savefig(fh, format="png", dpi=110)

        return atomic_write(path, write, inputs=inputs, what="plot", into=outputs)

    def as_solute(self, name: str, *, molar_mass: Optional[float] = None,
                  id: Optional[str] = None) -> "FittedSolute":
        """The fitted solute, ready for a :class:`SoluteLibrary`.

        ``molar_mass`` (kg/mol) is required for a Norrish fit (the fit uses molalities
        only); an effective-solute fit carries its own. A Pitzer fit gives a copy of the salt
        (molar mass, ions) with the fitted parameters as its own Pitzer row, valid to the
        highest molality of the data and over the data's temperatures widened by 5 K."""
        if not self.success:
            raise _core.ConvergenceError(
                f"as_solute: the fit did not converge (status '{self.status}'); refusing to build a solute")
        if self.model.startswith("single-salt"):
            raise _core.InvalidInputError(
                "as_solute: a single-salt Pitzer fit makes no solute for mixtures (its ions are not "
                "in the Pitzer model's tables); use its params in the closed binary form, e.g. "
                "colligate._core.single_salt_closed_form_freezing_point")
        sid = id or "_".join(name.lower().replace("-", " ").split())
        note = f"fitted by colligate.fit ({self.model}) to {self._core.n_points} points"
        if self.source.get("data"):
            note += f" from {self.source['data']}"
        if self.model.startswith("pitzer"):
            if molar_mass is not None:
                raise _core.InvalidInputError(
                    "as_solute: molar_mass is taken from the salt for a Pitzer fit; leave it out")
            temps = np.asarray(self.extra["temperature"], dtype=float)
            rec = _core.pitzer_solute_record(
                self._core, self.extra["salt"], sid, name, float(np.max(self.extra["molality"])),
                float(np.min(temps)) - _PITZER_T_MARGIN, float(np.max(temps)) + _PITZER_T_MARGIN,
                note, self.extra.get("table"))
            return FittedSolute(rec, fit=self.summary(), source=self.source, salt=self.extra["salt"])
        if self.model.startswith("norrish"):
            if molar_mass is None:
                raise _core.InvalidInputError(
                    "as_solute: molar_mass (kg/mol) is required for a Norrish fit, e.g. 0.3423 for sucrose")
            m_max = float(np.max(self.extra["molality"]))
            max_w = m_max * molar_mass / (1.0 + m_max * molar_mass)
            rec = _core.norrish_solute_record(self._core, sid, name, float(molar_mass), max_w, note)
            bound = 0.0
        else:
            rec = _core.effective_solute_record(self._core, sid, name, note)
            bound = float(self.params.get("bound_water_per_solids", self.extra.get("bound_water_fixed", 0.0)))
        return FittedSolute(rec, bound_water_per_solids=bound, fit=self.summary(), source=self.source)


class FittedSolute:
    """A solute made from a fit: its record, the food's bound water, and provenance.

    Use it through a :class:`SoluteLibrary` or a :class:`colligate.Library`.
    ``bound_water_per_solids`` (kg per kg of the solute's mass) is a property of the food:
    pass ``bound_water_fraction_of_water=fs.bound_water_fraction_of_water(s)`` to
    :func:`colligate.freezing_point` and :func:`colligate.ice_fraction`.
    """

    def __init__(self, record: Any, *, bound_water_per_solids: float = 0.0, fit: Any = None,
                 source: Optional[dict] = None, salt: Optional[str] = None) -> None:
        self.record = record
        self.salt = salt  # id of the salt a Pitzer fit started from (None otherwise)
        self.bound_water_per_solids = float(bound_water_per_solids)
        self.fit = fit
        self.source = dict(source or {})

    @property
    def id(self) -> str:
        return self.record.id

    @property
    def name(self) -> str:
        return self.record.name

    def bound_water_fraction_of_water(self, solution: Any) -> float:
        """Unfreezable water of ``solution`` as a share of its water (kg per kg water): b
        times the mass of this solute in it over the water; pass it as
        ``bound_water_fraction_of_water=`` to :func:`colligate.freezing_point` and friends."""
        masses = solution.solutes
        return self.bound_water_per_solids * float(masses.get(self.id, 0.0)) / float(solution.water)

    def __repr__(self) -> str:
        r = self.record
        if r.pitzer is not None:
            p = r.pitzer
            return (f"FittedSolute(id='{r.id}', salt='{self.salt}', beta0={p['beta0']:.6g}, "
                    f"beta1={p['beta1']:.6g}, cphi={p['cphi']:.6g}, max_molality={p['max_molality']:.6g})")
        return (f"FittedSolute(id='{r.id}', molar_mass={r.molar_mass:.6g} kg/mol, "
                f"norrish_k={r.norrish_k:.6g}, norrish_k3={r.norrish_k3:.6g}, "
                f"bound_water_per_solids={self.bound_water_per_solids:.6g})")

    # --- file format ---------------------------------------------------------------------
    def entry(self) -> dict:
        """The solute as a TOML table (the ``[solute]`` table of a fitted-solute file, one
        ``[solutes.<id>]`` table of a library file): SI units, keys of our own."""
        r = self.record
        pz = r.pitzer
        out: dict[str, Any] = {"id": r.id, "name": r.name, "molar_mass": float(r.molar_mass)}
        if pz is None:
            out.update({"norrish_k": float(r.norrish_k), "norrish_k3": float(r.norrish_k3),
                        "max_mass_fraction": float(r.max_mass_fraction),
                        "bound_water_per_solids": self.bound_water_per_solids, "note": r.note})
        else:
            out.update({"salt": str(self.salt), "note": r.note,
                        "pitzer": {**{k: float(pz[k]) for k in _PITZER_KEYS},
                                   "max_molality": float(pz["max_molality"]),
                                   "min_temperature": float(pz["min_temperature"]),
                                   "max_temperature": float(pz["max_temperature"]),
                                   "source": str(pz["source"])}})
        u = r.uncertainty
        if u is not None:  # the fit's covariance (GUM: u(p_i, p_j)) and its degrees of freedom
            out["uncertainty"] = {"names": [str(n) for n in u["names"]],
                                  "covariance": [[float(v) for v in row] for row in np.asarray(u["covariance"])],
                                  "degrees_of_freedom": int(u["degrees_of_freedom"]), "source": str(u["source"])}
        return out

    def document(self) -> dict:
        """The whole fitted-solute file as a dict (see :meth:`to_toml`)."""
        doc: dict[str, Any] = {"format": FORMAT_NAME,
                               "version": (3 if self.record.uncertainty is not None
                                           else 2 if self.record.pitzer is not None else 1),
                               "solute": self.entry()}
        if self.fit is not None:
            a = self.fit.attrs
            doc["fit"] = {"model": str(a.get("model", "")), "status": str(a.get("status", "")),
                          "n_points": int(a.get("n_points", 0)),
                          "degrees_of_freedom": int(a.get("degrees_of_freedom", 0)),
                          "chi_square": float(a.get("chi_square", float("nan"))),
                          "parameters": {str(pname): {"value": float(row["value"]), "stderr": float(row["stderr"]),
                                                      "unit": str(row["unit"])}
                                         for pname, row in self.fit.iterrows()}}
        doc["provenance"] = {str(k): str(v) for k, v in sorted(self.source.items())}
        return doc

    def to_toml(self) -> str:
        """The fitted-solute file: a small TOML document of our own design (written with
        tomli-w). Units: molar mass kg/mol; Pitzer values at 298.15 K in kg/mol (C-phi
        kg^2/mol^2) and their d/dT per K; temperatures K; bound water kg per kg of the solute."""
        import tomli_w

        return "# colligate fitted solute (SI units: kg, mol, K)\n" + tomli_w.dumps(self.document())

    def save(self, path: str | os.PathLike[str], *, outputs: Optional[OutputSet] = None) -> str:
        """Write the fitted solute as TOML (atomically; with ``outputs``, into that set of a
        command's files). Returns the path."""
        return atomic_write_text(path, self.to_toml(), what="fitted-solute file", into=outputs)

    @classmethod
    def load(cls, path: str | os.PathLike[str]) -> "FittedSolute":
        return load_solute(path)


def _solute_file_error(prefix: str, where: str, message: str) -> Exception:
    """An error whose message starts with ``prefix`` (the file), then the table and key."""
    return _core.InvalidInputError(f"{prefix}: {where}{': ' if where else ''}{message}")


def _toml_table(path: str, parent: Any, key: str, where: str, required: bool = True) -> Optional[dict]:
    value = parent.get(key) if isinstance(parent, dict) else None
    if value is None:
        if required:
            raise _solute_file_error(path, f"[{where}]", "missing table (required)")
        return None
    if not isinstance(value, dict):
        raise _solute_file_error(path, f"{where} = {value!r}"[:200], f"must be a table [{where}]")
    return value


def _toml_number(path: str, table: dict, key: str, where: str, rule: str, default: Optional[float] = None,
                 finite: bool = True) -> float:
    if key not in table:
        if default is None:
            raise _solute_file_error(path, f"[{where}] {key}", f"missing key ({rule})")
        return default
    value = table[key]
    if isinstance(value, bool) or not isinstance(value, (int, float)):
        raise _solute_file_error(path, f"[{where}] {key} = {value!r}"[:200], f"must be a number ({rule})")
    x = float(value)
    if finite and not math.isfinite(x):
        raise _solute_file_error(path, f"[{where}] {key} = {value!r}", f"must be finite ({rule})")
    return x


def _toml_text(path: str, table: dict, key: str, where: str, default: Optional[str] = None) -> str:
    if key not in table:
        if default is None:
            raise _solute_file_error(path, f"[{where}] {key}", "missing key (a string)")
        return default
    value = table[key]
    if not isinstance(value, str):
        raise _solute_file_error(path, f"[{where}] {key} = {value!r}"[:200], "must be a string")
    return value


#: Keys of one solute table (``[solute]`` of a fitted-solute file, ``[solutes.<id>]`` of a library).
_SOLUTE_KEYS = ("id", "name", "molar_mass", "norrish_k", "norrish_k3", "max_mass_fraction",
                "bound_water_per_solids", "note", "salt", "pitzer", "uncertainty")


def solute_from_entry(entry: Any, where: str, *, table: str = "solute", default_id: Optional[str] = None,
                      fit: Any = None, source: Optional[dict] = None) -> FittedSolute:
    """A :class:`FittedSolute` from one TOML table (see :meth:`FittedSolute.entry`).

    ``where`` starts every error message (it names the file), ``table`` names the table in
    it (``solute``, ``solutes.<id>``); ``default_id`` is used when the table has no ``id``
    (the key of ``[solutes.<key>]`` in a library file). Every problem is a
    :class:`colligate.InvalidInputError` naming the table, the key, the value and the rule."""
    if not isinstance(entry, dict):
        raise _solute_file_error(where, f"{table} = {entry!r}"[:200], f"must be a table [{table}]")
    s = dict(entry)
    if "id" not in s and default_id is not None:
        s["id"] = default_id
    extra = sorted(set(s) - set(_SOLUTE_KEYS))
    if extra:
        raise _solute_file_error(where, f"[{table}] {extra[0]}",
                                 f"unknown key; allowed keys are {', '.join(sorted(_SOLUTE_KEYS))}")
    pz = _toml_table(where, s, "pitzer", f"{table}.pitzer", required=False)
    sid = _toml_text(where, s, "id", table)
    name = _toml_text(where, s, "name", table, default=sid)
    note = _toml_text(where, s, "note", table, default="")
    if pz is not None:
        salt: Optional[str] = _toml_text(where, s, "salt", table)
        pw = f"{table}.pitzer"
        params = {k: _toml_number(where, pz, k, pw, "kg/mol, kg^2/mol^2 or their d/dT",
                                  default=None if k in ("beta0", "beta1", "cphi") else 0.0)
                  for k in _PITZER_KEYS}
        rec = _core.make_pitzer_solute_record(
            salt, sid, name, **params,
            max_molality=_toml_number(where, pz, "max_molality", pw, "mol/kg, > 0"),
            min_temperature=_toml_number(where, pz, "min_temperature", pw, "K, > 0"),
            max_temperature=_toml_number(where, pz, "max_temperature", pw, "K, above min_temperature"),
            source=_toml_text(where, pz, "source", pw, default="colligate_fit_user"), note=note)
    else:
        salt = None
        rec = _core.make_solute_record(
            sid, name, _toml_number(where, s, "molar_mass", table, "kg/mol, > 0"),
            _toml_number(where, s, "norrish_k", table, "Norrish K, dimensionless"),
            _toml_number(where, s, "norrish_k3", table, "Norrish K3, dimensionless", default=0.0),
            _toml_number(where, s, "max_mass_fraction", table, "kg/kg, in (0, 1]", default=0.9),
            note)
    bound = _toml_number(where, s, "bound_water_per_solids", table, "kg per kg of solute, >= 0", default=0.0)
    if bound < 0.0:
        raise _solute_file_error(where, f"[{table}] bound_water_per_solids = {bound!r}",
                                 "must be >= 0 (kg per kg of solute)")
    ut = _toml_table(where, s, "uncertainty", f"{table}.uncertainty", required=False)
    if ut is not None:
        rec = _core.record_with_uncertainty(rec, *_uncertainty_from_toml(where, ut, table))
    return FittedSolute(rec, bound_water_per_solids=bound, fit=fit, source=source, salt=salt)


def load_solute(path: str | os.PathLike[str]) -> FittedSolute:
    """Read a fitted-solute TOML file written by :meth:`FittedSolute.save`.

    Raises
    ------
    colligate.InvalidInputError
        The file is missing, larger than 10 MB, not UTF-8 TOML, or a field is missing or
        of the wrong type or range; the message names the file, the table and key, the
        value and what is expected.
    """
    try:
        import tomllib  # Python >= 3.11
    except ImportError:  # pragma: no cover
        import tomli as tomllib  # type: ignore[no-redef]
    source = os.fspath(path)
    try:
        raw = read_input_bytes(source, "fitted-solute file")
    except InputFileError as exc:
        raise _core.InvalidInputError(str(exc)) from None
    prefix = f"fitted-solute file '{source}'"
    try:
        doc = tomllib.loads(raw.decode("utf-8"))
    except UnicodeDecodeError as exc:
        raise _solute_file_error(prefix, "", f"not UTF-8 text (byte {exc.start})") from None
    except tomllib.TOMLDecodeError as exc:
        raise _solute_file_error(prefix, "", f"TOML syntax error: {exc}") from None
    except RecursionError:
        raise _solute_file_error(prefix, "", "arrays or inline tables nested too deeply for the TOML "
                                 "reader; the file holds flat tables of numbers and strings") from None
    return solute_from_document(doc, prefix)


def solute_from_document(doc: dict, where: str) -> FittedSolute:
    """A :class:`FittedSolute` from a parsed fitted-solute file (``where`` names it)."""
    if doc.get("format") != FORMAT_NAME:
        raise _core.InvalidInputError(
            f"{where}: format = {doc.get('format')!r}: not a colligate fitted-solute file "
            f"(expected format = '{FORMAT_NAME}')")
    version = doc.get("version", 1)
    if isinstance(version, bool) or not isinstance(version, int) or not 1 <= version <= FORMAT_VERSION:
        raise _core.InvalidInputError(
            f"{where}: version = {version!r}: this colligate reads versions 1 to {FORMAT_VERSION}")
    entry = _toml_table(where, doc, "solute", "solute")
    fit_df = None
    f = _toml_table(where, doc, "fit", "fit", required=False)
    if f is not None:
        import pandas as pd

        params_t = _toml_table(where, f, "parameters", "fit.parameters", required=False) or {}
        rows = {}
        for pname in params_t:
            p = _toml_table(where, params_t, pname, f"fit.parameters.{pname}")
            pw = f"fit.parameters.{pname}"
            rows[pname] = (_toml_number(where, p, "value", pw, "the fitted value", finite=False),
                           _toml_number(where, p, "stderr", pw, "its standard error", finite=False),
                           _toml_text(where, p, "unit", pw, default=""))
        fit_df = pd.DataFrame({"value": [r[0] for r in rows.values()],
                               "stderr": [r[1] for r in rows.values()],
                               "unit": [r[2] for r in rows.values()]},
                              index=pd.Index(list(rows), name="parameter"))
        fit_df.attrs.update({k: v for k, v in f.items() if k != "parameters"})
    prov = _toml_table(where, doc, "provenance", "provenance", required=False) or {}
    return solute_from_entry(entry, where, table="solute", fit=fit_df,
                             source={str(k): str(v) for k, v in prov.items()})


def _uncertainty_from_toml(where: str, t: dict, table: str) -> tuple:
    """(names, covariance, degrees of freedom, source) of a [<solute>.uncertainty] table."""
    tw = f"{table}.uncertainty"
    extra = sorted(set(t) - {"names", "covariance", "degrees_of_freedom", "source"})
    if extra:
        raise _solute_file_error(where, f"[{tw}] {extra[0]}",
                                 "unknown key; allowed keys are covariance, degrees_of_freedom, names, source")
    names = t.get("names")
    if not isinstance(names, list) or not all(isinstance(n, str) for n in names):
        raise _solute_file_error(where, f"[{tw}] names = {names!r}"[:200], "must be a list of constant names")
    matrix = t.get("covariance")
    ok = (isinstance(matrix, list) and len(matrix) == len(names)
          and all(isinstance(r, list) and len(r) == len(names) for r in matrix)
          and all(isinstance(v, (int, float)) and not isinstance(v, bool) for r in matrix for v in r))
    if not ok:
        raise _solute_file_error(where, f"[{tw}] covariance = {matrix!r}"[:200],
                                 f"must be a {len(names)} x {len(names)} array of numbers, one row per name")
    dof = t.get("degrees_of_freedom", 0)
    if isinstance(dof, bool) or not isinstance(dof, int) or not 0 <= dof <= 10**9:
        raise _solute_file_error(where, f"[{tw}] degrees_of_freedom = {dof!r}"[:200],
                                 "must be an integer >= 0 (0: covariance taken as known)")
    source = _toml_text(where, t, "source", tw, default="colligate_fit_user")
    return names, np.asarray(matrix, dtype=float).reshape(len(names), len(names)), dof, source


class SoluteLibrary(_core.SoluteTable):
    """The built-in solutes plus fitted ones: pass it as ``table=`` to the Solution factories.

    >>> lib = SoluteLibrary([fitted])                                   # doctest: +SKIP
    >>> s = Solution.from_mass_fractions({"my syrup": 0.3}, table=lib)   # doctest: +SKIP

    Adding a solute changes only this library object (there is no global registry).
    """

    def __init__(self, solutes: Sequence[FittedSolute] = (), *, include_builtin: bool = True) -> None:
        super().__init__(include_builtin)
        self.fitted: dict[str, FittedSolute] = {}
        for fs in solutes:
            self.add_solute(fs)

    def add_solute(self, solute: FittedSolute) -> "SoluteLibrary":
        """Add a fitted solute (raises if a name is taken). Returns self."""
        self.add(solute.record)
        self.fitted[solute.id] = solute
        return self

    def load(self, path: str | os.PathLike[str]) -> FittedSolute:
        """Read a fitted-solute file and add it. Returns the solute."""
        fs = load_solute(path)
        self.add_solute(fs)
        return fs

    def bound_water_fraction_of_water(self, solution: Any) -> float:
        """Unfreezable water of the fitted solutes in ``solution``, kg per kg of its water."""
        return sum(fs.bound_water_fraction_of_water(solution) for fs in self.fitted.values())


def _provenance(data_name: Optional[str], arrays: Sequence[np.ndarray]) -> dict:
    h = hashlib.sha256()
    for a in arrays:
        h.update(np.ascontiguousarray(a, dtype=float).tobytes())
    out = {"created": _dt.datetime.now(_dt.timezone.utc).isoformat(timespec="seconds"),
           "colligate_version": getattr(_core, "__version__", ""),
           "data_sha256": h.hexdigest()}
    if data_name:
        out["data"] = str(data_name)
    return out


def curve_fit(model, x, y, p0, *, weights=None, jacobian=None, lower_bounds=None,
              upper_bounds=None, max_iterations: int = 500):
    """General Levenberg-Marquardt fit of ``model(x, p)`` (x as an (n, d) array) to ``y``.

    Returns a :class:`FitResult`. ``jacobian(x, p)`` (n, k) is optional (central
    differences otherwise)."""
    x_arr = np.asarray(x, dtype=float)
    x2 = x_arr.reshape(-1, 1) if x_arr.ndim == 1 else x_arr
    y_arr = np.asarray(y, dtype=float)

    def f(xx, p):
        return np.asarray(model(xx[:, 0] if x_arr.ndim == 1 else xx, p), dtype=float)

    jac = None
    if jacobian is not None:
        def jac(xx, p):
            return np.asarray(jacobian(xx[:, 0] if x_arr.ndim == 1 else xx, p), dtype=float)

    core = _core.curve_fit(f, x2, y_arr, np.asarray(p0, dtype=float),
                           None if weights is None else np.asarray(weights, dtype=float), jac,
                           None if lower_bounds is None else np.asarray(lower_bounds, dtype=float),
                           None if upper_bounds is None else np.asarray(upper_bounds, dtype=float),
                           int(max_iterations))
    return FitResult(core, model="curve_fit", x=x_arr if x_arr.ndim == 1 else np.arange(len(y_arr)),
                     y=y_arr, x_label="x", y_label="y")


def fit_norrish(molality, water_activity=None, freezing_point=None, T: float = 298.15,
                weights=None, *, k3: bool = False, k_start: float = 2.0, k3_start: float = 0.0,
                data=None, data_name: Optional[str] = None) -> FitResult:
    """Fit Norrish K (and K3 with ``k3=True``) of one non-electrolyte.

    Parameters
    ----------
    molality : array_like or str
        Molality of each sample, mol/kg (or a column name of ``data``).
    water_activity : array_like or str, optional
        Water activity at temperature ``T`` (K). Give this or ``freezing_point``.
    freezing_point : array_like or str, optional
        Initial freezing point, K.
    T : float
        Temperature of the water-activity data, K (default 298.15).
    weights : array_like or str, optional
        Relative weights (e.g. 1/sigma^2); default all 1.
    data : pandas.DataFrame, optional
        Table whose columns the string arguments name.

    Returns
    -------
    FitResult
        Parameters ``norrish_k`` (and ``norrish_k3``), in our sign convention
        ln a_w = ln x_w - K x_s^2 - K3 x_s^3.
    """
    m = _column(molality, data, "molality")
    aw = _column(water_activity, data, "water_activity")
    tf = _column(freezing_point, data, "freezing_point")
    w = _column(weights, data, "weights")
    if (aw is None) == (tf is None):
        raise _core.InvalidInputError("fit_norrish: give exactly one of water_activity= or freezing_point=")
    if m is None:
        raise _core.InvalidInputError("fit_norrish: molality is required (mol/kg)")
    if aw is not None:
        core = _core.fit_norrish_water_activity(m, aw, float(T), w, k3, k_start, k3_start)
        y, ylab, model = aw, f"water activity at {float(T):.2f} K", "norrish (water activity)"
    else:
        core = _core.fit_norrish_freezing_point(m, tf, w, k3, k_start, k3_start)
        y, ylab, model = tf, "initial freezing point / K", "norrish (freezing point)"
    src = _provenance(data_name, [m, y])
    res = FitResult(core, model=model, x=m, y=y, x_label="molality / (mol/kg)", y_label=ylab,
                    source=src, extra={"molality": m})
    res._warn_if_poorly_determined()
    return res


def fit_effective_solute(water_fraction, freezing_point=None, *, temperature=None,
                         ice_fraction=None, weights=None, fit_bound_water: bool = True,
                         molar_mass_start: float = 0.2, bound_water_start: float = 0.1,
                         data=None, data_name: Optional[str] = None) -> FitResult:
    """Fit an unknown food's effective solute: apparent molar mass of its solids (kg/mol)
    and unfreezable water (kg per kg of solids).

    Give either ``freezing_point`` (K; initial freezing points at several water contents
    ``water_fraction``, kg water / kg food) or ``temperature`` (K) with ``ice_fraction``
    (ice mass / total water mass, e.g. from DSC). ``water_fraction`` may be a scalar for an
    ice curve of one sample. With ``fit_bound_water=False`` the bound water stays at
    ``bound_water_start``.
    """
    T = _column(temperature, data, "temperature")
    ice = _column(ice_fraction, data, "ice_fraction")
    tf = _column(freezing_point, data, "freezing_point")
    w = _column(weights, data, "weights")
    wf = _column(water_fraction, data, "water_fraction")
    if wf is None:
        raise _core.InvalidInputError("fit_effective_solute: water_fraction (kg water / kg food) is required")
    if tf is not None and (T is not None or ice is not None):
        raise _core.InvalidInputError(
            "fit_effective_solute: give freezing_point= or temperature= with ice_fraction=, not both")
    if tf is not None:
        core = _core.fit_effective_solute_freezing(wf, tf, w, fit_bound_water, molar_mass_start,
                                                   bound_water_start)
        x, y = wf, tf
        xl, yl, model = "water mass fraction / (kg/kg)", "initial freezing point / K", "effective solute (freezing point)"
    else:
        if T is None or ice is None:
            raise _core.InvalidInputError(
                "fit_effective_solute: give freezing_point=, or both temperature= and ice_fraction=")
        if wf.size == 1 and T.size > 1:
            wf = np.full(T.size, float(wf[0]))
        core = _core.fit_effective_solute_ice_curve(wf, T, ice, w, fit_bound_water, molar_mass_start,
                                                    bound_water_start)
        x, y = T, ice
        xl, yl, model = "temperature / K", "ice mass / total water", "effective solute (ice curve)"
    extra = {} if fit_bound_water else {"bound_water_fixed": bound_water_start}
    res = FitResult(core, model=model, x=x, y=y, x_label=xl, y_label=yl,
                    source=_provenance(data_name, [wf, y]), extra=extra)
    res._warn_if_poorly_determined()
    return res


def fit_pitzer(salt: str, molality, osmotic_coefficient=None, water_activity=None,
               freezing_point=None, T=298.15, weights=None, *, temperature_terms: bool = False,
               beta2: bool = False, table: Any = None, data=None,
               data_name: Optional[str] = None) -> FitResult:
    """Fit the Pitzer binary parameters of one salt to data on its binary solutions.

    Parameters
    ----------
    salt : str
        The salt, by any accepted name ("NaCl", "sodium chloride"); looked up in ``table``
        (default: the built-in table). Its ions must be ones the Pitzer model handles.
    molality : array_like or str
        Molality of each sample, mol/kg (or a column name of ``data``).
    osmotic_coefficient, water_activity, freezing_point : array_like or str, optional
        Give exactly one: osmotic coefficients or water activities at ``T``, or initial
        freezing points in K.
    T : float, array_like or str
        Temperature of osmotic-coefficient or water-activity data, K: one value or one per
        row (default 298.15). Not used with ``freezing_point``.
    weights : array_like or str, optional
        Relative weights (e.g. 1/sigma^2); default all 1.
    temperature_terms : bool
        Also fit d/dT of each parameter at 298.15 K (needs data at several temperatures;
        with one temperature the status is 'singular').
    beta2 : bool
        Also fit beta2 (2:2 salts only).

    Returns
    -------
    FitResult
        Parameters ``beta0``, ``beta1`` (kg/mol), ``cphi`` (kg^2/mol^2) (and ``beta2``, and
        ``d<name>_dT`` per K). ``as_solute(name)`` gives the fitted salt for a
        :class:`SoluteLibrary`.
    """
    m = _column(molality, data, "molality")
    phi = _column(osmotic_coefficient, data, "osmotic_coefficient")
    aw = _column(water_activity, data, "water_activity")
    tf = _column(freezing_point, data, "freezing_point")
    w = _column(weights, data, "weights")
    if sum(v is not None for v in (phi, aw, tf)) != 1:
        raise _core.InvalidInputError(
            "fit_pitzer: give exactly one of osmotic_coefficient=, water_activity= or freezing_point=")
    if m is None:
        raise _core.InvalidInputError("fit_pitzer: molality is required (mol/kg)")
    if not isinstance(salt, str):
        raise _core.InvalidInputError(f"fit_pitzer: salt must be a solute name, got {salt!r}")
    opts = dict(temperature_terms=bool(temperature_terms), beta2=bool(beta2), table=table)
    if tf is not None:
        core = _core.fit_pitzer_freezing_point(salt, m, tf, w, **opts)
        y, ylab, kind, temps = tf, "initial freezing point / K", "freezing point", tf
    else:
        temps = _column(T, data, "T")
        if phi is not None:
            core = _core.fit_pitzer_osmotic_coefficient(salt, m, phi, temps, w, **opts)
            y, ylab, kind = phi, "osmotic coefficient", "osmotic coefficient"
        else:
            core = _core.fit_pitzer_water_activity(salt, m, aw, temps, w, **opts)
            y, ylab, kind = aw, "water activity", "water activity"
        if temps.size == 1:
            ylab += f" at {float(temps[0]):.2f} K"
    salt_id = (table if table is not None else _core.SoluteTable()).find(salt).id
    src = _provenance(data_name, [m, y] + ([] if tf is not None else [temps]))
    src["salt"] = salt_id
    res = FitResult(core, model=f"pitzer {salt_id} ({kind})", x=m, y=y,
                    x_label="molality / (mol/kg)", y_label=ylab, source=src,
                    extra={"molality": m, "temperature": temps, "salt": salt_id, "table": table})
    res._warn_if_poorly_determined()
    return res


def fit_single_salt(cation_charge: int, anion_charge: int, cation_count: int, anion_count: int,
                    molality, freezing_point, weights=None, *, cphi: bool = True, data=None,
                    data_name: Optional[str] = None) -> FitResult:
    """Fit Pitzer's beta0, beta1 (and C-phi) of one salt of any charge type to the freezing
    points of its solutions, in the closed binary form (alpha1 = 2, b = 1.2).

    For salts whose ions the mixture model's tables do not hold (citrate, acetate,
    phosphates, lactate...); :func:`fit_pitzer` fits salts of the mixture model's ions. The
    parameters are taken as constant over the freezing temperatures of the data; A_phi
    follows T.

    Parameters
    ----------
    cation_charge, anion_charge : int
        z of the cation (1 to 4) and of the anion (-1 to -4); 2:2 salts need beta2 and are
        refused.
    cation_count, anion_count : int
        Ions per formula unit (trisodium citrate: 3 and 1); the unit must be neutral.
    molality : array_like or str
        Molality of each sample, mol/kg (or a column name of ``data``).
    freezing_point : array_like or str
        Freezing point of each sample, K (below 273.15 K).
    weights : array_like or str, optional
        Relative weights (e.g. 1/sigma^2); default all 1.
    cphi : bool
        Also fit C-phi (default). With data to about 1 mol/kg its interval often spans zero:
        fit beta0 and beta1 alone then (C-phi = 0).

    Returns
    -------
    FitResult
        Parameters ``beta0``, ``beta1`` (kg/mol) and ``cphi`` (kg^2/mol^2), with standard
        errors and confidence intervals. A poorly determined fit warns
        (:class:`PoorlyDeterminedFitWarning`).
    """
    m = _column(molality, data, "molality")
    tf = _column(freezing_point, data, "freezing_point")
    w = _column(weights, data, "weights")
    if m is None or tf is None:
        raise _core.InvalidInputError("fit_single_salt: molality (mol/kg) and freezing_point (K) are required")
    core = _core.fit_single_salt_freezing_point(int(cation_charge), int(anion_charge), int(cation_count),
                                                int(anion_count), m, tf, w, fit_cphi=bool(cphi))
    src = _provenance(data_name, [m, tf])
    shape = f"{int(cation_count)}x({int(cation_charge):+d}) {int(anion_count)}x({int(anion_charge):+d})"
    res = FitResult(core, model=f"single-salt pitzer {shape} (freezing point)", x=m, y=tf,
                    x_label="molality / (mol/kg)", y_label="freezing point / K", source=src,
                    extra={"molality": m})
    res._warn_if_poorly_determined()
    return res


#: Column names ``colligate fit`` accepts for each quantity, with the factor or conversion to
#: SI: concentration as molality (mol/kg water), mass fraction (kg/kg of solution) or mass
#: percent; temperatures in K or degC.
CONCENTRATION_COLUMNS = ("molality", "mass_fraction", "mass_percent")
TEMPERATURE_COLUMNS = ("freezing_point", "temperature")


def lab_units_to_si(df, where: str, *, model: str, salt: Optional[str] = None,
                    molar_mass: Optional[float] = None):
    """The data table with its columns in the SI units the fitters take.

    Accepts ``molality``, ``mass_fraction`` (kg solute per kg of solution) or
    ``mass_percent`` (also ``wt_percent``) for the concentration, and ``freezing_point_K``
    or ``freezing_point_C``, ``temperature_K`` or ``temperature_C`` for temperatures. A
    concentration given by mass needs the solute's molar mass: from the salt for a Pitzer
    fit, from ``molar_mass`` (kg/mol) for a Norrish fit; its absence is an error before any
    fitting. Returns the new table and a list of the conversions made.
    """
    from .units import kelvin_from_celsius

    out = df.copy()
    done: list[str] = []
    aliases = {"wt_percent": "mass_percent", "wt%": "mass_percent", "molality_mol_per_kg": "molality"}
    out = out.rename(columns={k: v for k, v in aliases.items() if k in out.columns})
    for base in TEMPERATURE_COLUMNS:
        k, c = f"{base}_K", f"{base}_C"
        if k in out.columns and c in out.columns:
            raise _core.InvalidInputError(f"{where}: columns {k} and {c} both given; keep one")
        if c in out.columns:
            values = np.asarray(out.pop(c), dtype=float)
            out[k] = [kelvin_from_celsius(v) if np.isfinite(v) else v for v in values]
            done.append(f"{c} -> {k}")
    given = [c for c in CONCENTRATION_COLUMNS if c in out.columns]
    if len(given) > 1:
        raise _core.InvalidInputError(f"{where}: concentration given as {given}; keep one column "
                                      f"(one of {', '.join(CONCENTRATION_COLUMNS)})")
    if model in ("norrish", "pitzer") and given and given[0] != "molality":
        col = given[0]
        if model == "pitzer":
            if not salt:
                raise _core.InvalidInputError("--salt is required for --model pitzer (e.g. --salt NaCl)")
            mm = float(_core.SoluteTable().find(salt).molar_mass)
        else:
            if molar_mass is None:
                raise _core.InvalidInputError(
                    f"{where}: column {col} needs the solute's molar mass to become a molality: "
                    "give --molar-mass in kg/mol (e.g. 0.3423 for sucrose)")
            mm = float(molar_mass)
            if not (np.isfinite(mm) and mm > 0.0):
                raise _core.InvalidInputError(f"--molar-mass = {molar_mass}: must be finite and > 0 kg/mol")
        w = np.asarray(out.pop(col), dtype=float) / (100.0 if col == "mass_percent" else 1.0)
        bad = ~((w >= 0.0) & (w < 1.0))
        if np.any(bad):
            row = int(np.flatnonzero(bad)[0])
            raise _core.InvalidInputError(f"{where}: column {col}, data row {row}: value {df[col].iloc[row]} "
                                          "is outside [0, 100) % of the solution")
        out["molality"] = w / ((1.0 - w) * mm)
        done.append(f"{col} -> molality (molar mass {mm:g} kg/mol)")
    return out, done


#: Columns the ``colligate fit`` command reads from a data file (in the unit each name
#: states; see :func:`lab_units_to_si`); each one present must hold a finite number on
#: every data line.
FIT_DATA_COLUMNS = ("molality", "water_activity", "freezing_point_K", "osmotic_coefficient",
                    "temperature_K", "water_fraction", "ice_fraction", "weight",
                    "mass_fraction", "mass_percent", "wt_percent", "wt%", "molality_mol_per_kg",
                    "freezing_point_C", "temperature_C")


def read_fit_data(path: str | os.PathLike[str]):
    """Read a data file of the ``colligate fit`` command: CSV, UTF-8, a header line of
    column names, at most 10 MB. Every column of :data:`FIT_DATA_COLUMNS` present is
    converted to float; other columns stay text. Blank lines are skipped.

    Raises
    ------
    colligate._files.InputFileError
        The file is missing, too large, not UTF-8 or not a table; or a cell of a data
        column is empty, not a number or not finite. The message names the file, the line
        (counting the header as line 1) and the column.
    """
    import io

    import pandas as pd

    source = os.fspath(path)
    prefix = f"data file '{source}'"
    raw = read_input_bytes(source, "data file")
    try:
        text = raw.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        raise InputFileError(f"{prefix}: not UTF-8 text (byte {exc.start})") from None
    if "\0" in text:
        raise InputFileError(f"{prefix}: line {text[:text.index(chr(0))].count(chr(10)) + 1}: "
                             "contains a NUL byte; expected CSV text")
    try:
        df = pd.read_csv(io.StringIO(text), dtype=str, keep_default_na=False, skip_blank_lines=False)
    except pd.errors.EmptyDataError:
        raise InputFileError(f"{prefix}: empty; expected a header line of column names "
                             f"({', '.join(FIT_DATA_COLUMNS[:3])}, ...) and data lines") from None
    except (pd.errors.ParserError, ValueError) as exc:
        detail = " ".join(str(exc).split())[:200]
        raise InputFileError(f"{prefix}: not a CSV table ({detail})") from None
    # Row i of the frame is line i + 2 of the file (line 1 is the header); quoted cells
    # spanning lines would shift this, and data files have none.
    lines = np.arange(len(df)) + 2
    blank = (df.apply(lambda c: c.str.strip()) == "").all(axis=1).to_numpy() if len(df.columns) \
        else np.zeros(len(df), bool)  # blank and whitespace-only lines
    df = df[~blank].reset_index(drop=True)
    lines = lines[~blank]
    for col in FIT_DATA_COLUMNS:
        if col not in df.columns:
            continue
        cells = df[col].to_numpy()
        values = np.empty(len(cells))
        for i, cell in enumerate(cells):
            where = f"{prefix}, line {lines[i]}, column '{col}'"
            text_cell = str(cell).strip()
            if not text_cell:
                raise InputFileError(f"{where}: empty cell; expected a finite number (in the unit of the column name)")
            try:
                x = float(text_cell)
            except ValueError:
                raise InputFileError(f"{where}: {text_cell[:40]!r} is not a number; expected a finite "
                                     "number (in the unit of the column name)") from None
            if not math.isfinite(x):
                raise InputFileError(f"{where}: {text_cell[:40]!r} is not finite; expected a finite number")
            values[i] = x
        df[col] = values
    return df


def run_fit_command(args: Any) -> str:
    """The ``colligate fit`` subcommand: fit, write the plot (and the solute file), return
    the printed summary. All files or none: both are written together at the end."""
    data_path = os.fspath(args.data)
    stem = os.path.splitext(data_path)[0]
    plot_path = args.plot or f"{stem}_fit.png"
    with OutputSet([data_path]) as out:
        out.plan(plot_path, "--plot")
        if args.save_solute:
            out.plan(args.save_solute, "--save-solute")
        # checked after the paths and before reading or fitting anything
        if args.model == "norrish" and args.save_solute and args.molar_mass is None:
            raise _core.InvalidInputError(
                "--molar-mass (kg/mol) is required to save a Norrish solute (--save-solute): the fit "
                "itself uses molalities only; e.g. --molar-mass 0.3423 for sucrose")
        text = _fit_from_file(args, data_path, stem, plot_path, out)
        out.commit()
    return text


def _fit_from_file(args: Any, data_path: str, stem: str, plot_path: str, out: OutputSet) -> str:
    df = read_fit_data(data_path)
    df, converted = lab_units_to_si(df, data_path, model=args.model, salt=args.salt, molar_mass=args.molar_mass)
    cols = set(df.columns)
    weights = "weight" if "weight" in cols else None
    name = os.path.basename(data_path)

    def need(*names: str) -> None:
        missing = [n for n in names if n not in cols]
        if missing:
            raise _core.InvalidInputError(
                f"{data_path}: column(s) {missing} missing for --model {args.model}; columns are {sorted(cols)}")

    if args.model == "pitzer":
        if not args.salt:
            raise _core.InvalidInputError("--salt is required for --model pitzer (e.g. --salt NaCl)")
        need("molality")
        kinds = [c for c in ("osmotic_coefficient", "water_activity", "freezing_point_K") if c in cols]
        if len(kinds) != 1:
            raise _core.InvalidInputError(
                f"{data_path}: --model pitzer needs exactly one of the columns osmotic_coefficient, "
                f"water_activity, freezing_point_K; columns are {sorted(cols)}")
        key = {"osmotic_coefficient": "osmotic_coefficient", "water_activity": "water_activity",
               "freezing_point_K": "freezing_point"}[kinds[0]]
        res = fit_pitzer(args.salt, "molality", T="temperature_K" if "temperature_K" in cols else args.T,
                         weights=weights, temperature_terms=args.temperature_terms, data=df,
                         data_name=name, **{key: kinds[0]})
    elif args.model == "norrish":
        need("molality")
        if "water_activity" in cols:
            res = fit_norrish("molality", water_activity="water_activity", T=args.T, weights=weights,
                              k3=args.k3, data=df, data_name=name)
        else:
            need("freezing_point_K")
            res = fit_norrish("molality", freezing_point="freezing_point_K", weights=weights,
                              k3=args.k3, data=df, data_name=name)
    else:
        need("water_fraction")
        if "ice_fraction" in cols:
            need("temperature_K")
            res = fit_effective_solute("water_fraction", temperature="temperature_K",
                                       ice_fraction="ice_fraction", weights=weights, data=df,
                                       data_name=name)
        else:
            need("freezing_point_K")
            res = fit_effective_solute("water_fraction", freezing_point="freezing_point_K",
                                       weights=weights, data=df, data_name=name)
    summary = res.summary()
    written = res.plot(plot_path, inputs=[data_path], outputs=out)
    a = summary.attrs
    lines = [f"fit: {a['model']} to {a['n_points']} points from {data_path}",
             *([f"columns converted to SI: {', '.join(converted)}"] if converted else []),
             f"status: {a['status']} ({a['message']}); chi-square {a['chi_square']:.6g}, "
             f"dof {a['degrees_of_freedom']}, R^2 {a['r_squared']:.6f}",
             summary.to_string(float_format=lambda v: f"{v:.6g}")]
    if a["contradictory_duplicates"]:
        lines.append(f"warning: rows with equal x but contradictory y: {a['contradictory_duplicates']}")
    lines.append(f"plot: {os.path.abspath(written)}")
    if args.save_solute:
        molar_mass = None if args.model == "pitzer" else args.molar_mass
        fs = res.as_solute(args.name or os.path.basename(stem), molar_mass=molar_mass)
        lines.append(f"fitted solute: {os.path.abspath(fs.save(args.save_solute, outputs=out))}")
    from ._warnings import CAUTIONS

    lines += ["", "Cautions:"] + [f"- {c}" for c in CAUTIONS]
    return "\n".join(lines) + "\n"

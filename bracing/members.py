"""Brace member capacity: rated tables, steel pipe (AISC 360-16), sawn lumber (NDS 2018).

Pure functions over floats or numpy arrays. Forces in lb, moments in lb-ft, lengths in ft,
section dimensions in in, steel stresses in ksi, wood stresses in psi. Capacities are
available strengths: allowable (ASD, the default) or design (LRFD) by `basis`.
Rated values (end connections, inserts, driven stakes) are used as entered: no function here.
The rated tables live here; steel pipe in `bracing.steel_pipe` (compression, tension) and
`bracing.steel_pipe_bending` (bending, axial with bending), lumber in `bracing.lumber`, all
named here.
"""

from __future__ import annotations

import numpy as np

from bracing.data_members import STEEL_E_KSI
from bracing.lumber import (
    C_SAWN,
    CD_WIND,
    LE_OVER_D_MAX,
    LE_OVER_D_MAX_CONSTRUCTION,
    column_stability_factor,
    lumber_compression,
    lumber_slenderness,
    lumber_too_slender,
    size_factor_fc,
)
from bracing.steel_pipe import (
    KSI_IN2_TO_LB,
    LC_OVER_R_ADVISORY,
    OMEGA_B,
    OMEGA_C,
    OMEGA_T,
    PHI_B,
    PHI_C,
    PHI_T,
    critical_stress,
    euler_stress,
    knee_brace_lengths,
    pipe_compression,
    pipe_tension,
    slenderness,
)
from bracing.steel_pipe_bending import (
    ALPHA_B1,
    amplifier_of,
    euler_load,
    moment_amplifier_b1,
    pipe_axial_bending_ratio,
    pipe_flexure,
    pipe_wall_nonslender,
    self_weight_moment,
)

__all__ = [
    "ALPHA_B1",
    "CD_WIND",
    "C_SAWN",
    "KSI_IN2_TO_LB",
    "LC_OVER_R_ADVISORY",
    "LE_OVER_D_MAX",
    "LE_OVER_D_MAX_CONSTRUCTION",
    "OMEGA_B",
    "OMEGA_C",
    "OMEGA_T",
    "PHI_B",
    "PHI_C",
    "PHI_T",
    "STEEL_E_KSI",
    "amplifier_of",
    "column_stability_factor",
    "critical_stress",
    "euler_load",
    "euler_stress",
    "knee_brace_lengths",
    "lumber_compression",
    "lumber_slenderness",
    "lumber_too_slender",
    "moment_amplifier_b1",
    "pipe_axial_bending_ratio",
    "pipe_compression",
    "pipe_flexure",
    "pipe_tension",
    "pipe_wall_nonslender",
    "rated_capacity",
    "self_weight_moment",
    "size_factor_fc",
    "slenderness",
    "validate_rated_table",
]


# --- Rated (adjustable / telescoping) braces: maker's table ----------------------------------
def validate_rated_table(lengths_ft, loads_lb):
    """Raise ValueError unless lengths strictly increase and every rated load is positive."""
    lengths = np.asarray(lengths_ft, dtype=float)
    loads = np.asarray(loads_lb, dtype=float)
    if lengths.ndim != 1 or lengths.shape != loads.shape or lengths.size < 2:
        raise ValueError("a rated table needs two or more (length, load) pairs of equal count")
    if not (np.all(np.isfinite(lengths)) and np.all(np.diff(lengths) > 0) and lengths[0] > 0):
        raise ValueError("rated table lengths must be positive and strictly increasing")
    if not (np.all(np.isfinite(loads)) and np.all(loads > 0)):
        raise ValueError("rated table loads must be positive")


def rated_capacity(length_ft, table_lengths_ft, table_loads_lb):
    """Maker's rated safe working load of a brace at a length, linear between table rows.

    Parameters
    ----------
    length_ft : float or array_like
        Brace length, ft.
    table_lengths_ft : array_like
        The maker's lengths, ft, strictly increasing (`validate_rated_table`).
    table_loads_lb : array_like
        The maker's rated safe working loads at those lengths, lb (allowable).

    Returns
    -------
    float or ndarray
        Rated load, lb. NaN outside the table's length range: the rating is unknown there
        ("outside the rated range"), never extrapolated.

    References
    ----------
    The brace maker's rated table (used as entered, method notes §1).

    Examples
    --------
    A table of 5,000 lb at 6 ft and 4,000 lb at 10 ft, then 2,000 lb at 20 ft:

    >>> [float(c) for c in rated_capacity([8.0, 12.0, 30.0], [6.0, 10.0, 20.0],
    ...                                   [5000.0, 4000.0, 2000.0])]
    [4500.0, 3600.0, nan]
    """
    validate_rated_table(table_lengths_ft, table_loads_lb)
    return np.interp(length_ft, table_lengths_ft, table_loads_lb, left=np.nan, right=np.nan)[()]

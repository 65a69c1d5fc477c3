"""Reference data for brace members: standard steel pipe, dressed lumber, NDS design values.

Each table names its source and how sure we are (references.md marks: `text`, `secondary`,
`from memory`; `computed` = derived here by geometry from the marked inputs).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

# --- Steel ---------------------------------------------------------------------------------
STEEL_E_KSI = 29_000.0  # AISC 360-16 §B3 (symbols: E = 29,000 ksi). text
A53_GRB_FY_KSI = 35.0  # ASTM A53 Gr. B minimum yield. text (references.md)
A53_GRB_FU_KSI = 60.0  # ASTM A53 Gr. B minimum tensile. text (references.md)
DESIGN_WALL_FACTOR = 0.93  # AISC Manual Table 1-14: design wall = 0.93 t_nom. from memory
STEEL_UNIT_WEIGHT_PCF = 490.0  # carbon steel. common practice


@dataclass(frozen=True)
class PipeSection:
    """One standard-weight pipe: dimensions in in, area in2, weight lb/ft (plf)."""

    name: str
    od_in: float
    t_nom_in: float
    area_in2: float
    r_in: float

    @property
    def t_design_in(self) -> float:
        """Design wall thickness, 0.93 t_nom (AISC Manual Table 1-14 basis)."""
        return DESIGN_WALL_FACTOR * self.t_nom_in

    @property
    def z_in3(self) -> float:
        """Plastic section modulus of a tube, Z = (D^3 - (D - 2t)^3) / 6, design wall."""
        return (self.od_in**3 - (self.od_in - 2.0 * self.t_design_in) ** 3) / 6.0

    @property
    def i_in4(self) -> float:
        """Moment of inertia, I = pi (D^4 - (D - 2t)^4) / 64, design wall."""
        return math.pi * (self.od_in**4 - (self.od_in - 2.0 * self.t_design_in) ** 4) / 64.0

    @property
    def weight_plf(self) -> float:
        """Plain-end weight per foot on the nominal wall: pi (D - t) t [in2] / 144 * 490 pcf."""
        area_in2 = math.pi * (self.od_in - self.t_nom_in) * self.t_nom_in
        return area_in2 / 144.0 * STEEL_UNIT_WEIGHT_PCF


PIPE_SOURCE = (
    "OD and nominal wall: ASME B36.10M; A and r: AISC Manual Table 1-14 (design wall 0.93 t); "
    "Z, I, weight: computed from OD and wall; A53 Gr. B Fy 35 ksi, E 29,000 ksi."
)
PIPE_CERTAINTY = {
    "od_in": "text",
    "t_nom_in": "text",
    "area_in2": "from memory",
    "r_in": "from memory",
    "t_design_in": "from memory",
    "z_in3": "computed",
    "i_in4": "computed",
    "weight_plf": "computed",
}
# Pipe 10 STD is here for the AISC Design Examples v14 E.11 check: all its values from memory.
# Its table area 11.5 in2 is 3 % above the design-wall geometry (11.1 in2); kept as published.
PIPES = {
    p.name: p
    for p in (
        PipeSection("Pipe 2 STD", 2.375, 0.154, 1.02, 0.791),
        PipeSection("Pipe 2-1/2 STD", 2.875, 0.203, 1.61, 0.952),
        PipeSection("Pipe 3 STD", 3.500, 0.216, 2.07, 1.17),
        PipeSection("Pipe 3-1/2 STD", 4.000, 0.226, 2.50, 1.34),
        PipeSection("Pipe 4 STD", 4.500, 0.237, 2.96, 1.51),
        PipeSection("Pipe 10 STD", 10.75, 0.365, 11.5, 3.68),
    )
}

# --- Sawn lumber ---------------------------------------------------------------------------
# Dressed (dry) sizes, thickness x width in inches. NDS Supplement Table 1B. from memory.
DRESSED_SIZES_IN = {
    "2x4": (1.5, 3.5),
    "2x6": (1.5, 5.5),
    "4x4": (3.5, 3.5),
    "4x6": (3.5, 5.5),
    "6x6": (5.5, 5.5),
}
DRESSED_SIZES_SOURCE = "NDS 2018 Supplement Table 1B (from memory)"


@dataclass(frozen=True)
class LumberGrade:
    """NDS reference design values (psi) for one species group, grade and size class."""

    species: str
    grade: str
    size_class: str  # "dimension" (2 to 4 in thick) or "posts_timbers" (5x5 and larger)
    fc_psi: float
    emin_psi: float
    source: str
    certainty: str


# Dimension lumber values exclude the size factor CF (apply size_factor_fc); Table 4D values
# for posts and timbers take no CF on Fc.
LUMBER_GRADES = {
    (g.species, g.grade, g.size_class): g
    for g in (
        LumberGrade(species="DF-L", grade="No.2", size_class="dimension", fc_psi=1350.0,
                    emin_psi=580_000.0, source="NDS 2018 Supplement Table 4A",
                    certainty="secondary"),
        LumberGrade(species="SPF", grade="No.1/No.2", size_class="dimension", fc_psi=1150.0,
                    emin_psi=510_000.0, source="NDS 2018 Supplement Table 4A",
                    certainty="secondary"),
        LumberGrade(species="Hem-Fir", grade="No.2", size_class="dimension", fc_psi=1300.0,
                    emin_psi=470_000.0, source="NDS 2018 Supplement Table 4A",
                    certainty="from memory"),
        LumberGrade(species="DF-L", grade="No.2", size_class="posts_timbers", fc_psi=700.0,
                    emin_psi=470_000.0, source="NDS 2018 Supplement Table 4D",
                    certainty="from memory"),
    )
}

# Size factor CF for Fc, dimension lumber Select Structural to No.3, by nominal width (in).
# NDS 2018 Supplement Table 4A adjustment factors: 2-4 in 1.15, 5-6 in 1.10 (secondary);
# 8 in 1.05, 10-12 in 1.0, 14 in and wider 0.9 (from memory).
SIZE_FACTOR_FC_WIDTHS_IN = (4.0, 6.0, 8.0, 12.0)
SIZE_FACTOR_FC_VALUES = (1.15, 1.10, 1.05, 1.00, 0.90)

"""The bracing gear: brace types, anchor types, one wall's bracing, and the layout designer's
options for walls with no bracing yet."""

from __future__ import annotations

from itertools import pairwise
from typing import Literal

from pydantic import Field, model_validator

from bracing import anchors
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.data_members import DRESSED_SIZES_IN, LUMBER_GRADES, PIPES
from bracing.model.base import (
    BRACE_LIMIT,
    COUNT_LIMIT,
    Angle,
    Force,
    Length,
    Moment,
    Pressure,
    SectionArea,
    Stress,
    Strict,
    Thickness,
)


class BraceType(Strict):
    """A brace as supplied: rated by its maker, a steel pipe (AISC 360-16), sawn lumber (NDS), or
    unrated (its forces are computed, its capacity is not known)."""

    kind: Literal["rated", "pipe", "lumber", "unrated"]
    # rated (adjustable / telescoping): the maker's table of allowable load by length
    lengths: list[Length] = Field(default_factory=list, description="Rated table lengths (ft).")
    loads: list[Force] = Field(default_factory=list, description="Allowable loads (lb).")
    # pipe
    section: str | None = Field(None, description="Pipe size, e.g. 'Pipe 3 STD'.")
    yield_strength: Stress = Field(35000.0, gt=0, description="Fy (psi); A53 Gr. B 35 ksi.")
    knee_brace: bool = Field(False, description="Knee brace at mid-length in the brace's plane.")
    lateral_struts: int = Field(0, ge=0, le=BRACE_LIMIT,
                                description="Out-of-plane struts along the brace.")
    # lumber
    size: str | None = Field(None, description="Nominal size, e.g. '4x4'.")
    species: str = Field("DF-L", description="NDS species group, e.g. 'DF-L', 'SPF'.")
    grade: str = Field("No.2", description="NDS grade, e.g. 'No.2', 'No.1/No.2'.")
    # every kind
    tension_capacity: Force | None = Field(
        None, gt=0, description="Allowable tension of the brace with its end connections (lb); "
                                "rated and lumber braces give it or compression_only.")
    compression_only: bool = Field(
        False, description="The brace works in compression only: wind away from its face is "
                           "held by the wall alone (method notes §4).")
    end_connection: Force | None = Field(
        None, gt=0, description="Rated allowable load of the end fittings (lb).")
    on_hand: int | None = Field(None, ge=0, le=COUNT_LIMIT, description="How many the site has.")

    @model_validator(mode="after")
    def _complete(self):
        self._tension_stated()
        if self.kind == "rated":
            self._rated_table()
        if self.kind == "pipe" and self.section not in PIPES:
            raise ValueError(f"pipe `section` must be one of {', '.join(PIPES)}")
        if self.kind == "lumber":
            self._lumber_known()
        return self

    def _tension_stated(self) -> None:
        """Tension that cannot be computed must be stated (method notes §4): a rated or lumber
        brace's tension_capacity; a pipe's end connection (end_connection or tension_capacity).
        An unrated brace has no capacity either way (flagged as such)."""
        if self.compression_only and self.tension_capacity is not None:
            raise ValueError("compression_only = true and a tension_capacity: give one or the "
                             "other")
        if self.compression_only:
            return
        if self.kind in ("rated", "lumber") and self.tension_capacity is None:
            raise ValueError(f"field tension_capacity: a {self.kind} brace states its "
                             "allowable tension (tension_capacity, lb) or compression_only "
                             "= true")
        if self.kind == "pipe" and self.tension_capacity is None and self.end_connection is None:
            raise ValueError("field end_connection: a pipe brace states the allowable load "
                             "of its end connections (end_connection or tension_capacity, "
                             "lb) or compression_only = true")

    def _rated_table(self) -> None:
        """The maker's table: two or more increasing positive lengths, a positive load each."""
        if len(self.lengths) < 2 or len(self.lengths) != len(self.loads):
            raise ValueError("a rated brace needs `lengths` and `loads` of equal length (2+)")
        if any(b <= a for a, b in pairwise(self.lengths)):
            raise ValueError("rated table `lengths` must increase")
        if self.lengths[0] <= 0:
            raise ValueError("rated table `lengths` must be positive")
        if any(x <= 0 for x in self.loads):
            raise ValueError("rated table `loads` must be positive")

    def _lumber_known(self) -> None:
        """A dressed size and a species and grade of the NDS tables the program holds."""
        if self.size not in DRESSED_SIZES_IN:
            raise ValueError(f"lumber `size` must be one of {', '.join(DRESSED_SIZES_IN)}")
        if not any(k[0] == self.species and k[1] == self.grade for k in LUMBER_GRADES):
            known = sorted({f"{k[0]} {k[1]}" for k in LUMBER_GRADES})
            raise ValueError(f"unknown lumber species/grade; known: {', '.join(known)}")


class AnchorType(Strict):
    """An anchor at either end of a brace: panel insert, slab anchor, helical, deadman, stake,
    or a fastening to an upper-floor deck."""

    kind: Literal[tuple(ANCHOR_KINDS)]  # one entry each in bracing.anchor_kinds
    # insert, stake and deck: the maker's (or the engineer's) allowable ratings at the angle used
    rated_tension: Force | None = Field(None, gt=0, description="Allowable tension (lb).")
    rated_shear: Force | None = Field(None, gt=0, description="Allowable shear (lb).")
    # slab anchor (ACI 318-19 Ch. 17)
    embedment: Thickness | None = Field(None, gt=0, description="h_ef (in).")
    diameter: Thickness | None = Field(None, gt=0, description="d_a (in).")
    cast_in: bool = Field(False, description="Cast-in (headed) or post-installed.")
    category: int = Field(1, ge=1, le=3, description="Post-installed anchor category (ACI 355.2).")
    steel_area: SectionArea | None = Field(None, gt=0, description="A_se,N (in^2).")
    steel_strength: Stress = Field(75000.0, gt=0, description="f_uta (psi).")
    pullout: Force | None = Field(None, gt=0, description="Nominal pullout N_p from the product "
                                  "report (lb); headed: from bearing area.")
    bearing_area: SectionArea | None = Field(None, gt=0, description="Headed anchor A_brg (in^2).")
    slab_thickness: Thickness | None = Field(None, gt=0, description="h_a (in).")
    concrete_strength: Stress | None = Field(None, gt=0, description="Slab f'c on the day (psi).")
    cracked: bool = Field(True, description="Cracked concrete (the default, conservative).")
    edge_distance: Thickness | None = Field(
        None, gt=0, description="Least edge distance the type needs (in); the plan gives the "
                                "real one.")
    # helical (ICC-ES AC358)
    shaft: Literal[tuple(anchors.KT_AC358_PER_FT)] = Field(
        "1.5in_square", description="Helical shaft: gives K_t (ICC-ES AC358) unless "
                                    "torque_factor is set.")
    torque_factor: float | None = Field(None, gt=0, le=100, description="K_t (1/ft); default by "
                                        "the shaft (ICC-ES AC358).")
    factor_of_safety: float = Field(anchors.HELICAL_FACTOR_OF_SAFETY, gt=0, le=10,
                                    description="On K_t T (ICC-ES AC358).")
    installation_torque: Moment | None = Field(
        None, gt=0, description="Final installation torque the crew reaches (ft-lb).")
    # deadman block
    weight: Force | None = Field(None, gt=0, description="Block weight (lb).")
    soil: str | None = Field(
        None, description="Soil under the block: its friction from soil_table (e.g. "
                          "'silty_sand'); without it, friction_coefficient is used.")
    soil_table: Literal[tuple(anchors.FRICTION_TABLES)] = Field(
        "IBC", description="'IBC' Table 1806.2 (allowable) or 'NAVFAC' DM-7.02 Table 1 "
                           "(ultimate).")
    friction_coefficient: float = Field(
        anchors.FRICTION_CONCRETE_ON_CONCRETE, gt=0, le=1.0,
        description="Block on slab 0.6 (ACI 318-19 §22.9.4.2); on soil give `soil`.")
    friction_basis: Literal["allowable", "ultimate"] = Field(
        "ultimate", description="'allowable' for IBC Table 1806.2 values (used as they are); "
                                "'ultimate' for NAVFAC DM-7.02 or concrete on concrete (a "
                                "factor of safety of 1.5 applies).")
    length: Length | None = Field(None, gt=0, description="Block length along the brace (ft); "
                                                          "with pin_height, its overturning is "
                                                          "checked.")
    pin_height: Length | None = Field(None, ge=0, description="Brace foot pin above the block's "
                                                              "base (ft).")
    pin_from_toe: Length | None = Field(None, ge=0, description="Brace foot pin from the block's "
                                                                "toe, its edge nearer the wall, "
                                                                "in plan (ft); default mid-length.")
    width: Length | None = Field(None, gt=0, description="Block width across the brace (ft); "
                                                         "with allowable_bearing, the pressure "
                                                         "under it is checked.")
    allowable_bearing: Pressure | None = Field(None, gt=0, description="Allowable bearing under "
                                                                       "the block (psf), e.g. IBC "
                                                                       "Table 1806.2.")
    on_hand: int | None = Field(None, ge=0, le=COUNT_LIMIT, description="How many the site has.")

    @model_validator(mode="after")
    def _complete(self):
        missing = [k for k in ANCHOR_KINDS[self.kind].needs if getattr(self, k) is None]
        if missing:
            raise ValueError(f"a {self.kind} anchor needs {', '.join(missing)}")
        if self.torque_factor is None:
            self.torque_factor = anchors.KT_AC358_PER_FT[self.shaft]
        if self.soil is not None:
            if {"friction_coefficient", "friction_basis"} & self.model_fields_set:
                raise ValueError("give soil or friction_coefficient, not both")
            values = anchors.FRICTION_TABLES[self.soil_table][0]
            if self.soil not in values:
                raise ValueError(f"soil {self.soil!r} is not in the {self.soil_table} table; "
                                 f"known: {', '.join(values)}")
            self.friction_coefficient, self.friction_basis = anchors.soil_friction(
                self.soil, self.soil_table)
        if (self.length is None) != (self.pin_height is None):
            raise ValueError("a deadman's overturning needs both length and pin_height")
        if self.pin_from_toe is not None and (self.length is None
                                              or self.pin_from_toe > self.length):
            raise ValueError("pin_from_toe must lie within the block's length")
        if (self.width is None) != (self.allowable_bearing is None) or (
                self.width is not None and self.length is None):
            raise ValueError("the bearing under a deadman needs width and allowable_bearing, "
                             "with length and pin_height")
        return self


class Bracing(Strict):
    """How one wall is braced: count, positions, insert height, foot distance, hardware."""

    brace_type: str = Field(description="A key of [brace_types].")
    wall_anchor: str | None = Field(None, description="Anchor on the wall: a key of "
                                                       "[anchor_types] (an insert).")
    foot_anchor: str | None = Field(None, description="Anchor at the brace foot: a key of "
                                                       "[anchor_types].")
    count: int = Field(ge=1, le=BRACE_LIMIT)
    insert_height: Length = Field(gt=0, le=200, description="Above the wall's base (ft).")
    anchor_distance: Length | None = Field(None, gt=0, le=1000,
                                           description="Foot from the wall face (ft).")
    angle: Angle | None = Field(None, gt=0, lt=90, description="From horizontal (deg).")
    positions: list[Length] = Field(
        default_factory=list, description="From the wall's left edge (ft); default: the "
                                          "centers of equal strips.")
    insert_offset: Thickness = Field(0.0, ge=0, description="Brace pin out from the face (in).")
    foot_offset: Thickness = Field(0.0, ge=0, description="Foot pin above the slab (in).")
    base_below_slab: Length = Field(0.0, ge=0, description="Wall base below the slab the "
                                                           "braces stand on (ft).")
    lean: Thickness = Field(0.25, ge=0, description="Erection out-of-plumb at the top (in).")
    slop: Thickness = Field(0.125, ge=0, description="Brace slop at the insert (in).")
    pretensioned: bool = Field(False, description="Braces pre-tensioned to share evenly.")
    stiff_member: bool = Field(
        False, description="A continuous stiff member (strongback or waler) ties the braces "
                           "of a masonry or framed wall together: they then share the wind "
                           "as on a rigid panel, with the twist. Without one each brace "
                           "carries its own strip of wall.")

    @model_validator(mode="after")
    def _geometry(self):
        if (self.anchor_distance is None) == (self.angle is None):
            raise ValueError("give exactly one of anchor_distance or angle")
        if self.positions and len(self.positions) != self.count:
            raise ValueError(f"{len(self.positions)} positions for {self.count} braces")
        if len(set(self.positions)) < len(self.positions):
            raise ValueError("two braces at the same position")
        rise = self.insert_height - self.base_below_slab - self.foot_offset / 12.0
        if rise <= 0:
            raise ValueError("insert_height is not above the brace foot (base_below_slab and "
                             "foot_offset leave no rise)")
        if self.anchor_distance is not None and self.anchor_distance <= self.insert_offset / 12.0:
            raise ValueError("anchor_distance is not beyond the insert_offset: the brace has no "
                             "run")
        return self


class DesignOptions(Strict):
    """What the layout designer may use for walls that have no bracing yet."""

    brace_types: list[str] = Field(min_length=1, description="Keys of [brace_types] to try.")
    wall_anchor: str | None = Field(None, description="Insert on the wall: a key of "
                                                       "[anchor_types].")
    foot_anchors: list[str] = Field(default_factory=list,
                                    description="Keys of [anchor_types] to try at the foot.")
    most_braces: int = Field(6, ge=1, le=BRACE_LIMIT, description="Most braces allowed per wall.")
    room: Length | None = Field(None, gt=0, description="Most distance from the wall face to "
                                                        "a brace foot (ft).")
    insert_offset: Thickness = Field(0.0, ge=0, description="Brace pin out from the face (in).")
    foot_offset: Thickness = Field(0.0, ge=0, description="Foot pin above the slab (in).")

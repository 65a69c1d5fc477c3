"""Wall materials shared by the braced-wall and layout tests."""

MATERIALS = {
    "concrete": {"kind": "concrete", "unit_weight": 150.0,  # ASCE 7 Table C3.1-2, from memory
                 "compressive_strength": 3000.0},
    "masonry": {"kind": "masonry", "face_weight": 36.0},  # 8 in hollow CMU, HUD RSDG, secondary
    "framed": {"kind": "framed", "face_weight": 6.0},  # 2x4 sheathed, HUD RSDG, secondary
}
THICKNESS_IN = {"concrete": 7.25, "masonry": 7.625, "framed": 4.5}

"""ACI 318-19 Chapter 17, checked against the values in references.md (text, verbatim in a
published design guide): cast-in anchor, h_ef 6 in, f'c 4000 psi, cracked concrete."""

import pytest

from bracing.anchors import (
    FRICTION_CONCRETE_ON_CONCRETE,
    PHI_CAST_IN,
    basic_breakout_tension,
    projected_area_tension,
    psi_c_n,
    psi_ed_n,
    reference_area_tension,
    tension_breakout,
)
from bracing.verification import ACI_EXAMPLE, published

HEF_IN, FC_PSI, EDGE_IN = (ACI_EXAMPLE[k] for k in ("hef_in", "fc_psi", "edge_in"))


def test_basic_breakout():
    # ACI 318-19 Eq. 17.6.2.2.1, kc 24: N_b = 22,308 lb (text), tolerance 0.1 %
    assert basic_breakout_tension(HEF_IN, FC_PSI) == pytest.approx(published("aci-nb"), rel=0.001)


def test_reference_area():
    # ACI 318-19 Eq. 17.6.2.1.4: A_Nco = 9 h_ef^2 = 324 in2 (text)
    assert reference_area_tension(HEF_IN) == pytest.approx(published("aci-anco"))


def test_projected_area_one_edge():
    # one edge at 6 in: A_Nc = 270 in2 (text)
    assert projected_area_tension(HEF_IN, c1_in=EDGE_IN) == pytest.approx(published("aci-anc"))


def test_edge_factor():
    # ACI 318-19 Eq. 17.6.2.4.1b: psi_ed,N = 0.90 at c_a,min 6 in (text)
    assert psi_ed_n(EDGE_IN, HEF_IN) == pytest.approx(published("aci-psi-ed"))


def test_cracking_factor():
    # ACI 318-19 §17.6.2.5: psi_c,N 1.0 cracked, 1.25 cast-in / 1.4 post-installed uncracked (text)
    assert psi_c_n(cracked=True) == 1.0
    assert psi_c_n(cracked=False, cast_in=True) == 1.25
    assert psi_c_n(cracked=False, cast_in=False) == 1.4


def test_breakout_one_edge_cracked():
    # ACI 318-19 Eq. 17.6.2.1a: N_cb = 16,731 lb, one edge at 6 in, cracked (text), tol 0.1 %
    assert tension_breakout(HEF_IN, FC_PSI, c1_in=EDGE_IN) == pytest.approx(
        published("aci-ncb"), rel=0.001)


def test_phi_cast_in_condition_b():
    # ACI 318-19 Table 17.5.3: phi 0.70 cast-in breakout without supplementary reinforcement
    # (text)
    assert PHI_CAST_IN == published("aci-phi-cast-in")  # 0.70


def test_concrete_on_concrete_friction():
    # ACI 318-19 Table 22.9.4.2: mu = 0.6 lambda, hardened concrete not roughened (from memory)
    assert FRICTION_CONCRETE_ON_CONCRETE == 0.6

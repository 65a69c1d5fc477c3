"""Helical anchors by torque correlation, ICC-ES AC358 (secondary): Q_u = K_t T, FS 2."""

import pytest
from braced_foot import foot_capacities

from bracing.anchors import KT_AC358_PER_FT, helical_capacity, required_torque


def test_ultimate_from_torque():
    # ICC-ES AC358: K_t 10 /ft x 5,000 ft-lb = 50,000 lb ultimate (secondary)
    assert helical_capacity(5000.0, 10.0, factor_of_safety=1.0) == pytest.approx(50_000.0)


def test_allowable_at_fs_2():
    # ICC-ES AC358: 50,000 lb / FS 2 = 25,000 lb allowable (secondary)
    assert helical_capacity(5000.0) == pytest.approx(25_000.0)


def test_required_torque():
    # ICC-ES AC358: T = FS P / K_t = 2 x 25,000 / 10 = 5,000 ft-lb (secondary)
    assert required_torque(25_000.0) == pytest.approx(5000.0)


def test_kt_values():
    # ICC-ES AC358: 1.5 in square shaft 10 /ft (secondary); 2-7/8 in round 9, 3-1/2 in round 7
    # (from memory)
    assert KT_AC358_PER_FT == {"1.5in_square": 10.0, "2.875in_round": 9.0, "3.5in_round": 7.0}


@pytest.mark.parametrize(("shaft", "expected"), [(None, 10_000.0), ("2.875in_round", 9_000.0),
                                                 ("3.5in_round", 7_000.0)])
def test_the_engine_reads_kt_by_shaft(shaft, expected):
    # ICC-ES AC358: K_t T / FS at T = 2,000 ft-lb, FS 2: 1.5 in square (the default) 10 /ft
    # -> 10,000 lb (secondary); 2-7/8 in round 9 /ft -> 9,000 lb; 3-1/2 in round 7 /ft
    # -> 7,000 lb (from memory)
    anchor = {"kind": "helical", "installation_torque": 2000.0}
    if shaft:
        anchor["shaft"] = shaft
    bs = foot_capacities(anchor)
    assert bs.foot_tension[0] == pytest.approx(expected)
    assert bs.torque_safety[0] == 2.0  # ICC-ES AC358 factor of safety 2 (secondary)

"""Sections compared with an independent mesh-based section library.

Source: *sectionproperties* (MIT licence, PyPI, version 3.x), an open-source
finite-element cross-section analysis library, used here as a second independent reference.
Its geometric properties integrate the mesh exactly for polygons, so straight-sided shapes agree
to rounding; fillets use the same chord count on both sides. Note the library's naming:
``get_z()`` returns the *elastic* moduli and ``get_s()`` the *plastic* moduli -- the reverse of
the US symbols (S elastic, Z plastic) calcpack uses. It is a test dependency (the ``test``
extra in pyproject.toml), which CI installs.
"""

from __future__ import annotations

import pytest
import sectionproperties.analysis as sp_analysis
import sectionproperties.pre.library as sp_library

from calcpack.sections import (
    Angle,
    Channel,
    HollowCircle,
    ISection,
    Rectangle,
    RectangularHollow,
    Tee,
    composite,
)
from calcpack.units import ureg

mm = ureg.mm
N_R = 25  # points per fillet arc in the library = 24 chords, as calcpack's FILLET_SEGMENTS


def _analyse(geometry, mesh=50.0, warping=False):
    geometry.create_mesh(mesh_sizes=[mesh])
    sec = sp_analysis.Section(geometry)
    sec.calculate_geometric_properties()
    sec.calculate_plastic_properties()
    if warping:
        sec.calculate_warping_properties()
    return sec


def _compare(props, sec, rel):
    ixx, iyy, ixy = sec.get_ic()
    zxx_top, zxx_bot, zyy_right, zyy_left = sec.get_z()  # elastic moduli in this library
    sxx, syy = sec.get_s()  # plastic moduli in this library
    got = {
        "A": props.A.to("mm**2").magnitude,
        "Ix": props.Ix.to("mm**4").magnitude,
        "Iy": props.Iy.to("mm**4").magnitude,
        "Sx_top": props.Sx_top.to("mm**3").magnitude,
        "Sx_bottom": props.Sx_bottom.to("mm**3").magnitude,
        "Sy_left": props.Sy_left.to("mm**3").magnitude,
        "Sy_right": props.Sy_right.to("mm**3").magnitude,
        "Zx": props.Zx.to("mm**3").magnitude,
        "Zy": props.Zy.to("mm**3").magnitude,
    }
    want = {
        "A": sec.get_area(),
        "Ix": ixx,
        "Iy": iyy,
        "Sx_top": zxx_top,
        "Sx_bottom": zxx_bot,
        "Sy_left": zyy_left,
        "Sy_right": zyy_right,
        "Zx": sxx,
        "Zy": syy,
    }
    for key in got:
        assert got[key] == pytest.approx(want[key], rel=rel), key
    scale = max(abs(ixx), abs(iyy))
    assert props.Ixy.to("mm**4").magnitude == pytest.approx(ixy, abs=rel * scale)


def test_rolled_i_with_root_fillets():
    props = ISection(d=300 * mm, bf=150 * mm, tf=10.7 * mm, tw=7.1 * mm, r=15 * mm).properties()
    sec = _analyse(sp_library.i_section(d=300, b=150, t_f=10.7, t_w=7.1, r=15, n_r=N_R))
    _compare(props, sec, rel=1e-6)  # same polygons; the library's plastic search tolerance


def test_unequal_angle_principal_axes():
    props = Angle(d=100 * mm, b=75 * mm, t=8 * mm, r=8 * mm).properties()
    sec = _analyse(sp_library.angle_section(d=100, b=75, t=8, r_r=8, r_t=0, n_r=N_R), mesh=20)
    _compare(props, sec, rel=1e-6)
    i11, i22 = sec.get_ip()
    assert props.I1.to("mm**4").magnitude == pytest.approx(i11, rel=1e-9)
    assert props.I2.to("mm**4").magnitude == pytest.approx(i22, rel=1e-9)
    # the library reports the angle of the 11 axis in (-180°, 180°]; compare modulo 180°
    phi = sec.get_phi() % 180.0
    assert props.theta_p.to("degree").magnitude % 180.0 == pytest.approx(phi, abs=1e-6)


def test_channel_and_tee():
    props = Channel(d=200 * mm, bf=75 * mm, tf=11 * mm, tw=8 * mm, r=11 * mm).properties()
    sec = _analyse(sp_library.channel_section(d=200, b=75, t_f=11, t_w=8, r=11, n_r=N_R))
    _compare(props, sec, rel=1e-6)
    props = Tee(d=150 * mm, bf=150 * mm, tf=12 * mm, tw=9 * mm, r=10 * mm).properties()
    sec = _analyse(sp_library.tee_section(d=150, b=150, t_f=12, t_w=9, r=10, n_r=N_R))
    _compare(props, sec, rel=1e-6)


def test_rectangular_hollow_with_corner_radii():
    props = RectangularHollow(b=100 * mm, d=200 * mm, t=8 * mm, r=16 * mm).properties()
    sec = _analyse(
        sp_library.rectangular_hollow_section(d=200, b=100, t=8, r_out=16, n_r=N_R), mesh=30
    )
    _compare(props, sec, rel=1e-6)


def test_hollow_circle_against_a_fine_polygon():
    props = HollowCircle(D=168.3 * mm, t=7.1 * mm).properties()
    sec = _analyse(sp_library.circular_hollow_section(d=168.3, t=7.1, n=512), mesh=30)
    # the library's circle is a 512-gon: about 2.5e-5 low in area, 5e-5 in I
    _compare(props, sec, rel=2e-4)


def test_plate_with_a_hole():
    props = composite(
        Rectangle(b=200 * mm, d=100 * mm).at(x=0 * mm, y=0 * mm),
        Rectangle(b=40 * mm, d=30 * mm).hole_at(x=30 * mm, y=50 * mm, anchor="corner"),
    ).properties()
    plate = sp_library.rectangular_section(d=100, b=200)
    hole = sp_library.rectangular_section(d=30, b=40).shift_section(x_offset=30, y_offset=50)
    sec = _analyse(plate - hole)
    _compare(props, sec, rel=1e-6)


def test_thin_walled_torsion_and_warping_constants_of_a_plate_girder():
    s = ISection(d=300 * mm, bf=150 * mm, tf=10 * mm, tw=7 * mm)
    props = s.properties()
    sec = _analyse(sp_library.i_section(d=300, b=150, t_f=10, t_w=7, r=0, n_r=1), mesh=10,
                   warping=True)  # fmt: skip
    # Σ b t³/3 against the finite-element Saint-Venant J: 3 % (thin-walled approximation,
    # 1.9 % high here since it ignores the free-edge loss and the junctions)
    assert props.J.to("mm**4").magnitude == pytest.approx(sec.get_j(), rel=0.03)
    # Cw = Iy h0²/4 against the finite-element warping constant: 1 % (thin-walled theory)
    assert props.Cw.to("mm**6").magnitude == pytest.approx(sec.get_gamma(), rel=0.01)

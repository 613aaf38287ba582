"""Calc sheet: properties of a built-up section (plates and catalog shapes placed freely), for the record.

Engines: :class:`calckit.sections.BuiltUp` (exact areas, moments, plastic moduli, Q at any cut) and
:func:`calckit.steel` (yield strength by thickness). The sheet shows the parts, a drawing to scale, every
property, and the yield and plastic moments; the results payload carries every number.
"""
from __future__ import annotations

from typing import Any, Mapping

from .common import CalcSheet

__all__ = ["BuiltUpSheet", "build_section", "PROPERTY_ROWS"]

_REF = "calckit.sections: exact integrals over the parts"
#: (field of SectionProps, symbol, dimension, label)
PROPERTY_ROWS = (
    ("A", "A", "area", "area"),
    ("mass", "m", "mass_per_length", "mass per length at 7850 kg/m3"),
    ("d", "d", "length", "overall depth"),
    ("y_c", "y_c", "length", "elastic neutral axis above the bottom fibre"),
    ("Ix", "I_x", "inertia", "second moment, major axis"),
    ("Sx_top", "S_x_top", "modulus", "elastic modulus to the top fibre"),
    ("Sx_bot", "S_x_bot", "modulus", "elastic modulus to the bottom fibre"),
    ("y_pna", "y_pna", "length", "plastic neutral axis above the bottom fibre"),
    ("Zx", "Z_x", "modulus", "plastic modulus, major axis"),
    ("rx", "r_x", "length", "radius of gyration, major axis"),
    ("Iy", "I_y", "inertia", "second moment, minor axis"),
    ("Sy", "S_y", "modulus", "elastic modulus, minor axis"),
    ("Zy", "Z_y", "modulus", "plastic modulus, minor axis"),
    ("ry", "r_y", "length", "radius of gyration, minor axis"),
    ("J", "J", "inertia", "St Venant torsion constant (welded parts as one solid)"),
    ("Cw", "C_w", "warping", "warping constant (from the warping function)"),
    ("y_s", "y_s", "length", "shear centre above the bottom fibre"),
    ("Q_na", "Q_NA", "modulus", "first moment of the area above the elastic NA"),
)


def build_section(p: Mapping[str, Any]):
    """The BuiltUp section of the parameters ``parts`` and a list of (label, part section, t_max)."""
    from .. import section as catalog_section
    from ..sections import BuiltUp, Plate

    placed, info = [], []
    for i, part in enumerate(p["parts"]):
        shape = str(part["shape"])
        label = part.get("name") or f"part {i + 1}"
        if shape.lower() == "plate":
            if part.get("b") is None or part.get("t") is None:
                from ..errors import InputError

                raise InputError(f"parts item {i + 1} ({label}): a plate needs b and t")
            sec = Plate(part["b"], part["t"], name=label)
            t_max = min(sec.si.bf_top, sec.si.d)
        else:
            sec = catalog_section(shape)
            t_max = max(sec.si.tf_top, sec.si.tf_bot, sec.si.tw)
        placed.append((sec, part["x"], part["y"]))
        info.append((label, shape, sec, t_max))
    return BuiltUp(placed, name=p["member"]), info


class BuiltUpSheet(CalcSheet):
    calc = "section_properties"
    title = "Built-up section properties"

    def __init__(self, p):
        super().__init__(p)
        from .. import steel

        self.section, self.info = build_section(self.p)
        self.steel = steel(self.p["grade"])
        self.t_max = max(t for *_, t in self.info)
        self.fy = self.steel.fy_si(self.t_max)
        self.part("parts", self._parts)
        self.part("figure", self._figure)
        self.part("properties", self._properties)
        self.part("moments", self._moments)
        self.part("summary", self._summary)

    def standard_text(self) -> str:
        return "section properties (no design standard)"

    def _parts(self):
        from ..render import Table
        from ..units import convert, display_unit

        u = display_unit("length", self.system)
        ua = display_unit("area", self.system)
        rows = []
        for (label, shape, sec, _), part in zip(self.info, self.p["parts"]):
            size = (f"{part['b']} x {part['t']}" if shape.lower() == "plate" else sec.name)
            rows.append([label, "plate" if shape.lower() == "plate" else "rolled shape", size, part["x"],
                         part["y"], f"{convert(sec.si.A, 'area', ua):.4g} {ua.replace('**2', '²')}"])
        return [Table(["Part", "Kind", "Size", "x (left)", "y (bottom)", "Area"], rows,
                      caption=f"Parts, placed by the lower-left corner of each bounding box ({u})")]

    def _figure(self):
        from .svgplot import SvgFigure, section_svg

        return [SvgFigure(section_svg(self.section, self.system, self.p["member"]),
                          caption="Section to scale: elastic NA solid, plastic NA dashed", width="480px")]

    def property_steps(self):
        from ..render import given

        s = self.section.si
        tor = getattr(self.section, "torsion", None)
        if tor is None:
            ref_t = _REF
        elif tor.method.startswith("finite volumes"):
            ref_t = (f"calckit.sections.torsion: finite volumes on {tor.cells} cells, Prandtl stress function "
                     "and warping function (Pilkey, Analysis and Design of Elastic Beams, 2002, ch. 6)")
        else:
            ref_t = tor.method
        return [given(sym, getattr(s, f), dim, reference=ref_t if f in ("J", "Cw", "y_s", "x_s") else _REF,
                      label=label) for f, sym, dim, label in PROPERTY_ROWS]

    def _properties(self):
        from ..render import Section

        return [Section("Section properties", self.property_steps(), number="1", system=self.system)]

    def moment_steps(self):
        from ..render import given

        s = self.section.si
        fy = given("f_y", self.fy, "stress", reference=f"{self.steel.name}, thickness "
                   f"{self.t_max * 1e3:.1f} mm ({self.steel.source})")
        My = _MY.step(f_y=fy, S_x=s.Sx)
        Mp = _MP.step(f_y=fy, Z_x=s.Zx)
        shape = _SF.step(M_p=Mp, M_y=My)
        return [fy, My, Mp, shape]

    def _moments(self):
        from ..render import Section

        return [Section("Yield and plastic moments", self.moment_steps(), number="2", system=self.system)]

    def _summary(self):
        from ..render import Summary

        return [Summary([], title="Properties for the record", header=self.header(),
                        steps=self.property_steps() + self.moment_steps(), system=self.system)]


def _formulas():
    from ..render import Formula

    my = Formula("M_y", "f_y*S_x", ref="first yield of the extreme fibre (elastic beam theory)",
                 label="yield moment", dims={"M_y": "moment", "f_y": "stress", "S_x": "modulus"})
    mp = Formula("M_p", "f_y*Z_x", ref="fully plastic section (simple plastic theory)", label="plastic moment",
                 dims={"M_p": "moment", "f_y": "stress", "Z_x": "modulus"})
    sf = Formula("k", "M_p/M_y", ref="shape factor", label="shape factor", dims={"M_p": "moment", "M_y": "moment"})
    return my, mp, sf


_MY, _MP, _SF = _formulas()

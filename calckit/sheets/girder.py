"""Calc sheet: a welded plate girder (simply supported), e.g. a transfer girder under column loads.

Engines: :class:`calckit.sections.PlateGirder`, the analysis of :mod:`calckit.analysis`, classification,
flexure and shear (with the transverse stiffener spacing) of :mod:`calckit.design.aisc360` or
:mod:`calckit.design.en1993`, and the flange-to-web welds from the shear flow VQ/I along the span
(:func:`calckit.design.shear_flow.design_flange_welds`).
"""
from __future__ import annotations

import math

from ..units import fmt
from .beam import BeamSheet
from .design import is_rated, to_render

__all__ = ["GirderSheet"]


class GirderSheet(BeamSheet):
    calc = "plate_girder"
    title = "Welded plate girder"
    deflection_number = "8"

    def register_parts(self):
        for name, fn in (("loads", self._loads), ("analysis", self._analysis),
                         ("proportions", self._proportions), ("classification", self._classification),
                         ("bending", self._bending), ("shear", self._shear), ("bearing", self._bearing),
                         ("welds", self._welds),
                         ("deflection", self._deflection), ("summary", self._summary)):
            self.part(name, fn)

    def make_section(self):
        from ..sections import PlateGirder

        p = self.p
        return PlateGirder(d=p["d"], tw=p["tw"], bf_top=p["bf_top"], tf_top=p["tf_top"], bf_bot=p["bf_bot"],
                           tf_bot=p["tf_bot"], weld=p["weld"], name=self.p["member"])

    def model_params(self) -> dict:
        return dict(self.p, spans=[self.p["span"]], supports=["pin", "roller"])

    @property
    def a(self) -> float | None:
        """Clear spacing of intermediate stiffeners (m), None when there are none."""
        from ..units import to_si

        a = to_si(self.p["stiffener_spacing"], "length")
        return a if a > 0 else None

    # -- parts ------------------------------------------------------------------------------------
    def _proportions(self):
        from ..render import Section, given

        s = self.section.si
        ref = "calckit.sections (welded plates)"
        recs = [given("d", s.d, "length", reference=ref), given("h_w", s.hw, "length", reference=ref,
                                                                   label="web depth between flanges"),
                given("t_w", s.tw, "length", reference=ref),
                given("b_f_top", s.bf_top, "length", reference=ref), given("t_f_top", s.tf_top, "length", reference=ref),
                given("b_f_bot", s.bf_bot, "length", reference=ref), given("t_f_bot", s.tf_bot, "length", reference=ref),
                given("A", s.A, "area", reference=ref), given("y_c", s.y_c, "length", reference=ref,
                                                               label="elastic NA above the bottom fibre"),
                given("I_x", s.Ix, "inertia", reference=ref), given("S_x_top", s.Sx_top, "modulus", reference=ref),
                given("S_x_bot", s.Sx_bot, "modulus", reference=ref), given("Z_x", s.Zx, "modulus", reference=ref),
                given("I_y", s.Iy, "inertia", reference=ref), given("J", s.J, "inertia", reference=ref),
                given("C_w", s.Cw, "warping", reference=ref), given("m", s.mass, "mass_per_length", reference=ref),
                given("h_w_t_w", s.hw / s.tw, "ratio", reference="web slenderness (plate proportions)",
                      latex=r"h_{w}/t_{w}"),
                given("a", self.a or 0.0, "length", reference="parameter stiffener_spacing (0: no intermediate "
                      "stiffeners)")]
        if self.a:
            recs.append(given("a_h_w", self.a / s.hw, "ratio", reference="panel aspect ratio", latex=r"a/h_{w}"))
        out = [Section("Plate proportions and section properties", recs, number="3", system=self.system)]
        from .svgplot import SvgFigure, section_svg

        out.append(SvgFigure(section_svg(self.section, self.system, self.p["member"]),
                             caption="Girder section to scale", width="480px"))
        return out

    def _classification(self):
        from ..render import Section

        if self.aisc:
            from ..design.aisc360.classify import classify

            c = classify(self.section, self.steel)
            intro = f"Flange {c.flange}, web {c.web} for flexure (AISC 360-22 Table B4.1b)."
        else:
            from ..design.en1993.classify import classify

            c = classify(self.section, self.steel)
            intro = (f"Compression flange Class {c.flange_class}, web Class {c.web_class}: section Class "
                     f"{c.cls} (EN 1993-1-1 Table 5.2).")
        return [Section("Classification of the plates", list(c.steps), number="4", intro=intro,
                        system=self.system)]

    @staticmethod
    def _part_of(r) -> str:
        """Which part of the sheet shows a design result: "bearing" (concentrated forces on the web and
        bearing stiffeners), "shear" (web shear, intermediate stiffeners) or "bending"."""
        ls = r.limit_state.lower()
        if ls.startswith(("concentrated force", "bearing stiffener", "transverse force")):
            return "bearing"
        if "shear" in ls or "stiffener" in ls:
            return "shear"
        return "bending"

    def _is_shear(self, r) -> bool:
        return self._part_of(r) == "shear"

    def _bending(self):
        from ..render import Section

        from .design import compact_repeats

        bend = compact_repeats([r for r in self.design_results() if self._part_of(r) == "bending"], self.system)
        recs = [to_render(r, self.system) for r in bend]
        return [Section("Bending", recs, number="5", system=self.system)]

    def _shear(self):
        from ..render import Section

        from .design import compact_repeats

        shear = compact_repeats([r for r in self.design_results() if self._is_shear(r)], self.system,
                                what="panel")
        recs = [to_render(r, self.system) for r in shear]
        intro = (f"Intermediate transverse stiffeners at a = {fmt(self.a, 'span', self.system)}." if self.a else
                 "No intermediate transverse stiffeners (stiffeners at the supports only).")
        return [Section("Shear, with the transverse stiffener spacing", recs, number="6", intro=intro,
                        system=self.system)]

    def _bearing(self):
        from ..render import Section

        from .design import compact_repeats

        res = [r for r in self.design_results() if self._part_of(r) == "bearing"]
        if not res:
            return [Section("Concentrated forces on the web", [], number="6a", system=self.system,
                            intro="No bearing length given (framed end connections): the web is not checked "
                                  "for concentrated forces. Give bearing_length (and the point loads' bearing) "
                                  "where the girder bears on its supports or carries loads on a flange.")]
        recs = [to_render(r, self.system) for r in compact_repeats(res, self.system)]
        return [Section("Concentrated forces on the web and bearing stiffeners", recs, number="6a",
                        system=self.system)]

    def weld_design(self):
        if "_welds_d" not in self.__dict__:
            from ..design.shear_flow import design_flange_welds

            leg = self.section.si.weld
            if self.aisc:
                kw = dict(standard="AISC 360-22", method=self.method, electrode=self.p["electrode"], size=leg)
            else:
                kw = dict(standard="EN 1993-1-8", method="simplified", size=leg / math.sqrt(2.0))
            self._welds_d = design_flange_welds(self.section, self.env, steel=self.steel, **kw)
        return self._welds_d

    def _welds(self):
        from ..render import Section

        wd = self.weld_design()
        recs = []
        for j in wd.junctions:
            if j.check is not None:
                recs.append(to_render(j.check, self.system))
        size = ("fillet leg w" if self.aisc else f"throat a = leg / sqrt(2) of the {self.p['weld']} leg")
        intro = f"Two fillet welds per junction ({size}); shear flow q = V Q / I_x along the span. " + \
            " ".join(wd.notes)
        return [Section("Flange-to-web welds", recs, number="7", intro=intro.strip(), system=self.system)]

    def design_results(self) -> list:
        if "_design" not in self.__dict__:
            from . import design as D

            self._design = D.girder_checks(self)
        return self._design

    def strength_checks(self) -> list:
        wd = self.weld_design()
        return [to_render(c, self.system) for c in self.design_results() if is_rated(c)] + [to_render(j.check, self.system) for j in wd.junctions
                                                                 if j.check is not None]

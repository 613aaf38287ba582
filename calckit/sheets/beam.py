"""Calc sheet: a rolled steel beam, simple, continuous or cantilever.

Engines: :class:`calckit.analysis.Beam` (exact V, M, deflection per load case), the code combinations and
pattern-loading envelopes of :mod:`calckit.analysis`, section properties (:mod:`calckit.sections`), the
stress profile (:mod:`calckit.design.stress`) and the member checks of :mod:`calckit.design.aisc360`
(AISC 360-22, LRFD or ASD, combinations of ASCE 7-22) or :mod:`calckit.design.en1993` (EN 1993-1-1,
combinations of EN 1990).
"""
from __future__ import annotations

from .common import CalcSheet
from ..units import fmt
from .design import brace_points, is_aisc, is_rated, to_render

__all__ = ["BeamSheet", "build_beam", "CASE_TEXT"]

CASE_TEXT = {"D": "dead (self-weight and superimposed)", "L": "live (imposed)", "Lr": "roof live",
             "S": "snow"}
_UDL = {"D": "dead_udl", "L": "live_udl", "Lr": "roof_live_udl", "S": "snow_udl"}


def build_beam(p: dict, section, steel):
    """The analysis model of the parameters: spans, supports, loads by case (SI inside)."""
    from ..analysis import Beam
    from ..units import to_si

    beam = Beam(p["spans"], p["supports"], section=section, steel=steel, name="")
    if p.get("self_weight", True):
        beam.self_weight(section, "D")
    for case, key in _UDL.items():
        if to_si(p.get(key, 0), "line_load", key) != 0:
            beam.udl(p[key], case)
    for pl in p.get("point_loads") or []:
        beam.point(pl["P"], pl["x"], pl["case"])
    return beam


class BeamSheet(CalcSheet):
    calc = "steel_beam"
    title = "Steel beam"

    def __init__(self, p):
        super().__init__(p)
        from .. import steel as get_steel

        self.aisc = is_aisc(self.p["standard"])
        self.method = self.p["method"] if self.aisc else "EN"
        self.section = self.make_section()
        self.steel = get_steel(self.p["grade"])
        self.beam = build_beam(self.model_params(), self.section, self.steel)
        self.solution = self.beam.solve()
        self.cases = list(self.beam.cases)
        self._combinations()
        self.env = self.solution.envelope(self.strength)
        self.service_env = {k: self.solution.envelope(cs) for k, cs in self.service.items()}
        nodes = self.beam.layout.nodes
        from ..units import to_si

        self.braces = brace_points(nodes, self.p["bracing"], [to_si(x, "length") for x in self.p["brace_points"]],
                                   kinds=[s.kind for s in self.beam.layout.supports])
        self.register_parts()

    deflection_number = "6"  #: section number of the deflection part (the girder sheet has more parts)

    def register_parts(self):
        for name, fn in (("loads", self._loads), ("analysis", self._analysis), ("section", self._section),
                         ("stress", self._stress), ("checks", self._checks), ("deflection", self._deflection),
                         ("summary", self._summary)):
            self.part(name, fn)

    # -- model ------------------------------------------------------------------------------------
    def make_section(self):
        """The catalog section named in the parameters, or for ``section = "lightest"`` the lightest
        passing one found by :func:`calckit.pick` (the choice and the candidates are recorded in part 3)."""
        from ..pick.report import select_section

        self.selection = select_section(self.p)
        return self.selection.section

    def model_params(self) -> dict:
        return self.p

    @property
    def spans(self) -> list:
        return self.model_params()["spans"]

    @property
    def supports(self) -> list:
        return self.model_params()["supports"]

    def standard_text(self) -> str:
        if self.aisc:
            return f"AISC 360-22 ({self.method}); load combinations ASCE 7-22"
        return "EN 1993-1-1 (recommended values); load combinations EN 1990"

    def _combinations(self):
        """Strength combinations of the standard, and two groups of service combinations for the
        deflection limits: "live" (variable loads alone) and "total" (permanent plus variable)."""
        from ..analysis.combinations import Combination, combinations

        cases = self.cases
        variable = [c for c in cases if c != "D"]
        if self.aisc:
            kind = "strength" if self.method == "LRFD" else "allowable"
            self.strength = combinations("ASCE 7-22", cases, kind)
            svc = combinations("ASCE 7-22", cases, "deflection")
            live = [c for c in svc if set(c.factors) and "D" not in c.factors]
            total = [c for c in svc if "D" in c.factors and len(c.factors) > 1]
        else:
            opts = {"category": self.p["live_category"]}
            if "S" in cases:
                opts["snow"] = "H<=1000m"
            self.strength = combinations("EN 1990", cases, "strength", **opts)
            total = combinations("EN 1990", cases, "characteristic", **opts) if variable else []
            live = [Combination(f"SLS variable action alone: {v}", {v: 1.0}, kind="user",
                                reference="EN 1990 A1.4.3 (deflection from the variable action; common "
                                          "practice)", variable=frozenset({v})) for v in variable]
        self.service = {}
        if live:
            self.service["live"] = live
        if total:
            self.service["total"] = total
        self.limits = {"live": self.p["defl_limit_live"], "total": self.p["defl_limit_total"]}

    # -- parts ------------------------------------------------------------------------------------
    def _loads(self):
        from ..render import Table

        rows = []
        for case in self.cases:
            loads = self.beam.loads_in(case)
            rows.append([case, CASE_TEXT.get(case, case), "; ".join(_describe(ld, self.system) for ld in loads)])
        combos = [[c.name, c.reference] for c in self.strength]
        combos += [[c.name, c.reference] for cs in self.service.values() for c in cs]
        return [Table(["Case", "Meaning", "Loads"], rows, caption="Load cases (the diagrams in part 2 draw "
                                                                  "them)"),
                Table(["Combination", "Reference"], combos, caption="Load combinations")]

    def _analysis(self):
        from ..render import Section, given

        env = self.env
        recs = []
        for i, s in enumerate(env.spans):
            recs.append(given(f"M_max_{i + 1}", s.M_max.value, "moment", reference=s.M_max.combination,
                              label=f"span {i + 1}: largest sagging moment at x = {fmt(s.M_max.x, 'span', self.system)}"))
            if s.M_min.value < -1e-9 * max(abs(s.M_max.value), 1.0):
                recs.append(given(f"M_min_{i + 1}", -s.M_min.value, "moment", reference=s.M_min.combination,
                                  label=f"span {i + 1}: largest hogging moment (magnitude) at x = {fmt(s.M_min.x, 'span', self.system)}"))
            Va = s.V_abs
            recs.append(given(f"V_max_{i + 1}", abs(Va.value), "force", reference=Va.combination,
                              label=f"span {i + 1}: largest shear at x = {fmt(Va.x, 'span', self.system)}"))
        for j, x in enumerate(env.nodes):
            recs.append(given(f"R_{j + 1}", float(env.R_max[j]), "force",
                              reference=env.combinations[int(env.R_max_by[j])],
                              label=f"support {j + 1} at x = {fmt(x, 'span', self.system)}: largest reaction (upward)"))
        from .svgplot import SvgFigure, beam_svg

        closed = self._closed_form()
        return [Section("Analysis: envelope of the strength combinations", recs, number="2",
                        intro=env.method, system=self.system),
                *closed,
                SvgFigure(beam_svg(self.beam, env, self.system),
                          caption="Loads by case; shear, moment and deflection envelopes of the strength "
                                  "combinations (deflection at factored loads, for its shape only)")]

    def header(self):
        h = super().header()
        sel = getattr(self, "selection", None)
        if sel is not None and sel.picked:
            from dataclasses import replace

            inputs = dict(h.inputs)
            text, meaning = inputs.get("section", ("lightest", ""))
            chosen = getattr(sel.section, "designation", sel.name)
            inputs["section"] = (f"{text}: {chosen} chosen (part 3)", meaning)
            h = replace(h, inputs=inputs)
        return h

    def _closed_form(self) -> list:
        """Where the member is a tabulated beam case (one span, full uniform loads or one point load), the
        closed-form formulas of :mod:`calckit.analysis.formulas` for the governing strength combination,
        formulas beside numbers; they must agree with the exact solution shown above."""
        from ..analysis.formulas import detect_standard_case
        from ..render import Formula, Section

        sp = self.env.spans[0] if len(self.env.spans) == 1 else None
        if sp is None:
            return []
        comb = next((c for c in self.strength if c.name == sp.M_max.combination), None)
        if comb is None:
            return []
        found = [(case, f, detect_standard_case(self.beam, case)) for case, f in comb.factors.items()
                 if case in self.cases and f]
        if not found or any(d is None for _, _, d in found) or len({d.case.key for _, _, d in found}) != 1:
            return []
        sc = found[0][2].case
        load = "w" if "w" in sc.inputs else "P"
        if load == "P" and len({round(d.values.get("a", 0.0), 9) for _, _, d in found}) != 1:
            return []
        vals = dict(found[0][2].values)
        vals[load] = sum(f * d.values[load] for _, f, d in found)
        dims = {"w": "line_load", "P": "force", "L": "span", "a": "span", "b": "span", "E": "stress",
                "I": "inertia", "R_1": "force", "R_2": "force", "V_max": "force", "M_max": "moment",
                "M_1": "moment", "M_2": "moment"}
        steps = []
        for key in ("R_1", "R_2", "V_max", "M_1", "M_2", "M_max"):
            eq = sc.equations.get(key)
            if eq is None:
                continue
            names = sorted(str(v) for v in eq.rhs.free_symbols)
            F = Formula(key, str(eq.rhs), dims={k: dims[k] for k in [key, *names]}, ref=sc.reference,
                        label=f"{sc.title}: {key.replace('_', ' ')} {sc.where.get(key, '')}".rstrip())
            steps.append(F.step(**{n: vals[n] for n in names}))
        intro = (f"The member is a tabulated case ({sc.title}); under {comb.name} the load is "
                 f"{load} = {self._fmt_load(vals[load], load)}. The closed-form values below must equal the "
                 f"exact solution above (a check on the analysis).")
        return [Section("Closed-form check of the analysis", steps, number="2a", intro=intro, system=self.system)]

    def _fmt_load(self, v: float, load: str) -> str:
        return fmt(v, "line_load" if load == "w" else "force", self.system)

    def _section(self):
        from ..render import Section, given

        s = self.section.si
        sec = self.section
        label = getattr(sec, "designation", sec.name)
        family = getattr(sec, "family", "")
        if family:
            dims = "EN 10365 (catalog)" if family in ("IPE", "HEA", "HEB") else "ASTM A6 (catalog)"
            ref_dim = f"{label} dimensions, {dims}"
            ref_prop = f"{label}: computed from the dimensions, root fillets included"
        else:
            ref_dim = ref_prop = f"{label} (given dimensions)"
        rows = [("d", "d", "length", "overall depth"), ("b_f", "bf_top", "length", "flange width"),
                ("t_f", "tf_top", "length", "flange thickness"), ("t_w", "tw", "length", "web thickness"),
                ("A", "A", "area", "area"), ("I_x", "Ix", "inertia", "second moment of area, major axis"),
                ("S_x", "Sx", "modulus", "elastic section modulus, major axis"),
                ("Z_x", "Zx", "modulus", "plastic section modulus, major axis"),
                ("I_y", "Iy", "inertia", "second moment of area, minor axis"),
                ("r_y", "ry", "length", "radius of gyration, minor axis"),
                ("J", "J", "inertia", "St Venant torsion constant"), ("C_w", "Cw", "warping", "warping constant"),
                ("h_o", "ho", "length", "distance between flange centroids"),
                ("m", "mass", "mass_per_length", "mass per length (steel 7850 kg/m3)")]
        recs = [given(sym, getattr(s, f), dim, reference=ref_dim if i < 4 else ref_prop, label=label)
                for i, (sym, f, dim, label) in enumerate(rows)]
        st = self.steel
        recs += [given("F_y" if self.aisc else "f_y", st.si.fy, "stress", reference=st.source or st.name,
                       label=f"{st.name}, thinnest band"),
                 given("E", st.si.E, "stress",
                       reference=("AISC 360-22, Symbols: E = 29,000 ksi" if st.standard == "ASTM"
                                  else "EN 1993-1-1:2005 3.2.6(1)"))]
        blocks = [Section(f"Section {label}, steel {st.name}", recs, number="3", system=self.system)]
        sel = getattr(self, "selection", None)
        if sel is not None and sel.picked:
            from ..pick.report import candidates_table
            from ..render import Table, Text

            cols, rows = candidates_table(sel.result, system=self.system)
            blocks = [Text(sel.record), Table(list(cols), [list(r) for r in rows],
                                              caption="Lightest passing candidates (each with its own self-weight)"),
                      *blocks]
        return blocks

    def _stress(self):
        from ..design.stress import stress_profile
        from ..render import Section

        M = self.env.overall("M", "max")
        Mn = self.env.overall("M", "min")
        Mg = M if abs(M.value) >= abs(Mn.value) else Mn
        V = max((s.V_abs for s in self.env.spans), key=lambda e: abs(e.value))
        prof = stress_profile(self.section, Mg.value, abs(V.value))
        intro = (f"Largest moment {Mg.combination} at x = {fmt(Mg.x, 'span', self.system)} and largest shear {V.combination} at "
                 f"x = {fmt(V.x, 'span', self.system)}, shown on one profile (each stress is linear in its own action).")
        from .svgplot import SvgFigure, stress_svg

        return [Section("Stress through the depth", list(prof.steps()), number="4", intro=intro,
                        system=self.system),
                SvgFigure(stress_svg(prof, self.section, self.system),
                          caption="Normal stress (tension +) and shear stress VQ/(I t) through the depth")]

    def design_results(self) -> list:
        """Design CheckResults of the member (from the design engine)."""
        if "_design" not in self.__dict__:
            self._design = _member_checks(self)
        return self._design

    def strength_checks(self) -> list:
        return [to_render(c, self.system) for c in self.design_results() if is_rated(c)]

    def deflection_checks(self) -> list:
        if "_defl" not in self.__dict__:
            from .design import deflection_checks

            self._defl = [to_render(r, self.system) for r in deflection_checks(self)]
        return self._defl

    def _checks(self):
        from ..render import Section

        from .design import compact_repeats

        title = f"Design checks, {self.standard_text()}"
        recs = [to_render(r, self.system) for r in compact_repeats(self.design_results(), self.system)]
        return [Section(title, recs, number="5", system=self.system)]

    def _deflection(self):
        from ..render import Section

        intro = ("Service combinations: " + "; ".join(f"{k}: " + ", ".join(c.name for c in cs)
                                                     for k, cs in self.service.items()) + ".")
        return [Section("Deflection (service loads)", self.deflection_checks(), number=self.deflection_number,
                        intro=intro,
                        system=self.system)]

    def all_checks(self) -> list:
        return self.strength_checks() + self.deflection_checks()

    def _summary(self):
        from ..render import Summary
        from .figures import utilisation_bars

        checks = self.all_checks()
        return [Summary(checks, header=self.header(), system=self.system),
                utilisation_bars([c.name for c in checks], [c.ratio for c in checks])]


def _describe(ld, system: str) -> str:
    from ..units import convert, display_unit

    uL, uw, uP = (display_unit(d, system) for d in ("span", "line_load", "force"))
    if hasattr(ld, "w1"):
        kind = "self-weight" if getattr(ld, "kind", "") == "self_weight" else "uniform"
        return (f"{kind} {convert(ld.w1, 'line_load', uw):.4g} {uw} from {convert(ld.start, 'span', uL):.4g} "
                f"to {convert(ld.end, 'span', uL):.4g} {uL}")
    if hasattr(ld, "P"):
        return f"point {convert(ld.P, 'force', uP):.4g} {uP} at {convert(ld.x, 'span', uL):.4g} {uL}"
    return ld.describe()


def _member_checks(sheet: BeamSheet) -> list:
    """Member checks from the design engine of the chosen standard."""
    from . import design as D

    return D.member_checks(sheet)

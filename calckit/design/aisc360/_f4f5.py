"""AISC 360-22 F4 (compact or noncompact webs, incl. singly symmetric I) and F5 (slender webs).

Equations (AISC 360-16/360-22 numbering, from memory):

F4: Myc = Fy Sxc (F4-4); Rpc = Mp/Myc when hc/tw <= lambda_pw (F4-9a), else
Rpc = [Mp/Myc - (Mp/Myc - 1)(lambda - lambda_pw)/(lambda_rw - lambda_pw)] <= Mp/Myc (F4-9b); Rpc = 1.0 when
Iyc/Iy <= 0.23 (F4-10); Mp = Fy Zx <= 1.6 Fy Sx. Compression flange yielding Mn = Rpc Myc (F4-1).
LTB: Lp = 1.1 rt sqrt(E/Fy) (F4-7); Lr = 1.95 rt (E/FL) sqrt(J/(Sxc ho) + sqrt((J/(Sxc ho))^2 +
6.76 (FL/E)^2)) (F4-8); Mn = Cb [Rpc Myc - (Rpc Myc - FL Sxc)(Lb - Lp)/(Lr - Lp)] <= Rpc Myc (F4-2);
Mn = Fcr Sxc <= Rpc Myc (F4-3), Fcr = Cb pi^2 E/(Lb/rt)^2 sqrt(1 + 0.078 J/(Sxc ho)(Lb/rt)^2) (F4-5), with
J = 0 when Iyc/Iy <= 0.23; rt = bfc / sqrt(12 (1 + aw/6)) (F4-11), aw = hc tw/(bfc tfc) (F4-12).
FLB: Mn = Rpc Myc - (Rpc Myc - FL Sxc)(lambda - lambda_pf)/(lambda_rf - lambda_pf) (F4-13);
Mn = 0.9 E kc Sxc / lambda^2 (F4-14). Tension flange yielding when Sxt < Sxc: Mn = Rpt Myt (F4-15) with
Rpt per F4-16a/b (F4-17: 1.0 when Iyc/Iy <= 0.23).

F5: Rpg = 1 - aw/(1200 + 300 aw)(hc/tw - 5.7 sqrt(E/Fy)) <= 1.0 (F5-6), aw <= 10; compression flange
yielding Mn = Rpg Fy Sxc (F5-1); LTB Mn = Rpg Fcr Sxc (F5-2) with Fcr = Cb [Fy - 0.3 Fy (Lb - Lp)/(Lr - Lp)]
<= Fy (F5-3), Fcr = Cb pi^2 E/(Lb/rt)^2 <= Fy (F5-4), Lp per F4-7, Lr = pi rt sqrt(E/(0.7 Fy)) (F5-5);
FLB Mn = Rpg Fcr Sxc (F5-7) with Fcr = Fy - 0.3 Fy (lambda - lambda_pf)/(lambda_rf - lambda_pf) (F5-8) or
0.9 E kc / lambda^2 (F5-9); tension flange yielding Mn = Fy Sxt when Sxt < Sxc (F5-10).
"""
from __future__ import annotations

from ._core import Calc, Cond, Fm, kind_word

_R = "AISC 360-22"

MYC = Fm("M_yc", "F_y*S_xc", f"{_R} Eq. F4-4", "yield moment in the compression flange")
MP4 = Fm("M_p", "Min(F_y*Z_x, 1.6*F_y*S_x)", f"{_R} F4.1", "plastic moment, Mp = Fy Zx <= 1.6 Fy Sx")
IYC = Cond("I_yc/I_y > 0.23", f"{_R} F4.1", then="Rpc from Eqs. F4-9a/b; J used in F4-5, F4-8",
           otherwise="Rpc = Rpt = 1.0 (Eqs. F4-10, F4-17) and J = 0")
RPC_C = Cond("lam_w <= lam_pw", f"{_R} F4.1", then="hc/tw <= lambda_pw: Eq. F4-9a",
             otherwise="hc/tw > lambda_pw: Eq. F4-9b")
F4_9A = Fm("R_pc", "M_p/M_yc", f"{_R} Eq. F4-9a", "web plastification factor")
F4_9B = Fm("R_pc", "Min(M_p/M_yc - (M_p/M_yc - 1)*((lam_w - lam_pw)/(lam_rw - lam_pw)), M_p/M_yc)",
           f"{_R} Eq. F4-9b", "web plastification factor")
F4_1 = Fm("M_n", "R_pc*M_yc", f"{_R} Eq. F4-1", "compression flange yielding")
AW4 = Fm("a_w", "h_c*t_w/(b_fc*t_fc)", f"{_R} Eq. F4-12", "web-to-compression-flange area ratio")
AW5 = Fm("a_w", "Min(h_c*t_w/(b_fc*t_fc), 10)", f"{_R} Eq. F4-12, aw <= 10 (F5.2)",
         "web-to-compression-flange area ratio")
F4_11 = Fm("r_t", "b_fc/sqrt(12*(1 + a_w/6))", f"{_R} Eq. F4-11", "effective radius of gyration for LTB")
F4_7 = Fm("L_p", "1.1*r_t*sqrt(E/F_y)", f"{_R} Eq. F4-7", "limiting unbraced length for yielding")
F4_8 = Fm("L_r", "1.95*r_t*(E/F_L)*sqrt(J/(S_xc*h_o) + sqrt((J/(S_xc*h_o))**2 + 6.76*(F_L/E)**2))",
          f"{_R} Eq. F4-8", "limiting unbraced length for inelastic LTB")
LB_LP = Cond("L_b <= L_p", f"{_R} F4.2(a) / F5.2", then="the limit state of lateral-torsional buckling does "
             "not apply", otherwise="lateral-torsional buckling applies")
LB_LR = Cond("L_b <= L_r", f"{_R} F4.2(b) / F5.2", then="inelastic lateral-torsional buckling",
             otherwise="elastic lateral-torsional buckling")
F4_2 = Fm("M_n", "Min(C_b*(R_pc*M_yc - (R_pc*M_yc - F_L*S_xc)*((L_b - L_p)/(L_r - L_p))), R_pc*M_yc)",
          f"{_R} Eq. F4-2", "inelastic lateral-torsional buckling")
F4_5 = Fm("F_cr", "C_b*pi**2*E/(L_b/r_t)**2*sqrt(1 + 0.078*J/(S_xc*h_o)*(L_b/r_t)**2)", f"{_R} Eq. F4-5",
          "elastic lateral-torsional buckling stress")
F4_3 = Fm("M_n", "Min(F_cr*S_xc, R_pc*M_yc)", f"{_R} Eq. F4-3", "elastic lateral-torsional buckling")
F4_13 = Fm("M_n", "R_pc*M_yc - (R_pc*M_yc - F_L*S_xc)*((lam_f - lam_pf)/(lam_rf - lam_pf))",
           f"{_R} Eq. F4-13", "compression flange local buckling, noncompact flange")
F4_14 = Fm("M_n", "0.9*E*k_c*S_xc/lam_f**2", f"{_R} Eq. F4-14", "compression flange local buckling, slender")
TFY = Cond("S_xt >= S_xc", f"{_R} F4.4 / F5.4", then="tension flange yielding does not apply",
           otherwise="tension flange yielding applies")
MYT = Fm("M_yt", "F_y*S_xt", f"{_R} F4.4", "yield moment in the tension flange")
F4_16A = Fm("R_pt", "M_p/M_yt", f"{_R} Eq. F4-16a", "web plastification factor, tension flange")
F4_16B = Fm("R_pt", "Min(M_p/M_yt - (M_p/M_yt - 1)*((lam_w - lam_pw)/(lam_rw - lam_pw)), M_p/M_yt)",
            f"{_R} Eq. F4-16b", "web plastification factor, tension flange")
F4_15 = Fm("M_n", "R_pt*M_yt", f"{_R} Eq. F4-15", "tension flange yielding")
F5_6 = Fm("R_pg", "Min(1 - a_w/(1200 + 300*a_w)*(h_c/t_w - 5.7*sqrt(E/F_y)), 1.0)", f"{_R} Eq. F5-6",
          "bending strength reduction factor")
F5_1 = Fm("M_n", "R_pg*F_y*S_xc", f"{_R} Eq. F5-1", "compression flange yielding")
F5_5 = Fm("L_r", "pi*r_t*sqrt(E/(0.7*F_y))", f"{_R} Eq. F5-5", "limiting unbraced length for inelastic LTB")
F5_3 = Fm("F_cr", "Min(C_b*(F_y - 0.3*F_y*((L_b - L_p)/(L_r - L_p))), F_y)", f"{_R} Eq. F5-3",
          "inelastic lateral-torsional buckling stress")
F5_4 = Fm("F_cr", "Min(C_b*pi**2*E/(L_b/r_t)**2, F_y)", f"{_R} Eq. F5-4",
          "elastic lateral-torsional buckling stress")
F5_2 = Fm("M_n", "R_pg*F_cr*S_xc", f"{_R} Eq. F5-2", "lateral-torsional buckling")
F5_8 = Fm("F_cr", "F_y - 0.3*F_y*((lam_f - lam_pf)/(lam_rf - lam_pf))", f"{_R} Eq. F5-8",
          "flange local buckling stress, noncompact flange")
F5_9 = Fm("F_cr", "0.9*E*k_c/lam_f**2", f"{_R} Eq. F5-9", "flange local buckling stress, slender flange")
F5_7 = Fm("M_n", "R_pg*F_cr*S_xc", f"{_R} Eq. F5-7", "compression flange local buckling")
F5_10 = Fm("M_n", "F_y*S_xt", f"{_R} Eq. F5-10", "tension flange yielding")


def _common(fs, calc: Calc, label: str) -> None:
    p = fs.p
    sym = "doubly" if p.symmetric else "singly"
    calc.say(f"{kind_word(p)} ({sym} symmetric), {fs.cl.web.cls} web: {label} applies",
             reference=f"{_R} Table User Note F1.1")


def f4(fs, calc: Calc) -> None:
    """Fill ``fs`` (a FlexSection) for AISC 360-22 F4."""
    from .flexure import LS_CFY, LS_FLB, LS_TFY

    p, g, cl, Fy, E = fs.p, fs.g, fs.cl, fs.mat.Fy, fs.mat.E
    fs.F = "F4"
    _common(fs, calc, "AISC 360-22 F4")
    d = fs.data
    Myc = calc(MYC, F_y=Fy, S_xc=g.Sxc)
    Mp = calc(MP4, F_y=Fy, Z_x=p.Zx, S_x=p.Sx)
    lw, lpw, lrw = cl.web.lam, cl.web.lam_p, cl.web.lam_r
    big = calc.cond(IYC, I_yc=g.Iyc, I_y=p.Iy)
    if big:
        if calc.cond(RPC_C, lam_w=lw, lam_pw=lpw):
            Rpc = calc(F4_9A, M_p=Mp, M_yc=Myc)
        else:
            Rpc = calc(F4_9B, M_p=Mp, M_yc=Myc, lam_w=lw, lam_pw=lpw, lam_rw=lrw)
    else:
        Rpc = calc.given("R_pc", 1.0, reference=f"{_R} Eq. F4-10")
    Mcfy = calc(F4_1, R_pc=Rpc, M_yc=Myc)
    fs.fixed.append((LS_CFY, Mcfy, "F4.1"))
    # lateral-torsional buckling, Lb-independent part
    FL = cl.FL if cl.FL is not None else _FL(fs, calc)
    aw = calc(AW4, h_c=max(g.hc, 0.0), t_w=p.tw, b_fc=g.bfc, t_fc=g.tfc)
    rt = calc(F4_11, b_fc=g.bfc, a_w=aw)
    J = p.J if big else calc.given("J", 0.0, "inertia", reference=f"{_R} F4.2(c): Iyc/Iy <= 0.23, J = 0")
    Lp = calc(F4_7, r_t=rt, E=E, F_y=Fy)
    Lr = calc(F4_8, r_t=rt, E=E, F_L=FL, J=J, S_xc=g.Sxc, h_o=p.ho)
    fs.Lp, fs.Lr, fs.cap, fs.ltb_kind = Lp, Lr, Rpc * Myc, "F4"
    fs.f4 = (Rpc, Myc, FL, rt, J)
    d.update(Mp=Mp, Myc=Myc, Rpc=Rpc, FL=FL, aw=aw, rt=rt, Lp=Lp, Lr=Lr, Mn_CFY=Mcfy, section_F="F4",
             Sxc=g.Sxc, Sxt=g.Sxt, Iyc_Iy=g.Iyc / p.Iy)
    # flange local buckling
    lf, lpf, lrf = cl.flange.lam, cl.flange.lam_p, cl.flange.lam_r
    if cl.flange.cls == "compact":
        calc.say("compact compression flange: flange local buckling does not apply", reference=f"{_R} F4.3(a)")
    else:
        if cl.flange.cls == "noncompact":
            Mn = calc(F4_13, R_pc=Rpc, M_yc=Myc, F_L=FL, S_xc=g.Sxc, lam_f=lf, lam_pf=lpf, lam_rf=lrf)
            c = "F4.3(b)"
        else:
            Mn = calc(F4_14, E=E, k_c=cl.kc, S_xc=g.Sxc, lam_f=lf)
            c = "F4.3(c)"
        fs.fixed.append((LS_FLB, Mn, c))
        d["Mn_FLB"] = Mn
    # tension flange yielding
    if not calc.cond(TFY, S_xt=g.Sxt, S_xc=g.Sxc):
        Myt = calc(MYT, F_y=Fy, S_xt=g.Sxt)
        if big:
            if calc.cond(RPC_C, lam_w=lw, lam_pw=lpw):
                Rpt = calc(F4_16A, M_p=Mp, M_yt=Myt)
            else:
                Rpt = calc(F4_16B, M_p=Mp, M_yt=Myt, lam_w=lw, lam_pw=lpw, lam_rw=lrw)
        else:
            Rpt = calc.given("R_pt", 1.0, reference=f"{_R} Eq. F4-17")
        Mn = calc(F4_15, R_pt=Rpt, M_yt=Myt)
        fs.fixed.append((LS_TFY, Mn, "F4.4"))
        d.update(Rpt=Rpt, Myt=Myt, Mn_TFY=Mn)


def _FL(fs, calc: Calc) -> float:
    """FL for rolled shapes (Eq. F4-6a/b), when the classification did not need it."""
    from .classify import FL_A, FL_B, FL_COND

    g, Fy = fs.g, fs.mat.Fy
    if calc.cond(FL_COND, S_xt=g.Sxt, S_xc=g.Sxc):
        return calc(FL_A, F_y=Fy)
    return calc(FL_B, F_y=Fy, S_xt=g.Sxt, S_xc=g.Sxc)


def ltb_f4(fs, Lb: float, Cb: float, calc: Calc):
    Rpc, Myc, FL, rt, J = fs.f4
    p, g, E = fs.p, fs.g, fs.mat.E
    if calc.cond(LB_LP, L_b=Lb, L_p=fs.Lp):
        return None, "F4.2(a)", "none", None
    if calc.cond(LB_LR, L_b=Lb, L_r=fs.Lr):
        Mn = calc(F4_2, C_b=Cb, R_pc=Rpc, M_yc=Myc, F_L=FL, S_xc=g.Sxc, L_b=Lb, L_p=fs.Lp, L_r=fs.Lr)
        return Mn, "F4.2(b)", "inelastic", None
    Fcr = calc(F4_5, C_b=Cb, E=E, L_b=Lb, r_t=rt, J=J, S_xc=g.Sxc, h_o=p.ho)
    Mn = calc(F4_3, F_cr=Fcr, S_xc=g.Sxc, R_pc=Rpc, M_yc=Myc)
    return Mn, "F4.2(c)", "elastic", Fcr


def f5(fs, calc: Calc) -> None:
    """Fill ``fs`` (a FlexSection) for AISC 360-22 F5 (slender web)."""
    from .flexure import LS_CFY, LS_FLB, LS_TFY

    p, g, cl, Fy, E = fs.p, fs.g, fs.cl, fs.mat.Fy, fs.mat.E
    fs.F = "F5"
    _common(fs, calc, "AISC 360-22 F5")
    d = fs.data
    aw = calc(AW5, h_c=g.hc, t_w=p.tw, b_fc=g.bfc, t_fc=g.tfc)
    Rpg = calc(F5_6, a_w=aw, h_c=g.hc, t_w=p.tw, E=E, F_y=Fy)
    Mcfy = calc(F5_1, R_pg=Rpg, F_y=Fy, S_xc=g.Sxc)
    fs.fixed.append((LS_CFY, Mcfy, "F5.1"))
    rt = calc(F4_11, b_fc=g.bfc, a_w=aw)
    Lp = calc(F4_7, r_t=rt, E=E, F_y=Fy)
    Lr = calc(F5_5, r_t=rt, E=E, F_y=Fy)
    fs.Lp, fs.Lr, fs.cap, fs.ltb_kind = Lp, Lr, Mcfy, "F5"
    fs.f5 = (Rpg, rt)
    d.update(Rpg=Rpg, aw=aw, rt=rt, Lp=Lp, Lr=Lr, Mn_CFY=Mcfy, section_F="F5", Sxc=g.Sxc, Sxt=g.Sxt,
             Iyc_Iy=g.Iyc / p.Iy)
    lf, lpf, lrf = cl.flange.lam, cl.flange.lam_p, cl.flange.lam_r
    if cl.flange.cls == "compact":
        calc.say("compact compression flange: flange local buckling does not apply", reference=f"{_R} F5.3(a)")
    else:
        if cl.flange.cls == "noncompact":
            Fcr = calc(F5_8, F_y=Fy, lam_f=lf, lam_pf=lpf, lam_rf=lrf)
            c = "F5.3(b)"
        else:
            Fcr = calc(F5_9, E=E, k_c=cl.kc, lam_f=lf)
            c = "F5.3(c)"
        Mn = calc(F5_7, R_pg=Rpg, F_cr=Fcr, S_xc=g.Sxc)
        fs.fixed.append((LS_FLB, Mn, c))
        d.update(Mn_FLB=Mn, Fcr_FLB=Fcr)
    if not calc.cond(TFY, S_xt=g.Sxt, S_xc=g.Sxc):
        Mn = calc(F5_10, F_y=Fy, S_xt=g.Sxt)
        fs.fixed.append((LS_TFY, Mn, "F5.4"))
        d["Mn_TFY"] = Mn


def ltb_f5(fs, Lb: float, Cb: float, calc: Calc):
    Rpg, rt = fs.f5
    g, Fy, E = fs.g, fs.mat.Fy, fs.mat.E
    if calc.cond(LB_LP, L_b=Lb, L_p=fs.Lp):
        return None, "F5.2(a)", "none", None
    if calc.cond(LB_LR, L_b=Lb, L_r=fs.Lr):
        Fcr = calc(F5_3, C_b=Cb, F_y=Fy, L_b=Lb, L_p=fs.Lp, L_r=fs.Lr)
        zone, cl = "inelastic", "F5.2(b)"
    else:
        Fcr = calc(F5_4, C_b=Cb, E=E, L_b=Lb, r_t=rt, F_y=Fy)
        zone, cl = "elastic", "F5.2(c)"
    Mn = calc(F5_2, R_pg=Rpg, F_cr=Fcr, S_xc=g.Sxc)
    return Mn, cl, zone, Fcr

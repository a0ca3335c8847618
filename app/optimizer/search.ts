// The exact section search (engine contract, SearchProblem / SearchResult): best-first
// branch-and-bound over the grid, ordered by the objective (area, or cost), with only sound
// bounds, so `best` (and each `bestByFamily`) is exactly what brute-force.ts finds.
//
// How it stays exact:
// - A row is one family with every dimension fixed except one width ("free", b; bb for
//   mono-i). Along a row the objective grows strictly with the free width (plate areas are
//   linear in it), so the first feasible point of a row is the row's best.
// - Rows sit in a min-heap keyed by a lower bound on the objective of their next unexcluded
//   point. Points are excluded only by necessary conditions proven below; every other point
//   is evaluated by checks.ts (the same evaluation as brute force), in objective order.
//   The family's search stops when the heap's least key exceeds the incumbent (with a 1e-9
//   relative margin, so ties are still popped and settled by the contract's tie-breaks).
// - Necessary conditions (each relaxed by 1e-9 relative so rounding never excludes a point):
//   (1) Iz grows with every dimension: adding material never lowers the centroidal second
//       moment (parallel-axis theorem: I_new ≥ I_old + ΔA·e²·(1 − ΔA/A_new) ≥ I_old), and a
//       deeper shape is the shallower one split and pulled apart plus web.
//   (2) Bending needs Iz ≥ M·c/σ at each fibre. Since c_top + c_bot = d, max over the two
//       fibres of c/σ ≥ d/(σc + σt): Iz ≥ M·d/(σc + σt) for every family, the angle included
//       (its two left corners are d apart in the general formula's lever arm, and the
//       effective I = Iz − Iyz²/Iy ≤ Iz). Shapes symmetric about z have c = d/2 exactly.
//       Sections with one plate on top (tee, channel-down) or, for mono-i, the bottom flange
//       as the free width: the centroid moves monotonically with the free width (toward
//       the free plate), so over the rest of the row the far fibre's c is at least its
//       value now, and the near fibre's at least its value at the row's widest point.
//   (3) Deflection needs I ≥ 5wL⁴/(384·E·δ_allow) (I ≤ Iz as in (2)).
//   (4) For any axis y0, Iz ≤ I about y0 (parallel-axis theorem), and I about a fixed y0 is
//       affine in the free width, so "Iz ≥ I_req" gives a closed-form lower bound on the
//       free width; with y0 at the current centroid it is tight for symmetric shapes and
//       converges in a few rounds otherwise.
//   (5) Shear (i, channel, box, rectangle: neutral axis fixed at mid-depth): the shear stress
//       at the neutral axis, V·Q_NA/(Iz·b_NA), is one of the points the contract's maximum
//       runs over, so it must not exceed the allowable. Q_NA and Iz are affine in the free
//       width and b_NA is fixed (rectangle: 1.5V/(b·d)), so the ratio is monotone along the
//       row and its passing points form one interval, found by bisection.
//   (6) Slenderness ratios are affine in the free width: explicit limits on it.
//   (7) Shear through the web band (every family with a web, stem or legs): see webShearOk.
//   (8) Where the centroid moves along the row (tee, channel-down, mono-i rows), (2) over the
//       whole row is loose; over a sub-range [k, m] of the row it is tight. For every x in
//       [k, m]: Iz(x) ≤ Iz(m) by (1); the centroid moves monotonically toward the free plate,
//       so the fibre it moves away from has c(x) ≥ c(k) and the other c(x) ≥ c(m); hence
//       σ(x) ≥ M·c_least/Iz(m) at each fibre, and deflection needs I_defl ≤ Iz(m). Shear at the
//       centroid ȳ (one of the heights the contract's maximum runs over):
//       Q(ȳ) = ∫_{y>ȳ}(y − ȳ) dA = ½∫|y − ȳ| dA (since ∫(y − ȳ) dA = 0) ≥ ½·Zz, Zz being the least
//       over a of ∫|y − a| dA; Zz never falls as material is added (E1), so Q(ȳ(x)) ≥ Zz(k)/2.
//       When ȳ(k) and ȳ(m) lie strictly inside one plate that the free width does not change,
//       with the same total width b just above and below both, ȳ(x) (between them, monotone)
//       has width b, so τ(x) ≥ V·Zz(k)/(2·Iz(m)·b). Each bound is the point's own demand at
//       m = k (tight) and only weakens as m grows (Iz(m), c(m) move the loose way), so "every
//       point of [k, m] fails" is monotone in m: bisection finds the first point that may pass.
//       (rangeFrom/rangeOut; allowable basis only, as (2), (5), (7).)
//   (8′) The shear part of (8) without bisection (shearJump): along the row Zz = min over a of
//       ∫|y − a| dA, each affine in the free width, so Zz is concave and lies above its chord
//       from k to the row's last point; Iz ≤ I about ȳ(k), affine. So τ(ȳ(x)) ≥ V·chord(x)/
//       (2·b·I_ȳ(k)(x)) while ȳ(x) stays in the band of width b, checked at the run's last
//       point (ȳ is monotone): the run that fails is one affine inequality, solved in closed form.
//   (8″) mono-i boxes (superBound, dBound; passReq): the points that can pass meet the knapsack's
//       I about y0 ≥ req, so bb ≥ bbMin(bt) and bt ≥ btMin(bb); over them c_top is least at
//       (bt1, bbMin(bt1)), c_bot at (btMin(bb1), bb1), at the least depth (R). When both exceed
//       their flange's thickness, ȳ is in the web at every such point and (8)'s shear bound needs
//       Iz ≥ V·Zz/(2·tw·τ), Zz least at (btMin(bb1), bbMin(bt1)). A larger requirement narrows
//       the region again: a few rounds of the knapsack.
// - mono-i has two widths: a "super" node per (d, tft, tfb, tw) and range of bt bounds both
//   with the fractional-knapsack solution of min objective s.t. I_y0(bt, bb) ≥ I_req (a
//   2-variable LP solved in closed form, valid by (4)), I_req from (2) with each fibre's
//   distance bounded over the box; popping a wide node halves its bt range (branching),
//   a narrow one spawns one row per bt.
//
// (E) Under basis "en1993" (member-checks.md §2) there are no allowable stresses: the context
//   holds Infinity for them, so (2) is vacuous, and (5), (7) are skipped; (1), (3), (4), (6)
//   stand. Every EN 1993 check is one more necessary condition; the search uses these:
//   (E1) Bending: M ≤ Mc,Rd = W·fy/γM0, and with LTB M ≤ Mb,Rd = χLT·W·fy/γM1 ≤ W·fy/γM1;
//       MV,Rd ≤ Mc,Rd. W ≤ Zz in every class (class 3's Wel,min: the elastic stresses are a
//       field within ±fy with no axial force, and Zz·fy is the most any such field carries, the
//       lower-bound theorem). fy is the thickest plate's band, fixed along a row (the
//       rectangle's smaller side varies with b: the largest fy of the bands it passes through).
//       So Zz ≥ M·max(γM0, γM1)/fy. Zz = min over a of ∫|y − a| dA (the derivative in a is
//       A_below − A_above, zero at the equal-area axis), so Zz never falls as material is added
//       (the integral grows for every a), and ∫|y − a| dA for a fixed a is affine in the free
//       width (each plate's heights are fixed: width × a fixed ∫|y − a| dy) and ≥ Zz: the
//       closed-form least width of (4), with a at the point's equal-area axis in rowStart, at
//       mid-depth in the raw key, and mono-i's knapsack of (4) on it (over a depth range, (R),
//       about a fixed a at the deepest depth).
//   (E2) LTB (restraint given), for each moment sign with M > 0: M ≤ Mb = B(W·fy, Mcr)/γM1,
//       B(Mpl, Mcr) = χLT(√(Mpl/Mcr))·Mpl. B is non-decreasing in Mpl and in Mcr, and
//       non-increasing in αLT. With Φ = (1 + α(λ − 0.2) + λ²)/2, R = √(Φ² − λ²) and λ ≥ 0.2:
//       χ = 1/(Φ + R) and ψ = χ·λ² = Φ − R are the smaller roots of λ²x² − 2Φx + 1 and
//       y² − 2Φy + λ² (B = χ·Mpl = ψ·Mcr). (a) d(Φ + R)/dλ = (Φ′(Φ + R) − λ)/R ≥ 0, as
//       Φ′ = λ + α/2 ≥ λ and Φ + R = 1/χ ≥ 1 (χ ≤ 1: the first polynomial at 1 is −α(λ − 0.2)
//       ≤ 0), so χ does not rise with λ: B does not fall as Mcr rises. (b) dψ/dλ = (λ − Φ′ψ)/R
//       ≥ 0 iff ψ ≤ s = 2λ/(2λ + α); the second polynomial at s is α·s·(0.4λ − λ² − s)/(2λ)
//       ≤ 0 (λ² + s ≥ 0.4λ for λ ≥ 0.2 and α ≤ 9.6), so s lies between its roots and ψ ≤ s:
//       B does not fall as Mpl rises. (c) Below λ = 0.2, χ = 1 and ψ = λ², continuous at 0.2.
//       (d) A larger α raises Φ, hence Φ + R, lowering χ. Then Mcr = C1·(√(P·U + P²t²) − P·t)
//       with P = π²E·Iy/L², U = π²E·Cw/L² + G·J, t = C2·zg − C3·zj (en1993.ts criticalMoment)
//       is non-decreasing in P and U and falls as t rises (∂/∂t = P²t/√(…) − P < 0). Iy grows
//       with every width (parallel axes, as (1)); Cw and J grow with each width in
//       stability.ts's closed forms (i tf·b³·h0²/24; mono-i h0²·It·Ib/(It + Ib), rising in It
//       and Ib; channel: d ln Cw/db′ ≥ 2/b′; open J = Σ long·short³/3 rising with the free
//       plate; the box's Bredt 4A²/∮ds/t rising in b − tw; the rectangle's approximation rising
//       in either side); curve c (the smaller α) holds once d/b_narrow ≤ 2. So over a range of
//       widths Mb ≤ B with Zz, Iy, Cw, J and the curve at the widest point, fy at its bound
//       and t at its least. i, channel, box, rectangle: betaX = 0 and the shear centre at
//       mid-depth, so t is fixed along a row; tee, mono-i: zg and betaX by interval arithmetic
//       (enTRange; the centroid and the shear centre move monotonically with each width). The
//       range bound grows with the range, so "every point of [k, m] fails" is monotone in m:
//       bisection (rows), and per width for mono-i boxes.
//   (E3) After a failed evaluation, the rest of the row is dropped when the cause cannot
//       improve as the free width grows (enFailEndsRow): shear (VRd depends on the row's fixed
//       plates only; not the rectangle), class 4 of a flange (c/t grows with its width, the
//       limit is the row's), a web or stem (fixed), or mono-i's web under sagging (ψ =
//       −(ȳ − y_web,bottom)/(y_web,top − ȳ) rises as bb widens and ȳ falls, and the class-3
//       limit, 42ε/(0.67 + 0.33ψ) or 62ε(1 − ψ)√(−ψ), does not rise with ψ).
//   (E4) Every welded point's throat is at least 3 mm against at most 0.7 × (the web; for i,
//       channel, tee, box the thinner of flange and web), fixed along the row.
//   (E5) Class 4 is excluded (member-checks.md §2 item 1): a compressed welded outstand (the
//       top flange under sagging, the bottom under hogging) needs (b − tw)/2 ≤ 14ε·t (Table 5.2
//       sheet 2, no root radius on plates), ε from the thickest plate's fy, fixed with the
//       thicknesses: a last width for that flange whatever the other dimensions (enFlangeHi; mono-i).
//   (E6) Likewise a compressed flange with c/t > 10ε makes the section class 3 (or 4, failing):
//       such points are checked with W = Wel,min = Iz/max(c_top, c_bot) (one W for every check),
//       at most Iz's upper bound over the range over the greater of the two fibre distances' least
//       values; c/t grows with the flange's width, so its least width over the range decides
//       (enWUpper; the LTB range bounds of i rows, mono-i rows, boxes and depth ranges).
//   Classification makes feasibility non-monotone along a row (a wider flange can turn class 3
//   or 4), so nothing above assumes monotone feasibility: points are only ever excluded by
//   these necessary conditions, and the row's first feasible point is still its lightest.
// (U) Under basis "aisc360" (issue 14; basis/aisc360.ts) the allowable stresses are Infinity too,
//   so (2), (5), (7) are vacuous and (1), (3), (4), (6) stand. The search uses:
//   (U1) Every Chapter F nominal strength of the "bending-resistance" check is at most Mp = Fy·Zx:
//       F2-1, F3-1/F3-2 and F7-1/F7-2/F7-6 are ≤ Mp as written; F4: Rpc·Myc ≤ Mp (F4-9a/b cap
//       Rpc at Mp/Myc, and F4-10's Rpc = 1 is ≤ Mp/Myc) and the limit states' least is ≤ that;
//       F5: with Sxt ≥ Sxc, Rpg·Fy·Sxc ≤ Fy·Sxc = Fy·Sx,min, with Sxt < Sxc, F5-10's Fy·Sxt =
//       Fy·Sx,min, and Fy·Sx,min ≤ Fy·Zx by the lower-bound theorem of (E1); F9: Mp ≤ Fy·Zx
//       (F9-2) or My = Fy·Sx,min (F9-4); F11-1 ≤ Fy·Z. So M ≤ φ·Mn needs Zx ≥ M/(φ·Fy) and
//       M ≤ Mn/Ω needs Zx ≥ M·Ω/Fy: (E1)'s machinery with γ = 1/φb or Ωb and fy = the plate Fy
//       (one value on every row).
//   (U2) LTB of family i (the only family with an LTB range bound here; others rely on (U1)):
//       over a row's widths [b1, b2] (d, tf, tw fixed, so h/tw, h0 and the web's Chapter F section
//       are fixed) A, Iz, Iy, J, Cw, Zx, Sx, √(Iy·Cw), rt and Rpg all grow with b, and
//       aisc360.ts ltbUpperI bounds the LTB strength of every point of the range from above
//       from their values at b1 and b2 (monotonicity argument in its comment); Infinity when a
//       point may sit in the plastic zone (no LTB check). The bound grows with the range, so
//       "every point of [k, m] fails" is monotone in m: bisection as (E2). Precision: compared
//       with the 1e-9 relative margin, like every other bound.
//   (U3) After a failed evaluation the rest of the row is dropped when the cause cannot improve as
//       the free width grows (usFailEndsRow, proof there): class-4 (web only), J10, shear (not the
//       bar), the weld of i, channel and box, and an i's slender-flange local buckling (F3-2/F4-14).
//   (U4) Family i's "bending-resistance" over a range of widths: aisc360.ts bendUpperI (yielding
//       by the row's fixed web section, flange local buckling by the flange classes the range
//       holds; proof in its comment), combined with (U2) in one bisection.
//   Shear, welds and J10 are not used to bound (they only make more points infeasible).
// (R) mono-i, both passes: one node per (tft, tfb, tw) and run of consecutive valid depths (the
//   width minima, tw, do not involve d), over every bt and bb: 10^6 per-depth super nodes were
//   each bounded on their own. dBound bounds the box d ∈ [d1, d2] × bt × bb:
//   - (6) the web's (d − tft − tfb)/tw rises with d: a last depth; the outstands bound bt, bb.
//   - The objective is affine in d, bt, bb with positive slopes (plate areas, prices > 0): its
//     value at (d1, bt1, bb1) is a lower bound, and the incumbent bounds each coordinate at the
//     others' least (as the rows' cut).
//   - Depth monotonicity: the section at d + Δ is the one at d cut across the web, its upper part
//     raised by Δ, the gap filled with web. So Iz, Iy (web added), Cw (h0 rises), J (longer web),
//     and Zz never fall with d: ∫|y − a′| dA at d + Δ is at least ∫|y − a| dA at d with a = a′
//     below the cut, a = the cut inside the gap, a = a′ − Δ above (every |y − a| there is at
//     least its old value), plus the web's share ≥ 0. The centroid ȳ rises with d (cut at the top
//     of the web: ȳ′ − ȳ has the sign of A_top + tw·(d − tft − ȳ + Δ/2) ≥ tft·(bt − tw) > 0), and
//     so does c = d − ȳ (cut at the web's bottom, the mirror argument with bb > tw). The shear
//     centre ysc = tfb/2 + h0·It/(It + Ib) rises with d and bt and falls with bb; zg (top:
//     d − ysc = tft/2 + h0·Ib/(It + Ib); bottom: −ysc; centre: 0) is monotone in each
//     coordinate, so its least and greatest values are at box corners (ltbOut3).
//   - (4), (E1), (U1) over the box: every point's Iz (Zz) is at most its value at d2, at most I
//     about any y0 (∫|y − a| dA about any a) at d2, affine in (bt, bb); the bending requirement
//     M·d/(σc + σt) rises with d (its value at d1 holds) and the Zz requirement is fixed; the
//     objective at d1 is affine in (bt, bb): the same fractional knapsack (lpRange) gives a lower
//     bound on the objective of every point that can pass.
//   - (E2) over the box (ltbOut3): Iy, Cw, J, Zz at (d2, bt2, bb2); curve c if d1/min(bt2, bb2) ≤ 2;
//     betaX = N/Iz − 2(ȳ − ysc) with N = Σ (B³/12)·S1 + B·S3 per plate (enTRange's terms): the
//     bottom flange's S1 = tfb·ȳ − tfb²/2 and S3 (derivative ȳ³ − (ȳ − tfb)³ > 0) rise with ȳ;
//     the top flange's S1 = tft²/2 − tft·c and S3 (derivative −((tft − c)³ + c³) < 0) fall with c;
//     the web's term is g(ȳ − tfb) − g(tft − c) with g(x) = (tw³/12)·x²/2 + tw·x⁴/4, even and
//     rising in |x|; interval products over B, then ÷ Iz ∈ [Iz(d1, bt1, bb1), Iz(d2, bt2, bb2)],
//     ȳ ∈ [ȳ(d1, bt1, bb2), ȳ(d2, bt2, bb1)], c ∈ [c(d1, bt2, bb1), c(d2, bt1, bb2)]. The bound
//     grows with the box, so "every point of the box with axis x in [x1, m] fails" is monotone in
//     m: bisection raises the least depth, bt and bb (raise3).
//   - Once an incumbent exists the box's widest corner is far heavier than it: the bt range is cut
//     into SLICES slices, each bounded by (E2) over its own box, with the bb (and, for ranges, the
//     depth) the incumbent leaves at the slice's least bt (the objective is affine with positive
//     slopes, so a point of the slice heavier than that is already cut); the bt range shrinks to
//     the span of the slices that may pass (superBound does the same per depth in best mode).
//   - (E4) and (E5) as for the super nodes.
//   A popped range is halved; at DRANGE_LEAF depths or fewer each depth becomes its super node.
// (R′) The row families but the rectangle (i, channel, tee, box, channel-down, angle), both passes:
//   one node per thickness tuple over its valid depths (the geometry rule is d > plates, the
//   fabrication rules involve the thicknesses alone: a run from the least valid depth, found by
//   bisection), over every free width: each family's rows (64,000 on a fine grid) were each
//   bounded when seeded and held in the heap. rowRangeBound bounds d ∈ [d1, d2] × b:
//   - The free width's least value (tw, t, 2·tw with the box clearance, 2·tf) involves no depth.
//     (6): every ratio either involves no depth (the width's elements: one last width for every
//     depth) or is (d − plates)/t, affine and rising in d (the web, stem, leg): a last depth, and
//     one failing at d1 fails at every deeper depth.
//   - The objective (plate areas × prices, plus a fixed weld term) is affine in d and b with
//     positive slopes (no plate's area holds d·b; the rectangle's does, so it keeps its rows): its
//     value at (d1, b) bounds the range's at b, and the incumbent cuts each coordinate at the
//     other's least (best mode).
//   - Depth monotonicity as (R): the section at d + Δ is the one at d cut across the band of fixed
//     width that d lengthens (the web or webs at mid-depth; the stem, the legs, the vertical leg
//     above the horizontal one), its upper part raised by Δ and the gap filled with that band. Iz
//     never falls: each part keeps its area and own I while their centroids move apart (I = I1 +
//     I2 + e²·A1·A2/(A1 + A2)), then material is added (1); Zz never falls by (R)'s argument.
//   - (2), (3), (E1), (U1): the I requirement, M·d/(σc + σt) (M·d/2/min σ for the doubly
//     symmetric), rises with d; deflection's and M·γ/fy (fy from the thickest plate, fixed with the
//     thicknesses) do not involve d. A point (d, b) that passes has I_y0(d2, b) ≥ Iz(d2, b) ≥
//     Iz(d, b) ≥ req(d1) for any y0, I_y0 affine in b ((4)): b is at least the closed-form width
//     where I_y0 at d2 reaches req(d1) (likewise ∫|y − a| dA at d2 and the Zz requirement), and the
//     objective at d1 and that width is the range's key. Every point of depths [d1, m] fails when
//     Iz (or Zz) at depth m and the widest allowed width falls short of req(d1): monotone in m, so
//     bisection raises d1, in rounds (req(d1) rises with it).
//   - (E2) over the range (i, channel, box under EN 1993 with a restraint; ltbOutRange): Iy, Cw,
//     J and Zz are at most their values at (d2, b2): none falls with b ((E2)) nor with d (the cut
//     adds web, which raises Iy by (1) and J by its longer web plate, long·short³/3 rising in
//     each side; Cw: the i's tf·b³·h0²/24 and the channel's h0²·(3a + 2h0·tw)/(6a + h0·tw)
//     (the ratio's derivative in h0 has the sign of 9a·tw > 0) rise with h0, the box's is 0; the
//     box's Bredt J = 4A²/∮ds/t with A and ∮ affine in h0 rises with it); betaX = 0 and the shear
//     centre at mid-depth, so zg = loadHeight(d/2) is monotone in d, bounded by its ends; curve c
//     if d1/b2 ≤ 2; (E6) for i with c = d1/2 and the least flange width. The bound grows with
//     the range, so "every point of [d1, m] fails" is monotone in m: bisection raises d1 too.
//   A popped range is halved; at ROW_LEAF depths or fewer each depth becomes its raw row (in best
//   mode before any incumbent exists, the row is settled at once instead, diveRow: the seeds'
//   phases in run() used to give an early incumbent that way, and its cut shortens the LTB
//   bisections of every later row). Its children are keyed no lower than the range: every point that can still matter weighs at least
//   the key (the points lighter than a key bounded at cap < 1 are beaten and heavier than each of
//   its depths' context point so far, (D)).
// (S) mono-i in best mode with a restraint (LTB checked), before the search: a local search from the heaviest grid point (and
//   the same at ¾ and ½ of the depth axis) steps each dimension down, then one down and another
//   up, keeping the lightest feasible point it meets (SEED_EVALS evaluations at most). It only
//   offers grid points it evaluated by checks.ts, so, as searchWithKnown's known candidates, it
//   changes no answer; it gives the incumbent's cut an early, near-best incumbent, which is what
//   narrows the boxes before (E2) bounds them.
// - Best mode also cuts each row, and each mono-i box, to the points no heavier than the
//   incumbent (the objective is affine in each width) before bounding them.
// - One bound function per kind of node serves both passes (best mode and the grid front, D):
//   boundRow for a row ((6), the incumbent's cut in best mode, then (1)–(8), (E), (U) in
//   rowStart), superBound for a mono-i node; every range bound on a row ((5), (8), (E2), (U2))
//   skips its run of failing points through one bisection, skipOut.
//
// (D) The grid's front and the context points (front "grid", the default). One heap holds
//   every family, so entries pop lightest first across families. An entry (a raw row, a row
//   tail, a mono-i node) with key o, a lower bound on the objective of its points, is needed:
//   - for a context point (each family's lightest feasible per depth) only while o is within
//     its (family, depth)'s lightest feasible so far (1e-9 margin for ties): then as above; a
//     depth range ((R), (R′)) while o is within the lightest so far of any depth it holds;
//   - for the front, otherwise. A point x is off the front when some feasible y has
//     objective(y) < objective(x) and u(y) < u(x) (u = utilisation; front.ts's "beats").
//     cap = the least utilisation among the evaluated feasible candidates strictly lighter
//     than o (Front.minUtilBelow: a candidate off the current front is beaten by a lighter
//     member of lower utilisation, so the members give the least). Every x in the entry has
//     objective ≥ o, so each x with u(x) > cap is beaten and only u(x) ≤ cap matters. Every
//     bound (1)–(7) is "demand ≤ capacity" for a demand that is one term of u's maximum, and
//     u ≤ cap implies that demand ≤ cap × capacity: run with the allowables and slenderness
//     limits scaled by cap (the required I divided by cap) each bound excludes only points
//     that cannot reach u ≤ cap ((E1), (E2), (E4) likewise divide the demand by cap). So the
//     entry is re-bounded at cap when it pops: a row tail whose first point cannot reach cap
//     is re-queued at its first point that can, a mono-i node or depth range whose bound rose
//     (by more than REKEY) is re-queued at it (dBound's and rowRangeBound's bounds at cap are the
//     same "demand ÷ cap" reading of (R)'s and (R′)'s), anything else is expanded or its point evaluated. What is dropped stays
//     beaten: dominance is transitive (strictly lighter and strictly lower twice over), and only
//     evaluated candidates enter the front.
//   A search that is one thread's part of a grid (SearchOptions.frontShare) also takes the other
//   parts' front members into cap (Tally.ext): they are feasible grid candidates too, so whatever
//   they beat is off the grid's front; the parts' fronts combine to the grid's (search-threads.ts).
//   A feasible point does not end its row here: heavier points may reach lower utilisation.
//   The heap empties, so every grid point is evaluated or proven off the front and heavier
//   than its depth's context point: the front and context equal brute force's.
//
// What the fast search guarantees: `best`, `bestByFamily` and `counts.grid` equal brute
// force's; `counts.evaluated` is the number of candidates it actually evaluated and
// `counts.feasible` the feasible among them. front "grid" (default): `front` and `context`
// equal brute force's, member for member (frontScope "grid"). front "evaluated": only best and
// bestByFamily are proven; `front` is over the candidates evaluated (the engine contract's
// original wording, frontScope "evaluated"), and `explore: 0.2` (a labelled approximation)
// keeps evaluating rows whose lightest point is within 20% of the family's best (each such
// row's lightest feasible point joins that front). `exhaustive: true` runs brute force.
//
// Progress: onProgress(done, total) in shapes (grid.ts PROGRESS_UNIT): total = counts.grid
// (known once every family is seeded), done = shapes evaluated or proven unable to change the
// answer; each heap entry carries how many shapes it stands for, so done moves with the work.
// Abort: the signal is checked every 4096 heap steps; an aborted search throws the signal's
// reason (an AbortError DOMException unless the caller gave one). Stop: `stopWhen` is asked at
// the same points and before each family; once it answers true the search returns what it has
// so far, marked `stoppedEarly` (a sweep's time budget: the queue keeps the best found so far,
// never presented as proven lightest).
import { Scratch, evaluateCandidate, plateObjective, type CheckContext } from "./checks";
import * as composite from "./composite";
import { bruteForceSearch } from "./brute-force";
import * as fkm from "./family-kernel";
import type { FamilyKernel } from "./family-kernel";
import type { RawCandidate } from "./front";
import { ABORT_EVERY, Tally, buildResult, checkAbort, offerFeasible, prepare, type Prepared, type PreparedFamily, type SearchOptions, type SearchPoint, type SearchResult } from "./grid";
import { searchProblemSchema, type SearchProblemInput } from "./search-schema";
import * as en1993 from "./basis/en1993";
import type { En1993Context, En1993Scratch } from "./basis/en1993";
import * as aisc from "./basis/aisc360";
import type { AiscContext, AiscScratch } from "./basis/aisc360";
import * as stability from "./stability";

export type { SearchOptions, SearchResult, SearchCandidate } from "./grid";

// Local copies of imported bindings: module transforms (tsx, vite-node) turn each access to an
// imported name into a getter call, which costs more than the arithmetic in these loops.
const { compositeKernel, plateQAbove, plateWidthAt, plateNeutralAxis, plateModulusAbout, KERNEL_OUT, K_AREA, K_CY, K_IY, K_IZ, K_MAXY, K_MINY, PLATE_STRIDE } = composite;
const { C_BEARING, C_BEND, C_CLASS4, C_COMP, C_DEFL, C_LTB, C_SHEAR, C_TENS, C_VB, C_VPL, C_WELD } = fkm;
const { chiLT, criticalMoment, fyFor, loadHeight, ltbCurveC, ALPHA_LT_C, ALPHA_LT_D, EL_WEB, MIN_WELD_THROAT } = en1993;
const { stabilityKernel, ST_BETA, ST_CW, ST_H0, ST_J, ST_OUT, ST_SCY } = stability;
const { bendUpperI, flexureGamma, ltbUpperI } = aisc;
const evaluate = evaluateCandidate,
  objectiveOf = plateObjective;

const REL = 1e-9;
/** Grid mode with SearchOptions.frontShare: the other parts' front members are taken in every this many heap steps. */
const SHARE_EVERY = 256;
/** Grid mode: a super node whose bound at the dominance cap rises by more than this (relative) is re-queued, not expanded. */
const REKEY = 1e-3;
/** mono-i super nodes spanning more bt values than this are split in two before expanding. */
const SUPER_SPLIT = 8;
/** the range bounds skipOut bisects on: (5), (8), (E2), (U2) */
const OUT_SHEAR = 0,
  OUT_RANGE = 1,
  OUT_LTB_EN = 2,
  OUT_LTB_US = 3;
const KIND_READY = 0,
  KIND_RAW = 1,
  KIND_SUPER = 2,
  KIND_DRANGE = 4,
  KIND_ROWRANGE = 5;
/** mono-i depth-range nodes (R) this short or shorter are expanded into one super node per depth. */
const DRANGE_LEAF = 2;
/** (R′) row depth ranges this short or shorter are expanded into one raw row per depth. */
const ROW_LEAF = 4;
/**
 * Grid mode: a row depth range whose bound at the cap rises by more than this (relative) is
 * re-queued, not split. Coarser than REKEY: a range's bound costs a few rows' keys, and a range
 * re-queued for a small rise is mostly split at its next pop anyway (measured on the (6b) brief).
 */
const ROW_REKEY = 1e-2;
/** (R) bt slices a depth range's box is cut into for (E2) once an incumbent exists. */
const SLICES = 8;
/** (S) the most candidates the mono-i seed's local search evaluates. */
const SEED_EVALS = 4000;

/**
 * Binary min-heap on typed arrays. The heap orders only (key, slot); an entry's payload (row id,
 * k (next free-width index), kHi, kind, the family's index (one heap serves every family in the
 * grid-front search) and n, the number of grid shapes the entry stands for (progress)) stays in
 * its slot, so a sift moves two numbers a level instead of seven. `key[0]` is the least key.
 */
class Heap {
  key = new Float64Array(1024);
  slot = new Int32Array(1024);
  id = new Float64Array(1024);
  k = new Int32Array(1024);
  hi = new Int32Array(1024);
  kind = new Int8Array(1024);
  fam = new Int8Array(1024);
  n = new Float64Array(1024);
  size = 0;
  private free = new Int32Array(1024);
  private nFree = 0;
  private nextSlot = 0;
  private grow() {
    const n = this.key.length * 2;
    const g = <T extends Float64Array | Int32Array | Int8Array>(a: T, C: new (n: number) => T): T => {
      const b = new C(n);
      b.set(a);
      return b;
    };
    this.key = g(this.key, Float64Array);
    this.slot = g(this.slot, Int32Array);
    this.free = g(this.free, Int32Array);
    this.id = g(this.id, Float64Array);
    this.k = g(this.k, Int32Array);
    this.hi = g(this.hi, Int32Array);
    this.kind = g(this.kind, Int8Array);
    this.fam = g(this.fam, Int8Array);
    this.n = g(this.n, Float64Array);
  }
  private alloc(id: number, k: number, hi: number, kind: number, fam: number, n: number): number {
    const s = this.nFree > 0 ? this.free[--this.nFree] : this.nextSlot++;
    this.id[s] = id;
    this.k[s] = k;
    this.hi[s] = hi;
    this.kind[s] = kind;
    this.fam[s] = fam;
    this.n[s] = n;
    return s;
  }
  clear() {
    this.size = this.nFree = this.nextSlot = 0;
  }
  /**
   * Appends without ordering: the seed lists use a Heap as a plain buffer, read by position
   * (a list only ever appended to has entry i in slot i).
   */
  append(key: number, id: number, k: number, hi: number, kind: number, fam: number, n: number) {
    if (this.size === this.key.length) this.grow();
    const i = this.size++;
    this.key[i] = key;
    this.slot[i] = this.alloc(id, k, hi, kind, fam, n);
  }
  push(key: number, id: number, k: number, hi: number, kind: number, fam: number, n: number) {
    if (this.size === this.key.length) this.grow();
    const s = this.alloc(id, k, hi, kind, fam, n);
    const K = this.key,
      S = this.slot;
    let i = this.size++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (K[p] <= key) break;
      K[i] = K[p];
      S[i] = S[p];
      i = p;
    }
    K[i] = key;
    S[i] = s;
  }
  // pops the top into the out fields
  outKey = 0;
  outId = 0;
  outK = 0;
  outHi = 0;
  outKind = 0;
  outFam = 0;
  outN = 0;
  pop() {
    const K = this.key,
      S = this.slot;
    const s = S[0];
    this.outKey = K[0];
    this.outId = this.id[s];
    this.outK = this.k[s];
    this.outHi = this.hi[s];
    this.outKind = this.kind[s];
    this.outFam = this.fam[s];
    this.outN = this.n[s];
    this.free[this.nFree++] = s;
    const n = --this.size;
    if (n === 0) return;
    const key = K[n],
      last = S[n];
    let i = 0;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= n) break;
      if (c + 1 < n && K[c + 1] < K[c]) c++;
      if (K[c] >= key) break;
      K[i] = K[c];
      S[i] = S[c];
      i = c;
    }
    K[i] = key;
    S[i] = last;
  }
}

/** Second moment of the plates about the horizontal line y = y0 (parallel-axis theorem). */
function iAbout(p: Float64Array, n: number, y0: number): number {
  let s = 0;
  for (let i = 0; i < n; i++) {
    const o = i * PLATE_STRIDE;
    const b = p[o],
      h = p[o + 1];
    const e = p[o + 3] + 0.5 * h - y0;
    s += b * h * (h * h / 12 + e * e);
  }
  return s;
}

/** (E1) The largest fy of the bands holding some thickness in [t1, t2] (fyFor's bands: (previous, maxThickness]). */
function fyMaxOver(e: En1993Context, t1: number, t2: number): number {
  let m = -Infinity,
    prev = -Infinity;
  for (let i = 0; i < e.bandT.length; i++) {
    const hi = e.bandT[i];
    if (hi >= t1 && prev < t2 && e.bandFy[i] > m) m = e.bandFy[i];
    prev = hi;
  }
  return m;
}

/** (R) The web's term of betaX's integral (enTRange) at |v| = x at one end: (tw³/12)·x²/2 + tw·x⁴/4, rising in x ≥ 0. */
function webWagner(tw: number, x: number): number {
  const x2 = x * x;
  return (tw * tw * tw * x2) / 24 + (tw * x2 * x2) / 4;
}

/** (R) mono-i's shear-centre height, stability.ts's closed form: tfb/2 + h0·It/(It + Ib). */
function monoShearCentre(d: number, bt: number, tft: number, bb: number, tfb: number): number {
  const h0 = d - tft / 2 - tfb / 2;
  const It = (tft * bt * bt * bt) / 12,
    Ib = (tfb * bb * bb * bb) / 12;
  return tfb / 2 + (h0 * It) / (It + Ib);
}

/** First index k with a[k] > x (a ascending). */
function firstAbove(a: Float64Array, x: number): number {
  let lo = 0,
    hi = a.length;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (a[m] > x) hi = m;
    else lo = m + 1;
  }
  return lo;
}
/** First index k with a[k] ≥ x. */
function firstAtLeast(a: Float64Array, x: number): number {
  let lo = 0,
    hi = a.length;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (a[m] >= x) hi = m;
    else lo = m + 1;
  }
  return lo;
}

/**
 * The incumbent's cut along one axis (header: "the objective is affine in d, bt, bb with positive
 * slopes"): with the objective o0 at a[lo] and o1 > lim at a[hi], the last index of a whose value
 * is at or below where the line reaches lim, widened by REL so rounding never cuts a point that
 * passes. The caller clamps it to its own range.
 */
function lastWithin(a: Float64Array, lo: number, hi: number, o0: number, o1: number, lim: number): number {
  return lastAtMost(a, a[lo] + ((lim - o0) * (a[hi] - a[lo])) / (o1 - o0));
}

/** The first index of a whose value is at least x, x widened by REL so rounding never cuts a grid value at the bound. */
function firstAtLeastWidened(a: Float64Array, x: number): number {
  return firstAtLeast(a, x - REL * (Math.abs(x) + 1));
}

/** The last index of a whose value is at most x, x widened by REL so rounding never cuts a grid value at the bound. */
function lastAtMost(a: Float64Array, x: number): number {
  return firstAbove(a, x + REL * (Math.abs(x) + 1)) - 1;
}

/** One family's branch-and-bound. */
class FamilySearch {
  readonly fk: FamilyKernel;
  readonly ctx: CheckContext;
  readonly W: Float64Array;
  readonly v: Float64Array;
  readonly plates = new Float64Array(8 * PLATE_STRIDE);
  readonly kout = new Float64Array(16);
  readonly scratch = new Scratch();
  /** every row (or mono-i super node) with its first, cheap key, before it enters the heap */
  seeds = new Heap();
  /** shapes of this family not yet settled (in the seeds or the heap), for progress */
  pending = 0;
  /** this family's index in problem.families (heap entries carry it) */
  readonly fam: number;
  /** context points: this family's slots in the tally start here; depth index of a row id = ⌊id / depthStride⌋ mod depthRadix */
  readonly ctxBase: number;
  readonly depthStride: number;
  readonly depthRadix: number;
  /** index in v of the overall depth d */
  readonly dSlot: number;
  readonly groupDims: number[];
  readonly radix: number[];
  readonly sym: boolean;
  readonly sumAllow: number;
  readonly minAllow: number;
  readonly Idefl: number;
  readonly cand: RawCandidate;
  /** the check that last excluded points in rowStart (for `reason`) */
  cause = C_TENS;
  slR1 = new Float64Array(8);
  slR2 = new Float64Array(8);
  // ---- EN 1993 (E): null under the allowable basis
  readonly en: En1993Context | null;
  /** (U) basis "aisc360": its context; null otherwise */
  readonly us: AiscContext | null;
  /** a limit-state basis (en1993 or aisc360): the plastic-modulus bound (E1)/(U1) applies */
  readonly lim: boolean;
  /** indices in v of the family's plate thicknesses (its fy band is the thickest's); empty for the rectangle */
  readonly enT: number[];
  /** the bending-type requirement's factor: Zz ≥ M·γ/fy with γ = γM0, or γM1 when LTB is checked and larger (E1) */
  readonly enGamma: number;
  readonly mMax: number;
  readonly st = new Float64Array(ST_OUT);
  /** interval bound scratch (E2): plates at the low and high corners of a range of widths */
  readonly pLo = new Float64Array(8 * PLATE_STRIDE);
  readonly pHi = new Float64Array(8 * PLATE_STRIDE);
  readonly rng = new Float64Array(8);

  constructor(
    readonly pf: PreparedFamily,
    ctx: CheckContext,
    readonly t: Tally,
    /** the heap the family pushes to: its own (best mode) or the one every family shares (grid mode) */
    readonly heap: Heap,
    /** true: the exact grid front and context points (D); false: best and bestByFamily only */
    readonly gridMode: boolean,
    readonly explore = 0,
  ) {
    this.fk = pf.fk;
    this.fam = pf.fi;
    this.ctx = ctx;
    this.W = pf.axes[pf.fk.free];
    this.v = new Float64Array(pf.fk.dims.length);
    this.groupDims = pf.fk.dims.map((_, i) => i).filter((i) => i !== pf.fk.free);
    this.radix = this.groupDims.map((i) => pf.axes[i].length);
    this.sym = this.fk.centroidDir === 0 && !this.fk.unsymmetric;
    this.sumAllow = ctx.aC + ctx.aT;
    this.minAllow = Math.min(ctx.aC, ctx.aT);
    this.Idefl = ctx.hasDeflection ? ctx.deflNumerator / ctx.deflLimit : 0;
    this.en = ctx.en;
    this.us = ctx.us;
    this.lim = ctx.en !== null || ctx.us !== null;
    this.enT = [...new Set(pf.fk.plateThickness.filter((i) => i >= 0))];
    this.enGamma = ctx.en ? Math.max(ctx.en.gM0, ctx.en.restraint ? ctx.en.gM1 : 0) : ctx.us ? flexureGamma(ctx.us) : 0;
    this.mMax = Math.max(ctx.Ms, ctx.Mh);
    this.cand = { fi: pf.fi, fk: this.fk, v: this.v, objective: 0, area: 0, utilisation: 0, governing: -1 };
    this.dSlot = pf.fk.roles.indexOf("depth");
    const dPos = this.groupDims.indexOf(this.dSlot);
    let stride = 1;
    for (let j = this.groupDims.length - 1; j > dPos; j--) stride *= this.radix[j];
    this.depthStride = stride;
    this.depthRadix = this.radix[dPos];
    this.ctxBase = pf.fi * t.nDepths;
  }

  depthIndex(id: number): number {
    return Math.floor(id / this.depthStride) % this.depthRadix;
  }

  /** Pushes onto the heap (this family's entry, standing for n grid shapes). */
  push(key: number, id: number, k: number, hi: number, kind: number, n: number): void {
    this.heap.push(key, id, k, hi, kind, this.fam, n);
    this.pending += n;
  }

  /** Keys above this cannot matter: the incumbent in best mode; none in grid mode (dominance decides there). */
  limit(): number {
    return this.gridMode ? Infinity : this.incumbent();
  }

  /** row id (mixed radix over the group dimensions) → v */
  decode(id: number): void {
    for (let j = this.groupDims.length - 1; j >= 0; j--) {
      const r = this.radix[j];
      const q = Math.floor(id / r);
      const dIdx = this.groupDims[j];
      this.v[dIdx] = this.pf.axes[dIdx][id - q * r];
      id = q;
    }
  }

  /** Pruning limit: the family's incumbent objective, widened by `explore` (and REL for ties). */
  incumbent(): number {
    const c = this.t.bestByFamily[this.pf.fi];
    return c ? c.objective * (1 + this.explore) * (1 + REL) : Infinity;
  }

  objectiveAt(k: number): number {
    this.v[this.fk.free] = this.W[k];
    this.fk.fill(this.v, this.plates);
    return objectiveOf(this.fk, this.v, this.plates, this.ctx);
  }

  /**
   * Base I requirement from (2) and (3) for depth d (relaxed by REL later), for a utilisation
   * of at most cap (1: feasibility; below 1: the dominance bound (D), every demand ÷ cap).
   */
  baseIreq(d: number, cap: number): number {
    const c = this.ctx;
    const M = Math.max(c.Ms, c.Mh);
    const bend = this.sym ? (M * d) / 2 / this.minAllow : (M * d) / this.sumAllow;
    return Math.max(bend, this.Idefl) / cap;
  }

  /**
   * Slenderness limits along the row, (6), for indices [kLo, last] and utilisation ≤ cap:
   * returns kHi (last allowed free index), or −1 when a ratio that does not involve the free
   * width already fails.
   */
  rowHi(kLo: number, last: number, cap: number): number {
    const fk = this.fk,
      W = this.W;
    let kHi = last;
    if (fk.slenderKinds.length === 0) return kHi;
    const v = this.v,
      f = fk.free;
    v[f] = W[kLo];
    fk.slender(v, this.slR1);
    v[f] = W[last];
    fk.slender(v, this.slR2);
    for (let e = 0; e < fk.slenderKinds.length; e++) {
      const c = fk.slenderKinds[e];
      const lim = this.ctx.slenderLimit[c] * cap;
      if (lim !== lim) continue;
      const r1 = this.slR1[e],
        r2 = this.slR2[e];
      if (r1 === r2 || kLo === last) {
        if (r1 > lim * (1 + REL)) {
          this.t.ruledOut[c] += last - kLo + 1;
          return -1;
        }
        continue;
      }
      // affine: r(b) = r1 + (b − b1)·slope
      const slope = (r2 - r1) / (W[last] - W[kLo]);
      if (slope > 0) {
        const bMax = W[kLo] + (lim - r1) / slope;
        const h = lastAtMost(W, bMax);
        if (h < kHi) {
          this.t.ruledOut[c] += kHi - Math.max(h, kLo - 1);
          kHi = h;
        }
      }
    }
    return kHi < kLo ? -1 : kHi;
  }

  /**
   * First index ≥ k (≤ kHi) not excluded by (1)–(5) and (7) at utilisation ≤ cap, or −1.
   * Leaves nothing in v but the free width.
   */
  rowStart(k: number, kHi: number, cap: number): number {
    const fk = this.fk,
      ctx = this.ctx,
      W = this.W,
      v = this.v,
      p = this.plates,
      ko = this.kout,
      n = fk.nPlates,
      f = fk.free;
    if (k > kHi) return -1;
    const d = this.depthOf();
    const base = this.baseIreq(d, cap);
    const aC = ctx.aC * cap,
      aT = ctx.aT * cap;
    let cTopHi = 0,
      cBotHi = 0;
    if (!this.sym && !fk.unsymmetric) {
      v[f] = W[kHi];
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      cTopHi = ko[K_MAXY] - ko[K_CY];
      cBotHi = ko[K_CY] - ko[K_MINY];
    }
    for (let iter = 0; iter < 12; iter++) {
      const b = W[k];
      v[f] = b;
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      const Iz = ko[K_IZ],
        cy = ko[K_CY];
      let req = base;
      let cause = base === this.Idefl / cap && this.Idefl > 0 ? C_DEFL : ctx.aT <= ctx.aC ? C_TENS : C_COMP;
      if (!this.sym && !fk.unsymmetric) {
        const cTop = ko[K_MAXY] - cy,
          cBot = cy - ko[K_MINY];
        const cTopLb = fk.centroidDir > 0 ? cTopHi : cTop;
        const cBotLb = fk.centroidDir > 0 ? cBot : cBotHi;
        const r1 = (ctx.Ms * cTopLb) / aC,
          r2 = (ctx.Ms * cBotLb) / aT,
          r3 = (ctx.Mh * cTopLb) / aT,
          r4 = (ctx.Mh * cBotLb) / aC;
        if (r1 > req) (req = r1), (cause = C_COMP);
        if (r2 > req) (req = r2), (cause = C_TENS);
        if (r3 > req) (req = r3), (cause = C_TENS);
        if (r4 > req) (req = r4), (cause = C_COMP);
      }
      req *= 1 - REL;
      if (Iz >= req) break;
      this.cause = cause;
      if (k === kHi) return this.dead(k, kHi);
      // (4): I about the current centroid, affine in the free width
      v[f] = W[kHi];
      fk.fill(v, p);
      const iHi = iAbout(p, n, cy);
      if (iHi < req) return this.dead(k, kHi);
      const slope = (iHi - Iz) / (W[kHi] - b);
      const bNeed = b + (req - Iz) / slope;
      let k2 = firstAtLeastWidened(W, bNeed);
      if (k2 <= k) k2 = k + 1;
      if (k2 > kHi) return this.dead(k, kHi);
      this.t.ruledOut[cause] += k2 - k;
      k = k2;
    }
    if (this.en) {
      if (this.enRowOut(cap)) {
        this.cause = C_WELD;
        return this.dead(k, kHi);
      }
      k = this.enZStart(k, kHi, cap);
      if (k >= 0 && this.en.restraint) k = this.skipOut(OUT_LTB_EN, k, kHi, cap);
      // (5), (7) concern the allowable shear stress: not checked under EN 1993
      return k;
    }
    if (this.us) {
      k = this.enZStart(k, kHi, cap);
      if (k >= 0 && this.fk.family === "i") k = this.skipOut(OUT_LTB_US, k, kHi, cap);
      return k;
    }
    if (ctx.hasShear && ctx.V > 0 && this.sym) {
      k = this.skipOut(OUT_SHEAR, k, kHi, cap);
      if (k < 0) return -1;
    }
    if (ctx.hasShear && ctx.V > 0 && !this.webShearOk(k, kHi, cap)) {
      this.cause = C_SHEAR;
      return this.dead(k, kHi);
    }
    if (!this.sym && !fk.unsymmetric) k = this.skipOut(OUT_RANGE, k, kHi, cap);
    return k;
  }

  /**
   * The range bounds of a row, by `which`: true when no point of [k1, m] can reach utilisation
   * ≤ cap (sets cause). Each is monotone in m for a fixed k1 (a wider range only loosens it), which
   * is what skipOut's bisection needs. (5) is pointwise: the shear ratio at the neutral axis is
   * monotone along the row, so a failing m after a failing k1 means all of [k1, m] fail.
   */
  private out(which: number, k1: number, m: number, cap: number): boolean {
    switch (which) {
      case OUT_SHEAR:
        this.cause = C_SHEAR;
        return !this.shearOk(m, cap);
      case OUT_RANGE:
        return this.rangeOut(m, cap); // rangeFrom(k1) was called by skipOut
      case OUT_LTB_EN:
        this.cause = C_LTB;
        return this.ltbOutRow(k1, m, cap);
      default:
        this.cause = C_LTB;
        return this.usLtbOutRow(k1, m, cap);
    }
  }

  /**
   * First index ≥ k (≤ kHi) that the range bound `which` does not exclude at cap, or −1: while
   * the point k itself fails, bisect for the longest run [k, lo] shown failing as a whole and
   * continue after it. Every range bound of a row ((5), (8), (E2), (U2)) goes through here.
   */
  private skipOut(which: number, k: number, kHi: number, cap: number): number {
    this.zzHiK = -1; // shearJump's chord end belongs to this row
    for (let round = 0; round < 64; round++) {
      if (which === OUT_RANGE) this.rangeFrom(k);
      if (!this.out(which, k, k, cap)) return k;
      if (which === OUT_RANGE && this.cause === C_SHEAR) {
        // (8′): jump the run shear excludes in closed form instead of bisecting for it
        const j = this.shearJump(k, kHi, cap);
        if (j > kHi) return this.dead(k, kHi);
        if (j > k) {
          this.t.ruledOut[C_SHEAR] += j - k;
          k = j;
          continue;
        }
      }
      if (k === kHi || this.out(which, k, kHi, cap)) return this.dead(k, kHi);
      let lo = k,
        hi = kHi; // [k, lo] out; [k, hi] not
      while (hi - lo > 1) {
        const m = (lo + hi) >> 1;
        if (this.out(which, k, m, cap)) lo = m;
        else hi = m;
      }
      this.t.ruledOut[this.cause] += hi - k;
      k = hi;
    }
    return k;
  }

  private rk = new Float64Array(KERNEL_OUT);
  /** the plastic modulus at the low end of the range rangeOut bounds (NaN until needed) */
  private rkZz = NaN;

  /** (8) Fixes the low end k of the ranges rangeOut(m) bounds (its plates in this.plates). */
  rangeFrom(k: number): void {
    const fk = this.fk,
      v = this.v;
    v[fk.free] = this.W[k];
    fk.fill(v, this.plates);
    compositeKernel(this.plates, fk.nPlates, this.rk);
    this.rkZz = NaN;
    // the plate holding ȳ(k) strictly inside, with the same total width b just above and below
    // (found once per low end: rangeOut asks it for every m)
    const p = this.plates,
      n = fk.nPlates,
      y1 = this.rk[K_CY];
    this.rkBand = -1;
    const b = plateWidthAt(p, n, y1, 1);
    if (!(b > 0) || b !== plateWidthAt(p, n, y1, -1)) return;
    this.rkB = b;
    for (let i = 0; i < n; i++) {
      const o = i * PLATE_STRIDE;
      if (p[o + 3] < y1 && y1 < p[o + 3] + p[o + 1]) {
        this.rkBand = i;
        return;
      }
    }
  }
  private rkBand = -1;
  private rkB = 0;

  /**
   * (8) Sections with the centroid moving along the row (tee, channel-down, mono-i rows): true
   * when every point of [k, m] (k set by rangeFrom) has a bending or shear utilisation above
   * cap. Over the range Iz ≤ Iz(m) (1); each fibre's distance is least at the end the centroid
   * moves away from it ((2)'s monotone c), so σ ≥ M·c_least/Iz(m). Shear at the centroid:
   * Q(ȳ) = ∫_{y>ȳ}(y − ȳ) dA = ½∫|y − ȳ| dA (as ∫(y − ȳ) dA = 0) ≥ Zz/2, and Zz never falls as
   * material is added ((E1)), so τ(ȳ) ≥ V·Zz(k)/(2·Iz(m)·b), b the width at ȳ, when ȳ stays
   * inside one plate of fixed size over the range (both ends inside it; ȳ moves monotonically).
   * At m = k this is the point's own bending ratio: tight.
   */
  rangeOut(m: number, cap: number): boolean {
    const fk = this.fk,
      ctx = this.ctx,
      v = this.v,
      n = fk.nPlates,
      ko = this.kout,
      rk = this.rk,
      p = this.plates,
      q = this.pHi;
    v[fk.free] = this.W[m];
    fk.fill(v, q);
    compositeKernel(q, n, ko);
    const iz = ko[K_IZ];
    const up = fk.centroidDir > 0;
    const cTop = up ? ko[K_MAXY] - ko[K_CY] : rk[K_MAXY] - rk[K_CY],
      cBot = up ? rk[K_CY] - rk[K_MINY] : ko[K_CY] - ko[K_MINY];
    const aC = ctx.aC * cap,
      aT = ctx.aT * cap;
    const lim = 1 + REL;
    if (ctx.Ms * cTop > aC * iz * lim || ctx.Ms * cBot > aT * iz * lim || ctx.Mh * cTop > aT * iz * lim || ctx.Mh * cBot > aC * iz * lim) {
      this.cause = C_TENS;
      return true;
    }
    if (this.Idefl > iz * cap * lim) {
      this.cause = C_DEFL;
      return true;
    }
    if (ctx.hasShear && ctx.V > 0 && this.rkBand >= 0) {
      const y2 = ko[K_CY],
        b = this.rkB,
        o = this.rkBand * PLATE_STRIDE;
      // ȳ(m) strictly inside the same plate, unchanged along the row, with the same width b
      if (p[o] === q[o] && p[o + 1] === q[o + 1] && p[o + 3] === q[o + 3] && q[o + 3] < y2 && y2 < q[o + 3] + q[o + 1] && b === plateWidthAt(q, n, y2, 1) && b === plateWidthAt(q, n, y2, -1)) {
        if (this.rkZz !== this.rkZz) this.rkZz = plateModulusAbout(p, n, plateNeutralAxis(p, n, rk[K_AREA], rk[K_CY]));
        if (ctx.V * this.rkZz > 2 * iz * b * ctx.aS * cap * lim) {
          this.cause = C_SHEAR;
          return true;
        }
      }
    }
    return false;
  }

  /** (8′) Zz at the row's last point kHi (zzHiK), for shearJump's chord; skipOut forgets it for each row. */
  private zzHi = NaN;
  private zzHiK = -1;

  /**
   * (8′) After rangeOut(k) failed by shear at ȳ(k) (rangeFrom(k) set the plate band): the first
   * index after the run [k, j − 1] that the shear bound excludes as a whole (k when it cannot
   * tell; kHi + 1 when the whole rest of the row fails). For x in the run, with ȳ(x) inside the
   * same band of width b: τ(ȳ(x)) = V·Q(ȳ(x))/(Iz(x)·b), Q(ȳ(x)) ≥ Zz(x)/2 as in (8); Zz is the
   * least over a of ∫|y − a| dA, each affine in the free width, so Zz is concave along the row and
   * lies above its chord between k and the row's last point kHi; Iz(x) ≤ I about ȳ(k), affine in
   * the free width (parallel-axis theorem). So the point fails wherever V·chord(x) > 2·b·aS·cap·
   * I_ȳ(k)(x): an affine inequality, solved in closed form. The band condition is checked at the
   * run's last point (ȳ moves monotonically along the row, so between the ends it stays inside).
   */
  private shearJump(k: number, kHi: number, cap: number): number {
    if (this.rkBand < 0 || k >= kHi || this.rkZz !== this.rkZz) return k;
    const fk = this.fk,
      ctx = this.ctx,
      W = this.W,
      v = this.v,
      n = fk.nPlates,
      p = this.plates,
      q = this.pHi,
      ko = this.kout,
      rk = this.rk;
    const a = rk[K_CY],
      zk = this.rkZz,
      ik = rk[K_IZ],
      w0 = W[k],
      dw = W[kHi] - w0;
    v[fk.free] = W[kHi];
    fk.fill(v, q);
    const iHi = iAbout(q, n, a);
    if (this.zzHiK !== kHi) {
      compositeKernel(q, n, ko);
      this.zzHi = plateModulusAbout(q, n, plateNeutralAxis(q, n, ko[K_AREA], ko[K_CY]));
      this.zzHiK = kHi;
    }
    const sZ = Math.max(0, (this.zzHi - zk) / dw),
      sI = (iHi - ik) / dw;
    const C = 2 * this.rkB * ctx.aS * cap * (1 + REL);
    const f0 = ctx.V * zk - C * ik,
      f1 = ctx.V * sZ - C * sI;
    if (!(f0 > 0)) return k;
    // the run: points whose free width is below w0 + Δ*, narrowed by REL (never cuts a point at the bound)
    const j = f1 >= 0 ? kHi + 1 : firstAtLeastWidened(W, w0 - f0 / f1);
    if (j <= k + 1) return k;
    // ȳ at the run's last point strictly inside the same band, of the same width
    const last = Math.min(j - 1, kHi);
    v[fk.free] = W[last];
    fk.fill(v, q);
    compositeKernel(q, n, ko);
    const y2 = ko[K_CY],
      b = this.rkB,
      o = this.rkBand * PLATE_STRIDE;
    if (!(p[o] === q[o] && p[o + 1] === q[o + 1] && p[o + 3] === q[o + 3] && q[o + 3] < y2 && y2 < q[o + 3] + q[o + 1] && b === plateWidthAt(q, n, y2, 1) && b === plateWidthAt(q, n, y2, -1))) return k;
    return j;
  }

  // ---- EN 1993 (E) -----------------------------------------------------------------------

  /** (E1) An upper bound on fy over the row's points [k1, k2] ((U1): the plate Fy, one value). */
  enFyMax(k1: number, k2: number): number {
    if (this.us) return this.us.Fy;
    const e = this.en!,
      v = this.v;
    const T = this.enT;
    if (T.length > 0) {
      let t = 0;
      for (let i = 0; i < T.length; i++) if (v[T[i]] > t) t = v[T[i]];
      return fyFor(e, t);
    }
    // rectangle [b, d]: its smaller side chooses the band (member-checks.md) and grows with b
    const d = v[1];
    return fyMaxOver(e, Math.min(this.W[k1], d), Math.min(this.W[k2], d));
  }

  /** (E1) The least plastic modulus a point can have and reach utilisation ≤ cap, with fy ≤ fy. */
  enZreq(fy: number, cap: number): number {
    return (this.mMax * this.enGamma) / (fy * cap);
  }

  /**
   * (E6) W over a range whose every point has a compressed flange of class 3 or 4 (c/t > 10ε,
   * Table 5.2 sheet 2; class 4 fails anyway): such a point is checked with W = Wel,min =
   * Iz/max(c_top, c_bot) (en1993.ts), at most izHi/max(cTopMin, cBotMin) with Iz at most izHi and
   * each fibre distance at least its least over the range; otherwise zz (W ≤ Zz, (E1)). The
   * flanges' least widths over the range decide (c/t rises with the width); ε from the thickest
   * plate's fy, fixed with the thicknesses (i, mono-i).
   */
  enWUpper(zz: number, izHi: number, cTopMin: number, cBotMin: number, bTopMin: number, tTop: number, bBotMin: number, tBot: number, tw: number): number {
    const lim = 20 * Math.sqrt(235 / this.enFyMax(0, 0)) * (1 + REL);
    const ctx = this.ctx;
    if ((ctx.Ms > 0 && bTopMin - tw > lim * tTop) || (ctx.Mh > 0 && bBotMin - tw > lim * tBot)) {
      const w = izHi / Math.max(cTopMin, cBotMin);
      return w < zz ? w : zz;
    }
    return zz;
  }

  /** (E4) The row's fixed plates leave no welded point a utilisation ≤ cap (the 3 mm least throat). */
  enRowOut(cap: number): boolean {
    const fam = this.fk.family,
      v = this.v;
    if (fam === "rectangle") return false;
    const t = fam === "mono-i" ? v[5] : Math.min(v[2], v[3]);
    return MIN_WELD_THROAT > 0.7 * t * cap * (1 + REL);
  }

  /** (E1) First index ≥ k (≤ kHi) whose plastic modulus can reach the requirement, or −1. */
  enZStart(k: number, kHi: number, cap: number): number {
    const fk = this.fk,
      W = this.W,
      v = this.v,
      p = this.plates,
      ko = this.kout,
      n = fk.nPlates,
      f = fk.free;
    const req = this.enZreq(this.enFyMax(k, kHi), cap) * (1 - REL);
    for (let iter = 0; iter < 12; iter++) {
      const b = W[k];
      v[f] = b;
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      const a = this.sym ? 0.5 * ko[K_MAXY] : plateNeutralAxis(p, n, ko[K_AREA], ko[K_CY]);
      const Z = plateModulusAbout(p, n, a);
      if (Z >= req) return k;
      this.cause = C_BEND;
      if (k === kHi) return this.dead(k, kHi);
      // ∫|y − a| dA about this point's equal-area axis a: Zz there, affine in the free width, ≥ Zz everywhere
      v[f] = W[kHi];
      fk.fill(v, p);
      const zHi = plateModulusAbout(p, n, a);
      if (zHi < req) return this.dead(k, kHi);
      const bNeed = b + (req - Z) / ((zHi - Z) / (W[kHi] - b));
      let k2 = firstAtLeastWidened(W, bNeed);
      if (k2 <= k) k2 = k + 1;
      if (k2 > kHi) return this.dead(k, kHi);
      this.t.ruledOut[C_BEND] += k2 - k;
      k = k2;
    }
    return k;
  }

  /**
   * (U2), (U4) True when no point of an i row's range [k1, k2] (b from W[k1] to W[k2]) can have
   * its bending-resistance and LTB utilisations ≤ cap: M·γ > cap·min(bendUpperI, ltbUpperI) with
   * the properties at both ends (upper bounds on Mn over the range, proven in aisc360.ts).
   */
  usLtbOutRow(k1: number, k2: number, cap: number): boolean {
    const v = this.v,
      W = this.W,
      lo = this.usLo,
      hi = this.usHi;
    // family i in closed form (rectangles, engine contract): A, Iz, Iy, J (Σ long·short³/3, as
    // stability.ts), Cw = tf·b³·h0²/24, Zx about mid-depth
    const d = v[0],
      tf = v[2],
      tw = v[3],
      h = d - 2 * tf,
      h0 = d - tf;
    for (let end = 0; end < 2; end++) {
      const o = end === 0 ? lo : hi;
      const b = W[end === 0 ? k1 : k2];
      o[0] = 2 * b * tf + h * tw;
      o[1] = (b * d * d * d - (b - tw) * h * h * h) / 12;
      o[2] = (2 * tf * b * b * b + h * tw * tw * tw) / 12;
      o[3] = (2 * (b > tf ? b * tf * tf * tf : tf * b * b * b) + (h > tw ? h * tw * tw * tw : tw * h * h * h)) / 3;
      o[4] = (tf * b * b * b * h0 * h0) / 24;
      o[5] = b * tf * h0 + (tw * h * h) / 4;
      o[6] = b;
    }
    const M = Math.max(this.ctx.Ms, this.ctx.Mh);
    const e = this.us!;
    let ub = bendUpperI(e, d, tf, tw, lo, hi);
    if (e.restraint) {
      const l = ltbUpperI(e, d, tf, tw, lo, hi);
      if (l < ub) ub = l;
    }
    return M * this.enGamma > ub * cap * (1 + REL);
  }
  readonly usLo = new Float64Array(8);
  readonly usHi = new Float64Array(8);

  /**
   * (E2) True when no point of the row's range [k1, k2] can have every LTB utilisation ≤ cap:
   * the resistance bound of enLtbOut with Iy, Cw, J, Zz and the curve at k2 (each monotone in
   * the free width) and zg, betaX bounded over the range.
   */
  ltbOutRow(k1: number, k2: number, cap: number): boolean {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      f = fk.free,
      n = fk.nPlates,
      ko = this.kout,
      st = this.st,
      pHi = this.pHi;
    v[f] = W[k2];
    fk.fill(v, pHi);
    compositeKernel(pHi, n, ko);
    const d = ko[K_MAXY],
      iyHi = ko[K_IY],
      izHi = ko[K_IZ],
      yHi = ko[K_CY];
    let zz = plateModulusAbout(pHi, n, this.sym ? 0.5 * d : plateNeutralAxis(pHi, n, ko[K_AREA], yHi));
    // (E6) family i: ȳ = d/2, both flanges of width b ≥ W[k1]
    if (fk.family === "i") zz = this.enWUpper(zz, izHi, 0.5 * d, 0.5 * d, W[k1], v[2], W[k1], v[2], v[3]);
    stabilityKernel(fk.family, v, st);
    const cw = st[ST_CW],
      j = st[ST_J];
    const narrow = fk.family === "mono-i" ? Math.min(v[1], v[3]) : v[f];
    const aLT = ltbCurveC(fk.family, d, narrow) ? ALPHA_LT_C : ALPHA_LT_D;
    const fy = this.enFyMax(k1, k2);
    const r = this.rng;
    if (fk.family === "tee" || fk.family === "mono-i") {
      const sHi = st[ST_SCY];
      v[f] = W[k1];
      fk.fill(v, this.pLo);
      compositeKernel(this.pLo, n, ko);
      stabilityKernel(fk.family, v, st);
      const yLo = ko[K_CY],
        sLo = st[ST_SCY];
      // ȳ and the shear centre move monotonically with the free width: their ends bound them
      this.enTRange(n, Math.min(yLo, yHi), Math.max(yLo, yHi), Math.min(sLo, sHi), Math.max(sLo, sHi), ko[K_IZ], izHi, d);
      // (E6) mono-i: bt fixed, bb from W[k1]; c_top least where ȳ is greatest, c_bot where least
      if (fk.family === "mono-i") zz = this.enWUpper(zz, izHi, d - Math.max(yLo, yHi), Math.min(yLo, yHi), v[1], v[2], W[k1], v[4], v[5]);
    } else {
      // i, channel, box, rectangle: betaX = 0 and the shear centre at mid-depth, fixed along the row
      r[0] = r[1] = loadHeight(this.en!, d, st[ST_SCY]);
      r[2] = r[3] = st[ST_BETA];
    }
    return this.enLtbOut(iyHi, cw, j, zz, fy, aLT, cap);
  }

  /**
   * (E2) Bounds on zg and betaX (into rng: zgLo, zgHi, betaLo, betaHi) over a range of widths:
   * plate widths between pLo's and pHi's (same heights), centroid height ȳ in [yLo, yHi], shear
   * centre height in [sLo, sHi], Iz in [izLo, izHi]. betaX = (1/Iz)·Σ∫v(w² + v²)dA − 2(ȳ − ysc)
   * (member-checks.md §1, v = ȳ − y, each plate centred on the symmetry axis). A plate of width
   * B over [y1, y2] gives (B³/12)·S1 + B·S3 with S1 = ∫v dy, S3 = ∫v³ dy over its height, both
   * increasing in ȳ (derivatives y2 − y1 > 0 and v2³ − v1³ > 0); interval products over B > 0
   * and S1, S3 at ȳ's ends, then ÷ Iz > 0 and − 2(ȳ − ysc). zg (loadHeight) is affine in ysc.
   */
  enTRange(n: number, yLo: number, yHi: number, sLo: number, sHi: number, izLo: number, izHi: number, d: number): void {
    let nLo = 0,
      nHi = 0;
    for (let i = 0; i < n; i++) {
      const o = i * PLATE_STRIDE;
      const b1 = this.pLo[o],
        b2 = this.pHi[o],
        y1 = this.pLo[o + 3],
        y2 = y1 + this.pLo[o + 1];
      const c1 = (b1 * b1 * b1) / 12,
        c2 = (b2 * b2 * b2) / 12;
      // at ȳ = yLo (least S1, S3) and ȳ = yHi (greatest)
      let u1 = yLo - y2,
        u2 = yLo - y1;
      const s1a = (u2 * u2 - u1 * u1) / 2,
        s3a = (u2 * u2 * u2 * u2 - u1 * u1 * u1 * u1) / 4;
      u1 = yHi - y2;
      u2 = yHi - y1;
      const s1b = (u2 * u2 - u1 * u1) / 2,
        s3b = (u2 * u2 * u2 * u2 - u1 * u1 * u1 * u1) / 4;
      nLo += (s1a >= 0 ? c1 * s1a : c2 * s1a) + (s3a >= 0 ? b1 * s3a : b2 * s3a);
      nHi += (s1b >= 0 ? c2 * s1b : c1 * s1b) + (s3b >= 0 ? b2 * s3b : b1 * s3b);
    }
    // relaxed outward so rounding in these sums never narrows the range
    const slack = REL * (Math.abs(nLo) + Math.abs(nHi)) + 1e-300;
    nLo -= slack;
    nHi += slack;
    const qLo = nLo >= 0 ? nLo / izHi : nLo / izLo,
      qHi = nHi >= 0 ? nHi / izLo : nHi / izHi;
    const r = this.rng,
      e = this.en!;
    const z1 = loadHeight(e, d, sLo),
      z2 = loadHeight(e, d, sHi);
    const zs = REL * (Math.abs(z1) + Math.abs(z2) + d);
    r[0] = Math.min(z1, z2) - zs;
    r[1] = Math.max(z1, z2) + zs;
    const bs = REL * (Math.abs(qLo) + Math.abs(qHi) + d);
    r[2] = qLo - 2 * (yHi - sLo) - bs;
    r[3] = qHi - 2 * (yLo - sHi) + bs;
  }

  /**
   * (E2) With zg, betaX bounds in rng: true when for some moment sign M > cap·Mb,Rd even with
   * Iy, Cw, J, Zz at their upper bounds, zj and zg at the ends that lower t = C2·zg − C3·zj, the
   * smaller imperfection factor and fy ≤ fy. Mcr grows with Iy, Cw, J and falls with t, and
   * Mb = χLT(√(W·fy/Mcr))·W·fy/γM1 grows with W·fy and with Mcr (proofs in the header), W ≤ Zz.
   */
  enLtbOut(iy: number, cw: number, j: number, zz: number, fy: number, aLT: number, cap: number): boolean {
    const e = this.en!,
      ctx = this.ctx,
      r = this.rng;
    const wfy = zz * fy;
    for (let sgn = 0; sgn < 2; sgn++) {
      const M = sgn === 0 ? ctx.Ms : ctx.Mh;
      if (!(M > 0)) continue;
      // zj = βc/2, βc = betaX sagging, −betaX hogging
      const zjLo = sgn === 0 ? r[2] / 2 : -r[3] / 2,
        zjHi = sgn === 0 ? r[3] / 2 : -r[2] / 2;
      const t = e.C2 * (e.C2 >= 0 ? r[0] : r[1]) - e.C3 * (e.C3 >= 0 ? zjHi : zjLo);
      const mcr = criticalMoment(e, iy, cw, j, t);
      const mb = (chiLT(Math.sqrt(wfy / mcr), aLT) * wfy) / e.gM1;
      if (M > mb * cap * (1 + REL)) return true;
    }
    return false;
  }

  /**
   * (E3) After a failed evaluation under EN 1993: true when every wider point of the row fails
   * too. Shear (resistance or buckling): VRd depends only on the row's fixed d, plates and fy
   * (all but the rectangle). Class 4: a flange's c/t grows with its width against a limit fixed
   * along the row (ε is the row's), a web or stem of i, channel, box, tee is fixed; the mono-i
   * web under sagging only: its ψ rises as bb widens (the centroid falls), so its class-3 limit
   * (falling in ψ) only tightens. A hogging mono-i web can improve as bb widens: no conclusion.
   */
  enFailEndsRow(s: Scratch): boolean {
    const g = s.governing,
      fam = this.fk.family;
    if (g === C_VPL || g === C_VB) return fam !== "rectangle";
    if (g !== C_CLASS4) return false;
    const x = s.en as En1993Scratch;
    for (let i = 0; i < x.nEl; i++) {
      if (x.elClass[i] !== 4) continue;
      if (fam !== "mono-i" || x.elName[i] !== EL_WEB || x.elUnder[i] === 1) return true;
    }
    return false;
  }

  /**
   * (U3) After a failed evaluation under AISC 360: true when every wider point of the row fails
   * too. class-4 (aisc360.ts: web h/tw over 260, a channel's noncompact web, a box's slender web)
   * and J10 (tw, the bottom flange's tf, d, lb, Fy) depend on the row's fixed plates only; so does
   * shear (Aw = d·tw or 2·h·tw, h/tw, Cv) except for the bar (Aw = b·d). The weld for i, channel
   * and box: Qf/Iz = c·b/(a·b + e) with a, c, e > 0 fixed along the row rises with b, so q and the
   * leg needed rise, against the same Table J2.4 minimum and the same thinner part joined.
   */
  usFailEndsRow(s: Scratch): boolean {
    const g = s.governing,
      fam = this.fk.family;
    if (g === C_CLASS4 || g === C_BEARING) return true;
    if (g === C_VPL || g === C_VB) return fam !== "rectangle";
    if (g === C_WELD) return fam === "i" || fam === "channel" || fam === "box";
    if (g === C_BEND && fam === "i") {
      // (U3) a slender flange's local buckling, F3-2 / F4-14: 0.9·E·kc·Sx/λ² with λ = b/(2·tf),
      // Sx = 2·(a·b + c)/d affine in b and kc fixed (h/tw fixed): Sx/b² falls as b grows
      // (derivative −(a·b + 2c)/b³), and λ > λr stays so; F5's Rpg rises with b, so not F5
      const x = s.us as AiscScratch;
      const w = x.f[0].on ? x.f[0] : x.f[1];
      return w.fCls === 2 && (w.sec === 1 || w.sec === 2) && w.MnLocal === w.flb;
    }
    return false;
  }

  private bands = new Float64Array(2);

  /**
   * (7) for a whole mono-i super node: Iz ≥ Iz at the narrowest flanges (1); the top fibre is
   * farthest from the centroid with the narrowest top and widest bottom flange, the bottom
   * fibre with the reverse (the centroid moves toward a widening flange); F is largest with
   * both flanges widest and those distances.
   */
  private superShearOk(jLo: number, jHi: number, kLo: number, kHi: number, cap: number): boolean {
    const fk = this.fk,
      v = this.v,
      p = this.plates,
      ko = this.kout,
      n = fk.nPlates,
      W = this.W,
      sec = fk.second,
      f = fk.free;
    v[sec] = W[jLo];
    v[f] = W[kLo];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const Iz = ko[K_IZ];
    v[f] = W[kHi];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const cTop = ko[K_MAXY] - ko[K_CY];
    v[sec] = W[jHi];
    v[f] = W[kLo];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const cBot = ko[K_CY] - ko[K_MINY];
    v[f] = W[kHi];
    fk.shearBands(v, cTop, cBot, this.bands);
    const tauLb = (this.ctx.V * (Iz - this.bands[0])) / (Iz * this.bands[1]);
    return tauLb <= this.ctx.aS * cap * (1 + REL);
  }

  /**
   * (7) Shear through the web band, for the rest of the row [k, kHi]: ∫Q dy over the depth is
   * Iz, so the web band carries ∫_web Q dy = Iz − F, where F (flange bands) is known exactly;
   * its mean over the band height is at most its maximum, whence
   *   τ_max ≥ V·(Iz − F)/(Iz·A_web_band).
   * Over the rest of the row Iz ≥ Iz(k) (1), F ≤ F at the widest point with each fibre
   * distance at its largest (F grows with the widths and with c; c moves monotonically, as in (2)).
   * False when even that lower bound exceeds the allowable (then no point of the rest passes).
   */
  private webShearOk(k: number, kHi: number, cap: number): boolean {
    const fk = this.fk,
      v = this.v,
      p = this.plates,
      ko = this.kout,
      n = fk.nPlates,
      f = fk.free;
    v[f] = this.W[k];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const Iz = ko[K_IZ];
    let cTop = ko[K_MAXY] - ko[K_CY],
      cBot = ko[K_CY] - ko[K_MINY];
    if (fk.shearDir !== 0 && kHi > k) {
      v[f] = this.W[kHi];
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      // dir +1: the centroid rises, so c_bot is largest at the widest point, c_top now
      if (fk.shearDir > 0) cBot = Math.max(cBot, ko[K_CY] - ko[K_MINY]);
      else cTop = Math.max(cTop, ko[K_MAXY] - ko[K_CY]);
    }
    v[f] = this.W[kHi];
    if (!fk.shearBands(v, cTop, cBot, this.bands)) return true;
    const F = this.bands[0],
      aw = this.bands[1];
    const tauLb = (this.ctx.V * (Iz - F)) / (Iz * aw);
    return tauLb <= this.ctx.aS * cap * (1 + REL);
  }

  private dead(k: number, kHi: number): number {
    this.t.ruledOut[this.cause] += kHi - k + 1;
    return -1;
  }

  /** (5): the shear stress at the neutral axis does not exceed the allowable (necessary). */
  shearOk(k: number, cap: number): boolean {
    const fk = this.fk,
      p = this.plates,
      n = fk.nPlates;
    this.v[fk.free] = this.W[k];
    fk.fill(this.v, p);
    compositeKernel(p, n, this.kout);
    const cy = this.kout[K_CY];
    const q = Math.abs(plateQAbove(p, n, cy, cy));
    const w = Math.max(plateWidthAt(p, n, cy, 1), plateWidthAt(p, n, cy, -1));
    // the contract's maximum at the NA takes the larger of q/w_above, q/w_below; the smaller
    // width gives the larger factor, so the larger width gives a value it cannot be below
    const tau = (this.ctx.V * q) / (this.kout[K_IZ] * w);
    return tau <= this.ctx.aS * cap * (1 + REL);
  }

  depthOf(): number {
    // every family's overall depth is its "d"
    return this.v[this.fk.dims.indexOf("d")];
  }

  /** Pushes a ready row node at its first index not excluded at utilisation ≤ cap, if it can still matter. */
  pushReady(id: number, k: number, kHi: number, cap: number): void {
    const k2 = this.boundRow(k, kHi, cap);
    if (k2 < 0) return;
    const key = this.objectiveAt(k2);
    if (key <= this.limit()) this.push(key, id, k2, this.bHi, KIND_READY, this.bHi - k2 + 1);
  }

  /** the last index boundRow left in the row */
  bHi = 0;

  /**
   * The one bound on a row's points [k, kHi] (every family but mono-i's super nodes, best mode and
   * the grid front alike): the slenderness limits (6) at cap (at cap 1 the seed applied them),
   * in best mode the incumbent's cut, then rowStart's (1)–(8), (E), (U). Returns the first index
   * that can still reach utilisation ≤ cap, its row's last in bHi; −1 when none can.
   */
  boundRow(k: number, kHi: number, cap: number): number {
    if (cap < 1) {
      kHi = this.rowHi(k, kHi, cap);
      if (kHi < 0) return -1;
    }
    const lim = this.limit();
    if (lim < Infinity && k < kHi) {
      // best mode: points heavier than the incumbent can never be popped; the objective is affine
      // in the free width, so they are a tail of the row, cut before the bounds look at it
      const o0 = this.objectiveAt(k),
        o1 = this.objectiveAt(kHi);
      if (o1 > lim) {
        if (o0 > lim) return -1;
        kHi = Math.min(kHi, lastWithin(this.W, k, kHi, o0, o1, lim));
        if (kHi < k) return -1;
      }
    }
    this.bHi = kHi;
    return this.rowStart(k, kHi, cap);
  }

  /** Seeds the family (counting its grid); every seed is pending until the search settles it. */
  seed(): void {
    if (this.pf.axes.some((a) => a.length === 0)) return;
    if (this.fk.second >= 0) {
      // (S) in best mode where LTB is checked (elsewhere the first rows' bounds are tight enough
      // that the first feasible point found is at or near the best): before the ranges are
      // bounded, so they are bounded with its cut. Grid mode has no incumbent's cut to feed.
      if (!this.gridMode && (this.en?.restraint || this.us?.restraint)) this.seedIncumbent();
      this.seedDepthRanges();
    } else if (this.fk.family !== "rectangle") this.seedRowRanges();
    else this.seedRows();
    const sd = this.seeds;
    for (let i = 0; i < sd.size; i++) this.pending += sd.n[i];
  }

  /** Best mode: this family's own best-first search (its heap is its own). */
  run(signal: AbortSignal | undefined, report: () => void): void {
    // Phases, same answer as pushing every seed at once: first the seeds with the ~2000 least
    // keys (cheap to order; they usually hold a good incumbent), then 4× more, and so on until
    // an incumbent exists; then only the seeds that can still beat it. A seed above the
    // incumbent could never be popped, so it never needs to enter the heap.
    const sd = this.seeds,
      n = sd.size,
      h = this.heap;
    if (n > 0) {
      const sample = new Float64Array(Math.min(n, 4096));
      for (let i = 0; i < sample.length; i++) sample[i] = sd.key[Math.floor((i * n) / sample.length)];
      sample.sort();
      let lo = -Infinity;
      // seeds already count as pending: move them to the heap without counting them again
      const move = (i: number) => h.push(sd.key[i], sd.id[i], sd.k[i], sd.hi[i], sd.kind[i], this.fam, sd.n[i]);
      for (let quota = 2000; ; quota *= 4) {
        const q = Math.ceil((sample.length * quota) / n);
        const thr = q >= sample.length ? Infinity : sample[q];
        const hi = Math.min(thr, this.incumbent());
        for (let i = 0; i < n; i++) {
          const key = sd.key[i];
          if (key > lo && key <= hi) move(i);
        }
        this.loop(signal, report);
        if (this.t.stopped) break;
        lo = hi;
        if (hi === Infinity || this.incumbent() <= lo) break;
        if (this.incumbent() < Infinity) {
          // an incumbent now exists: the rest can only matter up to it
          const inc = this.incumbent();
          for (let i = 0; i < n; i++) {
            const key = sd.key[i];
            if (key > lo && key <= inc) move(i);
          }
          this.loop(signal, report);
          break;
        }
      }
    }
    // Everything left (in the heap or never pushed) is pruned by the incumbent (unless the search
    // was stopped: then it is unsettled, and progress keeps counting it as left).
    h.clear();
    this.seeds = new Heap();
    if (!this.t.stopped) this.pending = 0;
  }

  private loop(signal: AbortSignal | undefined, report: () => void): void {
    const h = this.heap;
    let steps = 0;
    while (h.size > 0) {
      if (++steps % ABORT_EVERY === 0) {
        checkAbort(signal);
        report();
        if (this.t.shouldStop()) return;
      }
      if (h.key[0] > this.incumbent()) break;
      h.pop();
      this.pending -= h.outN;
      this.step(h.outKey, h.outId, h.outK, h.outHi, h.outKind, h.outN);
    }
    // Rows left in the heap are pruned by the incumbent, which exists whenever anything was left.
  }

  /**
   * (D) The cap for an entry whose points weigh at least o, at context slot `slot`: 1 in best
   * mode and while the entry may hold its depth's lightest; otherwise the least utilisation of
   * the front strictly lighter than o (below 1e-9 the utilisations carry too few digits,
   * subnormal demands, for the bounds' relative slack: no dominance bound then).
   */
  capAt(o: number, slot: number): number {
    if (!this.gridMode || o <= this.t.ctxObj[slot] * (1 + REL)) return 1;
    const u = Math.min(this.t.front.minUtilBelow(o), this.t.ext.minUtilBelow(o));
    return u < 1 && u > 1e-9 ? u : 1;
  }

  /** capAt for a mono-i depth range (R), depth indices [dA, dB]: 1 while any of its depths may still hold its context point. */
  rangeCapAt(o: number, dA: number, dB: number): number {
    const c = this.t.ctxObj,
      base = this.ctxBase;
    for (let i = dA; i <= dB; i++) if (o <= c[base + i] * (1 + REL)) return 1;
    return this.capAt(o, base + dA);
  }

  /**
   * One popped heap entry. Grid mode first asks what the entry can still give: a context point
   * (its key is within its depth's lightest so far) needs every feasible point, so cap = 1;
   * otherwise only front members, which have utilisation ≤ cap = the least utilisation of the
   * front strictly lighter than the key (D); every bound then runs at that cap.
   */
  step(key: number, id: number, k: number, kHi: number, kind: number, n: number): void {
    if (kind === KIND_ROWRANGE) {
      this.stepRowRange(key, id, k, kHi, n);
      return;
    }
    const fk = this.fk,
      W = this.W;
    this.decode(id);
    const slot = this.gridMode ? this.ctxBase + this.depthIndex(id) : 0;
    let cap = this.capAt(key, slot);
    // Grid mode re-keys an entry whose bound at cap moved up, following the front's cap at each
    // new key in turn (the front only ever lowers it, so the key stays a lower bound), and waits
    // at the last one: the front may have fallen further by the time it pops again.
    if (kind === KIND_DRANGE) {
      if (this.gridMode) {
        // (D) over a depth range: a context point of any of its depths needs cap 1; otherwise
        // the front's cap at the key bounds every point of the range, re-keyed as a super node
        cap = this.rangeCapAt(key, k, kHi);
        if (cap < 1) {
          let o = key;
          for (let it = 0; it < 3; it++) {
            const b = this.dBound(id, k, kHi, cap);
            if (b === null) return;
            k = this.dr.lo;
            kHi = this.dr.hi;
            if (!(b > o * (1 + REKEY))) break;
            o = b;
            cap = this.rangeCapAt(o, k, kHi);
          }
          if (o > key) {
            this.push(o, id, k, kHi, KIND_DRANGE, this.dr.n);
            return;
          }
        }
      }
      this.stepDepthRange(id, k, kHi, cap, n);
      return;
    }
    if (kind === KIND_SUPER) {
      if (cap < 1) {
        const m = this.m;
        let o = key;
        for (let it = 0; it < 3; it++) {
          const b = this.superBound(id, k, kHi, cap);
          if (b === null) return;
          k = m.jLo;
          kHi = m.jHi;
          this.decode(id);
          if (!(b > o * (1 + REKEY))) break;
          o = b;
          cap = this.capAt(o, slot);
        }
        if (o > key) {
          this.push(o, id, k, kHi, KIND_SUPER, (m.jHi - m.jLo + 1) * (m.kHi - m.kLo + 1));
          return;
        }
      }
      if (kHi - k + 1 > SUPER_SPLIT) {
        // branch on bt: each half gets its own (tighter) bound
        const mid = (k + kHi) >> 1;
        this.pushSuper(id, k, mid, cap);
        this.decode(id);
        this.pushSuper(id, mid + 1, kHi, cap);
      } else this.expandSuper(id, k, kHi, cap);
      return;
    }
    if (kind === KIND_RAW) {
      if (cap < 1) {
        let o = key;
        for (let it = 0; it < 32; it++) {
          const b = this.rowRawKey(k, kHi, cap);
          if (b !== b) return;
          if (!(b > o * (1 + REKEY))) break;
          o = b;
          cap = this.capAt(o, slot);
        }
        if (o > key) {
          this.push(o, id, k, kHi, KIND_RAW, kHi - k + 1);
          return;
        }
      }
      this.pushReady(id, k, kHi, cap);
      return;
    }
    // KIND_READY
    if (cap < 1) {
      // (D): drop the points that cannot reach utilisation cap; re-queue at the next one that can
      let moved = false;
      for (let it = 0; it < 8; it++) {
        const k2 = this.boundRow(k, kHi, cap);
        if (k2 < 0) return;
        kHi = this.bHi;
        if (k2 === k) break;
        k = k2;
        moved = true;
        cap = this.capAt(this.objectiveAt(k), slot);
      }
      if (moved) {
        this.push(this.objectiveAt(k), id, k, kHi, KIND_READY, kHi - k + 1);
        return;
      }
    }
    // evaluate the point (same evaluation as brute force)
    this.v[fk.free] = this.W[k];
    this.t.evaluated++;
    const s = this.scratch;
    if (evaluate(fk, this.v, this.ctx, s, false)) {
      const c = this.cand;
      c.objective = s.objective;
      c.area = s.area;
      c.utilisation = s.utilisation;
      c.governing = s.governing;
      if (this.gridMode) {
        offerFeasible(this.t, c, slot - this.ctxBase);
        // the rest of the row is heavier but may reach a lower utilisation: a front matter
        if (k < kHi) this.push(this.objectiveAt(k + 1), id, k + 1, kHi, KIND_READY, kHi - k);
      } else offerFeasible(this.t, c); // the rest of the row is heavier
    } else {
      this.t.ruledOut[s.governing]++;
      if (k < kHi && !(this.en ? this.enFailEndsRow(s) : this.us !== null && this.usFailEndsRow(s))) this.pushReady(id, k + 1, kHi, 1);
    }
  }

  /**
   * A row's first key, by (4) with y0 at mid-depth: I_mid is affine in the free width and
   * Iz ≤ I_mid, so the row needs at least the width where I_mid reaches the base requirement;
   * the objective (also affine) there is a lower bound. NaN when no width in the row can reach
   * it (the row is then ruled out by bending or deflection). Exact for shapes symmetric about z.
   */
  rowRawKey(kLo: number, kHi: number, cap: number): number {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      p = this.plates,
      n = fk.nPlates,
      f = fk.free;
    const d = this.depthOf();
    const req = this.baseIreq(d, cap) * (1 - REL);
    // (E1) the same with the plastic modulus about mid-depth, ∫|y − d/2| dA ≥ Zz, also affine
    const zreq = this.lim ? this.enZreq(this.enFyMax(kLo, kHi), cap) * (1 - REL) : 0;
    v[f] = W[kLo];
    fk.fill(v, p);
    const i0 = iAbout(p, n, d / 2),
      z0 = this.lim ? plateModulusAbout(p, n, d / 2) : 0,
      o0 = objectiveOf(fk, v, p, this.ctx);
    if (i0 >= req && z0 >= zreq) return o0;
    if (kHi === kLo) return this.deadRaw(kLo, kHi, i0 < req ? -1 : C_BEND);
    v[f] = W[kHi];
    fk.fill(v, p);
    const i1 = iAbout(p, n, d / 2),
      z1 = this.lim ? plateModulusAbout(p, n, d / 2) : 0,
      o1 = objectiveOf(fk, v, p, this.ctx);
    if (i1 < req) return this.deadRaw(kLo, kHi, -1);
    if (z1 < zreq) return this.deadRaw(kLo, kHi, C_BEND);
    const x = Math.max(i0 >= req ? 0 : (req - i0) / (i1 - i0), z0 >= zreq ? 0 : (zreq - z0) / (z1 - z0));
    return (o0 + (o1 - o0) * x) * (1 - REL);
  }

  /** Rules the row out for `reason` (cause −1: the I requirement's, bending or deflection). */
  private deadRaw(kLo: number, kHi: number, cause: number): number {
    if (cause < 0) cause = this.Idefl > this.baseIreq(this.depthOf(), 1) * 0.999999 ? C_DEFL : this.ctx.aT <= this.ctx.aC ? C_TENS : C_COMP;
    this.t.ruledOut[cause] += kHi - kLo + 1;
    return NaN;
  }

  /** Every valid row: counts the grid and seeds it with a cheap key. */
  seedRows(): void {
    const fk = this.fk,
      gd = this.groupDims,
      rad = this.radix,
      v = this.v,
      W = this.W;
    const idx = new Int32Array(gd.length);
    for (let j = 0; j < gd.length; j++) v[gd[j]] = this.pf.axes[gd[j]][0];
    let id = 0;
    for (;;) {
      if (fk.groupValid(v)) {
        const kLo = firstAbove(W, fk.freeMin(v));
        if (kLo < W.length) {
          this.t.grid += W.length - kLo;
          const kHi = this.rowHi(kLo, W.length - 1, 1);
          if (kHi >= 0) {
            const key = this.rowRawKey(kLo, kHi, 1);
            if (key === key) this.seeds.append(key, id, kLo, kHi, KIND_RAW, this.fam, kHi - kLo + 1);
          }
        }
      }
      id++;
      let j = gd.length - 1;
      while (j >= 0) {
        idx[j]++;
        if (idx[j] < rad[j]) {
          v[gd[j]] = this.pf.axes[gd[j]][idx[j]];
          break;
        }
        idx[j] = 0;
        v[gd[j]] = this.pf.axes[gd[j]][0];
        j--;
      }
      if (j < 0) break;
    }
  }


  // ---- row families: depth ranges (R′, both passes) -----------------------------------------

  /** what rowRangeBound left: the depth range (indices into the depth axis) and the shapes it stands for */
  private rr = { lo: 0, hi: 0, n: 0 };


  /** Every thickness tuple as one node over its valid depths (R′), bounded at once. */
  /**
   * The seeds' odometer over the group dimensions at positions `outer` (the last turns fastest):
   * advances idx and the matching values in v; false once every combination has been visited.
   */
  private nextCombination(outer: readonly number[], idx: Int32Array): boolean {
    const gd = this.groupDims,
      rad = this.radix,
      v = this.v;
    for (let o = outer.length - 1; o >= 0; o--) {
      const j = outer[o];
      if (++idx[j] < rad[j]) {
        v[gd[j]] = this.pf.axes[gd[j]][idx[j]];
        return true;
      }
      idx[j] = 0;
      v[gd[j]] = this.pf.axes[gd[j]][0];
    }
    return false;
  }

  seedRowRanges(): void {
    const fk = this.fk,
      gd = this.groupDims,
      v = this.v,
      W = this.W,
      ds = this.dSlot,
      D = this.pf.axes[ds];
    const dPos = gd.indexOf(ds);
    const outer = gd.map((_, j) => j).filter((j) => j !== dPos);
    const idx = new Int32Array(gd.length);
    for (let j = 0; j < gd.length; j++) v[gd[j]] = this.pf.axes[gd[j]][0];
    for (;;) {
      const base = this.encode(idx);
      // the geometry rule is d > plates (R′), with the fabrication rules on the thicknesses alone:
      // the valid depths are the ones from the first valid depth on, found by bisection
      const e = D.length - 1;
      v[ds] = D[e];
      if (e >= 0 && fk.groupValid(v)) {
        let lo = -1,
          hi = e; // D[lo] invalid (or none), D[hi] valid
        while (hi - lo > 1) {
          const m = (lo + hi) >> 1;
          v[ds] = D[m];
          if (fk.groupValid(v)) hi = m;
          else lo = m;
        }
        const i = hi;
        v[ds] = D[i];
        // the free width's least value involves no depth (R′)
        const kLo = firstAbove(W, fk.freeMin(v));
        if (kLo < W.length) {
          this.t.grid += (e - i + 1) * (W.length - kLo);
          const key = this.rowRangeBound(base, i, e, 1);
          if (key === key) this.seeds.append(key, base, this.rr.lo, this.rr.hi, KIND_ROWRANGE, this.fam, this.rr.n);
          this.decode(base);
        }
      }
      if (!this.nextCombination(outer, idx)) break;
    }
  }

  /**
   * A popped row depth range (R′): in grid mode first re-keyed at the front's cap while no depth of
   * it may still hold its context point (D); then halved, each half bounded on its own, or, once
   * short, one raw row per depth. n: the shapes it stood for; its children stand for at most that
   * many together, so progress never moves back. Every point of the range that can still matter
   * weighs at least the key (D's argument: the ones lighter than a key bounded at cap are beaten or
   * were never needed for context), so no child is keyed below it.
   */
  private stepRowRange(key: number, id: number, dA: number, dB: number, n: number): void {
    let cap = this.gridMode ? this.rangeCapAt(key, dA, dB) : 1;
    if (cap < 1) {
      let o = key;
      for (let it = 0; it < 8; it++) {
        const b = this.rowRangeBound(id, dA, dB, cap);
        if (b !== b) return;
        dA = this.rr.lo;
        dB = this.rr.hi;
        if (!(b > o * (1 + ROW_REKEY))) break;
        o = b;
        cap = this.rangeCapAt(o, dA, dB);
      }
      if (o > key) {
        this.push(o, id, dA, dB, KIND_ROWRANGE, Math.min(n, this.rr.n));
        return;
      }
    }
    const lim = this.limit();
    if (dB - dA + 1 <= ROW_LEAF) {
      const fk = this.fk,
        W = this.W;
      for (let i = dA; i <= dB; i++) {
        const rid = id + i * this.depthStride;
        this.decode(rid);
        const kLo = firstAbove(W, fk.freeMin(this.v));
        const kHi = this.rowHi(kLo, W.length - 1, cap);
        if (kHi < 0) continue;
        const rk = this.rowRawKey(kLo, kHi, cap);
        // (a dive below may have found an incumbent: the limit is asked for each row)
        const inc = this.limit();
        if (rk !== rk || rk > inc) continue;
        if (inc === Infinity && !this.gridMode) {
          // best mode, no incumbent yet: settle the row now (a dive) for an early incumbent's cut
          this.diveRow(kLo, kHi);
          continue;
        }
        const m = Math.min(kHi - kLo + 1, n);
        n -= m;
        this.push(rk > key ? rk : key, rid, kLo, kHi, KIND_RAW, m);
      }
      return;
    }
    const mid = (dA + dB) >> 1;
    for (let h = 0; h < 2; h++) {
      const b = h === 0 ? this.rowRangeBound(id, dA, mid, cap) : this.rowRangeBound(id, mid + 1, dB, cap);
      if (b === b && b <= lim) {
        const m = Math.min(this.rr.n, n);
        n -= m;
        this.push(b > key ? b : key, id, this.rr.lo, this.rr.hi, KIND_ROWRANGE, m);
      }
    }
  }

  /**
   * Best mode: settles the row in v (its points [k, kHi]) at once, out of the heap's order: its
   * points in objective order, each excluded by the bounds or evaluated, until the first feasible
   * (the rest of the row is heavier) or the end. The heap's order would settle it the same way,
   * only later: a feasible point found here is an incumbent (its cut then shortens every row the
   * bounds look at, the LTB bisections first), never a wrong answer (an evaluated grid point).
   */
  private diveRow(k: number, kHi: number): void {
    const fk = this.fk,
      s = this.scratch;
    for (;;) {
      const k2 = this.boundRow(k, kHi, 1);
      if (k2 < 0) return;
      kHi = this.bHi;
      this.v[fk.free] = this.W[k2];
      this.t.evaluated++;
      if (evaluate(fk, this.v, this.ctx, s, false)) {
        const c = this.cand;
        c.objective = s.objective;
        c.area = s.area;
        c.utilisation = s.utilisation;
        c.governing = s.governing;
        offerFeasible(this.t, c);
        return;
      }
      this.t.ruledOut[s.governing]++;
      if (k2 >= kHi || (this.en ? this.enFailEndsRow(s) : this.us !== null && this.usFailEndsRow(s))) return;
      k = k2 + 1;
    }
  }

  /**
   * (R′) Lower bound on the objective over a row family's depth range: the thicknesses of row id
   * (its depth index 0) fixed, depth indices [dA, dB] (all valid), every free width; NaN when no
   * point can reach utilisation ≤ cap. Narrows the range (into rr): the depth elements of (6), the
   * incumbent's cut (best mode), and the least depth whose widest allowed width can meet (2), (3),
   * (E1), (U1).
   */
  rowRangeBound(id: number, dA: number, dB: number, cap: number): number {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      f = fk.free,
      ds = this.dSlot,
      D = this.pf.axes[ds],
      p = this.plates,
      n = fk.nPlates,
      ko = this.kout,
      out = this.t.ruledOut;
    this.decode(id);
    v[ds] = D[dA];
    const kLo = firstAbove(W, fk.freeMin(v));
    if (kLo >= W.length) return NaN;
    // (6) the width's elements involve no depth; a depth element failing at D[dA] fails deeper
    let kHi = this.rowHi(kLo, W.length - 1, cap);
    if (kHi < 0) return NaN;
    dB = this.rangeDepthHi(dA, dB, kLo, kHi, cap);
    if (dB < dA) return NaN;
    const lim = this.limit();
    const zreq = this.lim ? this.enZreq(this.enFyMax(kLo, kHi), cap) * (1 - REL) : 0;
    for (let round = 0; round < 8; round++) {
      if (lim < Infinity) {
        // best mode: the objective is affine in d and b with positive slopes (R′)
        v[ds] = D[dA];
        v[f] = W[kLo];
        const o0 = this.objectiveOf2();
        if (o0 > lim) return NaN;
        kHi = this.cutAxis(f, W, kLo, kHi, o0, lim);
        dB = this.cutAxis(ds, D, dA, dB, o0, lim);
      }
      const d0 = dA;
      // the least depth that can pass: every point of depths [dA, m] fails once the widest allowed
      // width at depth m falls short of the requirement at dA (monotone in m)
      const req = this.baseIreq(D[dA], cap) * (1 - REL);
      if (this.rangeReqOut(dA, req, zreq, kHi)) {
        if (dA === dB || this.rangeReqOut(dB, req, zreq, kHi)) {
          out[this.cause] += (dB - dA + 1) * (kHi - kLo + 1);
          return NaN;
        }
        let lo = dA,
          hi = dB; // [dA, lo] fails as a whole, [dA, hi] does not
        while (hi - lo > 1) {
          const m = (lo + hi) >> 1;
          if (this.rangeReqOut(m, req, zreq, kHi)) lo = m;
          else hi = m;
        }
        out[this.cause] += (hi - dA) * (kHi - kLo + 1);
        dA = hi;
      }
      if (this.ltbRange) {
        // (E2) over the box [dA, m] × [kLo, kHi]: every point fails when the box bound does, and
        // the bound grows with the box, so bisection raises the least depth
        this.cause = C_LTB;
        if (this.ltbOutRange(dA, dB, kLo, kHi, cap)) {
          out[C_LTB] += (dB - dA + 1) * (kHi - kLo + 1);
          return NaN;
        }
        if (dA < dB && this.ltbOutRange(dA, dA, kLo, kHi, cap)) {
          let lo = dA,
            hi = dB;
          while (hi - lo > 1) {
            const m = (lo + hi) >> 1;
            if (this.ltbOutRange(dA, m, kLo, kHi, cap)) lo = m;
            else hi = m;
          }
          out[C_LTB] += (hi - dA) * (kHi - kLo + 1);
          dA = hi;
        }
      }
      // a raised least depth lowers the incumbent's reach in b and raises the requirement: again
      if (dA === d0) break;
    }
    const d1 = D[dA],
      d2 = D[dB];
    this.rr.lo = dA;
    this.rr.hi = dB;
    this.rr.n = (dB - dA + 1) * (kHi - kLo + 1);
    // (4), (E1) at the deepest depth, about its centroid and equal-area axis at the least width:
    // every point's Iz (Zz) is at most its value at d2 (R′), at most I (∫|y − a| dA) about any axis
    // there, affine in b; the requirements at d1 hold (they do not fall with d); the objective at d1
    const req = this.baseIreq(d1, cap) * (1 - REL);
    v[ds] = d2;
    v[f] = W[kLo];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const y0 = ko[K_CY],
      a = this.lim ? (this.sym ? 0.5 * d2 : plateNeutralAxis(p, n, ko[K_AREA], y0)) : 0;
    const i0 = iAbout(p, n, y0),
      z0 = this.lim ? plateModulusAbout(p, n, a) : 0;
    v[f] = W[kHi];
    fk.fill(v, p);
    const i1 = iAbout(p, n, y0),
      z1 = this.lim ? plateModulusAbout(p, n, a) : 0;
    v[ds] = d1;
    v[f] = W[kLo];
    const o0 = this.objectiveOf2();
    v[f] = W[kHi];
    const o1 = this.objectiveOf2();
    let x = 0;
    if (i0 < req) x = i1 > i0 ? (req - i0) / (i1 - i0) : 1;
    if (z0 < zreq) x = Math.max(x, z1 > z0 ? (zreq - z0) / (z1 - z0) : 1);
    return (o0 + (o1 - o0) * Math.min(1, x)) * (1 - REL);
  }

  /** (R′), (E2) the LTB bound over depth ranges applies: i, channel and box under EN 1993 with a restraint */
  private get ltbRange(): boolean {
    const fam = this.fk.family;
    return this.en !== null && this.en.restraint && (fam === "i" || fam === "channel" || fam === "box");
  }

  /**
   * (R′), (E2) True when no point of depth indices [dA, dB] and width indices [k1, k2] (the
   * thicknesses in v; i, channel, box) can have every LTB utilisation ≤ cap: Iy, Cw, J and Zz at
   * the deepest, widest corner (none falls with d or b: (R′), (E2)); betaX = 0 and the shear
   * centre at mid-depth (stability.ts), so zg = loadHeight at ysc = d/2 is monotone in d and its
   * two ends bound it; curve c if d1/b2 ≤ 2; (E6) for i with c = d1/2 and the least flange width;
   * fy the thickest plate's. enLtbOut at these bounds, as ltbOutRow does for one row.
   */
  private ltbOutRange(dA: number, dB: number, k1: number, k2: number, cap: number): boolean {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      ds = this.dSlot,
      D = this.pf.axes[ds],
      n = fk.nPlates,
      ko = this.kout,
      st = this.st,
      p = this.pHi,
      e = this.en!;
    const d1 = D[dA],
      d2 = D[dB];
    v[ds] = d1;
    v[fk.free] = W[k1];
    stabilityKernel(fk.family, v, st);
    const z1 = loadHeight(e, d1, st[ST_SCY]);
    v[ds] = d2;
    v[fk.free] = W[k2];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    stabilityKernel(fk.family, v, st);
    const z2 = loadHeight(e, d2, st[ST_SCY]);
    const iy = ko[K_IY],
      izHi = ko[K_IZ];
    let zz = plateModulusAbout(p, n, 0.5 * d2);
    if (fk.family === "i") zz = this.enWUpper(zz, izHi, 0.5 * d1, 0.5 * d1, W[k1], v[2], W[k1], v[2], v[3]);
    const aLT = ltbCurveC(fk.family, d1, W[k2]) ? ALPHA_LT_C : ALPHA_LT_D;
    const r = this.rng,
      zs = REL * (Math.abs(z1) + Math.abs(z2) + d2);
    r[0] = Math.min(z1, z2) - zs;
    r[1] = Math.max(z1, z2) + zs;
    r[2] = r[3] = st[ST_BETA];
    return this.enLtbOut(iy, st[ST_CW], st[ST_J], zz, this.enFyMax(k1, k2), aLT, cap);
  }

  /**
   * (R′) True when the widest allowed width kHi at depth index m cannot meet the I requirement req
   * or the plastic modulus requirement zreq (sets cause): by (1) and (R′)'s depth monotonicity no
   * point of a shallower depth or narrower width can either.
   */
  private rangeReqOut(m: number, req: number, zreq: number, kHi: number): boolean {
    const fk = this.fk,
      v = this.v,
      p = this.plates,
      n = fk.nPlates,
      ko = this.kout,
      ds = this.dSlot;
    v[ds] = this.pf.axes[ds][m];
    v[fk.free] = this.W[kHi];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    if (ko[K_IZ] < req) {
      const ctx = this.ctx;
      this.cause = this.Idefl >= req ? C_DEFL : ctx.aT <= ctx.aC ? C_TENS : C_COMP;
      return true;
    }
    if (zreq > 0 && plateModulusAbout(p, n, this.sym ? 0.5 * ko[K_MAXY] : plateNeutralAxis(p, n, ko[K_AREA], ko[K_CY])) < zreq) {
      this.cause = C_BEND;
      return true;
    }
    return false;
  }

  /**
   * (R′), (6) The last depth index in [dA, dB] whose depth elements can pass at cap: every
   * slenderness ratio of the row families either involves no depth or is (d − plates)/t, affine and
   * rising in d (the free width at kLo: the depth elements do not involve it).
   */
  private rangeDepthHi(dA: number, dB: number, kLo: number, kHi: number, cap: number): number {
    const fk = this.fk;
    if (dB === dA || fk.slenderKinds.length === 0) return dB;
    const v = this.v,
      ds = this.dSlot,
      D = this.pf.axes[ds];
    v[fk.free] = this.W[kLo];
    v[ds] = D[dA];
    fk.slender(v, this.slR1);
    v[ds] = D[dB];
    fk.slender(v, this.slR2);
    for (let e = 0; e < fk.slenderKinds.length; e++) {
      const c = fk.slenderKinds[e];
      const lim = this.ctx.slenderLimit[c] * cap;
      const r1 = this.slR1[e],
        r2 = this.slR2[e];
      if (lim !== lim || !(r2 > r1)) continue;
      const h = lastAtMost(D, D[dA] + ((lim - r1) * (D[dB] - D[dA])) / (r2 - r1));
      if (h < dB) {
        this.t.ruledOut[c] += (dB - Math.max(h, dA - 1)) * (kHi - kLo + 1);
        dB = h;
      }
    }
    return dB;
  }

  // ---- mono-i: two widths ----------------------------------------------------------------
  // super node = (d, tft, tfb, tw) with bt index 0 in its id; rows add bt.

  private btRange(cap: number): [number, number] {
    // bt > tw; top outstand (bt − tw)/2/tft ≤ limit (6)
    const fk = this.fk,
      v = this.v,
      W = this.W,
      sec = fk.second;
    const lo = firstAbove(W, fk.secondMin(v));
    let hi = W.length - 1;
    const lim = this.ctx.slenderLimit[3] * cap;
    if (lim === lim && lo < W.length) {
      // (bt − tw)/2/tft is the first slenderness element of mono-i
      v[sec] = W[lo];
      fk.slender(v, this.slR1);
      v[sec] = W[hi];
      fk.slender(v, this.slR2);
      const slope = (this.slR2[0] - this.slR1[0]) / (W[hi] - W[lo]);
      if (hi > lo && slope > 0) {
        const bMax = W[lo] + (lim - this.slR1[0]) / slope;
        hi = Math.min(hi, lastAtMost(W, bMax));
      } else if (this.slR1[0] > lim * (1 + REL)) hi = lo - 1;
    }
    // (E5) a sagging moment compresses the top flange, which must not be class 4
    if (this.en && this.ctx.Ms > 0) hi = Math.min(hi, this.enFlangeHi(v[2], v[5]));
    return [lo, hi];
  }

  /**
   * (E5) Class 4 is excluded (member-checks.md §2 item 1), so a compressed welded outstand needs
   * c/t = (b − tw)/2/t ≤ 14ε (EN 1993-1-1 Table 5.2 sheet 2, no root radius on welded plates),
   * ε from the section's fy (its thickest plate, fixed with the thicknesses): the last width index
   * of a flange of thickness t that can pass, whatever the other dimensions.
   */
  enFlangeHi(t: number, tw: number): number {
    const bMax = 28 * Math.sqrt(235 / this.enFyMax(0, 0)) * t + tw;
    return lastAtMost(this.W, bMax);
  }

  encode(idx: Int32Array): number {
    let id = 0;
    for (let j = 0; j < this.groupDims.length; j++) id = id * this.radix[j] + idx[j];
    return id;
  }

  // affine model of the super node (filled by superBound): I about y0 and objective in (bt, bb)
  private m = { y0: 0, i00: 0, it: 0, ib: 0, o00: 0, ot: 0, ob: 0, bt0: 0, bb0: 0, jLo: 0, jHi: 0, kLo: 0, kHi: 0, req: 0, za: 0, z00: 0, zt: 0, zb: 0, zreq: 0 };

  /** Lower bound on the objective over the super node's (bt, bb) rectangle, or null when none can pass. */
  superBound(id: number, jA: number, jB: number, cap: number): number | null {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      sec = fk.second,
      f = fk.free,
      p = this.plates,
      n = fk.nPlates;
    let [jLo, jHi] = this.btRange(cap);
    jLo = Math.max(jLo, jA);
    jHi = Math.min(jHi, jB);
    if (jHi < jLo) {
      this.t.ruledOut[3] += 1;
      return null;
    }
    let kLo = firstAbove(W, fk.freeMin(v));
    // bottom outstand and web; the top outstand element is held at an allowed bt (jLo)
    v[sec] = W[jLo];
    let kHi = this.rowHi(kLo, W.length - 1, cap);
    if (kHi < 0) return null;
    let req = this.baseIreq(this.depthOf(), cap);
    {
      // (2) with the fibre distances bounded over the box: the centroid moves toward a widening
      // flange, so c_top is least with the widest top and narrowest bottom flange, c_bot the reverse
      const ko = this.kout,
        ctx = this.ctx;
      v[sec] = W[jHi];
      v[f] = W[kLo];
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      const cTop = ko[K_MAXY] - ko[K_CY];
      v[sec] = W[jLo];
      v[f] = W[kHi];
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      const cBot = ko[K_CY] - ko[K_MINY];
      const aC = ctx.aC * cap,
        aT = ctx.aT * cap;
      req = Math.max(req, (ctx.Ms * cTop) / aC, (ctx.Ms * cBot) / aT, (ctx.Mh * cTop) / aT, (ctx.Mh * cBot) / aC);
    }
    req *= 1 - REL;
    if (!this.lim && this.ctx.hasShear && this.ctx.V > 0 && !this.superShearOk(jLo, jHi, kLo, kHi, cap)) {
      this.t.ruledOut[C_SHEAR] += (jHi - jLo + 1) * (kHi - kLo + 1);
      return null;
    }
    const lim = this.limit();
    for (let round = 0; round < 4; round++) {
      const j0 = jLo,
        k0 = kLo;
      if (lim < Infinity) {
        // best mode: the objective is affine in each width, so the points no heavier than the
        // incumbent lie within bt ≤ (its bound at the least bb) and bb ≤ (its bound at the least bt)
        v[sec] = W[jLo];
        v[f] = W[kLo];
        const o00 = this.objectiveOf2();
        if (o00 > lim) return null;
        jHi = this.cutAxis(sec, W, jLo, jHi, o00, lim);
        kHi = this.cutAxis(f, W, kLo, kHi, o00, lim);
        if (jHi < jLo || kHi < kLo) return null;
      }
      if (this.en && this.en.restraint) {
        // (E2) over the box: first the narrowest top flanges, then the narrowest bottom flanges,
        // that cannot pass LTB at cap whatever the other width (the box bound grows with the box)
        this.cause = C_LTB;
        if (this.ltbOutBox(jLo, jHi, kLo, kHi, cap)) {
          this.t.ruledOut[C_LTB] += (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
        // (with an incumbent, the slices below find the least bt at a slice's grain for fewer bounds)
        if (lim === Infinity && this.ltbOutBox(jLo, jLo, kLo, kHi, cap)) {
          let lo = jLo,
            hi = jHi; // [jLo, lo] out, [jLo, hi] not
          while (hi - lo > 1) {
            const mid = (lo + hi) >> 1;
            if (this.ltbOutBox(jLo, mid, kLo, kHi, cap)) lo = mid;
            else hi = mid;
          }
          jLo = hi;
        }
        if (this.ltbOutBox(jLo, jHi, kLo, kLo, cap)) {
          let lo = kLo,
            hi = kHi;
          while (hi - lo > 1) {
            const mid = (lo + hi) >> 1;
            if (this.ltbOutBox(jLo, jHi, kLo, mid, cap)) lo = mid;
            else hi = mid;
          }
          kLo = hi;
        }
        if (lim < Infinity && jHi > jLo) {
          // (R) as dBound: slices of bt, each with the bb the incumbent leaves at its least bt
          let sLo = -1,
            sHi = -1;
          const nj = jHi - jLo + 1,
            d = v[0];
          for (let q = 0; q < SLICES; q++) {
            const ja = jLo + Math.floor((q * nj) / SLICES),
              jb = jLo + Math.floor(((q + 1) * nj) / SLICES) - 1;
            if (jb < ja) continue;
            const kb = this.cutBelow(f, kLo, kHi, W[ja], d, lim);
            v[0] = d;
            if (kb < kLo || this.ltbOutBox(ja, jb, kLo, kb, cap)) continue;
            if (sLo < 0) sLo = ja;
            sHi = jb;
          }
          v[0] = d;
          if (sLo < 0) {
            this.t.ruledOut[C_LTB] += (jHi - jLo + 1) * (kHi - kLo + 1);
            return null;
          }
          jLo = sLo;
          jHi = sHi;
        }
      }
      // a raised lower end lowers the incumbent's reach in the other width: again until settled
      if (lim === Infinity || (jLo === j0 && kLo === k0)) break;
    }
    const m = this.m;
    m.jLo = jLo;
    m.jHi = jHi;
    m.kLo = kLo;
    m.kHi = kHi;
    m.req = req;
    const bt0 = W[jLo],
      bt1 = W[jHi],
      bb0 = W[kLo],
      bb1 = W[kHi];
    m.bt0 = bt0;
    m.bb0 = bb0;
    // (4): I about y0 (mid-depth, then the centroid of the relaxed optimum) is affine in (bt, bb)
    let best = -Infinity;
    let y0 = this.depthOf() / 2;
    const lp = this.lp;
    for (let round = 0; round < 2; round++) {
      const obj = this.lpRound(false, y0, req, bt0, bt1, bb0, bb1);
      if (obj !== obj) {
        this.t.ruledOut[this.ctx.aT <= this.ctx.aC ? C_TENS : C_COMP] += (jHi - jLo + 1) * (kHi - kLo + 1);
        return null;
      }
      if (obj > best) {
        best = obj;
        m.y0 = y0;
        m.i00 = lp.c00;
        m.it = lp.ct;
        m.ib = lp.cb;
        m.o00 = lp.o00;
        m.ot = lp.ot;
        m.ob = lp.ob;
      }
      if (req <= 0) break;
      // second round: y0 at the centroid of the relaxed optimum
      v[sec] = lp.bt;
      v[f] = lp.bb;
      fk.fill(v, p);
      compositeKernel(p, n, this.kout);
      y0 = this.kout[K_CY];
    }
    if (!this.lim && req > 0) {
      // (2′), (8″) over the points that can pass: rounds while the requirement rises
      this.lpRound(false, m.y0, req, bt0, bt1, bb0, bb1);
      for (let round = 0; round < 4; round++) {
        const r = this.passReq(req, v[0], bt0, bt1, bb0, bb1, cap);
        if (!(r > req * (1 + 1e-3))) break;
        req = r;
        const obj = this.lpRound(false, m.y0, req, bt0, bt1, bb0, bb1);
        if (obj !== obj) {
          this.t.ruledOut[this.cause] += (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
        const lp = this.lp;
        m.req = req;
        m.i00 = lp.c00;
        m.it = lp.ct;
        m.ib = lp.cb;
        m.o00 = lp.o00;
        m.ot = lp.ot;
        m.ob = lp.ob;
        if (obj > best) best = obj;
      }
    }
    m.zreq = 0;
    if (this.lim) {
      // (E1): ∫|y − a| dA about a fixed a is affine in (bt, bb) and ≥ Zz: the same knapsack on it,
      // a at mid-depth, then at the equal-area axis of the relaxed optimum
      const zreq = this.enZreq(this.enFyMax(0, 0), cap) * (1 - REL);
      m.zreq = zreq;
      let a = this.depthOf() / 2,
        bestZ = -Infinity;
      for (let round = 0; round < 2; round++) {
        const obj = this.lpRound(true, a, zreq, bt0, bt1, bb0, bb1);
        if (obj !== obj) {
          this.t.ruledOut[C_BEND] += (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
        if (obj > bestZ) {
          bestZ = obj;
          m.za = a;
          m.z00 = lp.c00;
          m.zt = lp.ct;
          m.zb = lp.cb;
          m.o00 = lp.o00;
          m.ot = lp.ot;
          m.ob = lp.ob;
        }
        v[sec] = lp.bt;
        v[f] = lp.bb;
        fk.fill(v, p);
        compositeKernel(p, n, this.kout);
        a = plateNeutralAxis(p, n, this.kout[K_AREA], this.kout[K_CY]);
      }
      if (bestZ > best) best = bestZ;
    }
    void id;
    // a key must stay at or below every point's objective in floating point too (grid mode
    // compares it with the front's objectives exactly): relax it
    return best * (1 - REL);
  }

  private lp = { c00: 0, ct: 0, cb: 0, o00: 0, ot: 0, ob: 0, bt: 0, bb: 0 };

  /** The objective at the widths now in v (fills the plates). */
  /**
   * The incumbent's cut along one axis of a box (the header's "objective is affine in d, bt, bb with
   * positive slopes"): [lo, hi] of the dimension in slot (values A) shrunk to the points no heavier
   * than lim, with the objective o0 at A[lo] and the other dimensions as v holds them; v[slot] is
   * left at A[lo].
   */
  private cutAxis(slot: number, A: Float64Array, lo: number, hi: number, o0: number, lim: number): number {
    if (hi <= lo) return hi;
    const v = this.v;
    v[slot] = A[hi];
    const o1 = this.objectiveOf2();
    v[slot] = A[lo];
    return o1 > lim ? Math.min(hi, lastWithin(A, lo, hi, o0, o1, lim)) : hi;
  }

  private objectiveOf2(): number {
    this.fk.fill(this.v, this.plates);
    return objectiveOf(this.fk, this.v, this.plates, this.ctx);
  }

  /**
   * (2′), (8″) A mono-i box's I requirement from the points that can pass (allowable stresses).
   * Each such point has I about y0 ≥ req, y0 the model's axis in this.lp (Iz ≤ I about any axis),
   * the model being affine in (bt, bb) with positive slopes: bb ≥ bbMin(bt), falling with bt, and
   * bt ≥ btMin(bb). The centroid rises with bt and falls with bb (R), so c_top is least at
   * (bt1, bbMin(bt1)) and c_bot at (btMin(bb1), bb1); with d at the box's least depth (both rise
   * with d, (R)). When both exceed their flange's thickness, ȳ lies in the web at every such point,
   * where the shear stress is V·Q(ȳ)/(Iz·tw) with Q(ȳ) ≥ Zz/2 ((8)), and Zz, rising with d, bt
   * and bb, is at least its value at (btMin(bb1), bbMin(bt1)). So Iz ≥ M·c/σ at each fibre and
   * Iz ≥ V·Zz/(2·tw·τ): the larger requirement, at utilisation ≤ cap (cause set for a caller that
   * finds it cannot be met).
   */
  private passReq(req: number, d: number, bt0: number, bt1: number, bb0: number, bb1: number, cap: number): number {
    const fk = this.fk,
      v = this.v,
      sec = fk.second,
      f = fk.free,
      p = this.plates,
      n = fk.nPlates,
      ko = this.kout,
      lp = this.lp,
      ctx = this.ctx;
    const bbAt = lp.cb > 0 ? Math.min(bb1, Math.max(bb0, bb0 + (req - lp.c00 - lp.ct * (bt1 - bt0)) / lp.cb)) : bb0,
      btAt = lp.ct > 0 ? Math.min(bt1, Math.max(bt0, bt0 + (req - lp.c00 - lp.cb * (bb1 - bb0)) / lp.ct)) : bt0;
    v[0] = d;
    v[sec] = bt1;
    v[f] = bbAt;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const cTop = ko[K_MAXY] - ko[K_CY];
    v[sec] = btAt;
    v[f] = bb1;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const cBot = ko[K_CY] - ko[K_MINY];
    const aC = ctx.aC * cap,
      aT = ctx.aT * cap;
    const rt = Math.max((ctx.Ms * cTop) / aC, (ctx.Mh * cTop) / aT),
      rb = Math.max((ctx.Ms * cBot) / aT, (ctx.Mh * cBot) / aC);
    let r = Math.max(rt, rb);
    this.cause = ctx.Ms >= ctx.Mh === rt >= rb ? C_COMP : C_TENS;
    if (ctx.hasShear && ctx.V > 0 && cTop > v[2] && cBot > v[4]) {
      v[sec] = btAt;
      v[f] = bbAt;
      fk.fill(v, p);
      compositeKernel(p, n, ko);
      const zz = plateModulusAbout(p, n, plateNeutralAxis(p, n, ko[K_AREA], ko[K_CY]));
      const rs = (ctx.V * zz) / (2 * v[5] * ctx.aS * cap);
      if (rs > r) {
        r = rs;
        this.cause = C_SHEAR;
      }
    }
    return r * (1 - REL);
  }

  /**
   * One fractional knapsack over the box [bt0, bt1] × [bb0, bb1]: least objective with a measure
   * affine in (bt, bb) at least req; the measure is I about y0 (useZ false, (4)) or ∫|y − y0| dA
   * (useZ true, (E1)), both from the plates at three corners. The objective is affine too; the
   * width with more measure per unit objective is taken first (both objective slopes > 0).
   * Leaves the model and the relaxed optimum in this.lp; NaN when even both widths in full fall short.
   */
  private lpRound(useZ: boolean, y0: number, req: number, bt0: number, bt1: number, bb0: number, bb1: number): number {
    const fk = this.fk,
      v = this.v,
      sec = fk.second,
      f = fk.free,
      p = this.plates,
      n = fk.nPlates,
      lp = this.lp,
      ctx = this.ctx;
    const measure = useZ ? plateModulusAbout : iAbout;
    v[sec] = bt0;
    v[f] = bb0;
    fk.fill(v, p);
    const c00 = measure(p, n, y0),
      o00 = objectiveOf(fk, v, p, ctx);
    v[sec] = bt1;
    fk.fill(v, p);
    const ct = bt1 > bt0 ? (measure(p, n, y0) - c00) / (bt1 - bt0) : 0,
      ot = bt1 > bt0 ? (objectiveOf(fk, v, p, ctx) - o00) / (bt1 - bt0) : 0;
    v[sec] = bt0;
    v[f] = bb1;
    fk.fill(v, p);
    const cb = bb1 > bb0 ? (measure(p, n, y0) - c00) / (bb1 - bb0) : 0,
      ob = bb1 > bb0 ? (objectiveOf(fk, v, p, ctx) - o00) / (bb1 - bb0) : 0;
    lp.c00 = c00;
    lp.ct = ct;
    lp.cb = cb;
    lp.o00 = o00;
    lp.ot = ot;
    lp.ob = ob;
    return this.knapsack(req, bt0, bt1, bb0, bb1);
  }

  /** The knapsack on the affine model in this.lp (measure c00 + ct·Δbt + cb·Δbb ≥ req at least objective). */
  private knapsack(req: number, bt0: number, bt1: number, bb0: number, bb1: number): number {
    const lp = this.lp,
      c00 = lp.c00,
      ct = lp.ct,
      cb = lp.cb,
      o00 = lp.o00,
      ot = lp.ot,
      ob = lp.ob;
    let deficit = req - c00;
    let bt = bt0,
      bb = bb0,
      obj = o00;
    if (deficit > 0) {
      const topFirst = (ct > 0 ? ct / ot : 0) >= (cb > 0 ? cb / ob : 0);
      for (let pass = 0; pass < 2; pass++) {
        const top = (pass === 0) === topFirst;
        const di = top ? ct : cb;
        if (deficit <= 0 || !(di > 0)) continue;
        const x = Math.min(top ? bt1 - bt0 : bb1 - bb0, deficit / di);
        deficit -= x * di;
        obj += x * (top ? ot : ob);
        if (top) bt += x;
        else bb += x;
      }
      if (deficit > REL * req) return NaN;
    }
    lp.bt = bt;
    lp.bb = bb;
    return obj;
  }

  /**
   * (E2) True when no point of the mono-i box bt ∈ [W[j1], W[j2]], bb ∈ [W[k1], W[k2]] can have
   * every LTB utilisation ≤ cap: Iy, Cw, J, Zz and the curve at the widest corner (each grows
   * with both widths); the centroid and the shear centre rise with bt and fall with bb, so their
   * extremes sit at the two mixed corners; Iz between the narrowest and widest corners.
   */
  ltbOutBox(j1: number, j2: number, k1: number, k2: number, cap: number): boolean {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      sec = fk.second,
      f = fk.free,
      n = fk.nPlates,
      ko = this.kout,
      st = this.st,
      p = this.plates;
    v[sec] = W[j2];
    v[f] = W[k2];
    fk.fill(v, this.pHi);
    compositeKernel(this.pHi, n, ko);
    const d = ko[K_MAXY],
      iy = ko[K_IY],
      izHi = ko[K_IZ];
    let zz = plateModulusAbout(this.pHi, n, plateNeutralAxis(this.pHi, n, ko[K_AREA], ko[K_CY]));
    stabilityKernel(fk.family, v, st);
    const cw = st[ST_CW],
      j = st[ST_J];
    const aLT = ltbCurveC(fk.family, d, Math.min(W[j2], W[k2])) ? ALPHA_LT_C : ALPHA_LT_D;
    const fy = this.enFyMax(0, 0);
    v[sec] = W[j1];
    v[f] = W[k1];
    fk.fill(v, this.pLo);
    compositeKernel(this.pLo, n, ko);
    const izLo = ko[K_IZ];
    v[sec] = W[j1];
    v[f] = W[k2];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    stabilityKernel(fk.family, v, st);
    const yMin = ko[K_CY],
      sMin = st[ST_SCY];
    v[sec] = W[j2];
    v[f] = W[k1];
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    stabilityKernel(fk.family, v, st);
    this.enTRange(n, yMin, ko[K_CY], sMin, st[ST_SCY], izLo, izHi, d);
    // (E6) ȳ is least at (j1, k2), greatest at (j2, k1)
    zz = this.enWUpper(zz, izHi, d - ko[K_CY], yMin, W[j1], v[2], W[k1], v[4], v[5]);
    return this.enLtbOut(iy, cw, j, zz, fy, aLT, cap);
  }

  /** Bounds a super node over bt indices [jA, jB] at cap and pushes it (k, hi = its bt range) if it can still matter. */
  private pushSuper(id: number, jA: number, jB: number, cap: number): void {
    const bound = this.superBound(id, jA, jB, cap);
    const m = this.m;
    if (bound !== null && bound <= this.limit()) this.push(bound, id, m.jLo, m.jHi, KIND_SUPER, (m.jHi - m.jLo + 1) * (m.kHi - m.kLo + 1));
  }

  /** Pops of a small super node: one raw row per bt, keyed by the affine model's bound for that bt. */
  expandSuper(id: number, jA: number, jB: number, cap: number): void {
    if (this.superBound(id, jA, jB, cap) === null) return;
    const m = this.m,
      W = this.W,
      inc = this.limit();
    const secPos = this.groupDims.indexOf(this.fk.second);
    // the second width's radix position: id with bt index j = id + j·stride
    let stride = 1;
    for (let j = this.groupDims.length - 1; j > secPos; j--) stride *= this.radix[j];
    for (let j = m.jLo; j <= m.jHi; j++) {
      const bt = W[j];
      let bb = m.bb0;
      // least bb each affine model allows at this bt: I (4), and under EN 1993 ∫|y − a| dA (E1)
      const deficit = m.req - (m.i00 + m.it * (bt - m.bt0));
      if (deficit > 0) {
        if (!(m.ib > 0)) continue;
        bb = m.bb0 + deficit / m.ib;
      }
      const zDeficit = m.zreq - (m.z00 + m.zt * (bt - m.bt0));
      if (zDeficit > 0) {
        if (!(m.zb > 0)) continue;
        bb = Math.max(bb, m.bb0 + zDeficit / m.zb);
      }
      if (bb > W[m.kHi] * (1 + REL) + REL) continue;
      const key = (m.o00 + m.ot * (bt - m.bt0) + m.ob * (bb - m.bb0)) * (1 - REL);
      if (key > inc) continue;
      const k = Math.max(m.kLo, firstAtLeastWidened(W, bb));
      if (k > m.kHi) continue;
      this.push(key, id + j * stride, k, m.kHi, KIND_RAW, m.kHi - k + 1);
    }
  }

  // ---- mono-i: depth ranges (R, both passes) and a first incumbent (S, best mode) ----------

  /** what dBound left: the depth range (indices into the depth axis) and the shapes it stands for */
  private dr = { lo: 0, hi: 0, n: 0 };
  /** the box ltbOut3 bounds: depth, bt and bb index ranges [d1, d2, j1, j2, k1, k2] */
  private bx = new Int32Array(6);

  /** Every (tft, tfb, tw) as one node per run of consecutive valid depths (R), bounded at once. */
  seedDepthRanges(): void {
    const fk = this.fk,
      gd = this.groupDims,
      v = this.v,
      W = this.W,
      D = this.pf.axes[0];
    const outer = gd.map((_, j) => j).filter((j) => gd[j] !== fk.second && gd[j] !== 0);
    const idx = new Int32Array(gd.length);
    for (let j = 0; j < gd.length; j++) v[gd[j]] = this.pf.axes[gd[j]][0];
    for (;;) {
      // mono-i's width minima (the web thickness, fabrication.ts's rules) do not involve the depth
      v[0] = D[0];
      const nBt = W.length - firstAbove(W, fk.secondMin(v));
      const nBb = W.length - firstAbove(W, fk.freeMin(v));
      if (nBt > 0 && nBb > 0) {
        const base = this.encode(idx);
        for (let i = 0; i < D.length; ) {
          v[0] = D[i];
          if (!fk.groupValid(v)) {
            i++;
            continue;
          }
          let e = i;
          while (e + 1 < D.length && ((v[0] = D[e + 1]), fk.groupValid(v))) e++;
          this.t.grid += (e - i + 1) * nBt * nBb;
          const key = this.dBound(base, i, e, 1);
          if (key !== null) this.seeds.append(key, base, this.dr.lo, this.dr.hi, KIND_DRANGE, this.fam, this.dr.n);
          this.decode(base);
          i = e + 1;
        }
      }
      if (!this.nextCombination(outer, idx)) break;
    }
  }

  /**
   * A popped depth range: halves, each bounded on its own, or one super node per depth once short.
   * n: the shapes it stood for; the halves stand for at most that many together, so progress
   * (settled shapes) never moves back.
   */
  private stepDepthRange(id: number, dA: number, dB: number, cap: number, n: number): void {
    if (dB - dA + 1 <= DRANGE_LEAF) {
      for (let i = dA; i <= dB; i++) {
        this.decode(id + i * this.depthStride);
        this.pushSuper(id + i * this.depthStride, 0, this.W.length - 1, cap);
      }
      return;
    }
    const mid = (dA + dB) >> 1;
    for (let h = 0; h < 2; h++) {
      const key = h === 0 ? this.dBound(id, dA, mid, cap) : this.dBound(id, mid + 1, dB, cap);
      if (key !== null && key <= this.limit()) {
        const m = Math.min(this.dr.n, n);
        n -= m;
        this.push(key, id, this.dr.lo, this.dr.hi, KIND_DRANGE, m);
      }
    }
  }

  /**
   * (R) Lower bound on the objective over a mono-i depth range: (tft, tfb, tw) fixed, depth
   * indices [dA, dB], every bt and bb; null when no point can reach utilisation ≤ cap. Narrows
   * the depth range (into dr) by the web's slenderness, the incumbent and (E2) over the box.
   */
  dBound(id: number, dA: number, dB: number, cap: number): number | null {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      D = this.pf.axes[0],
      sec = fk.second,
      f = fk.free,
      ctx = this.ctx,
      out = this.t.ruledOut;
    this.decode(id);
    const tft = v[2],
      tfb = v[4],
      tw = v[5];
    v[0] = D[dA];
    let [jLo, jHi] = this.btRange(cap);
    let kLo = firstAbove(W, fk.freeMin(v));
    this.dr.n = (dB - dA + 1) * (W.length - firstAbove(W, fk.secondMin(v))) * (W.length - kLo);
    // (6) the web's ratio (d − tft − tfb)/tw rises with d: a last depth
    const limW = ctx.slenderLimit[fkm.C_WEB] * cap;
    if (limW === limW) {
      const dMax = tft + tfb + limW * tw;
      dB = Math.min(dB, lastAtMost(D, dMax));
    }
    if (dB < dA || jHi < jLo) {
      out[fkm.C_OUTSTAND] += 1;
      return null;
    }
    // the bottom outstand, with the top outstand held at an allowed bt (rowHi checks every element)
    v[sec] = W[jLo];
    let kHi = this.rowHi(kLo, W.length - 1, cap);
    if (kHi < 0) return null;
    if (this.en && ctx.Mh > 0) kHi = Math.min(kHi, this.enFlangeHi(tfb, tw));
    if (kHi < kLo) {
      out[C_CLASS4] += 1;
      return null;
    }
    if (this.en && this.enRowOut(cap)) {
      out[C_WELD] += (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
      return null;
    }
    const lim = this.limit();
    const bx = this.bx;
    for (let round = 0; round < 4; round++) {
      const d0 = dA,
        j0 = jLo,
        k0 = kLo;
      if (lim < Infinity) {
        // best mode: the objective is affine in d, bt and bb with positive slopes, so the points no
        // heavier than the incumbent have each coordinate below its bound at the others' least
        v[0] = D[dA];
        v[sec] = W[jLo];
        v[f] = W[kLo];
        const o0 = this.objectiveOf2();
        if (o0 > lim) return null;
        jHi = this.cutAxis(sec, W, jLo, jHi, o0, lim);
        kHi = this.cutAxis(f, W, kLo, kHi, o0, lim);
        dB = this.cutAxis(0, D, dA, dB, o0, lim);
        if (jHi < jLo || kHi < kLo || dB < dA) return null;
      }
      if (this.en && this.en.restraint) {
        bx[0] = dA;
        bx[1] = dB;
        bx[2] = jLo;
        bx[3] = jHi;
        bx[4] = kLo;
        bx[5] = kHi;
        if (this.ltbOut3(cap)) {
          out[C_LTB] += (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
        // the least depth, bt and bb a point can have and pass (E2): each box bound grows with its box
        for (let ax = 0; ax < 3; ax++) this.raise3(ax, cap);
        dA = bx[0];
        jLo = bx[2];
        kLo = bx[4];
        if (lim < Infinity && jHi > jLo) {
          // the box's widest corner is far heavier than the incumbent: bound slices of bt, each with
          // the bb and d the incumbent leaves at its least bt, and keep the span of those that may pass
          let sLo = -1,
            sHi = -1;
          const nj = jHi - jLo + 1;
          for (let q = 0; q < SLICES; q++) {
            const ja = jLo + Math.floor((q * nj) / SLICES),
              jb = jLo + Math.floor(((q + 1) * nj) / SLICES) - 1;
            if (jb < ja) continue;
            bx[0] = dA;
            bx[1] = this.cutBelow(0, dA, dB, W[ja], W[kLo], lim);
            bx[2] = ja;
            bx[3] = jb;
            bx[4] = kLo;
            bx[5] = this.cutBelow(f, kLo, kHi, W[ja], D[dA], lim);
            if (bx[1] < dA || bx[5] < kLo || this.ltbOut3(cap)) continue;
            if (sLo < 0) sLo = ja;
            sHi = jb;
          }
          if (sLo < 0) {
            out[C_LTB] += (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
            return null;
          }
          jLo = sLo;
          jHi = sHi;
        }
      }
      if (lim === Infinity || (dA === d0 && jLo === j0 && kLo === k0)) break;
    }
    const d1 = D[dA],
      d2 = D[dB];
    this.dr.lo = dA;
    this.dr.hi = dB;
    const bt0 = W[jLo],
      bt1 = W[jHi],
      bb0 = W[kLo],
      bb1 = W[kHi];
    const p = this.plates,
      n = fk.nPlates,
      lp = this.lp;
    // (4) with (1): every point's Iz is at most its Iz at the deepest depth, at most I about any y0
    // there (affine in bt, bb); the requirement rises with d, so its value at the shallowest holds;
    // the objective rises with d, so its value at the shallowest is a lower bound
    v[0] = d1;
    v[sec] = bt0;
    v[f] = bb0;
    let best = this.objectiveOf2();
    let req = this.baseIreq(d1, cap) * (1 - REL);
    if (req > 0) {
      let y0 = d2 / 2,
        yBest = y0,
        oBest = -Infinity;
      for (let round = 0; round < 2; round++) {
        const obj = this.lpRange(false, y0, req, d2, d1, bt0, bt1, bb0, bb1);
        if (obj !== obj) {
          out[ctx.aT <= ctx.aC ? C_TENS : C_COMP] += (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
        if (obj > best) best = obj;
        if (obj > oBest) (oBest = obj), (yBest = y0);
        v[0] = d2;
        v[sec] = lp.bt;
        v[f] = lp.bb;
        fk.fill(v, p);
        compositeKernel(p, n, this.kout);
        y0 = this.kout[K_CY];
      }
      if (!this.lim) {
        // (2′), (8″) as superBound, over the depth range: c_top = d − ȳ, c_bot = ȳ and Zz never
        // fall with d (R), so their least values over the range are at d1
        this.lpRange(false, yBest, req, d2, d1, bt0, bt1, bb0, bb1); // the model at yBest, in lp
        for (let round = 0; round < 4; round++) {
          const r = this.passReq(req, d1, bt0, bt1, bb0, bb1, cap);
          if (!(r > req * (1 + 1e-3))) break;
          req = r;
          const obj = this.lpRange(false, yBest, req, d2, d1, bt0, bt1, bb0, bb1);
          if (obj !== obj) {
            out[this.cause] += (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
            return null;
          }
          if (obj > best) best = obj;
        }
      }
    }
    if (this.lim) {
      // (E1), (U1) likewise: Zz never falls with d or either width, ∫|y − a| dA at the deepest ≥ it
      const zreq = this.enZreq(this.enFyMax(0, 0), cap) * (1 - REL);
      let a = d2 / 2;
      for (let round = 0; round < 2; round++) {
        const obj = this.lpRange(true, a, zreq, d2, d1, bt0, bt1, bb0, bb1);
        if (obj !== obj) {
          out[C_BEND] += (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
          return null;
        }
        if (obj > best) best = obj;
        v[0] = d2;
        v[sec] = lp.bt;
        v[f] = lp.bb;
        fk.fill(v, p);
        compositeKernel(p, n, this.kout);
        a = plateNeutralAxis(p, n, this.kout[K_AREA], this.kout[K_CY]);
      }
    }
    this.dr.n = (dB - dA + 1) * (jHi - jLo + 1) * (kHi - kLo + 1);
    return best * (1 - REL);
  }

  /**
   * (R) The last index in [lo, hi] of the depth (dim 0) or bb (dim f) that keeps the objective
   * within lim with bt = bt and the other of depth and bb at `other` (its least): the objective is
   * affine in each with a positive slope. lo − 1 when none.
   */
  private cutBelow(dim: number, lo: number, hi: number, bt: number, other: number, lim: number): number {
    const fk = this.fk,
      v = this.v,
      A = this.pf.axes[dim];
    v[fk.second] = bt;
    v[dim === 0 ? fk.free : 0] = other;
    v[dim] = A[lo];
    const o0 = this.objectiveOf2();
    if (o0 > lim) return lo - 1;
    if (hi === lo) return hi;
    v[dim] = A[hi];
    const o1 = this.objectiveOf2();
    if (o1 <= lim) return hi;
    return Math.max(lo, Math.min(hi, lastWithin(A, lo, hi, o0, o1, lim)));
  }

  /** (R) Raises the low end of axis ax (0 depth, 1 bt, 2 bb) of the box in bx past the run of values whose sub-box fails (E2). */
  private raise3(ax: number, cap: number): void {
    const b = this.bx,
      lo0 = b[2 * ax],
      hi0 = b[2 * ax + 1];
    b[2 * ax + 1] = lo0;
    if (lo0 < hi0 && this.ltbOut3(cap)) {
      let lo = lo0,
        hi = hi0; // [lo0, lo] fails as a whole, [lo0, hi] does not (the whole box passed)
      while (hi - lo > 1) {
        const m = (lo + hi) >> 1;
        b[2 * ax + 1] = m;
        if (this.ltbOut3(cap)) lo = m;
        else hi = m;
      }
      b[2 * ax] = hi;
    }
    b[2 * ax + 1] = hi0;
  }

  /**
   * (R), (E2) True when no mono-i point with depth, bt and bb in the box bx can have every LTB
   * utilisation ≤ cap. Iy, Cw, J and Zz at the box's deepest and widest corner (each grows with
   * d, bt and bb); curve c if any point may have d/b_narrow ≤ 2. The centroid height ȳ rises with
   * d and bt and falls with bb; c = d − ȳ rises with d and bb and falls with bt; the shear centre
   * ysc = tfb/2 + h0·It/(It + Ib) rises with d and bt and falls with bb; zg (top: tft/2 + h0·Ib/(It
   * + Ib); bottom: −ysc) is monotone in each, so its extremes are at box corners. betaX = N/Iz −
   * 2(ȳ − ysc) with N = Σ over the plates of (B³/12)·S1 + B·S3 (enTRange): the bottom flange's S1,
   * S3 rise with ȳ, the top flange's fall with c, the web's term is g(ȳ − tfb) − g(tft − c) with
   * g(x) = (tw³/12)x²/2 + tw·x⁴/4, even and rising in |x|; interval products over B, then ÷ Iz.
   */
  private ltbOut3(cap: number): boolean {
    const fk = this.fk,
      v = this.v,
      W = this.W,
      D = this.pf.axes[0],
      b = this.bx,
      sec = fk.second,
      f = fk.free,
      n = fk.nPlates,
      ko = this.kout,
      st = this.st,
      p = this.plates;
    const d1 = D[b[0]],
      d2 = D[b[1]],
      bt1 = W[b[2]],
      bt2 = W[b[3]],
      bb1 = W[b[4]],
      bb2 = W[b[5]];
    const tft = v[2],
      tfb = v[4],
      tw = v[5];
    v[0] = d2;
    v[sec] = bt2;
    v[f] = bb2;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const iy = ko[K_IY],
      izHi = ko[K_IZ];
    let zz = plateModulusAbout(p, n, plateNeutralAxis(p, n, ko[K_AREA], ko[K_CY]));
    stabilityKernel(fk.family, v, st);
    const cw = st[ST_CW],
      j = st[ST_J];
    const aLT = ltbCurveC(fk.family, d1, Math.min(bt2, bb2)) ? ALPHA_LT_C : ALPHA_LT_D;
    const fy = this.enFyMax(0, 0);
    v[0] = d1;
    v[sec] = bt1;
    v[f] = bb1;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const izLo = ko[K_IZ];
    // ȳ least at (d1, bt1, bb2), greatest at (d2, bt2, bb1); c = d − ȳ least at (d1, bt2, bb1), greatest at (d2, bt1, bb2)
    v[f] = bb2;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const yLo = ko[K_CY];
    v[0] = d2;
    v[sec] = bt2;
    v[f] = bb1;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const yHi = ko[K_CY];
    v[0] = d1;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const cLo = d1 - ko[K_CY];
    v[0] = d2;
    v[sec] = bt1;
    v[f] = bb2;
    fk.fill(v, p);
    compositeKernel(p, n, ko);
    const cHi = d2 - ko[K_CY];
    // N's interval: bottom flange over [0, tfb] (v2 = ȳ, v1 = ȳ − tfb), top over [d − tft, d] (v2 = tft − c, v1 = −c)
    const c1 = (bb1 * bb1 * bb1) / 12,
      c2 = (bb2 * bb2 * bb2) / 12,
      e1 = (bt1 * bt1 * bt1) / 12,
      e2 = (bt2 * bt2 * bt2) / 12;
    let nLo = 0,
      nHi = 0;
    {
      let a = yLo,
        z = yLo - tfb;
      const s1a = (a * a - z * z) / 2,
        s3a = (a * a * a * a - z * z * z * z) / 4;
      a = yHi;
      z = yHi - tfb;
      const s1b = (a * a - z * z) / 2,
        s3b = (a * a * a * a - z * z * z * z) / 4;
      nLo += (s1a >= 0 ? c1 * s1a : c2 * s1a) + (s3a >= 0 ? bb1 * s3a : bb2 * s3a);
      nHi += (s1b >= 0 ? c2 * s1b : c1 * s1b) + (s3b >= 0 ? bb2 * s3b : bb1 * s3b);
    }
    {
      // least at c = cHi, greatest at c = cLo
      let a = tft - cHi,
        z = -cHi;
      const s1a = (a * a - z * z) / 2,
        s3a = (a * a * a * a - z * z * z * z) / 4;
      a = tft - cLo;
      z = -cLo;
      const s1b = (a * a - z * z) / 2,
        s3b = (a * a * a * a - z * z * z * z) / 4;
      nLo += (s1a >= 0 ? e1 * s1a : e2 * s1a) + (s3a >= 0 ? bt1 * s3a : bt2 * s3a);
      nHi += (s1b >= 0 ? e2 * s1b : e1 * s1b) + (s3b >= 0 ? bt2 * s3b : bt1 * s3b);
    }
    {
      const u1 = yLo - tfb,
        u2 = yHi - tfb,
        w1 = tft - cHi,
        w2 = tft - cLo;
      nLo += webWagner(tw, u1 <= 0 && u2 >= 0 ? 0 : Math.min(Math.abs(u1), Math.abs(u2))) - webWagner(tw, Math.max(Math.abs(w1), Math.abs(w2)));
      nHi += webWagner(tw, Math.max(Math.abs(u1), Math.abs(u2))) - webWagner(tw, w1 <= 0 && w2 >= 0 ? 0 : Math.min(Math.abs(w1), Math.abs(w2)));
    }
    const slack = REL * (Math.abs(nLo) + Math.abs(nHi)) + 1e-300;
    nLo -= slack;
    nHi += slack;
    const qLo = nLo >= 0 ? nLo / izHi : nLo / izLo,
      qHi = nHi >= 0 ? nHi / izLo : nHi / izHi;
    // the shear centre and zg from stability.ts's closed form at the corners that bound them
    const e = this.en!;
    const sLo = monoShearCentre(d1, bt1, tft, bb2, tfb),
      sHi = monoShearCentre(d2, bt2, tft, bb1, tfb);
    const za = loadHeight(e, d1, monoShearCentre(d1, bt2, tft, bb1, tfb)),
      zb = loadHeight(e, d2, monoShearCentre(d2, bt1, tft, bb2, tfb)),
      zc = loadHeight(e, d2, sHi),
      zd = loadHeight(e, d1, sLo);
    const zLo = Math.min(za, zb, zc, zd),
      zHi = Math.max(za, zb, zc, zd);
    const r = this.rng;
    const zs = REL * (Math.abs(zLo) + Math.abs(zHi) + d2);
    r[0] = zLo - zs;
    r[1] = zHi + zs;
    const bs = REL * (Math.abs(qLo) + Math.abs(qHi) + d2);
    r[2] = qLo - 2 * (yHi - sLo) - bs;
    r[3] = qHi - 2 * (yLo - sHi) + bs;
    zz = this.enWUpper(zz, izHi, cLo, yLo, bt1, tft, bb1, tfb, tw);
    return this.enLtbOut(iy, cw, j, zz, fy, aLT, cap);
  }

  /**
   * The knapsack of lpRound over a depth range: the measure (I about y0, or ∫|y − y0| dA) from
   * the plates at depth dM, the objective from those at depth dO; NaN when even both widths in
   * full fall short.
   */
  private lpRange(useZ: boolean, y0: number, req: number, dM: number, dO: number, bt0: number, bt1: number, bb0: number, bb1: number): number {
    const fk = this.fk,
      v = this.v,
      sec = fk.second,
      f = fk.free,
      p = this.plates,
      n = fk.nPlates,
      lp = this.lp,
      ctx = this.ctx;
    const measure = useZ ? plateModulusAbout : iAbout;
    v[0] = dO;
    v[sec] = bt0;
    v[f] = bb0;
    fk.fill(v, p);
    const o00 = objectiveOf(fk, v, p, ctx);
    v[sec] = bt1;
    fk.fill(v, p);
    const ot = bt1 > bt0 ? (objectiveOf(fk, v, p, ctx) - o00) / (bt1 - bt0) : 0;
    v[sec] = bt0;
    v[f] = bb1;
    fk.fill(v, p);
    const ob = bb1 > bb0 ? (objectiveOf(fk, v, p, ctx) - o00) / (bb1 - bb0) : 0;
    v[0] = dM;
    v[f] = bb0;
    fk.fill(v, p);
    const c00 = measure(p, n, y0);
    v[sec] = bt1;
    fk.fill(v, p);
    const ct = bt1 > bt0 ? (measure(p, n, y0) - c00) / (bt1 - bt0) : 0;
    v[sec] = bt0;
    v[f] = bb1;
    fk.fill(v, p);
    const cb = bb1 > bb0 ? (measure(p, n, y0) - c00) / (bb1 - bb0) : 0;
    lp.c00 = c00;
    lp.ct = ct;
    lp.cb = cb;
    lp.o00 = o00;
    lp.ot = ot;
    lp.ob = ob;
    return this.knapsack(req, bt0, bt1, bb0, bb1);
  }

  /**
   * (S) A first incumbent before the best-first search: a local search over the grid from the
   * heaviest valid point (each dimension stepped down, then one down and another up, by halving
   * steps, keeping the lightest feasible), at most SEED_EVALS evaluations. Only feasible grid
   * points it evaluated (the same evaluation as brute force) are offered, so the answer is the
   * same as without it (as searchWithKnown's known candidates); the incumbent's cut (best mode)
   * then narrows every box before (E2) bounds it, which is where the LTB bounds bite.
   */
  seedIncumbent(): void {
    const fk = this.fk,
      ax = this.pf.axes,
      nd = fk.dims.length,
      s = this.scratch;
    const sv = new Float64Array(nd);
    const cur = new Int32Array(nd),
      tryIx = new Int32Array(nd);
    const seen = new Map<number, number>();
    let evals = 0;
    const c: RawCandidate = { fi: this.fam, fk, v: sv, objective: 0, area: 0, utilisation: 0, governing: -1 };
    const at = (ix: Int32Array): number => {
      let key = 0;
      for (let i = 0; i < nd; i++) {
        if (ix[i] < 0 || ix[i] >= ax[i].length) return Infinity;
        sv[i] = ax[i][ix[i]];
        key = key * ax[i].length + ix[i];
      }
      const known = seen.get(key);
      if (known !== undefined) return known;
      let o = Infinity;
      if (evals < SEED_EVALS && fk.groupValid(sv) && sv[fk.free] > fk.freeMin(sv) && (fk.second < 0 || sv[fk.second] > fk.secondMin(sv))) {
        evals++;
        this.t.evaluated++;
        if (evaluate(fk, sv, this.ctx, s, false)) {
          c.objective = o = s.objective;
          c.area = s.area;
          c.utilisation = s.utilisation;
          c.governing = s.governing;
          offerFeasible(this.t, c);
        } else this.t.ruledOut[s.governing]++;
      }
      seen.set(key, o);
      return o;
    };
    const top = (len: number) => {
      let st = 1;
      while (st * 2 < len) st *= 2;
      return st;
    };
    // the depth last: thinner plates and narrower widths first, then a shallower section
    const order = [...fk.dims.keys()].sort((x, y) => (fk.roles[x] === "depth" ? 1 : 0) - (fk.roles[y] === "depth" ? 1 : 0));
    const descend = () => {
      let obj = at(cur);
      if (obj === Infinity) return;
      while (evals < SEED_EVALS) {
        const before = obj;
        for (const i of order)
          for (let st = top(ax[i].length); st >= 1; st >>= 1) {
            tryIx.set(cur);
            tryIx[i] -= st;
            const o = at(tryIx);
            if (o < obj) {
              obj = o;
              cur.set(tryIx);
              st <<= 1;
            }
          }
        if (obj < before) continue;
        // one dimension down, another up (a thinner plate for a wider one, a deeper web for a lighter flange)
        for (const i of order) {
          for (const j of order) {
            if (i === j) continue;
            for (let st = top(ax[i].length); st >= 1 && !(obj < before); st >>= 1)
              for (let up = 1; up <= top(ax[j].length) && !(obj < before); up *= 4) {
                tryIx.set(cur);
                tryIx[i] -= st;
                tryIx[j] += up;
                const o = at(tryIx);
                if (o < obj) {
                  obj = o;
                  cur.set(tryIx);
                }
              }
          }
        }
        if (!(obj < before)) break;
      }
    };
    // starts: the heaviest point, then the same at three quarters and half the depth axis
    for (const frac of [1, 0.75, 0.5]) {
      for (let i = 0; i < nd; i++) cur[i] = fk.roles[i] === "depth" ? Math.floor(frac * (ax[i].length - 1)) : ax[i].length - 1;
      descend();
    }
  }
}

/**
 * Evaluates known candidates and offers the feasible ones (the same evaluation as the search).
 * Only shapes of the grid count: a family in the problem, each dimension on its axis (the width
 * and depth grids are exact products, so a grid value compares equal), valid geometry.
 */
function offerKnown(p: Prepared, t: Tally, known: readonly SearchPoint[], gridMode: boolean): void {
  if (known.length === 0) return;
  const s = new Scratch();
  for (const c of known) {
    const pf = p.families.find((f) => f.fk.family === c.family);
    if (!pf) continue;
    const fk = pf.fk;
    const v = Float64Array.from(fk.dims, (d) => c.dimensions[d]);
    let onGrid = true;
    let di = -1;
    for (let i = 0; i < v.length && onGrid; i++) {
      const j = pf.axes[i].indexOf(v[i]);
      if (j < 0) onGrid = false;
      if (fk.roles[i] === "depth") di = j;
    }
    if (!onGrid || !fk.groupValid(v) || !(v[fk.free] > fk.freeMin(v)) || (fk.second >= 0 && !(v[fk.second] > fk.secondMin(v)))) continue;
    t.evaluated++;
    if (!evaluate(fk, v, p.ctx, s, false)) continue;
    offerFeasible(t, { fi: pf.fi, fk, v, objective: s.objective, area: s.area, utilisation: s.utilisation, governing: s.governing }, gridMode ? di : -1);
  }
}

/** The exact search. Throws a ZodError (fields named) on a bad problem. */
export function searchSections(input: SearchProblemInput, options: SearchOptions = {}): SearchResult {
  return searchWithKnown(input, options, []);
}

/**
 * The exact search, first evaluating `known` candidates of the same grid (each family's dimensions
 * by name): the feasible ones become incumbents before the search starts. The answer is the same
 * (a grid candidate only ever lowers an incumbent to a value the search would reach anyway, and
 * ties still pop within the 1e-9 margin), found sooner when a known candidate is near the best:
 * the restraint study (restraint-study.ts) passes each spacing's bests to the next, finer one.
 */
export function searchWithKnown(input: SearchProblemInput, options: SearchOptions, known: readonly SearchPoint[]): SearchResult {
  if (options.exhaustive) return bruteForceSearch(input, options);
  const problem = searchProblemSchema.parse(input);
  const p = prepare(problem, options.depthIndexRange, options.depthInterleave);
  const explore = Math.max(0, options.explore ?? 0);
  const gridMode = (options.front ?? (explore > 0 ? "evaluated" : "grid")) === "grid";
  const t = new Tally(p.families.length, gridMode ? p.depths.length : 0, options.stopWhen);
  // (best mode only: in grid mode every point of the front is evaluated in its turn anyway)
  if (!gridMode) offerKnown(p, t, known, gridMode);
  const shared = gridMode ? new Heap() : null;
  const fams = p.families.map((pf) => new FamilySearch(pf, p.ctx, t, shared ?? new Heap(), gridMode, gridMode ? 0 : explore));
  checkAbort(options.signal);
  for (const fs of fams) fs.seed();
  const report = () => {
    if (!options.onProgress) return;
    let pending = 0,
      familiesDone = 0;
    for (const fs of fams) {
      pending += fs.pending;
      // a family with nothing pending has been searched to the end (seeded families count their grid)
      if (fs.pending === 0) familiesDone++;
    }
    options.onProgress(t.grid - pending, t.grid, { familiesDone, familiesTotal: fams.length, evaluated: t.evaluated });
  };
  report();
  if (!gridMode) {
    for (const fs of fams) {
      checkAbort(options.signal);
      if (t.shouldStop()) break;
      fs.run(options.signal, report);
      report();
    }
    return buildResult(p, t, "evaluated");
  }
  // Grid mode: one heap over every family, so the front (which spans families) is built
  // lightest first and its dominance bound (D) is as strong as it can be when each entry pops.
  const h = shared!;
  for (const fs of fams) {
    const sd = fs.seeds;
    for (let i = 0; i < sd.size; i++) h.push(sd.key[i], sd.id[i], sd.k[i], sd.hi[i], sd.kind[i], fs.fam, sd.n[i]);
    fs.seeds = new Heap();
  }
  let steps = 0;
  const share = options.frontShare ?? null;
  t.share = share;
  const take = (o: number, u: number) => t.ext.add(o, u);
  while (h.size > 0 && !(steps === 0 && t.shouldStop())) {
    if (share !== null && (steps & (SHARE_EVERY - 1)) === 0) share.poll(take);
    if (++steps % ABORT_EVERY === 0) {
      checkAbort(options.signal);
      report();
      if (t.shouldStop()) break;
    }
    h.pop();
    const fs = fams[h.outFam];
    fs.pending -= h.outN;
    fs.step(h.outKey, h.outId, h.outK, h.outHi, h.outKind, h.outN);
  }
  report();
  return buildResult(p, t, "grid");
}

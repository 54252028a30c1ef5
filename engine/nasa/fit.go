package nasa

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// FitOptions sets the temperature ranges of a fitted polynomial in K. Zero
// values mean TLow = 300, TMid = 1000, THigh = 5000.
type FitOptions struct {
	TLow, TMid, THigh float64
	// Wilhoit, when set, is FitWilhoit of the same points and limits (the
	// W of EstimateTail), made once and shared: Fit then extrapolates with
	// it instead of fitting it again. It is used only when every point lies
	// inside the range in ascending order and its limits are Fit's (so that
	// it is the curve Fit would fit); otherwise it is ignored.
	Wilhoit *Wilhoit
}

// withDefaults fills zero fields and validates the order TLow < TMid < THigh.
func (o FitOptions) withDefaults() (FitOptions, error) {
	if o.TLow == 0 {
		o.TLow = 300
	}
	if o.TMid == 0 {
		o.TMid = 1000
	}
	if o.THigh == 0 {
		o.THigh = 5000
	}
	for _, v := range []float64{o.TLow, o.TMid, o.THigh} {
		if !(v > 0) || math.IsInf(v, 0) {
			return o, fmt.Errorf("fit options: temperatures %g/%g/%g K must be finite and positive", o.TLow, o.TMid, o.THigh)
		}
	}
	if !(o.TLow < o.TMid && o.TMid < o.THigh) {
		return o, fmt.Errorf("fit options: need TLow < TMid < THigh, got %g/%g/%g K", o.TLow, o.TMid, o.THigh)
	}
	return o, nil
}

// FitReport describes how well a fit reproduces its input.
type FitReport struct {
	// MaxCpResidual is the worst |Cp_fit − Cp_input| over the input points
	// used, in J/(mol K).
	MaxCpResidual float64
	// MaxCpRelResidual is the worst |Cp_fit − Cp_input|/Cp_input over the
	// same points (dimensionless).
	MaxCpRelResidual float64
	// Extrapolated is true when part of [TLow, THigh] lies beyond the input
	// points: Fit then follows the Wilhoit extrapolation there, FitPoly
	// extends the polynomial unsupported.
	Extrapolated bool
}

const (
	// fitEdge (K) is how far outside [TLow, THigh] an input point may lie and
	// still be used (so 298.15 K counts for TLow = 300 K).
	fitEdge = 2.0
	// fillStep (K) is the grid on which Fit fills gaps in the input with
	// Wilhoit values.
	fillStep = 50.0
	// pointWeight is the weight of an input point relative to a Wilhoit fill
	// sample in Fit.
	pointWeight = 3.0
	// tauScale (K) is the temperature unit of the shared linear term and of
	// the slope inequalities inside the least-squares problem (see
	// polyBasis): slopes are d(Cp/R)/dT per 1000 K.
	tauScale = 1000.0
	// nLowGrid and nHighGrid are the numbers of points in each range at which
	// monotonicity and the Cp ceiling are imposed.
	nLowGrid, nHighGrid = 120, 240
)

// sample is one Cp value (J/(mol K)) at T (K) with a least-squares weight.
type sample struct{ T, Cp, W float64 }

// Fit builds a two-range NASA7 polynomial from estimated heat capacities Cp
// (J/(mol K)) at temperatures T (K), typically group-additivity values at
// 300–1500 K, with the formation enthalpy hf298 (J/mol) and entropy s298
// (J/(mol K)) at 298.15 K and the classical limits cp0 and cpInf (J/(mol K),
// see ClassicalLimits).
//
// Method. A Wilhoit curve (FitWilhoit) is fitted to the points (EstimateTail
// continues the points along the same curve for callers that evaluate an
// estimate without fitting it). The least-
// squares targets are the input points inside [TLow−2 K, THigh+2 K] (weight 3)
// and the Wilhoit value at every 50 K grid temperature of [TLow, THigh] lying
// farther than 50 K from every input point (weight 1): this fills gaps in the
// data and extrapolates above the last point. The objective is the weighted sum
// of squared relative residuals of Cp. The ten Cp coefficients a1…a5 of both
// ranges are solved by constrained least squares under
//
//   - exact continuity of Cp and dCp/dT at TMid (built into the unknowns:
//     both ranges share Cp and dCp/dT at TMid, see polyBasis);
//   - dCp/dT ≥ 0 on 120 (low) and 240 (high) grid points, so Cp is monotone
//     non-decreasing over [TLow, THigh] (inequalities);
//   - Cp ≤ cpInf on the same grids (inequalities),
//
// by Householder QR of the data and a dual active-set method (lsi) that forms
// only the inequalities that become active, usually none or a few.
//
// Then a6 and a7 of the low range are fixed so that H(298.15) = hf298 and
// S(298.15) = s298 exactly (298.15 K is evaluated with the low range even when
// TLow = 300 K), and a6, a7 of the high range so that H and S are continuous
// at TMid; these hold to floating-point rounding. Finally Cp is checked at
// every stationary point of both ranges (see denseMonotone): a fall of more
// than 1e-6 R anywhere in [TLow, THigh] is an error.
//
// Errors: mismatched or empty inputs, non-finite values, T ≤ 0, Cp ≤ 0,
// limits not 0 < cp0 ≤ cpInf, an input Cp ≥ cpInf (inconsistent with the
// classical ceiling), bad ranges, or no input point inside the range.
func Fit(hf298, s298 float64, T, Cp []float64, cp0, cpInf float64, opt FitOptions) (NASA7, FitReport, error) {
	opt, err := opt.withDefaults()
	if err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", err)
	}
	if err := checkScalars(hf298, s298); err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", err)
	}
	pts, err := usablePoints(T, Cp, opt)
	if err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", err)
	}
	if len(pts) == 0 {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: no input point within %g–%g K", opt.TLow, opt.THigh)
	}
	for _, p := range pts {
		if p.Cp >= cpInf {
			return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: Cp = %g J/(mol K) at %g K is not below the classical limit %g J/(mol K)", p.Cp, p.T, cpInf)
		}
	}
	ts, cps := make([]float64, len(pts)), make([]float64, len(pts))
	for i, p := range pts {
		ts[i], cps[i] = p.T, p.Cp
		pts[i].W = pointWeight
	}
	var w Wilhoit
	if sw := opt.Wilhoit; sw != nil && sw.Cp0 == cp0 && sw.CpInf == cpInf && slices.Equal(ts, T) && slices.Equal(cps, Cp) {
		w = *sw
	} else if w, err = FitWilhoit(ts, cps, cp0, cpInf); err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", err)
	}
	samples := append([]sample(nil), pts...)
	extrapolated := false
	for k := 0; ; k++ {
		tg := math.Min(opt.TLow+float64(k)*fillStep, opt.THigh)
		near := false
		for _, p := range pts {
			if math.Abs(p.T-tg) <= fillStep {
				near = true
				break
			}
		}
		if !near {
			samples = append(samples, sample{T: tg, Cp: w.Cp(tg), W: 1})
			if tg > pts[len(pts)-1].T || tg < pts[0].T {
				extrapolated = true
			}
		}
		if tg >= opt.THigh {
			break
		}
	}
	p, err := solvePoly(hf298, s298, samples, opt, true, cpInf)
	if err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", err)
	}
	if err := denseMonotone(p); err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", err)
	}
	rep := report(p, pts)
	rep.Extrapolated = extrapolated
	return p, rep, nil
}

// FitPoly fits a two-range NASA7 polynomial directly to dense heat-capacity
// data Cp (J/(mol K)) at T (K), such as a thermochemical table to 3000 K or
// beyond, with hf298 (J/mol) and s298 (J/(mol K)) at 298.15 K. It uses the
// points inside [TLow−2 K, THigh+2 K], all with equal weight on relative
// residuals, and needs at least five of them below TMid and five at or above
// it. The constraints are those of Fit: exact continuity of Cp, dCp/dT, H and
// S at TMid and exact H(298.15) = hf298, S(298.15) = s298. Monotonicity of Cp
// is imposed only when the data themselves are non-decreasing in T (atoms and
// some radicals, e.g. O and OH, genuinely have Cp falling over part of the
// range); there is no ceiling. Report.Extrapolated is set when the points do
// not reach TLow or THigh (within 2 K).
func FitPoly(hf298, s298 float64, T, Cp []float64, opt FitOptions) (NASA7, FitReport, error) {
	opt, err := opt.withDefaults()
	if err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit poly: %w", err)
	}
	if err := checkScalars(hf298, s298); err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit poly: %w", err)
	}
	pts, err := usablePoints(T, Cp, opt)
	if err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit poly: %w", err)
	}
	nLow := 0
	monotone := true
	for i, p := range pts {
		pts[i].W = 1
		if p.T < opt.TMid {
			nLow++
		}
		if i > 0 && p.Cp < pts[i-1].Cp {
			monotone = false
		}
	}
	if nLow < 5 || len(pts)-nLow < 5 {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit poly: need at least 5 points on each side of %g K, have %d below and %d above", opt.TMid, nLow, len(pts)-nLow)
	}
	p, err := solvePoly(hf298, s298, pts, opt, monotone, 0)
	if err != nil {
		return NASA7{}, FitReport{}, fmt.Errorf("nasa fit poly: %w", err)
	}
	rep := report(p, pts)
	rep.Extrapolated = pts[0].T > opt.TLow+fitEdge || pts[len(pts)-1].T < opt.THigh-fitEdge
	return p, rep, nil
}

func checkScalars(hf298, s298 float64) error {
	if math.IsNaN(hf298) || math.IsInf(hf298, 0) || math.IsNaN(s298) || math.IsInf(s298, 0) {
		return fmt.Errorf("ΔHf°298 = %g J/mol and S°298 = %g J/(mol K) must be finite", hf298, s298)
	}
	return nil
}

// usablePoints validates the input and returns the points inside
// [TLow−fitEdge, THigh+fitEdge], sorted by T.
func usablePoints(T, Cp []float64, opt FitOptions) ([]sample, error) {
	if len(T) != len(Cp) {
		return nil, fmt.Errorf("%d temperatures but %d heat capacities", len(T), len(Cp))
	}
	if len(T) == 0 {
		return nil, errors.New("no Cp points")
	}
	var pts []sample
	for i := range T {
		t, c := T[i], Cp[i]
		if !(t > 0) || math.IsInf(t, 0) || !(c > 0) || math.IsInf(c, 0) {
			return nil, fmt.Errorf("point %d (T=%g K, Cp=%g J/(mol K)) must have finite positive T and Cp", i, t, c)
		}
		if t >= opt.TLow-fitEdge && t <= opt.THigh+fitEdge {
			pts = append(pts, sample{T: t, Cp: c})
		}
	}
	slices.SortFunc(pts, func(a, b sample) int {
		switch {
		case a.T < b.T:
			return -1
		case a.T > b.T:
			return 1
		}
		return 0
	})
	return pts, nil
}

// Unknowns of solvePoly. Both blocks share the value c0 and the slope d1 at
// TMid, which makes Cp and dCp/dT continuous there by construction:
//
//	Cp/R = c0 + d1 t + l2 sL² + l3 sL³ + l4 sL⁴   (low block)
//	Cp/R = c0 + d1 t + h2 sH² + h3 sH³ + h4 sH⁴   (high block)
//
// with t = (T − TMid)/1000 K, sL = (T − TMid)/(TMid − TLow) ∈ [−1, 0] and
// sH = (T − TMid)/(THigh − TMid) ∈ [0, 1]; the scaled, centred variables keep
// the least-squares columns of similar size. u = (c0, d1, l2, l3, l4, h2, h3, h4).
const nPoly = 8

// polyBasis evaluates the columns of solvePoly's unknowns.
type polyBasis struct{ tMid, dLow, dHigh float64 }

func newPolyBasis(opt FitOptions) polyBasis {
	return polyBasis{tMid: opt.TMid, dLow: opt.TMid - opt.TLow, dHigh: opt.THigh - opt.TMid}
}

// value writes into g the coefficients of Cp/R at T in the block given by
// high (g has length nPoly).
func (pb polyBasis) value(T float64, high bool, g []float64) {
	clear(g)
	g[0] = 1
	g[1] = (T - pb.tMid) / tauScale
	off, d := 2, pb.dLow
	if high {
		off, d = 5, pb.dHigh
	}
	s := (T - pb.tMid) / d
	g[off] = s * s
	g[off+1] = s * s * s
	g[off+2] = s * s * s * s
}

// slope writes into g the coefficients of d(Cp/R)/dT × 1000 K at T in the
// block given by high.
func (pb polyBasis) slope(T float64, high bool, g []float64) {
	clear(g)
	g[1] = 1
	off, d := 2, pb.dLow
	if high {
		off, d = 5, pb.dHigh
	}
	s := (T - pb.tMid) / d
	k := tauScale / d
	g[off] = 2 * s * k
	g[off+1] = 3 * s * s * k
	g[off+2] = 4 * s * s * s * k
}

// polyIneq is the family of inequalities of solvePoly, in this order: dCp/dT
// ≥ 0 on the low grid and on the high grid (when monotone), then Cp ≤ cpMax
// on the low and on the high grid (when cpMax > 0). Grid j of a block with m
// points lies at lo + (hi − lo) j/(m − 1).
type polyIneq struct {
	pb         polyBasis
	opt        FitOptions
	capR       float64 // cpMax/R, 0 for none
	nMon, nAll int
}

func newPolyIneq(opt FitOptions, monotone bool, cpMax float64) *polyIneq {
	f := &polyIneq{pb: newPolyBasis(opt), opt: opt}
	if monotone {
		f.nMon = nLowGrid + nHighGrid
	}
	f.nAll = f.nMon
	if cpMax > 0 {
		f.capR = cpMax / R
		f.nAll += nLowGrid + nHighGrid
	}
	return f
}

func (f *polyIneq) size() int { return f.nAll }

// point returns the temperature of grid index i (0 ≤ i < nLowGrid+nHighGrid)
// and whether it is on the high grid.
func (f *polyIneq) point(i int) (float64, bool) {
	if i < nLowGrid {
		return f.opt.TLow + (f.opt.TMid-f.opt.TLow)*float64(i)/float64(nLowGrid-1), false
	}
	j := i - nLowGrid
	return f.opt.TMid + (f.opt.THigh-f.opt.TMid)*float64(j)/float64(nHighGrid-1), true
}

func (f *polyIneq) row(i int, g []float64) float64 {
	if i < f.nMon {
		t, high := f.point(i)
		f.pb.slope(t, high, g)
		return 0
	}
	t, high := f.point(i - f.nMon)
	f.pb.value(t, high, g)
	for k := range g {
		g[k] = -g[k]
	}
	return -f.capR
}

// slacks evaluates the same quantities as row·u − rhs, but by Horner's rule
// on each block's polynomial in s = (T − TMid)/ΔT, without forming rows.
func (f *polyIneq) slacks(u, s []float64) {
	type block struct {
		dT, k      float64 // ΔT of the block, 1000 K/ΔT
		c2, c3, c4 float64 // coefficients of s², s³, s⁴
	}
	blocks := [2]block{
		{f.pb.dLow, tauScale / f.pb.dLow, u[2], u[3], u[4]},
		{f.pb.dHigh, tauScale / f.pb.dHigh, u[5], u[6], u[7]},
	}
	c0, d1 := u[0], u[1]
	for i := range s {
		j := i
		if i >= f.nMon {
			j = i - f.nMon
		}
		t, high := f.point(j)
		b := &blocks[0]
		if high {
			b = &blocks[1]
		}
		x := (t - f.pb.tMid) / b.dT
		if i < f.nMon {
			// d(Cp/R)/dT × 1000 K ≥ 0.
			s[i] = d1 + b.k*x*(2*b.c2+x*(3*b.c3+x*4*b.c4))
		} else {
			// cpMax/R − Cp/R ≥ 0.
			s[i] = f.capR - (c0 + d1*(t-f.pb.tMid)/tauScale + x*x*(b.c2+x*(b.c3+x*b.c4)))
		}
	}
}

// solvePoly solves the constrained least-squares problem described on Fit for
// the given samples; cpMax ≤ 0 means no ceiling. The unknowns are those of
// polyBasis, so the equalities at TMid hold by construction; the data matrix
// is reduced by Householder QR and the inequalities are handled by lsi.
func solvePoly(hf298, s298 float64, samples []sample, opt FitOptions, monotone bool, cpMax float64) (NASA7, error) {
	const n = nPoly
	m := len(samples)
	if m < n {
		return NASA7{}, fmt.Errorf("constrained least squares: %d samples for %d unknowns", m, n)
	}
	pb := newPolyBasis(opt)
	a := make([]float64, m*n)
	b := make([]float64, m)
	var cs [n]float64
	for i, s := range samples {
		row := a[i*n : (i+1)*n]
		pb.value(s.T, s.T >= opt.TMid, row)
		scale := s.W / (s.Cp / R)
		for k := range row {
			row[k] *= scale
			cs[k] += row[k] * row[k]
		}
		b[i] = s.W
	}
	if !scaledQR(a, m, n, b, cs[:], 1e-12) {
		return NASA7{}, errors.New("constrained least squares: too few independent data for the unknowns")
	}
	fam := scaledFamily{inner: newPolyIneq(opt, monotone, cpMax), scale: cs[:]}
	var v [n]float64
	if _, err := lsi(a, n, n, b[:n], &fam, 1e-9, v[:], nil); err != nil {
		return NASA7{}, err
	}
	var u [n]float64
	for k := range n {
		u[k] = v[k] * cs[k]
	}
	p := NASA7{TLow: opt.TLow, TMid: opt.TMid, THigh: opt.THigh}
	// Cp/R of each block as Σ βⱼ (T − TMid)ʲ, then expanded in powers of T:
	// aₖ = Σⱼ≥ₖ βⱼ C(j,k) (−TMid)^(j−k).
	toMonomial := func(beta [5]float64, dst *[7]float64) {
		for k := range 5 {
			c := 0.0
			for j := 4; j >= k; j-- {
				c += beta[j] * binomial(j, k) * math.Pow(-opt.TMid, float64(j-k))
			}
			dst[k] = c
		}
	}
	dl, dh := pb.dLow, pb.dHigh
	toMonomial([5]float64{u[0], u[1] / tauScale, u[2] / (dl * dl), u[3] / (dl * dl * dl), u[4] / (dl * dl * dl * dl)}, &p.Low)
	toMonomial([5]float64{u[0], u[1] / tauScale, u[5] / (dh * dh), u[6] / (dh * dh * dh), u[7] / (dh * dh * dh * dh)}, &p.High)
	p.Low[5] = hf298/R - hIntR(&p.Low, Tref)
	p.Low[6] = s298/R - sIntR(&p.Low, Tref)
	p.High[5] = hR(&p.Low, opt.TMid) - hIntR(&p.High, opt.TMid)
	p.High[6] = sR(&p.Low, opt.TMid) - sIntR(&p.High, opt.TMid)
	if !finite(&p.Low) || !finite(&p.High) {
		return NASA7{}, errors.New("fit produced non-finite coefficients")
	}
	return p, nil
}

// binomial returns C(n, k) for 0 ≤ k ≤ n ≤ 4 as a float64.
func binomial(n, k int) float64 {
	c := 1.0
	for i := range k {
		c = c * float64(n-i) / float64(i+1)
	}
	return c
}

// denseMonotone checks that Cp never falls by more than 1e-6 R below its
// running maximum over [TLow, THigh] (the low block on [TLow, TMid], the high
// block on [TMid, THigh]). The test is exact up to rounding: Cp is evaluated
// at the range ends and at every stationary point, the real roots of the
// cubic dCp/dT found by bisection between the roots of the quadratic
// d²Cp/dT², and a fall can only end at one of those.
func denseMonotone(p NASA7) error {
	peak := math.Inf(-1)
	for _, bl := range []struct {
		a      *[7]float64
		lo, hi float64
	}{{&p.Low, p.TLow, p.TMid}, {&p.High, p.TMid, p.THigh}} {
		var pts [5]float64
		k := 0
		pts[k] = bl.lo
		k++
		for _, r := range slopeRoots(bl.a, bl.lo, bl.hi) {
			pts[k] = r
			k++
		}
		pts[k] = bl.hi
		k++
		for _, t := range pts[:k] {
			c := R * cpR(bl.a, t)
			if c < peak-1e-6*R || math.IsNaN(c) {
				return fmt.Errorf("Cp falls to %g J/(mol K) at %g K below the earlier %g J/(mol K)", c, t, peak)
			}
			peak = math.Max(peak, c)
		}
	}
	return nil
}

// slopeRoots returns, in increasing order, the roots in (lo, hi) of the cubic
// dCp/dT of block a at which its sign changes. The cubic is monotone between
// the roots of its derivative, 2a3 + 6a4 T + 12a5 T² (1-based a), so each
// such piece holds at most one root, found by bisection to rounding.
func slopeRoots(a *[7]float64, lo, hi float64) []float64 {
	// Break points: lo, real roots of the quadratic inside (lo, hi), hi.
	br := []float64{lo}
	qa, qb, qc := 12*a[4], 6*a[3], 2*a[2]
	var qr []float64
	switch {
	case qa != 0:
		disc := qb*qb - 4*qa*qc
		if disc > 0 {
			sq := math.Sqrt(disc)
			// Numerically stable pair of roots.
			q := -0.5 * (qb + math.Copysign(sq, qb))
			qr = append(qr, q/qa)
			if q != 0 {
				qr = append(qr, qc/q)
			}
		}
	case qb != 0:
		qr = append(qr, -qc/qb)
	}
	if len(qr) == 2 && qr[0] > qr[1] {
		qr[0], qr[1] = qr[1], qr[0]
	}
	for _, r := range qr {
		if r > lo && r < hi {
			br = append(br, r)
		}
	}
	br = append(br, hi)
	var roots []float64
	for i := 0; i+1 < len(br); i++ {
		x0, x1 := br[i], br[i+1]
		f0, f1 := dcpR(a, x0), dcpR(a, x1)
		if !(f0 < 0 && f1 > 0) && !(f0 > 0 && f1 < 0) {
			continue
		}
		for range 200 {
			mid := 0.5 * (x0 + x1)
			if mid <= x0 || mid >= x1 {
				break
			}
			if fm := dcpR(a, mid); (fm < 0) == (f0 < 0) {
				x0, f0 = mid, fm
			} else {
				x1 = mid
			}
		}
		roots = append(roots, 0.5*(x0+x1))
	}
	return roots
}

func report(p NASA7, pts []sample) FitReport {
	var r FitReport
	for _, s := range pts {
		d := math.Abs(p.Cp(s.T) - s.Cp)
		r.MaxCpResidual = math.Max(r.MaxCpResidual, d)
		r.MaxCpRelResidual = math.Max(r.MaxCpRelResidual, d/s.Cp)
	}
	return r
}

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
	// monotonicity and the Cp ceiling are imposed; monotonicity also holds
	// between them (see polyIneq).
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
// data and extrapolates above the last point; a block left with fewer than four
// distinct temperatures (a TMID at or below 500 K) gets Wilhoit values at five
// more (fillThinBlocks). The objective is the weighted sum
// of squared relative residuals of Cp. The ten Cp coefficients a1…a5 of both
// ranges are solved by constrained least squares under
//
//   - exact continuity of Cp and dCp/dT at TMid (built into the unknowns:
//     both ranges share Cp and dCp/dT at TMid, see polyBasis);
//   - dCp/dT ≥ 0 on 120 (low) and 240 (high) grid points, and the inner
//     Bernstein coefficients of the cubic dCp/dT ≥ 0 on every piece between
//     neighbouring grid points, so Cp is monotone non-decreasing everywhere
//     in [TLow, THigh], not only at the grid (inequalities; see polyIneq);
//   - Cp ≤ cpInf on the same grids (inequalities; with Cp monotone this
//     holds between grid points too),
//
// by Householder QR of the data and a dual active-set method (lsi) that forms
// only the inequalities that become active, usually none or a few.
//
// Then a6 and a7 of the low range are fixed so that H(298.15) = hf298 and
// S(298.15) = s298 exactly (298.15 K is evaluated with the low range even when
// TLow = 300 K), and a6, a7 of the high range so that H and S are continuous
// at TMid; these hold to floating-point rounding. Finally Cp is checked at
// every stationary point of both ranges (see denseMonotone): a fall larger
// than the fit's own precision (fallTolerance, about 4e-8 J/(mol K))
// anywhere in [TLow, THigh] is an error, a *ShapeError; the constraints make
// that a safety net, never reached by the fits measured.
//
// Errors: mismatched or empty inputs, non-finite values, T ≤ 0, Cp ≤ 0,
// limits not 0 < cp0 ≤ cpInf, an input Cp ≥ cpInf (inconsistent with the
// classical ceiling; a *ShapeError), bad ranges, or no input point inside
// the range.
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
			return NASA7{}, FitReport{}, fmt.Errorf("nasa fit: %w", &ShapeError{Test: ShapeAboveLimit, T: p.T, Cp: p.Cp, Other: cpInf})
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
	samples = fillThinBlocks(samples, w, opt)
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

// minBlockTemps is the fewest distinct sample temperatures Fit lets a block
// have: each block has three coefficients of its own (the value and slope at
// TMid are shared, see polyBasis), so three determine them and the fourth
// leaves one degree of freedom to least squares.
const minBlockTemps = 4

// fillThinBlocks adds Wilhoit samples (weight 1, from w) to a block of Fit's
// samples that has fewer than minBlockTemps distinct temperatures: the
// low block of a TMID at or below 500 K holds only the 300 and 400 K group
// values, and a range narrower than the 50 K fill grid may hold none. The
// added samples lie at the centres of minBlockTemps+1 equal parts of the
// block. Blocks as for solvePoly: low T < TMid, high T ≥ TMid.
func fillThinBlocks(samples []sample, w Wilhoit, opt FitOptions) []sample {
	for _, high := range []bool{false, true} {
		lo, hi := opt.TLow, opt.TMid
		if high {
			lo, hi = opt.TMid, opt.THigh
		}
		seen := map[float64]bool{}
		for _, s := range samples {
			if (s.T >= opt.TMid) == high {
				seen[s.T] = true
			}
		}
		if len(seen) >= minBlockTemps {
			continue
		}
		const m = minBlockTemps + 1
		for k := range m {
			t := lo + (hi-lo)*(float64(k)+0.5)/m
			samples = append(samples, sample{T: t, Cp: w.Cp(t), W: 1})
		}
	}
	return samples
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

// slopeBern writes into g the coefficients of q(s) + δ q'(s) at T in the
// block given by high, where q is d(Cp/R)/dT × 1000 K as a function of the
// block variable s = (T − TMid)/ΔT and δ a step in s: with δ = ±h/3 for a
// piece of width h starting (+) or ending (−) at T, this is an inner
// Bernstein coefficient of the cubic q on that piece (see polyIneq).
func (pb polyBasis) slopeBern(T float64, high bool, delta float64, g []float64) {
	clear(g)
	g[1] = 1
	off, d := 2, pb.dLow
	if high {
		off, d = 5, pb.dHigh
	}
	s := (T - pb.tMid) / d
	k := tauScale / d
	g[off] = k * (2*s + 2*delta)
	g[off+1] = k * (3*s*s + 6*s*delta)
	g[off+2] = k * (4*s*s*s + 12*s*s*delta)
}

// polyIneq is the family of inequalities of solvePoly, in this order:
//
//  1. when monotone, q ≥ 0 at every grid point, q = d(Cp/R)/dT × 1000 K
//     (low grid, then high grid);
//  2. when monotone, the two inner Bernstein coefficients of the cubic q on
//     every piece between neighbouring grid points of a block are ≥ 0
//     (low pieces, then high pieces; each piece's left one, then its right
//     one);
//  3. when cpMax > 0, Cp ≤ cpMax on the low and on the high grid.
//
// Grid j of a block with m points lies at lo + (hi − lo) j/(m − 1).
//
// Why 2. The grid values alone (1.) leave q free between grid points, and
// where the fitted Cp flattens (an active constraint, q = 0 at a grid
// point) q dips below zero between neighbours: Cp then fell by some 1e-5
// J/(mol K) over a few kelvin and the fit was refused (1.5 % of the species
// of a generated 5,000-species file). On a piece [s₀, s₁] of width h the
// cubic q has the Bernstein coefficients b₀ = q(s₀), b₁ = q(s₀) + h q′(s₀)/3,
// b₂ = q(s₁) − h q′(s₁)/3 and b₃ = q(s₁) (b₀ and b₃ are the grid values of
// 1.), and by the convex-hull property q ≥ min bᵢ on the piece (Farouki &
// Rajan, Comput. Aided Geom. Des. 5 (1988)). All bᵢ ≥ 0 is therefore a
// linear, sufficient condition for Cp to be non-decreasing everywhere in
// [TLow, THigh], not only at the grid; it is conservative by O(h²) q″, which
// on pieces of 6–17 K (300/1000/5000 K; some 20 K for the widest ranges
// allowed) is far below the precision of the data. With Cp
// non-decreasing, its largest value on a piece is at the piece's right end,
// a grid point, so the ceiling of 3. holds everywhere too.
type polyIneq struct {
	pb                polyBasis
	opt               FitOptions
	capR              float64 // cpMax/R, 0 for none
	nGrid, nMon, nAll int
}

// nGridPoints is the number of grid points of both blocks, nPieces the
// number of pieces between neighbouring grid points.
const (
	nGridPoints = nLowGrid + nHighGrid
	nPieces     = nLowGrid - 1 + nHighGrid - 1
)

func newPolyIneq(opt FitOptions, monotone bool, cpMax float64) *polyIneq {
	f := &polyIneq{pb: newPolyBasis(opt), opt: opt, nGrid: nGridPoints}
	if monotone {
		f.nMon = nGridPoints + 2*nPieces
	}
	f.nAll = f.nMon
	if cpMax > 0 {
		f.capR = cpMax / R
		f.nAll += nGridPoints
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

// bern returns, for Bernstein index j (0 ≤ j < 2 nPieces), the temperature
// of the grid point it is formed at, the block and the step δ in the block
// variable s (+h/3 at a piece's left end, −h/3 at its right end).
func (f *polyIneq) bern(j int) (float64, bool, float64) {
	piece, right := j/2, j%2 == 1
	// Grid index of the piece's left end: low pieces 0…nLowGrid−2 start at
	// low grid points 0…nLowGrid−2, high pieces at the high grid points.
	gi, m := piece, nLowGrid
	if piece >= nLowGrid-1 {
		gi, m = piece+1, nHighGrid
	}
	h := 1 / float64(m-1) // piece width in s (each block spans |s| ≤ 1)
	if right {
		t, high := f.point(gi + 1)
		return t, high, -h / 3
	}
	t, high := f.point(gi)
	return t, high, h / 3
}

func (f *polyIneq) row(i int, g []float64) float64 {
	switch {
	case i < f.nGrid && i < f.nMon:
		t, high := f.point(i)
		f.pb.slope(t, high, g)
		return 0
	case i < f.nMon:
		t, high, delta := f.bern(i - f.nGrid)
		f.pb.slopeBern(t, high, delta, g)
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
		var (
			t     float64
			high  bool
			delta float64
		)
		switch {
		case i < f.nGrid && i < f.nMon:
			t, high = f.point(i)
		case i < f.nMon:
			t, high, delta = f.bern(i - f.nGrid)
		default:
			t, high = f.point(i - f.nMon)
		}
		b := &blocks[0]
		if high {
			b = &blocks[1]
		}
		x := (t - f.pb.tMid) / b.dT
		if i < f.nMon {
			// q + δ q′ ≥ 0, q = d(Cp/R)/dT × 1000 K (δ = 0 at grid points).
			q := d1 + b.k*x*(2*b.c2+x*(3*b.c3+x*4*b.c4))
			if delta != 0 {
				q += delta * b.k * (2*b.c2 + x*(6*b.c3+x*12*b.c4))
			}
			s[i] = q
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

// Tests of a ShapeError.
const (
	// ShapeFalls: the fitted Cp falls with temperature.
	ShapeFalls = "cp-falls"
	// ShapeAboveLimit: an input Cp is not below the classical limit Cp∞.
	ShapeAboveLimit = "cp-above-limit"
)

// ShapeError is Fit's refusal of a heat-capacity curve no real molecule of
// the given size has. Its fields carry the numbers in SI units so that
// callers can word the refusal in their own units (Error words it in SI).
type ShapeError struct {
	// Test is ShapeFalls or ShapeAboveLimit.
	Test string
	// T (K) and Cp (J/(mol K)) locate the defect: the lowest point of the
	// fall, or the input point at or above the limit.
	T, Cp float64
	// Other is the value Cp is compared with, J/(mol K): the higher Cp
	// reached earlier at OtherT (ShapeFalls), or the classical limit Cp∞
	// (ShapeAboveLimit; OtherT is 0).
	Other, OtherT float64
}

func (e *ShapeError) Error() string {
	if e.Test == ShapeAboveLimit {
		return fmt.Sprintf("Cp = %.4g J/(mol K) at %g K is not below the classical limit %.4g J/(mol K)", e.Cp, e.T, e.Other)
	}
	return fmt.Sprintf("Cp falls by %.2g J/(mol K), from %.6g J/(mol K) at %.0f K to %.6g J/(mol K) at %.0f K", e.Other-e.Cp, e.Other, e.OtherT, e.Cp, e.T)
}

// lsiTol is the accuracy to which solvePoly's solver satisfies each
// inequality: the monotonicity rows are in d(Cp/R)/dT × 1000 K, the ceiling
// rows in Cp/R.
const lsiTol = 1e-9

// fallTolerance returns how far (J/(mol K)) the Cp of p may fall below its
// running maximum, at a temperature where the low or high block (a) is
// compared with a value from block b, before denseMonotone calls it a fall.
// It is the fit's own precision, derived rather than chosen:
//
//   - the solver accepts each Bernstein coefficient of d(Cp/R)/dT × 1000 K
//     down to −lsiTol (see polyIneq), so over [TLow, THigh] Cp may fall by up
//     to R · lsiTol · (THigh − TLow)/1000 K (3.9e-8 J/(mol K) for 300–5000 K);
//   - the coefficients are converted from the centred form to powers of T
//     and evaluated in float64: each evaluation is exact to a few units of
//     rounding u = 2⁻⁵³ times Σ|aₖ|Tᵏ (Higham, Accuracy and Stability of
//     Numerical Algorithms, 2nd ed. 2002, §5.1, for Horner's rule), and the
//     conversion adds as much again; 256 u Σ|aₖ|Tᵏ R for each of the two
//     values compared is a generous bound. Measured on 15,000 fits of
//     generated species (genmech seeds 1–3), the largest fall was 1.4e-12
//     J/(mol K), at most 18 u Σ|aₖ|Tᵏ R, all at the join TMid.
//
// Both are below 1e-6 J/(mol K), some 1e5 times below the precision of any
// estimated or measured heat capacity; a fall larger than this is a real
// defect of the polynomial and is refused.
func fallTolerance(p NASA7, T float64, a, b *[7]float64, Tb float64) float64 {
	const u = 0x1p-53
	mag := func(a *[7]float64, T float64) float64 {
		m, tk := 0.0, 1.0
		for k := range 5 {
			m += math.Abs(a[k]) * tk
			tk *= T
		}
		return m
	}
	return R * (lsiTol*(p.THigh-p.TLow)/tauScale + 256*u*(mag(a, T)+mag(b, Tb)))
}

// denseMonotone checks that Cp never falls below its running maximum over
// [TLow, THigh] (the low block on [TLow, TMid], the high block on [TMid,
// THigh]) by more than the fit's own precision (fallTolerance); a fall is
// returned as a *ShapeError. The test is exact up to rounding: Cp is
// evaluated at the range ends and at every stationary point, the real roots
// of the cubic dCp/dT found by bisection between the roots of the quadratic
// d²Cp/dT², and a fall can only end at one of those. Fit's constraints make
// Cp non-decreasing by construction (see polyIneq), so this is a safety net
// that catches a failure of the solver, not a test that fits routinely fail.
func denseMonotone(p NASA7) error {
	peak, peakT := math.Inf(-1), 0.0
	var peakBlock *[7]float64
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
			if math.IsNaN(c) {
				return fmt.Errorf("Cp is not a number at %g K", t)
			}
			if peakBlock != nil && c < peak-fallTolerance(p, t, bl.a, peakBlock, peakT) {
				return &ShapeError{Test: ShapeFalls, T: t, Cp: c, Other: peak, OtherT: peakT}
			}
			if c > peak {
				peak, peakT, peakBlock = c, t, bl.a
			}
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

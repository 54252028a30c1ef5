package nasa

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/mat"
)

// FitOptions sets the temperature ranges of a fitted polynomial in K. Zero
// values mean TLow = 300, TMid = 1000, THigh = 5000.
type FitOptions struct{ TLow, TMid, THigh float64 }

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
	// tauScale (K) scales temperature inside the least-squares problem,
	// τ = T/tauScale, to keep the monomial columns of similar size.
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
// Method. A Wilhoit curve (FitWilhoit) is fitted to the points. The least-
// squares targets are the input points inside [TLow−2 K, THigh+2 K] (weight 3)
// and the Wilhoit value at every 50 K grid temperature of [TLow, THigh] lying
// farther than 50 K from every input point (weight 1): this fills gaps in the
// data and extrapolates above the last point. The objective is the weighted sum
// of squared relative residuals of Cp. The ten Cp coefficients a1…a5 of both
// ranges are solved by constrained least squares (null-space elimination,
// gonum/mat) under
//
//   - exact continuity of Cp and dCp/dT at TMid (equalities);
//   - dCp/dT ≥ 0 on 120 (low) and 240 (high) grid points, so Cp is monotone
//     non-decreasing over [TLow, THigh] (active-set inequalities);
//   - Cp ≤ cpInf on the same grids (active-set inequalities).
//
// Then a6 and a7 of the low range are fixed so that H(298.15) = hf298 and
// S(298.15) = s298 exactly (298.15 K is evaluated with the low range even when
// TLow = 300 K), and a6, a7 of the high range so that H and S are continuous
// at TMid; these hold to floating-point rounding. Finally Cp is checked on a
// 1 K grid: a fall of more than 1e-6 R anywhere is an error.
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
	w, err := FitWilhoit(ts, cps, cp0, cpInf)
	if err != nil {
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

// solvePoly solves the constrained least-squares problem described on Fit for
// the given samples; cpMax ≤ 0 means no ceiling.
func solvePoly(hf298, s298 float64, samples []sample, opt FitOptions, monotone bool, cpMax float64) (NASA7, error) {
	const n = 10 // τ-scaled Cp/R coefficients: 0–4 low, 5–9 high
	a := mat.NewDense(len(samples), n, nil)
	b := make([]float64, len(samples))
	for i, s := range samples {
		off := 0
		if s.T >= opt.TMid {
			off = 5
		}
		tau := s.T / tauScale
		scale := s.W / (s.Cp / R)
		tk := scale
		for k := range 5 {
			a.Set(i, off+k, tk)
			tk *= tau
		}
		b[i] = s.W
	}
	tm := opt.TMid / tauScale
	cont := make([]float64, n)
	slope := make([]float64, n)
	for k := range 5 {
		cont[k] = math.Pow(tm, float64(k))
		cont[5+k] = -cont[k]
		if k > 0 {
			slope[k] = float64(k) * math.Pow(tm, float64(k-1))
			slope[5+k] = -slope[k]
		}
	}
	eq := []linearRow{{c: cont}, {c: slope}}
	var ineq []linearRow
	addGrid := func(lo, hi float64, m, off int) {
		for j := range m {
			t := lo + (hi-lo)*float64(j)/float64(m-1)
			tau := t / tauScale
			if monotone {
				row := make([]float64, n)
				for k := 1; k < 5; k++ {
					row[off+k] = float64(k) * math.Pow(tau, float64(k-1))
				}
				ineq = append(ineq, linearRow{c: row})
			}
			if cpMax > 0 {
				row := make([]float64, n)
				for k := range 5 {
					row[off+k] = -math.Pow(tau, float64(k))
				}
				ineq = append(ineq, linearRow{c: row, rhs: -cpMax / R})
			}
		}
	}
	addGrid(opt.TLow, opt.TMid, nLowGrid, 0)
	addGrid(opt.TMid, opt.THigh, nHighGrid, 5)
	x, err := constrainedLSQ(a, b, eq, ineq, 1e-9)
	if err != nil {
		return NASA7{}, err
	}
	p := NASA7{TLow: opt.TLow, TMid: opt.TMid, THigh: opt.THigh}
	for k := range 5 {
		f := math.Pow(tauScale, float64(k))
		p.Low[k] = x[k] / f
		p.High[k] = x[5+k] / f
	}
	p.Low[5] = hf298/R - hIntR(&p.Low, Tref)
	p.Low[6] = s298/R - sIntR(&p.Low, Tref)
	p.High[5] = hR(&p.Low, opt.TMid) - hIntR(&p.High, opt.TMid)
	p.High[6] = sR(&p.Low, opt.TMid) - sIntR(&p.High, opt.TMid)
	if !finite(&p.Low) || !finite(&p.High) {
		return NASA7{}, errors.New("fit produced non-finite coefficients")
	}
	return p, nil
}

// denseMonotone checks on a 1 K grid that Cp never falls by more than 1e-6 R
// below its running maximum over [TLow, THigh].
func denseMonotone(p NASA7) error {
	peak := math.Inf(-1)
	for t := p.TLow; t <= p.THigh; t++ {
		c := p.Cp(t)
		if c < peak-1e-6*R {
			return fmt.Errorf("Cp falls to %g J/(mol K) at %g K below the earlier %g J/(mol K)", c, t, peak)
		}
		peak = math.Max(peak, c)
	}
	return nil
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

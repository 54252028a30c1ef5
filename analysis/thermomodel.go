package analysis

import (
	"fmt"
	"math"
	"sort"
	"sync"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/engine/nasa"
)

// groupThermo is the thermochemistry of a group-additivity estimate as the
// reaction checks use it: Cp linear between the estimated points (300…1500 K),
// H and S integrated exactly from ΔHf°298 and S°298:
//
//	H(T) = ΔHf°298 + ∫ Cp dT,   S(T) = S°298 + ∫ Cp/T dT   (from 298.15 K)
//
// Below 300 K the first segment is extended; above 1500 K Cp is held at its
// 1500 K value (a lower bound: Cp still rises slowly towards its classical
// limit). It needs no fit, so a mechanism's reactions can be checked without
// fitting a polynomial to every species; the fitted NASA-7 polynomial, which
// kiln writes into files, reproduces the same points within 2 %.
type groupThermo struct {
	t, cp, h, s []float64 // knots (K), Cp at the knots, H and S at the knots
}

func newGroupThermo(hf298, s298 float64, T, cp []float64) *groupThermo {
	g := &groupThermo{}
	type pt struct{ t, cp float64 }
	pts := make([]pt, len(T))
	for i := range T {
		pts[i] = pt{T[i], cp[i]}
	}
	sort.Slice(pts, func(i, j int) bool { return pts[i].t < pts[j].t })
	for _, p := range pts {
		g.t = append(g.t, p.t)
		g.cp = append(g.cp, p.cp)
	}
	g.h = make([]float64, len(g.t))
	g.s = make([]float64, len(g.t))
	// Values at the first knot from 298.15 K, then knot to knot.
	g.h[0] = hf298 + g.dh(0, T298, g.t[0])
	g.s[0] = s298 + g.ds(0, T298, g.t[0])
	for i := 1; i < len(g.t); i++ {
		g.h[i] = g.h[i-1] + g.dh(i-1, g.t[i-1], g.t[i])
		g.s[i] = g.s[i-1] + g.ds(i-1, g.t[i-1], g.t[i])
	}
	return g
}

// segment returns Cp = a + b·T on segment k (k = -1 or len-1: the constant
// or extended ends are handled by the callers).
func (g *groupThermo) segment(k int) (a, b float64) {
	n := len(g.t)
	if n == 1 {
		return g.cp[0], 0
	}
	if k >= n-1 {
		return g.cp[n-1], 0 // held above the last knot
	}
	if k < 0 {
		k = 0
	}
	b = (g.cp[k+1] - g.cp[k]) / (g.t[k+1] - g.t[k])
	return g.cp[k] - b*g.t[k], b
}

func (g *groupThermo) dh(k int, t1, t2 float64) float64 {
	a, b := g.segment(k)
	return a*(t2-t1) + b/2*(t2*t2-t1*t1)
}

func (g *groupThermo) ds(k int, t1, t2 float64) float64 {
	a, b := g.segment(k)
	return a*math.Log(t2/t1) + b*(t2-t1)
}

// knot returns the index of the segment holding T: -1 below the first knot,
// len-1 above the last.
func (g *groupThermo) knot(T float64) int {
	return sort.SearchFloat64s(g.t, T) - 1
}

// Cp returns the heat capacity in J/(mol K).
func (g *groupThermo) Cp(T float64) float64 {
	a, b := g.segment(g.knot(T))
	return a + b*T
}

// H returns the enthalpy in J/mol on the ΔHf°298 scale.
func (g *groupThermo) H(T float64) float64 {
	k := g.knot(T)
	if k < 0 {
		return g.h[0] - g.dh(0, T, g.t[0])
	}
	return g.h[k] + g.dh(k, g.t[k], T)
}

// S returns the entropy in J/(mol K) at 1 bar.
func (g *groupThermo) S(T float64) float64 {
	k := g.knot(T)
	if k < 0 {
		return g.s[0] - g.ds(0, T, g.t[0])
	}
	return g.s[k] + g.ds(k, g.t[k], T)
}

// fitResult is a NASA-7 fit made on first use.
type fitResult struct {
	once   sync.Once
	poly   nasa.NASA7
	report nasa.FitReport
	err    error
}

// NASA7 returns the estimate's NASA-7 polynomial: the reference library's own
// for library species, else a fit to the group values (made on first use;
// fitting is the costly step of an estimate, and most uses need only the
// values). FitReport is zero for library species.
//
// With explicit fit temperatures (EstimateOptions.ExplicitRange) a library
// polynomial is refitted to the requested TMid and THigh: its Cp sampled
// every 10 K over its own range, fitted by nasa.FitPoly with ΔHf°298 and
// S°298 kept exact. A THigh above the library's own is refused (that would
// extrapolate the reference data).
func (e *Estimate) NASA7() (nasa.NASA7, nasa.FitReport, error) {
	if e.Library != "" && e.fit == nil {
		return e.libPoly, nasa.FitReport{}, nil
	}
	f := e.fit
	if e.Library != "" {
		f.once.Do(func() { f.poly, f.report, f.err = e.refitLibrary() })
		return f.poly, f.report, f.err
	}
	f.once.Do(func() {
		f.poly, f.report, f.err = nasa.Fit(e.Hf298, e.S298, benson.StdTemps[:], e.Cp[:], e.cp0, e.cpInf,
			nasa.FitOptions{TLow: 300, TMid: e.tMid, THigh: e.tHigh})
	})
	return f.poly, f.report, f.err
}

// refitLibrary fits the library polynomial anew with the requested TMid and
// THigh (see NASA7).
func (e *Estimate) refitLibrary() (nasa.NASA7, nasa.FitReport, error) {
	lib := e.libPoly
	if e.tHigh > lib.THigh {
		return nasa.NASA7{}, nasa.FitReport{}, fmt.Errorf("the reference data for %s end at %g K, below the requested THIGH %g K (kiln does not extrapolate them)", e.Library, lib.THigh, e.tHigh)
	}
	if e.tMid <= lib.TLow {
		return nasa.NASA7{}, nasa.FitReport{}, fmt.Errorf("the requested TMID %g K is not above the reference data's lowest temperature %g K", e.tMid, lib.TLow)
	}
	var T, cp []float64
	for t := lib.TLow; t <= e.tHigh+1e-9; t += 10 {
		T = append(T, t)
		cp = append(cp, lib.Cp(t))
	}
	p, rep, err := nasa.FitPoly(e.Hf298, e.S298, T, cp, nasa.FitOptions{TLow: lib.TLow, TMid: e.tMid, THigh: e.tHigh})
	if err != nil {
		return p, rep, fmt.Errorf("refitting the reference data of %s to %g/%g K: %w", e.Library, e.tMid, e.tHigh, err)
	}
	return p, rep, nil
}

// Thermo returns the model the reaction checks use for the estimate: the
// library polynomial, or the group values integrated (groupThermo).
func (e *Estimate) Thermo() kinetics.Thermo {
	if e.Library != "" {
		return &e.libPoly // a pointer: no copy of the coefficients per call
	}
	return e.model
}

// thermoCurve is a thermo model with heat capacity: Cp (J/(mol K)), H
// (J/mol), S (J/(mol K)) as functions of T (K).
type thermoCurve interface {
	Cp(T float64) float64
	H(T float64) float64
	S(T float64) float64
}

// written returns the thermochemistry kiln writes for the estimate: its
// NASA-7 polynomial (`kiln fill`, `estimate --nasa`, the quick fix; the
// library polynomial, or for group values the fit with its Wilhoit
// extrapolation past 1500 K), or the group model when the fit fails (fill
// then writes nothing). `compare` and `equilibrium` evaluate estimates by
// it, so that a file and its fill output give the same results.
func (e *Estimate) written() thermoCurve {
	if p, _, err := e.NASA7(); err == nil {
		return &p
	}
	return e.curve()
}

// curve returns the same model as Thermo, with Cp.
func (e *Estimate) curve() thermoCurve {
	if e.Library != "" {
		return &e.libPoly
	}
	return e.model
}

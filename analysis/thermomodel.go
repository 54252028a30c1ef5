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

// groupThermo is heat capacities at points integrated: Cp linear between
// the points, H and S integrated exactly from ΔHf°298 and S°298:
//
//	H(T) = ΔHf°298 + ∫ Cp dT,   S(T) = S°298 + ∫ Cp/T dT   (from 298.15 K)
//
// Below the first point the first segment is extended. Above the last point
// an estimate (group values, 300…1500 K) continues along nasa.Tail, the
// Wilhoit curve its NASA-7 fit extrapolates with, fitted on first use (see
// continueAlongTail); a thermo-table block of a file holds Cp at its last value.
// It needs no NASA-7 fit, so a mechanism's reactions can be checked without
// fitting a polynomial to every species, and it agrees with the fit kiln
// writes to within the fit's residuals at every temperature.
type groupThermo struct {
	t, cp, h, s []float64 // knots (K), Cp at the knots, H and S at the knots
	extrapolate bool      // above the last knot: tail (else Cp held)
	tail        lazyTail
}

// lazyTail is the nasa.Tail of an estimate, fitted on first use: the
// Wilhoit fit costs about 0.1 ms, and most species are never evaluated
// above their last point (see gBound).
type lazyTail struct {
	cp0, cpInf float64 // classical limits, J/(mol K)
	once       sync.Once
	tail       *nasa.Tail // allocated when fitted: most never are
}

// continueAlongTail makes g continue above its last knot along the Wilhoit
// curve of its knots between the classical limits cp0 and cpInf
// (J/(mol K)).
func (g *groupThermo) continueAlongTail(cp0, cpInf float64) {
	g.extrapolate, g.tail.cp0, g.tail.cpInf = true, cp0, cpInf
}

// above returns the tail above the last knot, fitting it on first use. When
// the Wilhoit fit fails (the NASA-7 fit then fails too, and kiln writes
// nothing) Cp is held at its last value.
func (g *groupThermo) above() *nasa.Tail {
	l := &g.tail
	l.once.Do(func() {
		n := len(g.t)
		tail, err := nasa.EstimateTail(g.t, g.cp, l.cp0, l.cpInf)
		if err != nil {
			tail = nasa.NewTail(nasa.Wilhoit{}, g.t[n-1], g.cp[n-1])
		}
		l.tail = &tail
	})
	return l.tail
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
	k := g.knot(T)
	if g.extrapolate && k == len(g.t)-1 {
		return g.above().Cp(T)
	}
	a, b := g.segment(k)
	return a + b*T
}

// H returns the enthalpy in J/mol on the ΔHf°298 scale.
func (g *groupThermo) H(T float64) float64 {
	k := g.knot(T)
	switch {
	case k < 0:
		return g.h[0] - g.dh(0, T, g.t[0])
	case g.extrapolate && k == len(g.t)-1:
		return g.h[k] + g.above().DH(T)
	}
	return g.h[k] + g.dh(k, g.t[k], T)
}

// S returns the entropy in J/(mol K) at 1 bar.
func (g *groupThermo) S(T float64) float64 {
	k := g.knot(T)
	switch {
	case k < 0:
		return g.s[0] - g.ds(0, T, g.t[0])
	case g.extrapolate && k == len(g.t)-1:
		return g.s[k] + g.above().DS(T)
	}
	return g.s[k] + g.ds(k, g.t[k], T)
}

// tailFrom returns the temperature (K) above which th needs an estimate's
// Wilhoit tail (fitted on first use): its last group temperature; +Inf for
// every other model.
func tailFrom(th kinetics.Thermo) float64 {
	if g, ok := th.(*groupThermo); ok && g.extrapolate {
		return g.t[len(g.t)-1]
	}
	return math.Inf(1)
}

// gBound returns a bound on th's G(T) = H − T S (J/mol) that needs no
// Wilhoit fit: from above (upper) or below. Above tailFrom(th) Cp is held
// at the low (upper) or high end of nasa.TailRange from the last knot;
// elsewhere it is G itself.
func gBound(th kinetics.Thermo, T float64, upper bool) float64 {
	if g, ok := th.(*groupThermo); ok && g.extrapolate {
		n := len(g.t) - 1
		if t1 := g.t[n]; T > t1 {
			lo, hi := nasa.TailRange(g.cp[n], g.tail.cp0, g.tail.cpInf)
			cp := hi
			if upper {
				cp = lo
			}
			return g.h[n] + cp*(T-t1) - T*(g.s[n]+cp*math.Log(T/t1))
		}
	}
	return th.H(T) - T*th.S(T)
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
// values). For a library species the FitReport is that of the library's own
// fit to its source's Cp (reflib.Species.Fit): zero for one entered as
// published NASA-7 blocks.
//
// With explicit fit temperatures (EstimateOptions.ExplicitRange) a library
// polynomial is refitted to the requested TMid and THigh: its Cp sampled
// every 10 K over its own range, fitted by nasa.FitPoly with ΔHf°298 and
// S°298 kept exact. A THigh above the library's own is refused (that would
// extrapolate the reference data).
func (e *Estimate) NASA7() (nasa.NASA7, nasa.FitReport, error) {
	if e.Library != "" && e.fit == nil {
		return e.libPoly, e.libFit, nil
	}
	f := e.fit
	if e.Library != "" {
		f.once.Do(func() { f.poly, f.report, f.err = e.refitLibrary() })
		return f.poly, f.report, f.err
	}
	f.once.Do(func() {
		if g := e.Group; g != nil {
			// An S° the estimate itself flags as physically impossible
			// is not written as data (fill, the quick fix, estimate
			// --nasa all come here).
			if floor, below := g.EntropyFloor(); below {
				f.err = fmt.Errorf("the estimated S°298 %.1f J/(mol K) is below %.1f J/(mol K), the translational plus least rotational entropy of any structure of this mass, so the group values do not add up for this structure; kiln writes no polynomial from it", g.S298, floor)
				return
			}
		}
		if e.cpFloor != nil {
			// Nor a Cp below the translational and rotational heat
			// capacity (the bound nonphysical-thermo applies to blocks).
			f.err = e.cpFloor
			return
		}
		// One Wilhoit curve per estimate: the fit extrapolates with the
		// curve the reaction checks' model continues along (nasa.Fit
		// ignores it when the range leaves out group temperatures).
		opt := nasa.FitOptions{TLow: 300, TMid: e.tMid, THigh: e.tHigh}
		if t := e.model.above(); t.W.CpInf > 0 {
			opt.Wilhoit = &t.W
		}
		f.poly, f.report, f.err = nasa.Fit(e.Hf298, e.S298, benson.StdTemps[:], e.Cp[:], e.cp0, e.cpInf, opt)
	})
	return f.poly, f.report, f.err
}

// LibraryRefitted reports whether NASA7 refits a reference-library species'
// polynomial to requested fit temperatures (EstimateOptions.ExplicitRange)
// rather than giving the library's own.
func (e *Estimate) LibraryRefitted() bool { return e.Library != "" && e.fit != nil }

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

package nasa

import (
	"fmt"
	"math"
)

// Tolerances bounds what Check accepts. Zero fields take the defaults of
// DefaultTolerances.
type Tolerances struct {
	// Cp is the largest accepted jump of Cp at TMid and the slack allowed
	// above the ceiling cpMax, in J/(mol K).
	Cp float64
	// H is the largest accepted jump of H at TMid, in J/mol.
	H float64
	// S is the largest accepted jump of S at TMid, in J/(mol K).
	S float64
	// CpFall is how far Cp may fall below its running maximum within
	// [TLow, THigh] before Check calls it nonphysical, in J/(mol K).
	CpFall float64
}

// DefaultTolerances returns the tolerances Check uses for zero fields:
//
//	Cp     = 0.01 R ≈ 0.083 J/(mol K)
//	H      = 0.01 R × 1000 K ≈ 83 J/mol (0.01 R·TMid for the usual TMid)
//	S      = 0.01 R ≈ 0.083 J/(mol K)
//	CpFall = 0.3 R ≈ 2.49 J/(mol K)
//
// The jump tolerances are about 0.1–0.3 % of typical values at 1000 K:
// coarse enough for hand-made and older published polynomials whose ranges
// were fitted separately, fine enough to catch a mistyped coefficient. The
// fall allowance is large because real electronic contributions make Cp of
// some atoms and radicals fall with T (NIST-JANAF, Chase 1998, from memory:
// O atom Cp falls from about 22.7 J/(mol K) at 200 K to about 20.8 J/(mol K)
// near 1500 K, 0.23 R); it still catches polynomials whose Cp turns down by
// whole R at high T.
func DefaultTolerances() Tolerances {
	return Tolerances{Cp: 0.01 * R, H: 0.01 * R * 1000, S: 0.01 * R, CpFall: 0.3 * R}
}

// Problem is one defect found by Check.
type Problem struct {
	// Kind is "discontinuity" or "nonphysical".
	Kind string
	// Message is a human-readable description with numbers and temperatures
	// in SI units; callers that show numbers in other units format their own
	// from the fields below.
	Message string
	// Part names where the defect is: "low" or "high" (a coefficient block),
	// "ranges" (the temperature limits) or "tmid" (the join).
	Part string
	// Test names the failed test: "ranges", "finite", "cp-jump", "h-jump",
	// "s-jump", "cp-falls", "cp-nonpositive" or "cp-ceiling".
	Test string
	// T is the temperature (K) of the defect, Value the property there (Cp
	// in J/(mol K), H in J/mol, S in J/(mol K)) and Other the value it is
	// compared with: the high block's value at TMid for jumps (Value is the
	// low block's), the running maximum for cp-falls, the ceiling for
	// cp-ceiling.
	T, Value, Other float64
}

// ExcessCpAllowance (J/(mol K)) is how far Check lets Cp rise above the
// classical all-vibration limit Cp∞ of ClassicalLimits before it calls it
// nonphysical: 2 R. Real gases exceed Cp∞ through electronic heat capacity
// (low-lying excited states: the Schottky contribution of O, O2, HO2, NO,
// NO2) and vibrational anharmonicity at flame temperatures. In the NASA
// TM-4513 polynomials of kiln's reference library the excess reaches
// 0.42 R for O2 at 3500 K, 0.47 R for N2O near 5900 K and 1.5 R for NO2 at
// 6000 K (measured by kiln over each polynomial's range); 2 R covers these
// with a margin while a mistyped coefficient, which moves Cp by many R,
// is still caught.
const ExcessCpAllowance = 2 * R

// CpCeiling returns the highest Cp (J/(mol K)) Check accepts for a molecule
// of nAtoms atoms: the classical all-vibration limit Cp∞ (no internal rotor
// discounted, since any rotor may be a stiff vibration at high T) plus
// ExcessCpAllowance.
func CpCeiling(nAtoms int, linear bool) float64 {
	_, cpInf := ClassicalLimits(nAtoms, linear, 0)
	return cpInf + ExcessCpAllowance
}

// CpFloor returns the lowest Cp (J/(mol K)) a molecule of nAtoms atoms may
// have from FloorFrom up: 95 % of the translational and rotational heat
// capacity Cp0 of ClassicalLimits (5/2 R for an atom, 7/2 R linear, 4 R
// non-linear), which vibrations and electronic states only add to. The 5 %
// slack and the lower end of 296.15 K leave room for H2, whose rotational
// heat capacity is not classical at low temperature: 28.8 J/(mol K) at
// 298 K against 7/2 R = 29.1 (NIST-JANAF, common practice). It is the
// counterpart of CpCeiling; nAtoms < 1 returns 0 (no floor).
func CpFloor(nAtoms int, linear bool) float64 {
	cp0, _ := ClassicalLimits(nAtoms, linear, 0)
	return 0.95 * cp0
}

// FloorFrom (K) is where CpFloor starts to apply: 298.15 K, less the 2 K
// by which a range starting at 300 K counts as covering it.
const FloorFrom = Tref - 2

// floorPoints is the number of intervals per block at which BelowFloor
// samples Cp.
const floorPoints = 50

// BelowFloor returns the first temperature (K) at or above FloorFrom where
// p's Cp is positive but below floor (J/(mol K); CpFloor), with that Cp and
// the block ("low" or "high"), sampling each block's range at 51 evenly
// spaced temperatures; found is false when there is none. A Cp that is not
// positive is Check's to report (cp-nonpositive), as are ranges out of
// order (no block is then sampled).
func BelowFloor(p NASA7, floor float64) (part string, T, cp float64, found bool) {
	for _, r := range []struct {
		part   string
		lo, hi float64
	}{{"low", p.TLow, p.TMid}, {"high", p.TMid, p.THigh}} {
		if !(r.lo > 0 && r.hi > r.lo) {
			return "", 0, 0, false
		}
		for i := 0; i <= floorPoints; i++ {
			T := r.lo + (r.hi-r.lo)*float64(i)/floorPoints
			if T < FloorFrom {
				continue
			}
			if c := p.Cp(T); c > 0 && c < floor {
				return r.part, T, c, true
			}
		}
	}
	return "", 0, 0, false
}

const (
	// KindDiscontinuity marks a jump of Cp, H or S at TMid.
	KindDiscontinuity = "discontinuity"
	// KindNonphysical marks a property no real ideal gas has.
	KindNonphysical = "nonphysical"
)

// checkPoints is the number of grid points per range at which Check samples Cp.
const checkPoints = 500

// Check returns the defects of p, none for a sound polynomial:
//
//   - nonphysical, "ranges": TLow ≥ TMid, TMid ≥ THigh or TLow ≤ 0;
//   - nonphysical, "low"/"high": a non-finite coefficient (then nothing else
//     about that block is checked);
//   - discontinuity, "tmid": |ΔCp|, |ΔH| or |ΔS| between the blocks at TMid
//     above tol.Cp, tol.H, tol.S;
//   - nonphysical, "low"/"high": Cp ≤ 0 somewhere in the block's range, Cp
//     falling more than tol.CpFall below its running maximum, or Cp above
//     cpMax + tol.Cp (cpMax in J/(mol K), the classical limit Cp∞ from
//     ClassicalLimits; 0 skips this test).
//
// Each block is examined on its own range (low on [TLow, TMid], high on
// [TMid, THigh]) at 500 evenly spaced temperatures; a fall is tracked across
// both ranges. Ranges that are out of order are reported and the grid checks
// are skipped.
func Check(p NASA7, tol Tolerances, cpMax float64) []Problem {
	def := DefaultTolerances()
	if tol.Cp <= 0 {
		tol.Cp = def.Cp
	}
	if tol.H <= 0 {
		tol.H = def.H
	}
	if tol.S <= 0 {
		tol.S = def.S
	}
	if tol.CpFall <= 0 {
		tol.CpFall = def.CpFall
	}
	var out []Problem
	add := func(kind, part, test string, T, value, other float64, format string, args ...any) {
		out = append(out, Problem{Kind: kind, Part: part, Test: test, T: T, Value: value, Other: other, Message: fmt.Sprintf(format, args...)})
	}
	rangesOK := p.TLow > 0 && p.TLow < p.TMid && p.TMid < p.THigh && !math.IsInf(p.THigh, 0)
	if !rangesOK {
		add(KindNonphysical, "ranges", "ranges", 0, 0, 0, "temperature ranges %g–%g–%g K are not in increasing order of positive finite values", p.TLow, p.TMid, p.THigh)
	}
	lowOK, highOK := finite(&p.Low), finite(&p.High)
	if !lowOK {
		add(KindNonphysical, "low", "finite", 0, 0, 0, "low-range coefficients are not all finite: %v", p.Low)
	}
	if !highOK {
		add(KindNonphysical, "high", "finite", 0, 0, 0, "high-range coefficients are not all finite: %v", p.High)
	}
	if !rangesOK {
		return out
	}
	tm := p.TMid
	if lowOK && highOK {
		if d := R * (cpR(&p.High, tm) - cpR(&p.Low, tm)); math.Abs(d) > tol.Cp {
			add(KindDiscontinuity, "tmid", "cp-jump", tm, R*cpR(&p.Low, tm), R*cpR(&p.High, tm), "Cp jumps by %.4g J/(mol K) at %g K (low %.4g, high %.4g)", d, tm, R*cpR(&p.Low, tm), R*cpR(&p.High, tm))
		}
		if d := R * (hR(&p.High, tm) - hR(&p.Low, tm)); math.Abs(d) > tol.H {
			add(KindDiscontinuity, "tmid", "h-jump", tm, R*hR(&p.Low, tm), R*hR(&p.High, tm), "H jumps by %.4g kJ/mol at %g K (low %.6g, high %.6g kJ/mol)", d/1000, tm, R*hR(&p.Low, tm)/1000, R*hR(&p.High, tm)/1000)
		}
		if d := R * (sR(&p.High, tm) - sR(&p.Low, tm)); math.Abs(d) > tol.S {
			add(KindDiscontinuity, "tmid", "s-jump", tm, R*sR(&p.Low, tm), R*sR(&p.High, tm), "S jumps by %.4g J/(mol K) at %g K (low %.6g, high %.6g)", d, tm, R*sR(&p.Low, tm), R*sR(&p.High, tm))
		}
	}
	peak := math.Inf(-1)
	blocks := []struct {
		part   string
		a      *[7]float64
		ok     bool
		lo, hi float64
	}{{"low", &p.Low, lowOK, p.TLow, p.TMid}, {"high", &p.High, highOK, p.TMid, p.THigh}}
	for _, bl := range blocks {
		if !bl.ok {
			peak = math.Inf(-1)
			continue
		}
		var minCp, minT, maxCp, maxT = math.Inf(1), 0.0, math.Inf(-1), 0.0
		fallReported := false
		for j := range checkPoints {
			t := bl.lo + (bl.hi-bl.lo)*float64(j)/float64(checkPoints-1)
			c := R * cpR(bl.a, t)
			if c < minCp {
				minCp, minT = c, t
			}
			if c > maxCp {
				maxCp, maxT = c, t
			}
			if !fallReported && c < peak-tol.CpFall {
				add(KindNonphysical, bl.part, "cp-falls", t, c, peak, "Cp falls with temperature: %.4g J/(mol K) at %.0f K, below %.4g J/(mol K) reached earlier", c, t, peak)
				fallReported = true
			}
			peak = math.Max(peak, c)
		}
		if minCp <= 0 {
			add(KindNonphysical, bl.part, "cp-nonpositive", minT, minCp, 0, "Cp is not positive: %.4g J/(mol K) at %.0f K", minCp, minT)
		}
		if cpMax > 0 && maxCp > cpMax+tol.Cp {
			add(KindNonphysical, bl.part, "cp-ceiling", maxT, maxCp, cpMax, "Cp = %.4g J/(mol K) at %.0f K exceeds the ceiling %.4g J/(mol K) (classical limit with electronic and anharmonic allowance)", maxCp, maxT, cpMax)
		}
	}
	return out
}

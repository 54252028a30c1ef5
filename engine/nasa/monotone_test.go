package nasa

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// scanFall returns the largest fall of p's Cp below its running maximum on a
// 1 K scan of [TLow, THigh] (J/(mol K)) and where it ends.
func scanFall(p NASA7) (fall, at float64) {
	peak := math.Inf(-1)
	for T := p.TLow; T <= p.THigh; T++ {
		c := p.Cp(T)
		if peak-c > fall {
			fall, at = peak-c, T
		}
		peak = math.Max(peak, c)
	}
	return fall, at
}

// TestFitFlatTopNotRefused fits the group-additivity heat capacities of an
// ordinary ether-alcohol, 3-(methoxy)-3-(hydroxymethyl)pentane,
// CCC(CC)(CO)OC (kiln's own estimate, testdata/tester3/fitfail.kiln): 25
// atoms, whose Cp flattens near 3300 K on the way to its classical limit.
// With monotonicity imposed only at grid points the fitted slope dipped
// below zero between two of them and the fit was refused for a fall of
// 9e-6 J/(mol K); the Bernstein constraints of polyIneq make Cp
// non-decreasing everywhere. The 1 K scan must find no fall beyond rounding
// (1e-9 J/(mol K), some 1e3 times the measured 1e-12).
func TestFitFlatTopNotRefused(t *testing.T) {
	cp := []float64{194.93256, 245.43344, 287.73368, 323.13032, 380.45112, 421.62168, 482.206}
	for rotors := 0; rotors <= 8; rotors++ {
		cp0, cpInf := ClassicalLimits(25, false, rotors)
		p, rep, err := Fit(-479151.68, 491.663927583, benson, cp, cp0, cpInf, FitOptions{})
		require.NoError(t, err, "%d rotors", rotors)
		fall, at := scanFall(p)
		assert.Less(t, fall, 1e-9, "%d rotors: Cp falls by %g J/(mol K) at %g K", rotors, fall, at)
		assert.Less(t, rep.MaxCpRelResidual, 0.01, "%d rotors", rotors)
	}
}

// einsteinCp is the ideal-gas heat capacity (J/(mol K)) of a non-linear
// molecule whose vibrations are harmonic oscillators of characteristic
// temperatures theta (K): 4 R for translation and rotation plus
// R x² eˣ/(eˣ − 1)², x = θ/T, per mode (the Einstein function; common
// practice).
func einsteinCp(theta []float64, T float64) float64 {
	c := 4 * R
	for _, th := range theta {
		x := th / T
		ex := math.Exp(-x)
		c += R * x * x * ex / ((1 - ex) * (1 - ex))
	}
	return c
}

// TestFitMonotoneEverywhere fits 400 random harmonic-oscillator molecules
// of 5–40 atoms (vibrational temperatures drawn from 150–4500 K, the span
// of torsions to C–H stretches) at the group-additivity temperatures, with
// the default range and two others, and scans each fit every 1 K: every
// fit must succeed and no fitted Cp may fall by more than rounding (1e-9
// J/(mol K)). Before the Bernstein constraints some 1–2 % of such fits were
// refused or fell by about 1e-5 J/(mol K) between grid points.
func TestFitMonotoneEverywhere(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 12))
	opts := []FitOptions{{}, {TMid: 1200, THigh: 3000}, {TMid: 1500, THigh: 6000}}
	worst := 0.0
	for trial := range 400 {
		nAtoms := 5 + rng.IntN(36)
		theta := make([]float64, 3*nAtoms-6)
		for i := range theta {
			theta[i] = 150 * math.Pow(30, rng.Float64())
		}
		cp := make([]float64, len(benson))
		for i, T := range benson {
			cp[i] = einsteinCp(theta, T)
		}
		cp0, cpInf := ClassicalLimits(nAtoms, false, 0)
		opt := opts[trial%len(opts)]
		p, _, err := Fit(-100e3, 300+10*float64(nAtoms), benson, cp, cp0, cpInf, opt)
		require.NoError(t, err, "trial %d (%d atoms, %+v)", trial, nAtoms, opt)
		fall, at := scanFall(p)
		worst = math.Max(worst, fall)
		assert.Less(t, fall, 1e-9, "trial %d: Cp falls by %g J/(mol K) at %g K", trial, fall, at)
	}
	t.Logf("largest fall on a 1 K scan: %.3g J/(mol K)", worst)
}

// TestDenseMonotoneRefusesRealFall builds a polynomial whose high block
// turns down by a real amount (0.5 J/(mol K) from its maximum at 3000 K to
// 5000 K) and checks that denseMonotone refuses it with the numbers of the
// fall, and that a fall of 1e-4 J/(mol K), far below any thermochemical
// significance but far above the fit's precision, is refused too.
func TestDenseMonotoneRefusesRealFall(t *testing.T) {
	for _, drop := range []float64{0.5, 1e-4} {
		// Low block: Cp/R = 5 + 0.002 T (slope 0.002/K at 1000 K). High
		// block: Cp/R = c + b (T − 1000) − k (T − 1000)², rising to its
		// maximum at 3000 K and falling by drop/R at 5000 K.
		k := drop / R / (2000 * 2000)
		b := 2 * k * 2000
		p := NASA7{TLow: 300, TMid: 1000, THigh: 5000}
		p.Low[0], p.Low[1] = 5, 0.002
		c := 5 + 0.002*1000
		// Expand c + b u − k u², u = T − 1000.
		p.High[0] = c - b*1000 - k*1e6
		p.High[1] = b + 2*k*1000
		p.High[2] = -k
		err := denseMonotone(p)
		var se *ShapeError
		require.True(t, errors.As(err, &se), "drop %g: got %v", drop, err)
		assert.Equal(t, ShapeFalls, se.Test)
		assert.InDelta(t, 5000, se.T, 1e-6)
		assert.InDelta(t, 3000, se.OtherT, 1e-3)
		assert.InEpsilon(t, drop, se.Other-se.Cp, 1e-6)
	}
}

// TestFitAboveLimitIsShapeError: an input Cp at or above the classical
// limit Cp∞ (here 3 atoms, Cp∞ = 7 R) is refused with a ShapeError that
// carries the point and the limit.
func TestFitAboveLimitIsShapeError(t *testing.T) {
	cp0, cpInf := ClassicalLimits(3, false, 0)
	cp := []float64{35, 38, 41, 44, 50, 55, cpInf + 1}
	_, _, err := Fit(0, 200, benson, cp, cp0, cpInf, FitOptions{})
	var se *ShapeError
	require.True(t, errors.As(err, &se), "got %v", err)
	assert.Equal(t, ShapeAboveLimit, se.Test)
	assert.Equal(t, 1500.0, se.T)
	assert.Equal(t, cpInf+1, se.Cp)
	assert.Equal(t, cpInf, se.Other)
}

// TestFitLowTMid: a TMID at or below 500 K leaves only the 300 and 400 K
// group values in the low block, which has three coefficients of its own;
// the fit used to fail there ("too few independent data"), refusing every
// species for `--tmid 450`. The block is now filled from the Wilhoit curve:
// every TMID from 310 to 700 K and a narrow high range must fit, follow the
// input within 3 %, and stay monotone. (With a low TMID one quartic spans
// TMID–5000 K, where Cp turns from steep to flat; it follows the group
// values to 1–2.3 %, as it did for the TMIDs of 510–700 K that fitted
// before, against 0.45 % at the default 1000 K.)
func TestFitLowTMid(t *testing.T) {
	cp := []float64{194.93256, 245.43344, 287.73368, 323.13032, 380.45112, 421.62168, 482.206}
	cp0, cpInf := ClassicalLimits(25, false, 4)
	opts := []FitOptions{{TMid: 1400, THigh: 1450}}
	for tm := 310.0; tm <= 700; tm += 15 {
		opts = append(opts, FitOptions{TMid: tm, THigh: 5000})
	}
	for _, opt := range opts {
		p, rep, err := Fit(-479151.68, 491.663927583, benson, cp, cp0, cpInf, opt)
		require.NoError(t, err, "%+v", opt)
		assert.Less(t, rep.MaxCpRelResidual, 0.03, "%+v", opt)
		fall, at := scanFall(p)
		assert.Less(t, fall, 1e-9, "%+v: Cp falls by %g J/(mol K) at %g K", opt, fall, at)
	}
}

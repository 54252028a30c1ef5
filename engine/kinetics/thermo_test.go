package kinetics

import (
	"testing"

	"github.com/stretchr/testify/assert"
)

// fixed298 is a species whose H and S are only known at 298.15 K; tests
// evaluate it there only.
type fixed298 struct{ h, s float64 }

func (f fixed298) H(float64) float64 { return f.h }
func (f fixed298) S(float64) float64 { return f.s }

// NIST-JANAF Thermochemical Tables (Chase 1998), ΔfH°298 (J/mol) and
// S°298 (J/(mol K)), from memory.
var (
	janafH  = fixed298{217999, 114.716}
	janafO  = fixed298{249173, 161.058}
	janafOH = fixed298{38987, 183.737}
	janafO2 = fixed298{0, 205.147}
	janafH2 = fixed298{0, 130.680}
)

func TestKcUnitConversion(t *testing.T) {
	// At 1000 K, P°/RT = 1e5/(8.314462618·1000) mol/m3 = 12.027236 mol/m3
	// = 1.2027236e-5 mol/cm3.
	// Tolerance 1e-6 relative: hand values carry 7 digits.
	const kp = 3.0
	// Δn = 0: Kc = Kp, dimensionless.
	assert.Equal(t, kp, Kc(kp, 0, 1000))
	// Δn = +1: Kc = 3 · 1.2027236e-5 = 3.6081708e-5 mol/cm3.
	assert.InEpsilon(t, 3.6081708e-5, Kc(kp, 1, 1000), 1e-6)
	// Δn = −1: Kc = 3 / 1.2027236e-5 = 3 · 83144.626 = 249433.88 cm3/mol.
	assert.InEpsilon(t, 249433.88, Kc(kp, -1, 1000), 1e-6)
	// Fractional Δn = −0.5: Kc = 3 / sqrt(1.2027236e-5) = 3 / 3.4680305e-3 = 865.04.
	assert.InEpsilon(t, 865.04, Kc(kp, -0.5, 1000), 1e-5)
}

func TestDeltaAndReverseOfHPlusO2(t *testing.T) {
	// H + O2 → OH + O at 298.15 K with JANAF values:
	//   ΔH = 38987 + 249173 − 217999 − 0 = 70161 J/mol
	//   ΔS = 183.737 + 161.058 − 114.716 − 205.147 = 24.932 J/(mol K)
	//   ΔG = 70161 − 298.15·24.932 = 62727.52 J/mol
	//   ΔG/RT = 62727.52/(8.314462618·298.15) = 25.30400;  Kp = e^−25.304 = 1.02474e-11
	//   Δn = 0 so Kc = Kp.
	// Forward k = 3.5e16 T^-0.7 exp(−8590/T) (the expression used in the
	// collision tests): 298.15^-0.7 = 0.0184865, exp(−28.81100) = 3.08018e-13,
	//   kf = 3.5e16 · 0.0184865 · 3.08018e-13 = 199.299 cm3/mol/s
	//   kr = 199.299 / 1.02474e-11 = 1.94487e13 cm3/mol/s.
	// That matches the well-known room-temperature O + OH → O2 + H rate of
	// about 3.3e-11 cm3/molecule/s = 2.0e13 cm3/mol/s (from memory).
	T := 298.15
	r := Side{{1, janafH}, {1, janafO2}}
	p := Side{{1, janafOH}, {1, janafO}}
	dH, dS, dG := Delta(r, p, T)
	assert.InDelta(t, 70161, dH, 1e-6, "sum of table values, exact to rounding")
	assert.InDelta(t, 24.932, dS, 1e-9)
	assert.InDelta(t, 62727.52, dG, 0.01)
	assert.Equal(t, 0.0, DeltaN(r, p))
	kc := Kc(Kp(dG, T), DeltaN(r, p), T)
	assert.InEpsilon(t, 1.02474e-11, kc, 1e-5)
	kf := Arrhenius{A: 3.5e16, N: -0.7, Ea: 8590 * R}.Rate(T)
	assert.InEpsilon(t, 199.299, kf, 1e-5)
	kr := ReverseRate(kf, kc)
	assert.InEpsilon(t, 1.94487e13, kr, 1e-4)
	// Independent check against the measured reverse rate, within 30 %
	// (uncertainty of the forward fit far below its range, and of memory).
	assert.InEpsilon(t, 2.0e13, kr, 0.3)
}

func TestRecombinationKcDeltaNMinusOne(t *testing.T) {
	// 2 H → H2 at 298.15 K (JANAF):
	//   ΔH = 0 − 2·217999 = −435998 J/mol;  ΔS = 130.680 − 2·114.716 = −98.752 J/(mol K)
	//   ΔG = −435998 + 298.15·98.752 = −406555.09 J/mol
	//   −ΔG/RT = 406555.09/2478.9320 = 164.00248;  Kp = e^164.00248 = 1.68024e71
	//   Δn = −1: P°/RT = 1e5/2478.9320 = 40.33955 mol/m3 = 4.033955e-5 mol/cm3
	//   Kc = 1.68024e71 / 4.033955e-5 = 4.16524e75 cm3/mol
	T := 298.15
	r := Side{{2, janafH}}
	p := Side{{1, janafH2}}
	_, _, dG := Delta(r, p, T)
	assert.InDelta(t, -406555.09, dG, 0.01)
	dn := DeltaN(r, p)
	assert.Equal(t, -1.0, dn)
	// 1e-4: e^x amplifies the 1e-8 relative rounding in x by x ≈ 164.
	kc := Kc(Kp(dG, T), dn, T)
	assert.InEpsilon(t, 4.16524e75, kc, 1e-4)
	// Detailed balance both ways: the reverse of the reverse is the forward.
	kf := 1e15
	assert.InEpsilon(t, kf, ReverseRate(ReverseRate(kf, kc), 1/kc), 1e-12)
}

// Package nasa evaluates, fits and checks NASA 7-coefficient polynomials, the
// two-temperature-range form in which simulators read ideal-gas thermochemistry
// (McBride, Gordon & Reno, NASA TM-4513, 1993).
//
// With T in kelvin and R the molar gas constant, each range holds a1…a7 with
//
//	Cp/R   = a1 + a2 T + a3 T² + a4 T³ + a5 T⁴
//	H/(RT) = a1 + a2 T/2 + a3 T²/3 + a4 T³/4 + a5 T⁴/5 + a6/T
//	S/R    = a1 ln T + a2 T + a3 T²/2 + a4 T³/3 + a5 T⁴/4 + a7
//
// H is on the scale where H(298.15 K) = ΔHf°298 and S is the standard entropy
// at 1 bar. The package also holds the Wilhoit (1975) heat-capacity form used
// to extrapolate estimated Cp(T) to high temperature, and the classical limits
// Cp(0) and Cp(∞) that bound it. It does no I/O.
package nasa

import "math"

// R is the molar gas constant in J/(mol K) (CODATA 2018, exact in the 2019 SI).
const R = 8.314462618

// Tref is the reference temperature of standard formation data, 298.15 K.
const Tref = 298.15

// NASA7 is a two-range NASA 7-coefficient polynomial. Low holds a1…a7 for
// TLow ≤ T < TMid and High for TMid ≤ T ≤ THigh (temperatures in K).
type NASA7 struct {
	TLow, TMid, THigh float64
	Low, High         [7]float64
}

// block returns the coefficient set used at T: Low for T < TMid and High for
// T ≥ TMid. At exactly TMid the High block is used; for a polynomial that is
// continuous at TMid (see Check) the two blocks agree there anyway.
func (p NASA7) block(T float64) *[7]float64 {
	if T < p.TMid {
		return &p.Low
	}
	return &p.High
}

// Cp returns the heat capacity in J/(mol K):
// Cp = R (a1 + a2 T + a3 T² + a4 T³ + a5 T⁴), T in K.
// The Low block is used for T < TMid, the High block for T ≥ TMid (so at
// exactly TMid the High block). Outside [TLow, THigh] the nearest block is
// extrapolated; use InRange to know whether T is inside the fitted range.
func (p NASA7) Cp(T float64) float64 { return R * cpR(p.block(T), T) }

// H returns the standard enthalpy in J/mol on the scale H(298.15) = ΔHf°298:
// H = R (a1 T + a2 T²/2 + a3 T³/3 + a4 T⁴/4 + a5 T⁵/5 + a6), T in K (T > 0).
// Block choice as for Cp.
func (p NASA7) H(T float64) float64 { return R * hR(p.block(T), T) }

// S returns the standard entropy at 1 bar in J/(mol K):
// S = R (a1 ln T + a2 T + a3 T²/2 + a4 T³/3 + a5 T⁴/4 + a7), T in K (T > 0).
// Block choice as for Cp.
func (p NASA7) S(T float64) float64 { return R * sR(p.block(T), T) }

// G returns the standard Gibbs energy G = H − T S in J/mol at 1 bar, T in K.
func (p NASA7) G(T float64) float64 { return p.H(T) - T*p.S(T) }

// InRange reports whether TLow ≤ T ≤ THigh (K).
func (p NASA7) InRange(T float64) bool { return T >= p.TLow && T <= p.THigh }

// cpR is Cp/R of one block at T (K).
func cpR(a *[7]float64, T float64) float64 {
	return a[0] + T*(a[1]+T*(a[2]+T*(a[3]+T*a[4])))
}

// dcpR is d(Cp/R)/dT of one block at T, in 1/K.
func dcpR(a *[7]float64, T float64) float64 {
	return a[1] + T*(2*a[2]+T*(3*a[3]+T*4*a[4]))
}

// hR is H/R of one block at T, in K.
func hR(a *[7]float64, T float64) float64 {
	return hIntR(a, T) + a[5]
}

// hIntR is ∫Cp/R dT of one block without the constant a6, in K.
func hIntR(a *[7]float64, T float64) float64 {
	return T * (a[0] + T*(a[1]/2+T*(a[2]/3+T*(a[3]/4+T*a[4]/5))))
}

// sR is S/R of one block at T (dimensionless).
func sR(a *[7]float64, T float64) float64 {
	return sIntR(a, T) + a[6]
}

// sIntR is ∫Cp/(RT) dT of one block without the constant a7.
func sIntR(a *[7]float64, T float64) float64 {
	return a[0]*math.Log(T) + T*(a[1]+T*(a[2]/2+T*(a[3]/3+T*a[4]/4)))
}

// finite reports whether every coefficient of a block is a finite number.
func finite(a *[7]float64) bool {
	for _, v := range a {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

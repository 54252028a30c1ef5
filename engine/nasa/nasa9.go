package nasa

import "math"

// The nine-coefficient form of McBride, Zehe & Gordon, NASA/TP-2002-211556:
// one temperature range holds a1…a7, b1, b2 with
//
//	Cp/R   = a1 T⁻² + a2 T⁻¹ + a3 + a4 T + a5 T² + a6 T³ + a7 T⁴
//	H/(RT) = −a1 T⁻² + a2 ln(T)/T + a3 + a4 T/2 + a5 T²/3 + a6 T³/4 + a7 T⁴/5 + b1/T
//	S/R    = −a1 T⁻²/2 − a2 T⁻¹ + a3 ln T + a4 T + a5 T²/2 + a6 T³/3 + a7 T⁴/4 + b2
//
// kiln reads such blocks only to refit or check them (the reference library
// and tests that re-evaluate a published record).

// Cp9 is the heat capacity in J/(mol K) of one NASA-9 block at T.
func Cp9(a *[9]float64, T float64) float64 {
	return R * (a[0]/(T*T) + a[1]/T + a[2] + T*(a[3]+T*(a[4]+T*(a[5]+T*a[6]))))
}

// H9 is the enthalpy in J/mol of one NASA-9 block at T (ΔHf°298 at 298.15 K).
func H9(a *[9]float64, T float64) float64 {
	hrt := -a[0]/(T*T) + a[1]*math.Log(T)/T + a[2] + T*(a[3]/2+T*(a[4]/3+T*(a[5]/4+T*a[6]/5))) + a[7]/T
	return R * T * hrt
}

// S9 is the standard entropy in J/(mol K) of one NASA-9 block at T and 1 bar.
func S9(a *[9]float64, T float64) float64 {
	sr := -a[0]/(2*T*T) - a[1]/T + a[2]*math.Log(T) + T*(a[3]+T*(a[4]/2+T*(a[5]/3+T*a[6]/4))) + a[8]
	return R * sr
}

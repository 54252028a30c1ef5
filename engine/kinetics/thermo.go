package kinetics

import "math"

// Thermo is a species' thermochemistry as the reaction checks need it:
// standard enthalpy H(T) in J/mol (on the formation scale, so that
// reaction sums give ΔrH) and standard entropy S(T) in J/(mol K) at 1 bar.
type Thermo interface {
	H(T float64) float64 // J/mol
	S(T float64) float64 // J/(mol K), 1 bar
}

// Term is one species of a reaction side with its stoichiometric
// coefficient (positive; fractional allowed).
type Term struct {
	Coeff  float64
	Thermo Thermo
}

// Side is one side of a reaction. Third bodies are not listed.
type Side []Term

// Delta returns the standard reaction enthalpy, entropy and Gibbs energy at
// T (K):
//
//	ΔH = Σν_p H_p(T) − Σν_r H_r(T)         J/mol
//	ΔS = Σν_p S_p(T) − Σν_r S_r(T)         J/(mol K)
//	ΔG = ΔH − T ΔS                         J/mol
func Delta(reactants, products Side, T float64) (dH, dS, dG float64) {
	for _, t := range products {
		dH += t.Coeff * t.Thermo.H(T)
		dS += t.Coeff * t.Thermo.S(T)
	}
	for _, t := range reactants {
		dH -= t.Coeff * t.Thermo.H(T)
		dS -= t.Coeff * t.Thermo.S(T)
	}
	return dH, dS, dH - T*dS
}

// DeltaN returns the change in gas moles Δn = Σν_products − Σν_reactants.
// The caller leaves third bodies out of both sides.
func DeltaN(reactants, products Side) float64 {
	var dn float64
	for _, t := range products {
		dn += t.Coeff
	}
	for _, t := range reactants {
		dn -= t.Coeff
	}
	return dn
}

// Kp returns the dimensionless equilibrium constant for the 1 bar standard
// state, Kp = exp(−ΔG°/(R T)), with ΔG° in J/mol and T in K. It overflows to
// +Inf for ΔG° below about −709 R T.
func Kp(dG, T float64) float64 {
	return math.Exp(-dG / (R * T))
}

// Kc converts Kp to the concentration equilibrium constant in (mol/cm3)^Δn:
//
//	Kc = Kp · (P°/(R T))^Δn,  P°/(R T) in mol/cm3 = 1e5/(R T)/1e6
//
// so at 1000 K, P°/(R T) = 1.2027e-5 mol/cm3. dn is Δn from DeltaN.
func Kc(kp, dn, T float64) float64 {
	if dn == 0 {
		return kp
	}
	return kp * math.Pow(Concentration(T, PStd), dn)
}

// ReverseRate returns the reverse rate constant by detailed balance,
// k_r = k_f / Kc, with Kc in (mol/cm3)^Δn so that k_r comes out in the
// mechanism units of the reverse direction.
func ReverseRate(kf, kc float64) float64 {
	return kf / kc
}

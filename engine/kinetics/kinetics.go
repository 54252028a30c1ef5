// Package kinetics is the reaction arithmetic behind kiln's reaction checks:
// modified Arrhenius, falloff (Lindemann and Troe) and pressure-table rate
// expressions, reaction thermochemistry (ΔH, ΔS, ΔG, Kp, Kc) and reverse
// rates, element and charge balance, and a collision-limit sanity check.
//
// It works on plain Go values only: it reads no files and knows nothing of
// the mechanism text format. Units throughout are SI for energy (J/mol),
// entropy (J/(mol K)), temperature (K) and pressure (Pa), and the mechanism
// convention cm3, mol, s for rate constants and concentrations.
package kinetics

// Physical constants. Kb, NA and H are exact in the 2019 SI (CODATA 2018);
// R = NA·Kb and Rcal = R/4.184 (thermochemical calorie) follow from them.
const (
	R    = 8.314462618    // molar gas constant, J/(mol K)
	Rcal = 1.987204259    // molar gas constant, cal/(mol K)
	Kb   = 1.380649e-23   // Boltzmann constant, J/K (exact)
	NA   = 6.02214076e23  // Avogadro constant, 1/mol (exact)
	H    = 6.62607015e-34 // Planck constant, J s (exact)
	PStd = 1e5            // standard-state pressure, Pa (1 bar)

	// Amu is the atomic mass constant in kg (CODATA 2018,
	// 1.66053906660(50)e-27 kg; not exact in the 2019 SI).
	Amu = 1.66053906660e-27
)

// Concentration returns the total concentration of an ideal gas at
// temperature T (K) and pressure P (Pa) in mol/cm3:
//
//	c = P/(R T) [mol/m3] × 1e-6 [m3/cm3]
//
// e.g. 1 bar and 1000 K give 12.027 mol/m3 = 1.2027e-5 mol/cm3. T must be
// positive.
func Concentration(T, P float64) float64 {
	return P / (R * T) / 1e6
}

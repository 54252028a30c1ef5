package nasa

import "math"

// c2 is the second radiation constant hc/k in cm K (CODATA 2018).
const c2 = 1.438776877

// rrhoSpecies is a test molecule whose Cp(T) is computed from rigid-rotor /
// harmonic-oscillator statistical mechanics: translation + rotation + R, one
// Einstein function per vibration and R/2 per internal rotor treated as free.
// This gives physically shaped Cp(T) inputs without transcribing tables.
type rrhoSpecies struct {
	name    string
	nAtoms  int
	linear  bool
	rotors  int
	freqs   []float64 // harmonic fundamentals, cm⁻¹ (torsions replaced by the free rotors)
	hf, s   float64   // ΔHf°298 (J/mol), S°298 (J/(mol K)): inputs the fit must reproduce
	source  string
	comment string
}

// points returns m's heat capacities (J/(mol K)) at the benson
// temperatures and its classical limits, the inputs of a fit.
func (m rrhoSpecies) points() (cps []float64, cp0, cpInf float64) {
	cps = make([]float64, len(benson))
	for i, T := range benson {
		cps[i] = m.cp(T)
	}
	cp0, cpInf = ClassicalLimits(m.nAtoms, m.linear, m.rotors)
	return cps, cp0, cpInf
}

// cp returns the RRHO heat capacity in J/(mol K) at T (K).
func (m rrhoSpecies) cp(T float64) float64 {
	c := 4.0
	if m.linear {
		c = 3.5
	}
	c += 0.5 * float64(m.rotors)
	for _, nu := range m.freqs {
		x := c2 * nu / T
		ex := math.Exp(-x)
		c += x * x * ex / ((1 - ex) * (1 - ex))
	}
	return R * c
}

// benson are the temperatures of a group-additivity Cp table (K).
var benson = []float64{300, 400, 500, 600, 800, 1000, 1500}

// tenSpecies are the molecules of the fit tests. Frequencies: Shimanouchi,
// Tables of Molecular Vibrational Frequencies, NSRDS-NBS 39 (1972), from
// memory. ΔHf°298 and S°298: NIST-JANAF (Chase 1998) where the species is
// tabulated, else TRC tables, from memory; the fit only has to reproduce them,
// so their accuracy does not matter to the tests.
var tenSpecies = []rrhoSpecies{
	{name: "H2O", nAtoms: 3, freqs: []float64{3657, 1595, 3756}, hf: -241826, s: 188.834},
	{name: "CO2", nAtoms: 3, linear: true, freqs: []float64{1333, 667, 667, 2349}, hf: -393522, s: 213.795},
	{name: "CH4", nAtoms: 5, freqs: []float64{2917, 1534, 1534, 3019, 3019, 3019, 1306, 1306, 1306}, hf: -74873, s: 186.251},
	{name: "NH3", nAtoms: 4, freqs: []float64{3337, 950, 3444, 3444, 1627, 1627}, hf: -45898, s: 192.774},
	{name: "C2H2", nAtoms: 4, linear: true, freqs: []float64{3374, 1974, 3289, 612, 612, 730, 730}, hf: 226731, s: 200.958},
	{name: "C2H4", nAtoms: 6, freqs: []float64{3026, 1623, 1342, 1023, 3103, 1236, 949, 943, 3106, 826, 2989, 1444}, hf: 52467, s: 219.330},
	{name: "CH2O", nAtoms: 4, freqs: []float64{2782, 1746, 1500, 1167, 2843, 1249}, hf: -115897, s: 218.950},
	{name: "HCN", nAtoms: 3, linear: true, freqs: []float64{3311, 2097, 712, 712}, hf: 135143, s: 201.828},
	{name: "C2H6", nAtoms: 8, rotors: 1, freqs: []float64{2954, 1388, 995, 2896, 1379, 2969, 2969, 1468, 1468, 1190, 1190, 2985, 2985, 1469, 1469, 822, 822}, hf: -83800, s: 229.1},
	{name: "CH3OH", nAtoms: 6, rotors: 1, freqs: []float64{3681, 2999, 2844, 1477, 1455, 1345, 1060, 1033, 2960, 1477, 1165}, hf: -201000, s: 239.9},
}

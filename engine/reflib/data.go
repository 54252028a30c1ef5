package reflib

// entry is one library species as entered. Exactly one of coefficient blocks
// (lo/hi), monatomic, n9 or freqs is used to build the polynomial:
//
//   - lo, hi: NASA-7 coefficient blocks (a1…a7, low and high range) taken as
//     published; a6 and a7 are then recomputed from hf298 and s298 (low block)
//     and from continuity of H and S at tMid (high block), which moves the
//     curves by at most the small difference between the stored formation
//     data and those the coefficients were made with.
//   - monatomic: Cp = 5/2 R exactly over the range (an atom without electronic
//     states low enough to matter below 6000 K).
//   - n9: NASA-9 coefficient blocks (see nasa9), refitted to NASA-7.
//   - freqs: Cp from rigid-rotor / harmonic-oscillator statistical mechanics
//     with these fundamentals (cm⁻¹), tabulated every 50 K and fitted with
//     nasa.FitPoly when the library is built.
type entry struct {
	name      string
	smiles    string
	aliases   []string // other spellings of the same structure and state
	mult      int
	hf298     float64 // J/mol
	s298      float64 // J/(mol K)
	tLow      float64 // K
	tMid      float64
	tHigh     float64
	lo, hi    [7]float64
	monatomic bool
	freqs     []float64
	linear    bool
	// implied: hf298 and s298 are those the lo block implies at 298.15 K
	// (for coefficient sets published without separate formation data).
	implied bool
	// sImplied: S°298 is the one the lo block implies at 298.15 K while
	// hf298 is given (a coefficient set whose compilation selects another
	// ΔHf°298 than its coefficients carry).
	sImplied bool
	// n9: NASA-9 blocks; Cp is tabulated from them every 50 K and fitted
	// with nasa.FitPoly, and s298 is theirs at 298.15 K (see data_nsx.go).
	n9 *nasa9
	// hfUnc is the uncertainty of ΔHf°298 (J/mol) that the source gives —
	// the ± it states, or, where it quotes values further apart than their
	// stated uncertainties (NCN), their spread; the source string says
	// which — carried where it is 4 kJ/mol (about 1 kcal/mol) or more: a
	// weak tabulated value (an old estimate, a computed value, a poorly
	// determined molecule). Smaller stated uncertainties lie below any
	// group-additivity class error, and such entries count as exact, as
	// do entries whose source states none.
	hfUnc  float64
	source string
}

// Sources, cited once here and referred to in each entry.
const (
	srcJANAF = "NIST-JANAF Thermochemical Tables, 4th ed. (Chase, J. Phys. Chem. Ref. Data Monograph 9, 1998), from memory"
	srcGRI   = "NASA-7 coefficients of the GRI-Mech 3.0 thermodynamic data set (Smith, Golden, Frenklach, Moriarty, Eiteneer, Goldenberg, Bowman, Hanson, Song, Gardiner, Lissianski, Qin, 1999), from memory; entered values checked by their continuity of Cp, H and S at 1000 K"
	srcGRIHS = "ΔHf°298 and S°298 as implied by those coefficients (GRI-Mech 3.0), from memory"
	srcMono  = "Cp = 5/2 R: translation only, the first excited electronic state lies above 10 eV (common practice; agrees with " + srcJANAF + ")"
	srcATcT  = "Active Thermochemical Tables (Ruscic et al.), from memory"
)

// entries is the reference library. Coefficient blocks: srcGRI. Formation
// data: srcJANAF unless the entry says otherwise.
var entries = []entry{
	{name: "H", smiles: "[H]", mult: 2, hf298: 217999, s298: 114.717, tLow: 200, tMid: 1000, tHigh: 6000, monatomic: true,
		source: srcMono + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "H2", smiles: "[H][H]", mult: 1, hf298: 0, s298: 130.680, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{3.33727920e+00, -4.94024731e-05, 4.99456778e-07, -1.79566394e-10, 2.00255376e-14, -9.50158922e+02, -3.20502331e+00},
		lo:     [7]float64{2.34433112e+00, 7.98052075e-03, -1.94781510e-05, 2.01572094e-08, -7.37611761e-12, -9.17935173e+02, 6.83010238e-01},
		source: "Cp(T): " + srcGRI + "; S°298: " + srcJANAF},
	{name: "O", smiles: "[O]", mult: 3, hf298: 249173, s298: 161.059, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.56942078e+00, -8.59741137e-05, 4.19484589e-08, -1.00177799e-11, 1.22833691e-15, 2.92175791e+04, 4.78433864e+00},
		lo:     [7]float64{3.16826710e+00, -3.27931884e-03, 6.64306396e-06, -6.12806624e-09, 2.11265971e-12, 2.91222592e+04, 2.05193346e+00},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "O2", smiles: "[O][O]", aliases: []string{"O=O"}, mult: 3, hf298: 0, s298: 205.147, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{3.28253784e+00, 1.48308754e-03, -7.57966669e-07, 2.09470555e-10, -2.16717794e-14, -1.08845772e+03, 5.45323129e+00},
		lo:     [7]float64{3.78245636e+00, -2.99673416e-03, 9.84730201e-06, -9.68129509e-09, 3.24372837e-12, -1.06394356e+03, 3.65767573e+00},
		source: "Cp(T): " + srcGRI + "; S°298: " + srcJANAF},
	{name: "OH", smiles: "[OH]", mult: 2, hf298: 37490, s298: 183.739, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{3.09288767e+00, 5.48429716e-04, 1.26505228e-07, -8.79461556e-11, 1.17412376e-14, 3.85865700e+03, 4.47669610e+00},
		lo:     [7]float64{3.99201543e+00, -2.40131752e-03, 4.61793841e-06, -3.88113333e-09, 1.36411470e-12, 3.61508056e+03, -1.03925458e-01},
		source: "Cp(T): " + srcGRI + "; ΔHf°298: " + srcATcT + " (the JANAF value, 39.35 kJ/mol, is superseded); S°298: " + srcGRIHS},
	{name: "H2O", smiles: "O", mult: 1, hf298: -241826, s298: 188.834, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{3.03399249e+00, 2.17691804e-03, -1.64072518e-07, -9.70419870e-11, 1.68200992e-14, -3.00042971e+04, 4.96677010e+00},
		lo:     [7]float64{4.19864056e+00, -2.03643410e-03, 6.52040211e-06, -5.48797062e-09, 1.77197817e-12, -3.02937267e+04, -8.49032208e-01},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "HO2", smiles: "[O]O", mult: 2, hf298: 12552, s298: 229.104, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{4.01721090e+00, 2.23982013e-03, -6.33658150e-07, 1.14246370e-10, -1.07908535e-14, 1.11856713e+02, 3.78510215e+00},
		lo:     [7]float64{4.30179801e+00, -4.74912051e-03, 2.11582891e-05, -2.42763894e-08, 9.29225124e-12, 2.94808040e+02, 3.71666245e+00},
		source: "Cp(T): " + srcGRI + "; " + srcGRIHS},
	{name: "H2O2", smiles: "OO", mult: 1, hf298: -135879, s298: 234.526, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{4.16500285e+00, 4.90831694e-03, -1.90139225e-06, 3.71185986e-10, -2.87908305e-14, -1.78617877e+04, 2.91615662e+00},
		lo:     [7]float64{4.27611269e+00, -5.42822417e-04, 1.67335701e-05, -2.15770813e-08, 8.62454363e-12, -1.77025821e+04, 3.43505074e+00},
		source: "Cp(T): " + srcGRI + "; " + srcGRIHS},
	{name: "CO", smiles: "[C-]#[O+]", aliases: []string{"[C]=O"}, mult: 1, hf298: -110527, s298: 197.660, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.71518561e+00, 2.06252743e-03, -9.98825771e-07, 2.30053008e-10, -2.03647716e-14, -1.41518724e+04, 7.81868772e+00},
		lo:     [7]float64{3.57953347e+00, -6.10353680e-04, 1.01681433e-06, 9.07005884e-10, -9.04424499e-13, -1.43440860e+04, 3.50840928e+00},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "CO2", smiles: "O=C=O", mult: 1, hf298: -393522, s298: 213.795, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{3.85746029e+00, 4.41437026e-03, -2.21481404e-06, 5.23490188e-10, -4.72084164e-14, -4.87591660e+04, 2.27163806e+00},
		lo:     [7]float64{2.35677352e+00, 8.98459677e-03, -7.12356269e-06, 2.45919022e-09, -1.43699548e-13, -4.83719697e+04, 9.90105222e+00},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	// CH4: the GRI-Mech 3.0 coefficients (as remembered) give Cp 2.5 % above
	// NIST-JANAF at 1000 K and 10 % above at 3000 K, so Cp is computed from the
	// fundamentals instead; with these frequencies RRHO reproduces the JANAF
	// Cp column (300–3000 K) to better than 0.01 %.
	{name: "CH4", smiles: "C", mult: 1, hf298: -74873, s298: 186.251, tLow: 200, tMid: 1000, tHigh: 3500,
		freqs:  []float64{2917, 1534, 1534, 3019, 3019, 3019, 1306, 1306, 1306},
		source: "Cp(T): rigid rotor, harmonic oscillator with the fundamentals of Shimanouchi, Tables of Molecular Vibrational Frequencies, NSRDS-NBS 39 (1972), from memory, fitted to NASA-7 by kiln's polynomial fit; ΔHf°298, S°298: " + srcJANAF},
	{name: "CH3", smiles: "[CH3]", mult: 2, hf298: 146899, s298: 194.008, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.28571772e+00, 7.23990037e-03, -2.98714348e-06, 5.95684644e-10, -4.67154394e-14, 1.67755843e+04, 8.48007179e+00},
		lo:     [7]float64{3.67359040e+00, 2.01095175e-03, 5.73021856e-06, -6.87117425e-09, 2.54385734e-12, 1.64449988e+04, 1.60456433e+00},
		source: "Cp(T): " + srcGRI + "; " + srcGRIHS},
	{name: "CH2", smiles: "[CH2]", mult: 3, hf298: 392333, s298: 194.418, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.87410113e+00, 3.65639292e-03, -1.40894597e-06, 2.60179549e-10, -1.87727567e-14, 4.62636040e+04, 6.17119324e+00},
		lo:     [7]float64{3.76267867e+00, 9.68872143e-04, 2.79489841e-06, -3.85091153e-09, 1.68741719e-12, 4.60040401e+04, 1.56253185e+00},
		source: "Cp(T): " + srcGRI + " (triplet ³B1 ground state); " + srcGRIHS},
	{name: "CH2(S)", smiles: "[CH2]", mult: 1, hf298: 429890, s298: 189.220, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.29203842e+00, 4.65588637e-03, -2.01191947e-06, 4.17906000e-10, -3.39716365e-14, 5.09259997e+04, 8.62650169e+00},
		lo:     [7]float64{4.19860411e+00, -2.36661419e-03, 8.23296220e-06, -6.68815981e-09, 1.94314737e-12, 5.04968163e+04, -7.69118967e-01},
		source: "Cp(T): " + srcGRI + " (singlet ¹A1 state); " + srcGRIHS},
	{name: "CH", smiles: "[CH]", mult: 2, hf298: 597335, s298: 183.036, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.87846473e+00, 9.70913681e-04, 1.44445655e-07, -1.30687849e-10, 1.76079383e-14, 7.10124364e+04, 5.48497999e+00},
		lo:     [7]float64{3.48981665e+00, 3.23835541e-04, -1.68899065e-06, 3.16217327e-09, -1.40609067e-12, 7.07972934e+04, 2.08401108e+00},
		source: "Cp(T): " + srcGRI + "; " + srcGRIHS},
	{name: "C", smiles: "[C]", mult: 3, hf298: 716680, s298: 158.100, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.49266888e+00, 4.79889284e-05, -7.24335020e-08, 3.74291029e-11, -4.87277893e-15, 8.54512953e+04, 4.80150373e+00},
		lo:     [7]float64{2.55423955e+00, -3.21537724e-04, 7.33792245e-07, -7.32234889e-10, 2.66521446e-13, 8.54438832e+04, 4.53130848e+00},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "HCO", smiles: "[CH]=O", mult: 2, hf298: 42000, s298: 224.334, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{2.77217438e+00, 4.95695526e-03, -2.48445613e-06, 5.89161778e-10, -5.33508711e-14, 4.01191815e+03, 9.79834492e+00},
		lo:     [7]float64{4.22118584e+00, -3.24392532e-03, 1.37799446e-05, -1.33144093e-08, 4.33768865e-12, 3.83956496e+03, 3.39437243e+00},
		source: "Cp(T): " + srcGRI + "; " + srcGRIHS},
	{name: "CH2O", smiles: "C=O", mult: 1, hf298: -108579, s298: 218.763, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{1.76069008e+00, 9.20000082e-03, -4.42258813e-06, 1.00641212e-09, -8.83855640e-14, -1.39958323e+04, 1.36563230e+01},
		lo:     [7]float64{4.79372315e+00, -9.90833369e-03, 3.73220008e-05, -3.79285261e-08, 1.31772652e-11, -1.43089567e+04, 6.02812900e-01},
		source: "Cp(T): " + srcGRI + "; " + srcGRIHS},
	{name: "N2", smiles: "N#N", mult: 1, hf298: 0, s298: 191.609, tLow: 300, tMid: 1000, tHigh: 5000,
		hi:     [7]float64{2.92664000e+00, 1.48797680e-03, -5.68476000e-07, 1.00970380e-10, -6.75335100e-15, -9.22797700e+02, 5.98052800e+00},
		lo:     [7]float64{3.29867700e+00, 1.40824040e-03, -3.96322200e-06, 5.64151500e-09, -2.44485400e-12, -1.02089990e+03, 3.95037200e+00},
		source: "Cp(T): " + srcGRI + "; S°298: " + srcJANAF},
	{name: "Ar", smiles: "[Ar]", mult: 1, hf298: 0, s298: 154.846, tLow: 200, tMid: 1000, tHigh: 6000, monatomic: true,
		source: srcMono + "; S°298: " + srcJANAF},
	{name: "He", smiles: "[He]", mult: 1, hf298: 0, s298: 126.153, tLow: 200, tMid: 1000, tHigh: 6000, monatomic: true,
		source: srcMono + "; S°298: " + srcJANAF},
	{name: "NO", smiles: "[N]=O", mult: 2, hf298: 90291, s298: 210.758, tLow: 200, tMid: 1000, tHigh: 6000,
		hi:     [7]float64{3.26060560e+00, 1.19110430e-03, -4.29170480e-07, 6.94576690e-11, -4.03360990e-15, 9.92097460e+03, 6.36930270e+00},
		lo:     [7]float64{4.21847630e+00, -4.63897600e-03, 1.10410220e-05, -9.33613540e-09, 2.80357700e-12, 9.84462300e+03, 2.28084640e+00},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "NO2", smiles: "[O]N=O", aliases: []string{"[O-][N+]=O", "O=[N]=O"}, mult: 2, hf298: 33095, s298: 240.034, tLow: 200, tMid: 1000, tHigh: 6000,
		hi:     [7]float64{4.88475420e+00, 2.17239560e-03, -8.28069060e-07, 1.57475100e-10, -1.05108950e-14, 2.31649830e+03, -1.17416950e-01},
		lo:     [7]float64{3.94403120e+00, -1.58542900e-03, 1.66578120e-05, -2.04754260e-08, 7.83505640e-12, 2.89661790e+03, 6.31199170e+00},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "N2O", smiles: "[N-]=[N+]=O", aliases: []string{"N#[N+][O-]"}, mult: 1, hf298: 82048, s298: 219.957, tLow: 200, tMid: 1000, tHigh: 6000,
		hi:     [7]float64{4.82307290e+00, 2.62702510e-03, -9.58508740e-07, 1.60007120e-10, -9.77523030e-15, 8.07340480e+03, -2.20172070e+00},
		lo:     [7]float64{2.25715020e+00, 1.13047280e-02, -1.36713190e-05, 9.68198060e-09, -2.93071820e-12, 8.74177440e+03, 1.07579920e+01},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
	{name: "NH3", smiles: "N", mult: 1, hf298: -45898, s298: 192.774, tLow: 200, tMid: 1000, tHigh: 6000,
		hi:     [7]float64{2.63445210e+00, 5.66625600e-03, -1.72786760e-06, 2.38671610e-10, -1.25787860e-14, -6.54469580e+03, 6.56629280e+00},
		lo:     [7]float64{4.28602740e+00, -4.66052300e-03, 2.17185130e-05, -2.28088870e-08, 8.26380460e-12, -6.74172850e+03, -6.25372770e-01},
		source: "Cp(T): " + srcGRI + "; ΔHf°298, S°298: " + srcJANAF},
}

package reflib

// Small species of prompt-NO, nitroso/peroxynitrite and chlorine chemistry
// that kiln's group tables cannot estimate (the cumulated nitrogen Nk has no
// group; O–N=O peroxides, C–N=O, N–O• on an imine and the C(=O)Cl radical
// centre have no group values; ClClO has a two-bond chlorine): cyanonitrene
// NCN and the cyanamidyl radical HNCN, carbodiimide, nitrosomethane, the
// iminoxyl radical H2C=N–O•, peroxynitrous acid HOONO, the chlorocarbonyl
// radical ClCO and the Cl2O isomer ClClO.
//
// Each is entered coefficient by coefficient from the record copied verbatim
// into testdata/thermo/records/burcat_nox.md (with the read offset of each):
//
//   - n9: the NASA/TP-2002-211556 record (srcNASA9) where that compilation
//     has one (ClCO, Gurvich 1991);
//   - implied: the Goos–Burcat–Ruscic record (srcGBR) otherwise, with the
//     ΔHf°298 its coefficients carry;
//   - sImplied: NCN, whose coefficients carry the Active Thermochemical
//     Tables version C (2011) value 445.73 kJ/mol while the entry quotes the
//     version D (2012) value 457.8 ± 2.0 kJ/mol, which the library takes
//     (as for FO in data_inorg.go: the newest ATcT value the entry quotes),
//     with the 12.1 kJ/mol between the two versions as its uncertainty.
//
// HNCN, carbodiimide, nitrosomethane, H2C=N–O• and ClClO rest on the
// database's own G3B3 calculations (± 2 kcal/mol as it states; computed,
// said in each source). For every GBR record read (ClCO's too) H298 from the
// low block agrees with the header to 0.01 kJ/mol (NCN's to 0.033), the blocks meet at
// 1000 K, and S°298 and Cp°298 from the header's molecular data (rigid rotor,
// harmonic oscillator) agree with the coefficients within 0.01 J/(mol K)
// (nitrosomethane: its CH3 torsion is a hindered rotor, not recomputed). The
// NASA ClCO record's S°298 is 265.19 J/(mol K), the GBR one's 265.91.
//
// Not entered (see burcat_nox.md): cyanamide H2N–C≡N, whose record takes
// σ = 2 for a non-planar (Cs) molecule (its moments have IC < IA + IB), so
// S°298 is R ln 2 (5.8 J/(mol K)) low; formaldoxime CH2=N–OH, which counts
// the OH torsion twice (12 fundamentals and a rotor for a six-atom molecule),
// takes σ = 2 for a planar Cs molecule and labels its kcal value kJ; the
// fulminate radical CNO, a linear ²Π radical that the record gives an
// electronic weight of 2 with its bend split into two modes (409 and 308
// cm⁻¹), counting half the states of the ²Π bending manifold (S°298 about
// R ln 2 low; the database's NCO record counts both spin–orbit components
// and a doubly degenerate bend). Not in the database: HCNN, HCNOH, HO2NO2,
// CH3O2NO2, CH3OONO, H–NO2, ClCO2.
var noxEntries = []entry{
	{name: "NCN", smiles: "[N]=C=[N]", aliases: []string{"N#C[N]"}, mult: 3, hf298: 457800, hfUnc: 12100, tLow: 200, tMid: 1000, tHigh: 3500, sImplied: true,
		hi:     [7]float64{5.68744173e+00, 1.82662756e-03, -7.07546249e-07, 1.19515592e-10, -7.31827071e-15, 5.15901177e+04, -6.31954433e+00},
		lo:     [7]float64{2.79807977e+00, 1.00008683e-02, -9.59229469e-06, 4.75546842e-09, -1.04340146e-12, 5.24021705e+04, 8.62129767e+00},
		source: srcGBR + " (cyanonitrene N=C=N, ³Σg⁻ ground state; ΔHf°298: Active Thermochemical Tables version D (2012; Goos et al., Proc. Combust. Inst. 2012 as the entry cites it), 457.8 ± 2.0 kJ/mol, which the entry quotes beside the version C (2011) value 445.73 ± 1.7 that its coefficients carry; the two versions differ by 12.1 kJ/mol, far beyond either stated uncertainty, and kiln carries that spread, ± 12.1 kJ/mol, as the entry's uncertainty; S°298 and Cp from its coefficients; NASA/TP-2002-211556 has no record)"},
	{name: "HNCN", smiles: "N=C=[N]", aliases: []string{"[NH]C#N"}, mult: 2, hfUnc: 8368, tLow: 200, tMid: 1000, tHigh: 3500, implied: true,
		hi:     [7]float64{5.53846448e+00, 3.89054126e-03, -1.38104752e-06, 2.21294765e-10, -1.31827325e-14, 3.59635337e+04, -3.39587098e+00},
		lo:     [7]float64{3.06754311e+00, 1.06789939e-02, -7.96224305e-06, 2.59883390e-09, -1.27057612e-13, 3.66623508e+04, 9.41074995e+00},
		source: srcGBR + " (cyanamidyl radical HN=C=N• ↔ HN•–C≡N, doublet (the record's name field says \"singlet\", its STATWT is 2); ΔHf°298: the database's G3B3 calculation, 75.487 ± 2 kcal/mol (computed; C. Melius's BAC-MP4 76.433 quoted))"},
	{name: "HNCNH", smiles: "N=C=N", mult: 1, hf298: 146476.82, s298: 244.934, hfUnc: 8368, tLow: 200, tMid: 1000, tHigh: 3500,
		hi:     [7]float64{5.94595507e+00, 5.80760348e-03, -1.98052324e-06, 3.08559845e-10, -1.80145882e-14, 1.53455062e+04, -7.36412676e+00},
		lo:     [7]float64{1.75129693e+00, 1.85798568e-02, -1.40651038e-05, 2.15778951e-09, 1.63974112e-12, 1.63883727e+04, 1.38507333e+01},
		source: srcGBR + " (carbodiimide HN=C=NH, C2; ΔHf°298: the database's G3B3 calculation, 35.009 ± 2 kcal/mol (computed; BAC-MP4 35.613 ± 3.56 quoted); S°298: the record's, 239.171 J/(mol K), counts one of its two mirror-image forms (σ = 2 for a C2, axially chiral molecule, no R ln 2), so the entry adds R ln 2 = 5.763, as kiln's estimates count optical isomers: 244.934)"},
	{name: "CH3NO", smiles: "CN=O", mult: 1, hfUnc: 8368, tLow: 200, tMid: 1000, tHigh: 3500, implied: true,
		hi:     [7]float64{5.04711802e+00, 9.21544305e-03, -3.29034831e-06, 5.28940397e-10, -3.15689858e-14, 6.23718102e+03, -7.74395570e-01},
		lo:     [7]float64{5.18534727e+00, -6.34085575e-03, 4.57171139e-05, -5.30421813e-08, 1.99501601e-11, 6.93771506e+03, 2.18492659e+00},
		source: srcGBR + " (nitrosomethane CH3–N=O, the CH3 torsion a hindered rotor (V3 = 412.7 cm⁻¹); ΔHf°298: the database's G3B3 calculation, 16.912 ± 2 kcal/mol (computed; BAC-MP4 18.882 ± 1.74 quoted))"},
	{name: "H2CNO", smiles: "C=N[O]", aliases: []string{"[CH2]N=O"}, mult: 2, hfUnc: 8368, tLow: 200, tMid: 1000, tHigh: 3500, implied: true,
		hi:     [7]float64{5.41478025e+00, 6.68230119e-03, -2.38625695e-06, 3.83764001e-10, -2.29149657e-14, 1.63459530e+04, -3.03719498e+00},
		lo:     [7]float64{3.00389272e+00, 6.88209471e-03, 1.26563213e-05, -2.17579528e-08, 9.28731765e-12, 1.73161337e+04, 1.09485576e+01},
		source: srcGBR + " (iminoxyl radical H2C=N–O• ↔ •CH2–N=O, one resonance-stabilised structure as the database says; ΔHf°298: the database's G3B3 calculation, 36.944 ± 2 kcal/mol (computed; BAC-MP4 41.45 ± 5 quoted; its older BAC-MP4 record for H2C•–N=O, 53.52, is superseded there))"},
	{name: "HOONO", smiles: "OON=O", mult: 1, tLow: 200, tMid: 1000, tHigh: 3500, implied: true,
		hi:     [7]float64{8.10159627e+00, 4.26710941e-03, -1.51636661e-06, 2.43367788e-10, -1.45205265e-14, -4.43153800e+03, -1.43333218e+01},
		lo:     [7]float64{3.32226829e+00, 2.12293241e-02, -2.65957652e-05, 1.85448718e-08, -5.41951263e-12, -3.26789541e+03, 9.50933761e+00},
		source: srcGBR + " (peroxynitrous acid HO–O–N=O; ΔHf°298: Active Thermochemical Tables version D (2013), −12.76 ± 0.38 kJ/mol, which its coefficients carry; structure and frequencies from the database's G3B3 calculation (its own G3B3 ΔHf°298, −0.13 ± 2 kcal/mol, quoted); the record names no conformer and its moments are those of a non-planar one, of which S°298 counts one mirror-image form)"},
	{name: "ClCO", smiles: "Cl[C]=O", mult: 2, hf298: -16000, hfUnc: 10000, tLow: 200, tMid: 1000, tHigh: 3500,
		n9: &nasa9{
			lo: [9]float64{2.513175740e+04, -5.969189670e+02, 8.327671350e+00, -7.056132590e-03, 1.313150734e-05, -1.037059653e-08, 3.033665179e-12, -7.052770320e+02, -1.580716775e+01},
			hi: [9]float64{3.443720240e+05, -1.793143470e+03, 8.392755900e+00, -5.374769590e-04, 9.113555710e-08, -3.111441728e-12, -2.040435218e-16, 6.914470150e+03, -1.998919104e+01},
		},
		source: srcNASA9 + " (chlorocarbonyl radical ClC•=O; ΔHf°298 and functions: Gurvich,1991 pt1 p118 pt2 p91, as the record gives them; Gurvich states ± 10 kJ/mol, as the Goos–Burcat–Ruscic entry quotes it beside the database's G3B3 value −19.36 ± 8)"},
	{name: "ClClO", smiles: "Cl[Cl+][O-]", aliases: []string{"Cl[Cl]=O"}, mult: 1, hfUnc: 8368, tLow: 200, tMid: 1000, tHigh: 3500, implied: true,
		hi:     [7]float64{6.41518336e+00, 6.04056865e-04, -2.37739093e-07, 4.07146695e-11, -2.53755181e-15, 1.48575893e+04, -3.52622812e+00},
		lo:     [7]float64{3.70993293e+00, 1.15803074e-02, -1.83229590e-05, 1.41403615e-08, -4.28796450e-12, 1.54352948e+04, 9.59881374e+00},
		source: srcGBR + " (Cl–Cl=O, the isomer of dichlorine monoxide Cl–O–Cl; ΔHf°298: the database's G3B3 calculation, 33.624 ± 2 kcal/mol (computed), 61.9 kJ/mol above ClOCl's W4 value; frequencies: Jacox (NIST WebBook 2012) as the entry cites them)"},
}

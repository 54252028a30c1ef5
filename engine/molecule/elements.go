package molecule

// element is one row of the read-only periodic table used by the reader.
type element struct {
	Sym    string
	Z      int
	Name   string
	Weight float64 // standard atomic weight, g/mol (see elementTable)
	Group  int     // IUPAC group 1–18 (0 for the f-block rows not used)
	Period int
}

// elementTable lists the elements kiln accepts in SMILES.
//
// Weights: IUPAC Commission on Isotopic Abundances and Atomic Weights,
// "Standard atomic weights of the elements 2021" (Prohaska et al., Pure Appl.
// Chem. 94 (2022) 573), abridged/conventional values for the elements whose
// standard weight is an interval (H, Li, B, C, N, O, Mg, Si, S, Cl, Br, Tl),
// entered from memory. Groups and periods are the IUPAC long-form table.
var elementTable = []element{
	{"H", 1, "hydrogen", 1.008, 1, 1},
	{"He", 2, "helium", 4.002602, 18, 1},
	{"Li", 3, "lithium", 6.94, 1, 2},
	{"Be", 4, "beryllium", 9.0121831, 2, 2},
	{"B", 5, "boron", 10.81, 13, 2},
	{"C", 6, "carbon", 12.011, 14, 2},
	{"N", 7, "nitrogen", 14.007, 15, 2},
	{"O", 8, "oxygen", 15.999, 16, 2},
	{"F", 9, "fluorine", 18.998403162, 17, 2},
	{"Ne", 10, "neon", 20.1797, 18, 2},
	{"Na", 11, "sodium", 22.98976928, 1, 3},
	{"Mg", 12, "magnesium", 24.305, 2, 3},
	{"Al", 13, "aluminium", 26.9815384, 13, 3},
	{"Si", 14, "silicon", 28.085, 14, 3},
	{"P", 15, "phosphorus", 30.973761998, 15, 3},
	{"S", 16, "sulfur", 32.06, 16, 3},
	{"Cl", 17, "chlorine", 35.45, 17, 3},
	{"Ar", 18, "argon", 39.95, 18, 3},
	{"K", 19, "potassium", 39.0983, 1, 4},
	{"Ca", 20, "calcium", 40.078, 2, 4},
	{"Sc", 21, "scandium", 44.955907, 3, 4},
	{"Ti", 22, "titanium", 47.867, 4, 4},
	{"V", 23, "vanadium", 50.9415, 5, 4},
	{"Cr", 24, "chromium", 51.9961, 6, 4},
	{"Mn", 25, "manganese", 54.938043, 7, 4},
	{"Fe", 26, "iron", 55.845, 8, 4},
	{"Co", 27, "cobalt", 58.933194, 9, 4},
	{"Ni", 28, "nickel", 58.6934, 10, 4},
	{"Cu", 29, "copper", 63.546, 11, 4},
	{"Zn", 30, "zinc", 65.38, 12, 4},
	{"Ga", 31, "gallium", 69.723, 13, 4},
	{"Ge", 32, "germanium", 72.630, 14, 4},
	{"As", 33, "arsenic", 74.921595, 15, 4},
	{"Se", 34, "selenium", 78.971, 16, 4},
	{"Br", 35, "bromine", 79.904, 17, 4},
	{"Kr", 36, "krypton", 83.798, 18, 4},
	{"Rb", 37, "rubidium", 85.4678, 1, 5},
	{"Sr", 38, "strontium", 87.62, 2, 5},
	{"Y", 39, "yttrium", 88.905838, 3, 5},
	{"Zr", 40, "zirconium", 91.222, 4, 5},
	{"Nb", 41, "niobium", 92.90637, 5, 5},
	{"Mo", 42, "molybdenum", 95.95, 6, 5},
	{"Ru", 44, "ruthenium", 101.07, 8, 5},
	{"Rh", 45, "rhodium", 102.90549, 9, 5},
	{"Pd", 46, "palladium", 106.42, 10, 5},
	{"Ag", 47, "silver", 107.8682, 11, 5},
	{"Cd", 48, "cadmium", 112.414, 12, 5},
	{"In", 49, "indium", 114.818, 13, 5},
	{"Sn", 50, "tin", 118.710, 14, 5},
	{"Sb", 51, "antimony", 121.760, 15, 5},
	{"Te", 52, "tellurium", 127.60, 16, 5},
	{"I", 53, "iodine", 126.90447, 17, 5},
	{"Xe", 54, "xenon", 131.293, 18, 5},
	{"Cs", 55, "caesium", 132.90545196, 1, 6},
	{"Ba", 56, "barium", 137.327, 2, 6},
	{"W", 74, "tungsten", 183.84, 6, 6},
	{"Pt", 78, "platinum", 195.084, 10, 6},
	{"Au", 79, "gold", 196.966570, 11, 6},
	{"Hg", 80, "mercury", 200.592, 12, 6},
	{"Tl", 81, "thallium", 204.38, 13, 6},
	{"Pb", 82, "lead", 207.2, 14, 6},
	{"Bi", 83, "bismuth", 208.98040, 15, 6},
}

// isotopeMass holds atomic masses (g/mol, = Da) of the isotopes most often
// written in mechanisms. Source: Wang et al., "The AME 2020 atomic mass
// evaluation (II)", Chinese Phys. C 45 (2021) 030003, entered from memory.
// An isotope not listed here falls back to its mass number (an approximation
// good to ~0.01 g/mol for light nuclides; documented on MolarMass).
var isotopeMass = map[string]map[int]float64{
	"H":  {1: 1.00782503223, 2: 2.01410177812, 3: 3.0160492779},
	"C":  {12: 12, 13: 13.00335483507, 14: 14.0032419884},
	"N":  {14: 14.00307400443, 15: 15.00010889888},
	"O":  {16: 15.99491461957, 17: 16.99913175650, 18: 17.99915961286},
	"F":  {19: 18.99840316273},
	"S":  {32: 31.9720711744, 34: 33.967867004},
	"Cl": {35: 34.968852682, 37: 36.965902602},
	"Br": {79: 78.9183376, 81: 80.9162897},
}

// elementIndex maps a symbol to its row in elementTable.
func elementIndex(sym string) (element, bool) {
	for _, e := range elementTable {
		if e.Sym == sym {
			return e, true
		}
	}
	return element{}, false
}

// AtomicWeight returns the standard atomic weight (g/mol) of an element by
// symbol ("C", "Cl"), from the IUPAC 2021 table described on elementTable,
// and false for a symbol kiln does not know.
func AtomicWeight(sym string) (float64, bool) {
	e, ok := elementIndex(sym)
	return e.Weight, ok
}

// AtomicWeights returns a fresh map symbol → standard atomic weight (g/mol)
// of every element kiln knows (IUPAC 2021 conventional values).
func AtomicWeights() map[string]float64 {
	out := make(map[string]float64, len(elementTable))
	for _, e := range elementTable {
		out[e.Sym] = e.Weight
	}
	return out
}

// valences returns the normal valences (ascending) of an atom of element e
// carrying formal charge q, and false when kiln applies no valence rule to it
// (metals, noble gases, charged hydrogen).
//
// Neutral main-group atoms (common practice; OpenSMILES organic subset):
// group 13: 3; group 14: 4; group 15: 3, 5; group 16: 2 (O) or 2, 4, 6;
// group 17: 1 (F) or 1, 3, 5, 7; hydrogen 1. A charged atom is treated as the
// isoelectronic neutral atom of the same period: the group shifts by −q
// (N⁺ and B⁻ as C, O⁺ and C⁻ as N, C⁺ as B, O⁻ as F); landing in group 18
// gives valence 0 ([F-], [O-2]); landing outside groups 13–18 gives no rule.
func valences(e element, q int) ([]int, bool) {
	if e.Sym == "H" {
		if q != 0 {
			return nil, false
		}
		return valence1, true
	}
	if e.Group < 13 {
		return nil, false
	}
	g := e.Group - q
	if g < 13 || g > 18 {
		return nil, false
	}
	second := e.Period == 2
	switch g {
	case 13:
		return valence3, true
	case 14:
		return valence4, true
	case 15:
		return valence35, true
	case 16:
		if second {
			return valence2, true
		}
		return valence246, true
	case 17:
		if second {
			return valence1, true
		}
		return valence1357, true
	default:
		return valence0, true
	}
}

// Normal valence lists returned by valences (read-only, shared by all callers).
var (
	valence0    = []int{0}
	valence1    = []int{1}
	valence2    = []int{2}
	valence3    = []int{3}
	valence4    = []int{4}
	valence35   = []int{3, 5}
	valence246  = []int{2, 4, 6}
	valence1357 = []int{1, 3, 5, 7}
)

// lowestValence returns the lowest normal valence ≥ total, or false if total
// exceeds every normal valence.
func lowestValence(vs []int, total int) (int, bool) {
	for _, v := range vs {
		if v >= total {
			return v, true
		}
	}
	return 0, false
}

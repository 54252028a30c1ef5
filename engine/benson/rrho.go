package benson

import (
	_ "embed"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"

	"kiln.dev/kiln/engine/molecule"
)

// Rigid-rotor harmonic-oscillator (RRHO) ideal-gas S°298 and Cp(T) of a rigid
// molecule with no internal rotor, from its published molecular constants
// (rrho.tsv): the standard statistical-thermodynamics result (common
// practice),
//
//	Cp(T) = 4R + Σ R x² eˣ/(eˣ−1)²                    (nonlinear: 3/2 R
//	        translation + 3/2 R rotation + R for Cp − Cv; x = hcν̃/kT)
//	S°298 = Sackur–Tetrode (1 bar) + R [ln(√π/σ · √(T³/θAθBθC)) + 3/2]
//	        + Σ R [x/(eˣ−1) − ln(1−e⁻ˣ)]
//
// with θ = hcB/k for each rotational constant B. The ring corrections of
// thiophene (Cp) and pyrrole (S° and Cp) are derived from these values of
// the parent molecule minus its groups (corrections_sx.tsv,
// corrections_n.tsv); rrho_test.go recomputes them.

//go:embed rrho.tsv
var rrhoTSV string

// rrhoMolecule holds the molecular constants of one molecule of rrho.tsv.
type rrhoMolecule struct {
	formula string     // e.g. C4H4S
	sigma   int        // external symmetry number
	rot     [3]float64 // rotational constants A, B, C, MHz
	nu      []float64  // vibrational fundamentals, cm⁻¹, degeneracy 1
}

// speedOfLightCm is c in cm/s (exact): a rotational constant in MHz divided
// by c/1e6 is in cm⁻¹.
const speedOfLightCm = 2.99792458e10

// rrhoMolecules parses rrho.tsv.
func rrhoMolecules() (map[string]*rrhoMolecule, error) {
	out := map[string]*rrhoMolecule{}
	for n, line := range strings.Split(rrhoTSV, "\n") {
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		f := strings.Split(line, "\t")
		if len(f) != 5 {
			return nil, fmt.Errorf("rrho.tsv line %d: %d fields, want 5", n+1, len(f))
		}
		m := out[f[0]]
		if m == nil {
			m = &rrhoMolecule{}
			out[f[0]] = m
		}
		v, err := strconv.ParseFloat(f[3], 64)
		if err != nil {
			return nil, fmt.Errorf("rrho.tsv line %d: value: %w", n+1, err)
		}
		switch f[1] {
		case "formula":
			m.formula = f[2]
		case "sigma":
			m.sigma = int(v)
		case "rot":
			k := strings.Index("ABC", f[2])
			if len(f[2]) != 1 || k < 0 {
				return nil, fmt.Errorf("rrho.tsv line %d: rotational constant %q, want A, B or C", n+1, f[2])
			}
			m.rot[k] = v
		case "nu":
			m.nu = append(m.nu, v)
		default:
			return nil, fmt.Errorf("rrho.tsv line %d: unknown quantity %q", n+1, f[1])
		}
	}
	for name, m := range out {
		if m.sigma < 1 || m.rot[0] <= 0 || m.rot[1] <= 0 || m.rot[2] <= 0 || len(m.nu) == 0 {
			return nil, fmt.Errorf("rrho.tsv: %s lacks sigma, a rotational constant or fundamentals", name)
		}
		if _, err := m.mass(); err != nil {
			return nil, fmt.Errorf("rrho.tsv: %s: %w", name, err)
		}
	}
	return out, nil
}

// mass returns the molar mass (g/mol) of m's formula (element symbols, each
// followed by an optional count).
func (m *rrhoMolecule) mass() (float64, error) {
	s, total := m.formula, 0.0
	for i := 0; i < len(s); {
		j := i + 1
		for j < len(s) && unicode.IsLower(rune(s[j])) {
			j++
		}
		w, ok := molecule.AtomicWeight(s[i:j])
		if !ok {
			return 0, fmt.Errorf("formula %q: unknown element %q", s, s[i:j])
		}
		k := j
		for k < len(s) && unicode.IsDigit(rune(s[k])) {
			k++
		}
		n := 1
		if k > j {
			n, _ = strconv.Atoi(s[j:k])
		}
		total += float64(n) * w
		i = k
	}
	if total == 0 {
		return 0, fmt.Errorf("empty formula")
	}
	return total, nil
}

// cp returns m's RRHO ideal-gas heat capacity at T (K), J/(mol K).
func (m *rrhoMolecule) cp(T float64) float64 {
	c := 4 * R
	for _, nu := range m.nu {
		c += harmonicCp(nu, T)
	}
	return c
}

// s298 returns m's RRHO ideal-gas entropy at 298.15 K and 1 bar, J/(mol K):
// translational (Sackur–Tetrode, sfloor.go), rigid-rotor and vibrational.
func (m *rrhoMolecule) s298() float64 {
	M, _ := m.mass() // checked by rrhoMolecules
	prod := 1.0
	for _, b := range m.rot {
		prod *= secondRadiation * b * 1e6 / speedOfLightCm // θ, K
	}
	s := translationalEntropy(M) + R*(math.Log(math.Sqrt(math.Pi)/float64(m.sigma)*math.Sqrt(t298*t298*t298/prod))+1.5)
	for _, nu := range m.nu {
		s += harmonicS(nu, t298)
	}
	return s
}

// Package reflib is the library of reference thermochemistry for small
// species that group additivity does not cover (atoms, diatomics, small
// radicals and the common combustion products): for each, ΔHf°298 (J/mol),
// S°298 (J/(mol K), 1 bar) and a two-range NASA-7 polynomial, with the
// published source of every number. Species are found by molecular structure
// (canonical SMILES; see structureKey) and spin multiplicity. It does no I/O.
//
// data_nsx.go adds nitrogen, sulfur and halogen (F, Cl, Br) species (among them
// haloethylenes, haloacetylenes and their radicals), ketene, ketenyl, ethynyl,
// carbon suboxide and ozone from NASA/TP-2002-211556 (NASA-9, refitted) and
// GRI-Mech 3.0.
//
// How the polynomials are built (see data.go): most entries store published
// NASA-7 coefficient blocks whose a6, a7 are recomputed from the stored
// ΔHf°298 and S°298; monatomic gases use Cp = 5/2 R; CH4 stores fundamental
// frequencies and its tabulated rigid-rotor/harmonic-oscillator Cp(T) is
// fitted with nasa.FitPoly when the library is built. Valid temperature
// ranges are those of the source (200 or 300 K to 3500, 5000 or 6000 K),
// except where a NASA-9 refit stops lower (F2 at 3000 K, O3 at 2000 K).
package reflib

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"
	"sync"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/nasa"
)

// Species is one reference species.
type Species struct {
	Name         string
	SMILES       string // as entered; the index uses its canonical form
	Multiplicity int    // spin multiplicity 2S+1
	Hf298        float64
	S298         float64
	Poly         nasa.NASA7
	// Fit is the report of the NASA-7 fit that made Poly from the source's
	// Cp (NASA-9 coefficients, or an RRHO sum, sampled every 50 K); zero
	// for an entry entered as published NASA-7 blocks, which is used as it
	// stands.
	Fit nasa.FitReport
	// Hf298Unc is the uncertainty of Hf298 (J/mol) the source states, where
	// it is 4 kJ/mol or more; 0 for an entry that counts as exact.
	Hf298Unc float64
	Source   string
}

// Library is an immutable, indexed set of reference species, safe for
// concurrent use.
type Library struct {
	species []Species
	index   map[string]int // canonical SMILES + "|" + multiplicity → species
	// ground maps a canonical structure to its lowest-enthalpy entry: the
	// electronic ground state a modeller means when no multiplicity is given
	// (O=O is triplet oxygen, [CH2] triplet methylene).
	ground map[string]int
	// maxHeavy is the largest heavy-atom count of any entry: bigger
	// molecules are rejected without computing their canonical form.
	maxHeavy int
}

// New returns the library. It is built once per process (the NASA-9
// refits take a few milliseconds) and shared: a Library is immutable, and
// Lookup and All return copies.
func New() *Library { return built() }

var built = sync.OnceValue(build)

// build builds the library and its index by canonical SMILES (each entry's
// SMILES and aliases are read with molecule.ParseSMILES and written with
// Canonical). It panics if an entry of the built-in table cannot be read,
// fitted or indexed: that is a defect of the table, caught by the tests.
func build() *Library {
	l := &Library{index: map[string]int{}, ground: map[string]int{}}
	for _, e := range append(append([]entry(nil), entries...), nsxEntries...) {
		e.resolve()
		p, fit, err := e.poly()
		if err != nil {
			panic(fmt.Sprintf("reflib: %s: %v", e.name, err))
		}
		l.species = append(l.species, Species{
			Name: e.name, SMILES: e.smiles, Multiplicity: e.mult,
			Hf298: e.hf298, S298: e.s298, Poly: p, Fit: fit, Hf298Unc: e.hfUnc, Source: e.source,
		})
		for _, s := range append([]string{e.smiles}, e.aliases...) {
			m, err := molecule.ParseSMILES(s)
			if err != nil {
				panic(fmt.Sprintf("reflib: %s: SMILES %q: %v", e.name, s, err))
			}
			c := structureKey(m)
			k := key(c, e.mult)
			if prev, dup := l.index[k]; dup && prev == len(l.species)-1 {
				continue // an alias that is the same structure as the entry's SMILES
			} else if dup {
				panic(fmt.Sprintf("reflib: %s and %s share structure and multiplicity (%s)", l.species[prev].Name, e.name, k))
			}
			l.index[k] = len(l.species) - 1
			l.maxHeavy = max(l.maxHeavy, m.HeavyAtoms())
			if g, ok := l.ground[c]; !ok || e.hf298 < l.species[g].Hf298 {
				l.ground[c] = len(l.species) - 1
			}
		}
	}
	return l
}

func key(canonical string, mult int) string { return canonical + "|" + strconv.Itoa(mult) }

// structureKey identifies the structure of m whatever its spelling: its
// canonical SMILES, except for molecules made of hydrogen only. Those keep
// their hydrogens as graph atoms in some spellings ([H][H]: two atoms and a
// bond) and fold them into a hydrogen count in others ([HH]: one atom with
// one H), which the canonical form tells apart; they are keyed by the number
// of hydrogens and unpaired electrons of each '.'-separated component
// ("H:2/0" for H2, "H:1/1" for the H atom). Isotope labels and charges keep
// the canonical form, so [2H][2H] and [H+] find no protium entry.
func structureKey(m *molecule.Molecule) string {
	// Charge-separated and pentavalent spellings of an N–O unit are one
	// structure (molecule.NeutralOxo), as for the estimator.
	m = m.NeutralOxo()
	for _, a := range m.Atoms {
		if a.Element != "H" || a.Isotope != 0 || a.Charge != 0 {
			return m.Canonical()
		}
	}
	comp := make([]int, len(m.Atoms)) // component of each atom, by union–find
	for i := range comp {
		comp[i] = i
	}
	find := func(x int) int {
		for comp[x] != x {
			x = comp[x]
		}
		return x
	}
	for _, b := range m.Bonds {
		comp[find(b.A)] = find(b.B)
	}
	type count struct{ h, unpaired int }
	byRoot := map[int]*count{}
	for i, a := range m.Atoms {
		r := find(i)
		if byRoot[r] == nil {
			byRoot[r] = &count{}
		}
		byRoot[r].h += 1 + a.HCount
		byRoot[r].unpaired += a.Radical
	}
	parts := make([]string, 0, len(byRoot))
	for _, c := range byRoot {
		parts = append(parts, fmt.Sprintf("%d/%d", c.h, c.unpaired))
	}
	slices.Sort(parts)
	return "H:" + strings.Join(parts, ".")
}

// Lookup returns the species with exactly the structure of m (same canonical
// SMILES, or for hydrogen-only molecules the same structureKey, so that
// [HH] and [H][H] both find H2) and the given spin multiplicity;
// multiplicity 0 means the electronic ground state of that structure (the entry of lowest ΔHf°298),
// whatever the graph's formal radical count says: O=O finds triplet O2, and
// [CH2] finds triplet CH2 with 0 or 3 and singlet CH2(S) with 1. The returned Species is a copy owned by the caller.
func (l *Library) Lookup(m *molecule.Molecule, multiplicity int) (*Species, bool) {
	if m == nil || m.HeavyAtoms() > l.maxHeavy {
		return nil, false
	}
	c := structureKey(m)
	var (
		i  int
		ok bool
	)
	if multiplicity == 0 {
		// No multiplicity given: the electronic ground state.
		i, ok = l.ground[c]
	} else {
		i, ok = l.index[key(c, multiplicity)]
	}
	if !ok {
		return nil, false
	}
	s := l.species[i]
	return &s, true
}

// All returns a copy of every species, in table order.
func (l *Library) All() []Species {
	return append([]Species(nil), l.species...)
}

// c2 is the second radiation constant hc/k in cm K (CODATA 2018).
const c2 = 1.438776877

// poly builds the entry's polynomial (see the entry type) and, for a
// polynomial fitted to the source's Cp, the fit's report.
func (e entry) poly() (nasa.NASA7, nasa.FitReport, error) {
	p := nasa.NASA7{TLow: e.tLow, TMid: e.tMid, THigh: e.tHigh}
	switch {
	case e.monatomic:
		p.Low[0], p.High[0] = 2.5, 2.5
	case e.n9 != nil:
		var T, Cp []float64
		for t := e.tLow; t <= e.tHigh; t += 50 {
			T = append(T, t)
			Cp = append(Cp, e.n9.cp(t))
		}
		fit, rep, err := nasa.FitPoly(e.hf298, e.s298, T, Cp, nasa.FitOptions{TLow: e.tLow, TMid: e.tMid, THigh: e.tHigh})
		if err != nil {
			return p, rep, fmt.Errorf("fitting NASA-9 Cp: %w", err)
		}
		return fit, rep, nil
	case len(e.freqs) > 0:
		var T, Cp []float64
		for t := e.tLow; t <= e.tHigh; t += 50 {
			T = append(T, t)
			Cp = append(Cp, rrhoCp(t, e.freqs, e.linear))
		}
		fit, rep, err := nasa.FitPoly(e.hf298, e.s298, T, Cp, nasa.FitOptions{TLow: e.tLow, TMid: e.tMid, THigh: e.tHigh})
		if err != nil {
			return p, rep, fmt.Errorf("fitting RRHO Cp: %w", err)
		}
		return fit, rep, nil
	default:
		p.Low, p.High = e.lo, e.hi
	}
	// a6, a7 from ΔHf°298 and S°298 (low block), then continuity of H and S
	// at TMid (high block); see the nasa package for the formulas.
	p.Low[5] += (e.hf298 - p.H(nasa.Tref)) / nasa.R
	p.Low[6] += (e.s298 - p.S(nasa.Tref)) / nasa.R
	hLow, sLow := lowAt(p, p.TMid), lowSAt(p, p.TMid)
	p.High[5] += (hLow - p.H(p.TMid)) / nasa.R
	p.High[6] += (sLow - p.S(p.TMid)) / nasa.R
	return p, nasa.FitReport{}, nil
}

// resolve fills hf298 and s298 where the entry takes them from its
// coefficients: S°298 of NASA-9 and sImplied entries, both values of implied entries.
func (e *entry) resolve() {
	switch {
	case e.n9 != nil:
		e.s298 = e.n9.s(nasa.Tref)
	case e.implied || e.sImplied:
		p := nasa.NASA7{TLow: e.tLow, TMid: e.tMid, THigh: e.tHigh, Low: e.lo, High: e.lo}
		if e.implied {
			e.hf298 = p.H(nasa.Tref)
		}
		e.s298 = p.S(nasa.Tref)
	}
}

// block returns the NASA-9 block valid at T (the high one from 1000 K).
func (n *nasa9) block(T float64) *[9]float64 {
	if T >= 1000 {
		return &n.hi
	}
	return &n.lo
}

// cp, h and s evaluate the block valid at T (nasa.Cp9, H9, S9): Cp and S°
// in J/(mol K), H in J/mol with H(298.15 K) = ΔHf°298.
func (n *nasa9) cp(T float64) float64 { return nasa.Cp9(n.block(T), T) }
func (n *nasa9) h(T float64) float64  { return nasa.H9(n.block(T), T) }
func (n *nasa9) s(T float64) float64  { return nasa.S9(n.block(T), T) }

// lowAt and lowSAt evaluate H and S of the low block at T even when T is
// TMid (where NASA7 methods use the high block).
func lowAt(p nasa.NASA7, T float64) float64 {
	q := p
	q.High = p.Low
	return q.H(T)
}

func lowSAt(p nasa.NASA7, T float64) float64 {
	q := p
	q.High = p.Low
	return q.S(T)
}

// rrhoCp is the ideal-gas heat capacity in J/(mol K) of a rigid rotor with
// harmonic vibrations: Cp/R = 4 (non-linear) or 3.5 (linear) for translation,
// rotation and Cp − Cv, plus Σ x² eˣ/(eˣ − 1)² with x = c2 ν/T per vibration
// (ν in cm⁻¹, T in K).
func rrhoCp(T float64, freqs []float64, linear bool) float64 {
	c := 4.0
	if linear {
		c = 3.5
	}
	for _, nu := range freqs {
		x := c2 * nu / T
		ex := math.Exp(-x)
		c += x * x * ex / ((1 - ex) * (1 - ex))
	}
	return nasa.R * c
}

package benson

import (
	"errors"
	"fmt"
	"math/rand/v2"
	"regexp"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/molecule"
)

// One answer per molecule, checked on the engine itself (no canonical
// spelling in between): random radicals and closed-shell molecules, acyclic
// and cyclic, each estimated from several random spellings, must give
// bit-identical results.

// spellElements are the elements of the spelling corpus, with valence and
// drawing weight: C, O and the heteroatoms that have groups.
var spellElements = []genElement{
	{"C", 4, 70}, {"O", 2, 16}, {"N", 3, 5}, {"S", 2, 3}, {"Cl", 1, 3}, {"F", 1, 3},
}

// spellStructure writes a random valence-correct structure of 2–12 heavy
// atoms as bracket atoms: a random tree with some double and triple bonds,
// up to two ring closures, now and then a benzene ring, and (in about half
// of the structures) one or two radical centres.
func spellStructure(r *rand.Rand) string {
	s := randomTree(r, spellElements, 2+r.IntN(11), true)
	tries := 0
	if r.IntN(3) == 0 {
		tries = 1 + r.IntN(2)
	}
	s.addClosures(r, tries)
	n := len(s.el)
	radical := make([]int, n)
	if r.IntN(2) == 0 {
		for range 1 + r.IntN(4)/3 { // mostly one site, sometimes two
			var cand []int
			for i := range n {
				if s.free[i] > radical[i] {
					cand = append(cand, i)
				}
			}
			if len(cand) > 0 {
				radical[cand[r.IntN(len(cand))]]++
			}
		}
	}
	prefix := ""
	if r.IntN(8) == 0 && s.free[0] > radical[0] {
		prefix = "c1ccc(cc1)"
		s.free[0]--
	}
	return s.write(prefix, func(i int) (int, string) { return s.free[i] - radical[i], "" })
}

// respell writes m as another SMILES of the same structure: a random start
// atom, random neighbour (branch) order, random ring-closure digits (one or
// two digits, bond symbol at the opening, the closing or both ends), bracket
// or organic-subset atoms, and either the aromatic form (lower-case atoms,
// the reader picks a Kekulé structure) or the Kekulé form the molecule
// holds. Stereo is not written (the corpus has none).
func respell(m *molecule.Molecule, r *rand.Rand) string {
	n := len(m.Atoms)
	kekule := r.IntN(2) == 0
	visited := make([]bool, n)
	usedBond := make([]bool, len(m.Bonds))
	children := make([][]int, n)
	opens := make([][]int, n)  // ring-closure bonds opened at an atom
	closes := make([][]int, n) // ring-closure bonds closed at an atom
	var dfs func(a int)
	dfs = func(a int) {
		visited[a] = true
		adj := slices.Clone(m.Adj[a])
		r.Shuffle(len(adj), func(i, j int) { adj[i], adj[j] = adj[j], adj[i] })
		for _, bi := range adj {
			if usedBond[bi] {
				continue
			}
			usedBond[bi] = true
			o := m.Other(bi, a)
			if visited[o] {
				// o is an ancestor still being written: the closure opens
				// there and closes here.
				opens[o] = append(opens[o], bi)
				closes[a] = append(closes[a], bi)
				continue
			}
			children[a] = append(children[a], bi)
			dfs(o)
		}
	}
	aromaticAtom := func(a int) bool { return !kekule && m.Atoms[a].Aromatic }
	bondText := func(bi int) string {
		bd := m.Bonds[bi]
		if !kekule && bd.Aromatic {
			return ""
		}
		switch bd.Order {
		case 2:
			return "="
		case 3:
			return "#"
		}
		if aromaticAtom(bd.A) && aromaticAtom(bd.B) {
			return "-"
		}
		if r.IntN(8) == 0 {
			return "-"
		}
		return ""
	}
	organicValence := map[string]int{"C": 4, "N": 3, "O": 2, "S": 2, "F": 1, "Cl": 1}
	atomText := func(a int) string {
		at := m.Atoms[a]
		sym := at.Element
		if aromaticAtom(a) {
			sym = strings.ToLower(sym)
		}
		if v, ok := organicValence[at.Element]; ok && !aromaticAtom(a) && at.Radical == 0 && at.Charge == 0 && at.Isotope == 0 && r.IntN(2) == 0 {
			sum := at.HCount
			for _, bi := range m.Adj[a] {
				sum += m.Bonds[bi].Order
			}
			if sum == v {
				return sym // organic subset: the reader supplies the same H count
			}
		}
		s := "[" + sym
		if at.Isotope != 0 {
			s = fmt.Sprintf("[%d%s", at.Isotope, sym)
		}
		switch {
		case at.HCount == 1:
			s += "H"
		case at.HCount > 1:
			s += fmt.Sprintf("H%d", at.HCount)
		}
		switch {
		case at.Charge > 0:
			s += fmt.Sprintf("+%d", at.Charge)
		case at.Charge < 0:
			s += fmt.Sprintf("-%d", -at.Charge)
		}
		return s + "]"
	}
	digitOf := map[int]int{}
	inUse := map[int]bool{}
	var b strings.Builder
	var write func(a int)
	write = func(a int) {
		b.WriteString(atomText(a))
		for _, bi := range closes[a] {
			d := digitOf[bi]
			delete(inUse, d)
			if r.IntN(3) == 0 {
				b.WriteString(bondText(bi))
			}
			writeRingDigit(&b, d)
		}
		for _, bi := range opens[a] {
			d := 1 + r.IntN(30)
			for inUse[d] {
				d = 1 + r.IntN(30)
			}
			inUse[d] = true
			digitOf[bi] = d
			b.WriteString(bondText(bi))
			writeRingDigit(&b, d)
		}
		for k, bi := range children[a] {
			last := k == len(children[a])-1
			if !last {
				b.WriteByte('(')
			}
			b.WriteString(bondText(bi))
			write(m.Other(bi, a))
			if !last {
				b.WriteByte(')')
			}
		}
	}
	first := true
	for _, root := range r.Perm(n) {
		if visited[root] {
			continue
		}
		dfs(root)
		if !first {
			b.WriteByte('.')
		}
		first = false
		write(root)
	}
	return b.String()
}

func writeRingDigit(b *strings.Builder, d int) {
	if d < 10 {
		b.WriteByte(byte('0' + d))
		return
	}
	fmt.Fprintf(b, "%%%d", d)
}

// fingerprint renders everything an estimate reports about the molecule
// (not its atom numbering): totals bit for bit, σ, n, multiplicity, class,
// uncertainty, every term and every flag, in the result's own order.
func fingerprint(e *Result) string {
	var b strings.Builder
	fmt.Fprintf(&b, "Hf=%b S=%b Cp=%b sigma=%d n=%d mult=%d class=%s u=%b\n",
		e.Hf298, e.S298, e.Cp, e.SymmetryNumber, e.OpticalIsomers, e.Multiplicity, e.Class, e.Uncertainty)
	for _, t := range e.Groups {
		fmt.Fprintf(&b, "group %s ×%d %b %b %b atoms=%d\n", t.Name, t.Count, t.Hf298, t.S298, t.Cp, len(t.Atoms))
	}
	for _, t := range e.Corrections {
		fmt.Fprintf(&b, "corr %s ×%d %b %b %b\n", t.Name, t.Count, t.Hf298, t.S298, t.Cp)
	}
	for _, ms := range e.Missing {
		fmt.Fprintf(&b, "flag %s | %s | %s\n", ms.Group, ms.Approximation, ms.Note)
	}
	return b.String()
}

// looseFingerprint is fingerprint up to the order of terms and flags and
// to rounding (totals to 1e-6 J/mol and 1e-9 J/(mol K)): a difference that
// survives it is a different answer, not only a different summation order.
func looseFingerprint(e *Result) string {
	var lines []string
	for _, t := range e.Groups {
		lines = append(lines, fmt.Sprintf("group %s ×%d", t.Name, t.Count))
	}
	for _, t := range e.Corrections {
		lines = append(lines, fmt.Sprintf("corr %s ×%d %.6f %.9f", t.Name, t.Count, t.Hf298, t.S298))
	}
	for _, ms := range e.Missing {
		lines = append(lines, "flag "+ms.Group+" | "+ms.Approximation)
	}
	slices.Sort(lines)
	return fmt.Sprintf("Hf=%.6f S=%.9f Cp=%.9f sigma=%d n=%d mult=%d class=%s u=%.6f\n%s",
		e.Hf298, e.S298, e.Cp, e.SymmetryNumber, e.OpticalIsomers, e.Multiplicity, e.Class, e.Uncertainty, strings.Join(lines, "\n"))
}

// outcome is an estimate's fingerprint, or the kind of its refusal (the
// atom numbers of a refusal message follow the spelling); loose is
// looseFingerprint, or the same refusal kind.
func outcome(m *molecule.Molecule) (exact, loose string) {
	e, err := Estimate(m, Options{})
	if err == nil {
		return fingerprint(e), looseFingerprint(e)
	}
	k := refusalKind(err)
	return k, k
}

var digits = regexp.MustCompile(`[0-9]+`)

func refusalKind(err error) string {
	var mg *MissingGroupError
	var ue *UnsupportedError
	switch {
	case errors.As(err, &mg):
		return "missing group " + mg.Group + " also " + strings.Join(mg.Also, ", ")
	case errors.As(err, &ue):
		// the same reason, up to the atom numbers of the spelling
		return "unsupported: " + digits.ReplaceAllString(ue.Reason, "#")
	}
	return "error " + err.Error()
}

// spellingFixed are structures added to the random corpus of
// TestRandomSpellingsOneAnswer.
var spellingFixed = []string{
	"CC([C](C)O)=C", "C[C](O)C(C)=C", "C=C[CH]OC", "C=CC([O])C#C", "NCC(Cl)[CH]C=C", "NC[CH]Cl", "O=C[CH]C(=O)OC",
	"C=CC(C=O)[CH]C(C)=O", "[CH2]C(=C)C(=C)[CH2]", "c1ccccc1[CH]C=C", "OCC[CH]Cl", "FCC(O)[CH]F", "C[C](N)OC",
	"C1CC2CCC1CC2", "C1C2CC3CC1CC(C2)C3", "C12C3C4C1C5C2C3C45", "C1=CC2CCC1C2", "C1CC2CCC1C2",
	"C1CCC2CCCCC2C1", "c1ccc2ccccc2c1", "C1Cc2ccccc2C1", "c1ccc2c(c1)ccc1ccccc12", "CC12CCC(CC1)C(C)(C)O2",
	"Cc1nccs1", "c1cc[nH]n1", "Cn1ccnc1", "Cc1nc[nH]n1", // azoles (azole.go; typed from the Kekulé structure)
	"C1CC11CC1", "C12C3C1C4C2C34", "O=C1[CH]CCC1", "[O]C1=CCCC1", "c1ccoc1", "Cc1ccc(C)o1", "C1CCOC1",
	"c1ccc2c(c1)oc1ccccc12", "CC1=CC(=O)CC(C)(C)C1", "[CH2]c1ccccc1", "C1=CC=CC1", "[CH]1C=CC=C1",
	"Cc1cccs1", "CCc1ccsc1", "CCS(=O)C", "CS(=O)(=O)CC(C)C", "C1CCS1", "Clc1ccccc1Cl", "Fc1ccc(F)c(F)c1",
	"C/C=C/Cl", "FC(F)=CC", "CC(C)(C)Br", "CCC(C)Br", "C=CSC",
	// nitrogen (hetero_n.go): charge-separated and pentavalent nitro, nitrate, nitrite, azines, N rings
	"C[N+](=O)[O-]", "CCN(=O)=O", "[O-][N+](=O)c1ccccc1", "CCO[N+](=O)[O-]", "CC(C)ON=O",
	"c1ccncc1", "Cc1ccccn1", "c1cnccn1", "c1ccc2ncccc2c1", "Cc1ccc2cccnc2c1", "C1CCNC1", "CN1CC1",
	// pyrrole-type ring N and N-substituted amides (hetero_n.go)
	"c1cc[nH]c1", "Cn1cccc1", "Cc1ccc(C)[nH]1", "CCn1cccc1C", "CN(C)C=O", "CNC(C)=O", "CCN(CC)C(=O)CC",
}

// spellingRefused are refused structures added to the corpus: charged,
// isotope-labelled, several missing groups, Kekulé-dependent groups.
var spellingRefused = []string{
	"CC[NH3+].[Cl-]", "[2H]CC[13CH3]", "C[Si](C)CC[Li]", "CC(=S)C(=S)C", "OB(O)CCP",
	// azoles outside the derived groups (azole.go): N=N in the ring, =N– next to the donor O
	"Cc1c[nH]nn1", "Cc1cnoc1",
	// charges other than N⁺–O⁻ units, ions, imines, azo (hetero_n.go)
	"c1ccccc1[N+]#[C-]", "C[NH3+]", "CC[N+](C)(C)C", "CC=NO", "N=Cc1ccccc1", "CCN=O",
}

// TestRandomSpellingsOneAnswer: ≥ 2,000 estimable random structures
// (radicals and closed-shell, acyclic and cyclic), each estimated directly
// by Estimate from its generated spelling and from 6 random respellings,
// give identical results (refusals: the same kind of refusal).
func TestRandomSpellingsOneAnswer(t *testing.T) {
	r := rand.New(rand.NewPCG(2026, 12))
	const want, spellings = 2000, 6
	estimated, radicals, cyclic, refused, failed, answers := 0, 0, 0, 0, 0, 0
	for tries := 0; estimated < want && tries < 40*want; tries++ {
		smi := spellStructure(r)
		m, err := molecule.ParseSMILES(smi)
		if err != nil {
			continue
		}
		ref, refLoose := outcome(m)
		ok := !strings.HasPrefix(ref, "missing group") && !strings.HasPrefix(ref, "unsupported") && !strings.HasPrefix(ref, "error")
		if ok {
			estimated++
			if m.UnpairedElectrons() > 0 {
				radicals++
			}
			if len(m.Rings()) > 0 {
				cyclic++
			}
		} else {
			refused++
		}
		for range spellings {
			sp := respell(m, r)
			mm, err := molecule.ParseSMILES(sp)
			require.NoError(t, err, "%s respelled as %s", smi, sp)
			require.Equal(t, m.Canonical(), mm.Canonical(), "%s respelled as %s is another structure", smi, sp)
			if got, loose := outcome(mm); got != ref {
				failed++
				if loose != refLoose {
					answers++ // a different answer, not only term order or last bits
				}
				if failed <= 10 || loose != refLoose && answers <= 10 {
					t.Errorf("%s and its spelling %s differ:\n%s\nvs\n%s", smi, sp, ref, got)
				}
				break
			}
		}
	}
	// respellFixed checks a fixed structure and 3×spellings respellings of
	// it: one outcome, an estimate (refused false) or a refusal (true).
	respellFixed := func(smi string, refused bool) {
		m, err := molecule.ParseSMILES(smi)
		require.NoError(t, err, smi)
		ref, _ := outcome(m)
		isRefusal := strings.HasPrefix(ref, "missing group") || strings.HasPrefix(ref, "unsupported")
		differ := "differ"
		if refused {
			require.True(t, isRefusal, "%s: %s", smi, ref)
			differ = "are refused differently"
		} else {
			require.False(t, isRefusal, "%s: %s", smi, ref)
		}
		for range 3 * spellings {
			sp := respell(m, r)
			mm, err := molecule.ParseSMILES(sp)
			require.NoError(t, err, "%s respelled as %s", smi, sp)
			if got, _ := outcome(mm); got != ref {
				failed++
				t.Errorf("%s and its spelling %s %s:\n%s\nvs\n%s", smi, sp, differ, ref, got)
				break
			}
		}
	}
	// Polycyclics, cages and aromatics the generator rarely makes, and the
	// radicals whose site type once depended on the spelling.
	for _, smi := range spellingFixed {
		respellFixed(smi, false)
		estimated++
	}
	// Refusals name the same reason whatever the spelling.
	for _, smi := range spellingRefused {
		respellFixed(smi, true)
		refused++
	}
	t.Logf("%d structures estimated (%d radicals, %d cyclic), %d refused, each from %d spellings; %d with differing results, %d of them beyond term order and rounding",
		estimated, radicals, cyclic, refused, 1+spellings, failed, answers)
	require.GreaterOrEqual(t, estimated, want)
	require.GreaterOrEqual(t, radicals, want/4, "the corpus must hold many radicals")
	require.GreaterOrEqual(t, cyclic, want/10, "the corpus must hold ring structures")
	require.Zero(t, failed, "structures whose estimate depends on the spelling")
}

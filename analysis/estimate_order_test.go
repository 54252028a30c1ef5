package analysis

import (
	"fmt"
	"math/rand/v2"
	"os"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/molecule"
)

// An estimate depends only on the structure: spellings of one molecule give
// identical numbers whichever spelling the workspace meets first.
func TestEstimateSpellingAndOrderIndependent(t *testing.T) {
	groups := [][]string{
		{"C1CC2CCC1CC2", "C12CCC(CC1)CC2"},
		{"C1C2CC3CC1CC(C2)C3", "C12CC3CC(CC(C3)C1)C2", "C1C(C2)CC3CC1CC2C3"},
		{"C12C3C4C1C5C2C3C45", "C1(C2C3C14)C5C2C3C45"},
		{"C1CC2CCC1C2", "C12CCC(CC1)C2", "C1C2CCC1CC2"},
		{"C1=CC2CCC1C2", "C12C=CC(CC1)C2"},
		{"CC(C)(C)C", "C(C)(C)(C)C"},
		{"C[CH]C", "[CH](C)C"},
	}
	for _, g := range groups {
		var ref [2]float64
		for order := 0; order < 2; order++ {
			ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no includes") }, DefaultSettings())
			smis := g
			if order == 1 {
				smis = make([]string, len(g))
				for i := range g {
					smis[i] = g[len(g)-1-i]
				}
			}
			for _, s := range smis {
				m, err := molecule.ParseSMILES(s)
				require.NoError(t, err)
				e, err := ws.EstimateMolecule(m, EstimateOptions{})
				require.NoError(t, err, s)
				if ref == [2]float64{} {
					ref = [2]float64{e.Hf298, e.S298}
					continue
				}
				require.InDelta(t, ref[0], e.Hf298, 1e-6, "%s (order %d)", s, order)
				require.InDelta(t, ref[1], e.S298, 1e-9, "%s (order %d)", s, order)
			}
		}
	}
}

// randomSpelling writes m as a valid SMILES with a random start atom,
// random branch order and bracket atoms throughout (so the reader adds no
// hydrogens): another spelling of the same structure. Stereo is not written.
func randomSpelling(m *molecule.Molecule, r *rand.Rand) string {
	n := len(m.Atoms)
	visited := make([]bool, n)
	order := make([]int, 0, n)
	parentBond := make([]int, n)
	children := make([][]int, n) // bond indices to tree children
	var closures []int           // ring-closure bond indices
	seenBond := make([]bool, len(m.Bonds))
	var dfs func(a int)
	dfs = func(a int) {
		visited[a] = true
		order = append(order, a)
		adj := slices.Clone(m.Adj[a])
		r.Shuffle(len(adj), func(i, j int) { adj[i], adj[j] = adj[j], adj[i] })
		for _, b := range adj {
			if seenBond[b] {
				continue
			}
			seenBond[b] = true
			o := m.Other(b, a)
			if visited[o] {
				closures = append(closures, b)
				continue
			}
			parentBond[o] = b
			children[a] = append(children[a], b)
			dfs(o)
		}
	}
	var b strings.Builder
	start := r.IntN(n)
	roots := append([]int{start}, r.Perm(n)...)
	digits := map[int]int{} // closure bond → digit
	pos := map[int]int{}
	bondSym := func(bi int) string {
		bd := m.Bonds[bi]
		switch {
		case bd.Aromatic:
			return ""
		case bd.Order == 2:
			return "="
		case bd.Order == 3:
			return "#"
		case m.Atoms[bd.A].Aromatic && m.Atoms[bd.B].Aromatic:
			return "-"
		}
		return ""
	}
	atomText := func(a int) string {
		at := m.Atoms[a]
		sym := at.Element
		if at.Aromatic {
			sym = strings.ToLower(sym)
		}
		s := "[" + sym
		if at.HCount > 0 {
			s += fmt.Sprintf("H%d", at.HCount)
		}
		if at.Charge > 0 {
			s += fmt.Sprintf("+%d", at.Charge)
		} else if at.Charge < 0 {
			s += fmt.Sprintf("-%d", -at.Charge)
		}
		return s + "]"
	}
	var write func(a int)
	write = func(a int) {
		b.WriteString(atomText(a))
		for _, cb := range closures {
			if m.Bonds[cb].A != a && m.Bonds[cb].B != a {
				continue
			}
			other := m.Other(cb, a)
			if pos[other] < pos[a] {
				fmt.Fprintf(&b, "%s%%%d", bondSym(cb), 10+digits[cb])
			} else {
				fmt.Fprintf(&b, "%%%d", 10+digits[cb])
			}
		}
		for k, cb := range children[a] {
			last := k == len(children[a])-1
			if !last {
				b.WriteByte('(')
			}
			b.WriteString(bondSym(cb))
			write(m.Other(cb, a))
			if !last {
				b.WriteByte(')')
			}
		}
	}
	first := true
	for _, root := range roots {
		if visited[root] {
			continue
		}
		before := len(order)
		closures = closures[:0]
		dfs(root)
		for i, a := range order[before:] {
			pos[a] = i
		}
		for k, cb := range closures {
			digits[cb] = k
		}
		if !first {
			b.WriteByte('.')
		}
		first = false
		write(root)
	}
	return b.String()
}

// Many random spellings of every reference molecule (and of polycyclics and
// radicals) give identical estimates, each made in a fresh workspace so that
// no cache can hide a difference.
func TestEstimateRandomSpellings(t *testing.T) {
	var smiles []string
	for _, file := range []string{"train", "heldout"} {
		data, err := os.ReadFile("../testdata/thermo/" + file + ".tsv")
		require.NoError(t, err)
		header := true
		for _, line := range strings.Split(string(data), "\n") {
			if strings.HasPrefix(line, "#") || strings.TrimSpace(line) == "" {
				continue
			}
			if header {
				header = false
				continue
			}
			smiles = append(smiles, strings.Split(line, "\t")[1])
		}
	}
	smiles = append(smiles, "C1CC2CCC1CC2", "C1C2CC3CC1CC(C2)C3", "C12C3C4C1C5C2C3C45", "C1=CC2CCC1C2",
		"C1CC2CC1C1CCCC21", "C12C3C1C4C2C34", "C1CC11CC1", "O=C1[CH]CCC1", "CC12CCC(CC1)C(C)(C)O2")
	require.GreaterOrEqual(t, len(smiles), 50)
	r := rand.New(rand.NewPCG(7, 12))
	type result struct{ hf, s, cp float64 }
	checked := 0
	for _, smi := range smiles {
		if strings.ContainsAny(smi, `/\@`) {
			continue // the random writer does not write stereo
		}
		m, err := molecule.ParseSMILES(smi)
		require.NoError(t, err, smi)
		spellings := []string{smi}
		for range 5 {
			spellings = append(spellings, randomSpelling(m, r))
		}
		var ref *result
		r.Shuffle(len(spellings), func(i, j int) { spellings[i], spellings[j] = spellings[j], spellings[i] })
		for _, sp := range spellings {
			mm, err := molecule.ParseSMILES(sp)
			require.NoError(t, err, "%s (spelling of %s)", sp, smi)
			require.Equal(t, m.Canonical(), mm.Canonical(), "%s is not a spelling of %s", sp, smi)
			// A fresh workspace per spelling: no cache can hide a difference.
			ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no includes") }, DefaultSettings())
			e, err := ws.EstimateMolecule(mm, EstimateOptions{})
			if err != nil {
				continue // refused (all spellings alike, checked below by count)
			}
			got := result{e.Hf298, e.S298, e.Cp[0]}
			if ref == nil {
				ref = &got
				checked++
				continue
			}
			require.InDelta(t, ref.hf, got.hf, 1e-6, "%s vs %s", sp, smi)
			require.InDelta(t, ref.s, got.s, 1e-9, "%s vs %s", sp, smi)
			require.InDelta(t, ref.cp, got.cp, 1e-9, "%s vs %s", sp, smi)
		}
	}
	require.GreaterOrEqual(t, checked, 50)
}

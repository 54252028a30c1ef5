package benson

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/molecule"
)

var genElements = []genElement{
	{"C", 4, 60}, {"O", 2, 20}, {"N", 3, 5}, {"S", 2, 4}, {"F", 1, 3}, {"Cl", 1, 3}, {"Si", 4, 2}, {"Li", 1, 1},
}

// randomSMILES writes a random, valence-correct structure of 1–14 heavy
// atoms: a random tree with multiple bonds, some ring closures, some radical
// centres (a bracket atom with one H too few), now and then a benzene or
// azine ring, a nitro group or a charged atom. Every atom is a bracket atom with its H count, so the
// reader adds nothing.
func randomSMILES(r *rand.Rand) string {
	s := randomTree(r, genElements, 1+r.IntN(14), false)
	s.addClosures(r, r.IntN(3))
	prefix := ""
	if r.IntN(10) == 0 && s.free[0] > 0 {
		// a benzene, pyridine or pyrimidine ring, or a charge-separated
		// nitro group, bonded to the first atom
		prefix = [...]string{"c1ccc(cc1)", "c1ccc(cc1)", "c1ccc(nc1)", "c1cnc(nc1)", "[O-][N+](=O)"}[r.IntN(5)]
		s.free[0]--
	}
	return s.write(prefix, func(i int) (int, string) {
		h := s.free[i]
		if h > 0 && r.IntN(8) == 0 {
			h-- // radical centre
		}
		charge := ""
		if r.IntN(60) == 0 {
			charge = "+"
			if h > 0 {
				h--
			}
		}
		return h, charge
	})
}

// TestAtomAccounting: over thousands of generated structures, an estimate
// either is refused (with a reason) or accounts for every heavy atom exactly
// once in its group terms, and its breakdown sums to its totals.
func TestAtomAccounting(t *testing.T) {
	r := rand.New(rand.NewPCG(12, 2026))
	const want = 6000
	parsed, estimated, refused := 0, 0, 0
	reasons := map[string]int{}
	for tries := 0; parsed < want && tries < 10*want; tries++ {
		smi := randomSMILES(r)
		m, err := molecule.ParseSMILES(smi)
		if err != nil {
			continue
		}
		parsed++
		e, err := Estimate(m, Options{})
		if err != nil {
			var ue *UnsupportedError
			var mg *MissingGroupError
			if !errors.As(err, &ue) && !errors.As(err, &mg) {
				t.Errorf("%s: refusal of unexpected type %T: %v", smi, err, err)
			}
			require.NotEmpty(t, err.Error())
			refused++
			msg := "other: " + err.Error()
			switch {
			case ue != nil:
				msg, _, _ = strings.Cut(ue.Reason, ";")
				if _, after, ok := strings.Cut(msg, "): "); ok {
					msg = after
				}
				if i := strings.Index(msg, "(") - 1; i > 0 {
					msg = msg[:i]
				}
			case mg != nil:
				msg = "missing group " + centreOf(mg.Group)
			}
			reasons[msg]++
			continue
		}
		estimated++
		heavy := len(m.Atoms) // every graph atom (explicit isotopic H included)
		seen := map[int]int{}
		for _, g := range e.Groups {
			for _, a := range g.Atoms {
				seen[a]++
			}
			if g.Count < 1 || g.Count > len(g.Atoms) {
				t.Errorf("%s: group %s counts %d for %d atoms", smi, g.Name, g.Count, len(g.Atoms))
			}
		}
		if len(seen) != heavy {
			t.Errorf("%s: %d heavy atoms, groups account for %d: %+v", smi, heavy, len(seen), e.Groups)
		}
		for a, n := range seen {
			if n != 1 {
				t.Errorf("%s: atom %d in %d groups", smi, a+1, n)
			}
		}
		var h, s float64
		var cp [7]float64
		for _, ts := range [][]Term{e.Groups, e.Corrections} {
			for _, x := range ts {
				h += x.Hf298
				s += x.S298
				for i := range cp {
					cp[i] += x.Cp[i]
				}
			}
		}
		require.InDelta(t, e.Hf298, h, 1e-6, smi)
		require.InDelta(t, e.S298, s, 1e-9, smi)
		for i := range cp {
			require.InDelta(t, e.Cp[i], cp[i], 1e-9, smi)
		}
		require.False(t, math.IsNaN(e.Hf298) || math.IsNaN(e.S298), smi)
	}
	t.Logf("%d structures read, %d estimated, %d refused", parsed, estimated, refused)
	for k, v := range reasons {
		if v > 20 {
			t.Logf("  %5d refused: %s", v, k)
		}
	}
	require.GreaterOrEqual(t, parsed, 5000)
	require.Greater(t, estimated, 1000, "the generator must exercise estimates, not only refusals")
}

package analysis

import (
	"fmt"
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

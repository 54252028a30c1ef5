package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestDuplicateStructures: two names with one structure are reported however
// the structure is spelled; isomers, stereoisomers and spin states are not.
func TestDuplicateStructures(t *testing.T) {
	cases := []struct {
		a, b string
		dup  bool
	}{
		{"CCO", "OCC", true},
		{"C(C)(C)C", "CC(C)C", true},
		{"C1=CC=CC=C1", "c1ccccc1", true},
		{"Cc1ccccc1", "c1ccc(C)cc1", true},
		{"C1CCCCC1", "C1CCCC1C", false},       // cyclohexane vs methylcyclopentane
		{"C/C=C\\C", "C/C=C/C", false},        // cis vs trans 2-butene
		{"CCC[CH2]", "CC[CH]C", false},        // 1- vs 2-butyl
		{"OCC=O", "COC=O", false},             // same formula and degrees
		{"C1CC2CCC1C2", "C1CCC2CC2C1", false}, // norbornane vs bicyclo[4.1.0]heptane
	}
	for _, c := range cases {
		res := analyseText(t, "species a "+c.a+"\nspecies b "+c.b+"\n")
		got := false
		for _, d := range res.Diagnostics {
			if d.Code == "duplicate-species" {
				got = true
			}
		}
		assert.Equal(t, c.dup, got, "%s vs %s", c.a, c.b)
	}
}

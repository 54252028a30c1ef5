package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/reflib"
)

// The halomethane carbon groups of groups_sx.tsv are each derived from one
// reference-library molecule: estimating that molecule from its group must
// give the library's ΔHf°298, S°298 and Cp (to the table's rounding,
// 0.01 kcal/mol and 0.01 cal/(mol K)). A library entry changed without its
// group (or the reverse) fails here.
func TestHalomethaneGroupsMatchLibrary(t *testing.T) {
	lib := reflib.New()
	for _, smi := range []string{"ClC(Cl)Cl", "FC(F)F", "ClCCl", "FCF", "CBr"} {
		m, err := molecule.ParseSMILES(smi)
		require.NoError(t, err)
		sp, ok := lib.Lookup(m, 0)
		require.True(t, ok, smi)
		e, err := Estimate(m, Options{})
		require.NoError(t, err, smi)
		assert.Empty(t, e.Missing, smi)
		assert.InDelta(t, sp.Hf298/calorie/1000, e.Hf298/calorie/1000, 0.01, "%s ΔHf°298", smi)
		assert.InDelta(t, sp.S298/calorie, e.S298/calorie, 0.01, "%s S°298", smi)
		for k, T := range StdTemps {
			assert.InDelta(t, sp.Poly.Cp(T)/calorie, e.Cp[k]/calorie, 0.01, "%s Cp(%g K)", smi, T)
		}
	}
}

// The haloalkyl radicals whose parents are halomethanes are estimated from
// those parents with the halomethane C–H increments (hbi_nsx.tsv): ΔHf°298
// is the parent's plus D(R–H) − ΔHf°(H), exactly.
func TestHaloalkylRadicalsFromParents(t *testing.T) {
	for _, c := range []struct {
		radical, parent string
		bde             float64 // kcal/mol, hbi_nsx.tsv
	}{
		{"[C](Cl)(Cl)Cl", "ClC(Cl)Cl", 95.7},
		{"[C](F)(F)F", "FC(F)F", 106.7},
		{"[CH](Cl)Cl", "ClCCl", 97.3},
		{"[CH](F)F", "FCF", 103.2},
	} {
		r := heteroEstimate(t, c.radical)
		p := heteroEstimate(t, c.parent)
		assert.InDelta(t, p.Hf298/calorie/1000+c.bde-52.10, r.Hf298/calorie/1000, 0.01, c.radical)
	}
}

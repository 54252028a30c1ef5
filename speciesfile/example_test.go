package speciesfile

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestFurnaceExample: the demo mechanism parses cleanly and uses the features
// it is meant to show.
func TestFurnaceExample(t *testing.T) {
	f := parseFile(t, "../examples/furnace.kiln")
	require.Empty(t, f.Diags, "the demo must parse without any diagnostic")
	assertLossless(t, f)
	assert.GreaterOrEqual(t, len(f.Species), 15)
	assert.LessOrEqual(t, len(f.Species), 30)
	assert.GreaterOrEqual(t, len(f.Reactions), 15)
	assert.LessOrEqual(t, len(f.Reactions), 30)
	require.Len(t, f.Groups, 1)

	declared := map[string]bool{}
	var nasa, table, troe, lindemann, third, ptable, dup, rev int
	for _, s := range f.Species {
		declared[s.Name.Text] = true
		if s.NASA7 != nil {
			nasa++
		}
		if s.Table != nil {
			table++
		}
	}
	for _, r := range f.Reactions {
		for _, tm := range append(append([]Term{}, r.Reactants...), r.Products...) {
			assert.True(t, declared[tm.Name.Text], "species %s is declared", tm.Name.Text)
		}
		for _, e := range r.Efficiencies {
			assert.True(t, declared[e.Name.Text], "collider %s is declared", e.Name.Text)
		}
		switch {
		case r.Troe != nil:
			troe++
		case r.LowPressure != nil:
			lindemann++
		}
		if r.ThirdBody && len(r.Efficiencies) > 0 {
			third++
		}
		if len(r.Pressures) > 0 {
			ptable++
		}
		if r.Duplicate != nil {
			dup++
		}
		if r.Reverse != nil {
			rev++
		}
		// Demo rates must stay under the collision limit: for bimolecular
		// steps (two reactant molecules, M not counted) A*T^n < 1e14
		// cm3/mol/s at 300 and 2500 K (T^n is monotonic, so the ends suffice).
		molecules := 0.0
		for _, tm := range r.Reactants {
			molecules += tm.Coeff
		}
		if molecules == 2 && r.Rate != nil && !r.ThirdBody {
			for _, T := range []float64{300, 2500} {
				k := r.Rate.A.SI * math.Pow(T, r.Rate.N.SI)
				eq := f.Abs(r, r.Equation)
				assert.Less(t, k, 1e14, "%s at %g K", f.Src[eq.Start:eq.End], T)
			}
		}
	}
	assert.Equal(t, 1, nasa)
	assert.Equal(t, 1, table)
	assert.GreaterOrEqual(t, troe, 1)
	assert.GreaterOrEqual(t, lindemann, 1)
	assert.GreaterOrEqual(t, third, 1)
	assert.GreaterOrEqual(t, ptable, 1)
	assert.Equal(t, 2, dup)
	assert.GreaterOrEqual(t, rev, 1)
}

package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/reflib"
)

// libraryEntry returns the reference-library entry of smi (which must have
// one).
func libraryEntry(t *testing.T, lib *reflib.Library, smi string) *reflib.Species {
	t.Helper()
	m, err := molecule.ParseSMILES(smi)
	require.NoError(t, err)
	sp, ok := lib.Lookup(m, 0)
	require.True(t, ok, "%s: no library entry", smi)
	return sp
}

// againstLibrary returns the library entry of smi and kiln's group estimate
// of the same structure (Estimate does not consult the library), after
// checking that the estimate lies within tolH kcal/mol of the entry's ΔHf°
// and within tolS and tolCp cal/(mol K) of its S° and its Cp at StdTemps.
func againstLibrary(t *testing.T, lib *reflib.Library, smi, name string, tolH, tolS, tolCp float64) (*reflib.Species, *Result) {
	t.Helper()
	sp := libraryEntry(t, lib, smi)
	e := heteroEstimate(t, smi)
	dH := (e.Hf298 - sp.Hf298) / calorie / 1000
	t.Logf("%-6s ΔHf° group %.2f, library %.2f kcal/mol (%+.2f); S° %+.2f, Cp(300) %+.2f, Cp(1000) %+.2f cal/(mol K)",
		name, e.Hf298/calorie/1000, sp.Hf298/calorie/1000, dH, (e.S298-sp.S298)/calorie,
		(e.Cp[0]-sp.Poly.Cp(300))/calorie, (e.Cp[5]-sp.Poly.Cp(1000))/calorie)
	assert.InDelta(t, 0, dH, tolH, "%s ΔHf°", name)
	assert.InDelta(t, sp.S298/calorie, e.S298/calorie, tolS, "%s S°", name)
	for k, T := range StdTemps {
		assert.InDelta(t, sp.Poly.Cp(T)/calorie, e.Cp[k]/calorie, tolCp, "%s Cp(%g K)", name, T)
	}
	return sp, e
}

package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestIsocyanide: R–N⁺≡C⁻ is estimated with NC-(C) (groups_n.tsv), which
// rests on tert-butyl isocyanide: that molecule gives back its published
// ΔHf°298 (88.1 kJ/mol, Koizumi & Baer 2004), every estimate carries the
// one-molecule and S°/Cp-analogy flags, both spellings of the unit agree,
// and an isocyanide on aryl or vinyl carbon, or in an ion, stays refused
// until a group statement supplies what it lacks.
func TestIsocyanide(t *testing.T) {
	tb, err := Estimate(parse(t, "CC(C)(C)[N+]#[C-]"), Options{})
	require.NoError(t, err)
	assert.InDelta(t, 88.1e3, tb.Hf298, 0.05*calorie*1000, "tert-butyl isocyanide ΔHf°298 J/mol")
	assert.Equal(t, 81, tb.SymmetryNumber, "C3v with three methyl rotors")
	assert.Equal(t, "nitrogen", tb.Class)

	for _, smi := range []string{"C[N+]#[C-]", "CC[N+]#[C-]", "CC(C)[N+]#[C-]"} {
		est, err := Estimate(parse(t, smi), Options{})
		require.NoError(t, err, smi)
		assert.Equal(t, 1, flagCountOf(est, "NC-(C)"), "%s: %+v", smi, est.Missing)
		assert.Equal(t, 1, flagCountOf(est, analogSCpGroup+"NC-(C)"), "%s: %+v", smi, est.Missing)
		assert.Greater(t, est.Uncertainty/(calorie*1000), widenGroup, smi)
		assert.Equal(t, 1, est.Multiplicity, smi)
	}
	a, err := Estimate(parse(t, "C[N+]#[C-]"), Options{})
	require.NoError(t, err)
	b, err := Estimate(parse(t, "[C-]#[N+]C"), Options{})
	require.NoError(t, err)
	assert.Equal(t, a.Hf298, b.Hf298)
	assert.Equal(t, a.S298, b.S298)
	assert.Equal(t, 3, a.SymmetryNumber)

	for smi, want := range map[string]string{
		"c1ccccc1[N+]#[C-]": "Cb-(NC)",
		"C=C[N+]#[C-]":      "Cd-(NC)(H)",
		"[C-]#[N+][C-]":     "net charge -1",
		"C[N+]#[C-].C":      "disconnected",
	} {
		_, err := Estimate(parse(t, smi), Options{})
		if assert.Error(t, err, smi) {
			assert.Contains(t, err.Error(), want, smi)
		}
	}

	// Supplying the two aryl groups makes phenyl isocyanide estimable, with
	// no flag for the user's NC-(Cb).
	user := []GroupValue{
		{Name: "Cb-(NC)", Hf298: 5.51 * calorie * 1000, S298: -7.69 * calorie, Source: "test"},
		{Name: "NC-(Cb)", Hf298: 55.0 * calorie * 1000, S298: 28.0 * calorie, Source: "test"},
	}
	ph, err := Estimate(parse(t, "c1ccccc1[N+]#[C-]"), Options{UserGroups: user})
	require.NoError(t, err)
	assert.Zero(t, flagCountOf(ph, "NC-(Cb)"), "%+v", ph.Missing)
	assert.InDelta(t, (5*3.30+5.51+55.0)*calorie*1000, ph.Hf298, 1, "J/mol")
}

// TestIsocyanideCarbeneHint: the carbene spelling of an isocyanide, R–N=C:,
// is refused as a carbene centre with the hint to write the charges; other
// carbenes get no such hint.
func TestIsocyanideCarbeneHint(t *testing.T) {
	_, err := Estimate(parse(t, "CN=[C]"), Options{})
	require.Error(t, err)
	assert.Contains(t, err.Error(), "R–[N+]#[C-]")
	_, err = Estimate(parse(t, "C[C]C"), Options{})
	require.Error(t, err)
	assert.NotContains(t, err.Error(), "isocyanide")
}

package analysis

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/speciesfile"
)

func analyzeText(t *testing.T, text string) *Result {
	t.Helper()
	return analyseWith(t, text, DefaultSettings())
}

func TestReverseRateUncertainty(t *testing.T) {
	res := analyzeText(t, `species H [H]
species H2 [H][H]
species propane CCC
species propyl CC[CH2]
species ethanol CCO
  thermo-table
    hf298 -56.2
    s298 67.5
    cp 300=15.7 1000=33.4
species ethoxy CC[O]
reaction propane + H <=> propyl + H2   A=1e14 n=0 Ea=9
reaction propane + H => propyl + H2   A=1e14 n=0 Ea=9
  duplicate
reaction ethanol + H <=> ethoxy + H2   A=1e13 n=0 Ea=8
reaction propyl + propane <=> propane + propyl   A=1e11 n=0 Ea=10
reaction ethoxy + H2 <=> ethanol + H   A=1e12 n=0 Ea=10
  reverse A=1e13 n=0 Ea=8
`)
	require.Len(t, res.Reactions, 5)
	sig := func(name string) float64 { return res.ByName[name].Estimate.Uncertainty }
	require.Positive(t, sig("propane"))
	require.Positive(t, sig("propyl"))

	// Two estimated species (H and H2 come from the reference library).
	u, ok := res.ReverseRateUncertainty(res.Reactions[0], 1000)
	require.True(t, ok)
	want := math.Hypot(sig("propane"), sig("propyl"))
	assert.InDelta(t, want, u.Sigma, 1e-9)
	assert.InDelta(t, math.Exp(want/(kinetics.R*1000)), u.Factor, 1e-12)
	assert.Equal(t, []string{"propane", "propyl"}, u.Estimated)

	_, ok = res.ReverseRateUncertainty(res.Reactions[1], 1000)
	assert.False(t, ok, "irreversible: no reverse rate")

	// Ethanol's thermo comes from the file: only ethoxy's estimate counts.
	u, ok = res.ReverseRateUncertainty(res.Reactions[2], 1000)
	require.True(t, ok)
	assert.InDelta(t, sig("ethoxy"), u.Sigma, 1e-9)
	assert.Equal(t, []string{"ethoxy"}, u.Estimated)
	assert.Equal(t, []string{"ethanol"}, u.Given, "a table states no uncertainty")

	// A species on both sides cancels.
	u, ok = res.ReverseRateUncertainty(res.Reactions[3], 1000)
	require.True(t, ok)
	assert.Zero(t, u.Sigma)
	assert.Equal(t, 1.0, u.Factor)

	_, ok = res.ReverseRateUncertainty(res.Reactions[4], 1000)
	assert.False(t, ok, "an explicit reverse rate does not come from thermo")
}

// TestReverseUncertaintyAfterFill: `kiln fill` writes each estimate's
// numbers into a nasa7 block, which states no uncertainty. The blocks still
// hold the estimates' ΔHf°298 and S°298, so the reverse-rate uncertainty is
// the same after fill as before (it was 1, "exact", when file blocks all
// counted as exact). A block whose numbers were changed by hand is no longer
// the estimate: its uncertainty is unknown and it is listed in Given.
func TestReverseUncertaintyAfterFill(t *testing.T) {
	src := `species H [H]
species H2 [H][H]
species propane CCC
species propyl CC[CH2]
reaction propane + H <=> propyl + H2   A=1e14 n=0 Ea=9
`
	before := analyzeText(t, src)
	ub, ok := before.ReverseRateUncertainty(before.Reactions[0], 1000)
	require.True(t, ok)
	require.Greater(t, ub.Factor, 1.1)
	assert.Empty(t, ub.Given)

	edits, skips := before.FillPlan()
	require.Empty(t, skips)
	require.Len(t, edits, 4)
	filled, err := ApplyEdits([]byte(src), edits)
	require.NoError(t, err)
	after := analyzeText(t, string(filled))
	for _, n := range []string{"H", "H2", "propane", "propyl"} {
		require.Equal(t, SourceFile, after.ByName[n].Source, n)
	}
	ua, ok := after.ReverseRateUncertainty(after.Reactions[0], 1000)
	require.True(t, ok)
	assert.Equal(t, ub.Estimated, ua.Estimated)
	assert.InDelta(t, ub.Sigma, ua.Sigma, 1e-9)
	assert.InDelta(t, ub.Factor, ua.Factor, 1e-12)
	assert.Empty(t, ua.Given)

	// Change propyl's a6 (ΔHf°298 moves by about 0.8 kJ/mol): its block is
	// no longer the estimate. Only propane's estimate is left in the factor.
	text := string(filled)
	i := strings.Index(text, "species propyl")
	require.Positive(t, i)
	j := i + strings.Index(text[i:], "low ")
	fields := strings.Fields(text[j : j+strings.IndexByte(text[j:], '\n')])
	a6, err := strconv.ParseFloat(fields[6], 64)
	require.NoError(t, err)
	edited := text[:j] + strings.Replace(text[j:], fields[6], strconv.FormatFloat(a6+100, 'e', 10, 64), 1)
	res := analyzeText(t, edited)
	ue, ok := res.ReverseRateUncertainty(res.Reactions[0], 1000)
	require.True(t, ok)
	assert.Equal(t, []string{"propane"}, ue.Estimated)
	assert.Equal(t, []string{"propyl"}, ue.Given)
	assert.Less(t, ue.Factor, ua.Factor)
}

// TestReverseUncertaintyStatedByLibrary: reference-library data count as
// exact, except an entry whose source states a large uncertainty of its
// ΔHf°298 (thionyl fluoride, ± 50 kJ/mol in Gurvich 1989), read as a 95 %
// bound: its half enters the reverse-rate factor as an estimate's 1σ does.
func TestReverseUncertaintyStatedByLibrary(t *testing.T) {
	text := `species SOF2 O=S(F)F
species SF2 FSF
species O [O]
  multiplicity 3
species H [H]
species H2 [H][H]
reaction SF2 + O <=> SOF2   A=1e13 n=0 Ea=0
reaction H + H <=> H2   A=1e13 n=0 Ea=0
`
	res := analyzeText(t, text)
	require.Len(t, res.Reactions, 2)
	unc := func(name string) float64 { return res.ByName[name].Estimate.Uncertainty }
	// the stated ± read as a 95 % bound: 1σ is half of it
	assert.Equal(t, 25000.0, unc("SOF2"))
	assert.Equal(t, 50000.0, res.ByName["SOF2"].Estimate.StatedUncertainty)
	assert.Equal(t, 5000.0, unc("SF2"))
	assert.Zero(t, unc("O"), "NIST-JANAF O atom: exact")
	u, ok := res.ReverseRateUncertainty(res.Reactions[0], 1000)
	require.True(t, ok)
	assert.InDelta(t, math.Hypot(25000, 5000), u.Sigma, 1e-6)
	assert.Equal(t, []string{"SF2", "SOF2"}, u.Estimated)
	u, ok = res.ReverseRateUncertainty(res.Reactions[1], 1000)
	require.True(t, ok)
	assert.Equal(t, 1.0, u.Factor, "library data without a stated large uncertainty are exact")
}

// TestMismatchWithinStatedUncertainty: a block is compared with reference
// data by the larger of the mismatch threshold and the ± the data's source
// states, and the message names the reference library, not an estimate;
// compare widens its ΔHf° and G flags alike.
func TestMismatchWithinStatedUncertainty(t *testing.T) {
	block := func(name, smiles, extra string, hf float64) string {
		return "species " + name + " " + smiles + "\n" + extra + "  thermo-table\n    hf298 " + strconv.FormatFloat(hf, 'f', 2, 64) + "\n    s298 66.72\n    cp 300=13.68 1000=18.78\n"
	}
	// SOF2: library -139.81 kcal/mol, ± 50 kJ/mol (11.95 kcal/mol) stated
	within := messagesWithCode(analyzeText(t, block("SOF2", "O=S(F)F", "", -130)), speciesfile.CodeThermoMismatch)
	assert.Empty(t, within, "9.8 kcal/mol off, inside the stated ± 11.95")
	beyond := messagesWithCode(analyzeText(t, block("SOF2", "O=S(F)F", "", -125)), speciesfile.CodeThermoMismatch)
	require.Len(t, beyond, 1)
	assert.Contains(t, beyond[0], "vs reference library SOF2 -139.81 kcal/mol (difference 14.81 kcal/mol, threshold 11.95 kcal/mol: the ± its source gives)")
	// O2 states no large uncertainty: the setting's 3 kcal/mol applies
	o2 := messagesWithCode(analyzeText(t, block("O2", "O=O", "  multiplicity 3\n", 5)), speciesfile.CodeThermoMismatch)
	require.NotEmpty(t, o2)
	assert.Contains(t, o2[0], "vs reference library O2 0.00 kcal/mol (difference 5.00 kcal/mol, threshold 3.00 kcal/mol)")
}

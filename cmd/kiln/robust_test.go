package main

import (
	"encoding/json"
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Robustness against enormous numbers: a value that is not finite in SI is
// an error at its token and never data; JSON never holds Inf or NaN (null
// instead); text tables keep their width; "-0.00" never prints.

// overflowKiln holds 1e306 kJ/mol (a float64, but +Inf in J/mol).
const overflowKiln = `units kJ/mol
species X CC
  thermo-table
    hf298 1e306
    s298 229
    cp 300=52 1000=120
reaction X <=> X A=1 n=0 Ea=0
`

// nasaOverflowKiln has finite coefficients whose polynomial overflows.
const nasaOverflowKiln = `units kJ/mol
species X CC
  nasa7 300 1000 5000
    low 1e300 0 0 0 1e300 0 0
    high 1 0 0 0 0 0 0
reaction X <=> X A=1 n=0 Ea=0
`

// hugeKiln has finite, enormous values: Kp overflows, and ΔHf°298 would be
// 200 digits wide in a table.
const hugeKiln = `units kJ/mol
species A CC
  thermo-table
    hf298 1e200
    s298 229
    cp 300=52 1000=120
species B CC
  thermo-table
    hf298 -84
    s298 229
    cp 300=52 1000=120
reaction A <=> B A=1e13 n=0 Ea=0
`

// assertFiniteJSON checks that out is JSON and spells no infinity or NaN.
func assertFiniteJSON(t *testing.T, out string) {
	t.Helper()
	var v any
	require.NoError(t, json.Unmarshal([]byte(out), &v), out)
	for _, bad := range []string{"Inf", "NaN"} {
		assert.NotContains(t, out, bad)
	}
}

func TestOverflowAfterUnitConversion(t *testing.T) {
	path := writeTemp(t, "inf.kiln", overflowKiln)
	code, stdout, _ := runKiln(t, "check", path)
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stdout, `inf.kiln:4:11: error: number out of range: "1e306" overflows when converted to J/mol [syntax]`)
	assert.NotContains(t, stdout, "Inf")

	code, stdout, stderr := runKiln(t, "summary", "--json", path)
	assert.Equal(t, exitProblems, code, stderr)
	assertFiniteJSON(t, stdout)

	ref := writeTemp(t, "a.kiln", strings.Replace(overflowKiln, "1e306", "-84", 1))
	_, stdout, stderr = runKiln(t, "compare", "--json", ref, path)
	assert.NotContains(t, stderr, "unsupported value")
	assertFiniteJSON(t, stdout)
}

func TestNASAOverflowIsAnError(t *testing.T) {
	path := writeTemp(t, "n7.kiln", nasaOverflowKiln)
	code, stdout, _ := runKiln(t, "check", path)
	assert.Equal(t, exitProblems, code)
	// The error sits on the coefficient that overflows, and the block is
	// not used: no infinities in any message.
	assert.Contains(t, stdout, "n7.kiln:4:21: error: X: nasa7 low coefficient a5 = 1e300 makes Cp, H or S overflow")
	assert.Contains(t, stdout, "[nonphysical-thermo]")
	assert.Contains(t, stdout, "X: its thermo block has a value that overflows and is ignored")
	assert.NotContains(t, stdout, "Inf")
	assert.NotContains(t, stdout, "NaN")

	_, stdout, _ = runKiln(t, "summary", path)
	assert.NotContains(t, stdout, "NaN")
	assert.NotContains(t, stdout, "Inf")
	_, stdout, _ = runKiln(t, "summary", "--json", path)
	assertFiniteJSON(t, stdout)

	ref := writeTemp(t, "a.kiln", strings.Replace(overflowKiln, "1e306", "-84", 1))
	_, stdout, stderr := runKiln(t, "compare", "--json", ref, path)
	assert.NotContains(t, stderr, "unsupported value")
	assertFiniteJSON(t, stdout)
}

func TestHugeFiniteValues(t *testing.T) {
	path := writeTemp(t, "huge.kiln", hugeKiln)
	code, stdout, stderr := runKiln(t, "summary", "--json", path)
	require.Equal(t, exitOK, code, stderr)
	assertFiniteJSON(t, stdout)
	var s summaryJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &s))
	require.Len(t, s.Reactions, 1)
	// exp(ΔG/RT) for ΔG ≈ 1e203 J/mol is not a float64: null, as the
	// JSON conventions say.
	assert.Nil(t, s.Reactions[0].Keq["298"])

	code, stdout, stderr = runKiln(t, "summary", path)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stdout, "1.0e+200", "kJ/mol with check's digits")
	for _, line := range strings.Split(stdout, "\n") {
		assert.LessOrEqual(t, utf8.RuneCountInString(line), maxTableWidth, line)
	}
	_, stdout, _ = runKiln(t, "check", path)
	assert.Contains(t, stdout, "ΔHf°298 given 1.0e+200 kJ/mol")
}

// TestNoNegativeZero: a difference that rounds to zero prints without a
// sign in every table.
func TestNoNegativeZero(t *testing.T) {
	a := writeTemp(t, "a.kiln", "units kJ/mol\nspecies X CC\n  thermo-table\n    hf298 -84\n    s298 229\n    cp 300=52 1000=120\n")
	b := writeTemp(t, "b.kiln", "units kJ/mol\nspecies X CC\n  thermo-table\n    hf298 -84.001\n    s298 228.999\n    cp 300=52 1000=120\n")
	_, stdout, _ := runKiln(t, "compare", "--all", a, b)
	assert.Contains(t, stdout, "0.00")
	assert.NotContains(t, stdout, "-0.00")
	c := writeTemp(t, "c.kiln", "units kJ/mol\nspecies X CC\n  thermo-table\n    hf298 -0.001\n    s298 229\n    cp 300=52 1000=120\n")
	_, stdout, _ = runKiln(t, "summary", c)
	assert.Contains(t, stdout, " 0.0 ", "kJ/mol with one decimal, as check writes it")
	assert.NotContains(t, stdout, "-0.0")
}

// TestClearRefusals: an unsupported element is named as such with the way
// to give thermo; a hypervalent atom is named with its bonds; the `?`
// placeholder is a structure still to be written, at its position.
func TestClearRefusals(t *testing.T) {
	path := writeTemp(t, "m.kiln", "species Si [Si]\nspecies X N#N=O\nspecies Y ?\n")
	_, stdout, _ := runKiln(t, "check", path)
	assert.Contains(t, stdout, "m.kiln:1:9: error: Si has no thermo block and kiln cannot estimate it: atom 1 (Si): unsupported element Si")
	assert.Contains(t, stdout, "; add a nasa7 or thermo-table block [missing-thermo]")
	assert.NotContains(t, stdout, "carbene")
	assert.Contains(t, stdout, "m.kiln:2:9: error: X has no thermo block and kiln cannot estimate it: atom 2 (N) exceeds its valence: 5 bonds (triple bond to atom 1 (N), double bond to atom 3 (O))")
	assert.Contains(t, stdout, "m.kiln:3:11: error: Y: structure not given yet: replace ? with the species' SMILES")
	assert.NotContains(t, stdout, "invalid character")

	_, stdout, _ = runKiln(t, "estimate", "[Si]")
	assert.Contains(t, stdout, "unsupported element Si")
	assert.Contains(t, stdout, "nasa7 or thermo-table block")
	_, _, stderr := runKiln(t, "fill", "--dry-run", path)
	assert.Contains(t, stderr, "skipped Y: structure not given yet")
}

// TestMixSeparators: --mix takes blanks as well as commas between items,
// and a malformed item is shown with the expected form.
func TestMixSeparators(t *testing.T) {
	path := writeTemp(t, "mix.kiln", "species CH4 C\nspecies O2 O=O\nspecies H2O O\nspecies CO2 O=C=O\n")
	code, spaced, stderr := runKiln(t, "equilibrium", path, "--mix", "CH4:1 O2:2", "--temperature", "1500")
	require.Equal(t, exitOK, code, stderr)
	code, commas, stderr := runKiln(t, "equilibrium", path, "--mix", "CH4:1, O2:2", "--temperature", "1500")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, commas, spaced)
	code, _, stderr = runKiln(t, "equilibrium", path, "--mix", "CH4=1 O2=2")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, `--mix item 1 (column 1) "CH4=1" must be NAME:AMOUNT (items separated by commas or blanks, e.g. "CH4:1, O2:2, N2:7.52")`)
}

// TestCountWording: a count of one takes the singular.
func TestCountWording(t *testing.T) {
	a := writeTemp(t, "a.kiln", "species H [H]\nspecies H2 [H][H]\nreaction H + H <=> H2 A=1e13 n=0 Ea=0\n")
	_, stdout, _ := runKiln(t, "compare", a, a)
	assert.Contains(t, stdout, "(2 species, 1 reaction)")
	_, stdout, _ = runKiln(t, "estimate", "--multiplicity", "4", "C[CH2]")
	assert.Contains(t, stdout, "(1 unpaired electron: multiplicity 2)")
}

// TestRateOverflowWording: a rate constant that overflows is refused in
// words, not as "+Inf".
func TestRateOverflowWording(t *testing.T) {
	path := writeTemp(t, "r.kiln", "species H [H]\nspecies H2 [H][H]\nreaction H + H <=> H2 A=1e300 n=30 Ea=0\n")
	_, stdout, _ := runKiln(t, "check", path)
	assert.Contains(t, stdout, "r.kiln:3:23: error: the forward rate constant is too large for a 64-bit float (it overflows) at 300 K")
	assert.NotContains(t, stdout, "Inf")
	_, stdout, _ = runKiln(t, "summary", "--json", path)
	assertFiniteJSON(t, stdout)
}

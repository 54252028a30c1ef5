package main

import (
	"encoding/json"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestSummaryReverseFactor: each reversible reaction whose k_r comes from
// thermo shows the factor exp(σ(ΔG°r)/RT) at 1000 K from the estimates'
// uncertainties; --uncertain puts the largest first.
func TestSummaryReverseFactor(t *testing.T) {
	f := writeTemp(t, "u.kiln", `species H [H]
species H2 [H][H]
species OH [OH]
species H2O O
species propane CCC
species propyl CC[CH2]
species ethanol CCO
  thermo-table
    hf298 -56.2
    s298 67.5
    cp 300=15.7 1000=33.4
species ethoxy CC[O]
reaction H2 + OH <=> H2O + H   A=2.2e8 n=1.5 Ea=3.4
reaction ethanol + H <=> ethoxy + H2   A=1e13 n=0 Ea=8
reaction propane + H <=> propyl + H2   A=1e14 n=0 Ea=9
reaction propyl + H => propane   A=1e13 n=0 Ea=0
`)
	code, stdout, stderr := runKiln(t, "summary", "--json", "--uncertain", f)
	require.Equal(t, exitOK, code, stderr)
	var s struct {
		Reactions []summaryReaction `json:"reactions"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &s))
	var order []string
	factors := map[string]*float64{}
	for _, r := range s.Reactions {
		order = append(order, strings.Fields(r.Equation)[0])
		factors[strings.Fields(r.Equation)[0]] = reverseFactor(r)
	}
	// propane/propyl: alkane and radical class errors; ethoxy: one radical;
	// H2/OH/H2O/H: reference library (exact); propyl + H =>: irreversible.
	assert.Equal(t, []string{"propane", "ethanol", "H2", "propyl"}, order)
	require.NotNil(t, factors["H2"])
	assert.Equal(t, 1.0, *factors["H2"])
	assert.Nil(t, factors["propyl"])
	// Only ethoxy's estimate counts: exp(σ/(R·1000 K)) with σ the
	// uncertainty `kiln estimate` reports for it.
	code, est, _ := runKiln(t, "estimate", "--json", "CC[O]")
	require.Equal(t, exitOK, code)
	var e []map[string]any
	require.NoError(t, json.Unmarshal([]byte(est), &e))
	sigma := e[0]["uncertainty_hf298_kj_mol"].(float64) * 1000
	require.Positive(t, sigma)
	assert.InDelta(t, math.Exp(sigma/(8.314462618*1000)), *factors["ethanol"], 1e-9)
	assert.Greater(t, *factors["propane"], *factors["ethanol"])

	code, stdout, _ = runKiln(t, "summary", f)
	require.Equal(t, exitOK, code)
	assert.Contains(t, stdout, "k_r ×/÷")
}

// TestSummaryReverseFactorGiven: a file's own thermo blocks state no
// uncertainty. After `kiln fill`, whose blocks hold the estimates' numbers,
// summary shows the same k_r factor as before; a reaction whose species all
// have hand-made blocks shows "given" (not 1.00), and one that mixes them
// with estimates shows its factor as a lower bound; JSON lists the given
// species and keeps the factor's key.
func TestSummaryReverseFactorGiven(t *testing.T) {
	src := `species H [H]
species H2 [H][H]
species propane CCC
species propyl CC[CH2]
reaction propane + H <=> propyl + H2   A=1e14 n=0 Ea=9
`
	factorText := func(out, eq string) string {
		for _, line := range strings.Split(out, "\n") {
			if strings.Contains(line, eq) && strings.Contains(line, "cm³") {
				f := strings.Fields(line)
				return f[len(f)-1]
			}
		}
		t.Fatalf("no rate row for %q in\n%s", eq, out)
		return ""
	}
	f := writeTemp(t, "f.kiln", src)
	_, before, _ := runKiln(t, "summary", f)
	code, _, stderr := runKiln(t, "fill", f)
	require.Equal(t, exitOK, code, stderr)
	_, after, _ := runKiln(t, "summary", f)
	fb := factorText(before, "propane + H <=> propyl + H2")
	assert.NotEqual(t, "1.00", fb)
	assert.Equal(t, fb, factorText(after, "propane + H <=> propyl + H2"), "fill must not change the factor")

	g := writeTemp(t, "g.kiln", `species H [H]
species H2 [H][H]
species ethanol CCO
  thermo-table
    hf298 -56.2
    s298 67.5
    cp 300=15.7 1000=33.4
species ethoxy CC[O]
  thermo-table
    hf298 -3.9
    s298 65.6
    cp 300=16.0 1000=30.0
species propane CCC
species propyl CC[CH2]
reaction ethanol + H <=> ethoxy + H2   A=1e13 n=0 Ea=8
reaction ethanol + propyl <=> ethoxy + propane   A=1e11 n=0 Ea=8
`)
	code, out, stderr := runKiln(t, "summary", g)
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, "given", factorText(out, "ethanol + H <=> ethoxy + H2"))
	assert.True(t, strings.HasPrefix(factorText(out, "ethanol + propyl <=> ethoxy + propane"), "≥"))

	_, js, _ := runKiln(t, "summary", "--json", g)
	var s struct {
		Reactions []summaryReaction `json:"reactions"`
	}
	require.NoError(t, json.Unmarshal([]byte(js), &s))
	require.Len(t, s.Reactions, 2)
	assert.Equal(t, []string{"ethanol", "ethoxy"}, s.Reactions[0].ReverseGiven)
	assert.True(t, s.Reactions[0].ReverseLowerBound)
	require.NotNil(t, reverseFactor(s.Reactions[0]))
	assert.Equal(t, 1.0, *reverseFactor(s.Reactions[0]))
	assert.Greater(t, *reverseFactor(s.Reactions[1]), 1.0)
}

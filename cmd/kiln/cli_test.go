package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func keysOf(m map[string]any) []string {
	var out []string
	for k := range m {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}

// TestEstimateJSONContract checks the exact keys and units of
// `kiln estimate --json`, one object per input, even for one input.
func TestEstimateJSONContract(t *testing.T) {
	code, stdout, stderr := runKiln(t, "estimate", "--json", "CCO")
	require.Equal(t, exitOK, code, stderr)
	var arr []map[string]any
	require.NoError(t, json.Unmarshal([]byte(stdout), &arr))
	require.Len(t, arr, 1)
	o := arr[0]
	assert.Equal(t, []string{"corrections", "cp_j_mol_k", "error", "formula", "groups", "hf298_kj_mol", "input", "missing_groups",
		"molar_mass_g_mol", "multiplicity", "optical_isomers", "s298_j_mol_k", "symmetry_number", "uncertainty_hf298_kj_mol"}, keysOf(o))
	assert.Equal(t, "C2H6O", o["formula"])
	assert.EqualValues(t, 1, o["multiplicity"]) // extension: the contract's keys are all there
	assert.Nil(t, o["error"])
	// Ethanol, ΔHf°298(g) = −234.8 kJ/mol (NIST-JANAF / Pedley 1994, from
	// memory); group additivity within 4 kJ/mol (~1 kcal/mol).
	assert.InDelta(t, -234.8, o["hf298_kj_mol"].(float64), 4)
	assert.InDelta(t, 46.069, o["molar_mass_g_mol"].(float64), 0.01)
	cp := o["cp_j_mol_k"].(map[string]any)
	assert.Equal(t, []string{"1000", "1500", "300", "400", "500", "600", "800"}, keysOf(cp))

	// The breakdown sums to the totals.
	sumH, sumS := 0.0, 0.0
	for _, k := range []string{"groups", "corrections"} {
		for _, g := range o[k].([]any) {
			sumH += g.(map[string]any)["hf298_kj_mol"].(float64)
			sumS += g.(map[string]any)["s298_j_mol_k"].(float64)
		}
	}
	assert.InDelta(t, o["hf298_kj_mol"].(float64), sumH, 1e-9)
	assert.InDelta(t, o["s298_j_mol_k"].(float64), sumS, 1e-9)
	g0 := o["groups"].([]any)[0].(map[string]any)
	assert.Equal(t, []string{"count", "hf298_kj_mol", "name", "s298_j_mol_k", "source"}, keysOf(g0))
}

// TestEstimateLibraryJSON: a reference-library species is reported as
// tabulated data: no group uncertainty (null, not a promise of ± 0), the
// entry named, and σ and n of its structure (O2: D∞h, σ = 2).
func TestEstimateLibraryJSON(t *testing.T) {
	code, stdout, stderr := runKiln(t, "estimate", "--json", "O=O", "CCO")
	require.Equal(t, exitOK, code, stderr)
	var arr []map[string]any
	require.NoError(t, json.Unmarshal([]byte(stdout), &arr))
	require.Len(t, arr, 2)
	o2, eth := arr[0], arr[1]
	assert.Nil(t, o2["uncertainty_hf298_kj_mol"])
	assert.Equal(t, "O2", o2["reference_library"])
	assert.EqualValues(t, 2, o2["symmetry_number"])
	assert.EqualValues(t, 1, o2["optical_isomers"])
	assert.NotContains(t, eth, "reference_library")
	assert.Greater(t, eth["uncertainty_hf298_kj_mol"].(float64), 0.0)

	// A delocalised radical's Lewis structure does not give its σ (NO2 is
	// C2v, σ 2, whatever Lewis structure is written): null. Both spellings
	// of HNO3 give one σ.
	code, stdout, stderr = runKiln(t, "estimate", "--json", "[O]N=O", "O=[N+]([O-])O", "ON(=O)=O")
	require.Equal(t, exitOK, code, stderr)
	arr = nil
	require.NoError(t, json.Unmarshal([]byte(stdout), &arr))
	require.Len(t, arr, 3)
	assert.Nil(t, arr[0]["symmetry_number"])
	assert.Equal(t, arr[1]["symmetry_number"], arr[2]["symmetry_number"])

	code, stdout, stderr = runKiln(t, "estimate", "O=O")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stdout, "tabulated: its uncertainty is the source's")
	assert.NotContains(t, stdout, "± 0.00")
}

// TestEstimateErrors: a bad input gets an error object with its position,
// the others still get estimates, and the exit code is 1.
func TestEstimateErrors(t *testing.T) {
	code, stdout, _ := runKiln(t, "estimate", "C1CC", "--json", "CC")
	assert.Equal(t, exitProblems, code)
	var arr []map[string]any
	require.NoError(t, json.Unmarshal([]byte(stdout), &arr))
	require.Len(t, arr, 2)
	e := arr[0]["error"].(map[string]any)
	assert.Contains(t, e["message"], "ring")
	assert.Equal(t, 2.0, e["position"]) // the ring-bond digit, 1-based
	assert.Nil(t, arr[0]["hf298_kj_mol"])
	assert.Nil(t, arr[1]["error"])

	code, stdout, _ = runKiln(t, "estimate", "C(C")
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stdout, "error at position 2")
}

// TestEstimateNASA: --nasa adds a polynomial that reproduces the estimate.
func TestEstimateNASA(t *testing.T) {
	code, stdout, stderr := runKiln(t, "estimate", "--json", "--nasa", "CCC")
	require.Equal(t, exitOK, code, stderr)
	var arr []struct {
		Hf    float64 `json:"hf298_kj_mol"`
		NASA7 struct {
			TLow  float64    `json:"t_low"`
			TMid  float64    `json:"t_mid"`
			THigh float64    `json:"t_high"`
			Low   [7]float64 `json:"low"`
			High  [7]float64 `json:"high"`
		} `json:"nasa7"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &arr))
	p := arr[0].NASA7
	assert.Equal(t, []float64{300, 1000, 5000}, []float64{p.TLow, p.TMid, p.THigh})
	// H(298.15)/R from the low range, in K: a6 + T·(a1 + a2 T/2 + …).
	T := 298.15
	a := p.Low
	hOverR := a[0]*T + a[1]*T*T/2 + a[2]*T*T*T/3 + a[3]*T*T*T*T/4 + a[4]*T*T*T*T*T/5 + a[5]
	assert.InDelta(t, arr[0].Hf, hOverR*8.314462618/1000, 0.01)
}

// TestFlagsAnywhere: flags may stand before or after the operands.
func TestFlagsAnywhere(t *testing.T) {
	file := "../../testdata/check/valid.kiln"
	_, before, _ := runKiln(t, "check", "--format", "json", file)
	_, after, _ := runKiln(t, "check", file, "--format=json")
	assert.Equal(t, before, after)
	assert.True(t, strings.HasPrefix(before, "["))
}

func TestUsageErrors(t *testing.T) {
	code, _, stderr := runKiln(t, "frobnicate")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "unknown command")
	code, _, stderr = runKiln(t, "check", "--format", "xml", "x.kiln")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "--format")
	code, _, stderr = runKiln(t, "check", "/nonexistent/file.kiln")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "no such file")
	code, stdout, _ := runKiln(t, "version")
	assert.Equal(t, exitOK, code)
	assert.Equal(t, "kiln "+Version+"\n", stdout)
	code, stdout, _ = runKiln(t, "help")
	assert.Equal(t, exitOK, code)
	assert.Contains(t, stdout, "kiln check")
}

// TestSummaryJSONContract checks the keys of `kiln summary --json` and that
// it reports what it can on a file with errors, exiting 1 for them (issue
// 14, case 8: an unbalanced reaction gets no thermochemistry).
func TestSummaryJSONContract(t *testing.T) {
	code, stdout, stderr := runKiln(t, "summary", "--json", "../../testdata/check/broken.kiln")
	require.Equal(t, exitProblems, code, stderr)
	assert.Contains(t, stderr, "error(s)")
	var s map[string][]map[string]any
	require.NoError(t, json.Unmarshal([]byte(stdout), &s))
	require.NotEmpty(t, s["species"])
	require.NotEmpty(t, s["reactions"])
	// The contract's keys, plus reference_library (an extension) where the
	// thermo are a library entry's tabulated data.
	for _, sp := range s["species"] {
		want := []string{"cp_j_mol_k", "formula", "hf298_kj_mol", "name", "s298_j_mol_k", "smiles", "thermo_source"}
		if _, ok := sp["reference_library"]; ok {
			assert.Equal(t, "estimate", sp["thermo_source"], sp["name"])
			want = append(want[:4:4], "reference_library", "s298_j_mol_k", "smiles", "thermo_source")
		}
		assert.Equal(t, want, keysOf(sp), sp["name"])
	}
	assert.Equal(t, []string{"balanced", "collision_limit", "dg298_kj_mol", "dh298_kj_mol", "ds298_j_mol_k", "equation", "forward_rate", "forward_rate_units",
		"keq", "line", "rate_pressure_bar", "reverse_rate", "reverse_rate_factor", "reverse_rate_units"}, keysOf(s["reactions"][0]))
	sources := map[string]string{}
	for _, sp := range s["species"] {
		sources[sp["name"].(string)] = sp["thermo_source"].(string)
	}
	assert.Equal(t, "estimate", sources["H"])
	libs := map[string]any{}
	for _, sp := range s["species"] {
		libs[sp["name"].(string)] = sp["reference_library"]
	}
	assert.Equal(t, "H", libs["H"], "H atom: the library's entry")
	assert.Nil(t, libs["CH4"], "thermo from the file")
	assert.Equal(t, "file", sources["CH4"])
	assert.Equal(t, "none", sources["lump"])
	byEq := map[string]map[string]any{}
	for _, r := range s["reactions"] {
		byEq[r["equation"].(string)] = r
	}
	unb := byEq["H + O2 <=> OH"]
	require.NotNil(t, unb)
	assert.Equal(t, false, unb["balanced"])
	assert.Nil(t, unb["dh298_kj_mol"])
	assert.Nil(t, unb["reverse_rate"])
	for _, k := range []string{"298", "1000", "1500"} {
		assert.Nil(t, unb["keq"].(map[string]any)[k])
	}
	und := byEq["H + XYZ <=> OH + H2"]
	require.NotNil(t, und)
	assert.Nil(t, und["balanced"])
	assert.Nil(t, und["dh298_kj_mol"])
	ok := byEq["O + H2 <=> OH + H"]
	require.NotNil(t, ok)
	assert.Equal(t, true, ok["balanced"])
	// O + H2 -> OH + H: ΔH°298 = 37.3 + 218.0 − 249.2 = 6.1 kJ/mol (NIST-JANAF,
	// from memory); the library values agree within 1 kJ/mol.
	assert.InDelta(t, 8.0, ok["dh298_kj_mol"].(float64), 2.5)
	keq := ok["keq"].(map[string]any)
	assert.Equal(t, []string{"1000", "1500", "298"}, keysOf(keq))
	assert.NotNil(t, ok["reverse_rate"].(map[string]any)["1000"])
	assert.Equal(t, 42.0, ok["line"])
}

// copyToTemp copies a file into a fresh temporary directory.
func copyToTemp(t *testing.T, src string) string {
	t.Helper()
	data, err := os.ReadFile(src)
	require.NoError(t, err)
	dir := t.TempDir()
	dst := filepath.Join(dir, filepath.Base(src))
	require.NoError(t, os.WriteFile(dst, data, 0o644))
	return dst
}

// isSubsequence reports whether every byte of a appears in b in order, i.e.
// b is a made only of insertions into a.
func isSubsequence(a, b []byte) bool {
	i := 0
	for j := 0; j < len(b) && i < len(a); j++ {
		if a[i] == b[j] {
			i++
		}
	}
	return i == len(a)
}

// TestFill: fill inserts blocks only, is idempotent, atomic (no temp file
// left) and leaves a file that check accepts without missing-thermo errors.
func TestFill(t *testing.T) {
	path := copyToTemp(t, "../../examples/furnace.kiln")
	orig, err := os.ReadFile(path)
	require.NoError(t, err)

	code, diff, stderr := runKiln(t, "fill", path, "--dry-run")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, diff, "+  nasa7 300 1000 5000")
	unchanged, _ := os.ReadFile(path)
	assert.Equal(t, orig, unchanged, "--dry-run must not write")

	code, _, stderr = runKiln(t, "fill", path)
	require.Equal(t, exitOK, code, stderr)
	filled, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Greater(t, len(filled), len(orig))
	assert.True(t, isSubsequence(orig, filled), "fill may only insert")
	entries, _ := os.ReadDir(filepath.Dir(path))
	assert.Len(t, entries, 1, "no temporary file may remain")

	code, _, _ = runKiln(t, "fill", path)
	require.Equal(t, exitOK, code)
	again, _ := os.ReadFile(path)
	assert.Equal(t, filled, again, "fill is idempotent")

	code, stdout, _ := runKiln(t, "check", "--format", "json", path)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags))
	for _, d := range diags {
		assert.NotEqual(t, "missing-thermo", d.Code, "%+v", d)
		assert.NotEqual(t, "error", d.Severity, "%+v", d)
	}
	assert.Equal(t, exitOK, code)

	// The dry-run diff, applied, gives the written file: its + lines are
	// exactly the inserted text.
	var plus strings.Builder
	for _, l := range strings.SplitAfter(diff, "\n") {
		if strings.HasPrefix(l, "+") && !strings.HasPrefix(l, "+++") {
			plus.WriteString(l[1:])
		}
	}
	assert.Equal(t, len(filled)-len(orig), plus.Len())
}

// TestFillUnwritable: a path that cannot be written gives a clear error and
// a non-zero exit, and the original stays untouched.
func TestFillUnwritable(t *testing.T) {
	if os.Geteuid() == 0 {
		// root ignores directory permissions; use a directory that vanishes instead.
		path := copyToTemp(t, "../../testdata/check/info-thermo.kiln")
		code, _, stderr := runKiln(t, "fill", filepath.Join(path, "nested.kiln"))
		assert.Equal(t, exitUsage, code)
		assert.NotEmpty(t, stderr)
		return
	}
	path := copyToTemp(t, "../../testdata/check/info-thermo.kiln")
	orig, _ := os.ReadFile(path)
	dir := filepath.Dir(path)
	require.NoError(t, os.Chmod(dir, 0o500))
	defer os.Chmod(dir, 0o700)
	code, _, stderr := runKiln(t, "fill", path)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "writing")
	after, _ := os.ReadFile(path)
	assert.Equal(t, orig, after)
}

// TestPlot draws a species of the example and checks the SVG; an unknown
// species is a clear error.
func TestPlot(t *testing.T) {
	out := filepath.Join(t.TempDir(), "ethanol.svg")
	code, _, stderr := runKiln(t, "plot", "ethanol", "--file", "../../examples/furnace.kiln", "-o", out)
	require.Equal(t, exitOK, code, stderr)
	svg, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.Contains(t, string(svg[:200]), "<svg")
	assert.Contains(t, string(svg), "ethanol")

	code, _, stderr = runKiln(t, "plot", "nosuch", "--file", "../../examples/furnace.kiln", "-o", out)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, `no species named "nosuch"`)
}

// TestThresholdFlags: the mismatch threshold is settable from the command line.
func TestThresholdFlags(t *testing.T) {
	file := "../../testdata/check/broken.kiln"
	_, out, _ := runKiln(t, "check", "--format", "json", file)
	assert.Contains(t, out, "thermo-mismatch")
	_, out, _ = runKiln(t, "check", "--format", "json", "--mismatch-hf", "50", file)
	assert.NotContains(t, out, "thermo-mismatch", "a 36 kcal/mol difference is under a 50 kcal/mol threshold")
	_, out, _ = runKiln(t, "check", "--format", "json", "--collision-factor", "1000", file)
	assert.NotContains(t, out, "collision-limit")
	code, _, stderr := runKiln(t, "check", "--mismatch-s", "-1", file)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "--mismatch-s")
}

// TestMinSeverity: --min-severity drops the less severe diagnostics but not
// the exit code's reason.
func TestMinSeverity(t *testing.T) {
	file := "../../testdata/check/broken.kiln"
	_, all, _ := runKiln(t, "check", file)
	assert.Contains(t, all, ": information: ")
	code, some, stderr := runKiln(t, "check", "--min-severity", "warning", file)
	assert.Equal(t, exitProblems, code)
	assert.NotContains(t, some, ": information: ")
	assert.Contains(t, some, ": warning: ")
	assert.Contains(t, stderr, "error(s)")
	code, _, stderr = runKiln(t, "check", "--min-severity", "loud", file)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "--min-severity")
}

// TestEstimateSpellingsEachOwn: spellings of one structure on one command
// line give identical numbers, and each result (a refusal too) is reported
// for its own input: the input echoed, the atom numbers of its own spelling.
func TestEstimateSpellingsEachOwn(t *testing.T) {
	code, stdout, _ := runKiln(t, "estimate", "--json", "CC([C](C)O)=C", "C[C](O)C(C)=C")
	require.Equal(t, exitOK, code)
	var arr []map[string]any
	require.NoError(t, json.Unmarshal([]byte(stdout), &arr))
	require.Len(t, arr, 2)
	assert.Equal(t, "CC([C](C)O)=C", arr[0]["input"])
	assert.Equal(t, "C[C](O)C(C)=C", arr[1]["input"])
	assert.Equal(t, arr[0]["hf298_kj_mol"], arr[1]["hf298_kj_mol"])
	assert.Equal(t, arr[0]["s298_j_mol_k"], arr[1]["s298_j_mol_k"])
	assert.Equal(t, arr[0]["cp_j_mol_k"], arr[1]["cp_j_mol_k"])
	assert.Equal(t, arr[0]["missing_groups"], arr[1]["missing_groups"])

	// A refusal names an atom of the spelling it is printed under.
	code, stdout, _ = runKiln(t, "estimate", "CC[SiH3]", "[SiH3]CC")
	assert.Equal(t, exitProblems, code)
	parts := strings.SplitN(stdout, "\n\n", 2)
	require.Len(t, parts, 2, stdout)
	// (Si is an unsupported element: the refusal names the Si atom.)
	assert.True(t, strings.HasPrefix(parts[0], "CC[SiH3]\n"), parts[0])
	assert.Contains(t, parts[0], "atom 3 (Si)")
	assert.True(t, strings.HasPrefix(parts[1], "[SiH3]CC\n"), parts[1])
	assert.Contains(t, parts[1], "atom 1 (Si)")
	code, stdout, _ = runKiln(t, "estimate", "C(C)[SiH3]", "[SiH3]C(C)")
	assert.Equal(t, exitProblems, code)
	parts = strings.SplitN(stdout, "\n\n", 2)
	require.Len(t, parts, 2, stdout)
	assert.Contains(t, parts[0], "atom 3 (Si)")
	assert.Contains(t, parts[1], "atom 1 (Si)")
}

// TestSummaryLibraryLabel: the summary table labels a reference-library
// species "library" (tabulated data) and a group estimate "estimate".
func TestSummaryLibraryLabel(t *testing.T) {
	path := writeTemp(t, "lib.kiln", "species H2 [H][H]\nspecies propane CCC\n")
	code, stdout, stderr := runKiln(t, "summary", path)
	require.Equal(t, exitOK, code, stderr)
	var h2, propane string
	for _, line := range strings.Split(stdout, "\n") {
		f := strings.Fields(line)
		if len(f) > 2 && f[0] == "H2" {
			h2 = f[2]
		}
		if len(f) > 2 && f[0] == "propane" {
			propane = f[2]
		}
	}
	assert.Equal(t, "library", h2)
	assert.Equal(t, "estimate", propane)
}

// TestSummaryRateTableEdge: a rate shown at a pressure outside the
// reaction's pressure table says which tabulated pressure's rate it is.
func TestSummaryRateTableEdge(t *testing.T) {
	path := writeTemp(t, "p.kiln", `species CH3 [CH3]
species C2H6 CC
reaction C2H6 <=> CH3 + CH3   A=1e16 n=0 Ea=88
  pressure 0.1atm A=1e15 n=0 Ea=88
  pressure 10atm A=1e16 n=0 Ea=88
`)
	code, stdout, stderr := runKiln(t, "summary", "--json", "--pressure", "100atm", path)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stdout, `"rate_table_edge_bar": 10.1325`)
	code, stdout, _ = runKiln(t, "summary", "--pressure", "100atm", path)
	require.Equal(t, exitOK, code)
	assert.Contains(t, stdout, "table's 10.1325 bar rate", "the digits of the header's pressure and of the JSON")
	code, stdout, _ = runKiln(t, "summary", "--json", path)
	require.Equal(t, exitOK, code)
	assert.NotContains(t, stdout, "rate_table_edge_bar")
}

// TestEstimateSymmetryFlagOnLibrary: --symmetry changes a group estimate's
// σ, and for reference-library data (whose tabulated S° holds σ) it says on
// stderr that it does not apply, leaving stdout (and --json) as it was.
func TestEstimateSymmetryFlagOnLibrary(t *testing.T) {
	code, out, errOut := runKiln(t, "estimate", "--json", "--symmetry", "12", "FS(F)(F)F")
	require.Equal(t, 0, code, errOut)
	assert.Contains(t, errOut, "--symmetry does not apply to reference-library data (SF4)")
	var arr []map[string]any
	require.NoError(t, json.Unmarshal([]byte(out), &arr))
	assert.EqualValues(t, 2, arr[0]["symmetry_number"], "the structure's σ, not the flag's")
	code, _, errOut = runKiln(t, "estimate", "--symmetry", "12", "CCC")
	require.Equal(t, 0, code)
	assert.NotContains(t, errOut, "does not apply")
	_, _, errOut = runKiln(t, "estimate", "--symmetry", "2", "--optical-isomers", "2", "O=O")
	assert.Contains(t, errOut, "--symmetry and --optical-isomers do not apply to reference-library data (O2)")
}

// TestEstimateLibraryUncertaintyAndPolynomial: a library entry whose source
// states a large uncertainty gives it in the text (with its 1σ, half of it)
// and in the JSON (uncertainty_hf298_kj_mol is the 1σ, the extension
// stated_uncertainty_hf298_kj_mol the ±); an entry without one gives
// neither; --nasa names the polynomial it prints: the source's published
// coefficients, the library's fit to its source's Cp, or a refit to the
// requested range.
func TestEstimateLibraryUncertaintyAndPolynomial(t *testing.T) {
	code, out, errOut := runKiln(t, "estimate", "--json", "O=S(F)F", "O=O")
	require.Equal(t, 0, code, errOut)
	var arr []map[string]any
	require.NoError(t, json.Unmarshal([]byte(out), &arr))
	assert.EqualValues(t, 25, arr[0]["uncertainty_hf298_kj_mol"])
	assert.EqualValues(t, 50, arr[0]["stated_uncertainty_hf298_kj_mol"])
	assert.Nil(t, arr[1]["uncertainty_hf298_kj_mol"])
	assert.NotContains(t, arr[1], "stated_uncertainty_hf298_kj_mol")

	_, out, _ = runKiln(t, "estimate", "--units", "kJ/mol", "O=S(F)F")
	assert.Contains(t, out, "tabulated, ± 50.0 kJ/mol as its source gives it (read as a 95 % bound: 1σ 25.0 kJ/mol)")

	_, out, _ = runKiln(t, "estimate", "--nasa", "O=O")
	assert.Contains(t, out, "NASA-7 polynomial (the source's published Cp coefficients):")
	_, out, _ = runKiln(t, "estimate", "--nasa", "[NH2]")
	assert.Contains(t, out, "NASA-7 polynomial (the library's fit to its source's Cp; worst Cp residual")
	_, out, _ = runKiln(t, "estimate", "--nasa", "--tmid", "1200", "--thigh", "3000", "O=O")
	assert.Contains(t, out, "NASA-7 polynomial (refitted to 200–1200–3000 K from the library's; worst Cp residual")
}

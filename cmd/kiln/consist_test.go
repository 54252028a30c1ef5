package main

import (
	"encoding/json"
	"math"
	"os"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/speciesfile"
)

// TestSummaryLines (issue 14, case 1): every reaction is reported on its
// keyword's line, in text and JSON, however many comment and blank lines
// precede it.
func TestSummaryLines(t *testing.T) {
	code, stdout, stderr := runKiln(t, "summary", "--json", "../../examples/furnace.kiln")
	require.Equal(t, exitOK, code, stderr)
	var s struct {
		Reactions []struct {
			Line     int    `json:"line"`
			Equation string `json:"equation"`
		} `json:"reactions"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &s))
	src, err := os.ReadFile("../../examples/furnace.kiln")
	require.NoError(t, err)
	lines := strings.Split(string(src), "\n")
	require.NotEmpty(t, s.Reactions)
	for _, r := range s.Reactions {
		require.Less(t, r.Line-1, len(lines))
		assert.True(t, strings.HasPrefix(lines[r.Line-1], "reaction "), "line %d of %q is %q", r.Line, r.Equation, lines[r.Line-1])
	}
	assert.Equal(t, 82, s.Reactions[0].Line)
	_, text, _ := runKiln(t, "summary", "../../examples/furnace.kiln")
	assert.Regexp(t, `(?m)^82\s+H \+ O2 <=> O \+ OH`, text)
}

// TestSummaryBrokenAndTables: a block with a syntax error is not taken from
// the file (case 4), a table gives no Cp outside its temperatures (case 10,
// the rule hovers follow too), an unbalanced reaction gets no values and the
// exit code says there are errors (case 8).
func TestSummaryBrokenAndTables(t *testing.T) {
	path := writeTemp(t, "s.kiln", `species H [H]
species O2 O=O
  multiplicity 3
species HO2 O[O]
  nasa7 200 1000 3500
    low 4.30179807E+00 -4.74912097E-03 2.11582905E-05 -2.42763914E-08 9.29225225E-12 2.64018485E+02 3.71666220E+00
species lump
  composition C2H2
  thermo-table
    hf298 54.2
    s298 48.0
    cp 400=12.0 500=13.1 600=14.0
reaction H + O2 <=> HO2  A=1e13 n=0 Ea=0
reaction H + O2 <=> HO2 + H  A=1e13 n=0 Ea=0
`)
	code, stdout, stderr := runKiln(t, "summary", "--json", path)
	assert.Equal(t, exitProblems, code, stderr)
	var s struct {
		Species []struct {
			Name   string              `json:"name"`
			Source string              `json:"thermo_source"`
			Hf     *float64            `json:"hf298_kj_mol"`
			Cp     map[string]*float64 `json:"cp_j_mol_k"`
		} `json:"species"`
		Reactions []struct {
			Balanced *bool               `json:"balanced"`
			DH       *float64            `json:"dh298_kj_mol"`
			Keq      map[string]*float64 `json:"keq"`
		} `json:"reactions"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &s), stdout)
	byName := map[string]int{}
	for i, sp := range s.Species {
		byName[sp.Name] = i
	}
	ho2 := s.Species[byName["HO2"]]
	assert.Equal(t, "estimate", ho2.Source)
	// HO2: 12.0 kJ/mol (NASA TM-4513 library value, ±3); never the zeros
	// of a half-read block.
	require.NotNil(t, ho2.Hf)
	assert.InDelta(t, 12, *ho2.Hf, 3)
	lump := s.Species[byName["lump"]]
	assert.Equal(t, "file", lump.Source)
	assert.Nil(t, lump.Cp["300"], "300 K is below the table")
	assert.Nil(t, lump.Cp["800"], "800 K is above the table")
	require.NotNil(t, lump.Cp["500"])
	assert.InDelta(t, 13.1*4.184, *lump.Cp["500"], 1e-9)
	require.Len(t, s.Reactions, 2)
	assert.NotNil(t, s.Reactions[0].DH)
	require.NotNil(t, s.Reactions[1].Balanced)
	assert.False(t, *s.Reactions[1].Balanced)
	assert.Nil(t, s.Reactions[1].DH)
	assert.Nil(t, s.Reactions[1].Keq["1000"])

	_, text, _ := runKiln(t, "summary", path)
	assert.NotContains(t, text, "5e+105")
	assert.Contains(t, text, "cm³/(mol·s)", "rates carry their units")
}

// TestOutputConventions (case 14): JSON numbers carry no binary noise and
// temperature keys come in numeric order; text tables have no trailing
// blanks and stay under 120 columns.
func TestOutputConventions(t *testing.T) {
	for _, args := range [][]string{
		{"estimate", "--json", "CCO", "C1CCCCC1CCO"},
		{"summary", "--json", "../../examples/furnace.kiln"},
	} {
		code, stdout, stderr := runKiln(t, args...)
		require.Equal(t, exitOK, code, stderr)
		assertShortNumbers(t, stdout, args)
		assert.Regexp(t, `(?s)"300": [^,]+,\s*"400": [^,]+,\s*"500": [^,]+,\s*"600": [^,]+,\s*"800": [^,]+,\s*"1000": [^,]+,\s*"1500"`, stdout, "Cp keys in order, %v", args)
	}
	// Every --json output goes through the same writer: no float noise
	// anywhere, numeric keys in order.
	for _, args := range [][]string{
		{"compare", "--json", "--all", "../../examples/furnace.kiln", "../../testdata/check/broken.kiln"},
		{"equilibrium", "--json", "../../examples/furnace.kiln", "--mix", "CH4:1, O2:2, N2:7.52", "--temperature", "1500"},
		{"check", "--format", "json", "../../testdata/check/broken.kiln"},
	} {
		_, stdout, stderr := runKiln(t, args...)
		require.NotEmpty(t, stdout, "%v: %s", args, stderr)
		assertShortNumbers(t, stdout, args)
		assert.NotRegexp(t, `"1000": [^\n]*\n[^"]*"300"`, stdout, "numeric keys out of order in %v", args)
	}
	for _, args := range [][]string{
		{"summary", "../../examples/furnace.kiln"},
		{"summary", "--units", "kJ/mol", "../../examples/furnace.kiln"},
		{"estimate", "CCO", "CC(C)(C)c1ccccc1O", "C=CC(=O)OCC"},
		{"estimate", "--sources", "CCO"},
		{"check", "../../examples/furnace.kiln"},
		{"compare", "--all", "../../examples/furnace.kiln", "../../testdata/check/broken.kiln"},
		{"equilibrium", "../../examples/furnace.kiln", "--mix", "CH4:1, O2:2, N2:7.52", "--temperature", "1500"},
		{"help"},
	} {
		_, stdout, _ := runKiln(t, args...)
		for i, line := range strings.Split(stdout, "\n") {
			assert.False(t, strings.HasSuffix(line, " ") || strings.HasSuffix(line, "\t"), "%v line %d has trailing blanks: %q", args, i+1, line)
			// Diagnostic lines and notes carry file paths of any length;
			// tables and text blocks stay narrow.
			if args[0] != "check" && !strings.HasPrefix(line, "note: ") {
				assert.Less(t, len([]rune(line)), 120, "%v line %d: %q", args, i+1, line)
			}
		}
	}
}

// TestFillRangesAndSkips: explicit --tmid/--thigh apply to every inserted
// block, reference-library species included (case 3); species that get no
// block are listed with the reason and make the exit code 1 (case 9).
func TestFillRangesAndSkips(t *testing.T) {
	path := writeTemp(t, "f.kiln", `species O2 O=O
  multiplicity 3
species OH [OH]
species ethanol CCO
species imide CN(C=O)C=O
species lump
  composition C2
`)
	code, _, stderr := runKiln(t, "fill", "--tmid", "1200", "--thigh", "3000", path)
	assert.Equal(t, exitProblems, code, stderr)
	// Positions are those of the written file, where check reports the
	// same species (three blocks were inserted above them).
	assert.Regexp(t, `f.kiln:17:9: skipped imide: kiln cannot estimate it: .*no value .*group`, stderr)
	assert.Regexp(t, `f.kiln:18:9: skipped lump: no structure`, stderr)
	assert.Contains(t, stderr, "inserted 3 thermo block(s), skipped 2 species")
	out, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Equal(t, 3, strings.Count(string(out), "nasa7 "))
	for _, line := range strings.Split(string(out), "\n") {
		if f := strings.Fields(line); len(f) == 4 && f[0] == "nasa7" {
			assert.Equal(t, []string{"1200", "3000"}, f[2:], line)
		}
	}
	// What fill wrote, check accepts (only the two species fill could not
	// help remain).
	code, stdout, _ := runKiln(t, "check", "--min-severity", "warning", path)
	assert.Equal(t, exitProblems, code)
	assert.Equal(t, 2, strings.Count(stdout, "\n"), stdout)
	assert.Contains(t, stdout, "f.kiln:17:", "check reports imide on the line where fill said it skipped it")
	assert.Contains(t, stdout, "f.kiln:18:9:", "check reports lump where fill said it skipped it")

	// A range beyond the reference data is refused, not extrapolated.
	path = writeTemp(t, "g.kiln", "species O2 O=O\n  multiplicity 3\n")
	code, _, stderr = runKiln(t, "fill", "--thigh", "4000", path)
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stderr, "end at 3500 K, below the requested THIGH 4000 K")
	// The default range leaves library species at their own (as editors,
	// which always send tMid and tHigh, rely on).
	code, _, stderr = runKiln(t, "fill", "--thigh", "5000", "--dry-run", path)
	assert.Equal(t, exitOK, code, stderr)

	// Nothing to do: exit 0.
	code, _, stderr = runKiln(t, "fill", path)
	assert.Equal(t, exitOK, code, stderr)
	code, _, stderr = runKiln(t, "fill", path)
	assert.Equal(t, exitOK, code, stderr)
	assert.Contains(t, stderr, "every species of this file already has thermo")
}

// TestHelpEverywhere (case 14): --help and -h work on every command.
func TestHelpEverywhere(t *testing.T) {
	for _, cmd := range []string{"check", "estimate", "summary", "fill", "plot", "serve"} {
		for _, h := range []string{"--help", "-h"} {
			code, stdout, stderr := runKiln(t, cmd, h)
			assert.Equal(t, exitOK, code, "%s %s: %s", cmd, h, stderr)
			assert.Contains(t, stdout, "kiln "+cmd, "%s %s", cmd, h)
		}
	}
	code, stdout, _ := runKiln(t, "check", "x.kiln", "--help")
	assert.Equal(t, exitOK, code)
	assert.NotContains(t, stdout, "kiln fill")
}

// TestMismatchCpFlag (case 5): the Cp comparison has its own threshold;
// raising it leaves the H(T)−H(298 K) comparison, raising both silences it.
func TestMismatchCpFlag(t *testing.T) {
	file := "../../testdata/check/cp-mismatch.kiln"
	_, out, _ := runKiln(t, "check", "--min-severity", "warning", file)
	assert.Contains(t, out, "CH4: Cp at 3000 K")
	_, out, _ = runKiln(t, "check", "--min-severity", "warning", "--mismatch-cp", "4", file)
	assert.NotContains(t, out, "Cp at")
	assert.Contains(t, out, "CH4: H(3000 K) − H(298 K)")
	_, out, _ = runKiln(t, "check", "--min-severity", "warning", "--mismatch-cp", "4", "--mismatch-hf", "4", file)
	assert.Empty(t, out)
	code, _, stderr := runKiln(t, "check", "--mismatch-cp", "0", file)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "--mismatch-cp: must be a positive number")
	// The shipped example's CH4 block now agrees with the reference.
	_, out, _ = runKiln(t, "check", "--min-severity", "warning", "../../examples/furnace.kiln")
	assert.Empty(t, out)
}

// TestPlotBlockRange (case 6): a file block is drawn over its own range
// only, and its legend says which.
func TestPlotBlockRange(t *testing.T) {
	p := nasa.NASA7{TLow: 300, TMid: 1000, THigh: 3000, Low: [7]float64{4}, High: [7]float64{4}}
	s := blockSeries(p)
	assert.Contains(t, s.Name, "300–3000 K")
	cp, _, _ := s.Eval(2000)
	assert.InDelta(t, 4*nasa.R, cp, 1e-9)
	cp, h, st := s.Eval(5000)
	assert.True(t, math.IsNaN(cp) && math.IsNaN(h) && math.IsNaN(st))
}

// TestCodesDocumented: every diagnostic code is in FORMAT.md's table (one
// list, extended, never renamed).
func TestCodesDocumented(t *testing.T) {
	doc, err := os.ReadFile("../../FORMAT.md")
	require.NoError(t, err)
	for _, c := range speciesfile.Codes {
		assert.Contains(t, string(doc), "| `"+c+"` |", c)
	}
}

// TestSummaryPressure (case 15): summary shows k_f of a falloff reaction at
// the chosen pressure; the unit of --pressure is attached or bar.
func TestSummaryPressure(t *testing.T) {
	kf := func(args ...string) (float64, float64) {
		code, stdout, stderr := runKiln(t, append([]string{"summary", "--json", "../../examples/furnace.kiln"}, args...)...)
		require.Equal(t, exitOK, code, stderr)
		var s struct {
			Reactions []struct {
				Equation string              `json:"equation"`
				Kf       map[string]*float64 `json:"forward_rate"`
				P        float64             `json:"rate_pressure_bar"`
			} `json:"reactions"`
		}
		require.NoError(t, json.Unmarshal([]byte(stdout), &s))
		for _, r := range s.Reactions {
			if r.Equation == "CH3 + CH3 (+M) <=> C2H6 (+M)" {
				require.NotNil(t, r.Kf["1000"])
				return *r.Kf["1000"], r.P
			}
		}
		t.Fatal("falloff reaction not found")
		return 0, 0
	}
	k1, p1 := kf()
	assert.InDelta(t, 1.01325, p1, 1e-9)
	k01, p01 := kf("--pressure", "0.1bar")
	assert.InDelta(t, 0.1, p01, 1e-12)
	k100, _ := kf("--pressure", "10000kPa")
	assert.Less(t, k01, k1)
	assert.Less(t, k1, k100)
	// k∞ of the example's line is 1.8e16 × 1000^-0.97 × exp(−0.62 kcal/RT).
	assert.Less(t, k100, 1.8e16*math.Pow(1000, -0.97))
	_, text, _ := runKiln(t, "summary", "--pressure", "10bar", "../../examples/furnace.kiln")
	assert.Contains(t, text, "Rates at 1000 K and 10 bar")
	code, _, stderr := runKiln(t, "summary", "--pressure", "10psi", "../../examples/furnace.kiln")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "unknown unit")
	code, _, stderr = runKiln(t, "summary", "--pressure", "10", "../../examples/furnace.kiln")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "needs a unit")
}

// TestEstimateUnits (case 7): --units kJ/mol puts kJ/mol first everywhere
// in the text output.
func TestEstimateUnits(t *testing.T) {
	_, out, _ := runKiln(t, "estimate", "--units", "kJ/mol", "CCO")
	assert.Regexp(t, `ΔHf°298 = -23\d\.\d kJ/mol \(-5\d\.\d\d kcal/mol\)`, out)
	assert.Contains(t, out, "ΔHf°298 kJ/mol")
	assert.Contains(t, out, "Cp in J/(mol·K)")
	_, out, _ = runKiln(t, "estimate", "CCO")
	assert.Regexp(t, `ΔHf°298 = -5\d\.\d\d kcal/mol \(-23\d\.\d kJ/mol\)`, out)
}

// TestFlagsDocumented (case 16): README and kiln help describe every flag.
func TestFlagsDocumented(t *testing.T) {
	readme, err := os.ReadFile("../../README.md")
	require.NoError(t, err)
	flags := []string{"format", "min-severity", "json", "nasa", "sources", "dry-run", "log", "file"}
	for f := range settingsFlags {
		flags = append(flags, f)
	}
	for _, f := range flags {
		assert.Contains(t, string(readme), "--"+f, "README")
		assert.Contains(t, helpText, "--"+f, "kiln help")
	}
	for _, s := range []string{"kiln.server.logFile", "kiln.trace.server", "go install ./cmd/kiln", "npm registry", "mismatchCp"} {
		assert.Contains(t, string(readme), s)
	}
}

var numberRE = regexp.MustCompile(`-?\d+(\.\d+)?([eE][-+]?\d+)?`)

// assertShortNumbers checks that no number of a JSON text (outside strings,
// roughly: after a colon or in an array) has more than 12 significant
// digits.
func assertShortNumbers(t *testing.T, text string, args []string) {
	t.Helper()
	for _, line := range strings.Split(text, "\n") {
		v := strings.TrimSpace(line)
		if i := strings.Index(v, "\": "); i >= 0 {
			v = v[i+3:]
		}
		v = strings.TrimSuffix(v, ",")
		if !numberRE.MatchString(v) || numberRE.FindString(v) != v {
			continue
		}
		mant := strings.TrimLeft(strings.SplitN(strings.ToLower(v), "e", 2)[0], "-")
		digits := strings.Trim(strings.Replace(mant, ".", "", 1), "0")
		assert.LessOrEqual(t, len(digits), 12, "%v: %s", args, line)
	}
}

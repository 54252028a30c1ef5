package main

import (
	"encoding/json"
	"os"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestFillSourceNamesEachReferenceOnce: the source line fill writes names
// each reference once, even when a group's source is a list ("value; the
// analogy its 1500 K Cp rests on") that repeats another group's reference
// (ethanol and propanol cite Benson's Table A.2 through several groups).
func TestFillSourceNamesEachReferenceOnce(t *testing.T) {
	path := writeTemp(t, "e.kiln", "species ethanol CCO\nspecies propanol CCCO\n")
	code, _, stderr := runKiln(t, "fill", path)
	require.Equal(t, exitOK, code, stderr)
	src, err := os.ReadFile(path)
	require.NoError(t, err)
	lines := regexp.MustCompile(`(?m)^\s*source (.*)$`).FindAllStringSubmatch(string(src), -1)
	require.Len(t, lines, 2, string(src))
	for _, l := range lines {
		_, list, ok := strings.Cut(l[1], "group values from: ")
		require.True(t, ok, l[1])
		parts := strings.Split(strings.TrimSuffix(list, ")"), "; ")
		assert.Greater(t, len(parts), 1, l[1])
		seen := map[string]bool{}
		for _, p := range parts {
			assert.False(t, seen[p], "%q named twice in %q", p, l[1])
			seen[p] = true
		}
	}
	// The file fill wrote is what check accepts.
	code, stdout, _ := runKiln(t, "check", "--min-severity", "warning", path)
	assert.Equal(t, exitOK, code, stdout)
}

// TestFlagOncePerDistinctApproximation: a flag the engine makes on two
// atoms is one line with its count, in check, estimate (text and JSON) and
// summary; a group kiln has and uses as it stands is "FLAGGED", never
// "approximated by" itself. Diagnostic codes stay as they were.
func TestFlagOncePerDistinctApproximation(t *testing.T) {
	const smiles = "CC(F)(F)CCC(C)(F)F" // C-(F)2(C)2 twice, not adjacent
	_, text, _ := runKiln(t, "estimate", smiles)
	assert.Equal(t, 1, strings.Count(text, "C-(F)2(C)2 ×2 (used as it stands"), text)
	assert.Contains(t, text, "FLAGGED group C-(F)2(C)2 ×2 (used as it stands")
	assert.NotContains(t, text, "approximated by C-(F)2(C)2")
	assert.NotContains(t, text, "MISSING group C-(F)2(C)2")

	_, stdout, stderr := runKiln(t, "estimate", "--json", smiles)
	var est []estimateJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &est), stderr)
	require.Len(t, est, 1)
	assert.Equal(t, []string{"C-(F)2(C)2"}, est[0].MissingGroups)
	require.Len(t, est[0].Flags, 1)
	assert.True(t, strings.HasPrefix(est[0].Flags[0], "C-(F)2(C)2 ×2 (used as it stands"), est[0].Flags[0])

	path := writeTemp(t, "f.kiln", "species diene "+smiles+"\nspecies vdf CC(C)(F)F\n")
	_, stdout, _ = runKiln(t, "check", "--format", "json", path)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags))
	var warned []string
	for _, d := range diags {
		if d.Severity == "warning" {
			assert.Equal(t, "missing-group", d.Code, d.Message)
			warned = append(warned, d.Message)
		}
	}
	require.Len(t, warned, 2, "one warning per species")
	assert.Equal(t, 1, strings.Count(warned[0], "(used as it stands"), warned[0])
	assert.Contains(t, warned[0], "diene: flagged group value: C-(F)2(C)2 ×2 (used as it stands")
	assert.Contains(t, warned[1], "vdf: flagged group value: C-(F)2(C)2 (used as it stands")
	assert.NotContains(t, warned[1], "×", "a flag made once has no count")

	_, text, _ = runKiln(t, "summary", path)
	text = strings.Join(strings.Fields(text), " ")
	assert.Equal(t, 1, strings.Count(text, "diene: FLAGGED group C-(F)2(C)2 ×2"), text)
}

// lowCpGroup is a group statement whose Cp lies below what any molecule of
// CCl4's shape has from translation and rotation alone (4 R = 7.95
// cal/(mol·K) for 5 atoms, non-linear); test values, not data.
const lowCpGroup = `units kcal/mol
group C-(Cl)4
  hf298 -22.9
  s298 78.97
  cp 300=2.0 400=2.2 500=2.3 600=2.4 800=2.5 1000=2.5 1500=2.6
  source deliberately too low Cp test
species CCl4 ClC(Cl)(Cl)Cl
`

// TestCpFloorFillCheckAgree: an estimate whose Cp is below the ideal-gas
// floor is flagged by check before fill (missing-group, on the species),
// fill writes no block from it (as for an S°298 below its bound), and
// check of the file after fill says the same, with no nonphysical-thermo
// from a block fill should not have written. The bound is the one
// nonphysical-thermo applies to blocks: a table with the same numbers gets
// that warning.
func TestCpFloorFillCheckAgree(t *testing.T) {
	path := writeTemp(t, "cp.kiln", lowCpGroup)
	checkWarnings := func() []checkDiag {
		_, stdout, stderr := runKiln(t, "check", "--format", "json", "--min-severity", "warning", path)
		var diags []checkDiag
		require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stderr)
		return diags
	}
	before := checkWarnings()
	require.Len(t, before, 1, "%+v", before)
	assert.Equal(t, "missing-group", before[0].Code)
	assert.Equal(t, 7, before[0].Line)
	assert.Contains(t, before[0].Message, "CCl4: the estimate is beyond a physical bound: Cp below the ideal-gas lower bound")
	assert.Contains(t, before[0].Message, "Cp at 300 K is 8.4 J/(mol·K) (2.00 cal/(mol·K)), below 33.3 J/(mol·K) (7.95 cal/(mol·K)), the translational and rotational heat capacity of any non-linear molecule of 5 atoms")
	assert.Contains(t, before[0].Message, "check the user-supplied `group` values")

	code, _, stderr := runKiln(t, "fill", path)
	assert.Equal(t, exitProblems, code, stderr)
	assert.Contains(t, stderr, "skipped CCl4: no NASA-7 polynomial: the estimated Cp at 300 K is 2.00 cal/(mol·K), below 7.95 cal/(mol·K)")
	src, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Equal(t, lowCpGroup, string(src), "fill wrote nothing")
	assert.Equal(t, before, checkWarnings(), "check after fill says what it said before")

	// summary --json carries the same flag.
	summary := func(args ...string) summaryJSON {
		_, stdout, stderr := runKiln(t, append([]string{"summary", "--json"}, args...)...)
		var s summaryJSON
		require.NoError(t, json.Unmarshal([]byte(stdout), &s), stderr)
		return s
	}
	s := summary(path)
	require.Len(t, s.Species, 1)
	require.Len(t, s.Species[0].Flags, 1)
	assert.Contains(t, s.Species[0].Flags[0], "Cp below the ideal-gas lower bound")

	// The same numbers as a block are nonphysical-thermo: one bound.
	block := writeTemp(t, "t.kiln", `units kcal/mol
species CCl4 ClC(Cl)(Cl)Cl
  thermo-table
    hf298 -22.9
    s298 74.0
    cp 300=2.0 400=2.2 500=2.3 600=2.4 800=2.5 1000=2.5 1500=2.6
`)
	_, stdout, _ := runKiln(t, "check", "--min-severity", "warning", block)
	assert.Contains(t, stdout, "warning: CCl4: Cp at 300 K is 2.00 cal/(mol·K), below 7.95 cal/(mol·K), the translational and rotational heat capacity of any non-linear molecule of 5 atoms [nonphysical-thermo]")
}

// TestGroupCpAtFewerTemperatures: a `group` whose cp line does not give
// the seven group temperatures is reported on that line, saying which
// temperatures are held constant and which interpolated; estimates that
// use it carry the flag (summary text and JSON, the source line fill
// writes), and check of the filled file reports the group again, not the
// block fill wrote.
func TestGroupCpAtFewerTemperatures(t *testing.T) {
	const head = "group C-(Cl)4\n  hf298 -22.9\n  s298 78.97\n"
	for _, tc := range []struct {
		cp, want string
	}{
		{"300=20.0", "group C-(Cl)4: Cp given at 300 K only; 400–1500 K held at the 300 K value, and estimates that use the group are flagged; give all seven temperatures 300 400 500 600 800 1000 1500 K"},
		{"300=20.0 1000=25.4", "group C-(Cl)4: Cp given at 300 and 1000 K only; 400–800 K interpolated linearly and 1500 K held at the 1000 K value"},
		{"300=20.0 500=23.0 1000=25.4 1500=25.8", "group C-(Cl)4: Cp given at 300, 500, 1000 and 1500 K; 400, 600 and 800 K interpolated linearly"},
		{"400=21.0 1500=25.8", "Cp given at 400 and 1500 K only; 300 K held at the 400 K value and 500–1000 K interpolated linearly"},
	} {
		src := head + "  cp " + tc.cp + "\n  source test values\nspecies CCl4 ClC(Cl)(Cl)Cl\n"
		path := writeTemp(t, "g.kiln", src)
		_, stdout, stderr := runKiln(t, "check", "--format", "json", "--min-severity", "warning", path)
		var diags []checkDiag
		require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stderr)
		require.Len(t, diags, 1, "one warning, on the group's cp line: %+v", diags)
		assert.Equal(t, "missing-group", diags[0].Code)
		assert.Equal(t, "warning", diags[0].Severity)
		assert.Equal(t, 4, diags[0].Line, "the cp line")
		assert.Equal(t, 3, diags[0].Column)
		assert.Contains(t, diags[0].Message, tc.want)

		_, stdout, stderr = runKiln(t, "summary", "--json", path)
		var s summaryJSON
		require.NoError(t, json.Unmarshal([]byte(stdout), &s), stderr)
		require.Len(t, s.Species, 1)
		require.Len(t, s.Species[0].Flags, 1, tc.cp)
		assert.True(t, strings.HasPrefix(s.Species[0].Flags[0], "C-(Cl)4 (used as it stands, with Cp filled in from the temperatures its `group` statement gives: Cp given at"), s.Species[0].Flags[0])

		code, _, stderr := runKiln(t, "fill", path)
		require.Equal(t, exitOK, code, stderr)
		b, err := os.ReadFile(path)
		require.NoError(t, err)
		assert.Contains(t, string(b), "flagged groups: C-(Cl)4 with Cp filled in from the temperatures its `group` statement gives")
		_, stdout, stderr = runKiln(t, "check", "--format", "json", "--min-severity", "warning", path)
		var after []checkDiag
		require.NoError(t, json.Unmarshal([]byte(stdout), &after), stderr)
		assert.Equal(t, diags, after, "after fill, the same one warning")
	}

	// All seven temperatures: nothing to report, no flag.
	path := writeTemp(t, "g7.kiln", head+"  cp 300=20.0 400=22.0 500=23.3 600=24.1 800=25.0 1000=25.4 1500=25.7\nspecies CCl4 ClC(Cl)(Cl)Cl\n")
	code, stdout, _ := runKiln(t, "check", "--min-severity", "warning", path)
	assert.Equal(t, exitOK, code)
	assert.Empty(t, stdout)
	_, stdout, _ = runKiln(t, "summary", path)
	assert.NotContains(t, stdout, "FLAGGED")
}

// TestSummaryForwardRateWithUndeclaredSpecies: k_f needs only the rate
// parameters, so summary shows it for a reaction that names an undeclared
// species (plain and falloff), while balance, thermochemistry and k_r,
// which need the species, stay empty.
func TestSummaryForwardRateWithUndeclaredSpecies(t *testing.T) {
	path := writeTemp(t, "r.kiln", `species NH2 [NH2]
species NO [N]=O
species OH [OH]
reaction NH2 + NO <=> NNH + OH  A=9.3e11 n=0 Ea=0
reaction NNH + NO (+M) <=> OH + OH (+M)  A=1e12 n=0 Ea=0
  low-pressure A=1e15 n=0 Ea=0
`)
	code, stdout, stderr := runKiln(t, "summary", "--json", path)
	assert.Equal(t, exitProblems, code, "the file has errors")
	var s summaryJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &s), stderr)
	require.Len(t, s.Reactions, 2)
	r := s.Reactions[0]
	require.NotNil(t, r.ForwardRate["1000"], "k_f of line 4")
	assert.InDelta(t, 9.3e11, *r.ForwardRate["1000"], 1)
	assert.Equal(t, "cm³/(mol·s)", r.ForwardRateUnits)
	assert.Nil(t, r.ReverseRate["1000"])
	assert.Nil(t, r.Balanced)
	assert.Nil(t, r.DH298)
	// Falloff at 1 atm, 1000 K: [M] = P/RT = 1.2187e-5 mol/cm3, Pr = k0[M]/k∞
	// = 0.012187, k = k∞ Pr/(1+Pr) (Lindemann) = 1.2040e10.
	f := s.Reactions[1]
	require.NotNil(t, f.ForwardRate["1000"], "k_f of line 5")
	assert.InEpsilon(t, 1.2040e10, *f.ForwardRate["1000"], 1e-3)

	_, text, _ := runKiln(t, "summary", path)
	assert.Regexp(t, `(?m)^4 +NH2 \+ NO <=> NNH \+ OH +9\.3e\+11 cm³/\(mol·s\)`, text)
}

// TestLibrarySourceOneValue: thermo_source keeps the contract's three
// values; reference-library data are "estimate" refined by
// reference_library, which estimate --json gives too, and which the text
// table shows as "library" — for the same species, from one definition
// (analysis.Species.ReferenceLibrary).
func TestLibrarySourceOneValue(t *testing.T) {
	path := writeTemp(t, "lib.kiln", `species NH2 [NH2]
species ethanol CCO
species lump
  composition C2
species propane CCC
  thermo-table
    hf298 -25.0
    s298 64.6
    cp 300=17.7 400=22.5 500=26.9 600=30.7 800=36.9 1000=41.4 1500=48.6
    source test values
`)
	_, stdout, stderr := runKiln(t, "summary", "--json", path)
	var s summaryJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &s), stderr)
	got := map[string][2]string{}
	for _, sp := range s.Species {
		assert.Contains(t, []string{"file", "estimate", "none"}, sp.ThermoSource, sp.Name)
		got[sp.Name] = [2]string{sp.ThermoSource, sp.ReferenceLibrary}
	}
	assert.Equal(t, map[string][2]string{
		"NH2":     {"estimate", "NH2"},
		"ethanol": {"estimate", ""},
		"lump":    {"none", ""},
		"propane": {"file", ""},
	}, got)

	_, text, _ := runKiln(t, "summary", path)
	assert.Regexp(t, `(?m)^NH2 +H2N +library `, text)
	assert.Regexp(t, `(?m)^ethanol +C2H6O +estimate `, text)
	assert.Regexp(t, `(?m)^propane +C3H8 +file `, text)

	_, stdout, stderr = runKiln(t, "estimate", "--json", "[NH2]", "CCO")
	var est []estimateJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &est), stderr)
	require.Len(t, est, 2)
	assert.Equal(t, "NH2", est[0].ReferenceLibrary)
	assert.Empty(t, est[1].ReferenceLibrary)

	// compare: source_a stays "estimate", refined the same way.
	other := writeTemp(t, "other.kiln", "species NH2 [NH2]\n  thermo-table\n    hf298 45.0\n    s298 46.5\n    cp 300=8.1 400=8.5 500=8.9 600=9.3 800=9.9 1000=10.4 1500=11.8\n")
	_, stdout, stderr = runKiln(t, "compare", "--json", "--all", path, other)
	var cmp struct {
		Species []struct {
			A      string `json:"a"`
			Thermo *struct {
				SourceA  string `json:"source_a"`
				SourceB  string `json:"source_b"`
				LibraryA string `json:"reference_library_a"`
				LibraryB string `json:"reference_library_b"`
			} `json:"thermo"`
		} `json:"species"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &cmp), stderr)
	require.Len(t, cmp.Species, 1)
	require.NotNil(t, cmp.Species[0].Thermo)
	assert.Equal(t, "estimate", cmp.Species[0].Thermo.SourceA)
	assert.Equal(t, "NH2", cmp.Species[0].Thermo.LibraryA)
	assert.Equal(t, "file", cmp.Species[0].Thermo.SourceB)
	assert.Empty(t, cmp.Species[0].Thermo.LibraryB)
}

// TestCpCeilingFillCheckAgree: an estimate with a Cp at or above the
// classical all-vibration limit, which fill has always refused to fit, is
// flagged by check before fill too, and the flag and the refusal quote the
// same numbers.
func TestCpCeilingFillCheckAgree(t *testing.T) {
	src := strings.Replace(lowCpGroup, "cp 300=2.0 400=2.2 500=2.3 600=2.4 800=2.5 1000=2.5 1500=2.6", "cp 300=50.0 400=52.2 500=53.3 600=54.4 800=55.5 1000=56.5 1500=57.6", 1)
	path := writeTemp(t, "hi.kiln", src)
	_, stdout, stderr := runKiln(t, "check", "--format", "json", "--min-severity", "warning", path)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stderr)
	require.Len(t, diags, 1, "%+v", diags)
	assert.Equal(t, "missing-group", diags[0].Code)
	assert.Contains(t, diags[0].Message, "CCl4: the estimate is beyond a physical bound: Cp at or above the classical limit")
	assert.Contains(t, diags[0].Message, "Cp at 300 K, 209.2 J/(mol·K) (50.00 cal/(mol·K)), is not below 108.1 J/(mol·K) (25.83 cal/(mol·K)), the most a molecule of these atoms can hold")

	code, _, stderr := runKiln(t, "fill", path)
	assert.Equal(t, exitProblems, code, stderr)
	assert.Contains(t, stderr, "skipped CCl4: no NASA-7 polynomial: the estimated Cp at 300 K, 50.00 cal/(mol·K), is not below 25.83 cal/(mol·K), the most a molecule of these atoms can hold")
	b, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Equal(t, src, string(b))
}

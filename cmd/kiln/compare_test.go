package main

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/kinetics"
)

var (
	compareA = filepath.Join("..", "..", "testdata", "compare", "base.kiln")
	compareB = filepath.Join("..", "..", "testdata", "compare", "sub.kiln")
)

func compareJSONOf(t *testing.T, wantCode int, args ...string) compareJSON {
	t.Helper()
	code, stdout, stderr := runKiln(t, append([]string{"compare", "--json"}, args...)...)
	require.Equal(t, wantCode, code, stderr)
	var o compareJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &o))
	return o
}

// TestCompareMechanisms: testdata/compare holds two mechanisms that share
// species under different names and spellings and differ in thermo and
// rates (see its README).
func TestCompareMechanisms(t *testing.T) {
	o := compareJSONOf(t, exitProblems, compareA, compareB)

	renames := map[string]string{}
	for _, r := range o.Renames {
		renames[r.B] = r.A
	}
	assert.Equal(t, map[string]string{"hydrogen-atom": "H", "hydroxyl": "OH", "water": "H2O", "ethane": "C2H6", "ethyl": "C2H5",
		"vinoxy": "CH2CHO"}, renames) // one radical, two resonance structures
	assert.Contains(t, o.Renames[0].Suggestion, "rename hydrogen-atom to H in sub.kiln")
	assert.Equal(t, compareFile{File: o.A.File, Species: 11, Reactions: 4, Errors: 0, Unreadable: []string{}}, o.A) // no syntax or structure error (check also reports two unbalanced reactions)

	names := func(rs []compareRef) []string {
		var out []string
		for _, r := range rs {
			out = append(out, r.Name)
		}
		return out
	}
	assert.ElementsMatch(t, []string{"propyl", "only-base", "CH3"}, names(o.OnlyA))
	assert.ElementsMatch(t, []string{"propyl", "only-sub"}, names(o.OnlyB))
	require.Len(t, o.Clashes, 1)
	assert.Equal(t, compareClash{Name: "propyl", SMILESA: "CC[CH2]", SMILESB: "CC=C"}, o.Clashes[0])

	// Ethanol: spelled CCO and OCC, ΔHf°298 −56.2 vs −52.0 kcal/mol.
	var eth *compareSpecies
	for i, s := range o.Species {
		if s.A == "ethanol" {
			eth = &o.Species[i]
		}
	}
	require.NotNil(t, eth)
	assert.Equal(t, "ethanol", eth.B)
	assert.InDelta(t, 4.2*4.184, eth.Thermo.Hf298.Diff, 1e-9)
	assert.InDelta(t, 4.2*4.184, eth.Thermo.G["1000"].Diff, 1e-9, "same Cp and S: G differs by ΔHf only")
	assert.Equal(t, []string{"hf298", "g300", "g1000", "g2000"}, eth.Flags)
	assert.Equal(t, 1, o.Summary.ThermoFlagged)
	// Matched species estimated on both sides: not computed when spelled
	// alike; computed, and equal, when spelled differently (C[CH2] / [CH2]C).
	for _, s := range o.Species {
		if s.A == "ethanol" {
			continue
		}
		assert.Empty(t, s.Flags, s.A)
		require.NotNil(t, s.Thermo, s.A)
		if *s.SMILESA != *s.SMILESB {
			require.False(t, s.Thermo.SameEstimate, s.A)
			assert.Zero(t, s.Thermo.Hf298.Diff, s.A)
			assert.Zero(t, s.Thermo.S298.Diff, s.A)
			if s.A == "CH2CHO" {
				// Two resonance structures: one estimate, but the NASA-7
				// fits (what fill writes, what compare evaluates) take the
				// classical Cp limit from each written structure's rotors,
				// so G past the data differs by a few J/mol.
				assert.InDelta(t, 0, s.Thermo.G["2000"].Diff, 0.05, s.A)
				continue
			}
			assert.Zero(t, s.Thermo.G["2000"].Diff, s.A)
		} else {
			assert.True(t, s.Thermo.SameEstimate, s.A)
			assert.Nil(t, s.Thermo.Hf298, s.A)
		}
	}

	require.Len(t, o.Reactions, 2)
	same, rev := o.Reactions[0], o.Reactions[1]
	assert.Equal(t, "ethane + hydroxyl <=> ethyl + water", same.EquationB)
	for _, k := range []string{"500", "1000", "2000"} {
		assert.Equal(t, 1.0, *same.Ratio[k], "identical rate parameters")
	}
	assert.True(t, rev.Reversed)
	// B writes ethyl + H2 → ethane + H (A=3e12, Ea=12 kcal/mol); in A's
	// direction its rate is k_f/Kc with Kc from B's own thermo: its blocks
	// and, for estimates, the NASA-7 polynomials fill writes. The summary of
	// sub.kiln filled reports that Kc independently.
	filled := copyToTemp(t, compareB)
	code, _, stderr := runKiln(t, "fill", filled)
	require.Equal(t, exitOK, code, stderr)
	res, _, err := analyzeFile(env{now: today}, filled, map[string]string{})
	require.NoError(t, err)
	for _, tc := range []struct {
		key string
		T   float64
	}{{"500", 500}, {"1000", 1000}, {"2000", 2000}} {
		kc, ok := res.Reactions[1].Kc(tc.T)
		require.True(t, ok)
		kb := kinetics.Arrhenius{A: 3e12, Ea: 12 * 4184}.Rate(tc.T) / kc
		ka := kinetics.Arrhenius{A: 1.1e14, Ea: 9.7 * 4184}.Rate(tc.T)
		assert.InEpsilon(t, kb/ka, *rev.Ratio[tc.key], 1e-6, tc.key) // the written coefficients have 11 digits
	}
	assert.True(t, rev.Flagged, "k_B/k_A = %.2f at 500 K is outside 1/2–2", *rev.Ratio["500"])
	assert.Equal(t, 2, o.Summary.ReactionsOnlyA)
	assert.Equal(t, 1, o.Summary.ReactionsOnlyB)

	// A factor wider than every ratio clears the rate flag (thermo and names
	// still fail). The ratios rest on estimated thermo, so the factor is
	// derived from them rather than fixed here.
	widest := 1.0
	for _, r := range rev.Ratio {
		widest = math.Max(widest, math.Max(*r, 1 / *r))
	}
	wide := compareJSONOf(t, exitProblems, compareA, compareB, "--rate-factor", strconv.FormatFloat(1.01*widest, 'f', 3, 64))
	assert.Zero(t, wide.Summary.RateFlagged)
	// The thermo thresholds are the mismatch settings of every command.
	loose := compareJSONOf(t, exitProblems, compareA, compareB, "--mismatch-hf", "5")
	assert.Zero(t, loose.Summary.ThermoFlagged)
	assert.InDelta(t, 5*4.184, loose.Thresholds.Hf298, 1e-12)
}

// TestCompareSelf: a mechanism compared with itself matches everything and
// exits 0.
func TestCompareSelf(t *testing.T) {
	o := compareJSONOf(t, exitOK, compareA, compareA)
	assert.Equal(t, 11, o.Summary.Matched)
	assert.Zero(t, o.Summary.Renamed+o.Summary.OnlyA+o.Summary.OnlyB+o.Summary.NameClashes+o.Summary.ThermoFlagged+o.Summary.RateFlagged)
	assert.Equal(t, 4, o.Summary.MatchedReactions)
}

// TestCompareText: the table is under 120 columns with no trailing blanks,
// and the exit code follows the findings.
func TestCompareText(t *testing.T) {
	code, stdout, stderr := runKiln(t, "compare", compareA, compareB)
	require.Equal(t, exitProblems, code, stderr)
	for i, line := range strings.Split(stdout, "\n") {
		assert.Less(t, utf8.RuneCountInString(line), 120, "line %d: %q", i+1, line)
		assert.Equal(t, strings.TrimRight(line, " \t"), line, "trailing blanks on line %d", i+1)
	}
	// The reversed step's 500 K ratio as the JSON reports it, printed with two
	// decimals and flagged.
	rev := compareJSONOf(t, exitProblems, compareA, compareB).Reactions[1]
	ratio500 := fmt.Sprintf("%.2f*", *rev.Ratio["500"])
	for _, want := range []string{"rename hydroxyl to OH in sub.kiln", "propyl", "ethanol", "+4.20*", ratio500, "B writes it reversed",
		"Species only in B (2)", "Reactions only in A (2)"} {
		assert.Contains(t, stdout, want)
	}
	code, _, stderr = runKiln(t, "compare", compareA)
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "two files")
	code, _, _ = runKiln(t, "compare", compareA, "missing.kiln")
	assert.Equal(t, exitUsage, code)
	code, _, stderr = runKiln(t, "compare", compareA, compareB, "--rate-factor", "0.5")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "--rate-factor")
}

// TestCompareUnreadable: species whose SMILES cannot be read match nothing,
// are listed per file, and the same unreadable text is not a name clash.
func TestCompareUnreadable(t *testing.T) {
	a := writeTemp(t, "a.kiln", "species ok CC\nspecies bad C1CC\n")
	b := writeTemp(t, "b.kiln", "species ok CC\nspecies bad C1CC\nspecies worse C(C\n")
	o := compareJSONOf(t, exitOK, a, b)
	assert.Equal(t, []string{"bad"}, o.A.Unreadable)
	assert.Equal(t, []string{"bad", "worse"}, o.B.Unreadable)
	assert.Equal(t, 1, o.Summary.Matched)
	assert.Empty(t, o.Clashes)
	assert.Equal(t, 1, o.A.Errors)
	code, stdout, _ := runKiln(t, "compare", a, b)
	assert.Equal(t, exitOK, code)
	assert.Contains(t, stdout, "2 species with an unreadable SMILES match nothing (bad, worse)")
}

// TestCompareCountsDuplicates: tester3's kelp.kiln against a copy with one
// rate changed. Its HO2 + HO2 pair declared `duplicate` is one match of two
// reactions on each side: the counts say so, and every reaction of each file
// is in a match or listed as only on its side.
func TestCompareCountsDuplicates(t *testing.T) {
	src, err := os.ReadFile(filepath.Join("..", "..", "testdata", "tester3", "kelp.kiln"))
	require.NoError(t, err)
	dir := t.TempDir()
	a, b := filepath.Join(dir, "a.kiln"), filepath.Join(dir, "b.kiln")
	require.NoError(t, os.WriteFile(a, src, 0o644))
	changed := strings.Replace(string(src), "A=3.66e14", "A=7.32e14", 1)
	require.NotEqual(t, string(src), changed)
	require.NoError(t, os.WriteFile(b, []byte(changed), 0o644))
	statements := strings.Count("\n"+string(src), "\nreaction ")

	o := compareJSONOf(t, exitOK, a, b)
	assert.Equal(t, statements, o.A.Reactions)
	assert.Equal(t, o.A.Reactions, o.Summary.MatchedReactionsA+o.Summary.ReactionsOnlyA)
	assert.Equal(t, o.B.Reactions, o.Summary.MatchedReactionsB+o.Summary.ReactionsOnlyB)
	assert.Equal(t, statements-1, o.Summary.MatchedReactions, "one duplicate pair is one match")
	var dup []compareRxn
	for _, r := range o.Reactions {
		if r.RepeatA != "" || r.RepeatB != "" {
			dup = append(dup, r)
		}
	}
	require.Len(t, dup, 1)
	assert.Equal(t, "declared", dup[0].RepeatA)
	assert.Equal(t, "declared", dup[0].RepeatB)
	assert.Len(t, dup[0].LinesA, 2)
	require.NotNil(t, dup[0].Note)
	assert.Contains(t, *dup[0].Note, "2 reactions declared duplicate in A")

	_, stdout, _ := runKiln(t, "compare", a, b)
	assert.Contains(t, stdout, fmt.Sprintf("Reactions: %d matched (%d of A's %d reactions, %d of B's %d)", statements-1,
		statements, statements, statements, statements))
	assert.Contains(t, stdout, "1 equation(s) declared duplicate in A, 1 in B")
	assert.Regexp(t, `\n\d+,\d+ +HO2 \+ HO2 <=> H2O2 \+ O2 .*duplicates summed`, stdout)
}

// TestCompareNoteUncut: the note column of the rate table is printed whole
// (it is the last column; the JSON is not the only place to read it).
func TestCompareNoteUncut(t *testing.T) {
	a := writeTemp(t, "a.kiln", `species CH3 [CH3]
species C2H6 CC
reaction CH3 + CH3 (+M) <=> C2H6 (+M)  A=6.77e16 n=-1.18 Ea=0.654
  low-pressure A=3.4e41 n=-7.03 Ea=2.762
`)
	b := writeTemp(t, "b.kiln", `species CH3 [CH3]
species C2H6 CC
reaction C2H6 (+M) <=> CH3 + CH3 (+M)  A=1.8e21 n=-1.24 Ea=90.0
  low-pressure A=3.4e41 n=-7.03 Ea=2.762
`)
	_, stdout, stderr := runKiln(t, "compare", a, b)
	assert.Contains(t, stdout, "B writes it reversed; falloff rates at 1.01325 bar, N2 bath gas with each side's efficiency", stderr)
}

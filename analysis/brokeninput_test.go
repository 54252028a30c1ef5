package analysis

import (
	"context"
	"fmt"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestInvalidNamesAreNotData: a species statement without a name, or named
// by a number or a reserved word, gets the reader's syntax error only: no
// phantom species, no estimate, no duplicate-structure warning. A species
// without SMILES or composition gets one error, not two.
func TestInvalidNamesAreNotData(t *testing.T) {
	res := analyzeText(t, "# header\nspecies A CC\nspecies\nspecies 1.5 CC\nspecies + CC\nspecies (+X) CC\nspecies M C\nspecies Z\n")
	var names []string
	for _, sp := range res.Species {
		names = append(names, sp.Name)
	}
	assert.Equal(t, []string{"A", "Z"}, names)
	byLine := map[int][]string{}
	for _, d := range res.Diagnostics {
		line := res.Files["r.kiln"].Lines.Position(d.Span.Start).Line + 1
		byLine[line] = append(byLine[line], d.Code)
	}
	for line := 3; line <= 8; line++ {
		assert.Equal(t, []string{"syntax"}, byLine[line], "line %d", line)
	}
	require.Len(t, byLine[1], 0)
}

// TestBrokenReactionsOnlySyntax: a reaction whose equation or rate lines
// have a syntax error gets that error only — no unbalanced-reaction,
// undeclared-species or duplicate-reaction, and it is no one's duplicate.
func TestBrokenReactionsOnlySyntax(t *testing.T) {
	res := analyzeText(t, `species H [H]
species HO2 [O]O
species H2O O
species A CC
reaction H + HO2 <=> H2O   A=1e13 n=0 Ea=1.5d3
reaction H + HO2 <=> H2O + X   A=1e13 n=0
reaction
reaction A
reaction A <=> B +
reaction A <=> B +
`)
	for _, d := range res.Diagnostics {
		if d.Severity == speciesfile.SeverityError || d.Severity == speciesfile.SeverityWarning {
			assert.Equal(t, "syntax", d.Code, "%s", d.Message)
		}
	}
}

// TestNonphysicalRate: Troe parameters that make the falloff rate
// impossible to evaluate are an error on the troe line, and the rate is
// not used; usable ones are not flagged.
func TestNonphysicalRate(t *testing.T) {
	const head = "species CH3 [CH3]\nspecies C2H6 CC\nreaction CH3 + CH3 (+M) <=> C2H6 (+M)   A=2.1e16 n=-0.97 Ea=0.62\n  low-pressure A=1.27e41 n=-7.0 Ea=2.76\n"
	for _, c := range []struct{ troe, want string }{
		{"  troe alpha=5 T3=-73 T1=-1180\n", "troe parameters give Fcent = -"},
		{"  troe alpha=5 T3=1e30 T1=73\n", "troe parameters give Fcent = -"},
		{"  troe alpha=1.9816 T3=5383.7 T1=4.2932 T2=-0.0795\n", ""}, // a small negative T2 is harmless
		{"  troe alpha=0.62 T3=73 T1=1180 T2=-10\n", ""},
		{"  troe alpha=0.62 T3=73 T1=1180\n", ""},
		{"  troe alpha=0.62 T3=0 T1=0 T2=0\n", ""},
	} {
		res := analyzeText(t, head+c.troe)
		msgs := messagesWithCode(res, speciesfile.CodeNonphysicalRate)
		r := res.Reactions[0]
		if c.want == "" {
			assert.Empty(t, msgs, c.troe)
			assert.NotNil(t, r.ForwardRate1000, c.troe)
			continue
		}
		require.Len(t, msgs, 1, c.troe)
		assert.Contains(t, msgs[0], c.want)
		assert.Nil(t, r.ForwardRate1000, "a rate that cannot be evaluated is not used")
		assert.Nil(t, r.Collision)
	}
}

// TestDeepIncludeReportedAtTop: includes nested deeper than the limit are
// reported on the analysed file's include, not only in a file further down.
func TestDeepIncludeReportedAtTop(t *testing.T) {
	files := map[string]string{}
	for i := 0; i < 20; i++ {
		files[fmt.Sprintf("/w/f%d.kiln", i)] = fmt.Sprintf("include f%d.kiln\nspecies S%d %s\n", i+1, i, strings.Repeat("C", i+1))
	}
	files["/w/f20.kiln"] = "species LAST [H]\n"
	ws := NewWorkspace("/w", func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, os.ErrNotExist
	}, DefaultSettings())
	res, err := ws.Analyze(context.Background(), "/w/f0.kiln")
	require.NoError(t, err)
	msgs := messagesWithCode(res, CodeBadInclude)
	require.Len(t, msgs, 1, "%v", res.Diagnostics)
	assert.Equal(t, "includes nested deeper than 16 files, in f16.kiln (through f1.kiln)", msgs[0])
}

// TestOutOfRangeInclude: a thermo block in an included file that the
// analysed file's reactions evaluate outside its range is reported on the
// reaction that needs it.
func TestOutOfRangeInclude(t *testing.T) {
	const lib = `species CH4 C
  nasa7 300 1000 2000
    low   4.9167871967e+00 -1.1483891112e-02  4.2511392855e-05 -4.0608001400e-08  1.3281315423e-11 -1.0262275517e+04 -3.7460786362e+00
    high -2.6391815710e-01  1.4154495153e-02 -6.6354702565e-06  1.4933874433e-09 -1.3089122051e-13 -9.3613814741e+03  2.0295266791e+01
`
	const top = "include lib.kiln\nspecies H [H]\nspecies CH3 [CH3]\nspecies H2 [H][H]\nreaction CH4 + H <=> CH3 + H2   A=6.6e8 n=1.62 Ea=10.84\n"
	files := map[string]string{"/w/lib.kiln": lib, "/w/top.kiln": top}
	ws := NewWorkspace("/w", func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, os.ErrNotExist
	}, DefaultSettings())
	res, err := ws.Analyze(context.Background(), "/w/top.kiln")
	require.NoError(t, err)
	var got []speciesfile.Diagnostic
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeThermoOutOfRange {
			got = append(got, d)
		}
	}
	require.Len(t, got, 1, "%v", res.Diagnostics)
	assert.Equal(t, strings.Index(top, "CH4 + H"), got[0].Span.Start)
	assert.Contains(t, got[0].Message, "CH4: its thermo block (lib.kiln:2) covers 300–2000 K, but this reaction needs it from 298 K to 2500 K")
}

// TestCompositionChecks: a composition naming a non-element is an error
// (and not data); one that disagrees with the SMILES is a warning, and the
// SMILES is used.
func TestCompositionChecks(t *testing.T) {
	res := analyzeText(t, "species E CC\n  composition C2H4\nspecies F CC\n  composition H6C2\nspecies lump\n  composition C10H8X\n")
	mm := messagesWithCode(res, speciesfile.CodeCompositionMismatch)
	require.Len(t, mm, 1, "%v", res.Diagnostics)
	assert.Contains(t, mm[0], "composition C2H4 disagrees with the SMILES, which gives C2H6")
	assert.Equal(t, "C2H6", res.ByName["E"].Formula)
	assert.Equal(t, []string{`composition C10H8X: "X" is not a chemical element symbol`}, messagesWithCode(res, speciesfile.CodeSyntax))
	assert.Empty(t, res.ByName["lump"].Composition, "a composition with a non-element is not data")
}

// TestCpFloor: a given Cp below the translational and rotational heat
// capacity of the species' shape is nonphysical-thermo, for tables and
// polynomials; H2's real Cp (below 7/2 R near 298 K) is not.
func TestCpFloor(t *testing.T) {
	res := analyzeText(t, `species lump
  composition C4H10
  thermo-table
    hf298 -30
    s298 74
    cp 300=1 400=20 500=25
species CH4 C
  nasa7 300 1000 5000
    low   0.1 0 0 0 0 -10000 0
    high  0.1 0 0 0 0 -10000 0
species hyd [H][H]
  thermo-table
    hf298 0
    s298 31.2
    cp 300=6.9 400=6.97 500=7.0 600=7.01 800=7.08 1000=7.21 1500=7.73
`)
	msgs := messagesWithCode(res, speciesfile.CodeNonphysicalThermo)
	require.Len(t, msgs, 2, "%v", msgs)
	assert.Contains(t, msgs[0], "lump: Cp at 300 K is 1.00 cal/(mol·K), below 7.95 cal/(mol·K)")
	assert.Contains(t, msgs[1], "CH4: Cp at 300 K is 0.20 cal/(mol·K)")
}

// TestRateOutOfRange: rates shown at a pressure outside a reaction's
// pressure table say that the edge row is used (no extrapolation); inside
// the table, nothing is said.
func TestRateOutOfRange(t *testing.T) {
	const text = `species CH3 [CH3]
species C2H6 CC
reaction C2H6 <=> CH3 + CH3   A=1e16 n=0 Ea=88
  pressure 0.1atm A=1e15 n=0 Ea=88
  pressure 1atm A=5e15 n=0 Ea=88
  pressure 10atm A=1e16 n=0 Ea=88
`
	set := DefaultSettings()
	set.Pressure = 1013.25 // 0.01 atm
	msgs := messagesWithCode(analyseWith(t, text, set), speciesfile.CodeRateOutOfRange)
	require.Len(t, msgs, 1)
	assert.Contains(t, msgs[0], "the rate at 0.101325 bar is used there")
	assert.Empty(t, messagesWithCode(analyzeText(t, text), speciesfile.CodeRateOutOfRange))
}

// TestNegativeDuplicate: one reaction of a duplicate pair may carry a
// negative A (a pair fitted that way); without `duplicate` it is an error.
func TestNegativeDuplicate(t *testing.T) {
	const head = "species H [H]\nspecies O2 O=O\nspecies O [O]\nspecies OH [OH]\n"
	res := analyzeText(t, head+"reaction H + O2 <=> O + OH   A=1e14 n=0 Ea=15\n  duplicate\nreaction H + O2 <=> O + OH   A=-2e13 n=0 Ea=20\n  duplicate\n")
	assert.Empty(t, messagesWithCode(res, speciesfile.CodeNonphysicalRate))
	res = analyzeText(t, head+"reaction H + O2 <=> O + OH   A=-2e13 n=0 Ea=20\n")
	msgs := messagesWithCode(res, speciesfile.CodeNonphysicalRate)
	require.Len(t, msgs, 1)
	assert.NotContains(t, msgs[0], "1 atm", "a pressure-independent rate")
}

// TestAtomCpFallsAllowed: an atom's tabulated Cp that falls with T by
// electronic contributions (O, Cl; NIST-JANAF-type values entered from
// memory by a tester) is not nonphysical; a fall of several R is.
func TestAtomCpFallsAllowed(t *testing.T) {
	res := analyzeText(t, `units kJ/mol
species O [O]
  thermo-table
    hf298 249.18
    s298 161.06
    cp 298.15=21.911 400=21.482 500=21.257 600=21.124 800=20.990 1000=20.915 1500=20.874
species Cl [Cl]
  thermo-table
    hf298 121.30
    s298 165.19
    cp 298.15=21.838 400=22.467 500=22.744 600=22.781 800=22.550 1000=22.229 1500=21.650
species lump
  composition C4H10
  thermo-table
    hf298 -125
    s298 310
    cp 300=98 400=125 500=100
`)
	msgs := messagesWithCode(res, speciesfile.CodeNonphysicalThermo)
	require.Len(t, msgs, 1, "%v", msgs)
	assert.Contains(t, msgs[0], "lump: Cp falls")
}

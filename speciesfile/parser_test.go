package speciesfile

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// wantDiag is an expected diagnostic: 0-based line, byte columns of start and
// end (end on the same line), code and exact message.
type wantDiag struct {
	line, col, endCol int
	code, msg         string
}

// TestSyntaxErrors checks every syntax error case: the exact message, the
// exact position (the offending token), and that parsing went on.
func TestSyntaxErrors(t *testing.T) {
	cases := []struct {
		src  string
		want []wantDiag
	}{
		{"species 2 C\n", []wantDiag{{0, 8, 9, "syntax", "\"2\" is a number, not a species name"}}},
		{"species M C\n", []wantDiag{{0, 8, 9, "syntax", "\"M\" is reserved and cannot be a species name"}}},
		{"species (+AR) C\n", []wantDiag{{0, 8, 13, "syntax", "\"(+AR)\" is reserved (falloff collider) and cannot be a species name"}}},
		{"species\n", []wantDiag{{0, 7, 7, "syntax", "expected a species name after species"}}},
		{"species X C C\n", []wantDiag{{0, 12, 13, "syntax", "unexpected \"C\" after the SMILES (a SMILES has no blanks)"}}},
		{"species lump\n", []wantDiag{{0, 8, 12, "syntax", "species lump has no SMILES, so it needs a composition line"}}},
		{"frobnicate x\n", []wantDiag{{0, 0, 10, "syntax", "unknown keyword \"frobnicate\": expected one of species, reaction, units, include, group"}}},
		{"  indented\nspecies X C\n", []wantDiag{{0, 2, 10, "syntax", "indented line outside any statement: a statement starts in column 0 with one of species, reaction, units, include, group"}}},
		{"units kJ/mol\nunits kJ/mol\n", []wantDiag{{1, 0, 5, "syntax", "units declared twice (first on line 1)"}}},
		{"species X C\nunits kJ/mol\n", []wantDiag{{1, 0, 5, "syntax", "units must come before any species, reaction or group statement"}}},
		{"units furlong\n", []wantDiag{{0, 6, 13, "syntax", "unknown energy unit \"furlong\": expected kcal/mol, kJ/mol, cal/mol or J/mol"}}},
		{"units\n", []wantDiag{{0, 5, 5, "syntax", "expected an energy unit after units: kcal/mol, kJ/mol, cal/mol or J/mol"}}},
		{"units kJ/mol\n  extra\n", []wantDiag{{1, 2, 7, "syntax", "unexpected indented line: units takes no attribute lines"}}},
		{"include\n", []wantDiag{{0, 7, 7, "syntax", "expected a file path after include"}}},
		{"include a b\n", []wantDiag{{0, 10, 11, "syntax", "unexpected \"b\" after the path (a path has no blanks)"}}},
		{"group G\n  hf298 1\n", []wantDiag{{0, 6, 7, "syntax", "group G is missing its s298 and cp lines"}}},
		{"group G\n  hf298 1\n  s298 2\n  cp 300=1 200=2\n", []wantDiag{{3, 11, 14, "syntax", "cp temperatures must increase: 200 after 300"}}},
		{"group G\n  hf298 1\n  s298 2\n  cp 300=1\n  bogus 3\n", []wantDiag{{4, 2, 7, "syntax", "unknown group attribute \"bogus\": expected one of hf298, s298, cp, source"}}},
		{"group\n", []wantDiag{{0, 5, 5, "syntax", "expected a group name after group, e.g. C-(C)(H)3"}}},
		{"species X C\n  symmetry 0\n", []wantDiag{{1, 11, 12, "syntax", "symmetry needs a positive integer, found \"0\""}}},
		{"species X C\n  symmetry 2\n  symmetry 3\n", []wantDiag{{2, 2, 10, "syntax", "duplicate attribute \"symmetry\" (first given on line 2)"}}},
		{"species X C\n  multiplicity two\n", []wantDiag{{1, 15, 18, "syntax", "multiplicity needs a positive integer, found \"two\""}}},
		{"species X C\n  optical-isomers\n", []wantDiag{{1, 17, 17, "syntax", "expected a positive integer after optical-isomers"}}},
		{"species X C\n  composition c10\n", []wantDiag{{1, 14, 17, "syntax", "malformed composition \"c10\": expected an element symbol at \"c10\""}}},
		{"species X C\n  note\n", []wantDiag{{1, 6, 6, "syntax", "expected text after note"}}},
		{"species X C\n  low 1 2 3 4 5 6 7\n", []wantDiag{{1, 2, 5, "syntax", "\"low\" is only valid inside a nasa7 block"}}},
		{"species X C\n  hf298 1\n", []wantDiag{{1, 2, 7, "syntax", "\"hf298\" is only valid inside a thermo-table block"}}},
		{"species X C\n  source x\n", []wantDiag{{1, 2, 8, "syntax", "\"source\" is only valid inside a nasa7 or thermo-table block"}}},
		{"species X C\n species Y CC\n", []wantDiag{{1, 1, 8, "syntax", "\"species\" is a statement keyword, but this line is indented, so it is read as part of the statement above: a statement keyword belongs in column 0 (remove the leading blanks)"}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n\treaction B <=> C A=1 n=0 Ea=0\n", []wantDiag{{1, 1, 9, "syntax", "\"reaction\" is a statement keyword, but this line is indented, so it is read as part of the statement above: a statement keyword belongs in column 0 (remove the leading blanks)"}}},
		{"group C-(C)(H)3\n  hf298 1\n  s298 2\n  cp 300=1\n  units kJ/mol\n", []wantDiag{{4, 2, 7, "syntax", "\"units\" is a statement keyword, but this line is indented, so it is read as part of the statement above: a statement keyword belongs in column 0 (remove the leading blanks)"}}},
		{"species X C\n  colour red\n", []wantDiag{{1, 2, 8, "syntax", "unknown species attribute \"colour\": expected one of multiplicity, symmetry, optical-isomers, composition, note, nasa7, thermo-table"}}},
		{"species X C\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 7\n", []wantDiag{{1, 2, 7, "syntax", "nasa7 block is missing its high line"}}},
		{"species X C\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6\n    high 1 2 3 4 5 6 7\n", []wantDiag{{2, 19, 19, "syntax", "expected 7 coefficients after low, found 6"}}},
		{"species X C\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 7 8\n    high 1 2 3 4 5 6 7\n", []wantDiag{{2, 22, 23, "syntax", "expected 7 coefficients after low, found 8"}}},
		{"species X C\n  nasa7 300 1000\n", []wantDiag{{1, 2, 7, "syntax", "nasa7 block is missing its low and high lines"}, {1, 16, 16, "syntax", "expected three temperatures after nasa7: TLOW TMID THIGH (K)"}}},
		{"species X C\n  nasa7 1000 300 5000\n    low 1 2 3 4 5 6 7\n    high 1 2 3 4 5 6 7\n", []wantDiag{{1, 8, 21, "syntax", "nasa7 temperatures must satisfy 0 < TLOW < TMID < THIGH"}}},
		{"species X C\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 1.5d13\n    high 1 2 3 4 5 6 7\n", []wantDiag{{2, 20, 26, "syntax", "malformed number \"1.5d13\": the exponent letter is e, not d (write 1.5e13)"}}},
		{"species X C\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 1e999999\n    high 1 2 3 4 5 6 7\n", []wantDiag{{2, 20, 28, "syntax", "number out of range: \"1e999999\""}}},
		{"units kJ/mol\nspecies X C\n  thermo-table\n    hf298 1e306\n    s298 1\n    cp 300=1\n", []wantDiag{{3, 10, 15, "syntax", "number out of range: \"1e306\" overflows when converted to J/mol"}}},
		{"species X C\n  thermo-table\n    hf298 -1\n    s298 1e308\n    cp 300=1\n", []wantDiag{{3, 9, 14, "syntax", "number out of range: \"1e308\" overflows when converted to J/(mol K)"}}},
		{"reaction A <=> B A=1 n=0 Ea=1e308K\n", []wantDiag{{0, 28, 34, "syntax", "number out of range: \"1e308K\" overflows when converted to J/mol"}}},
		{"species X C\n  thermo-table\n    hf298 1\n", []wantDiag{{1, 2, 14, "syntax", "thermo-table is missing its s298 and cp lines"}}},
		{"species X C\n  thermo-table\n    hf298 1\n    s298 1\n    cp 300=1\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 7\n    high 1 2 3 4 5 6 7\n", []wantDiag{{5, 2, 7, "syntax", "a species has either a nasa7 block or a thermo-table, not both"}}},
		{"reaction\n", []wantDiag{{0, 8, 8, "syntax", "expected a reaction equation after reaction, e.g. H + O2 <=> O + OH"}}},
		{"reaction A + B C A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 16, "syntax", "missing arrow: expected <=> or => between reactants and products"}}},
		{"reaction A + B A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 14, "syntax", "missing arrow: expected <=> or => between reactants and products"}}},
		{"reaction A = B A=1 n=0 Ea=0\n", []wantDiag{{0, 11, 12, "syntax", "\"=\" is not an arrow: use <=> (reversible) or => (irreversible)"}}},
		{"reaction OH + OH => H2O2 A = 1e13 n = 0 Ea = 0\n", []wantDiag{{0, 27, 28, "syntax", "\"=\" between A and 1e13: rate parameters are written without blanks around =, e.g. A=1e13 n=0 Ea=0"}}},
		{"reaction A <=> B => C A=1 n=0 Ea=0\n", []wantDiag{{0, 17, 19, "syntax", "second arrow \"=>\": a reaction has exactly one arrow"}}},
		{"reaction <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 12, "syntax", "empty reactant side: expected a species before <=>"}}},
		{"reaction A <=> A=1 n=0 Ea=0\n", []wantDiag{{0, 11, 14, "syntax", "empty product side: expected a species after <=>"}}},
		{"reaction A + <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 11, 12, "syntax", "expected a species name after \"+\""}}},
		{"reaction + A <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 10, "syntax", "expected a species name, found \"+\""}}},
		{"reaction 0 A <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 10, "syntax", "bad coefficient \"0\": must be a positive number"}}},
		{"reaction -1 A <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 11, "syntax", "bad coefficient \"-1\": must be a positive number"}}},
		{"reaction 2 <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 10, "syntax", "expected a species name after coefficient \"2\""}}},
		{"reaction 2 M + A <=> B + M A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 10, "syntax", "M (third body) cannot have a coefficient"}}},
		{"reaction A + M <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 13, 14, "syntax", "M (third body) must appear on both sides"}}},
		{"reaction A (+M) <=> B A=1 n=0 Ea=0\n", []wantDiag{{0, 11, 15, "syntax", "(+M) must appear on both sides"}}},
		{"reaction A (+M) <=> B (+AR) A=1 n=0 Ea=0\n", []wantDiag{{0, 22, 27, "syntax", "falloff collider (+AR) differs from (+M) on the reactant side"}}},
		{"reaction A + M (+M) <=> B + M (+M) A=1 n=0 Ea=0\n", []wantDiag{{0, 13, 14, "syntax", "a reaction cannot have both M and a (+M) falloff collider"}}},
		{"reaction A(+M) <=> B(+M) A=1 n=0 Ea=0\n", []wantDiag{{0, 9, 14, "syntax", "write \"(+M)\" as a separate token: A (+M)"}, {0, 19, 24, "syntax", "write \"(+M)\" as a separate token: B (+M)"}}},
		{"reaction A (+M) + C <=> B (+M) A=1 n=0 Ea=0\n", []wantDiag{{0, 16, 17, "syntax", "unexpected \"+\" after (+M): the falloff collider ends the reactant side"}}},
		{"reaction A <=> B A=1 n=0\n", []wantDiag{{0, 17, 24, "syntax", "incomplete rate parameters: missing Ea= (A=, n= and Ea= are all required)"}}},
		{"reaction A <=> B A=1 n=0 Ea=0 A=2\n", []wantDiag{{0, 30, 33, "syntax", "duplicate A= in rate parameters"}}},
		{"reaction A <=> B A=1 n=0 Ea=0 foo\n", []wantDiag{{0, 30, 33, "syntax", "unexpected \"foo\" in rate parameters: expected A=, n= or Ea="}}},
		{"reaction A <=> B A=1.5d13 n=0 Ea=0\n", []wantDiag{{0, 19, 25, "syntax", "malformed number \"1.5d13\": the exponent letter is e, not d (write 1.5e13)"}}},
		{"reaction A <=> B A=1e999999 n=0 Ea=0\n", []wantDiag{{0, 19, 27, "syntax", "number out of range: \"1e999999\""}}},
		{"reaction A <=> B A=1 n=0 Ea=3furlongs\n", []wantDiag{{0, 28, 37, "syntax", "unknown unit \"furlongs\" in \"3furlongs\": expected kcal/mol, kJ/mol, cal/mol, J/mol or K"}}},
		{"reaction A <=> B A=1 n=0 Ea=\n", []wantDiag{{0, 25, 28, "syntax", "expected a number after Ea="}}},
		{"reaction A <=> B\n", []wantDiag{{0, 9, 16, "no-rate", "reaction has no rate parameters (A=, n=, Ea=)"}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n  low-pressure A=1 n=0 Ea=0\n", []wantDiag{{1, 2, 14, "syntax", "low-pressure needs a falloff reaction marked with (+M) on both sides"}}},
		{"reaction A (+M) <=> B (+M) A=1 n=0 Ea=0\n  troe alpha=0.5 T3=1 T1=2\n", []wantDiag{{1, 7, 26, "syntax", "troe needs a low-pressure line"}}},
		{"reaction A (+M) <=> B (+M) A=1 n=0 Ea=0\n  low-pressure A=1 n=0 Ea=0\n  troe alpha=0.5 T1=2\n", []wantDiag{{2, 7, 21, "syntax", "incomplete troe parameters: missing T3="}}},
		{"reaction A (+M) <=> B (+M) A=1 n=0 Ea=0\n  low-pressure A=1 n=0 Ea=0\n  troe alpha=0.5 T3=1 T1=2 X=3\n", []wantDiag{{2, 27, 30, "syntax", "unexpected \"X=3\" in troe: expected alpha=, T3=, T1= or T2="}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n  efficiencies H2O=2\n", []wantDiag{{1, 2, 14, "syntax", "efficiencies need a third body: M or (+M) in the equation"}}},
		{"reaction A + M <=> B + M A=1 n=0 Ea=0\n  efficiencies H2O=-2 CO2 N2=1 N2=2\n", []wantDiag{{1, 19, 21, "syntax", "efficiency must be >= 0, found -2"}, {1, 22, 25, "syntax", "expected a NAME=VALUE pair, found \"CO2\""}, {1, 31, 33, "syntax", "duplicate efficiency for N2"}}},
		{"reaction A <=> B\n  pressure 1 A=1 n=0 Ea=0\n", []wantDiag{{1, 11, 12, "syntax", "pressure \"1\" needs a unit: atm, bar, Pa, kPa or Torr"}}},
		{"reaction A <=> B\n  pressure 1atm A=1 n=0 Ea=0\n  pressure 0.1atm A=1 n=0 Ea=0\n", []wantDiag{{2, 11, 17, "syntax", "pressures must increase: 0.1atm after 1atm"}}},
		{"reaction A <=> B\n  pressure 1atm\n", []wantDiag{{1, 15, 15, "syntax", "expected A=, n= and Ea= after the pressure"}}},
		{"reaction A <=> B\n  pressure 1psi A=1 n=0 Ea=0\n", []wantDiag{{1, 11, 15, "syntax", "unknown unit \"psi\" in \"1psi\": expected atm, bar, Pa, kPa or Torr"}}},
		{"reaction A => B A=1 n=0 Ea=0\n  reverse A=1 n=0 Ea=0\n", []wantDiag{{1, 2, 9, "syntax", "reverse needs a reversible (<=>) reaction"}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n  duplicate now\n  duplicate\n", []wantDiag{{1, 12, 15, "syntax", "unexpected \"now\" after duplicate"}, {2, 2, 11, "syntax", "duplicate attribute \"duplicate\" (first given on line 2)"}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n  frob 1\n", []wantDiag{{1, 2, 6, "syntax", "unknown reaction attribute \"frob\": expected one of low-pressure, troe, efficiencies, pressure, duplicate, reverse, note"}}},
		{"reaction A + M <=> B + M\n  pressure 1atm A=1 n=0 Ea=0\n", []wantDiag{{1, 11, 28, "syntax", "pressure lines give the rate at each pressure and do not combine with a third body M: remove M from the equation or the pressure lines"}}},
		{"reaction A (+M) <=> B (+M)\n  pressure 1atm A=1 n=0 Ea=0\n", []wantDiag{{1, 11, 28, "syntax", "pressure lines give the rate at each pressure and do not combine with a falloff (+M): use either the falloff form (low-pressure, troe) or the pressure lines"}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n  pressure 1atm A=1 n=0 Ea=0\n", []wantDiag{{0, 17, 29, "unused-rate", "these rate parameters are not used: with pressure lines the rate comes from them (remove these, or the pressure lines)"}}},
		{"reaction A <=> B\n  A=1e13 n=0 Ea=0\n", []wantDiag{{0, 9, 16, "no-rate", "reaction has no rate parameters (A=, n=, Ea=)"}, {1, 2, 8, "syntax", "\"A=1e13\" on a line of its own: the forward rate parameters (A=, n=, Ea=) belong on the reaction line, after the equation"}}},
		{"reaction A <=> B A=1 n=0 Ea=0\n  reverse\n", []wantDiag{{1, 9, 9, "syntax", "expected A=, n= and Ea= after reverse"}}},
		{"x\xffy\n", []wantDiag{{0, 0, 3, "syntax", "unknown keyword \"x\\xffy\": expected one of species, reaction, units, include, group"}, {0, 1, 2, "syntax", "invalid UTF-8 byte 0xFF (ÿ in Latin-1): a .kiln file is UTF-8 text; re-save it as UTF-8"}}},
		{"species X CC\n  note caf\xe9\n", []wantDiag{{1, 10, 11, "syntax", "invalid UTF-8 byte 0xE9 (é in Latin-1): a .kiln file is UTF-8 text; re-save it as UTF-8"}}},
		{"species X CC\n  note \x93x\x94\n", []wantDiag{{1, 7, 8, "syntax", "invalid UTF-8 byte 0x93: a .kiln file is UTF-8 text; re-save it as UTF-8"}}},
		{"species X C\x00\n", []wantDiag{{0, 11, 12, "syntax", "NUL byte in text"}}},
	}
	for _, c := range cases {
		t.Run(c.src, func(t *testing.T) {
			f := Parse("t.kiln", []byte(c.src))
			got := make([]wantDiag, len(f.Diags))
			for i, d := range f.Diags {
				s, e := f.Lines.Position(d.Span.Start), f.Lines.Position(d.Span.End)
				require.Equal(t, s.Line, e.Line, "diagnostic spans one line")
				got[i] = wantDiag{s.Line, s.Col, e.Col, d.Code, d.Message}
				wantSev := SeverityError
				if d.Code == CodeNoRate || d.Code == CodeUnusedRate {
					wantSev = SeverityWarning
				}
				assert.Equal(t, wantSev, d.Severity)
			}
			assert.Equal(t, c.want, got)
			assertLossless(t, f)
		})
	}
}

// assertLossless checks that the statements tile the source exactly.
func assertLossless(t *testing.T, f *File) {
	t.Helper()
	var sb strings.Builder
	prev := 0
	for i := range f.Stmts {
		sp := f.StmtSpan(i)
		require.Equal(t, prev, sp.Start, "statements must be contiguous")
		require.LessOrEqual(t, sp.Start, sp.End)
		b := f.StmtBody(i)
		require.True(t, sp.Start <= b.Start && b.Start <= b.End && b.End <= sp.End, "body %v inside span %v", b, sp)
		sb.Write(f.Src[sp.Start:sp.End])
		prev = sp.End
	}
	require.Equal(t, string(f.Src), sb.String())
	require.Empty(t, tokenProblems(f))
	for _, d := range f.Diags {
		require.True(t, 0 <= d.Span.Start && d.Span.Start <= d.Span.End && d.Span.End <= len(f.Src), "diagnostic span %v in [0,%d]", d.Span, len(f.Src))
	}
}

func parseFile(t *testing.T, path string) *File {
	t.Helper()
	src, err := os.ReadFile(path)
	require.NoError(t, err)
	return Parse(path, src)
}

func syntaxDiags(f *File) []Diagnostic {
	var out []Diagnostic
	for _, d := range f.Diags {
		if d.Code == CodeSyntax {
			out = append(out, d)
		}
	}
	return out
}

func TestAllStatements(t *testing.T) {
	f := parseFile(t, "../testdata/speciesfile/all-statements.kiln")
	require.Empty(t, f.Diags)
	assertLossless(t, f)
	// (assertLossless checked every token's text against the source)
	tok := func(tk Token) string { return tk.Text }
	// text returns the source of span r of statement st
	text := func(st Stmt, r RelSpan) string { a := f.Abs(st, r); return string(f.Src[a.Start:a.End]) }

	assert.Equal(t, "kJ/mol", f.EnergyUnit)
	assert.Equal(t, "J/mol/K", f.EntropyUnit)
	require.Len(t, f.Includes, 1)
	assert.Equal(t, "shared/c0-core.kiln", f.Includes[0].Path.Text)
	assert.Equal(t, "shared/c0-core.kiln", tok(f.Includes[0].Path))

	require.Len(t, f.Groups, 1)
	g := f.Groups[0]
	assert.Equal(t, "O-(Cd)(C)", g.Name.Text)
	// exact conversions: kJ/mol → J/mol is ×1000; floats compared to 1e-9 relative.
	assert.InEpsilon(t, -127600, g.Hf298.SI, 1e-12)
	assert.Equal(t, "J/mol/K", g.S298.Unit)
	assert.InEpsilon(t, 40.6, g.S298.SI, 1e-12)
	require.Len(t, g.Cp, 7)
	assert.Equal(t, 300.0, g.Cp[0].T.SI)
	assert.InEpsilon(t, 14.2, g.Cp[0].Cp.SI, 1e-12)
	assert.Equal(t, "demo numbers, not from a publication", g.Source.Text)
	assert.Len(t, g.Attrs, 4)

	byName := map[string]*Species{}
	for _, s := range f.Species {
		byName[s.Name.Text] = s
	}
	assert.Equal(t, "C#C", byName["ethyne"].SMILES.Text, "a # inside a token is not a comment")
	et := byName["ethanol"]
	require.NotNil(t, et)
	assert.Equal(t, "CCO", et.SMILES.Text)
	assert.Equal(t, 1, et.Multiplicity.Value)
	assert.Equal(t, 3, et.Symmetry.Value)
	assert.Equal(t, 1, et.OpticalIsomers.Value)
	assert.Equal(t, "solvent feed, thermo from our estimate", et.Note.Text)
	require.NotNil(t, et.NASA7)
	assert.Equal(t, 300.0, et.NASA7.TLow.SI)
	assert.Equal(t, 1000.0, et.NASA7.TMid.SI)
	assert.Equal(t, 5000.0, et.NASA7.THigh.SI)
	assert.Equal(t, 4.8586957, et.NASA7.Low[0].Value)
	assert.Equal(t, -9.4730202, et.NASA7.High[6].Value)
	assert.Equal(t, "demo block", et.NASA7.Source.Text)
	assert.True(t, strings.HasPrefix(text(et, et.NASA7.LowSpan), "low "))
	assert.True(t, strings.HasPrefix(text(et, et.NASA7.Span), "nasa7 300"))
	assert.True(t, strings.HasSuffix(text(et, et.NASA7.Span), "source demo block"))
	require.Len(t, et.Attrs, 5)
	assert.Equal(t, "nasa7", et.Attrs[4].Key.Text)
	assert.Equal(t, et.NASA7.Span, et.Attrs[4].Span, "a block attribute spans its block lines")

	lump := byName["tar-lump"]
	assert.Nil(t, lump.SMILES)
	assert.Equal(t, "C10H8", lump.Composition.Text)
	assert.Equal(t, []ElementCount{{"C", 10}, {"H", 8}}, lump.Formula)
	require.NotNil(t, lump.Table)
	assert.InEpsilon(t, 150600, lump.Table.Hf298.SI, 1e-12)
	assert.InEpsilon(t, 335.6, lump.Table.S298.SI, 1e-12)
	assert.Len(t, lump.Table.Cp, 7)
	assert.Equal(t, "demo numbers", lump.Table.Source.Text)

	require.Len(t, f.Reactions, 6)
	r0 := f.Reactions[0]
	assert.Equal(t, "H + O2 <=> O + OH", text(r0, r0.Equation))
	assert.True(t, r0.Reversible)
	assert.Equal(t, "<=>", r0.Arrow.Text)
	assert.Equal(t, []string{"H", "O2"}, termNames(r0.Reactants))
	assert.Equal(t, []string{"O", "OH"}, termNames(r0.Products))
	assert.Equal(t, 3.52e16, r0.Rate.A.SI)
	assert.Equal(t, -0.7, r0.Rate.N.SI)
	assert.InEpsilon(t, 71420, r0.Rate.Ea.SI, 1e-12)

	r1 := f.Reactions[1]
	require.NotNil(t, r1.Falloff)
	assert.Equal(t, "(+M)", r1.Falloff.Text)
	assert.Equal(t, "M", r1.FalloffCollider())
	assert.False(t, r1.ThirdBody)
	assert.Equal(t, []string{"CH3", "CH3"}, termNames(r1.Reactants))
	assert.Equal(t, 1.27e41, r1.LowPressure.A.SI)
	assert.Equal(t, 0.62, r1.Troe.Alpha.SI)
	assert.Equal(t, 73.0, r1.Troe.T3.SI)
	assert.Equal(t, 1180.0, r1.Troe.T1.SI)
	assert.Equal(t, 5000.0, r1.Troe.T2.SI)
	require.Len(t, r1.Efficiencies, 3)
	assert.Equal(t, "AR", r1.Efficiencies[2].Name.Text)
	assert.Equal(t, 0.7, r1.Efficiencies[2].Value.SI)

	r2 := f.Reactions[2]
	assert.True(t, r2.ThirdBody)
	assert.Nil(t, r2.Falloff)
	assert.Equal(t, []string{"H", "O2"}, termNames(r2.Reactants), "M is not a term")
	assert.Equal(t, []string{"HO2"}, termNames(r2.Products))

	r3 := f.Reactions[3]
	assert.Nil(t, r3.Rate)
	require.Len(t, r3.Pressures, 2)
	// 0.1 atm = 10132.5 Pa exactly (1 atm = 101325 Pa by definition)
	assert.InEpsilon(t, 10132.5, r3.Pressures[0].P.SI, 1e-12)
	assert.Equal(t, "atm", r3.Pressures[0].P.Unit)
	assert.Equal(t, 1.0e30, r3.Pressures[0].Rate.A.SI)

	r4 := f.Reactions[4]
	require.NotNil(t, r4.Duplicate)
	// Ea=-1.63kcal/mol → -1.63*4184 J/mol
	assert.InEpsilon(t, -1.63*4184, r4.Rate.Ea.SI, 1e-12)
	assert.Equal(t, "kcal/mol", r4.Rate.Ea.Unit)
	// Ea=20000K → 20000 * R
	assert.InEpsilon(t, 20000*8.314462618, r4.Reverse.Ea.SI, 1e-12)
	assert.Equal(t, "demo", r4.Note.Text)

	r5 := f.Reactions[5]
	assert.False(t, r5.Reversible)
	require.Len(t, r5.Reactants, 1)
	assert.Equal(t, 2.0, r5.Reactants[0].Coeff)
	assert.Equal(t, "2", r5.Reactants[0].CoeffTok.Text)
	assert.Equal(t, "OH", r5.Reactants[0].Name.Text)
	assert.Equal(t, 1.0, f.Reactions[0].Reactants[0].Coeff, "default coefficient")
	assert.Nil(t, f.Reactions[0].Reactants[0].CoeffTok)

	// every token's Text is its source bytes
	for _, s := range f.Species {
		assert.Equal(t, s.Name.Text, tok(s.Name))
		assert.Equal(t, "species", s.Keyword().Text)
	}
}

func termNames(ts []Term) []string {
	out := make([]string, len(ts))
	for i, t := range ts {
		out[i] = t.Name.Text
	}
	return out
}

// TestUnitResolution checks SI conversion of every unit (exact constants:
// 1 cal = 4.184 J, R = 8.314462618 J/(mol K), 1 atm = 101325 Pa, 1 bar = 1e5
// Pa, 1 Torr = 101325/760 Pa). Tolerance 1e-12 relative: one or two float
// roundings of the product.
func TestUnitResolution(t *testing.T) {
	for _, c := range []struct {
		fileUnit string
		ea       string
		wantEa   float64
		s298     string
		wantS    float64
	}{
		{"", "10", 41840, "10", 41.84},
		{"units kcal/mol\n", "10", 41840, "10", 41.84},
		{"units kJ/mol\n", "10", 10000, "10", 10},
		{"units cal/mol\n", "10", 41.84, "10", 41.84},
		{"units J/mol\n", "10", 10, "10", 10},
		{"units J/mol\n", "10kJ/mol", 10000, "10cal/mol/K", 41.84},
		{"", "10J/mol", 10, "10J/mol/K", 10},
		{"", "10cal/mol", 41.84, "10kJ/mol/K", 10000},
		{"", "1000K", 8314.462618, "1kcal/mol/K", 4184},
	} {
		src := c.fileUnit + "species X C\n  thermo-table\n    hf298 " + c.ea + "\n    s298 " + c.s298 + "\n    cp 300=1\n" +
			"reaction X => X A=1 n=0 Ea=" + c.ea + "\n"
		f := Parse("u.kiln", []byte(src))
		if c.ea == "1000K" {
			// K is only an activation-energy unit
			require.Len(t, f.Diags, 1, src)
			assert.Contains(t, f.Diags[0].Message, `unknown unit "K"`)
		} else {
			require.Empty(t, f.Diags, src)
			assert.InEpsilon(t, c.wantEa, f.Species[0].Table.Hf298.SI, 1e-12)
		}
		assert.InEpsilon(t, c.wantS, f.Species[0].Table.S298.SI, 1e-12, src)
		assert.InEpsilon(t, c.wantEa, f.Reactions[0].Rate.Ea.SI, 1e-12, src)
	}
	for unit, pa := range map[string]float64{"atm": 101325, "bar": 1e5, "Pa": 1, "kPa": 1000, "Torr": 101325.0 / 760} {
		f := Parse("p.kiln", []byte("reaction A => B\n  pressure 2"+unit+" A=1 n=0 Ea=0\n"))
		require.Empty(t, f.Diags, unit)
		assert.InEpsilon(t, 2*pa, f.Reactions[0].Pressures[0].P.SI, 1e-12, unit)
	}
}

func TestNumberGrammar(t *testing.T) {
	good := map[string]float64{"2": 2, "-0.97": -0.97, "1.5e13": 1.5e13, "1.5E+13": 1.5e13, ".5": 0.5, "3.": 3, "+4": 4, "1e-400": 0}
	for s, v := range good {
		f := Parse("n.kiln", []byte("reaction A => B A=1 n="+s+" Ea=0\n"))
		require.Empty(t, f.Diags, s)
		assert.Equal(t, v, f.Reactions[0].Rate.N.Value, s)
	}
	for _, s := range []string{"1.5d13", "1.5D13", "0x10", "1_000", "inf", "NaN", "1e999999", "-1e999999", "e5", ".", "1..2", "1e"} {
		f := Parse("n.kiln", []byte("reaction A => B A=1 n="+s+" Ea=0\n"))
		require.Len(t, f.Diags, 1, s)
		assert.Equal(t, CodeSyntax, f.Diags[0].Code)
		assert.Nil(t, f.Reactions[0].Rate.N, s)
	}
}

// TestRecovery: a bad statement or attribute line does not lose the rest.
func TestRecovery(t *testing.T) {
	src := "species A C\nfrobnicate 1 2\n  more junk\nspecies B CC\n  symmetry x\n  note kept\n" +
		"reaction A <=> B A=1 n=0 Ea=oops\n  duplicate\nreaction A => B A=1 n=0 Ea=0\n"
	f := Parse("r.kiln", []byte(src))
	assertLossless(t, f)
	require.Len(t, f.Stmts, 5)
	_, bad := f.Stmts[1].(*BadStmt)
	assert.True(t, bad)
	require.Len(t, f.Species, 2)
	assert.Equal(t, "B", f.Species[1].Name.Text)
	assert.Nil(t, f.Species[1].Symmetry)
	assert.Equal(t, "kept", f.Species[1].Note.Text)
	require.Len(t, f.Reactions, 2)
	assert.NotNil(t, f.Reactions[0].Duplicate)
	assert.Equal(t, 1.0, f.Reactions[0].Rate.A.Value, "good parameters next to a bad one are kept")
	assert.Nil(t, f.Reactions[0].Rate.Ea)
	assert.Len(t, syntaxDiags(f), 3)
}

// TestTrivia: comments, blank lines, and where they attach.
func TestTrivia(t *testing.T) {
	src := "# header\n\nspecies A C   # trailing\n  # inside\n\n  symmetry 2\n# before B\n\nspecies B CC\n  note x # y\n# tail\n"
	f := Parse("c.kiln", []byte(src))
	require.Empty(t, f.Diags)
	assertLossless(t, f)
	require.Len(t, f.Stmts, 2)
	a, b := f.StmtBody(0), f.StmtSpan(1)
	assert.Equal(t, "species A C   # trailing\n  # inside\n\n  symmetry 2", src[a.Start:a.End])
	assert.Equal(t, 2, f.Species[0].Symmetry.Value, "blank and comment lines do not end a statement")
	assert.True(t, strings.HasPrefix(src[b.Start:], "# before B"), "leading comments belong to the next statement")
	assert.True(t, strings.HasSuffix(src[:b.End], "# tail\n"), "trailing trivia belongs to the last statement")
	assert.Equal(t, "x", f.Species[1].Note.Text)

	for _, s := range []string{"", "\n", "# only a comment", "\xef\xbb\xbf", "\r\n\r\n  # x\r"} {
		f := Parse("e.kiln", []byte(s))
		assert.Empty(t, f.Diags, "%q", s)
		assertLossless(t, f)
		if s == "" {
			assert.Empty(t, f.Stmts)
		} else {
			require.Len(t, f.Stmts, 1)
			_, ok := f.Stmts[0].(*Trivia)
			assert.True(t, ok)
		}
	}
}

// TestLineEndingsAndBOM: CRLF, lone CR, BOM and tabs give the same tree.
func TestLineEndingsAndBOM(t *testing.T) {
	base := "units kJ/mol\nspecies A [CH3]\n\tsymmetry 6\n  nasa7 300 1000 5000\n\t\tlow 1 2 3 4 5 6 7\n    high 1 2 3 4 5 6 7\nreaction A + A => B A=1 n=0 Ea=0\nspecies B CC"
	for _, v := range []struct{ name, src, nl string }{
		{"lf", base, "\n"},
		{"crlf", strings.ReplaceAll(base, "\n", "\r\n"), "\r\n"},
		{"cr", strings.ReplaceAll(base, "\n", "\r"), "\n"},
		{"bom", "\xef\xbb\xbf" + base, "\n"},
	} {
		t.Run(v.name, func(t *testing.T) {
			f := Parse(v.name, []byte(v.src))
			require.Empty(t, f.Diags)
			assertLossless(t, f)
			assert.Equal(t, v.nl, f.Newline)
			assert.Equal(t, v.name == "bom", f.BOM)
			assert.Equal(t, "kJ/mol", f.EnergyUnit, "the units keyword is found after a BOM")
			require.Len(t, f.Species, 2)
			assert.Equal(t, 6, f.Species[0].Symmetry.Value)
			assert.Equal(t, 7.0, f.Species[0].NASA7.High[6].Value)
			assert.Equal(t, "B", f.Reactions[0].Products[0].Name.Text)
			assert.Equal(t, 0, f.StmtSpan(0).Start, "the BOM belongs to the first statement")
		})
	}
}

func TestHostileInputs(t *testing.T) {
	long := "species X " + strings.Repeat("C", MaxLineSize+10) + "\n"
	for _, s := range []string{"\x00", "\xff\xfe", "\r", "\r\r\n\n", "species\x00 C", "  \n\t", "reaction", "reaction +", "reaction (+M)", "reaction M", "reaction M <=> M", "reaction 2", long} {
		f := Parse("h.kiln", []byte(s))
		assertLossless(t, f)
	}
	f := Parse("h.kiln", []byte(long))
	require.Len(t, f.Diags, 1)
	assert.Contains(t, f.Diags[0].Message, "line too long")
	f = Parse("h.kiln", []byte("reaction "+strings.Repeat("A + ", 70)+"A => B A=1 n=0 Ea=0"))
	require.Len(t, f.Diags, 1)
	assert.Equal(t, "too many terms: at most 64 per side", f.Diags[0].Message)
}

// TestTestdata parses testdata/speciesfile: files named bad-*.kiln must give
// at least one syntax error (the expected messages are listed in the file as
// "# expect: MESSAGE" lines), the others none.
func TestTestdata(t *testing.T) {
	paths, err := filepath.Glob("../testdata/speciesfile/*.kiln")
	require.NoError(t, err)
	require.NotEmpty(t, paths)
	for _, path := range paths {
		t.Run(filepath.Base(path), func(t *testing.T) {
			f := parseFile(t, path)
			assertLossless(t, f)
			var want []string
			for _, line := range strings.Split(string(f.Src), "\n") {
				if m, ok := strings.CutPrefix(line, "# expect: "); ok {
					want = append(want, strings.TrimRight(m, "\r"))
				}
			}
			var got []string
			for _, d := range f.Diags {
				got = append(got, d.Message)
			}
			if strings.HasPrefix(filepath.Base(path), "bad-") {
				require.NotEmpty(t, want, "bad files list their expected messages")
			}
			assert.Equal(t, want, got)
		})
	}
}

// TestConsistencyReader covers the reader's part of issue 14: a bounded
// stoichiometric coefficient (case 13), "did you mean" for misspelt
// keywords and attributes, and a hint when an equation lacks blanks
// (case 14).
func TestConsistencyReader(t *testing.T) {
	cases := []struct{ src, want string }{
		{"reaction 1e10 H2 => 2e10 H\n", `coefficient "1e10" is too large: at most 1000`},
		{"reaction 2 H2 => 1001 H\n", `coefficient "1001" is too large`},
		{"specie H [H]\n", `did you mean "species"?`},
		{"Species H [H]\n", `did you mean "species"?`},
		{"raection H => H\n", `did you mean "reaction"?`},
		{"species H [H]\n  multiplicty 2\n", `did you mean "multiplicity"?`},
		{"reaction H + H <=> H2\n  duplicat\n", `did you mean "duplicate"?`},
		{"group C-(C)(H)3\n  hf29 1\n", `did you mean "hf298"?`},
		{"reaction CH4+OH=>CH3+H2O\n", `put blanks around the arrow and around each +`},
	}
	for _, c := range cases {
		f := Parse("t.kiln", []byte(c.src))
		var msgs []string
		for _, d := range f.Diags {
			msgs = append(msgs, d.Message)
		}
		assert.Contains(t, strings.Join(msgs, "\n"), c.want, c.src)
	}
	// A coefficient at the bound is accepted.
	f := Parse("t.kiln", []byte("reaction 1000 H2 => 500 H4\n"))
	require.Len(t, f.Diags, 1)
	assert.Equal(t, CodeNoRate, f.Diags[0].Code)
	// An equation with a syntax error gets that error only, no no-rate.
	f = Parse("t.kiln", []byte("reaction H + O2 <=>\n"))
	require.Len(t, f.Diags, 1)
	assert.Equal(t, CodeSyntax, f.Diags[0].Code)
	// Nothing is suggested for words far from every keyword.
	f = Parse("t.kiln", []byte("xyzzy H\n"))
	assert.NotContains(t, f.Diags[0].Message, "did you mean")
}

// TestErrorIn: the errors of a block are found by offset, the end
// included, in a file with many statements.
func TestErrorIn(t *testing.T) {
	var b strings.Builder
	for i := 0; i < 200; i++ {
		b.WriteString("species A" + strings.Repeat("x", i%7) + " C\n  nasa7 300 1000 3000\n")
	}
	f := Parse("t.kiln", []byte(b.String()))
	require.NotEmpty(t, f.Diags)
	for _, sp := range f.Species[:5] {
		assert.True(t, f.ErrorIn(f.Abs(sp, sp.NASA7.Span)), "missing low/high lines")
		assert.False(t, f.ErrorIn(f.Abs(sp, sp.Name.Span)))
	}
}

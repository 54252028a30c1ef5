package ide

import (
	"context"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

func analyse(t *testing.T, files map[string]string, main string) *Index {
	t.Helper()
	ws := analysis.NewWorkspace("/w", func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, context.Canceled
	}, analysis.DefaultSettings())
	r, err := ws.Analyze(context.Background(), main)
	require.NoError(t, err)
	return NewIndex(r)
}

func apply(t *testing.T, src string, edits []analysis.Edit) string {
	t.Helper()
	out, err := analysis.ApplyEdits([]byte(src), edits)
	require.NoError(t, err)
	return string(out)
}

// tokens returns the non-blank runs of src, which formatting must keep.
func tokens(src string) []string { return strings.Fields(src) }

func TestFormatKeepsTokensAndIsIdempotent(t *testing.T) {
	cases := []string{
		"species  a   C\n",
		"species a C\r\n   symmetry    2\r\n\tnasa7 300 1000 5000\r\n\t\tlow 1 2 3 4 5 6 7\r\n  high 1 2 3 4 5 6 7\r\n",
		"# header   comment   \n\nreaction  A  +  B <=> C   A=1 n=0 Ea=0   # trailing   comment\n   efficiencies  A=2   B=3\n",
		"species t\n composition C2H6\n  thermo-table\n hf298 1\n     s298 2\n   cp 300=1 400=2\n      source  a   b  # c\n",
		"species e C#C   # ethyne; the # in the SMILES is part of the token\n",
		"bad line here\n  with   continuation\nspecies x C\n",
		"species x C",
		"species x C\n   \n\t\n  note   keep   these   blanks   \n",
		"species é C\n    note 🔥 emoji\n",
	}
	for _, src := range cases {
		f := speciesfile.Parse("/w/f.kiln", []byte(src))
		once := apply(t, src, Format(f))
		assert.Equal(t, tokens(src), tokens(once), "formatting changed tokens of %q", src)
		g := speciesfile.Parse("/w/f.kiln", []byte(once))
		assert.Empty(t, Format(g), "formatting %q again must change nothing; first pass gave %q", src, once)
		assert.Equal(t, len(f.Stmts), len(g.Stmts), "same statements after formatting %q", src)
	}
}

func TestFormatLayout(t *testing.T) {
	src := "species  x   C   # c\n      symmetry  2\n nasa7 300 1000 5000\n low 1 2 3 4 5 6 7\n high 1 2 3 4 5 6 7\n"
	f := speciesfile.Parse("/w/f.kiln", []byte(src))
	want := "species x C   # c\n  symmetry 2\n  nasa7 300 1000 5000\n    low   1  2  3  4  5  6  7\n    high  1  2  3  4  5  6  7\n"
	assert.Equal(t, want, apply(t, src, Format(f)))
}

func TestFormatLeavesBrokenStatements(t *testing.T) {
	src := "species x C\n  symmetry   two\n"
	f := speciesfile.Parse("/w/f.kiln", []byte(src))
	require.NotEmpty(t, f.Diags, "the fixture must have a syntax error")
	assert.Empty(t, Format(f))
}

func TestValidName(t *testing.T) {
	for _, ok := range []string{"OH", "C2H5", "tar-lump", "n-C3H7", "é"} {
		assert.NoError(t, ValidName(ok), ok)
	}
	for _, bad := range []string{"", "a b", "42", "1e5", "M", "(+M)", "<=>", "=>", "+", "=", "#x", "a=b", "(+AR)"} {
		assert.Error(t, ValidName(bad), bad)
	}
}

func TestSparkline(t *testing.T) {
	assert.Equal(t, "▁▂▃▄▅▆▇█", sparkline([]float64{0, 1, 2, 3, 4, 5, 6, 7}))
	assert.Equal(t, "▄▄▄", sparkline([]float64{5, 5, 5}), "a flat series sits mid-height")
}

func TestAtAndNavigation(t *testing.T) {
	files := map[string]string{
		"/w/main.kiln": "include core.kiln\nreaction H + OH <=> H2O   A=4.5e22 n=-2 Ea=0\n  efficiencies H2O=6\n",
		"/w/core.kiln": "species H [H]\nspecies OH [OH]\nspecies H2O O\n",
	}
	x := analyse(t, files, "/w/main.kiln")
	src := files["/w/main.kiln"]
	at := strings.Index(src, "OH <=>")
	o, ok := x.At("/w/main.kiln", at)
	require.True(t, ok)
	assert.Equal(t, KindSpeciesUse, o.Kind)
	assert.Equal(t, "OH", o.Name)
	// The end of a token still finds it (cursor just after the name).
	o, ok = x.At("/w/main.kiln", at+2)
	require.True(t, ok)
	assert.Equal(t, "OH", o.Name)
	// Between tokens: the reaction statement.
	o, ok = x.At("/w/main.kiln", strings.Index(src, "<=>")+1)
	require.True(t, ok)
	assert.Equal(t, KindReactionStmt, o.Kind)

	defs := Definition(x, "/w/main.kiln", at)
	require.Len(t, defs, 1)
	assert.Equal(t, "/w/core.kiln", defs[0].File)
	assert.Equal(t, "OH", files["/w/core.kiln"][defs[0].Span.Start:defs[0].Span.End])

	refs := References(x, "/w/main.kiln", strings.Index(src, "H2O"), true)
	assert.Len(t, refs, 3, "declaration, term and efficiency")

	edits, err := Rename([]*Index{x}, "H2O", "water")
	require.NoError(t, err)
	assert.Len(t, edits, 3)
	_, err = Rename([]*Index{x}, "H2O", "OH")
	assert.Error(t, err, "renaming onto an existing species is refused")
	_, _, err = PrepareRename(x, "/w/main.kiln", strings.Index(src, "<=>"))
	assert.ErrorIs(t, err, ErrNotRenamable)
}

func TestDeclareEdit(t *testing.T) {
	src := "species A C\n  note x\nreaction A <=> B\n"
	f := speciesfile.Parse("/w/f.kiln", []byte(src))
	out := apply(t, src, []analysis.Edit{DeclareEdit(f, "B")})
	assert.Equal(t, "species A C\n  note x\nspecies B ?\nreaction A <=> B\n", out)
	// The placeholder must be reported at the new line, pointing the user at it.
	x := analyse(t, map[string]string{"/w/f.kiln": out}, "/w/f.kiln")
	found := false
	for _, d := range x.Result().Diagnostics {
		if d.Code == speciesfile.CodeBadSMILES || d.Code == speciesfile.CodeSyntax {
			found = found || strings.Contains(out[d.Span.Start:], "?")
		}
	}
	assert.True(t, found, "the `?` placeholder is reported: %v", x.Result().Diagnostics)

	noSpecies := "reaction A <=> B\n"
	f = speciesfile.Parse("/w/g.kiln", []byte(noSpecies))
	assert.Equal(t, "species A ?\nreaction A <=> B\n", apply(t, noSpecies, []analysis.Edit{DeclareEdit(f, "A")}))
	// A reference-library name gets the library's structure, and the
	// declared species is then clean; a non-ground-state entry gets its
	// multiplicity too.
	lib := "species CH4 C\nreaction CH4 + OH <=> CH3 + H2O  A=1e7 n=1.8 Ea=2.8\nreaction CH2(S) + CH4 <=> CH3 + CH3  A=1e13 n=0 Ea=0\n"
	f = speciesfile.Parse("/w/l.kiln", []byte(lib))
	out = apply(t, lib, []analysis.Edit{DeclareEdit(f, "OH")})
	assert.Equal(t, "species CH4 C\nspecies OH [OH]\n"+lib[len("species CH4 C\n"):], out)
	f = speciesfile.Parse("/w/l.kiln", []byte(out))
	out = apply(t, out, []analysis.Edit{DeclareEdit(f, "CH2(S)")})
	assert.Contains(t, out, "species OH [OH]\nspecies CH2(S) [CH2]\n  multiplicity 1\nreaction")
	for _, name := range []string{"CH3", "H2O"} {
		f = speciesfile.Parse("/w/l.kiln", []byte(out))
		out = apply(t, out, []analysis.Edit{DeclareEdit(f, name)})
	}
	x = analyse(t, map[string]string{"/w/l.kiln": out}, "/w/l.kiln")
	for _, d := range x.Result().Diagnostics {
		assert.NotEqual(t, speciesfile.SeverityError, d.Severity, "%s: %s", d.Code, d.Message)
	}
	for _, sp := range x.Result().Species {
		require.NotNil(t, sp.Estimate, sp.Name)
		assert.Equal(t, sp.Name, sp.Estimate.Library, "declared as the library's own species")
	}
}

func TestFoldingRanges(t *testing.T) {
	src := "# one\n# two\nspecies A C\n  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 7\n    high 1 2 3 4 5 6 7\nspecies B C\n"
	f := speciesfile.Parse("/w/f.kiln", []byte(src))
	var lines [][2]int
	for _, fr := range FoldingRanges(f) {
		lines = append(lines, [2]int{f.Lines.Line(fr.Start), f.Lines.Line(fr.End)})
	}
	assert.Contains(t, lines, [2]int{0, 1}, "comment run")
	assert.Contains(t, lines, [2]int{2, 5}, "species statement")
	assert.Contains(t, lines, [2]int{3, 5}, "nasa7 block")
	assert.NotContains(t, lines, [2]int{6, 6}, "single-line statements do not fold")
}

// TestHoverTableRange (issue 14, case 10): hover follows the one rule for
// tables that summary follows: no Cp outside the table's temperatures, the
// interpolated value inside.
func TestHoverTableRange(t *testing.T) {
	src := "species lump\n  composition C2H2\n  thermo-table\n    hf298 54.2\n    s298 48.0\n    cp 400=12.0 500=13.1 600=14.0\n"
	x := analyse(t, map[string]string{"/w/a.kiln": src}, "/w/a.kiln")
	h, ok := Hover(x, "/w/a.kiln", strings.Index(src, "lump"), analysis.DefaultSettings(), false)
	require.True(t, ok)
	lines := map[string]string{}
	for _, l := range strings.Split(h.Text, "\n") {
		for _, k := range []string{"Cp 300 K", "Cp 500 K", "Cp 800 K"} {
			if strings.Contains(l, k) {
				lines[k] = l
			}
		}
	}
	assert.Contains(t, lines["Cp 500 K"], "13.1")
	assert.Contains(t, lines["Cp 300 K"], "—")
	assert.NotContains(t, lines["Cp 300 K"], "12.0")
	assert.Contains(t, lines["Cp 800 K"], "—")
	assert.NotContains(t, lines["Cp 800 K"], "14.0")
}

// TestHoverRefusal: hover on a species kiln cannot estimate says why (as
// check words it) and how to go on.
func TestHoverRefusal(t *testing.T) {
	src := "species tetrazole c1nnn[nH]1\n"
	x := analyse(t, map[string]string{"/w/a.kiln": src}, "/w/a.kiln")
	h, ok := Hover(x, "/w/a.kiln", strings.Index(src, "tetrazole"), analysis.DefaultSettings(), false)
	require.True(t, ok)
	assert.Contains(t, h.Text, "kiln cannot estimate it: atom 3 (N) has no group: no group in the tables has a centre of type NazN")
	assert.Contains(t, h.Text, "Give the species a nasa7 or thermo-table block")
}

// TestHoverLibraryColumn: a reference-library species' column is headed by
// its source, not "estimated".
func TestHoverLibraryColumn(t *testing.T) {
	src := "species O2 O=O\n"
	x := analyse(t, map[string]string{"/w/a.kiln": src}, "/w/a.kiln")
	h, ok := Hover(x, "/w/a.kiln", strings.Index(src, "O2"), analysis.DefaultSettings(), true)
	require.True(t, ok)
	assert.NotContains(t, h.Text, "| estimated |")
	assert.Contains(t, h.Text, "library")
}

// "Declare species NAME" for a formula in another element order than the
// library's name takes the one library species with that formula; a
// formula several library species share (isomers, spin states) or none
// has gets the placeholder.
func TestDeclareFormulaName(t *testing.T) {
	for name, want := range map[string]string{
		"CF3H": "FC(F)F", "ClOH": "OCl", "H2ON": Placeholder, "CHNO": Placeholder,
		"C2H4": Placeholder, "Xy2": Placeholder, "ethyl": Placeholder, "CH3": "[CH3]",
	} {
		assert.Equal(t, want, declaredStructure(name, "\n"), name)
	}
}

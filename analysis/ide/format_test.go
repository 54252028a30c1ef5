package ide

import (
	"context"
	"fmt"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"golang.org/x/tools/txtar"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// formatText formats src once.
func formatText(t *testing.T, name, src string) string {
	t.Helper()
	return apply(t, src, Format(speciesfile.Parse(name, []byte(src))))
}

// formatInputs returns every formatting fixture (inputs and goldens of
// testdata/lsp/format*.txtar) and every example mechanism, by name.
func formatInputs(t *testing.T) map[string]string {
	t.Helper()
	out := map[string]string{}
	archives, err := filepath.Glob("../../testdata/lsp/format*.txtar")
	require.NoError(t, err)
	require.NotEmpty(t, archives)
	for _, a := range archives {
		ar, err := txtar.ParseFile(a)
		require.NoError(t, err)
		for _, f := range ar.Files {
			out[filepath.Base(a)+"/"+f.Name] = string(f.Data)
		}
	}
	examples, err := filepath.Glob("../../examples/*.kiln")
	require.NoError(t, err)
	require.GreaterOrEqual(t, len(examples), 2)
	for _, e := range examples {
		b, err := os.ReadFile(e)
		require.NoError(t, err)
		out[e] = string(b)
	}
	return out
}

func TestFormatFixturesIdempotentAndBlankOnly(t *testing.T) {
	for name, src := range formatInputs(t) {
		once := formatText(t, "/w/f.kiln", src)
		assert.Equal(t, tokens(src), tokens(once), "%s: formatting must only change blanks", name)
		twice := formatText(t, "/w/f.kiln", once)
		assert.Equal(t, once, twice, "%s: formatting the formatted text must change nothing", name)
		assert.Equal(t, strings.Count(src, "\n"), strings.Count(once, "\n"), "%s: same lines", name)
	}
}

// diagLines lists "line:code" for every diagnostic of path.
func diagLines(t *testing.T, files map[string]string, path string) []string {
	t.Helper()
	ws := analysis.NewWorkspace("/w", func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, os.ErrNotExist
	}, analysis.DefaultSettings())
	r, err := ws.Analyze(context.Background(), path)
	require.NoError(t, err)
	var out []string
	for _, d := range r.Diagnostics {
		out = append(out, fmt.Sprintf("%d:%v", r.File.Lines.Line(d.Span.Start)+1, d.Code))
	}
	return out
}

// Formatting the examples keeps the checker's verdict: the same codes on the
// same lines (the analysis that `kiln check` runs).
func TestFormatExamplesKeepDiagnostics(t *testing.T) {
	for _, ex := range []string{"furnace.kiln", "denox.kiln"} {
		b, err := os.ReadFile(filepath.Join("../../examples", ex))
		require.NoError(t, err)
		src := string(b)
		path := "/w/" + ex
		formatted := formatText(t, path, src)
		require.NotEqual(t, src, formatted, "%s: the example must exercise the formatter", ex)
		before := diagLines(t, map[string]string{path: src}, path)
		after := diagLines(t, map[string]string{path: formatted}, path)
		require.NotEmpty(t, before, "%s: the example has diagnostics to compare", ex)
		assert.Equal(t, before, after, "%s: formatting changed the diagnostics", ex)
	}
}

// Each coefficient column is aligned on the decimal point (on the exponent
// when a number has no point), with one place kept for a sign; the numbers'
// text is kept.
func TestFormatNASA7Columns(t *testing.T) {
	src := "species x C\n  nasa7 300 1000 5000\n    low 3.5 0.01 0 -1.5e-8 5 -29000 5.\n    high   -6.5   1.2E+3 0.5 1e5 .5 -2.9e4 -5.0   # fitted\n"
	want := "species x C\n  nasa7 300 1000 5000\n" +
		"    low   3.5  0.01    0   -1.5e-8  5   -29000      5.\n" +
		"    high -6.5  1.2E+3  0.5  1e5      .5     -2.9e4 -5.0   # fitted\n"
	assert.Equal(t, want, formatText(t, "/w/f.kiln", src))
}

func TestFormatReactionBlocks(t *testing.T) {
	src := "species A C\nspecies BB CC\n\n" +
		"reaction A <=> BB A=1e13 n=0 Ea=10\n" +
		"reaction A + A <=> BB    A=2.5e12   n=-0.5 Ea=1.2kJ/mol\n" +
		"  duplicate\n" +
		"reaction A + A <=> BB A=1 n=0 Ea=0\n" +
		"  duplicate\n" +
		"# a comment line ends the block\n" +
		"reaction BB => A A=3e9 n=1.5 Ea=40 # tail\n" +
		"\n" +
		"reaction BB <=> A\n" +
		"  pressure 0.1atm A=1 n=0 Ea=0\n" +
		"  pressure 10atm A=22 n=-1 Ea=5\n"
	want := "species A  C\nspecies BB CC\n\n" +
		"reaction A <=> BB       A=1e13   n=0    Ea=10\n" +
		"reaction A + A <=> BB   A=2.5e12 n=-0.5 Ea=1.2kJ/mol\n" +
		"  duplicate\n" +
		"reaction A + A <=> BB   A=1      n=0    Ea=0\n" +
		"  duplicate\n" +
		"# a comment line ends the block\n" +
		"reaction BB => A   A=3e9 n=1.5 Ea=40 # tail\n" +
		"\n" +
		"reaction BB <=> A\n" +
		"  pressure 0.1atm A=1  n=0  Ea=0\n" +
		"  pressure 10atm  A=22 n=-1 Ea=5\n"
	assert.Equal(t, want, formatText(t, "/w/f.kiln", src))
}

// An equation wider than the column limit neither pads to nor widens its
// block's column.
func TestFormatLongEquationNotPadded(t *testing.T) {
	long := "A + A + A + A + A + A + A + A + A + A + A + A + A + A + A + A + A <=> A"
	require.Greater(t, len("reaction "+long), maxEquationColumn)
	src := "species A C\nreaction A <=> A A=1 n=0 Ea=0\n  duplicate\nreaction " + long + " A=1 n=0 Ea=0\nreaction A => A A=10 n=0 Ea=0\n"
	want := "species A C\nreaction A <=> A   A=1  n=0 Ea=0\n  duplicate\nreaction " + long + "   A=1 n=0 Ea=0\nreaction A => A    A=10 n=0 Ea=0\n"
	assert.Equal(t, want, formatText(t, "/w/f.kiln", src))
}

func TestFormatThermoRows(t *testing.T) {
	src := "species t\n  composition C2\n  thermo-table\n     hf298   1.5\n  s298 20   # note\n cp 300=1 400=2\n      source  a   b\n" +
		"group C-(C)(H)3\n  hf298 -10.2\n  s298 30.4\n  cp 300=6.2 400=7.8\n"
	want := "species t\n  composition C2\n  thermo-table\n    hf298 1.5\n    s298  20   # note\n    cp    300=1 400=2\n    source a   b\n" +
		"group C-(C)(H)3\n  hf298 -10.2\n  s298  30.4\n  cp    300=6.2 400=7.8\n"
	assert.Equal(t, want, formatText(t, "/w/f.kiln", src))
}

// A statement with a syntax error is left exactly as written, and it ends
// the block of the statements around it.
func TestFormatBrokenLineInBlock(t *testing.T) {
	src := "species A C\nreaction A <=> A   A=1 n=0 Ea=0\n  duplicate\nreaction A  <=>  A A=x n=0 Ea=0\nreaction A => A A=10 n=0 Ea=0\n"
	f := speciesfile.Parse("/w/f.kiln", []byte(src))
	require.NotEmpty(t, f.Diags)
	want := "species A C\nreaction A <=> A   A=1 n=0 Ea=0\n  duplicate\nreaction A  <=>  A A=x n=0 Ea=0\nreaction A => A   A=10 n=0 Ea=0\n"
	assert.Equal(t, want, formatText(t, "/w/f.kiln", src))
}

// Random changes to the blanks between tokens (and to the indentation of
// continuation lines) of every fixture and example: formatting keeps the
// tokens and the statements, and formatting its result changes nothing.
func TestFormatRandomBlanks(t *testing.T) {
	rng := rand.New(rand.NewPCG(15, 4))
	blanks := []string{" ", "  ", "\t", " \t ", "      "}
	for name, src := range formatInputs(t) {
		for range 20 {
			lines := strings.SplitAfter(src, "\n")
			for i, l := range lines {
				body := strings.TrimRight(l, "\r\n")
				end := l[len(body):]
				fields := strings.Fields(body)
				if len(fields) == 0 || rng.IntN(3) == 0 {
					continue
				}
				var b strings.Builder
				if body[0] == ' ' || body[0] == '\t' {
					b.WriteString(blanks[rng.IntN(len(blanks))])
				}
				for j, fl := range fields {
					if j > 0 {
						b.WriteString(blanks[rng.IntN(len(blanks))])
					}
					b.WriteString(fl)
				}
				if rng.IntN(4) == 0 {
					b.WriteString(blanks[rng.IntN(len(blanks))])
				}
				lines[i] = b.String() + end
			}
			in := strings.Join(lines, "")
			f := speciesfile.Parse("/w/f.kiln", []byte(in))
			once := apply(t, in, Format(f))
			require.Equal(t, tokens(in), tokens(once), "%s: tokens changed formatting %q", name, in)
			g := speciesfile.Parse("/w/f.kiln", []byte(once))
			require.Empty(t, Format(g), "%s: formatting %q twice changed it", name, in)
			require.Equal(t, len(f.Stmts), len(g.Stmts), "%s: statements", name)
			require.Equal(t, len(f.Diags), len(g.Diags), "%s: reader diagnostics", name)
		}
	}
}

func TestFormatAlignsCRLF(t *testing.T) {
	src := "species a C\r\nspecies bbb CC\r\n  nasa7 300 1000 5000\r\n    low 1 2 3 4 5 6 7\r\n  high -1 2 3 4 5 6 7\r\nreaction a <=> bbb A=1 n=0 Ea=0\r\nreaction bbb <=> a A=10 n=0 Ea=0\r\n"
	want := "species a   C\r\nspecies bbb CC\r\n  nasa7 300 1000 5000\r\n    low   1  2  3  4  5  6  7\r\n    high -1  2  3  4  5  6  7\r\nreaction a <=> bbb   A=1  n=0 Ea=0\r\nreaction bbb <=> a   A=10 n=0 Ea=0\r\n"
	assert.Equal(t, want, formatText(t, "/w/f.kiln", src))
}

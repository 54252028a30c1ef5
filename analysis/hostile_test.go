package analysis

import (
	"math/rand"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestHostileInputs feeds the analysis inputs a user (or a broken tool) can
// produce: each must give diagnostics inside the file, never a panic or a hang.
func TestHostileInputs(t *testing.T) {
	rnd := rand.New(rand.NewSource(7))
	random := make([]byte, 64<<10)
	rnd.Read(random)
	deep := "species deep " + strings.Repeat("C(", 5000) + "C" + strings.Repeat(")", 5000) + "\n"
	wide := "species wide " + strings.Repeat("C", 600) + "\n"
	cases := map[string]struct {
		text string
		code string // a diagnostic code that must appear ("" = any or none)
	}{
		"random bytes":     {string(random), ""},
		"NUL":              {"species a C\x00C\nreaction a => a\n", "syntax"},
		"invalid UTF-8":    {"species \xff\xfe C\n", ""},
		"5 MB line":        {"species long " + strings.Repeat("C", 5<<20) + "\n", ""},
		"deep branches":    {deep, "bad-smiles"},
		"too many atoms":   {wide, "bad-smiles"},
		"CRLF":             {"species a CC\r\nspecies b CCC\r\nreaction a => b  A=1 n=0 Ea=0\r\n", "unbalanced-reaction"},
		"lone CR":          {"species a CC\rspecies b CCC\rreaction a => b  A=1 n=0 Ea=0\r", "unbalanced-reaction"},
		"BOM":              {"\ufeffspecies a CC\n", ""},
		"huge exponent":    {"species a CC\nreaction a => a  A=1e999999 n=0 Ea=0\n", "syntax"},
		"many terms":       {"species a C\nreaction " + strings.Repeat("a + ", 100) + "a => a\n", ""},
		"unterminated":     {"species", "syntax"},
		"only whitespace":  {" \t\n\n   \r\n", ""},
		"deep parentheses": {"species p " + strings.Repeat("(", 100000) + "\n", "bad-smiles"},
	}
	for name, c := range cases {
		t.Run(name, func(t *testing.T) {
			res := analyseText(t, c.text)
			codes := map[string]bool{}
			for _, d := range res.Diagnostics {
				codes[d.Code] = true
				require.GreaterOrEqual(t, d.Span.Start, 0)
				require.LessOrEqual(t, d.Span.End, len(c.text))
				require.LessOrEqual(t, d.Span.Start, d.Span.End)
				require.NotEmpty(t, d.Message)
			}
			if c.code != "" {
				assert.True(t, codes[c.code], "want a %s diagnostic, got %v", c.code, res.Diagnostics)
			}
			// Every diagnostic position converts to a line and column.
			for _, d := range res.Diagnostics {
				p := res.File.Lines.Position(d.Span.Start)
				assert.GreaterOrEqual(t, p.Line, 0)
			}
		})
	}
}

// TestNoDataLoss: every edit analysis produces (fill, single insert,
// replace) only inserts or replaces, leaving all other bytes in place.
func TestNoDataLoss(t *testing.T) {
	text := "# head\r\nspecies ethanol CCO   # trailing comment\r\n  note keep me\r\nspecies propane CCC\r\n  thermo-table\r\n    hf298 -10\r\n    s298 64.5\r\n    cp 300=17.6 1000=41.9\r\nspecies last C=C"
	res := analyseText(t, text)
	edits := res.FillEdits()
	require.Len(t, edits, 2, "ethanol and the last species lack blocks")
	out, err := ApplyEdits([]byte(text), edits)
	require.NoError(t, err)
	assert.True(t, strings.HasPrefix(string(out), "# head\r\nspecies ethanol CCO   # trailing comment\r\n  note keep me\r\n"))
	for _, e := range edits {
		assert.Equal(t, e.Span.Start, e.Span.End, "fill only inserts")
		assert.NotContains(t, strings.ReplaceAll(e.NewText, "\r\n", ""), "\n", "CRLF file gets CRLF lines")
	}
	// Re-analysing the filled text finds nothing more to fill.
	res2 := analyseText(t, string(out))
	assert.Empty(t, res2.FillEdits())
	for _, d := range res2.Diagnostics {
		assert.NotEqual(t, speciesfile.SeverityError, d.Severity, "%v", d)
	}
	// Replacement of propane's mismatching table by the estimate.
	sp := res.ByName["propane"]
	e, ok := res.ReplaceThermoEdit(sp)
	require.True(t, ok)
	out, err = ApplyEdits([]byte(text), []Edit{e})
	require.NoError(t, err)
	s := string(out)
	assert.Contains(t, s, "species propane CCC\r\n  nasa7 300 1000 5000\r\n")
	assert.Contains(t, s, "\r\nspecies last C=C")
	assert.NotContains(t, s, "thermo-table")
}

package main

import (
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
)

// TestHoverAgreesWithCLI: a species' ΔHf°298 and S°298 read the same (unit,
// digits, sign and value) in `kiln check`, `estimate` and `summary` text and
// in the editor's hover (plain and Markdown) and inlay hint, with the
// display unit chosen by the setting and by the file's own `units`
// statement. The strings are taken from check's message and looked for
// verbatim everywhere else, so a second formatter anywhere fails the test.
func TestHoverAgreesWithCLI(t *testing.T) {
	cases := []struct {
		name, header, setting, shown string
	}{
		{"kcal/mol setting", "", "kcal/mol", "kcal/mol"},
		{"kJ/mol setting", "", "kJ/mol", "kJ/mol"},
		{"kJ/mol file", "units kJ/mol\n", "", "kJ/mol"},
		{"kcal/mol setting over a kJ/mol file", "units kJ/mol\n", "kcal/mol", "kcal/mol"},
	}
	species := [][2]string{{"ethanol", "CCO"}, {"propyl", "CC[CH2]"}}
	checkRE := regexp.MustCompile(`(\w+): no thermo block; (?:estimated|reference library \S+:) ΔHf°298 = (\S+ \S+), S°298 = (\S+ \S+)`)
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			src := c.header
			for _, s := range species {
				src += "species " + s[0] + " " + s[1] + "\n"
			}
			path := filepath.Join(t.TempDir(), "agree.kiln")
			require.NoError(t, os.WriteFile(path, []byte(src), 0o644))
			var flags []string
			if c.setting != "" {
				flags = []string{"--units", c.setting}
			}
			set := analysis.DefaultSettings()
			set.DisplayUnits = c.setting

			// check: the reference strings, with their unit.
			_, out, stderr := runKiln(t, append(append([]string{"check", "--min-severity", "information"}, flags...), path)...)
			hf, s := map[string]string{}, map[string]string{}
			for _, m := range checkRE.FindAllStringSubmatch(out, -1) {
				hf[m[1]], s[m[1]] = m[2], m[3]
			}
			require.Len(t, hf, len(species), "check output:\n%s%s", out, stderr)
			for _, name := range []string{"ethanol", "propyl"} {
				assert.True(t, strings.HasSuffix(hf[name], " "+c.shown), "%s: check shows %q", name, hf[name])
			}

			// estimate (a SMILES has no file: --units names the unit).
			other := map[string]string{}
			for _, sp := range species {
				_, out, _ := runKiln(t, "estimate", "--units", c.shown, sp[1])
				m := regexp.MustCompile(`ΔHf°298 = (\S+ \S+) \((\S+ \S+)\)`).FindStringSubmatch(out)
				require.NotNil(t, m, out)
				assert.Equal(t, hf[sp[0]], m[1], "estimate %s", sp[1])
				other[sp[0]] = m[2]
				assert.Contains(t, out, "S°298   = "+s[sp[0]]+" (", "estimate %s", sp[1])
			}

			// summary: the same numbers under a header naming the unit.
			_, out, _ = runKiln(t, append(append([]string{"summary"}, flags...), path)...)
			assert.Contains(t, out, "ΔHf°298 in "+c.shown)
			for _, sp := range species {
				row := lineStartingWith(out, sp[0]+" ")
				require.NotEmpty(t, row, "summary has no row for %s:\n%s", sp[0], out)
				fields := strings.Fields(row)
				number := func(v string) string { return strings.Fields(v)[0] }
				assert.Contains(t, fields, number(hf[sp[0]]), "summary row %q", row)
				assert.Contains(t, fields, number(s[sp[0]]), "summary row %q", row)
			}

			// hover and inlay hints, as the server computes them.
			ws := analysis.NewWorkspace(filepath.Dir(path), os.ReadFile, set)
			res, err := ws.Analyze(t.Context(), path)
			require.NoError(t, err)
			x := ide.NewIndex(res)
			hints := ide.InlayHints(x, path, 0, len(src), set)
			for _, sp := range species {
				off := strings.Index(src, "species "+sp[0]+" ") + len("species ")
				for _, md := range []bool{false, true} {
					h, ok := ide.Hover(x, path, off, set, md)
					require.True(t, ok, sp[0])
					assert.Contains(t, h.Text, hf[sp[0]]+" ("+other[sp[0]]+")", "hover on %s (markdown %v)", sp[0], md)
					assert.Contains(t, lineStartingWith(h.Text, map[bool]string{false: "S°298 ", true: "| S°298 |"}[md]), s[sp[0]], "hover on %s (markdown %v)", sp[0], md)
				}
				want := "ΔHf°298 " + hf[sp[0]] + " · S° " + s[sp[0]] + " (estimated)"
				var labels []string
				for _, h := range hints {
					labels = append(labels, h.Label)
				}
				assert.Contains(t, labels, want, "inlay hint of %s", sp[0])
			}
		})
	}
}

// lineStartingWith returns the first line of text that starts with prefix
// ("" when none does).
func lineStartingWith(text, prefix string) string {
	for _, l := range strings.Split(text, "\n") {
		if strings.HasPrefix(l, prefix) {
			return l
		}
	}
	return ""
}

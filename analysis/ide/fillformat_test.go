package ide

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/analysis"
)

// TestFillIsFormatted: the nasa7 blocks kiln writes (fill, and the quick fix
// that replaces a block by the estimate) are already in the formatter's
// layout, so formatting a filled file changes nothing kiln wrote: one
// layout, whose home is speciesfile.FormatNASA7Block. The inputs are
// formatted first; blocks of species with attributes, a reference-library
// species (its own source line), CRLF line endings and a file whose last
// line has no line break are covered.
func TestFillIsFormatted(t *testing.T) {
	inputs := map[string]string{
		"plain":  "species ethanol CCO\nspecies propane CCC\nspecies O2 O=O\n  multiplicity 3\nspecies toluene Cc1ccccc1\n  note solvent\n  symmetry 6\n",
		"crlf":   "species ethanol CCO\r\n  note feed\r\nspecies acetone CC(C)=O\r\n",
		"no-eol": "species dme COC\nspecies propanal CCC=O",
	}
	for name, src := range inputs {
		src = formatText(t, "/w/f.kiln", src)
		x := analyse(t, map[string]string{"/w/f.kiln": src}, "/w/f.kiln")
		edits := x.Result().FillEdits()
		require.NotEmpty(t, edits, name)
		filled := apply(t, src, edits)
		require.Equal(t, len(edits), strings.Count(filled, "nasa7 "), name)
		assert.Equal(t, filled, formatText(t, "/w/f.kiln", filled), "%s: formatting a filled file must change nothing", name)

		// Replacing a filled block by the estimate again writes the same
		// layout.
		y := analyse(t, map[string]string{"/w/f.kiln": filled}, "/w/f.kiln")
		for _, sp := range y.Result().Species {
			e, ok := y.Result().ReplaceThermoEdit(sp)
			if !ok {
				continue
			}
			replaced := apply(t, filled, []analysis.Edit{e})
			assert.Equal(t, replaced, formatText(t, "/w/f.kiln", replaced), "%s: %s: replaced block", name, sp.Name)
		}
	}
}

package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
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

package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"

	"kiln.dev/kiln/speciesfile"
)

// TestResonanceSpellingsAreOneStructure: two resonance structures of one
// radical declared under two names are reported as the same structure, as
// two spellings of one closed-shell molecule are; different radicals are not.
func TestResonanceSpellingsAreOneStructure(t *testing.T) {
	res := analyseWith(t, `species propargyl [CH2]C#C
species allenyl C=C=[CH]
species allyl C=C[CH2]
species allyl2 [CH2]C=C
species propyl CC[CH2]
species isopropyl C[CH]C
`, DefaultSettings())
	lines := map[int]bool{}
	for _, d := range res.Diagnostics {
		if d.Code == speciesfile.CodeDuplicateSpecies {
			lines[res.File.Lines.Position(d.Span.Start).Line+1] = true
		}
	}
	assert.Equal(t, map[int]bool{2: true, 4: true}, lines, "%v", res.Diagnostics)
}

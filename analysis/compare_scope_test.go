package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestCompareUndeclaredSameName: a name undeclared on both sides is the
// same name on both (the same text), so a reaction written alike on both
// sides matches; a name undeclared in B that A declares stays apart.
func TestCompareUndeclaredSameName(t *testing.T) {
	text := "species CH4 C\nspecies H [H]\nspecies CH3 [CH3]\nreaction CH4 + H <=> CH3 + H2  A=1e14 n=0 Ea=12\n"
	c := compareTexts(t, map[string]string{"/w/a.kiln": text, "/w/b.kiln": text}, "/w/a.kiln", "/w/b.kiln")
	assert.Empty(t, c.ReactionsOnlyA)
	assert.Empty(t, c.ReactionsOnlyB)
	require.Len(t, c.Reactions, 1)

	// A declares H2, B does not: B's H2 is not known to be A's.
	a := "species H2 [H][H]\n" + text
	c = compareTexts(t, map[string]string{"/w/a.kiln": a, "/w/b.kiln": text}, "/w/a.kiln", "/w/b.kiln")
	assert.Len(t, c.ReactionsOnlyA, 1)
	assert.Len(t, c.ReactionsOnlyB, 1)
	assert.Empty(t, c.Reactions)
}

package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"

	"kiln.dev/kiln/engine/reflib"
)

// TestNitrogenRadicalIncrementsAgainstLibrary estimates the N-centred
// radicals whose increments (hbi_n.tsv: D, dS, dCp) were taken from
// library species by groups, bypassing the library, and compares them with
// the library entries. It re-derives the increments (a mistyped column
// shows here): ΔHf° differs only by the parent's group error (methanimine's
// groups are 0.79 kcal/mol above its ATcT value), S° and Cp only by the
// parent's.
func TestNitrogenRadicalIncrementsAgainstLibrary(t *testing.T) {
	lib := reflib.New()
	for _, c := range []struct {
		smiles, name string
		tolH, tolS   float64 // kcal/mol, cal/(mol K)
		tolCp        float64 // cal/(mol K)
	}{
		{"C=[N]", "H2CN", 0.85, 0.05, 0.1},
		{"[CH]=N", "HCNH", 0.85, 0.05, 0.1}, // the iminoyl increment
		{"N[NH]", "N2H3", 0.1, 0.05, 0.1},   // N-(N)(H)2's S° and Cp are half of the library's N2H4
	} {
		_, e := againstLibrary(t, lib, c.smiles, c.name, c.tolH, c.tolS, c.tolCp)
		assert.False(t, hfApproximated(e), "%s: %v", c.smiles, e.Missing)
	}
}

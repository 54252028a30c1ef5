package main

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestEstimateLibraryOzone: ozone, which kiln refused before it was a
// reference-library entry (a charge-separated structure no group describes;
// as the chain [O]O[O], the group O-(O)2, which has no value), comes from
// the library under its charge-separated SMILES in either order and under
// the diradical spelling, with the NASA/TP-2002-211556 header ΔHf°298
// (141.8 kJ/mol), as a singlet. A triplet is refused, naming the entry.
func TestEstimateLibraryOzone(t *testing.T) {
	for _, smiles := range []string{"O=[O+][O-]", "[O-][O+]=O", "[O]O[O]"} {
		assertLibraryEstimate(t, smiles, "O3", "(141.8 kJ/mol)")
		_, out, _ := runKiln(t, "estimate", smiles)
		assert.Contains(t, out, "reference library: O3 (tabulated data, not a group estimate; its data cover 200–2000 K only), multiplicity 1", smiles)
	}
	code, out, stderr := runKiln(t, "estimate", "--multiplicity", "3", "[O]O[O]")
	assert.Equal(t, exitProblems, code, out+stderr)
	assert.Contains(t, out, "the reference library holds this structure only as O3, multiplicity 1")
}

// TestPlotLibrarySpecies: a reference-library species is plotted as its
// data over their own range (ozone stops at 2000 K), labelled as library
// data, never as a group estimate (tester12).
func TestPlotLibrarySpecies(t *testing.T) {
	file := writeTemp(t, "o3.kiln", "species O3 O=[O+][O-]\n")
	out := filepath.Join(t.TempDir(), "o3.svg")
	code, stdout, stderr := runKiln(t, "plot", "O3", "--file", file, "-o", out)
	require.Equal(t, exitOK, code, stdout+stderr)
	svg, err := os.ReadFile(out)
	require.NoError(t, err)
	assert.Contains(t, string(svg), "reference library O3 (200–2000 K)")
	assert.NotContains(t, string(svg), "group estimate")
}

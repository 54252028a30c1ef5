package main

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestEstimateRefusalShowsReading: a refused estimate prints the formula the
// SMILES was read as before the error, and N(=O)=O names the NO2 spellings.
func TestEstimateRefusalShowsReading(t *testing.T) {
	code, stdout, _ := runKiln(t, "estimate", "N(=O)=O")
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stdout, "N(=O)=O\n  formula HNO2, molar mass 47.013 g/mol\n  error: kiln cannot estimate it: ")
	assert.Contains(t, stdout, "write it [O]N=O or [N](=O)=O")
}

// TestFillSkipAtSMILESError: fill lists a species whose SMILES cannot be
// read at the offending character, where check reports it.
func TestFillSkipAtSMILESError(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "m.kiln")
	require.NoError(t, os.WriteFile(path, []byte("species badring C1CC\nspecies badpyrrole c1cc[n]c1\nspecies empty ?\nspecies CH4 C\n"), 0o644))
	_, stdout, stderr := runKiln(t, "check", path)
	for _, want := range []string{"m.kiln:1:18: error: bad SMILES for badring", "m.kiln:2:20: error: bad SMILES for badpyrrole", "m.kiln:3:15: error: empty: structure not given yet"} {
		assert.Contains(t, stdout+stderr, want)
	}
	_, _, stderr = runKiln(t, "fill", "--dry-run", path)
	for _, want := range []string{"m.kiln:1:18: skipped badring", "m.kiln:2:20: skipped badpyrrole", "m.kiln:3:15: skipped empty"} {
		assert.Contains(t, stderr, want)
	}
}

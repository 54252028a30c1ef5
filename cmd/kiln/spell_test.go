package main

import (
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestEstimateRefusalShowsReading: a refused estimate prints the formula the
// SMILES was read as before the error, and N(=O)=O names the NO2 spellings.
func TestEstimateRefusalShowsReading(t *testing.T) {
	code, stdout, _ := runKiln(t, "estimate", "N(=O)=O")
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stdout, "N(=O)=O\n  formula HNO2, molar mass 47.013 g/mol\n  error: kiln cannot estimate it: ")
	assert.Contains(t, stdout, "write it [O]N=O or [N](=O)=O")
}

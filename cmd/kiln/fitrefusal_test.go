package main

import (
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestFitRefusalWording: fill and plot word a refused NASA-7 fit alike
// (analysis.FitRefusal, as hover and estimate --nasa do), in the file's
// units with the temperature and what to do. The `group` statement (test fixture, invented values) puts
// ethane's Cp above its classical limit at 1000 K.
func TestFitRefusalWording(t *testing.T) {
	f := writeTemp(t, "refuse.kiln", `units kcal/mol
group C-(C)(H)3
  hf298 -10
  s298 30
  cp 300=12 400=14 500=16 600=18 800=20 1000=22 1500=23
species ethane CC
`)
	const want = "the estimated Cp at 1000 K, 44.00 cal/(mol·K), is not below 42.72 cal/(mol·K)"
	const advice = "give the species a nasa7 or thermo-table block"
	code, _, stderr := runKiln(t, "fill", "--dry-run", f)
	assert.Equal(t, exitProblems, code)
	assert.Contains(t, stderr, "skipped ethane: no NASA-7 polynomial: "+want)
	assert.Contains(t, stderr, advice)

	_, _, stderr = runKiln(t, "plot", "ethane", "--file", f, "-o", filepath.Join(t.TempDir(), "e.svg"))
	assert.Contains(t, stderr, want)
	assert.Contains(t, stderr, advice)
	assert.NotContains(t, stderr, "nasa fit")
}

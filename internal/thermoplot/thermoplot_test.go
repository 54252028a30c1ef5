package thermoplot

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/nasa"
)

func TestRenderSVG(t *testing.T) {
	// Argon-like constant Cp = 5/2 R (a demo polynomial, not reference data).
	var p nasa.NASA7
	p.TLow, p.TMid, p.THigh = 300, 1000, 5000
	p.Low[0], p.High[0] = 2.5, 2.5
	p.Low[6], p.High[6] = 4.38, 4.38
	poly := func(T float64) (float64, float64, float64) { return p.Cp(T), p.H(T), p.S(T) }
	pts := func(T float64) (float64, float64, float64) { return 1.01 * p.Cp(T), p.H(T), p.S(T) + 0.5 }
	var buf bytes.Buffer
	err := Render(&buf, "KilnPlotTitle", []Series{
		{Name: "polynomial", Eval: poly},
		{Name: "table", Points: true, Eval: pts, T: []float64{300, 500, 1000, 1500, 6000}},
	}, 300, 3000)
	require.NoError(t, err)
	out := buf.String()
	trimmed := strings.TrimSpace(out)
	assert.True(t, strings.HasPrefix(trimmed, "<?xml") || strings.HasPrefix(trimmed, "<svg"), "starts %q", trimmed[:min(40, len(trimmed))])
	assert.Contains(t, out, "</svg>")
	assert.Contains(t, out, "KilnPlotTitle")
	assert.Contains(t, out, "polynomial")
	assert.Contains(t, out, "table")
}

func TestRenderErrors(t *testing.T) {
	ok := func(T float64) (float64, float64, float64) { return 30, 0, 200 }
	var buf bytes.Buffer
	assert.Error(t, Render(&buf, "x", []Series{{Name: "a", Eval: ok}}, 3000, 300))
	assert.Error(t, Render(&buf, "x", []Series{{Name: "a", Eval: ok}}, 0, 300))
	assert.Error(t, Render(&buf, "x", nil, 300, 3000))
	assert.Error(t, Render(&buf, "x", []Series{{Name: "a"}}, 300, 3000))
	assert.Error(t, Render(&buf, "x", []Series{{Name: "a", Points: true, Eval: ok}}, 300, 3000))
	// Non-finite values are skipped, not an error.
	nan := func(T float64) (float64, float64, float64) { return math.NaN(), math.Inf(1), 1 }
	assert.NoError(t, Render(&buf, "x", []Series{{Name: "a", Eval: nan}}, 300, 3000))
}

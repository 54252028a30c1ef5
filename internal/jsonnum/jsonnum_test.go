package jsonnum

import (
	"encoding/json"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestRound(t *testing.T) {
	assert.Equal(t, 68.664, Round(68.66400000000003))
	assert.Equal(t, 2223.40126456, Round(2223.401264561234))
	assert.Equal(t, 0.0, Round(0))
	assert.True(t, math.IsInf(Round(math.Inf(1)), 1))
	assert.Equal(t, 1e-300, Round(1e-300))
}

// TestRoundLiterals: numbers outside strings are rounded, strings and short
// numbers keep their spelling.
func TestRoundLiterals(t *testing.T) {
	in := `{"a": 68.66400000000003, "b": "68.66400000000003", "c": [1, -2.5e-7, 0.30000000000000004], "d": "x\"1.00000000000001"}`
	want := `{"a": 68.664, "b": "68.66400000000003", "c": [1, -2.5e-7, 0.3], "d": "x\"1.00000000000001"}`
	assert.Equal(t, want, string(RoundLiterals([]byte(in))))
}

// TestMarshalNonFinite: a float that is not finite is written as null,
// wherever it sits (field, pointer, map value, slice, interface, a value
// with its own MarshalJSON), and the rest of the value is unchanged.
func TestMarshalNonFinite(t *testing.T) {
	inf, nan := math.Inf(1), math.NaN()
	type inner struct {
		P *float64           `json:"p"`
		M map[string]float64 `json:"m"`
	}
	v := struct {
		A float64   `json:"a"`
		B []float64 `json:"b"`
		C inner     `json:"c"`
		D any       `json:"d"`
		E float64   `json:"e"`
		F string    `json:"f"`
	}{A: inf, B: []float64{1, nan, -inf}, C: inner{P: &inf, M: map[string]float64{"x": nan, "y": 2}}, D: -inf, E: 68.66400000000003, F: "-1.2345678901234567e+307"}
	out, err := Marshal(v)
	require.NoError(t, err)
	want := `{
  "a": null,
  "b": [
    1,
    null,
    null
  ],
  "c": {
    "p": null,
    "m": {
      "x": null,
      "y": 2
    }
  },
  "d": null,
  "e": 68.664,
  "f": "-1.2345678901234567e+307"
}`
	assert.Equal(t, want, string(out))
	// The value itself is not modified.
	assert.True(t, math.IsInf(v.A, 1))
	assert.True(t, math.IsNaN(v.C.M["x"]))
}

// labelled encodes itself from an unexported field.
type labelled struct {
	label string
	V     float64
}

func (l labelled) MarshalJSON() ([]byte, error) {
	return json.Marshal(map[string]any{"label": l.label, "v": l.V})
}

// TestMarshalKeepsUnexported: with a non-finite float somewhere in the
// value, a type that encodes itself from unexported state still sees it.
func TestMarshalKeepsUnexported(t *testing.T) {
	b, err := Marshal(struct {
		A labelled
		B float64
	}{labelled{"kept", 1}, math.Inf(1)})
	require.NoError(t, err)
	assert.JSONEq(t, `{"A": {"label": "kept", "v": 1}, "B": null}`, string(b))
}

package jsonnum

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
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

package analysis

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestFormatFixed: the one fixed-decimal formatter never writes "-0.00",
// switches to exponent notation for huge values (bounded width), and writes
// "—" for a value that is not a finite number.
func TestFormatFixed(t *testing.T) {
	for v, want := range map[float64]string{
		-56.214:              "-56.21",
		-0.001:               "0.00",
		math.Copysign(0, -1): "0.00",
		0.004:                "0.00",
		999999999.994:        "999999999.99",
		1e9:                  "1.00e+09",
		-1e200:               "-1.00e+200",
		math.Inf(1):          "—",
		math.NaN():           "—",
	} {
		assert.Equal(t, want, FormatFixed(v, 2), "%g", v)
	}
	assert.Equal(t, "+3.25", FormatSigned(3.25, 2))
	assert.Equal(t, "0.00", FormatSigned(-0.001, 2))
	assert.Equal(t, "-3.25", FormatSigned(-3.25, 2))
	assert.Equal(t, "0.0 kJ/mol", Units{KJ: true}.Energy(-1))
	assert.Equal(t, "1.0e+200 kJ/mol", Units{KJ: true}.Energy(1e203))
}

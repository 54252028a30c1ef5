package analysis

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestNonphysicalOverrideRefused: a symmetry or optical-isomers override
// that drives S°298 to zero or below gives no estimate (a refusal saying
// why), in the file as on the command line; a sane override still gives one.
func TestNonphysicalOverrideRefused(t *testing.T) {
	res := analyseWith(t, "species x CC\n  symmetry 99999999999999\nspecies y CC\n  symmetry 6\n", DefaultSettings())
	var xMsg string
	for _, d := range res.Diagnostics {
		if strings.Contains(d.Message, "x has no thermo") {
			xMsg = d.Message
		}
		assert.NotContains(t, d.Message, "y has no thermo", "a sane override is estimated")
	}
	require.NotEmpty(t, xMsg, "the absurd override is refused: %v", res.Diagnostics)
	assert.Contains(t, xMsg, "not physical")
	assert.Contains(t, xMsg, "symmetry")
}

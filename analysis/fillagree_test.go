package analysis

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestWrittenBlockAccepted: the block kiln writes for an estimate (its
// NASA-7 fit) draws no thermo-mismatch even where the fit departs from the
// group values by more than the Cp threshold (adamantane at 1500 K: the
// summed ring corrections make a Cp curve the two-range polynomial follows
// to about 3 cal/(mol K)); a block farther than the threshold from both the
// group values and the fit is still reported.
func TestWrittenBlockAccepted(t *testing.T) {
	const decl = "species A C1C2CC3CC1CC(C2)C3\n"
	res := analyzeText(t, decl)
	var sp *Species
	for _, s := range res.Species {
		if s.Name == "A" {
			sp = s
		}
	}
	require.NotNil(t, sp)
	require.NotNil(t, sp.Estimate)
	p, rep, err := sp.Estimate.NASA7()
	require.NoError(t, err)
	require.Greater(t, rep.MaxCpResidual, DefaultSettings().MismatchCp,
		"the case needs a fit that departs from the group values by more than the threshold")

	block := func(d float64) string {
		low, high := p.Low, p.High
		low[0] += d
		high[0] += d
		return decl + speciesfile.FormatNASA7Block("  ", p.TLow, p.TMid, p.THigh, low, high, "test", "\n")
	}
	mismatches := func(text string) []string {
		var out []string
		for _, m := range messagesWithCode(analyzeText(t, text), speciesfile.CodeThermoMismatch) {
			if strings.Contains(m, "Cp at") || strings.Contains(m, "H(") {
				out = append(out, m)
			}
		}
		return out
	}
	assert.Empty(t, mismatches(block(0)), "the block kiln writes")
	// Cp lowered by 1.2 R ≈ 2.4 cal/(mol K) everywhere: beyond the threshold
	// from the fit and from the group values.
	assert.NotEmpty(t, mismatches(block(-1.2)))
}

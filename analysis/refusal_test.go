package analysis

import (
	"fmt"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/nasa"
	"kiln.dev/kiln/speciesfile"
)

// TestRefusalMessage: a species the estimator refuses gets one
// missing-thermo error that names the atom as written (1-based, in the
// SMILES order) and the reason, gives the advice once, and does not leak
// the engine package's name.
func TestRefusalMessage(t *testing.T) {
	res := analyzeText(t, "species Z C[Si](C)(C)C\nspecies W CC[N+](C)(C)C\n")
	msgs := messagesWithCode(res, speciesfile.CodeMissingThermo)
	require.Len(t, msgs, 2, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "Z has no thermo block and kiln cannot estimate it: atom 2 (Si): unsupported element Si")
	assert.Contains(t, msgs[1], "atom 3 (N) has charge +1")
	for _, m := range msgs {
		assert.NotContains(t, m, "benson")
		assert.Equal(t, 1, strings.Count(m, "thermo block;")+strings.Count(m, "thermo-table block"), m)
		assert.True(t, strings.HasSuffix(m, "; add a nasa7 or thermo-table block"), m)
	}
}

// TestRefusalSpinState: a library structure in a spin state the library
// does not hold is refused for that reason (not for a missing group).
func TestRefusalSpinState(t *testing.T) {
	res := analyzeText(t, "species O2s O=O\n  multiplicity 1\n")
	msgs := messagesWithCode(res, speciesfile.CodeMissingThermo)
	require.Len(t, msgs, 1, "%v", res.Diagnostics)
	assert.Contains(t, msgs[0], "multiplicity 1 has no data: the reference library holds this structure only as O2, multiplicity 3")
}

// TestApproximationAdvice: a missing group is to be defined with a `group`
// statement; an approximation that is not a group (a radical site without
// an increment, an unknown ring system) is not, and the advice says what
// does replace it.
func TestApproximationAdvice(t *testing.T) {
	res := analyzeText(t, "species P C=C[CH]C=C\nspecies V FC(=C)C\n")
	byName := missingGroupBySpecies(res)
	require.Contains(t, byName, "P", "%v", res.Diagnostics)
	assert.NotContains(t, byName["P"], "`group` statement")
	assert.Contains(t, byName["P"], "estimated with an approximation kiln has no data for: HBI: radical delocalised")
	assert.Contains(t, byName["P"], "thermo block")
	require.Contains(t, byName, "V", "%v", res.Diagnostics)
	assert.Contains(t, byName["V"], "no value for group Cd-(F)(C)")
	assert.Contains(t, byName["V"], "`group` statement")
}

// messagesWithCode returns the messages of the diagnostics with code.
func messagesWithCode(res *Result, code string) []string {
	var out []string
	for _, d := range res.Diagnostics {
		if d.Code == code {
			out = append(out, d.Message)
		}
	}
	return out
}

// TestFitRefusalInFileUnits: a species whose NASA-7 fit is refused is
// listed by fill with the numbers in the file's units, the temperature of
// the defect and what to do, without the engine's package name or raw
// floats. The refusal is provoked independently of the group tables: a
// `group` statement gives C-(C)(H)3 a heat capacity that puts ethane's
// estimated Cp above its classical limit, (3·8 − 2) R − R/2 = 21.5 R
// = 42.72 cal/(mol·K), at 1000 K.
func TestFitRefusalInFileUnits(t *testing.T) {
	const groups = "group C-(C)(H)3\n  hf298 -10\n  s298 30\n  cp 300=12 400=14 500=16 600=18 800=20 1000=22 1500=23\n"
	for _, c := range []struct{ units, cpUnit, value, limit string }{
		{"kcal/mol", "cal/(mol·K)", "44.00 cal/(mol·K)", "42.72 cal/(mol·K)"},
		{"kJ/mol", "J/(mol·K)", "184.1 J/(mol·K)", "178.8 J/(mol·K)"},
	} {
		src := "units " + c.units + "\n" + groups + "species E CC\n"
		if c.units == "kJ/mol" {
			// The same group values in J/(mol K).
			src = "units kJ/mol\ngroup C-(C)(H)3\n  hf298 -41.84\n  s298 125.52\n  cp 300=50.208 400=58.576 500=66.944 600=75.312 800=83.68 1000=92.048 1500=96.232\nspecies E CC\n"
		}
		res := analyzeText(t, src)
		_, skips := res.FillPlan()
		require.Len(t, skips, 1, c.units)
		msg := skips[0].Reason
		assert.Contains(t, msg, "at 1000 K, "+c.value+", is not below "+c.limit, c.units)
		assert.Contains(t, msg, "give the species a nasa7 or thermo-table block", c.units)
		assert.NotContains(t, msg, "nasa fit", c.units)
		assert.NotContains(t, msg, "J/(mol K)", c.units) // the engine's SI wording
	}
}

// TestFitRefusalFalls words a falling fitted Cp (a ShapeError the fit
// returns only if its constraints fail) in the display units, with both
// temperatures, the size of the fall and the remedies.
func TestFitRefusalFalls(t *testing.T) {
	err := fmt.Errorf("nasa fit: %w", &nasa.ShapeError{Test: nasa.ShapeFalls, T: 3376.6, Cp: 525.95, Other: 526.10, OtherT: 3300.2})
	kcal := FitRefusal(err, Units{})
	assert.Equal(t, "the fitted Cp falls with temperature, by 0.036 cal/(mol·K) from 125.74 cal/(mol·K) at 3300 K "+
		"to 125.71 cal/(mol·K) at 3377 K; try another TMID or THIGH (--tmid/--thigh, or tMid/tHigh in the editor's "+
		"settings), or give the species a nasa7 or thermo-table block", kcal)
	kj := FitRefusal(err, Units{KJ: true})
	assert.Contains(t, kj, "by 0.15 J/(mol·K) from 526.1 J/(mol·K) at 3300 K to 526.0 J/(mol·K) at 3377 K")
}

// TestApproximationWithBlock: a species with a thermo block of its own
// whose estimate is approximated gets the approximation as information (the
// block is what kiln uses); without the block it is a warning.
func TestApproximationWithBlock(t *testing.T) {
	const smiles = "species V CC(C)(F)F\n"
	const block = "  thermo-table\n    hf298 -4.5\n    s298 77.5\n    cp 300=19.2 400=21.6 500=23.3 600=24.5 800=26.1 1000=27.0 1500=28.0\n    source demo values\n"
	for _, tc := range []struct {
		text string
		sev  speciesfile.Severity
	}{{smiles, speciesfile.SeverityWarning}, {smiles + block, speciesfile.SeverityInformation}} {
		res := analyzeText(t, tc.text)
		var got []speciesfile.Diagnostic
		for _, d := range res.Diagnostics {
			if d.Code == speciesfile.CodeMissingGroup {
				got = append(got, d)
			}
		}
		require.Len(t, got, 1, "%v", res.Diagnostics)
		assert.Equal(t, tc.sev, got[0].Severity, got[0].Message)
		assert.Contains(t, got[0].Message, "C-(F)2(C)2 (used as it stands")
	}
}

// TestEntropyOnlyApproximation: an approximation that changes only S° and
// Cp (an imine group's S°/Cp by analogy) does not claim to widen the
// estimate's uncertainty, which is that of ΔHf°; one that changes ΔHf° (a
// ketene end with a vinyl substituent) does.
func TestEntropyOnlyApproximation(t *testing.T) {
	res := analyzeText(t, "species I CC=NC\nspecies K C=CC=C=O\n")
	byName := missingGroupBySpecies(res)
	require.Contains(t, byName, "I", "%v", res.Diagnostics)
	assert.Contains(t, byName["I"], "I: S° and Cp estimated with an approximation kiln has no data for: S, Cp by analogy: CdN-(C)(H)")
	assert.Contains(t, byName["I"], "ΔHf° and its uncertainty are not affected")
	assert.NotContains(t, byName["I"], "widened")
	require.Contains(t, byName, "K", "%v", res.Diagnostics)
	assert.Contains(t, byName["K"], "its uncertainty is widened")
	assert.NotContains(t, byName["K"], "not affected")
}

// missingGroupBySpecies maps each species name to its missing-group message.
func missingGroupBySpecies(res *Result) map[string]string {
	byName := map[string]string{}
	for _, m := range messagesWithCode(res, speciesfile.CodeMissingGroup) {
		byName[strings.SplitN(m, ":", 2)[0]] = m
	}
	return byName
}

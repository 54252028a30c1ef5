package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/speciesfile"
)

// TestInvalidNamesAreNotData: a species statement without a name, or named
// by a number or a reserved word, gets the reader's syntax error only: no
// phantom species, no estimate, no duplicate-structure warning. A species
// without SMILES or composition gets one error, not two.
func TestInvalidNamesAreNotData(t *testing.T) {
	res := analyzeText(t, "# header\nspecies A CC\nspecies\nspecies 1.5 CC\nspecies + CC\nspecies (+X) CC\nspecies M C\nspecies Z\n")
	var names []string
	for _, sp := range res.Species {
		names = append(names, sp.Name)
	}
	assert.Equal(t, []string{"A", "Z"}, names)
	byLine := map[int][]string{}
	for _, d := range res.Diagnostics {
		line := res.Files["r.kiln"].Lines.Position(d.Span.Start).Line + 1
		byLine[line] = append(byLine[line], d.Code)
	}
	for line := 3; line <= 8; line++ {
		assert.Equal(t, []string{"syntax"}, byLine[line], "line %d", line)
	}
	require.Len(t, byLine[1], 0)
}

// TestBrokenReactionsOnlySyntax: a reaction whose equation or rate lines
// have a syntax error gets that error only — no unbalanced-reaction,
// undeclared-species or duplicate-reaction, and it is no one's duplicate.
func TestBrokenReactionsOnlySyntax(t *testing.T) {
	res := analyzeText(t, `species H [H]
species HO2 [O]O
species H2O O
species A CC
reaction H + HO2 <=> H2O   A=1e13 n=0 Ea=1.5d3
reaction H + HO2 <=> H2O + X   A=1e13 n=0
reaction
reaction A
reaction A <=> B +
reaction A <=> B +
`)
	for _, d := range res.Diagnostics {
		if d.Severity == speciesfile.SeverityError || d.Severity == speciesfile.SeverityWarning {
			assert.Equal(t, "syntax", d.Code, "%s", d.Message)
		}
	}
}

// TestNonphysicalRate: Troe parameters that make the falloff rate
// impossible to evaluate are an error on the troe line, and the rate is
// not used; usable ones are not flagged.
func TestNonphysicalRate(t *testing.T) {
	const head = "species CH3 [CH3]\nspecies C2H6 CC\nreaction CH3 + CH3 (+M) <=> C2H6 (+M)   A=2.1e16 n=-0.97 Ea=0.62\n  low-pressure A=1.27e41 n=-7.0 Ea=2.76\n"
	for _, c := range []struct{ troe, want string }{
		{"  troe alpha=5 T3=-73 T1=-1180\n", "troe T3=-73 K is negative"},
		{"  troe alpha=5 T3=1e30 T1=73\n", "troe parameters give Fcent = -"},
		{"  troe alpha=0.62 T3=73 T1=1180 T2=-10\n", "troe T2=-10 K is negative"},
		{"  troe alpha=0.62 T3=73 T1=1180\n", ""},
		{"  troe alpha=0.62 T3=0 T1=0 T2=0\n", ""},
	} {
		res := analyzeText(t, head+c.troe)
		msgs := messagesWithCode(res, speciesfile.CodeNonphysicalRate)
		r := res.Reactions[0]
		if c.want == "" {
			assert.Empty(t, msgs, c.troe)
			assert.NotNil(t, r.ForwardRate1000, c.troe)
			continue
		}
		require.Len(t, msgs, 1, c.troe)
		assert.Contains(t, msgs[0], c.want)
		assert.Nil(t, r.ForwardRate1000, "a rate that cannot be evaluated is not used")
		assert.Nil(t, r.Collision)
	}
}

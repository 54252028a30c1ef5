package analysis

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

const stoichSpecies = `species H [H]
species O2 O=O
species OH [OH]
species H2O2 OO
species HO2 [O]O
`

// TestDuplicateReactionStoichiometry: one reaction however its sides are
// written (coefficient or repeated term, term order, direction) is reported
// as repeated; different stoichiometry or third body is not.
func TestDuplicateReactionStoichiometry(t *testing.T) {
	cases := []struct {
		a, b string
		dup  bool
	}{
		{"2 OH <=> H2O2", "OH + OH <=> H2O2", true},
		{"H2O2 <=> OH + OH", "2 OH <=> H2O2", true},
		{"OH + H + OH <=> H + H2O2", "H + 2 OH <=> H2O2 + H", true},
		{"1 OH + 1 OH <=> H2O2", "2.0 OH <=> 1 H2O2", true},
		{"0.1 OH + 0.2 OH <=> 0.15 H2O2", "0.3 OH <=> 0.15 H2O2", true},
		{"0.3 OH <=> 0.15 H2O2", "0.31 OH <=> 0.15 H2O2", false},
		{"2 OH <=> H2O2", "OH <=> H2O2", false},
		{"2 OH <=> H2O2", "2 OH + M <=> H2O2 + M", false},
		{"OH + OH + M <=> H2O2 + M", "2 OH + M <=> H2O2 + M", true},
		{"OH + OH (+M) <=> H2O2 (+M)", "2 OH (+M) <=> H2O2 (+M)", true},
	}
	for _, c := range cases {
		res := analyseText(t, stoichSpecies+"reaction "+c.a+"  A=1e13 n=0 Ea=0\nreaction "+c.b+"  A=1e13 n=0 Ea=0\n")
		got := 0
		for _, d := range res.Diagnostics {
			if d.Code == "duplicate-reaction" {
				got++
				assert.Contains(t, d.Message, "line 6", "%s | %s", c.a, c.b)
			}
		}
		want := 0
		if c.dup {
			want = 1
		}
		assert.Equal(t, want, got, "%s | %s", c.a, c.b)
	}
	// Declared duplicates in either spelling are not reported.
	res := analyseText(t, stoichSpecies+"reaction 2 OH <=> H2O2  A=1e13 n=0 Ea=0\n  duplicate\nreaction OH + OH <=> H2O2  A=1e12 n=0 Ea=0\n  duplicate\n")
	for _, d := range res.Diagnostics {
		assert.NotEqual(t, "duplicate-reaction", d.Code, d.Message)
	}
}

// TestCompareStoichiometry: compare matches a reaction whichever way each
// side writes its stoichiometry, in either direction.
func TestCompareStoichiometry(t *testing.T) {
	files := map[string]string{
		"/w/a.kiln": stoichSpecies + "reaction 2 OH <=> H2O2  A=1e13 n=0 Ea=0\nreaction H + HO2 <=> OH + OH  A=1e14 n=0 Ea=1\n",
		"/w/b.kiln": stoichSpecies + "reaction OH + OH <=> H2O2  A=2e13 n=0 Ea=0\nreaction 2 OH <=> HO2 + H  A=1e12 n=0 Ea=30\n",
	}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 2)
	assert.Empty(t, c.ReactionsOnlyA)
	assert.Empty(t, c.ReactionsOnlyB)
	assert.False(t, c.Reactions[0].Reversed)
	require.NotNil(t, c.Reactions[0].Ratio[1])
	assert.InEpsilon(t, 2, *c.Reactions[0].Ratio[1], 1e-12)
	assert.True(t, c.Reactions[1].Reversed)
}

// TestCompareCountsEveryReaction: every reaction of a side is either in a
// matched pair or listed as only on its side; a pair that holds several
// reactions of one equation lists them all and says whether they are
// declared `duplicate`.
func TestCompareCountsEveryReaction(t *testing.T) {
	a := stoichSpecies + `reaction HO2 + HO2 <=> H2O2 + O2  A=1.3e11 n=0 Ea=-1.6
  duplicate
reaction HO2 + HO2 <=> H2O2 + O2  A=3.7e14 n=0 Ea=12
  duplicate
reaction H + O2 <=> OH + OH  A=1e13 n=0 Ea=20
reaction H + O2 <=> OH + OH  A=1e12 n=0 Ea=10
reaction 2 OH <=> H2O2  A=1e13 n=0 Ea=0
  duplicate
reaction OH + OH <=> H2O2  A=1e12 n=0 Ea=0
  duplicate
`
	b := stoichSpecies + `reaction 2 HO2 <=> H2O2 + O2  A=1.3e11 n=0 Ea=-1.6
reaction H + O2 <=> OH + OH  A=1e13 n=0 Ea=20
`
	c := compareTexts(t, map[string]string{"/w/a.kiln": a, "/w/b.kiln": b}, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 2)
	inPairs := func(side func(ReactionPair) []ReactionRef) int {
		n := 0
		for _, p := range c.Reactions {
			n += len(side(p))
		}
		return n
	}
	allA := func(p ReactionPair) []ReactionRef { return p.AllA }
	allB := func(p ReactionPair) []ReactionRef { return p.AllB }
	assert.Equal(t, 6, c.A.Reactions)
	assert.Equal(t, c.A.Reactions, inPairs(allA)+len(c.ReactionsOnlyA), "every reaction of A counted once")
	assert.Equal(t, c.B.Reactions, inPairs(allB)+len(c.ReactionsOnlyB), "every reaction of B counted once")
	require.Len(t, c.ReactionsOnlyA, 2, "both reactions of the duplicate pair only in A are listed")
	assert.Equal(t, []int{12, 14}, []int{c.ReactionsOnlyA[0].Line, c.ReactionsOnlyA[1].Line})

	ho2 := c.Reactions[0]
	require.Len(t, ho2.AllA, 2)
	assert.Equal(t, []int{6, 8}, []int{ho2.AllA[0].Line, ho2.AllA[1].Line})
	assert.Equal(t, RepeatDeclared, ho2.RepeatA)
	assert.Equal(t, RepeatNone, ho2.RepeatB)
	assert.Contains(t, ho2.RepeatNote(), "2 reactions declared duplicate in A (lines 6, 8), rates summed")

	chain := c.Reactions[1]
	assert.Equal(t, RepeatUndeclared, chain.RepeatA)
	assert.Contains(t, chain.RepeatNote(), "without `duplicate`")
}

package benson

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// flagsOf returns the flags of e whose group name ends in suffix, and the
// sum of the counts they name.
func flagsOf(t *testing.T, e *Result, suffix string) ([]Missing, int) {
	var out []Missing
	sum := 0
	for _, m := range e.Missing {
		if strings.HasSuffix(m.Group, suffix) {
			n, ok := flagCount(m.Group, suffix)
			require.True(t, ok, m.Group)
			out = append(out, m)
			sum += n
		}
	}
	return out, sum
}

// A ketene whose CR2 end carries carbon substituents takes the alkene group
// there: flagged once, naming the alkene group used and the number of
// substituents, and its
// ΔHf° uncertainty widened by widenKeteneEnd per substituent, added
// linearly. Ketene itself, from which Ck was derived, is not flagged. The
// result does not depend on the spelling.
func TestSubstitutedKeteneFlag(t *testing.T) {
	cases := []struct {
		spellings []string
		subs      int
		group     string // the alkene group of the CR2 end
	}{
		{[]string{"C=C=O", "O=C=C"}, 0, "Cd-(H)2"},
		{[]string{"CC=C=O", "O=C=CC", "C(=C=O)C"}, 1, "Cd-(C)(H)"},
		{[]string{"CC(C)=C=O", "O=C=C(C)C", "C(C)(C)=C=O"}, 2, "Cd-(C)2"},
		{[]string{"CCC=C=O", "O=C=CCC"}, 1, "Cd-(C)(H)"},
		{[]string{"O=C=Cc1ccccc1", "O=C=CC1=CC=CC=C1", "c1cccc(C=C=O)c1"}, 1, "Cd-(Cb)(H)"},
		{[]string{"C=CC=C=O", "O=C=CC=C"}, 1, "Cd-(Cd)(H)"},
	}
	for _, c := range cases {
		var first *Result
		for _, smi := range c.spellings {
			e := heteroEstimate(t, smi)
			assert.Contains(t, groupNames(e), c.group, smi)
			flags, n := flagsOf(t, e, keteneEndSuffix)
			require.Equal(t, c.subs, n, "%s: the flag counts the carbon substituents: %v", smi, e.Missing)
			if c.subs > 0 {
				require.Len(t, flags, 1, "%s: one flag per ketene end", smi)
				assert.Equal(t, c.group+" (the alkene value)", flags[0].Approximation, smi)
				assert.Equal(t, keteneEndFlag(c.subs), flags[0].Group, smi)
			}
			base := maeToSigma * classError(e.Class)
			want := math.Hypot(base, widenKeteneEnd*float64(c.subs))
			assert.InDelta(t, want, e.Uncertainty/calorie/1000, 1e-9, "%s: class σ and %d × %.1f kcal/mol", smi, c.subs, widenKeteneEnd)
			if c.subs > 0 {
				assert.GreaterOrEqual(t, e.Uncertainty/calorie/1000, 3.0*float64(c.subs), smi)
			}
			if first == nil {
				first = e
				continue
			}
			assert.Equal(t, resultKey(first), resultKey(e), "%s vs %s", smi, c.spellings[0])
		}
	}
}

// The ketene rows of the validation table (computed values, not counted in
// its MAE) are estimated with the ketene-end flag, and the widened
// uncertainty covers their difference from the reference at 2σ.
func TestKeteneRowsFlagged(t *testing.T) {
	n := 0
	for _, r := range readHeteroRef(t) {
		if r.class != "ketene" {
			continue
		}
		n++
		e := heteroEstimate(t, r.smiles)
		flags, _ := flagsOf(t, e, keteneEndSuffix)
		assert.Len(t, flags, 1, "%s must be flagged", r.name)
		d := e.Hf298/calorie/1000 - r.hf
		u := e.Uncertainty / calorie / 1000
		t.Logf("%-16s estimate %7.2f ± %.2f kcal/mol, reference %7.2f, difference %+.2f (%.1fσ)", r.name, e.Hf298/calorie/1000, u, r.hf, d, math.Abs(d)/u)
		assert.LessOrEqual(t, math.Abs(d), 2*u, "%s: off by %.2f kcal/mol, beyond 2σ = %.2f", r.name, d, 2*u)
	}
	assert.Equal(t, 2, n, "methylketene and dimethylketene rows")
}

// Ketene-type carbons no group describes are refused: the message names the
// kind of carbon (isocyanate, cumulated, heteroatom-substituted ketene end)
// and ends with the route, a thermo block; it never calls an isocyanate or
// suboxide carbon a "ketene carbon".
func TestKeteneRefusalRoutes(t *testing.T) {
	cases := []struct{ smiles, want string }{
		{"CN=C=O", "atom 3 (C) is an isocyanate carbon (N=C=O, double bonds to atoms 2 (N) and 4 (O))"},
		{"O=C=NC", "is an isocyanate carbon"},
		{"O=C=C=C=O", "is a cumulated carbon of C=C=O whose =C partner (atom 3) is itself cumulated"},
		{"C=C=C=O", "atom 3 (C) is a cumulated carbon of C=C=O whose =C partner (atom 2) is itself cumulated"},
		{"O=C=C=O", "is itself cumulated"},
		{"COC=C=O", "atom 3 (C) is the CR2 end of a ketene (C=C=O with atoms 4 and 5) carrying a heteroatom (O)"},
		{"ClC=C=O", "carrying a heteroatom (Cl)"},
		{"NC(Cl)=C=O", "carrying a heteroatom (Cl, N)"},
		{"Cl/C(N)=C=O", "carrying a heteroatom (Cl, N)"},
	}
	for _, c := range cases {
		_, err := Estimate(parse(t, c.smiles), Options{})
		require.Error(t, err, c.smiles)
		msg := err.Error()
		assert.Contains(t, msg, c.want, c.smiles)
		assert.True(t, strings.HasSuffix(msg, "; "+thermoBlockRoute), "%s: the refusal must end with the route: %s", c.smiles, msg)
		assert.NotContains(t, msg, "ketene carbon", c.smiles)
		var ue *UnsupportedError
		assert.ErrorAs(t, err, &ue, c.smiles)
	}
}

// Adjacent allene centres (butatriene and longer cumulenes) take allene's
// Ca group, flagged once per chain with its number of centres and widened
// as a stand-in group per centre;
// allene and substituted allenes, where Ca has ordinary Cd partners, are
// not flagged, and the Ca value is allene's.
func TestCumuleneFlag(t *testing.T) {
	cases := []struct {
		spellings []string
		centres   []int // chain lengths, in the order of the flags
	}{
		{[]string{"C=C=C"}, nil},
		{[]string{"C=C=CC", "CC=C=C"}, nil},
		{[]string{"CC=C=CC"}, nil},
		{[]string{"C=C=C=C", "C(=C)=C=C"}, []int{2}},
		{[]string{"CC=C=C=C", "C=C=C=CC"}, []int{2}},
		{[]string{"C=C=C=C=C"}, []int{3}},
		{[]string{"C=C=C=CCC=C=C=C", "C(C=C=C=C)C=C=C=C"}, []int{2, 2}},
	}
	for _, c := range cases {
		var first *Result
		for _, smi := range c.spellings {
			e := estimate(t, smi, Options{})
			flags, n := flagsOf(t, e, cumuleneSuffix)
			require.Len(t, flags, len(c.centres), "%s: %v", smi, e.Missing)
			for k, f := range flags {
				assert.Equal(t, cumuleneFlag(c.centres[k]), f.Group, smi)
				assert.True(t, strings.HasPrefix(f.Approximation, "Ca, "), "%s: %s", smi, f.Approximation)
			}
			assert.Len(t, e.Missing, len(flags), "%s: no other flag: %v", smi, e.Missing)
			want := math.Sqrt(math.Pow(maeToSigma*classError(e.Class), 2) + float64(n)*widenGroup*widenGroup)
			assert.InDelta(t, want, e.Uncertainty/calorie/1000, 1e-9, smi)
			for _, g := range e.Groups {
				if g.Name == "Ca" {
					assert.InDelta(t, 34.20, g.Hf298/calorie/1000/float64(g.Count), 1e-9, "%s: allene's Ca (Benson 1976) unchanged", smi)
				}
			}
			if first == nil {
				first = e
				continue
			}
			assert.Equal(t, resultKey(first), resultKey(e), "%s vs %s", smi, c.spellings[0])
		}
	}
}

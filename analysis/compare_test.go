package analysis

import (
	"context"
	"fmt"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/kinetics"
	"kiln.dev/kiln/internal/mechgen"
)

func compareTexts(t testing.TB, files map[string]string, a, b string) *Comparison {
	ws := NewWorkspace("/w", func(p string) ([]byte, error) {
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, fmt.Errorf("no file %s", p)
	}, DefaultSettings())
	c, err := ws.Compare(context.Background(), a, b, CompareOptions{})
	require.NoError(t, err)
	return c
}

func pairNames(c *Comparison) map[string]string {
	out := map[string]string{}
	for _, p := range c.Species {
		out[p.A.Name] = p.B.Name
	}
	return out
}

// TestCompareMatching: structure and multiplicity decide, not names or
// spellings; stereo isomers stay apart; lumped species pair by name and
// composition; included files count; a multiplicity written out equals the
// ground state kiln assumes without it (O=O is triplet oxygen).
func TestCompareMatching(t *testing.T) {
	files := map[string]string{
		"/w/a.kiln": `species CH2 [CH2]
species singlet-CH2 [CH2]
  multiplicity 1
species cis C/C=C\C
species trans C/C=C/C
species benzene c1ccccc1
species O2 O=O
  multiplicity 3
species tar
  composition C10H8
  thermo-table
    hf298 35
    s298 80
    cp 300=32 1000=70
species pitch
  composition C16H10
  thermo-table
    hf298 50
    s298 90
    cp 300=40 1000=90
include more.kiln
`,
		"/w/more.kiln": "species acetone CC(C)=O\n",
		"/w/b.kiln": `species methylene-s [CH2]
  multiplicity 1
species methylene [CH2]
species E-butene C\C=C\C
species Z-butene C/C=C\C
species phenyl-H C1=CC=CC=C1
species oxygen O=O
species tar
  composition C10H8
  thermo-table
    hf298 35
    s298 80
    cp 300=32 1000=70
species pitch
  composition C16H12
  thermo-table
    hf298 50
    s298 90
    cp 300=40 1000=90
species propanone O=C(C)C
`,
	}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	assert.Equal(t, map[string]string{"CH2": "methylene", "singlet-CH2": "methylene-s", "cis": "Z-butene", "trans": "E-butene",
		"benzene": "phenyl-H", "O2": "oxygen", "tar": "tar", "acetone": "propanone"}, pairNames(c))
	require.Len(t, c.OnlyA, 1)
	assert.Equal(t, "pitch", c.OnlyA[0].Name, "same name, other composition: not matched")
	assert.Equal(t, "/w/more.kiln", c.Species[len(c.Species)-1].A.File)
	for _, p := range c.Species {
		if p.A.Name == "tar" {
			assert.Equal(t, "name", p.By)
		} else {
			assert.Equal(t, "structure", p.By)
		}
	}
}

// TestCompareResonance: one delocalised radical written as two resonance
// structures on the two sides is one species (propargyl's structures are
// different graphs; allyl's are the same graph), while radicals that only
// share a skeleton (1- and 2-propyl) stay apart.
func TestCompareResonance(t *testing.T) {
	files := map[string]string{
		"/w/a.kiln": "species C3H3 [CH2]C#C\nspecies allyl [CH2]C=C\nspecies npropyl CC[CH2]\nspecies CH2CHO [CH2]C=O\n",
		"/w/b.kiln": "species propargyl C=C=[CH]\nspecies C3H5 C=C[CH2]\nspecies ipropyl C[CH]C\nspecies vinoxy C=C[O]\n",
	}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	assert.Equal(t, map[string]string{"C3H3": "propargyl", "allyl": "C3H5", "CH2CHO": "vinoxy"}, pairNames(c))
	require.Len(t, c.OnlyA, 1)
	assert.Equal(t, "npropyl", c.OnlyA[0].Name)
	require.Len(t, c.OnlyB, 1)
	assert.Equal(t, "ipropyl", c.OnlyB[0].Name)
}

// TestCompareReactions: duplicates are summed, third bodies must agree,
// and an irreversible step written the other way has no ratio.
func TestCompareReactions(t *testing.T) {
	files := map[string]string{
		"/w/a.kiln": `species H [H]
species O2 O=O
species HO2 [O]O
species OH [OH]
species O [O]
reaction H + O2 (+M) <=> HO2 (+M)   A=4.6e12 n=0.44 Ea=0
  low-pressure A=6.3e19 n=-1.4 Ea=0
reaction H + O2 <=> O + OH   A=1e14 n=0 Ea=15
  duplicate
reaction H + O2 <=> O + OH   A=1e13 n=0 Ea=5
  duplicate
reaction HO2 + H => OH + OH   A=7e13 n=0 Ea=0.3
`,
		"/w/b.kiln": `species h [H]
species o2 O=O
species ho2 [O]O
species oh [OH]
species o [O]
reaction h + o2 + M <=> ho2 + M   A=4.6e12 n=0.44 Ea=0
reaction o2 + h <=> oh + o   A=1.1e14 n=0 Ea=15
reaction oh + oh => ho2 + h   A=1e12 n=0 Ea=30
`,
	}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 2)
	chain := c.Reactions[0]
	assert.Equal(t, "o2 + h <=> oh + o", chain.B.Equation)
	ka := func(T float64) float64 { return arr(1e14, 15).Rate(T) + arr(1e13, 5).Rate(T) }
	for i, tt := range CompareRateTemps {
		require.NotNil(t, chain.Ratio[i])
		assert.InEpsilon(t, arr(1.1e14, 15).Rate(tt.T)/ka(tt.T), *chain.Ratio[i], 1e-12, "duplicates summed")
	}
	rev := c.Reactions[1]
	assert.True(t, rev.Reversed)
	assert.Equal(t, [3]*float64{}, rev.Ratio, "an irreversible step has no rate the other way")
	// The falloff (+M) and the plain third body M are different reactions.
	require.Len(t, c.ReactionsOnlyA, 1)
	assert.Contains(t, c.ReactionsOnlyA[0].Equation, "(+M)")
	require.Len(t, c.ReactionsOnlyB, 1)
	assert.Contains(t, c.ReactionsOnlyB[0].Equation, "+ M")
}

// TestCompareFalloff: falloff reactions are compared at the settings'
// pressure with the N2 bath gas, each side with its own N2 efficiency, so
// two falloffs with one high-pressure limit but different low-pressure
// limits (or efficiencies) differ; the note says what was compared. (H +
// O2 at 1 atm is near its low-pressure limit, so the ratios are close to
// the factors applied to k0.)
func TestCompareFalloff(t *testing.T) {
	base := `species H [H]
species O2 O=O
species HO2 [O]O
species N2 N#N
reaction H + O2 (+M) <=> HO2 (+M)   A=4.6e12 n=0.44 Ea=0
  low-pressure A=%s n=-1.4 Ea=0
  efficiencies N2=%s
`
	files := map[string]string{
		"/w/a.kiln": fmt.Sprintf(base, "6.3e19", "1.0"),
		"/w/b.kiln": fmt.Sprintf(base, "1.26e20", "1.0"),
		"/w/c.kiln": fmt.Sprintf(base, "6.3e19", "0.5"),
	}
	low := kinetics.Arrhenius{A: 6.3e19, N: -1.4}
	kf := func(lowFactor, eff, T float64) float64 {
		l := low
		l.A *= lowFactor
		f := kinetics.Falloff{High: kinetics.Arrhenius{A: 4.6e12, N: 0.44}, Low: l}
		return f.Rate(T, eff*kinetics.Concentration(T, 101325))
	}
	for _, c := range []struct {
		b              string
		lowFactor, eff float64
	}{{"/w/b.kiln", 2, 1}, {"/w/c.kiln", 1, 0.5}} {
		cmp := compareTexts(t, files, "/w/a.kiln", c.b)
		require.Len(t, cmp.Reactions, 1, c.b)
		p := cmp.Reactions[0]
		assert.Contains(t, p.Note, "falloff rates at 1.01325 bar")
		for i, tt := range CompareRateTemps {
			require.NotNil(t, p.Ratio[i])
			want := kf(c.lowFactor, c.eff, tt.T) / kf(1, 1, tt.T)
			assert.InEpsilon(t, want, *p.Ratio[i], 1e-9, "%s at %g K", c.b, tt.T)
			// Equal high-pressure limits: comparing those alone gave 1.
			assert.Greater(t, math.Abs(*p.Ratio[i]-1), 0.1, "%s at %g K", c.b, tt.T)
		}
	}
}

func arr(a, eaKcal float64) kinetics.Arrhenius { return kinetics.Arrhenius{A: a, Ea: eaKcal * 4184} }

var (
	generatedName = regexp.MustCompile(`\b([MR])(\d+)\b`)
	coreName      = regexp.MustCompile(`(^| )(H|H2|OH|H2O|HO2|H2O2|O2)( |$)`)
	preExp        = regexp.MustCompile(`A=([0-9.e+-]+)`)
)

// renameAll gives every species of a generated mechanism another name and
// doubles the pre-exponential factor of every tenth reaction.
func renameAll(src string) string {
	lines := strings.Split(src, "\n")
	n := 0
	for i, line := range lines {
		line = generatedName.ReplaceAllString(line, "${1}x$2")
		for range 2 { // adjacent matches share a blank
			line = coreName.ReplaceAllString(line, "${1}${2}-b${3}")
		}
		if strings.HasPrefix(line, "reaction ") {
			n++
			if n%10 == 0 {
				line = preExp.ReplaceAllStringFunc(line, func(m string) string {
					v, _ := strconv.ParseFloat(m[2:], 64)
					return "A=" + strconv.FormatFloat(2*v, 'g', -1, 64)
				})
			}
		}
		lines[i] = line
	}
	return strings.Join(lines, "\n")
}

// BenchmarkCompare10k compares two generated 10k-molecule mechanisms
// (20,000 species and 30,000 reactions each, internal/mechgen): the same
// mechanism with every name changed and every tenth rate doubled (a merge
// of two spellings of one mechanism), from a cold workspace.
func BenchmarkCompare10k(b *testing.B) {
	a := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	renamed := renameAll(string(a))
	files := map[string]string{"/w/a.kiln": string(a), "/w/b.kiln": renamed}
	b.ResetTimer()
	for b.Loop() {
		c := compareTexts(b, files, "/w/a.kiln", "/w/b.kiln")
		if len(c.Species) != 20007 || len(c.Reactions) != 30000 {
			b.Fatalf("%d species, %d reactions matched", len(c.Species), len(c.Reactions))
		}
	}
}

// BenchmarkCompare10kDistinct compares two generated 10k-molecule
// mechanisms from different seeds (few shared species).
func BenchmarkCompare10kDistinct(b *testing.B) {
	files := map[string]string{
		"/w/a.kiln": string(mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})),
		"/w/b.kiln": string(mechgen.Generate(mechgen.Options{Seed: 2, Molecules: 10000})),
	}
	b.ResetTimer()
	for b.Loop() {
		compareTexts(b, files, "/w/a.kiln", "/w/b.kiln")
	}
}

// TestCompareGenerated: a generated mechanism against its renamed copy
// (renameAll): every species and reaction is matched through the renaming,
// every tenth reaction has k_B/k_A = 2 and the others 1. Large enough that
// structures are read and estimated on several goroutines.
func TestCompareGenerated(t *testing.T) {
	src := mechgen.Generate(mechgen.Options{Seed: 3, Molecules: 300})
	files := map[string]string{"/w/a.kiln": string(src), "/w/b.kiln": renameAll(string(src))}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	assert.Len(t, c.Species, 607)
	assert.Empty(t, c.OnlyA)
	assert.Empty(t, c.OnlyB)
	assert.Empty(t, c.NameClashes)
	require.Len(t, c.Reactions, 900)
	doubled := 0
	for i, p := range c.Reactions {
		want := 1.0
		if (i+1)%10 == 0 {
			want = 2
			doubled++
		}
		for k := range p.Ratio {
			require.NotNil(t, p.Ratio[k])
			assert.InEpsilon(t, want, *p.Ratio[k], 1e-12, "%s", p.A.Equation)
		}
	}
	assert.Equal(t, 90, doubled)
	for _, p := range c.Species {
		assert.True(t, p.SameEstimate, p.A.Name)
		assert.True(t, p.Renamed())
	}
}

// TestIncludeDuplicatesBounded: an included file that repeats many of the
// including file's structures under other names gets at most
// maxIncludeDupReports warnings on the include, plus one that says there
// are more.
func TestIncludeDuplicatesBounded(t *testing.T) {
	var main, sub strings.Builder
	main.WriteString("include sub.kiln\n")
	chain := "C"
	for i := range 30 {
		chain += "C"
		fmt.Fprintf(&main, "species a%d %s\n", i, chain)
		fmt.Fprintf(&sub, "species b%d %s\n", i, chain)
	}
	ws := NewWorkspace("/w", func(p string) ([]byte, error) {
		if p == "/w/sub.kiln" {
			return []byte(sub.String()), nil
		}
		return nil, fmt.Errorf("no file %s", p)
	}, DefaultSettings())
	ws.SetOverlay("/w/main.kiln", []byte(main.String()))
	res, err := ws.Analyze(context.Background(), "/w/main.kiln")
	require.NoError(t, err)
	n, more := 0, 0
	for _, d := range res.Diagnostics {
		if d.Code == "duplicate-species" {
			n++
			if strings.Contains(d.Message, "kiln compare") {
				more++
			}
		}
	}
	assert.Equal(t, maxIncludeDupReports+1, n)
	assert.Equal(t, 1, more)
}

// TestCompareEfficiencies: matched third-body reactions whose efficiencies
// differ say so in the note, in A's names, an unlisted species counting 1.
func TestCompareEfficiencies(t *testing.T) {
	files := map[string]string{
		"/w/a.kiln": "species H [H]\nspecies O2 O=O\nspecies HO2 [O]O\nspecies H2O O\nspecies CO2 O=C=O\n" +
			"reaction H + O2 + M <=> HO2 + M   A=2.8e18 n=-0.86 Ea=0\n  efficiencies H2O=12 O2=0.78\n",
		"/w/b.kiln": "species h [H]\nspecies o2 O=O\nspecies ho2 [O]O\nspecies water O\nspecies co2 O=C=O\n" +
			"reaction h + o2 + M <=> ho2 + M   A=2.8e18 n=-0.86 Ea=0\n  efficiencies water=6 o2=0.78 co2=2\n",
	}
	c := compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 1)
	assert.Equal(t, "third-body efficiencies differ (A → B): CO2 (1) → 2, H2O 12 → 6", c.Reactions[0].Note)
	files["/w/b.kiln"] = strings.Replace(files["/w/b.kiln"], "water=6 o2=0.78 co2=2", "o2=0.78 water=12", 1)
	c = compareTexts(t, files, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 1)
	assert.Empty(t, c.Reactions[0].Note)
}

// TestCompareSelfMixedDirections: a file compared with itself has ratio 1
// for a group holding a reversible step and an irreversible step written
// the other way (the latter adds nothing to the forward direction), and
// reactions with a syntax error in their rate lines are left out.
func TestCompareSelfMixedDirections(t *testing.T) {
	text := `species H [H]
species H2 [H][H]
species Cl [Cl]
species HCl Cl
species C2H6 CC
species CH3 [CH3]
species C2H5 C[CH2]
species CH4 C
reaction H + HCl <=> H2 + Cl   A=2.3e13 n=0 Ea=3.5
reaction Cl + H2 => HCl + H   A=4.8e13 n=0 Ea=5.5
reaction C2H6 + CH3 <=> C2H5 + CH4   A=6e6 n=1.74 Ea=10 Ea=11
`
	c := compareTexts(t, map[string]string{"/w/a.kiln": text, "/w/b.kiln": text}, "/w/a.kiln", "/w/b.kiln")
	require.Len(t, c.Reactions, 1, "the broken reaction is not data")
	for i := range CompareRateTemps {
		require.NotNil(t, c.Reactions[0].Ratio[i])
		assert.InDelta(t, 1, *c.Reactions[0].Ratio[i], 1e-12)
	}
	assert.Empty(t, c.ReactionsOnlyA)
}

// TestCompareWithinStatedUncertainty: a block compared with reference data
// whose source states a ± wider than the threshold is not flagged on
// ΔHf° or G within that ± (SOF2: ± 50 kJ/mol); beyond it, it is.
func TestCompareWithinStatedUncertainty(t *testing.T) {
	lib := "species SOF2 O=S(F)F\n"
	blk := func(hf string) string {
		return "species SOF2 O=S(F)F\n  thermo-table\n    hf298 " + hf + "\n    s298 66.72\n    cp 300=13.68 1000=18.78 1500=19.35\n"
	}
	for _, c := range []struct {
		hf      string
		flagged bool
	}{{"-130", false}, {"-125", true}} {
		cmp := compareTexts(t, map[string]string{"a.kiln": lib, "b.kiln": blk(c.hf)}, "a.kiln", "b.kiln")
		require.Len(t, cmp.Species, 1)
		require.NotNil(t, cmp.Species[0].Thermo)
		assert.Equal(t, c.flagged, slices.Contains(cmp.Species[0].Thermo.Flags, "hf298"), "hf298 %s: %v", c.hf, cmp.Species[0].Thermo.Flags)
	}
}

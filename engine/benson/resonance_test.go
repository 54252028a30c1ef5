package benson

import (
	"errors"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"sort"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"kiln.dev/kiln/engine/molecule"
)

// resonanceRadicals are radicals with more than one resonance structure,
// written in one of them: allylic, propargylic, aromatic, enoxy, ring and
// heteroatom paths.
var resonanceRadicals = []string{
	"[CH2]C=C", "[CH2]C#C", "[CH2]c1ccccc1", "[O]c1ccccc1", "[CH2]C=CC=C",
	"[CH2]C=CC", "C=CC=C[O]", "C=C1[CH]C1", "[CH2]C=O", "CC(=O)[CH2]",
	"C1=CC=C[CH]1", "C=[C]C=C", "C=C[C]=O", "C[C](C)C=C", "[CH2]C(C)=C",
	"C1=CC[CH]C=C1", "[CH]1C=CCCC1", "[CH2]c1ccc2ccccc2c1", "[CH2]c1cccc2ccccc12",
	"C[CH]c1ccccc1", "[O]c1ccc(C)cc1", "[CH2]C=CC=O", "O=C[CH]C(C)=O",
	"[CH2]C#CC", "CC#C[CH]C", "[CH2]/C=C/C=C/C", "[CH2]C(=C)C=C", "C=CC(=O)[CH2]",
	"[CH2]C1=CCCC1", "O=C1[CH]CCC1", "[CH2]C=N", "C=C[NH]", "[CH2]c1ccncc1",
	"[O]C1=CC=CCC1", "c1ccc2c(c1)[CH]c1ccccc12", "[CH2]C=CC#C",
	// thiyl ↔ thione (a terminal divalent S as an end of the shift)
	"C=C[S]", "[S]c1ccccc1", "[S]C=CC=C", "CC(=S)[CH2]",
}

// respellKekule writes m as a random Kekulé SMILES: a random start atom and
// branch order, every atom a bracket atom with its hydrogen count (so a
// radical is an atom with too few), every multiple bond explicit.
func respellKekule(m *molecule.Molecule, r *rand.Rand) string {
	n := len(m.Atoms)
	visited := make([]bool, n)
	seen := make([]bool, len(m.Bonds))
	children := make([][]int, n)
	closuresAt := make([][]int, n)
	var closures []int
	var dfs func(a int)
	dfs = func(a int) {
		visited[a] = true
		adj := slices.Clone(m.Adj[a])
		r.Shuffle(len(adj), func(i, j int) { adj[i], adj[j] = adj[j], adj[i] })
		for _, b := range adj {
			if seen[b] {
				continue
			}
			seen[b] = true
			o := m.Other(b, a)
			if visited[o] {
				closures = append(closures, b)
				closuresAt[a] = append(closuresAt[a], b)
				closuresAt[o] = append(closuresAt[o], b)
				continue
			}
			children[a] = append(children[a], b)
			dfs(o)
		}
	}
	start := r.IntN(n)
	dfs(start)
	sym := map[int]string{1: "", 2: "=", 3: "#"}
	var sb strings.Builder
	var write func(a int)
	write = func(a int) {
		at := m.Atoms[a]
		sb.WriteString("[" + at.Element)
		if at.HCount > 0 {
			fmt.Fprintf(&sb, "H%d", at.HCount)
		}
		sb.WriteString("]")
		for _, b := range closuresAt[a] {
			fmt.Fprintf(&sb, "%s%%%d", sym[m.Bonds[b].Order], 10+slices.Index(closures, b))
		}
		for k, b := range children[a] {
			last := k == len(children[a])-1
			if !last {
				sb.WriteByte('(')
			}
			sb.WriteString(sym[m.Bonds[b].Order])
			write(m.Other(b, a))
			if !last {
				sb.WriteByte(')')
			}
		}
	}
	write(start)
	return sb.String()
}

// resultKey is everything an estimate promises, rounded far below any
// group value so that summation order cannot show.
func resultKey(e *Result) string {
	var miss []string
	for _, m := range e.Missing {
		miss = append(miss, m.Group+" ≈ "+m.Approximation)
	}
	sort.Strings(miss)
	round := func(x float64) string { return fmt.Sprintf("%.6f", x) }
	cp := make([]string, len(e.Cp))
	for i, c := range e.Cp {
		cp[i] = round(c)
	}
	return strings.Join([]string{
		e.Formula, round(e.Hf298), round(e.S298), strings.Join(cp, ","),
		fmt.Sprint(e.SymmetryNumber, e.OpticalIsomers, e.Multiplicity),
		e.Class, round(e.Uncertainty), e.Form, fmt.Sprint(e.ResonanceForms),
		strings.Join(miss, "; "),
	}, " | ")
}

// generatedResonanceRadicals draws structures from the accounting corpus
// generator and keeps uncharged C/H/O/N monoradicals with more than one
// resonance structure.
func generatedResonanceRadicals(t *testing.T, want int) []string {
	r := rand.New(rand.NewPCG(7, 2026))
	var out []string
	for k := 0; k < 200000 && len(out) < want; k++ {
		smi := randomSMILES(r)
		m, err := molecule.ParseSMILES(smi)
		if err != nil || m.UnpairedElectrons() != 1 || m.Charge() != 0 {
			continue
		}
		ok := true
		for _, a := range m.Atoms {
			if !conjugable(a.Element) || a.Charge != 0 {
				ok = false
			}
		}
		if !ok || strings.Contains(smi, ".") {
			continue
		}
		forms, _ := resonanceForms(m, maxResonanceForms)
		if len(forms) < 2 {
			continue
		}
		out = append(out, smi)
	}
	require.Len(t, out, want, "the generator yields enough resonance-capable radicals")
	return out
}

// One answer per molecule: every resonance structure of a radical, each in
// several random spellings, gives the same values, symmetry number, flags,
// uncertainty and representative structure (or the same refusal).
func TestResonanceOneAnswer(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 12))
	all := append(slices.Clone(resonanceRadicals), generatedResonanceRadicals(t, 40)...)
	multi := 0
	for _, smi := range all {
		m := parse(t, smi)
		forms, capped := resonanceForms(m, maxResonanceForms)
		require.False(t, capped, smi)
		require.Greater(t, len(forms), 1, "%s has resonance structures", smi)
		var want string
		wantErr := ""
		for fi, f := range forms {
			spellings := []string{f.Canonical()}
			for range 3 {
				spellings = append(spellings, respellKekule(f, r))
			}
			for _, s := range spellings {
				g, err := molecule.ParseSMILES(s)
				require.NoError(t, err, "%s form %d spelled %s", smi, fi, s)
				e, err := Estimate(g, Options{})
				got, gotErr := "", ""
				if err != nil {
					gotErr = err.Error()
				} else {
					got = resultKey(e)
				}
				if fi == 0 && s == spellings[0] {
					want, wantErr = got, gotErr
					if err == nil && e.ResonanceForms > 1 {
						multi++
					}
					continue
				}
				// which missing group a refusal names first may follow the
				// atom order; whether it is refused may not
				assert.Equal(t, wantErr == "", gotErr == "", "%s: form %s spelled %s: %q vs %q", smi, f.Canonical(), s, wantErr, gotErr)
				assert.Equal(t, want, got, "%s: form %s spelled %s", smi, f.Canonical(), s)
			}
		}
	}
	t.Logf("%d radicals (%d with several distinct structures estimated), every structure × 4 spellings agree", len(all), multi)
}

// The representative is the most stable Lewis structure: benzyl keeps its
// aromatic ring, propargyl its propargylic increment, and the σ radical of
// phenyl is not moved into the ring.
func TestResonanceRepresentative(t *testing.T) {
	for _, c := range [][2]string{
		{"C=C1C=CC=C[CH]1", "[CH2]c1ccccc1"},
		{"C=C=[CH]", "[CH2]C#C"},
		{"O=C1C=C[CH]C=C1", "[O]c1ccccc1"},
		{"C=C[CH]C=C", "[CH2]C=CC=C"},
		// thioformylmethyl is vinylthiyl (S• ↔ C=S), as [CH2]C=N is C=C[NH]
		{"[CH2]C=S", "C=C[S]"},
		{"S=C1C=C[C](C)C=C1", "[S]c1ccc(C)cc1"},
	} {
		a, b := estimate(t, c[0], Options{}), estimate(t, c[1], Options{})
		assert.Equal(t, parse(t, c[1]).Canonical(), a.Form, c[0])
		assert.Equal(t, resultKey(b), resultKey(a), c[0])
	}
	phenyl := parse(t, "[c]1ccccc1")
	forms, _ := resonanceForms(phenyl, maxResonanceForms)
	for _, f := range forms {
		if f.Canonical() != phenyl.Canonical() {
			assert.False(t, lewisAdmissible(f), "phenyl: %s is not a Lewis structure", f.Canonical())
		}
	}
	e := estimate(t, "[c]1ccccc1", Options{})
	assert.Equal(t, 1, correctionCount(e, "HBI: phenyl"))
	// a closed-shell molecule and a radical without conjugation have one
	// structure; the electron moves neither through S nor onto a sulfur
	// with other bonds (sulfoxide, thiophene ring, thiol)
	for _, s := range []string{"C=CC=C", "CC[CH2]", "c1ccccc1", "C[S]", "[CH2]S(C)=O", "[CH2]SC=C", "C=C[SH]"} {
		assert.Equal(t, "", estimate(t, s, Options{}).Form, s)
	}
}

// The enumeration is bounded, and an estimate that hit the bound says so.
func TestResonanceBound(t *testing.T) {
	m := parse(t, "[CH2]C=CC=CC=CC=CC=CC=CC=CC=CC=CC=C")
	forms, capped := resonanceForms(m, 4)
	assert.Len(t, forms, 4)
	assert.True(t, capped)
	// a long polyene radical: explored to the bound, and flagged
	long := "[CH2]" + strings.Repeat("c1ccc(cc1)", 0) + strings.Repeat("C=C", 70)
	e := estimate(t, long, Options{})
	assert.LessOrEqual(t, e.ResonanceForms, maxResonanceForms)
	found := slices.ContainsFunc(e.Missing, func(m Missing) bool { return m.Group == resonanceLimitGroup })
	assert.True(t, found, "%+v", e.Missing)
}

// radicalHf is published ΔHf°298 (kcal/mol) of resonance-stabilised and ring
// radicals, entered from memory of the named evaluations (BDE-derived rows:
// ΔHf(parent) + D(R–H) − ΔHf(H), ΔHf(H) = 52.10). Values already in
// testdata/thermo are repeated here only so that every resonance structure
// of them is checked.
var radicalHf = []struct {
	smiles string
	hf     float64
	source string
}{
	{"[CH2]C=C", 40.9, "Tsang 1996 (from memory)"},
	{"[CH2]C#C", 84.0, "Ruscic, Active Thermochemical Tables (from memory)"},
	{"[CH2]c1ccccc1", 49.7, "Luo 2007, BDE-derived (from memory)"},
	{"[O]c1ccccc1", 13.0, "Tsang 1996 / Luo 2007 (from memory)"},
	{"[CH2]C=CC=C", 49.7, "1,4-pentadiene −ΔHf 25.2 + D 76.6 − 52.10; Luo 2007 (from memory)"},
	{"[CH2]C(C)=C", 32.7, "isobutene −4.0 + D 88.8 − 52.10; Luo 2007 (from memory)"},
	{"[CH2]C=O", 3.5, "Ruscic, Active Thermochemical Tables (from memory; uncertain by up to 2)"},
	{"CC(=O)[CH2]", -8.3, "acetone −52.2 + D 96.0 − 52.10; Luo 2007 (from memory; uncertain by up to 2)"},
	{"C1=CC=C[CH]1", 61.5, "cyclopentadiene 32.1 + D 81.5 − 52.10; Luo 2007 (from memory)"},
}

// Accuracy of resonance-stabilised radicals, every structure of each: the
// MAE over all structures (each structure weighted once) stays at its
// measured value (kcal/mol).
func TestResonanceAccuracy(t *testing.T) {
	// measured 1.41 kcal/mol (run of 2026-12-03; 7.37 when each structure
	// was estimated as written, 2.71 before ring-radical sites)
	const maxMAE = 1.5
	sum, n := 0.0, 0
	for _, row := range radicalHf {
		forms, _ := resonanceForms(parse(t, row.smiles), maxResonanceForms)
		for _, f := range forms {
			e, err := Estimate(parse(t, f.Canonical()), Options{})
			require.NoError(t, err, f.Canonical())
			d := math.Abs(e.Hf298/calorie/1000 - row.hf)
			t.Logf("%-22s as %-22s %7.2f ref %6.1f  |Δ| %.2f", row.smiles, f.Canonical(), e.Hf298/calorie/1000, row.hf, d)
			sum += d
			n++
		}
	}
	mae := sum / float64(n)
	t.Logf("resonance radicals: MAE %.2f kcal/mol over %d structures", mae, n)
	assert.LessOrEqual(t, mae, maxMAE)
}

// BenchmarkEstimateResonance estimates radicals with several resonance
// structures (benzyl: 3 distinct; 1-naphthylmethyl; a C21 polyene radical
// at the structure bound), each parse included.
func BenchmarkEstimateResonance(b *testing.B) {
	for _, s := range []string{"[CH2]c1ccccc1", "[CH2]c1cccc2ccccc12", "[CH2]" + strings.Repeat("C=C", 10)} {
		b.Run(s, func(b *testing.B) {
			for b.Loop() {
				m, err := molecule.ParseSMILES(s)
				if err != nil {
					b.Fatal(err)
				}
				if _, err := Estimate(m, Options{}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
	// baseline: benzyl as one structure, without the enumeration
	b.Run("one structure [CH2]c1ccccc1", func(b *testing.B) {
		for b.Loop() {
			m, err := molecule.ParseSMILES("[CH2]c1ccccc1")
			if err != nil {
				b.Fatal(err)
			}
			if _, err := estimateForm(m, Options{}); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// A radical none of whose resonance structures can be estimated is refused
// with the missing group of a structure when one has it, not with another
// structure's structural refusal (a radical on a nitro O, an imine N).
func TestResonanceRefusalNamesGroup(t *testing.T) {
	for smiles, group := range map[string]string{
		"C=[C][N+](=O)[O-]":  "Cd-(NO2)(H)",
		"N#C[CH]Cl":          "C-(Cl)(CN)(H)2",
		"CC(Cl)(Br)C[CH]C#N": "C-(Cl)(Br)(C)2",
	} {
		_, err := Estimate(parse(t, smiles), Options{})
		var mg *MissingGroupError
		require.ErrorAs(t, err, &mg, smiles)
		assert.Equal(t, group, mg.Group, smiles)
	}
}

// A radical whose missing parent group would not make it estimable (the
// site has no increment in any of its structures: amidyl, aminoxyl,
// oxyl-on-S, perthiyl, diazenyl) is refused for the site, not sent to
// supply the group; where the group is a route (a vinyl radical with a
// nitro group), the group is named.
func TestRefusalNamesSiteWhenGroupIsNoRoute(t *testing.T) {
	for smi, site := range map[string]string{
		"CC(=O)[NH]": "amidyl", "[O]N(C)C": "aminoxyl", "CS[O]": "oxyl bonded to S",
		"CS[S]": "perthiyl", "O[N]O": "oxyaminyl",
	} {
		_, err := Estimate(parse(t, smi), Options{})
		var mg *MissingGroupError
		assert.False(t, errors.As(err, &mg), "%s: %v", smi, err)
		assert.ErrorContains(t, err, "radical site of type "+site, smi)
	}
	_, err := Estimate(parse(t, "C=[C][N+](=O)[O-]"), Options{})
	var mg *MissingGroupError
	require.ErrorAs(t, err, &mg)
	assert.Equal(t, "Cd-(NO2)(H)", mg.Group)
	assert.Empty(t, mg.Form)
}

// Where the group is a route through another resonance structure (C=C[N]N:
// the N• site as written has no increment, the C-centred structure
// lacks only groups), the refusal names the group, the structure that needs
// it and why the structure as written is refused.
func TestResonanceRefusalNamesForm(t *testing.T) {
	_, err := Estimate(parse(t, "C=C[N]N"), Options{})
	var mg *MissingGroupError
	require.ErrorAs(t, err, &mg)
	assert.NotEmpty(t, mg.Form)
	assert.Contains(t, mg.Written, "radical site of type")
	assert.Contains(t, err.Error(), "needed by the resonance structure "+mg.Form+"; the structure as written is refused: no hydrogen-bond increment")
}

package analysis

import (
	"context"
	"fmt"
	"io/fs"
	"math/rand/v2"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/internal/mechgen"
	"kiln.dev/kiln/speciesfile"
)

// incrementalBase is a small workspace touching every rule: given blocks
// (polynomial and table, sound and unsound), a lumped species, bad SMILES,
// duplicate names and structures, user groups in an included file,
// falloff/third-body reactions, an unbalanced reaction and comments.
const incrementalBase = `# furnace demo mechanism (invented scenario)
include shared.kiln

species N2 N#N
species CH4 C   # methane
species CH3 [CH3]
species C2H6 CC
species C2H5 C[CH2]
species ETOH CCO
  note ethanol
species BAD C1CC
species LUMP
  composition C10H22
  thermo-table
    hf298 -59.6
    s298 130.2
    cp 300=55.1 500=80.3 1000=120.4
species TAB CCC
  thermo-table
    hf298 -10
    s298 64.5
    cp 300=17.6 500=25.6 1000=36.1 800=30
species POLY O=C=O
  nasa7 200 1000 3500
    low  2.35677352e+00 8.98459677e-03 -7.12356269e-06 2.45919022e-09 -1.43699548e-13 -4.83719697e+04 9.90105222e+00
    high 3.85746029e+00 4.41437026e-03 -2.21481404e-06 5.23490188e-10 -4.72084164e-14 -4.87591660e+04 2.27163806e+00
species ETHANE CC
species CH4 C

reaction CH3 + CH3 (+M) <=> C2H6 (+M)   A=2.1e16 n=-0.97 Ea=0.62
  low-pressure A=1.27e41 n=-7.0 Ea=2.76
  troe alpha=0.62 T3=73 T1=1180 T2=5000
  efficiencies N2=1.0 AR=0.7
reaction CH4 + H <=> CH3 + H2   A=6.6e8 n=1.62 Ea=10.84
reaction C2H6 + H <=> C2H5 + H2   A=1.15e8 n=1.9 Ea=7.53
reaction C2H5 + M <=> C2H6 + M  A=1e14 n=0 Ea=0
reaction CH3 + CH3 => C2H6   A=1e20 n=0 Ea=0
reaction CH4 + H <=> CH3 + H2   A=6.6e8 n=1.62 Ea=10.84
reaction CH4 + OH <=> CH3 + H2O   A=1e7 n=1.8 Ea=2.8
reaction ETOH + H <=> C2H5 + H2   A=1e13 n=0 Ea=5
reaction LUMP + H <=> TAB + H2   A=1e13 n=0 Ea=5
`

const incrementalShared = `# shared core
species H [H]
species H2 [H][H]
species OH [OH]
species H2O O
group C-(C)(H)3
  hf298 -10.2
  s298 30.41
  cp 300=6.19 400=7.84 500=9.4 600=10.79 800=13.02 1000=14.77 1500=17.58
  source invented demo value
`

var smilesPool = []string{"C", "CC", "CCC", "CCCC", "C=C", "C#C", "CCO", "OCC", "C1CC1", "c1ccccc1", "[CH3]", "C[CH2]",
	"CC(C)C", "O=CC", "C1CC", "C(", "[Xx]", "CC(=O)O", "[O][O]", "N#N", "CCOC", "C1CCOC1", "[H]", "[H][H]", "O"}

var lineTemplates = []string{
	"species NEW%d %s\n",
	"reaction CH4 + H <=> CH3 + NEW%d   A=1e13 n=0 Ea=%s\n",
	"# a new comment %d %s\n",
	"\n",
	"species NEW%d %s\n  multiplicity 3\n",
	"reaction C2H6 + OH <=> C2H5 + H2O   A=%d.5e12 n=0 Ea=1%s\n",
	"group C-(C)2(H)2\n  hf298 -%d.9\n  s298 9.4\n  cp 300=5.5 1000=12\n  source demo %s\n",
	"units kJ/mol\n",
	"  symmetry %d\n# %s\n",
	"reaction CH3 + H (+M) <=> CH4 (+M)   A=%d.0e14 n=0 Ea=0\n  efficiencies X%s=2\n",
}

// randomEdit changes text at a random place in one of a few kinds of way.
func randomEdit(rng *rand.Rand, text string, step int) string {
	lines := strings.SplitAfter(text, "\n")
	pick := func() int { return rng.IntN(len(lines)) }
	switch rng.IntN(9) {
	case 0: // replace the SMILES of a species
		for range 20 {
			i := pick()
			f := strings.Fields(lines[i])
			if len(f) >= 3 && f[0] == "species" && !strings.HasPrefix(f[2], "#") {
				lines[i] = strings.Replace(lines[i], " "+f[2], " "+smilesPool[rng.IntN(len(smilesPool))], 1)
				break
			}
		}
	case 1: // type inside a comment (or start one at a line end)
		i := pick()
		l := strings.TrimRight(lines[i], "\n")
		if k := strings.Index(l, "#"); k >= 0 {
			at := k + 1 + rng.IntN(len(l)-k)
			l = l[:at] + fmt.Sprintf("x%d", step) + l[at:]
		} else if l != "" {
			l += " # typed " + fmt.Sprint(step)
		}
		lines[i] = l + strings.TrimPrefix(lines[i], strings.TrimRight(lines[i], "\n"))
	case 2: // delete a line
		i := pick()
		lines = append(lines[:i], lines[i+1:]...)
	case 3: // duplicate a line
		i := pick()
		lines = append(lines[:i+1], lines[i:]...)
	case 4, 5: // insert a line from the templates
		t := lineTemplates[rng.IntN(len(lineTemplates))]
		s := fmt.Sprintf(t, step%7, smilesPool[rng.IntN(len(smilesPool))])
		i := pick()
		lines = append(lines[:i], append([]string{s}, lines[i:]...)...)
	case 6: // change a number
		i := pick()
		lines[i] = strings.Replace(lines[i], "0", fmt.Sprint(rng.IntN(10)), 1)
	case 7: // insert or delete a few bytes anywhere
		if len(text) == 0 {
			return "species A C\n"
		}
		at := rng.IntN(len(text))
		if rng.IntN(2) == 0 {
			return text[:at] + []string{" ", "C", "\n", "#", "=", "  ", "H"}[rng.IntN(7)] + text[at:]
		}
		end := min(len(text), at+1+rng.IntN(4))
		return text[:at] + text[end:]
	case 8: // rename a species where it is used or declared
		i := pick()
		for _, n := range []string{"CH3", "C2H6", "H2", "OH", "TAB"} {
			if strings.Contains(lines[i], " "+n+" ") {
				lines[i] = strings.Replace(lines[i], " "+n+" ", " "+n+"X ", 1)
				break
			}
		}
	}
	return strings.Join(lines, "")
}

// digest writes what a result says in a comparable form: diagnostics with
// their positions and everything computed about species and reactions.
func digest(r *Result) string {
	var b strings.Builder
	for _, d := range r.Diagnostics {
		fmt.Fprintf(&b, "D %d-%d %s %s %q", d.Span.Start, d.Span.End, d.Severity, d.Code, d.Message)
		for _, rel := range d.Related {
			fmt.Fprintf(&b, " [%s %d-%d %q]", rel.File, rel.Span.Start, rel.Span.End, rel.Message)
		}
		b.WriteByte('\n')
	}
	for _, sp := range r.Species {
		hf, s, ok := sp.Hf298S298()
		fmt.Fprintf(&b, "S %s %s %v %s %s %v %v %v %v", sp.Name, sp.File, r.SpeciesLoc(sp).Span, sp.Formula, sp.Source, hf, s, ok, sp.MolarMass)
		if sp.Given != nil {
			fmt.Fprintf(&b, " given %v", sp.Given.Span.At(r.declStart(sp)))
		}
		if sp.Estimate != nil {
			fmt.Fprintf(&b, " est %v %v %v", sp.Estimate.Hf298, sp.Estimate.S298, sp.Estimate.Cp)
		}
		fmt.Fprintf(&b, " decl %p\n", sp.Decl)
	}
	f := func(p *float64) string {
		if p == nil {
			return "nil"
		}
		return fmt.Sprint(*p)
	}
	for _, rx := range r.Reactions {
		fmt.Fprintf(&b, "R %d %q %v %s %s %s %v %v %v", r.ReactionLine(rx), rx.Equation, rx.Resolved, f(rx.DH298), f(rx.DS298), f(rx.DG298),
			rx.Balance, rx.Collision, f(rx.ReverseRate1000))
		for _, k := range keqTemperatures {
			fmt.Fprintf(&b, " %s=%s", k.Key, f(rx.Kp[k.Key]))
		}
		fmt.Fprintf(&b, " decl %p\n", rx.Decl)
	}
	for _, g := range r.Groups {
		fmt.Fprintf(&b, "G %s %v %v\n", g.Name, g.Loc, g.UsedBy)
	}
	return b.String()
}

// TestIncrementalMatchesScratch applies random edit sequences to a
// workspace that keeps units between analyses and checks after every edit
// that its result is identical to an analysis from scratch of the same texts.
func TestIncrementalMatchesScratch(t *testing.T) {
	gen := string(mechgen.Generate(mechgen.Options{Seed: 3, Molecules: 30}))
	// Keep the generated file's statements but drop its units line and
	// core species (the base declares its own).
	gen = gen[strings.Index(gen, "species M1 "):]
	for seed := uint64(1); seed <= 5; seed++ {
		t.Run(fmt.Sprint("seed", seed), func(t *testing.T) {
			rng := rand.New(rand.NewPCG(seed, 99))
			files := map[string]string{"/w/main.kiln": incrementalBase + gen, "/w/shared.kiln": incrementalShared}
			load := func(p string) ([]byte, error) {
				if s, ok := files[p]; ok {
					return []byte(s), nil
				}
				return nil, &fs.PathError{Op: "open", Path: p, Err: fs.ErrNotExist}
			}
			inc := NewWorkspace("/w", load, DefaultSettings())
			inc.SetIncremental(true)
			var prev *Result
			prevDigest := ""
			reusedSpecies, reusedReactions := 0, 0
			for step := range 50 {
				target := "/w/main.kiln"
				if rng.IntN(6) == 0 {
					target = "/w/shared.kiln"
				}
				files[target] = randomEdit(rng, files[target], step)
				if rng.IntN(20) == 0 {
					s := DefaultSettings()
					s.DisplayUnits = []string{"kcal/mol", "kJ/mol"}[rng.IntN(2)]
					inc.SetSettings(s)
				}
				inc.SetOverlay("/w/main.kiln", []byte(files["/w/main.kiln"]))
				got, err := inc.Analyze(context.Background(), "/w/main.kiln")
				require.NoError(t, err)
				if rng.IntN(4) == 0 {
					// The included file analysed on its own keeps its own units.
					_, err := inc.Analyze(context.Background(), "/w/shared.kiln")
					require.NoError(t, err)
				}
				scratch := NewWorkspace("/w", load, inc.Settings())
				scratch.SetOverlay("/w/main.kiln", []byte(files["/w/main.kiln"]))
				want, err := scratch.Analyze(context.Background(), "/w/main.kiln")
				require.NoError(t, err)
				// Syntax nodes differ between the two parses; compare
				// everything else.
				gd := stripPointers(digest(got))
				wd := stripPointers(digest(want))
				if gd != wd {
					t.Fatalf("step %d: incremental result differs from scratch\n%s", step, firstDifference(gd, wd))
				}
				for _, sp := range got.Species {
					require.Same(t, got.Files[sp.File].Species[indexOf(got.Files[sp.File].Species, sp.Decl)], sp.Decl)
				}
				// Values reused from the last analysis are shared, never
				// modified: the last result still says what it said.
				if prev != nil {
					require.Equal(t, prevDigest, digest(prev), "step %d: the previous result changed", step)
					for _, sp := range got.Species {
						if prev.ByName[sp.Name] == sp {
							reusedSpecies++
						}
					}
					old := map[*Reaction]bool{}
					for _, r := range prev.Reactions {
						old[r] = true
					}
					for _, r := range got.Reactions {
						if old[r] {
							reusedReactions++
						}
					}
				}
				prev, prevDigest = got, digest(got)
			}
			require.Positive(t, reusedSpecies, "species values reused")
			require.Positive(t, reusedReactions, "reaction values reused")
		})
	}
}

func indexOf[T comparable](xs []T, x T) int {
	for i, y := range xs {
		if y == x {
			return i
		}
	}
	return -1
}

func stripPointers(s string) string {
	var b strings.Builder
	for _, l := range strings.Split(s, "\n") {
		if i := strings.Index(l, " decl 0x"); i >= 0 {
			l = l[:i]
		}
		b.WriteString(l + "\n")
	}
	return b.String()
}

func firstDifference(got, want string) string {
	g, w := strings.Split(got, "\n"), strings.Split(want, "\n")
	for i := 0; i < len(g) || i < len(w); i++ {
		var gl, wl string
		if i < len(g) {
			gl = g[i]
		}
		if i < len(w) {
			wl = w[i]
		}
		if gl != wl {
			return fmt.Sprintf("line %d:\n incremental: %s\n scratch:     %s", i, gl, wl)
		}
	}
	return "(none)"
}

// TestIncrementalReusesUnits checks that the units do their job: an edit to
// one SMILES recomputes one species unit and the reaction units naming that
// species, and a comment edit recomputes none.
func TestIncrementalReusesUnits(t *testing.T) {
	src := string(mechgen.Generate(mechgen.Options{Seed: 5, Molecules: 200}))
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fs.ErrNotExist }, DefaultSettings())
	ws.SetIncremental(true)
	analyse := func(text string) *Result {
		ws.SetOverlay("m.kiln", []byte(text))
		r, err := ws.Analyze(context.Background(), "m.kiln")
		require.NoError(t, err)
		return r
	}
	before := analyse(src)
	// A comment line between statements: every unit is reused.
	at := strings.Index(src, "species M7 ")
	after := analyse(src[:at] + "# a remark\n" + src[at:])
	requireReused(t, before, after, map[string]bool{}, map[string]bool{})
	// Every statement but the two read again (the one holding the comment
	// and the one before it) is the same syntax node, moved or not, so its
	// value is the same too: values hold no positions.
	kept := 0
	for _, sp := range after.Species {
		same := before.ByName[sp.Name].Decl == sp.Decl
		require.Equal(t, same, before.ByName[sp.Name] == sp, "species %s: value reused", sp.Name)
		if same {
			kept++
		}
	}
	require.GreaterOrEqual(t, kept, len(after.Species)-2, "species values reused")
	require.NotSame(t, before.ByName["M7"], after.ByName["M7"], "M7 was read again")
	keptRx := 0
	for i, r := range after.Reactions {
		if before.Reactions[i] == r {
			keptRx++
			require.Same(t, before.Reactions[i].Decl, r.Decl)
		}
	}
	require.GreaterOrEqual(t, keptRx, len(after.Reactions)-2, "reaction values reused")
	// the values and positions of the moved statements are right: the
	// result equals an analysis from scratch (TestIncrementalMatchesScratch
	// checks that on random edits)
	m7 := after.SpeciesLoc(after.ByName["M7"])
	require.Equal(t, "M7", string(after.File.Src[m7.Span.Start:m7.Span.End]))
	last := after.Species[len(after.Species)-1]
	loc := after.SpeciesLoc(last)
	require.Equal(t, last.Name, string(after.File.Src[loc.Span.Start:loc.Span.End]))
	require.Equal(t, before.SpeciesLoc(last).Span.Start+len("# a remark\n"), loc.Span.Start)

	// A new SMILES for M7: its unit, and only the reactions naming M7.
	line := src[at : at+strings.IndexByte(src[at:], '\n')]
	edited := strings.Replace(src, line, "species M7 CCCCCCO", 1)
	after2 := analyse(edited)
	changedRx := map[string]bool{}
	for _, r := range after2.Reactions {
		for _, tm := range append(append([]speciesfile.Term{}, r.Decl.Reactants...), r.Decl.Products...) {
			if tm.Name.Text == "M7" {
				changedRx[r.Equation] = true
			}
		}
	}
	require.Len(t, changedRx, 3, "the generator writes three reactions per molecule")
	requireReused(t, after, after2, map[string]bool{"M7": true}, changedRx)
}

// requireReused checks which species and reactions of b were made from new
// units compared with a (by unit identity).
func requireReused(t *testing.T, a, b *Result, species, reactions map[string]bool) {
	t.Helper()
	for _, sp := range b.Species {
		old := a.ByName[sp.Name]
		require.NotNil(t, old)
		require.Equal(t, !species[sp.Name], old.unit == sp.unit, "species %s: unit reused", sp.Name)
	}
	oldRx := map[string]*Reaction{}
	for _, r := range a.Reactions {
		oldRx[r.Equation] = r
	}
	for _, r := range b.Reactions {
		old := oldRx[r.Equation]
		require.NotNil(t, old)
		same := old.DH298 == r.DH298 // units share their computed values
		require.Equal(t, !reactions[r.Equation], same, "reaction %s: unit reused", r.Equation)
	}
}

// TestIncrementalLeadingComment: a comment typed just before a declaration
// with a thermo block changes the statement's leading lines, not its body:
// its unit is reused and every position (the block's too) must come out as
// from scratch.
func TestIncrementalLeadingComment(t *testing.T) {
	at := strings.Index(incrementalBase, "species POLY ")
	require.Positive(t, at)
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fs.ErrNotExist }, DefaultSettings())
	ws.SetIncremental(true)
	for _, text := range []string{incrementalBase, incrementalBase[:at] + "# a remark\n# and another\n" + incrementalBase[at:]} {
		ws.SetOverlay("m.kiln", []byte(text))
		got, err := ws.Analyze(context.Background(), "m.kiln")
		require.NoError(t, err)
		scratch := NewWorkspace("", func(string) ([]byte, error) { return nil, fs.ErrNotExist }, DefaultSettings())
		scratch.SetOverlay("m.kiln", []byte(text))
		want, err := scratch.Analyze(context.Background(), "m.kiln")
		require.NoError(t, err)
		require.Equal(t, stripPointers(digest(want)), stripPointers(digest(got)))
		require.NotNil(t, got.ByName["POLY"].Given)
	}
}

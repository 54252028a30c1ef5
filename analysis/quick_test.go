package analysis

import (
	"cmp"
	"context"
	"fmt"
	"io/fs"
	"math/rand/v2"
	"slices"
	"strings"
	"sync"
	"testing"

	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/internal/mechgen"
)

// triviaEdit changes only blank and comment lines of text (most of the
// time: a comment typed inside a statement's lines changes its body, which
// the shortcut must notice).
func triviaEdit(rng *rand.Rand, text string, step int) string {
	lines := strings.SplitAfter(text, "\n")
	pick := func() int { return rng.IntN(len(lines)) }
	switch rng.IntN(6) {
	case 0, 1: // a comment line typed before a line
		i := pick()
		lines = append(lines[:i], append([]string{fmt.Sprintf("# remark %d\n", step)}, lines[i:]...)...)
	case 2: // a blank line
		i := pick()
		lines = append(lines[:i], append([]string{"\n"}, lines[i:]...)...)
	case 3: // a comment or blank line deleted
		for range 20 {
			i := pick()
			if t := strings.TrimSpace(lines[i]); t == "" || strings.HasPrefix(t, "#") {
				lines = append(lines[:i], lines[i+1:]...)
				break
			}
		}
	case 4: // typing inside a comment line (the same lines)
		for range 20 {
			i := pick()
			if strings.HasPrefix(lines[i], "#") {
				l := strings.TrimRight(lines[i], "\n")
				at := 1 + rng.IntN(len(l))
				lines[i] = l[:at] + fmt.Sprintf("x%d", step) + l[at:] + lines[i][len(l):]
				break
			}
		}
	case 5: // a comment line's text replaced by as many bytes
		for range 20 {
			i := pick()
			if strings.HasPrefix(lines[i], "# ") && len(lines[i]) > 4 {
				lines[i] = "# " + strings.Repeat("z", len(lines[i])-3) + "\n"
				break
			}
		}
	}
	return strings.Join(lines, "")
}

// TestMovedMatchesScratch applies random edit sequences, mostly to comment
// and blank lines, to one file without includes (where edits that only
// move positions are analysed by movedResult) and checks after every edit
// that the result is identical to an analysis from scratch, that the
// previous result is unchanged, and that the shortcut was taken.
func TestMovedMatchesScratch(t *testing.T) {
	gen := string(mechgen.Generate(mechgen.Options{Seed: 4, Molecules: 30}))
	gen = gen[strings.Index(gen, "species M1 "):]
	// comment lines to type in
	gen = strings.ReplaceAll(gen, "\nspecies M2", "\n# second molecule\nspecies M2")
	gen = strings.ReplaceAll(gen, "\nreaction M1", "\n# reactions of the first\n\nreaction M1")
	gen = strings.ReplaceAll(gen, "\nreaction M2", "\n# reactions of the second\nreaction M2")
	// With repeated names, structures and reactions (messages naming
	// lines), and without them.
	withDups := strings.Replace(incrementalBase, "include shared.kiln\n", incrementalShared, 1) + gen
	clean := "# clean\n" + incrementalShared + "species POLY O=C=O\n  nasa7 200 1000 3500\n" +
		"    low  2.35677352e+00 8.98459677e-03 -7.12356269e-06 2.45919022e-09 -1.43699548e-13 -4.83719697e+04 9.90105222e+00\n" +
		"    high 3.85746029e+00 4.41437026e-03 -2.21481404e-06 5.23490188e-10 -4.72084164e-14 -4.87591660e+04 2.27163806e+00\n" +
		"\n" + gen + "reaction POLY + H <=> M1 + OH   A=1e13 n=0 Ea=5\n"
	// and with an included file, edited now and then
	withInclude := incrementalBase + gen
	for name, base := range map[string]string{"dups": withDups, "clean": clean, "include": withInclude} {
		for seed := uint64(1); seed <= 4; seed++ {
			t.Run(fmt.Sprint(name, "/seed", seed), func(t *testing.T) {
				rng := rand.New(rand.NewPCG(seed, 7))
				text := base
				shared := incrementalShared
				var mu sync.Mutex
				load := func(p string) ([]byte, error) {
					mu.Lock()
					defer mu.Unlock()
					if p == "/w/shared.kiln" {
						return []byte(shared), nil
					}
					return nil, &fs.PathError{Op: "open", Path: p, Err: fs.ErrNotExist}
				}
				inc := NewWorkspace("/w", load, DefaultSettings())
				inc.SetIncremental(true)
				var prev *Result
				prevDigest := ""
				for step := range 60 {
					if step > 0 && name == "include" && rng.IntN(8) == 0 {
						mu.Lock()
						if rng.IntN(2) == 0 {
							shared = triviaEdit(rng, shared, step)
						} else {
							shared = randomEdit(rng, shared, step)
						}
						mu.Unlock()
					} else if step > 0 {
						if rng.IntN(8) == 0 {
							text = randomEdit(rng, text, step)
						} else {
							text = triviaEdit(rng, text, step)
						}
					}
					if rng.IntN(25) == 0 {
						s := DefaultSettings()
						s.DisplayUnits = []string{"kcal/mol", "kJ/mol"}[rng.IntN(2)]
						inc.SetSettings(s)
					}
					inc.SetOverlay("/w/main.kiln", []byte(text))
					var got *Result
					if rng.IntN(2) == 0 {
						got = inc.Quick(context.Background(), "/w/main.kiln")
					}
					if got == nil {
						var err error
						got, err = inc.Analyze(context.Background(), "/w/main.kiln")
						require.NoError(t, err)
					}
					scratch := NewWorkspace("/w", load, inc.Settings())
					scratch.SetOverlay("/w/main.kiln", []byte(text))
					want, err := scratch.Analyze(context.Background(), "/w/main.kiln")
					require.NoError(t, err)
					gd, wd := stripPointers(digest(got)), stripPointers(digest(want))
					if gd != wd {
						t.Fatalf("step %d: result differs from scratch\n%s", step, firstDifference(gd, wd))
					}
					require.Equal(t, want.namesLines, got.namesLines, "step %d", step)
					require.Equal(t, sortedNames(want.lineNames), sortedNames(got.lineNames), "step %d", step)
					for _, sp := range got.Species {
						require.Same(t, got.Files[sp.File].Species[indexOf(got.Files[sp.File].Species, sp.Decl)], sp.Decl)
						require.Same(t, sp, got.ByName[sp.Name])
					}
					for i, r := range got.Reactions {
						require.Same(t, got.File.Reactions[i], r.Decl)
					}
					if prev != nil {
						require.Equal(t, prevDigest, digest(prev), "step %d: the previous result changed", step)
					}
					prev, prevDigest = got, digest(got)
				}
				t.Logf("%d of 60 results made by moving positions", inc.moved)
				require.Positive(t, inc.moved, "results made by moving positions")
			})
		}
	}
}

// sortedNames returns names in order of offset, code and message (the
// analysis records them as it reports, movedResult in offset order).
func sortedNames(names []lineName) []lineName {
	out := slices.Clone(names)
	slices.SortFunc(out, func(x, y lineName) int {
		return cmp.Or(cmp.Compare(x.start, y.start), strings.Compare(x.code, y.code), strings.Compare(x.msg, y.msg))
	})
	return out
}

// TestMovedCommentLine: a comment line typed between statements of a file
// without repeated names moves positions only; one typed into a comment
// without adding a line changes no diagnostic at all.
func TestMovedCommentLine(t *testing.T) {
	src := string(mechgen.Generate(mechgen.Options{Seed: 5, Molecules: 200}))
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fs.ErrNotExist }, DefaultSettings())
	ws.SetIncremental(true)
	ws.SetOverlay("m.kiln", []byte(src))
	before, err := ws.Analyze(context.Background(), "m.kiln")
	require.NoError(t, err)
	require.NotEmpty(t, before.Diagnostics)
	at := strings.Index(src, "\nreaction M100 + ") + 1
	text := src[:at] + "# a remark\n" + src[at:]
	ws.SetOverlay("m.kiln", []byte(text))
	after := ws.Quick(context.Background(), "m.kiln")
	require.NotNil(t, after, "a comment line moves positions only")
	require.Equal(t, 1, ws.moved)
	require.Same(t, before.ByName["M1"], after.ByName["M1"])
	moved := 0
	for i, d := range after.Diagnostics {
		o := before.Diagnostics[i]
		if o.Span.Start >= at {
			o.Span = shift(o.Span, len("# a remark\n"))
			moved++
		}
		require.Equal(t, o.Span, d.Span)
		require.Equal(t, o.Message, d.Message)
	}
	require.Positive(t, moved)
	// the next full analysis starts from the moved result's tables
	again, err := ws.Analyze(context.Background(), "m.kiln")
	require.NoError(t, err)
	require.Equal(t, 2, ws.moved)
	require.Equal(t, digest(after), digest(again))
	// the header comment above the units statement: the whole file is
	// read again (every node is new), still a move
	hdr := strings.IndexByte(text, '\n')
	header := text[:hdr] + " (edited)" + text[hdr:]
	ws.SetOverlay("m.kiln", []byte(header))
	hdrMoved := ws.Quick(context.Background(), "m.kiln")
	require.NotNil(t, hdrMoved)
	scratch := NewWorkspace("", func(string) ([]byte, error) { return nil, fs.ErrNotExist }, DefaultSettings())
	scratch.SetOverlay("m.kiln", []byte(header))
	want, err := scratch.Analyze(context.Background(), "m.kiln")
	require.NoError(t, err)
	require.Equal(t, stripPointers(digest(want)), stripPointers(digest(hdrMoved)))
	ws.SetOverlay("m.kiln", []byte(text))
	require.NotNil(t, ws.Quick(context.Background(), "m.kiln"))
	// a SMILES edit is not a move
	k := strings.Index(text, "species M3 ") + len("species M3 ")
	ws.SetOverlay("m.kiln", []byte(text[:k]+"CCCCO\n"+text[k+strings.IndexByte(text[k:], '\n')+1:]))
	require.Nil(t, ws.Quick(context.Background(), "m.kiln"))
}

// TestMovedIncludeAppears: a file that could not be read when the last
// analysis ran may be readable now; a comment edit then needs the full
// analysis (the included species are declared now).
func TestMovedIncludeAppears(t *testing.T) {
	files := map[string]string{}
	var mu sync.Mutex
	load := func(p string) ([]byte, error) {
		mu.Lock()
		defer mu.Unlock()
		if s, ok := files[p]; ok {
			return []byte(s), nil
		}
		return nil, &fs.PathError{Op: "open", Path: p, Err: fs.ErrNotExist}
	}
	ws := NewWorkspace("/w", load, DefaultSettings())
	ws.SetIncremental(true)
	main := "include extra.kiln\n# notes\nreaction H + H <=> H2   A=1e13 n=0 Ea=0\n"
	ws.SetOverlay("/w/main.kiln", []byte(main))
	before, err := ws.Analyze(context.Background(), "/w/main.kiln")
	require.NoError(t, err)
	require.Contains(t, diagCodes(before), "undeclared-species")
	mu.Lock()
	files["/w/extra.kiln"] = "species H [H]\nspecies H2 [H][H]\n"
	mu.Unlock()
	main = strings.Replace(main, "# notes", "# more notes\n", 1)
	ws.SetOverlay("/w/main.kiln", []byte(main))
	require.Nil(t, ws.Quick(context.Background(), "/w/main.kiln"))
	after, err := ws.Analyze(context.Background(), "/w/main.kiln")
	require.NoError(t, err)
	require.NotContains(t, diagCodes(after), "undeclared-species")
	// now a comment edit with the include unchanged is a move
	ws.SetOverlay("/w/main.kiln", []byte(strings.Replace(main, "# more", "# many more", 1)))
	require.NotNil(t, ws.Quick(context.Background(), "/w/main.kiln"))
}

func diagCodes(r *Result) []string {
	var out []string
	for _, d := range r.Diagnostics {
		out = append(out, d.Code)
	}
	return out
}

package speciesfile_test

import (
	"fmt"
	"io/fs"
	"math/rand/v2"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/internal/mechgen"
	"kiln.dev/kiln/speciesfile"
)

// reparseInputs returns the .kiln files of the repository's test data and
// examples, and a small generated mechanism.
func reparseInputs(t *testing.T) map[string][]byte {
	t.Helper()
	out := map[string][]byte{}
	for _, dir := range []string{"../testdata", "../examples", "testdata", "../lsp/testdata"} {
		err := filepath.WalkDir(dir, func(path string, d fs.DirEntry, err error) error {
			if err != nil || d.IsDir() || !strings.HasSuffix(path, ".kiln") {
				return err
			}
			b, err := os.ReadFile(path)
			out[path] = b
			return err
		})
		if !os.IsNotExist(err) {
			require.NoError(t, err)
		}
	}
	require.NotEmpty(t, out)
	out["generated"] = mechgen.Generate(mechgen.Options{Seed: 7, Molecules: 60})
	return out
}

// fragments are inserted by the random edits: statement starts and ends,
// indentation, comments, terminators of every kind, broken syntax, bytes
// that are not UTF-8, and units statements.
var fragments = []string{
	"\n", "\r\n", "\r", " ", "  ", "\t", "#", "# note\n", "x", "=", "1", "e", "<=>", "+", " + ", "(+M)",
	"species ", "reaction ", "group ", "include ", "units kJ/mol\n", "units kcal/mol\n", "bogus ",
	"species Q1 CC\n", "species Q2 C[CH2]\n  multiplicity 2\n", "\n  composition C2H6\n",
	"reaction Q1 + H <=> Q2 + H2 A=1e13 n=0 Ea=5\n", "  A=1 n=0 Ea=1\n", "  duplicate\n",
	"  nasa7 300 1000 5000\n    low 1 2 3 4 5 6 7\n    high 1 2 3 4 5 6 7\n",
	"\xff", "\x00", "é", "  note hello\n", "\n\n", "    ",
	// longer than the reader's first windows of token text (4 KiB, then 16 KiB)
	"  note " + strings.Repeat("long ", 5000) + "\n",
}

// randomEdit returns a random edit of text and the edited text.
func randomEdit(rng *rand.Rand, text []byte) (speciesfile.Edit, []byte) {
	start := rng.IntN(len(text) + 1)
	if rng.IntN(3) == 0 { // at a line start
		if i := strings.LastIndexByte(string(text[:start]), '\n'); i >= 0 {
			start = i + 1
		}
	}
	end := start
	switch rng.IntN(4) {
	case 0: // delete a few bytes
		end = min(len(text), start+rng.IntN(8))
	case 1: // delete up to a few lines
		end = min(len(text), start+rng.IntN(200))
	}
	var ins string
	switch rng.IntN(5) {
	case 0: // nothing: a deletion
	case 1: // a copy of some other part of the text
		a := rng.IntN(len(text) + 1)
		ins = string(text[a:min(len(text), a+rng.IntN(120))])
	default:
		for range 1 + rng.IntN(3) {
			ins += fragments[rng.IntN(len(fragments))]
		}
	}
	out := make([]byte, 0, len(text)-(end-start)+len(ins))
	out = append(append(append(out, text[:start]...), ins...), text[end:]...)
	return speciesfile.Edit{Old: speciesfile.Span{Start: start, End: end}, NewLen: len(ins)}, out
}

// TestReparseMatchesScratch applies random edit sequences to real and
// generated files, reading each version incrementally from the previous
// incremental result, and requires the same tree and diagnostics as a
// parse from scratch.
func TestReparseMatchesScratch(t *testing.T) {
	inputs := reparseInputs(t)
	edits := 40
	if testing.Short() {
		edits = 15
	}
	for name, text := range inputs {
		for seed := range uint64(4) {
			rng := rand.New(rand.NewPCG(seed, uint64(len(name))))
			f := speciesfile.Parse(name, text)
			cur := text
			for k := range edits {
				e, next := randomEdit(rng, cur)
				if rng.IntN(2) == 0 {
					// the edit as a client would send it is sometimes
					// larger than the smallest one
					e = speciesfile.DiffEdit(cur, next)
				}
				require.Equal(t, speciesfile.NewLineIndex(next), f.Lines.Edited(next, e))
				got := speciesfile.Reparse(f, next, e)
				want := speciesfile.Parse(name, next)
				if !reflect.DeepEqual(got, want) {
					t.Fatalf("%s seed %d edit %d (%+v): incremental parse differs from scratch: %s", name, seed, k, e, fileDiff(got, want))
				}
				// the old parse shares its moved statements with the new
				// one and must still be the parse of the old text
				if k%4 == 0 {
					if before := speciesfile.Parse(name, cur); !reflect.DeepEqual(f, before) {
						t.Fatalf("%s seed %d edit %d: Reparse changed the old parse: %s", name, seed, k, fileDiff(f, before))
					}
				}
				f, cur = got, next
			}
		}
	}
}

// fileDiff describes the first difference between two parses.
func fileDiff(got, want *speciesfile.File) string {
	if len(got.Stmts) != len(want.Stmts) {
		return fmt.Sprintf("%d statements, want %d", len(got.Stmts), len(want.Stmts))
	}
	for i := range got.Stmts {
		if !reflect.DeepEqual(got.Stmts[i], want.Stmts[i]) {
			var r recorder
			assert.Equal(&r, want.Stmts[i], got.Stmts[i])
			return fmt.Sprintf("statement %d: %s", i, r.msg)
		}
	}
	if !reflect.DeepEqual(got.Diags, want.Diags) {
		return fmt.Sprintf("diagnostics:\n got %+v\nwant %+v", got.Diags, want.Diags)
	}
	if !reflect.DeepEqual(got.Lines, want.Lines) {
		return "line index"
	}
	return fmt.Sprintf("file fields: got %+v\nwant %+v", *got, *want)
}

func TestDiffEdit(t *testing.T) {
	for _, c := range []struct{ a, b string }{
		{"", ""}, {"abc", "abc"}, {"abc", "abXc"}, {"aaaa", "aa"}, {"aa", "aaaa"}, {"x", ""}, {"", "y"},
		{strings.Repeat("a", 200) + "1" + strings.Repeat("b", 200), strings.Repeat("a", 200) + "22" + strings.Repeat("b", 200)},
	} {
		e := speciesfile.DiffEdit([]byte(c.a), []byte(c.b))
		got := c.a[:e.Old.Start] + c.b[e.Old.Start:e.Old.Start+e.NewLen] + c.a[e.Old.End:]
		require.Equal(t, c.b, got, "%q → %q: %+v", c.a, c.b, e)
		require.Equal(t, len(c.b), len(c.a)+e.Delta())
	}
}

// recorder keeps the message of a failed assertion.
type recorder struct{ msg string }

func (r *recorder) Errorf(format string, args ...any) { r.msg = fmt.Sprintf(format, args...) }

// FuzzReparse: for any text and any edit of it, reading the edited text
// incrementally gives the same parse as reading it from scratch.
func FuzzReparse(f *testing.F) {
	base, err := os.ReadFile("../testdata/speciesfile/all-statements.kiln")
	if err == nil {
		f.Add(base, 40, 3, []byte("  note x\n"))
		f.Add(base, 200, 0, []byte("\n  bogus 1\n"))
	}
	f.Add([]byte("species A C\nspecies B CC\n  multiplicity 2\nreaction A => B A=1 n=0 Ea=0\n"), 12, 1, []byte(" "))
	f.Fuzz(func(t *testing.T, src []byte, at, n int, ins []byte) {
		if len(src) == 0 || len(src) > 1<<16 || len(ins) > 1<<12 {
			return
		}
		at = (at%len(src) + len(src)) % len(src)
		n = min((n%64+64)%64, len(src)-at)
		next := append(append(append([]byte{}, src[:at]...), ins...), src[at+n:]...)
		old := speciesfile.Parse("fuzz.kiln", src)
		got := speciesfile.Reparse(old, next, speciesfile.Edit{Old: speciesfile.Span{Start: at, End: at + n}, NewLen: len(ins)})
		want := speciesfile.Parse("fuzz.kiln", next)
		if !reflect.DeepEqual(got, want) {
			t.Fatalf("incremental parse differs from scratch: %s", fileDiff(got, want))
		}
		if before := speciesfile.Parse("fuzz.kiln", src); !reflect.DeepEqual(old, before) {
			t.Fatalf("Reparse changed the old parse: %s", fileDiff(old, before))
		}
	})
}

// TestReparseFallbacks: inconsistent edits and a missing old parse read the
// text from scratch.
func TestReparseFallbacks(t *testing.T) {
	src := []byte("species A C\nspecies B CC\n")
	next := []byte("species A C\nspecies B CCC\n")
	old := speciesfile.Parse("f.kiln", src)
	want := speciesfile.Parse("f.kiln", next)
	for _, e := range []speciesfile.Edit{
		{Old: speciesfile.Span{Start: 22, End: 22}, NewLen: 5},  // wrong length
		{Old: speciesfile.Span{Start: 30, End: 20}, NewLen: 1},  // backwards
		{Old: speciesfile.Span{Start: 22, End: 400}, NewLen: 1}, // past the end
		{Old: speciesfile.Span{Start: 0, End: 0}, NewLen: 1},    // start of file
	} {
		require.True(t, reflect.DeepEqual(want, speciesfile.Reparse(old, next, e)), "%+v", e)
	}
	require.True(t, reflect.DeepEqual(speciesfile.Parse("", next), speciesfile.Reparse(nil, next, speciesfile.Edit{})))
}

// TestReparseSharesMoved: statements after an edit that changes the text's
// length are the same nodes in the old and the new parse (only their
// starts move), and both parses read their own text correctly.
func TestReparseSharesMoved(t *testing.T) {
	src := []byte("species A C\nspecies B CC\n  multiplicity 2\n# c\nreaction A => B A=1 n=0 Ea=0\nspecies D CCC\n")
	old := speciesfile.Parse("s.kiln", src)
	require.Empty(t, old.Diags)
	at := len("species A C")
	next := append(append(append([]byte{}, src[:at]...), "C(O)"...), src[at:]...)
	got := speciesfile.Reparse(old, next, speciesfile.Edit{Old: speciesfile.Span{Start: at, End: at}, NewLen: 4})
	require.True(t, reflect.DeepEqual(speciesfile.Parse("s.kiln", next), got))
	require.Len(t, got.Stmts, 4)
	for i := 2; i < 4; i++ {
		assert.Same(t, old.Stmts[i], got.Stmts[i], "statement %d is shared", i)
		assert.Equal(t, old.Starts[i]+4, got.Starts[i])
	}
	r := got.Reactions[0]
	eq := got.Abs(r, r.Equation)
	assert.Equal(t, "A => B", string(next[eq.Start:eq.End]))
	eq = old.Abs(r, r.Equation)
	assert.Equal(t, "A => B", string(src[eq.Start:eq.End]), "the old parse reads the shared node at its old start")
	assert.Equal(t, "CC(O)", got.Species[0].SMILES.Text)
}

package speciesfile

import (
	"fmt"
	"reflect"
	"strings"
	"testing"
)

// tokenProblems walks every statement node of f by reflection and returns a
// description of each token whose text differs from the source at its
// absolute span (its relative span read with the statement's start), and
// of each statement extent that does not tile the source.
func tokenProblems(f *File) []string {
	var out []string
	if len(f.Starts) != len(f.Stmts) {
		return []string{fmt.Sprintf("%d starts for %d statements", len(f.Starts), len(f.Stmts))}
	}
	pos := 0
	tokType := reflect.TypeOf(Token{})
	for i, st := range f.Stmts {
		base := f.Starts[i]
		if base != pos {
			out = append(out, fmt.Sprintf("statement %d starts at %d, not %d", i, base, pos))
		}
		pos = base + st.Len()
		var walk func(v reflect.Value)
		walk = func(v reflect.Value) {
			switch v.Kind() {
			case reflect.Pointer, reflect.Interface:
				if !v.IsNil() {
					walk(v.Elem())
				}
			case reflect.Slice, reflect.Array:
				for k := range v.Len() {
					walk(v.Index(k))
				}
			case reflect.Struct:
				if v.Type() == tokType {
					tok := v.Interface().(Token)
					if tok == (Token{}) {
						return
					}
					sp := tok.Span.At(base)
					if sp.Start < 0 || sp.End > len(f.Src) || sp.Start > sp.End || string(f.Src[sp.Start:sp.End]) != tok.Text {
						out = append(out, fmt.Sprintf("statement %d: token %q at %v does not match the source", i, tok.Text, sp))
					}
					return
				}
				for k := range v.NumField() {
					if v.Type().Field(k).IsExported() {
						walk(v.Field(k))
					}
				}
			}
		}
		walk(reflect.ValueOf(st))
	}
	if len(f.Stmts) > 0 && pos != len(f.Src) {
		out = append(out, fmt.Sprintf("statements cover %d of %d bytes", pos, len(f.Src)))
	}
	return out
}

// TestStmtIndex: the node lookup gives every statement's index and start,
// by scanning for the first lookups and by its map after them, and -1 for a
// node of another parse.
func TestStmtIndex(t *testing.T) {
	var b strings.Builder
	for i := range 100 {
		fmt.Fprintf(&b, "# c%d\nspecies S%d C\nreaction S%d => S%d A=1 n=0 Ea=0\n", i, i, i, i)
	}
	f := Parse("x.kiln", []byte(b.String()))
	other := Parse("x.kiln", []byte(b.String()))
	for round := range 2 { // the second round uses the map
		for i, st := range f.Stmts {
			if got := f.StmtIndex(st); got != i {
				t.Fatalf("round %d: StmtIndex of statement %d = %d", round, i, got)
			}
			if got := f.Start(st); got != f.Starts[i] {
				t.Fatalf("round %d: Start of statement %d = %d, want %d", round, i, got, f.Starts[i])
			}
		}
		if got := f.StmtIndex(other.Stmts[3]); got != -1 {
			t.Fatalf("round %d: a node of another parse has index %d", round, got)
		}
	}
	for k, r := range f.Reactions {
		if f.ReactionStart(k) != f.Start(r) || f.Stmts[f.ReactionStmt(k)] != Stmt(r) {
			t.Fatalf("reaction %d: list index and node lookup disagree", k)
		}
	}
}

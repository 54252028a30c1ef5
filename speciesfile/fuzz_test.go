package speciesfile

import (
	"os"
	"testing"
)

// FuzzParse checks, for any input: no panic, the statements tile the source
// byte for byte, and every diagnostic span lies within [0, len(src)].
func FuzzParse(f *testing.F) {
	if src, err := os.ReadFile("../testdata/speciesfile/all-statements.kiln"); err == nil {
		f.Add(src)
	}
	f.Add([]byte("reaction CH3 + CH3 (+M) <=> C2H6 (+M) A=1 n=0 Ea=0\n  low-pressure A=1 n=0 Ea=1\n  troe alpha=1 T3=1 T1=1\n"))
	f.Fuzz(func(t *testing.T, src []byte) {
		file := Parse("fuzz.kiln", src)
		for i := range file.Stmts {
			sp := file.StmtSpan(i)
			b := file.StmtBody(i)
			if b.Start < sp.Start || b.End > sp.End || b.Start > b.End {
				t.Fatalf("body %v outside span %v", b, sp)
			}
		}
		if probs := tokenProblems(file); len(probs) > 0 {
			t.Fatalf("positions: %v", probs)
		}
		for _, d := range file.Diags {
			if d.Span.Start < 0 || d.Span.Start > d.Span.End || d.Span.End > len(src) {
				t.Fatalf("diagnostic %q span %v outside [0,%d]", d.Message, d.Span, len(src))
			}
		}
		for _, s := range file.Species {
			off, _, _ := file.ThermoInsertion(s)
			if off < 0 || off > len(src) {
				t.Fatalf("insertion offset %d outside the file", off)
			}
		}
		li := file.Lines
		for off := 0; off <= len(src); off += 1 + len(src)/64 {
			p := li.Position(off)
			if o := li.Offset(p.Line, p.UTF16); o < 0 || o > len(src) {
				t.Fatalf("Offset(%d,%d) = %d outside the file", p.Line, p.UTF16, o)
			}
		}
	})
}

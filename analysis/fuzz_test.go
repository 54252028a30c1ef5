package analysis

import (
	"context"
	"os"
	"path/filepath"
	"testing"
)

// FuzzAnalyze: any text analyses without a panic, every diagnostic lies in
// the file, and the fill edits apply cleanly.
func FuzzAnalyze(f *testing.F) {
	seeds, _ := filepath.Glob("../testdata/check/*.kiln")
	seeds = append(seeds, "../examples/furnace.kiln")
	for _, p := range seeds {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(b)
		}
	}
	f.Fuzz(func(t *testing.T, src []byte) {
		ws := NewWorkspace("", func(string) ([]byte, error) { return nil, os.ErrNotExist }, DefaultSettings())
		ws.SetOverlay("f.kiln", src)
		res, err := ws.Analyze(context.Background(), "f.kiln")
		if err != nil {
			t.Fatal(err)
		}
		for _, d := range res.Diagnostics {
			if d.Span.Start < 0 || d.Span.End > len(src) || d.Span.Start > d.Span.End {
				t.Fatalf("diagnostic %q at %v outside the %d-byte file", d.Message, d.Span, len(src))
			}
		}
		if _, err := ApplyEdits(src, res.FillEdits()); err != nil {
			t.Fatal(err)
		}
	})
}

package analysis

import (
	"context"
	"fmt"
	"testing"

	"kiln.dev/kiln/internal/mechgen"
)

// benchAnalyze analyses a generated mechanism of n molecules (2n species and
// 3n reactions) from a cold workspace each iteration: parse, estimate, fit,
// check — what `kiln check` does.
func benchAnalyze(b *testing.B, n int) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: n})
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no includes") }, DefaultSettings())
		ws.SetOverlay("gen.kiln", src)
		res, err := ws.Analyze(context.Background(), "gen.kiln")
		if err != nil {
			b.Fatal(err)
		}
		if len(res.Species) < 2*n {
			b.Fatalf("%d species, want %d", len(res.Species), 2*n)
		}
	}
}

func BenchmarkCheck1k(b *testing.B)  { benchAnalyze(b, 1000) }
func BenchmarkCheck10k(b *testing.B) { benchAnalyze(b, 10000) }

// BenchmarkReanalyseOneEdit measures a warm re-analysis after one species
// changed: the estimate cache keeps every other species.
func BenchmarkReanalyseOneEdit(b *testing.B) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no includes") }, DefaultSettings())
	ws.SetOverlay("gen.kiln", src)
	if _, err := ws.Analyze(context.Background(), "gen.kiln"); err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		edited := append([]byte(fmt.Sprintf("species EDIT%d CCCC%s\n", i, "O")), src...)
		ws.SetOverlay("gen.kiln", edited)
		if _, err := ws.Analyze(context.Background(), "gen.kiln"); err != nil {
			b.Fatal(err)
		}
	}
}

package analysis

import (
	"bytes"
	"context"
	"fmt"
	"slices"
	"strings"
	"testing"

	"kiln.dev/kiln/internal/mechgen"
	"kiln.dev/kiln/speciesfile"
)

// benchAnalyze analyses a generated mechanism of n molecules (2n species and
// 3n reactions) from a cold workspace each iteration: parse, estimate, fit,
// check — what `kiln check` does.
func benchAnalyze(b *testing.B, n int) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: n})
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	cpu0 := cpuTime()
	defer func() { reportCPU(b, cpu0, b.N) }()
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

func BenchmarkCheck1k(b *testing.B) { benchAnalyze(b, 1000) }

// BenchmarkTokenise10k reads (copies) and parses the 10k-molecule file:
// the denominator of the check ÷ reading+tokenising ratio.
func BenchmarkTokenise10k(b *testing.B) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	cpu0, n := cpuTime(), 0
	defer func() { reportCPU(b, cpu0, n) }()
	for b.Loop() {
		n++
		text := bytes.Clone(src)
		if f := speciesfile.Parse("gen.kiln", text); len(f.Species) < 20000 {
			b.Fatal("short parse")
		}
	}
}
func BenchmarkCheck10k(b *testing.B) { benchAnalyze(b, 10000) }

// reanalyseBench opens the generated 10k-molecule mechanism (20,000
// species, 30,000 reactions) in an incremental workspace, then measures the
// re-analysis after each edit made by edit (given the original text and the
// iteration).
func reanalyseBench(b *testing.B, edit func(src []byte, i int) []byte) {
	src := mechgen.Generate(mechgen.Options{Seed: 1, Molecules: 10000})
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, fmt.Errorf("no includes") }, DefaultSettings())
	ws.SetIncremental(true)
	ws.SetOverlay("gen.kiln", src)
	if _, err := ws.Analyze(context.Background(), "gen.kiln"); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		ws.SetOverlay("gen.kiln", edit(src, i))
		if _, err := ws.Analyze(context.Background(), "gen.kiln"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkReanalyseOneEdit measures a re-analysis after the SMILES of one
// species changed (a new structure: one new estimate, three reactions).
func BenchmarkReanalyseOneEdit(b *testing.B) {
	reanalyseBench(b, func(src []byte, i int) []byte {
		decl := []byte(fmt.Sprintf("species M%d ", 1+i%5000))
		at := bytes.Index(src, decl) + len(decl)
		end := at + bytes.IndexByte(src[at:], '\n')
		return slices.Concat(src[:at], []byte(fmt.Sprintf("CCCC%sO", strings.Repeat("C", i%9))), src[end:])
	})
}

// BenchmarkReanalyseCommentEdit measures a re-analysis after a comment line
// was typed between two statements: no unit is recomputed.
func BenchmarkReanalyseCommentEdit(b *testing.B) {
	reanalyseBench(b, func(src []byte, i int) []byte {
		at := bytes.Index(src, []byte("species M5000 "))
		return slices.Concat(src[:at], []byte(fmt.Sprintf("# remark %d\n", i)), src[at:])
	})
}

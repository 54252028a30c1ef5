package lsp

import (
	"context"

	"fmt"
	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"math/rand/v2"
	"runtime"
	"sort"
	"strings"
	"testing"
	"time"
)

// genMechanism writes a deterministic mechanism of nPairs closed-shell C/H/O
// species RH, their radicals R (the first carbon turned into a CH2 radical
// centre) and the H-abstractions RH + OH <=> R + H2O: 2·nPairs species plus
// a small core, nPairs reactions. It returns the text and the byte offsets
// of the species names in the reaction lines (hover targets).
func genMechanism(nPairs int) (string, []int) {
	frags := []string{"C", "C(C)", "C(O)", "O", "C(=O)", "C=C", "CC"}
	var b strings.Builder
	b.WriteString("# generated benchmark mechanism: H-abstraction by OH from C/H/O species\n")
	b.WriteString("species OH [OH]\nspecies H2O O\n")
	tails := make([]string, nPairs)
	for i := range nPairs {
		var t strings.Builder
		for n := i + 1; n > 0; n /= len(frags) {
			t.WriteString(frags[n%len(frags)])
		}
		tails[i] = t.String()
		fmt.Fprintf(&b, "species s%d C%s\nspecies r%d [CH2]%s\n", i, tails[i], i, tails[i])
	}
	var targets []int
	for i := range nPairs {
		line := fmt.Sprintf("reaction s%d + OH <=> r%d + H2O   A=2.0e6 n=2.0 Ea=-0.8\n", i, i)
		targets = append(targets, b.Len()+len("reaction "))
		b.WriteString(line)
	}
	return b.String(), targets
}

const benchPairs = 10000 // 20,000 generated species

// BenchmarkOpen20k measures didOpen of a 20,000-species file to the first
// published diagnostics, with a cold estimate cache (a new server each time).
func BenchmarkOpen20k(b *testing.B) {
	text, _ := genMechanism(benchPairs)
	b.SetBytes(int64(len(text)))
	b.ReportAllocs()
	var heap uint64
	for b.Loop() {
		b.StopTimer()
		e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{})
		b.StartTimer()
		ds := e.open("big.kiln")
		b.StopTimer()
		if len(ds) == 0 {
			b.Fatal("expected diagnostics (missing-thermo information) for the generated species")
		}
		runtime.GC()
		var ms runtime.MemStats
		runtime.ReadMemStats(&ms)
		heap = max(heap, ms.HeapInuse)
		if err := e.shutdown(); err != nil {
			b.Fatal(err)
		}
		b.StartTimer()
	}
	b.ReportMetric(float64(heap)/(1<<20), "heap-MiB")
}

// BenchmarkHover20k measures hover requests on species names in the reaction
// lines of the 20,000-species file and reports the 95th percentile latency.
func BenchmarkHover20k(b *testing.B) {
	text, targets := genMechanism(benchPairs)
	e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{})
	e.open("big.kiln")
	rng := rand.New(rand.NewPCG(1, 2))
	var lat []time.Duration
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		off := targets[rng.IntN(len(targets))]
		t0 := time.Now()
		if h := e.hover("big.kiln", off); h == "" {
			b.Fatal("empty hover")
		}
		lat = append(lat, time.Since(t0))
	}
	b.StopTimer()
	reportPercentile(b, lat, 0.95, "p95-ms")
	if err := e.shutdown(); err != nil {
		b.Fatal(err)
	}
}

// BenchmarkEdit20k measures a one-species edit (a new SMILES, so one new
// estimate) to the publication of fresh diagnostics for that version,
// including the 50 ms debounce.
func BenchmarkEdit20k(b *testing.B) {
	text, _ := genMechanism(benchPairs)
	e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{})
	e.open("big.kiln")
	var lat []time.Duration
	b.ReportAllocs()
	b.ResetTimer()
	i := 0
	for b.Loop() {
		cur := e.text("big.kiln")
		// Replace the structure of species s<i> by a new chain.
		decl := fmt.Sprintf("species s%d ", i)
		at := strings.Index(cur, decl) + len(decl)
		end := at + strings.IndexByte(cur[at:], '\n')
		t0 := time.Now()
		e.change("big.kiln", contentChange{Range: e.rangeAt("big.kiln", at, end), Text: "CCCC" + strings.Repeat("C", i%7) + "O"})
		e.waitDiagnostics("big.kiln")
		lat = append(lat, time.Since(t0))
		i++
	}
	b.StopTimer()
	reportPercentile(b, lat, 0.95, "p95-ms")
	var ms runtime.MemStats
	runtime.ReadMemStats(&ms)
	b.ReportMetric(float64(ms.HeapInuse)/(1<<20), "heap-MiB")
	if err := e.shutdown(); err != nil {
		b.Fatal(err)
	}
}

func reportPercentile(b *testing.B, lat []time.Duration, p float64, unit string) {
	if len(lat) == 0 {
		return
	}
	sort.Slice(lat, func(i, j int) bool { return lat[i] < lat[j] })
	k := int(p * float64(len(lat)-1))
	b.ReportMetric(float64(lat[k])/float64(time.Millisecond), unit)
}

// BenchmarkAnalyzeWarm20k is the analysis alone (no protocol) of the
// 20,000-species file with a warm estimate cache: the floor under
// BenchmarkEdit20k, to tell analysis time from server overhead.
func BenchmarkAnalyzeWarm20k(b *testing.B) {
	text, _ := genMechanism(benchPairs)
	ws := analysis.NewWorkspace(fakeRoot, func(string) ([]byte, error) { return nil, context.Canceled }, analysis.DefaultSettings())
	p := fakeRoot + "/big.kiln"
	ws.SetOverlay(p, []byte(text))
	if _, err := ws.Analyze(context.Background(), p); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		r, err := ws.Analyze(context.Background(), p)
		if err != nil {
			b.Fatal(err)
		}
		_ = ide.NewIndex(r)
	}
}

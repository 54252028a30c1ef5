package lsp

import (
	"context"
	"fmt"
	"math/rand/v2"
	"os"
	"runtime"
	"sort"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"kiln.dev/kiln/internal/mechgen"
)

// The server benchmarks run on the generated 10k-molecule mechanism
// (internal/mechgen, seed 1): 20,007 species, 30,000 reactions, 2.5 MB.
const benchMolecules = 10000

var benchText = sync.OnceValue(func() string {
	return string(mechgen.Generate(mechgen.Options{Seed: 1, Molecules: benchMolecules}))
})

// hoverTarget returns the offset of the first species name of the reaction
// line of molecule i in text.
func hoverTarget(text string, i int) int {
	return strings.Index(text, fmt.Sprintf("\nreaction M%d + ", i)) + len("\nreaction ")
}

// BenchmarkOpen20k measures didOpen of the 20,000-species file to the first
// published diagnostics, with cold caches (a new server each time). It
// reports the diagnostics published to a client with inlay hints.
func BenchmarkOpen20k(b *testing.B) {
	text := benchText()
	b.SetBytes(int64(len(text)))
	b.ReportAllocs()
	var heap uint64
	n := 0
	for b.Loop() {
		b.StopTimer()
		e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{inlayHints: true})
		b.StartTimer()
		ds := e.open("big.kiln")
		b.StopTimer()
		n = len(ds)
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
	b.ReportMetric(float64(n), "diags/publish")
}

// BenchmarkHover20k measures hover requests on species names in the reaction
// lines of the 20,000-species file with no analysis running (p95).
func BenchmarkHover20k(b *testing.B) {
	text := benchText()
	e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{inlayHints: true})
	e.open("big.kiln")
	rng := rand.New(rand.NewPCG(1, 2))
	var lat []time.Duration
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		off := hoverTarget(text, 1+rng.IntN(benchMolecules))
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

// BenchmarkRequestsDuringAnalysis20k measures hover, definition and
// completion on the 20,000-species file while another goroutine keeps
// editing SMILES every 25 ms, so that re-analyses are running (p95 of each).
func BenchmarkRequestsDuringAnalysis20k(b *testing.B) {
	text := benchText()
	e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{inlayHints: true, debounce: time.Millisecond})
	e.open("big.kiln")
	stop := make(chan struct{})
	var wg sync.WaitGroup
	wg.Add(1)
	go func() { // the typist
		defer wg.Done()
		for i := 0; ; i++ {
			select {
			case <-stop:
				return
			case <-time.After(25 * time.Millisecond):
			}
			editSMILES(e, 1+i%benchMolecules, i)
		}
	}()
	rng := rand.New(rand.NewPCG(3, 4))
	var hov, def, comp []time.Duration
	b.ResetTimer()
	for b.Loop() {
		cur := e.text("big.kiln")
		off := hoverTarget(cur, 1+rng.IntN(benchMolecules))
		pos := e.pos("big.kiln", off)
		t0 := time.Now()
		e.hover("big.kiln", off)
		hov = append(hov, time.Since(t0))
		t0 = time.Now()
		var locs []any
		e.call("textDocument/definition", map[string]any{"textDocument": textDoc(e, "big.kiln"), "position": pos}, &locs)
		def = append(def, time.Since(t0))
		t0 = time.Now()
		var list struct{ Items []any }
		e.call("textDocument/completion", map[string]any{"textDocument": textDoc(e, "big.kiln"), "position": pos}, &list)
		comp = append(comp, time.Since(t0))
		if len(list.Items) == 0 {
			b.Fatal("no completion items")
		}
	}
	b.StopTimer()
	close(stop)
	wg.Wait()
	reportPercentile(b, hov, 0.95, "hover-p95-ms")
	reportPercentile(b, def, 0.95, "definition-p95-ms")
	reportPercentile(b, comp, 0.95, "completion-p95-ms")
	if err := e.shutdown(); err != nil {
		b.Fatal(err)
	}
}

// editSMILES replaces the structure of species M<i> by a new chain (a
// structure not seen before in most iterations).
func editSMILES(e *fakeEditor, i, k int) {
	cur := e.text("big.kiln")
	decl := fmt.Sprintf("\nspecies M%d ", i)
	at := strings.Index(cur, decl) + len(decl)
	end := at + strings.IndexByte(cur[at:], '\n')
	e.change("big.kiln", contentChange{Range: e.rangeAt("big.kiln", at, end), Text: "CCCC" + strings.Repeat("C", k%9) + "O" + strings.Repeat("C", k%5)})
}

// benchEdits measures edits made by edit to the settled diagnostics of the
// new version (published, or found unchanged), including the debounce.
func benchEdits(b *testing.B, o fakeOptions, edit func(e *fakeEditor, i int)) {
	text := benchText()
	e := newFakeEditor(b, map[string]string{"big.kiln": text}, o)
	e.open("big.kiln")
	var lat []time.Duration
	b.ReportAllocs()
	b.ResetTimer()
	i := 0
	pubs := e.publications()
	cpu0 := cpuTime()
	for b.Loop() {
		t0 := time.Now()
		edit(e, i)
		e.waitDiagnostics("big.kiln")
		lat = append(lat, time.Since(t0))
		i++
	}
	b.StopTimer()
	b.ReportMetric(float64(cpuTime()-cpu0)/float64(time.Millisecond)/float64(max(i, 1)), "cpu-ms/edit")
	reportPercentile(b, lat, 0.95, "p95-ms")
	reportPercentile(b, lat, 0.5, "p50-ms")
	b.ReportMetric(float64(e.publications()-pubs)/float64(i), "publishes/edit")
	b.ReportMetric(float64(len(e.diagnostics("big.kiln"))), "diags/publish")
	if err := e.shutdown(); err != nil {
		b.Fatal(err)
	}
}

// BenchmarkEdit20k: a one-species SMILES edit (a new structure: one new
// estimate, three reactions re-checked) to its diagnostics published, for a
// client without inlay hints (the edited species' estimate note changes, so
// every edit publishes).
func BenchmarkEdit20k(b *testing.B) {
	benchEdits(b, fakeOptions{}, func(e *fakeEditor, i int) { editSMILES(e, 1+i%benchMolecules, i) })
}

// BenchmarkEdit20kInlayHints: the same edits for a client with inlay hints
// (diagnostics settle unchanged unless the edit creates a problem).
func BenchmarkEdit20kInlayHints(b *testing.B) {
	benchEdits(b, fakeOptions{inlayHints: true}, func(e *fakeEditor, i int) { editSMILES(e, 1+i%benchMolecules, i) })
}

// BenchmarkCommentEdit20k: a comment line typed between two statements in
// the middle of the file (every later diagnostic moves down a line, so every
// edit publishes).
func BenchmarkCommentEdit20k(b *testing.B) {
	benchEdits(b, fakeOptions{inlayHints: true}, func(e *fakeEditor, i int) {
		at := strings.Index(e.text("big.kiln"), "\nreaction M5000 + ") + 1
		e.typeAt("big.kiln", at, "# remark "+strconv.Itoa(i)+"\n")
	})
}

// BenchmarkServerRSS20k opens the 20,000-species file, makes 20 SMILES
// edits (each awaited), and reports the process's resident set size (peak
// and current) and the live heap. Run it alone (-run '^$' -bench ServerRSS
// -benchtime 1x): RSS is per process.
func BenchmarkServerRSS20k(b *testing.B) {
	text := benchText()
	for b.Loop() {
		e := newFakeEditor(b, map[string]string{"big.kiln": text}, fakeOptions{inlayHints: true})
		e.open("big.kiln")
		for i := range 20 {
			editSMILES(e, 1+i*37, i)
			e.waitDiagnostics("big.kiln")
		}
		b.StopTimer()
		runtime.GC()
		var ms runtime.MemStats
		runtime.ReadMemStats(&ms)
		b.ReportMetric(float64(ms.HeapInuse)/(1<<20), "heap-MiB")
		hwm, rss := procRSS()
		b.ReportMetric(hwm, "peak-RSS-MiB")
		b.ReportMetric(rss, "RSS-MiB")
		if err := e.shutdown(); err != nil {
			b.Fatal(err)
		}
		b.StartTimer()
	}
}

// procRSS returns VmHWM and VmRSS of this process in MiB (0 where unknown).
func procRSS() (hwm, rss float64) {
	data, err := os.ReadFile("/proc/self/status")
	if err != nil {
		return 0, 0
	}
	for _, l := range strings.Split(string(data), "\n") {
		f := strings.Fields(l)
		if len(f) < 2 {
			continue
		}
		v, _ := strconv.ParseFloat(f[1], 64)
		switch f[0] {
		case "VmHWM:":
			hwm = v / 1024
		case "VmRSS:":
			rss = v / 1024
		}
	}
	return hwm, rss
}

// cpuTime returns the user and system CPU time of this process so far
// (a measure less disturbed than wall time on a shared machine).
func cpuTime() time.Duration {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
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
// 20,000-species file after a one-species edit, in an incremental workspace:
// the floor under BenchmarkEdit20k, to tell analysis time from server
// overhead.
func BenchmarkAnalyzeWarm20k(b *testing.B) {
	text := benchText()
	ws := analysis.NewWorkspace(fakeRoot, func(string) ([]byte, error) { return nil, context.Canceled }, analysis.DefaultSettings())
	ws.SetIncremental(true)
	p := fakeRoot + "/big.kiln"
	ws.SetOverlay(p, []byte(text))
	if _, err := ws.Analyze(context.Background(), p); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	cpu0 := cpuTime()
	i := 0
	defer func() {
		b.ReportMetric(float64(cpuTime()-cpu0)/float64(time.Millisecond)/float64(max(i, 1)), "cpu-ms/op")
	}()
	for b.Loop() {
		decl := fmt.Sprintf("\nspecies M%d ", 1+i%benchMolecules)
		at := strings.Index(text, decl) + len(decl)
		end := at + strings.IndexByte(text[at:], '\n')
		ws.SetOverlay(p, []byte(text[:at]+"CCCC"+strings.Repeat("C", i%9)+"O"+text[end:]))
		i++
		r, err := ws.Analyze(context.Background(), p)
		if err != nil {
			b.Fatal(err)
		}
		_ = ide.NewIndex(r)
	}
}

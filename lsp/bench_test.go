package lsp

import (
	"bytes"
	"context"
	"fmt"
	"io"
	"math/rand/v2"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"sort"
	"strconv"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
	"go.lsp.dev/uri"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"kiln.dev/kiln/internal/mechgen"
	"kiln.dev/kiln/speciesfile"
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
	benchEditsOf(b, benchText(), o, edit)
}

// benchEditsOf is benchEdits on another text.
func benchEditsOf(b *testing.B, text string, o fakeOptions, edit func(e *fakeEditor, i int)) {
	e := newFakeEditor(b, map[string]string{"big.kiln": text}, o)
	e.open("big.kiln")
	var lat, srv []time.Duration
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
		u := e.uri("big.kiln")
		e.mu.Lock()
		if s := e.settledAt[u]; s.version == e.versions[u] {
			srv = append(srv, s.at.Sub(t0))
		}
		e.mu.Unlock()
		i++
	}
	b.StopTimer()
	b.ReportMetric(float64(cpuTime()-cpu0)/float64(time.Millisecond)/float64(max(i, 1)), "cpu-ms/edit")
	reportPercentile(b, lat, 0.95, "p95-ms")
	reportPercentile(b, lat, 0.5, "p50-ms")
	// the same up to the server's publication having been read by the
	// client (or found unchanged), before the client decodes it
	reportPercentile(b, srv, 0.95, "server-p95-ms")
	reportPercentile(b, srv, 0.5, "server-p50-ms")
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

// BenchmarkCommentTyping20k: a character typed into a comment line in the
// middle of the file (no line is added, so no diagnostic changes and
// nothing is published: the analysis settles unchanged).
func BenchmarkCommentTyping20k(b *testing.B) {
	text := benchText()
	at := strings.Index(text, "\nreaction M5000 + ") + 1
	text = text[:at] + "# remark \n" + text[at:]
	benchEditsOf(b, text, fakeOptions{inlayHints: true}, func(e *fakeEditor, i int) {
		e.typeAt("big.kiln", at+len("# remark "), string(rune('a'+i%26)))
	})
}

// BenchmarkServerRSS20k measures the memory of the real server: it builds
// the kiln binary, starts `kiln serve` as a child process, opens the
// 20,000-species file over stdio, makes 20 SMILES edits (each awaited: a
// prepareRename request is answered only from the analysis of the current
// text) and reads the child's peak and current resident set size (VmHWM,
// VmRSS) from /proc. The client (this process) is not counted. It also
// reports the server's CPU time per edit and the time to the first
// analysis. Sub-benchmarks run the server as `kiln serve` starts by
// default and with a soft memory limit (--memory-limit 600MiB); the
// server inherits the environment, so GOGC or GOMEMLIMIT set for the
// benchmark apply to it.
func BenchmarkServerRSS20k(b *testing.B) {
	bin, dir, file := serverBenchSetup(b)
	for _, c := range []struct{ name, limit string }{{"default", ""}, {"limit600MiB", "600MiB"}} {
		b.Run(c.name, func(b *testing.B) {
			for b.Loop() {
				args := []string{"serve"}
				if c.limit != "" {
					args = append(args, "--memory-limit", c.limit)
				}
				serveAndEdit(b, bin, args, dir, file, 20, smilesEdit)
			}
		})
	}
}

// serverBenchSetup skips off Linux (the server benchmarks read /proc) and
// returns the kiln binary (buildKiln) and the 20,000-species benchmark file
// written into a temporary directory.
func serverBenchSetup(b *testing.B) (bin, dir, file string) {
	b.Helper()
	if runtime.GOOS != "linux" {
		b.Skip("reads /proc")
	}
	bin = buildKiln(b)
	dir = b.TempDir()
	file = filepath.Join(dir, "big.kiln")
	if err := os.WriteFile(file, []byte(benchText()), 0o644); err != nil {
		b.Fatal(err)
	}
	return bin, dir, file
}

// buildKiln builds cmd/kiln into a temporary directory, or returns the
// binary named by KILN_BENCH_BIN (to measure another build, e.g. main's).
func buildKiln(b *testing.B) string {
	b.Helper()
	if bin := os.Getenv("KILN_BENCH_BIN"); bin != "" {
		return bin
	}
	bin := filepath.Join(b.TempDir(), "kiln")
	out, err := exec.Command("go", "build", "-o", bin, "kiln.dev/kiln/cmd/kiln").CombinedOutput()
	if err != nil {
		b.Fatalf("building kiln: %v\n%s", err, out)
	}
	return bin
}

// BenchmarkServerCommentEdit20k measures the real server (as
// BenchmarkServerRSS20k) on 50 awaited edits that each type a comment line
// between two statements in the middle of the file: the server's CPU time
// per edit (no client work is counted) and the wall time per edit from the
// change to the answer of a request that waits for its analysis.
func BenchmarkServerCommentEdit20k(b *testing.B) {
	bin, dir, file := serverBenchSetup(b)
	for b.Loop() {
		serveAndEdit(b, bin, []string{"serve"}, dir, file, 50, func(text []byte, k int) (int, int, string) {
			at := bytes.Index(text, []byte("\nreaction M5000 + ")) + 1
			return at, at, "# remark " + strconv.Itoa(k) + "\n"
		})
	}
}

// smilesEdit replaces the structure of species M(1+37k): the edits of
// BenchmarkServerRSS20k.
func smilesEdit(text []byte, k int) (start, end int, repl string) {
	decl := fmt.Sprintf("\nspecies M%d ", 1+k*37)
	at := bytes.Index(text, []byte(decl)) + len(decl)
	return at, at + bytes.IndexByte(text[at:], '\n'), "CCCC" + strings.Repeat("C", k%9) + "O" + strings.Repeat("C", k%5)
}

// serveAndEdit runs one server session: open file, n awaited edits (edit
// gives the bytes of the current text to replace, and by what), then
// the measurements, shutdown and exit.
func serveAndEdit(b *testing.B, bin string, args []string, dir, file string, n int, edit func(text []byte, k int) (start, end int, repl string)) {
	b.Helper()
	cmd := exec.Command(bin, args...)
	cmd.Env = os.Environ()
	stdin, err := cmd.StdinPipe()
	if err != nil {
		b.Fatal(err)
	}
	stdout, err := cmd.StdoutPipe()
	if err != nil {
		b.Fatal(err)
	}
	cmd.Stderr = os.Stderr
	if err := cmd.Start(); err != nil {
		b.Fatal(err)
	}
	defer cmd.Process.Kill()
	ctx := context.Background()
	conn := jsonrpc2.NewConn(jsonrpc2.NewStream(pipeConn{stdout, stdin}))
	conn.Go(ctx, func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		if _, ok := req.(*jsonrpc2.Call); ok {
			return reply(ctx, nil, nil)
		}
		return nil // publications and messages are not decoded
	})
	defer conn.Close()
	call := func(method string, params any) {
		c, cancel := context.WithTimeout(ctx, 2*time.Minute)
		defer cancel()
		// An error answer (no name to rename at the position) still comes
		// after the analysis of the current text.
		if _, err := conn.Call(c, method, params, nil); err != nil && c.Err() != nil {
			b.Fatalf("%s: %v", method, err)
		}
	}
	notify := func(method string, params any) {
		if err := conn.Notify(ctx, method, params); err != nil {
			b.Fatalf("%s: %v", method, err)
		}
	}
	call("initialize", map[string]any{"processId": os.Getpid(), "rootUri": string(uri.File(dir)),
		"capabilities": map[string]any{"textDocument": map[string]any{"inlayHint": map[string]any{"dynamicRegistration": false}}}})
	notify("initialized", map[string]any{})
	u := uri.File(file)
	text := []byte(benchText())
	lines := speciesfile.NewLineIndex(text)
	await := func() {
		call("textDocument/prepareRename", protocol.TextDocumentPositionParams{TextDocument: protocol.TextDocumentIdentifier{URI: u}})
	}
	t0 := time.Now()
	notify("textDocument/didOpen", protocol.DidOpenTextDocumentParams{
		TextDocument: protocol.TextDocumentItem{URI: u, LanguageID: "kiln", Version: 1, Text: string(text)},
	})
	await()
	open := time.Since(t0)
	cpu0 := childCPU(cmd.Process.Pid)
	t1 := time.Now()
	var lat []time.Duration
	for k := range n {
		at, end, repl := edit(text, k)
		ps, pe := lines.Position(at), lines.Position(end)
		c := contentChange{
			Range: &protocol.Range{Start: protocol.Position{Line: uint32(ps.Line), Character: uint32(ps.UTF16)},
				End: protocol.Position{Line: uint32(pe.Line), Character: uint32(pe.UTF16)}},
			Text: repl,
		}
		t0 := time.Now()
		text, lines, _ = applyChange(text, lines, c)
		notify("textDocument/didChange", didChangeParams{
			TextDocument:   protocol.VersionedTextDocumentIdentifier{TextDocumentIdentifier: protocol.TextDocumentIdentifier{URI: u}, Version: int32(k + 2)},
			ContentChanges: []contentChange{c},
		})
		await()
		lat = append(lat, time.Since(t0))
	}
	editCPU := childCPU(cmd.Process.Pid) - cpu0
	editWall := time.Since(t1)
	b.StopTimer()
	hwm, rss := procRSSOf(fmt.Sprintf("/proc/%d/status", cmd.Process.Pid))
	b.ReportMetric(hwm, "peak-RSS-MiB")
	b.ReportMetric(rss, "RSS-MiB")
	b.ReportMetric(float64(open)/float64(time.Millisecond), "open-ms")
	b.ReportMetric(float64(editCPU)/float64(time.Millisecond)/float64(n), "server-cpu-ms/edit")
	b.ReportMetric(float64(editWall)/float64(time.Millisecond)/float64(n), "ms/edit")
	reportPercentile(b, lat, 0.5, "p50-ms")
	reportPercentile(b, lat, 0.95, "p95-ms")
	call("shutdown", nil)
	notify("exit", nil)
	if err := cmd.Wait(); err != nil {
		b.Fatalf("kiln serve: %v", err)
	}
	b.StartTimer()
}

// pipeConn joins a child's stdout and stdin into one stream.
type pipeConn struct {
	io.Reader
	io.WriteCloser
}

// childCPU returns the user and system CPU time of process pid so far, from
// /proc/PID/stat (fields 14 and 15, in clock ticks of 1/100 s, the value
// of USER_HZ on Linux).
func childCPU(pid int) time.Duration {
	data, err := os.ReadFile(fmt.Sprintf("/proc/%d/stat", pid))
	if err != nil {
		return 0
	}
	// The command name (field 2) is in parentheses and may hold spaces.
	f := strings.Fields(string(data[bytes.LastIndexByte(data, ')')+1:]))
	if len(f) < 13 {
		return 0
	}
	ut, _ := strconv.ParseInt(f[11], 10, 64)
	st, _ := strconv.ParseInt(f[12], 10, 64)
	return time.Duration(ut+st) * 10 * time.Millisecond
}

// procRSSOf returns VmHWM and VmRSS in MiB from a /proc status file.
func procRSSOf(status string) (hwm, rss float64) {
	data, err := os.ReadFile(status)
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

package lsp

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io/fs"
	"net"
	"path"
	"sort"
	"sync"
	"testing"
	"time"

	"github.com/stretchr/testify/require"
	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
	"go.lsp.dev/uri"
	"go.uber.org/zap"

	"kiln.dev/kiln/speciesfile"
)

// fakeRoot is the workspace root of fake editors; files live in memory.
const fakeRoot = "/ws"

// fakeEditor is an in-process LSP client talking to Serve over net.Pipe with
// a real jsonrpc2 connection. It keeps the text of the documents it opened,
// applies edits the way an editor does (incremental changes) and records the
// diagnostics the server publishes.
type fakeEditor struct {
	t    testing.TB
	conn jsonrpc2.Conn
	done chan error // Serve's result

	disk map[string]string // files "on disk" (the server's Loader), by path

	mu       sync.Mutex
	texts    map[protocol.DocumentURI]string
	versions map[protocol.DocumentURI]int32
	diags    map[protocol.DocumentURI]protocol.PublishDiagnosticsParams
	settled  map[protocol.DocumentURI]int32 // latest version whose analysis changed no diagnostics
	// settledAt says when the server last settled a version (published, the
	// publication's bytes read by this client, or found unchanged).
	settledAt map[protocol.DocumentURI]settledAt
	pubs      int           // publications received
	notify    chan struct{} // closed and replaced on every publication or settled analysis
	liText    string        // the text liCache indexes
	liCache   *speciesfile.LineIndex
	messages  []string // window/showMessage texts
}

type settledAt struct {
	version int32
	at      time.Time
}

type fakeOptions struct {
	initOptions any
	plainText   bool // the client's hover supports only plaintext
	inlayHints  bool // the client advertises textDocument.inlayHint
	debounce    time.Duration
}

// newFakeEditor starts a server over files (relative path → text) and initializes it.
func newFakeEditor(t testing.TB, files map[string]string, o fakeOptions) *fakeEditor {
	t.Helper()
	disk := map[string]string{}
	for p, text := range files {
		disk[path.Join(fakeRoot, p)] = text
	}
	e := &fakeEditor{
		t: t, disk: disk, done: make(chan error, 1),
		texts: map[protocol.DocumentURI]string{}, versions: map[protocol.DocumentURI]int32{},
		diags: map[protocol.DocumentURI]protocol.PublishDiagnosticsParams{}, notify: make(chan struct{}),
		settled: map[protocol.DocumentURI]int32{}, settledAt: map[protocol.DocumentURI]settledAt{},
	}
	serverSide, clientSide := net.Pipe()
	loader := func(p string) ([]byte, error) {
		e.mu.Lock()
		defer e.mu.Unlock()
		text, ok := e.disk[p]
		if !ok {
			return nil, &fs.PathError{Op: "open", Path: p, Err: fs.ErrNotExist}
		}
		return []byte(text), nil
	}
	ctx, cancel := context.WithCancel(context.Background())
	t.Cleanup(cancel)
	go func() {
		e.done <- Serve(ctx, serverSide, zap.NewNop(), Options{Root: fakeRoot, Loader: loader, Debounce: o.debounce, settled: e.onSettled})
	}()
	e.conn = jsonrpc2.NewConn(jsonrpc2.NewStream(clientSide))
	e.conn.Go(ctx, e.handle)
	t.Cleanup(func() { e.conn.Close() })

	formats := []string{"markdown", "plaintext"}
	if o.plainText {
		formats = []string{"plaintext"}
	}
	td := map[string]any{"hover": map[string]any{"contentFormat": formats}}
	if o.inlayHints {
		td["inlayHint"] = map[string]any{"dynamicRegistration": false}
	}
	params := map[string]any{
		"processId":    1,
		"rootUri":      string(uri.File(fakeRoot)),
		"capabilities": map[string]any{"textDocument": td},
	}
	if o.initOptions != nil {
		params["initializationOptions"] = o.initOptions
	}
	var res struct {
		Capabilities map[string]any `json:"capabilities"`
	}
	e.call("initialize", params, &res)
	require.Equal(t, true, res.Capabilities["inlayHintProvider"], "inlay hints must be advertised")
	require.NoError(t, e.conn.Notify(context.Background(), "initialized", map[string]any{}))
	return e
}

func (e *fakeEditor) handle(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
	switch req.Method() {
	case "textDocument/publishDiagnostics":
		var p protocol.PublishDiagnosticsParams
		if err := json.Unmarshal(req.Params(), &p); err != nil {
			e.t.Errorf("bad publishDiagnostics: %v", err)
			return nil
		}
		e.mu.Lock()
		e.diags[p.URI] = p
		e.pubs++
		close(e.notify)
		e.notify = make(chan struct{})
		e.mu.Unlock()
		return nil
	case "window/showMessage":
		var p protocol.ShowMessageParams
		_ = json.Unmarshal(req.Params(), &p)
		e.mu.Lock()
		e.messages = append(e.messages, p.Message)
		e.mu.Unlock()
		return nil
	}
	if _, ok := req.(*jsonrpc2.Call); ok {
		return reply(ctx, nil, nil)
	}
	return nil
}

// onSettled is the server's test hook: the analysis of version v of u is
// published (the publication is on its way) or changed nothing.
func (e *fakeEditor) onSettled(u protocol.DocumentURI, v int32, published bool) {
	e.mu.Lock()
	defer e.mu.Unlock()
	e.settledAt[u] = settledAt{v, time.Now()}
	if published {
		return
	}
	e.settled[u] = v
	close(e.notify)
	e.notify = make(chan struct{})
}

// publications returns the number of publications received so far.
func (e *fakeEditor) publications() int {
	e.mu.Lock()
	defer e.mu.Unlock()
	return e.pubs
}

// call sends a request and decodes its result, failing the test on error.
func (e *fakeEditor) call(method string, params, result any) {
	e.t.Helper()
	require.NoError(e.t, e.callErr(method, params, result), method)
}

func (e *fakeEditor) callErr(method string, params, result any) error {
	ctx, cancel := context.WithTimeout(context.Background(), 30*time.Second)
	defer cancel()
	_, err := e.conn.Call(ctx, method, params, result)
	return err
}

func (e *fakeEditor) uri(rel string) protocol.DocumentURI { return uri.File(path.Join(fakeRoot, rel)) }

// open opens rel with its text on disk and waits for its diagnostics.
func (e *fakeEditor) open(rel string) []protocol.Diagnostic {
	e.t.Helper()
	u := e.uri(rel)
	e.mu.Lock()
	text, ok := e.disk[path.Join(fakeRoot, rel)]
	e.texts[u] = text
	e.versions[u] = 1
	e.mu.Unlock()
	require.True(e.t, ok, "no file %s in the workspace", rel)
	require.NoError(e.t, e.conn.Notify(context.Background(), "textDocument/didOpen", protocol.DidOpenTextDocumentParams{
		TextDocument: protocol.TextDocumentItem{URI: u, LanguageID: "kiln", Version: 1, Text: text},
	}))
	return e.waitDiagnostics(rel)
}

// text returns the editor's text of rel.
func (e *fakeEditor) text(rel string) string {
	e.mu.Lock()
	defer e.mu.Unlock()
	return e.texts[e.uri(rel)]
}

// change sends incremental changes (in order) to rel and returns the new
// version. Each change is applied to the text left by the previous one.
func (e *fakeEditor) change(rel string, changes ...contentChange) int32 {
	e.t.Helper()
	u := e.uri(rel)
	e.mu.Lock()
	text := []byte(e.texts[u])
	lines := speciesfile.NewLineIndex(text)
	for _, c := range changes {
		text, lines, _ = applyChange(text, lines, c)
	}
	e.texts[u] = string(text)
	e.versions[u]++
	v := e.versions[u]
	e.mu.Unlock()
	require.NoError(e.t, e.conn.Notify(context.Background(), "textDocument/didChange", didChangeParams{
		TextDocument:   protocol.VersionedTextDocumentIdentifier{TextDocumentIdentifier: protocol.TextDocumentIdentifier{URI: u}, Version: v},
		ContentChanges: changes,
	}))
	return v
}

// typeAt inserts s at byte offset off of rel's text, as a keystroke would.
func (e *fakeEditor) typeAt(rel string, off int, s string) int32 {
	e.t.Helper()
	return e.change(rel, contentChange{Range: e.rangeAt(rel, off, off), Text: s})
}

// lineIndex returns the line index of rel's current text (cached: large
// files would otherwise dominate the measured request times).
func (e *fakeEditor) lineIndex(rel string) *speciesfile.LineIndex {
	text := e.text(rel)
	e.mu.Lock()
	defer e.mu.Unlock()
	if e.liCache == nil || e.liText != text {
		e.liText, e.liCache = text, speciesfile.NewLineIndex([]byte(text))
	}
	return e.liCache
}

// rangeAt converts byte offsets of rel's current text to a protocol range.
func (e *fakeEditor) rangeAt(rel string, start, end int) *protocol.Range {
	li := e.lineIndex(rel)
	ps, pe := li.Position(start), li.Position(end)
	return &protocol.Range{
		Start: protocol.Position{Line: uint32(ps.Line), Character: uint32(ps.UTF16)},
		End:   protocol.Position{Line: uint32(pe.Line), Character: uint32(pe.UTF16)},
	}
}

func (e *fakeEditor) pos(rel string, off int) protocol.Position {
	return e.rangeAt(rel, off, off).Start
}

// offsetOf converts a protocol position of rel's current text to a byte offset.
func (e *fakeEditor) offsetOf(rel string, p protocol.Position) int {
	li := e.lineIndex(rel)
	return li.Offset(int(p.Line), int(p.Character))
}

// waitDiagnostics waits until the diagnostics of rel's current version
// arrive, or the server reports that its analysis left them unchanged, and
// returns the diagnostics in force.
func (e *fakeEditor) waitDiagnostics(rel string) []protocol.Diagnostic {
	e.t.Helper()
	u := e.uri(rel)
	deadline := time.After(60 * time.Second)
	for {
		e.mu.Lock()
		p, ok := e.diags[u]
		want := e.versions[u]
		settled := e.settled[u] == want
		ch := e.notify
		e.mu.Unlock()
		if ok && (int32(p.Version) == want || settled) {
			return p.Diagnostics
		}
		select {
		case <-ch:
		case err := <-e.done:
			e.t.Fatalf("server stopped while waiting for diagnostics of %s: %v", rel, err)
		case <-deadline:
			e.t.Fatalf("timed out waiting for diagnostics of %s version %d", rel, want)
		}
	}
}

// diagnostics returns the last diagnostics published for rel.
func (e *fakeEditor) diagnostics(rel string) []protocol.Diagnostic {
	e.mu.Lock()
	defer e.mu.Unlock()
	return e.diags[e.uri(rel)].Diagnostics
}

// applyEdit applies a workspace edit as an editor does: open documents get
// incremental didChange notifications (edits applied from the end so that
// earlier positions stay valid); other files are rewritten "on disk".
// It returns the relative paths it changed.
func (e *fakeEditor) applyEdit(we *protocol.WorkspaceEdit) []string {
	e.t.Helper()
	var changed []string
	uris := make([]string, 0, len(we.Changes))
	for u := range we.Changes {
		uris = append(uris, string(u))
	}
	sort.Strings(uris)
	for _, us := range uris {
		u := protocol.DocumentURI(us)
		edits := append([]protocol.TextEdit(nil), we.Changes[u]...)
		sort.SliceStable(edits, func(i, j int) bool { return comparePos(edits[i].Range.Start, edits[j].Range.Start) > 0 })
		p := uriToPath(u)
		rel := p[len(fakeRoot)+1:]
		changed = append(changed, rel)
		e.mu.Lock()
		_, open := e.texts[u]
		e.mu.Unlock()
		if open {
			cs := make([]contentChange, len(edits))
			for i, ed := range edits {
				r := ed.Range
				cs[i] = contentChange{Range: &r, Text: ed.NewText}
			}
			e.change(rel, cs...)
			continue
		}
		e.mu.Lock()
		text := []byte(e.disk[p])
		lines := speciesfile.NewLineIndex(text)
		for _, ed := range edits {
			r := ed.Range
			text, lines, _ = applyChange(text, lines, contentChange{Range: &r, Text: ed.NewText})
		}
		e.disk[p] = string(text)
		e.mu.Unlock()
	}
	return changed
}

func comparePos(a, b protocol.Position) int {
	if a.Line != b.Line {
		return int(a.Line) - int(b.Line)
	}
	return int(a.Character) - int(b.Character)
}

// shutdown performs shutdown + exit and returns Serve's result.
func (e *fakeEditor) shutdown() error {
	e.t.Helper()
	e.call("shutdown", nil, nil)
	require.NoError(e.t, e.conn.Notify(context.Background(), "exit", nil))
	return e.serveResult()
}

func (e *fakeEditor) serveResult() error {
	select {
	case err := <-e.done:
		return err
	case <-time.After(30 * time.Second):
		return errors.New("server did not stop")
	}
}

// hover returns the hover text at byte offset off of rel ("" for none).
func (e *fakeEditor) hover(rel string, off int) string {
	e.t.Helper()
	var h *protocol.Hover
	e.call("textDocument/hover", protocol.TextDocumentPositionParams{TextDocument: protocol.TextDocumentIdentifier{URI: e.uri(rel)}, Position: e.pos(rel, off)}, &h)
	if h == nil {
		return ""
	}
	return h.Contents.Value
}

func (e *fakeEditor) String() string { return fmt.Sprintf("fakeEditor(%d docs)", len(e.texts)) }

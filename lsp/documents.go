package lsp

import (
	"context"
	"encoding/json"
	"fmt"
	"net/url"
	"path/filepath"
	"runtime/debug"
	"strings"
	"sync"
	"time"

	"go.lsp.dev/protocol"
	"go.lsp.dev/uri"
	"go.uber.org/zap"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"kiln.dev/kiln/speciesfile"
)

// document is an open text document.
type document struct {
	uri  protocol.DocumentURI
	path string

	// text state, guarded by server.mu
	version int32
	text    []byte
	lines   *speciesfile.LineIndex
	seq     uint64     // number of text changes so far
	edits   []textEdit // changes made after latest's text, in order
	latest  *snapshot  // the latest finished analysis (nil before the first)

	publishMu sync.Mutex // orders diagnostics publications; guards the fields below
	published []protocol.Diagnostic
	hasPub    bool
	pubBuf    []byte          // the last publication's encoding (its array encodes the next)
	noteNames map[string]bool // species changed since open (estimate notes of large files)

	mu          sync.Mutex // guards the analysis state below
	gen         uint64
	cancel      context.CancelFunc
	ready       chan struct{} // closed once the latest text is analysed
	readyClosed bool
	snap        *snapshot
	closed      bool
}

// snapshot is a completed analysis of a document.
type snapshot struct {
	version int32
	seq     uint64 // the document's change count when its text was taken
	result  *analysis.Result
	index   *ide.Index
}

// maxPendingEdits bounds the edits kept between a document's latest
// finished analysis and its current text.
const maxPendingEdits = 10000

// textEdit is one change of a document's text: bytes [start, end) of the
// text before it were replaced by newLen bytes.
type textEdit struct {
	seq                uint64
	start, end, newLen int
}

// uriToPath turns a file:// URI into a clean OS path; other URIs (untitled:)
// are used verbatim as workspace keys.
func uriToPath(u protocol.DocumentURI) string {
	s := string(u)
	if strings.HasPrefix(s, "file://") {
		if pu, err := url.Parse(s); err == nil && pu.Path != "" {
			return filepath.Clean(filepath.FromSlash(pu.Path))
		}
	}
	return s
}

// pathToURI is the inverse of uriToPath for open documents; other paths
// become file:// URIs.
func (s *server) pathToURI(path string) protocol.DocumentURI {
	s.mu.Lock()
	d := s.docs[path]
	s.mu.Unlock()
	if d != nil {
		return d.uri
	}
	if strings.Contains(path, ":") && !filepath.IsAbs(path) && !strings.HasPrefix(path, "/") {
		return protocol.DocumentURI(path)
	}
	return uri.File(path)
}

func (s *server) didOpen(raw json.RawMessage) error {
	var p protocol.DidOpenTextDocumentParams
	if err := json.Unmarshal(raw, &p); err != nil {
		return fmt.Errorf("didOpen params: %w", err)
	}
	path := uriToPath(p.TextDocument.URI)
	text := []byte(p.TextDocument.Text)
	s.mu.Lock()
	d := s.docs[path]
	if d == nil {
		d = &document{uri: p.TextDocument.URI, path: path}
		s.docs[path] = d
	}
	d.version = p.TextDocument.Version
	d.text = text
	d.lines = speciesfile.NewLineIndex(text)
	d.seq++
	d.edits = nil
	d.latest = nil // a reopened text cannot be mapped to the old analysis
	s.ws.SetOverlay(path, text)
	s.mu.Unlock()
	d.publishMu.Lock()
	d.noteNames = nil
	d.publishMu.Unlock()
	s.schedule(d, 0, true)
	return nil
}

func (s *server) didChange(raw json.RawMessage) error {
	var p didChangeParams
	if err := json.Unmarshal(raw, &p); err != nil {
		return fmt.Errorf("didChange params: %w", err)
	}
	path := uriToPath(p.TextDocument.URI)
	s.mu.Lock()
	d := s.docs[path]
	if d == nil {
		s.mu.Unlock()
		return fmt.Errorf("didChange for a document that is not open: %s", p.TextDocument.URI)
	}
	text, lines := d.text, d.lines
	for _, c := range p.ContentChanges {
		var e textEdit
		text, lines, e = applyChange(text, lines, c)
		d.seq++
		e.seq = d.seq
		d.edits = append(d.edits, e)
		if len(d.edits) > maxPendingEdits {
			// No analysis has finished for a long while (it keeps failing):
			// stop mapping through an ever longer log; requests wait for
			// the next analysis instead.
			d.latest, d.edits = nil, nil
		}
	}
	d.text, d.lines = text, lines
	d.version = p.TextDocument.Version
	s.ws.SetOverlay(path, text)
	s.mu.Unlock()
	s.schedule(d, s.opts.Debounce, true)
	return nil
}

// applyChange applies one content change (UTF-16 range, or whole text) and
// returns the new text with its line index and the change as a byte edit (a
// whole-text change is narrowed to the bytes that differ). Out-of-range
// positions are clamped by LineIndex.Offset; a reversed range is treated as
// empty.
func applyChange(text []byte, lines *speciesfile.LineIndex, c contentChange) ([]byte, *speciesfile.LineIndex, textEdit) {
	if c.Range == nil {
		t := []byte(c.Text)
		pre := 0
		for pre < len(text) && pre < len(t) && text[pre] == t[pre] {
			pre++
		}
		suf := 0
		for suf < len(text)-pre && suf < len(t)-pre && text[len(text)-1-suf] == t[len(t)-1-suf] {
			suf++
		}
		return t, speciesfile.NewLineIndex(t), textEdit{start: pre, end: len(text) - suf, newLen: len(t) - pre - suf}
	}
	start := lines.Offset(int(c.Range.Start.Line), int(c.Range.Start.Character))
	end := lines.Offset(int(c.Range.End.Line), int(c.Range.End.Character))
	if end < start {
		end = start
	}
	out := make([]byte, 0, len(text)-(end-start)+len(c.Text))
	out = append(out, text[:start]...)
	out = append(out, c.Text...)
	out = append(out, text[end:]...)
	e := speciesfile.Edit{Old: speciesfile.Span{Start: start, End: end}, NewLen: len(c.Text)}
	return out, lines.Edited(out, e), textEdit{start: start, end: end, newLen: len(c.Text)}
}

func (s *server) didClose(raw json.RawMessage) error {
	var p protocol.DidCloseTextDocumentParams
	if err := json.Unmarshal(raw, &p); err != nil {
		return fmt.Errorf("didClose params: %w", err)
	}
	path := uriToPath(p.TextDocument.URI)
	s.mu.Lock()
	d := s.docs[path]
	delete(s.docs, path)
	if d != nil {
		s.ws.CloseOverlay(path)
		s.ws.ForgetFile(path)
	}
	s.mu.Unlock()
	if d == nil {
		return nil
	}
	d.mu.Lock()
	d.closed = true
	d.gen++
	if d.cancel != nil {
		d.cancel()
	}
	if !d.readyClosed {
		close(d.ready)
		d.readyClosed = true
	}
	d.mu.Unlock()
	s.publish(d, nil, 0, true)
	s.reanalyseIncluders(path)
	return nil
}

func (s *server) didSave(raw json.RawMessage) error {
	var p protocol.DidSaveTextDocumentParams
	if err := json.Unmarshal(raw, &p); err != nil {
		return fmt.Errorf("didSave params: %w", err)
	}
	s.reanalyseIncluders(uriToPath(p.TextDocument.URI))
	return nil
}

// reanalyseAll schedules every open document (settings or files on disk changed).
func (s *server) reanalyseAll() {
	s.mu.Lock()
	docs := make([]*document, 0, len(s.docs))
	for _, d := range s.docs {
		docs = append(docs, d)
	}
	s.mu.Unlock()
	for _, d := range docs {
		s.schedule(d, 0, false)
	}
}

// reanalyseIncluders schedules the open documents whose last analysis read path.
func (s *server) reanalyseIncluders(path string) {
	s.mu.Lock()
	docs := make([]*document, 0, len(s.docs))
	for p, d := range s.docs {
		if p != path {
			docs = append(docs, d)
		}
	}
	s.mu.Unlock()
	for _, d := range docs {
		d.mu.Lock()
		uses := d.snap != nil && d.snap.result != nil && d.snap.result.Files[path] != nil
		d.mu.Unlock()
		if uses {
			s.schedule(d, s.opts.Debounce, false)
		}
	}
}

// schedule starts an analysis of d after delay, cancelling any analysis
// still running for an older text. When propagate is set, open documents
// that include d are re-analysed afterwards.
func (s *server) schedule(d *document, delay time.Duration, propagate bool) {
	d.mu.Lock()
	if d.closed {
		d.mu.Unlock()
		return
	}
	if d.cancel != nil {
		d.cancel()
	}
	d.gen++
	gen := d.gen
	if d.ready == nil || d.readyClosed {
		d.ready = make(chan struct{})
		d.readyClosed = false
	}
	ctx, cancel := context.WithCancel(s.ctx)
	d.cancel = cancel
	d.mu.Unlock()

	s.mu.Lock()
	version, seq, text := d.version, d.seq, d.text
	ws := s.ws
	s.mu.Unlock()

	s.wg.Add(1)
	go func() {
		defer s.wg.Done()
		defer cancel()
		defer func() {
			if p := recover(); p != nil {
				s.logger.Error("panic in analysis", zap.String("path", d.path), zap.Any("panic", p), zap.ByteString("stack", debug.Stack()))
				s.finish(d, gen, &snapshot{version: version, seq: seq})
			}
		}()
		// An edit of blank and comment lines only moves positions: its
		// analysis costs little, so it does not wait for more typing.
		var res *analysis.Result
		var err error
		if delay > 0 {
			res = ws.Quick(ctx, d.path)
		}
		if res == nil && delay > 0 {
			t := time.NewTimer(delay)
			select {
			case <-ctx.Done():
				t.Stop()
				return
			case <-t.C:
			}
		}
		if res == nil {
			res, err = ws.Analyze(ctx, d.path)
		}
		if ctx.Err() != nil {
			return // superseded or shutting down
		}
		if err == nil && !sameBytes(res.File.Src, text) {
			return // the text changed meanwhile: a newer analysis is scheduled
		}
		snap := &snapshot{version: version, seq: seq}
		if err != nil {
			s.logger.Warn("analysis failed", zap.String("path", d.path), zap.Error(err))
		} else {
			snap.result = res
			snap.index = ide.NewIndex(res)
		}
		if s.finish(d, gen, snap) && propagate {
			s.reanalyseIncluders(d.path)
		}
	}()
}

// finish records snap as d's analysis if gen is still current, wakes the
// requests waiting for it and publishes its diagnostics.
func (s *server) finish(d *document, gen uint64, snap *snapshot) bool {
	d.mu.Lock()
	if d.gen != gen || d.closed {
		d.mu.Unlock()
		return false
	}
	prev := d.snap
	d.snap = snap
	d.cancel = nil
	if !d.readyClosed {
		close(d.ready)
		d.readyClosed = true
	}
	d.mu.Unlock()
	if snap.result != nil {
		s.mu.Lock()
		if d.latest == nil || d.latest.seq <= snap.seq {
			d.latest = snap
			k := 0
			for k < len(d.edits) && d.edits[k].seq <= snap.seq {
				k++
			}
			d.edits = d.edits[k:len(d.edits):len(d.edits)]
		}
		s.mu.Unlock()
	}
	s.noteChanges(d, prev, snap)
	s.publish(d, snap, gen, false)
	return true
}

// sameBytes reports whether a and b are the same slice (the analysed text is
// the text an analysis was scheduled for).
func sameBytes(a, b []byte) bool {
	if len(a) != len(b) {
		return false
	}
	return len(a) == 0 || &a[0] == &b[0]
}

// publish sends the diagnostics of snap (none when snap is nil), unless they
// are the ones last sent for the document (force sends regardless).
func (s *server) publish(d *document, snap *snapshot, gen uint64, force bool) {
	d.publishMu.Lock()
	defer d.publishMu.Unlock()
	if !force {
		d.mu.Lock()
		current := d.gen == gen && !d.closed
		d.mu.Unlock()
		if !current {
			return
		}
	}
	params := protocol.PublishDiagnosticsParams{URI: d.uri, Diagnostics: []protocol.Diagnostic{}}
	if snap != nil {
		if snap.version > 0 {
			params.Version = uint32(snap.version)
		}
		if snap.result != nil {
			params.Diagnostics = s.toDiagnostics(snap.result, s.noteFilter(d, snap))
		}
	}
	if !force && d.hasPub && sameDiagnostics(d.published, params.Diagnostics) {
		s.settled(d, snap, false)
		return
	}
	d.published, d.hasPub = params.Diagnostics, true
	buf, err := s.out.notify("textDocument/publishDiagnostics", params, d.pubBuf)
	d.pubBuf = buf
	if len(params.Diagnostics) == 0 {
		d.pubBuf = nil // (a closed document, or none to show: keep no large array)
	}
	if err != nil {
		s.logger.Debug("publishDiagnostics failed", zap.Error(err))
	}
	s.settled(d, snap, true)
}

// settled tells the test hook that the analysis of a version is published
// or found to change nothing.
func (s *server) settled(d *document, snap *snapshot, published bool) {
	if s.opts.settled != nil && snap != nil {
		s.opts.settled(d.uri, snap.version, published)
	}
}

// sameDiagnostics reports whether two lists are equal.
func sameDiagnostics(a, b []protocol.Diagnostic) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		x, y := &a[i], &b[i]
		if x.Range != y.Range || x.Severity != y.Severity || x.Code != y.Code || x.Message != y.Message ||
			x.Source != y.Source || len(x.RelatedInformation) != len(y.RelatedInformation) {
			return false
		}
		for k := range x.RelatedInformation {
			if x.RelatedInformation[k] != y.RelatedInformation[k] {
				return false
			}
		}
	}
	return true
}

// errNotOpen is returned for requests about documents the client has not opened.
type errNotOpen string

func (e errNotOpen) Error() string { return fmt.Sprintf("document %s is not open", string(e)) }

// await returns the analysis of the document's latest text, waiting for it
// if needed.
func (s *server) await(ctx context.Context, u protocol.DocumentURI) (*document, *snapshot, error) {
	path := uriToPath(u)
	s.mu.Lock()
	d := s.docs[path]
	s.mu.Unlock()
	if d == nil {
		return nil, nil, errNotOpen(u)
	}
	d.mu.Lock()
	ready := d.ready
	d.mu.Unlock()
	select {
	case <-ready:
	case <-ctx.Done():
		return nil, nil, ctx.Err()
	}
	d.mu.Lock()
	snap := d.snap
	closed := d.closed
	d.mu.Unlock()
	if closed {
		return nil, nil, errNotOpen(u)
	}
	if snap == nil || snap.result == nil {
		return nil, nil, fmt.Errorf("no analysis available for %s", u)
	}
	return d, snap, nil
}

// openSnapshots returns the latest analyses of every open document (waiting
// for pending ones).
func (s *server) openSnapshots(ctx context.Context) ([]*snapshot, error) {
	s.mu.Lock()
	uris := make([]protocol.DocumentURI, 0, len(s.docs))
	for _, d := range s.docs {
		uris = append(uris, d.uri)
	}
	s.mu.Unlock()
	var out []*snapshot
	for _, u := range uris {
		_, snap, err := s.await(ctx, u)
		if err != nil {
			if ctx.Err() != nil {
				return nil, ctx.Err()
			}
			continue
		}
		out = append(out, snap)
	}
	return out, nil
}

package lsp

import (
	"context"
	"encoding/json"
	"fmt"
	"strings"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"kiln.dev/kiln/speciesfile"
)

// handlerFunc answers one request.
type handlerFunc func(s *server, ctx context.Context, params json.RawMessage) (any, error)

// requestHandlers maps request methods to their handlers (read-only).
var requestHandlers = map[string]handlerFunc{
	"textDocument/hover":          (*server).hover,
	"textDocument/inlayHint":      (*server).inlayHint,
	"textDocument/definition":     (*server).definition,
	"textDocument/references":     (*server).references,
	"textDocument/prepareRename":  (*server).prepareRename,
	"textDocument/rename":         (*server).rename,
	"textDocument/documentSymbol": (*server).documentSymbol,
	"workspace/symbol":            (*server).workspaceSymbol,
	"textDocument/completion":     (*server).completion,
	"textDocument/foldingRange":   (*server).foldingRange,
	"textDocument/formatting":     (*server).formatting,
	"textDocument/codeAction":     (*server).codeAction,
	"textDocument/codeLens":       (*server).codeLens,
	"workspace/executeCommand":    (*server).executeCommand,
}

func decode(raw json.RawMessage, v any) error {
	if len(raw) == 0 {
		return jsonrpc2.NewError(jsonrpc2.InvalidParams, "missing params")
	}
	if err := json.Unmarshal(raw, v); err != nil {
		return jsonrpc2.NewError(jsonrpc2.InvalidParams, "invalid params: "+err.Error())
	}
	return nil
}

// --- position conversion (speciesfile.LineIndex is the one converter) ---

func position(f *speciesfile.File, off int) protocol.Position {
	p := f.Lines.Position(off)
	return protocol.Position{Line: uint32(p.Line), Character: uint32(p.UTF16)}
}

func rangeOf(f *speciesfile.File, sp speciesfile.Span) protocol.Range {
	return protocol.Range{Start: position(f, sp.Start), End: position(f, sp.End)}
}

func offset(f *speciesfile.File, p protocol.Position) int {
	return f.Lines.Offset(int(p.Line), int(p.Character))
}

// target is a document position resolved against its latest analysis.
type target struct {
	doc  *document
	snap *snapshot
	file *speciesfile.File
	off  int
}

func (s *server) at(ctx context.Context, p protocol.TextDocumentPositionParams) (target, error) {
	d, snap, err := s.await(ctx, p.TextDocument.URI)
	if err != nil {
		return target{}, err
	}
	f := snap.result.Files[d.path]
	if f == nil {
		return target{}, fmt.Errorf("no parsed text for %s", p.TextDocument.URI)
	}
	return target{doc: d, snap: snap, file: f, off: offset(f, p.Position)}, nil
}

// viewAt resolves a position against the latest finished analysis without
// waiting for one in progress; ok is false when the position lies in text
// typed since that analysis.
func (s *server) viewAt(ctx context.Context, p protocol.TextDocumentPositionParams) (view, int, bool, error) {
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return view{}, 0, false, err
	}
	off, ok := v.offset(p.Position)
	return v, off, ok, nil
}

// location converts an analysis location, using whichever of the snapshots
// holds the file.
func (s *server) location(l analysis.Location, snaps ...*snapshot) (protocol.Location, bool) {
	for _, sn := range snaps {
		if f := sn.result.Files[l.File]; f != nil {
			return protocol.Location{URI: s.pathToURI(l.File), Range: rangeOf(f, l.Span)}, true
		}
	}
	return protocol.Location{}, false
}

// toDiagnostics converts the diagnostics of r's file that keep accepts (all
// when keep is nil).
func (s *server) toDiagnostics(r *analysis.Result, keep func(speciesfile.Diagnostic) bool) []protocol.Diagnostic {
	if keep == nil {
		out := make([]protocol.Diagnostic, 0, len(r.Diagnostics))
		for _, d := range r.Diagnostics {
			out = append(out, s.toDiagnostic(r, d))
		}
		return out
	}
	// sized exactly: most of a large file's diagnostics may be estimate
	// notes left out
	kept := make([]bool, len(r.Diagnostics))
	n := 0
	for i, d := range r.Diagnostics {
		if keep(d) {
			kept[i] = true
			n++
		}
	}
	out := make([]protocol.Diagnostic, 0, n)
	for i, d := range r.Diagnostics {
		if kept[i] {
			out = append(out, s.toDiagnostic(r, d))
		}
	}
	return out
}

func (s *server) toDiagnostic(r *analysis.Result, d speciesfile.Diagnostic) protocol.Diagnostic {
	pd := protocol.Diagnostic{
		Range:    rangeOf(r.File, d.Span),
		Severity: protocol.DiagnosticSeverity(d.Severity),
		Code:     d.Code,
		Source:   "kiln",
		Message:  d.Message,
	}
	if d.Severity < speciesfile.SeverityError || d.Severity > speciesfile.SeverityHint {
		pd.Severity = protocol.DiagnosticSeverityError
	}
	for _, rel := range d.Related {
		f := r.Files[rel.File]
		if f == nil {
			continue
		}
		pd.RelatedInformation = append(pd.RelatedInformation, protocol.DiagnosticRelatedInformation{
			Location: protocol.Location{URI: s.pathToURI(rel.File), Range: rangeOf(f, rel.Span)},
			Message:  rel.Message,
		})
	}
	return pd
}

// workspaceEdit groups edits by file.
func (s *server) workspaceEdit(edits []analysis.Edit, snaps ...*snapshot) (*protocol.WorkspaceEdit, error) {
	we := &protocol.WorkspaceEdit{Changes: map[protocol.DocumentURI][]protocol.TextEdit{}}
	for _, e := range edits {
		l, ok := s.location(analysis.Location{File: e.File, Span: e.Span}, snaps...)
		if !ok {
			return nil, fmt.Errorf("edit in unknown file %s", e.File)
		}
		we.Changes[l.URI] = append(we.Changes[l.URI], protocol.TextEdit{Range: l.Range, NewText: e.NewText})
	}
	return we, nil
}

// viewEdit groups edits by file, mapping those in the viewed document to its
// current text; ok is false when one of them touches text changed since.
func (s *server) viewEdit(v view, edits []analysis.Edit) (*protocol.WorkspaceEdit, bool) {
	we := &protocol.WorkspaceEdit{Changes: map[protocol.DocumentURI][]protocol.TextEdit{}}
	for _, e := range edits {
		l, ok := s.viewLocation(v, analysis.Location{File: e.File, Span: e.Span})
		if !ok {
			return nil, false
		}
		we.Changes[l.URI] = append(we.Changes[l.URI], protocol.TextEdit{Range: l.Range, NewText: e.NewText})
	}
	return we, true
}

// openViews returns the views of every open document that has a finished
// analysis (waiting for none).
func (s *server) openViews(ctx context.Context) ([]view, error) {
	s.mu.Lock()
	uris := make([]protocol.DocumentURI, 0, len(s.docs))
	for _, d := range s.docs {
		if d.latest != nil {
			uris = append(uris, d.uri)
		}
	}
	s.mu.Unlock()
	var out []view
	for _, u := range uris {
		v, err := s.view(ctx, u)
		if err != nil {
			if ctx.Err() != nil {
				return nil, ctx.Err()
			}
			continue
		}
		out = append(out, v)
	}
	return out, nil
}

// locationIn converts a location using the view that holds its file.
func (s *server) locationIn(views []view, l analysis.Location) (protocol.Location, bool) {
	for _, v := range views {
		if v.doc.path == l.File {
			return s.viewLocation(v, l)
		}
	}
	for _, v := range views {
		if v.snap.result.Files[l.File] != nil {
			return s.location(l, v.snap)
		}
	}
	return protocol.Location{}, false
}

// --- requests ---

func (s *server) hover(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.TextDocumentPositionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, off, ok, err := s.viewAt(ctx, p)
	if err != nil || !ok {
		return nil, err
	}
	s.mu.Lock()
	md := s.markdown
	s.mu.Unlock()
	h, ok := ide.Hover(v.snap.index, v.doc.path, off, s.currentSettings(), md)
	if !ok {
		return nil, nil
	}
	kind := protocol.PlainText
	if md {
		kind = protocol.Markdown
	}
	rng, ok := v.rangeOf(h.Span)
	if !ok {
		return nil, nil // the hovered text changed since the analysis
	}
	return &protocol.Hover{Contents: protocol.MarkupContent{Kind: kind, Value: h.Text}, Range: &rng}, nil
}

func (s *server) inlayHint(ctx context.Context, raw json.RawMessage) (any, error) {
	var p inlayHintParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	start, _ := v.offset(p.Range.Start)
	end, _ := v.offset(p.Range.End)
	if end <= start {
		end = len(v.file.Src) + 1
	}
	out := []inlayHint{}
	for _, h := range ide.InlayHints(v.snap.index, v.doc.path, start, end, s.currentSettings()) {
		if pos, ok := v.position(h.Offset); ok {
			out = append(out, inlayHint{Position: pos, Label: h.Label, PaddingLeft: true})
		}
	}
	return out, nil
}

func (s *server) definition(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.TextDocumentPositionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, off, ok, err := s.viewAt(ctx, p)
	if err != nil {
		return nil, err
	}
	out := []protocol.Location{}
	if !ok {
		return out, nil
	}
	for _, l := range ide.Definition(v.snap.index, v.doc.path, off) {
		if pl, ok := s.viewLocation(v, l); ok {
			out = append(out, pl)
		}
	}
	return out, nil
}

func (s *server) references(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.ReferenceParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	t, err := s.at(ctx, p.TextDocumentPositionParams)
	if err != nil {
		return nil, err
	}
	_, name, err := ide.PrepareRename(t.snap.index, t.doc.path, t.off)
	if err != nil {
		return []protocol.Location{}, nil
	}
	snaps, err := s.snapshotsWith(ctx, t.snap)
	if err != nil {
		return nil, err
	}
	seen := map[protocol.Location]bool{}
	out := []protocol.Location{}
	for _, sn := range snaps {
		for _, l := range ide.NameReferences(sn.index, name, p.Context.IncludeDeclaration) {
			if pl, ok := s.location(l, sn); ok && !seen[pl] {
				seen[pl] = true
				out = append(out, pl)
			}
		}
	}
	return out, nil
}

// snapshotsWith returns first followed by the analyses of the other open documents.
func (s *server) snapshotsWith(ctx context.Context, first *snapshot) ([]*snapshot, error) {
	all, err := s.openSnapshots(ctx)
	if err != nil {
		return nil, err
	}
	out := []*snapshot{first}
	for _, sn := range all {
		if sn != first {
			out = append(out, sn)
		}
	}
	return out, nil
}

func (s *server) prepareRename(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.TextDocumentPositionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	t, err := s.at(ctx, p)
	if err != nil {
		return nil, err
	}
	span, name, err := ide.PrepareRename(t.snap.index, t.doc.path, t.off)
	if err != nil {
		return nil, jsonrpc2.NewError(jsonrpc2.InvalidRequest, err.Error())
	}
	return prepareRenameResult{Range: rangeOf(t.file, span), Placeholder: name}, nil
}

func (s *server) rename(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.RenameParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	t, err := s.at(ctx, p.TextDocumentPositionParams)
	if err != nil {
		return nil, err
	}
	_, name, err := ide.PrepareRename(t.snap.index, t.doc.path, t.off)
	if err != nil {
		return nil, jsonrpc2.NewError(jsonrpc2.InvalidRequest, err.Error())
	}
	snaps, err := s.snapshotsWith(ctx, t.snap)
	if err != nil {
		return nil, err
	}
	xs := make([]*ide.Index, len(snaps))
	for i, sn := range snaps {
		xs[i] = sn.index
	}
	edits, err := ide.Rename(xs, name, p.NewName)
	if err != nil {
		return nil, jsonrpc2.NewError(jsonrpc2.InvalidRequest, err.Error())
	}
	return s.workspaceEdit(edits, snaps...)
}

func (s *server) documentSymbol(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.DocumentSymbolParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	out := []protocol.DocumentSymbol{}
	for _, sym := range ide.DocumentSymbols(v.snap.index, v.doc.path) {
		r, ok1 := v.rangeOf(sym.Span)
		sel, ok2 := v.rangeOf(sym.Selection)
		if !ok2 {
			continue // the name was edited since the analysis
		}
		if !ok1 {
			r = sel
		}
		out = append(out, protocol.DocumentSymbol{
			Name: sym.Name, Detail: sym.Detail, Kind: protocol.SymbolKind(sym.Kind),
			Range: r, SelectionRange: sel,
		})
	}
	return out, nil
}

// maxWorkspaceSymbols bounds a workspace/symbol answer.
const maxWorkspaceSymbols = 1000

func (s *server) workspaceSymbol(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.WorkspaceSymbolParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	views, err := s.openViews(ctx)
	if err != nil {
		return nil, err
	}
	xs := make([]*ide.Index, len(views))
	for i, v := range views {
		xs[i] = v.snap.index
	}
	out := []protocol.SymbolInformation{}
	for _, sym := range ide.WorkspaceSymbols(xs, p.Query, maxWorkspaceSymbols) {
		l, ok := s.locationIn(views, analysis.Location{File: sym.File, Span: sym.Selection})
		if !ok {
			continue
		}
		out = append(out, protocol.SymbolInformation{Name: sym.Name, Kind: protocol.SymbolKind(sym.Kind), Location: l, ContainerName: sym.Detail})
	}
	return out, nil
}

// maxCompletions bounds a completion answer; a longer list is cut and
// marked incomplete, so that the client asks again as the word grows.
const maxCompletions = 200

func (s *server) completion(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.CompletionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	// The context comes from the editor's current text, the names from the
	// latest analysis. A short list is sent whole (the client filters it); a
	// long one (a mechanism has tens of thousands of species names) only
	// with the candidates that start with the word being typed, cut at
	// maxCompletions and marked incomplete.
	off := v.lines.Offset(int(p.Position.Line), int(p.Position.Character))
	all := ide.CompleteText(v.snap.index, v.text, v.lines, off)
	start := off
	for start > 0 && v.text[start-1] != ' ' && v.text[start-1] != '\t' && v.text[start-1] != '\n' && v.text[start-1] != '\r' {
		start--
	}
	word := string(v.text[start:off])
	list := &protocol.CompletionList{Items: []protocol.CompletionItem{}}
	for _, c := range all {
		if len(all) > maxCompletions && !strings.HasPrefix(c.Label, word) {
			continue
		}
		if len(list.Items) == maxCompletions {
			list.IsIncomplete = true
			break
		}
		list.Items = append(list.Items, protocol.CompletionItem{Label: c.Label, Detail: c.Detail, Kind: protocol.CompletionItemKind(c.Kind)})
	}
	return list, nil
}

func (s *server) foldingRange(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.FoldingRangeParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	out := []protocol.FoldingRange{}
	for _, fr := range ide.FoldingRanges(v.file) {
		start, ok1 := v.position(fr.Start)
		end, ok2 := v.position(fr.End)
		if !ok1 || !ok2 || end.Line <= start.Line {
			continue
		}
		out = append(out, protocol.FoldingRange{StartLine: start.Line, EndLine: end.Line, Kind: protocol.FoldingRangeKind(fr.Kind)})
	}
	return out, nil
}

func (s *server) formatting(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.DocumentFormattingParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	d, snap, err := s.await(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	f := snap.result.Files[d.path]
	out := []protocol.TextEdit{}
	for _, e := range ide.Format(f) {
		out = append(out, protocol.TextEdit{Range: rangeOf(f, e.Span), NewText: e.NewText})
	}
	return out, nil
}

func (s *server) codeAction(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.CodeActionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	start, _ := v.offset(p.Range.Start)
	end, _ := v.offset(p.Range.End)
	out := []protocol.CodeAction{}
	for _, a := range ide.CodeActions(v.snap.index, v.doc.path, speciesfile.Span{Start: start, End: max(start, end)}) {
		if !kindWanted(a.Kind, p.Context.Only) {
			continue
		}
		we, ok := s.viewEdit(v, a.Edits)
		if !ok {
			continue // the text it would change was edited since the analysis
		}
		ca := protocol.CodeAction{Title: a.Title, Kind: protocol.CodeActionKind(a.Kind), Edit: we, IsPreferred: a.Preferred}
		for _, dg := range a.Diagnostics {
			pd := s.toDiagnostic(v.snap.result, dg)
			if r, ok := v.rangeOf(dg.Span); ok {
				pd.Range = r
			}
			ca.Diagnostics = append(ca.Diagnostics, pd)
		}
		out = append(out, ca)
	}
	return out, nil
}

// kindWanted applies the client's `only` filter: a kind matches a requested
// kind equal to it or a dot-separated prefix of it.
func kindWanted(kind string, only []protocol.CodeActionKind) bool {
	if len(only) == 0 {
		return true
	}
	for _, o := range only {
		if kind == string(o) || strings.HasPrefix(kind, string(o)+".") {
			return true
		}
	}
	return false
}

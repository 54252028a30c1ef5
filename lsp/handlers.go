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

// toDiagnostics converts the diagnostics of r's file.
func (s *server) toDiagnostics(r *analysis.Result) []protocol.Diagnostic {
	out := make([]protocol.Diagnostic, 0, len(r.Diagnostics))
	for _, d := range r.Diagnostics {
		out = append(out, s.toDiagnostic(r, d))
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

// --- requests ---

func (s *server) hover(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.TextDocumentPositionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	t, err := s.at(ctx, p)
	if err != nil {
		return nil, err
	}
	s.mu.Lock()
	md := s.markdown
	s.mu.Unlock()
	h, ok := ide.Hover(t.snap.index, t.doc.path, t.off, s.currentSettings(), md)
	if !ok {
		return nil, nil
	}
	kind := protocol.PlainText
	if md {
		kind = protocol.Markdown
	}
	rng := rangeOf(t.file, h.Span)
	return &protocol.Hover{Contents: protocol.MarkupContent{Kind: kind, Value: h.Text}, Range: &rng}, nil
}

func (s *server) inlayHint(ctx context.Context, raw json.RawMessage) (any, error) {
	var p inlayHintParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	d, snap, err := s.await(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	f := snap.result.Files[d.path]
	start, end := offset(f, p.Range.Start), offset(f, p.Range.End)
	if end <= start {
		end = len(f.Src) + 1
	}
	out := []inlayHint{}
	for _, h := range ide.InlayHints(snap.index, d.path, start, end, s.currentSettings()) {
		out = append(out, inlayHint{Position: position(f, h.Offset), Label: h.Label, PaddingLeft: true})
	}
	return out, nil
}

func (s *server) definition(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.TextDocumentPositionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	t, err := s.at(ctx, p)
	if err != nil {
		return nil, err
	}
	out := []protocol.Location{}
	for _, l := range ide.Definition(t.snap.index, t.doc.path, t.off) {
		if pl, ok := s.location(l, t.snap); ok {
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
	d, snap, err := s.await(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	f := snap.result.Files[d.path]
	out := []protocol.DocumentSymbol{}
	for _, sym := range ide.DocumentSymbols(snap.index, d.path) {
		out = append(out, protocol.DocumentSymbol{
			Name: sym.Name, Detail: sym.Detail, Kind: protocol.SymbolKind(sym.Kind),
			Range: rangeOf(f, sym.Span), SelectionRange: rangeOf(f, sym.Selection),
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
	snaps, err := s.openSnapshots(ctx)
	if err != nil {
		return nil, err
	}
	xs := make([]*ide.Index, len(snaps))
	for i, sn := range snaps {
		xs[i] = sn.index
	}
	out := []protocol.SymbolInformation{}
	for _, sym := range ide.WorkspaceSymbols(xs, p.Query, maxWorkspaceSymbols) {
		l, ok := s.location(analysis.Location{File: sym.File, Span: sym.Selection}, snaps...)
		if !ok {
			continue
		}
		out = append(out, protocol.SymbolInformation{Name: sym.Name, Kind: protocol.SymbolKind(sym.Kind), Location: l, ContainerName: sym.Detail})
	}
	return out, nil
}

func (s *server) completion(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.CompletionParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	t, err := s.at(ctx, p.TextDocumentPositionParams)
	if err != nil {
		return nil, err
	}
	items := []protocol.CompletionItem{}
	for _, c := range ide.Complete(t.snap.index, t.doc.path, t.off) {
		items = append(items, protocol.CompletionItem{Label: c.Label, Detail: c.Detail, Kind: protocol.CompletionItemKind(c.Kind)})
	}
	return &protocol.CompletionList{Items: items}, nil
}

func (s *server) foldingRange(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.FoldingRangeParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	d, snap, err := s.await(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	f := snap.result.Files[d.path]
	out := []protocol.FoldingRange{}
	for _, fr := range ide.FoldingRanges(f) {
		out = append(out, protocol.FoldingRange{
			StartLine: uint32(f.Lines.Line(fr.Start)), EndLine: uint32(f.Lines.Line(fr.End)),
			Kind: protocol.FoldingRangeKind(fr.Kind),
		})
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
	d, snap, err := s.await(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	f := snap.result.Files[d.path]
	span := speciesfile.Span{Start: offset(f, p.Range.Start), End: offset(f, p.Range.End)}
	out := []protocol.CodeAction{}
	for _, a := range ide.CodeActions(snap.index, d.path, span) {
		if !kindWanted(a.Kind, p.Context.Only) {
			continue
		}
		we, err := s.workspaceEdit(a.Edits, snap)
		if err != nil {
			return nil, err
		}
		ca := protocol.CodeAction{Title: a.Title, Kind: protocol.CodeActionKind(a.Kind), Edit: we, IsPreferred: a.Preferred}
		for _, dg := range a.Diagnostics {
			ca.Diagnostics = append(ca.Diagnostics, s.toDiagnostic(snap.result, dg))
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

package lsp

import (
	"context"

	"go.lsp.dev/protocol"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
)

// Requests never wait for an analysis in progress: they answer from the
// latest finished analysis of the document (its snapshot), whose text may
// be older than the editor's. A view maps between the two texts through the
// edits made since the snapshot's text was taken: a position in the current
// text maps back to the snapshot unless it lies in text typed since; a span
// of the snapshot maps forward unless its text was deleted or replaced.

// view is a document's latest snapshot seen from its current text.
type view struct {
	doc   *document
	snap  *snapshot
	file  *speciesfile.File      // the snapshot's parse of the document
	text  []byte                 // the current text
	lines *speciesfile.LineIndex // the current text's line index
	edits []textEdit             // changes after the snapshot's text, in order
}

// view returns the view of the open document u, waiting only when no
// analysis of it has finished yet.
func (s *server) view(ctx context.Context, u protocol.DocumentURI) (view, error) {
	path := uriToPath(u)
	for {
		s.mu.Lock()
		d := s.docs[path]
		if d == nil {
			s.mu.Unlock()
			return view{}, errNotOpen(u)
		}
		if snap := d.latest; snap != nil {
			v := view{doc: d, snap: snap, file: snap.result.Files[path], text: d.text, lines: d.lines, edits: d.edits}
			s.mu.Unlock()
			if v.file == nil {
				return view{}, errNotOpen(u)
			}
			return v, nil
		}
		s.mu.Unlock()
		// No analysis yet (the document was just opened): wait for one.
		if _, _, err := s.await(ctx, u); err != nil {
			return view{}, err
		}
		s.mu.Lock()
		ok := d.latest != nil
		s.mu.Unlock()
		if !ok {
			// The awaited analysis failed or was superseded before any
			// finished: answer nothing rather than spin.
			return view{}, errNotOpen(u)
		}
	}
}

// stale reports whether the document changed since the snapshot's text.
func (v view) stale() bool { return len(v.edits) > 0 }

// back maps an offset of the current text to the snapshot's text; ok is
// false when the offset lies in text inserted since (it then maps to where
// the insertion began).
func (v view) back(off int) (int, bool) {
	ok := true
	for i := len(v.edits) - 1; i >= 0; i-- {
		e := v.edits[i]
		switch {
		case off <= e.start:
		case off >= e.start+e.newLen:
			off += (e.end - e.start) - e.newLen
		default:
			ok = false
			off = e.start
		}
	}
	return off, ok
}

// forward maps an offset of the snapshot's text to the current text; ok is
// false when the text at the offset was deleted or replaced since (it then
// maps to where the replacement begins).
func (v view) forward(off int) (int, bool) {
	ok := true
	for _, e := range v.edits {
		switch {
		case off <= e.start:
		case off >= e.end:
			off += e.newLen - (e.end - e.start)
		default:
			ok = false
			off = e.start
		}
	}
	return off, ok
}

// offset maps a client position to an offset of the snapshot's text.
func (v view) offset(p protocol.Position) (int, bool) {
	return v.back(v.lines.Offset(int(p.Line), int(p.Character)))
}

// position converts an offset of the snapshot's text to a client position.
func (v view) position(off int) (protocol.Position, bool) {
	cur, ok := v.forward(off)
	pp := v.lines.Position(cur)
	return protocol.Position{Line: uint32(pp.Line), Character: uint32(pp.UTF16)}, ok
}

// rangeOf converts a span of the snapshot's text to a client range; ok is
// false when part of the span's text changed since.
func (v view) rangeOf(sp speciesfile.Span) (protocol.Range, bool) {
	start, ok1 := v.position(sp.Start)
	end, ok2 := v.position(sp.End)
	return protocol.Range{Start: start, End: end}, ok1 && ok2
}

// location converts a location of the snapshot (in this document or a file
// it includes) to a client location.
func (s *server) viewLocation(v view, l analysis.Location) (protocol.Location, bool) {
	if l.File == v.doc.path {
		r, ok := v.rangeOf(l.Span)
		return protocol.Location{URI: v.doc.uri, Range: r}, ok
	}
	return s.location(l, v.snap)
}

// largeFileSpecies is the number of species above which a file counts as
// large: its estimate notes are sent only for the species changed since the
// document was opened.
const largeFileSpecies = 1000

// maxNoteNames bounds the changed species remembered per document.
const maxNoteNames = 1000

// estimateNotes reports whether per-species "estimated …" notes are sent:
// the estimateNotes setting, by default on only for clients that cannot show
// inlay hints.
func (s *server) estimateNotes() bool {
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.notes != nil {
		return *s.notes
	}
	return !s.clientHints
}

// isEstimateNote reports whether d is a species' "no thermo block; estimated"
// information note.
func isEstimateNote(d speciesfile.Diagnostic) bool {
	return d.Code == speciesfile.CodeMissingThermo && d.Severity == speciesfile.SeverityInformation
}

// noteFilter returns which diagnostics of snap to publish (nil: all). The
// caller holds d.publishMu.
func (s *server) noteFilter(d *document, snap *snapshot) func(speciesfile.Diagnostic) bool {
	notes := s.estimateNotes()
	f := snap.result.File
	large := len(f.Species) > largeFileSpecies
	if notes && !large {
		return nil
	}
	return func(dg speciesfile.Diagnostic) bool {
		if !isEstimateNote(dg) {
			return true
		}
		if !notes {
			return false
		}
		if dg.Span.Start < 0 || dg.Span.End > len(f.Src) || dg.Span.Start > dg.Span.End {
			return false
		}
		return d.noteNames[string(f.Src[dg.Span.Start:dg.Span.End])]
	}
}

// noteChanges records the species of a large document whose declaration
// changed between two analyses (the region the user is editing).
func (s *server) noteChanges(d *document, prev, snap *snapshot) {
	if prev == nil || prev.result == nil || snap.result == nil || len(snap.result.File.Species) <= largeFileSpecies ||
		prev.result.Settings != snap.result.Settings {
		return
	}
	if ps, ss := prev.result.Species, snap.result.Species; len(ps) == len(ss) && len(ps) > 0 && &ps[0] == &ss[0] {
		return // the same values (an edit of comment lines): nothing changed
	}
	d.publishMu.Lock()
	defer d.publishMu.Unlock()
	ps := prev.result.Species
	for i, sp := range snap.result.Species {
		if len(d.noteNames) >= maxNoteNames {
			return
		}
		if i < len(ps) && ps[i] == sp {
			continue // the same value (reused by the analysis): the same unit
		}
		if sp.File == d.path && !sp.SameUnit(prev.result.ByName[sp.Name]) {
			if d.noteNames == nil {
				d.noteNames = map[string]bool{}
			}
			d.noteNames[sp.Name] = true
		}
	}
}

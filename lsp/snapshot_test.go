package lsp

import (
	"fmt"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.lsp.dev/protocol"
)

const viewFile = `species H2 [H][H]
species H [H]
species CH4 C
species CH3 [CH3]
reaction CH4 + H <=> CH3 + H2   A=6.6e8 n=1.62 Ea=10.84
`

// TestRequestsAnswerFromLatestAnalysis: with an analysis pending for an hour,
// hover, definition, symbols and completion answer at once from the last
// finished analysis, with positions mapped through the edits typed since.
func TestRequestsAnswerFromLatestAnalysis(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"a.kiln": viewFile}, fakeOptions{debounce: time.Hour})
	e.open("a.kiln")
	// Two lines typed at the top and a word inside the reaction line: the
	// analysis of this text is an hour away.
	e.typeAt("a.kiln", 0, "# first remark\n# second remark é🔥\n")
	at := strings.Index(e.text("a.kiln"), "A=6.6e8")
	e.typeAt("a.kiln", at, "  ")
	text := e.text("a.kiln")

	done := make(chan struct{})
	go func() {
		defer close(done)
		use := strings.Index(text, "CH3 + H2")
		h := e.hover("a.kiln", use+1)
		assert.Contains(t, h, "CH3")

		var hv *protocol.Hover
		e.call("textDocument/hover", protocol.TextDocumentPositionParams{TextDocument: textDoc(e, "a.kiln"), Position: e.pos("a.kiln", use)}, &hv)
		require.NotNil(t, hv)
		assert.Equal(t, *e.rangeAt("a.kiln", use, use+3), *hv.Range, "the hover range is in the current text")

		var locs []protocol.Location
		e.call("textDocument/definition", protocol.TextDocumentPositionParams{TextDocument: textDoc(e, "a.kiln"), Position: e.pos("a.kiln", use)}, &locs)
		require.Len(t, locs, 1)
		decl := strings.Index(text, "species CH3") + len("species ")
		assert.Equal(t, *e.rangeAt("a.kiln", decl, decl+3), locs[0].Range)

		var syms []protocol.DocumentSymbol
		e.call("textDocument/documentSymbol", protocol.DocumentSymbolParams{TextDocument: textDoc(e, "a.kiln")}, &syms)
		require.NotEmpty(t, syms)
		assert.Equal(t, *e.rangeAt("a.kiln", strings.Index(text, "H2"), strings.Index(text, "H2")+2), syms[0].SelectionRange)

		// Inside text typed since the analysis there is nothing to say.
		assert.Empty(t, e.hover("a.kiln", strings.Index(text, "second")+2))

		var list protocol.CompletionList
		e.call("textDocument/completion", protocol.CompletionParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
			TextDocument: textDoc(e, "a.kiln"), Position: e.pos("a.kiln", strings.Index(text, "CH4 +"))}}, &list)
		var labels []string
		for _, it := range list.Items {
			labels = append(labels, it.Label)
		}
		assert.Contains(t, labels, "CH3")
	}()
	select {
	case <-done:
	case <-time.After(20 * time.Second):
		t.Fatal("requests waited for the pending analysis")
	}
	require.NoError(t, e.shutdown())
}

func TestViewMapping(t *testing.T) {
	// Old text "abcdef"; replace "cd" by "XYZ" (→ "abXYZef"), then insert
	// "!" at 0 (→ "!abXYZef").
	v := view{edits: []textEdit{{seq: 1, start: 2, end: 4, newLen: 3}, {seq: 2, start: 0, end: 0, newLen: 1}}}
	for _, c := range []struct {
		old, cur int
		ok       bool
	}{{0, 0, true}, {1, 2, true}, {2, 3, true}, {4, 6, true}, {5, 7, true}, {6, 8, true}} {
		got, ok := v.forward(c.old)
		if c.old != 0 { // offset 0 is before the inserted "!"
			assert.Equal(t, c.cur, got, "forward %d", c.old)
		}
		assert.Equal(t, c.ok, ok, "forward %d", c.old)
	}
	got, ok := v.forward(3) // inside the replaced "cd"
	assert.False(t, ok)
	assert.Equal(t, 3, got, "maps to where the replacement begins")
	back, ok := v.back(6) // "e" in the current text
	assert.True(t, ok)
	assert.Equal(t, 4, back)
	_, ok = v.back(4) // inside "XYZ"
	assert.False(t, ok)
}

func hasNote(ds []protocol.Diagnostic) int {
	n := 0
	for _, d := range ds {
		if d.Code == "missing-thermo" && d.Severity == protocol.DiagnosticSeverityInformation {
			n++
		}
	}
	return n
}

// TestEstimateNotes: the per-species "estimated" notes go only to clients
// without inlay hints, follow the estimateNotes setting, and in large files
// only name the species edited since opening.
func TestEstimateNotes(t *testing.T) {
	withHints := newFakeEditor(t, map[string]string{"a.kiln": viewFile}, fakeOptions{inlayHints: true})
	assert.Zero(t, hasNote(withHints.open("a.kiln")), "a client with inlay hints gets no notes")
	var hints []inlayHint
	withHints.call("textDocument/inlayHint", inlayHintParams{TextDocument: textDoc(withHints, "a.kiln")}, &hints)
	assert.NotEmpty(t, hints, "the estimates are shown as hints instead")
	require.NoError(t, withHints.shutdown())

	without := newFakeEditor(t, map[string]string{"a.kiln": viewFile}, fakeOptions{})
	assert.Equal(t, 4, hasNote(without.open("a.kiln")), "a client without inlay hints gets a note per estimated species")
	require.NoError(t, without.conn.Notify(t.Context(), "workspace/didChangeConfiguration", map[string]any{"settings": map[string]any{"kiln": map[string]any{"estimateNotes": false}}}))
	require.Eventually(t, func() bool { return hasNote(without.diagnostics("a.kiln")) == 0 }, 10*time.Second, 10*time.Millisecond)
	require.NoError(t, without.shutdown())

	forced := newFakeEditor(t, map[string]string{"a.kiln": viewFile}, fakeOptions{inlayHints: true, initOptions: map[string]any{"estimateNotes": true}})
	assert.Equal(t, 4, hasNote(forced.open("a.kiln")), "the setting turns notes on for any client")
	require.NoError(t, forced.shutdown())

	// A large file: no notes on open, then only for the species edited.
	var b strings.Builder
	b.WriteString("species H [H]\nspecies H2 [H][H]\n")
	for i := range largeFileSpecies + 10 {
		fmt.Fprintf(&b, "species S%d %s\n", i, strings.Repeat("C", 1+i%9))
	}
	big := newFakeEditor(t, map[string]string{"big.kiln": b.String()}, fakeOptions{})
	assert.Zero(t, hasNote(big.open("big.kiln")), "no notes for species outside the edited region of a large file")
	at := strings.Index(big.text("big.kiln"), "species S7 ") + len("species S7 ")
	big.typeAt("big.kiln", at, "O")
	ds := big.waitDiagnostics("big.kiln")
	require.Equal(t, 1, hasNote(ds), "%s", diagSummary(ds))
	for _, d := range ds {
		if d.Code == "missing-thermo" {
			assert.Contains(t, d.Message, "S7")
		}
	}
	require.NoError(t, big.shutdown())
}

// TestPublishOnlyChanged: an edit that leaves the diagnostics as they were
// publishes nothing; one that changes them publishes.
func TestPublishOnlyChanged(t *testing.T) {
	src := viewFile + "reaction CH4 + XX <=> CH3 + H2   A=1e13 n=0 Ea=0\n# last line\n"
	e := newFakeEditor(t, map[string]string{"a.kiln": src}, fakeOptions{inlayHints: true})
	require.NotEmpty(t, e.open("a.kiln"))
	n := e.publications()
	// Typing inside the last comment moves no diagnostic.
	e.typeAt("a.kiln", len(src)-2, " more")
	e.waitDiagnostics("a.kiln")
	assert.Equal(t, n, e.publications(), "unchanged diagnostics are not published again")
	// A line inserted above the reaction moves its diagnostic.
	e.typeAt("a.kiln", 0, "# new first line\n")
	e.waitDiagnostics("a.kiln")
	assert.Equal(t, n+1, e.publications())
	require.NoError(t, e.shutdown())
}

// TestCompletionLongListIsCut: species completions in a large file are
// filtered by the word typed and cut, marked incomplete.
func TestCompletionLongListIsCut(t *testing.T) {
	var b strings.Builder
	for i := range 3 * maxCompletions {
		fmt.Fprintf(&b, "species S%d C\n", i)
	}
	b.WriteString("reaction S1")
	e := newFakeEditor(t, map[string]string{"c.kiln": b.String()}, fakeOptions{inlayHints: true})
	e.open("c.kiln")
	complete := func(off int) protocol.CompletionList {
		var list protocol.CompletionList
		e.call("textDocument/completion", protocol.CompletionParams{TextDocumentPositionParams: protocol.TextDocumentPositionParams{
			TextDocument: textDoc(e, "c.kiln"), Position: e.pos("c.kiln", off)}}, &list)
		return list
	}
	end := len(e.text("c.kiln"))
	list := complete(end) // after "S1"
	require.NotEmpty(t, list.Items)
	for _, it := range list.Items {
		assert.True(t, strings.HasPrefix(it.Label, "S1"), it.Label)
	}
	assert.Len(t, list.Items, 1+10+100, "S1, S10–S19, S100–S199")
	list = complete(end - 2) // after "reaction ": every name
	assert.Len(t, list.Items, maxCompletions)
	assert.True(t, list.IsIncomplete)
	require.NoError(t, e.shutdown())
}

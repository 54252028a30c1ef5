package lsp

import (
	"context"
	"encoding/json"
	"errors"
	"net"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
	"go.uber.org/zap"

	"kiln.dev/kiln/analysis"
)

const smokeFile = `# smoke test
species H2 [H][H]
species H [H]
reaction H2 <=> H + H   A=4.6e19 n=-1.4 Ea=104.4
`

func TestOpenTypeHoverShutdown(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"a.kiln": smokeFile}, fakeOptions{})
	e.open("a.kiln")
	// Type a reaction that uses an undeclared species, one keystroke at a time.
	line := "reaction H + XY <=> H2\n"
	off := len(smokeFile)
	for i := range line {
		e.typeAt("a.kiln", off+i, line[i:i+1])
	}
	ds := e.waitDiagnostics("a.kiln")
	require.Equal(t, smokeFile+line, e.text("a.kiln"))
	var undeclared []protocol.Diagnostic
	for _, d := range ds {
		if d.Code == "undeclared-species" {
			undeclared = append(undeclared, d)
		}
	}
	require.Len(t, undeclared, 1, "XY is the one undeclared name: %s", diagSummary(ds))
	// The range covers exactly "XY" on line 5 (0-based 4), UTF-16 columns 13–15.
	assert.Equal(t, protocol.Range{Start: protocol.Position{Line: 4, Character: 13}, End: protocol.Position{Line: 4, Character: 15}}, undeclared[0].Range)
	assert.Equal(t, "kiln", undeclared[0].Source)

	h := e.hover("a.kiln", strings.Index(e.text("a.kiln"), "species H2")+8)
	assert.Contains(t, h, "H2")
	// H2 is reference-library data: the caution for tabulated data, not
	// the group-additivity one (analysis/ide.CautionFor)
	assert.Contains(t, h, "Tabulated reference data")
	assert.Contains(t, h, "licensed engineering practice and local codes")
	require.NoError(t, e.shutdown())
}

func TestUTF16Positions(t *testing.T) {
	// A comment with an emoji (2 UTF-16 units) and é (1 unit, 2 bytes) before
	// a name: the diagnostic column must count UTF-16 units.
	src := "species H [H]\nreaction H + H <=> ZZ # 🔥é\nreaction H + H <=> Q2 # x\n"
	e := newFakeEditor(t, map[string]string{"u.kiln": src}, fakeOptions{})
	e.open("u.kiln")
	// Insert "é🔥" before Q2 via an incremental edit expressed in UTF-16.
	e.change("u.kiln", contentChange{Range: &protocol.Range{
		Start: protocol.Position{Line: 2, Character: 19}, End: protocol.Position{Line: 2, Character: 19}}, Text: "é🔥"})
	require.Equal(t, "species H [H]\nreaction H + H <=> ZZ # 🔥é\nreaction H + H <=> é🔥Q2 # x\n", e.text("u.kiln"))
	ds := e.waitDiagnostics("u.kiln")
	var got []protocol.Range
	for _, d := range ds {
		if d.Code == "undeclared-species" {
			got = append(got, d.Range)
		}
	}
	// "é🔥Q2" starts at UTF-16 column 19 and is 1+2+2 = 5 units long.
	assert.Contains(t, got, protocol.Range{Start: protocol.Position{Line: 2, Character: 19}, End: protocol.Position{Line: 2, Character: 24}})
	require.NoError(t, e.shutdown())
}

func TestProtocolErrors(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"a.kiln": smokeFile}, fakeOptions{})
	// Unknown request → MethodNotFound.
	err := e.callErr("kiln/noSuchMethod", map[string]any{}, nil)
	var werr *jsonrpc2.Error
	require.True(t, errors.As(err, &werr), "got %v", err)
	assert.Equal(t, jsonrpc2.MethodNotFound, werr.Code)
	// Unknown notification: ignored, server still answers.
	require.NoError(t, e.conn.Notify(context.Background(), "kiln/whatever", map[string]any{"x": 1}))
	// Request about a document that is not open → error, no crash.
	err = e.callErr("textDocument/hover", protocol.TextDocumentPositionParams{TextDocument: protocol.TextDocumentIdentifier{URI: e.uri("a.kiln")}}, nil)
	require.Error(t, err)
	assert.Contains(t, err.Error(), "not open")
	// Malformed params → InvalidParams.
	err = e.callErr("textDocument/hover", []int{1, 2}, nil)
	require.Error(t, err)
	// The server is still alive.
	e.open("a.kiln")
	require.NoError(t, e.shutdown())
}

func TestExitWithoutShutdown(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"a.kiln": smokeFile}, fakeOptions{})
	require.NoError(t, e.conn.Notify(context.Background(), "exit", nil))
	assert.ErrorIs(t, e.serveResult(), ErrExitWithoutShutdown)
}

func TestRequestBeforeInitialize(t *testing.T) {
	server, client := net.Pipe()
	done := make(chan error, 1)
	go func() { done <- Serve(context.Background(), server, zap.NewNop(), Options{}) }()
	conn := jsonrpc2.NewConn(jsonrpc2.NewStream(client))
	conn.Go(context.Background(), jsonrpc2.MethodNotFoundHandler)
	ctx, cancel := context.WithTimeout(context.Background(), 10*time.Second)
	defer cancel()
	_, err := conn.Call(ctx, "textDocument/hover", map[string]any{}, nil)
	var werr *jsonrpc2.Error
	require.True(t, errors.As(err, &werr), "got %v", err)
	assert.Equal(t, jsonrpc2.ServerNotInitialized, werr.Code)
	conn.Close()
	assert.ErrorIs(t, <-done, ErrConnectionClosed)
}

func TestPanicBecomesInternalError(t *testing.T) {
	s := &server{logger: zap.NewNop()}
	res, err := s.safeCall(context.Background(), "test/panic", func() (any, error) { panic("boom") })
	assert.Nil(t, res)
	var werr *jsonrpc2.Error
	require.True(t, errors.As(err, &werr))
	assert.Equal(t, jsonrpc2.InternalError, werr.Code)
	assert.Contains(t, werr.Message, "boom")
}

func TestCancelRequest(t *testing.T) {
	// A request that waits for an analysis that never comes (debounce of an
	// hour) must end with RequestCancelled when the client cancels it.
	// Rename waits for the analysis of the current text (it edits text).
	e := newFakeEditor(t, map[string]string{"a.kiln": smokeFile}, fakeOptions{debounce: time.Hour})
	e.open("a.kiln")
	// schedules an analysis an hour away (a new statement: an edit of
	// comment lines only would be analysed at once, see Workspace.Quick)
	e.typeAt("a.kiln", 0, "species EDITED C\n")
	errc := make(chan error, 1)
	go func() {
		errc <- e.callErr("textDocument/prepareRename", protocol.TextDocumentPositionParams{TextDocument: textDoc(e, "a.kiln")}, nil)
	}()
	// The client's request ids count from 1: initialize was 1, this is 2.
	deadline := time.After(10 * time.Second)
	for {
		require.NoError(t, e.conn.Notify(context.Background(), "$/cancelRequest", map[string]any{"id": 2}))
		select {
		case err := <-errc:
			var werr *jsonrpc2.Error
			require.True(t, errors.As(err, &werr), "got %v", err)
			assert.Equal(t, jsonrpc2.Code(codeRequestCancelled), werr.Code)
			require.NoError(t, e.shutdown())
			return
		case <-time.After(20 * time.Millisecond):
		case <-deadline:
			t.Fatal("request was not cancelled")
		}
	}
}

func TestSettings(t *testing.T) {
	base := analysis.DefaultSettings()
	s, notes, err := applySettings(base, json.RawMessage(`{"kiln": {"units": "kJ/mol", "tMid": 1200, "mismatchHf298": 2, "mismatchS298": 1.5, "collisionFactor": 3, "estimateNotes": false}}`))
	require.NoError(t, err)
	require.NotNil(t, notes)
	assert.False(t, *notes)
	assert.Equal(t, "kJ/mol", s.DisplayUnits)
	assert.Equal(t, 1200.0, s.TMid)
	// 2 kcal/mol = 8368 J/mol and 1.5 cal/(mol K) = 6.276 J/(mol K) exactly; 1e-9 allows for rounding.
	assert.InDelta(t, 8368, s.MismatchHf298, 1e-9)
	assert.InDelta(t, 6.276, s.MismatchS298, 1e-9)
	assert.Equal(t, 3.0, s.CollisionFactor)
	flat, notes, err := applySettings(base, json.RawMessage(`{"units": "kJ/mol"}`))
	require.NoError(t, err)
	assert.Nil(t, notes, "absent estimateNotes keeps the default")
	assert.Equal(t, "kJ/mol", flat.DisplayUnits)
	for _, bad := range []string{`{"units": "eV"}`, `{"tMid": -1}`, `{"tMid": 6000}`, `{"collisionFactor": 0}`, `[1]`, `{"estimateNotes": "yes"}`} {
		_, _, err := applySettings(base, json.RawMessage(bad))
		assert.Error(t, err, bad)
	}
	// A pressure as text with its unit, as the CLI and files write it; a
	// bare number is bar.
	for in, want := range map[string]float64{`{"pressure": "10atm"}`: 1013250, `{"pressure": "1.5 bar"}`: 150000, `{"pressure": 2}`: 200000} {
		s, _, err := applySettings(base, json.RawMessage(in))
		require.NoError(t, err, in)
		assert.InDelta(t, want, s.Pressure, 1e-6, in)
	}
	// Wrong types are named by key, all at once, without decoder jargon.
	_, _, err = applySettings(base, json.RawMessage(`{"tMid": "hot", "pressure": "10 furlongs"}`))
	require.Error(t, err)
	assert.Contains(t, err.Error(), `tMid must be a number, got "hot"`)
	assert.Contains(t, err.Error(), `unknown unit "furlongs"`)
	assert.NotContains(t, err.Error(), "unmarshal")
}

func TestDidChangeConfiguration(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"a.kiln": smokeFile}, fakeOptions{})
	e.open("a.kiln")
	require.NoError(t, e.conn.Notify(context.Background(), "workspace/didChangeConfiguration",
		map[string]any{"settings": map[string]any{"kiln": map[string]any{"units": "kJ/mol"}}}))
	// Configuration changes re-analyse; the next hover shows kJ/mol first.
	deadline := time.Now().Add(10 * time.Second)
	for time.Now().Before(deadline) {
		var hints []inlayHint
		e.call("textDocument/inlayHint", inlayHintParams{TextDocument: textDoc(e, "a.kiln"), Range: protocol.Range{End: protocol.Position{Line: 99}}}, &hints)
		if len(hints) > 0 && strings.Contains(hints[0].Label, "kJ/mol") {
			require.NoError(t, e.shutdown())
			return
		}
		time.Sleep(10 * time.Millisecond)
	}
	t.Fatal("inlay hints did not switch to kJ/mol")
}

func TestRelatedInformation(t *testing.T) {
	src := "species ethanol CCO\nspecies ethanol OCC\n"
	e := newFakeEditor(t, map[string]string{"d.kiln": src, "inc.kiln": "species H [H]\n"}, fakeOptions{})
	ds := e.open("d.kiln")
	var dup *protocol.Diagnostic
	for i, d := range ds {
		if d.Code == "duplicate-species" {
			dup = &ds[i]
		}
	}
	require.NotNil(t, dup, diagSummary(ds))
	// A name declared twice is an error (issue 14, case 11).
	assert.Equal(t, protocol.DiagnosticSeverityError, dup.Severity)
	require.NotEmpty(t, dup.RelatedInformation)
	rel := dup.RelatedInformation[0]
	assert.Equal(t, e.uri("d.kiln"), rel.Location.URI)
	// The first declaration's name: line 0, UTF-16 columns 8–15.
	assert.Equal(t, protocol.Range{Start: protocol.Position{Line: 0, Character: 8}, End: protocol.Position{Line: 0, Character: 15}}, rel.Location.Range)
	require.NoError(t, e.shutdown())
}

func TestCommentEditPublishesAtOnce(t *testing.T) {
	// A comment line typed between statements only moves positions: it is
	// analysed without waiting for the debounce (an hour here), and the
	// diagnostics after it move down a line. Typing inside that comment
	// then changes no diagnostic: nothing is published.
	src := smokeFile + "species CH3 [CH3]\nspecies ME [CH3]\nreaction H + XY <=> H2   A=1e13 n=0 Ea=0\n"
	e := newFakeEditor(t, map[string]string{"a.kiln": src}, fakeOptions{debounce: time.Hour})
	before := e.open("a.kiln")
	require.NotEmpty(t, before)
	at := strings.Index(src, "species CH3")
	e.typeAt("a.kiln", at, "# a remark\n")
	after := e.waitDiagnostics("a.kiln")
	require.Len(t, after, len(before))
	line := protocol.Position{Line: uint32(strings.Count(src[:at], "\n"))}
	for i, d := range before {
		if d.Range.Start.Line >= line.Line {
			d.Range.Start.Line++
			d.Range.End.Line++
			// a message naming a line after the comment names the moved one
		}
		require.Equal(t, d.Range, after[i].Range, "%s", d.Message)
		require.Equal(t, d.Code, after[i].Code)
	}
	// the same as a fresh analysis of the new text
	fresh := newFakeEditor(t, map[string]string{"a.kiln": e.text("a.kiln")}, fakeOptions{})
	require.Equal(t, diagSummary(fresh.open("a.kiln")), diagSummary(after))
	require.NoError(t, fresh.shutdown())
	pubs := e.publications()
	e.typeAt("a.kiln", at+len("# a"), "nother")
	require.Equal(t, diagSummary(after), diagSummary(e.waitDiagnostics("a.kiln")))
	require.Equal(t, pubs, e.publications(), "unchanged diagnostics are not published again")
	require.NoError(t, e.shutdown())
}

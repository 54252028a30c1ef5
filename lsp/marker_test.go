package lsp

import (
	"encoding/json"
	"fmt"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"unicode"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.lsp.dev/protocol"
	"golang.org/x/tools/txtar"
)

// The marker tests run every testdata/lsp/*.txtar archive against the real
// server through the fake editor. An archive is a small workspace:
//
//	# free comment
//	open: main.kiln other.kiln      (default: the first file)
//	settings: {"units": "kJ/mol"}   (initializationOptions)
//	plaintext: true                 (the client hovers in plain text only)
//	-- main.kiln --
//	species ethanol CCO   #@hover("ethanol", "kJ/mol")
//	-- main.kiln.formatted --        (golden: textDocument/formatting result)
//	-- main.kiln.renamed --          (golden: text after the file's #@rename)
//
// Markers live in comments (`#@name(args)`; several per line). Arguments are
// Go string literals or integers, optionally key=value. A WORD argument
// selects the first occurrence of that text on the marker's line (before the
// marker comment); the request is made at its start (or, for complete, just
// after it).
//
//	#@hover(WORD, SUBSTR..., not=S)     hover text contains every SUBSTR (and not S)
//	#@nohover(WORD)                     no hover
//	#@diag(CODE [, SUBSTR])             a diagnostic CODE (message ∋ SUBSTR) starts on this line
//	#@nodiag(CODE)                      no diagnostic CODE on this line
//	#@def(WORD, FILE, LINETEXT)         definition is in FILE on the line containing LINETEXT
//	#@refs(WORD, N)                     N references including the declaration
//	#@rename(WORD, NEW)                 rename; files with a .renamed golden must match it
//	#@norename(WORD)                    prepareRename refuses
//	#@complete(WORD, LABEL...)          completion after WORD offers every LABEL
//	#@nocomplete(WORD, LABEL)           completion after WORD does not offer LABEL
//	#@hint(WORD, SUBSTR)                an inlay hint on this line contains SUBSTR
//	#@symbol(NAME)                      document symbols include NAME
//	#@wsymbol(QUERY, NAME)              workspace symbols for QUERY include NAME
//	#@fold()                            a folding range starts on this line
//	#@codeaction(WORD, TITLE, contains=S, gone=CODE, kind=K)
//	                                    the action whose title starts with TITLE, for the range of
//	                                    WORD, is offered (kind K), is applied; the file then contains S
//	                                    and has no CODE diagnostic on this line (in the whole file
//	                                    for the fill-all source action)
//	#@nocodeaction(WORD, TITLE)         no such action
func TestMarkers(t *testing.T) {
	archives, err := filepath.Glob("../testdata/lsp/*.txtar")
	require.NoError(t, err)
	require.GreaterOrEqual(t, len(archives), 12, "the marker suite needs its archives")
	for _, a := range archives {
		t.Run(strings.TrimSuffix(filepath.Base(a), ".txtar"), func(t *testing.T) {
			runArchive(t, a)
		})
	}
}

type marker struct {
	name  string
	args  []string
	kw    map[string]string
	file  string
	line  int    // 0-based
	text  string // the line before the first "#@"
	start int    // byte offset of the line in its file
}

func (m marker) String() string {
	return fmt.Sprintf("%s:%d: #@%s(%s)", m.file, m.line+1, m.name, strings.Join(m.args, ", "))
}

// wordOffset returns the offset of the first occurrence of word on the line.
func (m marker) wordOffset(t *testing.T, word string) int {
	i := strings.Index(m.text, word)
	require.GreaterOrEqual(t, i, 0, "%v: %q not found on the line", m, word)
	return m.start + i
}

func runArchive(t *testing.T, name string) {
	ar, err := txtar.ParseFile(name)
	require.NoError(t, err)
	files := map[string]string{}
	goldens := map[string]string{}
	var order []string
	for _, f := range ar.Files {
		switch {
		case strings.HasSuffix(f.Name, ".formatted"), strings.HasSuffix(f.Name, ".renamed"):
			goldens[f.Name] = string(f.Data)
		default:
			files[f.Name] = string(f.Data)
			order = append(order, f.Name)
		}
	}
	require.NotEmpty(t, order)
	opts := fakeOptions{}
	open := []string{order[0]}
	for _, line := range strings.Split(string(ar.Comment), "\n") {
		key, val, ok := strings.Cut(line, ":")
		if !ok || strings.HasPrefix(line, "#") {
			continue
		}
		val = strings.TrimSpace(val)
		switch strings.TrimSpace(key) {
		case "open":
			open = strings.Fields(val)
		case "settings":
			var v any
			require.NoError(t, json.Unmarshal([]byte(val), &v))
			opts.initOptions = v
		case "plaintext":
			opts.plainText = val == "true"
		}
	}
	e := newFakeEditor(t, files, opts)
	for _, f := range open {
		e.open(f)
	}
	for _, f := range open {
		// Markers are re-read after each one: code actions and renames
		// change the text, and the i-th marker stays the i-th marker.
		for i := 0; ; i++ {
			ms := parseMarkers(t, f, e.text(f))
			if i >= len(ms) {
				break
			}
			m := ms[i]
			t.Run(fmt.Sprintf("%s:%d:%s", f, m.line+1, m.name), func(t *testing.T) {
				runMarker(t, e, m, goldens)
			})
		}
		if g, ok := goldens[f+".formatted"]; ok {
			checkFormatting(t, e, f, g)
		}
	}
	require.NoError(t, e.shutdown())
}

func parseMarkers(t *testing.T, file, text string) []marker {
	var out []marker
	start := 0
	for i, line := range strings.SplitAfter(text, "\n") {
		body := line
		for {
			j := strings.Index(body, "#@")
			if j < 0 {
				break
			}
			rest := body[j+2:]
			k := strings.IndexByte(rest, '(')
			require.Greater(t, k, 0, "%s:%d: marker without arguments", file, i+1)
			args, kw, n := parseArgs(t, rest[k+1:], fmt.Sprintf("%s:%d", file, i+1))
			text := line[:strings.Index(line, "#@")]
			out = append(out, marker{name: rest[:k], args: args, kw: kw, file: file, line: i, text: text, start: start})
			body = rest[k+1+n:]
		}
		start += len(line)
	}
	return out
}

// parseArgs reads `"a", 3, key="v")` and returns the values and the bytes used.
func parseArgs(t *testing.T, s, where string) ([]string, map[string]string, int) {
	var args []string
	kw := map[string]string{}
	i := 0
	for {
		for i < len(s) && (s[i] == ' ' || s[i] == ',') {
			i++
		}
		require.Less(t, i, len(s), "%s: unterminated marker", where)
		if s[i] == ')' {
			return args, kw, i + 1
		}
		key := ""
		j := i
		for j < len(s) && (unicode.IsLetter(rune(s[j])) || s[j] == '_') {
			j++
		}
		if j < len(s) && j > i && s[j] == '=' {
			key, i = s[i:j], j+1
		}
		var val string
		if i < len(s) && s[i] == '"' {
			j := i + 1
			for j < len(s) && s[j] != '"' {
				if s[j] == '\\' {
					j++
				}
				j++
			}
			require.Less(t, j, len(s), "%s: unterminated string", where)
			v, err := strconv.Unquote(s[i : j+1])
			require.NoError(t, err, where)
			val, i = v, j+1
		} else {
			j := i
			for j < len(s) && s[j] != ',' && s[j] != ')' {
				j++
			}
			val, i = strings.TrimSpace(s[i:j]), j
		}
		if key != "" {
			kw[key] = val
		} else {
			args = append(args, val)
		}
	}
}

func (m marker) arg(t *testing.T, i int) string {
	require.Greater(t, len(m.args), i, "%v: missing argument %d", m, i+1)
	return m.args[i]
}

func textDoc(e *fakeEditor, f string) protocol.TextDocumentIdentifier {
	return protocol.TextDocumentIdentifier{URI: e.uri(f)}
}

func runMarker(t *testing.T, e *fakeEditor, m marker, goldens map[string]string) {
	f := m.file
	e.waitDiagnostics(f)
	posParams := func(off int) protocol.TextDocumentPositionParams {
		return protocol.TextDocumentPositionParams{TextDocument: textDoc(e, f), Position: e.pos(f, off)}
	}
	switch m.name {
	case "hover":
		h := e.hover(f, m.wordOffset(t, m.arg(t, 0)))
		require.NotEmpty(t, h, "%v: no hover", m)
		for _, s := range m.args[1:] {
			assert.Contains(t, h, s, "%v", m)
		}
		if s, ok := m.kw["not"]; ok {
			assert.NotContains(t, h, s, "%v", m)
		}
	case "nohover":
		assert.Empty(t, e.hover(f, m.wordOffset(t, m.arg(t, 0))), "%v", m)
	case "diag", "nodiag":
		code := m.arg(t, 0)
		found := false
		for _, d := range e.diagnostics(f) {
			if d.Code == code && int(d.Range.Start.Line) == m.line {
				assert.Equal(t, "kiln", d.Source)
				if len(m.args) < 2 || strings.Contains(d.Message, m.args[1]) {
					found = true
				}
			}
		}
		if m.name == "diag" {
			assert.True(t, found, "%v: missing; have %s", m, diagSummary(e.diagnostics(f)))
		} else {
			assert.False(t, found, "%v: present; have %s", m, diagSummary(e.diagnostics(f)))
		}
	case "def":
		var locs []protocol.Location
		e.call("textDocument/definition", posParams(m.wordOffset(t, m.arg(t, 0))), &locs)
		require.Len(t, locs, 1, "%v", m)
		assert.Equal(t, e.uri(m.arg(t, 1)), locs[0].URI, "%v", m)
		want := m.arg(t, 2)
		lines := strings.Split(e.fileText(m.arg(t, 1)), "\n")
		require.Less(t, int(locs[0].Range.Start.Line), len(lines), "%v", m)
		assert.Contains(t, lines[locs[0].Range.Start.Line], want, "%v", m)
	case "refs":
		var locs []protocol.Location
		e.call("textDocument/references", protocol.ReferenceParams{TextDocumentPositionParams: posParams(m.wordOffset(t, m.arg(t, 0))),
			Context: protocol.ReferenceContext{IncludeDeclaration: true}}, &locs)
		n, err := strconv.Atoi(m.arg(t, 1))
		require.NoError(t, err)
		assert.Len(t, locs, n, "%v: %v", m, locs)
	case "rename":
		var prep prepareRenameResult
		e.call("textDocument/prepareRename", posParams(m.wordOffset(t, m.arg(t, 0))), &prep)
		assert.Equal(t, m.arg(t, 0), prep.Placeholder, "%v", m)
		var we protocol.WorkspaceEdit
		e.call("textDocument/rename", protocol.RenameParams{TextDocumentPositionParams: posParams(m.wordOffset(t, m.arg(t, 0))), NewName: m.arg(t, 1)}, &we)
		changed := e.applyEdit(&we)
		require.NotEmpty(t, changed, "%v: no edits", m)
		for _, c := range changed {
			if g, ok := goldens[c+".renamed"]; ok {
				assert.Equal(t, g, e.fileText(c), "%v: %s after rename", m, c)
			}
		}
	case "norename":
		var prep prepareRenameResult
		err := e.callErr("textDocument/prepareRename", posParams(m.wordOffset(t, m.arg(t, 0))), &prep)
		assert.Error(t, err, "%v", m)
	case "complete", "nocomplete":
		w := m.arg(t, 0)
		var list protocol.CompletionList
		e.call("textDocument/completion", protocol.CompletionParams{TextDocumentPositionParams: posParams(m.wordOffset(t, w) + len(w))}, &list)
		labels := map[string]string{}
		for _, it := range list.Items {
			labels[it.Label] = it.Detail
		}
		for _, l := range m.args[1:] {
			if m.name == "complete" {
				assert.Contains(t, labels, l, "%v", m)
			} else {
				assert.NotContains(t, labels, l, "%v", m)
			}
		}
		if d, ok := m.kw["detail"]; ok && len(m.args) > 1 {
			assert.Equal(t, d, labels[m.args[1]], "%v", m)
		}
	case "hint":
		var hints []inlayHint
		full := protocol.Range{End: protocol.Position{Line: 1 << 30}}
		e.call("textDocument/inlayHint", inlayHintParams{TextDocument: textDoc(e, f), Range: full}, &hints)
		found := false
		for _, h := range hints {
			if int(h.Position.Line) == m.line && strings.Contains(h.Label, m.arg(t, 1)) {
				found = true
			}
		}
		assert.True(t, found, "%v: hints %v", m, hints)
	case "symbol":
		var syms []protocol.DocumentSymbol
		e.call("textDocument/documentSymbol", protocol.DocumentSymbolParams{TextDocument: textDoc(e, f)}, &syms)
		var names []string
		for _, s := range syms {
			names = append(names, s.Name)
		}
		assert.Contains(t, names, m.arg(t, 0), "%v", m)
	case "wsymbol":
		var syms []protocol.SymbolInformation
		e.call("workspace/symbol", protocol.WorkspaceSymbolParams{Query: m.arg(t, 0)}, &syms)
		var names []string
		for _, s := range syms {
			names = append(names, s.Name)
		}
		assert.Contains(t, names, m.arg(t, 1), "%v", m)
	case "fold":
		var folds []protocol.FoldingRange
		e.call("textDocument/foldingRange", map[string]any{"textDocument": textDoc(e, f)}, &folds)
		found := false
		for _, fr := range folds {
			if int(fr.StartLine) == m.line && fr.EndLine > fr.StartLine {
				found = true
			}
		}
		assert.True(t, found, "%v: folds %v", m, folds)
	case "codeaction", "nocodeaction":
		w := m.arg(t, 0)
		off := m.wordOffset(t, w)
		var actions []protocol.CodeAction
		e.call("textDocument/codeAction", protocol.CodeActionParams{TextDocument: textDoc(e, f), Range: *e.rangeAt(f, off, off+len(w)),
			Context: protocol.CodeActionContext{Diagnostics: e.diagnostics(f)}}, &actions)
		var pick *protocol.CodeAction
		var titles []string
		for i, a := range actions {
			titles = append(titles, a.Title)
			if strings.HasPrefix(a.Title, m.arg(t, 1)) && pick == nil {
				pick = &actions[i]
			}
		}
		if m.name == "nocodeaction" {
			assert.Nil(t, pick, "%v: offered (%v)", m, titles)
			return
		}
		require.NotNil(t, pick, "%v: not offered; have %v", m, titles)
		if k, ok := m.kw["kind"]; ok {
			assert.Equal(t, k, string(pick.Kind), "%v", m)
		}
		require.NotNil(t, pick.Edit, "%v", m)
		e.applyEdit(pick.Edit)
		e.waitDiagnostics(f)
		if s, ok := m.kw["contains"]; ok {
			assert.Contains(t, e.text(f), s, "%v", m)
		}
		if code, ok := m.kw["gone"]; ok {
			for _, d := range e.diagnostics(f) {
				if int(d.Range.Start.Line) == m.line || code == "missing-thermo" && m.kw["kind"] == "source.fixAll.kiln" {
					assert.NotEqual(t, code, d.Code, "%v: %s still reported: %s", m, code, d.Message)
				}
			}
		}
	default:
		t.Fatalf("%v: unknown marker", m)
	}
}

// fileText returns rel's text in the editor, or on disk when it is not open.
func (e *fakeEditor) fileText(rel string) string {
	e.mu.Lock()
	defer e.mu.Unlock()
	if t, ok := e.texts[e.uri(rel)]; ok {
		return t
	}
	return e.disk[filepath.Join(fakeRoot, rel)]
}

func diagSummary(ds []protocol.Diagnostic) string {
	var parts []string
	for _, d := range ds {
		parts = append(parts, fmt.Sprintf("%d:%v %s", d.Range.Start.Line+1, d.Code, d.Message))
	}
	return "[" + strings.Join(parts, "; ") + "]"
}

// checkFormatting formats f, compares with the golden text, checks that only
// blanks changed, and that formatting again changes nothing.
func checkFormatting(t *testing.T, e *fakeEditor, f, golden string) {
	before := e.text(f)
	var edits []protocol.TextEdit
	e.call("textDocument/formatting", protocol.DocumentFormattingParams{TextDocument: textDoc(e, f)}, &edits)
	e.applyEdit(&protocol.WorkspaceEdit{Changes: map[protocol.DocumentURI][]protocol.TextEdit{e.uri(f): edits}})
	after := e.text(f)
	assert.Equal(t, golden, after, "formatted %s", f)
	assert.Equal(t, strings.Fields(before), strings.Fields(after), "formatting must only change blanks")
	e.waitDiagnostics(f)
	var again []protocol.TextEdit
	e.call("textDocument/formatting", protocol.DocumentFormattingParams{TextDocument: textDoc(e, f)}, &again)
	assert.Empty(t, again, "formatting is idempotent")
}

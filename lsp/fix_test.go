package lsp

import (
	"context"
	"path"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.lsp.dev/protocol"

	"kiln.dev/kiln/analysis"
)

const fixFile = `# species without thermo blocks; the fill action must cover them all
species ethanol CCO
species propane CCC
species acetone CC(C)=O
species propene C=CC
species allyl [CH2]C=C
species acetaldehyde CC=O
species dimethyl-ether COC
species H [H]
reaction propane + H <=> propene + H + H   A=1e13 n=0 Ea=10`

// TestFillAllThenAnalyse applies the fill-all source action the way an
// editor does and checks that the file then has no missing-thermo
// diagnostic and that every inserted block reproduces the estimate.
func TestFillAllThenAnalyse(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"fix.kiln": fixFile}, fakeOptions{})
	before := e.open("fix.kiln")
	n := 0
	for _, d := range before {
		if d.Code == "missing-thermo" {
			n++
		}
	}
	require.Equal(t, 8, n, "every species lacks a block before the fix: %s", diagSummary(before))

	var actions []protocol.CodeAction
	e.call("textDocument/codeAction", protocol.CodeActionParams{
		TextDocument: textDoc(e, "fix.kiln"),
		Range:        protocol.Range{End: protocol.Position{Line: 100}},
		Context:      protocol.CodeActionContext{Only: []protocol.CodeActionKind{"source"}},
	}, &actions)
	require.Len(t, actions, 1, "only the source action passes the `source` filter")
	require.Equal(t, "Fill all missing thermo blocks", actions[0].Title)
	e.applyEdit(actions[0].Edit)
	after := e.waitDiagnostics("fix.kiln")
	for _, d := range after {
		assert.NotEqual(t, "missing-thermo", d.Code, d.Message)
	}
	text := e.text("fix.kiln")
	// Edits are insertions: every original line survives in order.
	rest := text
	for _, line := range strings.Split(fixFile, "\n") {
		i := strings.Index(rest, line)
		require.GreaterOrEqual(t, i, 0, "original line %q lost", line)
		rest = rest[i+len(line):]
	}

	// Analyse the fixed text independently of the server.
	p := path.Join(fakeRoot, "fix.kiln")
	ws := analysis.NewWorkspace(fakeRoot, func(string) ([]byte, error) { return nil, context.Canceled }, analysis.DefaultSettings())
	ws.SetOverlay(p, []byte(text))
	ctx, cancel := context.WithTimeout(context.Background(), time.Minute)
	defer cancel()
	r, err := ws.Analyze(ctx, p)
	require.NoError(t, err)
	checked := 0
	for _, sp := range r.Species {
		require.NotNil(t, sp.Given, "%s has a block now", sp.Name)
		require.NotNil(t, sp.Given.Poly, "%s has a nasa7 block", sp.Name)
		require.NotNil(t, sp.Estimate, "%s is estimable", sp.Name)
		// The block is written at ~10 significant digits: H(298.15 K) from it
		// must match the estimate's ΔHf°298 to 0.01 kJ/mol (10 J/mol).
		assert.InDelta(t, sp.Estimate.Hf298, sp.Given.Poly.H(298.15), 10, "%s ΔHf°298 J/mol", sp.Name)
		// and S°298 to 0.01 J/(mol K).
		assert.InDelta(t, sp.Estimate.S298, sp.Given.Poly.S(298.15), 0.01, "%s S°298", sp.Name)
		checked++
	}
	assert.Equal(t, 8, checked)
	require.NoError(t, e.shutdown())
}

// TestIncludedFileChange: editing an included file that is open re-analyses
// the open files that include it.
func TestIncludedFileChange(t *testing.T) {
	files := map[string]string{
		"main.kiln": "include core.kiln\nreaction H + H <=> H2   A=1e14 n=0 Ea=0\n",
		"core.kiln": "species H [H]\nspecies H2 [H][H]\n",
	}
	e := newFakeEditor(t, files, fakeOptions{})
	for _, d := range e.open("main.kiln") {
		assert.NotEqual(t, "undeclared-species", d.Code, d.Message)
	}
	e.open("core.kiln")
	// Rename H2 to HH in core.kiln (not saved): main.kiln must now see H2 undeclared.
	text := e.text("core.kiln")
	i := strings.Index(text, "H2 ")
	e.change("core.kiln", contentChange{Range: e.rangeAt("core.kiln", i, i+2), Text: "HH"})
	deadline := time.Now().Add(20 * time.Second)
	for time.Now().Before(deadline) {
		for _, d := range e.diagnostics("main.kiln") {
			if d.Code == "undeclared-species" && strings.Contains(d.Message, "H2") {
				require.NoError(t, e.shutdown())
				return
			}
		}
		time.Sleep(10 * time.Millisecond)
	}
	t.Fatalf("main.kiln was not re-analysed: %s", diagSummary(e.diagnostics("main.kiln")))
}

package lsp

import (
	"context"
	"encoding/json"
	"errors"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"

	"kiln.dev/kiln/analysis"
)

// flameFile declares the reference library's C/H/O/N combustion products
// (their thermo comes from engine/reflib) and one lump that cannot take part.
const flameFile = `# methane flame, equilibrium command test
species CH4 C
species O2 O=O
species N2 N#N
species H2O O
species CO2 O=C=O
species CO [C-]#[O+]
species OH [OH]
species H [H]
species O [O]
species H2 [H][H]
species NO [N]=O
species soot-lump
  composition C20H10
`

// flatFile: products without heat capacity cannot hold the energy released,
// so no adiabatic temperature up to 6000 K exists.
const flatFile = `species X
  composition C
  nasa7 300 1000 6000
    low  0 0 0 0 0 0 10
    high 0 0 0 0 0 0 10
    source test: no heat capacity
species Y
  composition C
  nasa7 300 1000 6000
    low  0 0 0 0 0 -120000 10
    high 0 0 0 0 0 -120000 10
    source test: no heat capacity
`

type equilibriumReply struct {
	Text     string         `json:"text"`
	Result   map[string]any `json:"result"`
	Warnings []string       `json:"warnings"`
}

func (e *fakeEditor) equilibrium(args map[string]any) (equilibriumReply, error) {
	var r equilibriumReply
	err := e.callErr("workspace/executeCommand", protocol.ExecuteCommandParams{Command: "kiln.equilibrium", Arguments: []any{args}}, &r)
	return r, err
}

// TestEquilibriumCommand: kiln.equilibrium answers with the text and the
// JSON of analysis.Result.Equilibrium (what `kiln equilibrium` prints; the
// CLI itself is compared in cmd/kiln's TestEquilibriumEditorCommandMatchesCLI),
// computed from the document's analysis in the editor, not the disk.
func TestEquilibriumCommand(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"air.kiln": flameFile}, fakeOptions{})
	e.open("air.kiln")
	mix := "CH4:1, O2:2, N2:7.52"
	r, err := e.equilibrium(map[string]any{"uri": e.uri("air.kiln"), "mix": mix, "temperature": 298.15, "pressure": "1atm", "adiabatic": true})
	require.NoError(t, err)
	T := r.Result["temperature_k"].(float64)
	// Stoichiometric methane–air from 298.15 K at 1 atm: ≈ 2225 K (common
	// practice), as the CLI test allows ±10 K.
	assert.InDelta(t, 2225, T, 10)
	assert.Equal(t, "air.kiln", r.Result["file"], "shown relative to the workspace root")
	// The lump without thermo is an error of the file (missing-thermo), said
	// as `kiln equilibrium` says it on stderr.
	assert.Equal(t, []string{"air.kiln has 1 error(s); broken statements were left out"}, r.Warnings)

	// The same question asked of the analysis directly gives the same text
	// and numbers.
	ws := analysis.NewWorkspace(fakeRoot, func(string) ([]byte, error) { return []byte(flameFile), nil }, analysis.DefaultSettings())
	res, err := ws.Analyze(context.Background(), fakeRoot+"/air.kiln")
	require.NoError(t, err)
	m, err := analysis.ParseMix(mix)
	require.NoError(t, err)
	want, err := res.Equilibrium(context.Background(), analysis.EquilibriumRequest{Mix: m, T: 298.15, P: 101325, Adiabatic: true,
		Display: func(string) string { return "air.kiln" }})
	require.NoError(t, err)
	assert.Equal(t, want.Text(), r.Text)
	assert.Contains(t, r.Text, "Equilibrium of air.kiln, adiabatic at constant pressure")
	assert.Contains(t, r.Text, "not included: soot-lump: no thermochemistry")
	assert.InEpsilon(t, want.Temperature, T, 1e-11)

	// Defaults: 298.15 K, 1 atm, temperature held; temperature as text.
	r, err = e.equilibrium(map[string]any{"uri": e.uri("air.kiln"), "mix": "H2O:1", "temperature": "2500K"})
	require.NoError(t, err)
	assert.Equal(t, 2500.0, r.Result["temperature_k"])
	assert.Equal(t, 101325.0, r.Result["pressure_pa"])
	assert.Equal(t, false, r.Result["adiabatic"])
	// Constant volume: hotter than at constant pressure, pressure about ninefold.
	r, err = e.equilibrium(map[string]any{"uri": e.uri("air.kiln"), "mix": mix, "adiabatic": true, "volume": true})
	require.NoError(t, err)
	assert.Greater(t, r.Result["temperature_k"].(float64), T+300)
	assert.Contains(t, r.Text, "adiabatic at constant volume")

	// The command works on the editor's text: an edit that removes CO2
	// changes the answer once analysed.
	text := e.text("air.kiln")
	i := indexOf(t, text, "species CO2 O=C=O\n")
	e.change("air.kiln", contentChange{Range: e.rangeAt("air.kiln", i, i+len("species CO2 O=C=O\n"))})
	e.waitDiagnostics("air.kiln")
	r, err = e.equilibrium(map[string]any{"uri": e.uri("air.kiln"), "mix": mix, "adiabatic": true})
	require.NoError(t, err)
	assert.Less(t, r.Result["temperature_k"].(float64), T-300, "without CO2 the carbon stays as CO")
	require.NoError(t, e.shutdown())
}

func indexOf(t *testing.T, s, sub string) int {
	t.Helper()
	for i := 0; i+len(sub) <= len(s); i++ {
		if s[i:i+len(sub)] == sub {
			return i
		}
	}
	t.Fatalf("%q not in text", sub)
	return -1
}

// TestEquilibriumCommandErrors: every mistake comes back as an error with
// the CLI's message; input mistakes are InvalidParams (with the item and
// column of the mixture), a file that cannot give an answer RequestFailed.
func TestEquilibriumCommandErrors(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"air.kiln": flameFile, "flat.kiln": flatFile}, fakeOptions{})
	e.open("air.kiln")
	e.open("flat.kiln")
	air := e.uri("air.kiln")
	for _, c := range []struct {
		args map[string]any
		code jsonrpc2.Code
		msg  string
	}{
		{map[string]any{"uri": air}, jsonrpc2.InvalidParams, `kiln equilibrium: mix is required, e.g. "CH4:1, O2:2, N2:7.52"`},
		{map[string]any{"uri": air, "mix": "CH4:1, O2"}, jsonrpc2.InvalidParams, `mix item 2 (column 8) "O2" must be NAME:AMOUNT`},
		{map[string]any{"uri": air, "mix": "CH4:1, O2:0"}, jsonrpc2.InvalidParams, "amount of O2 must be a positive number"},
		{map[string]any{"uri": air, "mix": "CH4:1", "pressure": "1"}, jsonrpc2.InvalidParams, `pressure: pressure "1" needs a unit`},
		{map[string]any{"uri": air, "mix": "CH4:1", "pressure": 101325}, jsonrpc2.InvalidParams, "needs a unit"},
		{map[string]any{"uri": air, "mix": "CH4:1", "temperature": 50}, jsonrpc2.InvalidParams, "temperature must be in K between 200 and 6000"},
		{map[string]any{"uri": air, "mix": "CH4:1", "temperature": true}, jsonrpc2.InvalidParams, "temperature must be in K"},
		{map[string]any{"uri": air, "mix": "C3H8:1, O2:5"}, codeRequestFailed, "kiln equilibrium: mix species C3H8 is not declared in air.kiln"},
		{map[string]any{"uri": air, "mix": "soot-lump:1, O2:20"}, codeRequestFailed,
			"mix species soot-lump cannot take part: no thermochemistry (no block and no estimate) (declared at air.kiln:13:9)"},
		{map[string]any{"uri": e.uri("flat.kiln"), "mix": "X:1", "adiabatic": true}, codeRequestFailed, "adiabatic temperature is above 6000 K"},
		{map[string]any{"uri": e.uri("closed.kiln"), "mix": "X:1"}, jsonrpc2.InvalidParams, "not open"},
		{map[string]any{"mix": "X:1"}, jsonrpc2.InvalidParams, "uri is required"},
		{map[string]any{"uri": air, "mix": "CH4:1", "adiabtic": true}, jsonrpc2.InvalidParams, `unknown field "adiabtic"`},
		{map[string]any{"uri": air, "mix": 3}, jsonrpc2.InvalidParams, "kiln.equilibrium argument"},
	} {
		_, err := e.equilibrium(c.args)
		var werr *jsonrpc2.Error
		if assert.True(t, errors.As(err, &werr), "%v: got %v", c.args, err) {
			assert.Equal(t, c.code, werr.Code, "%v: %s", c.args, werr.Message)
			assert.Contains(t, werr.Message, c.msg, "%v", c.args)
		}
	}
	// Unknown command, wrong argument count.
	err := e.callErr("workspace/executeCommand", protocol.ExecuteCommandParams{Command: "kiln.nothing"}, nil)
	assert.ErrorContains(t, err, `unknown command "kiln.nothing"`)
	err = e.callErr("workspace/executeCommand", protocol.ExecuteCommandParams{Command: "kiln.equilibrium"}, nil)
	assert.ErrorContains(t, err, "takes one argument")
	// The server is still alive and answers.
	_, err = e.equilibrium(map[string]any{"uri": air, "mix": "H2O:1", "temperature": 3000})
	require.NoError(t, err)
	require.NoError(t, e.shutdown())
}

// TestEquilibriumCommandLatestSnapshot: the command does not wait for an
// analysis in progress; it answers from the latest finished one and says so.
func TestEquilibriumCommandLatestSnapshot(t *testing.T) {
	e := newFakeEditor(t, map[string]string{"air.kiln": flameFile}, fakeOptions{debounce: time.Hour})
	e.open("air.kiln")
	e.typeAt("air.kiln", 0, "species CH3 [CH3]\n") // analysed an hour from now
	done := make(chan struct{})
	var r equilibriumReply
	var err error
	go func() {
		defer close(done)
		r, err = e.equilibrium(map[string]any{"uri": e.uri("air.kiln"), "mix": "CH4:1, O2:2, N2:7.52", "adiabatic": true})
	}()
	select {
	case <-done:
	case <-time.After(20 * time.Second):
		t.Fatal("the command waited for the pending analysis")
	}
	require.NoError(t, err)
	assert.NotContains(t, r.Text, "CH3 ", "species typed since the analysis are not used")
	require.Len(t, r.Warnings, 2)
	assert.Contains(t, r.Warnings[1], "before the latest edits")
}

// TestEquilibriumCodeLens: one lens on the first species statement whose
// command is the editor's kiln.showEquilibrium with the document's URI;
// the server advertises the lens and its own command.
func TestEquilibriumCodeLens(t *testing.T) {
	files := map[string]string{"air.kiln": "# header\nunits kJ/mol\n" + flameFile, "empty.kiln": "# nothing here\n"}
	e := newFakeEditor(t, files, fakeOptions{})
	e.open("air.kiln")
	e.open("empty.kiln")
	var lenses []struct {
		Range   protocol.Range `json:"range"`
		Command struct {
			Title     string           `json:"title"`
			Command   string           `json:"command"`
			Arguments []map[string]any `json:"arguments"`
		} `json:"command"`
	}
	e.call("textDocument/codeLens", protocol.CodeLensParams{TextDocument: textDoc(e, "air.kiln")}, &lenses)
	require.Len(t, lenses, 1)
	// Line 4 (0-based 3) is the first species line ("species CH4 C"), after
	// two comment lines and the units line; the lens covers its keyword.
	assert.Equal(t, protocol.Range{Start: protocol.Position{Line: 3, Character: 0}, End: protocol.Position{Line: 3, Character: 7}}, lenses[0].Range)
	assert.Equal(t, "Equilibrium / flame temperature…", lenses[0].Command.Title)
	assert.Equal(t, "kiln.showEquilibrium", lenses[0].Command.Command)
	require.Len(t, lenses[0].Command.Arguments, 1)
	assert.Equal(t, string(e.uri("air.kiln")), lenses[0].Command.Arguments[0]["uri"])

	e.call("textDocument/codeLens", protocol.CodeLensParams{TextDocument: textDoc(e, "empty.kiln")}, &lenses)
	assert.Empty(t, lenses, "no species, no lens")
	require.NoError(t, e.shutdown())
}

func TestEquilibriumCapabilities(t *testing.T) {
	caps := serverCapabilities()
	assert.Equal(t, map[string]any{"commands": []string{"kiln.equilibrium"}}, caps["executeCommandProvider"])
	assert.Equal(t, map[string]any{"resolveProvider": false}, caps["codeLensProvider"])
	b, err := json.Marshal(caps)
	require.NoError(t, err)
	assert.Contains(t, string(b), `"executeCommandProvider":{"commands":["kiln.equilibrium"]}`)
}

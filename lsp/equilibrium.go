package lsp

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"path/filepath"
	"strings"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
	"kiln.dev/kiln/internal/jsonnum"
)

// Commands. kiln.equilibrium is executed by the server
// (workspace/executeCommand); kiln.showEquilibrium is the editor plugins'
// command that the code lens invokes: it asks for the mixture and then calls
// kiln.equilibrium.
const (
	commandEquilibrium     = "kiln.equilibrium"
	commandShowEquilibrium = "kiln.showEquilibrium"
)

// codeRequestFailed is the LSP 3.17 RequestFailed error code: the request
// was valid but could not be answered (no equilibrium could be computed).
const codeRequestFailed = -32803

// equilibriumArgs is the one argument of kiln.equilibrium. The inputs are
// written as for `kiln equilibrium` (analysis.ParseMix, …):
//
//	uri          the open kiln document whose species and thermo are used
//	mix          "CH4:1, O2:2, N2:7.52" (required)
//	temperature  initial temperature, a number or "298.15K" (default 298.15)
//	pressure     initial pressure with its unit, "1atm", "10 bar" (default 1 atm)
//	adiabatic    find the flame temperature (else hold the temperature)
//	volume       hold the volume instead of the pressure
type equilibriumArgs struct {
	URI         protocol.DocumentURI `json:"uri"`
	Mix         string               `json:"mix"`
	Temperature json.RawMessage      `json:"temperature,omitempty"`
	Pressure    json.RawMessage      `json:"pressure,omitempty"`
	Adiabatic   bool                 `json:"adiabatic"`
	Volume      bool                 `json:"volume"`
}

// equilibriumAnswer is kiln.equilibrium's result: the text that
// `kiln equilibrium` prints, the result in the keys of its --json output,
// and warnings about the file (errors in it, an analysis older than the
// editor's text).
type equilibriumAnswer struct {
	Text     string          `json:"text"`
	Result   json.RawMessage `json:"result"`
	Warnings []string        `json:"warnings"`
}

func (s *server) executeCommand(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.ExecuteCommandParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	switch p.Command {
	case commandEquilibrium:
		if len(p.Arguments) != 1 {
			return nil, jsonrpc2.NewError(jsonrpc2.InvalidParams, fmt.Sprintf("%s takes one argument {uri, mix, temperature, pressure, adiabatic, volume}, not %d", commandEquilibrium, len(p.Arguments)))
		}
		b, err := json.Marshal(p.Arguments[0])
		if err != nil {
			return nil, jsonrpc2.NewError(jsonrpc2.InvalidParams, err.Error())
		}
		// A misspelt key is an error, not a default silently applied.
		dec := json.NewDecoder(bytes.NewReader(b))
		dec.DisallowUnknownFields()
		var a equilibriumArgs
		if err := dec.Decode(&a); err != nil {
			return nil, jsonrpc2.NewError(jsonrpc2.InvalidParams, fmt.Sprintf("%s argument: %v (keys: uri, mix, temperature, pressure, adiabatic, volume)", commandEquilibrium, err))
		}
		return s.equilibrium(ctx, a)
	}
	return nil, jsonrpc2.NewError(jsonrpc2.InvalidParams, fmt.Sprintf("unknown command %q (kiln runs %s)", p.Command, commandEquilibrium))
}

// equilibrium answers kiln.equilibrium from the latest finished analysis of
// the document, with analysis.Result.Equilibrium, the code `kiln
// equilibrium` runs. Input mistakes are InvalidParams errors, a file that
// cannot give an equilibrium a RequestFailed error; both carry the message
// the CLI prints.
func (s *server) equilibrium(ctx context.Context, a equilibriumArgs) (any, error) {
	invalid := func(err error) error {
		return jsonrpc2.NewError(jsonrpc2.InvalidParams, "kiln equilibrium: "+err.Error())
	}
	if a.URI == "" {
		return nil, invalid(errors.New("uri is required"))
	}
	req := analysis.EquilibriumRequest{T: analysis.DefaultEquilibriumTemperature, P: analysis.DefaultEquilibriumPressure,
		Adiabatic: a.Adiabatic, ConstantVolume: a.Volume, Display: s.displayPath}
	var err error
	if req.Mix, err = analysis.ParseMix(a.Mix); err != nil {
		return nil, invalid(err)
	}
	if t, ok := jsonText(a.Temperature); ok {
		if req.T, err = analysis.ParseEquilibriumTemperature(t); err != nil {
			return nil, invalid(err)
		}
	}
	if p, ok := jsonText(a.Pressure); ok {
		if req.P, err = analysis.ParseEquilibriumPressure(p); err != nil {
			return nil, invalid(err)
		}
	}
	v, err := s.view(ctx, a.URI)
	if err != nil {
		return nil, err
	}
	res := v.snap.result
	out, err := res.Equilibrium(ctx, req)
	if err != nil {
		if ctx.Err() != nil {
			return nil, ctx.Err()
		}
		var ie *analysis.InputError
		if errors.As(err, &ie) {
			return nil, invalid(err)
		}
		return nil, jsonrpc2.NewError(codeRequestFailed, "kiln equilibrium: "+err.Error())
	}
	js, err := jsonnum.Marshal(out)
	if err != nil {
		return nil, fmt.Errorf("equilibrium result: %w", err)
	}
	ans := equilibriumAnswer{Text: out.Text(), Result: json.RawMessage(js), Warnings: []string{}}
	if n := res.ErrorCount(); n > 0 {
		ans.Warnings = append(ans.Warnings, fmt.Sprintf("%s has %d error(s); broken statements were left out", out.File, n))
	}
	if v.stale() {
		ans.Warnings = append(ans.Warnings, "computed from the file as it was before the latest edits (their analysis has not finished)")
	}
	return ans, nil
}

// jsonText returns a JSON string's text or a number's literal; ok is false
// for an absent or null value (the default applies).
func jsonText(raw json.RawMessage) (string, bool) {
	t := strings.TrimSpace(string(raw))
	if t == "" || t == "null" {
		return "", false
	}
	var str string
	if err := json.Unmarshal(raw, &str); err == nil {
		return str, true
	}
	return t, true // a number's literal; anything else is refused by the caller's parser
}

// displayPath shows a file relative to the workspace root when it is inside
// it, as `kiln equilibrium` run from the root shows it.
func (s *server) displayPath(path string) string {
	s.mu.Lock()
	root := ""
	if s.ws != nil {
		root = s.ws.Root()
	}
	s.mu.Unlock()
	if root == "" || !filepath.IsAbs(path) {
		return path
	}
	rel, err := filepath.Rel(root, path)
	if err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
		return path
	}
	return rel
}

// codeLensItem is a CodeLens with its command (protocol.CodeLens's
// arguments are loosely typed).
type codeLensItem struct {
	Range   protocol.Range    `json:"range"`
	Command *protocol.Command `json:"command,omitempty"`
}

// codeLens offers the equilibrium calculation on the file's first species
// (or include) statement; the lens runs the editor's kiln.showEquilibrium
// command with the document's URI.
func (s *server) codeLens(ctx context.Context, raw json.RawMessage) (any, error) {
	var p protocol.CodeLensParams
	if err := decode(raw, &p); err != nil {
		return nil, err
	}
	v, err := s.view(ctx, p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	out := []codeLensItem{}
	sp, ok := ide.EquilibriumLens(v.file)
	if !ok {
		return out, nil
	}
	r, ok := v.rangeOf(sp)
	if !ok {
		return out, nil // the keyword was edited since the analysis
	}
	out = append(out, codeLensItem{Range: r, Command: &protocol.Command{
		Title: ide.EquilibriumLensTitle, Command: commandShowEquilibrium,
		Arguments: []any{map[string]any{"uri": v.doc.uri}},
	}})
	return out, nil
}

package main

import (
	"context"
	"encoding/json"
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
	"go.lsp.dev/uri"
)

// pipeStream is one side of an in-process stdio connection.
type pipeStream struct {
	io.Reader
	io.WriteCloser
}

// TestEquilibriumEditorCommandMatchesCLI runs `kiln serve` as an editor
// sees it (LSP over its stdin/stdout) and asks its kiln.equilibrium command
// what `kiln equilibrium` is asked on the same file: the text is identical
// byte for byte, the JSON result equal, and the errors carry the same
// message (the editor's names the input "mix" where the CLI's names the
// flag "--mix").
func TestEquilibriumEditorCommandMatchesCLI(t *testing.T) {
	f := writeTemp(t, "air.kiln", airFile)
	dir := filepath.Dir(f)
	t.Chdir(dir) // the CLI shows the file relative to the working directory, the server to the workspace root

	inR, inW := io.Pipe()
	outR, outW := io.Pipe()
	var stderr strings.Builder
	done := make(chan int, 1)
	go func() {
		done <- run(env{stdin: inR, stdout: outW, stderr: &stderr, now: func() string { return "2026-12-01" }}, []string{"serve"})
		outW.Close()
	}()
	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	conn := jsonrpc2.NewConn(jsonrpc2.NewStream(pipeStream{outR, inW}))
	conn.Go(ctx, func(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
		if _, ok := req.(*jsonrpc2.Call); ok {
			return reply(ctx, nil, nil)
		}
		return nil
	})
	defer conn.Close()
	call := func(method string, params, result any) error {
		_, err := conn.Call(ctx, method, params, result)
		return err
	}
	require.NoError(t, call("initialize", map[string]any{"processId": 1, "rootUri": string(uri.File(dir)), "capabilities": map[string]any{}}, nil))
	require.NoError(t, conn.Notify(ctx, "initialized", map[string]any{}))
	text, err := os.ReadFile(f)
	require.NoError(t, err)
	u := uri.File(f)
	require.NoError(t, conn.Notify(ctx, "textDocument/didOpen", protocol.DidOpenTextDocumentParams{
		TextDocument: protocol.TextDocumentItem{URI: u, LanguageID: "kiln", Version: 1, Text: string(text)}}))

	type answer struct {
		Text     string         `json:"text"`
		Result   map[string]any `json:"result"`
		Warnings []string       `json:"warnings"`
	}
	exec := func(args map[string]any) (answer, error) {
		args["uri"] = u
		var a answer
		err := call("workspace/executeCommand", map[string]any{"command": "kiln.equilibrium", "arguments": []any{args}}, &a)
		return a, err
	}
	for _, c := range []struct {
		flags []string
		args  map[string]any
	}{
		{[]string{"--mix", "CH4:1, O2:2, N2:7.52", "--temperature", "298.15", "--pressure", "1atm", "--adiabatic"},
			map[string]any{"mix": "CH4:1, O2:2, N2:7.52", "temperature": "298.15", "pressure": "1atm", "adiabatic": true}},
		{[]string{"--mix", "CH4:1, O2:2, N2:7.52", "--adiabatic", "--volume"},
			map[string]any{"mix": "CH4:1, O2:2, N2:7.52", "adiabatic": true, "volume": true}},
		{[]string{"--mix", "H2O:1, N2:1", "--temperature", "2800", "--pressure", "0.1bar"},
			map[string]any{"mix": "H2O:1, N2:1", "temperature": 2800, "pressure": "0.1bar"}},
	} {
		code, cliText, cliErr := runKiln(t, append([]string{"equilibrium", "air.kiln"}, c.flags...)...)
		require.Equal(t, exitOK, code, cliErr)
		code, cliJSON, _ := runKiln(t, append([]string{"equilibrium", "air.kiln", "--json"}, c.flags...)...)
		require.Equal(t, exitOK, code)
		var want map[string]any
		require.NoError(t, json.Unmarshal([]byte(cliJSON), &want))

		got, err := exec(c.args)
		require.NoError(t, err, "%v", c.flags)
		assert.Equal(t, cliText, got.Text, "%v", c.flags)
		assert.Equal(t, want, got.Result, "%v", c.flags)
		// The CLI's stderr note about the file's errors is the editor's warning.
		require.Len(t, got.Warnings, 1)
		assert.Contains(t, cliErr, got.Warnings[0][:strings.Index(got.Warnings[0], ";")])
	}
	for _, c := range []struct {
		flags []string
		args  map[string]any
	}{
		{[]string{"--mix", "C3H8:1, O2:5"}, map[string]any{"mix": "C3H8:1, O2:5"}},
		{[]string{"--mix", "soot-lump:1, O2:20"}, map[string]any{"mix": "soot-lump:1, O2:20"}},
		{[]string{"--mix", "CH4:1,  O2"}, map[string]any{"mix": "CH4:1,  O2"}},
		{[]string{"--mix", "CH4:1", "--pressure", "3psi"}, map[string]any{"mix": "CH4:1", "pressure": "3psi"}},
	} {
		_, _, cliErr := runKiln(t, append([]string{"equilibrium", "air.kiln"}, c.flags...)...)
		_, err := exec(c.args)
		var werr *jsonrpc2.Error
		require.True(t, errors.As(err, &werr), "%v: %v", c.flags, err)
		first := strings.TrimSpace(strings.SplitN(cliErr, "\n", 2)[0])
		assert.Equal(t, strings.Replace(first, "--", "", 1), werr.Message, "%v", c.flags)
	}

	require.NoError(t, call("shutdown", nil, nil))
	require.NoError(t, conn.Notify(ctx, "exit", nil))
	select {
	case code := <-done:
		assert.Equal(t, exitOK, code, stderr.String())
	case <-time.After(10 * time.Second):
		t.Fatal("serve did not exit")
	}
	inW.Close()
}

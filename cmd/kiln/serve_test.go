package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// frame writes one LSP message with its Content-Length header.
func frame(w io.Writer, msg map[string]any) {
	b, _ := json.Marshal(msg)
	fmt.Fprintf(w, "Content-Length: %d\r\n\r\n%s", len(b), b)
}

// TestServeExits: `kiln serve` ends after shutdown and exit even though its
// input stays open (an editor keeps the pipe until the process is gone), with
// code 0; a bare exit gives code 1.
func TestServeExits(t *testing.T) {
	for _, shutdown := range []bool{true, false} {
		in, inW := io.Pipe()
		var out, errb bytes.Buffer
		done := make(chan int, 1)
		go func() {
			done <- run(env{stdin: in, stdout: &out, stderr: &errb, now: func() string { return "2026-12-01" }}, []string{"serve"})
		}()
		frame(inW, map[string]any{"jsonrpc": "2.0", "id": 1, "method": "initialize", "params": map[string]any{"capabilities": map[string]any{}}})
		frame(inW, map[string]any{"jsonrpc": "2.0", "method": "initialized", "params": map[string]any{}})
		if shutdown {
			frame(inW, map[string]any{"jsonrpc": "2.0", "id": 2, "method": "shutdown"})
		}
		frame(inW, map[string]any{"jsonrpc": "2.0", "method": "exit"})
		select {
		case code := <-done:
			want := 1
			if shutdown {
				want = 0
			}
			assert.Equal(t, want, code, "shutdown=%v stderr=%s", shutdown, errb.String())
			require.Contains(t, out.String(), `"capabilities"`, "initialize was answered on stdout")
			if shutdown {
				// Editors show stderr as errors: a clean session writes nothing there.
				assert.Empty(t, errb.String(), "stderr of a clean session")
			}
		case <-time.After(10 * time.Second):
			t.Fatalf("serve did not exit (shutdown=%v)", shutdown)
		}
		inW.Close()
	}
}

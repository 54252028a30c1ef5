package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
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

// TestServeMemoryLimit: --memory-limit reads sizes with decimal and binary
// units, "off" lifts any limit, no flag sets nothing, and anything else is a
// usage error.
func TestServeMemoryLimit(t *testing.T) {
	for _, c := range []struct {
		flag string
		want int64
		set  bool
	}{
		{"", 0, false},
		{"off", math.MaxInt64, true},
		{"600MiB", 600 << 20, true},
		{"1GiB", 1 << 30, true},
		{"800MB", 800e6, true},
		{"512 KiB", 512 << 10, true},
		{"123456789", 123456789, true},
		{"300B", 300, true},
	} {
		got, set, err := serveMemoryLimit(c.flag)
		require.NoError(t, err, c.flag)
		assert.Equal(t, c.want, got, c.flag)
		assert.Equal(t, c.set, set, c.flag)
	}
	for _, bad := range []string{"lots", "-5MiB", "0", "1.5GiB", "MiB", "9999999999GiB"} {
		_, _, err := serveMemoryLimit(bad)
		var u usageError
		assert.ErrorAs(t, err, &u, bad)
	}
}

package lsp

import (
	"context"
	"encoding/json"
	"fmt"
	"net"
	"testing"
	"time"

	"go.uber.org/zap"
)

// rawClient drives a server with hand-made frames, so that bodies need not
// be valid JSON-RPC.
type rawClient struct {
	conn      net.Conn
	responses chan map[string]json.RawMessage
}

func newRawClient(t *testing.T) (*rawClient, chan error) {
	server, client := net.Pipe()
	done := make(chan error, 1)
	ctx, cancel := context.WithCancel(context.Background())
	t.Cleanup(cancel)
	go func() {
		done <- Serve(ctx, server, zap.NewNop(), Options{Root: fakeRoot, Loader: func(p string) ([]byte, error) {
			return nil, fmt.Errorf("no file %s", p)
		}, Debounce: time.Millisecond})
	}()
	c := &rawClient{conn: client, responses: make(chan map[string]json.RawMessage, 64)}
	in := newStream(client, zap.NewNop())
	go func() {
		for {
			body, _, err := in.readFrame()
			if err != nil {
				close(c.responses)
				return
			}
			var m map[string]json.RawMessage
			if json.Unmarshal(body, &m) == nil {
				if _, ok := m["id"]; ok {
					c.responses <- m
				}
			}
		}
	}()
	t.Cleanup(func() { client.Close() })
	return c, done
}

func (c *rawClient) send(t *testing.T, body []byte) {
	if _, err := fmt.Fprintf(c.conn, "Content-Length: %d\r\n\r\n%s", len(body), body); err != nil {
		t.Fatalf("write: %v", err)
	}
}

func (c *rawClient) sendJSON(t *testing.T, v any) {
	b, err := json.Marshal(v)
	if err != nil {
		t.Fatal(err)
	}
	c.send(t, b)
}

// await waits for the response with the given JSON id.
func (c *rawClient) await(t *testing.T, id string) map[string]json.RawMessage {
	timeout := time.After(20 * time.Second)
	for {
		select {
		case m, ok := <-c.responses:
			if !ok {
				t.Fatalf("connection closed while waiting for response %s", id)
			}
			if string(m["id"]) == id {
				return m
			}
		case <-timeout:
			t.Fatalf("no response %s: server unresponsive", id)
		}
	}
}

// FuzzServer sends an arbitrary message body and an arbitrary incremental
// edit to a running server and checks that it neither panics nor stops
// answering.
func FuzzServer(f *testing.F) {
	f.Add([]byte(`{"jsonrpc":"2.0","id":7,"method":"textDocument/hover","params":{"textDocument":{"uri":"file:///ws/f.kiln"},"position":{"line":0,"character":9}}}`),
		"species ethanol CCO\nreaction ethanol <=> X\n", uint16(0), uint16(8), "x")
	f.Add([]byte(`{"jsonrpc":"2.0","method":"textDocument/didChange","params":{"textDocument":{"uri":"file:///ws/f.kiln","version":9},"contentChanges":[{"range":{"start":{"line":99,"character":99},"end":{"line":0,"character":0}},"text":"🔥"}]}}`),
		"species H [H]\n", uint16(5), uint16(500), "reaction H + H <=> H2\n")
	f.Add([]byte(`{"jsonrpc":"2.0","id":"a","method":"textDocument/codeAction","params":{"textDocument":{"uri":"file:///ws/f.kiln"},"range":{"start":{"line":0,"character":0},"end":{"line":9,"character":0}},"context":{"diagnostics":[]}}}`),
		"species propane CCC\n  nasa7 300 1000 5000\n", uint16(1), uint16(2), "\r\n")
	f.Add([]byte(`{"jsonrpc":"2.0","id":3,"method":"textDocument/rename","params":{"textDocument":{"uri":"file:///ws/f.kiln"},"position":{"line":0,"character":8},"newName":"=>"}}`),
		"species OH [OH]\nreaction OH + OH <=> OH\n", uint16(1), uint16(9), "é")
	f.Add([]byte(`{"jsonrpc":"2.0","id":4,"method":"textDocument/formatting","params":{"textDocument":{"uri":"file:///ws/f.kiln"},"options":{}}}`),
		"species   a   C\n    note  x\n\tnasa7 1 2 3\n", uint16(2), uint16(1), "\t")
	f.Add([]byte(`{not json`), "\xff\xfe\x00species", uint16(0), uint16(0), "\x00")
	f.Add([]byte(`{"jsonrpc":"2.0","id":null,"method":"workspace/symbol","params":{"query":""}}`), "group C-(C)(H)3\n  hf298 x\n", uint16(0), uint16(3), "#")
	f.Add([]byte(`{"jsonrpc":"2.0","id":12345678901234,"method":"textDocument/completion","params":{}}`), "reaction \n", uint16(0), uint16(9), "A")
	f.Add([]byte(`[]`), "", uint16(0), uint16(0), "")
	f.Add([]byte(`{"jsonrpc":"2.0","method":"workspace/didChangeConfiguration","params":{"settings":{"kiln":{"units":"kJ/mol","tMid":1e308}}}}`), "species C [C]\n", uint16(0), uint16(0), "")
	f.Fuzz(func(t *testing.T, body []byte, text string, line, col uint16, insert string) {
		var probe struct {
			Method string `json:"method"`
		}
		_ = json.Unmarshal(body, &probe)
		if probe.Method == "exit" || probe.Method == "shutdown" {
			return // ending the session is legal; it is tested elsewhere
		}
		c, done := newRawClient(t)
		c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "id": 1, "method": "initialize", "params": map[string]any{"rootUri": "file:///ws", "capabilities": map[string]any{}}})
		c.await(t, "1")
		c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "method": "initialized", "params": map[string]any{}})
		uri := "file:///ws/f.kiln"
		c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "method": "textDocument/didOpen", "params": map[string]any{
			"textDocument": map[string]any{"uri": uri, "languageId": "kiln", "version": 1, "text": text}}})
		c.send(t, body)
		c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "method": "textDocument/didChange", "params": map[string]any{
			"textDocument":   map[string]any{"uri": uri, "version": 2},
			"contentChanges": []any{map[string]any{"range": map[string]any{"start": map[string]any{"line": line, "character": col}, "end": map[string]any{"line": line, "character": col + 1}}, "text": insert}},
		}})
		// The server must still answer, about the (possibly closed) document.
		for i, m := range []string{"textDocument/hover", "textDocument/inlayHint", "textDocument/codeAction", "textDocument/formatting", "textDocument/completion"} {
			id := fmt.Sprintf(`"probe%d"`, i)
			c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "id": json.RawMessage(id), "method": m, "params": map[string]any{
				"textDocument": map[string]any{"uri": uri},
				"position":     map[string]any{"line": line, "character": col},
				"range":        map[string]any{"start": map[string]any{"line": 0, "character": 0}, "end": map[string]any{"line": line, "character": col}},
				"context":      map[string]any{"diagnostics": []any{}},
				"options":      map[string]any{},
			}})
			c.await(t, id)
		}
		c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "id": "bye", "method": "shutdown"})
		c.await(t, `"bye"`)
		c.sendJSON(t, map[string]any{"jsonrpc": "2.0", "method": "exit"})
		select {
		case err := <-done:
			if err != nil {
				t.Fatalf("Serve after shutdown+exit: %v", err)
			}
		case <-time.After(20 * time.Second):
			t.Fatal("server did not exit")
		}
	})
}

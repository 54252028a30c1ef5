package lsp

import (
	"bufio"
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"strconv"
	"strings"
	"sync"

	segjson "github.com/segmentio/encoding/json"
	"go.lsp.dev/jsonrpc2"
	"go.uber.org/zap"
)

// maxMessageBytes bounds one JSON-RPC body. Files are limited to 64 MiB by the
// format; a didOpen carries one file, JSON escaping can roughly double it.
const maxMessageBytes = 160 << 20

// stream is a jsonrpc2.Stream with the base-protocol framing
// (Content-Length header, blank line, JSON body) that survives bad bodies: a
// body that is not a JSON-RPC message is answered with a ParseError /
// InvalidRequest response (id null) and skipped instead of ending the
// connection. Broken framing still ends it, as there is no way to resync.
type stream struct {
	conn   io.ReadWriteCloser
	in     *bufio.Reader
	logger *zap.Logger

	mu sync.Mutex // serialises writes
}

func newStream(conn io.ReadWriteCloser, logger *zap.Logger) *stream {
	return &stream{conn: conn, in: bufio.NewReaderSize(conn, 64<<10), logger: logger}
}

// Read returns the next well-formed message.
func (s *stream) Read(ctx context.Context) (jsonrpc2.Message, int64, error) {
	var total int64
	for {
		if err := ctx.Err(); err != nil {
			return nil, total, err
		}
		body, n, err := s.readFrame()
		total += n
		if err != nil {
			return nil, total, err
		}
		msg, err := jsonrpc2.DecodeMessage(body)
		if err == nil {
			return msg, total, nil
		}
		code := jsonrpc2.ParseError
		if errors.Is(err, jsonrpc2.ErrInvalidRequest) || json.Valid(body) {
			code = jsonrpc2.InvalidRequest
		}
		s.logger.Warn("dropping malformed message", zap.Error(err), zap.Int("bytes", len(body)))
		if werr := s.writeRaw(nullIDError(code, err.Error())); werr != nil {
			return nil, total, werr
		}
	}
}

// nullIDError is a response with id null, as JSON-RPC 2.0 prescribes when
// the id of a broken request cannot be known.
func nullIDError(code jsonrpc2.Code, msg string) []byte {
	b, _ := json.Marshal(struct {
		JSONRPC string         `json:"jsonrpc"`
		ID      *int           `json:"id"`
		Error   jsonrpc2.Error `json:"error"`
	}{JSONRPC: "2.0", Error: jsonrpc2.Error{Code: code, Message: msg}})
	return b
}

func (s *stream) readFrame() ([]byte, int64, error) {
	var total int64
	length := -1
	for {
		line, err := s.in.ReadString('\n')
		total += int64(len(line))
		if err != nil {
			return nil, total, fmt.Errorf("reading message header: %w", err)
		}
		if len(line) > 4096 {
			return nil, total, fmt.Errorf("message header line too long (%d bytes)", len(line))
		}
		line = strings.TrimSpace(line)
		if line == "" {
			if length < 0 {
				// Tolerate stray blank lines between messages.
				continue
			}
			break
		}
		name, value, ok := strings.Cut(line, ":")
		if !ok {
			return nil, total, fmt.Errorf("invalid message header line %q", line)
		}
		if strings.EqualFold(strings.TrimSpace(name), "Content-Length") {
			n, err := strconv.Atoi(strings.TrimSpace(value))
			if err != nil || n < 0 || n > maxMessageBytes {
				return nil, total, fmt.Errorf("invalid Content-Length %q", value)
			}
			length = n
		}
	}
	body := make([]byte, length)
	n, err := io.ReadFull(s.in, body)
	total += int64(n)
	if err != nil {
		return nil, total, fmt.Errorf("reading message body: %w", err)
	}
	return body, total, nil
}

// Write frames and sends msg.
func (s *stream) Write(ctx context.Context, msg jsonrpc2.Message) (int64, error) {
	// The message types marshal themselves; calling that directly skips
	// encoding/json's re-validation of the output, which for a large
	// publishDiagnostics costs as much as the encoding itself.
	var data []byte
	var err error
	if m, ok := msg.(json.Marshaler); ok {
		data, err = m.MarshalJSON()
	} else {
		data, err = json.Marshal(msg)
	}
	if err != nil {
		return 0, fmt.Errorf("marshaling message: %w", err)
	}
	if err := s.writeRaw(data); err != nil {
		return 0, err
	}
	return int64(len(data)), nil
}

func (s *stream) writeRaw(data []byte) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	if _, err := fmt.Fprintf(s.conn, "Content-Length: %d\r\n\r\n", len(data)); err != nil {
		return fmt.Errorf("writing message header: %w", err)
	}
	if _, err := s.conn.Write(data); err != nil {
		return fmt.Errorf("writing message body: %w", err)
	}
	return nil
}

// notification is a JSON-RPC notification with its parameters as a value.
type notification struct {
	JSONRPC string `json:"jsonrpc"`
	Method  string `json:"method"`
	Params  any    `json:"params"`
}

// notify sends a notification, encoding params once, and returns the
// encoding. (conn.Notify encodes params, then the message holding them
// again, which re-reads and compacts the encoded parameters: for a large
// publishDiagnostics a second pass over ~1.5 MB.) The encoding is made in
// buf's array (the last one of the same kind, written and no longer used),
// grown by an eighth beyond its length when it is too small, so that a
// publication of ~1.5 MB neither allocates again nor grows by doubling.
// Writes are serialised with the connection's (and done when it returns).
func (s *stream) notify(method string, params any, buf []byte) ([]byte, error) {
	if n := len(buf); cap(buf) < n+n/8 || cap(buf) < 512 {
		buf = make([]byte, 0, max(n+n/8, 512))
	}
	data, err := segjson.Append(buf[:0], notification{JSONRPC: "2.0", Method: method, Params: params}, segjson.EscapeHTML|segjson.SortMapKeys)
	if err != nil {
		return buf[:0], fmt.Errorf("marshaling %s: %w", method, err)
	}
	return data, s.writeRaw(data)
}

// Close closes the underlying connection.
func (s *stream) Close() error { return s.conn.Close() }

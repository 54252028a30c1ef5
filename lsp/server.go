// Package lsp is kiln's language server: the protocol glue between an editor
// speaking the Language Server Protocol 3.16 (plus textDocument/inlayHint
// from 3.17) over JSON-RPC and the analysis of kiln files.
//
// The server keeps the text of open documents (incremental sync; positions
// are UTF-16 based and converted with speciesfile.LineIndex, the project's one
// converter), analyses each document off the message loop after a short
// debounce, publishes diagnostics, and answers editor requests with the pure
// functions of package analysis/ide. Files that are not open are read through
// Options.Loader (the disk by default). Logs go to the given zap logger, never
// to the protocol stream.
package lsp

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"sync"
	"time"

	"go.lsp.dev/jsonrpc2"
	"go.lsp.dev/protocol"
	"go.uber.org/zap"

	"kiln.dev/kiln/analysis"
)

// Options configure Serve. The zero value is usable.
type Options struct {
	// Root is the workspace root (includes must stay inside it). "" takes
	// the client's rootUri, else its first workspace folder, else no limit.
	Root string
	// Loader reads files that are not open in the editor; nil reads the disk.
	Loader analysis.Loader
	// Debounce is the delay between a change and its analysis; 0 means 20 ms
	// (short: a newer change cancels an analysis in progress, and an analysis
	// after a small edit recomputes only what the edit touched).
	Debounce time.Duration
	// Settings are the initial settings; the zero value means
	// analysis.DefaultSettings(). Client settings are applied on top.
	Settings *analysis.Settings

	// settled, when set (by tests), is called after each finished analysis
	// of a document once its diagnostics are published (published is true)
	// or found unchanged.
	settled func(uri protocol.DocumentURI, version int32, published bool)
}

// ErrExitWithoutShutdown is returned by Serve when the client sent exit
// without a prior shutdown request (the protocol asks for exit code 1).
var ErrExitWithoutShutdown = errors.New("lsp: exit notification without shutdown request")

// ErrConnectionClosed is returned by Serve when the stream ended before an
// exit notification.
var ErrConnectionClosed = errors.New("lsp: connection closed before exit")

// server states.
const (
	stateNew = iota
	stateRunning
	stateShutdown
)

type server struct {
	logger *zap.Logger
	opts   Options
	conn   jsonrpc2.Conn
	out    *stream         // conn's stream, for notifications encoded here (notify)
	ctx    context.Context // lifetime of background work
	wg     sync.WaitGroup

	exitCh   chan struct{}
	exitOnce sync.Once

	mu       sync.Mutex
	state    int
	shutdown bool // shutdown request seen
	ws       *analysis.Workspace
	settings analysis.Settings
	markdown bool
	// clientHints: the client renders textDocument/inlayHint; notes: the
	// estimateNotes setting (nil = by clientHints).
	clientHints bool
	notes       *bool
	docs        map[string]*document // by path
	inflight    map[string]context.CancelFunc
}

// Serve runs a language server on stream until the client sends exit, the
// stream ends or ctx is done. It returns nil after a shutdown request
// followed by exit, ErrExitWithoutShutdown after a bare exit,
// ErrConnectionClosed when the stream ends first, or ctx's error.
func Serve(ctx context.Context, stream io.ReadWriteCloser, logger *zap.Logger, opts Options) error {
	if logger == nil {
		logger = zap.NewNop()
	}
	if opts.Debounce <= 0 {
		opts.Debounce = 20 * time.Millisecond
	}
	if opts.Loader == nil {
		opts.Loader = os.ReadFile
	}
	bg, cancel := context.WithCancel(ctx)
	defer cancel()
	s := &server{
		logger:   logger,
		opts:     opts,
		ctx:      bg,
		exitCh:   make(chan struct{}),
		docs:     map[string]*document{},
		inflight: map[string]context.CancelFunc{},
		settings: analysis.DefaultSettings(),
	}
	if opts.Settings != nil {
		s.settings = *opts.Settings
	}
	s.out = newStream(stream, logger)
	s.conn = jsonrpc2.NewConn(s.out)
	s.conn.Go(bg, s.handle)

	var err error
	select {
	case <-s.exitCh:
		s.mu.Lock()
		if !s.shutdown {
			err = ErrExitWithoutShutdown
		}
		s.mu.Unlock()
	case <-s.conn.Done():
		err = ErrConnectionClosed
		if cerr := s.conn.Err(); cerr != nil && !errors.Is(cerr, io.EOF) && !errors.Is(cerr, io.ErrClosedPipe) {
			err = fmt.Errorf("%w: %v", ErrConnectionClosed, cerr)
		}
	case <-ctx.Done():
		err = ctx.Err()
	}
	cancel()
	s.conn.Close()
	// The read loop may stay blocked on a stream that cannot be closed from
	// here (a process's stdin): give it a moment, then return regardless so
	// that the process can exit as the protocol asks.
	select {
	case <-s.conn.Done():
	case <-time.After(200 * time.Millisecond):
	}
	s.wg.Wait()
	return err
}

// handle is the jsonrpc2 handler. It runs on the message loop: notifications
// that change state are applied here, in order; requests are answered on
// their own goroutine so that a slow one (waiting for analysis) does not hold
// up later messages, and so that $/cancelRequest can reach it.
func (s *server) handle(ctx context.Context, reply jsonrpc2.Replier, req jsonrpc2.Request) error {
	call, isCall := req.(*jsonrpc2.Call)
	method := req.Method()
	if !isCall {
		s.safeNotify(ctx, method, req.Params())
		return nil
	}
	// Replies are written even when the request's context is cancelled.
	send := func(result any, err error) {
		if rerr := reply(context.WithoutCancel(ctx), result, err); rerr != nil {
			s.logger.Debug("reply failed", zap.String("method", method), zap.Error(rerr))
		}
	}
	s.mu.Lock()
	state := s.state
	s.mu.Unlock()
	switch {
	case method == "initialize":
		if state != stateNew {
			send(nil, jsonrpc2.NewError(jsonrpc2.InvalidRequest, "initialize sent twice"))
			return nil
		}
		send(s.safeCall(ctx, method, func() (any, error) { return s.initialize(call.Params()) }))
		return nil
	case state == stateNew:
		send(nil, jsonrpc2.NewError(jsonrpc2.ServerNotInitialized, "server not initialized"))
		return nil
	case method == "shutdown":
		s.mu.Lock()
		s.state = stateShutdown
		s.shutdown = true
		s.mu.Unlock()
		send(nil, nil)
		return nil
	case state == stateShutdown:
		send(nil, jsonrpc2.NewError(jsonrpc2.InvalidRequest, "server is shutting down"))
		return nil
	}
	h, ok := requestHandlers[method]
	if !ok {
		send(nil, jsonrpc2.NewError(jsonrpc2.MethodNotFound, fmt.Sprintf("method %q not supported", method)))
		return nil
	}
	key := fmt.Sprintf("%q", call.ID())
	rctx, cancel := context.WithCancel(s.ctx)
	s.mu.Lock()
	s.inflight[key] = cancel
	s.mu.Unlock()
	s.wg.Add(1)
	go func() {
		defer s.wg.Done()
		defer func() {
			s.mu.Lock()
			delete(s.inflight, key)
			s.mu.Unlock()
			cancel()
		}()
		result, err := s.safeCall(rctx, method, func() (any, error) { return h(s, rctx, call.Params()) })
		if rctx.Err() != nil && err != nil {
			err = jsonrpc2.NewError(codeRequestCancelled, "request cancelled")
		}
		send(result, err)
	}()
	return nil
}

// safeCall runs f, turning a panic into an InternalError (logged with its
// stack) and a plain error into a wire error.
func (s *server) safeCall(ctx context.Context, method string, f func() (any, error)) (result any, err error) {
	defer func() {
		if p := recover(); p != nil {
			s.logger.Error("panic in request handler", zap.String("method", method), zap.Any("panic", p), zap.ByteString("stack", debug.Stack()))
			result, err = nil, jsonrpc2.NewError(jsonrpc2.InternalError, fmt.Sprintf("internal error in %s: %v", method, p))
		}
	}()
	result, err = f()
	if err != nil {
		var werr *jsonrpc2.Error
		if !errors.As(err, &werr) {
			err = jsonrpc2.NewError(jsonrpc2.InvalidParams, err.Error())
		}
	}
	return result, err
}

// safeNotify applies a notification; panics are logged and swallowed.
func (s *server) safeNotify(ctx context.Context, method string, params json.RawMessage) {
	defer func() {
		if p := recover(); p != nil {
			s.logger.Error("panic in notification handler", zap.String("method", method), zap.Any("panic", p), zap.ByteString("stack", debug.Stack()))
		}
	}()
	if method == "exit" {
		s.exitOnce.Do(func() { close(s.exitCh) })
		return
	}
	s.mu.Lock()
	state := s.state
	s.mu.Unlock()
	if state != stateRunning && method != "$/cancelRequest" {
		return // before initialize or after shutdown: ignored
	}
	var err error
	switch method {
	case "initialized":
	case "$/cancelRequest":
		err = s.cancelRequest(params)
	case "textDocument/didOpen":
		err = s.didOpen(params)
	case "textDocument/didChange":
		err = s.didChange(params)
	case "textDocument/didClose":
		err = s.didClose(params)
	case "textDocument/didSave":
		err = s.didSave(params)
	case "workspace/didChangeConfiguration":
		err = s.didChangeConfiguration(params)
	case "workspace/didChangeWatchedFiles":
		s.reanalyseAll()
	default:
		// Unknown notifications (including $/ ones) are ignored, as the
		// protocol prescribes.
	}
	if err != nil {
		s.logger.Warn("notification failed", zap.String("method", method), zap.Error(err))
	}
}

func (s *server) cancelRequest(params json.RawMessage) error {
	var p cancelParams
	if err := json.Unmarshal(params, &p); err != nil {
		return fmt.Errorf("$/cancelRequest params: %w", err)
	}
	var id jsonrpc2.ID
	if err := id.UnmarshalJSON(p.ID); err != nil {
		return fmt.Errorf("$/cancelRequest id: %w", err)
	}
	key := fmt.Sprintf("%q", id)
	s.mu.Lock()
	cancel := s.inflight[key]
	s.mu.Unlock()
	if cancel != nil {
		cancel()
	}
	return nil
}

func (s *server) initialize(raw json.RawMessage) (any, error) {
	var p initializeParams
	if len(raw) > 0 {
		if err := json.Unmarshal(raw, &p); err != nil {
			return nil, fmt.Errorf("initialize params: %w", err)
		}
	}
	root := s.opts.Root
	if root == "" {
		switch {
		case p.RootURI != "":
			root = uriToPath(p.RootURI)
		case len(p.WorkspaceFolders) > 0:
			root = uriToPath(protocol.DocumentURI(p.WorkspaceFolders[0].URI))
		case p.RootPath != "":
			root = p.RootPath
		}
	}
	settings, notes, err := applySettings(s.settings, p.InitializationOptions)
	if err != nil {
		s.logger.Warn("ignoring initializationOptions", zap.Error(err))
		settings, notes = s.settings, nil
	}
	markdown := len(p.Capabilities.TextDocument.Hover.ContentFormat) == 0 // clients that say nothing get markdown
	for _, f := range p.Capabilities.TextDocument.Hover.ContentFormat {
		if f == "markdown" {
			markdown = true
		}
	}
	s.mu.Lock()
	s.settings = settings
	s.markdown = markdown
	s.clientHints = p.Capabilities.TextDocument.InlayHint != nil
	if notes != nil {
		s.notes = notes
	}
	s.ws = analysis.NewWorkspace(root, s.opts.Loader, settings)
	s.ws.SetIncremental(true)
	s.state = stateRunning
	s.mu.Unlock()
	s.logger.Info("initialized", zap.String("root", root), zap.Bool("markdown", markdown), zap.Bool("inlayHints", s.clientHints))
	return map[string]any{
		"capabilities": serverCapabilities(),
		"serverInfo":   map[string]any{"name": "kiln"},
	}, nil
}

func (s *server) didChangeConfiguration(raw json.RawMessage) error {
	var p didChangeConfigurationParams
	if err := json.Unmarshal(raw, &p); err != nil {
		return fmt.Errorf("didChangeConfiguration params: %w", err)
	}
	s.mu.Lock()
	settings, notes, err := applySettings(s.settings, p.Settings)
	if err == nil {
		s.settings = settings
		s.ws.SetSettings(settings)
		if notes != nil {
			s.notes = notes
		}
	}
	s.mu.Unlock()
	if err != nil {
		s.showMessage(protocol.MessageTypeWarning, "kiln: "+err.Error())
		return err
	}
	s.reanalyseAll()
	return nil
}

// showMessage sends window/showMessage; failures are logged.
func (s *server) showMessage(t protocol.MessageType, msg string) {
	if err := s.conn.Notify(s.ctx, "window/showMessage", protocol.ShowMessageParams{Type: t, Message: msg}); err != nil {
		s.logger.Debug("showMessage failed", zap.Error(err))
	}
}

// currentSettings returns the settings in force.
func (s *server) currentSettings() analysis.Settings {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.settings
}

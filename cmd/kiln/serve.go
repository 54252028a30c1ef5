package main

import (
	"context"
	"fmt"
	"io"
	"os"
	"os/signal"
	"syscall"

	"go.uber.org/zap"
	"go.uber.org/zap/zapcore"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/lsp"
)

// stdio joins stdin and stdout into the stream the server speaks on.
type stdio struct {
	io.Reader
	io.Writer
}

func (stdio) Close() error { return nil }

func runServe(e env, args []string) (int, error) {
	flags, rest, err := parseArgs(args, flagSpec{"log": true, "stdio": false, "verbose": false})
	if err != nil {
		return 0, err
	}
	if len(rest) > 0 {
		return 0, usagef("serve takes no operands, got %q", rest[0])
	}
	logger, closeLog, err := newLogger(e, flags["log"], flags["verbose"] == "true")
	if err != nil {
		return 0, err
	}
	defer closeLog()
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM)
	defer stop()
	set := analysis.DefaultSettings()
	set.Stamp = fmt.Sprintf("kiln %s, %s", Version, e.now())
	opts := lsp.Options{Settings: &set}
	if err := lsp.Serve(ctx, stdio{e.stdin, e.stdout}, logger, opts); err != nil {
		logger.Error("server stopped", zap.Error(err))
		return 1, nil
	}
	return exitOK, nil
}

// newLogger logs to the file at path, or to stderr when path is empty —
// never to stdout, which carries the protocol. Editors show whatever a
// server writes on stderr as errors, so stderr gets warnings and errors
// only (everything with --verbose); a log file also gets information.
func newLogger(e env, path string, verbose bool) (*zap.Logger, func(), error) {
	level := zapcore.WarnLevel
	if path != "" {
		level = zapcore.InfoLevel
	}
	if verbose {
		level = zapcore.DebugLevel
	}
	enc := zapcore.NewConsoleEncoder(zap.NewDevelopmentEncoderConfig())
	var ws zapcore.WriteSyncer = zapcore.AddSync(e.stderr)
	closeFn := func() {}
	if path != "" {
		f, err := os.OpenFile(path, os.O_CREATE|os.O_WRONLY|os.O_APPEND, 0o644)
		if err != nil {
			return nil, nil, fmt.Errorf("opening log file: %w", err)
		}
		ws = zapcore.AddSync(f)
		closeFn = func() { f.Close() }
	}
	logger := zap.New(zapcore.NewCore(enc, ws, level))
	return logger, func() { logger.Sync(); closeFn() }, nil
}

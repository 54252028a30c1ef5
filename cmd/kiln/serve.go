package main

import (
	"context"
	"fmt"
	"io"
	"math"
	"os"
	"os/signal"
	"runtime/debug"
	"strconv"
	"strings"
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
	flags, rest, err := parseArgs(args, flagSpec{"log": true, "stdio": false, "verbose": false, "memory-limit": true})
	if err != nil {
		return 0, err
	}
	if len(rest) > 0 {
		return 0, usagef("serve takes no operands, got %q", rest[0])
	}
	limit, setLimit, err := serveMemoryLimit(flags["memory-limit"])
	if err != nil {
		return 0, err
	}
	if setLimit {
		// Restored on return: tests run the command in their own process.
		defer debug.SetMemoryLimit(debug.SetMemoryLimit(limit))
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

// serveMemoryLimit returns the soft limit on the Go heap that `kiln serve`
// sets (runtime/debug.SetMemoryLimit) and whether to set one: the
// --memory-limit flag, a size such as 600MiB, 1GiB, 800MB or a byte count,
// or "off" for none (also overriding GOMEMLIMIT). Without the flag kiln
// sets nothing and the Go runtime's defaults apply (GOGC, GOMEMLIMIT).
//
// There is no default limit: a fixed limit near the live heap of a large
// file makes the collector run almost continuously (measured on the
// 20,000-species file: 400 MiB costs ~1 s of CPU per edit instead of
// ~0.2 s), and a file larger than the limit would always pay that; see
// BENCHMARKS.md for the measured trade-off.
func serveMemoryLimit(flag string) (int64, bool, error) {
	switch flag {
	case "":
		return 0, false, nil
	case "off":
		return math.MaxInt64, true, nil
	}
	n, err := parseSize(flag)
	if err != nil {
		return 0, false, usagef("--memory-limit: %v", err)
	}
	return n, true, nil
}

// parseSize reads a byte count with an optional unit: B, KB, MB, GB (powers
// of 1000) or KiB, MiB, GiB (powers of 1024).
func parseSize(s string) (int64, error) {
	units := []struct {
		suffix string
		scale  int64
	}{{"KiB", 1 << 10}, {"MiB", 1 << 20}, {"GiB", 1 << 30}, {"KB", 1e3}, {"MB", 1e6}, {"GB", 1e9}, {"B", 1}}
	num, scale := strings.TrimSpace(s), int64(1)
	for _, u := range units {
		if strings.HasSuffix(num, u.suffix) {
			num, scale = strings.TrimSpace(strings.TrimSuffix(num, u.suffix)), u.scale
			break
		}
	}
	n, err := strconv.ParseInt(num, 10, 64)
	if err != nil || n <= 0 || n > math.MaxInt64/scale {
		return 0, fmt.Errorf("%q is not a size (a positive number with B, KB, MB, GB, KiB, MiB or GiB, or off)", s)
	}
	return n * scale, nil
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

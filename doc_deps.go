//go:build tools

// Package kiln pins dependencies used by packages still being written.
package kiln

import (
	_ "github.com/stretchr/testify/require"
	_ "go.lsp.dev/jsonrpc2"
	_ "go.lsp.dev/protocol"
	_ "go.uber.org/zap"
	_ "golang.org/x/tools/txtar"
	_ "gonum.org/v1/gonum/mat"
	_ "gonum.org/v1/plot"
)

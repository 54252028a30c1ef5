package lsp

import (
	"encoding/json"

	"go.lsp.dev/protocol"
)

// This file holds the few protocol shapes that go.lsp.dev/protocol v0.12
// lacks or models too loosely for kiln: inlay hints (LSP 3.17), a content
// change whose range may be absent (full-text change), and the capabilities
// object, kept as a map so that members newer than 3.16 can be added.

// inlayHintParams are the params of textDocument/inlayHint (LSP 3.17).
type inlayHintParams struct {
	TextDocument protocol.TextDocumentIdentifier `json:"textDocument"`
	Range        protocol.Range                  `json:"range"`
}

// inlayHint is one hint (LSP 3.17); kiln only sends string labels.
type inlayHint struct {
	Position     protocol.Position `json:"position"`
	Label        string            `json:"label"`
	Kind         int               `json:"kind,omitempty"` // 1 = Type, 2 = Parameter
	PaddingLeft  bool              `json:"paddingLeft,omitempty"`
	PaddingRight bool              `json:"paddingRight,omitempty"`
	Tooltip      string            `json:"tooltip,omitempty"`
}

// contentChange is a TextDocumentContentChangeEvent: with Range it replaces
// that range, without it the whole text.
type contentChange struct {
	Range *protocol.Range `json:"range,omitempty"`
	Text  string          `json:"text"`
}

type didChangeParams struct {
	TextDocument   protocol.VersionedTextDocumentIdentifier `json:"textDocument"`
	ContentChanges []contentChange                          `json:"contentChanges"`
}

// cancelParams are the params of $/cancelRequest.
type cancelParams struct {
	ID json.RawMessage `json:"id"`
}

// initializeParams is the subset of InitializeParams kiln reads.
type initializeParams struct {
	RootURI               protocol.DocumentURI       `json:"rootUri,omitempty"`
	RootPath              string                     `json:"rootPath,omitempty"`
	InitializationOptions json.RawMessage            `json:"initializationOptions,omitempty"`
	WorkspaceFolders      []protocol.WorkspaceFolder `json:"workspaceFolders,omitempty"`
	Capabilities          struct {
		TextDocument struct {
			Hover struct {
				ContentFormat []string `json:"contentFormat,omitempty"`
			} `json:"hover"`
			// InlayHint is present when the client renders inlay hints.
			InlayHint *json.RawMessage `json:"inlayHint,omitempty"`
		} `json:"textDocument"`
	} `json:"capabilities"`
}

type didChangeConfigurationParams struct {
	Settings json.RawMessage `json:"settings"`
}

// prepareRenameResult is the {range, placeholder} form of the answer.
type prepareRenameResult struct {
	Range       protocol.Range `json:"range"`
	Placeholder string         `json:"placeholder"`
}

// Code action kinds kiln offers.
const (
	kindQuickFix   = "quickfix"
	kindFillThermo = "source.fixAll.kiln"
)

// errRequestCancelled is the LSP RequestCancelled error code.
const codeRequestCancelled = -32800

// serverCapabilities returns the capabilities kiln announces.
func serverCapabilities() map[string]any {
	return map[string]any{
		"textDocumentSync": map[string]any{
			"openClose": true,
			"change":    2, // incremental
			"save":      map[string]any{"includeText": false},
		},
		"hoverProvider":           true,
		"definitionProvider":      true,
		"referencesProvider":      true,
		"documentSymbolProvider":  true,
		"workspaceSymbolProvider": true,
		"completionProvider": map[string]any{
			"triggerCharacters": []string{" "},
		},
		"codeActionProvider": map[string]any{
			"codeActionKinds": []string{kindQuickFix, kindFillThermo},
		},
		"renameProvider":             map[string]any{"prepareProvider": true},
		"foldingRangeProvider":       true,
		"documentFormattingProvider": true,
		"inlayHintProvider":          true,
		"codeLensProvider":           map[string]any{"resolveProvider": false},
		"executeCommandProvider":     map[string]any{"commands": []string{commandEquilibrium}},
	}
}

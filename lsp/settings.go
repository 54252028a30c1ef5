package lsp

import (
	"encoding/json"
	"fmt"

	"kiln.dev/kiln/analysis"
)

// serverSettings are the settings only the language server reads (the
// analysis settings are analysis.SettingsInput):
//
//	estimateNotes  boolean  send per-species "estimated …" information
//	                        diagnostics (default: only to clients without
//	                        inlay hints; in files of more than 1,000 species
//	                        only for the species edited since opening)
type serverSettings struct {
	EstimateNotes *bool `json:"estimateNotes"`
}

// applySettings reads raw (either {"kiln": {...}} or the flat object) onto
// base and returns the result, with the estimateNotes setting (nil when
// absent). The analysis keys and their validation are those of
// analysis.SettingsInput, shared with the CLI's flags. Invalid values are
// rejected with an error and leave base unchanged; null or empty input
// returns base.
func applySettings(base analysis.Settings, raw json.RawMessage) (analysis.Settings, *bool, error) {
	if len(raw) == 0 || string(raw) == "null" {
		return base, nil, nil
	}
	var wrapped struct {
		Kiln json.RawMessage `json:"kiln"`
	}
	if err := json.Unmarshal(raw, &wrapped); err != nil {
		return base, nil, fmt.Errorf("settings: %w", err)
	}
	if len(wrapped.Kiln) > 0 && string(wrapped.Kiln) != "null" {
		raw = wrapped.Kiln
	}
	var u analysis.SettingsInput
	if err := json.Unmarshal(raw, &u); err != nil {
		return base, nil, fmt.Errorf("settings: %w", err)
	}
	var ss serverSettings
	if err := json.Unmarshal(raw, &ss); err != nil {
		return base, nil, fmt.Errorf("settings: %w", err)
	}
	s, err := u.Apply(base)
	if err != nil {
		return base, nil, fmt.Errorf("settings: %w", err)
	}
	return s, ss.EstimateNotes, nil
}

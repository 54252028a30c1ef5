package lsp

import (
	"encoding/json"
	"fmt"

	"kiln.dev/kiln/analysis"
)

// applySettings reads raw (either {"kiln": {...}} or the flat object) onto
// base and returns the result. The keys and their validation are those of
// analysis.SettingsInput, shared with the CLI's flags. Invalid values are
// rejected with an error and leave base unchanged; null or empty input
// returns base.
func applySettings(base analysis.Settings, raw json.RawMessage) (analysis.Settings, error) {
	if len(raw) == 0 || string(raw) == "null" {
		return base, nil
	}
	var wrapped struct {
		Kiln json.RawMessage `json:"kiln"`
	}
	if err := json.Unmarshal(raw, &wrapped); err != nil {
		return base, fmt.Errorf("settings: %w", err)
	}
	if len(wrapped.Kiln) > 0 && string(wrapped.Kiln) != "null" {
		raw = wrapped.Kiln
	}
	var u analysis.SettingsInput
	if err := json.Unmarshal(raw, &u); err != nil {
		return base, fmt.Errorf("settings: %w", err)
	}
	s, err := u.Apply(base)
	if err != nil {
		return base, fmt.Errorf("settings: %w", err)
	}
	return s, nil
}

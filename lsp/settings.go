package lsp

import (
	"encoding/json"
	"fmt"
	"strings"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/speciesfile"
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
	raw, err := normalizeSettings(raw)
	if err != nil {
		return base, nil, err
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

// normalizeSettings checks the JSON types of the settings object and turns
// a pressure given as text with its unit ("10atm", "1.5 bar", the syntax of
// every kiln input) into the number of bar the analysis settings take. A
// value of the wrong type is named by its key, all of them at once, instead
// of the decoder's first complaint.
func normalizeSettings(raw json.RawMessage) (json.RawMessage, error) {
	var m map[string]json.RawMessage
	if err := json.Unmarshal(raw, &m); err != nil {
		return nil, fmt.Errorf("settings: must be a JSON object: %w", err)
	}
	var problems []string
	for _, key := range analysis.NumberSettingKeys() {
		v, ok := m[key]
		if !ok || string(v) == "null" {
			continue
		}
		var f float64
		if json.Unmarshal(v, &f) == nil {
			continue
		}
		var text string
		if key == "pressure" && json.Unmarshal(v, &text) == nil {
			pa, err := speciesfile.ParsePressure(strings.Join(strings.Fields(text), ""), "bar")
			if err != nil {
				problems = append(problems, err.Error())
				continue
			}
			m[key], _ = json.Marshal(pa / 1e5)
			continue
		}
		problems = append(problems, fmt.Sprintf("%s must be a number, got %s", key, v))
	}
	if v, ok := m["units"]; ok && string(v) != "null" {
		var text string
		if json.Unmarshal(v, &text) != nil {
			problems = append(problems, fmt.Sprintf("units must be \"kcal/mol\" or \"kJ/mol\", got %s", v))
		}
	}
	if len(problems) > 0 {
		return nil, fmt.Errorf("settings: %s", strings.Join(problems, "; "))
	}
	return json.Marshal(m)
}

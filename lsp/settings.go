package lsp

import (
	"encoding/json"
	"fmt"
	"math"

	"kiln.dev/kiln/analysis"
)

// userSettings are the client-facing settings, in the units people use.
// Every field is optional; absent fields keep their current value.
//
//	units            "kcal/mol" | "kJ/mol"   display unit of energies
//	tMid, tHigh      K                       NASA-7 fit temperatures, 300 < tMid < tHigh ≤ 6000
//	mismatchHf298    kcal/mol                thermo-mismatch threshold on ΔHf°298, > 0
//	mismatchS298     cal/(mol K)             thermo-mismatch threshold on S°298, > 0
//	collisionFactor  dimensionless           multiplies the collision-limit bound, > 0
//	estimateNotes    boolean                 send per-species "estimated …" information
//	                                         diagnostics (default: only to clients without
//	                                         inlay hints; in files of more than 1,000
//	                                         species only for species edited since opening)
type userSettings struct {
	EstimateNotes   *bool    `json:"estimateNotes"`
	Units           *string  `json:"units"`
	TMid            *float64 `json:"tMid"`
	THigh           *float64 `json:"tHigh"`
	MismatchHf298   *float64 `json:"mismatchHf298"`
	MismatchS298    *float64 `json:"mismatchS298"`
	CollisionFactor *float64 `json:"collisionFactor"`
}

// calorie is the thermochemical calorie in J (exact by definition).
const calorie = 4.184

// applySettings reads raw (either {"kiln": {...}} or the flat object) onto
// base and returns the result, with the estimateNotes setting (nil when
// absent). Invalid values are rejected with an error and leave base
// unchanged; null or empty input returns base.
func applySettings(base analysis.Settings, raw json.RawMessage) (analysis.Settings, *bool, error) {
	s, u, err := readSettings(base, raw)
	return s, u.EstimateNotes, err
}

func readSettings(base analysis.Settings, raw json.RawMessage) (analysis.Settings, userSettings, error) {
	var u userSettings
	if len(raw) == 0 || string(raw) == "null" {
		return base, u, nil
	}
	var wrapped struct {
		Kiln json.RawMessage `json:"kiln"`
	}
	if err := json.Unmarshal(raw, &wrapped); err != nil {
		return base, userSettings{}, fmt.Errorf("settings: %w", err)
	}
	if len(wrapped.Kiln) > 0 && string(wrapped.Kiln) != "null" {
		raw = wrapped.Kiln
	}
	if err := json.Unmarshal(raw, &u); err != nil {
		return base, userSettings{}, fmt.Errorf("settings: %w", err)
	}
	s := base
	if u.Units != nil {
		switch *u.Units {
		case "kcal/mol", "kJ/mol":
			s.DisplayUnits = *u.Units
		default:
			return base, userSettings{}, fmt.Errorf("settings: units must be \"kcal/mol\" or \"kJ/mol\", got %q", *u.Units)
		}
	}
	positive := func(name string, v *float64, scale float64, dst *float64) error {
		if v == nil {
			return nil
		}
		if math.IsNaN(*v) || math.IsInf(*v, 0) || *v <= 0 {
			return fmt.Errorf("settings: %s must be a positive number, got %g", name, *v)
		}
		*dst = *v * scale
		return nil
	}
	for _, f := range []struct {
		name  string
		v     *float64
		scale float64
		dst   *float64
	}{
		{"tMid", u.TMid, 1, &s.TMid},
		{"tHigh", u.THigh, 1, &s.THigh},
		{"mismatchHf298", u.MismatchHf298, 1000 * calorie, &s.MismatchHf298},
		{"mismatchS298", u.MismatchS298, calorie, &s.MismatchS298},
		{"collisionFactor", u.CollisionFactor, 1, &s.CollisionFactor},
	} {
		if err := positive(f.name, f.v, f.scale, f.dst); err != nil {
			return base, userSettings{}, err
		}
	}
	if !(s.TMid > 300 && s.TMid < s.THigh && s.THigh <= 6000) {
		return base, userSettings{}, fmt.Errorf("settings: need 300 K < tMid < tHigh ≤ 6000 K, got tMid=%g tHigh=%g", s.TMid, s.THigh)
	}
	return s, u, nil
}

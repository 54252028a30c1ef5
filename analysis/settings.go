package analysis

import (
	"fmt"
	"math"
)

// SettingsInput holds settings as people give them, in the units they use;
// nil fields keep the current value. It is the one validator of settings:
// the CLI fills it from flags, the language server from the editor's JSON
// (the json keys below), and both get the same rules and messages.
//
//	units            "kcal/mol" | "kJ/mol"   display unit (default: the file's)
//	tMid, tHigh      K                       NASA-7 fit temperatures, 300 < tMid < tHigh ≤ 6000
//	mismatchHf298    kcal/mol                thermo-mismatch threshold on ΔHf°298 and on H(T)−H(298 K), > 0
//	mismatchS298     cal/(mol K)             thermo-mismatch threshold on S°298, > 0
//	mismatchCp       cal/(mol K)             thermo-mismatch threshold on Cp(T), > 0
//	collisionFactor  dimensionless           multiplies the collision-limit bound, > 0
//	pressure         bar                     where pressure-dependent rates are shown, > 0
type SettingsInput struct {
	Units           *string  `json:"units"`
	TMid            *float64 `json:"tMid"`
	THigh           *float64 `json:"tHigh"`
	MismatchHf298   *float64 `json:"mismatchHf298"`
	MismatchS298    *float64 `json:"mismatchS298"`
	MismatchCp      *float64 `json:"mismatchCp"`
	CollisionFactor *float64 `json:"collisionFactor"`
	Pressure        *float64 `json:"pressure"`
}

// numberSetting is one numeric field of SettingsInput: its json key, the
// field, the factor from the unit people give it in to SI, and the field of
// Settings it sets.
type numberSetting struct {
	key   string
	v     *float64
	scale float64
	dst   *float64
}

// numbers lists the numeric fields of in with their destinations in s: the
// one table of numeric settings (Apply validates them in this order;
// NumberSettingKeys gives their keys to other readers of the same input).
func (in SettingsInput) numbers(s *Settings) []numberSetting {
	return []numberSetting{
		{"tMid", in.TMid, 1, &s.TMid},
		{"tHigh", in.THigh, 1, &s.THigh},
		{"mismatchHf298", in.MismatchHf298, 1000 * JoulesPerCalorie, &s.MismatchHf298},
		{"mismatchS298", in.MismatchS298, JoulesPerCalorie, &s.MismatchS298},
		{"mismatchCp", in.MismatchCp, JoulesPerCalorie, &s.MismatchCp},
		{"collisionFactor", in.CollisionFactor, 1, &s.CollisionFactor},
		{"pressure", in.Pressure, 1e5, &s.Pressure},
	}
}

// NumberSettingKeys returns the json keys of the numeric settings of
// SettingsInput (every key but "units"), in the order Apply checks them.
func NumberSettingKeys() []string {
	var s Settings
	ns := SettingsInput{}.numbers(&s)
	out := make([]string, len(ns))
	for i, n := range ns {
		out[i] = n.key
	}
	return out
}

// MaxTHigh (K) is the highest THIGH kiln fits to: the upper end of the
// NASA TM-4513 tables' usual range.
const MaxTHigh = 6000

// SettingError is an invalid setting; Key is its json key (the CLI maps it
// to its flag name).
type SettingError struct {
	Key string
	Msg string
}

func (e *SettingError) Error() string { return e.Key + ": " + e.Msg }

// Apply returns base with the given fields set, or base unchanged and a
// *SettingError naming the first invalid field.
func (in SettingsInput) Apply(base Settings) (Settings, error) {
	s := base
	if in.Units != nil {
		switch *in.Units {
		case "kcal/mol", "kJ/mol":
			s.DisplayUnits = *in.Units
		default:
			return base, &SettingError{"units", fmt.Sprintf("must be \"kcal/mol\" or \"kJ/mol\", got %q", *in.Units)}
		}
	}
	for _, f := range in.numbers(&s) {
		if f.v == nil {
			continue
		}
		if math.IsNaN(*f.v) || math.IsInf(*f.v, 0) || *f.v <= 0 {
			return base, &SettingError{f.key, fmt.Sprintf("must be a positive number, got %g", *f.v)}
		}
		*f.dst = *f.v * f.scale
	}
	// A range other than the defaults applies to every inserted block;
	// the defaults leave reference-library species at their own ranges.
	// (Editors send tMid and tHigh whether or not the user changed them, so
	// "given" cannot mean "chosen"; the rule is the same for flags.)
	def := DefaultSettings()
	s.ExplicitFitRange = s.TMid != def.TMid || s.THigh != def.THigh
	if !(s.TMid > 300 && s.TMid < s.THigh && s.THigh <= MaxTHigh) {
		key := "tMid"
		if in.THigh != nil {
			key = "tHigh"
		}
		return base, &SettingError{key, fmt.Sprintf("need 300 K < tMid < tHigh ≤ %d K, got tMid=%g K, tHigh=%g K", MaxTHigh, s.TMid, s.THigh)}
	}
	return s, nil
}

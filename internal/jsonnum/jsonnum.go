// Package jsonnum decides how kiln's JSON numbers look, for the CLI's
// --json outputs and the language server's command results alike: numbers
// are rounded to 12 significant digits, so that binary float noise never
// shows (68.664, not 68.66400000000003: the data behind them carry at most
// 6 significant digits).
package jsonnum

import (
	"math"
	"strconv"
)

// Round rounds v to 12 significant digits; 0, NaN and ±Inf are returned as
// they are.
func Round(v float64) float64 {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 12, 64), 64)
	if err != nil {
		return v
	}
	return r
}

// RoundLiterals rewrites every number literal of a JSON text (outside
// strings) that has more than 12 significant digits, as Round rounds it;
// other numbers keep their spelling.
func RoundLiterals(in []byte) []byte {
	return mapLiterals(in, func(lit string) string {
		if v, err := strconv.ParseFloat(lit, 64); err == nil {
			if r := Round(v); r != v {
				return strconv.FormatFloat(r, 'g', -1, 64)
			}
		}
		return lit
	})
}

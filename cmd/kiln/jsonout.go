package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"sort"
	"strconv"

	"kiln.dev/kiln/internal/jsonnum"
)

// JSON output conventions shared by every command: numbers are rounded to
// 12 significant digits, so that binary float noise never shows
// (68.664, not 68.66400000000003: the data behind them carry at most 6
// significant digits); a value that is not a finite number is null; maps
// keyed by temperature or pressure list their keys in numeric order.

// jnum rounds v to 12 significant digits for output (jsonnum.Round).
func jnum(v float64) float64 { return jsonnum.Round(v) }

// jptr is jnum for optional values.
func jptr(p *float64) *float64 {
	if p == nil {
		return nil
	}
	return ptr(jnum(*p))
}

// numericKeys is a JSON object whose keys are numbers written as strings
// ("300", "1000"): it marshals its keys in numeric order (encoding/json
// would sort them as text: "1000" before "300").
type numericKeys[V any] map[string]V

// numericMap is the common case: optional numbers by temperature or
// pressure (null for nil).
type numericMap = numericKeys[*float64]

// MarshalJSON implements json.Marshaler.
func (m numericKeys[V]) MarshalJSON() ([]byte, error) {
	if m == nil {
		return []byte("null"), nil
	}
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	sort.Slice(keys, func(i, j int) bool {
		a, errA := strconv.ParseFloat(keys[i], 64)
		b, errB := strconv.ParseFloat(keys[j], 64)
		if errA != nil || errB != nil || a == b {
			return keys[i] < keys[j]
		}
		return a < b
	})
	var buf bytes.Buffer
	buf.WriteByte('{')
	for i, k := range keys {
		if i > 0 {
			buf.WriteByte(',')
		}
		kb, err := json.Marshal(k)
		if err != nil {
			return nil, err
		}
		buf.Write(kb)
		buf.WriteByte(':')
		vb, err := json.Marshal(m[k])
		if err != nil {
			return nil, err
		}
		buf.Write(vb)
	}
	buf.WriteByte('}')
	return buf.Bytes(), nil
}

// writeJSON writes v indented, as every --json output is, through
// jsonnum.Marshal: every number rounded to 12 significant digits (see jnum)
// and every float that is not finite written as null, the one place that
// decides how kiln's JSON numbers look.
func writeJSON(w io.Writer, v any) error {
	out, err := jsonnum.Marshal(v)
	if err != nil {
		return fmt.Errorf("writing output: %w", err)
	}
	if _, err := w.Write(append(out, '\n')); err != nil {
		return fmt.Errorf("writing output: %w", err)
	}
	return nil
}

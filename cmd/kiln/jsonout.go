package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
)

// JSON output conventions shared by every command: numbers are rounded to
// 12 significant digits, so that binary float noise never shows
// (68.664, not 68.66400000000003: the data behind them carry at most 6
// significant digits); maps keyed by temperature or pressure list their keys
// in numeric order.

// jnum rounds v to 12 significant digits for output.
func jnum(v float64) float64 {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 12, 64), 64)
	if err != nil {
		return v
	}
	return r
}

// jptr is jnum for optional values.
func jptr(p *float64) *float64 {
	if p == nil {
		return nil
	}
	return ptr(jnum(*p))
}

// numericMap is a JSON object whose keys are numbers written as strings
// ("300", "1000"); it marshals its keys in numeric order and its values
// rounded by jnum (null for nil).
type numericMap map[string]*float64

// MarshalJSON implements json.Marshaler.
func (m numericMap) MarshalJSON() ([]byte, error) {
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
		vb, err := json.Marshal(jptr(m[k]))
		if err != nil {
			return nil, err
		}
		buf.Write(vb)
	}
	buf.WriteByte('}')
	return buf.Bytes(), nil
}

// writeJSON writes v indented, as every --json output is.
func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	if err := enc.Encode(v); err != nil {
		return fmt.Errorf("writing output: %w", err)
	}
	return nil
}

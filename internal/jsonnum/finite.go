package jsonnum

import (
	"bytes"
	"encoding/json"
	"errors"
	"math"
	"reflect"
	"strconv"
	"strings"
)

// Not-a-number policy: JSON has no infinity or NaN, and encoding/json
// refuses them ("json: unsupported value: +Inf"). kiln's JSON writes a
// float that is not finite as null, the value it writes for "cannot be
// computed" everywhere else (an overflowing Kp, a rate that underflows to
// an infinite reciprocal). Marshal is the one place that applies it.

// Marshal encodes v as JSON indented by two blanks, with every float that is
// not finite written as null and every number rounded as RoundLiterals
// rounds it. No trailing newline.
func Marshal(v any) ([]byte, error) {
	out, err := encode(v)
	var unsupported *json.UnsupportedValueError
	if errors.As(err, &unsupported) {
		// Only a value with an infinity or NaN in it takes this path: a
		// copy with each one replaced by a sentinel (a finite number no
		// kiln value is), whose literal becomes null.
		out, err = encode(withSentinels(reflect.ValueOf(v)).Interface())
		if err == nil {
			out = nullSentinels(out)
		}
	}
	if err != nil {
		return nil, err
	}
	return RoundLiterals(out), nil
}

func encode(v any) ([]byte, error) {
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetIndent("", "  ")
	if err := enc.Encode(v); err != nil {
		return nil, err
	}
	return bytes.TrimRight(buf.Bytes(), "\n"), nil
}

// sentinel stands for a float that is not finite while v is encoded; its
// literal is replaced by null (nullSentinels).
const sentinel = -1.2345678901234567e+307

// withSentinels returns a deep copy of v with every float that is not
// finite replaced by sentinel. Values that encode themselves are copied
// too (kiln's numericKeys holds floats), so a struct is copied whole before
// its exported fields are replaced: what a MarshalJSON method reads from
// unexported state is kept.
func withSentinels(v reflect.Value) reflect.Value {
	if !v.IsValid() {
		return v
	}
	t := v.Type()
	switch v.Kind() {
	case reflect.Float32, reflect.Float64:
		out := reflect.New(t).Elem()
		f := v.Float()
		if math.IsInf(f, 0) || math.IsNaN(f) {
			f = sentinel
		}
		out.SetFloat(f)
		return out
	case reflect.Pointer:
		if v.IsNil() {
			return v
		}
		out := reflect.New(t.Elem())
		out.Elem().Set(withSentinels(v.Elem()))
		return out
	case reflect.Interface:
		if v.IsNil() {
			return v
		}
		out := reflect.New(t).Elem()
		out.Set(withSentinels(v.Elem()))
		return out
	case reflect.Struct:
		out := reflect.New(t).Elem()
		out.Set(v)
		for i := 0; i < t.NumField(); i++ {
			if t.Field(i).IsExported() {
				out.Field(i).Set(withSentinels(v.Field(i)))
			}
		}
		return out
	case reflect.Slice:
		if v.IsNil() {
			return v
		}
		out := reflect.MakeSlice(t, v.Len(), v.Len())
		for i := 0; i < v.Len(); i++ {
			out.Index(i).Set(withSentinels(v.Index(i)))
		}
		return out
	case reflect.Array:
		out := reflect.New(t).Elem()
		for i := 0; i < v.Len(); i++ {
			out.Index(i).Set(withSentinels(v.Index(i)))
		}
		return out
	case reflect.Map:
		if v.IsNil() {
			return v
		}
		out := reflect.MakeMapWithSize(t, v.Len())
		for it := v.MapRange(); it.Next(); {
			out.SetMapIndex(it.Key(), withSentinels(it.Value()))
		}
		return out
	}
	return v
}

// nullSentinels replaces the number literals (outside strings) that read as
// sentinel by null.
func nullSentinels(in []byte) []byte {
	return mapLiterals(in, func(lit string) string {
		if v, err := strconv.ParseFloat(lit, 64); err == nil && v == sentinel {
			return "null"
		}
		return lit
	})
}

// mapLiterals rewrites each number literal of a JSON text outside strings
// by f.
func mapLiterals(in []byte, f func(string) string) []byte {
	out := make([]byte, 0, len(in))
	inString, escaped := false, false
	for i := 0; i < len(in); i++ {
		c := in[i]
		if inString {
			out = append(out, c)
			switch {
			case escaped:
				escaped = false
			case c == '\\':
				escaped = true
			case c == '"':
				inString = false
			}
			continue
		}
		if c == '"' {
			inString = true
			out = append(out, c)
			continue
		}
		if c == '-' || (c >= '0' && c <= '9') {
			j := i + 1
			for j < len(in) && strings.IndexByte("0123456789.eE+-", in[j]) >= 0 {
				j++
			}
			out = append(out, f(string(in[i:j]))...)
			i = j - 1
			continue
		}
		out = append(out, c)
	}
	return out
}

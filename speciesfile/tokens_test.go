package speciesfile

import (
	"fmt"
	"reflect"
)

// tokenProblems walks every statement node of f by reflection and returns a
// description of each token whose text differs from the source at its
// absolute span (its relative span read with the statement's start), and
// of each statement extent that does not tile the source.
func tokenProblems(f *File) []string {
	var out []string
	if len(f.Starts) != len(f.Stmts) {
		return []string{fmt.Sprintf("%d starts for %d statements", len(f.Starts), len(f.Stmts))}
	}
	pos := 0
	tokType := reflect.TypeOf(Token{})
	for i, st := range f.Stmts {
		base := f.Starts[i]
		if base != pos {
			out = append(out, fmt.Sprintf("statement %d starts at %d, not %d", i, base, pos))
		}
		pos = base + st.Len()
		var walk func(v reflect.Value)
		walk = func(v reflect.Value) {
			switch v.Kind() {
			case reflect.Pointer, reflect.Interface:
				if !v.IsNil() {
					walk(v.Elem())
				}
			case reflect.Slice, reflect.Array:
				for k := range v.Len() {
					walk(v.Index(k))
				}
			case reflect.Struct:
				if v.Type() == tokType {
					tok := v.Interface().(Token)
					if tok == (Token{}) {
						return
					}
					sp := tok.Span.At(base)
					if sp.Start < 0 || sp.End > len(f.Src) || sp.Start > sp.End || string(f.Src[sp.Start:sp.End]) != tok.Text {
						out = append(out, fmt.Sprintf("statement %d: token %q at %v does not match the source", i, tok.Text, sp))
					}
					return
				}
				for k := range v.NumField() {
					if v.Type().Field(k).IsExported() {
						walk(v.Field(k))
					}
				}
			}
		}
		walk(reflect.ValueOf(st))
	}
	if len(f.Stmts) > 0 && pos != len(f.Src) {
		out = append(out, fmt.Sprintf("statements cover %d of %d bytes", pos, len(f.Src)))
	}
	return out
}

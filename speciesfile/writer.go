package speciesfile

import (
	"strconv"
	"strings"
)

// FormatNumber returns the shortest text that the parser reads back as
// exactly v (strconv 'g' format with the minimal number of digits, e.g.
// "300", "0.62", "1.5e+13"); negative zero is written "0". NaN and ±Inf
// give "NaN", "+Inf", "-Inf", which the format does not accept.
func FormatNumber(v float64) string {
	if v == 0 {
		v = 0 // no "-0"
	}
	return strconv.FormatFloat(v, 'g', -1, 64)
}

// formatCoeff formats a NASA coefficient with 11 significant digits
// (relative rounding error ≤ 5e-11), with a leading blank for non-negative
// values so that columns line up; negative zero is written as zero.
func formatCoeff(b []byte, v float64) []byte {
	if v == 0 {
		v = 0 // no "-0.0000000000e+00"
	}
	if !(v < 0) {
		b = append(b, ' ')
	}
	return strconv.AppendFloat(b, v, 'e', 10, 64)
}

// FormatNASA7Block returns the text of a nasa7 block:
//
//	{indent}nasa7 TLOW TMID THIGH{newline}
//	{indent}  low   a1 … a7{newline}
//	{indent}  high  a1 … a7{newline}
//	{indent}  source TEXT{newline}
//
// Temperatures are written with FormatNumber, coefficients in 'e' format with
// 11 significant digits. indent is the species' attribute indentation; block
// lines get indent+"  ". Every line ends with newline. The source line is
// omitted when source is empty after cleaning: line breaks become blanks, a
// '#' that would begin a token (and so start a comment) is dropped, and
// surrounding blanks are trimmed.
func FormatNASA7Block(indent string, tLow, tMid, tHigh float64, low, high [7]float64, source string, newline string) string {
	b := make([]byte, 0, 512)
	b = append(b, indent...)
	b = append(b, "nasa7 "...)
	b = append(b, FormatNumber(tLow)...)
	b = append(b, ' ')
	b = append(b, FormatNumber(tMid)...)
	b = append(b, ' ')
	b = append(b, FormatNumber(tHigh)...)
	b = append(b, newline...)
	for i, row := range [2][7]float64{low, high} {
		b = append(b, indent...)
		if i == 0 {
			b = append(b, "  low  "...)
		} else {
			b = append(b, "  high "...)
		}
		for j, v := range row {
			if j > 0 {
				b = append(b, ' ')
			}
			b = formatCoeff(b, v)
		}
		b = append(b, newline...)
	}
	if src := cleanFreeText(source); src != "" {
		b = append(b, indent...)
		b = append(b, "  source "...)
		b = append(b, src...)
		b = append(b, newline...)
	}
	return string(b)
}

// cleanFreeText makes s safe as free text on one line (see FormatNASA7Block).
func cleanFreeText(s string) string {
	s = strings.NewReplacer("\r\n", " ", "\r", " ", "\n", " ").Replace(s)
	var sb strings.Builder
	prevBlank := true
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c == '#' && prevBlank {
			continue
		}
		sb.WriteByte(c)
		prevBlank = c == ' ' || c == '\t'
	}
	return strings.Trim(sb.String(), " \t")
}

// ThermoInsertion tells where to insert a thermo block into species s:
//
//   - offset is just after the last line of the species' own lines (its
//     keyword line and attribute/block lines), after that line's terminator;
//     blank and comment lines that follow it (and precede the next statement)
//     are left below the insertion.
//   - indent is the indentation of the species' first attribute line, or two
//     spaces when it has none.
//   - newline is the file's prevailing line terminator (File.Newline).
//
// Rule for the unterminated last line: when the species is the last text of
// the file and its last line has no terminator, offset is len(f.Src) and the
// inserted text must begin with newline. NeedsNewlineAt(offset) reports
// exactly this case; ThermoInsertionText applies it.
func (f *File) ThermoInsertion(s *Species) (offset int, indent string, newline string) {
	base := f.Start(s)
	end := s.BodySpan.At(base).End
	switch {
	case end < len(f.Src) && f.Src[end] == '\r' && end+1 < len(f.Src) && f.Src[end+1] == '\n':
		offset = end + 2
	case end < len(f.Src) && (f.Src[end] == '\r' || f.Src[end] == '\n'):
		offset = end + 1
	default:
		offset = end
	}
	indent = "  "
	if len(s.Attrs) > 0 {
		k := s.Attrs[0].Key.Span.At(base).Start
		ls := f.Lines.LineStart(f.Lines.Line(k))
		if ls < k {
			indent = string(f.Src[ls:k])
		}
	}
	return offset, indent, f.Newline
}

// NeedsNewlineAt reports whether text inserted at offset must begin with a
// line terminator to start on a line of its own: offset > 0 and the byte
// before offset is not '\n' or '\r'.
func (f *File) NeedsNewlineAt(offset int) bool {
	if offset <= 0 || offset > len(f.Src) {
		return false
	}
	c := f.Src[offset-1]
	return c != '\n' && c != '\r'
}

// ThermoInsertionText returns the offset and the exact text that inserts
// block (text produced by FormatNASA7Block with the indent and newline from
// ThermoInsertion) into species s, prefixing a newline when
// NeedsNewlineAt(offset).
func (f *File) ThermoInsertionText(s *Species, block string) (offset int, text string) {
	offset, _, nl := f.ThermoInsertion(s)
	if f.NeedsNewlineAt(offset) {
		return offset, nl + block
	}
	return offset, block
}

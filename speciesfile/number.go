package speciesfile

import (
	"fmt"
	"strconv"
)

// exactPow10 holds the powers of ten that a float64 represents exactly
// (10^0 … 10^22; 5^22 < 2^53, so 10^22 = 2^22·5^22 is exact).
var exactPow10 = [...]float64{
	1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10,
	1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20,
	1e21, 1e22,
}

// parseNumberPrefix scans the longest prefix of s that is a number per
// FORMAT.md §1.1 (the same prefix as scanNumber: [+-] digits [. digits]
// [(e|E) [+-] digits], at least one mantissa digit) and converts it in the
// same pass. n is the prefix length (0 when s does not start with a number).
// When exact is true, v is the correctly rounded float64 value of s[:n];
// otherwise the caller must convert s[:n] with strconv.ParseFloat.
//
// The conversion is exact (Clinger's fast path, common practice in float
// parsers): when the decimal significand m has at most 19 digits and
// m ≤ 2^53, and the decimal exponent k satisfies |k| ≤ 22, both m and 10^|k|
// are exact float64 values, so the single IEEE multiplication m·10^k or
// division m/10^-k rounds correctly. Typical mechanism numbers ("-7.8e-12",
// "1.3e11", "2.76", "0") all take this path.
func parseNumberPrefix(s string) (n int, v float64, exact bool) {
	i := 0
	neg := false
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		neg = s[i] == '-'
		i++
	}
	var mant uint64
	digits := 0 // mantissa digits seen
	sig := 0    // significant digits accumulated into mant (after leading zeros)
	exp := 0    // decimal exponent adjustment from digits after the point
	exact = true
	for ; i < len(s) && s[i] >= '0' && s[i] <= '9'; i++ {
		digits++
		if mant == 0 && s[i] == '0' {
			continue
		}
		if sig < 19 {
			mant = mant*10 + uint64(s[i]-'0')
			sig++
		} else {
			exact = false
		}
	}
	if i < len(s) && s[i] == '.' {
		i++
		for ; i < len(s) && s[i] >= '0' && s[i] <= '9'; i++ {
			digits++
			if mant == 0 && s[i] == '0' {
				exp--
				continue
			}
			if sig < 19 {
				mant = mant*10 + uint64(s[i]-'0')
				sig++
				exp--
			} else {
				exact = false
			}
		}
	}
	if digits == 0 {
		return 0, 0, false
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		eneg := false
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			eneg = s[j] == '-'
			j++
		}
		k := j
		e := 0
		for ; k < len(s) && s[k] >= '0' && s[k] <= '9'; k++ {
			if e < 100000 { // larger exponents are left to strconv
				e = e*10 + int(s[k]-'0')
			}
		}
		if k > j {
			i = k
			if eneg {
				e = -e
			}
			exp += e
		}
	}
	if !exact {
		return i, 0, false
	}
	switch {
	case mant == 0:
		v = 0
	case mant > 1<<53 || exp < -22 || exp > 22:
		return i, 0, false
	case exp >= 0:
		v = float64(mant) * exactPow10[exp]
	default:
		v = float64(mant) / exactPow10[-exp]
	}
	if neg {
		v = -v
	}
	return i, v, true
}

// parseNumber returns the length of the number prefix of s (0 if none) and
// its value; err is strconv's error for a prefix out of float64 range.
func parseNumber(s string) (n int, v float64, err error) {
	n, v, exact := parseNumberPrefix(s)
	if n == 0 || exact {
		return n, v, nil
	}
	v, err = strconv.ParseFloat(s[:n], 64)
	return n, v, err
}

// ParsePressure reads a pressure as the format writes one, a number with an
// attached unit (`0.1atm`, `100kPa`, `2bar`), or a bare number taken in
// defaultUnit ("" requires a unit), and returns it in Pa. Tools use it for pressures given on
// their command line, so that the file and the flags read pressures alike.
func ParsePressure(s, defaultUnit string) (float64, error) {
	n, v, err := parseNumber(s)
	if n == 0 {
		return 0, fmt.Errorf("%q is not a pressure: expected a number with a unit, e.g. 1atm or 100kPa", s)
	}
	if err != nil {
		return 0, fmt.Errorf("pressure %q: number out of range", s)
	}
	u := s[n:]
	if u == "" {
		u = defaultUnit
	}
	if u == "" {
		return 0, fmt.Errorf("pressure %q needs a unit: %s", s, unitLists[kPressure])
	}
	f, ok := pressureUnit(u)
	if !ok {
		return 0, fmt.Errorf("pressure %q: unknown unit %q (expected %s)", s, u, unitLists[kPressure])
	}
	if !(v > 0) {
		return 0, fmt.Errorf("pressure %q must be positive", s)
	}
	return v * f, nil
}

package benson

import (
	"fmt"
	"strconv"
	"strings"

	"kiln.dev/kiln/internal/wording"
)

// ligandRank orders neighbour types in a normalised group name: heteroatoms
// first, then carbonyl and unsaturated carbons, then sp3 carbon, then H
// (so "C-(H)3(C)" normalises to "C-(C)(H)3", "C-(H)2(C)(O)" to "C-(O)(C)(H)2").
var ligandRank = func() map[string]int {
	r := make(map[string]int, len(ligandOrder))
	for i, t := range ligandOrder {
		r[t] = i
	}
	return r
}()

// centreLigands is the number of written neighbours of each group centre:
// partners of multiple bonds and ring members of aromatic carbon are implied
// by the centre type (Cd-(C)(H) has the =C partner implied, Cb-(H) its two
// ring neighbours).
var centreLigands = map[string]int{
	"C": 4, "Cd": 2, "Ct": 1, "Cb": 1, "Cbf": 3, "Ca": 0, "CO": 2, "O": 2, "S": 2, "N": 3,
	"CN": 1, "Ck": 0, "CS": 2, // nitrile, ketene and thiocarbonyl carbons (hetero.go)
	"NO2": 1, "NO": 1, "NA": 1, "Nb": 0, "Nbb": 0, "NC": 1, // nitro, nitroso, azo, azine and isocyanide nitrogen (hetero_n.go)
	"NI": 1, "CdN": 2, // imine nitrogen and imine carbon (hetero_n.go)
	"SO": 2, "SO2": 2, // sulfoxide and sulfone sulfur (hetero_sx.go)
	"Naz": 1, // azole ring "=N–", its double-bond partner implied (azole.go)
}

// impliedPartner names, per centre type, the element of a terminal
// double-bonded partner that the centre type itself stands for: the =O of a
// carbonyl group CO-(C)(H). A terminal atom joined by a double bond to any
// other centre is named by no group and the estimate is refused. The ≡N of
// a nitrile carbon CN is the one triple-bonded implied partner. This is the one place where a new centre
// type (say a thiocarbonyl) declares the terminal atom it carries.
var impliedPartner = map[string]string{"CO": "O", "Ck": "O", "CS": "S", "CN": "N", "SO": "O", "SO2": "O",
	"NO2": "O", "NO": "O", // nitro (both =O) and nitroso nitrogen: hetero_n.go
	"NC": "C", // isocyanide nitrogen: hetero_n.go
} // Ck, CS, CN: hetero.go; SO, SO2: hetero_sx.go

// ParseGroupName validates a group name in Benson notation, centre-(ligand)n…,
// and returns it normalised: ligands merged and sorted (see ligandRank), counts
// written after the parenthesis and omitted when 1. "C-(H)3(C)" and
// "C-(C)(H)(H)(H)" both give "C-(C)(H)3". The ligand count must match the
// centre (4 for C, 2 for Cd, CO, O, S, 1 for Ct and Cb, 3 for Cbf and N, 0
// for Ca).
func ParseGroupName(s string) (string, error) {
	s = strings.TrimSpace(s)
	centre, rest, hasDash := strings.Cut(s, "-")
	want, ok := centreLigands[centre]
	if !ok {
		return "", fmt.Errorf("group %q: unknown centre %q", s, centre)
	}
	if !hasDash {
		if want != 0 {
			return "", fmt.Errorf("group %q: centre %s needs %s", s, centre, wording.Count(want, "neighbour"))
		}
		return centre, nil
	}
	var counts ligCounts
	total := 0
	for rest != "" {
		if rest[0] != '(' {
			return "", fmt.Errorf("group %q: expected '(' at %q", s, rest)
		}
		end := strings.IndexByte(rest, ')')
		if end < 0 {
			return "", fmt.Errorf("group %q: unclosed '('", s)
		}
		lig := rest[1:end]
		li, ok := ligandRank[lig]
		if !ok {
			return "", fmt.Errorf("group %q: unknown neighbour type %q", s, lig)
		}
		rest = rest[end+1:]
		n := 1
		j := 0
		for j < len(rest) && rest[j] >= '0' && rest[j] <= '9' {
			j++
		}
		if j > 0 {
			n, _ = strconv.Atoi(rest[:j])
			if n < 1 {
				return "", fmt.Errorf("group %q: bad count for %s", s, lig)
			}
			rest = rest[j:]
		}
		counts[li] += int32(n) // a count past the int32 range fails the total check below
		total += n
	}
	if total != want {
		return "", fmt.Errorf("group %q: %s, centre %s takes %d", s, wording.Count(total, "neighbour"), centre, want)
	}
	return groupName(centre, counts), nil
}

// ligCounts counts neighbours by type, indexed by ligandRank (int32: an
// accumulator of a group is copied and compared per atom).
type ligCounts [len(ligandOrder)]int32

// groupName writes a normalised group name from a centre and neighbour counts.
func groupName(centre string, counts ligCounts) string {
	if counts == (ligCounts{}) {
		return centre
	}
	var b strings.Builder
	b.Grow(24)
	b.WriteString(centre)
	b.WriteByte('-')
	for li, lig := range ligandOrder {
		n := counts[li]
		if n == 0 {
			continue
		}
		b.WriteByte('(')
		b.WriteString(lig)
		b.WriteByte(')')
		if n > 1 {
			b.WriteString(strconv.Itoa(int(n)))
		}
	}
	return b.String()
}

// ligandOrder lists the neighbour types by ligandRank.
// The nitrogen types of hetero_n.go (nitro NO2, nitroso NO, azo NA, imine
// NI, azine Nb and Nbb) follow N, and Nb, Nbb follow Cb; the azole ring nitrogens
// Naz, NazN (azole.go) follow NI; the imine carbon CdN follows Cd; SO, SO2
// (hetero_sx.go) follow S.
var ligandOrder = [...]string{"O", "N", "NO2", "NO", "NA", "NI", "Naz", "NazN", "S", "SO", "SO2", "F", "Cl", "Br", "I", "CO", "CN", "NC", "CS", "Cbf", "Cb", "Nb", "Nbb", "Ct", "Cd", "CdN", "Ca", "C", "H"}

package speciesfile

import (
	"fmt"
	"sort"
)

// didYouMean returns `did you mean "x"? ` for the candidate closest to word
// when it is within one edit (words of up to five letters) or two edits
// (longer words), else "". Case differences count as edits: keywords are case-sensitive, and
// `Species` is best answered with `species`.
func didYouMean(word string, candidates []string) string {
	limit := 2
	if len([]rune(word)) > 5 {
		limit = 3
	}
	best, bestD := "", limit
	for _, c := range candidates {
		if d := editDistance(word, c, bestD); d < bestD {
			best, bestD = c, d
		}
	}
	if best == "" {
		return ""
	}
	return fmt.Sprintf("did you mean %q? ", best)
}

// editDistance is the Levenshtein distance between a and b (insertions,
// deletions and substitutions of runes, plus swaps of two adjacent runes),
// or limit when it is at least limit. Words longer than 64 runes are not
// compared (limit): the work stays bounded whatever the input.
func editDistance(a, b string, limit int) int {
	ra, rb := []rune(a), []rune(b)
	if len(ra) > 64 || len(rb) > 64 {
		return limit
	}
	if d := len(ra) - len(rb); d >= limit || -d >= limit {
		return limit
	}
	prev2 := make([]int, len(rb)+1)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && ra[i-1] == rb[j-2] && ra[i-2] == rb[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return min(prev[len(rb)], limit)
}

// ErrorIn reports whether the reader found an error whose start lies in
// [s.Start, s.End] (the end included: "expected more" errors sit just after
// the last token). Analysis uses it so that a block or an equation with a
// syntax error is never used as data.
//
// Diags are sorted by start offset (Parse sorts them), so the search is a
// binary search plus the errors inside s: callers may ask once per block
// of a large file.
func (f *File) ErrorIn(s Span) bool {
	i := sort.Search(len(f.Diags), func(i int) bool { return f.Diags[i].Span.Start >= s.Start })
	for ; i < len(f.Diags) && f.Diags[i].Span.Start <= s.End; i++ {
		if f.Diags[i].Severity == SeverityError {
			return true
		}
	}
	return false
}

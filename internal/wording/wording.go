// Package wording holds the small rules of English that kiln's messages
// share, so that every command, hover and diagnostic words a count alike:
// "1 unpaired electron", "2 unpaired electrons", never "1 reactions".
package wording

import "strconv"

// Count writes n and the noun in the number n takes: Count(1, "reaction")
// is "1 reaction", Count(2, "reaction") "2 reactions". The plural is the
// singular plus "s"; CountAs takes an irregular one.
func Count(n int, singular string) string { return CountAs(n, singular, singular+"s") }

// CountAs is Count with the plural given: CountAs(3, "species", "species").
func CountAs(n int, singular, plural string) string {
	if n == 1 || n == -1 {
		return strconv.Itoa(n) + " " + singular
	}
	return strconv.Itoa(n) + " " + plural
}

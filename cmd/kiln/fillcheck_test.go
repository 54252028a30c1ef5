package main

import (
	"os"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestFillSourceNamesEachReferenceOnce: the source line fill writes names
// each reference once, even when a group's source is a list ("value; the
// analogy its 1500 K Cp rests on") that repeats another group's reference
// (ethanol and propanol cite Benson's Table A.2 through several groups).
func TestFillSourceNamesEachReferenceOnce(t *testing.T) {
	path := writeTemp(t, "e.kiln", "species ethanol CCO\nspecies propanol CCCO\n")
	code, _, stderr := runKiln(t, "fill", path)
	require.Equal(t, exitOK, code, stderr)
	src, err := os.ReadFile(path)
	require.NoError(t, err)
	lines := regexp.MustCompile(`(?m)^\s*source (.*)$`).FindAllStringSubmatch(string(src), -1)
	require.Len(t, lines, 2, string(src))
	for _, l := range lines {
		_, list, ok := strings.Cut(l[1], "group values from: ")
		require.True(t, ok, l[1])
		parts := strings.Split(strings.TrimSuffix(list, ")"), "; ")
		assert.Greater(t, len(parts), 1, l[1])
		seen := map[string]bool{}
		for _, p := range parts {
			assert.False(t, seen[p], "%q named twice in %q", p, l[1])
			seen[p] = true
		}
	}
	// The file fill wrote is what check accepts.
	code, stdout, _ := runKiln(t, "check", "--min-severity", "warning", path)
	assert.Equal(t, exitOK, code, stdout)
}

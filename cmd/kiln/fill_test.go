package main

import (
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestFillDryRunSameReport: fill and fill --dry-run report the same
// positions (those of the filled file, where check then reports the same
// species, with the line before fill when insertions moved it); species of
// included files that fill does not fill are listed at their file:line.
func TestFillDryRunSameReport(t *testing.T) {
	main := writeTemp(t, "main.kiln", `include sub.kiln
species propane CCC
species butane CCCC
species lump
  composition C2
`)
	dir := filepath.Dir(main)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "sub.kiln"), []byte("species ethanol CCO\nspecies lump2\n  composition C3\n"), 0o644))

	code, diff, dryStderr := runKiln(t, "fill", "--dry-run", main)
	assert.Equal(t, exitProblems, code, dryStderr)
	assert.Contains(t, diff, "+  nasa7 ")
	code, _, stderr := runKiln(t, "fill", main)
	assert.Equal(t, exitProblems, code, stderr)

	report := regexp.MustCompile(`(?m)^\S+:\d+:\d+: .*$`)
	dry, real := report.FindAllString(dryStderr, -1), report.FindAllString(stderr, -1)
	require.Len(t, dry, 3, dryStderr)
	assert.Equal(t, dry, real, "the same positions with and without --dry-run")
	assert.Regexp(t, `main.kiln:12:9: skipped lump: no structure .* \(line 4 before fill\)$`, real[0])
	assert.Regexp(t, `sub.kiln:1:9: not filled ethanol: declared in an included file: fill writes only the file it is given; run kiln fill on that file`, real[1])
	assert.Regexp(t, `sub.kiln:2:9: not filled lump2: declared in an included file .*cannot be filled there either: no structure`, real[2])
	assert.Contains(t, stderr, "inserted 2 thermo block(s), skipped 1 species (listed above), 2 species of included files not filled (listed above)")

	// check on the filled file reports lump where fill said.
	_, stdout, _ := runKiln(t, "check", "--min-severity", "warning", main)
	assert.Contains(t, stdout, "main.kiln:12:9:")
	assert.Contains(t, stdout, "sub.kiln:2:9:")

	// Every species of the file has thermo now; the included ones are
	// still listed.
	code, _, stderr = runKiln(t, "fill", main)
	assert.Equal(t, exitProblems, code, "lump is still without thermo")
	assert.Contains(t, stderr, "nothing inserted, 1 species skipped, 2 species of included files not filled")
	require.NoError(t, os.WriteFile(main, []byte("include sub.kiln\n"), 0o644))
	code, _, stderr = runKiln(t, "fill", main)
	assert.Equal(t, exitOK, code, "species of included files do not change the exit code")
	assert.Contains(t, stderr, "every species of this file already has thermo, 2 species of included files not filled")
	assert.Equal(t, 2, strings.Count(stderr, ": not filled "), stderr)
}

// TestFillKeepsApproximationWarning: a block fill wrote from an approximated
// estimate is that approximation, so check still warns about it after fill
// (a block of other values turns the note into information: see
// analysis.TestApproximationWithBlock).
func TestFillKeepsApproximationWarning(t *testing.T) {
	path := writeTemp(t, "v.kiln", "species C3H6F2 CC(C)(F)F\n")
	warned := func() bool {
		_, stdout, _ := runKiln(t, "check", "--min-severity", "warning", path)
		return strings.Contains(stdout, "warning: C3H6F2: flagged group value: C-(F)2(C)2") // a polyhalogenated group no handbook molecule checks
	}
	require.True(t, warned(), "before fill")
	code, _, stderr := runKiln(t, "fill", path)
	require.Equal(t, exitOK, code, stderr)
	b, err := os.ReadFile(path)
	require.NoError(t, err)
	require.Contains(t, string(b), "nasa7")
	assert.True(t, warned(), "after fill")
}

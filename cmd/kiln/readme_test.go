package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
)

// readmeBlock returns the first fenced block of README.md after the line
// that contains anchor.
func readmeBlock(t *testing.T, anchor string) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	require.NoError(t, err)
	text := string(data)
	i := strings.Index(text, anchor)
	require.GreaterOrEqual(t, i, 0, "README has no %q", anchor)
	rest := text[i:]
	start := strings.Index(rest, "\n```")
	require.GreaterOrEqual(t, start, 0)
	rest = rest[start+4:]
	rest = rest[strings.Index(rest, "\n")+1:] // the info string, if any
	end := strings.Index(rest, "\n```")
	require.GreaterOrEqual(t, end, 0)
	return rest[:end+1]
}

// TestReadmeExamples: the README's example files work as written and its
// shown output is what kiln prints now.
func TestReadmeExamples(t *testing.T) {
	// The short tour of the format has no errors.
	tour := writeTemp(t, "tour.kiln", readmeBlock(t, "## A short tour of the format"))
	code, stdout, stderr := runKiln(t, "check", tour)
	assert.Equal(t, exitOK, code, stdout)
	assert.Contains(t, stderr, "kiln check: 0 error(s), 0 warning(s)")

	// "What it looks like": the file, its diagnostics, the inserted block.
	file := writeTemp(t, "ethanol.kiln", readmeBlock(t, "The examples below use this file"))
	code, stdout, _ = runKiln(t, "check", file)
	assert.Equal(t, exitProblems, code)
	got := strings.ReplaceAll(stdout, file, "ethanol.kiln")
	assert.Equal(t, readmeBlock(t, "Diagnostics on the same file"), got)

	code, _, stderr = runKiln(t, "fill", file)
	require.Equal(t, exitOK, code, stderr)
	filled, err := os.ReadFile(file)
	require.NoError(t, err)
	block := readmeBlock(t, "\ninto\n")
	checked := 0
	for _, line := range strings.Split(block, "\n") {
		if f := strings.Fields(line); len(f) > 0 && (f[0] == "low" || f[0] == "high" || f[0] == "nasa7") {
			assert.Contains(t, string(filled), line+"\n")
			checked++
		}
	}
	assert.Equal(t, 3, checked, "the README shows the nasa7 block:\n%s", block)

	// The hover it shows (kJ/mol setting, shortened where a line ends in
	// "...") is what the server answers now.
	src := readmeBlock(t, "The examples below use this file")
	file = writeTemp(t, "ethanol.kiln", src) // the one fill wrote to has a block now
	set := analysis.DefaultSettings()
	set.DisplayUnits = "kJ/mol"
	ws := analysis.NewWorkspace(filepath.Dir(file), os.ReadFile, set)
	res, err := ws.Analyze(t.Context(), file)
	require.NoError(t, err)
	h, ok := ide.Hover(ide.NewIndex(res), file, strings.Index(src, "ethanol"), set, true)
	require.True(t, ok)
	shown := 0
	for _, line := range strings.Split(readmeBlock(t, "Hover on `ethanol`"), "\n") {
		if line == "" || line == "..." {
			continue
		}
		line, _, _ = strings.Cut(line, "...")
		assert.Contains(t, h.Text, line)
		shown++
	}
	assert.Greater(t, shown, 10, "the README shows the hover")
}

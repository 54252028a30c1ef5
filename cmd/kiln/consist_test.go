package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// writeTemp writes a kiln file into a fresh directory and returns its path.
func writeTemp(t *testing.T, name, text string) string {
	t.Helper()
	dir := t.TempDir()
	path := filepath.Join(dir, name)
	require.NoError(t, os.WriteFile(path, []byte(text), 0o644))
	return path
}

// TestSummaryLines (issue 14, case 1): every reaction is reported on its
// keyword's line, in text and JSON, however many comment and blank lines
// precede it.
func TestSummaryLines(t *testing.T) {
	code, stdout, stderr := runKiln(t, "summary", "--json", "../../examples/furnace.kiln")
	require.Equal(t, exitOK, code, stderr)
	var s struct {
		Reactions []struct {
			Line     int    `json:"line"`
			Equation string `json:"equation"`
		} `json:"reactions"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &s))
	src, err := os.ReadFile("../../examples/furnace.kiln")
	require.NoError(t, err)
	lines := strings.Split(string(src), "\n")
	require.NotEmpty(t, s.Reactions)
	for _, r := range s.Reactions {
		require.Less(t, r.Line-1, len(lines))
		assert.True(t, strings.HasPrefix(lines[r.Line-1], "reaction "), "line %d of %q is %q", r.Line, r.Equation, lines[r.Line-1])
	}
	assert.Equal(t, 82, s.Reactions[0].Line)
	_, text, _ := runKiln(t, "summary", "../../examples/furnace.kiln")
	assert.Regexp(t, `(?m)^82\s+H \+ O2 <=> O \+ OH`, text)
}

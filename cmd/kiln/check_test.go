package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// runKiln runs the kiln command line in-process.
func runKiln(t *testing.T, args ...string) (code int, stdout, stderr string) {
	t.Helper()
	var out, errb bytes.Buffer
	code = run(env{stdout: &out, stderr: &errb, now: func() string { return "2026-12-01" }}, args)
	return code, out.String(), errb.String()
}

var wantRE = regexp.MustCompile(`#\s*want:\s*([a-z0-9, -]+)`)

// wanted reads the "# want: code, code" markers of a test file: line (1-based)
// → sorted codes.
func wanted(t *testing.T, path string) map[int][]string {
	t.Helper()
	src, err := os.ReadFile(path)
	require.NoError(t, err)
	out := map[int][]string{}
	for i, line := range strings.Split(string(src), "\n") {
		if m := wantRE.FindStringSubmatch(line); m != nil {
			for _, c := range strings.Split(m[1], ",") {
				if c = strings.TrimSpace(c); c != "" {
					out[i+1] = append(out[i+1], c)
				}
			}
			sort.Strings(out[i+1])
		}
	}
	return out
}

// TestCheckMarkers runs `kiln check --format json` on every file in
// testdata/check and compares the (line, code) of each diagnostic with the
// file's "# want:" markers: every problem on its line, nothing on valid lines.
// Information-level diagnostics are compared only in files whose name starts
// with "info-".
func TestCheckMarkers(t *testing.T) {
	files, err := filepath.Glob("../../testdata/check/*.kiln")
	require.NoError(t, err)
	require.NotEmpty(t, files)
	for _, file := range files {
		t.Run(filepath.Base(file), func(t *testing.T) {
			code, stdout, stderr := runKiln(t, "check", "--format", "json", file)
			require.NotEqual(t, exitUsage, code, stderr)
			var diags []checkDiag
			require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stdout)
			// Diagnostics by "file:line"; wanted markers of every file reported.
			got := map[string][]string{}
			want := map[string][]string{}
			addWants := func(path string) {
				for line, codes := range wanted(t, path) {
					want[fmt.Sprintf("%s:%d", filepath.Base(path), line)] = codes
				}
			}
			addWants(file)
			seen := map[string]bool{filepath.Base(file): true}
			hasError := false
			for _, d := range diags {
				if d.Severity == "error" {
					hasError = true
				}
				if !seen[filepath.Base(d.File)] {
					seen[filepath.Base(d.File)] = true
					addWants(d.File)
				}
				if d.Severity == "information" && !strings.HasPrefix(filepath.Base(file), "info-") {
					continue
				}
				k := fmt.Sprintf("%s:%d", filepath.Base(d.File), d.Line)
				got[k] = append(got[k], d.Code)
			}
			for l := range got {
				sort.Strings(got[l])
			}
			assert.Equal(t, want, got, "diagnostics by file:line (want vs got); output:\n%s", stdout)
			if hasError {
				assert.Equal(t, exitProblems, code)
			} else {
				assert.Equal(t, exitOK, code)
			}
		})
	}
}

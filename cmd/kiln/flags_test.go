package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/analysis"
	"kiln.dev/kiln/analysis/ide"
)

// TestFlagsAgreeAcrossCommands: the approximations an estimate carries are
// the same, worded the same, in check (its missing-group diagnostic),
// estimate (text and --json), summary (--json) and hover. Radicals whose
// site increment has no S°/Cp data, ring systems without whole-system
// values, a group sum below the S° bound and a stand-in group are all there.
func TestFlagsAgreeAcrossCommands(t *testing.T) {
	species := [][2]string{
		{"ethyl", "C[CH2]"},
		{"tbutyl", "C[C](C)C"},
		{"cubane", "C12C3C4C1C5C2C3C45"},
		{"adamantane", "C1C2CC3CC1CC(C2)C3"},
		{"octane", "C1CC2CCC(C1)C2"}, // bicyclo[3.2.1]octane: no system value
		{"butane", "CCCC"},           // no flag
	}
	var src strings.Builder
	for _, s := range species {
		src.WriteString("species " + s[0] + " " + s[1] + "\n")
	}
	path := filepath.Join(t.TempDir(), "flags.kiln")
	require.NoError(t, os.WriteFile(path, []byte(src.String()), 0o644))

	// estimate --json: the reference list, per SMILES.
	args := []string{"estimate", "--json"}
	for _, s := range species {
		args = append(args, s[1])
	}
	_, stdout, stderr := runKiln(t, args...)
	var est []estimateJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &est), stderr)
	require.Len(t, est, len(species))
	want := map[string][]string{}
	for i, s := range species {
		require.Nil(t, est[i].Error, s[0])
		require.Len(t, est[i].Flags, len(est[i].MissingGroups), s[0])
		want[s[0]] = est[i].Flags
	}
	assert.Empty(t, want["butane"])
	for _, name := range []string{"ethyl", "tbutyl", "cubane", "adamantane", "octane"} {
		assert.NotEmpty(t, want[name], name)
	}
	joined := strings.Join(want["cubane"], "\n")
	assert.Contains(t, joined, "S°298 below the physical lower bound")
	assert.Contains(t, joined, "ring system S°, Cp: cubane")
	assert.Contains(t, strings.Join(want["ethyl"], "\n"), "HBI dS, dCp: primary")

	// estimate text: one line per flag, same words; the radical site's
	// S°/Cp change is computed by a validated model, headed MODELLED.
	_, text, _ := runKiln(t, "estimate", "C[CH2]", "C12C3C4C1C5C2C3C45")
	for _, name := range []string{"ethyl", "cubane"} {
		for _, f := range want[name] {
			assert.Contains(t, text, headed(f), name)
		}
	}
	assert.Contains(t, text, "MODELLED HBI dS, dCp: primary (computed by the statistical-mechanics site model")

	// check: one missing-group warning per species with an approximation,
	// holding every approximation; none for a species whose only flag is a
	// modelled quantity (ethyl, tbutyl) or that has none (butane).
	_, stdout, stderr = runKiln(t, "check", "--format", "json", path)
	var diags []checkDiag
	require.NoError(t, json.Unmarshal([]byte(stdout), &diags), stderr)
	got := map[string]string{}
	for _, d := range diags {
		if d.Code == "missing-group" {
			assert.Equal(t, "warning", d.Severity, "%+v", d)
			name, _, _ := strings.Cut(d.Message, ":")
			got[name] += d.Message
		}
	}
	for _, s := range species {
		var approx []string
		for _, f := range want[s[0]] {
			if !modelled(f) {
				approx = append(approx, f)
			}
		}
		if len(approx) == 0 {
			assert.NotContains(t, got, s[0])
			continue
		}
		for _, f := range approx {
			assert.Contains(t, got[s[0]], f, s[0])
		}
	}
	assert.NotContains(t, got, "ethyl")
	assert.Contains(t, got, "cubane")

	// summary --json: the same list.
	_, stdout, stderr = runKiln(t, "summary", "--json", path)
	var sum summaryJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &sum), stderr)
	for _, sp := range sum.Species {
		assert.Equal(t, want[sp.Name], sp.Flags, sp.Name)
	}

	// summary text: every flag under the same heading, after the name
	// (lines are wrapped: compare with the blanks collapsed).
	_, text, _ = runKiln(t, "summary", path)
	text = strings.Join(strings.Fields(text), " ")
	for _, s := range species {
		for _, f := range want[s[0]] {
			assert.Contains(t, text, s[0]+": "+headed(f), s[0])
		}
	}

	// hover on each declaration: every flag, under the same heading (plain
	// text; Markdown styles the same words).
	ws := analysis.NewWorkspace(filepath.Dir(path), os.ReadFile, analysis.DefaultSettings())
	res, err := ws.Analyze(t.Context(), path)
	require.NoError(t, err)
	x := ide.NewIndex(res)
	for _, s := range species {
		h, ok := ide.Hover(x, path, strings.Index(src.String(), "species "+s[0]+" ")+9, analysis.DefaultSettings(), false)
		require.True(t, ok, s[0])
		for _, f := range want[s[0]] {
			assert.Contains(t, h.Text, headed(f), s[0])
		}
		if len(want[s[0]]) == 0 {
			assert.NotContains(t, h.Text, "MISSING group", s[0])
		}
		md, ok := ide.Hover(x, path, strings.Index(src.String(), "species "+s[0]+" ")+9, analysis.DefaultSettings(), true)
		require.True(t, ok, s[0])
		for _, f := range want[s[0]] {
			heading, _, _ := strings.Cut(headed(f), " "+f)
			assert.Contains(t, md.Text, "**"+heading+"** `"+f+"`", s[0])
		}
	}
}

// headed is a flag under the heading every surface gives it (FlagHeading):
// MODELLED for a quantity a validated model computes, UNPHYSICAL for a sum
// beyond a physical bound, FLAGGED for a group used as it stands, else
// MISSING; "group" follows when the flag names a Benson group.
func headed(flag string) string {
	switch {
	case modelled(flag):
		return "MODELLED " + flag
	case strings.HasPrefix(flag, "S°298 below the physical lower bound"), strings.HasPrefix(flag, "Cp below the ideal-gas lower bound"),
		strings.HasPrefix(flag, "Cp at or above the classical limit"):
		return "UNPHYSICAL " + flag
	case strings.Contains(flag, " (used as it stands"):
		return "FLAGGED" + groupWord(flag) + " " + flag
	}
	return "MISSING" + groupWord(flag) + " " + flag
}

// groupWord is " group" when the flag's subject (its text up to the first
// " (" or " ×") is a Benson group name, as FlagHeading words it.
func groupWord(flag string) string {
	name, _, _ := strings.Cut(flag, " (")
	name, _, _ = strings.Cut(name, " ×")
	if analysis.IsGroupName(name) {
		return " group"
	}
	return ""
}

// modelled reports whether a flag, as FlagText words it, is a quantity a
// validated model computes rather than an approximation.
func modelled(flag string) bool { return strings.Contains(flag, "(computed by the ") }

// TestFlagKinds: estimate --json and summary --json classify every flag
// alike (flag_kinds parallel to missing_groups and flags): a radical site's
// modelled S°/Cp change is "modelled", not a missing group.
func TestFlagKinds(t *testing.T) {
	code, stdout, stderr := runKiln(t, "estimate", "--json", "[CH2]S", "CC(C)(F)F")
	require.Equal(t, exitOK, code, stderr)
	var est []estimateJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &est))
	require.Len(t, est, 2)
	assert.Equal(t, []string{"modelled", "missing"}, est[0].FlagKinds, "%v", est[0].MissingGroups)
	assert.Equal(t, []string{"flagged"}, est[1].FlagKinds, "%v", est[1].MissingGroups)
	for _, r := range est {
		assert.Len(t, r.FlagKinds, len(r.MissingGroups))
	}

	path := filepath.Join(t.TempDir(), "k.kiln")
	require.NoError(t, os.WriteFile(path, []byte("species TM [CH2]S\nspecies DF CC(C)(F)F\n"), 0o644))
	code, stdout, stderr = runKiln(t, "summary", "--json", path)
	require.Equal(t, exitOK, code, stderr)
	var sum summaryJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &sum))
	require.Len(t, sum.Species, 2)
	assert.Equal(t, est[0].FlagKinds, sum.Species[0].FlagKinds)
	assert.Equal(t, est[1].FlagKinds, sum.Species[1].FlagKinds)
}

// TestRefusalNamesMissingGroups: a refusal for want of groups lists them in
// missing_groups (kind "missing"), beside the error, so a tool reads the
// same field for refused and flagged estimates.
func TestRefusalNamesMissingGroups(t *testing.T) {
	code, stdout, stderr := runKiln(t, "estimate", "--json", "CC(F)=C", "CCN=O", "CC")
	require.NotEqual(t, exitOK, code, stderr)
	var est []estimateJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &est), stderr)
	require.Len(t, est, 3)
	assert.Equal(t, []string{"Cd-(F)(C)"}, est[0].MissingGroups)
	assert.Equal(t, []string{"C-(NO)(C)(H)2", "NO-(C)"}, est[1].MissingGroups)
	for _, e := range est[:2] {
		require.NotNil(t, e.Error, e.Input)
		assert.Nil(t, e.Hf298, e.Input)
		assert.Len(t, e.Flags, len(e.MissingGroups), e.Input)
		for _, k := range e.FlagKinds {
			assert.Equal(t, "missing", k, e.Input)
		}
	}
	assert.Empty(t, est[2].MissingGroups, "ethane: nothing missing")

	// summary --json words them as flags of the refused species.
	path := writeTemp(t, "r.kiln", "species A CC(F)=C\nspecies B CC\n")
	_, stdout, _ = runKiln(t, "summary", "--json", path)
	var sum summaryJSON
	require.NoError(t, json.Unmarshal([]byte(stdout), &sum), stdout)
	require.Len(t, sum.Species, 2)
	assert.Equal(t, []string{"Cd-(F)(C): no value and no approximation (the estimate is refused)"}, sum.Species[0].Flags)
	assert.Equal(t, []string{"missing"}, sum.Species[0].FlagKinds)
	assert.Empty(t, sum.Species[1].Flags)
}

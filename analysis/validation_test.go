package analysis

import (
	"bufio"
	"context"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// readTSV reads a tab-separated reference file: '#' lines are comments, the
// first other line is the header.
func readTSV(t *testing.T, path string) []map[string]string {
	t.Helper()
	f, err := os.Open(path)
	require.NoError(t, err)
	defer f.Close()
	var header []string
	var rows []map[string]string
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.TrimSpace(line) == "" {
			continue
		}
		cells := strings.Split(line, "\t")
		if header == nil {
			header = cells
			continue
		}
		row := map[string]string{}
		for i, h := range header {
			if i < len(cells) {
				row[h] = cells[i]
			}
		}
		rows = append(rows, row)
	}
	require.NoError(t, sc.Err())
	require.NotEmpty(t, rows, path)
	return rows
}

// reactionFile turns an equation of SMILES ("C=C + [H][H] => CC") into a
// kiln file declaring each structure once, and returns it.
func reactionFile(eq string) string {
	arrow := " => "
	if strings.Contains(eq, " <=> ") {
		arrow = " <=> "
	}
	sides := strings.SplitN(eq, arrow, 2)
	names := map[string]string{}
	var b strings.Builder
	name := func(smi string) string {
		if n, ok := names[smi]; ok {
			return n
		}
		n := fmt.Sprintf("s%d", len(names))
		names[smi] = n
		fmt.Fprintf(&b, "species %s %s\n", n, smi)
		return n
	}
	var terms [2][]string
	for k, side := range sides {
		for _, smi := range strings.Split(side, " + ") {
			terms[k] = append(terms[k], name(strings.TrimSpace(smi)))
		}
	}
	fmt.Fprintf(&b, "reaction %s <=> %s\n", strings.Join(terms[0], " + "), strings.Join(terms[1], " + "))
	return b.String()
}

func analyseText(t *testing.T, text string) *Result {
	t.Helper()
	ws := NewWorkspace("", func(string) ([]byte, error) { return nil, os.ErrNotExist }, DefaultSettings())
	ws.SetOverlay("r.kiln", []byte(text))
	res, err := ws.Analyze(context.Background(), "r.kiln")
	require.NoError(t, err)
	return res
}

// TestReactionEnthalpies compares kiln's ΔH°r(298) — from estimated or
// reference-library thermo — with values from handbook ΔHf° (the file names
// the source of each): hydrogenations, bond fissions, H abstractions.
// Tolerance 1.5 kcal/mol, the bar for group-additivity reaction
// enthalpies.
func TestReactionEnthalpies(t *testing.T) {
	rows := readTSV(t, "../testdata/reactions/enthalpies.tsv")
	var sum, worst float64
	for _, row := range rows {
		want, err := strconv.ParseFloat(row["dh298_kcal"], 64)
		require.NoError(t, err)
		res := analyseText(t, reactionFile(row["equation"]))
		require.Len(t, res.Reactions, 1)
		r := res.Reactions[0]
		require.NotNil(t, r.DH298, "%s: no ΔH (diagnostics %v)", row["equation"], res.Diagnostics)
		got := *r.DH298 / 4184
		d := got - want
		t.Logf("%-40s handbook %8.2f  kiln %8.2f  diff %+6.2f kcal/mol", row["equation"], want, got, d)
		sum += math.Abs(d)
		worst = math.Max(worst, math.Abs(d))
		if math.Abs(d) > 1.5 {
			t.Errorf("%s: ΔH°r %.2f kcal/mol, handbook %.2f (diff %+.2f > 1.5)", row["equation"], got, want, d)
		}
		require.NotNil(t, r.Balance)
		require.True(t, r.Balance.Balanced, row["equation"])
	}
	t.Logf("reaction enthalpies: n=%d MAE %.2f kcal/mol, max %.2f", len(rows), sum/float64(len(rows)), worst)
}

// TestEquilibriumConstants compares Kp of simple equilibria with values
// computed from NIST-JANAF log Kf (the file shows the arithmetic): within 5 %.
func TestEquilibriumConstants(t *testing.T) {
	for _, row := range readTSV(t, "../testdata/reactions/equilibria.tsv") {
		T, err := strconv.ParseFloat(row["T_K"], 64)
		require.NoError(t, err)
		logK, err := strconv.ParseFloat(row["log10_Kp"], 64)
		require.NoError(t, err)
		res := analyseText(t, reactionFile(row["equation"]))
		require.Len(t, res.Reactions, 1)
		kp, ok := res.Reactions[0].KpAt(T)
		require.True(t, ok, row["equation"])
		want := math.Pow(10, logK)
		t.Logf("%-36s %5.0f K  JANAF Kp %.4g  kiln %.4g  ratio %.4f", row["equation"], T, want, kp, kp/want)
		if math.Abs(kp/want-1) > 0.05 {
			t.Errorf("%s at %g K: Kp %.4g, JANAF %.4g (off by %.1f %% > 5 %%)", row["equation"], T, kp, want, 100*(kp/want-1))
		}
	}
}

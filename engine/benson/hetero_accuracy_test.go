package benson

import (
	"bufio"
	"hash/fnv"
	"math"
	"os"
	"sort"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/engine/reflib"
)

type heteroRow struct {
	name, smiles, class, split string
	hf, s, cp300, cp1000       float64 // NaN when not entered
	uncertain                  bool
}

func readHeteroRef(t *testing.T) []heteroRow {
	t.Helper()
	path := "../../testdata/thermo/nsx.tsv"
	require.FileExists(t, path, "the N/S/halogen validation table must exist; this test must not pass vacuously")
	f, err := os.Open(path)
	require.NoError(t, err)
	defer f.Close()
	var rows []heteroRow
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || strings.TrimSpace(line) == "" || strings.HasPrefix(line, "name\t") {
			continue
		}
		c := strings.Split(line, "\t")
		require.Len(t, c, 9, "row %q", line)
		num := func(s string) float64 {
			if strings.TrimSpace(s) == "" {
				return math.NaN()
			}
			v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
			require.NoError(t, err, "row %q", line)
			return v
		}
		rows = append(rows, heteroRow{name: c[0], smiles: c[1], class: c[2], split: c[3],
			hf: num(c[4]), s: num(c[5]), cp300: num(c[6]), cp1000: num(c[7]),
			uncertain: strings.Contains(c[8], "uncertain")})
	}
	require.NoError(t, sc.Err())
	return rows
}

// heldOut is the split rule fixed before any value was entered: a row is
// held out when the FNV-1a 32-bit hash of its name is divisible by 4.
func heldOut(name string) bool {
	h := fnv.New32a()
	h.Write([]byte(name))
	return h.Sum32()%4 == 0
}

// TestHeteroAccuracy compares group-additivity estimates of N, S and halogen
// compounds with handbook values (testdata/thermo/nsx.tsv) and prints, per
// element class and split, the coverage (estimated / rows), the ΔHf° and S°
// MAE of the estimates made without any approximation, and the flagged and
// refused rows. Aims (issue 13): ΔHf° MAE ≤ 1.5 kcal/mol per class (for a
// held-out class only with at least 5 rows; the pooled held-out MAE always),
// S° MAE ≤ 1.0 cal/(mol K), and no unflagged estimate off by more than
// 5 kcal/mol.
// Rows marked "uncertain" in their source are shown but not counted. Rows
// that are reference-library species (as in kiln, the library answers
// first) are compared with the library and counted under "library", not in
// the group-additivity MAE.
func TestHeteroAccuracy(t *testing.T) {
	rows := readHeteroRef(t)
	lib := reflib.New()
	require.GreaterOrEqual(t, len(rows), 80)
	type stat struct {
		rows, est, flagged, refused int
		hf, s                       errStat
		hfAll                       errStat // every estimate, flagged ones included
	}
	stats := map[string]*stat{}
	kinds := map[string]*errStat{} // nitrogen rows by functional kind and split: unflagged, certain ΔHf°
	for _, r := range rows {
		want := "train"
		if heldOut(r.name) {
			want = "heldout"
		}
		require.Equal(t, want, r.split, "%s: the split column must follow the rule fixed before the values", r.name)
		key := r.class + "/" + r.split
		st := stats[key]
		if st == nil {
			st = &stat{}
			stats[key] = st
		}
		st.rows++
		m, err := molecule.ParseSMILES(r.smiles)
		require.NoError(t, err, "%s %s", r.name, r.smiles)
		if sp, ok := lib.Lookup(m, 0); ok {
			ls := stats["library"]
			if ls == nil {
				ls = &stat{}
				stats["library"] = ls
			}
			ls.rows++
			ls.est++
			st.rows--
			dh := sp.Hf298/calorie/1000 - r.hf
			ls.hf.add(dh, r.name)
			ls.s.add(sp.S298/calorie-r.s, r.name)
			ls.hfAll.add(dh, r.name)
			t.Logf("%-26s %-8s dHf %+6.2f  dS %+6.2f  reference library (%s)", r.name, r.split, dh, sp.S298/calorie-r.s, sp.Name)
			continue
		}
		est, err := Estimate(m, Options{})
		if err != nil {
			st.refused++
			t.Logf("%-26s %-8s refused: %v", r.name, r.split, err)
			continue
		}
		if est.Class == "sulfur oxide" { // a class of its own (hetero.go, heteroClass)
			st.rows--
			key = "sulfur oxide/" + r.split
			if stats[key] == nil {
				stats[key] = &stat{}
			}
			st = stats[key]
			st.rows++
		}
		st.est++
		dh := est.Hf298/calorie/1000 - r.hf
		if r.class == "nitrogen" {
			kk := nitrogenKind(est) + "/" + r.split
			if kinds[kk] == nil {
				kinds[kk] = &errStat{}
			}
			if !r.uncertain && len(est.Missing) == 0 || !r.uncertain && onlyEntropyFlags(est) {
				kinds[kk].add(dh, r.name)
			}
		}
		ds := est.S298/calorie - r.s
		flag := ""
		if !r.uncertain {
			st.hfAll.add(dh, r.name)
		}
		// An S°/Cp-only flag (entropyOnly) leaves ΔHf° unapproximated: such
		// a row counts in the ΔHf° MAE but not in the S° MAE.
		hfFlag := ""
		for _, m := range est.Missing {
			if !entropyOnly(m) {
				hfFlag = m.Group
				break
			}
		}
		switch {
		case hfFlag != "":
			st.flagged++
			flag = "flagged: " + hfFlag
		case r.uncertain:
			flag = "reference uncertain"
		default:
			st.hf.add(dh, r.name)
			if len(est.Missing) == 0 {
				st.s.add(ds, r.name)
			} else {
				st.flagged++
				flag = "S, Cp flagged: " + est.Missing[0].Group
			}
			assert.LessOrEqual(t, math.Abs(dh), 5.0, "%s: off by %.1f kcal/mol without a flag", r.name, dh)
		}
		t.Logf("%-26s %-8s dHf %+6.2f  dS %+6.2f  %s", r.name, r.split, dh, ds, flag)
	}
	var keys []string
	for k := range stats {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	t.Logf("%-18s %5s %5s %5s %5s %18s %18s %18s", "class/split", "rows", "est", "flag", "ref", "ΔHf MAE/max kcal", "S MAE/max cal", "ΔHf MAE incl. flagged")
	for _, k := range keys {
		st := stats[k]
		t.Logf("%-18s %5d %5d %5d %5d %8.2f %8.2f %8.2f %8.2f %8.2f (n=%d)  unflagged n=%d, worst: %s", k, st.rows, st.est, st.flagged, st.refused,
			st.hf.mae(), st.hf.max, st.s.mae(), st.s.max, st.hfAll.mae(), st.hfAll.n, st.hf.n, st.hf.worst)
	}
	const minHeldOut = 5
	var kindKeys []string
	for k := range kinds {
		kindKeys = append(kindKeys, k)
	}
	sort.Strings(kindKeys)
	// The aim holds per kind for training rows; a held-out kind is asserted
	// only with at least minHeldOut rows, as for the element classes below
	// (the pooled held-out MAE is asserted there).
	for _, k := range kindKeys {
		ks := kinds[k]
		t.Logf("nitrogen kind %-34s ΔHf° MAE %5.2f kcal/mol (n=%d, max %.2f %s)", k, ks.mae(), ks.n, ks.max, ks.worst)
		if strings.HasSuffix(k, "/train") || ks.n >= minHeldOut {
			assert.LessOrEqual(t, ks.mae(), 1.5, "nitrogen kind %s ΔHf° MAE (kcal/mol)", k)
		}
	}
	// Aims per element class. A held-out class with fewer than
	// minHeldOut unflagged estimates is too small for its MAE to mean much
	// (one molecule moves it by a third of its error): it is printed, and the
	// pooled held-out MAE over all classes is held to the aim instead.
	var pooled errStat
	for _, class := range []string{"nitrogen", "sulfur", "halogen"} {
		for _, split := range []string{"train", "heldout"} {
			st := stats[class+"/"+split]
			if !assert.NotNil(t, st, "class %s/%s is empty", class, split) {
				continue
			}
			assert.Greater(t, st.hf.n, 0, "%s/%s: no unflagged estimate", class, split)
			assert.LessOrEqual(t, st.s.mae(), 1.0, "%s/%s S° MAE (cal/(mol K))", class, split)
			if split == "heldout" {
				assert.InDelta(t, st.hf.mae(), heldoutMAE[class], 0.05, "heldoutMAE[%q] drifted from the measured held-out MAE", class)
				pooled.n += st.hf.n
				pooled.sum += st.hf.sum
				if st.hf.n < minHeldOut {
					if st.hf.mae() > 1.5 {
						t.Logf("NOTE %s/%s ΔHf° MAE %.2f kcal/mol > 1.5 on only %d rows (worst %s)", class, split, st.hf.mae(), st.hf.n, st.hf.worst)
					}
					continue
				}
			}
			assert.LessOrEqual(t, st.hf.mae(), 1.5, "%s/%s ΔHf° MAE (kcal/mol)", class, split)
			if split == "train" {
				// classMAE (the uncertainty of an estimate of the class)
				// must be what this test measures.
				assert.InDelta(t, st.hf.mae(), classMAE[class], 0.05, "classMAE[%q] drifted from the measured train MAE", class)
				// S° may not drift up from what was measured either.
				assert.LessOrEqual(t, st.s.mae(), heteroTrainS[class]+0.15, "%s/train S° MAE rose above its measured %.2f cal/(mol K)", class, heteroTrainS[class])
			}
		}
	}
	t.Logf("held-out, all classes: ΔHf° MAE %.2f kcal/mol over %d rows", pooled.mae(), pooled.n)
	// Sulfoxides and sulfones: their class error must be what is measured
	// here (train rows only: no held-out row is a sulfoxide or sulfone).
	if so := stats["sulfur oxide/train"]; assert.NotNil(t, so) {
		assert.Greater(t, so.hf.n, 0)
		assert.InDelta(t, so.hf.mae(), classMAE["sulfur oxide"], 0.05, "classMAE[sulfur oxide] drifted from the measured train MAE")
		assert.Nil(t, stats["sulfur oxide/heldout"], "a held-out sulfoxide row needs a heldoutMAE entry")
	}
	assert.LessOrEqual(t, pooled.mae(), 1.5, "pooled held-out ΔHf° MAE (kcal/mol)")
}

// heteroTrainS is the S° MAE (cal/(mol K)) of each class's training rows as
// measured on 2026-12-03 (after the N, S and halogen groups of that day);
// the test allows 0.15 above it.
var heteroTrainS = map[string]float64{"nitrogen": 0.30, "sulfur": 0.17, "halogen": 0.16}

// onlyEntropyFlags reports whether every approximation of est concerns S°
// and Cp only.
func onlyEntropyFlags(est *Result) bool {
	for _, m := range est.Missing {
		if !entropyOnly(m) {
			return false
		}
	}
	return true
}

// nitrogenKind names the functional kind of a nitrogen compound from the
// groups of its estimate, for the per-kind breakdown of TestHeteroAccuracy.
func nitrogenKind(est *Result) string {
	has := func(sub string) bool {
		for _, g := range est.Groups {
			if strings.Contains(g.Name, sub) {
				return true
			}
		}
		return false
	}
	switch {
	case has("Naz"):
		return "azole ring N"
	case has("CdN-("):
		return "imine"
	case has("NA-("):
		return "azo"
	case has("NO-(Cb)"):
		return "C-nitroso"
	case has("N-(Cd)2"):
		return "pyrrole-type ring N"
	case has("N-(CO)(C)"):
		return "N-substituted amide"
	case has("N-(CO)(H)2"):
		return "primary amide"
	case has("Nb"):
		return "azine"
	case has("NO2-"):
		return "nitro, nitrate"
	case has("NO-(O)"):
		return "nitrite"
	case has("CN-("):
		return "nitrile"
	case has("N-(N)"):
		return "hydrazine"
	}
	return "amine"
}

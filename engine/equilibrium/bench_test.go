package equilibrium

import (
	"context"
	"math"
	"slices"
	"strings"
	"testing"

	"kiln.dev/kiln/engine/benson"
	"kiln.dev/kiln/engine/molecule"
	"kiln.dev/kiln/internal/mechgen"
)

// linearCp is a test thermo model: Cp linear between the group-additivity
// points (held at the last point above it), H and S integrated from 298.15 K
// by the trapezoid rule on a 10 K grid. Accurate enough for timing.
type linearCp struct {
	hf, s298 float64
	cp       [7]float64
}

func (l *linearCp) cpAt(T float64) float64 {
	ts := benson.StdTemps
	if T <= ts[0] {
		return l.cp[0]
	}
	for i := 1; i < len(ts); i++ {
		if T <= ts[i] {
			f := (T - ts[i-1]) / (ts[i] - ts[i-1])
			return l.cp[i-1] + f*(l.cp[i]-l.cp[i-1])
		}
	}
	return l.cp[len(ts)-1]
}

func (l *linearCp) integrate(T float64, weight func(float64) float64) float64 {
	n := int(math.Ceil(math.Abs(T-298.15)/10)) + 1
	h := (T - 298.15) / float64(n)
	s := 0.0
	for i := 0; i <= n; i++ {
		t := 298.15 + float64(i)*h
		w := 1.0
		if i == 0 || i == n {
			w = 0.5
		}
		s += w * weight(t)
	}
	return s * h
}

func (l *linearCp) H(T float64) float64 { return l.hf + l.integrate(T, l.cpAt) }
func (l *linearCp) S(T float64) float64 {
	return l.s298 + l.integrate(T, func(t float64) float64 { return l.cpAt(t) / t })
}

// hundredSpecies returns 25 reference-library species of C, H, O, N and Ar
// (the first in the library's order; the library has grown past the 25 it
// once held, and the benchmark keeps its size) and 75 generated C/H/O
// molecules and radicals (internal/mechgen) estimated by group additivity.
func hundredSpecies(b *testing.B) []Species {
	var out []Species
	for _, s := range librarySpecies(b) {
		if len(out) < 25 && onlyElements(s.Composition, "C", "H", "O", "N", "Ar") {
			out = append(out, s)
		}
	}
	have := map[string]bool{}
	for _, s := range out {
		have[s.Name] = true
	}
	src := string(mechgen.Generate(mechgen.Options{Seed: 7, Molecules: 60}))
	for _, line := range strings.Split(src, "\n") {
		f := strings.Fields(line)
		if len(out) == 100 || len(f) != 3 || f[0] != "species" || have[f[1]] {
			continue
		}
		m, err := molecule.ParseSMILES(f[2])
		if err != nil {
			b.Fatal(err)
		}
		g, err := benson.Estimate(m, benson.Options{})
		if err != nil {
			continue
		}
		out = append(out, Species{Name: f[1], Composition: m.Composition(), Thermo: &linearCp{hf: g.Hf298, s298: g.S298, cp: g.Cp}})
	}
	if len(out) != 100 {
		b.Fatalf("%d species, want 100", len(out))
	}
	return out
}

// BenchmarkSolve100: one equilibrium at fixed T and P over 100 species and
// 4 elements (C, H, O, N): a lean C/H/O fuel mixture in air at 2000 K, 1 atm.
func BenchmarkSolve100(b *testing.B) {
	sys, err := NewSystem(hundredSpecies(b))
	if err != nil {
		b.Fatal(err)
	}
	feed := feedOf(b, sys, map[string]float64{"M1": 1, "M2": 1, "O2": 20, "N2": 75.2})
	b.ReportAllocs()
	for b.Loop() {
		if _, err := sys.Solve(context.Background(), Problem{Feed: feed, T: 2000, P: atm}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkAdiabatic100: the adiabatic flame temperature of the same
// mixture from 298.15 K (a temperature search of warm-started solves).
func BenchmarkAdiabatic100(b *testing.B) {
	sys, err := NewSystem(hundredSpecies(b))
	if err != nil {
		b.Fatal(err)
	}
	feed := feedOf(b, sys, map[string]float64{"M1": 1, "M2": 1, "O2": 20, "N2": 75.2})
	b.ReportAllocs()
	for b.Loop() {
		if _, err := sys.Solve(context.Background(), Problem{Feed: feed, T: 298.15, P: atm, Adiabatic: true}); err != nil {
			b.Fatal(err)
		}
	}
}

// onlyElements reports whether composition c has no element outside els.
func onlyElements(c map[string]int, els ...string) bool {
	for e := range c {
		if !slices.Contains(els, e) {
			return false
		}
	}
	return true
}

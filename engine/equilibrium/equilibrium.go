// Package equilibrium computes the chemical equilibrium of an ideal-gas
// mixture over a given set of species by minimising its Gibbs energy (at
// fixed temperature and pressure) or its Helmholtz energy (at fixed
// temperature and volume), and from these the adiabatic temperature at
// constant pressure (fixed enthalpy) or constant volume (fixed internal
// energy).
//
// The method is the element-potential (Lagrange multiplier) formulation of
// the minimisation: at equilibrium every species satisfies
//
//	μ_j/(R T) = Σ_i a_ij π_i
//
// with a_ij the number of atoms of element i in species j and π_i the
// dimensionless element potentials, subject to the element balances
// Σ_j a_ij n_j = b_i. For an ideal gas
//
//	μ_j/(R T) = G°_j(T)/(R T) + ln(n_j/n) + ln(P/P°)       (fixed T, P)
//	μ_j/(R T) = G°_j(T)/(R T) + ln(n_j R T/(V P°))         (fixed T, V)
//
// with P° = 1 bar. Newton's method in the logarithms of the amounts reduces
// to a linear system in the element potentials (and the change of the total
// amount n at fixed pressure) of size (elements + 1), so a step costs
// O(species × elements²); steps are damped so that no major species changes
// by more than a factor e² and no trace species jumps above a mole fraction
// of 1e-4 in one step (common practice, e.g. Smith & Missen, Chemical
// Reaction Equilibrium Analysis, 1982).
//
// Only gases are treated (no condensed phases) and ions are not: callers
// pass neutral species. Thermochemistry comes from the caller through the
// Thermo interface, on the formation scale (H(298.15 K) = ΔHf°298). The
// package does no I/O and every solve has a bound on its iterations.
package equilibrium

import (
	"context"
	"errors"
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// R is the molar gas constant in J/(mol K) (CODATA 2018, exact in the 2019 SI).
const R = 8.314462618

// PStd is the standard-state pressure, 1 bar in Pa.
const PStd = 1e5

// Temperature bounds (K) of the adiabatic search.
const (
	TMin = 200.0
	TMax = 6000.0
)

// Thermo is a species' standard-state thermochemistry: H(T) in J/mol on the
// formation scale and S(T) in J/(mol K) at 1 bar, T in K.
type Thermo interface {
	H(T float64) float64
	S(T float64) float64
}

// Species is one gas-phase species that may take part in the equilibrium.
type Species struct {
	Name        string
	Composition map[string]int // element symbol → atoms per molecule
	Thermo      Thermo
}

// System is a set of species with their element matrix. It is immutable and
// safe for concurrent use.
type System struct {
	species  []Species
	elements []string    // sorted element symbols present in any species
	a        [][]float64 // a[j][i]: atoms of element i in species j
}

// NewSystem indexes the species. It refuses an empty set, a species without
// thermochemistry or composition, and two species with the same name.
func NewSystem(species []Species) (*System, error) {
	if len(species) == 0 {
		return nil, errors.New("equilibrium: no species")
	}
	s := &System{species: append([]Species(nil), species...)}
	seen := map[string]bool{}
	elset := map[string]bool{}
	for _, sp := range species {
		if seen[sp.Name] {
			return nil, fmt.Errorf("equilibrium: species %s given twice", sp.Name)
		}
		seen[sp.Name] = true
		if sp.Thermo == nil {
			return nil, fmt.Errorf("equilibrium: species %s has no thermochemistry", sp.Name)
		}
		if len(sp.Composition) == 0 {
			return nil, fmt.Errorf("equilibrium: species %s has no elemental composition", sp.Name)
		}
		for el, c := range sp.Composition {
			if c < 0 {
				return nil, fmt.Errorf("equilibrium: species %s has a negative count of %s", sp.Name, el)
			}
			if c > 0 {
				elset[el] = true
			}
		}
	}
	for el := range elset {
		s.elements = append(s.elements, el)
	}
	sort.Strings(s.elements)
	s.a = make([][]float64, len(species))
	for j, sp := range species {
		s.a[j] = make([]float64, len(s.elements))
		for i, el := range s.elements {
			s.a[j][i] = float64(sp.Composition[el])
		}
	}
	return s, nil
}

// Species returns the species of the system in the order given.
func (s *System) Species() []Species { return s.species }

// Index returns the position of the named species, or -1.
func (s *System) Index(name string) int {
	for j, sp := range s.species {
		if sp.Name == name {
			return j
		}
	}
	return -1
}

// Problem says which equilibrium to compute.
type Problem struct {
	// Feed holds the initial amount (mol, any scale) of each species of the
	// system, by index; it fixes the element totals and, for adiabatic
	// problems, the enthalpy or internal energy.
	Feed []float64
	// T (K) and P (Pa) are the temperature and pressure of the feed, and the
	// equilibrium temperature and pressure of a non-adiabatic problem.
	T, P float64
	// Adiabatic: find the equilibrium temperature at which the enthalpy
	// (constant pressure) or internal energy (constant volume) equals the
	// feed's at T.
	Adiabatic bool
	// ConstantVolume holds the volume of the feed at T and P fixed instead
	// of the pressure.
	ConstantVolume bool
	// MaxIterations bounds the Newton steps of one composition solve
	// (default 400).
	MaxIterations int
}

// Result is an equilibrium state. Amounts are on the scale of the feed.
type Result struct {
	T float64 // K
	P float64 // Pa
	V float64 // m3 for the feed amounts
	// Moles and MoleFractions are per species of the system, by index.
	Moles         []float64
	MoleFractions []float64
	// N is the total amount (mol).
	N float64
	// H and U are the enthalpy and internal energy of the mixture (J, for
	// the feed amounts, formation scale); S its entropy (J/K) and G = H − T S.
	H, U, S, G float64
	// ElementPotentials are π_i = λ_i/(R T) by element symbol.
	ElementPotentials map[string]float64
	// Iterations counts the Newton steps of the last composition solve;
	// TemperatureIterations the outer steps of an adiabatic search.
	Iterations, TemperatureIterations int
	// Excluded lists species left out because they hold an element absent
	// from the feed (their amount is exactly zero).
	Excluded []string
}

// ConvergenceError is returned when a solve does not converge within its
// iteration bound.
type ConvergenceError struct {
	What       string
	Iterations int
	Residual   float64
}

func (e *ConvergenceError) Error() string {
	return fmt.Sprintf("equilibrium: %s did not converge in %d iterations (residual %.3g)", e.What, e.Iterations, e.Residual)
}

// Solve computes the equilibrium the problem describes.
func (s *System) Solve(ctx context.Context, p Problem) (*Result, error) {
	if len(p.Feed) != len(s.species) {
		return nil, fmt.Errorf("equilibrium: feed has %d amounts for %d species", len(p.Feed), len(s.species))
	}
	if !(p.T >= TMin && p.T <= TMax) {
		return nil, fmt.Errorf("equilibrium: temperature %g K outside %g–%g K", p.T, TMin, TMax)
	}
	if !(p.P > 0) || math.IsInf(p.P, 0) {
		return nil, fmt.Errorf("equilibrium: pressure must be positive, not %g Pa", p.P)
	}
	nFeed := 0.0
	for j, n := range p.Feed {
		if n < 0 || math.IsNaN(n) || math.IsInf(n, 0) {
			return nil, fmt.Errorf("equilibrium: amount of %s must be a non-negative number, not %g", s.species[j].Name, n)
		}
		nFeed += n
	}
	if !(nFeed > 0) {
		return nil, errors.New("equilibrium: the feed is empty")
	}
	if p.MaxIterations <= 0 {
		p.MaxIterations = 400
	}
	// Work on one mole of feed; scale back at the end.
	feed := make([]float64, len(p.Feed))
	for j, n := range p.Feed {
		feed[j] = n / nFeed
	}
	sub, err := s.reduce(feed)
	if err != nil {
		return nil, err
	}
	V := R * p.T / p.P // m3 for one mole of feed at T, P
	var st *state
	switch {
	case !p.Adiabatic:
		st, err = sub.solveAt(ctx, p.T, p.P, V, p.ConstantVolume, p.MaxIterations, nil)
	case !p.ConstantVolume:
		h0 := 0.0
		for j, n := range feed {
			if n > 0 {
				h0 += n * s.species[j].Thermo.H(p.T)
			}
		}
		st, err = sub.adiabatic(ctx, func(st *state) float64 { return st.h }, h0, p, V)
	default:
		u0 := 0.0
		for j, n := range feed {
			if n > 0 {
				u0 += n * (s.species[j].Thermo.H(p.T) - R*p.T)
			}
		}
		st, err = sub.adiabatic(ctx, func(st *state) float64 { return st.h - st.n*R*st.T }, u0, p, V)
	}
	if err != nil {
		return nil, err
	}
	return sub.result(st, nFeed), nil
}

// subsystem is the system restricted to the elements of one feed.
type subsystem struct {
	sys      *System
	idx      []int       // system index of each active species
	elements []string    // active elements (independent rows)
	a        [][]float64 // a[k][i] for active species k
	b        []float64   // element totals per mole of feed
	excluded []string
	outer    int // steps of the last adiabatic search
}

// reduce keeps the elements present in the feed and the species made only of
// them, and drops element rows that are linear combinations of others (they
// hold no extra constraint for species built from the same atoms).
func (s *System) reduce(feed []float64) (*subsystem, error) {
	b := make([]float64, len(s.elements))
	for j, n := range feed {
		for i := range s.elements {
			b[i] += n * s.a[j][i]
		}
	}
	sub := &subsystem{sys: s}
	for j, sp := range s.species {
		ok := true
		for i := range s.elements {
			if s.a[j][i] > 0 && b[i] == 0 {
				ok = false
				break
			}
		}
		if ok {
			sub.idx = append(sub.idx, j)
		} else {
			sub.excluded = append(sub.excluded, sp.Name)
		}
	}
	var rows []int
	for i := range s.elements {
		if b[i] > 0 {
			rows = append(rows, i)
		}
	}
	// Independent element rows by Gram–Schmidt over the active species.
	var basis [][]float64
	var keep []int
	for _, i := range rows {
		v := make([]float64, len(sub.idx))
		for k, j := range sub.idx {
			v[k] = s.a[j][i]
		}
		norm0 := math.Sqrt(dot(v, v))
		for _, u := range basis {
			c := dot(v, u)
			for k := range v {
				v[k] -= c * u[k]
			}
		}
		norm := math.Sqrt(dot(v, v))
		if norm <= 1e-10*norm0 {
			continue
		}
		for k := range v {
			v[k] /= norm
		}
		basis = append(basis, v)
		keep = append(keep, i)
	}
	if len(keep) == 0 {
		return nil, errors.New("equilibrium: the feed holds no atoms")
	}
	for _, i := range keep {
		sub.elements = append(sub.elements, s.elements[i])
		sub.b = append(sub.b, b[i])
	}
	sub.a = make([][]float64, len(sub.idx))
	for k, j := range sub.idx {
		sub.a[k] = make([]float64, len(keep))
		for r, i := range keep {
			sub.a[k][r] = s.a[j][i]
		}
	}
	return sub, nil
}

func dot(x, y []float64) float64 {
	s := 0.0
	for i := range x {
		s += x[i] * y[i]
	}
	return s
}

// state is a converged composition of a subsystem.
type state struct {
	T, P, V float64
	lnn     []float64 // ln n_k per active species
	n       float64   // total amount
	pi      []float64 // element potentials
	h, sEnt float64   // mixture H (J) and S (J/K)
	iter    int
}

// solveAt computes the equilibrium composition at T and P (or at T and V
// when constV), starting from warm (a previous composition) when given.
func (sub *subsystem) solveAt(ctx context.Context, T, P, V float64, constV bool, maxIter int, warm *state) (*state, error) {
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	ns, ne := len(sub.idx), len(sub.elements)
	g := make([]float64, ns) // G°/(R T)
	for k, j := range sub.idx {
		th := sub.sys.species[j].Thermo
		g[k] = (th.H(T) - T*th.S(T)) / (R * T)
		if math.IsNaN(g[k]) || math.IsInf(g[k], 0) {
			return nil, fmt.Errorf("equilibrium: the thermochemistry of %s is not finite at %.0f K", sub.sys.species[j].Name, T)
		}
	}
	lnn := make([]float64, ns)
	n := 1.0
	if constV {
		n = P * V / (R * T)
	}
	if warm != nil {
		copy(lnn, warm.lnn)
		n = warm.n
	} else {
		for k := range lnn {
			lnn[k] = math.Log(n / float64(ns))
		}
	}
	lnP := math.Log(P / PStd)
	lnVT := math.Log(R * T / (V * PStd)) // ln(R T/(V P°)) for constant volume
	size := ne
	if !constV {
		size++
	}
	A := mat.NewDense(size, size, nil)
	rhs := mat.NewVecDense(size, nil)
	x := mat.NewVecDense(size, nil)
	mu := make([]float64, ns)
	nj := make([]float64, ns)
	dln := make([]float64, ns)
	bmax := 0.0
	for _, v := range sub.b {
		bmax = math.Max(bmax, v)
	}
	const (
		tol      = 1e-11
		traceLn  = -18.420680743952367 // ln 1e-8: below this a species is a trace species
		traceCap = -9.210340371976184  // ln 1e-4: a trace species may rise to this in one step
	)
	residual := math.Inf(1)
	for it := 1; it <= maxIter; it++ {
		if it%32 == 0 {
			if err := ctx.Err(); err != nil {
				return nil, err
			}
		}
		lnN := math.Log(n)
		sumN := 0.0
		for k := range lnn {
			nj[k] = math.Exp(lnn[k])
			sumN += nj[k]
			if constV {
				mu[k] = g[k] + lnn[k] + lnVT
			} else {
				mu[k] = g[k] + lnn[k] - lnN + lnP
			}
		}
		A.Zero()
		for r := 0; r < ne; r++ {
			br := 0.0
			s := 0.0
			for k := 0; k < ns; k++ {
				if sub.a[k][r] == 0 {
					continue
				}
				w := sub.a[k][r] * nj[k]
				br += w
				s += w * mu[k]
				for c := 0; c <= r; c++ {
					A.Set(r, c, A.At(r, c)+w*sub.a[k][c])
				}
			}
			for c := 0; c < r; c++ {
				A.Set(c, r, A.At(r, c))
			}
			rhs.SetVec(r, sub.b[r]-br+s)
			if !constV {
				A.Set(r, ne, br)
				A.Set(ne, r, br)
			}
		}
		if !constV {
			s := 0.0
			for k := range nj {
				s += nj[k] * mu[k]
			}
			A.Set(ne, ne, sumN-n)
			rhs.SetVec(ne, n-sumN+s)
		}
		if err := x.SolveVec(A, rhs); err != nil {
			var c mat.Condition
			if !errors.As(err, &c) {
				return nil, fmt.Errorf("equilibrium: singular Newton system at %.0f K: %w", T, err)
			}
		}
		dlnN := 0.0
		if !constV {
			dlnN = x.AtVec(ne)
		}
		// Step and damping.
		maxMajor := 5 * math.Abs(dlnN)
		lambda2 := 1.0
		for k := range lnn {
			d := -mu[k] + dlnN
			for r := 0; r < ne; r++ {
				d += sub.a[k][r] * x.AtVec(r)
			}
			dln[k] = d
			rel := lnn[k] - lnN
			if rel > traceLn {
				maxMajor = math.Max(maxMajor, math.Abs(d))
			} else if d-dlnN > 0 {
				if l := math.Abs((-rel + traceCap) / (d - dlnN)); l < lambda2 {
					lambda2 = l
				}
			}
		}
		lambda := 1.0
		if maxMajor > 2 {
			lambda = 2 / maxMajor
		}
		lambda = math.Min(lambda, lambda2)
		if math.IsNaN(lambda) {
			return nil, fmt.Errorf("equilibrium: Newton step is not a number at %.0f K", T)
		}
		// Convergence: relative changes of every amount, of the total, and
		// the element balances.
		residual = math.Abs(dlnN) * n / sumN
		for k := range lnn {
			residual = math.Max(residual, nj[k]*math.Abs(dln[k])/sumN)
		}
		for r := 0; r < ne; r++ {
			br := 0.0
			for k := 0; k < ns; k++ {
				br += sub.a[k][r] * nj[k]
			}
			residual = math.Max(residual, math.Abs(sub.b[r]-br)/bmax)
		}
		floor := lnN - 700 // keeps trace amounts representable
		for k := range lnn {
			lnn[k] = math.Max(lnn[k]+lambda*dln[k], floor)
		}
		if !constV {
			n *= math.Exp(lambda * dlnN)
		} else {
			n = 0
			for k := range lnn {
				n += math.Exp(lnn[k])
			}
		}
		if residual < tol && lambda == 1 {
			pi := make([]float64, ne)
			for r := range pi {
				pi[r] = x.AtVec(r)
			}
			return sub.finish(T, P, V, constV, lnn, n, pi, it), nil
		}
	}
	return nil, &ConvergenceError{What: fmt.Sprintf("composition at %.1f K", T), Iterations: maxIter, Residual: residual}
}

// finish fills in the state's properties from a converged composition.
func (sub *subsystem) finish(T, P, V float64, constV bool, lnn []float64, n float64, pi []float64, iter int) *state {
	st := &state{T: T, P: P, V: V, lnn: lnn, pi: pi, iter: iter}
	sum := 0.0
	for k := range lnn {
		sum += math.Exp(lnn[k])
	}
	st.n = sum
	if constV {
		st.P = sum * R * T / V
	} else {
		st.V = sum * R * T / P
	}
	for k, j := range sub.idx {
		nk := math.Exp(lnn[k])
		if nk == 0 {
			continue
		}
		th := sub.sys.species[j].Thermo
		st.h += nk * th.H(T)
		st.sEnt += nk * (th.S(T) - R*math.Log(nk/sum) - R*math.Log(st.P/PStd))
	}
	return st
}

// adiabatic finds the temperature at which energy(state) equals target: a
// bracketed secant search (Illinois variant of regula falsi) over
// [TMin, TMax], each step warm-started from the previous composition.
func (sub *subsystem) adiabatic(ctx context.Context, energy func(*state) float64, target float64, p Problem, V float64) (*state, error) {
	const maxOuter = 100
	solve := func(T float64, warm *state) (*state, float64, error) {
		st, err := sub.solveAt(ctx, T, p.P, V, p.ConstantVolume, p.MaxIterations, warm)
		if err != nil && warm != nil {
			st, err = sub.solveAt(ctx, T, p.P, V, p.ConstantVolume, p.MaxIterations, nil)
		}
		if err != nil {
			return nil, 0, err
		}
		return st, energy(st) - target, nil
	}
	// The equilibrium energy rises with T: start from the feed temperature
	// and step up (combustion) or down by 500 K until the sign changes, so
	// that the thermo is evaluated far from the answer only when needed.
	const step = 500.0
	T0 := p.T
	st0, f0, err := solve(T0, nil)
	if err != nil {
		return nil, err
	}
	if f0 == 0 {
		sub.outer = 0
		return st0, nil
	}
	lo, hi := T0, T0
	fLo, fHi := f0, f0
	warm := st0
	for fLo > 0 || fHi < 0 {
		if fHi < 0 { // too cold: raise the upper end
			if hi >= TMax {
				return nil, fmt.Errorf("equilibrium: the adiabatic temperature is above %g K (the mixture releases more energy than %g K of products can hold)", TMax, TMax)
			}
			lo, fLo = hi, fHi
			hi = math.Min(hi+step, TMax)
			st, f, err := solve(hi, warm)
			if err != nil {
				return nil, err
			}
			fHi, warm = f, st
		} else { // too hot: lower the lower end
			if lo <= TMin {
				return nil, fmt.Errorf("equilibrium: the adiabatic temperature is below %g K", TMin)
			}
			hi, fHi = lo, fLo
			lo = math.Max(lo-step, TMin)
			st, f, err := solve(lo, warm)
			if err != nil {
				return nil, err
			}
			fLo, warm = f, st
		}
	}
	scale := math.Max(math.Abs(target), R*1000) // J per mole of feed
	side := 0
	for it := 1; it <= maxOuter; it++ {
		T := (lo*fHi - hi*fLo) / (fHi - fLo)
		if !(T > lo && T < hi) {
			T = (lo + hi) / 2
		}
		st, f, err := solve(T, warm)
		if err != nil {
			return nil, err
		}
		warm = st
		if math.Abs(f) < 1e-9*scale || hi-lo < 1e-6 {
			sub.outer = it
			return st, nil
		}
		if f < 0 {
			lo, fLo = T, f
			if side == -1 {
				fHi /= 2
			}
			side = -1
		} else {
			hi, fHi = T, f
			if side == 1 {
				fLo /= 2
			}
			side = 1
		}
	}
	return nil, &ConvergenceError{What: "adiabatic temperature search", Iterations: maxOuter, Residual: (hi - lo)}
}

// result converts a state to the caller's scale (nFeed moles of feed).
func (sub *subsystem) result(st *state, nFeed float64) *Result {
	s := sub.sys
	r := &Result{
		T: st.T, P: st.P, V: st.V * nFeed,
		Moles:                 make([]float64, len(s.species)),
		MoleFractions:         make([]float64, len(s.species)),
		N:                     st.n * nFeed,
		H:                     st.h * nFeed,
		S:                     st.sEnt * nFeed,
		ElementPotentials:     map[string]float64{},
		Iterations:            st.iter,
		TemperatureIterations: sub.outer,
		Excluded:              sub.excluded,
	}
	r.U = r.H - r.N*R*r.T
	r.G = r.H - r.T*r.S
	for k, j := range sub.idx {
		nk := math.Exp(st.lnn[k])
		r.Moles[j] = nk * nFeed
		r.MoleFractions[j] = nk / st.n
	}
	for i, el := range sub.elements {
		r.ElementPotentials[el] = st.pi[i]
	}
	return r
}

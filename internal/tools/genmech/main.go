// Command genmech writes a large, valid, generated kiln mechanism to stdout
// for tests and benchmarks:
//
//	go run ./internal/tools/genmech -molecules 10000 -seed 1 > big.kiln
package main

import (
	"flag"
	"fmt"
	"os"

	"kiln.dev/kiln/internal/mechgen"
)

func main() {
	n := flag.Int("molecules", 1000, "number of distinct molecules (each adds a radical and three reactions)")
	seed := flag.Int64("seed", 1, "random seed")
	maxHeavy := flag.Int("max-heavy", 12, "largest molecule in heavy atoms")
	flag.Parse()
	if *n < 1 || *maxHeavy < 2 {
		fmt.Fprintln(os.Stderr, "genmech: -molecules must be ≥ 1 and -max-heavy ≥ 2")
		os.Exit(2)
	}
	out := mechgen.Generate(mechgen.Options{Seed: *seed, Molecules: *n, MaxHeavy: *maxHeavy})
	if _, err := os.Stdout.Write(out); err != nil {
		fmt.Fprintln(os.Stderr, "genmech:", err)
		os.Exit(1)
	}
}

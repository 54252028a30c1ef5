package molecule
import "testing"
func BenchmarkParseOnly(b *testing.B){ for b.Loop(){ ParseSMILES(thirtyAtoms) } }
func BenchmarkCanonOnly(b *testing.B){ m,_:=ParseSMILES(thirtyAtoms); for b.Loop(){ m.Canonical() } }

package benson

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestBridgedBenzeneSpelling: a benzene ring bridged across its para
// positions lies in three six-membered relevant cycles, two of which an SSSR
// may pick without the benzene ring; benzenoid atoms are found among the
// relevant cycles, so every spelling types the bridge's neighbour as Cb and
// names the same missing group (tester10: one spelling asked for
// C-(N)(S)(Cd)(H), which supplying did not help in the other).
func TestBridgedBenzeneSpelling(t *testing.T) {
	var msgs []string
	for _, smi := range []string{"c1cc2ccc1C(N)S2", "c1cc2C(N)Sc1cc2", "NC1Sc2ccc1cc2"} {
		_, err := Estimate(parse(t, smi), Options{})
		require.Error(t, err, smi)
		msgs = append(msgs, err.Error())
		assert.Contains(t, err.Error(), "C-(N)(S)(Cb)(H)", smi)
	}
	for _, m := range msgs[1:] {
		assert.Equal(t, msgs[0], m)
	}
}

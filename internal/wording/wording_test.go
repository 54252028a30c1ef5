package wording

import (
	"testing"

	"github.com/stretchr/testify/assert"
)

func TestCount(t *testing.T) {
	assert.Equal(t, "0 reactions", Count(0, "reaction"))
	assert.Equal(t, "1 reaction", Count(1, "reaction"))
	assert.Equal(t, "2 reactions", Count(2, "reaction"))
	assert.Equal(t, "1 unpaired electron", Count(1, "unpaired electron"))
	assert.Equal(t, "1 species", CountAs(1, "species", "species"))
	assert.Equal(t, "1 neighbour", Count(1, "neighbour"))
}

package analysis

import (
	"encoding/json"
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestNumberSettingKeys: the table of numeric settings names every json key
// of SettingsInput but "units", each for the field that key decodes into.
func TestNumberSettingKeys(t *testing.T) {
	var tags []string
	typ := reflect.TypeOf(SettingsInput{})
	for i := range typ.NumField() {
		tag, _, _ := strings.Cut(typ.Field(i).Tag.Get("json"), ",")
		if tag != "units" {
			tags = append(tags, tag)
		}
	}
	keys := NumberSettingKeys()
	assert.ElementsMatch(t, tags, keys)
	for _, k := range keys {
		var in SettingsInput
		require.NoError(t, json.Unmarshal([]byte(`{"`+k+`": 7}`), &in))
		var s Settings
		for _, n := range in.numbers(&s) {
			assert.Equal(t, n.key == k, n.v != nil, "key %s, table entry %s", k, n.key)
		}
	}
}

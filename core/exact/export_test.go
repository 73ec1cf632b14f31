package exact

import "testing"

// watchLayers shows fn each layer built until the test ends.
func watchLayers(t *testing.T, fn func(*layer)) {
	t.Helper()
	layerBuilt = fn
	t.Cleanup(func() { layerBuilt = nil })
}

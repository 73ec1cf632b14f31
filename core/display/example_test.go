package display_test

import (
	"fmt"

	"midrank/core/display"
)

func ExampleRough() {
	fmt.Println(display.Rough(52300), "|", display.Rough(8.8e8), "|", display.Rough(1.23e9))
	// Output: 52,300 | 880 million | 1.2 billion
}

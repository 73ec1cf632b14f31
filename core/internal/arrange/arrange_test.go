package arrange

import "fmt"

// The arrangements of two a's and one b, each once.
func ExampleNext() {
	a := []int{0, 0, 1}
	for {
		fmt.Println(a)
		if !Next(a) {
			break
		}
	}
	// Output:
	// [0 0 1]
	// [0 1 0]
	// [1 0 0]
}

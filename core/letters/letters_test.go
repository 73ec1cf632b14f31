package letters

import (
	"fmt"
	"reflect"
	"strings"
	"testing"
)

func TestDisplay(t *testing.T) {
	tests := []struct {
		k      int
		differ [][2]int
		want   []string
	}{
		{3, nil, []string{"a", "a", "a"}},
		{3, [][2]int{{0, 1}, {0, 2}, {1, 2}}, []string{"a", "b", "c"}},
		// a chain: 0 differs from 2 only (common practice: the classic "a ab b")
		{3, [][2]int{{0, 2}}, []string{"a", "ab", "b"}},
		{4, [][2]int{{0, 3}, {1, 3}}, []string{"a", "a", "ab", "b"}},
	}
	for _, tt := range tests {
		differ := func(a, b int) bool {
			for _, p := range tt.differ {
				if (p[0] == a && p[1] == b) || (p[0] == b && p[1] == a) {
					return true
				}
			}
			return false
		}
		got := Display(tt.k, differ)
		if !reflect.DeepEqual(got, tt.want) {
			t.Errorf("Display(%d, %v) = %v, want %v", tt.k, tt.differ, got, tt.want)
		}
		// consistency: two groups share a letter exactly when they do not differ
		for a := 0; a < tt.k; a++ {
			for b := a + 1; b < tt.k; b++ {
				if share(got[a], got[b]) == differ(a, b) {
					t.Errorf("groups %d (%s) and %d (%s): share %v, differ %v", a, got[a], b, got[b], share(got[a], got[b]), differ(a, b))
				}
			}
		}
	}
}

func share(x, y string) bool {
	return strings.ContainsAny(x, y)
}

func ExampleDisplay() {
	// four groups; group 3 differs from groups 0 and 1
	fmt.Println(Display(4, func(a, b int) bool { return b == 3 && a < 2 }))
	// Output: [a a ab b]
}

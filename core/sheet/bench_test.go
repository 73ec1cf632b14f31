package sheet

import (
	"testing"

	"midrank/core/testfiles"
)

// BenchmarkXLSX20MB opens a 21 MB .xlsx file (1,000,000 rows × 4 columns)
// and makes its sheet's text: the target is 5 s in the page's module (make
// bench-wasm; the browser test logs the time in the tab).
func BenchmarkXLSX20MB(b *testing.B) {
	data := testfiles.BigXLSX(1_000_000)
	b.SetBytes(int64(len(data)))
	b.ReportMetric(float64(len(data))/(1<<20), "MB-packed")
	for b.Loop() {
		book, err := Open(data)
		if err != nil {
			b.Fatal(err)
		}
		if _, err := book.Text(0); err != nil {
			b.Fatal(err)
		}
	}
}

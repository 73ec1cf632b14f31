package montecarlo

import (
	"context"
	"strings"
	"testing"
)

// TestPartRefuses: a job that does not hold together, or chunks it does
// not have, are refused with a message.
func TestPartRefuses(t *testing.T) {
	good := hJob([]int{2, 2}, []int64{0, 1, 2, 3}, []int64{1, 5}, 5000, 1)
	if _, err := Part(context.Background(), good, 0, 3); err == nil || !strings.Contains(err.Error(), "not among") {
		t.Errorf("chunks beyond the job: %v", err)
	}
	for _, text := range []string{`{}`, `[`, `{"kind":"h","resamples":0,"seed":1,"lists":{}}`,
		`{"kind":"h","resamples":5000,"seed":1,"lists":{"sizes":[2,"x"]}}`} {
		if _, err := ParseJob([]byte(text)); err == nil {
			t.Errorf("ParseJob(%s) accepted", text)
		}
	}
	for _, text := range []string{`{"kind":"h","resamples":5000,"seed":1,"lists":{"sizes":[2,3],"scores":[0,1,2,3],"observed":[1,5]}}`,
		`{"kind":"dice","resamples":5000,"seed":1,"lists":{}}`} {
		j, err := ParseJob([]byte(text))
		if err != nil {
			t.Fatal(err)
		}
		if _, err := Part(context.Background(), j, 0, 1); err == nil {
			t.Errorf("Part of %s ran", text)
		}
	}
	back, err := ParseJob(good.JSON())
	if err != nil || back.Resamples != good.Resamples || len(back.Lists["scores"]) != 4 {
		t.Errorf("ParseJob(JSON()) = %+v, %v", back, err)
	}
	if _, err := Part(context.Background(), hJob([]int{1, 1}, []int64{0, 1 << 60}, []int64{0, 1 << 60}, 10, 1), 0, 1); err == nil {
		t.Error("a job whose sums are beyond exact comparison was run")
	}
}

// FuzzParseJob: whatever the bytes, ParseJob gives an error or a job whose
// parts can be run without a panic.
func FuzzParseJob(f *testing.F) {
	f.Add(hJob([]int{2, 2}, []int64{0, 1, 2, 3}, []int64{1, 5}, 5000, 1).JSON())
	f.Add([]byte(`{"kind":"h","resamples":1,"seed":0,"lists":{"sizes":[1],"scores":[-5],"observed":[-5]}}`))
	f.Fuzz(func(t *testing.T, b []byte) {
		j, err := ParseJob(b)
		if err != nil || j.Resamples > 20_000 || len(j.Lists["scores"]) > 100 || len(j.Lists["groups"]) > 100 {
			return
		}
		Part(context.Background(), j, 0, j.chunks())
	})
}

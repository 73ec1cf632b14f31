//go:build js && wasm

package main

import (
	"midrank/core"
	"os"
	"path/filepath"
	"strings"
	"syscall/js"
	"testing"

	"midrank/core/testfiles"
)

func module() js.Value {
	if m := js.Global().Get("midrank"); !m.IsUndefined() {
		return m
	}
	register()
	return js.Global().Get("midrank")
}

// TestAnswersMatchGolden calls globalThis.midrank.analyze the way the
// page's worker does and expects, byte for byte, the answers pinned in
// testdata/cases, which the command line's --json also prints.
func TestAnswersMatchGolden(t *testing.T) {
	const dir = "../testdata/cases"
	cases, err := testfiles.Cases(os.DirFS(dir))
	if err != nil {
		t.Fatal(err)
	}
	m := module()
	for _, c := range cases {
		data, err := os.ReadFile(filepath.Join(dir, c.Input))
		if err != nil {
			t.Fatal(err)
		}
		options := ""
		if c.Options != "" {
			b, err := os.ReadFile(filepath.Join(dir, c.Options))
			if err != nil {
				t.Fatal(err)
			}
			options = string(b)
		}
		want, err := os.ReadFile(filepath.Join(dir, c.Golden))
		if err != nil {
			t.Fatal(err)
		}
		asString := m.Call("analyze", string(data), options).String()
		bytes := js.Global().Get("Uint8Array").New(len(data))
		js.CopyBytesToJS(bytes, data)
		asBytes := m.Call("analyze", bytes, options).String()
		if asString != string(want) || asBytes != string(want) {
			t.Errorf("%s: module answered\n%.300s\nwant\n%.300s", c.Name, asString, want)
		}
	}
}

func TestByteOrderMarkAndPages(t *testing.T) {
	m := module()
	got := m.Call("analyze", "\uFEFFA,B\n1,2\n3,3\n", `{"alpha":0.1}`).String()
	if !strings.Contains(got, `"n":4`) || !strings.Contains(got, `"alpha":0.1`) {
		t.Fatalf("analyze with a byte-order mark = %s", got)
	}
	page := m.Call("page", "ranks", 1, 2).String()
	if want := `{"list":"ranks","offset":1,"total":4,"ranks":[{"group":"B","value":2,"rank":2,"line":2,"shared":1},{"group":"A","value":3,"rank":3.5,"line":3,"shared":2}]}`; page != want+"\n" {
		t.Errorf("page = %s, want %s", page, want)
	}
	if bad := m.Call("page", "groups", 0, 1).String(); !strings.Contains(bad, `"error"`) {
		t.Errorf("page of an unknown list = %s, want an error", bad)
	}
	if bad := m.Call("analyze", "A\n1\n", `{"alpha":`).String(); !strings.Contains(bad, `"option":"options"`) {
		t.Errorf("analyze with broken options = %s, want an options error", bad)
	}
}

func TestPreview(t *testing.T) {
	m := module()
	data := "A,B\n1,x\n2,3\n"
	want := string(core.EncodePreview(core.PreviewOf([]byte(data), core.Options{})))
	if got := m.Call("preview", data, "").String(); got != want || !strings.Contains(got, `"line":2,"column":2`) {
		t.Errorf("preview = %s, want %s", got, want)
	}
}

// TestWorkspace: the preview comes first, through its callback, and the
// answer is analyze's for the edits that apply.
func TestWorkspace(t *testing.T) {
	m := module()
	data := "A,B,C\n1,2,3\n4,5,6\n7,8,9\n"
	var previews []string
	cb := js.FuncOf(func(_ js.Value, args []js.Value) any {
		previews = append(previews, args[0].String())
		return nil
	})
	defer cb.Release()
	got := await(m.Call("workspace", data, `{"exclude":["B","Z"]}`, cb)).String()
	want := m.Call("analyze", data, `{"exclude":["B"]}`).String()
	if got != want || len(previews) != 1 || !strings.Contains(previews[0], `"groups":[{"label":"A"`) {
		t.Errorf("workspace = %.200s with previews %q, want %.200s", got, previews, want)
	}
}

// await waits for a Promise and gives what it resolves to.
func await(promise js.Value) js.Value {
	done := make(chan js.Value, 1)
	then := js.FuncOf(func(_ js.Value, args []js.Value) any { done <- args[0]; return nil })
	defer then.Release()
	promise.Call("then", then)
	return <-done
}

// TestFarm: a Monte Carlo estimate shared with a farm of helpers — here
// JavaScript functions that run monteCarloPart in this same module, as the
// page's other workers do — is the estimate made alone, to the last bit.
func TestFarm(t *testing.T) {
	m := module()
	data := "A,B,C\n1,2,3\n4,5,6\n7,8,9\n10,11,2\n"
	const options = `{"pvalue":"monte-carlo","resamples":100000,"posthoc":"none"}`
	noop := js.FuncOf(func(js.Value, []js.Value) any { return nil })
	defer noop.Release()
	parts := 0
	share := js.FuncOf(func(_ js.Value, args []js.Value) any {
		parts++
		answer := m.Call("monteCarloPart", args[0], args[1], args[2]).String()
		exceed := js.Global().Get("JSON").Call("parse", answer).Get("exceed")
		return js.Global().Get("Promise").Call("resolve", exceed)
	})
	defer share.Release()
	farm := js.ValueOf(map[string]any{"helpers": 2, "share": share})
	shared := await(m.Call("workspace", data, options, noop, js.Undefined(), farm)).String()
	alone := m.Call("analyze", data, options).String()
	if shared != alone || parts != 2 {
		t.Errorf("with a farm (%d parts shared):\n%.300s\nalone:\n%.300s", parts, shared, alone)
	}
	if bad := m.Call("monteCarloPart", `{"sizes":[1]}`, 0, 1).String(); !strings.Contains(bad, `"error"`) {
		t.Errorf("a bad job: %s", bad)
	}
}

func TestProgressCallback(t *testing.T) {
	m := module()
	calls := 0
	cb := js.FuncOf(func(_ js.Value, args []js.Value) any {
		if args[0].String() != "monte-carlo" || args[1].Int() > args[2].Int() {
			t.Errorf("progress(%v, %v, %v)", args[0], args[1], args[2])
		}
		calls++
		return nil
	})
	defer cb.Release()
	got := m.Call("analyze", "A,B,C\n1,2,3\n4,5,6\n7,8,9\n", `{"pvalue":"monte-carlo","resamples":50000}`, cb).String()
	if !strings.Contains(got, `"p_method":"monte-carlo"`) || calls == 0 {
		t.Errorf("analyze = %.200s with %d progress calls", got, calls)
	}
}

func TestLinks(t *testing.T) {
	m := module()
	made := m.Call("link", "A,B\n1,2\n3,4\n", `{"alpha":0.1,"posthoc":"conover"}`).String()
	if !strings.Contains(made, `"link":"#r1.`) {
		t.Fatalf("link = %s", made)
	}
	frag := made[strings.Index(made, "#r1."):strings.LastIndex(made, `"`)]
	opened := m.Call("openLink", frag).String()
	if !strings.Contains(opened, `"data":"A,B\n1,2\n3,4\n"`) || !strings.Contains(opened, `"alpha":0.1`) || !strings.Contains(opened, `"posthoc":"conover"`) {
		t.Errorf("openLink = %s", opened)
	}
	if bad := m.Call("openLink", "#r1.%%%").String(); !strings.Contains(bad, "cannot be opened") {
		t.Errorf("openLink of a broken link = %s", bad)
	}
}

// TestBadArguments: wrong arguments get an error answer that names what is
// wrong, a progress callback that throws does not stop the analysis, and the
// module keeps answering afterwards.
func TestBadArguments(t *testing.T) {
	m := module()
	data := "A,B,C\n1,2,3\n4,5,6\n7,8,9\n"
	m.Call("analyze", data, "")
	for _, c := range []struct {
		name string
		args []any
		says string
	}{
		{"page", []any{"ranks", "x", 1}, "offset must be a whole number"},
		{"page", []any{"ranks", 1e300, 1e300}, "offset must be a whole number"},
		{"page", []any{"ranks", 0, -1}, "count must be a whole number"},
		{"page", []any{7, 0, 1}, "needs a list name"},
		{"analyze", []any{12, ""}, "the data must be text or a Uint8Array"},
		{"analyze", []any{data, 5}, "the options must be JSON text or an object"},
		{"analyze", []any{data, "", "not a function"}, "must be a function"},
		{"openLink", []any{nil}, "needs the fragment"},
	} {
		if got := m.Call(c.name, c.args...).String(); !strings.Contains(got, `"error"`) || !strings.Contains(got, c.says) {
			t.Errorf("%s%v = %.300s, want an error saying %q", c.name, c.args, got, c.says)
		}
	}
	// options as an object are read, not ignored
	asObject := m.Call("analyze", data, js.ValueOf(map[string]any{"alpha": 0.1})).String()
	if !strings.Contains(asObject, `"alpha":0.1`) {
		t.Errorf("analyze with options as an object = %.200s", asObject)
	}
	throws := js.Global().Get("Function").New("stage", "done", "total", "throw new Error('broken progress bar')")
	got := m.Call("analyze", data, `{"pvalue":"monte-carlo","resamples":20000}`, throws).String()
	if !strings.Contains(got, `"p_method":"monte-carlo"`) {
		t.Errorf("analyze with a throwing callback = %.300s", got)
	}
	if again := m.Call("page", "ranks", 0, 1).String(); !strings.Contains(again, `"total":9`) {
		t.Errorf("page after the bad calls = %.200s", again)
	}
}

// TestTablesFollowTheLastAnalysis: tables gives the tables of the last
// analysis, and none once an analysis has failed, so that the page can never
// show the tables of other data than it gave.
func TestTablesFollowTheLastAnalysis(t *testing.T) {
	m := module()
	m.Call("analyze", "A,B,C\n1,4,7\n2,5,8\n3,6,9\n", "")
	got := m.Call("tables").String()
	if !strings.Contains(got, `"groups":{"title":"Groups"`) || !strings.Contains(got, `"text":[["A","3","0","2",`) {
		t.Errorf("tables = %.300s", got)
	}
	m.Call("analyze", "A,B\n1,x\n", "")
	if got := m.Call("tables").String(); !strings.Contains(got, `"error"`) {
		t.Errorf("tables after a failed analysis = %.300s, want an error", got)
	}
}

// TestBattery: with several measures the workspace answers with the
// battery, tables() gives its overview and each measure's tables, and
// page() serves a measure's ranking by its index.
func TestBattery(t *testing.T) {
	m := module()
	data := "site,wait,stay\nA,3,1\nA,4,2\nB,8,2\nB,9,3\nC,1,5\nC,2,4\n"
	var previews int
	onPreview := js.FuncOf(func(js.Value, []js.Value) any { previews++; return nil })
	defer onPreview.Release()
	got := await(m.Call("workspace", data, `{"group":"site","measures":["wait","stay"],"adjust_across":"holm"}`, onPreview)).String()
	if previews != 1 || !strings.Contains(got, `"adjust_across":"holm","summary":"2 measures compared`) || !strings.Contains(got, `"measures":[{"measure":"wait","p_adjusted_across":`) {
		t.Fatalf("workspace with two measures (%d previews) = %.300s", previews, got)
	}
	tables := m.Call("tables").String()
	if !strings.Contains(tables, `"overview":{"title":"Measures at a glance"`) || strings.Count(tables, `"groups":{"title":"Groups"`) != 2 {
		t.Errorf("battery tables = %.400s", tables)
	}
	if page := m.Call("page", "ranks", 0, 10, 1).String(); !strings.Contains(page, `"ranks":[{`) {
		t.Errorf("page of the second measure = %.300s", page)
	}
	if page := m.Call("page", "ranks", 0, 10, 2).String(); !strings.Contains(page, `"error"`) {
		t.Errorf("page of a third measure of two = %.300s, want an error", page)
	}
}

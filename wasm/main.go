//go:build js && wasm

// Command wasm is the WebAssembly adapter of the statistics core. It sets
//
//	globalThis.midrank.analyze(data, optionsJSON[, onProgress]) → responseJSON
//	globalThis.midrank.preview(data, optionsJSON) → previewJSON
//	globalThis.midrank.workspace(data, optionsJSON, onPreview[, onProgress[, farm]]) → Promise of responseJSON
//	globalThis.midrank.monteCarloPart(jobJSON, from, to) → {"exceed": n}, a farm's part (see wasm/farm.go)
//	globalThis.midrank.page(list, offset, count[, measure]) → pageJSON
//	globalThis.midrank.tables() → tablesJSON
//	globalThis.midrank.link(data, optionsJSON) → {"link": "#r1.…"}
//	globalThis.midrank.findings() → the last analysis's results as shared (package findings; of every measure of a battery)
//	globalThis.midrank.resultsLink([measure]) → {"link": "#f1.…"}, a results-only link to them (to one measure of a battery)
//	globalThis.midrank.openLink(fragment) → {"data": …, "options": {…}}, or {"findings": results} for results only
//	globalThis.midrank.sheet(bytes[, sheet]) → {json: '{"format", "sheets", "sheet"}', text: Uint8Array}
//	globalThis.midrank.textFile(bytes) → {json: '{"encoding", "note"}', text: Uint8Array}, a text file made UTF-8
//	globalThis.midrank.version
//	globalThis.midrank.defaults → the default settings as options JSON
//	globalThis.midrank.limits → {"text": bytes of the largest text read, "link": characters of the longest link}
//	globalThis.midrank.menus → {"pvalue"|"posthoc"|"adjust": [{"key", "label"}, …]}, the methods offered, default first
//
// where data is the pasted text (a string, or a Uint8Array of UTF-8 bytes,
// which saves a copy), optionsJSON holds core.Options, and responseJSON is
// byte for byte what the command line prints with --json. onProgress, when
// given, is called as onProgress(stage, done, total) while an exact or Monte
// Carlo p-value is computed, at most once per percent. page serves the
// per-value ranking in text order ("ranks") or by rank ("ranked") or the tie table ("ties") of the last analysis
// in pieces, for inputs too large to list in one response (of measure i of a battery with the fourth argument). tables gives the
// last analysis's tables of results as core/tables defines and shows them
// (for several measures, the request key measures, as tables.EncodeBattery writes them),
// which the page renders from (and nothing when the last call failed). preview gives
// core.Preview: the text as a grid, how it was read, its groups as written
// and every cell that could not be read. workspace is what the page uses:
// one reading of the text serves onPreview(previewJSON), called first, and
// the analysis, with group edits that name absent labels left out; link
// leaves them out too.
package main

import (
	"cmp"
	"context"
	"errors"
	"fmt"
	"math"
	"slices"
	"syscall/js"
	"unsafe"

	"midrank/core"
	"midrank/core/jsonlite"
	"midrank/core/link"
	"midrank/core/montecarlo"
	"midrank/core/table"
	"midrank/core/tables"
	"midrank/core/textenc"
)

func main() {
	register()
	select {} // keep the module alive for later calls
}

// last is the most recent successful analysis, which page reads from, or
// lastBattery when that was of several measures.
var (
	last        *core.Result
	lastBattery *core.Battery
	lastOptions core.Options // the settings of last
)

func register() {
	js.Global().Set("midrank", js.ValueOf(map[string]any{
		"analyze":        guarded(analyze),
		"preview":        guarded(preview),
		"workspace":      promised(workspace),
		"page":           guarded(page),
		"tables":         guarded(resultTables),
		"link":           guarded(shareLink),
		"findings":       guarded(sharedFindings),
		"resultsLink":    guarded(resultsLink),
		"monteCarloPart": guarded(monteCarloPart),
		"openLink":       guarded(openLink),
		"sheet":          guarded(sheetText),
		"textFile":       guarded(textFile),
		"version":        core.Version,
		"defaults":       string(core.Defaults().JSON()),
		"limits":         limits(),
		"menus":          string(core.EncodeMenus()),
	}))
}

// limits are the bounds the page checks before it hands anything over.
func limits() string {
	var w jsonlite.Writer
	w.BeginObject()
	w.IntMember("text", table.MaxText)
	w.IntMember("link", link.MaxLink)
	w.EndObject()
	return string(w.Bytes())
}

// guarded wraps a function of the API so that whatever goes wrong inside
// (a bug, a callback that throws) comes back as an error answer instead of
// stopping the module, which would need a reload of the page.
func guarded[T string | js.Value](fn func([]js.Value) (T, error)) js.Func {
	call := guardedCall(fn)
	return js.FuncOf(func(_ js.Value, args []js.Value) any { return call(args) })
}

// guardedCall is fn with a failure or a panic turned into an error answer.
func guardedCall[T string | js.Value](fn func([]js.Value) (T, error)) func([]js.Value) any {
	return func(args []js.Value) (out any) {
		defer func() {
			if p := recover(); p != nil {
				out = string(core.EncodeError(fmt.Errorf("internal error in the module: %v; reload the page, and please report it", p)))
			}
		}()
		answer, err := fn(args)
		if err != nil {
			return string(core.EncodeError(err))
		}
		return answer
	}
}

func analyze(args []js.Value) (string, error) {
	const call = "analyze(data, optionsJSON[, onProgress])"
	data, opt, err := inputOf(call, args)
	if err != nil {
		return "", err
	}
	progress, err := progressOf(call, args, 2)
	if err != nil {
		return "", err
	}
	lastOptions = opt
	return one(core.AnalyzeContext(context.Background(), data, opt, progress))
}

func workspace(args []js.Value) (string, error) {
	const call = "workspace(data, optionsJSON, onPreview[, onProgress[, farm]])"
	data, opt, err := inputOf(call, args)
	if err != nil {
		return "", err
	}
	onPreview, err := callbackOf(call, args, 2)
	if err != nil || onPreview == nil {
		return "", cmp.Or(err, fmt.Errorf("%s needs onPreview", call))
	}
	progress, err := progressOf(call, args, 3)
	if err != nil {
		return "", err
	}
	ctx := context.Background()
	farm, err := farmOf(call, args, 4)
	if err != nil {
		return "", err
	}
	if farm != nil {
		ctx = montecarlo.WithFarm(ctx, farm)
	}
	lastOptions = opt
	if opt.Several() { // a battery: the preview follows the first measure
		onPreview(string(core.EncodePreview(core.PreviewOf(data, opt))))
		b, err := core.AnalyzeMeasures(ctx, data, opt, progress)
		return answer(nil, b, err)
	}
	return one(core.Workspace(ctx, data, opt,
		func(p core.Preview) { onPreview(string(core.EncodePreview(p))) }, progress))
}

// answer is the JSON of an analysis of one measure (r) or of several (b),
// kept for page and tables; a failure forgets the previous analysis, which
// is not of the data just given.
func answer(r *core.Result, b *core.Battery, err error) (string, error) {
	last, lastBattery = nil, nil
	if err != nil {
		return "", err
	}
	var out []byte
	if b != nil {
		out, err = core.EncodeBattery(b)
	} else {
		out, err = core.Encode(r)
	}
	if err != nil {
		return "", err
	}
	last, lastBattery = r, b
	return unsafe.String(unsafe.SliceData(out), len(out)), nil
}

// one is answer for an analysis of one measure.
func one(r *core.Result, err error) (string, error) { return answer(r, nil, err) }

func preview(args []js.Value) (string, error) {
	data, opt, err := inputOf("preview(data, optionsJSON)", args)
	if err != nil {
		return "", err
	}
	return string(core.EncodePreview(core.PreviewOf(data, opt))), nil
}

func page(args []js.Value) (string, error) {
	const call = "page(list, offset, count[, measure])"
	r := last
	if lastBattery != nil && len(args) > 3 { // the measure's 0-based index in the battery
		i, err := wholeOf(call, "measure", args[3])
		if err != nil || i >= len(lastBattery.Measures) {
			return "", cmp.Or(err, fmt.Errorf("page: the battery has %d measures", len(lastBattery.Measures)))
		}
		r = lastBattery.Measures[i].Result
	}
	if r == nil {
		return "", errors.New("page: there is no analysis yet; call analyze first")
	}
	if len(args) < 3 || args[0].Type() != js.TypeString {
		return "", fmt.Errorf("%s needs a list name and two whole numbers", call)
	}
	list := core.List(args[0].String())
	if !slices.Contains(core.Lists, list) {
		return "", errors.New(`page: the list is "ranks", "ranked" or "ties"`)
	}
	offset, err := wholeOf(call, "offset", args[1])
	if err != nil {
		return "", err
	}
	count, err := wholeOf(call, "count", args[2])
	if err != nil {
		return "", err
	}
	b, err := core.EncodePage(r.Page(list, offset, count))
	return string(b), err
}

func resultTables([]js.Value) (string, error) {
	var b []byte
	var err error
	switch {
	case lastBattery != nil:
		b, err = tables.EncodeBattery(lastBattery)
	case last != nil:
		b, err = tables.Encode(tables.Of(last))
	default:
		return "", errors.New("tables: there is no analysis of the data last given")
	}
	return string(b), err
}

// textFile makes a text file that is not UTF-8 (a Uint8Array) UTF-8:
// {json: '{"encoding", "note"}', text: a Uint8Array of the UTF-8 text}
// (package textenc; the note says how it was read).
func textFile(args []js.Value) (js.Value, error) {
	const call = "textFile(bytes)"
	if len(args) < 1 {
		return js.Value{}, fmt.Errorf("%s needs the file's bytes", call)
	}
	data, err := bytesOf(call, args[0])
	if err != nil {
		return js.Value{}, err
	}
	text, enc := textenc.ToUTF8(data)
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("encoding", string(enc))
	w.StringMember("note", core.EncodingNote(enc))
	w.EndObject()
	return bytesAnswer(w.Bytes(), text), nil
}

// bytesAnswer is {json, text: a Uint8Array copy of text}.
func bytesAnswer(json, text []byte) js.Value {
	array := js.Global().Get("Uint8Array").New(len(text))
	js.CopyBytesToJS(array, text)
	answer := js.Global().Get("Object").New()
	answer.Set("json", string(json))
	answer.Set("text", array)
	return answer
}

// sheetText opens a spreadsheet file (a Uint8Array) and gives one sheet:
// {json: '{"format", "sheets", "sheet"}' (see core.Sheets.JSON), text: a
// Uint8Array of the sheet's UTF-8 text}, the text as bytes because a sheet
// can make tens of megabytes, which JSON would escape and parse again.
func sheetText(args []js.Value) (js.Value, error) {
	const call = "sheet(bytes[, sheet])"
	if len(args) < 1 {
		return js.Value{}, fmt.Errorf("%s needs the file's bytes", call)
	}
	data, err := bytesOf(call, args[0])
	if err != nil {
		return js.Value{}, err
	}
	ref := ""
	if len(args) > 1 && args[1].Type() == js.TypeString {
		ref = args[1].String()
	}
	s, err := core.SheetText(data, ref)
	if err != nil {
		return js.Value{}, err
	}
	return bytesAnswer(s.JSON(), s.Text), nil
}

// inputOf reads the data in args[0] and the options in args[1] of call.
func inputOf(call string, args []js.Value) ([]byte, core.Options, error) {
	if len(args) < 1 {
		return nil, core.Options{}, fmt.Errorf("%s needs the data", call)
	}
	data, err := bytesOf(call, args[0])
	if err != nil {
		return nil, core.Options{}, err
	}
	opt, err := optionsOf(call, args)
	return data, opt, err
}

// wholeOf reads a whole number from 0 to 2³¹ − 1.
func wholeOf(call, name string, v js.Value) (int, error) {
	if v.Type() == js.TypeNumber {
		if f := v.Float(); f >= 0 && f <= math.MaxInt32 && f == math.Trunc(f) {
			return int(f), nil
		}
	}
	return 0, fmt.Errorf("%s: %s must be a whole number from 0 to %d, not %s", call, name, math.MaxInt32, v.Type())
}

// optionsOf reads the options in args[1]: JSON text, or an object, which is
// put through JSON.stringify; none (or undefined or null) means the defaults.
func optionsOf(call string, args []js.Value) (core.Options, error) {
	if len(args) < 2 || args[1].IsUndefined() || args[1].IsNull() {
		return core.Options{}, nil
	}
	switch v := args[1]; v.Type() {
	case js.TypeString:
		return core.DecodeOptions([]byte(v.String()))
	case js.TypeObject:
		return core.DecodeOptions([]byte(js.Global().Get("JSON").Call("stringify", v).String()))
	}
	return core.Options{}, fmt.Errorf("%s: the options must be JSON text or an object, not a %s", call, args[1].Type())
}

// callbackOf is the function in args[i], nil when none is given, wrapped so
// that an exception it throws is swallowed: a failing progress bar must not
// stop an analysis, and later calls are skipped.
func callbackOf(call string, args []js.Value, i int) (func(...any), error) {
	if len(args) <= i || args[i].IsUndefined() || args[i].IsNull() {
		return nil, nil
	}
	fn := args[i]
	if fn.Type() != js.TypeFunction {
		return nil, fmt.Errorf("%s: argument %d must be a function, not a %s", call, i+1, fn.Type())
	}
	broken := false
	return func(values ...any) {
		if broken {
			return
		}
		defer func() {
			if recover() != nil {
				broken = true
			}
		}()
		fn.Invoke(values...)
	}, nil
}

// progressOf is the progress callback in args[i], if one is given, called
// when the progress has moved by a percent or more.
func progressOf(call string, args []js.Value, i int) (core.Progress, error) {
	fn, err := callbackOf(call, args, i)
	if fn == nil || err != nil {
		return nil, err
	}
	last := -1
	return func(stage string, done, total int) {
		if pct := 100 * done / max(total, 1); pct != last {
			last = pct
			fn(stage, done, total)
		}
	}, nil
}

// bytesOf returns the data argument as bytes: a Uint8Array is copied once;
// a string is converted by syscall/js and then viewed without another copy.
func bytesOf(call string, v js.Value) ([]byte, error) {
	switch {
	case v.Type() == js.TypeString:
		s := v.String()
		return unsafe.Slice(unsafe.StringData(s), len(s)), nil
	case v.Type() == js.TypeObject && v.InstanceOf(js.Global().Get("Uint8Array")):
		b := make([]byte, v.Length())
		js.CopyBytesToGo(b, v)
		return b, nil
	}
	return nil, fmt.Errorf("%s: the data must be text or a Uint8Array, not a %s", call, v.Type())
}

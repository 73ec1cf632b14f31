//go:build js && wasm

// Command wasm is the WebAssembly adapter of the statistics core. It sets
//
//	globalThis.midrank.analyze(data, optionsJSON[, onProgress]) → responseJSON
//	globalThis.midrank.preview(data, optionsJSON) → previewJSON
//	globalThis.midrank.workspace(data, optionsJSON, onPreview[, onProgress]) → responseJSON
//	globalThis.midrank.page(list, offset, count) → pageJSON
//	globalThis.midrank.link(data, optionsJSON) → {"link": "#r1.…"}
//	globalThis.midrank.openLink(fragment) → {"data": …, "options": {…}}
//	globalThis.midrank.version
//	globalThis.midrank.defaults → the default settings as options JSON
//
// where data is the pasted text (a string, or a Uint8Array of UTF-8 bytes,
// which saves a copy), optionsJSON holds core.Options, and responseJSON is
// byte for byte what the command line prints with --json. onProgress, when
// given, is called as onProgress(stage, done, total) while an exact or Monte
// Carlo p-value is computed, at most once per percent. page serves the
// per-value ranking in text order ("ranks") or by rank ("ranked") or the tie table ("ties") of the last analysis
// in pieces, for inputs too large to list in one response. preview gives
// core.Preview: the text as a grid, how it was read, its groups as written
// and every cell that could not be read. workspace is what the page uses:
// one reading of the text serves onPreview(previewJSON), called first, and
// the analysis, with group edits that name absent labels left out; link
// leaves them out too.
package main

import (
	"context"
	"errors"
	"slices"
	"syscall/js"
	"unsafe"

	"midrank/core"
	"midrank/core/jsonlite"
)

func main() {
	register()
	select {} // keep the module alive for later calls
}

// last is the most recent successful analysis, which page reads from.
var last *core.Result

func register() {
	js.Global().Set("midrank", js.ValueOf(map[string]any{
		"analyze":   js.FuncOf(analyze),
		"preview":   js.FuncOf(preview),
		"workspace": js.FuncOf(workspace),
		"page":      js.FuncOf(page),
		"link":      js.FuncOf(shareLink),
		"openLink":  js.FuncOf(openLink),
		"version":   core.Version,
		"defaults":  string(core.Defaults().JSON()),
	}))
}

func analyze(_ js.Value, args []js.Value) any {
	if len(args) < 1 {
		return string(core.EncodeError(errors.New("analyze(data, optionsJSON) needs the data")))
	}
	opt, err := optionsOf(args)
	if err != nil {
		return string(core.EncodeError(err))
	}
	return answer(core.AnalyzeContext(context.Background(), bytesOf(args[0]), opt, progressOf(args, 2)))
}

func workspace(_ js.Value, args []js.Value) any {
	if len(args) < 3 || args[2].Type() != js.TypeFunction {
		return string(core.EncodeError(errors.New("workspace(data, optionsJSON, onPreview[, onProgress]) needs three arguments")))
	}
	opt, err := optionsOf(args)
	if err != nil {
		return string(core.EncodeError(err))
	}
	onPreview := args[2]
	return answer(core.Workspace(context.Background(), bytesOf(args[0]), opt,
		func(p core.Preview) { onPreview.Invoke(string(core.EncodePreview(p))) }, progressOf(args, 3)))
}

// answer is the JSON of an analysis, kept for page, or of its error.
func answer(r *core.Result, err error) any {
	if err != nil {
		return string(core.EncodeError(err))
	}
	b, err := core.Encode(r)
	if err != nil {
		return string(core.EncodeError(err))
	}
	last = r
	return unsafe.String(unsafe.SliceData(b), len(b))
}

func preview(_ js.Value, args []js.Value) any {
	if len(args) < 1 {
		return string(core.EncodeError(errors.New("preview(data, optionsJSON) needs the data")))
	}
	opt, err := optionsOf(args)
	if err != nil {
		return string(core.EncodeError(err))
	}
	return string(core.EncodePreview(core.PreviewOf(bytesOf(args[0]), opt)))
}

func page(_ js.Value, args []js.Value) any {
	if last == nil {
		return string(core.EncodeError(errors.New("page: there is no analysis yet; call analyze first")))
	}
	if len(args) < 3 {
		return string(core.EncodeError(errors.New("page(list, offset, count) needs three arguments")))
	}
	list := core.List(args[0].String())
	if !slices.Contains(core.Lists, list) {
		return string(core.EncodeError(errors.New(`page: the list is "ranks", "ranked" or "ties"`)))
	}
	return string(core.EncodePage(last.Page(list, args[1].Int(), args[2].Int())))
}

func shareLink(_ js.Value, args []js.Value) any {
	if len(args) < 2 {
		return string(core.EncodeError(errors.New("link(data, optionsJSON) needs two arguments")))
	}
	opt, err := optionsOf(args)
	if err != nil {
		return string(core.EncodeError(err))
	}
	data := bytesOf(args[0])
	var labels []string
	for _, g := range core.PreviewOf(data, opt).Groups {
		labels = append(labels, g.Label)
	}
	fragment, err := core.ShareLink(data, opt.ForLabels(labels))
	if err != nil {
		return string(core.EncodeError(err))
	}
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("link", fragment)
	w.EndObject()
	return string(w.Bytes())
}

func openLink(_ js.Value, args []js.Value) any {
	if len(args) < 1 {
		return string(core.EncodeError(errors.New("openLink(fragment) needs the fragment")))
	}
	req, err := core.OpenLink(args[0].String())
	if err != nil {
		return string(core.EncodeError(err))
	}
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("data", req.Data)
	w.Key("options")
	w.Raw(req.Options.JSON())
	w.EndObject()
	return string(w.Bytes())
}

// optionsOf reads the options JSON in args[1]; none means the defaults.
func optionsOf(args []js.Value) (core.Options, error) {
	if len(args) > 1 && args[1].Type() == js.TypeString {
		return core.DecodeOptions([]byte(args[1].String()))
	}
	return core.Options{}, nil
}

// progressOf is the progress callback in args[i], if one is given.
func progressOf(args []js.Value, i int) core.Progress {
	if len(args) > i && args[i].Type() == js.TypeFunction {
		return throttled(args[i])
	}
	return nil
}

// throttled calls fn when the progress has moved by a percent or more.
func throttled(fn js.Value) core.Progress {
	last := -1
	return func(stage string, done, total int) {
		if pct := 100 * done / max(total, 1); pct != last {
			last = pct
			fn.Invoke(stage, done, total)
		}
	}
}

// bytesOf returns the data argument as bytes: a Uint8Array is copied once;
// a string is converted by syscall/js and then viewed without another copy.
func bytesOf(v js.Value) []byte {
	if v.Type() == js.TypeObject && v.InstanceOf(js.Global().Get("Uint8Array")) {
		b := make([]byte, v.Length())
		js.CopyBytesToGo(b, v)
		return b
	}
	s := v.String()
	return unsafe.Slice(unsafe.StringData(s), len(s))
}

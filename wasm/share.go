//go:build js && wasm

package main

import (
	"errors"
	"syscall/js"

	"midrank/core"
	"midrank/core/findings"
	"midrank/core/jsonlite"
	"midrank/core/link"
)

// shareLink is a link with the data and settings.
func shareLink(args []js.Value) (string, error) {
	data, opt, err := inputOf("link(data, optionsJSON)", args)
	if err != nil {
		return "", err
	}
	var labels []string
	for _, g := range core.PreviewOf(data, opt).Groups {
		labels = append(labels, g.Label)
	}
	fragment, err := core.ShareLink(data, opt.ForLabels(labels))
	if err != nil {
		return "", err
	}
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("link", fragment)
	w.EndObject()
	return string(w.Bytes()), nil
}

// openLink opens a link of either kind: the data and settings, or the
// results only (checked by findings.Open), as {"findings": results}. A
// sealed link comes here opened, as a #r1. fragment of whatever it held.
func openLink(args []js.Value) (string, error) {
	if len(args) < 1 || args[0].Type() != js.TypeString {
		return "", errors.New("openLink(fragment) needs the fragment as a string")
	}
	raw, err := link.Decode(args[0].String())
	if err != nil {
		return "", err
	}
	if link.CarriesResults(raw) {
		doc, err := findings.Open(raw)
		if err != nil {
			return "", err
		}
		return `{"findings":` + string(doc) + "}", nil
	}
	req, err := core.ParseRequest(raw)
	if err != nil {
		return "", err
	}
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("data", req.Data)
	w.Key("options")
	w.Raw(req.Options.JSON())
	w.EndObject()
	return string(w.Bytes()), nil
}

// sharedFindings are the results of the last analysis of one measure as
// they may be shared.
func sharedFindings([]js.Value) (string, error) {
	if last == nil {
		return "", errors.New("findings: there is no analysis of one measure to share")
	}
	b, err := findings.Encode(last, lastOptions)
	return string(b), err
}

// resultsLink is a results-only link to the last analysis of one measure.
func resultsLink([]js.Value) (string, error) {
	if last == nil {
		return "", errors.New("resultsLink: there is no analysis of one measure to share")
	}
	fragment, err := findings.Link(last, lastOptions)
	if err != nil {
		return "", err
	}
	var w jsonlite.Writer
	w.BeginObject()
	w.StringMember("link", fragment)
	w.EndObject()
	return string(w.Bytes()), nil
}

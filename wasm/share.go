//go:build js && wasm

package main

import (
	"cmp"
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
	return linkAnswer(core.ShareLink(data, opt.ForLabels(labels)))
}

// linkAnswer is a link made, as {"link": fragment}.
func linkAnswer(fragment string, err error) (string, error) {
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

// sharedFindings are the results of the last analysis as they may be
// shared: of one measure, or of several (findings.EncodeBattery).
func sharedFindings([]js.Value) (string, error) {
	var b []byte
	var err error
	switch {
	case lastBattery != nil:
		b, err = findings.EncodeBattery(lastBattery, lastOptions)
	case last != nil:
		b, err = findings.Encode(last, lastOptions)
	default:
		return "", errors.New("findings: there is no analysis to share")
	}
	return string(b), err
}

// resultsLink is a results-only link to the last analysis of one measure,
// or to measure i (the argument) of the last battery.
func resultsLink(args []js.Value) (string, error) {
	r := last
	if lastBattery != nil && len(args) > 0 {
		i, err := wholeOf("resultsLink(measure)", "measure", args[0])
		if err != nil || i >= len(lastBattery.Measures) || lastBattery.Measures[i].Result == nil {
			return "", cmp.Or(err, errors.New("resultsLink: the battery has no such measure analysed"))
		}
		r = lastBattery.Measures[i].Result
	}
	if r == nil {
		return "", errors.New("a results-only link carries one measure: open a measure from the overview, then make the link")
	}
	return linkAnswer(findings.Link(r, lastOptions))
}

package testfiles

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"io/fs"
	"strconv"
	"strings"
	"unicode/utf16"
)

// Chicks reads R's chickwts (protect/chickwts.csv in fsys, written by
// tools/reference/protect.R), keeps the first keep[feed] chicks of the
// feeds named (all of the others), and makes every weight distinctive
// (w·1.000123 + 0.000456 + row·0.000001: no ties, and the text of a weight
// found in an output can only be that weight): the input of the tests of
// what is shared. Medians and quartiles are shared as in any report, and
// the median of an odd number of values is one of them: keep groups of
// even size, where both interpolate. It gives the data as CSV and the
// weights' texts.
func Chicks(fsys fs.FS, keep map[string]int) ([]byte, []string, error) {
	f, err := fsys.Open("protect/chickwts.csv")
	if err != nil {
		return nil, nil, err
	}
	defer f.Close()
	rows, err := csv.NewReader(f).ReadAll()
	if err != nil {
		return nil, nil, err
	}
	var b bytes.Buffer
	b.WriteString("feed,weight\n")
	var weights []string
	seen := map[string]int{}
	for i, row := range rows[1:] {
		feed := row[0]
		if most, ok := keep[feed]; ok && seen[feed] >= most {
			continue
		}
		seen[feed]++
		w, err := strconv.ParseFloat(row[1], 64)
		if err != nil {
			return nil, nil, fmt.Errorf("chickwts row %d: %v", i+2, err)
		}
		text := strconv.FormatFloat(w*1.000123+0.000456+float64(i)*0.000001, 'f', 6, 64)
		weights = append(weights, text)
		fmt.Fprintf(&b, "%s,%s\n", feed, text)
	}
	return b.Bytes(), weights, nil
}

// Exports are R's chickwts (protect/chickwts.csv in fsys) with the feed
// "linseed" renamed "graine de lin à Zürich" (a label with accents), as
// spreadsheets save text: UTF-8 with commas, UTF-16LE with its byte-order
// mark and tabs ("Unicode text"), and Windows-1252 with semicolons (CSV
// saved on Windows): the input of the tests of reading encodings.
func Exports(fsys fs.FS) (utf8, utf16le, cp1252 []byte, err error) {
	raw, err := fs.ReadFile(fsys, "protect/chickwts.csv")
	if err != nil {
		return nil, nil, nil, err
	}
	text := strings.ReplaceAll(strings.ReplaceAll(string(raw), `"`, ""), "linseed", AccentedFeed)
	utf16le = []byte{0xFF, 0xFE}
	for _, u := range utf16.Encode([]rune(strings.ReplaceAll(text, ",", "\t"))) {
		utf16le = append(utf16le, byte(u), byte(u>>8))
	}
	for _, r := range strings.ReplaceAll(text, ",", ";") {
		cp1252 = append(cp1252, byte(r)) // à and ü are their code points in Windows-1252
	}
	return []byte(text), utf16le, cp1252, nil
}

// AccentedFeed is the label Exports gives the feed "linseed".
const AccentedFeed = "graine de lin à Zürich"

package sheet

import (
	"archive/zip"
	"bytes"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"midrank/core/table"
)

// TestAgainstPandas reads every sheet of the files in testdata/sheets (R
// datasets written by tools/reference/sheets.py with openpyxl and odfpy)
// and compares every cell with what pandas.read_excel (pandas 1.5.3,
// header=None) reads from the same file: numbers equal as doubles, text
// equal as text.
func TestAgainstPandas(t *testing.T) {
	const dir = "../../testdata/sheets"
	files, _ := filepath.Glob(filepath.Join(dir, "*.xlsx"))
	ods, _ := filepath.Glob(filepath.Join(dir, "*.ods"))
	files = append(files, ods...)
	if len(files) < 6 {
		t.Fatalf("found %d spreadsheet files in %s, want 6", len(files), dir)
	}
	for _, file := range files {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		book, err := Open(data)
		if err != nil {
			t.Errorf("%s: %v", file, err)
			continue
		}
		for i := range book.Names {
			want, err := os.ReadFile(fmt.Sprintf("%s.%d.tsv", file, i+1))
			if err != nil {
				t.Fatalf("%s sheet %d: %v", file, i+1, err)
			}
			text, err := book.Text(i)
			if err != nil {
				t.Errorf("%s sheet %q: %v", file, book.Names[i], err)
				continue
			}
			compareCells(t, fmt.Sprintf("%s sheet %q", filepath.Base(file), book.Names[i]), text, want)
		}
	}
}

// compareCells compares text made of a sheet with pandas' cells, line by line.
func compareCells(t *testing.T, what string, text, want []byte) {
	t.Helper()
	got := table.Records(text, '\t', math.MaxInt32)
	lines := strings.Split(strings.TrimSuffix(string(want), "\n"), "\n")
	if len(got) != len(lines) {
		t.Errorf("%s: %d rows, pandas %d", what, len(got), len(lines))
		return
	}
	for r, line := range lines {
		cells := strings.Split(line, "\t")
		for len(cells) > 0 && cells[len(cells)-1] == "" {
			cells = cells[:len(cells)-1]
		}
		if len(got[r].Cells) != len(cells) {
			t.Errorf("%s row %d: %q, pandas %q", what, r+1, got[r].Cells, cells)
			continue
		}
		for c, w := range cells {
			g := got[r].Cells[c]
			gv, gerr := strconv.ParseFloat(g, 64)
			wv, werr := strconv.ParseFloat(w, 64)
			if g != w && !(gerr == nil && werr == nil && gv == wv) {
				t.Errorf("%s row %d column %d: %q, pandas %q", what, r+1, c+1, g, w)
			}
		}
	}
}

// zipOf packs named parts into a ZIP file, deflated.
func zipOf(t *testing.T, parts map[string]string) []byte {
	t.Helper()
	var b bytes.Buffer
	w := zip.NewWriter(&b)
	for name, body := range parts {
		f, err := w.Create(name)
		if err != nil {
			t.Fatal(err)
		}
		f.Write([]byte(body))
	}
	if err := w.Close(); err != nil {
		t.Fatal(err)
	}
	return b.Bytes()
}

// TestXLSXCells: the cell types and layouts of ECMA-376 §18.3.1.4, in a
// workbook written here by hand: shared strings with runs and a phonetic
// run, inline strings, formulas (their cached value is read), booleans,
// errors, dates in built-in and custom formats, a skipped row, cells
// without references, entities and a namespace prefix.
func TestXLSXCells(t *testing.T) {
	book := zipOf(t, map[string]string{
		"xl/workbook.xml": `<?xml version="1.0"?><workbook xmlns:r="r"><workbookPr/><sheets>` +
			`<sheet name="Notes &amp; more" sheetId="1" r:id="rId1"/><sheet name="Data" sheetId="2" r:id="rId2"/></sheets></workbook>`,
		"xl/_rels/workbook.xml.rels": `<Relationships><Relationship Id="rId1" Target="worksheets/a.xml"/>` +
			`<Relationship Id="rId2" Target="/xl/worksheets/b.xml"/></Relationships>`,
		"xl/sharedStrings.xml": `<sst><si><t>Site</t></si><si><r><t>North</t></r><r><t xml:space="preserve"> ward</t></r>` +
			`<rPh><t>のーす</t></rPh></si><si><t>a&lt;b &#x263A;</t></si></sst>`,
		"xl/styles.xml": `<styleSheet><numFmts><numFmt numFmtId="164" formatCode="yyyy\-mm\-dd"/>` +
			`<numFmt numFmtId="165" formatCode="&quot;days&quot; 0.0"/></numFmts>` +
			`<cellXfs><xf numFmtId="0"/><xf numFmtId="14"/><xf numFmtId="164"/><xf numFmtId="165"/></cellXfs></styleSheet>`,
		"xl/worksheets/a.xml": `<worksheet><sheetData><row r="1"><c r="A1" t="inlineStr"><is><t>see Data</t></is></c></row></sheetData></worksheet>`,
		"xl/worksheets/b.xml": `<x:worksheet xmlns:x="x"><x:sheetData>` +
			`<x:row r="1"><x:c r="A1" t="s"><x:v>0</x:v></x:c><x:c r="C1" t="str"><x:f>"min"</x:f><x:v>min</x:v></x:c></x:row>` +
			`<x:row r="3"><x:c t="s"><x:v>1</x:v></x:c><x:c><x:f>1+2</x:f><x:v>3</x:v></x:c><x:c s="3"><x:v>12.5</x:v></x:c></x:row>` +
			`<x:row r="4"><x:c r="A4" t="s"><x:v>2</x:v></x:c><x:c r="B4" t="b"><x:v>1</x:v></x:c><x:c r="C4" t="e"><x:v>#N/A</x:v></x:c>` +
			`<x:c r="D4" s="1"><x:v>45352</x:v></x:c><x:c r="E4" s="2"><x:v>45352.5</x:v></x:c><x:c r="F4"><x:v>1E-7</x:v></x:c></x:row>` +
			`<x:row r="5"/></x:sheetData><x:mergeCells><x:mergeCell ref="A1:B1"/></x:mergeCells></x:worksheet>`,
	})
	b, err := Open(book)
	if err != nil {
		t.Fatal(err)
	}
	if b.Format != "xlsx" || strings.Join(b.Names, "|") != "Notes & more|Data" {
		t.Fatalf("format %q, sheets %q", b.Format, b.Names)
	}
	i, err := b.Sheet("Data")
	if err != nil || i != 1 {
		t.Fatalf("Sheet(Data) = %d, %v", i, err)
	}
	if _, err := b.Sheet("3"); err == nil || !strings.Contains(err.Error(), `"Notes & more", "Data"`) {
		t.Errorf("Sheet(3): %v, want the sheets named", err)
	}
	got, err := b.Text(i)
	if err != nil {
		t.Fatal(err)
	}
	want := "Site\t\tmin\n\nNorth ward\t3\t12.5\na<b ☺\tTRUE\tNA\t2024-03-01\t2024-03-01 12:00:00\t1E-7\n"
	if string(got) != want {
		t.Errorf("Text = %q, want %q", got, want)
	}
}

// TestODSCells: OpenDocument cells (ODF 1.2 §9.1, §19.385): typed values
// over their displayed text, repeated rows and columns, the covered part
// of a merged cell, paragraphs and spaces, a nested table skipped, and the
// last empty row repeated to the end of the sheet not written.
func TestODSCells(t *testing.T) {
	content := `<office:document-content xmlns:office="o" xmlns:table="t" xmlns:text="x"><office:body><office:spreadsheet>` +
		`<table:table table:name="First"><table:table-row><table:table-cell office:value-type="string"><text:p>x</text:p></table:table-cell></table:table-row></table:table>` +
		`<table:table table:name="Waits">` +
		`<table:table-header-rows><table:table-row><table:table-cell table:number-columns-spanned="2" office:value-type="string"><text:p>Site</text:p><text:p>and  ward</text:p></table:table-cell>` +
		`<table:covered-table-cell/><table:table-cell office:value-type="string"><text:p>min<text:s text:c="2"/>waited</text:p></table:table-cell></table:table-row></table:table-header-rows>` +
		`<table:table-row table:number-rows-repeated="2"><table:table-cell office:value-type="string"><text:p>North</text:p></table:table-cell>` +
		`<table:table-cell table:number-columns-repeated="1"/><table:table-cell office:value-type="float" office:value="12.25"><text:p>12.3</text:p></table:table-cell></table:table-row>` +
		`<table:table-row table:number-rows-repeated="3"><table:table-cell table:number-columns-repeated="1024"/></table:table-row>` +
		`<table:table-row><table:table-cell office:value-type="percentage" office:value="0.35"><text:p>35%</text:p></table:table-cell>` +
		`<table:table-cell office:value-type="date" office:date-value="2026-03-01T08:30:00"/><table:table-cell office:value-type="boolean" office:boolean-value="true"/>` +
		`<table:table-cell><table:table table:name="inner"><table:table-row><table:table-cell office:value-type="float" office:value="9"/></table:table-row></table:table></table:table-cell>` +
		`<table:table-cell office:value-type="currency" office:value="1E-8" table:number-columns-repeated="2"/></table:table-row>` +
		`<table:table-row table:number-rows-repeated="1048570"><table:table-cell table:number-columns-repeated="1024"/></table:table-row>` +
		`</table:table></office:spreadsheet></office:body></office:document-content>`
	b, err := Open(zipOf(t, map[string]string{"mimetype": "application/vnd.oasis.opendocument.spreadsheet", "content.xml": content}))
	if err != nil {
		t.Fatal(err)
	}
	if b.Format != "ods" || strings.Join(b.Names, "|") != "First|Waits|inner" {
		t.Fatalf("format %q, sheets %q", b.Format, b.Names)
	}
	got, err := b.Text(1)
	if err != nil {
		t.Fatal(err)
	}
	want := "\"Site\nand  ward\"\t\tmin  waited\nNorth\t\t12.25\nNorth\t\t12.25\n\n\n\n0.35\t2026-03-01 08:30:00\tTRUE\t\t1E-8\t1E-8\n"
	if string(got) != want {
		t.Errorf("Text = %q, want %q", got, want)
	}
}

// TestDamagedFiles: a file cut short, a part whose checksum fails and a ZIP
// that is no spreadsheet each give a message, never a panic.
func TestDamagedFiles(t *testing.T) {
	good := zipOf(t, map[string]string{"content.xml": `<table:table table:name="A"></table:table>`})
	bad := bytes.Clone(good)
	bad[30+len("content.xml")+4] ^= 0xFF // inside the deflated content
	for name, data := range map[string][]byte{
		"cut short":    good[:len(good)/2],
		"checksum":     bad,
		"not a sheet":  zipOf(t, map[string]string{"word/document.xml": "<w/>"}),
		"empty":        {},
		"no ZIP magic": []byte("PK\x03\x04"),
	} {
		if _, err := Open(data); err == nil {
			if b, _ := Open(data); b != nil {
				if _, err := b.Text(0); err != nil {
					continue
				}
			}
			t.Errorf("%s: opened without an error", name)
		}
	}
}

// FuzzOpen: no input makes Open or Text panic, and the text of a sheet is
// within MaxText.
func FuzzOpen(f *testing.F) {
	for _, file := range []string{"npk.xlsx", "npk.ods"} {
		if data, err := os.ReadFile(filepath.Join("../../testdata/sheets", file)); err == nil {
			f.Add(data)
		}
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		b, err := Open(data)
		if err != nil {
			return
		}
		for i := range b.Names {
			text, err := b.Text(i)
			if err == nil && len(text) > MaxText+1<<20 {
				t.Fatalf("sheet %d makes %d bytes", i, len(text))
			}
		}
	})
}

// prefixed gives an XML part with a namespace prefix on every element
// name, which the readers of a cell's usual form leave to the general tag
// reader.
func prefixed(part string) string { return elementName.ReplaceAllString(part, "<${1}x:$2") }

var elementName = regexp.MustCompile(`<(/?)([A-Za-z_])`)

// sheetOf makes the text of a worksheet part with the shared strings and
// date styles of TestXLSXCells's workbook.
func sheetOf(part string) ([]byte, error) {
	x := &xlsxShared{strings: [][]byte{[]byte("Site"), []byte("North ward")}, dateStyle: []bool{false, true}}
	return x.sheetText([]byte(part))
}

// TestPlainCells: a sheet whose rows and cells are in the usual forms,
// which are read without the general tag reader, and in forms that leave
// them to it (white space, single quotes, empty cells, other attributes,
// a reference in a value, an attribute given twice, tags that begin like
// <c>), gives the same text as the same sheet read wholly by the general
// reader.
func TestPlainCells(t *testing.T) {
	for _, part := range []string{
		`<sheetData><row r="1"><c r="A1" t="s"><v>0</v></c><c r="B1" s="1"><v>45352</v></c></row></sheetData>`,
		"<sheetData>\n  <row r='2' spans='1:3' x14ac:dyDescent='0.25'>\n    <c r='B2' s='0' t='n'><v>1.5</v></c>\n    <c r='C2'/>\n  </row>\n</sheetData>",
		`<cols><col min="1" max="2"/></cols><sheetData><row r="3"><c r="A3"><v>1&amp;2</v></c><c r="B3" r="D3"><v>7</v></c><c r="C3" x:r="E3"><v>8</v></c></row></sheetData>`,
		`<sheetData><row r="&#52;"><c r="A4"><f>1+1</f><v>2</v></c><c><v>3</v></c><c t="inlineStr"><is><t>North</t></is></c></row><row/><row r="9"><c r="B9"><v> 4 </v></c></row></sheetData>`,
	} {
		plain, err := sheetOf(part)
		if err != nil {
			t.Fatal(err)
		}
		general, err := sheetOf(prefixed(part))
		if err != nil {
			t.Fatal(err)
		}
		if string(plain) != string(general) {
			t.Errorf("%s:\nread %q\nthe general reader %q", part, plain, general)
		}
	}
}

// FuzzPlainCells: whatever the order of well-formed pieces of a sheet
// (each fuzz byte picks one), reading the usual forms of rows and cells at
// once gives the same text as the general tag reader.
func FuzzPlainCells(f *testing.F) {
	pieces := []string{
		`<row r="2">`, `<row>`, `<row r='1' spans="1:2"/>`, `</row>`, " ", "\n\t",
		`<c r="B2" t="s">`, `<c s="1">`, `<c r='C3' s='0' t='n'>`, `<c>`, `<c/>`, `<c r="A9"/>`, `<c t="b" r="D2">`, `</c>`,
		`<v>1</v>`, `<v>45352.5</v>`, `<v>a&amp;b</v>`, `<v> 7 </v>`, `<v/>`, `<f>1+1</f>`, `<is><t>a</t></is>`, `<is>`, `<t>`, `</t>`,
		`<col min="1"/>`, `<cols>`, `<c r="A1"><v>0</v></c>`, `<c r="E5" s="1"><v>45000</v></c>`,
	}
	f.Add([]byte{0, 26, 27, 3, 1, 6, 14, 13, 10, 3})
	f.Fuzz(func(t *testing.T, picks []byte) {
		var part strings.Builder
		for _, p := range picks {
			part.WriteString(pieces[int(p)%len(pieces)])
		}
		plain, err1 := sheetOf(part.String())
		general, err2 := sheetOf(prefixed(part.String()))
		if string(plain) != string(general) || (err1 == nil) != (err2 == nil) {
			t.Fatalf("%s: read %q (%v), the general reader %q (%v)", part.String(), plain, err1, general, err2)
		}
	})
}

// FuzzXML: the scanner ends on every input and never reads out of range.
func FuzzXML(f *testing.F) {
	f.Add([]byte(`<a x="1" y='&amp;'>t&#65;<![CDATA[<c>]]><!-- c --><?p?><b/></a>`))
	f.Fuzz(func(t *testing.T, data []byte) {
		s := xmlScanner{b: data}
		var text []byte
		for n := 0; ; n++ {
			tg, ok := s.next(&text)
			if !ok {
				break
			}
			tg.attr("x")
			if n > len(data) {
				t.Fatalf("more tags than bytes")
			}
		}
	})
}

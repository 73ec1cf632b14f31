package testfiles

import (
	"archive/zip"
	"bytes"
	"math/rand/v2"
	"strconv"
)

// BigXLSX makes an .xlsx file of rows × (site code, shared-string site
// name, minutes with two decimals, a date), about 21 MB packed at 1,000,000
// rows, as an export of a year's visits would be: the input of the speed
// measurements of spreadsheet reading (core/sheet's benchmark, the browser
// test). The values are random from a fixed seed.
func BigXLSX(rows int) []byte {
	rng := rand.New(rand.NewPCG(3, 4))
	var sheet bytes.Buffer
	sheet.WriteString(`<?xml version="1.0" encoding="UTF-8" standalone="yes"?><worksheet xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main"><sheetData>`)
	sheet.WriteString(`<row r="1"><c r="A1" t="s"><v>0</v></c><c r="B1" t="s"><v>1</v></c><c r="C1" t="s"><v>2</v></c><c r="D1" t="s"><v>3</v></c></row>`)
	for r := 2; r <= rows+1; r++ {
		n := strconv.Itoa(r)
		site := rng.IntN(8)
		sheet.WriteString(`<row r="` + n + `"><c r="A` + n + `"><v>` + strconv.Itoa(site+1) + `</v></c><c r="B` + n + `" t="s"><v>` +
			strconv.Itoa(4+site) + `</v></c><c r="C` + n + `"><v>` + strconv.FormatFloat(float64(rng.IntN(50000))/100, 'f', -1, 64) +
			`</v></c><c r="D` + n + `" s="1"><v>` + strconv.Itoa(45000+rng.IntN(365)) + `</v></c></row>`)
	}
	sheet.WriteString(`</sheetData></worksheet>`)
	shared := `<sst><si><t>code</t></si><si><t>site</t></si><si><t>minutes</t></si><si><t>day</t></si>`
	for s := 1; s <= 8; s++ {
		shared += `<si><t>Site ` + strconv.Itoa(s) + `</t></si>`
	}
	shared += `</sst>`
	var b bytes.Buffer
	w := zip.NewWriter(&b)
	for _, part := range []struct {
		name string
		body []byte
	}{
		{"xl/workbook.xml", []byte(`<workbook><sheets><sheet name="Visits" sheetId="1" r:id="rId1"/></sheets></workbook>`)},
		{"xl/_rels/workbook.xml.rels", []byte(`<Relationships><Relationship Id="rId1" Target="worksheets/sheet1.xml"/></Relationships>`)},
		{"xl/sharedStrings.xml", []byte(shared)},
		{"xl/styles.xml", []byte(`<styleSheet><cellXfs><xf numFmtId="0"/><xf numFmtId="14"/></cellXfs></styleSheet>`)},
		{"xl/worksheets/sheet1.xml", sheet.Bytes()},
	} {
		f, _ := w.Create(part.name)
		f.Write(part.body)
	}
	w.Close()
	return b.Bytes()
}

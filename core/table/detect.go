package table

import "bytes"

// sampleLines is how many non-blank lines the detectors look at.
const sampleLines = 200

// DetectSeparator picks the separator found on the most of the first
// non-blank lines; on a tie tab beats semicolon beats comma, because a
// semicolon or tab file may also hold decimal commas. Text with none of them
// is read as tab-separated (one column).
func DetectSeparator(data []byte) byte {
	candidates := [...]byte{'\t', ';', ','}
	var count [3]int
	lines := 0
	for len(data) > 0 && lines < sampleLines {
		end := bytes.IndexAny(data, "\r\n")
		line := data
		if end >= 0 {
			line, data = data[:end], data[end+1:]
		} else {
			data = nil
		}
		if len(bytes.TrimSpace(line)) == 0 {
			continue
		}
		lines++
		for i, c := range candidates {
			if bytes.IndexByte(line, c) >= 0 {
				count[i]++
			}
		}
	}
	best := 0
	for i := range candidates {
		if count[i] > count[best] {
			best = i
		}
	}
	return candidates[best]
}

// detectLayout applies the documented rule for LayoutAuto: the text is long
// when its records (among the first 200) use exactly two fields and, below
// the first record, more first cells are text than numbers; otherwise wide.
func detectLayout(data []byte, sep byte, plan headerPlan) Layout {
	r := newReader(data, sep)
	r.start(plan)
	widest, text, numbers := 0, 0, 0
	for i := 0; i < sampleLines; i++ {
		ok, err := r.read()
		if err != nil || !ok {
			break
		}
		widest = max(widest, len(r.fields))
		if i == 0 {
			continue
		}
		switch _, kind, _ := parseCell(r.fields[0].text); kind {
		case cellNumber:
			numbers++
		case cellText:
			text++
		}
	}
	if widest == 2 && text > numbers {
		return LayoutLong
	}
	return LayoutWide
}

package table

import (
	"bytes"
	"runtime"
)

// halvesFrom is the size of text from which a long reading is split in two
// halves read side by side (see longInHalves): below it the second
// goroutine is not worth its start. A variable so that tests can split
// small texts.
var halvesFrom = 1 << 20

// halvesJoined, when set (by tests only), is called each time a text was
// read in two halves.
var halvesJoined func()

// longInHalves reads a long text in two halves at once, on two cores, and
// joins them; it reports false, having changed nothing, when the text is
// not split (one core, a short text, a text with quotes, whose line breaks
// may lie inside cells) or when either half met a cell it cannot read: then
// the text is read again in one pass, which reports the problems in its own
// order. A line without quotes is a record, so the second half starts at
// the first line break after the middle, on a line numbered by counting the
// breaks before it; groups keep their order of first appearance, the
// second half's new ones after the first half's.
func (p *parser) longInHalves(cols longColumns, lines int) bool {
	r := p.r
	d := r.data
	if len(d)-r.pos < halvesFrom || runtime.GOMAXPROCS(0) < 2 || bytes.IndexByte(d[r.pos:], '"') >= 0 {
		return false
	}
	mid := r.pos + (len(d)-r.pos)/2
	i := bytes.IndexByte(d[mid:], r.eol)
	if i < 0 {
		return false
	}
	cut := mid + i + 1
	firstReader, secondReader := *r, *r
	firstReader.data, firstReader.fields = d[:cut], make([]field, 0, cap(r.fields))
	secondReader.pos, secondReader.joined, secondReader.fields = cut, nil, make([]field, 0, cap(r.fields))
	secondReader.next = r.next + bytes.Count(d[r.pos:cut], []byte{r.eol})
	secondReader.nextSep, secondReader.nextQuote = -1, -1
	half := func(rd *reader, capacity int) *parser {
		h := &parser{t: &Table{Profile: p.t.Profile, Layout: p.t.Layout, Separator: p.t.Separator}, r: rd, numbers: p.numbers}
		h.t.reserve(capacity)
		return h
	}
	a, b := half(&firstReader, lines), half(&secondReader, lines/2+16)
	done := make(chan error)
	go func() { done <- b.longRecords(cols, false) }()
	errA := a.longRecords(cols, true)
	if errB := <-done; errA != nil || errB != nil || len(a.problems)+len(b.problems) > 0 || !a.join(b) {
		return false
	}
	t := p.t
	t.Labels, t.Missing, t.Values, t.Groups, t.Lines = a.t.Labels, a.t.Missing, a.t.Values, a.t.Groups, a.t.Lines
	t.Header, t.Measure = a.t.Header, a.t.Measure
	t.GroupColumn, t.MeasureColumn, t.CountColumn = a.t.GroupColumn, a.t.MeasureColumn, a.t.CountColumn
	p.numbers, p.units = a.numbers, a.units
	*r = secondReader
	if halvesJoined != nil {
		halvesJoined()
	}
	return true
}

// join appends what parser b read after a's text to a's, as one reading of
// both would have it; it reports false when the groups would be too many.
func (a *parser) join(b *parser) bool {
	at := len(a.t.Values)
	index := make(map[string]int, len(a.t.Labels))
	for i, label := range a.t.Labels {
		index[label] = i
	}
	group := make([]int32, len(b.t.Labels)) // b's group in a
	for g, label := range b.t.Labels {
		i, seen := index[label]
		if !seen {
			if len(a.t.Labels) == MaxGroups {
				return false
			}
			i = len(a.t.Labels)
			a.t.Labels, a.t.Missing = append(a.t.Labels, label), append(a.t.Missing, 0)
		}
		group[g] = int32(i)
		a.t.Missing[i] += b.t.Missing[g]
	}
	a.t.Values, a.t.Lines = append(a.t.Values, b.t.Values...), append(a.t.Lines, b.t.Lines...)
	for _, g := range b.t.Groups {
		a.t.Groups = append(a.t.Groups, group[g])
	}
	a.numbers.join(&b.numbers, at)
	a.units.join(&b.units)
	return true
}

// join adds the numbers of b, read after nr's values (at of them).
func (nr *numberReading) join(b *numberReading, at int) {
	for m := range nr.decimals {
		nr.decimals[m].join(b.decimals[m])
		nr.groups[m].join(b.groups[m])
		nr.ambiguous[m].join(b.ambiguous[m])
		for _, run := range b.ambiguousAt[m] {
			nr.ambiguousAt[m] = append(nr.ambiguousAt[m], valueRun{run.at + int32(at), run.n})
		}
	}
	nr.ungrouped.join(b.ungrouped)
}

// join adds the cells of b, seen after s's.
func (s *sighting) join(b sighting) {
	if s.count == 0 {
		*s = b
		return
	}
	s.count += b.count
}

// join adds the units of b, seen after ur's: as note would have seen them,
// but for the count of ur's unit among b's cells after b's first cell of
// another unit, which matters only when there is another unit (an error
// whatever the count).
func (ur *unitReading) join(b *unitReading) {
	ur.values += b.values
	switch {
	case b.unit == "":
	case ur.unit == "":
		ur.unit, ur.first, ur.count, ur.other = b.unit, b.first, b.count, b.other
	case b.unit == ur.unit:
		ur.count += b.count
		if ur.other.count == 0 {
			ur.other = b.other
		}
	case ur.other.count == 0:
		ur.other = b.first
	}
}

package exact

// empty marks a free slot; no state encodes to it, because keys use at most
// 63 bits.
const empty = ^uint64(0)

// entry is one slot: key and probability side by side, so that a probe
// touches one cache line.
type entry struct {
	key uint64
	p   float64
}

// layer is an open-addressing hash table from state keys to probabilities,
// with linear probing; it grows at half full to keep probes short.
type layer struct {
	slots []entry
	n     int
	shift uint // 64 − log2(len(slots))
}

func newLayer(capacity int) *layer {
	l := &layer{}
	l.reset(capacity)
	return l
}

// reset empties the layer, sized for about n states.
func (l *layer) reset(n int) {
	size, shift := 1024, uint(64-10)
	for size < 2*n {
		size *= 2
		shift--
	}
	if cap(l.slots) >= size {
		l.slots = l.slots[:size]
	} else {
		l.slots = make([]entry, size)
	}
	for i := range l.slots {
		l.slots[i] = entry{key: empty}
	}
	l.n, l.shift = 0, shift
}

func (l *layer) len() int { return l.n }

// add adds p to the probability of key.
func (l *layer) add(key uint64, p float64) {
	mask := uint64(len(l.slots) - 1)
	for i := (key * 0x9E3779B97F4A7C15) >> l.shift; ; i = (i + 1) & mask {
		e := &l.slots[i]
		switch e.key {
		case key:
			e.p += p
			return
		case empty:
			*e = entry{key, p}
			l.n++
			if 2*l.n > len(l.slots) {
				l.grow()
			}
			return
		}
	}
}

func (l *layer) grow() {
	old := l.slots
	l.slots = make([]entry, 2*len(old))
	for i := range l.slots {
		l.slots[i] = entry{key: empty}
	}
	l.shift--
	l.n = 0
	for _, e := range old {
		if e.key != empty {
			l.add(e.key, e.p)
		}
	}
}

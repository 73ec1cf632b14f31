package exact

// empty marks a free slot; no state encodes to it, because keys (cell
// indices) stay below 2⁶³.
const empty = ^uint64(0)

// entry is one slot: key and probability side by side, so that a probe
// touches one cache line.
type entry struct {
	key uint64
	p   float64
}

// table is an open-addressing hash table from state keys to probabilities,
// with linear probing; it grows at half full to keep probes short. It holds
// a bucket's states when a dense array would be too large.
type table struct {
	slots  []entry
	n      int
	shift  uint // 64 − log2(len(slots))
	shared *int // counts the new keys of every table of a layer
}

func newTable(capacity int, shared *int) *table {
	l := &table{shared: shared}
	l.reset(capacity)
	return l
}

// reset empties the layer, sized for about n states.
func (l *table) reset(n int) {
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

func (l *table) len() int { return l.n }

// add adds p to the probability of key.
func (l *table) add(key uint64, p float64) {
	mask := uint64(len(l.slots) - 1)
	for i := mix(key) >> l.shift; ; i = (i + 1) & mask {
		e := &l.slots[i]
		switch e.key {
		case key:
			e.p += p
			return
		case empty:
			*e = entry{key, p}
			l.n++
			if l.shared != nil {
				*l.shared++
			}
			if 2*l.n > len(l.slots) {
				l.grow()
			}
			return
		}
	}
}

// get is the probability of key, 0 when it has none.
func (l *table) get(key uint64) float64 {
	mask := uint64(len(l.slots) - 1)
	for i := mix(key) >> l.shift; ; i = (i + 1) & mask {
		switch e := l.slots[i]; e.key {
		case key:
			return e.p
		case empty:
			return 0
		}
	}
}

// mix is the finaliser of MurmurHash3 (Appleby 2011): every bit of the key
// moves every bit of the hash, so that keys that differ by a constant, as
// successors do, do not crowd one stretch of slots.
func mix(key uint64) uint64 {
	key ^= key >> 33
	key *= 0xff51afd7ed558ccd
	key ^= key >> 33
	key *= 0xc4ceb9fe1a85ec53
	key ^= key >> 33
	return key
}

func (l *table) grow() {
	old := l.slots
	l.slots = make([]entry, 2*len(old))
	for i := range l.slots {
		l.slots[i] = entry{key: empty}
	}
	l.shift--
	l.n = 0
	shared := l.shared
	l.shared = nil // the keys are not new
	for _, e := range old {
		if e.key != empty {
			l.add(e.key, e.p)
		}
	}
	l.shared = shared
}

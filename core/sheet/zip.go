package sheet

import (
	"bytes"
	"compress/flate"
	"encoding/binary"
	"fmt"
	"hash/crc32"
	"io"
)

// archive is the table of contents of a ZIP file (PKWARE APPNOTE 6.3, §4.3):
// each member's name, compression method, sizes, CRC-32 and where its data
// starts. It is read here rather than with archive/zip, whose file-system
// interface would add about 100 KB to the WebAssembly module for what a
// spreadsheet needs: stored and deflated members of a file held in memory.
type archive struct {
	data    []byte
	members map[string]member
}

type member struct {
	method            uint16
	crc               uint32
	packed, unpacked  uint64
	localHeaderOffset uint64
}

const (
	sigEnd     = 0x06054b50 // end of central directory record
	sigCentral = 0x02014b50 // central directory file header
	sigLocal   = 0x04034b50 // local file header
	// MaxUnpacked bounds one member's unpacked size, so that a small file
	// that unpacks to gigabytes is refused rather than filling the memory.
	MaxUnpacked = 512 << 20
)

// openArchive reads the central directory of a ZIP file held in data.
func openArchive(data []byte) (*archive, error) {
	le := binary.LittleEndian
	// the end record is in the last 22 bytes plus a comment of up to 65,535
	from := max(0, len(data)-22-65535)
	at := -1
	for i := len(data) - 22; i >= from; i-- {
		if le.Uint32(data[i:]) == sigEnd {
			at = i
			break
		}
	}
	if at < 0 {
		return nil, fmt.Errorf("the file is not a complete ZIP archive (no end record): it may be damaged or cut short")
	}
	count := int(le.Uint16(data[at+10:]))
	size, offset := uint64(le.Uint32(data[at+12:])), uint64(le.Uint32(data[at+16:]))
	if count == 0xFFFF || offset == 0xFFFFFFFF {
		return nil, fmt.Errorf("the file is a ZIP64 archive, larger than a spreadsheet this tool reads")
	}
	if offset+size > uint64(at) {
		return nil, fmt.Errorf("the file's ZIP directory points outside the file: it may be damaged")
	}
	a := &archive{data: data, members: make(map[string]member, count)}
	p := int(offset)
	for range count {
		if p+46 > at || le.Uint32(data[p:]) != sigCentral {
			return nil, fmt.Errorf("the file's ZIP directory is damaged")
		}
		nameLen, extraLen, commentLen := int(le.Uint16(data[p+28:])), int(le.Uint16(data[p+30:])), int(le.Uint16(data[p+32:]))
		if p+46+nameLen > at {
			return nil, fmt.Errorf("the file's ZIP directory is damaged")
		}
		name := string(data[p+46 : p+46+nameLen])
		a.members[name] = member{
			method:            le.Uint16(data[p+10:]),
			crc:               le.Uint32(data[p+16:]),
			packed:            uint64(le.Uint32(data[p+20:])),
			unpacked:          uint64(le.Uint32(data[p+24:])),
			localHeaderOffset: uint64(le.Uint32(data[p+42:])),
		}
		p += 46 + nameLen + extraLen + commentLen
	}
	return a, nil
}

// has reports whether the archive holds a member of that name.
func (a *archive) has(name string) bool {
	_, ok := a.members[name]
	return ok
}

// read unpacks a member and checks its CRC-32.
func (a *archive) read(name string) ([]byte, error) {
	m, ok := a.members[name]
	if !ok {
		return nil, fmt.Errorf("the file has no part %q", name)
	}
	le := binary.LittleEndian
	p := m.localHeaderOffset
	if p+30 > uint64(len(a.data)) || le.Uint32(a.data[p:]) != sigLocal {
		return nil, fmt.Errorf("the part %q is damaged", name)
	}
	start := p + 30 + uint64(le.Uint16(a.data[p+26:])) + uint64(le.Uint16(a.data[p+28:]))
	if start+m.packed > uint64(len(a.data)) {
		return nil, fmt.Errorf("the part %q is cut short: the file may be incomplete", name)
	}
	if m.unpacked > MaxUnpacked {
		return nil, fmt.Errorf("the part %q unpacks to %d MB; the most this tool reads is %d MB", name, m.unpacked>>20, MaxUnpacked>>20)
	}
	packed := a.data[start : start+m.packed]
	var out []byte
	switch m.method {
	case 0: // stored
		out = packed
	case 8: // deflated
		out = make([]byte, m.unpacked)
		r := flate.NewReader(bytes.NewReader(packed))
		n, err := io.ReadFull(r, out)
		var extra [1]byte
		if err != nil || uint64(n) != m.unpacked {
			return nil, fmt.Errorf("the part %q cannot be unpacked: the file may be damaged", name)
		}
		if k, _ := r.Read(extra[:]); k > 0 {
			return nil, fmt.Errorf("the part %q unpacks to more than its stated size: the file may be damaged", name)
		}
	default:
		return nil, fmt.Errorf("the part %q is packed with method %d, which this tool does not read; save the file again from the spreadsheet", name, m.method)
	}
	if crc32.ChecksumIEEE(out) != m.crc {
		return nil, fmt.Errorf("the part %q fails its checksum: the file is damaged", name)
	}
	return out, nil
}

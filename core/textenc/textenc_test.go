package textenc

import (
	"bytes"
	"encoding/hex"
	"testing"
	"unicode/utf16"
	"unicode/utf8"
)

// The bytes 0x80–0x9F of Windows-1252 in UTF-8, from Python 3's cp1252
// codec, the five bytes it leaves unassigned as their own code points (as
// the WHATWG Encoding Standard maps them).
const high1252 = "e282acc281e2809ac692e2809ee280a6e280a0e280a1cb86e280b0c5a0e280b9c592c28dc5bdc28fc290e28098e28099e2809ce2809de280a2e28093e28094cb9ce284a2c5a1e280bac593c29dc5bec5b8"

func TestToUTF8(t *testing.T) {
	const text = "site\tcity\nA\tCafé Zürich – 5€\n"
	le := utf16.Encode([]rune(text))
	var utf16le, utf16be []byte
	for _, u := range le {
		utf16le = append(utf16le, byte(u), byte(u>>8))
		utf16be = append(utf16be, byte(u>>8), byte(u))
	}
	// "Café Zürich – 5€" in cp1252, from Python 3's codec
	cp1252, _ := hex.DecodeString("436166e9205afc726963682096203580")
	tests := []struct {
		name string
		in   []byte
		want string
		enc  Encoding
	}{
		{"UTF-8", []byte(text), text, UTF8},
		{"UTF-8 with its mark (left for the reading)", []byte("\uFEFF" + text), "\uFEFF" + text, UTF8},
		{"UTF-16LE with its mark", append([]byte{0xFF, 0xFE}, utf16le...), text, UTF16LE},
		{"UTF-16BE with its mark", append([]byte{0xFE, 0xFF}, utf16be...), text, UTF16BE},
		{"UTF-16LE without a mark", utf16le, text, UTF16LE},
		{"UTF-16BE without a mark", utf16be, text, UTF16BE},
		{"Windows-1252", append([]byte("site\tcity\nA\t"), append(cp1252, '\n')...), text, Windows1252},
		{"an odd last byte of UTF-16", append([]byte{0xFF, 0xFE, 'A', 0}, 'B'), "A\uFFFD", UTF16LE},
		{"empty", nil, "", UTF8},
	}
	for _, tt := range tests {
		got, enc := ToUTF8(tt.in)
		if string(got) != tt.want || enc != tt.enc {
			t.Errorf("%s: %q (%s), want %q (%s)", tt.name, got, enc, tt.want, tt.enc)
		}
	}
	all := make([]byte, 32)
	for i := range all {
		all[i] = byte(0x80 + i)
	}
	want, _ := hex.DecodeString(high1252)
	if got := fromWindows1252(all); !bytes.Equal(got, want) {
		t.Errorf("0x80–0x9F: %q, want %q", got, want)
	}
}

// FuzzToUTF8: whatever the bytes, the text given is valid UTF-8, and valid
// UTF-8 is given back unchanged.
func FuzzToUTF8(f *testing.F) {
	for _, s := range []string{"A,B\n1,2\n", "\xff\xfeA\x00", "\xfe\xff\x00A", "Caf\xe9", "\xed\xa0\x80"} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		got, enc := ToUTF8(data)
		if !utf8.Valid(got) {
			t.Fatalf("%q gave %q (%s), not UTF-8", data, got, enc)
		}
		if utf8.Valid(data) && !bytes.HasPrefix(data, []byte{0xFF, 0xFE}) && !bytes.HasPrefix(data, []byte{0xFE, 0xFF}) && !bytes.Equal(got, data) {
			t.Fatalf("valid UTF-8 %q changed to %q", data, got)
		}
	})
}

// Package textenc turns the bytes of a text file into UTF-8, which the
// reading expects, and says which encoding they were in. Spreadsheets save
// text in three encodings besides UTF-8: "Unicode text" is UTF-16 with a
// byte-order mark (little-endian from Excel), and CSV saved on Windows is in
// the ANSI code page, Windows-1252 in Western Europe and the Americas
// (common practice; the mapping of 0x80–0x9F is the WHATWG Encoding
// Standard's index for windows-1252).
package textenc

import (
	"bytes"
	"unicode/utf16"
	"unicode/utf8"
)

// Encoding names the encoding a text was found in.
type Encoding string

const (
	UTF8        Encoding = "UTF-8"
	UTF16LE     Encoding = "UTF-16LE"
	UTF16BE     Encoding = "UTF-16BE"
	Windows1252 Encoding = "Windows-1252"
)

// sniff is how many bytes the look for UTF-16 without a byte-order mark
// reads.
const sniff = 4096

// ToUTF8 gives the text as UTF-8 and the encoding it was in: UTF-16 by its
// byte-order mark, or without one when most of the bytes at odd (or even)
// places of its start are zero, as they are for Latin text; UTF-8 when the
// bytes are valid UTF-8 (then data itself is returned, not a copy); else
// Windows-1252, every byte of which stands for a character.
func ToUTF8(data []byte) ([]byte, Encoding) {
	switch {
	case bytes.HasPrefix(data, []byte{0xFF, 0xFE}):
		return fromUTF16(data[2:], false), UTF16LE
	case bytes.HasPrefix(data, []byte{0xFE, 0xFF}):
		return fromUTF16(data[2:], true), UTF16BE
	case utf8.Valid(data):
		return data, UTF8
	}
	if e := zeroes(data[:min(len(data), sniff)]); e != "" {
		return fromUTF16(data, e == UTF16BE), e
	}
	return fromWindows1252(data), Windows1252
}

// zeroes tells UTF-16 without a byte-order mark by its zero bytes: Latin
// text has a zero in the high byte of almost every code unit.
func zeroes(head []byte) Encoding {
	var even, odd int
	for i, b := range head {
		if b == 0 {
			if i%2 == 0 {
				even++
			} else {
				odd++
			}
		}
	}
	units := len(head) / 2
	switch {
	case units < 2:
		return ""
	case odd*10 >= units*4 && even*10 < units:
		return UTF16LE
	case even*10 >= units*4 && odd*10 < units:
		return UTF16BE
	}
	return ""
}

// fromUTF16 decodes UTF-16 (a lone surrogate, or an odd last byte, becomes
// U+FFFD).
func fromUTF16(data []byte, bigEndian bool) []byte {
	units := make([]uint16, len(data)/2)
	for i := range units {
		lo, hi := data[2*i], data[2*i+1]
		if bigEndian {
			lo, hi = hi, lo
		}
		units[i] = uint16(lo) | uint16(hi)<<8
	}
	out := make([]byte, 0, len(units)+len(units)/8)
	for _, r := range utf16.Decode(units) {
		out = utf8.AppendRune(out, r)
	}
	if len(data)%2 == 1 {
		out = utf8.AppendRune(out, utf8.RuneError)
	}
	return out
}

// high are the characters of Windows-1252's bytes 0x80–0x9F; the five
// bytes it leaves unassigned keep their C1 control code points.
var high = [32]rune{
	'€', 0x81, '‚', 'ƒ', '„', '…', '†', '‡', 'ˆ', '‰', 'Š', '‹', 'Œ', 0x8D, 'Ž', 0x8F,
	0x90, '‘', '’', '“', '”', '•', '–', '—', '˜', '™', 'š', '›', 'œ', 0x9D, 'ž', 'Ÿ',
}

// fromWindows1252 decodes Windows-1252: bytes below 0x80 are ASCII, from
// 0xA0 Latin-1, and 0x80–0x9F the characters of high.
func fromWindows1252(data []byte) []byte {
	out := make([]byte, 0, len(data)+len(data)/16)
	for _, b := range data {
		switch {
		case b < 0x80:
			out = append(out, b)
		case b < 0xA0:
			out = utf8.AppendRune(out, high[b-0x80])
		default:
			out = utf8.AppendRune(out, rune(b))
		}
	}
	return out
}

package sealed

import (
	"bytes"
	"crypto/rand"
	"errors"
	"strings"
	"testing"

	"midrank/core/link"
)

func TestSealedRoundTrip(t *testing.T) {
	req := []byte(`{"data":"A,B\n1,2\n","alpha":0.1}`)
	frag, err := Seal(req, "correct horse", rand.Reader)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.HasPrefix(frag, Prefix) || !Is(frag) || Is(link.Encode(req)) {
		t.Fatalf("sealed link %q", frag)
	}
	if got, err := Open(frag, "correct horse"); err != nil || !bytes.Equal(got, req) {
		t.Fatalf("Open = %q, %v", got, err)
	}
	if strings.Contains(frag, "alpha") {
		t.Error("the sealed link shows its contents")
	}
	var e *link.Error
	if _, err := Open(frag, "wrong horse"); !errors.As(err, &e) || !strings.Contains(err.Error(), "passphrase does not open") {
		t.Errorf("wrong passphrase: %v", err)
	}
	tampered := []byte(frag)
	tampered[len(tampered)-5] ^= 1
	if _, err := Open(string(tampered), "correct horse"); !errors.As(err, &e) {
		t.Errorf("tampered link: %v", err)
	}
	if _, err := Open(Prefix+"AAAA", "x"); !errors.As(err, &e) || !strings.Contains(err.Error(), "damaged") {
		t.Errorf("short link: %v", err)
	}
	if _, err := Seal(req, "", rand.Reader); err == nil {
		t.Error("an empty passphrase was accepted")
	}
}

// TestSealedKnownAnswer pins the format with fixed salt and nonce: the key
// is PBKDF2-HMAC-SHA-256 (RFC 8018) and the cipher AES-256-GCM (NIST SP
// 800-38D), both from Go's standard library, so this pins how they are put
// together, not their correctness.
func TestSealedKnownAnswer(t *testing.T) {
	fixed := bytes.NewReader(bytes.Repeat([]byte{7}, saltSize+nonceSize))
	frag, err := Seal([]byte(`{"data":"x"}`), "pass", fixed)
	if err != nil {
		t.Fatal(err)
	}
	if got, err := Open(frag, "pass"); err != nil || string(got) != `{"data":"x"}` {
		t.Fatalf("Open = %q, %v", got, err)
	}
	if !strings.HasPrefix(frag, Prefix+"BwcHBwcHBwcHBwcHBwcHBwcHBwcHBwcH") {
		t.Errorf("salt and nonce are not where the format puts them: %s", frag)
	}
}

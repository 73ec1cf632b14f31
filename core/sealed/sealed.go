// Package sealed encrypts a share link (package link) under a passphrase.
// It is kept apart from package link so that the WebAssembly module, where
// the page seals links with the browser's own Web Crypto, does not carry
// Go's cryptography; the command line uses this package, and the browser
// tests check that the two seal and open each other's links.
package sealed

import (
	"crypto/aes"
	"crypto/cipher"
	"crypto/pbkdf2"
	"crypto/sha256"
	"encoding/base64"
	"fmt"
	"io"
	"strings"

	"midrank/core/link"
)

// Prefix starts a link whose request is encrypted with a passphrase:
//
//	#s1.<base64url without padding of salt (16 bytes) ‖ nonce (12 bytes) ‖ AES-256-GCM ciphertext and tag>
//
// The plaintext is the raw DEFLATE stream of a plain link; the key is
// PBKDF2-HMAC-SHA-256 of the passphrase with the salt and Iterations rounds
// (NIST SP 800-132; OWASP's 2023 guidance for this hash is 600,000). GCM
// authenticates, so a wrong passphrase and a changed link are both refused.
const Prefix = "#s1."

// Iterations is the PBKDF2 work factor.
const Iterations = 600_000

const (
	saltSize  = 16
	nonceSize = 12
)

// Seal encrypts request JSON under passphrase, drawing salt and nonce from
// random (crypto/rand.Reader in use; fixed bytes in tests).
func Seal(request []byte, passphrase string, random io.Reader) (string, error) {
	if passphrase == "" {
		return "", &link.Error{Reason: "the passphrase is empty"}
	}
	packed, err := base64.RawURLEncoding.DecodeString(strings.TrimPrefix(link.Encode(request), link.Prefix))
	if err != nil {
		return "", err
	}
	head := make([]byte, saltSize+nonceSize)
	if _, err := io.ReadFull(random, head); err != nil {
		return "", fmt.Errorf("no random bytes for the link: %w", err)
	}
	aead, err := gcm(passphrase, head[:saltSize])
	if err != nil {
		return "", err
	}
	sealed := aead.Seal(head, head[saltSize:], packed, []byte(Prefix))
	return Prefix + base64.RawURLEncoding.EncodeToString(sealed), nil
}

// Open decrypts a sealed link into request JSON, with the same bounds as
// link.Decode.
func Open(fragment, passphrase string) ([]byte, error) {
	if !strings.HasPrefix(fragment, "#") {
		fragment = "#" + fragment
	}
	if !strings.HasPrefix(fragment, Prefix) {
		return nil, &link.Error{Reason: fmt.Sprintf("it does not start with %q", Prefix)}
	}
	body := fragment[len(Prefix):]
	if len(body) > link.MaxLink {
		return nil, &link.Error{Reason: fmt.Sprintf("it is longer than %d characters", link.MaxLink)}
	}
	raw, err := base64.RawURLEncoding.DecodeString(body)
	if err != nil || len(raw) < saltSize+nonceSize+16 {
		return nil, &link.Error{Reason: "it is damaged; it may have been cut or changed in transit"}
	}
	aead, err := gcm(passphrase, raw[:saltSize])
	if err != nil {
		return nil, err
	}
	packed, err := aead.Open(nil, raw[saltSize:saltSize+nonceSize], raw[saltSize+nonceSize:], []byte(Prefix))
	if err != nil {
		return nil, &link.Error{Reason: "the passphrase does not open it, or the link was changed"}
	}
	return link.Decode(link.Prefix + base64.RawURLEncoding.EncodeToString(packed))
}

// Is reports whether a fragment is a sealed link.
func Is(fragment string) bool {
	return strings.HasPrefix(strings.TrimPrefix(fragment, "#"), Prefix[1:])
}

func gcm(passphrase string, salt []byte) (cipher.AEAD, error) {
	key, err := pbkdf2.Key(sha256.New, passphrase, salt, Iterations, 32)
	if err != nil {
		return nil, err
	}
	block, err := aes.NewCipher(key)
	if err != nil {
		return nil, err
	}
	return cipher.NewGCM(block)
}

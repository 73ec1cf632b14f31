// Sealed links (#s1.) wrap the plain link's DEFLATE bytes in AES-256-GCM
// under a key from PBKDF2-HMAC-SHA-256 (600,000 rounds), the format of Go's
// core/sealed, here with the browser's own Web Crypto.

export const SEALED = "#s1.";
const PLAIN = "#r1.";
const ITERATIONS = 600000;
const DAMAGED = "the link cannot be opened: it is damaged; it may have been cut or changed in transit";

function fromBase64url(s) {
  s = s.replace(/-/g, "+").replace(/_/g, "/");
  while (s.length % 4) s += "=";
  return Uint8Array.from(atob(s), (c) => c.charCodeAt(0));
}

function toBase64url(bytes) {
  let s = "";
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s).replace(/\+/g, "-").replace(/\//g, "_").replace(/=+$/, "");
}

async function sealingKey(passphrase, salt) {
  if (!globalThis.crypto || !crypto.subtle) {
    throw new Error("passphrase links need the page opened over HTTPS, from this computer or from a file");
  }
  const base = await crypto.subtle.importKey("raw", new TextEncoder().encode(passphrase), "PBKDF2", false, ["deriveKey"]);
  return crypto.subtle.deriveKey({ name: "PBKDF2", hash: "SHA-256", salt, iterations: ITERATIONS }, base,
    { name: "AES-GCM", length: 256 }, false, ["encrypt", "decrypt"]);
}

// seal turns a plain link's fragment into a sealed one.
export async function seal(plainLink, passphrase) {
  const packed = fromBase64url(plainLink.slice(PLAIN.length));
  const head = crypto.getRandomValues(new Uint8Array(28)); // salt (16) and nonce (12)
  const key = await sealingKey(passphrase, head.subarray(0, 16));
  const sealed = new Uint8Array(await crypto.subtle.encrypt(
    { name: "AES-GCM", iv: head.subarray(16), additionalData: new TextEncoder().encode(SEALED) }, key, packed));
  const out = new Uint8Array(head.length + sealed.length);
  out.set(head);
  out.set(sealed, head.length);
  return SEALED + toBase64url(out);
}

// unseal opens a sealed fragment of at most longest characters.
export async function unseal(fragment, passphrase, longest) {
  if (fragment.length > longest) throw new Error("the link cannot be opened: it is longer than " + longest + " characters");
  let raw;
  try {
    raw = fromBase64url(fragment.slice(SEALED.length));
  } catch {
    throw new Error(DAMAGED);
  }
  if (raw.length < 28 + 16) throw new Error(DAMAGED);
  const key = await sealingKey(passphrase, raw.subarray(0, 16));
  try {
    const packed = await crypto.subtle.decrypt(
      { name: "AES-GCM", iv: raw.subarray(16, 28), additionalData: new TextEncoder().encode(SEALED) }, key, raw.subarray(28));
    return PLAIN + toBase64url(new Uint8Array(packed));
  } catch {
    throw new Error("the link cannot be opened: the passphrase does not open it, or the link was changed");
  }
}

// What the user typed and chose is kept in this browser's own storage, on
// this computer only, so that a reload loses nothing.

export const KEPT = "midrank.workspace.v1";

// RUNNING is set while an analysis runs: found on a load, it means that the
// page died during the last analysis (out of memory, a crashed tab), so the
// kept text is not analysed again by itself.
export const RUNNING = "midrank.running.v1";

// remember sets (or, with null, removes) an item of this browser's storage;
// false when the storage refuses (full, or switched off).
export function remember(key, value) {
  try {
    if (value === null) localStorage.removeItem(key);
    else localStorage.setItem(key, value);
    return true;
  } catch {
    return false;
  }
}

// recall reads an item of this browser's storage; null when there is none
// or the storage is switched off.
export function recall(key) {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
}

// recallWorkspace is the kept text, settings and edits, or null.
export function recallWorkspace() {
  try {
    const kept = JSON.parse(recall(KEPT) || "null");
    return kept && typeof kept.data === "string" ? kept : null;
  } catch {
    return null;
  }
}

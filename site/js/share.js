// Sharing: a link that carries the data and settings, or the results only
// (either sealed with a passphrase when one is given), the passphrase form
// of a sealed link, and the result line, the decision paragraph and the
// tables copied, as they may leave the tab (outgoing.js).
import { $, copyAs, copyText, setStatus, showProblem } from "./dom.js";
import { state } from "./state.js";
import { htmlOf, plainOf } from "./tableview.js";
import { dataText } from "./input.js";
import { formOptions } from "./settings.js";
import { seal, unseal } from "./seal.js";
import { outgoing, protecting } from "./outgoing.js";

// Links longer than this are cut by some mail and chat programs.
const SAFE_LINK = 2000;

// linkKind is what the link is to carry: "data" or "results"; results
// that came without their data can be passed on only as results.
function linkKind() {
  return state.readOnly ? "results" : document.querySelector("input[name=link-kind]:checked").value;
}

// contents says in a sentence what a link of this kind carries.
function contents(kind, sealed) {
  if (kind === "results") {
    const { r } = outgoing();
    return "This link carries the results only — the figures, the group summaries, the pairs and the settings — and no value of any person" +
      (r.protection_note ? "; small groups are protected as the report says" : "") + (sealed ? ", encrypted: only someone who also has the passphrase can open it. Send the passphrase another way. " : ". ");
  }
  const unprotected = protecting() ? "Small groups are not protected in it: choose \u201cthe results only\u201d for that. " : "";
  return (sealed ? "This link contains your data, encrypted: only someone who also has the passphrase can open it. Send the passphrase another way. "
    : "This link contains your data itself: anyone who has it can see the data. ") + unprotected;
}

async function makeLink(ask) {
  const passphrase = $("link-passphrase").value, kind = linkKind();
  setStatus(passphrase ? "Sealing the link with the passphrase…" : "Making the link…");
  const { body } = kind === "results" && state.readOnly ? { body: { link: state.readOnlyLink } }
    : await ask(kind === "results" ? { kind: "results-link", measure: state.drill } : { kind: "link", data: dataText(), options: formOptions(), edits: state.edits });
  if (body.error) {
    showProblem(body.error);
    return;
  }
  let fragment = body.link;
  if (passphrase) {
    try {
      fragment = await seal(fragment, passphrase);
    } catch (err) {
      showProblem({ message: "The link could not be sealed: " + err.message + "." });
      return;
    }
  }
  const url = location.href.split("#")[0] + fragment;
  let note = contents(kind, Boolean(passphrase)) + "It is " + url.length.toLocaleString() + " characters long and never reaches a server, because browsers do not send the part after # anywhere.";
  setStatus("The link is ready.");
  if (url.length > SAFE_LINK) note += " It is longer than " + SAFE_LINK.toLocaleString() + " characters, which some mail and chat programs cut: send it as a file or check that it arrives whole.";
  $("link-note").textContent = note;
  $("link-text").value = url;
  $("link-box").hidden = false;
}

// wireShare connects the link and copy buttons and the passphrase form;
// ask is the bridge's, opened(fragment) opens an unsealed link.
export function wireShare(ask, opened) {
  $("make-link").addEventListener("click", () => makeLink(ask));
  $("copy-link").addEventListener("click", async () => {
    if (!await copyText($("link-text").value, "The link", "the link is selected, copy it by hand.")) $("link-text").select();
  });
  $("copy-result-line").addEventListener("click", () =>
    copyText($("result-line").textContent, "The result line", "select the line and copy it by hand."));
  $("copy-decision").addEventListener("click", () => {
    if (state.result) copyText(outgoing().r.decision, "The paragraph", "select the paragraph and copy it by hand.");
  });
  $("copy-tables").addEventListener("click", () => {
    if (!state.result) return;
    const tables = Object.values(outgoing().tables);
    copyAs({ "text/html": tables.map(htmlOf).join(""), "text/plain": tables.map(plainOf).join("\n") },
      "Every table", "download the report instead and copy the tables from it.");
  });
  $("unlock").addEventListener("submit", async (event) => {
    event.preventDefault();
    setStatus("Opening the link…");
    let fragment;
    try {
      fragment = await unseal(location.hash, $("unlock-passphrase").value, state.limits.link);
    } catch (err) {
      showProblem({ message: err.message });
      setStatus("The link is still locked.");
      return;
    }
    if (await opened(fragment)) $("unlock").hidden = true;
  });
}

// Sharing: a link that carries the data and settings (sealed with a
// passphrase when one is given), the passphrase form of a sealed link, and
// the result line, the decision paragraph and the tables copied.
import { $, copyAs, copyText, setStatus, showProblem } from "./dom.js";
import { state } from "./state.js";
import { htmlOf, plainOf } from "./tableview.js";
import { dataText } from "./input.js";
import { formOptions } from "./settings.js";
import { seal, unseal } from "./seal.js";

// Links longer than this are cut by some mail and chat programs.
const SAFE_LINK = 2000;

async function makeLink(ask) {
  const passphrase = $("link-passphrase").value;
  setStatus(passphrase ? "Sealing the link with the passphrase…" : "Making the link…");
  const { body } = await ask({ kind: "link", data: dataText(), options: formOptions(), edits: state.edits });
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
  let note = passphrase
    ? "This link contains your data, encrypted (" + url.length.toLocaleString() + " characters): only someone who also has the passphrase can open it. Send the passphrase another way. "
    : "This link contains your data itself (" + url.length.toLocaleString() + " characters): anyone who has it can see the data. ";
  note += "It never reaches a server, because browsers do not send the part after # anywhere.";
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
  $("copy-decision").addEventListener("click", () =>
    copyText($("decision").textContent, "The paragraph", "select the paragraph and copy it by hand."));
  $("copy-tables").addEventListener("click", () => {
    if (!state.result) return;
    const tables = Object.values(state.tables);
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

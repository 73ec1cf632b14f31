// Small helpers for the page's elements. User text is only ever set as
// text, never as HTML.

export const $ = (id) => document.getElementById(id);

// row makes a table row of text cells.
export function row(cells, className) {
  const tr = document.createElement("tr");
  if (className) tr.className = className;
  for (const c of cells) {
    const td = document.createElement("td");
    td.textContent = String(c);
    tr.append(td);
  }
  return tr;
}

export function setStatus(text) {
  $("status").textContent = text;
}

// showProblem shows an error of the module ({message}) above the results.
export function showProblem(error) {
  const p = $("problem");
  p.textContent = error.option && error.reason != null ? settingProblem(error) : error.message;
  p.hidden = false;
  setStatus("The data could not be analysed.");
}

// settingProblem says which setting cannot be used as the form names it
// (its label, the choice's words), and which choices would do instead.
function settingProblem(error) {
  const control = document.getElementById(error.option);
  if (!(control instanceof HTMLSelectElement || control instanceof HTMLInputElement)) return error.message;
  const name = control.closest("label")?.firstChild?.textContent.trim() || error.option;
  const words = (value) => [...(control.options ?? [])].find((o) => o.value === value)?.textContent ?? value;
  const instead = error.instead ?? [];
  return `${name} “${words(error.found ?? control.value)}”: ${error.reason}` +
    (instead.length ? `. Choose ${instead.map((v) => "“" + words(v) + "”").join(" or ")} instead.` : "");
}

// download saves text as a file made in the page: a Blob and a link.
export function download(name, type, content) {
  const url = URL.createObjectURL(content instanceof Blob ? content : new Blob([content], { type }));
  const a = document.createElement("a");
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

// copyText puts text on the clipboard and says so; when the browser
// refuses, the status says what to do instead.
export function copyText(text, what, instead) {
  return copyAs({ "text/plain": text }, what, instead);
}

// copyAs puts one thing on the clipboard in several forms ({type: text}),
// so that a word processor takes the HTML and a plain editor the text. The
// Clipboard API needs a secure origin; on a plain http intranet address the
// browser's copy command is used instead.
export async function copyAs(forms, what, instead) {
  try {
    if (navigator.clipboard?.write && typeof ClipboardItem === "function") {
      await navigator.clipboard.write([new ClipboardItem(Object.fromEntries(
        Object.entries(forms).map(([type, text]) => [type, new Blob([text], { type })])))]);
    } else if (!copyCommand(forms)) {
      throw new Error("refused");
    }
    setStatus(what + " is on the clipboard.");
  } catch {
    setStatus("Copying was refused by the browser; " + instead);
    return false;
  }
  return true;
}

// copyCommand copies through the browser's copy command, filling the copy
// event's data with every form.
function copyCommand(forms) {
  const fill = (event) => {
    for (const [type, text] of Object.entries(forms)) event.clipboardData.setData(type, text);
    event.preventDefault();
  };
  document.addEventListener("copy", fill, { once: true });
  const done = document.execCommand("copy");
  document.removeEventListener("copy", fill);
  return done;
}

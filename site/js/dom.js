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
  p.textContent = error.message;
  p.hidden = false;
  setStatus("The data could not be analysed.");
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
export async function copyText(text, what, instead) {
  try {
    await navigator.clipboard.writeText(text);
    setStatus(what + " is on the clipboard.");
  } catch {
    setStatus("Copying was refused by the browser; " + instead);
    return false;
  }
  return true;
}

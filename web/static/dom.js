// dom.js: the page's small DOM helpers: element by id, HTML escaping,
// the notice line and downloads.

export const $ = function (id) { return document.getElementById(id); };

// esc makes text safe inside HTML.
export function esc(s) {
  return String(s).replace(/[&<>"']/g, function (c) {
    return { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' }[c];
  });
}

export function cssEsc(s) { return window.CSS && CSS.escape ? CSS.escape(s) : s.replace(/["\\\[\]]/g, '\\$&'); }

export function notice(msg) {
  var n = $('notice');
  n.textContent = msg;
  n.hidden = false;
  clearTimeout(notice.t);
  // A message about something that went wrong stays longer.
  notice.t = setTimeout(function () { n.hidden = true; }, /^[\u2716\u26A0]/.test(msg) ? 20000 : 6000);
}

export function download(text, name, type) {
  var blob = new Blob([text], { type: type });
  var a = document.createElement('a');
  a.href = URL.createObjectURL(blob);
  a.download = name;
  document.body.appendChild(a);
  a.click();
  setTimeout(function () { URL.revokeObjectURL(a.href); a.remove(); }, 1000);
}

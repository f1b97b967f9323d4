// sheet.js: the printed check sheet. The core writes it (the "sheet" call,
// core/sheet in Go: the same renderer as swaysheet -sheet); this file only
// puts it into the page's print area after each result, and prints it.

const sheetHost = document.getElementById('sheet-host');
let sheetTimer = null, sheetSeq = 0, sheetResults = 0, sheetMadeFor = 0;

function two(n) { return (n < 10 ? '0' : '') + n; }
function printedAt() {
  var d = new Date();
  return d.getFullYear() + '-' + two(d.getMonth() + 1) + '-' + two(d.getDate()) + ' ' + two(d.getHours()) + ':' + two(d.getMinutes());
}

// build asks the core for the sheet of the inputs as they are now.
function buildSheet() {
  var sw = window.swaysheet;
  if (!sw || !sw.call) return Promise.resolve(false);
  var my = ++sheetSeq, forResult = sheetResults, sc;
  try { sc = JSON.parse(sw.scenarioJSON()); } catch (e) { sc = null; }
  if (!sc) { sheetMadeFor = forResult; return Promise.resolve(false); }
  var input = JSON.stringify({ scenario: sc, units: sw.units(), system: sw.system(),
    link_base: location.protocol === 'file:' ? '' : location.href.split('#')[0], printed_at: printedAt() });
  return sw.call('sheet', input, { later: 'sheet' }).then(function (r) {
    if (my !== sheetSeq) return false;
    if (r.error) {
      sheetMadeFor = forResult;
      sheetHost.textContent = 'The check sheet could not be made: ' + r.error.message;
      delete sheetHost.dataset.fingerprint;
      sheetHost.dataset.ready = 'error';
      return false;
    }
    // The core's HTML: every text in it, the user's fields included, is
    // escaped by the renderer.
    sheetHost.innerHTML = r.result.html;
    sheetHost.dataset.fingerprint = r.result.fingerprint;
    // Which scenario's results it prints (the figures' and plots' too).
    sheetHost.dataset.resultFingerprint = r.result.result_fingerprint;
    fitSheet();
    sheetHost.dataset.ready = String(my);
    sheetMadeFor = forResult;
    return true;
  });
}

// fit scales a sheet that would not fit on one page of the shorter
// (US Letter: 279.4 mm less 20 mm of margins) or narrower (A4) paper.
function fitSheet() {
  var a = sheetHost.firstElementChild;
  if (!a) return;
  a.style.zoom = '';
  var mm = a.getBoundingClientRect().height * 25.4 / 96;
  if (mm > 258) a.style.zoom = String(Math.floor(258 / mm * 100) / 100);
}

document.addEventListener('swaysheet:result', function () {
  sheetResults++;
  clearTimeout(sheetTimer);
  sheetTimer = setTimeout(buildSheet, 500);
});

// sheetCurrent: the sheet is that of the last result (main.js's
// window.swaysheet.settled asks).
export function sheetCurrent() { return sheetMadeFor === sheetResults; }

// The browser's own print, while inputs or the sheet are still being
// worked out: the paper says so.
window.addEventListener('beforeprint', function () {
  var old = sheetHost.querySelector('.sw-stale');
  if (old) old.remove();
  var sw = window.swaysheet;
  if (sw && sw.settled && !sw.settled()) {
    var p = document.createElement('p');
    p.className = 'sw-banner sw-stale';
    p.textContent = '\u26A0 NOT UP TO DATE: the inputs were still being computed when this was printed. Cancel, wait for the sheetResults and print again.';
    var a = sheetHost.querySelector('article');
    if (a) a.insertBefore(p, a.firstChild); else sheetHost.appendChild(p);
  }
});

// print makes the sheet of the inputs as they are, then prints it (the
// page's Print button; the browser's own print uses the sheet kept).
function printSheet() {
  clearTimeout(sheetTimer);
  buildSheet().then(function () { window.print(); });
}

window.swaysheetSheet = { build: buildSheet, print: printSheet };

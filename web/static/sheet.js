// sheet.js: the printed check sheet. The core writes it (the "sheet" call,
// core/sheet in Go: the same renderer as swaysheet -sheet); this file only
// puts it into the page's print area after each result, and prints it.
(function () {
  'use strict';
  var host = document.getElementById('sheet-host');
  var timer = null, seq = 0, results = 0, madeFor = 0;

  function two(n) { return (n < 10 ? '0' : '') + n; }
  function now() {
    var d = new Date();
    return d.getFullYear() + '-' + two(d.getMonth() + 1) + '-' + two(d.getDate()) + ' ' + two(d.getHours()) + ':' + two(d.getMinutes());
  }

  // build asks the core for the sheet of the inputs as they are now.
  function build() {
    var sw = window.swaysheet;
    if (!sw || !sw.call) return Promise.resolve(false);
    var my = ++seq, forResult = results, sc;
    try { sc = JSON.parse(sw.scenarioJSON()); } catch (e) { sc = null; }
    if (!sc) { madeFor = forResult; return Promise.resolve(false); }
    var input = JSON.stringify({ scenario: sc, units: sw.units(), system: sw.system(),
      link_base: location.protocol === 'file:' ? '' : location.href.split('#')[0], printed_at: now() });
    return sw.call('sheet', input).then(function (r) {
      if (my !== seq) return false;
      if (r.error) {
        madeFor = forResult;
        host.textContent = 'The check sheet could not be made: ' + r.error.message;
        delete host.dataset.fingerprint;
        host.dataset.ready = 'error';
        return false;
      }
      // The core's HTML: every text in it, the user's fields included, is
      // escaped by the renderer.
      host.innerHTML = r.result.html;
      host.dataset.fingerprint = r.result.fingerprint;
      fit();
      host.dataset.ready = String(my);
      madeFor = forResult;
      return true;
    });
  }

  // fit scales a sheet that would not fit on one page of the shorter
  // (US Letter: 279.4 mm less 20 mm of margins) or narrower (A4) paper.
  function fit() {
    var a = host.firstElementChild;
    if (!a) return;
    a.style.zoom = '';
    var mm = a.getBoundingClientRect().height * 25.4 / 96;
    if (mm > 258) a.style.zoom = String(Math.floor(258 / mm * 100) / 100);
  }

  document.addEventListener('swaysheet:result', function () {
    results++;
    clearTimeout(timer);
    timer = setTimeout(build, 500);
  });

  // The page is settled when the sheet, too, is that of the last result.
  function current() { return madeFor === results; }
  if (window.swaysheet && window.swaysheet.settled) {
    var settled = window.swaysheet.settled;
    window.swaysheet.settled = function () { return settled() && current(); };
  }

  // The browser's own print, while inputs or the sheet are still being
  // worked out: the paper says so.
  window.addEventListener('beforeprint', function () {
    var old = host.querySelector('.sw-stale');
    if (old) old.remove();
    var sw = window.swaysheet;
    if (sw && sw.settled && !sw.settled()) {
      var p = document.createElement('p');
      p.className = 'sw-banner sw-stale';
      p.textContent = '\u26A0 NOT UP TO DATE: the inputs were still being computed when this was printed. Cancel, wait for the results and print again.';
      var a = host.querySelector('article');
      if (a) a.insertBefore(p, a.firstChild); else host.appendChild(p);
    }
  });

  // print makes the sheet of the inputs as they are, then prints it (the
  // page's Print button; the browser's own print uses the sheet kept).
  function print() {
    clearTimeout(timer);
    build().then(function () { window.print(); });
  }

  window.swaysheetSheet = { build: build, print: print };
})();

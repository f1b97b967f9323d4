// sheet.js: the printed check sheet. The core writes it (the "sheet" call,
// web/sheet in Go: the same renderer as swaysheet -sheet); this file only
// puts it into the page's print area after each result, and prints it.
(function () {
  'use strict';
  var host = document.getElementById('sheet-host');
  var btn = document.getElementById('do-print');
  var timer = null, seq = 0;

  function two(n) { return (n < 10 ? '0' : '') + n; }
  function now() {
    var d = new Date();
    return d.getFullYear() + '-' + two(d.getMonth() + 1) + '-' + two(d.getDate()) + ' ' + two(d.getHours()) + ':' + two(d.getMinutes());
  }

  // build asks the core for the sheet of the inputs as they are now.
  function build() {
    var sw = window.swaysheet;
    if (!sw || !sw.call) return Promise.resolve(false);
    var my = ++seq, sc;
    try { sc = JSON.parse(sw.scenarioJSON()); } catch (e) { return Promise.resolve(false); }
    if (!sc) return Promise.resolve(false);
    var input = JSON.stringify({ scenario: sc, units: sw.units(), system: sw.system(),
      link_base: location.protocol === 'file:' ? '' : location.href.split('#')[0], printed_at: now() });
    return sw.call('sheet', input).then(function (r) {
      if (my !== seq) return false;
      if (r.error) {
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
      return true;
    });
  }

  // fit scales a sheet that would not fit on one page of the shorter
  // (US Letter: 279.4 mm less 16 mm of margins) or narrower (A4) paper.
  function fit() {
    var a = host.firstElementChild;
    if (!a) return;
    a.style.zoom = '';
    var mm = a.getBoundingClientRect().height * 25.4 / 96;
    if (mm > 262) a.style.zoom = String(Math.floor(262 / mm * 100) / 100);
  }

  document.addEventListener('swaysheet:result', function () {
    clearTimeout(timer);
    timer = setTimeout(build, 300);
  });

  if (btn) {
    btn.addEventListener('click', function () {
      clearTimeout(timer);
      build().then(function () { window.print(); });
    });
  }

  window.swaysheetSheet = { build: build };
})();

// boot.js: starts the calculation engine's worker (worker.js: it fetches
// and compiles the wasm) while the page's modules are still loading; a
// classic script read before main.js, which is run only once every module
// it imports has arrived. engine.js takes this worker for its first start.
'use strict';
try {
  window.swaysheetBootWorker = new Worker(window.swaysheetWorkerURL || 'worker.js');
  // An error before engine.js takes the worker is kept for it to report.
  window.swaysheetBootWorker.onerror = function (e) {
    if (e.preventDefault) e.preventDefault();
    this.bootError = e.message || 'unknown error';
  };
  // The inputs kept from last time (storage.js CURRENT): the worker
  // evaluates them while the page's modules load (worker.js warmUp).
  var kept = null;
  try { kept = window.localStorage.getItem('swaysheet.current.v1'); } catch (e) { kept = null; }
  if (kept) window.swaysheetBootWorker.postMessage({ warm: kept });
} catch (e) {
  window.swaysheetBootWorker = null; // engine.js starts one (and reports what fails)
}

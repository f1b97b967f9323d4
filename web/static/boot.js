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
} catch (e) {
  window.swaysheetBootWorker = null; // engine.js starts one (and reports what fails)
}

// fetchworker.js: runs the small fetch wasm (swayfetch.wasm, wasm/fetch)
// that reads the site library's files with tinyutil's httputil. The core's
// worker (worker.js) starts it the first time the library is read.
// Messages in: {id, url}; out: {id, text, error} with the file's text or
// why it could not be read ({id: 0, error} when the wasm stopped).
'use strict';
importScripts('wasm_exec.js');

var ready = (async function () {
  var go = new Go();
  var resp = await fetch('swayfetch.wasm');
  if (!resp.ok) throw new Error('swayfetch.wasm: ' + resp.status + ' ' + resp.statusText);
  var inst = (await WebAssembly.instantiate(await resp.arrayBuffer(), go.importObject)).instance;
  go.run(inst).then(function () {
    self.swayfetchGet = null;
    postMessage({ id: 0, error: 'the fetch wasm ended' });
  });
  while (!self.swayfetchReady) await new Promise(function (r) { setTimeout(r, 5); });
})();

onmessage = async function (e) {
  var m = e.data;
  try {
    await ready;
  } catch (err) {
    postMessage({ id: m.id, error: 'the site library reader could not start (' + err.message + ')' });
    return;
  }
  if (typeof self.swayfetchGet !== 'function') {
    postMessage({ id: m.id, error: 'the site library reader is not running' });
    return;
  }
  self.swayfetchGet(String(m.url), function (text, error) {
    postMessage({ id: m.id, text: text, error: error });
  });
};

// worker.js: runs the swaysheet core (Go compiled to wasm) off the page's
// main thread. Messages in: {id, name, input}; out: {id, out} where out is
// the reply JSON of the named call (see wasm/bridge).
'use strict';
// The single-file build (make dist) puts wasm_exec.js and the gzipped,
// base64 wasm (self.swaysheetWasmGz) in front of this file.
if (typeof Go === 'undefined') importScripts('wasm_exec.js');

async function embeddedWasm() {
  var bin = atob(self.swaysheetWasmGz), gz = new Uint8Array(bin.length);
  for (var i = 0; i < bin.length; i++) gz[i] = bin.charCodeAt(i);
  return new Response(new Blob([gz]).stream().pipeThrough(new DecompressionStream('gzip'))).arrayBuffer();
}

function errorReply(msg) {
  return JSON.stringify({ error: { message: msg, fields: [] } });
}

var ready = (async function () {
  var go = new Go();
  var inst;
  if (self.swaysheetWasmGz) {
    inst = (await WebAssembly.instantiate(await embeddedWasm(), go.importObject)).instance;
  } else if (WebAssembly.instantiateStreaming) {
    try {
      inst = (await WebAssembly.instantiateStreaming(fetch('swaysheet.wasm'), go.importObject)).instance;
    } catch (e) {
      inst = null;
    }
  }
  if (!inst && !self.swaysheetWasmGz) {
    var resp = await fetch('swaysheet.wasm');
    if (!resp.ok) throw new Error('swaysheet.wasm: ' + resp.status + ' ' + resp.statusText);
    inst = (await WebAssembly.instantiate(await resp.arrayBuffer(), go.importObject)).instance;
  }
  go.run(inst).then(function () {
    self.swaysheetCall = null;
    postMessage({ id: 0, out: errorReply('The calculation engine stopped. Reload the page; your scenario is kept.') });
  });
  while (!self.swaysheetReady) await new Promise(function (r) { setTimeout(r, 5); });
})();

onmessage = async function (e) {
  var m = e.data;
  try {
    await ready;
  } catch (err) {
    postMessage({ id: m.id, out: errorReply('The calculation engine could not start (' + err.message + '). Reload the page.') });
    return;
  }
  if (typeof self.swaysheetCall !== 'function') {
    postMessage({ id: m.id, out: errorReply('The calculation engine is not running. Reload the page.') });
    return;
  }
  self.swaysheetCall(m.name, m.input || '', function (out) {
    postMessage({ id: m.id, out: out });
  });
};

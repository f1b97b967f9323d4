// worker.js: runs the swaysheet core (Go compiled to wasm) off the page's
// main thread. Messages in: {id, name, input}; out: {id, out} where out is
// the reply JSON of the named call (see wasm/bridge).
'use strict';
// The single-file build (make dist, web/dist) puts wasm_exec.js and the
// gzipped wasm as base85 text (self.swaysheetWasmGz85) in front of this file.
if (typeof Go === 'undefined') importScripts('wasm_exec.js');

// decode85 is web/dist's Decode85: 5 digits of its alphabet to 4 bytes.
function decode85(s) {
  var A = '';
  for (var c = 33; c <= 126 && A.length < 85; c++) if ('"&\'<>\\`'.indexOf(String.fromCharCode(c)) < 0) A += String.fromCharCode(c);
  var idx = new Int16Array(128).fill(-1), d = [], i, k;
  for (i = 0; i < 85; i++) idx[A.charCodeAt(i)] = i;
  for (i = 0; i < s.length; i++) { var x = s.charCodeAt(i); if (x < 128 && idx[x] >= 0) d.push(idx[x]); }
  var out = new Uint8Array(Math.floor(d.length / 5) * 4 + 4), n = 0;
  for (i = 0; i < d.length; i += 5) {
    var m = Math.min(5, d.length - i), v = 0;
    for (k = 0; k < 5; k++) v = v * 85 + (k < m ? d[i + k] : 84);
    for (k = 0; k < m - 1; k++) out[n++] = Math.floor(v / Math.pow(256, 3 - k)) % 256;
  }
  return out.subarray(0, n);
}

async function embeddedWasm() {
  var gz = decode85(self.swaysheetWasmGz85);
  return new Response(new Blob([gz]).stream().pipeThrough(new DecompressionStream('gzip'))).arrayBuffer();
}

function errorReply(msg) {
  return JSON.stringify({ error: { message: msg, fields: [] } });
}

var ready = (async function () {
  var go = new Go();
  var inst;
  if (self.swaysheetWasmGz85) {
    inst = (await WebAssembly.instantiate(await embeddedWasm(), go.importObject)).instance;
  } else if (WebAssembly.instantiateStreaming) {
    try {
      inst = (await WebAssembly.instantiateStreaming(fetch('swaysheet.wasm'), go.importObject)).instance;
    } catch (e) {
      inst = null;
    }
  }
  if (!inst && !self.swaysheetWasmGz85) {
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

// worker.js: runs the swaysheet core (Go compiled to wasm) off the page's
// main thread. Messages in: {id, name, input}; out: {id, out} where out is
// the reply JSON of the named call (see wasm/bridge).
'use strict';
// The single-file build (make dist, web/dist) puts wasm_exec.js and the
// gzipped wasm as 7-bit text (self.swaysheetWasmText) in front of this file.
if (typeof Go === 'undefined') importScripts('wasm_exec.js');

// decode7 is web/dist's Decode7: "<bytes>:", then each character is 7
// bits, except U+0100 + 128 i + w, which stands for the i-th of the values
// NUL, CR, '<' and then w.
function decode7(s) {
  var colon = s.indexOf(':'), n = parseInt(s.slice(0, colon), 10);
  var unsafe = [0, 13, 60], out = new Uint8Array(n), o = 0, acc = 0, bits = 0;
  function put(v) {
    acc = (acc << 7) | v;
    bits += 7;
    if (bits >= 8) {
      bits -= 8;
      if (o < n) out[o++] = (acc >> bits) & 255;
      acc &= (1 << bits) - 1;
    }
  }
  for (var i = colon + 1; i < s.length && o < n; i++) {
    var c = s.charCodeAt(i);
    if (c < 128) put(c);
    else { c -= 256; put(unsafe[c >> 7]); put(c & 127); }
  }
  if (o < n) throw new Error('the wasm text inside the page is cut short');
  return out;
}

async function embeddedWasm() {
  var gz = decode7(self.swaysheetWasmText);
  return new Response(new Blob([gz]).stream().pipeThrough(new DecompressionStream('gzip'))).arrayBuffer();
}

function errorReply(msg) {
  return JSON.stringify({ error: { message: msg, fields: [] } });
}

var ready = (async function () {
  var go = new Go();
  var inst;
  if (self.swaysheetWasmText) {
    inst = (await WebAssembly.instantiate(await embeddedWasm(), go.importObject)).instance;
  } else if (WebAssembly.instantiateStreaming) {
    try {
      inst = (await WebAssembly.instantiateStreaming(fetch('swaysheet.wasm'), go.importObject)).instance;
    } catch (e) {
      inst = null;
    }
  }
  if (!inst && !self.swaysheetWasmText) {
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

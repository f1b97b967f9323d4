// worker.js: runs the swaysheet core (Go compiled to wasm) off the page's
// main thread. Messages in: {id, name, input}; out: {id, out} where out is
// the reply JSON of the named call (see wasm/bridge).
'use strict';
// The single-file build (make dist, web/dist) puts wasm_exec.js and the
// gzipped wasm as 7-bit text (self.swaysheetWasmText) in front of this file.
// The served page's wasm is asked for first, so that it downloads (and
// compiles as it arrives) while wasm_exec.js is read.
var wasmResponse = self.swaysheetWasmText ? null : fetch('swaysheet.wasm');
if (wasmResponse) wasmResponse.catch(function () { /* reported by the start below */ });
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
      inst = (await WebAssembly.instantiateStreaming(wasmResponse, go.importObject)).instance;
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

// swaysheetFetch(kind, url, done) is how the core (wasm/fetch.go) reads
// files of the page's server: done(text, '') or done('', message). The
// example files ('example') are read with the Fetch API; the site library
// ('library') by the small fetch wasm (swayfetch.wasm, tinyutil's
// httputil) in a worker of its own (fetchworker.js), started the first
// time the library is read. Each read has a deadline: one not answered in
// time ends the fetch worker (a fresh one starts on the next read).
var FETCH_DEADLINE_MS = 30000, fetcher = null, fetchId = 1, fetchWaiting = {};

function fetchText(url) {
  return fetch(url).then(function (r) {
    if (!r.ok) throw new Error(url + ': ' + r.status + ' ' + r.statusText);
    return r.text();
  });
}

function stopFetcher(msg) {
  var pending = fetchWaiting;
  fetchWaiting = {};
  if (fetcher) { try { fetcher.terminate(); } catch (e) { /* already gone */ } }
  fetcher = null;
  Object.keys(pending).forEach(function (id) {
    clearTimeout(pending[id].timer);
    pending[id].done('', msg);
  });
}

function startFetcher() {
  fetcher = new Worker('fetchworker.js');
  fetcher.onmessage = function (e) {
    var m = e.data, w = fetchWaiting[m.id];
    if (m.id === 0) { stopFetcher('the site library reader stopped: ' + m.error); return; }
    delete fetchWaiting[m.id];
    if (w) { clearTimeout(w.timer); w.done(m.text || '', m.error || ''); }
  };
  fetcher.onerror = function (e) {
    if (e.preventDefault) e.preventDefault();
    stopFetcher('the site library reader failed (' + (e.message || 'unknown error') + ')');
  };
}

self.swaysheetFetch = function (kind, url, done) {
  if (kind !== 'library') {
    fetchText(url).then(function (t) { done(t, ''); }, function (err) { done('', err.message); });
    return;
  }
  if (!fetcher) startFetcher();
  var id = fetchId++;
  fetchWaiting[id] = {
    done: done,
    timer: setTimeout(function () {
      if (fetchWaiting[id]) stopFetcher(url + ' was not read within ' + FETCH_DEADLINE_MS / 1000 + ' s');
    }, FETCH_DEADLINE_MS)
  };
  fetcher.postMessage({ id: id, url: new URL(url, self.location.href).href });
};

// Work done before the page asks, while its modules still load (the
// wasm is ready well before them): the calls without input whose answer
// never changes in one engine (the page's first calls) are answered from
// here; the inputs kept from last time (boot.js sends them: {warm}) are
// evaluated, so the page's own evaluate call finds them in the bridge's
// memo; and the figures and plot calls run once, so that their code is
// compiled before a person waits for it. Nothing here is shown.
var FIXED = ['units', 'ranges', 'version', 'ropelength_ranges'], fixed = {}, warm = null, started = false;
// live: the evaluate calls with a chart not answered yet; unwanted: those
// of them the page no longer wants.
var live = {}, unwanted = {};

function callOut(name, input) {
  return new Promise(function (resolve) { self.swaysheetCall(name, input, resolve); });
}

function warmUp() {
  if (typeof self.swaysheetCall !== 'function') return;
  started = true;
  FIXED.forEach(function (n) { fixed[n] = callOut(n, ''); });
  if (warm) {
    callOut('evaluate', warm);
    callOut('figures', '{"scenario":' + warm + ',"units":{},"system":"si"}');
  }
  callOut('plot', '{"title":"","x_label":"","y_label":"","series":[{"x":[0,1],"y":[0,1]}],"width_px":300}');
}
ready.then(warmUp, function () { /* reported to each call */ });

onmessage = async function (e) {
  var m = e.data;
  if (m.unwanted) {
    if (live[m.unwanted]) unwanted[m.unwanted] = true;
    return;
  }
  if (m.warm !== undefined) {
    if (!started) warm = m.warm;
    return;
  }
  if (!m.input && fixed[m.name]) {
    fixed[m.name].then(function (out) { postMessage({ id: m.id, out: out }); });
    return;
  }
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
  var run = function () {
    if (unwanted[m.id]) {
      done(m.id);
      postMessage({ id: m.id, out: errorReply('Not computed: later inputs were sent.') });
      return;
    }
    self.swaysheetCall(m.name, m.input || '', function (out) {
      var answer = function () { done(m.id); postMessage({ id: m.id, out: out }); };
      if (m.chart) drawFirst(m, out, answer);
      else answer();
    });
  };
  // An evaluate call with a chart (the page's inputs, typed on) begins a
  // task later: a later change sent meanwhile has said by then that this
  // one is no longer wanted ({unwanted: id}, posted before it), and it is
  // left out.
  if (m.chart) {
    live[m.id] = true;
    soon(run);
  } else {
    run();
  }
};

function done(id) {
  delete live[id];
  delete unwanted[id];
}

// soon runs f in a task of its own after the messages already here (a
// message to itself: no timer's minimum wait).
var soonPort = new MessageChannel(), soonQueue = [];
soonPort.port1.onmessage = function () { var f = soonQueue.shift(); if (f) f(); };
function soon(f) {
  soonQueue.push(f);
  soonPort.port2.postMessage(0);
}

// drawFirst draws the chart an evaluate call came with (engine.js) from
// its result and posts it, with the bands drawn, before the result: the
// page shows it without a second trip here (a chart without a width: the
// bands alone). The chart's series name the
// result's history fields ("time_s"); the bands are the moves' speeding
// up (A) and braking (B), numbered by move.
function drawFirst(m, out, then) {
  var r = JSON.parse(out).result, hs = r && r.history, c = m.chart, bands = [];
  if (!hs || !hs.time_s) { then(); return; }
  (r.phases || []).forEach(function (p) {
    var n = p.motion + 1;
    bands.push({ x0: p.start_s, x1: p.accel_end_s, text: 'A' + n });
    bands.push({ x0: p.decel_start_s, x1: p.end_s, text: 'B' + n });
  });
  // A task later (soon): the page may have said meanwhile that it no longer
  // wants the result ({unwanted: id}, engine.js); the chart is then not drawn.
  soon(function () {
    var drop = unwanted[m.id];
    if (!c.width_px || drop) { postMessage({ id: m.id, chart: '', bands: bands }); then(); return; }
    var post = function (svg, byKey) {
      postMessage({ id: m.id, chart: svg, bands: bands, byKey: byKey });
      then();
    };
    c.bands = bands;
    // Drawn from the evaluation the engine keeps (the result's key), the
    // series named, not sent back: the same numbers (wasm/bridge,
    // plotInput). Should it no longer be kept: with the numbers.
    var named = Object.assign({}, c, {
      history_key: r.key,
      series_of: c.series.map(function (s) { return [s.x, s.y]; }),
      series: c.series.map(function (s) { var t = Object.assign({}, s); delete t.x; delete t.y; return t; })
    });
    self.swaysheetCall('plot', JSON.stringify(named), function (svg) {
      if (r.key && svg.lastIndexOf('{"error"', 0) !== 0) { post(svg, true); return; }
      c.series.forEach(function (s) { s.x = hs[s.x]; s.y = hs[s.y]; });
      self.swaysheetCall('plot', JSON.stringify(c), post);
    });
  });
}

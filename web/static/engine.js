// engine.js: the client of the calculation engine (worker.js runs the Go
// core compiled to wasm): calls with deadlines, restart, cancel.

import { evaluate } from './compute.js';
import { $, notice } from './dom.js';

let worker = null, nextId = 1, waiting = {}, restarts = [], inFlight = 0, held = [], pumping = false;

// chartsDrawn counts the charts the worker drew with an evaluation, from
// the evaluation the engine keeps (byKey) or from numbers sent back
// (byNumbers, when it was no longer kept), for the browser tests.
export const chartsDrawn = { byKey: 0, byNumbers: 0 };

// DEADLINES: how long (ms) a call may go unanswered before the engine is
// taken as stuck or gone (a worker can end without an error event). The
// first calls wait for the engine to start; a plan simulates many moves.
export const DEADLINES = { plan: 180000, evaluate: 90000, sheet: 90000, clearance: 120000, other: 60000 };

export function startWorker() {
  // The first start takes the worker boot.js started early.
  worker = window.swaysheetBootWorker || new Worker(window.swaysheetWorkerURL || 'worker.js');
  window.swaysheetBootWorker = null;
  worker.onmessage = function (e) {
    var m = e.data;
    if (m.id === 0) { engineStopped(JSON.parse(m.out).error.message, 'failed'); return; }
    var w = waiting[m.id];
    // An evaluate call's chart comes before its result (worker.js).
    if (m.chart !== undefined) {
      // (One no longer wanted is not read.)
      if (w) { w.bands = m.bands; if (m.chart && w.onChart && !(w.stale && w.stale())) w.onChart(JSON.parse(m.chart)); }
      if (m.chart) chartsDrawn[m.byKey ? 'byKey' : 'byNumbers']++;
      return;
    }
    delete waiting[m.id];
    if (!w) return;
    inFlight--;
    clearTimeout(w.timer);
    // An answer its caller no longer wants is not read (a result can be
    // large: reading it holds up the page).
    var r = w.stale && w.stale() ? { stale: true } : JSON.parse(m.out);
    if (w.bands) r.bands = w.bands;
    w.resolve(r);
    pumpSoon();
  };
  worker.onerror = function (e) {
    if (e.preventDefault) e.preventDefault();
    engineStopped('The calculation engine failed: ' + (e.message || 'unknown error') + '.', 'failed');
  };
  var early = worker.bootError;
  if (early) setTimeout(function () { engineStopped('The calculation engine failed: ' + early + '.', 'failed'); }, 0);
}

// engineStopped answers every call still waiting with an error, ends the
// worker and starts a fresh one. how is 'failed' (the engine broke: the
// results are computed again, at most three times a minute; after that
// the page asks for a reload), 'timeout' (a call was not answered in
// time) or 'cancelled' (the person pressed Cancel): the inputs, the last
// valid results and the saved scenarios stay.
function engineStopped(msg, how) {
  var pending = waiting, later = held;
  waiting = {};
  held = [];
  inFlight = 0;
  var tail = how === 'cancelled' ? '' : ' The calculation was not finished.';
  Object.keys(pending).forEach(function (id) {
    clearTimeout(pending[id].timer);
    pending[id].resolve({ error: { message: msg + tail, fields: [], stopped: how } });
  });
  later.forEach(function (h) { h.resolve({ error: { message: msg + tail, fields: [], stopped: how } }); });
  try { worker.terminate(); } catch (e) { /* already gone */ }
  if (how === 'failed') {
    var now = Date.now();
    restarts = restarts.filter(function (t) { return now - t < 60000; });
    if (restarts.length >= 3) {
      engineError(msg + ' It stopped again; reload the page (your inputs and saved scenarios are kept).');
      return;
    }
    restarts.push(now);
  }
  startWorker();
  if (how === 'failed') {
    notice('\u26A0 ' + msg + ' It has been restarted; the results are computed again.');
    setTimeout(function () { if (typeof evaluate === 'function') evaluate(); }, 0);
  } else if (how === 'timeout') {
    notice('\u26A0 ' + msg + ' It has been stopped and restarted; your inputs are kept. Change an input to compute again.');
  } else {
    notice('\u2716 ' + msg);
  }
}

// call runs a core call; it resolves to {result} or {error}. A call not
// answered within its deadline ends the worker (see engineStopped).
// opt (optional): later, a key: the call can wait; it is sent only when
// the engine has nothing else to do, and a later call with the same key
// takes its place (the one replaced resolves to an error with
// superseded: true). chart and onChart (evaluate only): the rope-angle
// chart's "plot" input without its data; worker.js fills it from the
// result (the history's fields named in the series, the moves' bands) and
// draws it before it answers (unless its width_px is 0), and onChart gets
// that plot reply first; the result then carries the bands (bands).
// stale: a function, true when the answer arrives: it is not read, and
// the call resolves to {stale: true}.
export function call(name, input, opt) {
  return new Promise(function (resolve) {
    var m = { name: name, input: input === undefined ? '' : input, resolve: resolve, opt: opt || {} };
    if (!m.opt.later) { send(m); return; }
    held = held.filter(function (h) {
      if (h.opt.later !== m.opt.later) return true;
      h.resolve({ error: { message: 'superseded by a later ' + name + ' call', fields: [], superseded: true } });
      return false;
    });
    held.push(m);
    pumpSoon();
  });
}

function send(m) {
  var id = nextId++, ms = DEADLINES[m.name] || DEADLINES.other;
  inFlight++;
  waiting[id] = {
    resolve: m.resolve,
    onChart: m.opt.onChart,
    stale: m.opt.stale,
    timer: setTimeout(function () {
      if (waiting[id]) engineStopped('The calculation engine did not answer within ' + Math.round(ms / 1000) + ' s (' + m.name + ').', 'timeout');
    }, ms)
  };
  var msg = { id: id, name: m.name, input: m.input };
  if (m.opt.chart) msg.chart = m.opt.chart;
  worker.postMessage(msg);
}

// pumpSoon sends the first call that waits (opt.later) once the engine
// has answered everything sent and what the answers start has been sent
// (a task later).
function pumpSoon() {
  if (pumping || !held.length) return;
  pumping = true;
  setTimeout(function () {
    pumping = false;
    if (inFlight === 0 && held.length) send(held.shift());
  }, 0);
}

// unwanted tells the worker (once a call) that the answers of the calls
// waiting whose stale function says so are no longer wanted: it leaves
// out an evaluate call it has not begun, and the chart of one it has not
// drawn yet.
export function unwanted() {
  Object.keys(waiting).forEach(function (id) {
    var w = waiting[id];
    if (w.stale && !w.told && w.stale()) {
      w.told = true;
      worker.postMessage({ unwanted: Number(id) });
    }
  });
}

// cancel stops whatever the engine is doing (a fresh one is started).
export function cancel() {
  engineStopped('The calculation was cancelled; your inputs are kept and the results shown are for earlier inputs.', 'cancelled');
}

export function engineError(msg) {
  var b = $('engine-error');
  b.textContent = msg;
  b.hidden = false;
}

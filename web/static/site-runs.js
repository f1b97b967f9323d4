// site-runs.js: the clearance check's runs, split over several workers.
// Each worker runs the core (worker.js, as the engine's does) and answers
// "clearance_part" for a range of run indices; the engine's own worker
// joins the parts received ("clearance_join") into the core's report over
// those runs, so the envelope is refined as the parts arrive, and the
// report of every run is the single "clearance" call's, exactly (each run
// is drawn from the seed and its index alone: core/clearance parts.go).
// The page computes nothing here: it splits index ranges and waits.

import { DEADLINES, call } from './engine.js';

let pool = [], jobSeq = 0, nextCall = 1;

// poolSize is how many workers share the runs: min(4, the processors the
// browser reports), at least 1.
export function poolSize() {
  return Math.max(1, Math.min(4, navigator.hardwareConcurrency || 1));
}

function startPoolWorker() {
  var w = { worker: new Worker(window.swaysheetWorkerURL || 'worker.js'), waiting: null };
  w.worker.onmessage = function (e) {
    var m = e.data, p = w.waiting;
    if (m.id === 0 || !p || p.id !== m.id) {
      if (m.id === 0) stopPool('The calculation engine of the clearance runs stopped.', 'failed');
      return;
    }
    w.waiting = null;
    clearTimeout(p.timer);
    p.resolve(JSON.parse(m.out));
  };
  w.worker.onerror = function (e) {
    if (e.preventDefault) e.preventDefault();
    stopPool('The calculation engine of the clearance runs failed: ' + (e.message || 'unknown error') + '.', 'failed');
  };
  return w;
}

// stopPool ends every pool worker and answers the calls still waiting
// with an error ('failed', 'timeout' or 'cancelled'); the next runs start
// fresh workers.
function stopPool(msg, how) {
  var old = pool;
  pool = [];
  jobSeq++;
  old.forEach(function (w) {
    try { w.worker.terminate(); } catch (e) { /* gone */ }
    var p = w.waiting;
    w.waiting = null;
    if (p) { clearTimeout(p.timer); p.resolve({ error: { message: msg, fields: [], stopped: how } }); }
  });
}

// CLEARANCE is the split of the clearance check: the calls that run a
// range of runs and join the parts (another split, the spread of likely
// runs in spread-view.js, gives its own). hold: the engine's worker keeps
// the parts sent to it (wasm/bridge joinheld.go): each part's data is
// sent once, as it arrives (the hold call) or with a join, and a join
// names the parts sent before by their runs alone ({"from","to"}).
const CLEARANCE = {
  part: 'clearance_part', join: 'clearance_join', hold: 'clearance_hold',
  partInput: function (sent, from, to) { return '{"scenario":' + sent + ',"from":' + from + ',"to":' + to + '}'; },
  joinInput: function (sent, parts) { return '{"scenario":' + sent + ',"parts":[' + parts.join(',') + ']}'; }
};

// partCall asks pool worker w for runs [from, to) of the scenario, with
// the engine's deadline for the clearance calls.
function partCall(w, sent, from, to, kind) {
  return new Promise(function (resolve) {
    var id = nextCall++, ms = DEADLINES.clearance || DEADLINES.other;
    w.waiting = { id: id, resolve: resolve, timer: setTimeout(function () {
      stopPool('The clearance runs were not answered within ' + Math.round(ms / 1000) + ' s.', 'timeout');
    }, ms) };
    w.worker.postMessage({ id: id, name: kind.part, input: kind.partInput(sent, from, to) });
  });
}

// chunks splits runs 0..n-1 into ranges: a few per worker, so the
// envelope is refined several times, and none smaller than 5 runs.
export function chunks(n, workers) {
  var size = Math.max(5, Math.ceil(n / (workers * 3))), out = [];
  for (var i = 0; i < n; i += size) out.push([i, Math.min(n, i + size)]);
  return out;
}

// runSplit runs the check of the scenario JSON sent (n runs) on the
// pool. on(state) is told of progress: {done, total, report (the join of
// the parts so far, or null), final}. It resolves to {result} (the
// report of every run) or {error}; a later runSplit or cancelRuns ends it.
// Workers left idle by the check before are used again (a fresh worker
// compiles the wasm and starts Go: about half a second, a third of the
// 1,000-run check); busy ones are ended, as their runs cannot be stopped.
// kind, when given, is another split than the clearance check's (as
// CLEARANCE: its part and join calls and their inputs).
export function runSplit(sent, n, on, workers, kind) {
  kind = kind || CLEARANCE;
  if (runsGoing()) stopPool('Replaced by newer inputs.', 'cancelled');
  else jobSeq++;
  var job = jobSeq, want = workers || poolSize();
  while (pool.length < want) pool.push(startPoolWorker());
  var mine = pool.slice(0, want);
  var todo = chunks(n, want), parts = [], done = 0, joining = false, joinedCount = -1, failed = null;
  return new Promise(function (resolve) {
    function finish(r) {
      if (failed) return;
      failed = r;
      resolve(r);
    }
    // texts are the parts for a join or hold call: with kind.hold, the
    // parts sent before by their runs alone; the others' data, marked sent.
    function texts(list) {
      return list.map(function (p) {
        if (kind.hold && p.sent) return '{"from":' + p.from + ',"to":' + p.to + '}';
        p.sent = true;
        return p.text;
      });
    }
    // hold sends the engine's worker the parts not sent yet (kind.hold),
    // so that the joins after name them only; a part the engine did not
    // take is sent again with the next join.
    function hold() {
      var fresh = parts.filter(function (p) { return !p.sent; });
      if (!kind.hold || !fresh.length || job !== jobSeq || failed) return;
      call(kind.hold, kind.joinInput(sent, texts(fresh))).then(function (r) {
        if (r.error) fresh.forEach(function (p) { p.sent = false; });
      });
    }
    // join asks the engine's worker for the report of the parts so far:
    // one join at a time, a refinement only when a quarter of the runs
    // more are in, the last one over every part. It says whether it
    // asked. A join that names a part the engine no longer holds (it was
    // restarted) is answered "resend": it is asked again with every
    // part's data.
    var joinedRuns = 0;
    function join() {
      if (joining || job !== jobSeq || failed) return false;
      if (parts.length === joinedCount) return false;
      if (done < n && done - joinedRuns < n / 4) return false;
      joinedRuns = done;
      joining = true;
      var count = parts.length, all = done === n, list = parts.slice(), resent = false;
      function ask() {
        call(kind.join, kind.joinInput(sent, texts(list))).then(function (r) {
          if (r.error && r.error.resend && !resent && job === jobSeq) {
            resent = true;
            parts.forEach(function (p) { p.sent = false; });
            ask();
            return;
          }
          joining = false;
          joinedCount = count;
          if (job !== jobSeq) { finish({ error: { message: 'Replaced by newer inputs.', stopped: 'cancelled' } }); return; }
          if (r.error) { finish(r); return; }
          if (all) { on({ done: done, total: n, report: r.result, final: true }); finish(r); return; }
          on({ done: done, total: n, report: r.result, final: false });
          if (!join()) hold();
        });
      }
      ask();
      return true;
    }
    function feed(w) {
      if (job !== jobSeq || failed) return;
      var range = todo.shift();
      if (!range) return;
      partCall(w, sent, range[0], range[1], kind).then(function (r) {
        if (job !== jobSeq) { finish(r.error ? r : { error: { message: 'Replaced by newer inputs.', stopped: 'cancelled' } }); return; }
        if (r.error) { stopPool(r.error.message, 'failed'); finish(r); return; }
        parts.push({ from: range[0], to: range[1], text: JSON.stringify(r.result), sent: false });
        done += range[1] - range[0];
        on({ done: done, total: n, report: null, final: false });
        if (!join()) hold();
        feed(w);
      });
    }
    on({ done: 0, total: n, report: null, final: false });
    mine.forEach(feed);
  });
}

// warmPool starts the pool's workers ahead of runs asked for, so that
// their start (compiling the wasm and starting Go) overlaps the person's
// reading and typing rather than the runs.
export function warmPool() {
  while (pool.length < poolSize()) pool.push(startPoolWorker());
}

// cancelRuns stops the runs going (the pool's workers are ended).
export function cancelRuns(msg) {
  stopPool(msg || 'The clearance runs were cancelled.', 'cancelled');
}

// runsGoing is true while a split check has pool workers busy.
export function runsGoing() {
  return pool.some(function (w) { return !!w.waiting; });
}

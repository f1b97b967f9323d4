// spread-view.js: how the crew's figures spread over likely runs. When
// asked, the last result's scenario is run many times with the rope
// length, the depth of the load's centre, the press timing and the gust
// drawn about their values (the core's "draws" call, seeded: run i is the
// same wherever it is computed), split over the clearance runs' worker
// pool (site-runs.js); the engine's worker joins the parts ("draws_join")
// and presents the percentiles in the figures table's words, units and
// rounding. The page computes nothing here: it splits, waits and shows.

import { call } from './engine.js';
import { $, esc } from './dom.js';
import { cancelRuns, poolSize, runSplit, runsGoing } from './site-runs.js';
import { S } from './state.js';
import { parseNumber, toSI, toShown, unitOf, fmtField } from './units.js';
import { unitsKey } from './words.js';

// The spread asked for (SI, as the draws call takes it) and the runs.
// These are starting values for a first look, to be set to what is known
// of the lift; they are stated beside every answer.
const REQ = { runs: 1000, seed: 1, spread: { rope_length_m: 0.3, centre_depth_m: 0.1, press_s: 0.2, gust_pct: 20, gust_s: 1 } };

// The fields: request path, label, display quantity (converted with the
// core's factors) or fixed unit.
const FIELDS = [
  ['spread.rope_length_m', 'Rope length, give or take', 'length'],
  ['spread.centre_depth_m', 'Depth of the load\'s centre, give or take', 'length'],
  ['spread.press_s', 'Press timing, give or take', '', 's'],
  ['spread.gust_pct', 'Gust strength, give or take', '', '%'],
  ['spread.gust_s', 'Gust timing, give or take', '', 's'],
  ['runs', 'Runs', '', ''],
  ['seed', 'Seed (the same seed gives the same runs)', '', '']
];

// D: the runs going or last done, the scenario they are of (key), the
// parts joined, and the presented answer.
const D = { going: false, key: null, sent: null, req: null, parts: null, shown: null, done: 0, total: 0, error: null, bad: {}, units: null, job: 0 };

function keyOf(sent) {
  var sc = JSON.parse(sent);
  delete sc.sheet;
  return JSON.stringify(sc);
}

function get(path) { var p = path.split('.'); return p.length > 1 ? REQ[p[0]][p[1]] : REQ[p[0]]; }
function put(path, v) { var p = path.split('.'); if (p.length > 1) REQ[p[0]][p[1]] = v; else REQ[p[0]] = v; }

function renderForm() {
  $('spread-form').innerHTML = FIELDS.map(function (f) {
    var id = 'spread-' + f[0].replace('.', '-'), sym = f[2] ? unitOf(f[2]).symbol : f[3];
    var v = D.bad[f[0]] !== undefined ? D.bad[f[0]].text : fmtField(f[2] ? toShown(f[2], get(f[0])) : get(f[0]), f[2]);
    return '<div class="field" data-field="draws.' + esc(f[0]) + '"><label for="' + id + '">' + esc(f[1]) + '</label>' +
      (sym ? '<div class="with-unit">' : '') + '<input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-spread="' + esc(f[0]) + '" value="' + esc(v) + '" aria-describedby="' + id + '-msg">' +
      (sym ? '<span class="unit">' + esc(sym) + '</span></div>' : '') + '<p class="msg" id="' + id + '-msg" role="alert">' + esc(D.bad[f[0]] ? D.bad[f[0]].msg : '') + '</p></div>';
  }).join('');
  D.units = unitsKey();
}

// read takes a typed value; a text that is not a number is kept and
// marked (the core checks the ranges and names the field).
function read(el) {
  var path = el.dataset.spread, f = FIELDS.filter(function (x) { return x[0] === path; })[0];
  var v = parseNumber(el.value);
  if (isNaN(v)) {
    D.bad[path] = { text: el.value, msg: 'Not a number: type a number such as 0.2.' };
  } else {
    delete D.bad[path];
    put(path, f[2] ? toSI(f[2], v) : v);
  }
  el.closest('.field').querySelector('.msg').textContent = D.bad[path] ? D.bad[path].msg : '';
}

// kindOf is the split of request req for the worker pool (site-runs.js
// runSplit): runs [from, to) by the draws call, joined by draws_join.
function kindOf(req) {
  return {
    part: 'draws', join: 'draws_join',
    partInput: function (sent, from, to) { return '{"scenario":' + sent + ',"draws":' + JSON.stringify(Object.assign({}, req, { first: from, count: to - from })) + '}'; },
    joinInput: function (sent, parts) { return joinInput(sent, req, parts); }
  };
}

function joinInput(sent, req, parts) {
  return '{"scenario":' + sent + ',"draws":' + JSON.stringify(req) + ',"parts":[' + parts.join(',') + '],"units":' + JSON.stringify(S.chosen) + ',"system":' + JSON.stringify(S.sys === 'us' ? 'us' : 'si') + '}';
}

// start runs the draws of the last result's scenario on the worker pool;
// it waits while the clearance runs have the pool.
function start() {
  if (!S.resultSent || Object.keys(D.bad).length) { render(); return; }
  if (runsGoing() && !D.going) {
    D.error = null;
    $('spread-progress-text').textContent = 'Waiting for the clearance runs to finish\u2026';
    $('spread-progress').hidden = false;
    clearTimeout(start.t);
    start.t = setTimeout(start, 250);
    return;
  }
  var sent = S.resultSent, job = ++D.job;
  D.sent = sent; D.key = keyOf(sent); D.req = JSON.parse(JSON.stringify(REQ));
  D.going = true; D.error = null; D.done = 0; D.total = REQ.runs; D.parts = null;
  render();
  runSplit(sent, REQ.runs, function (st) {
    if (job !== D.job) return;
    D.done = st.done;
    if (st.report) D.shown = st.report.shown;
    showProgress();
    if (st.report && !st.final) render();
  }, 0, kindOf(D.req)).then(function (r) {
    if (job !== D.job) return;
    D.going = false;
    if (r.error) {
      D.error = r.error.stopped === 'cancelled' ? 'The runs were stopped; the spread shown, if any, is for earlier inputs or fewer runs.' :
        /unknown call/.test(r.error.message) ? 'The spread of likely runs is not in this single-file copy of swaysheet: use the hosted page.' : r.error.message;
      markFields(r.error.fields || []);
    } else {
      D.shown = r.result.shown;
      D.parts = [JSON.stringify(r.result)];
    }
    render();
  });
}

// markFields shows the core's messages on the spread's fields (draws.*).
function markFields(fields) {
  fields.forEach(function (f) {
    var el = document.querySelector('#spread-form [data-field="' + f.field + '"] .msg');
    if (el) el.textContent = f.message;
  });
}

function showProgress() {
  $('spread-progress').hidden = !D.going;
  $('spread-progress-text').textContent = 'Runs done ' + D.done.toLocaleString('en-US') + ' of ' + D.total.toLocaleString('en-US');
  $('spread-bar').style.width = (D.total ? Math.round(100 * D.done / D.total) : 0) + '%';
}

function stale() { return !!D.shown && D.key !== (S.resultSent && keyOf(S.resultSent)); }

function render() {
  showProgress();
  var out = $('spread-out'), sh = D.shown;
  out.dataset.state = D.going ? 'going' : D.error ? 'error' : sh ? (stale() ? 'stale' : 'done') : 'none';
  if (!sh) {
    out.innerHTML = D.error ? '<p class="spread-msg" role="alert">' + esc(D.error) + '</p>' : '';
    return;
  }
  var head = '<tr><th scope="col">Figure</th><th scope="col">in half the runs up to</th><th scope="col">in 9 of 10 runs up to</th><th scope="col">in 95 of 100 runs up to</th><th scope="col">largest of all runs</th></tr>';
  var cell = function (row, p) { return '<td class="' + p + '" data-value-si="' + row[p].value_si + '">' + esc(row[p].text + (row.unit ? ' ' + row.unit : '')) + '</td>'; };
  out.dataset.runs = String(sh.runs);
  out.dataset.seed = String(sh.seed);
  out.innerHTML = (D.error ? '<p class="spread-msg" role="alert">' + esc(D.error) + '</p>' : '') +
    (stale() ? '<p class="stale" role="status">\u26A0 The inputs have changed since: this spread is for earlier inputs. Work it out again.</p>' : '') +
    (sh.limits ? '<p class="spread-verdict ' + (sh.over ? 'out' : 'ok') + '">' + esc(sh.limits) + '</p>' : '') +
    '<ul class="spread-words">' + sh.rows.map(function (row) {
      return '<li data-key="' + esc(row.key) + '">' + esc(row.words) + (row.limit_words ? ' <span class="' + (row.over ? 'out' : 'ok') + '">' + esc(row.limit_words) + '</span>' : '') + '</li>';
    }).join('') + '</ul>' +
    '<div class="table-wrap"><table class="spread-table"><caption>How the figures spread over ' + sh.runs.toLocaleString('en-US') + ' likely runs</caption><thead>' + head + '</thead><tbody>' +
    sh.rows.map(function (row) {
      return '<tr data-key="' + esc(row.key) + '"><th scope="row">' + esc(row.crew) + '</th>' + cell(row, 'p50') + cell(row, 'p90') + cell(row, 'p95') + cell(row, 'max') + '</tr>';
    }).join('') + '</tbody></table></div>' +
    '<p class="small spread-used">' + esc(sh.spreads) + '</p>';
}

// present asks the core again for the last answer in the units now shown
// (the join of the runs kept: nothing is run again).
function present() {
  if (!D.parts || D.going) return;
  var job = D.job;
  call('draws_join', joinInput(D.sent, D.req, D.parts)).then(function (r) {
    if (job !== D.job || r.error) return;
    D.shown = r.result.shown;
    render();
  });
}

$('spread-form').addEventListener('change', function (e) { if (e.target.dataset.spread) read(e.target); });
$('spread-run').onclick = function () {
  document.querySelectorAll('#spread-form [data-spread]').forEach(read);
  start();
};
$('spread-cancel').onclick = function () { if (D.going) cancelRuns('The runs were cancelled.'); };

// A new result ends runs of earlier inputs and marks what they showed;
// new units show the same answer in them.
document.addEventListener('swaysheet:result', function () {
  if (D.units !== unitsKey()) { renderForm(); present(); }
  if (D.going && D.key !== keyOf(S.resultSent)) cancelRuns('Replaced by newer inputs.');
  render();
});

// For the browser tests and the page bench: the answer shown, the state,
// the request, and the split on its own.
window.swaysheetSpread = {
  shown: function () { return D.shown; },
  state: function () { return { going: D.going, done: D.done, total: D.total, error: D.error, stale: stale() }; },
  request: function () { return JSON.parse(JSON.stringify(REQ)); },
  split: function (sent, req, workers, on) { return runSplit(sent, req.runs, on || function () {}, workers, kindOf(req)); },
  poolSize: poolSize
};

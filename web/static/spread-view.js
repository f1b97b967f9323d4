// spread-view.js: how the crew's figures spread over likely runs. When
// asked, the last result's scenario is run many times with the rope
// length, the depth of the load's centre, the press timing and the gust
// drawn about their values (the core's "draws" call, seeded: run i is the
// same wherever it is computed), split over the clearance runs' worker
// pool (site-runs.js); the engine's worker joins the parts ("draws_join")
// and presents the percentiles in the figures table's words, units and
// rounding. The page computes nothing here: it splits, waits and shows.
// A module of its own (index.html, after main.js), left out of the single
// file with its section (web/dist servedOnly): that copy's core has no
// draws calls.

import { call } from './engine.js';
import { $, esc } from './dom.js';
import { cancelRuns, poolSize, runSplit, runsGoing, warmPool } from './site-runs.js';
import { S } from './state.js';
import { parseNumber, toSI, toShown, unitOf, fmtField } from './units.js';
import { unitsKey } from './words.js';

// The spread asked for (SI, as the draws call takes it) and the runs.
// These are starting values for a first look, to be set to what is known
// of the lift; they are stated beside every answer.
const SPREAD_REQ = { runs: 1000, seed: 1, spread: { rope_length_m: 0.3, centre_depth_m: 0.1, press_s: 0.2, gust_pct: 20, gust_s: 1 } };

// The fields: request path, label, display quantity (converted with the
// core's factors) or fixed unit.
const SPREAD_FIELDS = [
  ['spread.rope_length_m', 'Rope length, give or take', 'length'],
  ['spread.centre_depth_m', 'Depth of the load\'s centre, give or take', 'length'],
  ['spread.press_s', 'Press timing, give or take', '', 's'],
  ['spread.gust_pct', 'Gust strength, give or take', '', '%'],
  ['spread.gust_s', 'Gust timing, give or take', '', 's'],
  ['runs', 'Runs', '', ''],
  ['seed', 'Seed (the same seed gives the same runs)', '', '']
];

// SP: the runs going or last done, the scenario they are of (key), the
// last answer's scenario, request and parts joined (last: kept when later
// runs fail, to show it in new units), and the presented answer; fieldError
// marks an error that is the core's messages at the fields.
const SP = { going: false, key: null, sent: null, req: null, last: null, shown: null, done: 0, total: 0, error: null, fieldError: false, bad: {}, units: null, job: 0 };

function spreadKey(sent) {
  var sc = JSON.parse(sent);
  delete sc.sheet;
  return JSON.stringify(sc);
}

function getSpread(path) { var p = path.split('.'); return p.length > 1 ? SPREAD_REQ[p[0]][p[1]] : SPREAD_REQ[p[0]]; }
function putSpread(path, v) { var p = path.split('.'); if (p.length > 1) SPREAD_REQ[p[0]][p[1]] = v; else SPREAD_REQ[p[0]] = v; }

function spreadForm() {
  $('spread-form').innerHTML = SPREAD_FIELDS.map(function (f) {
    var id = 'spread-' + f[0].replace('.', '-'), sym = f[2] ? unitOf(f[2]).symbol : f[3];
    var v = SP.bad[f[0]] !== undefined ? SP.bad[f[0]].text : fmtField(f[2] ? toShown(f[2], getSpread(f[0])) : getSpread(f[0]), f[2]);
    return '<div class="field" data-field="draws.' + esc(f[0]) + '"><label for="' + id + '">' + esc(f[1]) + '</label>' +
      (sym ? '<div class="with-unit">' : '') + '<input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-spread="' + esc(f[0]) + '" value="' + esc(v) + '" aria-describedby="' + id + '-msg">' +
      (sym ? '<span class="unit">' + esc(sym) + '</span></div>' : '') + '<p class="msg" id="' + id + '-msg" role="alert">' + esc(SP.bad[f[0]] ? SP.bad[f[0]].msg : '') + '</p></div>';
  }).join('');
  SP.units = unitsKey();
}

// readSpread takes a typed value; a text that is not a number is kept and
// marked (the core checks the ranges and names the field).
function readSpread(el) {
  var path = el.dataset.spread, f = SPREAD_FIELDS.filter(function (x) { return x[0] === path; })[0];
  var v = parseNumber(el.value);
  if (isNaN(v)) {
    SP.bad[path] = { text: el.value, msg: 'Not a number: type a number such as 0.2.' };
  } else {
    delete SP.bad[path];
    putSpread(path, f[2] ? toSI(f[2], v) : v);
  }
  el.closest('.field').querySelector('.msg').textContent = SP.bad[path] ? SP.bad[path].msg : '';
}

// spreadKind is the split of request req for the worker pool (site-runs.js
// runSplit): runs [from, to) by the draws call, joined by draws_join. Both
// are given the units shown: the core says a spread out of range in them.
function spreadKind(req) {
  return {
    part: 'draws', join: 'draws_join',
    partInput: function (sent, from, to) { return '{"scenario":' + sent + ',"draws":' + JSON.stringify(Object.assign({}, req, { first: from, count: to - from })) + unitsShown() + '}'; },
    joinInput: function (sent, parts) { return spreadJoinInput(sent, req, parts); }
  };
}

function spreadJoinInput(sent, req, parts) {
  return '{"scenario":' + sent + ',"draws":' + JSON.stringify(req) + ',"parts":[' + parts.join(',') + ']' + unitsShown() + '}';
}

function unitsShown() { return ',"units":' + JSON.stringify(S.chosen) + ',"system":' + JSON.stringify(S.sys === 'us' ? 'us' : 'si'); }

// startSpread runs the draws of the last result's scenario on the worker pool;
// it waits while the clearance runs have the pool.
function startSpread() {
  if (!S.resultSent || Object.keys(SP.bad).length) { renderSpread(); return; }
  if (runsGoing() && !SP.going) {
    SP.error = null;
    $('spread-progress-text').textContent = 'Waiting for the clearance runs to finish\u2026';
    $('spread-progress').hidden = false;
    clearTimeout(startSpread.t);
    startSpread.t = setTimeout(startSpread, 250);
    return;
  }
  var sent = S.resultSent, job = ++SP.job;
  SP.sent = sent; SP.key = spreadKey(sent); SP.req = JSON.parse(JSON.stringify(SPREAD_REQ));
  SP.going = true; SP.error = null; SP.done = 0; SP.total = SPREAD_REQ.runs;
  renderSpread();
  runSplit(sent, SPREAD_REQ.runs, function (st) {
    if (job !== SP.job) return;
    SP.done = st.done;
    if (st.report) SP.shown = st.report.shown;
    spreadProgress();
    if (st.report && !st.final) renderSpread();
  }, 0, spreadKind(SP.req)).then(function (r) {
    if (job !== SP.job) return;
    SP.going = false;
    if (r.error) {
      SP.error = r.error.stopped === 'cancelled' ? 'The runs were stopped; the spread shown, if any, is for earlier inputs or fewer runs.' : r.error.message;
      SP.fieldError = !!(r.error.fields && r.error.fields.length);
      markSpreadFields(r.error.fields || []);
    } else {
      SP.shown = r.result.shown;
      SP.last = { sent: SP.sent, req: SP.req, parts: [JSON.stringify(r.result)] };
    }
    renderSpread();
  });
}

// markSpreadFields shows the core's messages on the spread's fields (draws.*).
function markSpreadFields(fields) {
  fields.forEach(function (f) {
    var el = document.querySelector('#spread-form [data-field="' + f.field + '"] .msg');
    if (el) el.textContent = f.message;
  });
}

function spreadProgress() {
  $('spread-progress').hidden = !SP.going;
  $('spread-progress-text').textContent = 'Runs done ' + SP.done.toLocaleString('en-US') + ' of ' + SP.total.toLocaleString('en-US');
  $('spread-bar').style.width = (SP.total ? Math.round(100 * SP.done / SP.total) : 0) + '%';
}

function spreadStale() { return !!SP.shown && SP.key !== (S.resultSent && spreadKey(S.resultSent)); }

function renderSpread() {
  spreadProgress();
  var out = $('spread-out'), sh = SP.shown;
  out.dataset.state = SP.going ? 'going' : SP.error ? 'error' : sh ? (spreadStale() ? 'stale' : 'done') : 'none';
  if (!sh) {
    out.innerHTML = SP.error ? '<p class="spread-msg" role="alert">' + esc(SP.error) + '</p>' : '';
    return;
  }
  var head = '<tr><th scope="col">Figure</th><th scope="col">in half the runs up to</th><th scope="col">in 9 of 10 runs up to</th><th scope="col">in 95 of 100 runs up to</th><th scope="col">largest of all runs</th></tr>';
  var cell = function (row, p) { return '<td class="' + p + '" data-value-si="' + row[p].value_si + '">' + esc(row[p].text + (row.unit ? ' ' + row.unit : '')) + '</td>'; };
  out.dataset.runs = String(sh.runs);
  out.dataset.seed = String(sh.seed);
  out.innerHTML = (SP.error ? '<p class="spread-msg" role="alert">' + esc(SP.error) + '</p>' : '') +
    (spreadStale() ? '<p class="stale" role="status">\u26A0 The inputs have changed since: this spread is for earlier inputs. Work it out again.</p>' : '') +
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

// presentSpread asks the core again for the last answer in the units now shown
// (the join of the runs kept: nothing is run again).
function presentSpread() {
  if (!SP.last || SP.going) return;
  var job = SP.job;
  call('draws_join', spreadJoinInput(SP.last.sent, SP.last.req, SP.last.parts)).then(function (r) {
    if (job !== SP.job || r.error) return;
    SP.shown = r.result.shown;
    renderSpread();
  });
}

// The workers start when the person comes to the section (not with the
// page: they would compete with the first result).
$('spread').addEventListener('focusin', warmPool);
$('spread').addEventListener('pointerenter', warmPool);

$('spread-form').addEventListener('change', function (e) { if (e.target.dataset.spread) readSpread(e.target); });
$('spread-run').onclick = function () {
  document.querySelectorAll('#spread-form [data-spread]').forEach(readSpread);
  startSpread();
};
$('spread-cancel').onclick = function () { if (SP.going) cancelRuns('The runs were cancelled.'); };

// A new result ends runs of earlier inputs and marks what they showed;
// new units show the same answer in them.
// (In a task of its own: nothing here delays the result shown.)
document.addEventListener('swaysheet:result', function () { setTimeout(afterResult, 0); });
function afterResult() {
  if (!S.resultSent) return;
  // New units: the fields and the answer in them; the core's messages at
  // the fields, in the old units, go with the fields.
  if (SP.units !== unitsKey()) { spreadForm(); presentSpread(); if (SP.fieldError) SP.error = null; }
  if (SP.key !== spreadKey(S.resultSent)) {
    if (SP.going) cancelRuns('Replaced by newer inputs.');
    else SP.error = null;
  }
  renderSpread();
}

// A result shown before this module ran is taken up now.
if (S.resultSent) afterResult();

// For the browser tests and the page bench: the answer shown, the state,
// the request, and the split on its own.
window.swaysheetSpread = {
  shown: function () { return SP.shown; },
  state: function () { return { going: SP.going, done: SP.done, total: SP.total, error: SP.error, stale: spreadStale() }; },
  request: function () { return JSON.parse(JSON.stringify(SPREAD_REQ)); },
  split: function (sent, req, workers, on) { return runSplit(sent, req.runs, on || function () {}, workers, spreadKind(req)); },
  poolSize: poolSize
};

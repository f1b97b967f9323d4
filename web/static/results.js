// results.js: the verdict and figures (the core's "figures" call: every
// row of core/figures, its words, rounded text and unit as the core gives
// them), warnings, assumptions and plots.

import { chartInput, drawChart, showChart } from './charts.js';
import { $, esc } from './dom.js';
import { call } from './engine.js';
import { renderForm } from './form.js';
import { renderPlan } from './plan-view.js';
import { clearanceVerdict } from './site-view.js';
import { S } from './state.js';
import { SHOWN_QUANTITIES, defaultsFor, fmtStep, toShown, unitOf } from './units.js';
import { say, unitsKey } from './words.js';

let figuresAsked = 0, figuresWaiting = false, figuresHeld = false;

// figuresInput is the "figures" call's input: the scenario of the result
// shown (its JSON as sent to the core) and the units shown.
function figuresInput(sent) {
  return '{"scenario":' + sent + ',"units":' + JSON.stringify(S.chosen) + ',"system":' + JSON.stringify(S.sys === 'us' ? 'us' : 'si') + '}';
}

// presentFigures asks the core for the figures of the last result
// (S.resultSent) in the units shown, then shows them with the warnings
// and plots. The bridge keeps the last results by scenario fingerprint,
// so this computes nothing again. An answer overtaken by a later request
// (the units changed meanwhile) is dropped. The figures may be of another
// scenario than the inputs (a planned request without moves: the
// recommended move, result_scenario); the warnings and plots are then of
// that one too, so page, plots and sheet show the same move.
export function presentFigures() {
  if (!S.result || !S.resultSent) return Promise.resolve();
  var n = ++figuresAsked, own = S.result, ownSent = S.resultSent;
  figuresWaiting = true;
  figuresHeld = false;
  // The figures are of this result itself unless the inputs are a
  // planning request without moves of their own (then of the planner's
  // recommended move): its charts are drawn now, beside the figures call,
  // not after it. The result's own warnings are put into words at the
  // same time (not after the figures). The rope-angle chart, when the
  // worker has not drawn it with the result (compute.js), is asked for
  // after the figures and words, the other three once the engine has
  // nothing else to do.
  var sent = JSON.parse(S.resultSent), rest = [];
  var asked = call('figures', figuresInput(S.resultSent));
  var ownWords = say(own.warning_sentences || []);
  if (!(sent.plan && !(sent.motions || []).length)) drawPlots(own, '', false, rest);
  rest.forEach(function (draw) { draw(); });
  return asked.then(function (f) {
    if (n !== figuresAsked) return null;
    if (f.error) return { figures: { error: f.error.message }, result: own, fingerprint: '' };
    var rep = f.result;
    // (Its rope-angle chart is drawn with it for the moves' bands.)
    var got = rep.result_scenario ? call('evaluate', JSON.stringify(rep.result_scenario), { chart: angleChart(rep.result_for || '', true).opt }) :
      Promise.resolve({ result: own });
    return got.then(function (e) {
      if (e.error) return { figures: { error: 'the figures\u2019 own move could not be evaluated: ' + e.error.message }, result: own, fingerprint: '' };
      keepBands(e.result, e.bands);
      return { figures: rep, result: e.result, fingerprint: rep.result_fingerprint };
    });
  }).then(function (p) {
    if (!p || n !== figuresAsked) return null;
    return (p.result === own ? ownWords : say(p.result.warning_sentences || [])).then(function (texts) {
      if (n !== figuresAsked) return;
      figuresWaiting = false;
      // Typed on meanwhile: the core works on later inputs, whose figures
      // follow at once; these are not put into the page in between (it
      // would hold up the later inputs' chart). Should the later inputs
      // fail, these are shown then (presentHeld).
      if (S.evaluating && S.evaluating !== ownSent) { figuresHeld = true; return; }
      S.figures = p.figures;
      S.shown = { result: p.result, fingerprint: p.fingerprint, warnings: texts };
      renderResults();
    });
  });
}

// presentHeld presents the figures of the last result when they were
// held back for later inputs that then were not evaluated.
export function presentHeld() { if (figuresHeld) presentFigures(); }

// presenting is true while the figures of the last result are asked for.
export function presenting() { return figuresWaiting; }

// figuresCount counts the figures asked for so far (a later count: they
// were asked again since).
export function figuresCount() { return figuresAsked; }

// The verdict band's words and symbol by the core's verdict state; the
// sentence after them is the core's own.
const VERDICT_WORDS = {
  within: ['ok', '\u2714', 'Within the limits'],
  outside: ['out', '\u2716', 'OUTSIDE the limits'],
  no_limits: ['none', '\u2013', 'No limits set'],
  not_simulated: ['none', '\u2013', 'Nothing simulated'],
  not_computed: ['none', '\u2013', 'Not computed']
};

function verdictBand(v) {
  var w = VERDICT_WORDS[v.state] || ['none', '\u2013', v.state];
  return '<div id="verdict" class="verdict-band ' + w[0] + '" data-state="' + esc(v.state) + '">' +
    '<p class="verdict-head"><span class="sym" aria-hidden="true">' + w[1] + '</span> ' + esc(w[2]) + '</p>' +
    '<p class="verdict-text">' + esc(v.text) + '</p></div>';
}

// figureCheck is a row's line about its limit: the core's words, or why
// there are none.
function figureCheck(row, state) {
  if (row.check) {
    return row.check.within ?
      '<p class="check ok"><span aria-hidden="true">\u2714</span> ' + esc(row.check.words) + '</p>' :
      '<p class="check out"><span aria-hidden="true">\u2716</span> ' + esc(row.check.words) + '</p>';
  }
  if (!row.limit_key) return '';
  return '<p class="check none"><span aria-hidden="true">\u2013</span> ' + (state === 'not_simulated' ? 'nothing simulated' : 'no limit set') + '</p>';
}

function figureRow(row, state) {
  var cls = 'fig' + (row.limit_key ? ' limited' : '') + (row.check && !row.check.within ? ' is-out' : '');
  return '<li class="' + cls + '" data-key="' + esc(row.key) + '"><span class="crew">' + esc(row.crew) + '</span>' +
    '<span class="val"><span class="num">' + esc(row.text) + '</span>' + (row.unit ? ' <span class="u">' + esc(row.unit) + '</span>' : '') + '</span>' +
    figureCheck(row, state) + '</li>';
}

// engineeringDetail: each figure's technical name and its path in the
// evaluate call's result, folded away.
function engineeringDetail(rows, open) {
  return '<details class="engineering" id="engineering"' + (open ? ' open' : '') + '><summary>Engineering detail</summary>' +
    '<div class="table-wrap" tabindex="0" role="region" aria-label="Engineering detail"><table class="plain"><thead><tr><th scope="col">technical name</th><th scope="col">value</th><th scope="col">in the result</th></tr></thead><tbody>' +
    rows.map(function (row) {
      return '<tr data-key="' + esc(row.key) + '"><th scope="row">' + esc(row.technical) + '</th><td class="n">' + esc(row.text) + (row.unit ? ' ' + esc(row.unit) : '') +
        '</td><td><code>' + esc(row.key) + '</code></td></tr>';
    }).join('') + '</tbody></table></div></details>';
}

// shownResult is the result the figures, warnings and plots are of.
function shownResult() { return S.shown && S.shown.result ? S.shown.result : S.result; }

export function renderResults() {
  var r = shownResult(), f = S.figures;
  if (!r || !f) return;
  var hd = $('headline');
  if (f.error) {
    hd.innerHTML = '<p class="waiting">\u2716 The figures could not be shown: ' + esc(f.error) + '</p>';
  } else {
    var det = $('engineering');
    hd.innerHTML = verdictBand(f.verdict) +
      (f.result_for ? '<p class="result-for" id="result-for">' + esc(f.result_for) + '</p>' : '') +
      '<ul class="figs" id="figures">' + f.rows.map(function (row) { return figureRow(row, f.verdict.state); }).join('') + '</ul>' +
      engineeringDetail(f.rows, det && det.open);
    clearanceVerdict();
  }
  hd.dataset.count = String(S.count);
  // The core's warnings in the units shown (the "say" call); should that
  // fail, its SI text, said to be SI.
  var w = S.shown && S.shown.warnings, si = !w;
  if (!w) w = r.warnings || [];
  $('warnings').innerHTML = w.length ?
    '<h3>Warnings</h3><ul>' + w.map(function (t) { return '<li><span aria-hidden="true">\u26A0</span> ' + esc(t) + '</li>'; }).join('') + '</ul>' +
      (si ? '<p class="small">(in SI units: they could not be put into the units shown)</p>' : '') :
    '<p class="no-warn"><span aria-hidden="true">\u2714</span> No warnings for these inputs.</p>';
  $('assumptions').innerHTML = (r.assumptions || []).map(function (t) { return '<li>' + esc(t) + '</li>'; }).join('');
  // The check sheet (sheet.js) follows each result.
  document.dispatchEvent(new CustomEvent('swaysheet:result'));
  renderPlots();
}

function scale(dq, arr) {
  var f = unitOf(dq).to_si;
  return arr.map(function (v) { return v / f; });
}

// markStale says the results and plots shown are for earlier inputs (the
// inputs now have a problem, or their computation was stopped): greyed,
// the verdict band marked.
export function markStale(on) {
  $('stale').hidden = !on;
  $('results').classList.toggle('is-stale', on);
  $('charts').classList.toggle('is-stale', on);
}

// renderPlots draws the shown result's charts with the core's plotter
// (charts.js), the values in the units shown; again (redraw) even when
// they are drawn already (the width changed).
export function renderPlots(redraw) {
  // Which scenario the plots are of: the figures' (result_fingerprint).
  $('charts').dataset.fingerprint = (S.shown && S.shown.fingerprint) || '';
  drawPlots(shownResult(), S.figures && S.figures.result_for ? S.figures.result_for : '', redraw === true);
}

// plotted says what the charts shown were drawn of: the result, whose
// move they are said to be of, the units and the limits. early: the
// rope-angle chart drawn by the worker with the evaluate call (sent: the
// scenario JSON it is of; key as plotted's).
let plotted = { result: null, key: '' }, early = { sent: null, key: '' };
// bandsOf keeps the moves' bands of each result as the worker drew them
// with its rope-angle chart (engine.js call's chart, worker.js).
const bandsOf = new WeakMap();
export function keepBands(result, bands) { if (result && bands) bandsOf.set(result, bands); }

function plotKey(of) { return of + '|' + unitsKey() + '|' + JSON.stringify(S.scenario.limits || {}); }

// angleChart is the rope-angle chart of a result (of: the words for
// whose move it is, '' for the inputs' own): its "plot" input and its
// caption. The series name the history's fields and there are no bands:
// the worker fills them in (engine.js call's chart), or drawPlots does.
// known: at a width measured before, or none (width_px 0: the worker
// then gives the bands only).
export function angleChart(of, known) {
  var lim = S.scenario.limits || {}, hl = [], fig = $('plot-angle');
  if (typeof lim.peak_swing_deg === 'number') hl.push({ y: lim.peak_swing_deg, text: 'limit ' + fmtStep('angle', lim.peak_swing_deg) + ' deg' });
  // Plots of another move than the inputs' (the planner's recommended
  // one) say so (of), as the figures above do.
  return {
    fig: fig, key: plotKey(of),
    opt: chartInput(fig, { id: 'angle', title: 'Rope angle from the vertical', x_label: 'time (s)', y_label: 'rope angle (deg)',
      series: [{ x: 'time_s', y: 'swing_deg', name: 'rope angle', class: 's1' }], lines: hl, y_from_zero: true }, known),
    caption: esc(of ? 'Of ' + of + '. ' : '') + 'Hatched bands: A = a move speeding up, B = braking, numbered by move.'
  };
}

// showEarly puts the rope-angle chart a (angleChart('')) the worker drew
// with the evaluate call of sent into the page, ahead of the result.
export function showEarly(sent, a, reply) {
  early = { sent: sent, key: a.key };
  showChart(a.fig, a.opt, a.caption, reply);
}

// unshown: the inputs' result was not presented (an error, or
// overtaken): a rope-angle chart the worker drew of them is replaced by
// the charts of the result shown.
export function unshown() {
  if (!early.sent || early.sent === S.resultSent) return;
  early = { sent: null, key: '' };
  if (S.result) renderPlots(true);
}

// drawPlots draws the charts of result r (of: the words for whose move it
// is, '' for the inputs' own), unless they are drawn of the same already.
// With later (a list), the rope-angle chart is asked for now (unless the
// worker drew it with the evaluate call: showEarly) and the others are
// put in the list as functions to call: they wait until the engine has
// nothing else to do (charts.js drawChart's later).
function drawPlots(r, of, redraw, later) {
  var hs = r && r.history;
  if (!hs || !hs.time_s || !hs.time_s.length) return;
  var key = plotKey(of), drawn = !redraw && later && early.sent === S.resultSent && early.key === key;
  if (!redraw && plotted.result === r && plotted.key === key) return;
  plotted = { result: r, key: key };
  early = { sent: null, key: '' };
  var bands = bandsOf.get(r) || [];
  if (!drawn) {
    var a = angleChart(of);
    a.opt.series[0].x = hs.time_s;
    a.opt.series[0].y = hs.swing_deg;
    a.opt.bands = bands;
    drawChart(a.fig, a.opt, a.caption);
  }
  var draw = function (fig, opt, caption) {
    if (later) later.push(function () { drawChart(fig, opt, caption, true); });
    else drawChart(fig, opt, caption);
  };
  var L = unitOf('length').symbol, F = unitOf('force').symbol, lim = S.scenario.limits || {};
  draw($('plot-path'), { id: 'path', title: 'Seen from above: load and trolley paths', x_label: 'x (' + L + ')', y_label: 'y (' + L + ')', equal: true, legend_top: true,
    series: [{ x: scale('length', hs.suspension_x_m), y: scale('length', hs.suspension_y_m), name: 'suspension point', class: 's2' },
      { x: scale('length', hs.load_x_m), y: scale('length', hs.load_y_m), name: 'load', class: 's1' }] },
  'The load (solid) and the suspension point (dashed) on the ground plan.');
  var circles = [];
  if (typeof lim.peak_excursion_m === 'number') circles.push({ r: toShown('length', lim.peak_excursion_m) });
  draw($('plot-rel'), { id: 'rel', title: 'Seen from above: load around the suspension point', x_label: 'x (' + L + ')', y_label: 'y (' + L + ')', equal: true,
    series: [{ x: scale('length', hs.rel_x_m), y: scale('length', hs.rel_y_m), name: 'load', class: 's1' }], circles: circles },
  circles.length ? 'Dashed circle: the allowed excursion.' : 'No excursion limit set.');
  var st = toShown('force', r.static_tension_n);
  draw($('plot-tension'), { id: 'tension', title: 'Rope tension', x_label: 'time (s)', y_label: 'tension (' + F + ')',
    series: [{ x: hs.time_s, y: scale('force', hs.tension_n), name: 'tension', class: 's1' }], bands: bands,
    lines: [{ y: st, text: 'static ' + fmtStep('force', st) + ' ' + F }] },
  'Dashed line: the load\u2019s weight (static pull).');
}

// updateBanner shows the example banner while the inputs are an
// example's (changed at each keystroke: written only when it changes).
export function updateBanner() {
  var b = $('example-banner'), hide = !(S.scenario && S.scenario.example);
  if (b.hidden !== hide) b.hidden = hide;
}

export function renderAll() {
  renderForm();
  updateBanner();
  renderSys();
  if (S.result) presentFigures();
  renderPlan();
}

export function renderSys() {
  var d = defaultsFor('us'), allUS = true, allSI = true, ds = defaultsFor('si');
  SHOWN_QUANTITIES.forEach(function (k) { if (S.chosen[k] !== d[k]) allUS = false; if (S.chosen[k] !== ds[k]) allSI = false; });
  $('sys-si').setAttribute('aria-pressed', String(allSI));
  $('sys-us').setAttribute('aria-pressed', String(allUS && !allSI));
}

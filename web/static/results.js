// results.js: the result tiles, warnings, assumptions and plots, all
// from the core's result converted for display.

import { $, esc } from './dom.js';
import { renderForm } from './form.js';
import { renderPlan } from './plan-view.js';
import { chart, fitWidth } from './plot.js';
import { S } from './state.js';
import { SHOWN_QUANTITIES, defaultsFor, fmtRes, toShown, unitOf } from './units.js';

function checkFor(name) {
  var cs = (S.result && S.result.checks) || [];
  for (var i = 0; i < cs.length; i++) if (cs[i].name === name) return cs[i];
  return null;
}

function verdict(name, dq, unitSym) {
  var c = checkFor(name);
  if (!c) return '<p class="verdict none"><span aria-hidden="true">\u2013</span> no limit set</p>';
  var lim = dq ? fmtRes(toShown(dq, c.limit)) + ' ' + unitOf(dq).symbol : fmtRes(c.limit) + (unitSym ? ' ' + unitSym : '');
  return c.within ?
    '<p class="verdict ok"><span aria-hidden="true">\u2714</span> within the limit of ' + esc(lim) + '</p>' :
    '<p class="verdict out"><span aria-hidden="true">\u2716</span> OUTSIDE the limit of ' + esc(lim) + '</p>';
}

function tile(id, label, value, unit, sub, verdictHtml, cls) {
  var c = verdictHtml && verdictHtml.indexOf('verdict out') >= 0 ? ' is-out' : '';
  return '<div class="tile ' + (cls || '') + c + '" id="' + id + '"><h3>' + esc(label) + '</h3>' +
    '<p class="big"><span class="num">' + esc(value) + '</span> <span class="u">' + esc(unit) + '</span></p>' +
    (sub ? '<p class="sub">' + sub + '</p>' : '') + (verdictHtml || '') + '</div>';
}

export function renderResults() {
  var r = S.result;
  if (!r) return;
  var L = unitOf('length'), F = unitOf('force');
  var h = [];
  h.push(tile('r-period', 'Sway period', fmtRes(r.period_s), 's',
    'one full swing; ' + esc(fmtRes(r.period_amplitude_s)) + ' s at the residual swing'));
  h.push(tile('r-peak', 'Peak swing', fmtRes(r.peak_swing_deg), 'deg',
    'at ' + esc(fmtRes(r.peak_swing_time_s)) + ' s', verdict('peak_swing_deg', null, 'deg')));
  h.push(tile('r-excursion', 'Peak excursion', fmtRes(toShown('length', r.peak_excursion_m)), L.symbol,
    'load off plumb, sideways', verdict('peak_excursion_m', 'length')));
  h.push(tile('r-residual', 'Residual swing', fmtRes(r.residual_swing_deg), 'deg',
    'after the last move; excursion ' + esc(fmtRes(toShown('length', r.residual_excursion_m)) + ' ' + L.symbol), verdict('residual_swing_deg', null, 'deg')));
  h.push(tile('r-factor', 'Tension factor', fmtRes(r.tension_factor), '\u00D7',
    'peak rope pull / load weight', verdict('tension_factor', null, '')));
  h.push(tile('r-tension', 'Peak rope tension', fmtRes(toShown('force', r.tension_max_n)), F.symbol,
    'lowest ' + esc(fmtRes(toShown('force', r.tension_min_n)) + ' ' + F.symbol) + '; static ' + esc(fmtRes(toShown('force', r.static_tension_n)) + ' ' + F.symbol)));
  if (r.wind_force_n > 0) {
    h.push(tile('r-wind', 'Wind lean', fmtRes(r.wind_lean_deg), 'deg',
      'steady lean under ' + esc(fmtRes(toShown('force', r.wind_force_n)) + ' ' + F.symbol)));
  }
  if (r.rigging) {
    var g = r.rigging;
    h.push(tile('r-modes', 'Two sway modes', fmtRes(g.mode_periods_s[0]), 's',
      'slow mode: <span id="r-mode1-lin">' + esc(fmtRes(g.mode_periods_s[0])) + '</span> s linear, <span id="r-mode1-sim">' + esc(fmtRes(g.simulated_periods_s[0])) + '</span> s simulated<br>' +
      'fast mode: <span id="r-mode2-lin">' + esc(fmtRes(g.mode_periods_s[1])) + '</span> s linear, <span id="r-mode2-sim">' + esc(fmtRes(g.simulated_periods_s[1])) + '</span> s simulated'));
    h.push(tile('r-second', 'Second mode\u2019s share', fmtRes(100 * g.second_mode_share), '%',
      'of the load\u2019s swing after a sudden start (linear theory)'));
    h.push(tile('r-rigging-angle', 'Rope to rigging', fmtRes(g.peak_rigging_angle_deg), 'deg',
      'peak angle between rope and rigging: the load swinging under the hook; the rope itself swings up to ' + esc(fmtRes(g.peak_rope_swing_deg)) + ' deg'));
    h.push(tile('r-rigging-tension', 'Peak rigging tension', fmtRes(toShown('force', g.rigging_tension_max_n)), F.symbol,
      'lowest ' + esc(fmtRes(toShown('force', g.rigging_tension_min_n)) + ' ' + F.symbol)));
  }
  var hd = $('headline');
  hd.innerHTML = h.join('');
  hd.dataset.count = String(S.count);
  var w = r.warnings || [];
  $('warnings').innerHTML = w.length ?
    '<h3>Warnings</h3><ul>' + w.map(function (t) { return '<li><span aria-hidden="true">\u26A0</span> ' + esc(t) + '</li>'; }).join('') + '</ul>' :
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
// each tile marked.
export function markStale(on) {
  $('stale').hidden = !on;
  $('results').classList.toggle('is-stale', on);
  $('charts').classList.toggle('is-stale', on);
}

export function renderPlots() {
  var r = S.result, hs = r.history;
  if (!hs || !hs.time_s || !hs.time_s.length) return;
  var L = unitOf('length').symbol, F = unitOf('force').symbol;
  var bands = [];
  (r.phases || []).forEach(function (p) {
    var n = p.motion + 1;
    bands.push({ x0: p.start_s, x1: p.accel_end_s, text: 'A' + n });
    bands.push({ x0: p.decel_start_s, x1: p.end_s, text: 'B' + n });
  });
  var lim = S.scenario.limits || {};
  var hl = [];
  if (typeof lim.peak_swing_deg === 'number') hl.push({ y: lim.peak_swing_deg, label: 'limit ' + fmtRes(lim.peak_swing_deg) + ' deg' });
  $('plot-angle').innerHTML = chart({ width: fitWidth($('plot-angle')), id: 'angle', title: 'Rope angle from the vertical', xLabel: 'time (s)', yLabel: 'rope angle (deg)',
    series: [{ x: hs.time_s, y: hs.swing_deg, label: 'rope angle', cls: 's1' }], bands: bands, hlines: hl, yFromZero: true }) +
    '<figcaption>Hatched bands: A = a move speeding up, B = braking, numbered by move.</figcaption>';
  $('plot-path').innerHTML = chart({ width: fitWidth($('plot-path')), id: 'path', title: 'Seen from above: load and trolley paths', xLabel: 'x (' + L + ')', yLabel: 'y (' + L + ')', equal: true,
    series: [{ x: scale('length', hs.suspension_x_m), y: scale('length', hs.suspension_y_m), label: 'suspension point', cls: 's2' },
      { x: scale('length', hs.load_x_m), y: scale('length', hs.load_y_m), label: 'load', cls: 's1' }] }) +
    '<figcaption>The load (solid) and the suspension point (dashed) on the ground plan.</figcaption>';
  var circles = [];
  if (typeof lim.peak_excursion_m === 'number') circles.push({ r: toShown('length', lim.peak_excursion_m) });
  $('plot-rel').innerHTML = chart({ width: fitWidth($('plot-rel')), id: 'rel', title: 'Seen from above: load around the suspension point', xLabel: 'x (' + L + ')', yLabel: 'y (' + L + ')', equal: true,
    series: [{ x: scale('length', hs.rel_x_m), y: scale('length', hs.rel_y_m), label: 'load', cls: 's1' }], circles: circles }) +
    '<figcaption>' + (circles.length ? 'Dashed circle: the allowed excursion.' : 'No excursion limit set.') + '</figcaption>';
  var st = toShown('force', r.static_tension_n);
  $('plot-tension').innerHTML = chart({ width: fitWidth($('plot-tension')), id: 'tension', title: 'Rope tension', xLabel: 'time (s)', yLabel: 'tension (' + F + ')',
    series: [{ x: hs.time_s, y: scale('force', hs.tension_n), label: 'tension', cls: 's1' }], bands: bands,
    hlines: [{ y: st, label: 'static ' + fmtRes(st) + ' ' + F }] }) +
    '<figcaption>Dashed line: the load\u2019s weight (static pull).</figcaption>';
}

export function updateBanner() {
  $('example-banner').hidden = !(S.scenario && S.scenario.example);
}

export function renderAll() {
  renderForm();
  updateBanner();
  renderSys();
  if (S.result) renderResults();
  renderPlan();
}

export function renderSys() {
  var d = defaultsFor('us'), allUS = true, allSI = true, ds = defaultsFor('si');
  SHOWN_QUANTITIES.forEach(function (k) { if (S.chosen[k] !== d[k]) allUS = false; if (S.chosen[k] !== ds[k]) allSI = false; });
  $('sys-si').setAttribute('aria-pressed', String(allSI));
  $('sys-us').setAttribute('aria-pressed', String(allUS && !allSI));
}

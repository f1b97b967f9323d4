// site-view.js: the site section (#site): the plan from above with the
// clearance check's envelopes (site-plan.js), the site block's fields and
// its obstacles (added, moved and resized on the plan by pointer, or
// typed), the runs' progress and Cancel, and the clearance verdict in the
// results' verdict band. Every edit goes into the scenario through the
// form's own handlers (form.js bindOne: typed numbers, unit conversion,
// the core's messages at the fields); the core validates and computes.

import { $, esc } from './dom.js';
import { call } from './engine.js';
import { numField, section, textField } from './fields.js';
import { bindOne, clearBad, showErrors } from './form.js';
import { changed } from './compute.js';
import { askSite, dragEdit, nearestHandle, putSVG, showHandles, siteDrawing, toMetres } from './site-plan.js';
import { obstacleFigures, obstacleFiguresSettled, showObstacleFigures } from './site-figures.js';
import { cancelRuns, poolSize, runSplit, runsGoing } from './site-runs.js';
import { S, setPath } from './state.js';
import { say, unitsKey } from './words.js';

// C is the clearance check's state: the report shown and the inputs it is
// of, the runs going.
const C = { report: null, reportFor: null, started: null, going: false, done: 0, total: 0, error: null, sel: -1, fieldsKey: null, frame: null, outlines: null, sendReport: null, drag: null, partial: null, said: null, saying: null };

// siteKey is what the clearance check depends on: the scenario JSON
// without the check sheet's reference fields (as the bridge's memo).
function siteKey(sent) {
  var sc = JSON.parse(sent);
  delete sc.sheet;
  return JSON.stringify(sc);
}

// runsOf is how many runs the site block asks for: its spread's runs, 200
// when it gives none (core/scenario DefaultSiteRuns), one with no spread.
function runsOf(sc) {
  var sp = sc.site.spread;
  return sp ? (sp.runs || 200) : 1;
}

// startRuns starts the check of the last result's inputs when it has a
// site block and they are not the ones checked or being checked.
function startRuns(force) {
  var sent = S.resultSent;
  if (!sent) return;
  var sc = JSON.parse(sent);
  if (!sc.site) { if (C.going) cancelRuns('No site block.'); return; }
  var key = siteKey(sent);
  if (!force && key === C.started) return;
  C.started = key;
  C.going = true;
  C.error = null;
  C.total = runsOf(sc);
  C.done = 0;
  renderSite();
  runSplit(sent, C.total, function (st) {
    if (C.started !== key) return;
    C.done = st.done;
    if (st.report) { C.partial = st.final ? null : st.report; }
    showRunsProgress();
    if (st.report && !st.final) drawPlan();
  }).then(function (r) {
    if (C.started !== key) return;
    C.going = false;
    C.partial = null;
    if (r.error) {
      C.error = r.error.stopped === 'cancelled' ? 'The clearance runs were cancelled; the clearances shown are for earlier inputs.' : r.error.message;
    } else {
      C.report = r.result;
      C.reportFor = key;
      // The check sheet prints the report the bridge now keeps.
      if (window.swaysheetSheet) window.swaysheetSheet.build();
    }
    renderSite();
  });
}

// siteRunPending: the last result has a site block whose runs have not
// started yet.
function siteRunPending() { return !!S.resultSent && !!JSON.parse(S.resultSent).site && siteKey(S.resultSent) !== C.started; }

function stale() { return !!C.report && C.reportFor !== (S.resultSent && siteKey(S.resultSent)); }

function showRunsProgress() {
  var p = $('clearance-progress');
  p.hidden = !C.going;
  $('clearance-progress-text').textContent = 'Clearance runs done ' + C.done + ' of ' + C.total;
  var bar = $('clearance-bar');
  if (bar) bar.style.width = (C.total ? 100 * C.done / C.total : 0).toFixed(0) + '%';
  clearanceVerdict();
}

// clearanceVerdict puts the clearance check's verdict, in the core's
// words, into the results' verdict band (results.js calls it too).
export function clearanceVerdict() {
  var band = $('verdict');
  if (!band) return;
  var p = $('clearance-verdict');
  if (!S.scenario || !S.scenario.site) { if (p) p.remove(); return; }
  if (!p) {
    p = document.createElement('p');
    p.id = 'clearance-verdict';
    band.appendChild(p);
  }
  var r = C.report, t, cls;
  if (C.going) { t = '\u2013 Clearances: runs done ' + C.done + ' of ' + C.total + '\u2026'; cls = 'none'; }
  else if (!r) { t = '\u2013 Clearances not checked' + (C.error ? ': ' + C.error : '.'); cls = 'none'; }
  else {
    t = (r.clears ? '\u2714 Clears every obstacle: ' : '\u2716 DOES NOT CLEAR: ') + verdictWords(r).join(' ');
    cls = r.clears ? 'ok' : 'out';
  }
  if (r && stale() && !C.going) t += ' (for earlier inputs)';
  p.className = 'clearance-verdict ' + cls;
  p.dataset.state = C.going ? 'running' : !r ? 'none' : r.clears ? 'clears' : 'hit';
  p.textContent = t;
  showObstacleFigures(r, !C.going ? (r && stale() ? 'These figures are for earlier inputs.' : '') :
    r ? 'Runs going: the figures below are of the last check done.' : 'Each obstacle\u2019s figures follow when the runs are done.');
}

// verdictWords are the core's verdict sentences in the units shown (the
// "say" call), or its SI words until they come.
function verdictWords(r) {
  var key = unitsKey();
  if (C.said && C.said.report === r && C.said.key === key) return C.said.texts;
  if (r.word_sentences && (!C.saying || C.saying.report !== r || C.saying.key !== key)) {
    var asked = C.saying = { report: r, key: key };
    say(r.word_sentences).then(function (texts) {
      if (C.saying !== asked || !texts) return;
      C.said = { report: r, key: key, texts: texts };
      clearanceVerdict();
    });
  }
  return r.words;
}

// drawPlan asks the core for the plan and the section at the width shown
// (the transform kept during a drag): the site as edited, the envelopes
// of the report the bridge keeps for the inputs checked (or the partial
// report while runs arrive, or the page's own when the bridge keeps
// another). The selected obstacle's handles are drawn at once.
function drawPlan(keepView) {
  var fig = $('site-plan');
  if (!fig || !S.scenario.site) return;
  var site = C.drag ? C.drag.site : S.scenario.site;
  var input = { scenario: Object.assign({}, S.scenario, { site: site }), units: S.chosen, system: S.sys === 'us' ? 'us' : 'si',
    width_px: Math.max(fig.clientWidth - 4, 280), max_height_px: Math.max(260, Math.min(window.innerHeight * 0.7, 640)), selected: C.sel };
  if (C.reportFor) input.report_for = JSON.parse(C.reportFor);
  if (C.partial) input.report = C.partial;
  else if (C.report && C.sendReport === C.report) input.report = C.report;
  if (keepView && C.frame) input.frame = C.frame;
  showHandles(fig.querySelector('svg'), C.frame, C.outlines && C.outlines[C.sel], C.sel);
  var rep = C.partial || C.report, dragging = !!C.drag;
  askSite(input, function (r) {
    if (!r.error && !r.result.envelopes && C.report && !C.partial && C.sendReport !== C.report) {
      C.sendReport = C.report; // the bridge keeps another check: send the one shown
      drawPlan(keepView);
      return;
    }
    var old = fig.querySelector('.chart-error');
    if (old) old.remove();
    if (r.error || !putSVG(fig, r.result.svg, 'site-svg')) {
      var p = document.createElement('p');
      p.className = 'chart-error';
      p.textContent = '\u26A0 The plan could not be drawn' + (r.error ? ': ' + r.error.message : '.');
      fig.appendChild(p);
      return;
    }
    C.frame = r.result.frame;
    C.outlines = r.result.outlines || []; // none when the site has no obstacle
    showHandles(fig.querySelector('svg'), C.frame, C.outlines[C.sel], C.sel);
    var cap = fig.querySelector('figcaption') || fig.appendChild(document.createElement('figcaption'));
    cap.textContent = 'Hatched: the exclusion zone, where the load may pass in 95 % of runs: nobody stands here during the lift. ' +
      'Grey: where it stays in half the runs. Solid line: the load with no spread; dashed: the crane (suspension point). ' +
      'Black: obstacles with their top heights, ringed by the margin. Tap an obstacle to select it; drag it to move it, its round handles to resize it (on a small one the handles stand off its corners, joined by a line).' +
      (rep && stale() ? ' The envelopes are for earlier inputs.' : '');
    var sec = $('site-section-fig');
    if (!sec || dragging) return;
    sec.hidden = !r.result.section_svg;
    if (r.result.section_svg && putSVG(sec, r.result.section_svg, 'site-section') && !sec.querySelector('figcaption')) {
      sec.appendChild(document.createElement('figcaption')).textContent = 'Seen from the side along the crane\u2019s path: the band the load\u2019s lowest point stays in (hatched: 95 % of runs; grey: half), ' +
        'the load\u2019s lowest point with no spread (solid) and the hook (dashed), and the obstacles it passes with their tops (black).';
    }
  });
}

function fieldsHTML(st) {
  var h = [];
  h.push(section('Site', numField('site.suspension_height_m', 'Rope top above the floor', { hint: 'sheave or jib tip' }) +
    numField('site.load_radius_m', 'Load size (radius)', { hint: 'half its largest dimension' }) +
    numField('site.margin_m', 'Margin to keep', { optional: true }), 'site-card'));
  h.push(section('Spreads of the runs', numField('site.spread.runs', 'Runs', { optional: true }) +
    numField('site.spread.seed', 'Seed', { optional: true }) +
    numField('site.spread.rope_length_m', 'Rope length \u00B1 (1 sd)', { optional: true }) +
    numField('site.spread.centre_depth_m', 'Centre of mass \u00B1 (1 sd)', { optional: true }) +
    numField('site.spread.press_s', 'Press timing \u00B1 (1 sd)', { optional: true }) +
    numField('site.spread.gust_pct', 'Gust strength \u00B1 (1 sd)', { optional: true }) +
    numField('site.spread.gust_s', 'Gust moment \u00B1 (1 sd)', { optional: true }), 'site-spread-card'));
  (st.obstacles || []).forEach(function (o, i) {
    var at = 'site.obstacles[' + i + ']', b = '';
    b += textField(at + '.name', 'Name') + numField(at + '.top_m', 'Top height');
    if (o.box) {
      ['centre_x_m', 'centre_y_m', 'length_m', 'width_m'].forEach(function (k, j) {
        b += numField(at + '.box.' + k, ['Centre x', 'Centre y', 'Length', 'Width'][j]);
      });
      b += numField(at + '.box.angle_deg', 'Turned by', { optional: true, hint: 'degrees from x toward y' });
    } else {
      (o.corners || []).forEach(function (c, j) {
        b += numField(at + '.corners[' + j + '].x_m', 'Corner ' + (j + 1) + ' x') + numField(at + '.corners[' + j + '].y_m', 'Corner ' + (j + 1) + ' y');
      });
    }
    b += '<div class="field"><button type="button" class="small-btn site-del" data-site-remove="' + i + '">Delete ' + esc(o.name || 'obstacle ' + (i + 1)) + '</button></div>';
    h.push('<fieldset class="card ob-card' + (i === C.sel ? ' selected' : '') + '" data-ob-card="' + i + '"><legend>Obstacle ' + (i + 1) +
      (o.name ? ': ' + esc(o.name) : '') + '</legend><div class="grid">' + b + '</div></fieldset>');
  });
  return h.join('');
}

// renderSite draws the section: the fields again only when the site
// block changed from outside them (never under the person typing).
export function renderSite() {
  var out = $('site-out');
  if (!out || !S.scenario || !S.ranges) return;
  var st = S.scenario.site;
  showRunsProgress();
  if (!st) {
    C.fieldsKey = null;
    out.innerHTML = '<p>No site plan in these inputs. Add one to check the load\u2019s likely swept area against what stands along the path.</p>' +
      '<button type="button" id="site-add">Add a site plan</button>';
    return;
  }
  if (!$('site-plan')) {
    out.innerHTML = '<div class="site-tools"><button type="button" id="site-add-obstacle">Add an obstacle</button>' +
      '<button type="button" id="clearance-run" class="small-btn">Run the clearance check again</button></div>' +
      '<p id="clearance-msg" class="clearance-msg" role="status"></p>' +
      '<figure id="site-plan" class="site-plan"></figure><figure id="site-section-fig" class="site-plan" hidden></figure>' +
      '<section id="clearance-figures" class="clr-figures" aria-label="Clearance of each obstacle"></section>' +
      '<form id="site-form" novalidate autocomplete="off"></form>';
    bindOne($('site-form'));
    bindSitePlan();
    C.fieldsKey = null;
  }
  var f = $('site-form'), key = JSON.stringify([st, S.chosen, Object.keys(S.bad), C.sel]);
  if (key !== C.fieldsKey && !f.contains(document.activeElement)) {
    f.innerHTML = fieldsHTML(st);
    C.fieldsKey = key;
    showErrors();
  }
  $('clearance-msg').textContent = C.error && !C.going ? '\u2716 ' + C.error : '';
  drawPlan();
}

// edit changes the site block and hands it to the form's normal path.
function edit(fn) {
  fn(S.scenario.site);
  clearBad('site.obstacles');
  C.fieldsKey = null;
  renderSite();
  changed();
}

function bindSitePlan() {
  var fig = $('site-plan');
  fig.addEventListener('pointerdown', function (e) {
    var t = e.target;
    // Of overlapping handles, the one nearest the finger.
    if (t.classList && t.classList.contains('handle-hit')) t = nearestHandle(fig.querySelector('svg'), e.clientX, e.clientY) || t;
    var ob = t.dataset ? t.dataset.ob : undefined;
    if (ob === undefined) { if (C.sel >= 0) { C.sel = -1; drawPlan(true); } return; }
    e.preventDefault();
    if (!C.frame || !C.outlines) return;
    var i = Number(ob), rect = fig.querySelector('svg').getBoundingClientRect();
    C.sel = i;
    C.drag = { i: i, handle: t.dataset.handle !== undefined ? Number(t.dataset.handle) : -1, id: e.pointerId, moved: false,
      from: toMetres(C.frame, rect, e.clientX, e.clientY), rect: rect, frame: C.frame, outline: C.outlines[i],
      orig: JSON.stringify(S.scenario.site.obstacles[i]), site: JSON.parse(JSON.stringify(S.scenario.site)) };
    try { fig.setPointerCapture(e.pointerId); } catch (err) { /* synthetic pointer */ }
    drawPlan(true);
  });
  fig.addEventListener('pointermove', function (e) {
    var d = C.drag;
    if (!d || e.pointerId !== d.id) return;
    var to = toMetres(d.frame, d.rect, e.clientX, e.clientY);
    d.site.obstacles[d.i] = dragEdit(JSON.parse(d.orig), d.handle, d.from, to, d.outline);
    d.moved = true;
    drawPlan(true);
  });
  function end(e) {
    var d = C.drag;
    if (!d || e.pointerId !== d.id) return;
    C.drag = null;
    if (d.moved) edit(function (st) { st.obstacles[d.i] = d.site.obstacles[d.i]; });
    else { C.fieldsKey = null; renderSite(); }
  }
  fig.addEventListener('pointerup', end);
  fig.addEventListener('pointercancel', end);
}

document.addEventListener('click', function (e) {
  var t = e.target;
  if (t.id === 'site-add') {
    S.scenario.site = { suspension_height_m: 10, load_radius_m: 1, margin_m: 0.3, obstacles: [], spread: { runs: 200, seed: 1 } };
    C.sel = -1;
    renderSite();
    changed();
  } else if (t.id === 'site-add-obstacle') {
    // A 1 m square, 3 m high, in the middle of the plan shown.
    var f = C.frame, cx = f ? f.x_m + f.width_px * f.m_per_px / 2 : 0, cy = f ? f.y_m - f.height_px * f.m_per_px / 2 : 0;
    edit(function (st) {
      st.obstacles = st.obstacles || [];
      st.obstacles.push({ name: 'obstacle ' + (st.obstacles.length + 1), top_m: 3,
        box: { centre_x_m: Math.round(cx * 10) / 10, centre_y_m: Math.round(cy * 10) / 10, length_m: 1, width_m: 1 } });
      C.sel = st.obstacles.length - 1;
    });
  } else if (t.dataset && t.dataset.siteRemove !== undefined) {
    var i = Number(t.dataset.siteRemove);
    edit(function (st) { st.obstacles.splice(i, 1); C.sel = -1; });
  } else if (t.id === 'clearance-cancel') {
    cancelRuns();
  } else if (t.id === 'clearance-run') {
    startRuns(true);
  }
});

// The runs start a moment after a result, so typing on does not start
// (and end) them at every key.
let siteRunTimer = null;
document.addEventListener('swaysheet:result', function () {
  renderSite();
  clearTimeout(siteRunTimer);
  siteRunTimer = setTimeout(function () { startRuns(false); }, 300);
});

let siteResize = null;
window.addEventListener('resize', function () {
  clearTimeout(siteResize);
  siteResize = setTimeout(function () { if (S.scenario && S.scenario.site) drawPlan(); }, 150);
});

// For the browser tests: the report shown and its inputs, the runs'
// state, the single call and the split runs on their own.
window.swaysheetSite = {
  report: function () { return C.report; },
  state: function () { return { going: C.going || runsGoing(), done: C.done, total: C.total, error: C.error, stale: stale(), sel: C.sel }; },
  figures: obstacleFigures,
  settled: function () { return obstacleFiguresSettled() && !C.going && !siteRunPending() && !siteDrawing() && (!S.scenario || !S.scenario.site || !!C.error || (!!C.report && !stale())); },
  single: function (sent) { return call('clearance', sent); },
  split: function (sent, n, workers, on) { return runSplit(sent, n, on || function () {}, workers); },
  poolSize: poolSize,
  cancel: function () { cancelRuns(); }
};

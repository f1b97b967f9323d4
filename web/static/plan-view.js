// plan-view.js: runs the core's "plan" call and shows the ranked options,
// their crew settings, verified figures and the planner's curves. Every
// figure comes from the core; nothing is computed here beyond differences
// of times the planner gives (a ramp's duration).

import { drawChart } from './charts.js';
import { openCoach } from './coach.js';
import { changed } from './compute.js';
import { $, esc, notice } from './dom.js';
import { call, cancel } from './engine.js';
import { clearBad, renderForm } from './form.js';
import { P, accelDQ, axisName, deg, kindOf, limitsLine, listHTML, num, planKey, secs, siNote, speedDQ, sym, withU } from './plan-form.js';
import { S, axisOf, axisWord } from './state.js';
import { figuresCount, presentFigures } from './results.js';
import { keepInSaved } from './storage.js';
import { fmtRes, fmtStep, toShown } from './units.js';
import { planWords, unitsKey } from './words.js';

function runPlan() {
  if (!S.scenario || !S.scenario.plan || P.running) return;
  if (Object.keys(S.bad).length) {
    P.error = { message: 'Correct the marked fields first: the plan needs every input as a number.', fields: [] };
    renderPlan();
    return;
  }
  var sent = JSON.stringify(S.scenario), keyed = planKey(S.scenario), seq = P.keySeq;
  P.running = true;
  P.error = null;
  P.started = Date.now();
  clearInterval(P.ticker);
  P.ticker = setInterval(planProgress, 250);
  planProgress();
  renderPlan();
  // The plan, then its sentences in the units shown, before it is shown.
  var asked = 0; // the figures asked for when the plan came
  Promise.all([call('plan', sent), keyed]).then(function (rs) {
    asked = figuresCount();
    return rs[0].error ? rs : planWords(rs[0].result).then(function (w) { return rs.concat([w]); });
  }).then(function (rs) {
    var r = rs[0], key = rs[1];
    P.running = false;
    clearInterval(P.ticker);
    planProgress();
    if (r.error) {
      P.error = r.error;
    } else {
      P.result = r.result;
      P.key = key;
      if (P.keySeq === seq) P.nowKey = key;
      P.applied = null;
      P.count++;
      P.words = rs[2];
      if (P.words) P.words.count = P.count;
    }
    renderPlan();
    // A planned request without moves is presented for the recommended
    // move: the results follow the plan. Only when the result shown is of
    // the inputs as they are: otherwise their evaluation is due or under
    // way, and presents its figures (of the plan, now kept) when it comes;
    // asking now would compute the figures of earlier inputs for nothing.
    // Nor when they were asked for since the plan came (the core had it).
    if (!r.error && S.resultSent === JSON.stringify(S.scenario) && figuresCount() === asked) presentFigures();
  });
}

// words are the plan's sentences in the units shown (the core's "say"
// call, asked again when the units change); until they come, the
// planner's SI text, said to be SI.
function words(r) {
  var w = P.words;
  if (w && w.key === unitsKey() && w.count === P.count) return w;
  if (!P.wordsAsked || P.wordsAsked.key !== unitsKey() || P.wordsAsked.count !== P.count) {
    var asked = P.wordsAsked = { key: unitsKey(), count: P.count };
    planWords(r).then(function (got) {
      if (P.wordsAsked !== asked || !got || P.result !== r) return;
      got.count = asked.count;
      P.words = got;
      renderPlan();
    });
  }
  return { si: true, reason: r.reason, infeasible: r.infeasible, notes: r.notes,
    options: r.options.map(function (o) { return { settings: o.settings, findings: o.findings, outside: o.outside }; }) };
}

function note(w) { return w.si ? siNote() : ''; }

function planProgress() {
  var box = $('plan-progress');
  box.hidden = !P.running;
  $('plan-run').disabled = P.running;
  $('plan-cancel').hidden = !(P.running && Date.now() - P.started >= 1000);
  if (P.running) $('plan-progress-text').textContent = 'Planning and checking each option\u2026 ' + Math.floor((Date.now() - P.started) / 1000) + ' s';
}

function applyOption(i) {
  var s = S.scenario, o = P.result.options[i];
  var mv = JSON.parse(JSON.stringify(o.motion));
  var kept = false;
  if ((s.motions || []).length && JSON.stringify(s.motions) !== JSON.stringify([mv]) && !s.example) {
    kept = keepInSaved('Kept before using a planned move');
  }
  s.motions = [mv];
  clearBad('motions[');
  renderForm();
  changed();
  P.applied = o.key;
  renderPlan();
  notice('The crane motions are now the planned move \u201C' + o.label + '\u201D; the results show it.' +
    (kept ? ' The motions it replaced are kept among the saved scenarios.' : ''));
  var res = $('results');
  if (res && res.scrollIntoView) res.scrollIntoView({ block: 'start' });
}

// --------------------------------------------------------------- showing

export function renderPlan() {
  if (!S.table) return;
  var s = S.scenario, out = [];
  $('plan-run').hidden = !(s && s.plan);
  planProgress();
  if (!s || !s.plan) {
    $('plan-out').innerHTML = '<p class="small">Tick \u201CPlan a move\u201D to state a travel or slew move and have the planner propose ramp times, shaped speed profiles or pendant press times for it.</p>';
    return;
  }
  if (P.error) {
    out.push('<div class="banner bad plan-error" role="alert" id="plan-error">\u2716 No plan: ' + esc(P.error.message) +
      (P.error.fields && P.error.fields.length ? ' See the marked fields.' : '') + '</div>');
  }
  var r = P.result;
  if (!r) {
    if (!P.running && !P.error) out.push('<p class="small" id="plan-none">No plan yet: press \u201CPlan the move\u201D.</p>');
    $('plan-out').innerHTML = out.join('');
    return;
  }
  out.push('<p class="stale" id="plan-stale" role="status"' + (P.key === P.nowKey ? ' hidden' : '') +
    '>\u26A0 The inputs changed since this plan was made: press \u201CPlan the move\u201D again. The plan below is for the earlier inputs.</p>');
  var w = words(r);
  out.push(summary(r));
  out.push(recommended(r, w));
  if (!(s.motions || []).length && r.options.length) {
    out.push('<p class="plan-nomove" id="plan-nomove"><span aria-hidden="true">\u2139</span> The crane motions are empty, so the results, plots and sheet show the recommended move. ' +
      'Use one of these moves in the crane motions to see another.</p>');
  }
  if (w.infeasible && w.infeasible.length) {
    out.push('<div class="plan-infeasible" id="plan-infeasible"><h3>What to change</h3>' + listHTML(w.infeasible, 'warn-list', '\u2716') + note(w) + '</div>');
  }
  if (w.notes && w.notes.length) out.push('<div class="plan-notes"><h3>Notes</h3>' + listHTML(w.notes, 'note-list', '\u2139') + note(w) + '</div>');
  if (r.options.length) {
    out.push(planTable(r));
    out.push('<h3 class="plan-h">Each option: crew settings and checked figures</h3>');
    r.options.forEach(function (o, i) { out.push(optionCard(r, o, i, w)); });
  }
  out.push('<div class="plots plan-plots"><figure id="plot-plan-ramp" class="plot"></figure><figure id="plot-plan-rope" class="plot"></figure></div>');
  out.push('<details class="assumptions"><summary>What the planner assumes</summary>' + listHTML(r.assumptions, '', '') + '</details>');
  out.push('<div class="plan-cautions"><h3>Before using a plan</h3>' + listHTML(r.cautions, 'warn-list', '\u26A0') + '</div>');
  // Cards a person opened or closed stay so through a unit switch or an
  // applied option (same plan).
  var open = null;
  if (P.shownCount === P.count) {
    open = {};
    document.querySelectorAll('#plan-out .opt-card').forEach(function (d) { open[d.id] = d.open; });
  }
  $('plan-out').innerHTML = out.join('');
  if (open) document.querySelectorAll('#plan-out .opt-card').forEach(function (d) { if (d.id in open) d.open = open[d.id]; });
  P.shownCount = P.count;
  curves(r);
}

function summary(r) {
  var K = kindOf(r);
  var move = typeof r.radius_m === 'number' ?
    axisOf(r.axis).label + ' ' + withU(K.quantity, r[K.distance]) + ' at a hook radius of ' + withU('length', r.radius_m) + ', top rate ' + withU(K.speedQ, r[K.top]) +
      (r.slew_lean_deg ? ' (outward lean ' + deg(r.slew_lean_deg) + ' at that rate)' : '') :
    'Travel ' + withU(K.quantity, r[K.distance]) + ' on ' + axisName(r.axis) + ', top speed ' + withU(K.speedQ, r[K.top]);
  var ropes = r.rope_lengths_m.map(function (l) { return num('length', l); }).join(', ') + '\u00A0' + sym('length');
  return '<p class="plan-summary" id="plan-summary">' + esc(move) + '. Rope ' + esc(withU('length', r.rope_length_m)) +
    ' (sway period ' + esc(secs(r.period_s)) + '); each option simulated at ' + esc(ropes) +
    '; shapers and whole-period ramps tuned to ' + esc(secs(r.design_period_s)) + ' (rope ' + esc(withU('length', r.design_rope_length_m)) + '). ' +
    esc(String(r.simulations)) + ' simulations.</p>' + modes(r);
}

// modes shows the two sway modes of a hook block or a rigid load, when
// the plan has them (modes_of: whose they are, in the core's words).
function modes(r) {
  var m = r.mode_periods_s;
  if (!m || m.length < 2) return '';
  return '<p class="plan-modes" id="plan-modes"><b>Two sway modes ' + esc(r.modes_of || 'of hook block and rigging') + '</b>, <span id="plan-mode1">' + esc(secs(m[0])) +
    '</span> and <span id="plan-mode2">' + esc(secs(m[1])) + '</span> at the nominal rope; the second carries up to <span id="plan-share">' +
    esc(fmtRes(100 * r.second_mode_share)) + '\u00A0%</span> of the load\u2019s swing. Two-mode shapers are tuned to ' +
    esc(secs(r.design_period_s)) + ' and ' + esc(secs(r.second_design_period_s)) + '.</p>';
}

function recommended(r, w) {
  if (r.recommended < 0) {
    return '<div class="plan-rec none" id="plan-rec"><p class="rec-head"><span aria-hidden="true">\u2716</span> No option is recommended</p><p>' + esc(w.reason) + note(w) + '</p></div>';
  }
  var o = r.options[r.recommended];
  // The core's reason starts by naming the option, as the heading does.
  var why = w.reason, lead = 'Recommended: ' + o.label + ' \u2014 ';
  if (why.indexOf(lead) === 0) why = why.slice(lead.length);
  return '<div class="plan-rec" id="plan-rec"><p class="rec-head"><span aria-hidden="true">\u2605</span> Recommended: <span id="plan-rec-label">' + esc(o.label) + '</span></p>' +
    '<p><b>Why:</b> <span id="plan-reason">' + esc(why) + '</span>' + note(w) + '</p>' +
    '<p><a class="button" href="#plan-opt-' + r.recommended + '">Its crew settings</a>' +
    (o.presses && o.presses.length ? ' <button type="button" class="coach-open" data-coach="' + r.recommended + '">Press coach</button>' : '') + '</p></div>';
}

// verdict says whether an option keeps inside every limit, and which it
// breaks (the figures are in the table beside it).
function optionVerdict(o, short) {
  if (o.within) return '<span class="verdict ok"><span aria-hidden="true">\u2714</span> within</span>';
  // The limit's name: the first two words of each (no figures).
  var which = (o.outside || []).map(function (t) { return t.split(' ').slice(0, 2).join(' '); });
  return '<span class="verdict out"><span aria-hidden="true">\u2716</span> OUTSIDE</span>' +
    (which.length ? (short ? '<br>' : ': ') + '<span class="which">' + esc(which.join(', ')) + '</span>' : '');
}

function planTable(r) {
  var L = sym('length');
  var h = '<div class="table-wrap" tabindex="0" role="region" aria-label="Options, best first">' +
    '<table class="plan-table" id="plan-table"><caption>Options, best first, each against the limits. Peak and residual: the worst over the rope lengths simulated; extra: longer than the fastest move.</caption><thead><tr>' +
    '<th scope="col">Option</th><th scope="col">Move (s)</th><th scope="col">Extra (s)</th>' +
    '<th scope="col">Peak (deg)</th><th scope="col">Excursion (' + esc(L) + ')</th><th scope="col">Residual (deg)</th></tr></thead><tbody>';
  r.options.forEach(function (o, i) {
    var rec = i === r.recommended;
    h += '<tr class="' + (rec ? 'rec' : '') + (o.within ? '' : ' out') + '" data-key="' + esc(o.key) + '">' +
      '<th scope="row"><a href="#plan-opt-' + i + '"><span data-col="rank">' + (rec ? '<span aria-hidden="true">\u2605</span> ' : '') + o.rank + '.</span> ' +
      '<span data-col="label">' + esc(o.label) + '</span></a>' + (rec ? ' <strong class="rec-word">Recommended</strong>' : '') +
      (o.two_mode ? ' <span class="mode-word">both modes</span>' : '') +
      '<span class="lim" data-col="limits">' + optionVerdict(o, false) + '</span></th>' +
      '<td class="n" data-col="move" data-label="Move (s)">' + fmtStep('time', o.move_time_s) + '</td><td class="n" data-col="extra" data-label="Extra (s)">' + fmtStep('time', o.penalty_s) + '</td>' +
      '<td class="n" data-col="peak" data-label="Peak (deg)">' + fmtStep('angle', o.worst_peak_swing_deg) + '</td><td class="n" data-col="excursion" data-label="Excursion (' + esc(L) + ')">' +
      num('length', o.worst_peak_excursion_m) + '</td>' +
      '<td class="n" data-col="residual" data-label="Residual (deg)">' + fmtStep('angle', o.worst_residual_swing_deg) + '</td></tr>';
  });
  return h + '</tbody></table></div>';
}

// crew renders an option's settings from the planner's own numbers.
function crew(r, o, ow, w) {
  var sdq = speedDQ(r), adq = accelDQ(r), h = '';
  var K = kindOf(r), top = o[K.top], acc = o[K.accel];
  if (o.speed_profile && o.speed_profile.length > 1) {
    h += '<p>Program the drive\u2019s speed profile (multi-segment ramps, or the drive\u2019s own sway-control function) for starting; stopping mirrors it.</p>';
    h += '<table class="plain crew" data-crew="ramps"><caption>Speed profile for a variable-speed drive</caption><thead><tr><th scope="col">From</th><th scope="col">To</th><th scope="col">The drive</th><th scope="col">Ramp time</th></tr></thead><tbody>';
    for (var i = 0; i + 1 < o.speed_profile.length; i++) {
      var k0 = o.speed_profile[i], k1 = o.speed_profile[i + 1];
      var same = fmtRes(toShown(sdq, k0.speed)) === fmtRes(toShown(sdq, k1.speed));
      h += '<tr><td>' + secs(k0.t_s) + '</td><td>' + secs(k1.t_s) + '</td><td>' +
        (same ? 'holds ' + withU(sdq, k1.speed) : 'ramps ' + num(sdq, k0.speed) + ' \u2192 ' + withU(sdq, k1.speed)) + '</td><td>' +
        (same ? '\u2014' : secs(k1.t_s - k0.t_s)) + '</td></tr>';
    }
    h += '</tbody></table>';
  } else if (o.presses && o.presses.length) {
    h += '<p>Press and release the pendant at these times from the first press' + (acc ? ', with the drive ramping at ' + esc(withU(adq, acc)) : '') + '.</p>';
    h += '<table class="plain crew" data-crew="presses"><caption>Pendant press times</caption><thead><tr><th scope="col">At</th><th scope="col">Action</th><th scope="col">Step</th><th scope="col">Speed</th></tr></thead><tbody>';
    var prev = 0;
    o.presses.forEach(function (p) {
      var action = p.step_pct === 0 ? 'release to stop' : p.step_pct > prev ? 'press' : 'release';
      prev = p.step_pct;
      h += '<tr><td>' + secs(p.at_s) + '</td><td>' + action + '</td><td>' + fmtRes(p.step_pct) + '\u00A0%</td><td>' + withU(sdq, Math.abs(p.speed)) + '</td></tr>';
    });
    h += '</tbody></table>';
  } else {
    h += '<ul class="crew-list" data-crew="ramp"><li>Acceleration and deceleration: <b>' + esc(withU(adq, acc)) + '</b></li>' +
      '<li>Ramp time to the top speed: <b>' + esc(secs(o.ramp_s)) + '</b></li>' +
      '<li>' + esc(axisWord(r.axis, 'top')) + ': <b>' + esc(withU(sdq, top)) + '</b></li></ul>';
  }
  if (ow.settings && ow.settings.length) {
    h += '<details class="words"><summary>The planner\u2019s own words' + (w.si ? ' (figures in SI units)' : '') + '</summary>' +
      '<pre>' + esc(ow.settings.join('\n')) + '</pre></details>';
  }
  return h;
}

function optionCard(r, o, i, w) {
  var ow = w.options[i];
  var rec = i === r.recommended, L = sym('length');
  var h = '<details class="opt-card' + (rec ? ' rec' : '') + '" id="plan-opt-' + i + '"' + (rec ? ' open' : '') + '><summary>' +
    (rec ? '<span aria-hidden="true">\u2605</span> ' : '') + o.rank + '. ' + esc(o.label) + (rec ? ' \u2014 <strong>Recommended</strong>' : '') +
    ' \u00B7 ' + esc(secs(o.move_time_s)) + ' \u00B7 ' + optionVerdict(o) + '</summary><div class="opt-body">';
  h += '<h4>Settings for the crew</h4>' + crew(r, o, ow, w);
  if (o.presses && o.presses.length) {
    h += '<p class="row"><button type="button" class="coach-open" data-coach="' + i + '">Press coach: count the presses on screen</button></p>';
  }
  var mr = o.mode_residual_pct;
  if (mr && mr.length >= 2) {
    h += '<p class="mode-left">Left in each sway mode (linear theory, the worst over the rope lengths): first mode ' + esc(fmtRes(mr[0])) +
      '\u00A0%, second mode ' + esc(fmtRes(mr[1])) + '\u00A0% of what the drive-limits move leaves' + (o.two_mode ? ' (a shaper for both modes).' : '.') + '</p>';
  }
  if (o.not_simulated) {
    // Screened by the planner: linear-theory estimates, never shown as checked.
    h += '<h4>Not simulated: linear-theory estimate</h4><p class="note">' + esc(o.not_simulated) + '. Use this move in the crane motions to simulate it.</p>' +
      '<div class="table-wrap" tabindex="0" role="region" aria-label="Estimated figures at each rope length"><table class="plain estimated"><thead><tr><th scope="col">Rope length (' + esc(L) + ')</th>' +
      '<th scope="col">Peak swing, estimate (deg)</th><th scope="col">Peak excursion, estimate (' + esc(L) + ')</th><th scope="col">Residual swing, estimate (deg)</th></tr></thead><tbody>' +
      (o.estimated || []).map(function (v, j) {
        return '<tr><th scope="row">' + num('length', v.rope_length_m) + (j === 0 ? ' (nominal)' : '') + '</th><td class="n">' + fmtStep('angle', v.peak_swing_deg) +
          '</td><td class="n">' + num('length', v.peak_excursion_m) + '</td><td class="n">' + fmtStep('angle', v.residual_swing_deg) + '</td></tr>';
      }).join('') + '</tbody></table></div>';
  } else {
    var rig = o.verified.some(function (v) { return typeof v.peak_rigging_angle_deg === 'number'; });
    h += '<h4>Checked by simulation</h4><div class="table-wrap" tabindex="0" role="region" aria-label="Checked figures at each rope length"><table class="plain verified"><thead><tr><th scope="col">Rope length (' + esc(L) + ')</th>' +
      '<th scope="col">Peak swing (deg)</th><th scope="col">Peak excursion (' + esc(L) + ')</th><th scope="col">Residual swing (deg)</th><th scope="col">Tension factor</th>' +
      (rig ? '<th scope="col">Rope to rigging (deg)</th>' : '') + '</tr></thead><tbody>' +
      o.verified.map(function (v, j) {
        return '<tr><th scope="row">' + num('length', v.rope_length_m) + (j === 0 ? ' (nominal)' : '') + '</th><td class="n">' + fmtStep('angle', v.peak_swing_deg) +
          '</td><td class="n">' + num('length', v.peak_excursion_m) + '</td><td class="n">' + fmtStep('angle', v.residual_swing_deg) + '</td><td class="n">' +
          fmtStep('ratio', v.tension_factor) + '</td>' + (rig ? '<td class="n">' + (typeof v.peak_rigging_angle_deg === 'number' ? fmtStep('angle', v.peak_rigging_angle_deg) : '\u2014') + '</td>' : '') + '</tr>';
      }).join('') + '</tbody></table></div>';
  }
  if (!o.within) h += listHTML(ow.outside, 'warn-list', '\u2716') + note(w);
  h += '<p class="row"><button type="button" class="apply" data-apply="' + i + '">' +
    (P.applied === o.key ? '\u2714 In the crane motions' : 'Use this move in the crane motions') + '</button></p>';
  return h + '</div></details>';
}

function sentence(t) {
  t = String(t || '');
  return t.charAt(0).toUpperCase() + t.slice(1) + (/[.]$/.test(t) ? '' : '.');
}

// shaperName: zv, zvd, ei; the planner's two-mode shapers end in 2.
function shaperName(k) {
  k = String(k);
  return /2$/.test(k) ? k.slice(0, -1).toUpperCase() + ' both modes' : k.toUpperCase();
}

const CLS = ['s1', 's2', 's3', 's4', 's5', 's6'];

function curves(r) {
  var at = r.curves.accel_time, re = r.curves.rope_error, lim = r.limits || {};
  var hl = typeof lim.residual_swing_deg === 'number' ? [{ y: lim.residual_swing_deg, text: 'limit ' + deg(lim.residual_swing_deg) }] : [];
  drawChart($('plot-plan-ramp'), {
    id: 'plan-ramp', title: 'Residual swing after one ramp, against ramp time', x_label: 'ramp time to top speed (s)', y_label: 'residual swing (deg)',
    y_from_zero: true, lines: hl, legend_top: true,
    series: at.series.map(function (sr, i) {
      return { x: at.ramp_s, y: sr.residual_deg, name: 'rope ' + num('length', sr.rope_length_m) + ' ' + sym('length'), class: CLS[i % CLS.length] };
    })
  }, 'Zero at whole sway periods (' + esc(secs(r.design_period_s)) + ' each). ' + esc(sentence(at.basis)));
  drawChart($('plot-plan-rope'), {
    id: 'plan-rope', title: 'Residual swing against rope-length error, per shaper', x_label: 'rope length error from the tuned length (%)',
    y_label: 'residual (% of unshaped)', y_from_zero: true, legend_top: true,
    bands: [{ x0: re.range_pct[0], x1: re.range_pct[1], text: 'your range' }],
    series: re.series.map(function (sr, i) {
      return { x: re.error_pct, y: sr.residual_pct, name: shaperName(sr.shaper), class: CLS[i % CLS.length] };
    })
  }, 'Hatched: the plan\u2019s rope-length range. A flatter curve forgives a wrong rope length. ' + esc(sentence(re.basis)));
}

export function planChanged() {
  // A failed attempt's message is about the inputs as they were.
  if (P.error && !P.running) {
    P.error = null;
    var pe = $('plan-error');
    if (pe) pe.remove();
  }
  if (S.scenario && S.scenario.plan) {
    var my = ++P.keySeq;
    planKey(S.scenario).then(function (k) {
      if (my !== P.keySeq) return;
      P.nowKey = k;
      var st = $('plan-stale');
      if (st) st.hidden = P.key === k;
    });
  }
  var lim = $('plan-limits');
  if (lim && S.scenario.plan) lim.outerHTML = limitsLine(S.scenario);
}

// loaded: a new scenario replaced the inputs; one with a plan block is
// planned at once, so a planning example opens with its plan.
export function planLoaded() {
  P.result = null;
  P.key = null;
  P.nowKey = null;
  P.keySeq++;
  P.error = null;
  P.stash = null;
  P.applied = null;
  renderPlan();
  var s = S.scenario;
  if (s && s.plan) runPlan();
}

export function bindPlan() {
  $('plan-run').onclick = runPlan;
  $('plan-cancel').onclick = function () { cancel(); };
  $('plan-out').addEventListener('click', function (e) {
    var b = e.target.closest && e.target.closest('[data-apply]');
    if (b && P.result) applyOption(Number(b.dataset.apply));
    var c = e.target.closest && e.target.closest('[data-coach]');
    if (c && P.result) {
      // The option with its sentences in the units shown, when the core has put them.
      var i = Number(c.dataset.coach), o = Object.assign({}, P.result.options[i]), w = words(P.result);
      if (!w.si) o.said = w.options[i];
      openCoach(P.result, o, c, P.key !== P.nowKey);
    }
  });
}

// For the browser tests: the plan shown and whether one is being made.
window.swaysheetPlan = {
  running: function () { return P.running; },
  count: function () { return P.count; },
  resultJSON: function () { return P.result ? JSON.stringify(P.result) : ''; }
};

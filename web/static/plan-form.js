// plan-form.js: the planner's inputs (the scenario's plan block) and the
// moves it made as shown among the crane motions.

import { changed } from './compute.js';
import { $, esc } from './dom.js';
import { call } from './engine.js';
import { numField, selectField } from './fields.js';
import { clearBad, renderForm } from './form.js';
import { renderPlan } from './plan-view.js';
import { ANGULAR, LINEAR, S, axisOf, axisOptions, axisWord, getPath, setPath } from './state.js';
import { fmtField, fmtStep, parseNumber, toShown, unitOf } from './units.js';

export const P = {
  result: null,   // last plan.Result
  key: null,      // planKey of the inputs it was made for
  nowKey: null,   // planKey of the inputs as they are
  keySeq: 0,
  running: false,
  error: null,    // {message, fields}
  started: 0,
  ticker: null,
  stash: null,    // plan block kept while "Plan a move" is off
  count: 0,
  applied: null   // key of the option last applied
};

const DRIVES = [['', 'either: show both'], ['variable_speed', 'variable-speed drive (ramps on the inverter)'],
  ['pendant', 'step-speed pendant (press and release)']];

// planKey asks the core for the key of what a plan depends on: the
// fingerprint (the core's canonical form) of everything but the motions
// (which applying an option replaces) and the describing text, so key
// order, or an optional field at zero against one left out, makes no
// difference. Inputs the core does not read are keyed by their text.
export function planKey(sc) {
  var c = JSON.parse(JSON.stringify(sc));
  ['motions', 'name', 'description', 'sheet', 'example'].forEach(function (k) { delete c[k]; });
  var text = JSON.stringify(c);
  S.keeping = (S.keeping || 0) + 1;
  return call('validate', text).then(function (r) {
    S.keeping--;
    return r.error ? 'not read: ' + text : r.result.fingerprint;
  });
}

// ------------------------------------------------------------ formatting

export function num(dq, v) { return fmtStep(dq, toShown(dq, v)); }
export function sym(dq) { return unitOf(dq).symbol; }
export function withU(dq, v) { return num(dq, v) + '\u00A0' + sym(dq); }
export function secs(v) { return fmtStep('time', v) + '\u00A0s'; }
export function deg(v) { return fmtStep('angle', v) + '\u00A0deg'; }
// siNote marks the planner's own sentences, which give figures in SI
// units, when other units are shown.
export function siNote() {
  if (unitOf('length').symbol === 'm' && unitOf('speed').symbol.indexOf('ft') < 0) return '';
  return ' <span class="small si-note">(the planner\u2019s sentences give figures in SI units)</span>';
}
// kindOf is the kind of the plan's (or a move's) axis: LINEAR or ANGULAR.
export function kindOf(r) { return axisOf(r.axis).kind; }
export function speedDQ(r) { return kindOf(r).speedQ; }
export function accelDQ(r) { return kindOf(r).accelQ; }
export function axisName(a) { return axisOf(a).label.toLowerCase(); }
export function listHTML(items, cls, mark) {
  if (!items || !items.length) return '';
  return '<ul class="' + cls + '">' + items.map(function (t) {
    return '<li>' + (mark ? '<span aria-hidden="true">' + mark + '</span> ' : '') + esc(t) + '</li>';
  }).join('') + '</ul>';
}

// ---------------------------------------------------------------- inputs

// defaultPlan starts from the scenario's first plain move when there is
// one, else from a short travel.
function defaultPlan(s) {
  var m = (s.motions || [])[0];
  var ok = function (v) { return typeof v === 'number' && v !== 0; };
  if (m && (m.profile || 'trapezoid') === 'trapezoid' && !m.shaper) {
    var K = kindOf(m);
    if (axisOf(m.axis).plan && ok(m[K.distance]) && ok(m[K.speed]) && ok(m[K.accel])) {
      var p = { axis: m.axis };
      p[K.distance] = m[K.distance]; p[K.top] = m[K.speed]; p[K.maxAccel] = m[K.accel];
      return p;
    }
  }
  return { axis: 'travel_x', distance_m: 10, top_speed_m_per_s: 0.5, max_accel_m_per_s2: 0.3 };
}

export function limitsLine(s) {
  // The limits are inputs: shown as typed (fields' format), not rounded
  // as results.
  var l = s.limits || {}, parts = [];
  var typed = function (dq, v) { return fmtField(toShown(dq, v), dq) + '\u00A0' + sym(dq); };
  if (typeof l.peak_swing_deg === 'number') parts.push('peak swing ' + fmtField(l.peak_swing_deg) + '\u00A0deg');
  if (typeof l.peak_excursion_m === 'number') parts.push('peak excursion ' + typed('length', l.peak_excursion_m));
  if (typeof l.residual_swing_deg === 'number') parts.push('residual swing ' + fmtField(l.residual_swing_deg) + '\u00A0deg');
  return '<p class="field wide plan-limits" id="plan-limits">Limits used: ' +
    (parts.length ? esc(parts.join(', ')) : 'none set yet') +
    ' \u2014 from <a href="#f-limits-peak_swing_deg">Limits from the lift plan</a>; a plan needs the residual swing and a peak swing or excursion.</p>';
}

export function inputsHTML() {
  var s = S.scenario, p = s && s.plan, h = [];
  $('planner').classList.toggle('has-plan', !!p);
  h.push('<div class="field wide"><label class="check"><input type="checkbox" id="plan-on"' + (p ? ' checked' : '') +
    '> Plan a move for this load</label></div>');
  if (p) {
    var K = kindOf(p), ax = axisOf(p.axis);
    h.push(selectField('plan.axis', 'Move to plan', axisOptions(true), p.axis));
    h.push(numField('plan.' + K.distance, axisWord(p.axis, 'distance')));
    if (ax.needs && ax.needs[0] === 'crane.radius_m') {
      h.push(numField('crane.radius_m', 'Hook radius', { id: 'f-plan-radius', hint: 'the same as the crane\u2019s hook radius' }));
    }
    h.push(numField('plan.' + K.top, axisWord(p.axis, 'top')));
    h.push(numField('plan.' + K.maxAccel, axisWord(p.axis, 'maxAccel'), K === LINEAR ? { hint: 'the drive\u2019s shortest ramp' } : undefined));
    h.push(numField('plan.rope_length_min_m', 'Shortest rope during the move', { optional: true, hint: 'blank: the rope length only' }));
    h.push(numField('plan.rope_length_max_m', 'Longest rope during the move', { optional: true }));
    h.push(selectField('plan.drive', 'Drive', DRIVES, p.drive || ''));
    if (p.drive !== 'variable_speed') h.push(listField('plan.pendant_steps_pct', 'The pendant\u2019s own speed steps'));
    h.push(limitsLine(s));
  }
  return '<div class="grid">' + h.join('') + '</div>';
}

function listField(path, label) {
  var id = 'f-' + path.replace(/[^a-z0-9_]+/gi, '-');
  var bad = S.bad[path], v = getPath(S.scenario, path);
  var text = bad ? bad.text : (Array.isArray(v) ? v.map(function (x) { return fmtField(x); }).join(', ') : '');
  return '<div class="field" data-field="' + esc(path) + '"><label for="' + id + '">' + esc(label) +
    ' <span class="opt">(optional)</span></label><div class="with-unit"><input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-list="' +
    esc(path) + '" value="' + esc(text) + '" aria-describedby="' + id + '-unit ' + id + '-hint ' + id + '-msg"><span class="pv" aria-hidden="true"></span>' +
    '<span class="unit" id="' + id + '-unit">%</span></div>' +
    '<p class="hint" id="' + id + '-hint">% of the top speed, slowest first, the last 100, for example 33, 67, 100; blank: the planner picks the steps</p>' +
    '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
}

export function onList(el) {
  var path = el.dataset.list, t = el.value.trim();
  if (t === '') {
    delete S.bad[path];
    setPath(S.scenario, path, undefined);
  } else {
    var parts = t.split(/[\s,;]+/).filter(function (x) { return x !== ''; });
    var vs = parts.map(function (x) { return parseNumber(x); });
    if (vs.some(function (v) { return !isFinite(v); })) {
      S.bad[path] = { text: el.value, message: 'Enter the steps as numbers in % of the top speed, separated by commas, for example 33, 67, 100.' };
    } else {
      delete S.bad[path];
      setPath(S.scenario, path, vs);
    }
  }
  changed();
}

export function planOnSelect(el) {
  var s = S.scenario;
  if (el.dataset.select === 'plan.drive') {
    // The crew's own pendant steps apply to a pendant only: kept aside
    // while a variable-speed drive is chosen.
    if (el.value === 'variable_speed') {
      if (s.plan.pendant_steps_pct) P.steps = s.plan.pendant_steps_pct;
      delete s.plan.pendant_steps_pct;
      clearBad('plan.pendant_steps_pct');
    } else if (P.steps && !s.plan.pendant_steps_pct) {
      s.plan.pendant_steps_pct = P.steps;
    }
    setPath(s, 'plan.drive', el.value === '' ? undefined : el.value);
    renderForm();
    changed();
    return true;
  }
  if (el.dataset.select !== 'plan.axis') return false;
  var p = s.plan, from = kindOf(p), to = axisOf(el.value).kind, needs = axisOf(el.value).needs;
  p.axis = el.value;
  if (from !== to) {
    [LINEAR, ANGULAR].forEach(function (K) { delete p[K.distance]; delete p[K.top]; delete p[K.maxAccel]; });
    p[to.distance] = to.plan[0]; p[to.top] = to.plan[1]; p[to.maxAccel] = to.plan[2];
    clearBad('plan.');
  }
  if (needs && !(getPath(s, needs[0]) > 0)) setPath(s, needs[0], needs[1]);
  renderForm();
  changed();
  return true;
}

export function planOnChange(el) {
  var s = S.scenario;
  if (el.id !== 'plan-on') return false;
  if (el.checked) {
    s.plan = P.stash || defaultPlan(s);
  } else {
    P.stash = s.plan;
    delete s.plan;
    clearBad('plan.');
  }
  renderForm();
  changed();
  renderPlan();
  return true;
}

// motionHTML shows a move the planner made (speed steps, or a shaped
// ramp) in the motions list; app.js shows the plain trapezoids.
export function motionHTML(m, i) {
  var at = 'motions[' + i + ']', F = kindOf(m);
  var sdq = F.speedQ;
  var h = '<div class="move planned" data-move="' + i + '"><div class="move-head"><h3>Move ' + (i + 1) + ': ' + esc(axisName(m.axis)) +
    (m.profile === 'steps' ? ', pendant speed steps' : ', shaped ramp') + '</h3>' +
    '<button type="button" class="small-btn" data-remove="' + i + '">Remove move ' + (i + 1) + '</button></div><div class="grid">';
  if (m.profile === 'steps') {
    h += '<div class="field wide"><table class="plain"><caption>Speed steps</caption><thead><tr><th scope="col">At</th><th scope="col">Speed</th></tr></thead><tbody>' +
      (m.steps || []).map(function (st) {
        var v = st[F.speed];
        return '<tr><td>' + secs(st.at_s) + '</td><td>' + (typeof v === 'number' ? withU(sdq, v) : '\u2014') + '</td></tr>';
      }).join('') + '</tbody></table><p class="hint">From the planner. To change the steps, plan again or edit the scenario file.</p></div>';
    h += numField(at + '.' + F.accel, 'Drive ramp, speeding up') + numField(at + '.' + F.decel, 'Drive ramp, slowing', { optional: true });
  } else {
    h += numField(at + '.start_s', 'Starts at', { optional: true }) +
      numField(at + '.' + F.distance, axisWord(m.axis, 'distance')) +
      numField(at + '.' + F.speed, axisWord(m.axis, 'speed')) +
      numField(at + '.' + F.accel, 'Acceleration') +
      numField(at + '.' + F.decel, 'Braking', { optional: true, hint: 'blank: same as acceleration' });
    if (m.shaper) {
      h += '<p class="field wide hint">Shaped by the ' + esc(String(m.shaper.kind).toUpperCase()) + ' shaper' +
        (typeof m.shaper.period_s === 'number' ? ', tuned to a sway period of ' + esc(secs(m.shaper.period_s)) : '') +
        (typeof m.shaper.second_period_s === 'number' ? ' and ' + esc(secs(m.shaper.second_period_s)) : '') + ' (from the planner).</p>';
    }
  }
  return h + '</div></div>';
}

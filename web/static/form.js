// form.js: the inputs: the form, its events and the messages at fields.

import { changed } from './compute.js';
import { renderBodyForm } from './body-form.js';
import { $, cssEsc } from './dom.js';
import { numField, section, selectField, syncPrint, textField, unitChoosers } from './fields.js';
import { inputsHTML, motionHTML, onList, planOnChange, planOnSelect } from './plan-form.js';
import { renderAll } from './results.js';
import { KINDS, S, axisOf, axisOptions, axisWord, rangeKey, setPath } from './state.js';
import { bindRopeFind, ropeFindHTML } from './rope-form.js';
import { saveUnits } from './storage.js';
import { fmtRange, parseNumber, toSI, toShown, unitOf } from './units.js';

// The forms the inputs are in, in the page's order.
const FORMS = ['form', 'body-form', 'move-form', 'plan-form', 'sheet-form', 'more-form'];

// renderForm lays the inputs out in the job's order: load and crane, the
// move, the wind on it and the lift plan's limits (the planner follows
// them); the sheet's references after the answer; rarely used inputs in
// the folded "more" (swing at the start, air drag, units shown,
// computation).
export function renderForm() {
  var s = S.scenario, h = [];
  var hook = s.load && s.load.hook;
  h.push(section('Load and crane',
    selectField('crane.kind', 'Crane', KINDS, (s.crane && s.crane.kind) || '') +
    numField('load.mass_kg', 'Load mass', { hint: hook ? 'the rigged load, without the hook block' : 'hook block and rigging included' }) +
    numField('load.rope_length_m', 'Rope length', { hint: s.load && s.load.body ? 'sheave to the hook (with a spreader: the spreader legs\u2019 length)' :
      hook ? 'sheave to the hook block\u2019s centre of mass' : 'sheave to the load\u2019s centre of mass' }) +
    ropeFindHTML() +
    numField('crane.radius_m', 'Hook radius from the slew axis', { optional: true }) +
    '<div class="field wide"><label class="check"><input type="checkbox" id="hook-on"' + (hook ? ' checked' : '') + '> Hook block and rigging as a second mass ' +
    '<span class="opt">(heavy hook block, or long slings: two sway modes)</span></label></div>' +
    (hook ? numField('load.hook.mass_kg', 'Hook block mass') +
      numField('load.hook.rigging_length_m', 'Rigging length', { hint: 'hook block to the load\u2019s centre of mass' }) : ''), 'load-card'));
  $('form').innerHTML = h.join('');
  // The rigid load (body-form.js) follows the load; then the move, the
  // wind and the limits, which the planner after them uses.
  renderBodyForm();
  h = [motionsHTML(s), section('Wind', windHTML(s.wind))];
  h.push(section('Limits from the lift plan',
    numField('limits.peak_swing_deg', 'Allowed peak swing angle', { optional: true }) +
    numField('limits.peak_excursion_m', 'Allowed peak excursion', { optional: true, hint: 'load off plumb, sideways' }) +
    numField('limits.residual_swing_deg', 'Allowed residual swing', { optional: true, hint: 'after the last move' }) +
    numField('limits.residual_excursion_m', 'Allowed swing-out after stopping', { optional: true, hint: 'load off plumb after the last move: a landing tolerance' }) +
    numField('limits.tension_factor', 'Allowed tension factor', { optional: true, hint: 'peak rope pull / static' }) +
    numField('limits.peak_tilt_deg', 'Allowed peak tilt of the load', { optional: true, hint: 'rigid load only (a point load has no tilt)' }), 'limits-card'));
  $('move-form').innerHTML = h.join('');
  $('plan-form').innerHTML = inputsHTML();
  $('sheet-form').innerHTML = section('Lift', textField('name', 'Scenario name', false, true) + textField('description', 'Description', true), 'lift-card') +
    section('Check sheet details', textField('sheet.project', 'Project') + textField('sheet.lift_reference', 'Lift reference') +
    textField('sheet.crane', 'Crane') + textField('sheet.load_description', 'Load') + textField('sheet.prepared_by', 'Prepared by') +
    textField('sheet.checked_by', 'Checked by') + textField('sheet.date', 'Date and time'), 'sheet-card');
  $('more-form').innerHTML = section('Swing at the start',
    numField('initial.swing_deg', 'Initial swing', { optional: true }) +
    numField('initial.toward_deg', 'Swing toward', { optional: true, hint: 'degrees from +x toward +y' })) +
    section('Air drag on the load',
    numField('load.drag_coefficient', 'Air drag coefficient', { optional: true, hint: 'on the speed relative to the air; usually the shape factor; blank: no damping by the air' }) +
    (s.wind ? '' : numField('load.area_m2', 'Area facing the wind', { optional: true }))) +
    section('Crane at the start', numField('crane.slew_deg', 'Slew angle at the start', { optional: true })) +
    section('Units shown', unitChoosers(), 'units-card') +
    section('Computation', selectField('settings.accuracy', 'Accuracy',
      [['', 'default'], ['tight', 'tight (slower)']], (s.settings && s.settings.accuracy) || ''));
  FORMS.forEach(function (id) {
    $(id).querySelectorAll('input[type="text"], select, textarea').forEach(syncPrint);
  });
  openMoreWhenSet(s);
  showErrors();
}

// openMoreWhenSet opens the "more" fold when a scenario sets something in
// it, so nothing that changes the answer is out of sight.
function openMoreWhenSet(s) {
  var set = function (v) { return v !== undefined && v !== null && v !== ''; };
  if (set(s.initial && s.initial.swing_deg) || set(s.load && s.load.drag_coefficient) || (!s.wind && set(s.load && s.load.area_m2)) ||
    set(s.crane && s.crane.slew_deg) || set(s.settings && s.settings.accuracy) || Object.keys(S.bad).some(inMore)) {
    $('more-fold').open = true;
  }
}
function inMore(path) { return !!document.querySelector('#more-form [data-field="' + cssEsc(path) + '"]'); }

// PROFILES are the speed profiles the move form edits (the others are
// shown by plan-form.js motionHTML); the core checks the name.
var PROFILES = [['trapezoid', 'trapezoid: ramp, run, ramp'], ['sine_ramp', 'sine ramp: smooth ramp, run, smooth ramp']];

function motionsHTML(s) {
  var mv = [];
  (s.motions || []).forEach(function (m, i) {
    var at = 'motions[' + i + ']', F = axisOf(m.axis).kind;
    var sine = m.profile === 'sine_ramp';
    if ((m.profile && m.profile !== 'trapezoid' && !sine || m.shaper)) {
      mv.push(motionHTML(m, i));
      return;
    }
    mv.push('<div class="move" data-move="' + i + '"><div class="move-head"><h3>Move ' + (i + 1) + '</h3>' +
      '<button type="button" class="small-btn" data-remove="' + i + '">Remove move ' + (i + 1) + '</button></div><div class="grid">' +
      selectField(at + '.axis', 'Axis', axisOptions(false), m.axis) +
      selectField(at + '.profile', 'Speed profile', PROFILES, m.profile || 'trapezoid', ' data-reform="1"') +
      numField(at + '.start_s', 'Starts at', { optional: true }) +
      numField(at + '.' + F.distance, axisWord(m.axis, 'distance')) +
      numField(at + '.' + F.speed, axisWord(m.axis, 'speed')) +
      numField(at + '.' + F.accel, 'Acceleration', sine ? { hint: 'the largest, half way up the ramp' } : undefined) +
      numField(at + '.' + F.decel, 'Braking', { optional: true, hint: 'blank: same as acceleration' + (sine ? '; the largest' : '') }) +
      '</div></div>');
  });
  return '<fieldset class="card wide-card" id="moves"><legend>Crane motions</legend>' + mv.join('') +
    '<button type="button" id="add-move">Add a move</button></fieldset>';
}

function windHTML(w) {
  var wb = '<div class="field"><label class="check"><input type="checkbox" id="wind-on"' + (w ? ' checked' : '') + '> Wind on the load</label></div>';
  if (!w) return wb;
  var bySpeed = w.speed_m_per_s !== undefined;
  wb += selectField('wind.mode', 'Wind given as', [['force', 'force on the load'], ['speed', 'wind speed']], bySpeed ? 'speed' : 'force', ' data-windmode="1"');
  if (bySpeed) {
    wb += numField('wind.speed_m_per_s', 'Wind speed', { dq: 'wind_speed', hint: '3-s gust at the load\u2019s height' }) +
      numField('load.area_m2', 'Area facing the wind', { optional: true }) +
      numField('wind.shape_factor', 'Shape factor', { hint: 'about 1.2 to 2 for boxes and plates' }) +
      numField('wind.air_density_kg_per_m3', 'Air density', { optional: true, hint: 'blank: 1.25 kg/m\u00B3' });
  } else {
    wb += numField('wind.force_n', 'Wind force') + numField('load.area_m2', 'Area facing the wind', { optional: true });
  }
  return wb + numField('wind.toward_deg', 'Pushes toward', { optional: true, hint: 'degrees from +x toward +y' }) +
    numField('wind.start_s', 'Starts at', { optional: true }) +
    numField('wind.duration_s', 'Lasts', { optional: true, hint: 'blank: to the end' }) +
    numField('wind.ramp_s', 'Rises over', { optional: true, hint: 'blank: a sudden gust' });
}

function onNumberInput(el) {
  var path = el.dataset.path, dq = el.dataset.dq, t = el.value;
  if (t.trim() === '') {
    delete S.bad[path];
    setPath(S.scenario, path, undefined);
  } else {
    var v = parseNumber(t);
    if (!isFinite(v)) {
      S.bad[path] = { text: t, message: 'Enter a number' + (unitOf(dq).symbol ? ' in ' + unitOf(dq).symbol : '') + ', for example 8.5.' };
    } else {
      delete S.bad[path];
      setPath(S.scenario, path, dq ? toSI(dq, v) : v);
    }
  }
  document.querySelectorAll('[data-path="' + cssEsc(path) + '"]').forEach(function (o) {
    if (o !== el) { o.value = t; syncPrint(o); }
  });
  changed();
}

function onSelect(el) {
  var path = el.dataset.select, v = el.value, s = S.scenario;
  if (planOnSelect(el)) return;
  if (el.dataset.windmode) {
    var w = s.wind;
    if (v === 'speed') { delete w.force_n; w.speed_m_per_s = 10; if (!w.shape_factor) w.shape_factor = 1.4; }
    else { delete w.speed_m_per_s; w.force_n = 1000; }
    clearBad('wind.');
    renderForm();
    changed();
    return;
  }
  var m = /^motions\[(\d+)\]\.axis$/.exec(path);
  if (m) {
    var mo = s.motions[Number(m[1])], from = axisOf(mo.axis).kind, to = axisOf(v).kind;
    mo.axis = v;
    if (from !== to) {
      ['distance', 'speed', 'accel', 'decel'].forEach(function (k) { delete mo[from[k]]; });
      mo[to.distance] = to.move[0]; mo[to.speed] = to.move[1]; mo[to.accel] = to.move[2];
      clearBad('motions[' + m[1] + ']');
    }
    renderForm();
    changed();
    return;
  }
  setPath(s, path, v === '' ? undefined : v);
  if (el.dataset.reform) renderForm(); // the profile's hints
  changed();
}

export function clearBad(prefix) {
  Object.keys(S.bad).forEach(function (k) { if (k.indexOf(prefix) === 0) delete S.bad[k]; });
}

export function bindForm() {
  FORMS.forEach(function (id) { bindOne($(id)); });
  bindRopeFind();
}

export function bindOne(f) {
  f.addEventListener('input', function (e) {
    var el = e.target;
    syncPrint(el);
    if (el.dataset.path) onNumberInput(el);
    else if (el.dataset.list) onList(el);
    else if (el.dataset.text) { setPath(S.scenario, el.dataset.text, el.value === '' ? undefined : el.value); changed(); }
  });
  f.addEventListener('change', function (e) {
    var el = e.target;
    syncPrint(el);
    if (el.dataset.select) onSelect(el);
    else if (el.dataset.unit) { S.chosen[el.dataset.unit] = el.value; saveUnits(); renderAll(); }
    else if (el.id === 'hook-on') {
      if (el.checked) S.scenario.load.hook = S.hookStash || { mass_kg: 500, rigging_length_m: 3 };
      else { S.hookStash = S.scenario.load.hook; delete S.scenario.load.hook; clearBad('load.hook.'); }
      renderForm();
      changed();
    } else if (planOnChange(el)) {
      return;
    } else if (el.id === 'wind-on') {
      if (el.checked) S.scenario.wind = S.windStash || { force_n: 1000 };
      else { S.windStash = S.scenario.wind; delete S.scenario.wind; clearBad('wind.'); }
      renderForm();
      changed();
    }
  });
  f.addEventListener('click', function (e) {
    var el = e.target;
    if (el.closest && el.closest('#plan-form')) return;
    if (el.id === 'add-move') {
      var ms = S.scenario.motions || (S.scenario.motions = []);
      var last = ms[ms.length - 1];
      ms.push({ axis: 'travel_x', profile: 'trapezoid', start_s: last ? endGuess() : 0, distance_m: 10, speed_m_per_s: 0.5, accel_m_per_s2: 0.25 });
      renderForm();
      changed();
      var inputs = document.querySelectorAll('[data-move="' + (ms.length - 1) + '"] input');
      if (inputs.length) inputs[0].focus();
    } else if (el.dataset.remove !== undefined) {
      var i = Number(el.dataset.remove);
      S.scenario.motions.splice(i, 1);
      clearBad('motions[');
      renderForm();
      changed();
    }
  });
  f.addEventListener('submit', function (e) { e.preventDefault(); });
}

// endGuess is where a new move starts by default: when the core's last
// result says the motions end (the page computes no timing itself).
function endGuess() { return S.result ? Number(S.result.motion_end_s.toPrecision(6)) : 0; }

// --------------------------------------------------------------- errors

export function showErrors() {
  // The rope-length fold (rope-form.js) keeps its own messages.
  document.querySelectorAll('.field .msg').forEach(function (p) { if (!p.closest('#rope-find')) p.textContent = ''; });
  document.querySelectorAll('[aria-invalid]').forEach(function (el) { if (!el.closest('#rope-find')) el.removeAttribute('aria-invalid'); });
  var general = [];
  function put(path, msg) {
    var boxes = document.querySelectorAll('[data-field="' + cssEsc(path) + '"]');
    // A list's item (plan.pendant_steps_pct[2]) is shown at the list.
    if (!boxes.length) boxes = document.querySelectorAll('[data-field="' + cssEsc(path.replace(/\[\d+\]$/, '')) + '"]');
    if (!boxes.length) { general.push(path === '(inputs)' ? msg : path + ': ' + msg); return; }
    boxes.forEach(function (box) {
      var p = box.querySelector('.msg');
      p.textContent = (p.textContent ? p.textContent + ' ' : '') + '\u2716 ' + msg;
      var inp = box.querySelector('input,select,textarea');
      if (inp) inp.setAttribute('aria-invalid', 'true');
      // A message is never left in the closed "more" fold.
      if (box.closest('#more-fold')) $('more-fold').open = true;
    });
  }
  Object.keys(S.bad).forEach(function (p) { put(p, S.bad[p].message); });
  S.coreErrors.forEach(function (fe) {
    if (S.bad[fe.field]) return;
    put(fe.field, shownMessage(fe));
  });
  var g = $('general-error');
  g.hidden = general.length === 0;
  g.textContent = general.length ? '\u2716 ' + general.join(' ') : '';
}

// shownMessage is the core's message; when the field is shown in
// another unit than the core's, the accepted range is added in that unit.
function shownMessage(fe) {
  var r = S.ranges[rangeKey(fe.field)];
  var el = document.querySelector('[data-path="' + cssEsc(fe.field) + '"]');
  var msg = fe.message.replace(/^is required/, 'required');
  msg = msg.charAt(0).toUpperCase() + msg.slice(1);
  if (!r || !el || !el.dataset.dq) return msg;
  var u = unitOf(el.dataset.dq);
  if (u.to_si === 1 && u.symbol === r.unit) return msg;
  var lo = toShown(el.dataset.dq, r.min), hi = toShown(el.dataset.dq, r.max);
  var accepted = 'accepted ' + (r.open_min ? 'above ' : 'from ') + fmtRange(lo, 'min') + ' up to ' + fmtRange(hi, 'max') + ' ' + u.symbol;
  if (/ is out of range: /.test(fe.message)) {
    return el.value.trim() + ' ' + u.symbol + ' is out of range: ' + accepted + ' (' + r.text.replace(/^accepted /, '') + ').';
  }
  return msg.replace(/\.?$/, '.') + ' In ' + u.symbol + ': ' + accepted + '.';
}

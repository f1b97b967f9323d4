// rope-form.js: "Find the rope length", a fold beside the rope length
// field for a crew at the work face: from heights read off the crane, or
// from a timed swing (full swings counted, the seconds, the rough swing
// size). It only collects and shows: the core's "ropelength" call
// (core/ropelength, through the worker) answers, with the large-swing
// correction and, for a hook block or a rigid load, the effective length
// the tool shapes for; the core's field messages are shown at these
// fields, in the units shown. "Use this length" puts the answer into the
// rope length field (typing there changes it again). What the crew typed
// here is kept in this browser (ROPE_KEY), like the inputs.

import { changed } from './compute.js';
import { $, cssEsc, esc, notice } from './dom.js';
import { call } from './engine.js';
import { renderForm } from './form.js';
import { S, setPath } from './state.js';
import { fmtField, fmtRange, fmtStep, parseNumber, toSI, toShown, unitOf } from './units.js';

const ROPE_KEY = 'swaysheet.ropefind.v1';

// RF is the fold's state: open or not, the way chosen, the values typed
// (SI, by the call's JSON path), text that is not a number (as typed),
// the call's accepted ranges, and the core's reply with its question.
const RF = { open: false, way: 'heights', v: {}, bad: {}, ranges: null, asking: 0, timer: null, asked: undefined, reply: null, count: 0 };

// ROPE_FIELDS: [JSON path, label, hint, optional] for each way.
const ROPE_FIELDS = {
  heights: [
    ['heights.sheave_height_m', 'Height of the sheave or jib tip', 'where the rope hangs from'],
    ['heights.hook_height_m', 'Height of the hook', 'from the same level as the sheave'],
    ['heights.sling_depth_m', 'Hook down to the lifting points', 'slings, shackles, spreader', true],
    ['heights.centre_depth_m', 'Lifting points down to the load\u2019s centre', 'blank: 0', true]
  ],
  timed: [
    ['timed.swings', 'Full swings counted', 'there and back is one swing'],
    ['timed.time_s', 'Seconds they took', 'from the stopwatch']
  ]
};
// ROPE_SIZES: the rough swing sizes offered (rope angle either side of
// straight down, deg); 0 is a small swing, above 30 the core says it is
// outside what the tool is for.
const ROPE_SIZES = [[0, 'small: under 5\u00B0 either side'], [10, 'about 10\u00B0 either side'], [20, 'about 20\u00B0 either side'],
  [30, 'about 30\u00B0 either side'], [40, 'more than 30\u00B0']];

function ropeRestore() {
  try {
    var o = JSON.parse(window.localStorage.getItem(ROPE_KEY) || 'null');
    if (!o || typeof o !== 'object') return;
    RF.open = o.open === true;
    RF.way = o.way === 'timed' ? 'timed' : 'heights';
    Object.keys(o.v || {}).forEach(function (k) { if (typeof o.v[k] === 'number' && isFinite(o.v[k])) RF.v[k] = o.v[k]; });
    Object.keys(o.bad || {}).forEach(function (k) { if (typeof o.bad[k] === 'string') RF.bad[k] = o.bad[k]; });
  } catch (e) { /* nothing kept */ }
}
function ropeKeep() {
  try { window.localStorage.setItem(ROPE_KEY, JSON.stringify({ open: RF.open, way: RF.way, v: RF.v, bad: RF.bad })); } catch (e) { /* not kept */ }
}

// ropeModel is how the scenario hangs the load: a rigid load, a hook
// block and load as two masses, or a point load on one rope.
function ropeModel() {
  var l = (S.scenario && S.scenario.load) || {};
  return l.body ? 'rigid' : l.hook ? 'hook' : 'one';
}
const ROPE_TO = {
  one: 'from the sheave to the load\u2019s centre of mass',
  hook: 'from the sheave to the hook block',
  rigid: 'from the sheave to the hook (with a spreader: the spreader legs\u2019 length)'
};

// ropeShownFields are the fields of the way chosen; with a hook block or
// a rigid load the depths below the hook come from the inputs above.
function ropeShownFields() {
  return ROPE_FIELDS[RF.way].filter(function (f) { return !f[3] || ropeModel() === 'one'; });
}

function ropeId(key) { return 'rf-' + key.replace(/[^a-z0-9_]+/gi, '-'); }
function ropeDQ(key) { var r = RF.ranges && RF.ranges[key]; return r ? r.quantity : ''; }
function ropeLen(v) { return fmtStep('length', toShown('length', v)) + ' ' + unitOf('length').symbol; }
function ropeSecs(v) { return fmtStep('time', v) + ' s'; }

function ropeFieldHTML(f) {
  var key = f[0], id = ropeId(key), dq = ropeDQ(key), r = (RF.ranges && RF.ranges[key]) || {};
  var sym = dq ? unitOf(dq).symbol : (r.unit || '');
  var text = RF.bad[key] !== undefined ? RF.bad[key] : typeof RF.v[key] === 'number' ? fmtField(dq ? toShown(dq, RF.v[key]) : RF.v[key], dq) : '';
  var hint = f[2];
  if (r.text !== undefined) {
    var lo = dq ? toShown(dq, r.min) : r.min, hi = dq ? toShown(dq, r.max) : r.max;
    hint += '; ' + (r.open_min ? 'above ' : '') + fmtRange(lo, 'min') + ' to ' + fmtRange(hi, 'max') + (sym ? ' ' + sym : '');
  }
  return '<div class="field" data-rope-field="' + esc(key) + '"><label for="' + id + '">' + esc(f[1]) + (f[3] ? ' <span class="opt">(optional)</span>' : '') + '</label>' +
    '<div class="with-unit"><input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-rope="' + esc(key) + '" data-dq="' + esc(dq) + '" value="' + esc(text) +
    '" aria-describedby="' + id + '-unit ' + id + '-hint ' + id + '-msg"><span class="unit" id="' + id + '-unit">' + esc(sym || '\u00A0') + '</span></div>' +
    '<p class="hint" id="' + id + '-hint">' + esc(hint) + '</p><p class="msg" id="' + id + '-msg" role="alert"></p></div>';
}

function ropeSizeHTML() {
  var a = RF.v['timed.amplitude_deg'] || 0;
  return '<div class="field" data-rope-field="timed.amplitude_deg"><label for="rf-size">Rough swing size</label>' +
    '<select id="rf-size" data-ropesize="1" aria-describedby="rf-size-hint rf-size-msg">' + ROPE_SIZES.map(function (s) {
      return '<option value="' + s[0] + '"' + (s[0] === a ? ' selected' : '') + '>' + esc(s[1]) + '</option>';
    }).join('') + '</select><p class="hint" id="rf-size-hint">the rope\u2019s angle from straight down at the ends</p>' +
    '<p class="msg" id="rf-size-msg" role="alert"></p></div>';
}

// ropeFindHTML is the fold, for form.js to put after the rope length
// field; the answer shown is the last one (asked again when the question
// changed).
export function ropeFindHTML() {
  setTimeout(ropeAsk, 0);
  return '<details class="field wide rope-find" id="rope-find"' + (RF.open ? ' open' : '') + '><summary>Find the rope length ' +
    '<span class="opt">from heights, or by timing a swing</span></summary><div id="rope-body">' + ropeBodyHTML() + '</div></details>';
}

// ropeBodyHTML is the fold's inside; nothing while it is closed, so that
// no input is hidden in it.
function ropeBodyHTML() {
  if (!RF.open) return '';
  var way = function (v, label) {
    return '<label class="check"><input type="radio" name="rope-way" value="' + v + '" data-ropeway="1"' + (RF.way === v ? ' checked' : '') + '> ' + label + '</label>';
  };
  return '<fieldset class="rope-way"><legend>How</legend>' + way('heights', 'From heights') + way('timed', 'Time a swing') + '</fieldset>' +
    '<p class="hint">The rope length found runs ' + esc(ROPE_TO[ropeModel()]) + ', as in the rope length field.</p>' +
    '<div class="grid">' + ropeShownFields().map(ropeFieldHTML).join('') + (RF.way === 'timed' ? ropeSizeHTML() : '') + '</div>' +
    '<div id="rope-out" aria-live="polite">' + ropeOutHTML() + '</div>' +
    '<ul class="rope-cautions small">' +
    '<li>Time at least 5 full swings, ten where you can (there and back is one), starting and stopping the watch as the load passes the same end.</li>' +
    '<li>Time with the crane still, the load just clear of the ground and no wind; keep the swing small.</li>' +
    '<li>Read every height from the same level (the ground, or the crane\u2019s height indicator).</li>' +
    '<li>The answer is an estimate from a simplified model; the lift plan and the person in charge of the lift decide.</li></ul>';
}

// ropeQuestion is the call's input for what is typed, '' when nothing is
// typed for the way chosen, null when a text is not a number.
function ropeQuestion() {
  var keys = ropeShownFields().map(function (f) { return f[0]; });
  if (keys.some(function (k) { return RF.bad[k] !== undefined; })) return null;
  if (!keys.some(function (k) { return RF.v[k] !== undefined; })) return '';
  var q = {};
  keys.forEach(function (k) { if (RF.v[k] !== undefined) setPath(q, k, RF.v[k]); });
  if (RF.way === 'heights') q.heights = q.heights || {};
  else { q.timed = q.timed || {}; q.timed.amplitude_deg = RF.v['timed.amplitude_deg'] || 0; }
  var l = (S.scenario && S.scenario.load) || {};
  if (l.body) q.load = { mass_kg: l.mass_kg, body: l.body };
  else if (l.hook) q.hook = { mass_kg: l.hook.mass_kg, load_mass_kg: l.mass_kg, rigging_length_m: l.hook.rigging_length_m };
  return JSON.stringify(q);
}

// (A closed fold asks nothing: opening it asks at once, bindRopeFind. So
// a keystroke in the load's fields sets no timer then.)
function ropeAskSoon() {
  if (!RF.open && !RF.timer) return;
  clearTimeout(RF.timer);
  RF.timer = setTimeout(function () { RF.timer = null; ropeAsk(); }, 120);
}

// ropeAsk asks the core when the fold is open and the question changed.
function ropeAsk() {
  if (!RF.open || !$('rope-find')) return;
  var q = ropeQuestion();
  if (q === RF.asked) return;
  RF.asked = q;
  if (!q) { RF.reply = null; ropeShow(); return; }
  RF.asking++;
  ropeShow();
  call('ropelength', q).then(function (r) {
    RF.asking--;
    if (q !== RF.asked) return;
    // A stopped engine has not answered: the next change asks again.
    if (r.error && r.error.stopped) RF.asked = undefined;
    RF.reply = r;
    RF.count++;
    ropeShow();
  });
}

// ropeOutHTML is the answer, the core's message, or what to type.
function ropeOutHTML() {
  var q = ropeQuestion(), r = RF.reply;
  if (q === null) return '<p class="waiting">\u2716 No rope length yet: correct the marked field.</p>';
  if (q === '') {
    return '<p class="waiting">' + (RF.way === 'heights' ? 'Type the heights read off the crane.' : 'Count the full swings, time them and pick the swing size.') + '</p>';
  }
  if (RF.asking) return '<p class="waiting">Working it out\u2026</p>';
  if (r && r.error && r.error.stopped) return '<p class="waiting">\u2716 ' + esc(r.error.message) + ' Change a value to ask again.</p>';
  if (!r || RF.asked !== q) return '<p class="waiting">Working it out\u2026</p>';
  if (r.error) {
    var other = ropeErrors().filter(function (fe) { return !ropeBox(fe.field); });
    return '<p class="waiting">\u2716 No rope length yet: ' + (other.length ? esc(other.map(ropeGeneral).join(' ')) : 'correct the marked field.') + '</p>';
  }
  var a = r.result, m = ropeModel(), h = a.from_heights, t = a.from_timed, lines = [];
  if (t) {
    lines.push('One full swing took ' + ropeSecs(t.period_s) + '.');
    lines.push(t.amplitude_factor > 1 ?
      'Correction for the swing size: a small swing would take ' + ropeSecs(t.small_swing_period_s) + ' (yours is ' +
      (100 * (t.amplitude_factor - 1)).toFixed(1) + ' % slower); the length is from the small swing.' :
      'A small swing: no correction for the swing size.');
    lines.push('With the stopwatch off by ' + ropeSecs(t.timing_error_s) + ': ' + ropeLen(t.range_m[0]) + ' to ' + ropeLen(t.range_m[1]) + '.');
    if (RF.v['timed.swings'] < 5) lines.push('\u26A0 Only ' + RF.v['timed.swings'] + ' swings timed: time at least 5 for a steadier figure.');
  }
  if (h) lines.push('A timed small swing should take ' + ropeSecs(h.small_swing_period_s) + ' for one full swing: time one to check.');
  if (m !== 'one') {
    lines.push('Effective length the tool shapes for: ' + ropeLen((t || h).effective_length_m) +
      ' (one rope with the same swing time; the planner uses it, you need not type it).');
    lines.push((m === 'hook' ? 'Rigging, hook block to the load\u2019s centre: ' : 'The load\u2019s centre below the hook: ') + ropeLen(a.rigging_length_m) + '.');
  }
  (a.notes || []).forEach(function (n) { lines.push('\u26A0 ' + n); });
  return '<p class="rope-answer">Rope length: <b id="rope-length">' + esc(ropeLen(a.rope_length_m)) + '</b> <span class="hint">(' + esc(ROPE_TO[m]) + ')</span></p>' +
    '<ul class="rope-lines">' + lines.map(function (l) { return '<li>' + esc(l) + '</li>'; }).join('') + '</ul>' +
    '<button type="button" id="rope-use">Use this length</button>';
}

function ropeErrors() {
  var r = RF.reply;
  if (!r || !r.error || RF.asked !== ropeQuestion()) return [];
  return r.error.fields && r.error.fields.length ? r.error.fields : [{ field: '(input)', message: r.error.message }];
}
function ropeBox(field) { return document.querySelector('#rope-find [data-rope-field="' + cssEsc(field) + '"]'); }

// ropeGeneral words a message about something outside the fold: the
// load's inputs above (hook.mass_kg is load.hook.mass_kg there).
function ropeGeneral(fe) {
  var at = { 'hook.mass_kg': 'load.hook.mass_kg', 'hook.load_mass_kg': 'load.mass_kg', 'hook.rigging_length_m': 'load.hook.rigging_length_m' }[fe.field] || fe.field;
  return (at === '(input)' || at === 'heights' || at === 'timed' ? '' : at + ': ') + ropeUnits(fe.message) + '.';
}

// ropeUnits puts the lengths of a core message (in m) into the length
// unit shown, with the core's factor: a range "from a up to b m", a pair
// "a to b m" (both ends are lengths), a single "a m". (The core's
// ropelength messages are plain text; marked quantities, as core/words
// gives the other sentences, would make this pattern-matching go.)
function ropeUnits(msg) {
  var u = unitOf('length');
  if (u.symbol === 'm') return msg;
  var num = function (t) { return Number(t); };
  return msg.replace(/(from|above) (-?[\d.]+(?:e[-+]?\d+)?) up to (-?[\d.]+(?:e[-+]?\d+)?) m\b/g, function (all, w, lo, hi) {
    return w + ' ' + fmtRange(toShown('length', num(lo)), 'min') + ' up to ' + fmtRange(toShown('length', num(hi)), 'max') + ' ' + u.symbol;
  }).replace(/(-?\d[\d.]*(?:e[-+]?\d+)?) to (-?\d[\d.]*(?:e[-+]?\d+)?) m\b/g, function (all, lo, hi) {
    return fmtRange(toShown('length', num(lo))) + ' to ' + fmtRange(toShown('length', num(hi))) + ' ' + u.symbol;
  }).replace(/(-?\d[\d.]*(?:e[-+]?\d+)?) m\b/g, function (all, v) {
    return fmtRange(toShown('length', num(v))) + ' ' + u.symbol;
  });
}

// ropeShow puts the answer and the messages at the fields.
function ropeShow() {
  var out = $('rope-out');
  if (!out) return;
  out.innerHTML = ropeOutHTML();
  document.querySelectorAll('#rope-find .msg').forEach(function (p) { p.textContent = ''; });
  document.querySelectorAll('#rope-find [aria-invalid]').forEach(function (el) { el.removeAttribute('aria-invalid'); });
  var put = function (field, msg) {
    var box = ropeBox(field);
    if (!box) return;
    var p = box.querySelector('.msg'), inp = box.querySelector('input,select');
    p.textContent = (p.textContent ? p.textContent + ' ' : '') + '\u2716 ' + msg;
    if (inp) inp.setAttribute('aria-invalid', 'true');
  };
  Object.keys(RF.bad).forEach(function (k) {
    var sym = unitOf(ropeDQ(k)).symbol;
    put(k, 'Enter a number' + (ropeDQ(k) && sym ? ' in ' + sym : '') + ', for example 8.5.');
  });
  ropeErrors().forEach(function (fe) {
    if (RF.bad[fe.field] !== undefined) return;
    var msg = fe.message.replace(/^is required/, 'required'), dq = ropeDQ(fe.field), el = $(ropeId(fe.field));
    if (dq === 'length' && el && / is out of range: /.test(msg) && unitOf('length').symbol !== 'm') {
      msg = el.value.trim() + ' ' + unitOf('length').symbol + ' is out of range: ' + ropeUnits(msg.replace(/^.* is out of range: /, ''));
    } else {
      msg = ropeUnits(msg);
    }
    put(fe.field, msg.charAt(0).toUpperCase() + msg.slice(1));
  });
}

// ropeUse puts the answer, as shown, into the rope length field.
function ropeUse() {
  var a = RF.reply && RF.reply.result;
  if (!a) return;
  var load = S.scenario.load || (S.scenario.load = {}), was = load.rope_length_m;
  load.rope_length_m = toSI('length', Number(fmtStep('length', toShown('length', a.rope_length_m))));
  delete S.bad['load.rope_length_m'];
  renderForm();
  changed();
  notice('Rope length set to ' + ropeLen(load.rope_length_m) + (typeof was === 'number' ? ' (it was ' + ropeLen(was) + ')' : '') +
    ': type in the rope length field to change it.');
}

function ropeInput(el) {
  var key = el.dataset.rope, dq = el.dataset.dq, t = el.value;
  delete RF.bad[key];
  delete RF.v[key];
  if (t.trim() !== '') {
    var v = parseNumber(t);
    if (isFinite(v)) RF.v[key] = dq ? toSI(dq, v) : v;
    else RF.bad[key] = t;
  }
  ropeKeep();
  ropeShow();
  ropeAskSoon();
}

// bindRopeFind listens on the load's form (the fold is in it) and asks
// again when the load's inputs change (a hook block's or a rigid load's
// masses and lengths are part of the question).
export function bindRopeFind() {
  var f = $('form');
  f.addEventListener('input', function (e) { if (e.target.dataset.rope) ropeInput(e.target); else ropeAskSoon(); });
  f.addEventListener('change', function (e) {
    var el = e.target;
    if (el.dataset.ropeway) {
      RF.way = el.value;
      ropeKeep();
      $('rope-body').innerHTML = ropeBodyHTML();
      ropeAskSoon();
      var r = document.querySelector('#rope-find input[data-ropeway]:checked');
      if (r) r.focus();
    } else if (el.dataset.ropesize) {
      RF.v['timed.amplitude_deg'] = Number(el.value);
      ropeKeep();
      ropeAskSoon();
    }
  });
  f.addEventListener('toggle', function (e) {
    if (e.target.id !== 'rope-find' || RF.open === e.target.open) return;
    RF.open = e.target.open;
    ropeKeep();
    $('rope-body').innerHTML = ropeBodyHTML();
    ropeAsk();
    ropeShow();
  }, true);
  f.addEventListener('click', function (e) { if (e.target.id === 'rope-use') ropeUse(); });
  var b = $('body-form');
  b.addEventListener('input', ropeAskSoon);
  // The rigid load ticked or hung otherwise: the rope length field's words
  // and the fold's fields follow.
  b.addEventListener('change', function (e) { if (e.target.id === 'body-on' || e.target.dataset.bodyhung) setTimeout(renderForm, 0); });
  call('ropelength_ranges').then(function (r) {
    if (r.error) return;
    RF.ranges = r.result;
    var d = $('rope-body');
    if (d && !d.contains(document.activeElement)) { d.innerHTML = ropeBodyHTML(); ropeShow(); }
  });
}

ropeRestore();

// For the browser tests: the fold is answered for what is typed.
window.swaysheetRope = {
  answered: function () { return !RF.timer && !RF.asking && (!RF.open || RF.asked === ropeQuestion()); },
  count: function () { return RF.count; }
};

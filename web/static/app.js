// app.js: the swaysheet page. It shows and collects; every figure comes
// from the core (Go compiled to wasm, run in worker.js) and every unit
// factor from the core's unit table (core/units, through the "units" call).
(function () {
  'use strict';

  var $ = function (id) { return document.getElementById(id); };
  var esc = window.SwayPlot.escape;

  // ---------------------------------------------------------------- worker

  var worker = null, nextId = 1, waiting = {}, restarts = [];

  function startWorker() {
    worker = new Worker(window.swaysheetWorkerURL || 'worker.js');
    worker.onmessage = function (e) {
      var m = e.data;
      if (m.id === 0) { engineStopped(JSON.parse(m.out).error.message); return; }
      var w = waiting[m.id];
      delete waiting[m.id];
      if (w) w(JSON.parse(m.out));
    };
    worker.onerror = function (e) {
      if (e.preventDefault) e.preventDefault();
      engineStopped('The calculation engine failed: ' + (e.message || 'unknown error') + '.');
    };
  }

  // engineStopped answers every call still waiting with an error, and
  // starts a fresh engine (at most three times a minute; after that the
  // page asks for a reload). The inputs, results and saved scenarios stay.
  function engineStopped(msg) {
    var pending = waiting;
    waiting = {};
    Object.keys(pending).forEach(function (id) {
      pending[id]({ error: { message: msg + ' The calculation was not finished.', fields: [] } });
    });
    try { worker.terminate(); } catch (e) { /* already gone */ }
    var now = Date.now();
    restarts = restarts.filter(function (t) { return now - t < 60000; });
    if (restarts.length >= 3) {
      engineError(msg + ' It stopped again; reload the page (your inputs and saved scenarios are kept).');
      return;
    }
    restarts.push(now);
    startWorker();
    notice('\u26A0 ' + msg + ' It has been restarted; the results are computed again.');
    setTimeout(function () { if (typeof evaluate === 'function') evaluate(); }, 0);
  }

  // call runs a core call; it resolves to {result} or {error}.
  function call(name, input) {
    return new Promise(function (resolve) {
      var id = nextId++;
      waiting[id] = resolve;
      worker.postMessage({ id: id, name: name, input: input === undefined ? '' : input });
    });
  }

  function engineError(msg) {
    var b = $('engine-error');
    b.textContent = msg;
    b.hidden = false;
  }

  // ----------------------------------------------------------------- state

  var S = {
    scenario: null,     // the scenario object, in the file's own SI format
    table: null,        // core/units table
    ranges: null,       // core/scenario ranges by key
    examples: null,
    sys: 'si',
    chosen: {},         // display quantity -> unit symbol
    bad: {},            // field path -> page-side message (text that is not a number)
    coreErrors: [],     // field errors from the core for the current inputs
    result: null,       // last valid result
    count: 0,
    windStash: null
  };

  // Display quantities: the core's quantities plus wind speed, which is a
  // speed shown in its own units.
  var DISPLAY = {
    wind_speed: { base: 'speed', si: 'm/s', us: 'ft/s', label: 'wind speed' }
  };
  var SHOWN_QUANTITIES = ['length', 'mass', 'speed', 'acceleration', 'angular_speed', 'angular_acceleration', 'force', 'area', 'wind_speed'];

  function baseOf(dq) { return DISPLAY[dq] ? DISPLAY[dq].base : dq; }

  function unitOf(dq) {
    var q = S.table.quantities[baseOf(dq)];
    if (!q) return { symbol: '', to_si: 1 };
    var sym = S.chosen[dq];
    for (var i = 0; i < q.units.length; i++) if (q.units[i].symbol === sym) return q.units[i];
    return q.units[0];
  }

  function defaultsFor(sys) {
    var c = {};
    Object.keys(S.table.quantities).forEach(function (k) {
      var q = S.table.quantities[k];
      c[k] = sys === 'us' ? q.us_default : q.si_default;
    });
    Object.keys(DISPLAY).forEach(function (k) { c[k] = DISPLAY[k][sys]; });
    return c;
  }

  // toShown and toSI convert with the core's factors: SI = shown * to_si.
  function toShown(dq, v) { return v / unitOf(dq).to_si; }
  function toSI(dq, v) { return v * unitOf(dq).to_si; }

  // Field values: 10 significant digits (the scenario keeps the full
  // value in SI, so SI -> US -> SI shows the number typed); results: 4.
  function fmtField(v) { return Number(v.toPrecision(10)).toString(); }
  // Range bounds: 6 significant digits, so a bound is not rounded past
  // itself (10 m/s is 1968.5 ft/min, not 1969).
  function fmtRange(v) { return Number(v.toPrecision(6)).toString(); }
  function fmtRes(v) {
    if (!isFinite(v)) return '\u2014';
    return Number(v.toPrecision(4)).toString();
  }

  // ------------------------------------------------------------ path utils

  function parsePath(p) {
    var out = [];
    p.split('.').forEach(function (part) {
      var m = /^([a-z_0-9]+)(?:\[(\d+)\])?$/.exec(part);
      if (!m) throw new Error('bad path ' + p);
      out.push(m[1]);
      if (m[2] !== undefined) out.push(Number(m[2]));
    });
    return out;
  }
  function getPath(obj, p) {
    var ks = parsePath(p);
    for (var i = 0; i < ks.length; i++) {
      if (obj == null) return undefined;
      obj = obj[ks[i]];
    }
    return obj;
  }
  function setPath(obj, p, v) {
    var ks = parsePath(p);
    for (var i = 0; i < ks.length - 1; i++) {
      if (obj[ks[i]] == null || typeof obj[ks[i]] !== 'object') obj[ks[i]] = {};
      obj = obj[ks[i]];
    }
    if (v === undefined) delete obj[ks[ks.length - 1]];
    else obj[ks[ks.length - 1]] = v;
  }
  function rangeKey(p) { return p.replace(/\[\d+\]/g, '[]'); }
  function fieldId(p) { return 'f-' + p.replace(/[^a-z0-9_]+/gi, '-').replace(/-$/, ''); }

  // ------------------------------------------------------------------ form

  var AXES = [
    ['travel_x', 'Travel x'],
    ['travel_y', 'Travel y'],
    ['slew', 'Slew'],
    ['radius', 'Trolley on jib (radius)'],
    ['hoist', 'Hoist (up +)']
  ];
  var KINDS = [['', 'not given'], ['overhead', 'overhead crane'], ['gantry', 'gantry crane'], ['tower', 'tower crane'],
    ['slewing', 'slewing (mobile or crawler) crane'], ['monorail', 'monorail hoist']];
  var LINEAR = { distance: 'distance_m', speed: 'speed_m_per_s', accel: 'accel_m_per_s2', decel: 'decel_m_per_s2' };
  var ANGULAR = { distance: 'angle_deg', speed: 'rate_deg_per_s', accel: 'accel_deg_per_s2', decel: 'decel_deg_per_s2' };

  // PV follows each control: a plain-text copy of its value for paper,
  // where a text box would cut long text (filled in by syncPrint).
  var PV = '<span class="pv" aria-hidden="true"></span>';

  function syncPrint(el) {
    var pv = el.nextElementSibling;
    if (!pv || !pv.classList.contains('pv')) return;
    pv.textContent = el.tagName === 'SELECT' ? (el.selectedOptions[0] ? el.selectedOptions[0].textContent : '') : el.value;
  }

  // numField describes one number input bound to a scenario path.
  function numField(path, label, opts) {
    opts = opts || {};
    var r = S.ranges[rangeKey(path)] || {};
    var dq = opts.dq || r.quantity || '';
    var u = dq ? unitOf(dq) : { symbol: r.unit || '', to_si: 1 };
    var v = getPath(S.scenario, path);
    var text = '';
    if (S.bad[path] !== undefined) text = S.bad[path].text;
    else if (typeof v === 'number') text = fmtField(dq ? toShown(dq, v) : v);
    var hint = '';
    if (r.text !== undefined) {
      var lo = dq ? toShown(dq, r.min) : r.min, hi = dq ? toShown(dq, r.max) : r.max;
      hint = (r.open_min ? 'above ' : '') + fmtRange(lo) + ' to ' + fmtRange(hi) + (u.symbol ? ' ' + u.symbol : '');
    }
    if (opts.hint) hint = opts.hint + (hint ? '; ' + hint : '');
    var id = opts.id || fieldId(path);
    return '<div class="field" data-field="' + esc(path) + '">' +
      '<label for="' + id + '">' + esc(label) + (opts.optional ? ' <span class="opt">(optional)</span>' : '') + '</label>' +
      '<div class="with-unit"><input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-path="' + esc(path) + '" data-dq="' + esc(dq) + '"' +
      (opts.optional ? ' data-optional="1"' : '') + ' value="' + esc(text) + '" aria-describedby="' + id + '-hint ' + id + '-msg">' + PV +
      '<span class="unit" aria-label="unit">' + esc(u.symbol || '\u00A0') + '</span></div>' +
      '<p class="hint" id="' + id + '-hint">' + esc(hint) + '</p>' +
      '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
  }

  function selectField(path, label, options, value, extra) {
    var id = fieldId(path);
    return '<div class="field" data-field="' + esc(path) + '"><label for="' + id + '">' + esc(label) + '</label>' +
      '<select id="' + id + '" data-select="' + esc(path) + '"' + (extra || '') + '>' +
      options.map(function (o) {
        return '<option value="' + esc(o[0]) + '"' + (o[0] === value ? ' selected' : '') + '>' + esc(o[1]) + '</option>';
      }).join('') + '</select>' + PV + '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
  }

  function textField(path, label, multiline, wide) {
    var id = fieldId(path), v = getPath(S.scenario, path) || '';
    var input = multiline ?
      '<textarea id="' + id + '" data-text="' + esc(path) + '" rows="3">' + esc(v) + '</textarea>' :
      '<input id="' + id + '" type="text" data-text="' + esc(path) + '" value="' + esc(v) + '">';
    return '<div class="field' + (multiline || wide ? ' wide' : '') + '" data-field="' + esc(path) + '"><label for="' + id + '">' + esc(label) + '</label>' + input + PV +
      '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
  }

  function section(title, body, id) {
    return '<fieldset class="card"' + (id ? ' id="' + id + '"' : '') + '><legend>' + esc(title) + '</legend><div class="grid">' + body + '</div></fieldset>';
  }

  function renderForm() {
    var s = S.scenario, h = [];
    h.push(section('Lift', textField('name', 'Scenario name', false, true) + textField('description', 'Description', true), 'lift-card'));
    var hook = s.load && s.load.hook;
    h.push(section('Load and rope',
      numField('load.mass_kg', 'Load mass', { hint: hook ? 'the rigged load, without the hook block' : 'hook block and rigging included' }) +
      numField('load.rope_length_m', 'Rope length', { hint: hook ? 'sheave to the hook block\u2019s centre of mass' : 'sheave to the load\u2019s centre of mass' }) +
      numField('load.area_m2', 'Area facing the wind', { optional: true }) +
      numField('load.drag_coefficient', 'Air drag coefficient', { optional: true, hint: 'on the speed relative to the air; usually the shape factor; blank: no damping by the air' }) +
      '<div class="field wide"><label class="check"><input type="checkbox" id="hook-on"' + (hook ? ' checked' : '') + '> Hook block and rigging as a second mass ' +
      '<span class="opt">(heavy hook block, or long slings: two sway modes)</span></label></div>' +
      (hook ? numField('load.hook.mass_kg', 'Hook block mass') +
        numField('load.hook.rigging_length_m', 'Rigging length', { hint: 'hook block to the load\u2019s centre of mass' }) : ''), 'load-card'));
    h.push(section('Crane',
      selectField('crane.kind', 'Crane', KINDS, (s.crane && s.crane.kind) || '') +
      numField('crane.radius_m', 'Hook radius from the slew axis', { optional: true }) +
      numField('crane.slew_deg', 'Slew angle at the start', { optional: true })));
    var mv = [];
    (s.motions || []).forEach(function (m, i) {
      var at = 'motions[' + i + ']', F = m.axis === 'slew' ? ANGULAR : LINEAR;
      var slew = m.axis === 'slew';
      if (window.SwayPlan && window.SwayPlan.motionHTML && (m.profile && m.profile !== 'trapezoid' || m.shaper)) {
        mv.push(window.SwayPlan.motionHTML(m, i));
        return;
      }
      mv.push('<div class="move" data-move="' + i + '"><div class="move-head"><h4>Move ' + (i + 1) + '</h4>' +
        '<button type="button" class="small-btn" data-remove="' + i + '">Remove move ' + (i + 1) + '</button></div><div class="grid">' +
        selectField(at + '.axis', 'Axis', AXES, m.axis) +
        selectField(at + '.profile', 'Speed profile', [['trapezoid', 'trapezoid: ramp, run, ramp']], m.profile || 'trapezoid') +
        numField(at + '.start_s', 'Starts at', { optional: true }) +
        numField(at + '.' + F.distance, slew ? 'Slew angle' : (m.axis === 'hoist' ? 'Hoist distance' : 'Distance')) +
        numField(at + '.' + F.speed, slew ? 'Slew rate' : 'Speed') +
        numField(at + '.' + F.accel, 'Acceleration') +
        numField(at + '.' + F.decel, 'Braking', { optional: true, hint: 'blank: same as acceleration' }) +
        '</div></div>');
    });
    h.push('<fieldset class="card wide-card" id="moves"><legend>Crane motions</legend>' + mv.join('') +
      '<button type="button" id="add-move">Add a move</button></fieldset>');
    var w = s.wind, wb = '';
    wb += '<div class="field"><label class="check"><input type="checkbox" id="wind-on"' + (w ? ' checked' : '') + '> Wind on the load</label></div>';
    if (w) {
      var bySpeed = w.speed_m_per_s !== undefined;
      wb += selectField('wind.mode', 'Wind given as', [['force', 'force on the load'], ['speed', 'wind speed']], bySpeed ? 'speed' : 'force', ' data-windmode="1"');
      if (bySpeed) {
        wb += numField('wind.speed_m_per_s', 'Wind speed', { dq: 'wind_speed', hint: '3-s gust at the load\u2019s height' }) +
          numField('wind.shape_factor', 'Shape factor', { hint: 'about 1.2 to 2 for boxes and plates' }) +
          numField('wind.air_density_kg_per_m3', 'Air density', { optional: true, hint: 'blank: 1.25 kg/m\u00B3' });
      } else {
        wb += numField('wind.force_n', 'Wind force');
      }
      wb += numField('wind.toward_deg', 'Pushes toward', { optional: true, hint: 'degrees from +x toward +y' }) +
        numField('wind.start_s', 'Starts at', { optional: true }) +
        numField('wind.duration_s', 'Lasts', { optional: true, hint: 'blank: to the end' }) +
        numField('wind.ramp_s', 'Rises over', { optional: true, hint: 'blank: a sudden gust' });
    }
    h.push(section('Wind', wb));
    h.push(section('Swing at the start',
      numField('initial.swing_deg', 'Initial swing', { optional: true }) +
      numField('initial.toward_deg', 'Swing toward', { optional: true, hint: 'degrees from +x toward +y' })));
    h.push(section('Limits from the lift plan',
      numField('limits.peak_swing_deg', 'Allowed peak swing angle', { optional: true }) +
      numField('limits.peak_excursion_m', 'Allowed peak excursion', { optional: true, hint: 'load off plumb, sideways' }) +
      numField('limits.residual_swing_deg', 'Allowed residual swing', { optional: true, hint: 'after the last move' }) +
      numField('limits.tension_factor', 'Allowed tension factor', { optional: true, hint: 'peak rope pull / static' })));
    h.push(section('Check sheet details', textField('sheet.project', 'Project') + textField('sheet.lift_reference', 'Lift reference') +
      textField('sheet.crane', 'Crane') + textField('sheet.load_description', 'Load') + textField('sheet.prepared_by', 'Prepared by') +
      textField('sheet.checked_by', 'Checked by') + textField('sheet.date', 'Date and time'), 'sheet-card'));
    h.push(section('Units shown', unitChoosers(), 'units-card'));
    h.push(section('Computation', selectField('settings.accuracy', 'Accuracy',
      [['', 'default'], ['tight', 'tight (slower)']], (s.settings && s.settings.accuracy) || '')));
    $('form').innerHTML = h.join('');
    if (window.SwayPlan) $('plan-form').innerHTML = window.SwayPlan.inputsHTML();
    document.querySelectorAll('#form, #plan-form').forEach(function (f) {
      f.querySelectorAll('input[type="text"], select, textarea').forEach(syncPrint);
    });
    showErrors();
  }

  function unitChoosers() {
    return SHOWN_QUANTITIES.map(function (dq) {
      var q = S.table.quantities[baseOf(dq)];
      var label = DISPLAY[dq] ? DISPLAY[dq].label : q.name;
      var id = 'unit-' + dq;
      return '<div class="field"><label for="' + id + '">' + esc(label.charAt(0).toUpperCase() + label.slice(1)) + '</label>' +
        '<select id="' + id + '" data-unit="' + dq + '">' + q.units.map(function (u) {
          return '<option value="' + esc(u.symbol) + '"' + (u.symbol === unitOf(dq).symbol ? ' selected' : '') + '>' + esc(u.symbol + ' (' + u.name + ')') + '</option>';
        }).join('') + '</select></div>';
    }).join('');
  }

  // parseNumber reads a typed number; a comma alone is taken as the
  // decimal mark. It returns NaN for anything else.
  function parseNumber(t) {
    t = t.trim().replace(/\u2212/g, '-');
    if (t.indexOf(',') >= 0 && t.indexOf('.') < 0) t = t.replace(',', '.');
    if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return NaN;
    return Number(t);
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
    if (window.SwayPlan && window.SwayPlan.onSelect(el)) return;
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
      var mo = s.motions[Number(m[1])], wasSlew = mo.axis === 'slew', isSlew = v === 'slew';
      mo.axis = v;
      if (wasSlew !== isSlew) {
        var from = wasSlew ? ANGULAR : LINEAR;
        Object.keys(from).forEach(function (k) { delete mo[from[k]]; });
        if (isSlew) { mo.angle_deg = 90; mo.rate_deg_per_s = 3.6; mo.accel_deg_per_s2 = 0.5; }
        else { mo.distance_m = 10; mo.speed_m_per_s = 0.5; mo.accel_m_per_s2 = 0.25; }
        clearBad('motions[' + m[1] + ']');
      }
      renderForm();
      changed();
      return;
    }
    setPath(s, path, v === '' ? undefined : v);
    changed();
  }

  function clearBad(prefix) {
    Object.keys(S.bad).forEach(function (k) { if (k.indexOf(prefix) === 0) delete S.bad[k]; });
  }

  function bindForm() {
    [$('form'), $('plan-form')].forEach(bindOne);
  }

  function bindOne(f) {
    f.addEventListener('input', function (e) {
      var el = e.target;
      syncPrint(el);
      if (el.dataset.path) onNumberInput(el);
      else if (el.dataset.list && window.SwayPlan) window.SwayPlan.onList(el);
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
      } else if (window.SwayPlan && window.SwayPlan.onChange(el)) {
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

  function showErrors() {
    document.querySelectorAll('.field .msg').forEach(function (p) { p.textContent = ''; });
    document.querySelectorAll('[aria-invalid]').forEach(function (el) { el.removeAttribute('aria-invalid'); });
    var general = [];
    function put(path, msg) {
      var boxes = document.querySelectorAll('[data-field="' + cssEsc(path) + '"]');
      // A list's item (plan.pendant_steps_pct[2]) is shown at the list.
      if (!boxes.length) boxes = document.querySelectorAll('[data-field="' + cssEsc(path.replace(/\[\d+\]$/, '')) + '"]');
      if (!boxes.length) { general.push(path + ': ' + msg); return; }
      boxes.forEach(function (box) {
        var p = box.querySelector('.msg');
        p.textContent = (p.textContent ? p.textContent + ' ' : '') + '\u2716 ' + msg;
        var inp = box.querySelector('input,select,textarea');
        if (inp) inp.setAttribute('aria-invalid', 'true');
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
    var accepted = 'accepted ' + (r.open_min ? 'above ' : 'from ') + fmtRange(lo) + ' up to ' + fmtRange(hi) + ' ' + u.symbol;
    if (/ is out of range: /.test(fe.message)) {
      return el.value.trim() + ' ' + u.symbol + ' is out of range: ' + accepted + ' (' + r.text.replace(/^accepted /, '') + ').';
    }
    return msg.replace(/\.?$/, '.') + ' In ' + u.symbol + ': ' + accepted + '.';
  }

  function cssEsc(s) { return window.CSS && CSS.escape ? CSS.escape(s) : s.replace(/["\\\[\]]/g, '\\$&'); }

  // ------------------------------------------------------------ evaluate

  var timer = null, busy = false, again = false, progressTimer = null;

  function changed() {
    saveCurrent();
    updateBanner();
    if (window.SwayPlan) window.SwayPlan.changed();
    clearTimeout(timer);
    S.waiting = true;
    timer = setTimeout(function () { S.waiting = false; evaluate(); }, 30);
  }

  function noResults() {
    if (!S.result) $('headline').innerHTML = '<p class="waiting">\u2716 No results yet: correct the marked fields.</p>';
  }

  function evaluate() {
    if (Object.keys(S.bad).length) {
      S.coreErrors = [];
      showErrors();
      $('stale').hidden = !S.result;
      noResults();
      return;
    }
    if (busy) { again = true; return; }
    busy = true;
    var sent = JSON.stringify(S.scenario);
    S.lastSent = sent;
    clearTimeout(progressTimer);
    progressTimer = setTimeout(function () { $('progress').hidden = false; document.body.dataset.state = 'computing'; }, 120);
    call('evaluate', sent).then(function (r) {
      busy = false;
      S.lastDone = sent;
      clearTimeout(progressTimer);
      $('progress').hidden = true;
      document.body.dataset.state = 'ready';
      if (again) { again = false; evaluate(); return; }
      if (r.error) {
        S.coreErrors = r.error.fields && r.error.fields.length ? r.error.fields : [{ field: '(inputs)', message: r.error.message }];
        showErrors();
        $('stale').hidden = !S.result;
        noResults();
        return;
      }
      S.coreErrors = [];
      showErrors();
      S.result = r.result;
      S.count++;
      $('stale').hidden = true;
      renderResults();
    });
  }

  // -------------------------------------------------------------- results

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

  function renderResults() {
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

  function renderPlots() {
    var r = S.result, hs = r.history, P = window.SwayPlot;
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
    $('plot-angle').innerHTML = P.chart({ id: 'angle', title: 'Rope angle from the vertical', xLabel: 'time (s)', yLabel: 'rope angle (deg)',
      series: [{ x: hs.time_s, y: hs.swing_deg, label: 'rope angle', cls: 's1' }], bands: bands, hlines: hl, yFromZero: true }) +
      '<figcaption>Hatched bands: A = a move speeding up, B = braking, numbered by move.</figcaption>';
    $('plot-path').innerHTML = P.chart({ id: 'path', title: 'Seen from above: load and trolley paths', xLabel: 'x (' + L + ')', yLabel: 'y (' + L + ')', equal: true,
      series: [{ x: scale('length', hs.suspension_x_m), y: scale('length', hs.suspension_y_m), label: 'suspension point', cls: 's2' },
        { x: scale('length', hs.load_x_m), y: scale('length', hs.load_y_m), label: 'load', cls: 's1' }] }) +
      '<figcaption>The load (solid) and the suspension point (dashed) on the ground plan.</figcaption>';
    var circles = [];
    if (typeof lim.peak_excursion_m === 'number') circles.push({ r: toShown('length', lim.peak_excursion_m) });
    $('plot-rel').innerHTML = P.chart({ id: 'rel', title: 'Seen from above: load around the suspension point', xLabel: 'x (' + L + ')', yLabel: 'y (' + L + ')', equal: true,
      series: [{ x: scale('length', hs.rel_x_m), y: scale('length', hs.rel_y_m), label: 'load', cls: 's1' }], circles: circles }) +
      '<figcaption>' + (circles.length ? 'Dashed circle: the allowed excursion.' : 'No excursion limit set.') + '</figcaption>';
    var st = toShown('force', r.static_tension_n);
    $('plot-tension').innerHTML = P.chart({ id: 'tension', title: 'Rope tension', xLabel: 'time (s)', yLabel: 'tension (' + F + ')',
      series: [{ x: hs.time_s, y: scale('force', hs.tension_n), label: 'tension', cls: 's1' }], bands: bands,
      hlines: [{ y: st, label: 'static ' + fmtRes(st) + ' ' + F }] }) +
      '<figcaption>Dashed line: the load\u2019s weight (static pull).</figcaption>';
  }

  function updateBanner() {
    $('example-banner').hidden = !(S.scenario && S.scenario.example);
  }

  function renderAll() {
    renderForm();
    updateBanner();
    renderSys();
    if (S.result) renderResults();
    if (window.SwayPlan) window.SwayPlan.render();
  }

  function renderSys() {
    var d = defaultsFor('us'), allUS = true, allSI = true, ds = defaultsFor('si');
    SHOWN_QUANTITIES.forEach(function (k) { if (S.chosen[k] !== d[k]) allUS = false; if (S.chosen[k] !== ds[k]) allSI = false; });
    $('sys-si').setAttribute('aria-pressed', String(allSI));
    $('sys-us').setAttribute('aria-pressed', String(allUS && !allSI));
  }

  // --------------------------------------------------------------- storage

  var SAVED = 'swaysheet.saved.v1:', CURRENT = 'swaysheet.current.v1', UNITS = 'swaysheet.units.v1';

  function store() {
    try { return window.localStorage; } catch (e) { return null; }
  }
  function saveCurrent() {
    var st = store();
    if (!st) return;
    try { st.setItem(CURRENT, JSON.stringify(S.scenario)); } catch (e) { notice('The inputs could not be kept in this browser: ' + e.message); }
  }
  function saveUnits() {
    var st = store();
    if (st) try { st.setItem(UNITS, JSON.stringify({ sys: S.sys, chosen: S.chosen })); } catch (e) { /* not kept */ }
  }

  function looksLikeScenario(o) {
    return o && typeof o === 'object' && !Array.isArray(o) && o.format === 'swaysheet-scenario';
  }

  // savedEntries lists the saved scenarios; damaged ones are listed as
  // such and left alone.
  function savedEntries() {
    var st = store(), out = [];
    if (!st) return out;
    for (var i = 0; i < st.length; i++) {
      var k = st.key(i);
      if (!k || k.indexOf(SAVED) !== 0) continue;
      var name = k.slice(SAVED.length), e = { name: name, key: k };
      try {
        var o = JSON.parse(st.getItem(k));
        if (!o || !looksLikeScenario(o.scenario)) throw new Error('not a scenario');
        e.scenario = o.scenario;
        e.saved_at = o.saved_at;
      } catch (err) {
        e.damaged = err.message;
      }
      out.push(e);
    }
    out.sort(function (a, b) { return a.name.localeCompare(b.name); });
    return out;
  }

  function renderSaved() {
    var list = savedEntries();
    $('saved-list').innerHTML = list.length ? list.map(function (e, i) {
      if (e.damaged) {
        return '<li class="damaged"><span>\u26A0 \u201C' + esc(e.name) + '\u201D cannot be read (the stored entry is damaged) and was skipped.</span>' +
          '<span class="btns"><button type="button" data-sdel="' + i + '">Delete</button></span></li>';
      }
      return '<li><span><b>' + esc(e.name) + '</b><br><small>' + esc(e.scenario.name || '') + (e.saved_at ? ' \u00B7 saved ' + esc(e.saved_at.replace('T', ' ').slice(0, 16)) : '') + '</small></span>' +
        '<span class="btns"><button type="button" data-sopen="' + i + '">Open</button>' +
        '<button type="button" data-sren="' + i + '">Rename</button>' +
        '<button type="button" data-sdel="' + i + '">Delete</button></span></li>';
    }).join('') : '<li class="empty">Nothing saved yet.</li>';
    $('saved-list').entries = list;
  }

  function saveAs(name) {
    name = name.trim();
    if (!name) { $('save-msg').textContent = '\u2716 Give the scenario a name.'; return; }
    var st = store();
    if (!st) { $('save-msg').textContent = '\u2716 This browser does not allow saving.'; return; }
    try {
      st.setItem(SAVED + name, JSON.stringify({ saved_at: new Date().toISOString(), scenario: S.scenario }));
      $('save-msg').textContent = '\u2714 Saved as \u201C' + name + '\u201D.';
    } catch (e) {
      $('save-msg').textContent = '\u2716 Not saved: ' + e.message;
    }
    renderSaved();
  }

  function bindSaved() {
    $('open-saved').onclick = function () {
      $('save-name').value = (S.scenario && S.scenario.name) || '';
      $('save-msg').textContent = '';
      renderSaved();
      $('dlg-saved').showModal();
    };
    $('save-do').onclick = function () { saveAs($('save-name').value); };
    $('save-name').onkeydown = function (e) { if (e.key === 'Enter') { e.preventDefault(); saveAs($('save-name').value); } };
    $('saved-list').onclick = function (e) {
      var el = e.target, list = $('saved-list').entries || [], st = store();
      if (el.dataset.sopen !== undefined) {
        var en = list[Number(el.dataset.sopen)];
        load(JSON.parse(JSON.stringify(en.scenario)), 'Opened \u201C' + en.name + '\u201D.');
        $('dlg-saved').close();
      } else if (el.dataset.sren !== undefined) {
        var e1 = list[Number(el.dataset.sren)];
        var li = el.closest('li');
        li.innerHTML = '<label for="ren-in">New name</label><input id="ren-in" type="text" value="' + esc(e1.name) + '">' +
          '<span class="btns"><button type="button" id="ren-ok">Rename</button><button type="button" id="ren-cancel">Cancel</button></span>';
        var inp = $('ren-in');
        inp.focus();
        inp.select();
        var done = function () {
          var nn = inp.value.trim();
          if (!nn || nn === e1.name) { renderSaved(); return; }
          if (st.getItem(SAVED + nn) !== null) { $('save-msg').textContent = '\u2716 \u201C' + nn + '\u201D exists already: pick another name.'; return; }
          st.setItem(SAVED + nn, st.getItem(e1.key));
          st.removeItem(e1.key);
          $('save-msg').textContent = '\u2714 Renamed to \u201C' + nn + '\u201D.';
          renderSaved();
        };
        $('ren-ok').onclick = done;
        inp.onkeydown = function (ev) { if (ev.key === 'Enter') { ev.preventDefault(); done(); } };
        $('ren-cancel').onclick = renderSaved;
      } else if (el.dataset.sdel !== undefined) {
        // Ask in the list itself: no blocking browser dialog.
        var e2 = list[Number(el.dataset.sdel)];
        var row = el.closest('li');
        row.innerHTML = '<span>Delete \u201C' + esc(e2.name) + '\u201D for good?</span><span class="btns">' +
          '<button type="button" id="del-yes">Yes, delete</button><button type="button" id="del-no">Keep it</button></span>';
        $('del-no').focus();
        $('del-yes').onclick = function () {
          st.removeItem(e2.key);
          $('save-msg').textContent = 'Deleted \u201C' + e2.name + '\u201D.';
          renderSaved();
        };
        $('del-no').onclick = renderSaved;
      }
    };
  }

  // ------------------------------------------------ load, export, import

  function load(sc, msg) {
    S.scenario = sc;
    S.bad = {};
    S.coreErrors = [];
    S.windStash = null;
    S.hookStash = null;
    if (!Array.isArray(S.scenario.motions)) S.scenario.motions = [];
    renderForm();
    updateBanner();
    if (msg) notice(msg);
    changed();
    if (window.SwayPlan) window.SwayPlan.loaded();
  }

  function notice(msg) {
    var n = $('notice');
    n.textContent = msg;
    n.hidden = false;
    clearTimeout(notice.t);
    notice.t = setTimeout(function () { n.hidden = true; }, 6000);
  }

  function fileName() {
    var n = (S.scenario.name || 'scenario').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '');
    return (n || 'scenario').slice(0, 60) + '.json';
  }

  function bindFiles() {
    $('do-export').onclick = function () {
      var blob = new Blob([JSON.stringify(S.scenario, null, 2) + '\n'], { type: 'application/json' });
      var a = document.createElement('a');
      a.href = URL.createObjectURL(blob);
      a.download = fileName();
      document.body.appendChild(a);
      a.click();
      setTimeout(function () { URL.revokeObjectURL(a.href); a.remove(); }, 1000);
      notice('Exported ' + a.download + '.');
    };
    $('import-file').onchange = function (e) {
      var f = e.target.files && e.target.files[0];
      if (!f) return;
      var rd = new FileReader();
      rd.onload = function () {
        var text = String(rd.result);
        e.target.value = '';
        var o;
        try { o = JSON.parse(text); } catch (err) { notice('\u2716 ' + f.name + ' is not a scenario file: ' + err.message); return; }
        if (!looksLikeScenario(o)) { notice('\u2716 ' + f.name + ' is not a swaysheet scenario (its "format" is not "swaysheet-scenario").'); return; }
        call('validate', text).then(function (r) {
          load(o, 'Imported ' + f.name + '.' + (r.error ? ' It has problems; see the marked fields.' : ''));
        });
      };
      rd.onerror = function () { notice('\u2716 ' + f.name + ' could not be read.'); };
      rd.readAsText(f);
    };
  }

  // Share links carry the scenario JSON, base64url-encoded UTF-8, after #s=.
  function encodeShare(sc) {
    var bytes = new TextEncoder().encode(JSON.stringify(sc)), bin = '';
    for (var i = 0; i < bytes.length; i++) bin += String.fromCharCode(bytes[i]);
    return btoa(bin).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
  }
  function decodeShare(s) {
    var b = atob(s.replace(/-/g, '+').replace(/_/g, '/'));
    var bytes = new Uint8Array(b.length);
    for (var i = 0; i < b.length; i++) bytes[i] = b.charCodeAt(i);
    return JSON.parse(new TextDecoder().decode(bytes));
  }
  function shareURL() {
    return location.href.split('#')[0] + '#s=' + encodeShare(S.scenario);
  }

  function fromHash() {
    var m = /^#s=([A-Za-z0-9_-]+)$/.exec(location.hash);
    if (!m) return null;
    try {
      var o = decodeShare(m[1]);
      if (!looksLikeScenario(o)) throw new Error('no scenario in it');
      return o;
    } catch (e) {
      notice('\u2716 The link does not hold a readable scenario (' + e.message + '); the previous inputs are kept.');
      return null;
    }
  }

  // openLink loads the scenario of the URL fragment, first keeping the
  // inputs it replaces among the saved scenarios.
  function openLink() {
    // #z= links: the check sheet's QR code (the scenario's canonical JSON,
    // compressed; read by the core's "unshare" call).
    if (/^#z=[A-Za-z0-9_-]+$/.test(location.hash)) {
      var frag = location.hash;
      history.replaceState(null, '', location.href.split('#')[0]);
      call('unshare', frag).then(function (r) {
        if (r.error) {
          notice('\u2716 The link does not hold a readable scenario (' + r.error.message + '); the previous inputs are kept.');
          renderForm();
          updateBanner();
          changed();
          return;
        }
        keepBeforeLink(r.result);
        load(r.result, 'Opened the scenario from the link.');
      });
      return true;
    }
    var o = fromHash();
    if (!o) return false;
    history.replaceState(null, '', location.href.split('#')[0]);
    keepBeforeLink(o);
    load(o, 'Opened the scenario from the link.');
    return true;
  }

  function keepBeforeLink(o) {
    if (S.scenario && JSON.stringify(S.scenario) !== JSON.stringify(o) && !S.scenario.example) {
      var st = store();
      if (st) try { st.setItem(SAVED + 'Kept before opening a link ' + new Date().toISOString().slice(0, 19).replace('T', ' '), JSON.stringify({ saved_at: new Date().toISOString(), scenario: S.scenario })); } catch (e) { /* ignore */ }
    }
  }

  function bindShare() {
    $('do-share').onclick = function () {
      $('share-url').value = shareURL();
      $('share-msg').textContent = '';
      $('dlg-share').showModal();
      $('share-url').select();
    };
    $('share-copy').onclick = function () {
      var t = $('share-url');
      t.select();
      var ok = function () { $('share-msg').textContent = '\u2714 Copied.'; };
      if (navigator.clipboard && navigator.clipboard.writeText) {
        navigator.clipboard.writeText(t.value).then(ok, function () { $('share-msg').textContent = 'Select the link and copy it.'; });
      } else {
        $('share-msg').textContent = 'Select the link and copy it.';
      }
    };
    window.addEventListener('hashchange', openLink);
  }

  // -------------------------------------------------------------- examples

  function bindExamples() {
    $('open-examples').onclick = function () {
      var ex = S.examples;
      $('examples-source').textContent = !ex ? 'The examples are not loaded.' :
        ex.source === 'origin' ? 'Read from this page\u2019s own server.' : 'Built into the tool' + (ex.note ? ': ' + ex.note : '.');
      $('examples-list').innerHTML = ex ? ex.examples.map(function (e, i) {
        return '<li><span><b>' + esc(e.name) + '</b><br><small>' + esc(e.description || '') + '</small></span>' +
          '<span class="btns"><button type="button" data-ex="' + i + '">Open</button></span></li>';
      }).join('') : '';
      $('dlg-examples').showModal();
    };
    $('examples-list').onclick = function (e) {
      var i = e.target.dataset.ex;
      if (i === undefined) return;
      var ex = S.examples.examples[Number(i)];
      load(JSON.parse(JSON.stringify(ex.scenario)), 'Opened the example \u201C' + ex.name + '\u201D.');
      $('dlg-examples').close();
    };
  }

  // ------------------------------------------------------------------ start

  function bindSys() {
    $('sys-si').onclick = function () { setSys('si'); };
    $('sys-us').onclick = function () { setSys('us'); };
  }
  function setSys(sys) {
    S.sys = sys;
    S.chosen = defaultsFor(sys);
    // Typed text that is not a number stays as typed.
    saveUnits();
    renderAll();
  }

  function demo() {
    var ex = S.examples;
    for (var i = 0; ex && i < ex.examples.length; i++) {
      if (ex.examples[i].file === ex.demo) return JSON.parse(JSON.stringify(ex.examples[i].scenario));
    }
    return null;
  }

  function start() {
    startWorker();
    bindForm(); bindSaved(); bindFiles(); bindShare(); bindExamples(); bindSys();
    Promise.all([call('units'), call('ranges'), call('examples'), call('version')]).then(function (rs) {
      for (var i = 0; i < rs.length; i++) if (rs[i].error) { engineError(rs[i].error.message); return; }
      S.table = rs[0].result;
      S.ranges = rs[1].result;
      S.examples = rs[2].result;
      $('version').textContent = 'swaysheet ' + rs[3].result.version + ' \u00B7 scenario format ' + rs[3].result.format + ' v' + rs[3].result.format_version;
      S.chosen = defaultsFor('si');
      var st = store();
      try {
        var u = st && JSON.parse(st.getItem(UNITS) || 'null');
        if (u && u.chosen) { S.sys = u.sys; Object.keys(u.chosen).forEach(function (k) { S.chosen[k] = u.chosen[k]; }); }
      } catch (e) { /* default units */ }
      var cur = null;
      try { cur = st && JSON.parse(st.getItem(CURRENT) || 'null'); } catch (e) { cur = null; }
      if (!looksLikeScenario(cur)) {
        if (cur !== null) notice('The inputs kept from last time could not be read; the example is shown instead.');
        cur = null;
      }
      S.scenario = cur || demo();
      if (!S.scenario) { engineError('No scenario to show: the example library could not be read.'); return; }
      if (!Array.isArray(S.scenario.motions)) S.scenario.motions = [];
      renderSys();
      if (!openLink()) {
        renderForm();
        updateBanner();
        changed();
        if (window.SwayPlan) window.SwayPlan.loaded();
      }
      document.body.dataset.state = 'ready';
    });
  }

  // Print: the check sheet from the core (sheet.js), made fresh first.
  $('do-print').onclick = function () {
    if (window.swaysheetSheet) window.swaysheetSheet.print();
    else window.print();
  };

  $('example-own').onclick = function () {
    delete S.scenario.example;
    renderForm();
    changed();
  };

  // What web/static/plan.js uses of the page: the state, the core's calls
  // and units, the form's field builders.
  window.SwayApp = {
    S: S, call: call, unitOf: unitOf, toShown: toShown, toSI: toSI, fmtRes: fmtRes, fmtField: fmtField,
    numField: numField, selectField: selectField, parseNumber: parseNumber, setPath: setPath, getPath: getPath,
    renderForm: renderForm, changed: changed, notice: notice, clearBad: clearBad, showErrors: showErrors,
    keepInSaved: function (why) {
      var st = store();
      if (!st) return false;
      try {
        st.setItem(SAVED + why + ' ' + new Date().toISOString().slice(0, 19).replace('T', ' '), JSON.stringify({ saved_at: new Date().toISOString(), scenario: S.scenario }));
        return true;
      } catch (e) { return false; }
    }
  };

  // For the browser tests and for people checking a figure: the current
  // scenario as JSON (read only).
  window.swaysheet = {
    scenarioJSON: function () { return JSON.stringify(S.scenario); },
    // For the check sheet (sheet.js): a core call, and the units shown.
    call: call,
    units: function () { return S.chosen; },
    system: function () { return S.sys; },
    resultCount: function () { return S.count; },
    // settled is true when the core has answered for the inputs as they are.
    settled: function () {
      return !S.waiting && !busy && !again && (Object.keys(S.bad).length > 0 || S.lastDone === JSON.stringify(S.scenario));
    }
  };

  start();
})();

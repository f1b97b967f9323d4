// plan.js: the planner section of the swaysheet page. It collects the
// scenario's plan block, asks the core's "plan" call (in the worker) for the
// ranked options and shows them, their crew settings, their verified figures
// and the planner's curves. Every figure comes from the core; every unit
// factor from the core's unit table (through app.js). Nothing is computed
// here beyond differences of times the planner gives (a ramp's duration).
(function () {
  'use strict';

  var $ = function (id) { return document.getElementById(id); };
  var esc = window.SwayPlot.escape;
  function A() { return window.SwayApp; }

  var P = {
    result: null,   // last plan.Result
    key: null,      // planKey of the inputs it was made for
    running: false,
    error: null,    // {message, fields}
    started: 0,
    ticker: null,
    stash: null,    // plan block kept while "Plan a move" is off
    count: 0,
    applied: null   // key of the option last applied
  };

  var AXES = [['travel_x', 'Travel x'], ['travel_y', 'Travel y'], ['slew', 'Slew']];
  var DRIVES = [['', 'either: show both'], ['variable_speed', 'variable-speed drive (ramps on the inverter)'],
    ['pendant', 'step-speed pendant (press and release)']];
  var LINEAR = { distance: 'distance_m', speed: 'speed_m_per_s', accel: 'accel_m_per_s2', decel: 'decel_m_per_s2' };
  var ANGULAR = { distance: 'angle_deg', speed: 'rate_deg_per_s', accel: 'accel_deg_per_s2', decel: 'decel_deg_per_s2' };

  // planKey is what a plan depends on: everything but the motions (which
  // applying an option replaces) and the describing text.
  // Keys are sorted: a field typed over keeps its value but not its place.
  function planKey(sc) {
    var c = JSON.parse(JSON.stringify(sc));
    ['motions', 'name', 'description', 'sheet', 'example'].forEach(function (k) { delete c[k]; });
    return canon(c);
  }
  function canon(v) {
    if (Array.isArray(v)) return '[' + v.map(canon).join(',') + ']';
    if (v && typeof v === 'object') {
      return '{' + Object.keys(v).sort().map(function (k) { return JSON.stringify(k) + ':' + canon(v[k]); }).join(',') + '}';
    }
    return JSON.stringify(v);
  }

  // ------------------------------------------------------------ formatting

  function num(dq, v) { return A().fmtRes(A().toShown(dq, v)); }
  function sym(dq) { return A().unitOf(dq).symbol; }
  function withU(dq, v) { return num(dq, v) + '\u00A0' + sym(dq); }
  function secs(v) { return A().fmtRes(v) + '\u00A0s'; }
  function deg(v) { return A().fmtRes(v) + '\u00A0deg'; }
  // siNote marks the planner's own sentences, which give figures in SI
  // units, when other units are shown.
  function siNote() {
    var a = A();
    if (a.unitOf('length').symbol === 'm' && a.unitOf('speed').symbol.indexOf('ft') < 0) return '';
    return ' <span class="small si-note">(the planner\u2019s sentences give figures in SI units)</span>';
  }
  function isSlew(r) { return r.axis === 'slew'; }
  function speedDQ(r) { return isSlew(r) ? 'angular_speed' : 'speed'; }
  function accelDQ(r) { return isSlew(r) ? 'angular_acceleration' : 'acceleration'; }
  function axisName(a) {
    for (var i = 0; i < AXES.length; i++) if (AXES[i][0] === a) return AXES[i][1].toLowerCase();
    return a;
  }
  function list(items, cls, mark) {
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
      if ((m.axis === 'travel_x' || m.axis === 'travel_y') && ok(m.distance_m) && ok(m.speed_m_per_s) && ok(m.accel_m_per_s2)) {
        return { axis: m.axis, distance_m: m.distance_m, top_speed_m_per_s: m.speed_m_per_s, max_accel_m_per_s2: m.accel_m_per_s2 };
      }
      if (m.axis === 'slew' && ok(m.angle_deg) && ok(m.rate_deg_per_s) && ok(m.accel_deg_per_s2)) {
        return { axis: 'slew', angle_deg: m.angle_deg, top_rate_deg_per_s: m.rate_deg_per_s, max_accel_deg_per_s2: m.accel_deg_per_s2 };
      }
    }
    return { axis: 'travel_x', distance_m: 10, top_speed_m_per_s: 0.5, max_accel_m_per_s2: 0.3 };
  }

  function limitsLine(s) {
    var l = s.limits || {}, parts = [];
    if (typeof l.peak_swing_deg === 'number') parts.push('peak swing ' + deg(l.peak_swing_deg));
    if (typeof l.peak_excursion_m === 'number') parts.push('peak excursion ' + withU('length', l.peak_excursion_m));
    if (typeof l.residual_swing_deg === 'number') parts.push('residual swing ' + deg(l.residual_swing_deg));
    return '<p class="field wide plan-limits" id="plan-limits">Limits used: ' +
      (parts.length ? esc(parts.join(', ')) : 'none set yet') +
      ' \u2014 from <a href="#f-limits-peak_swing_deg">Limits from the lift plan</a>; a plan needs the residual swing and a peak swing or excursion.</p>';
  }

  function inputsHTML() {
    var a = A(), s = a.S.scenario, p = s && s.plan, h = [];
    $('planner').classList.toggle('has-plan', !!p);
    h.push('<div class="field wide"><label class="check"><input type="checkbox" id="plan-on"' + (p ? ' checked' : '') +
      '> Plan a move for this load</label></div>');
    if (p) {
      var slew = p.axis === 'slew';
      h.push(a.selectField('plan.axis', 'Move to plan', AXES, p.axis));
      if (slew) {
        h.push(a.numField('plan.angle_deg', 'Slew angle'));
        h.push(a.numField('crane.radius_m', 'Hook radius', { id: 'f-plan-radius', hint: 'the same as the crane\u2019s hook radius' }));
        h.push(a.numField('plan.top_rate_deg_per_s', 'Top slew rate'));
        h.push(a.numField('plan.max_accel_deg_per_s2', 'Largest slew acceleration'));
      } else {
        h.push(a.numField('plan.distance_m', 'Distance'));
        h.push(a.numField('plan.top_speed_m_per_s', 'Top speed'));
        h.push(a.numField('plan.max_accel_m_per_s2', 'Largest acceleration', { hint: 'the drive\u2019s shortest ramp' }));
      }
      h.push(a.numField('plan.rope_length_min_m', 'Shortest rope during the move', { optional: true, hint: 'blank: the rope length only' }));
      h.push(a.numField('plan.rope_length_max_m', 'Longest rope during the move', { optional: true }));
      h.push(a.selectField('plan.drive', 'Drive', DRIVES, p.drive || ''));
      if (p.drive !== 'variable_speed') h.push(listField('plan.pendant_steps_pct', 'The pendant\u2019s own speed steps'));
      h.push(limitsLine(s));
    }
    return '<div class="grid">' + h.join('') + '</div>';
  }

  function listField(path, label) {
    var a = A(), id = 'f-' + path.replace(/[^a-z0-9_]+/gi, '-');
    var bad = a.S.bad[path], v = a.getPath(a.S.scenario, path);
    var text = bad ? bad.text : (Array.isArray(v) ? v.map(function (x) { return a.fmtField(x); }).join(', ') : '');
    return '<div class="field" data-field="' + esc(path) + '"><label for="' + id + '">' + esc(label) +
      ' <span class="opt">(optional)</span></label><div class="with-unit"><input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-list="' +
      esc(path) + '" value="' + esc(text) + '" aria-describedby="' + id + '-hint ' + id + '-msg"><span class="pv" aria-hidden="true"></span>' +
      '<span class="unit" aria-label="unit">%</span></div>' +
      '<p class="hint" id="' + id + '-hint">% of the top speed, slowest first, the last 100, for example 33, 67, 100; blank: the planner picks the steps</p>' +
      '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
  }

  function onList(el) {
    var a = A(), path = el.dataset.list, t = el.value.trim();
    if (t === '') {
      delete a.S.bad[path];
      a.setPath(a.S.scenario, path, undefined);
    } else {
      var parts = t.split(/[\s,;]+/).filter(function (x) { return x !== ''; });
      var vs = parts.map(function (x) { return a.parseNumber(x); });
      if (vs.some(function (v) { return !isFinite(v); })) {
        a.S.bad[path] = { text: el.value, message: 'Enter the steps as numbers in % of the top speed, separated by commas, for example 33, 67, 100.' };
      } else {
        delete a.S.bad[path];
        a.setPath(a.S.scenario, path, vs);
      }
    }
    a.changed();
  }

  function onSelect(el) {
    var a = A(), s = a.S.scenario;
    if (el.dataset.select === 'plan.drive') {
      // The crew's own pendant steps apply to a pendant only: kept aside
      // while a variable-speed drive is chosen.
      if (el.value === 'variable_speed') {
        if (s.plan.pendant_steps_pct) P.steps = s.plan.pendant_steps_pct;
        delete s.plan.pendant_steps_pct;
        a.clearBad('plan.pendant_steps_pct');
      } else if (P.steps && !s.plan.pendant_steps_pct) {
        s.plan.pendant_steps_pct = P.steps;
      }
      a.setPath(s, 'plan.drive', el.value === '' ? undefined : el.value);
      a.renderForm();
      a.changed();
      return true;
    }
    if (el.dataset.select !== 'plan.axis') return false;
    var p = s.plan, wasSlew = p.axis === 'slew', nowSlew = el.value === 'slew';
    p.axis = el.value;
    if (wasSlew !== nowSlew) {
      ['distance_m', 'top_speed_m_per_s', 'max_accel_m_per_s2', 'angle_deg', 'top_rate_deg_per_s', 'max_accel_deg_per_s2'].forEach(function (k) { delete p[k]; });
      if (nowSlew) {
        p.angle_deg = 90; p.top_rate_deg_per_s = 3.6; p.max_accel_deg_per_s2 = 0.5;
        if (!(s.crane && s.crane.radius_m > 0)) a.setPath(s, 'crane.radius_m', 20);
      } else {
        p.distance_m = 10; p.top_speed_m_per_s = 0.5; p.max_accel_m_per_s2 = 0.3;
      }
      a.clearBad('plan.');
    }
    a.renderForm();
    a.changed();
    return true;
  }

  function onChange(el) {
    var a = A(), s = a.S.scenario;
    if (el.id !== 'plan-on') return false;
    if (el.checked) {
      s.plan = P.stash || defaultPlan(s);
    } else {
      P.stash = s.plan;
      delete s.plan;
      a.clearBad('plan.');
    }
    a.renderForm();
    a.changed();
    render();
    return true;
  }

  // motionHTML shows a move the planner made (speed steps, or a shaped
  // ramp) in the motions list; app.js shows the plain trapezoids.
  function motionHTML(m, i) {
    var a = A(), at = 'motions[' + i + ']', slew = m.axis === 'slew', F = slew ? ANGULAR : LINEAR;
    var sdq = slew ? 'angular_speed' : 'speed';
    var h = '<div class="move planned" data-move="' + i + '"><div class="move-head"><h4>Move ' + (i + 1) + ': ' + esc(axisName(m.axis)) +
      (m.profile === 'steps' ? ', pendant speed steps' : ', shaped ramp') + '</h4>' +
      '<button type="button" class="small-btn" data-remove="' + i + '">Remove move ' + (i + 1) + '</button></div><div class="grid">';
    if (m.profile === 'steps') {
      h += '<div class="field wide"><table class="plain"><caption>Speed steps</caption><thead><tr><th scope="col">At</th><th scope="col">Speed</th></tr></thead><tbody>' +
        (m.steps || []).map(function (st) {
          var v = slew ? st.rate_deg_per_s : st.speed_m_per_s;
          return '<tr><td>' + secs(st.at_s) + '</td><td>' + (typeof v === 'number' ? withU(sdq, v) : '\u2014') + '</td></tr>';
        }).join('') + '</tbody></table><p class="hint">From the planner. To change the steps, plan again or edit the scenario file.</p></div>';
      h += a.numField(at + '.' + F.accel, 'Drive ramp, speeding up') + a.numField(at + '.' + F.decel, 'Drive ramp, slowing', { optional: true });
    } else {
      h += a.numField(at + '.start_s', 'Starts at', { optional: true }) +
        a.numField(at + '.' + F.distance, slew ? 'Slew angle' : 'Distance') +
        a.numField(at + '.' + F.speed, slew ? 'Slew rate' : 'Speed') +
        a.numField(at + '.' + F.accel, 'Acceleration') +
        a.numField(at + '.' + F.decel, 'Braking', { optional: true, hint: 'blank: same as acceleration' });
      if (m.shaper) {
        h += '<p class="field wide hint">Shaped by the ' + esc(String(m.shaper.kind).toUpperCase()) + ' shaper' +
          (typeof m.shaper.period_s === 'number' ? ', tuned to a sway period of ' + esc(secs(m.shaper.period_s)) : '') +
          (typeof m.shaper.second_period_s === 'number' ? ' and ' + esc(secs(m.shaper.second_period_s)) : '') + ' (from the planner).</p>';
      }
    }
    return h + '</div></div>';
  }

  // ------------------------------------------------------------- planning

  function run() {
    var a = A(), S = a.S;
    if (!S.scenario || !S.scenario.plan || P.running) return;
    if (Object.keys(S.bad).length) {
      P.error = { message: 'Correct the marked fields first: the plan needs every input as a number.', fields: [] };
      render();
      return;
    }
    var sent = JSON.stringify(S.scenario), key = planKey(S.scenario);
    P.running = true;
    P.error = null;
    P.started = Date.now();
    clearInterval(P.ticker);
    P.ticker = setInterval(progress, 250);
    progress();
    render();
    a.call('plan', sent).then(function (r) {
      P.running = false;
      clearInterval(P.ticker);
      progress();
      if (r.error) {
        P.error = r.error;
      } else {
        P.result = r.result;
        P.key = key;
        P.applied = null;
        P.count++;
      }
      render();
    });
  }

  function progress() {
    var box = $('plan-progress');
    box.hidden = !P.running;
    $('plan-run').disabled = P.running;
    if (P.running) $('plan-progress-text').textContent = 'Planning and checking each option\u2026 ' + Math.floor((Date.now() - P.started) / 1000) + ' s';
  }

  function apply(i) {
    var a = A(), s = a.S.scenario, o = P.result.options[i];
    var mv = JSON.parse(JSON.stringify(o.motion));
    var kept = false;
    if ((s.motions || []).length && JSON.stringify(s.motions) !== JSON.stringify([mv]) && !s.example) {
      kept = a.keepInSaved('Kept before using a planned move');
    }
    s.motions = [mv];
    a.clearBad('motions[');
    a.renderForm();
    a.changed();
    P.applied = o.key;
    render();
    a.notice('The crane motions are now the planned move \u201C' + o.label + '\u201D; the results show it.' +
      (kept ? ' The motions it replaced are kept among the saved scenarios.' : ''));
    var res = $('results');
    if (res && res.scrollIntoView) res.scrollIntoView({ block: 'start' });
  }

  // --------------------------------------------------------------- showing

  function render() {
    var a = A();
    if (!a || !a.S.table) return;
    var s = a.S.scenario, out = [];
    $('plan-run').hidden = !(s && s.plan);
    progress();
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
    out.push('<p class="stale" id="plan-stale" role="status"' + (P.key === planKey(s) ? ' hidden' : '') +
      '>\u26A0 The inputs changed since this plan was made: press \u201CPlan the move\u201D again. The plan below is for the earlier inputs.</p>');
    out.push(summary(r));
    out.push(recommended(r));
    if (!(s.motions || []).length && r.options.length) {
      out.push('<p class="plan-nomove" id="plan-nomove"><span aria-hidden="true">\u2139</span> The crane motions are empty, so the results above show the load at rest. ' +
        'Use one of these moves in the crane motions to see its swing there.</p>');
    }
    if (r.infeasible && r.infeasible.length) {
      out.push('<div class="plan-infeasible" id="plan-infeasible"><h3>What to change</h3>' + list(r.infeasible, 'warn-list', '\u2716') + siNote() + '</div>');
    }
    if (r.notes && r.notes.length) out.push('<div class="plan-notes"><h3>Notes</h3>' + list(r.notes, 'note-list', '\u2139') + siNote() + '</div>');
    if (r.options.length) {
      out.push(table(r));
      out.push('<h3 class="plan-h">Each option: crew settings and checked figures</h3>');
      r.options.forEach(function (o, i) { out.push(optionCard(r, o, i)); });
    }
    out.push('<div class="plots plan-plots"><figure id="plot-plan-ramp" class="plot"></figure><figure id="plot-plan-rope" class="plot"></figure></div>');
    out.push('<details class="assumptions"><summary>What the planner assumes</summary>' + list(r.assumptions, '', '') + '</details>');
    out.push('<div class="plan-cautions"><h3>Before using a plan</h3>' + list(r.cautions, 'warn-list', '\u26A0') + '</div>');
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
    var move = isSlew(r) ?
      'Slew ' + deg(r.angle_deg) + ' at a hook radius of ' + withU('length', r.radius_m) + ', top rate ' + withU('angular_speed', r.top_rate_deg_per_s) +
        (r.slew_lean_deg ? ' (outward lean ' + deg(r.slew_lean_deg) + ' at that rate)' : '') :
      'Travel ' + withU('length', r.distance_m) + ' on ' + axisName(r.axis) + ', top speed ' + withU('speed', r.top_speed_m_per_s);
    var ropes = r.rope_lengths_m.map(function (l) { return num('length', l); }).join(', ') + '\u00A0' + sym('length');
    return '<p class="plan-summary" id="plan-summary">' + esc(move) + '. Rope ' + esc(withU('length', r.rope_length_m)) +
      ' (sway period ' + esc(secs(r.period_s)) + '); each option simulated at ' + esc(ropes) +
      '; shapers and whole-period ramps tuned to ' + esc(secs(r.design_period_s)) + ' (rope ' + esc(withU('length', r.design_rope_length_m)) + '). ' +
      esc(String(r.simulations)) + ' simulations.</p>' + modes(r);
  }

  // modes shows the hook block's two sway modes, when the plan has them.
  function modes(r) {
    var m = r.mode_periods_s;
    if (!m || m.length < 2) return '';
    return '<p class="plan-modes" id="plan-modes"><b>Hook block and rigging: two sway modes</b>, <span id="plan-mode1">' + esc(secs(m[0])) +
      '</span> and <span id="plan-mode2">' + esc(secs(m[1])) + '</span> at the nominal rope; the second carries up to <span id="plan-share">' +
      esc(A().fmtRes(100 * r.second_mode_share)) + '\u00A0%</span> of the load\u2019s swing. Two-mode shapers are tuned to ' +
      esc(secs(r.design_period_s)) + ' and ' + esc(secs(r.second_design_period_s)) + '.</p>';
  }

  function recommended(r) {
    if (r.recommended < 0) {
      return '<div class="plan-rec none" id="plan-rec"><p class="rec-head"><span aria-hidden="true">\u2716</span> No option is recommended</p><p>' + esc(r.reason) + siNote() + '</p></div>';
    }
    var o = r.options[r.recommended];
    // The core's reason starts by naming the option, as the heading does.
    var why = r.reason, lead = 'Recommended: ' + o.label + ' \u2014 ';
    if (why.indexOf(lead) === 0) why = why.slice(lead.length);
    return '<div class="plan-rec" id="plan-rec"><p class="rec-head"><span aria-hidden="true">\u2605</span> Recommended: <span id="plan-rec-label">' + esc(o.label) + '</span></p>' +
      '<p><b>Why:</b> <span id="plan-reason">' + esc(why) + '</span>' + siNote() + '</p>' +
      '<p><a class="button" href="#plan-opt-' + r.recommended + '">Its crew settings</a></p></div>';
  }

  // verdict says whether an option keeps inside every limit, and which it
  // breaks (the figures are in the table beside it).
  function verdict(o, short) {
    if (o.within) return '<span class="verdict ok"><span aria-hidden="true">\u2714</span> within</span>';
    var which = (o.outside || []).map(function (t) { return t.split(' ').slice(0, 2).join(' '); });
    return '<span class="verdict out"><span aria-hidden="true">\u2716</span> OUTSIDE</span>' +
      (which.length ? (short ? '<br>' : ': ') + '<span class="which">' + esc(which.join(', ')) + '</span>' : '');
  }

  function table(r) {
    var L = sym('length');
    var h = '<div class="table-wrap"><table class="plan-table" id="plan-table"><caption>Options, best first, each against the limits. Peak and residual: the worst over the rope lengths simulated; extra: longer than the fastest move.</caption><thead><tr>' +
      '<th scope="col">Option</th><th scope="col">Move (s)</th><th scope="col">Extra (s)</th>' +
      '<th scope="col">Peak (deg)</th><th scope="col">Excursion (' + esc(L) + ')</th><th scope="col">Residual (deg)</th></tr></thead><tbody>';
    r.options.forEach(function (o, i) {
      var rec = i === r.recommended;
      h += '<tr class="' + (rec ? 'rec' : '') + (o.within ? '' : ' out') + '" data-key="' + esc(o.key) + '">' +
        '<th scope="row"><a href="#plan-opt-' + i + '"><span data-col="rank">' + (rec ? '<span aria-hidden="true">\u2605</span> ' : '') + o.rank + '.</span> ' +
        '<span data-col="label">' + esc(o.label) + '</span></a>' + (rec ? ' <strong class="rec-word">Recommended</strong>' : '') +
        (o.two_mode ? ' <span class="mode-word">both modes</span>' : '') +
        '<span class="lim" data-col="limits">' + verdict(o, false) + '</span></th>' +
        '<td class="n" data-col="move">' + A().fmtRes(o.move_time_s) + '</td><td class="n" data-col="extra">' + A().fmtRes(o.penalty_s) + '</td>' +
        '<td class="n" data-col="peak">' + A().fmtRes(o.worst_peak_swing_deg) + '</td><td class="n" data-col="excursion">' + num('length', o.worst_peak_excursion_m) + '</td>' +
        '<td class="n" data-col="residual">' + A().fmtRes(o.worst_residual_swing_deg) + '</td></tr>';
    });
    return h + '</tbody></table></div>';
  }

  // crew renders an option's settings from the planner's own numbers.
  function crew(r, o) {
    var sdq = speedDQ(r), adq = accelDQ(r), h = '';
    var top = isSlew(r) ? o.top_rate_deg_per_s : o.top_speed_m_per_s;
    var acc = isSlew(r) ? o.accel_deg_per_s2 : o.accel_m_per_s2;
    if (o.speed_profile && o.speed_profile.length > 1) {
      h += '<p>Program the drive\u2019s speed profile (multi-segment ramps, or the drive\u2019s own sway-control function) for starting; stopping mirrors it.</p>';
      h += '<table class="plain crew" data-crew="ramps"><caption>Speed profile for a variable-speed drive</caption><thead><tr><th scope="col">From</th><th scope="col">To</th><th scope="col">The drive</th><th scope="col">Ramp time</th></tr></thead><tbody>';
      for (var i = 0; i + 1 < o.speed_profile.length; i++) {
        var k0 = o.speed_profile[i], k1 = o.speed_profile[i + 1];
        var same = A().fmtRes(A().toShown(sdq, k0.speed)) === A().fmtRes(A().toShown(sdq, k1.speed));
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
        h += '<tr><td>' + secs(p.at_s) + '</td><td>' + action + '</td><td>' + A().fmtRes(p.step_pct) + '\u00A0%</td><td>' + withU(sdq, Math.abs(p.speed)) + '</td></tr>';
      });
      h += '</tbody></table>';
    } else {
      h += '<ul class="crew-list" data-crew="ramp"><li>Acceleration and deceleration: <b>' + esc(withU(adq, acc)) + '</b></li>' +
        '<li>Ramp time to the top speed: <b>' + esc(secs(o.ramp_s)) + '</b></li>' +
        '<li>Top ' + (isSlew(r) ? 'slew rate' : 'speed') + ': <b>' + esc(withU(sdq, top)) + '</b></li></ul>';
    }
    if (o.settings && o.settings.length) {
      h += '<details class="words"><summary>The planner\u2019s own words (figures in SI units)</summary>' +
        '<pre>' + esc(o.settings.join('\n')) + '</pre></details>';
    }
    return h;
  }

  function optionCard(r, o, i) {
    var rec = i === r.recommended, L = sym('length');
    var h = '<details class="opt-card' + (rec ? ' rec' : '') + '" id="plan-opt-' + i + '"' + (rec ? ' open' : '') + '><summary>' +
      (rec ? '<span aria-hidden="true">\u2605</span> ' : '') + o.rank + '. ' + esc(o.label) + (rec ? ' \u2014 <strong>Recommended</strong>' : '') +
      ' \u00B7 ' + esc(secs(o.move_time_s)) + ' \u00B7 ' + verdict(o) + '</summary><div class="opt-body">';
    h += '<h4>Settings for the crew</h4>' + crew(r, o);
    var mr = o.mode_residual_pct;
    if (mr && mr.length >= 2) {
      h += '<p class="mode-left">Left in each sway mode (linear theory, the worst over the rope lengths): first mode ' + esc(A().fmtRes(mr[0])) +
        '\u00A0%, second mode ' + esc(A().fmtRes(mr[1])) + '\u00A0% of what the drive-limits move leaves' + (o.two_mode ? ' (a shaper for both modes).' : '.') + '</p>';
    }
    if (o.not_simulated) {
      // Screened by the planner: linear-theory estimates, never shown as checked.
      h += '<h4>Not simulated: linear-theory estimate</h4><p class="note">' + esc(o.not_simulated) + '. Use this move in the crane motions to simulate it.</p>' +
        '<div class="table-wrap"><table class="plain estimated"><thead><tr><th scope="col">Rope length (' + esc(L) + ')</th>' +
        '<th scope="col">Peak swing, estimate (deg)</th><th scope="col">Peak excursion, estimate (' + esc(L) + ')</th><th scope="col">Residual swing, estimate (deg)</th></tr></thead><tbody>' +
        (o.estimated || []).map(function (v, j) {
          return '<tr><th scope="row">' + num('length', v.rope_length_m) + (j === 0 ? ' (nominal)' : '') + '</th><td class="n">' + A().fmtRes(v.peak_swing_deg) +
            '</td><td class="n">' + num('length', v.peak_excursion_m) + '</td><td class="n">' + A().fmtRes(v.residual_swing_deg) + '</td></tr>';
        }).join('') + '</tbody></table></div>';
    } else {
      var rig = o.verified.some(function (v) { return typeof v.peak_rigging_angle_deg === 'number'; });
      h += '<h4>Checked by simulation</h4><div class="table-wrap"><table class="plain verified"><thead><tr><th scope="col">Rope length (' + esc(L) + ')</th>' +
        '<th scope="col">Peak swing (deg)</th><th scope="col">Peak excursion (' + esc(L) + ')</th><th scope="col">Residual swing (deg)</th><th scope="col">Tension factor</th>' +
        (rig ? '<th scope="col">Rope to rigging (deg)</th>' : '') + '</tr></thead><tbody>' +
        o.verified.map(function (v, j) {
          return '<tr><th scope="row">' + num('length', v.rope_length_m) + (j === 0 ? ' (nominal)' : '') + '</th><td class="n">' + A().fmtRes(v.peak_swing_deg) +
            '</td><td class="n">' + num('length', v.peak_excursion_m) + '</td><td class="n">' + A().fmtRes(v.residual_swing_deg) + '</td><td class="n">' +
            A().fmtRes(v.tension_factor) + '</td>' + (rig ? '<td class="n">' + (typeof v.peak_rigging_angle_deg === 'number' ? A().fmtRes(v.peak_rigging_angle_deg) : '\u2014') + '</td>' : '') + '</tr>';
        }).join('') + '</tbody></table></div>';
    }
    if (!o.within) h += list(o.outside, 'warn-list', '\u2716');
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

  var CLS = ['s1', 's2', 's3', 's4', 's5', 's6'];

  function curves(r) {
    var at = r.curves.accel_time, re = r.curves.rope_error, lim = r.limits || {};
    var hl = typeof lim.residual_swing_deg === 'number' ? [{ y: lim.residual_swing_deg, label: 'limit ' + A().fmtRes(lim.residual_swing_deg) + ' deg' }] : [];
    $('plot-plan-ramp').innerHTML = window.SwayPlot.chart({
      id: 'plan-ramp', title: 'Residual swing after one ramp, against ramp time', xLabel: 'ramp time to top speed (s)', yLabel: 'residual swing (deg)',
      yFromZero: true, hlines: hl, legendTop: true,
      series: at.series.map(function (sr, i) {
        return { x: at.ramp_s, y: sr.residual_deg, label: 'rope ' + num('length', sr.rope_length_m) + ' ' + sym('length'), cls: CLS[i % CLS.length] };
      })
    }) + '<figcaption>Zero at whole sway periods (' + esc(secs(r.design_period_s)) + ' each). ' + esc(sentence(at.basis)) + '</figcaption>';
    $('plot-plan-rope').innerHTML = window.SwayPlot.chart({
      id: 'plan-rope', title: 'Residual swing against rope-length error, per shaper', xLabel: 'rope length error from the tuned length (%)',
      yLabel: 'residual (% of unshaped)', yFromZero: true, legendTop: true,
      bands: [{ x0: re.range_pct[0], x1: re.range_pct[1], text: 'your range' }],
      series: re.series.map(function (sr, i) {
        return { x: re.error_pct, y: sr.residual_pct, label: shaperName(sr.shaper), cls: CLS[i % CLS.length] };
      })
    }) + '<figcaption>Hatched: the plan\u2019s rope-length range. A flatter curve forgives a wrong rope length. ' + esc(sentence(re.basis)) + '</figcaption>';
  }

  function changed() {
    var st = $('plan-stale'), a = A();
    // A failed attempt's message is about the inputs as they were.
    if (P.error && !P.running) {
      P.error = null;
      var pe = $('plan-error');
      if (pe) pe.remove();
    }
    if (st && P.result && a && a.S.scenario) st.hidden = P.key === planKey(a.S.scenario);
    var lim = $('plan-limits');
    if (lim && a.S.scenario.plan) lim.outerHTML = limitsLine(a.S.scenario);
  }

  // loaded: a new scenario replaced the inputs; one with a plan block is
  // planned at once, so a planning example opens with its plan.
  function loaded() {
    P.result = null;
    P.key = null;
    P.error = null;
    P.stash = null;
    P.applied = null;
    render();
    var s = A().S.scenario;
    if (s && s.plan) run();
  }

  function bind() {
    $('plan-run').onclick = run;
    $('plan-out').addEventListener('click', function (e) {
      var b = e.target.closest && e.target.closest('[data-apply]');
      if (b && P.result) apply(Number(b.dataset.apply));
    });
  }

  window.SwayPlan = {
    inputsHTML: inputsHTML, motionHTML: motionHTML, onSelect: onSelect, onChange: onChange, onList: onList,
    render: render, changed: changed, loaded: loaded
  };
  // For the browser tests: the plan shown and whether one is being made.
  window.swaysheetPlan = {
    running: function () { return P.running; },
    count: function () { return P.count; },
    resultJSON: function () { return P.result ? JSON.stringify(P.result) : ''; }
  };
  if (document.readyState === 'loading') document.addEventListener('DOMContentLoaded', bind);
  else bind();
})();

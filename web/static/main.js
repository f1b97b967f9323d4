// main.js: the swaysheet page. It shows and collects; every figure comes
// from the core (Go compiled to wasm, run in worker.js) and every unit
// factor from the core's unit table (core/units, through the "units" call).
// The modules: engine (worker calls), state, units, fields and form,
// compute, results, storage, scenarios (links, files), plan-form and
// plan-view, charts (the core's plotter), sheet, offline.

import { plotting } from './charts.js';
import { changed, computing } from './compute.js';
import { $, notice } from './dom.js';
import { DEADLINES, call, cancel, chartsDrawn, engineError, startWorker } from './engine.js';
import { bindForm, renderForm } from './form.js';
import { bindPlan, planLoaded, renderPlan } from './plan-view.js';
import { sheetCurrent } from './sheet.js';
import { bindLibrary } from './library.js';
import './offline.js';
import { P } from './plan-form.js';
import { renderAll, renderPlots, renderSys, updateBanner } from './results.js';
import { bindExamples, bindFiles, bindShare, openLink } from './scenarios.js';
import './site-view.js';
import { S } from './state.js';
import { CURRENT, UNITS, bindSaved, keepDamaged, looksLikeScenario, saveUnits, store } from './storage.js';
import { defaultsFor } from './units.js';

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
  bindForm(); bindSaved(); bindFiles(); bindShare(); bindExamples(); bindLibrary(); bindSys();
  Promise.all([call('units'), call('ranges'), call('version')]).then(function (rs) {
    for (var i = 0; i < rs.length; i++) if (rs[i].error) { engineError(rs[i].error.message); return; }
    S.table = rs[0].result;
    S.ranges = rs[1].result;
    $('version').textContent = 'swaysheet ' + rs[2].result.version + ' \u00B7 scenario format ' + rs[2].result.format + ' v' + rs[2].result.format_version;
    S.chosen = defaultsFor('si');
    var st = store();
    try {
      var u = st && JSON.parse(st.getItem(UNITS) || 'null');
      if (u && u.chosen && typeof u.chosen === 'object') { S.sys = u.sys; Object.keys(u.chosen).forEach(function (k) { S.chosen[k] = u.chosen[k]; }); }
    } catch (e) { /* default units */ }
    readCurrent(st).then(function (cur) {
      var own = cur && show(cur);
      // The example library is asked for once the engine has answered for
      // the inputs kept from last time (it reads and checks every example
      // file: engine.js call's later); the demo, shown on a first visit,
      // waits for it.
      S.examplesLoading = true;
      var examples = call('examples', '', { later: 'examples' }).then(function (r) {
        S.examplesLoading = false;
        if (r.error) { engineError(r.error.message); return false; }
        S.examples = r.result;
        return true;
      });
      if (own) return true;
      return examples.then(function (ok) {
        if (!ok) return false;
        if (cur) damagedCurrent(JSON.stringify(cur), 'the page could not show them');
        if (!show(demo())) { engineError('No scenario to show: the example library could not be read.'); return false; }
        return true;
      });
    }).then(function (ok) {
      if (!ok) return;
      renderSys();
      openLink();
      document.body.dataset.state = 'ready';
    });
  });
}

// show puts a scenario into the empty page at the start; false when the
// form cannot show it.
function show(sc) {
  if (!sc) return false;
  S.scenario = sc;
  if (!Array.isArray(S.scenario.motions)) S.scenario.motions = [];
  try {
    renderForm();
  } catch (e) {
    return false;
  }
  updateBanner();
  changed();
  planLoaded();
  return true;
}

// readCurrent reads the inputs kept from last time, when the core reads
// them; damaged ones are kept among the saved scenarios (null).
function readCurrent(st) {
  var text = null, o;
  try { text = st ? st.getItem(CURRENT) : null; } catch (e) { text = null; }
  if (text === null) return Promise.resolve(null);
  try { o = JSON.parse(text); } catch (e) { return Promise.resolve(damagedCurrent(text, 'not readable: ' + e.message)); }
  if (!looksLikeScenario(o)) return Promise.resolve(damagedCurrent(text, 'not a swaysheet scenario'));
  return call('validate', text).then(function (r) {
    return r.error ? damagedCurrent(text, r.error.message) : o;
  });
}

function damagedCurrent(text, why) {
  var kept = keepDamaged('Inputs kept from last time', text, why);
  notice('\u26A0 The inputs kept from last time could not be used (' + why + '); the example is shown instead.' +
    (kept ? ' Their text is kept among the saved scenarios as \u201C' + kept + '\u201D.' : ''));
  return null;
}

// Print: the check sheet from the core (sheet.js), made fresh first.
$('do-print').onclick = function () {
  if (window.swaysheetSheet) window.swaysheetSheet.print();
  else window.print();
};

$('cancel-calc').onclick = cancel;

// "Use as my own": nothing of the example stays to print under the
// user's lift: its name, description and example mark go (the sheet's
// reference fields, typed by the user, stay).
$('example-own').onclick = function () {
  delete S.scenario.example;
  delete S.scenario.name;
  delete S.scenario.description;
  renderForm();
  changed();
  notice('The example\u2019s name and description are cleared: name this lift before printing.');
};

// For the browser tests and for people checking a figure: the current
// scenario as JSON (read only).
window.swaysheet = {
  scenarioJSON: function () { return JSON.stringify(S.scenario); },
  // For the check sheet (sheet.js): a core call, and the units shown.
  call: call,
  // For the browser tests: the calls' deadlines in ms (they may shorten
  // them) and Cancel.
  deadlines: DEADLINES,
  cancel: cancel,
  units: function () { return S.chosen; },
  system: function () { return S.sys; },
  resultCount: function () { return S.count; },
  chartsDrawn: function () { return chartsDrawn; },
  // loads counts the scenarios loaded from outside the form (links,
  // files, saved entries, examples).
  loads: function () { return S.loads || 0; },
  // answered is true when the core has answered for the inputs as they
  // are; settled (below) also waits for the check sheet.
  answered: function () {
    return !S.waiting && !computing() && !S.adopting && !S.keeping && !S.saying && !S.examplesLoading && (Object.keys(S.bad).length > 0 || S.lastDone === JSON.stringify(S.scenario));
  }
};
// settled: answered, the charts drawn, and the check sheet is that of the
// last result.
window.swaysheet.settled = function () { return window.swaysheet.answered() && !plotting() && sheetCurrent(); };

// The charts are drawn at the width they are shown at: again when it
// changes (a phone turned, a window resized).
let resizeTimer = null;
window.addEventListener('resize', function () {
  clearTimeout(resizeTimer);
  resizeTimer = setTimeout(function () {
    if (S.result) renderPlots(true);
    if (P.result) renderPlan();
  }, 150);
});

bindPlan();
start();

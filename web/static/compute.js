// compute.js: evaluates the inputs in the core after each change, shows
// progress and its Cancel, keeps the last valid result, then has
// results.js present it.

import { $ } from './dom.js';
import { call, unwanted } from './engine.js';
import { showErrors } from './form.js';
import { planChanged } from './plan-view.js';
import { angleChart, keepBands, markStale, presentFigures, presentHeld, presenting, showEarly, unshown, updateBanner } from './results.js';
import { S } from './state.js';
import { keepCurrent } from './storage.js';

let queued = false, busy = false, sentCount = 0, progressTimer = null, cancelTimer = null;

// computing is true while the core works on the inputs or more are due,
// or while the figures of the last result are asked for.
export function computing() { return busy || presenting(); }

// changed: the inputs changed. The core is asked at once, when the task
// that changed them ends (the changes made together, as a form redrawn,
// go as one): no wait after a keystroke. A change while the core works
// is sent at once too; a result overtaken by a change is not presented
// (evaluate), and the worker skips an evaluation overtaken before it
// began, so typing never queues more than one computation. The inputs are kept (storage.js)
// once the core has read them.
export function changed() {
  updateBanner();
  planChanged();
  S.waiting = true;
  if (queued) return;
  queued = true;
  queueMicrotask(function () { queued = false; S.waiting = false; evaluate(); });
}

function noResults() {
  if (!S.result) $('headline').innerHTML = '<p class="waiting">\u2716 No results yet: correct the marked fields.</p>';
}

// showProgress shows "Computing" after a moment and its Cancel button
// when the work runs over a second.
function showProgress(on) {
  clearTimeout(progressTimer);
  clearTimeout(cancelTimer);
  if (!on) {
    $('progress').hidden = true;
    $('cancel-calc').hidden = true;
    return;
  }
  progressTimer = setTimeout(function () { $('progress').hidden = false; document.body.dataset.state = 'computing'; }, 120);
  cancelTimer = setTimeout(function () { $('cancel-calc').hidden = false; }, 1000);
}

export function evaluate() {
  if (Object.keys(S.bad).length) {
    keepCurrent(JSON.stringify(S.scenario), false);
    unshown();
    S.coreErrors = [];
    showErrors();
    markStale(!!S.result);
    noResults();
    presentHeld();
    return;
  }
  // While the core works: its answer is wanted only if the inputs are
  // still those sent ("8" typed on to "8." leaves them so). Otherwise the
  // change is sent at once, not when that answer is back: the worker
  // leaves out what it has not begun of the answer no longer wanted
  // (engine.js unwanted, worker.js), so a change waits at most for the
  // rest of the evaluation under way, never for its trip back through a
  // page busy with the typing.
  var sent = JSON.stringify(S.scenario);
  if (busy && sent === S.lastSent) return;
  var my = ++sentCount, angle = angleChart('', true);
  S.lastSent = sent;
  if (busy) unwanted();
  busy = true;
  S.evaluating = sent;
  showProgress(true);
  // The worker draws the rope-angle chart with the result and sends it
  // first: it is shown unless the inputs changed meanwhile.
  call('evaluate', sent, { chart: angle.opt, onChart: function (c) {
    if (my === sentCount && !S.waiting) showEarly(sent, angle, c);
  }, stale: function () { return my !== sentCount; } }).then(function (r) {
    // Overtaken by a change: the answer for it follows.
    if (my !== sentCount) return;
    busy = false;
    S.evaluating = null;
    S.lastDone = sent;
    showProgress(false);
    document.body.dataset.state = 'ready';
    // Stopped or cancelled: the inputs changed meanwhile are not computed
    // until the next change, so the page has answered for them (with the
    // message; the results shown are marked as for earlier inputs).
    if (r.error && r.error.stopped && r.error.stopped !== 'failed') S.lastDone = JSON.stringify(S.scenario);
    // Kept: inputs the core evaluated; those it could not (not for their
    // fields) once it has read them.
    if (!r.error) keepCurrent(sent, true);
    else if (!(r.error.fields && r.error.fields.length)) keepCurrent(S.lastDone, false);
    if (r.error) {
      unshown();
      S.coreErrors = r.error.fields && r.error.fields.length ? r.error.fields : [{ field: '(inputs)', message: r.error.message }];
      showErrors();
      markStale(!!S.result);
      noResults();
      presentHeld();
      return;
    }
    S.coreErrors = [];
    showErrors();
    S.result = r.result;
    S.resultSent = sent;
    keepBands(r.result, r.bands);
    S.count++;
    markStale(false);
    // Inputs changed since: their result follows and is presented.
    if (S.waiting) return;
    // The verdict and figures come from the core's table (one more call,
    // answered from the bridge's memo of this result).
    presentFigures();
  });
}

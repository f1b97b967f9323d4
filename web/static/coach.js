// coach.js: the press coach. For a pendant option of the plan it counts
// the operator (or the banksman) through the presses and releases on a
// full screen: a count-in (3, 2, 1) before each timed cue, the cue in large
// words, a short coachBeep (Web Audio) and a vibration where the device has
// them. Every moment comes from the planner's JSON: the counts
// (presses[].count_s), the releases made at a mark (by_mark) and each
// release's mark (before_stop_m / before_stop_deg). The page adds the
// counts up and computes nothing else.
//
// The time source and the scheduler are replaceable (window.swaysheetCoach
// .useClock), so a test can drive the coach on a fake clock.

import { esc } from './dom.js';
import { kindOf, speedDQ, withU } from './plan-form.js';
import { fmtRes, fmtStep } from './units.js';

const REAL_CLOCK = {
  now: function () { return performance.now(); },
  after: function (ms, fn) { return setTimeout(fn, ms); },
  cancel: function (id) { clearTimeout(id); }
};
let coachClock = REAL_CLOCK;
let coachRun = null;   // the coach on screen
let coachLog = [];     // what it did: {kind, text, at_ms, planned_ms}

// LATE_MS: a cue given this much after its planned moment (a busy or
// sleeping device holds timers back) is marked late on the screen.
const COUNT_IN_MS = 1000, TICK_MS = 200, LATE_MS = 250;

// cueSteps turns the option's presses into cues in words, in the units shown.
function cueSteps(r, o) {
  var sdq = speedDQ(r), prev = 0;
  return o.presses.map(function (p, i) {
    var rel = p.release === true || p.step_pct < prev;
    prev = p.step_pct;
    var word = p.step_pct === 0 ? 'RELEASE to stop' : (rel ? 'RELEASE to ' : 'PRESS to ') + fmtRes(p.step_pct) + '\u00A0%';
    var mark = '';
    if (typeof p.before_stop_m === 'number') mark = withU('length', p.before_stop_m) + ' before the stop point';
    else if (typeof p.before_stop_deg === 'number') mark = fmtRes(p.before_stop_deg) + '\u00A0deg before the stop angle';
    return { i: i, word: word, speed: withU(sdq, Math.abs(p.speed)), mark: mark, byMark: p.by_mark === true,
      count_ms: Math.round(1000 * (p.count_s || 0)), at_s: p.at_s };
  });
}

// timingNote: the finding about a person's timing, in the units shown as
// the core put it (plan-view.js passes the plan's words in o.said).
function timingNote(o) {
  var fs = o.finding_sentences || [], said = o.said && o.said.findings, f = '';
  for (var i = 0; i < fs.length; i++) if (/9 in 10 times/.test(fs[i].text)) f = said && said[i] ? said[i] : '';
  if (!o.timing) {
    return 'These counts were checked with the presses exactly on the cues only: a person\u2019s timing scatter was NOT accounted for.';
  }
  return 'The counts allow for a person\u2019s timing scatter (' + fmtStep('time', o.timing.sigma_s) + '\u00A0s standard deviation), as the planner checked them. ' + f;
}

// markPasser names what reaches the mark: the crane's position, not the
// swinging load.
function markPasser(r) { return kindOf(r).words.passer + ' passes the mark'; }

function coachHTML(r, o, st, stale) {
  var lim = (stale ? '<p class="coach-out" id="coach-stale" role="alert"><span aria-hidden="true">\u26A0</span> The inputs changed since this plan was made: plan the move again before using these counts.</p>' : '') +
    (o.within ? '' : '<p class="coach-out" id="coach-outside" role="alert"><span aria-hidden="true">\u2716</span> This option is OUTSIDE the plan\u2019s limits: ' +
    esc(((o.said && o.said.outside) || o.outside || []).join('; ')) + '. Do not use it for the lift without the person in charge agreeing.</p>');
  var list = st.map(function (s) {
    return '<li data-step="' + s.i + '">' + esc(s.word) + ' (' + esc(s.speed) + ')' +
      (s.byMark ? ' <b>at the mark</b>' : s.i === 0 ? ' after the count-in' : ', count ' + esc(fmtRes(s.count_ms / 1000)) + '\u00A0s') +
      (s.mark ? ' \u2014 ' + esc((s.byMark ? '' : 'about ') + s.mark) : '') + '</li>';
  }).join('');
  return '<div class="coach-bar"><h2 id="coach-h">Press coach: ' + esc(o.label) + '</h2>' +
    '<button type="button" id="coach-stop" class="coach-stop">Stop</button></div>' + lim +
    '<div class="coach-main" aria-live="assertive">' +
    '<p class="coach-late" id="coach-late" role="alert" hidden></p>' +
    '<p class="coach-count" id="coach-count"></p>' +
    '<p class="coach-cue" id="coach-cue">Ready</p>' +
    '<p class="coach-sub" id="coach-sub">Tap Start: a count of 3, 2, 1, then ' + esc(st[0].word) + '.</p>' +
    '<p class="coach-mark" id="coach-mark"></p>' +
    '<p class="coach-next"><span id="coach-next"></span> <b id="coach-left" aria-hidden="true"></b></p>' +
    '<button type="button" id="coach-start" class="coach-go">Start</button>' +
    '<button type="button" id="coach-marked" class="coach-go" hidden>Released at the mark</button></div>' +
    '<details class="coach-steps"><summary>All cues</summary><ol id="coach-list">' + list + '</ol></details>' +
    '<p class="coach-note" id="coach-timing">' + esc(timingNote(o)) + '</p>' +
    '<ul class="coach-cautions"><li><span aria-hidden="true">\u26A0</span> Stop the move if the load swings more than the plan allows.</li>' +
    '<li><span aria-hidden="true">\u26A0</span> No one under the load.</li>' +
    '<li><span aria-hidden="true">\u26A0</span> A release \u201Cat the mark\u201D is made where the ' + markPasser(r) +
    ', not by the clock. The counts are an estimate from a simplified model; the person in charge of the lift decides.</li></ul>';
}

// ------------------------------------------------------------- running

function cel(id) { return document.getElementById(id); }

function coachLater(me, at_ms, fn) {
  var id = coachClock.after(Math.max(0, at_ms - coachClock.now()), function () {
    me.timers.delete(id);
    if (coachRun === me) fn();
  });
  me.timers.add(id);
}

function coachBeep(me, hz, ms) {
  if (!me.audio) return;
  try {
    var osc = me.audio.createOscillator(), g = me.audio.createGain();
    osc.frequency.value = hz;
    g.gain.value = 0.3;
    osc.connect(g);
    g.connect(me.audio.destination);
    osc.start();
    osc.stop(me.audio.currentTime + ms / 1000);
    me.oscs.push(osc);
    if (me.oscs.length > 8) me.oscs.shift();
  } catch (e) { /* no sound: the screen still shows the cue */ }
}

function coachBuzz(pattern) {
  try { if (navigator.vibrate) navigator.vibrate(pattern); } catch (e) { /* no vibration */ }
}

function logCue(kind, text, at, planned) {
  coachLog.push({ kind: kind, text: text, at_ms: at, planned_ms: planned });
}

function countIn(me, n, planned) {
  cel('coach-count').textContent = String(n);
  coachBeep(me, 660, 80);
  coachBuzz(60);
  logCue('count', String(n), coachClock.now(), planned);
}

function fireCue(me, s, planned) {
  cel('coach-count').textContent = '';
  cel('coach-cue').textContent = s.word;
  cel('coach-sub').textContent = s.speed;
  cel('coach-mark').textContent = s.mark ? (s.byMark ? 'at ' : 'about ') + s.mark : '';
  cel('coach-cue').className = 'coach-cue ' + (/^PRESS/.test(s.word) ? 'press' : 'release');
  coachBeep(me, 990, 180);
  coachBuzz(200);
  logCue('cue', s.word, coachClock.now(), planned);
  var late = coachClock.now() - planned;
  if (late > LATE_MS) {
    cel('coach-late').hidden = false;
    cel('coach-late').textContent = '\u26A0 The device gave this cue ' + fmtRes(late / 1000) + '\u00A0s late: do not rely on the counts; stop the move if unsure.';
  }
  document.querySelectorAll('#coach-list li').forEach(function (li) { li.classList.toggle('now', Number(li.dataset.step) === s.i); });
}

// nextCue schedules step k: its count-in and cue, from base (the planned
// moment of the cue before it), or a wait for the mark.
function nextCue(me, k, base) {
  me.k = k;
  if (k >= me.steps.length) {
    me.due = null;
    cel('coach-next').textContent = 'All cues given. Watch the load settle before landing it.';
    logCue('done', '', coachClock.now(), base);
    return;
  }
  var s = me.steps[k];
  if (s.byMark) {
    me.due = null;
    var prevAt = me.steps[k - 1] ? me.steps[k - 1].at_s : 0, last = me.steps[k - 1];
    cel('coach-sub').textContent = last ? 'Now holding: ' + last.word.replace(/^(PRESS|RELEASE) to /, '') + ', ' + last.speed : '';
    cel('coach-cue').textContent = 'At the mark: ' + s.word;
    cel('coach-cue').className = 'coach-cue waiting';
    cel('coach-mark').textContent = s.mark;
    cel('coach-next').textContent = 'Release where the ' + me.passes + ', not by the clock (planned about ' + fmtRes(s.at_s - prevAt) +
      '\u00A0s after the last cue). Tap \u201CReleased at the mark\u201D as you release.';
    cel('coach-marked').hidden = false;
    me.waiting = k;
    return;
  }
  var at = base + (k === 0 ? 3 * COUNT_IN_MS : s.count_ms);
  me.due = at;
  cel('coach-next').textContent = 'Next: ' + s.word + (s.mark ? ' (about ' + s.mark + ')' : '');
  for (var n = 3; n >= 1; n--) {
    var c = at - n * COUNT_IN_MS;
    if (c >= base) coachLater(me, c, countIn.bind(null, me, n, c));
  }
  coachLater(me, at, function () {
    fireCue(me, s, at);
    nextCue(me, k + 1, at);
  });
}

function coachTick(me) {
  var left = me.due === null ? null : (me.due - coachClock.now()) / 1000;
  cel('coach-left').textContent = left !== null && left > 0 ? 'in ' + Math.ceil(left) + '\u00A0s' : '';
  coachLater(me, coachClock.now() + TICK_MS, function () { coachTick(me); });
}

function startCoach(me) {
  cel('coach-start').hidden = true;
  var AC = window.AudioContext || window.webkitAudioContext;
  try { me.audio = AC ? new AC() : null; } catch (e) { me.audio = null; }
  // Phones start sound only from a tap, sometimes suspended.
  try { if (me.audio && me.audio.resume) me.audio.resume(); } catch (e) { /* no sound */ }
  // Keep the screen on while counting, where the browser allows it.
  try {
    if (navigator.wakeLock && navigator.wakeLock.request) {
      navigator.wakeLock.request('screen').then(function (l) { if (coachRun === me) me.lock = l; else l.release(); }, function () {});
    }
  } catch (e) { /* the screen may dim */ }
  coachBuzz(1);
  logCue('start', '', coachClock.now(), coachClock.now());
  nextCue(me, 0, coachClock.now());
  coachTick(me);
}

function markedCue(me) {
  if (me.waiting === null) return;
  var k = me.waiting, now = coachClock.now();
  me.waiting = null;
  cel('coach-marked').hidden = true;
  fireCue(me, me.steps[k], now);
  nextCue(me, k + 1, now);
}

// stopCoach ends the coach at once: no cue, sound or vibration after it.
export function stopCoach() {
  var me = coachRun;
  if (!me) return;
  coachRun = null;
  me.timers.forEach(function (id) { coachClock.cancel(id); });
  me.timers.clear();
  me.oscs.forEach(function (o) { try { o.stop(); } catch (e) { /* already stopped */ } });
  if (me.audio && me.audio.close) { try { me.audio.close(); } catch (e) { /* closed */ } }
  coachBuzz(0);
  if (me.lock) { try { me.lock.release(); } catch (e) { /* released */ } }
  logCue('stop', '', coachClock.now(), coachClock.now());
  me.box.remove();
  me.behind.forEach(function (e) { e.inert = false; });
  document.removeEventListener('keydown', me.key);
  document.body.classList.remove('coaching');
  if (me.back && me.back.focus) me.back.focus();
}

// openCoach shows the coach for option o of plan r (an option with
// presses); back gets the focus again after Stop; stale marks a plan made
// for earlier inputs.
export function openCoach(r, o, back, stale) {
  stopCoach();
  var box = document.createElement('div');
  box.id = 'coach';
  box.className = 'coach';
  box.setAttribute('role', 'dialog');
  box.setAttribute('aria-modal', 'true');
  box.setAttribute('aria-labelledby', 'coach-h');
  var st = cueSteps(r, o);
  box.innerHTML = coachHTML(r, o, st, stale);
  // The page behind cannot be reached (Tab, a screen reader) while the
  // coach is open.
  var behind = Array.prototype.filter.call(document.body.children, function (e) { return !e.inert; });
  behind.forEach(function (e) { e.inert = true; });
  document.body.appendChild(box);
  document.body.classList.add('coaching');
  var me = { box: box, steps: st, timers: new Set(), oscs: [], audio: null, due: null, waiting: null, k: 0, back: back, passes: markPasser(r), behind: behind };
  me.key = function (e) { if (e.key === 'Escape') stopCoach(); };
  document.addEventListener('keydown', me.key);
  coachRun = me;
  coachLog = [];
  cel('coach-stop').onclick = stopCoach;
  cel('coach-start').onclick = function () { startCoach(me); };
  cel('coach-marked').onclick = function () { markedCue(me); };
  cel('coach-start').focus();
}

// For the browser tests: replace the clock ({now, after, cancel}) and read
// what the coach did.
window.swaysheetCoach = {
  useClock: function (c) { coachClock = c || REAL_CLOCK; },
  logJSON: function () { return JSON.stringify(coachLog); },
  running: function () { return coachRun !== null; }
};

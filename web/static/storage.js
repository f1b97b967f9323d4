// storage.js: what the page keeps in this browser: the working inputs (once
// the core has read them), the unit choice and the saved scenarios, each
// its own entry so that a damaged one touches no other.

import { $, download, esc, notice } from './dom.js';
import { call } from './engine.js';
import { adopt } from './scenarios.js';
import { S } from './state.js';

export const SAVED = 'swaysheet.saved.v1:', CURRENT = 'swaysheet.current.v1', UNITS = 'swaysheet.units.v1';

export function store() {
  try { return window.localStorage; } catch (e) { return null; }
}
// keepCurrent keeps the inputs (text, the scenario JSON) in this browser
// once the core has read them: the kept inputs are always a scenario the
// page can show again (a value the core rejects is not kept; the one
// before it is). read: the core has evaluated text without an error
// (compute.js), so it is kept at once; otherwise the core is asked to read
// it when it has nothing else to do.
let keepSeq = 0, keptSeq = 0;
export function keepCurrent(text, read) {
  var st = store();
  if (!st) return;
  var my = ++keepSeq;
  var keep = function () {
    if (my < keptSeq) return;
    keptSeq = my;
    try { st.setItem(CURRENT, text); } catch (e) { notice('The inputs could not be kept in this browser: ' + e.message); }
  };
  if (read) { keep(); return; }
  S.keeping = (S.keeping || 0) + 1;
  call('validate', text, { later: 'keep' }).then(function (r) {
    S.keeping--;
    if (!r.error) keep();
  });
}
// keepInSaved keeps the inputs among the saved scenarios under why and
// the time (before a planned move replaces the motions).
export function keepInSaved(why) {
  var st = store();
  if (!st) return false;
  try {
    st.setItem(SAVED + why + ' ' + new Date().toISOString().slice(0, 19).replace('T', ' '), JSON.stringify({ saved_at: new Date().toISOString(), scenario: S.scenario }));
    return true;
  } catch (e) { return false; }
}

export function saveUnits() {
  var st = store();
  if (st) try { st.setItem(UNITS, JSON.stringify({ sys: S.sys, chosen: S.chosen })); } catch (e) { /* not kept */ }
}

export function looksLikeScenario(o) {
  return o && typeof o === 'object' && !Array.isArray(o) && o.format === 'swaysheet-scenario';
}

// savedEntries lists the saved scenarios. An entry that cannot be read
// (or was kept as damaged, see keepDamaged) is listed as damaged with its
// raw text; the others are not affected.
function savedEntries() {
  var st = store(), out = [];
  if (!st) return out;
  for (var i = 0; i < st.length; i++) {
    var k = st.key(i);
    if (!k || k.indexOf(SAVED) !== 0) continue;
    var name = k.slice(SAVED.length), raw = st.getItem(k), e = { name: name, key: k, raw: raw };
    try {
      var o = JSON.parse(raw);
      if (o && typeof o.damaged === 'string') {
        e.damaged = o.damaged;
        e.raw = typeof o.raw === 'string' ? o.raw : raw;
      } else {
        if (!o || !looksLikeScenario(o.scenario)) throw new Error('not a scenario');
        if (o.saved_at !== undefined && typeof o.saved_at !== 'string') throw new Error('its date is not a date');
        e.scenario = o.scenario;
        e.saved_at = o.saved_at;
      }
    } catch (err) {
      e.damaged = 'the stored entry cannot be read: ' + err.message;
    }
    out.push(e);
  }
  out.sort(function (a, b) { return a.name.localeCompare(b.name); });
  return out;
}

// keepDamaged keeps text the page could not use among the saved
// scenarios, listed as damaged, so that it can be exported and mended.
export function keepDamaged(what, text, why) {
  var st = store();
  if (!st) return '';
  var name = what + ' ' + new Date().toISOString().slice(0, 19).replace('T', ' ') + ' (damaged)';
  try {
    st.setItem(SAVED + name, JSON.stringify({ saved_at: new Date().toISOString(), damaged: why, raw: text }));
    return name;
  } catch (e) { return ''; }
}

function savedRow(e, i) {
  if (e.damaged) {
    return '<li class="damaged"><span>\u26A0 \u201C' + esc(e.name) + '\u201D is damaged (' + esc(e.damaged) + ') and cannot be opened.</span>' +
      '<span class="btns"><button type="button" data-sraw="' + i + '">Export its text</button><button type="button" data-sdel="' + i + '">Delete</button></span></li>';
  }
  return '<li><span><b>' + esc(e.name) + '</b><br><small>' + esc(String(e.scenario.name || '')) + (e.saved_at ? ' \u00B7 saved ' + esc(e.saved_at.replace('T', ' ').slice(0, 16)) : '') + '</small></span>' +
    '<span class="btns"><button type="button" data-sopen="' + i + '">Open</button>' +
    '<button type="button" data-sren="' + i + '">Rename</button>' +
    '<button type="button" data-sdel="' + i + '">Delete</button></span></li>';
}

function renderSaved() {
  var list = savedEntries();
  $('saved-list').innerHTML = list.length ? list.map(function (e, i) {
    try {
      return savedRow(e, i);
    } catch (err) {
      e.damaged = 'it cannot be shown: ' + err.message;
      e.scenario = null;
      return savedRow(e, i);
    }
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

export function bindSaved() {
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
      adopt(JSON.stringify(en.scenario), '\u201C' + en.name + '\u201D', 'Opened \u201C' + en.name + '\u201D.').then(function (ok) {
        if (ok) $('dlg-saved').close();
        else $('save-msg').textContent = $('notice').textContent;
      });
    } else if (el.dataset.sraw !== undefined) {
      var ed = list[Number(el.dataset.sraw)];
      download(ed.raw, ed.name.replace(/[^A-Za-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) + '.txt', 'text/plain');
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

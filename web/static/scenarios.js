// scenarios.js: scenarios from outside the form: links, files, saved
// entries, examples (adopted only when the core reads them).

import { changed } from './compute.js';
import { $, download, esc, notice } from './dom.js';
import { call } from './engine.js';
import { renderForm } from './form.js';
import { planLoaded } from './plan-view.js';
import { importRecord, isRecord } from './record.js';
import { updateBanner } from './results.js';
import { S } from './state.js';
import { SAVED, looksLikeScenario, store } from './storage.js';

// load shows a scenario the core has read (see adopt). Should the form
// still fail to show it, the inputs before it are put back.
function load(sc, msg) {
  var prev = { scenario: S.scenario, bad: S.bad, coreErrors: S.coreErrors, windStash: S.windStash, hookStash: S.hookStash };
  S.scenario = sc;
  S.bad = {};
  S.coreErrors = [];
  S.windStash = null;
  S.hookStash = null;
  if (!Array.isArray(S.scenario.motions)) S.scenario.motions = [];
  S.loads = (S.loads || 0) + 1;
  try {
    renderForm();
  } catch (e) {
    Object.keys(prev).forEach(function (k) { S[k] = prev[k]; });
    renderForm();
    notice('\u2716 The scenario could not be shown (' + e.message + '); the previous inputs are kept.');
    return false;
  }
  updateBanner();
  if (msg) notice(msg);
  changed();
  planLoaded();
  return true;
}

// adopt loads scenario text from outside the form (a link, a file, a
// saved entry) only when the core reads it: what the core rejects leaves
// the inputs as they were, with the core's message. before runs just
// before the inputs are replaced.
export function adopt(text, source, okMsg, before) {
  var o, fail = function (why) {
    notice('\u2716 ' + source + ' does not hold a readable scenario (' + why + '); the previous inputs are kept.');
    return false;
  };
  try { o = JSON.parse(text); } catch (e) { return Promise.resolve(fail(e.message)); }
  if (!looksLikeScenario(o)) return Promise.resolve(fail('its "format" is not "swaysheet-scenario"'));
  S.adopting = (S.adopting || 0) + 1;
  return call('validate', text).then(function (r) {
    S.adopting--;
    if (r.error) return fail(r.error.message);
    if (before) before(o);
    return load(o, okMsg);
  });
}

function fileName() {
  var n = (S.scenario.name || 'scenario').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '');
  return (n || 'scenario').slice(0, 60) + '.json';
}

export function bindFiles() {
  $('do-export').onclick = function () {
    var name = fileName();
    download(JSON.stringify(S.scenario, null, 2) + '\n', name, 'application/json');
    notice('Exported ' + name + '.');
  };
  $('import-file').onchange = function (e) {
    var f = e.target.files && e.target.files[0];
    if (!f) return;
    var rd = new FileReader();
    rd.onload = function () {
      e.target.value = '';
      var text = String(rd.result);
      // A drive record (CSV) becomes a recorded move (record.js).
      if (isRecord(f.name, text)) importRecord(text, f.name);
      else adopt(text, f.name, 'Imported ' + f.name + '.');
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
  return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
}
function shareURL() {
  return location.href.split('#')[0] + '#s=' + encodeShare(S.scenario);
}

// openLink loads the scenario of the URL fragment, first keeping the
// inputs it replaces among the saved scenarios. It returns whether the
// fragment was a link of the page's.
export function openLink() {
  var frag = location.hash, z = /^#z=[A-Za-z0-9_-]+$/.test(frag), m = /^#s=([A-Za-z0-9_-]+)$/.exec(frag);
  if (!z && !m) return false;
  history.replaceState(null, '', location.href.split('#')[0]);
  var okMsg = 'Opened the scenario from the link.';
  if (z) {
    // #z= links: the check sheet's QR code (the scenario's canonical JSON,
    // compressed; read by the core's "unshare" call).
    S.adopting = (S.adopting || 0) + 1;
    call('unshare', frag).then(function (r) {
      S.adopting--;
      if (r.error) {
        notice('\u2716 The link does not hold a readable scenario (' + r.error.message + '); the previous inputs are kept.');
        return;
      }
      adopt(JSON.stringify(r.result), 'The link', okMsg, keepBeforeLink);
    });
    return true;
  }
  var text;
  try { text = decodeShare(m[1]); } catch (e) { text = null; }
  if (text === null) {
    notice('\u2716 The link does not hold a readable scenario (it is not base64url-encoded UTF-8 text); the previous inputs are kept.');
    return true;
  }
  adopt(text, 'The link', okMsg, keepBeforeLink);
  return true;
}

function keepBeforeLink(o) {
  if (S.scenario && JSON.stringify(S.scenario) !== JSON.stringify(o) && !S.scenario.example) {
    var st = store();
    if (st) try { st.setItem(SAVED + 'Kept before opening a link ' + new Date().toISOString().slice(0, 19).replace('T', ' '), JSON.stringify({ saved_at: new Date().toISOString(), scenario: S.scenario })); } catch (e) { /* ignore */ }
  }
}

export function bindShare() {
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

export function bindExamples() {
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

// site-figures.js: under the site plan, each obstacle's clearance figures
// as a crew reads them, the worst first: its name, the core's verdict
// against the margin, then every row the core gives (closest approach,
// where along the path and when, how often it is struck, the room under
// the load...) with the core's words, rounded text and unit, and the
// engineers' rows folded. The "clearance_figures" call presents the
// report the page shows (sent with it, so nothing is checked again), in
// the units shown; the page neither converts nor rounds nor orders.

import { $, esc } from './dom.js';
import { call } from './engine.js';
import { S } from './state.js';
import { unitsKey } from './words.js';

// CF is what is shown: the report and units key it is of, the reply, the
// request waiting.
const CF = { report: null, key: null, reply: null, error: null, asking: null };

// showObstacleFigures shows the figures of report (the last full check,
// or null) in #clearance-figures; note says when it is of earlier inputs
// or runs are going. It asks the core again only when the report or the
// units shown changed.
export function showObstacleFigures(report, note) {
  var box = $('clearance-figures');
  if (!box) return;
  var key = unitsKey();
  if (!report) { CF.report = null; CF.reply = null; CF.error = null; drawObstacleFigures(box, note); return; }
  if (CF.report === report && CF.key === key) { drawObstacleFigures(box, note); return; }
  if (CF.asking && CF.asking.report === report && CF.asking.key === key) return;
  var asked = CF.asking = { report: report, key: key };
  var input = '{"scenario":' + S.resultSent + ',"units":' + JSON.stringify(S.chosen) + ',"system":' + JSON.stringify(S.sys === 'us' ? 'us' : 'si') +
    ',"report":' + JSON.stringify(report) + '}';
  call('clearance_figures', input).then(function (r) {
    if (CF.asking !== asked) return;
    CF.asking = null;
    CF.report = report;
    CF.key = key;
    CF.reply = r.error ? null : r.result;
    CF.error = r.error ? r.error.message : null;
    var b = $('clearance-figures');
    if (b) drawObstacleFigures(b, CF.note);
  });
  CF.note = note;
}

function clrRowsHTML(rows) {
  return rows.map(function (r) {
    return '<div class="clr-row" data-key="' + esc(r.key) + '"><dt>' + esc(r.crew) + '</dt><dd>' + esc(r.text) + (r.unit ? ' ' + esc(r.unit) : '') + '</dd></div>';
  }).join('');
}

function clrDetailHTML(rows) {
  if (!rows.length) return '';
  return '<details class="clr-detail"><summary>For engineers</summary><dl>' + rows.map(function (r) {
    return '<div class="clr-row" data-key="' + esc(r.key) + '"><dt>' + esc(r.technical) + '</dt><dd>' + esc(r.text) + (r.unit ? ' ' + esc(r.unit) : '') + '</dd></div>';
  }).join('') + '</dl></details>';
}

function clrSplit(rows) {
  return { crew: rows.filter(function (r) { return !r.detail; }), detail: rows.filter(function (r) { return r.detail; }) };
}

// draw writes the list: the obstacles in the core's worst_first order
// (the site's order when the reply has none).
function drawObstacleFigures(box, note) {
  CF.note = note;
  var h = ['<h3 class="clr-head">Each obstacle, worst first</h3>'];
  if (note) h.push('<p class="clr-note">' + esc(note) + '</p>');
  if (CF.error) h.push('<p class="clr-note">\u2716 The figures could not be presented: ' + esc(CF.error) + '</p>');
  var rep = CF.reply;
  if (!rep && !note && !CF.error) { h = []; }
  if (rep) {
    var order = rep.worst_first || rep.obstacles.map(function (o, i) { return i; });
    h.push('<ol class="clr-list">');
    order.forEach(function (i) {
      var o = rep.obstacles[i];
      if (!o) return;
      var rs = clrSplit(o.rows || []), v = o.verdict || '';
      h.push('<li class="clr-ob ' + (o.keeps ? 'ok' : 'out') + '" data-ob="' + i + '"><h4>' + esc(o.name || 'obstacle ' + (i + 1)) + '</h4>' +
        (v ? '<p class="clr-verdict">' + (o.keeps ? '\u2714 ' : '\u2716 ') + esc(v) + '</p>' : '') +
        '<dl>' + clrRowsHTML(rs.crew) + '</dl>' + clrDetailHTML(rs.detail) + '</li>');
    });
    h.push('</ol>');
    var all = clrSplit(rep.rows || []);
    if (all.crew.length || all.detail.length) {
      h.push('<details class="clr-check"><summary>The check as a whole: margin, keep-out area, spreads</summary><dl>' + clrRowsHTML(all.crew) + '</dl>' + clrDetailHTML(all.detail) + '</details>');
    }
  }
  var html = h.join('');
  if (box.dataset.drawn !== html) { box.innerHTML = html; box.dataset.drawn = html; } // open folds stay open
}

// obstacleFiguresSettled: no figures asked for and not yet shown.
export function obstacleFiguresSettled() { return !CF.asking; }

// obstacleFigures is the reply shown (for the browser tests).
export function obstacleFigures() { return CF.reply; }

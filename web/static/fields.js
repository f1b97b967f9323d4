// fields.js: the form's field builders (HTML strings) and the unit
// choosers.

import { esc } from './dom.js';
import { S, fieldId, getPath, rangeKey } from './state.js';
import { DISPLAY, SHOWN_QUANTITIES, baseOf, fmtField, fmtRange, toShown, unitOf } from './units.js';

// PV follows each control: a plain-text copy of its value for paper,
// where a text box would cut long text (filled in by syncPrint).
const PV = '<span class="pv" aria-hidden="true"></span>';

export function syncPrint(el) {
  var pv = el.nextElementSibling;
  if (!pv || !pv.classList.contains('pv')) return;
  pv.textContent = el.tagName === 'SELECT' ? (el.selectedOptions[0] ? el.selectedOptions[0].textContent : '') : el.value;
}

// numField describes one number input bound to a scenario path.
export function numField(path, label, opts) {
  opts = opts || {};
  var r = S.ranges[rangeKey(path)] || {};
  var dq = opts.dq || r.quantity || '';
  var u = dq ? unitOf(dq) : { symbol: r.unit || '', to_si: 1 };
  var v = getPath(S.scenario, path);
  var text = '';
  if (S.bad[path] !== undefined) text = S.bad[path].text;
  else if (typeof v === 'number') text = fmtField(dq ? toShown(dq, v) : v, dq);
  var hint = '';
  if (r.text !== undefined) {
    var lo = dq ? toShown(dq, r.min) : r.min, hi = dq ? toShown(dq, r.max) : r.max;
    hint = (r.open_min ? 'above ' : '') + fmtRange(lo, 'min') + ' to ' + fmtRange(hi, 'max') + (u.symbol ? ' ' + u.symbol : '');
  }
  if (opts.hint) hint = opts.hint + (hint ? '; ' + hint : '');
  var id = opts.id || fieldId(path);
  return '<div class="field" data-field="' + esc(path) + '">' +
    '<label for="' + id + '">' + esc(label) + (opts.optional ? ' <span class="opt">(optional)</span>' : '') + '</label>' +
    '<div class="with-unit"><input id="' + id + '" type="text" inputmode="decimal" spellcheck="false" data-path="' + esc(path) + '" data-dq="' + esc(dq) + '"' +
    (opts.optional ? ' data-optional="1"' : '') + ' value="' + esc(text) + '" aria-describedby="' + id + '-unit ' + id + '-hint ' + id + '-msg">' + PV +
    '<span class="unit" id="' + id + '-unit">' + esc(u.symbol || '\u00A0') + '</span></div>' +
    '<p class="hint" id="' + id + '-hint">' + esc(hint) + '</p>' +
    '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
}

export function selectField(path, label, options, value, extra) {
  var id = fieldId(path);
  return '<div class="field" data-field="' + esc(path) + '"><label for="' + id + '">' + esc(label) + '</label>' +
    '<select id="' + id + '" data-select="' + esc(path) + '"' + (extra || '') + '>' +
    options.map(function (o) {
      return '<option value="' + esc(o[0]) + '"' + (o[0] === value ? ' selected' : '') + '>' + esc(o[1]) + '</option>';
    }).join('') + '</select>' + PV + '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
}

export function textField(path, label, multiline, wide) {
  var id = fieldId(path), v = getPath(S.scenario, path) || '';
  var input = multiline ?
    '<textarea id="' + id + '" data-text="' + esc(path) + '" rows="3">' + esc(v) + '</textarea>' :
    '<input id="' + id + '" type="text" data-text="' + esc(path) + '" value="' + esc(v) + '">';
  return '<div class="field' + (multiline || wide ? ' wide' : '') + '" data-field="' + esc(path) + '"><label for="' + id + '">' + esc(label) + '</label>' + input + PV +
    '<p class="msg" id="' + id + '-msg" role="alert"></p></div>';
}

export function section(title, body, id) {
  return '<fieldset class="card"' + (id ? ' id="' + id + '"' : '') + '><legend>' + esc(title) + '</legend><div class="grid">' + body + '</div></fieldset>';
}

export function unitChoosers() {
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

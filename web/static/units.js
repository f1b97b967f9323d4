// units.js: display units from the core's unit table (the "units" call)
// and number formats. Conversions use the core's factors only.

import { S } from './state.js';

// Display quantities: the core's quantities plus wind speed, which is a
// speed shown in its own units.
export const DISPLAY = {
  wind_speed: { base: 'speed', si: 'm/s', us: 'ft/s', label: 'wind speed' }
};
export const SHOWN_QUANTITIES = ['length', 'mass', 'speed', 'acceleration', 'angular_speed', 'angular_acceleration', 'force', 'area', 'wind_speed'];

export function baseOf(dq) { return DISPLAY[dq] ? DISPLAY[dq].base : dq; }

export function unitOf(dq) {
  var q = S.table.quantities[baseOf(dq)];
  if (!q) return { symbol: '', to_si: 1 };
  var sym = S.chosen[dq];
  for (var i = 0; i < q.units.length; i++) if (q.units[i].symbol === sym) return q.units[i];
  return q.units[0];
}

export function defaultsFor(sys) {
  var c = {};
  Object.keys(S.table.quantities).forEach(function (k) {
    var q = S.table.quantities[k];
    c[k] = sys === 'us' ? q.us_default : q.si_default;
  });
  Object.keys(DISPLAY).forEach(function (k) { c[k] = DISPLAY[k][sys]; });
  return c;
}

// toShown and toSI convert with the core's factors: SI = shown * to_si.
export function toShown(dq, v) { return v / unitOf(dq).to_si; }
export function toSI(dq, v) { return v * unitOf(dq).to_si; }

// Field values: 10 significant digits (the scenario keeps the full
// value in SI, so SI -> US -> SI shows the number typed); results: 4.
export function fmtField(v) { return Number(v.toPrecision(10)).toString(); }
// Range bounds: 6 significant digits, so a bound is not rounded past
// itself (10 m/s is 1968.5 ft/min, not 1969).
export function fmtRange(v) { return Number(v.toPrecision(6)).toString(); }
export function fmtRes(v) {
  if (!isFinite(v)) return '\u2014';
  return Number(v.toPrecision(4)).toString();
}

// parseNumber reads a typed number; a comma alone is taken as the
// decimal mark. It returns NaN for anything else.
export function parseNumber(t) {
  t = t.trim().replace(/\u2212/g, '-');
  if (t.indexOf(',') >= 0 && t.indexOf('.') < 0) t = t.replace(',', '.');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) return NaN;
  return Number(t);
}

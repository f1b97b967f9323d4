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

// Field values: in the SI view's units as typed (10 significant digits,
// so SI -> US -> SI shows the number typed); converted into another unit
// (US units, m/min) rounded to four significant digits, as a person
// would type it (8.5 m shows 27.89 ft, not 27.88713911). The scenario
// keeps the full value; only a field that is typed in is read again.
export function fmtField(v, dq) {
  if (dq && unitOf(dq).symbol !== siDefault(dq)) return Number(v.toPrecision(4)).toString();
  return Number(v.toPrecision(10)).toString();
}
function siDefault(dq) {
  if (DISPLAY[dq]) return DISPLAY[dq].si;
  var q = S.table.quantities[dq];
  return q ? q.si_default : '';
}
// Range bounds: four significant digits, rounded inward (side 'min'
// up, 'max' down) so that a bound as shown is accepted: 0.3 m shows
// 0.9843 ft, 500 m 1640 ft. Without a side, six significant digits.
export function fmtRange(v, side) {
  if (side !== 'min' && side !== 'max') return Number(v.toPrecision(6)).toString();
  var r = Number(v.toPrecision(4));
  if (r === v || v === 0) return r.toString();
  var e = Math.pow(10, Math.floor(Math.log10(Math.abs(v))) - 3);
  r = side === 'min' ? Math.ceil(v / e - 1e-9) * e : Math.floor(v / e + 1e-9) * e;
  return Number(r.toPrecision(4)).toString();
}
// fmtStep: a value in the units shown (dq's unit), rounded as the core
// rounds figures for people (the unit's step: 0.1 deg, 1 cm, 0.05 ft,
// 0.1 s, 0.1 kN), in fixed notation.
export function fmtStep(dq, v) {
  if (!isFinite(v)) return '\u2014';
  var st = unitOf(dq).step;
  if (!(st > 0)) return fmtRes(v);
  var d = 0;
  while (d < 6 && Math.abs(st * Math.pow(10, d) - Math.round(st * Math.pow(10, d))) > 1e-9) d++;
  var t = (Math.round(v / st) * st).toFixed(d);
  return /^-0(\.0*)?$/.test(t) ? t.slice(1) : t;
}
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

// plot.js: a small SVG line plotter for swaysheet. It draws what it is
// given (already converted to the units shown) and computes no physics.
// Kept in the repo rather than vendored: the page needs four plain line
// charts with axes, units, shaded time bands and equal-aspect plan views,
// which is about two hundred lines; see DEVELOPERS.md.

import { esc } from './dom.js';

const NS = 'http://www.w3.org/2000/svg';


// niceStep returns a round tick step (1, 2 or 5 times a power of ten)
// giving about n ticks over span.
function niceStep(span, n) {
  if (!(span > 0)) return 1;
  var raw = span / n;
  var p = Math.pow(10, Math.floor(Math.log10(raw)));
  var f = raw / p;
  return (f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10) * p;
}

function ticks(lo, hi, n) {
  var step = niceStep(hi - lo, n);
  var out = [];
  for (var v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) {
    out.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  }
  return out;
}

function tickText(v) {
  var s = Number(v.toPrecision(6)).toString();
  return s.replace('-', '\u2212');
}

function extent(series, key, extra) {
  var lo = Infinity, hi = -Infinity;
  series.forEach(function (s) {
    s[key].forEach(function (v) {
      if (isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
    });
  });
  (extra || []).forEach(function (v) {
    if (isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
  });
  if (!isFinite(lo)) { lo = 0; hi = 1; }
  if (hi - lo < 1e-12) { var c = lo; lo = c - (Math.abs(c) * 0.1 || 0.5); hi = c + (Math.abs(c) * 0.1 || 0.5); }
  return [lo, hi];
}

// chart draws an SVG line chart.
// opt: {title, xLabel, yLabel, series: [{x: [], y: [], label, cls}],
//       bands: [{x0, x1, text}], hlines: [{y, label}], equal: bool,
//       circles: [{r, label}], yFromZero: bool, width, height,
//       legendTop: bool (legend in rows above the plot, off the lines)}
// The title is HTML above the SVG (it wraps on a narrow screen). Drawn at
// the width it is shown (see fitWidth), the SVG's text keeps its CSS size.
export function chart(opt) {
  var W = opt.width || 640, H = opt.height || 300;
  var m = { l: 72, r: 16, t: 12, b: 56 };
  var rows = [];
  var legendWidth = opt.series.reduce(function (a, s) { return a + 44 + 8.5 * String(s.label).length; }, 8);
  if ((opt.legendTop || legendWidth > W - m.l - m.r) && opt.series.length > 1) {
    var x0 = m.l, row = [];
    opt.series.forEach(function (s) {
      var w = 44 + 8.5 * String(s.label).length;
      if (row.length && x0 + w > W - m.r) { rows.push(row); row = []; x0 = m.l; }
      row.push({ s: s, x: x0 });
      x0 += w;
    });
    rows.push(row);
    m.t += 22 * rows.length;
    H += 22 * rows.length;
  }
  var pw = W - m.l - m.r, ph = H - m.t - m.b;
  var extraY = (opt.hlines || []).map(function (h) { return h.y; });
  var xr = extent(opt.series, 'x', []);
  var yr = extent(opt.series, 'y', extraY.concat(opt.yFromZero ? [0] : []));
  (opt.circles || []).forEach(function (c) {
    xr = [Math.min(xr[0], -c.r), Math.max(xr[1], c.r)];
    yr = [Math.min(yr[0], -c.r), Math.max(yr[1], c.r)];
  });
  var padY = (yr[1] - yr[0]) * 0.06;
  yr = [yr[0] - (opt.yFromZero && yr[0] >= 0 ? 0 : padY), yr[1] + padY];
  if (opt.equal) {
    var padX = (xr[1] - xr[0]) * 0.04;
    xr = [xr[0] - padX, xr[1] + padX];
    var sx = pw / (xr[1] - xr[0]), sy = ph / (yr[1] - yr[0]);
    var s = Math.min(sx, sy);
    var cx = (xr[0] + xr[1]) / 2, cy = (yr[0] + yr[1]) / 2;
    xr = [cx - pw / s / 2, cx + pw / s / 2];
    yr = [cy - ph / s / 2, cy + ph / s / 2];
  }
  function X(v) { return m.l + (v - xr[0]) / (xr[1] - xr[0]) * pw; }
  function Y(v) { return m.t + ph - (v - yr[0]) / (yr[1] - yr[0]) * ph; }
  var o = [];
  o.push('<p class="chart-title">' + esc(opt.title) + '</p>');
  o.push('<svg xmlns="' + NS + '" viewBox="0 0 ' + W + ' ' + H + '" role="img" aria-label="' + esc(opt.title) + '" class="chart">');
  o.push('<defs><pattern id="hatch-' + opt.id + '" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">' +
    '<rect width="8" height="8" class="band-bg"/><line x1="0" y1="0" x2="0" y2="8" class="band-line"/></pattern>' +
    '<clipPath id="clip-' + opt.id + '"><rect x="' + m.l + '" y="' + m.t + '" width="' + pw + '" height="' + ph + '"/></clipPath></defs>');
  (opt.bands || []).forEach(function (b) {
    var x0 = Math.max(X(b.x0), m.l), x1 = Math.min(X(b.x1), m.l + pw);
    if (x1 - x0 < 0.5) return;
    o.push('<rect x="' + x0.toFixed(1) + '" y="' + m.t + '" width="' + (x1 - x0).toFixed(1) + '" height="' + ph + '" fill="url(#hatch-' + opt.id + ')" class="band"/>');
    if (b.text) o.push('<text x="' + ((x0 + x1) / 2).toFixed(1) + '" y="' + (m.t + 14) + '" class="band-text" text-anchor="middle">' + esc(b.text) + '</text>');
  });
  // grid and ticks
  ticks(xr[0], xr[1], Math.max(3, Math.round(pw / (opt.equal ? 80 : 64)))).forEach(function (v) {
    var x = X(v).toFixed(1);
    o.push('<line x1="' + x + '" y1="' + m.t + '" x2="' + x + '" y2="' + (m.t + ph) + '" class="grid"/>');
    o.push('<text x="' + x + '" y="' + (m.t + ph + 20) + '" text-anchor="middle" class="tick">' + tickText(v) + '</text>');
  });
  ticks(yr[0], yr[1], 5).forEach(function (v) {
    var y = Y(v).toFixed(1);
    o.push('<line x1="' + m.l + '" y1="' + y + '" x2="' + (m.l + pw) + '" y2="' + y + '" class="grid"/>');
    o.push('<text x="' + (m.l - 8) + '" y="' + y + '" dy="0.35em" text-anchor="end" class="tick">' + tickText(v) + '</text>');
  });
  o.push('<rect x="' + m.l + '" y="' + m.t + '" width="' + pw + '" height="' + ph + '" class="frame"/>');
  o.push('<g clip-path="url(#clip-' + opt.id + ')">');
  (opt.circles || []).forEach(function (c) {
    var r = Math.abs(X(c.r) - X(0));
    o.push('<circle cx="' + X(0).toFixed(1) + '" cy="' + Y(0).toFixed(1) + '" r="' + r.toFixed(1) + '" class="limit"/>');
  });
  (opt.hlines || []).forEach(function (h) {
    var y = Y(h.y).toFixed(1);
    o.push('<line x1="' + m.l + '" y1="' + y + '" x2="' + (m.l + pw) + '" y2="' + y + '" class="limit"/>');
    var below = Y(h.y) < m.t + 20;
    o.push('<text x="' + (m.l + pw - 6) + '" y="' + y + '" dy="' + (below ? '1.1em' : '-0.4em') + '" text-anchor="end" class="limit-text">' + esc(h.label) + '</text>');
  });
  opt.series.forEach(function (s) {
    var d = [];
    for (var i = 0; i < s.x.length; i++) {
      if (!isFinite(s.x[i]) || !isFinite(s.y[i])) continue;
      d.push((d.length ? 'L' : 'M') + X(s.x[i]).toFixed(1) + ' ' + Y(s.y[i]).toFixed(1));
    }
    o.push('<path d="' + d.join('') + '" class="line ' + (s.cls || '') + '"/>');
  });
  o.push('</g>');
  o.push('<text x="' + (m.l + pw / 2) + '" y="' + (H - 10) + '" text-anchor="middle" class="axis-label">' + esc(opt.xLabel) + '</text>');
  o.push('<text transform="translate(18 ' + (m.t + ph / 2) + ') rotate(-90)" text-anchor="middle" class="axis-label">' + esc(opt.yLabel) + '</text>');
  // legend
  rows.forEach(function (row, i) {
    var y = 18 + 22 * i;
    row.forEach(function (it) {
      o.push('<line x1="' + it.x + '" y1="' + y + '" x2="' + (it.x + 26) + '" y2="' + y + '" class="line ' + (it.s.cls || '') + '"/>');
      o.push('<text x="' + (it.x + 32) + '" y="' + y + '" dy="0.35em" class="legend">' + esc(it.s.label) + '</text>');
    });
  });
  var lx = m.l + 8;
  if (opt.series.length > 1 && !rows.length) {
    opt.series.forEach(function (s) {
      o.push('<line x1="' + lx + '" y1="' + (m.t + ph - 12) + '" x2="' + (lx + 26) + '" y2="' + (m.t + ph - 12) + '" class="line ' + (s.cls || '') + '"/>');
      o.push('<text x="' + (lx + 32) + '" y="' + (m.t + ph - 12) + '" dy="0.35em" class="legend">' + esc(s.label) + '</text>');
      lx += 44 + 8.5 * String(s.label).length;
    });
  }
  o.push('</svg>');
  return o.join('');
}

// fitWidth is the width to draw a chart in el at: the width it is shown
// at, from 300 (a phone) to 640 px (wider, the SVG is scaled up).
export function fitWidth(el) {
  var w = el ? el.clientWidth - 12 : 640;
  return Math.max(300, Math.min(640, Math.round(w || 640)));
}

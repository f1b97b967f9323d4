// site-plan.js: the site plan from above (SVG): the obstacles of the
// scenario's site block with their top heights, the 50 % and 95 %
// envelopes and the exclusion zone as the core's clearance report gives
// them (cell spans), the load's path with no spread and the crane's path
// (the suspension point, from the evaluation's history). Obstacles are
// edited by pointer (mouse, touch, pen): drag one to move it, drag a
// handle to resize a box or move a corner. Nothing is computed but the
// drawing: positions on screen and the obstacle's own outline.

import { esc } from './dom.js';
import { fmtRes, toShown, unitOf } from './units.js';

// HIT is the radius (CSS px) of a handle's touch target: 48 px across.
const HIT = 24;

// outlineOf is an obstacle's outline from above as [[x, y], ...] in m:
// its corners, or its box's four corners (turned by angle_deg from x
// toward y about its centre).
export function outlineOf(o) {
  if (o.box) {
    var b = o.box, a = (b.angle_deg || 0) * Math.PI / 180, c = Math.cos(a), s = Math.sin(a);
    var hl = (b.length_m || 0) / 2, hw = (b.width_m || 0) / 2;
    return [[-hl, -hw], [hl, -hw], [hl, hw], [-hl, hw]].map(function (p) {
      return [(b.centre_x_m || 0) + p[0] * c - p[1] * s, (b.centre_y_m || 0) + p[0] * s + p[1] * c];
    });
  }
  return (o.corners || []).map(function (p) { return [p.x_m || 0, p.y_m || 0]; });
}

// view fits the drawing into width CSS px: the extent of the obstacles,
// envelopes and paths, equal scales, y up.
export function makeView(site, rep, paths, width) {
  var lo = [Infinity, Infinity], hi = [-Infinity, -Infinity];
  function grow(x, y) {
    if (!isFinite(x) || !isFinite(y)) return;
    lo[0] = Math.min(lo[0], x); lo[1] = Math.min(lo[1], y); hi[0] = Math.max(hi[0], x); hi[1] = Math.max(hi[1], y);
  }
  (site.obstacles || []).forEach(function (o) { outlineOf(o).forEach(function (p) { grow(p[0], p[1]); }); });
  if (rep) rep.envelope_95.spans.forEach(function (s) { grow(s.X0M, s.Y0M); grow(s.X1M, s.Y1M); });
  paths.forEach(function (p) { for (var i = 0; i < p.x.length; i++) grow(p.x[i], p.y[i]); });
  if (!isFinite(lo[0])) { lo = [-5, -5]; hi = [5, 5]; }
  var pad = Math.max(hi[0] - lo[0], hi[1] - lo[1]) * 0.06 + 0.5;
  lo = [lo[0] - pad, lo[1] - pad]; hi = [hi[0] + pad, hi[1] + pad];
  var left = 50, bottom = 34, top = 8, right = 8;
  var pw = Math.max(width - left - right, 120), k = pw / (hi[0] - lo[0]);
  var ph = (hi[1] - lo[1]) * k, maxH = Math.max(260, Math.min(window.innerHeight * 0.7, 640));
  if (ph > maxH) { ph = maxH; k = ph / (hi[1] - lo[1]); }
  // Centre the plan across the width when the height limits it.
  var x0 = lo[0] - (pw / k - (hi[0] - lo[0])) / 2;
  return { lo: [x0, lo[1]], hi: [x0 + pw / k, hi[1]], k: k, left: left, top: top, pw: pw, ph: ph,
    width: left + pw + right, height: top + ph + bottom,
    px: function (x) { return left + (x - x0) * k; },
    py: function (y) { return top + (hi[1] - y) * k; },
    world: function (cx, cy) { return [x0 + (cx - left) / k, hi[1] - (cy - top) / k]; } };
}

function planTicks(lo, hi, n) {
  var raw = (hi - lo) / n, mag = Math.pow(10, Math.floor(Math.log10(raw))), step = mag;
  [1, 2, 2.5, 5, 10].some(function (m) { step = m * mag; return m * mag >= raw; });
  var out = [];
  for (var t = Math.ceil(lo / step) * step; t <= hi && out.length < 40; t += step) out.push(t);
  return out;
}

function spansPath(v, spans) {
  return spans.map(function (s) {
    return 'M' + v.px(s.X0M).toFixed(1) + ' ' + v.py(s.Y1M).toFixed(1) + 'H' + v.px(s.X1M).toFixed(1) +
      'V' + v.py(s.Y0M).toFixed(1) + 'H' + v.px(s.X0M).toFixed(1) + 'z';
  }).join('');
}

function line(v, p) {
  var d = '';
  for (var i = 0; i < p.x.length; i++) d += (i ? 'L' : 'M') + v.px(p.x[i]).toFixed(1) + ' ' + v.py(p.y[i]).toFixed(1);
  return d;
}

// planSVG draws the plan. sel is the selected obstacle's index (its
// handles are drawn) or -1; paths are [{x, y, cls, label}] in m.
export function planSVG(v, site, rep, paths, sel) {
  var L = unitOf('length').symbol, h = [];
  h.push('<svg id="site-svg" class="site-svg" width="' + v.width.toFixed(0) + '" height="' + v.height.toFixed(0) + '" viewBox="0 0 ' +
    v.width.toFixed(1) + ' ' + v.height.toFixed(1) + '" role="img" aria-label="Site plan from above: obstacles, envelopes and the exclusion zone">');
  h.push('<defs><pattern id="site-hatch" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">' +
    '<rect width="8" height="8" class="zone-bg"/><line x1="0" y1="0" x2="0" y2="8" class="zone-line"/></pattern></defs>');
  h.push('<rect x="' + v.left + '" y="' + v.top + '" width="' + v.pw.toFixed(1) + '" height="' + v.ph.toFixed(1) + '" class="frame"/>');
  // Ticks at round numbers of the length unit shown.
  var f = unitOf('length').to_si;
  planTicks(v.lo[0] / f, v.hi[0] / f, Math.max(3, Math.floor(v.pw / 70))).forEach(function (t) {
    var x = v.px(t * f).toFixed(1);
    h.push('<line x1="' + x + '" x2="' + x + '" y1="' + v.top + '" y2="' + (v.top + v.ph).toFixed(1) + '" class="grid"/>' +
      '<text x="' + x + '" y="' + (v.top + v.ph + 14).toFixed(1) + '" text-anchor="middle">' + esc(fmtRes(t)) + '</text>');
  });
  planTicks(v.lo[1] / f, v.hi[1] / f, Math.max(3, Math.floor(v.ph / 60))).forEach(function (t) {
    var y = v.py(t * f).toFixed(1);
    h.push('<line y1="' + y + '" y2="' + y + '" x1="' + v.left + '" x2="' + (v.left + v.pw).toFixed(1) + '" class="grid"/>' +
      '<text x="' + (v.left - 4) + '" y="' + (Number(y) + 4) + '" text-anchor="end">' + esc(fmtRes(t)) + '</text>');
  });
  h.push('<text x="' + (v.left + v.pw / 2).toFixed(1) + '" y="' + (v.height - 4).toFixed(1) + '" text-anchor="middle">x (' + esc(L) + ')</text>');
  var my = (v.top + v.ph / 2).toFixed(1);
  h.push('<text x="12" y="' + my + '" text-anchor="middle" transform="rotate(-90 12 ' + my + ')">y (' + esc(L) + ')</text>');
  if (rep) {
    h.push('<path class="env95" d="' + spansPath(v, rep.envelope_95.spans) + '"/>');
    h.push('<path class="env50" d="' + spansPath(v, rep.envelope_50.spans) + '"/>');
  }
  paths.forEach(function (p) { h.push('<path class="' + p.cls + '" d="' + line(v, p) + '"/>'); });
  var margin = site.margin_m || 0;
  (site.obstacles || []).forEach(function (o, i) {
    var pts = outlineOf(o), d = pts.map(function (p, j) { return (j ? 'L' : 'M') + v.px(p[0]).toFixed(1) + ' ' + v.py(p[1]).toFixed(1); }).join('') + 'z';
    if (margin > 0) h.push('<path class="margin" d="' + d + '" stroke-width="' + (2 * margin * v.k).toFixed(1) + '"/>');
    // The touch target: the outline and a band 24 px wide around it.
    h.push('<path class="ob-hit" d="' + d + '" stroke-width="' + 2 * HIT + '" data-ob="' + i + '"/>');
    h.push('<path class="obstacle' + (i === sel ? ' selected' : '') + '" d="' + d + '" data-ob="' + i + '"><title>' + esc(o.name || 'obstacle ' + (i + 1)) + '</title></path>');
  });
  // Names with the tops when there is room; else the tops alone (the
  // names are on the obstacles' cards below and on the one selected).
  var roomy = v.pw / Math.max(1, (site.obstacles || []).length) > 170;
  (site.obstacles || []).forEach(function (o, i) {
    var pts = outlineOf(o), cx = 0, ty = -Infinity;
    pts.forEach(function (p) { cx += p[0] / pts.length; ty = Math.max(ty, p[1]); });
    var top = typeof o.top_m === 'number' ? ', top ' + fmtRes(toShown('length', o.top_m)) + ' ' + L : '';
    var name = roomy || i === sel ? (o.name || 'obstacle ' + (i + 1)) + top : top.replace(/^, /, '');
    h.push('<text class="ob-label" x="' + v.px(cx).toFixed(1) + '" y="' + Math.max(v.py(ty) - 6, 12).toFixed(1) + '" text-anchor="middle">' +
      esc(name) + '</text>');
  });
  if (sel >= 0 && site.obstacles && site.obstacles[sel]) {
    outlineOf(site.obstacles[sel]).forEach(function (p, j) {
      var x = v.px(p[0]).toFixed(1), y = v.py(p[1]).toFixed(1);
      h.push('<circle class="handle-hit" cx="' + x + '" cy="' + y + '" r="' + HIT + '" data-handle="' + j + '" data-ob="' + sel + '"/>' +
        '<circle class="handle" cx="' + x + '" cy="' + y + '" r="8"/>');
    });
  }
  h.push('</svg>');
  return h.join('');
}

// dragEdit is what a drag does to obstacle o (a copy is changed): the
// pointer moved from world point a to b. handle < 0 moves the whole
// obstacle; on a box, handle j drags corner j with the opposite corner
// fixed; on corners, handle j moves that corner.
export function dragEdit(o, handle, a, b) {
  var dx = b[0] - a[0], dy = b[1] - a[1];
  if (handle < 0) {
    if (o.box) { o.box.centre_x_m = r2(o.box.centre_x_m + dx); o.box.centre_y_m = r2(o.box.centre_y_m + dy); }
    else o.corners.forEach(function (c) { c.x_m = r2(c.x_m + dx); c.y_m = r2(c.y_m + dy); });
    return o;
  }
  if (!o.box) {
    o.corners[handle].x_m = r2(b[0]);
    o.corners[handle].y_m = r2(b[1]);
    return o;
  }
  var bx = o.box, pts = outlineOf(o), opp = pts[(handle + 2) % 4];
  var ang = (bx.angle_deg || 0) * Math.PI / 180, c = Math.cos(ang), s = Math.sin(ang);
  // The dragged corner's new place in the box's own axes from the fixed one.
  var ux = b[0] - opp[0], uy = b[1] - opp[1];
  var along = ux * c + uy * s, across = -ux * s + uy * c;
  bx.length_m = Math.max(0.05, r2(Math.abs(along)));
  bx.width_m = Math.max(0.05, r2(Math.abs(across)));
  var sa = along < 0 ? -1 : 1, sc = across < 0 ? -1 : 1;
  bx.centre_x_m = r2(opp[0] + (sa * bx.length_m * c - sc * bx.width_m * s) / 2);
  bx.centre_y_m = r2(opp[1] + (sa * bx.length_m * s + sc * bx.width_m * c) / 2);
  return o;
}

// r2 keeps a dragged position to the centimetre.
function r2(v) { return Math.round(v * 100) / 100; }

// sectionSVG draws the core's vertical section along the crane's path
// (report.section): the bands the load's lowest point stays in (95 %
// hatched, 50 % grey), its path with no spread (solid) and the hook's
// (dashed), and the obstacles passed with their tops, distances along the
// path across, heights up, in the length unit shown.
export function sectionSVG(sec, width) {
  if (!sec || !sec.nominal || !sec.nominal.length) return '';
  var f = unitOf('length').to_si, L = unitOf('length').symbol;
  var d0 = Infinity, d1 = -Infinity, z1 = sec.suspension_height_m || 0;
  function grow(d) { if (isFinite(d)) { d0 = Math.min(d0, d); d1 = Math.max(d1, d); } }
  sec.nominal.forEach(function (p) { grow(p.distance_m); });
  [sec.envelope_95, sec.envelope_50].forEach(function (b) { b.distance_m.forEach(function (d) { grow(d); grow(d + b.bin_m); }); });
  (sec.obstacles || []).forEach(function (o) { grow(o.from_m); grow(o.to_m); z1 = Math.max(z1, o.top_m); });
  if (!(d1 > d0)) d1 = d0 + 1;
  var left = 50, right = 8, top = 8, bottom = 34, pw = Math.max(width - left - right, 120), ph = 150;
  var kx = pw / (d1 - d0), ky = ph / (z1 * 1.05);
  function px(d) { return (left + (d - d0) * kx).toFixed(1); }
  function py(z) { return (top + ph - z * ky).toFixed(1); }
  var h = ['<svg id="site-section" class="site-svg" width="' + (left + pw + right).toFixed(0) + '" height="' + (top + ph + bottom) + '" viewBox="0 0 ' +
    (left + pw + right).toFixed(1) + ' ' + (top + ph + bottom) + '" role="img" aria-label="Vertical section along the crane\u2019s path">'];
  h.push('<rect x="' + left + '" y="' + top + '" width="' + pw.toFixed(1) + '" height="' + ph + '" class="frame"/>');
  planTicks(d0 / f, d1 / f, Math.max(3, Math.floor(pw / 70))).forEach(function (t) {
    h.push('<text x="' + px(t * f) + '" y="' + (top + ph + 14) + '" text-anchor="middle">' + esc(fmtRes(t)) + '</text>');
  });
  planTicks(0, z1 * 1.05 / f, 4).forEach(function (t) {
    h.push('<line x1="' + left + '" x2="' + (left + pw).toFixed(1) + '" y1="' + py(t * f) + '" y2="' + py(t * f) + '" class="grid"/>' +
      '<text x="' + (left - 4) + '" y="' + (Number(py(t * f)) + 4) + '" text-anchor="end">' + esc(fmtRes(t)) + '</text>');
  });
  h.push('<text x="' + (left + pw / 2).toFixed(1) + '" y="' + (top + ph + bottom - 4) + '" text-anchor="middle">along the path (' + esc(L) + ')</text>');
  h.push('<text x="12" y="' + (top + ph / 2) + '" text-anchor="middle" transform="rotate(-90 12 ' + (top + ph / 2) + ')">height (' + esc(L) + ')</text>');
  [[sec.envelope_95, 'env95'], [sec.envelope_50, 'env50']].forEach(function (e) {
    var b = e[0], d = '';
    for (var i = 0; i < b.distance_m.length; i++) {
      d += 'M' + px(b.distance_m[i]) + ' ' + py(b.high_m[i]) + 'H' + px(b.distance_m[i] + b.bin_m) + 'V' + py(b.low_m[i]) + 'H' + px(b.distance_m[i]) + 'z';
    }
    h.push('<path class="' + e[1] + '" d="' + d + '"/>');
  });
  (sec.obstacles || []).forEach(function (o) {
    h.push('<rect class="obstacle-side" x="' + px(o.from_m) + '" y="' + py(o.top_m) + '" width="' + Math.max((o.to_m - o.from_m) * kx, 2).toFixed(1) +
      '" height="' + (o.top_m * ky).toFixed(1) + '"><title>' + esc(o.name) + '</title></rect>');
  });
  ['low_m', 'hook_m'].forEach(function (k) {
    var d = sec.nominal.map(function (p, i) { return (i ? 'L' : 'M') + px(p.distance_m) + ' ' + py(p[k]); }).join('');
    h.push('<path class="' + (k === 'low_m' ? 'load-path' : 'crane-path') + '" d="' + d + '"/>');
  });
  h.push('</svg>');
  return h.join('');
}

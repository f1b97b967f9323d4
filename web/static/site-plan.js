// site-plan.js: the site plan from above and the vertical section, drawn
// by the core's plotter (core/sheet sitedraw.go, the same that draws the
// check sheet's plan view) through the "site_plot" call and put in the
// page as charts.js puts its charts. The page keeps only the pointer
// overlay: the handles of the selected obstacle and the mapping of a
// pointer to metres with the transform the core returns with the plan
// (x = x_m + px * m_per_px, y = y_m - py * m_per_px), for the edit it
// sends to the form. Nothing else is computed here.

import { safeSVG } from './charts.js';
import { call } from './engine.js';

// HIT is the radius (CSS px) of a handle's touch target: 48 px across.
const HIT = 24;
const NS = 'http://www.w3.org/2000/svg';

let sitePending = null, siteAsking = false;

// askSite asks the core for the plan of input (the "site_plot" call's:
// scenario, units, system, report_for, report, width_px, max_height_px,
// selected, frame); done(reply) is told of the answer unless a newer
// request came meanwhile. One call at a time: a drag's moves coalesce.
export function askSite(input, done) {
  sitePending = { input: input, done: done };
  if (!siteAsking) next();
}

function next() {
  var w = sitePending;
  sitePending = null;
  if (!w) return;
  siteAsking = true;
  call('site_plot', JSON.stringify(w.input)).then(function (r) {
    siteAsking = false;
    if (!sitePending) w.done(r);
    next();
  });
}

// siteDrawing is true while a drawing is asked for.
export function siteDrawing() { return siteAsking || !!sitePending; }

// putSVG puts the core's SVG text into fig in place of the one there (or
// first), with the id given; false when it is not one plain drawing.
export function putSVG(fig, text, id) {
  var svg = text ? safeSVG(text) : null;
  if (!svg) return false;
  svg.id = id;
  var old = fig.querySelector('svg');
  if (old) fig.replaceChild(svg, old);
  else fig.insertBefore(svg, fig.firstChild);
  return true;
}

// toMetres maps a pointer at (clientX, clientY) to metres on the plan
// whose box on screen is rect, by the core's transform frame.
export function toMetres(frame, rect, clientX, clientY) {
  var s = frame.width_px / (rect.width || frame.width_px);
  return [frame.x_m + (clientX - rect.left) * s * frame.m_per_px, frame.y_m - (clientY - rect.top) * s * frame.m_per_px];
}

// showHandles draws the handles of obstacle sel at the corners of its
// outline (the core's, in metres) over the plan svg; none when sel < 0.
// When two corners are closer on screen than a handle's target (a small
// obstacle on a phone), every handle is set out from its corner by HANDLE_OUT
// px along the corner's outward bisector, with a line back to it: the
// targets then do not overlap one another (a rectangle's neighbours end
// at least 51 px apart) and leave the obstacle itself free to drag.
export function showHandles(svg, frame, outline, sel) {
  if (!svg) return;
  var old = svg.querySelector('.handle-layer');
  if (old) old.remove();
  if (sel < 0 || !outline || !frame) return;
  var g = document.createElementNS(NS, 'g'), s = frame.width_px / (svg.getBoundingClientRect().width || frame.width_px);
  g.setAttribute('class', 'handle-layer');
  var pts = outline.map(function (p) { return [(p.X - frame.x_m) / frame.m_per_px, (frame.y_m - p.Y) / frame.m_per_px]; });
  var at = handlePlaces(pts, s);
  pts.forEach(function (p, j) {
    var x = at[j][0].toFixed(1), y = at[j][1].toFixed(1);
    if (at[j][0] !== p[0] || at[j][1] !== p[1]) g.appendChild(svgShape('line', { 'class': 'handle-lead', x1: p[0].toFixed(1), y1: p[1].toFixed(1), x2: x, y2: y }));
    g.appendChild(svgShape('circle', { 'class': 'handle-hit', cx: x, cy: y, r: (HIT * s).toFixed(1), 'data-handle': j, 'data-ob': sel }));
    g.appendChild(svgShape('circle', { 'class': 'handle', cx: x, cy: y, r: (8 * s).toFixed(1) }));
  });
  svg.appendChild(g);
}

// HANDLE_OUT is how far (CSS px) a handle is set out from its corner when the
// corners are too close for their targets.
const HANDLE_OUT = 36;

// handlePlaces gives each corner's handle centre (drawing units; s of
// them to a CSS px): the corner itself when every two corners are at
// least a target (2 HIT px) apart, else set out by HANDLE_OUT px along the
// outward bisector of its corner (away from the outline's inside, also
// at a corner turned inward).
export function handlePlaces(pts, s) {
  var n = pts.length, near = Infinity, area = 0;
  for (var i = 0; i < n; i++) {
    var a = pts[i], b = pts[(i + 1) % n];
    area += a[0] * b[1] - b[0] * a[1];
    for (var j = i + 1; j < n; j++) near = Math.min(near, Math.hypot(pts[j][0] - a[0], pts[j][1] - a[1]) / s);
  }
  if (near >= 2 * HIT || n < 3) return pts;
  return pts.map(function (p, i) {
    var u = unitToward(pts[(i + n - 1) % n], p), v = unitToward(pts[(i + 1) % n], p);
    var bx = u[0] + v[0], by = u[1] + v[1], l = Math.hypot(bx, by);
    // At a corner that turns the way the outline runs, u + v points
    // inside; at one turned against it, outside.
    var turn = (p[0] - pts[(i + n - 1) % n][0]) * (pts[(i + 1) % n][1] - p[1]) - (p[1] - pts[(i + n - 1) % n][1]) * (pts[(i + 1) % n][0] - p[0]);
    var out;
    if (l < 1e-9) out = area > 0 ? [-u[1], u[0]] : [u[1], -u[0]]; // straight on: the edge's outward normal
    else if (turn * area > 0) out = [-bx / l, -by / l];
    else out = [bx / l, by / l];
    return [p[0] + out[0] * HANDLE_OUT * s, p[1] + out[1] * HANDLE_OUT * s];
  });
}

// unit is the unit vector from p to q ([0, 0] when they meet).
function unitToward(q, p) {
  var dx = q[0] - p[0], dy = q[1] - p[1], l = Math.hypot(dx, dy);
  return l > 0 ? [dx / l, dy / l] : [0, 0];
}

function svgShape(tag, attrs) {
  var e = document.createElementNS(NS, tag);
  Object.keys(attrs).forEach(function (k) { e.setAttribute(k, attrs[k]); });
  return e;
}

// nearestHandle is, of the handles of the layer under the pointer at
// (clientX, clientY), the one whose centre is nearest (the target hit
// may overlap another's on a crowded outline); null when none is.
export function nearestHandle(svg, clientX, clientY) {
  var best = null, bd = Infinity;
  svg.querySelectorAll('.handle-hit').forEach(function (h) {
    var r = h.getBoundingClientRect(), d = Math.hypot(clientX - (r.left + r.width / 2), clientY - (r.top + r.height / 2));
    if (d <= r.width / 2 && d < bd) { best = h; bd = d; }
  });
  return best;
}

// dragEdit is what a drag does to obstacle o (a copy is changed): the
// pointer moved from point a to b (m). handle < 0 moves the whole
// obstacle; on a box, handle j drags corner j of its outline (the core's)
// by the pointer's move, the opposite corner fixed; on corners, handle j
// moves that corner by it (a handle may sit away from its corner).
export function dragEdit(o, handle, a, b, outline) {
  var dx = b[0] - a[0], dy = b[1] - a[1];
  if (handle < 0) {
    if (o.box) { o.box.centre_x_m = r2(o.box.centre_x_m + dx); o.box.centre_y_m = r2(o.box.centre_y_m + dy); }
    else o.corners.forEach(function (c) { c.x_m = r2(c.x_m + dx); c.y_m = r2(c.y_m + dy); });
    return o;
  }
  if (!o.box) {
    o.corners[handle].x_m = r2(o.corners[handle].x_m + dx);
    o.corners[handle].y_m = r2(o.corners[handle].y_m + dy);
    return o;
  }
  var bx = o.box, opp = outline[(handle + 2) % 4];
  var ang = (bx.angle_deg || 0) * Math.PI / 180, c = Math.cos(ang), s = Math.sin(ang);
  // The dragged corner's new place in the box's own axes from the fixed one.
  var ux = outline[handle].X + dx - opp.X, uy = outline[handle].Y + dy - opp.Y;
  var along = ux * c + uy * s, across = -ux * s + uy * c;
  bx.length_m = Math.max(0.05, r2(Math.abs(along)));
  bx.width_m = Math.max(0.05, r2(Math.abs(across)));
  var sa = along < 0 ? -1 : 1, sc = across < 0 ? -1 : 1;
  bx.centre_x_m = r2(opp.X + (sa * bx.length_m * c - sc * bx.width_m * s) / 2);
  bx.centre_y_m = r2(opp.Y + (sa * bx.length_m * s + sc * bx.width_m * c) / 2);
  return o;
}

// r2 keeps a dragged position to the centimetre.
function r2(v) { return Math.round(v * 100) / 100; }

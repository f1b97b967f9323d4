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
export function showHandles(svg, frame, outline, sel) {
  if (!svg) return;
  var old = svg.querySelector('.handle-layer');
  if (old) old.remove();
  if (sel < 0 || !outline || !frame) return;
  var g = document.createElementNS(NS, 'g'), s = frame.width_px / (svg.getBoundingClientRect().width || frame.width_px);
  g.setAttribute('class', 'handle-layer');
  outline.forEach(function (p, j) {
    var x = ((p.X - frame.x_m) / frame.m_per_px).toFixed(1), y = ((frame.y_m - p.Y) / frame.m_per_px).toFixed(1);
    [['handle-hit', HIT], ['handle', 8]].forEach(function (c) {
      var e = document.createElementNS(NS, 'circle');
      e.setAttribute('class', c[0]);
      e.setAttribute('cx', x);
      e.setAttribute('cy', y);
      e.setAttribute('r', (c[1] * s).toFixed(1));
      if (c[0] === 'handle-hit') { e.dataset.handle = j; e.dataset.ob = sel; }
      g.appendChild(e);
    });
  });
  svg.appendChild(g);
}

// dragEdit is what a drag does to obstacle o (a copy is changed): the
// pointer moved from point a to b (m). handle < 0 moves the whole
// obstacle; on a box, handle j drags corner j of its outline (the core's)
// with the opposite corner fixed; on corners, handle j moves that corner.
export function dragEdit(o, handle, a, b, outline) {
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
  var bx = o.box, opp = outline[(handle + 2) % 4];
  var ang = (bx.angle_deg || 0) * Math.PI / 180, c = Math.cos(ang), s = Math.sin(ang);
  // The dragged corner's new place in the box's own axes from the fixed one.
  var ux = b[0] - opp.X, uy = b[1] - opp.Y;
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

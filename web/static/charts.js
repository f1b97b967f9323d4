// charts.js: the page's charts, drawn by the core's plotter (core/sheet
// svg.go, the same that draws the check sheet's plots) through the "plot"
// call. The page gives the values already in the units shown; the core's
// SVG is parsed as SVG, checked to hold only drawing elements (no script,
// no event handler, no outside link) and put in the page as nodes.

import { esc } from './dom.js';
import { call } from './engine.js';

let chartAsked = {}, chartsDrawing = 0;

// fitWidth is the width to draw a chart in el at: the width it is shown
// at, from 300 (a phone) to 640 px (wider, the SVG is scaled up). The
// core sizes the chart's viewBox to it, so its text keeps its size. It is
// measured once and again only when el's width changes (a
// ResizeObserver): reading it forces the page's layout, which would hold
// up a change's evaluate call. known: only a width measured before (0
// when there is none).
const widths = {}, boxes = {}, sized = typeof ResizeObserver === 'function' ?
  new ResizeObserver(function (es) {
    es.forEach(function (e) {
      var id = e.target.id, w = e.contentRect.width;
      if (id in boxes && boxes[id] !== w) delete widths[id];
      boxes[id] = w;
    });
  }) : null;
function fitWidth(el, known) {
  if (!el) return 640;
  if (sized && widths[el.id]) return widths[el.id];
  if (known) return 0;
  var w = Math.max(300, Math.min(640, Math.round(el.clientWidth - 12 || 640)));
  if (sized && el.id) {
    sized.observe(el);
    widths[el.id] = w;
  }
  return w;
}

// plotting is true while a chart is being drawn.
export function plotting() { return chartsDrawing > 0; }

const SVG_ELEMENTS = /^(svg|g|defs|clipPath|pattern|rect|line|path|circle|ellipse|polyline|text|tspan|title)$/;

// safeSVG parses the core's SVG text; null when it is not one plain
// drawing. Attributes that could run or fetch anything are dropped. It is
// read by the page's own HTML parser into a template, where nothing runs
// or loads, and is checked there before it goes into the page: several
// times quicker than an XML parse and a copy into the page, which a
// change's rope-angle chart waits for.
const SVG_NS = 'http://www.w3.org/2000/svg';
export function safeSVG(text) {
  var t = document.createElement('template');
  t.innerHTML = String(text);
  var root = t.content.firstElementChild;
  if (!root || t.content.childElementCount !== 1 || root.localName !== 'svg' || root.namespaceURI !== SVG_NS) return null;
  for (var c = t.content.firstChild; c; c = c.nextSibling) if (c !== root && !(c.nodeType === 3 && !c.data.trim())) return null;
  // (The attributes are read by name: el.attributes would make a node of
  // each, which took as long as the parse.)
  var all = root.getElementsByTagName('*');
  for (var i = -1; i < all.length; i++) {
    var el = i < 0 ? root : all[i];
    if (el.namespaceURI !== SVG_NS || !SVG_ELEMENTS.test(el.localName)) return null;
    var names = el.getAttributeNames();
    for (var j = names.length - 1; j >= 0; j--) {
      var a = names[j], n = a.toLowerCase(), v = el.getAttribute(a);
      if (n.indexOf('on') === 0 || n === 'style' || /href$/.test(n) || (/url\(/i.test(v) && !/^\s*url\(#[a-z0-9_-]+\)\s*$/i.test(v))) el.removeAttribute(a);
    }
  }
  return document.adoptNode(root);
}

// chartInput completes opt, the "plot" call's input (id, title, x_label,
// y_label, series, lines, bands, circles, equal, y_from_zero,
// legend_top), for the figure fig: the width it is shown at, the title
// above. known: only a width measured before (0 when there is none).
export function chartInput(fig, opt, known) {
  opt.width_px = fitWidth(fig, known);
  opt.title_above = true;
  return opt;
}

// drawChart asks the core for the chart opt at the width fig is shown,
// and puts it in fig (showChart). An answer overtaken by a later drawing
// of the same figure is dropped. later: the call waits until the engine
// has nothing else to do, and a later drawing of the figure takes its
// place (engine.js call's later).
export function drawChart(fig, opt, caption, later) {
  if (!fig) return Promise.resolve();
  var n = (chartAsked[fig.id] || 0) + 1;
  chartAsked[fig.id] = n;
  chartsDrawing++;
  return call('plot', JSON.stringify(chartInput(fig, opt)), later ? { later: 'plot:' + fig.id } : undefined).then(function (r) {
    chartsDrawing--;
    if (chartAsked[fig.id] === n) put(fig, opt, caption, r);
  });
}

// showChart puts the plot reply r of opt into fig, in place of any
// drawing of it still asked for.
export function showChart(fig, opt, caption, r) {
  chartAsked[fig.id] = (chartAsked[fig.id] || 0) + 1;
  put(fig, opt, caption, r);
}

// put puts the chart in fig with its title above and the caption (HTML)
// below; a failed one keeps the chart shown and says why.
function put(fig, opt, caption, r) {
  var svg = r.error ? null : safeSVG(r.result && r.result.svg);
  if (!svg) {
    if (!fig.querySelector('svg')) fig.innerHTML = '<p class="chart-title">' + esc(opt.title) + '</p>';
    var old = fig.querySelector('.chart-error');
    if (old) old.remove();
    var p = document.createElement('p');
    p.className = 'chart-error';
    p.textContent = '\u26A0 The chart could not be drawn' + (r.error ? ': ' + r.error.message : '.');
    fig.appendChild(p);
    return;
  }
  // The same title and caption: the drawing alone is replaced.
  var was = fig.querySelector(':scope > svg');
  if (was && shownText.get(fig) === opt.title + '\n' + caption && fig.childElementCount === 3) {
    fig.replaceChild(svg, was);
    return;
  }
  fig.innerHTML = '<p class="chart-title">' + esc(opt.title) + '</p><figcaption>' + caption + '</figcaption>';
  fig.insertBefore(svg, fig.lastChild);
  shownText.set(fig, opt.title + '\n' + caption);
}

// shownText: the title and caption each figure shows (put).
const shownText = new WeakMap();

// words.js: the sentences the core writes (warnings, the planner's
// sentences) with their quantities marked (core/words), put into words in
// the units shown by the core's "say" call, rounded as the figures are.
// The page formats no number of them itself.

import { call } from './engine.js';
import { S } from './state.js';

// unitsKey names the units shown: words made for another key are redone.
export function unitsKey() { return S.sys + ' ' + JSON.stringify(S.chosen); }

// say puts marked sentences into words in the units shown; null when the
// core could not (the caller then says so).
export function say(sentences) {
  if (!sentences || !sentences.length) return Promise.resolve([]);
  S.saying = (S.saying || 0) + 1;
  var input = JSON.stringify({ sentences: sentences, units: S.chosen, system: S.sys === 'us' ? 'us' : 'si' });
  return call('say', input).then(function (r) {
    S.saying--;
    return r.error ? null : r.result.texts;
  });
}

// sayGroups puts several lists of sentences into words with one call:
// the texts come back in the same lists (null when the core could not).
export function sayGroups(groups) {
  var flat = [], ends = [];
  groups.forEach(function (g) { flat = flat.concat(g || []); ends.push(flat.length); });
  return say(flat).then(function (texts) {
    if (!texts) return null;
    var start = 0;
    return ends.map(function (end) { var part = texts.slice(start, end); start = end; return part; });
  });
}

// planWords puts a plan's sentences into words in the units shown:
// {key, reason, infeasible, notes, options: [{settings, findings,
// outside}]}, or null when the core could not.
export function planWords(r) {
  var groups = [r.reason_sentence && r.reason_sentence.text ? [r.reason_sentence] : [], r.infeasible_sentences, r.note_sentences];
  r.options.forEach(function (o) { groups.push(o.sentences, o.finding_sentences, o.outside_sentences); });
  var key = unitsKey();
  return sayGroups(groups).then(function (g) {
    if (!g) return null;
    var w = { key: key, reason: g[0][0] || r.reason, infeasible: g[1], notes: g[2], options: [] };
    for (var i = 0; i < r.options.length; i++) w.options.push({ settings: g[3 + 3 * i], findings: g[4 + 3 * i], outside: g[5 + 3 * i] });
    return w;
  });
}

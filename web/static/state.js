// state.js: the page's state and the definitions the form and the
// planner share: axes, crane kinds, the field names of a move, and the
// scenario paths ("motions[1].speed_m_per_s").

export const S = {
  scenario: null,     // the scenario object, in the file's own SI format
  table: null,        // core/units table
  ranges: null,       // core/scenario ranges by key
  examples: null,
  sys: 'si',
  chosen: {},         // display quantity -> unit symbol
  bad: {},            // field path -> page-side message (text that is not a number)
  coreErrors: [],     // field errors from the core for the current inputs
  result: null,       // last valid result
  resultSent: null,   // the scenario JSON it is the result of
  evaluating: null,   // the scenario JSON the core evaluates now (compute.js)
  figures: null,      // its figures from the core's "figures" call (or {error})
  count: 0,
  windStash: null
};

// The two kinds of axis (core/crane Linear and Angular): a move's
// fields, the plan block's, the result's, the display quantities, the
// form's words and the values a new move or plan of the kind starts with.
export const LINEAR = { distance: 'distance_m', speed: 'speed_m_per_s', accel: 'accel_m_per_s2', decel: 'decel_m_per_s2',
  top: 'top_speed_m_per_s', maxAccel: 'max_accel_m_per_s2', quantity: 'length', speedQ: 'speed', accelQ: 'acceleration',
  words: { distance: 'Distance', speed: 'Speed', top: 'Top speed', maxAccel: 'Largest acceleration', passer: 'crane' },
  move: [10, 0.5, 0.25], plan: [10, 0.5, 0.3] };
export const ANGULAR = { distance: 'angle_deg', speed: 'rate_deg_per_s', accel: 'accel_deg_per_s2', decel: 'decel_deg_per_s2',
  top: 'top_rate_deg_per_s', maxAccel: 'max_accel_deg_per_s2', quantity: 'angle', speedQ: 'angular_speed', accelQ: 'angular_acceleration',
  words: { distance: 'Angle', speed: 'Rate', top: 'Top rate', maxAccel: 'Largest angular acceleration', passer: 'jib' },
  move: [90, 3.6, 0.5], plan: [90, 3.6, 0.5] };

// AXES are core/crane's axes as the form offers them (a new crane type
// adds its axes here): the scenario's name, the label, the kind, whether
// the planner plans it, the crane block's field its plan needs (with the
// value a new plan starts from) and the words that differ from the kind's.
export const AXES = [
  { name: 'travel_x', label: 'Travel x', kind: LINEAR, plan: true },
  { name: 'travel_y', label: 'Travel y', kind: LINEAR, plan: true },
  { name: 'slew', label: 'Slew', kind: ANGULAR, plan: true, needs: ['crane.radius_m', 20],
    words: { distance: 'Slew angle', speed: 'Slew rate', top: 'Top slew rate', maxAccel: 'Largest slew acceleration' } },
  { name: 'radius', label: 'Trolley on jib (radius)', kind: LINEAR },
  { name: 'hoist', label: 'Hoist (up +)', kind: LINEAR, words: { distance: 'Hoist distance' } }
];

// axisOf is the axis of that name (an unknown one reads as linear: the
// core names the problem).
export function axisOf(name) {
  for (var i = 0; i < AXES.length; i++) if (AXES[i].name === name) return AXES[i];
  return { name: name, label: String(name), kind: LINEAR };
}
// axisWord is the form's word for a field of a move of the axis.
export function axisWord(name, key) {
  var a = axisOf(name);
  return (a.words && a.words[key]) || a.kind.words[key];
}
// axisOptions are [name, label] pairs for a chooser; plannable: only the
// axes the planner plans.
export function axisOptions(plannable) {
  return AXES.filter(function (a) { return a.plan || !plannable; }).map(function (a) { return [a.name, a.label]; });
}
export const KINDS = [['', 'not given'], ['overhead', 'overhead crane'], ['gantry', 'gantry crane'], ['tower', 'tower crane'],
  ['slewing', 'slewing (mobile or crawler) crane'], ['monorail', 'monorail hoist']];

function parsePath(p) {
  var out = [];
  p.split('.').forEach(function (part) {
    var m = /^([a-z_0-9]+)(?:\[(\d+)\])?$/.exec(part);
    if (!m) throw new Error('bad path ' + p);
    out.push(m[1]);
    if (m[2] !== undefined) out.push(Number(m[2]));
  });
  return out;
}
export function getPath(obj, p) {
  var ks = parsePath(p);
  for (var i = 0; i < ks.length; i++) {
    if (obj == null) return undefined;
    obj = obj[ks[i]];
  }
  return obj;
}
export function setPath(obj, p, v) {
  var ks = parsePath(p);
  for (var i = 0; i < ks.length - 1; i++) {
    if (obj[ks[i]] == null || typeof obj[ks[i]] !== 'object') obj[ks[i]] = {};
    obj = obj[ks[i]];
  }
  if (v === undefined) delete obj[ks[ks.length - 1]];
  else obj[ks[ks.length - 1]] = v;
}
export function rangeKey(p) { return p.replace(/\[\d+\]/g, '[]'); }
export function fieldId(p) { return 'f-' + p.replace(/[^a-z0-9_]+/gi, '-').replace(/-$/, ''); }

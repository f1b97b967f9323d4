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
  count: 0,
  windStash: null
};

export const AXES = [
  ['travel_x', 'Travel x'],
  ['travel_y', 'Travel y'],
  ['slew', 'Slew'],
  ['radius', 'Trolley on jib (radius)'],
  ['hoist', 'Hoist (up +)']
];
export const KINDS = [['', 'not given'], ['overhead', 'overhead crane'], ['gantry', 'gantry crane'], ['tower', 'tower crane'],
  ['slewing', 'slewing (mobile or crawler) crane'], ['monorail', 'monorail hoist']];
export const LINEAR = { distance: 'distance_m', speed: 'speed_m_per_s', accel: 'accel_m_per_s2', decel: 'decel_m_per_s2' };
export const ANGULAR = { distance: 'angle_deg', speed: 'rate_deg_per_s', accel: 'accel_deg_per_s2', decel: 'decel_deg_per_s2' };

// The axes a plan can move (the first three of AXES).
export const PLAN_AXES = AXES.slice(0, 3);

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

// body-form.js: the load as a rigid body (the scenario's load.body): the
// box, its radii of gyration, how it hangs (two or four sling legs from
// the hook, a spreader's two parallel legs, or two hook ropes each to its
// own lifting point: a tandem lift), the hook block's mass.
// It only collects: every value goes into the scenario as typed (in SI,
// through the form's number handling) and the core validates it; its
// field errors are shown at these fields by form.js showErrors. Nothing
// here computes physics: the defaults are fixed numbers to edit.

import { changed } from './compute.js';
import { $, esc } from './dom.js';
import { numField, section } from './fields.js';
import { S } from './state.js';

const B = 'load.body';
// Fixed starting values for a box of 6 m by 1 m by 1 m (edit them).
const BOX = { length_m: 6, width_m: 1, height_m: 1 };
const HUNG = {
  four: function () {
    return { legs: [[2.5, 0.5], [-2.5, 0.5], [-2.5, -0.5], [2.5, -0.5]].map(function (p) {
      return { length_m: 4, attach_x_m: p[0], attach_y_m: p[1], attach_z_m: 0.5 };
    }) };
  },
  two: function () {
    return { hook_mass_kg: 100, legs: [{ length_m: 4, attach_x_m: 2.5, attach_z_m: 0.5 }, { length_m: 4, attach_x_m: -2.5, attach_z_m: 0.5 }] };
  },
  spreader: function () { return { spreader: { spacing_m: 4 } }; },
  tandem: function () { return { tandem: { ropes: [{ attach_x_m: 2.5 }, { attach_x_m: -2.5 }] } }; }
};
const HUNG_WORDS = [['two', 'two sling legs from the hook'], ['four', 'four sling legs from the hook'],
  ['spreader', 'a spreader beam held by the crane (two parallel spreader legs)'],
  ['tandem', 'two hook ropes, each to its own lifting point (tandem lift)']];

let stash = null; // load.body kept while the box is unticked

function hungOf(b) {
  if (b.spreader) return 'spreader';
  if (b.tandem) return 'tandem';
  return b.legs && b.legs.length === 2 ? 'two' : 'four';
}

// group wraps fields in a card of their own; with field, the core's
// messages about the whole group (load.body.legs) are shown at its top
// (showErrors takes the first .msg inside the field's box).
function group(title, body, field) {
  return '<fieldset class="card"' + (field ? ' data-field="' + esc(field) + '"' : '') + '><legend>' + esc(title) + '</legend>' +
    (field ? '<p class="msg" role="alert"></p>' : '') + '<div class="grid">' + body + '</div></fieldset>';
}

export function renderBodyForm() {
  var f = $('body-form');
  if (!f) return;
  var b = S.scenario.load && S.scenario.load.body;
  var h = '<div class="field wide" data-field="' + B + '"><label class="check"><input type="checkbox" id="body-on"' + (b ? ' checked' : '') +
    '> The load as a rigid box on its slings <span class="opt">(long loads, spreader beams: pitch, twist and every leg\u2019s pull)</span></label>' +
    '<p class="hint">With it, the rope length above runs from the sheave to the hook (with a spreader: the spreader legs\u2019 length; with two hook ropes: each rope\u2019s length unless given below, and both change with it) and the load mass is without the hook block.</p>' +
    '<p class="msg" role="alert"></p></div>';
  if (!b) { f.innerHTML = section('Rigid load', h, 'body-card'); return; }
  var hung = hungOf(b);
  h += numField(B + '.length_m', 'Length of the load') + numField(B + '.width_m', 'Width') + numField(B + '.height_m', 'Height') +
    numField(B + '.heading_deg', 'Length points toward', { optional: true, hint: 'degrees from +x toward +y' }) +
    numField(B + '.gyration_length_m', 'Radius of gyration about its length', { optional: true, hint: 'blank: a solid box' }) +
    numField(B + '.gyration_width_m', 'Radius of gyration about its width', { optional: true, hint: 'blank: a solid box' }) +
    numField(B + '.gyration_height_m', 'Radius of gyration about the vertical', { optional: true, hint: 'blank: a solid box' }) +
    '<div class="field wide"><label for="body-hung">Hung from</label><select id="body-hung" data-bodyhung="1">' +
    HUNG_WORDS.map(function (o) { return '<option value="' + o[0] + '"' + (o[0] === hung ? ' selected' : '') + '>' + esc(o[1]) + '</option>'; }).join('') +
    '</select></div>';
  var parts = [section('Rigid load', h, 'body-card')];
  if (hung === 'tandem') {
    var ropes = ((b.tandem && b.tandem.ropes) || []).map(function (r, i) {
      var at = B + '.tandem.ropes[' + i + ']';
      return '<div class="field wide"><b>Hook rope ' + (i + 1) + (i === 0 ? ' (toward the load\u2019s +x end)' : '') + '</b></div>' +
        numField(at + '.length_m', 'Rope ' + (i + 1) + ' length', { optional: true, hint: 'blank: the rope length above' }) +
        numField(at + '.attach_x_m', 'Attached along the length at', { hint: 'from the centre of mass' }) +
        numField(at + '.attach_y_m', 'across at', { optional: true }) +
        numField(at + '.attach_z_m', 'above the centre of mass at', { optional: true, hint: 'blank: the load\u2019s top face' });
    }).join('');
    parts.push(group('Two hook ropes (tandem lift)', numField(B + '.tandem.spacing_m', 'Spacing of the two ropes at the crane',
      { optional: true, hint: 'blank: the lifting points\u2019 spacing (ropes straight down)' }) + ropes, B + '.tandem'));
  } else if (hung === 'spreader') {
    parts.push(group('Spreader legs (beam to lifting point)', numField(B + '.spreader.spacing_m', 'Spacing of the two spreader legs') +
      numField(B + '.spreader.attach_z_m', 'Lifting points above the centre of mass', { optional: true, hint: 'blank: the load\u2019s top face' })));
  } else {
    if (hung === 'two' || b.hook_mass_kg !== undefined) parts.push(group('Hook block', numField(B + '.hook_mass_kg', 'Hook block mass', { optional: hung !== 'two' })));
    var legs = (b.legs || []).map(function (l, i) {
      var at = B + '.legs[' + i + ']';
      return '<div class="field wide"><b>Leg ' + (i + 1) + '</b></div>' + numField(at + '.length_m', 'Leg ' + (i + 1) + ' length') +
        numField(at + '.attach_x_m', 'Attached along the length at', { optional: true, hint: 'from the centre of mass' }) +
        numField(at + '.attach_y_m', 'across at', { optional: true }) +
        numField(at + '.attach_z_m', 'above the centre of mass at');
    }).join('');
    parts.push(group('Sling legs (hook to lifting point)', legs, B + '.legs'));
  }
  f.innerHTML = parts.join('');
}

function clearBody() {
  Object.keys(S.bad).forEach(function (k) { if (k.indexOf(B + '.') === 0) delete S.bad[k]; });
}

function onChange(e) {
  var el = e.target, load = S.scenario.load || (S.scenario.load = {});
  if (el.id === 'body-on') {
    if (el.checked) {
      load.body = stash || Object.assign({}, BOX, HUNG.four());
    } else {
      stash = load.body;
      delete load.body;
    }
  } else if (el.dataset.bodyhung) {
    var b = load.body;
    delete b.legs; delete b.spreader; delete b.tandem; delete b.hook_mass_kg;
    Object.assign(b, HUNG[el.value]());
  } else {
    return;
  }
  clearBody();
  renderBodyForm();
  changed();
}

var form = $('body-form');
if (form) form.addEventListener('change', onChange);

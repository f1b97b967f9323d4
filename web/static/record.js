// record.js: import of a drive record, a CSV of time and position or
// speed per axis (header time_s,travel_x_m_per_s,...; see the README).
// The core's "record" call makes it the scenario's recorded motion (a
// "series" move) and names the CSV line and column of any problem; the
// scenario with it is adopted only when the core reads it. A bad record
// leaves the inputs as they were, with the core's message.

import { $, esc, notice } from './dom.js';
import { call } from './engine.js';
import { adopt } from './scenarios.js';
import { S, axisOf, axisOptions } from './state.js';
import { fmtStep } from './units.js';

// isRecord: a file to read as a drive record rather than a scenario: a
// .csv file, or one of another name whose text starts with time_s.
export function isRecord(name, text) {
  if (/\.csv$/i.test(name)) return true;
  if (/\.json$/i.test(name)) return false;
  return /^\s*(#.*\n\s*)*"?time_s/.test(text);
}

// importRecord reads a drive record; axis '' lets the core take the one
// axis the record has a column for, and asks the person when it has more.
export function importRecord(text, name, axis) {
  S.adopting = (S.adopting || 0) + 1;
  return call('record', JSON.stringify({ csv: text, axis: axis || '' })).then(function (r) {
    S.adopting--;
    if (r.error) {
      var fe = (r.error.fields || [])[0];
      if (fe && fe.field === 'axis' && !axis) return chooseAxis(text, name, fe.message);
      notice('\u2716 ' + name + ' is not a drive record the tool can use: ' + r.error.message + '. The inputs are kept.');
      return false;
    }
    var rec = r.result, sc = JSON.parse(JSON.stringify(S.scenario));
    // The record replaces the moves of its axis; the other axes' stay.
    var others = (sc.motions || []).filter(function (m) { return m.axis !== rec.motion.axis; });
    var replaced = (sc.motions || []).length - others.length;
    sc.motions = others.concat([rec.motion]);
    var axisWords = axisLabel(rec.motion.axis);
    return adopt(JSON.stringify(sc), name, 'Imported the drive record ' + name + ' (' + rec.samples + ' samples over ' + fmtStep('time', rec.duration_s) + ' s, column ' + rec.column + ') as the ' +
      axisWords + ' move' + (replaced ? ', in place of the ' + replaced + ' move(s) of that axis' : '') + '.');
  });
}

function axisLabel(a) { return axisOf(a).label.toLowerCase(); }

// chooseAxis asks which axis a record with several axis columns is for.
function chooseAxis(text, name, why) {
  var d = $('dlg-record');
  if (!d) {
    d = document.createElement('dialog');
    d.id = 'dlg-record';
    d.setAttribute('aria-labelledby', 'dlg-record-h');
    document.body.appendChild(d);
  }
  d.innerHTML = '<h2 id="dlg-record-h">Which axis is this drive record for?</h2><p class="small" id="record-why"></p>' +
    '<div class="row"><label for="record-axis">Axis</label><select id="record-axis">' +
    axisOptions(false).map(function (a) { return '<option value="' + esc(a[0]) + '">' + esc(a[1]) + '</option>'; }).join('') + '</select></div>' +
    '<div class="row"><button type="button" id="record-use">Use the record</button><form method="dialog"><button>Cancel</button></form></div>';
  $('record-why').textContent = name + ': ' + why + '.';
  $('record-use').onclick = function () {
    var axis = $('record-axis').value;
    d.close();
    importRecord(text, name, axis);
  };
  d.showModal();
  return false;
}

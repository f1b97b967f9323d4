// library.js: the site library, the scenario files a site office puts in
// library/ beside the page (library/index.json lists them). The core
// reads them from the page's own server (the "library" and "library_file"
// calls; the text comes from the small fetch wasm, tinyutil's httputil, in
// a worker the core's worker starts the first time; the service worker
// keeps a copy of each file read for use with no network) and says when
// there is none (a page opened from a file). The list shows in the Examples dialog; a file
// opened is adopted only when the core reads it, as a share link is.

import { $, esc } from './dom.js';
import { call } from './engine.js';
import { adopt } from './scenarios.js';
import { S } from './state.js';
import { keepInSaved } from './storage.js';

let libraryFiles = [];

// showLibrary asks the core for the library and lists it.
export function showLibrary() {
  var src = $('library-source'), list = $('library-list');
  src.textContent = 'Reading this site\u2019s library\u2026';
  list.innerHTML = '';
  S.libraryReading = true;
  return call('library', '{}').then(function (r) {
    S.libraryReading = false;
    if (r.error) {
      libraryFiles = [];
      src.textContent = 'No site library here: ' + r.error.message;
      $('library').dataset.state = 'none';
      return;
    }
    libraryFiles = r.result.files;
    $('library').dataset.state = 'listed';
    src.textContent = libraryFiles.length ?
      'Scenario files your site office published on this server (kept on this device for use with no network once read). Opening one replaces the inputs; your own are kept among the saved scenarios.' :
      'The site library lists no readable scenario file.';
    list.innerHTML = libraryFiles.map(function (f, i) {
      return '<li><span><b>' + esc(f.name || f.file) + '</b><br><small>' + esc(f.description || '') + ' (' + esc(f.file) + ')</small></span>' +
        '<span class="btns"><button type="button" data-lib="' + i + '">Open</button></span></li>';
    }).join('') + (r.result.problems || []).map(function (p) {
      return '<li class="damaged"><span>\u2716 Not listed: ' + esc(p) + '</span></li>';
    }).join('');
  });
}

// openLibraryFile reads one file again through the core (the newest copy
// on the server, or the one kept) and adopts it.
function openLibraryFile(f) {
  S.adopting = (S.adopting || 0) + 1;
  return call('library_file', JSON.stringify({ file: f.file })).then(function (r) {
    S.adopting--;
    if (r.error) {
      $('library-source').textContent = '\u2716 ' + f.file + ' could not be opened: ' + r.error.message;
      return false;
    }
    $('dlg-examples').close();
    return adopt(JSON.stringify(r.result.scenario), 'The site library file ' + f.file, 'Opened \u201C' + (r.result.name || f.file) + '\u201D from the site library.', function (o) {
      if (S.scenario && !S.scenario.example && JSON.stringify(S.scenario) !== JSON.stringify(o)) keepInSaved('Kept before opening from the site library');
    });
  });
}

export function bindLibrary() {
  $('open-examples').addEventListener('click', showLibrary);
  $('library-list').onclick = function (e) {
    var i = e.target.dataset.lib;
    if (i !== undefined && libraryFiles[Number(i)]) openLibraryFile(libraryFiles[Number(i)]);
  };
}

// For the browser tests: whether the library is being read.
window.swaysheetLibrary = { reading: function () { return !!S.libraryReading; } };

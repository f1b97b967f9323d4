// offline.js: registers the service worker (sw.js) that keeps every file of
// the page for use with no network, and tells the user when a new release
// is ready. A new release is used only after the user reloads for it, so
// an open page never runs a mix of two releases. Service workers need
// http(s) or localhost; opened as a file the page (or the single-file
// build) runs without one.

let updateWanted = false;

function registerOffline() {
  var box = document.getElementById('update-notice');

  function offer(w) {
    if (!box) return;
    box.hidden = false;
    document.getElementById('update-reload').onclick = function () {
      updateWanted = true;
      w.postMessage('activate');
    };
  }

  navigator.serviceWorker.addEventListener('controllerchange', function () {
    if (updateWanted) location.reload();
  });

  window.addEventListener('load', function () {
    navigator.serviceWorker.register('sw.js').then(function (reg) {
      if (reg.waiting && navigator.serviceWorker.controller) offer(reg.waiting);
      reg.addEventListener('updatefound', function () {
        var w = reg.installing;
        if (!w) return;
        w.addEventListener('statechange', function () {
          // A worker installed while another controls the page is a new
          // release waiting; the first install controls the page at once.
          if (w.state === 'installed' && navigator.serviceWorker.controller) offer(w);
        });
      });
      // Look for a new release when the tablet comes back to the page.
      document.addEventListener('visibilitychange', function () {
        if (document.visibilityState === 'visible') reg.update().catch(function () { /* offline */ });
      });
    }).catch(function () { /* no offline use; the page works online */ });
  });
}

if ('serviceWorker' in navigator && location.protocol !== 'file:') registerOffline();

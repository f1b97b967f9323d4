// sw.js: the service worker. It keeps every file of one release of the
// page in one cache, named after the release's version and a hash of all
// its files (both written in by the build: web/offline), and answers from
// that cache only, so the page works with no network and never mixes the
// files of two releases. A new release installs beside the old one,
// waits until the user asks for it (the page's "new version" notice), and
// then replaces the old cache whole.
'use strict';
var VERSION = '{{VERSION}}';
var FILES = {{FILES}};
var CACHE = 'swaysheet-' + VERSION;
// The site library (library/ beside the page: index.json and the scenario
// files a site office publishes) is read from the network first, so a new
// file shows at once, and kept in a cache of its own for use offline; it
// outlives releases.
var LIBRARY = 'swaysheet-site-library';

self.addEventListener('install', function (e) {
  // addAll stores all the files or none.
  e.waitUntil(caches.open(CACHE).then(function (c) {
    return c.addAll(FILES.map(function (f) { return new Request(f, { cache: 'no-cache' }); }));
  }).then(function () {
    // The first release takes over at once; a later one waits for the user.
    return self.registration.active ? null : self.skipWaiting();
  }));
});

self.addEventListener('activate', function (e) {
  e.waitUntil(caches.keys().then(function (keys) {
    return Promise.all(keys.filter(function (k) { return k.indexOf('swaysheet-') === 0 && k !== CACHE && k !== LIBRARY; })
      .map(function (k) { return caches.delete(k); }));
  }).then(function () { return self.clients.claim(); }));
});

self.addEventListener('message', function (e) {
  if (e.data === 'activate') self.skipWaiting();
});

self.addEventListener('fetch', function (e) {
  var req = e.request;
  if (req.method !== 'GET') return;
  var url = new URL(req.url);
  if (url.origin !== self.location.origin) return;
  if (url.pathname.indexOf(new URL('library/', self.registration.scope).pathname) === 0) {
    e.respondWith(fetch(req, { cache: 'no-cache' }).then(function (resp) {
      if (resp.ok) {
        var copy = resp.clone();
        caches.open(LIBRARY).then(function (c) { return c.put(req, copy); });
      }
      return resp;
    }).catch(function () {
      return caches.open(LIBRARY).then(function (c) {
        return c.match(req, { ignoreSearch: true }).then(function (hit) {
          return hit || Response.error();
        });
      });
    }));
    return;
  }
  var key = req.mode === 'navigate' ? './' : url.pathname;
  e.respondWith(caches.open(CACHE).then(function (c) {
    return c.match(key === './' ? new URL('./', self.registration.scope).href : req, { ignoreSearch: true }).then(function (hit) {
      return hit || fetch(req);
    });
  }));
});

// Conductor Atlas: keep the whole site on this device for reading offline (see sw.js), and say how
// that goes. Runs in <head>: it marks <html> at once, so the notes for a copy opened from a file
// (html.from-file) and for one served over plain http from another machine (html.not-secure: no
// browser keeps such a copy) show without a flash, then registers the service worker after load.
// The worker's messages ({type: 'offline-progress' | 'offline-saved' | 'offline-failed'}) become
// one line in #offline-status: "Saving for offline use: 120 of 748 files", then "Saved for offline
// use, edition …".
(function () {
  'use strict';
  var root = document.documentElement;
  if (window.location.protocol === 'file:') {
    root.classList.add('from-file');
    return;
  }
  if (!window.isSecureContext || !('serviceWorker' in navigator)) {
    // plain http from another machine (localhost counts as secure): no service worker at all
    root.classList.add('not-secure');
    return;
  }
  if (!document.currentScript) return;
  root.classList.add('can-keep');   // the status line's room is kept from the first paint: no jump later
  var worker = new URL('../sw.js', document.currentScript.src).href;

  var latest = '';
  function say(text, state) {
    latest = text;
    var line = document.getElementById('offline-status');
    if (!line) return;                                      // before the body: shown on DOMContentLoaded
    if (line.textContent !== text) line.textContent = text;
    if (state) line.dataset.state = state;
  }
  document.addEventListener('DOMContentLoaded', function () { if (latest) say(latest); });

  navigator.serviceWorker.addEventListener('message', function (event) {
    var data = event.data || {};
    if (data.type === 'offline-progress') {
      say('Saving for offline use: ' + data.stored + ' of ' + data.total + ' files stored; stay on the network.', 'saving');
    } else if (data.type === 'offline-saved') {
      say('Saved for offline use, edition ' + data.edition + ': works without a network.', 'saved');
    } else if (data.type === 'offline-failed') {
      say('Not saved for offline use: ' + data.reason + '. Reload the page to try again.', 'failed');
    }
  });

  window.addEventListener('load', function () {
    navigator.serviceWorker.register(worker).catch(function (problem) {
      say('Not saved for offline use: this browser did not accept the offline copy (' + problem + ').', 'failed');
    });
    // a worker already in charge says whether its copy is whole (a fresh one reports as it stores)
    navigator.serviceWorker.ready.then(function (registration) {
      if (registration.active) registration.active.postMessage({type: 'offline-status'});
    });
  });
})();

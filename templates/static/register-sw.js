// Conductor Atlas: keep the whole site on this device for reading offline (see sw.js), and say how
// that goes. Runs in <head>: it marks <html> at once (html.from-file: a copy opened from a file;
// html.not-secure: one served over plain http from another machine, which no browser keeps) and
// writes the note for that case (only this script ever shows them, so the pages do not carry their
// text), then registers the service worker after load.
// The worker's messages ({type: 'offline-progress' | 'offline-saved' | 'offline-failed'}) become
// one line in #offline-status: "Saving for offline use: 120 of 748 files", then "Saved for offline
// use, edition …".
(function () {
  'use strict';
  var root = document.documentElement;
  // Each note is a list of parts: plain text, or [tag, text] for a <code> or <strong> inside it
  // (built with textContent: the page glue never writes markup from strings).
  var FROM_FILE_NOTE = ['This copy is open from files: every page reads, but to keep the site on this device '
    + 'for use without a network, serve the folder (run ', ['code', 'conductor-atlas serve'], ' in it, or any static '
    + 'web server) and open it once over http.'];
  var NOT_SECURE_NOTE = [['strong', 'Not kept for offline use.'], ' This copy comes over plain http from '
    + 'another machine, and browsers keep a site for use without a network only when it is served over https '
    + '(or from this device itself). To keep it: serve it over https (',
    ['code', 'conductor-atlas serve --host 0.0.0.0 --cert FILE --key FILE'], ', see the README), or copy the '
    + 'site folder onto this device and open its ', ['code', 'index.html'], ', which reads fully from files.'];

  // Put a note (fixed parts above) first in the element ``where`` as soon as the parser has made that
  // element: a MutationObserver runs before the browser paints again, so the note is there from the
  // first paint that shows its place and nothing below it jumps.
  function addNote(where, className, parts) {
    function place() {
      var box = document.querySelector(where);
      if (!box) return false;
      var note = document.createElement('p');
      note.className = className;
      parts.forEach(function (part) {
        if (typeof part === 'string') {
          note.appendChild(document.createTextNode(part));
        } else {
          var inner = document.createElement(part[0]);
          inner.textContent = part[1];
          note.appendChild(inner);
        }
      });
      box.insertBefore(note, box.firstChild);
      return true;
    }
    if (place()) return;
    var watch = new MutationObserver(function () { if (place()) watch.disconnect(); });
    watch.observe(root, {childList: true, subtree: true});
  }

  if (window.location.protocol === 'file:') {
    root.classList.add('from-file');
    addNote('footer.colophon', 'from-file-note', FROM_FILE_NOTE);
    return;
  }
  if (!window.isSecureContext || !('serviceWorker' in navigator)) {
    // plain http from another machine (localhost counts as secure): no service worker at all
    root.classList.add('not-secure');
    addNote('.site-status', 'not-secure-note', NOT_SECURE_NOTE);
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

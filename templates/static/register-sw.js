// Conductor Atlas: keep the whole site on this device for reading offline (see sw.js).
// Runs in <head>: it marks <html> at once, so notes meant for a copy opened from a file
// (html.from-file) show without a flash, then registers the service worker after load.
(function () {
  'use strict';
  var root = document.documentElement;
  if (window.location.protocol === 'file:') {
    root.classList.add('from-file');
    return;
  }
  if (!('serviceWorker' in navigator) || !document.currentScript) return;
  var worker = new URL('../sw.js', document.currentScript.src).href;
  window.addEventListener('load', function () {
    navigator.serviceWorker.register(worker).catch(function (problem) {
      console.warn('Conductor Atlas: this browser did not accept the offline copy: ' + problem);
    });
  });
})();

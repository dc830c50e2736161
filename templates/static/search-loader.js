// Conductor Atlas: fetch the search script (static/search.classic.js, the core's search and the
// Transcrypt runtime, about 37 kB compressed) only when someone starts to search, so reading a
// page does not pay for it. The search page itself needs it at once. Text typed before the script
// arrives is searched when it starts (search.js runs a focused box that already holds text).
// Marks <html> with search-ready at once, as search.js does when it starts.
(function () {
  'use strict';
  if (!document.currentScript) return;
  var source = new URL('search.classic.js', document.currentScript.src).href;
  // the boxes take typing from now on (search.css hides the search page's "needs JavaScript" note)
  document.documentElement.classList.add('search-ready');
  var requested = false;
  function load() {
    if (requested) return;
    requested = true;
    var script = document.createElement('script');
    script.src = source;
    document.head.appendChild(script);
  }
  function inSearch(event) {
    var target = event.target;
    if (target && target.closest && target.closest('form[data-search]')) load();
  }
  document.addEventListener('focusin', inSearch);
  document.addEventListener('pointerdown', inSearch);
  document.addEventListener('DOMContentLoaded', function () {
    if (document.querySelector('form[data-search="page"]')) load();
  });
})();

// Conductor Atlas: a material page's calculator script (named by this tag's data-load, beside this
// file: the resistance calculator and its part of the core, most of a first visit's bytes) is loaded
// only when the calculator is about to be used:
// - when its section comes within about a screen of the view (so a reader who scrolls to it never
//   sees it empty), or at once where the browser cannot tell (no IntersectionObserver);
// - on the first touch or focus inside it (the form then starts with what was typed meanwhile);
// - at once when the address points into it (#calc-resistance) or carries its inputs (?length=…, the
//   address calc-form.js writes and reads back).
// Until then its results show "—". While it loads, and if it cannot be loaded (no network, and the
// site not stored on this device yet), the results' status line says so; a later touch or focus, or
// the network coming back, tries again. Plain script, so it runs from a copied folder too.
(function () {
  'use strict';
  var me = document.currentScript;
  var form = document.querySelector('form[data-calculator]');
  if (!me || !form) return;
  var section = form.closest('section');
  var busy = section.querySelector('[data-busy]');
  var source = new URL(me.dataset.load, me.src).href;
  var LOADING = 'Loading the calculator …';
  var MISSING = 'The calculator could not be loaded (no network, and the site is not stored on this device '
    + 'yet): its results are not shown.';
  var state = '';  // '' (not asked yet), 'loading', 'ready' or 'failed'

  // scripts run here: the "needs JavaScript" note is not for this reader (style.css)
  document.documentElement.classList.add('calc-waiting');

  function say(text) {
    if (busy) busy.textContent = text;
  }

  function load() {
    if (state === 'loading' || state === 'ready') return;
    state = 'loading';
    say(LOADING);
    var script = document.createElement('script');
    script.src = source;
    // runs calc-form.js's start() at once; its own status, if any, replaces ours
    script.onload = function () {
      state = 'ready';
      if (busy && busy.textContent === LOADING) say('');
    };
    script.onerror = function () {
      state = 'failed';
      script.remove();
      say(MISSING);
    };
    document.head.appendChild(script);
  }

  // the address asks for the calculator: it points into its section or carries one of its inputs
  // (calc-form.js fills the visible fields from the query)
  function addressAsks() {
    var id = '';
    try { id = decodeURIComponent(window.location.hash.slice(1)); } catch (malformed) { id = ''; }
    var target = id && document.getElementById(id);
    if (target && section.contains(target)) return true;
    var query = new URLSearchParams(window.location.search);
    return Array.prototype.some.call(form.elements, function (field) {
      return field.name && field.type !== 'hidden' && query.has(field.name);
    });
  }

  section.addEventListener('focusin', load);
  section.addEventListener('pointerdown', load);
  window.addEventListener('hashchange', function () { if (addressAsks()) load(); });
  window.addEventListener('online', function () { if (state === 'failed') load(); });
  if (addressAsks() || !('IntersectionObserver' in window)) {
    load();
    return;
  }
  // rootMargin: one height of the view above and below it
  var watch = new IntersectionObserver(function (entries) {
    for (var i = 0; i < entries.length; i++) {
      if (entries[i].isIntersecting) {
        watch.disconnect();
        load();
        return;
      }
    }
  }, {rootMargin: '100% 0px'});
  watch.observe(section);
})();

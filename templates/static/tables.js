// Conductor Atlas: tables. A row link (#table--row, from a design note or the row's "#") lands with
// the table's title or column headings (the units) in view above the row and the row's first column
// visible; a table wider than its box says that it scrolls sideways. Plain script, no imports.
(function () {
  'use strict';
  var HINT = 'Wider than the window: swipe or scroll the table sideways for all its columns.';

  function targetRow() {
    if (window.location.hash.length < 2) return null;
    var found = document.getElementById(decodeURIComponent(window.location.hash.slice(1)));
    return found && found.tagName === 'TR' && found.closest('.table-wrap') ? found : null;
  }

  // The table box scrolls down inside itself with its headings fixed on top (style.css): bring the
  // box into the window (its title too when both fit), then the row just under the headings.
  function land(row) {
    var wrap = row.closest('.table-wrap');
    var head = row.closest('table').tHead;
    var section = wrap.closest('section');
    var title = section ? section.querySelector('h2, h3') : null;
    wrap.scrollLeft = 0;
    var top = title && wrap.getBoundingClientRect().bottom - title.getBoundingClientRect().top <= window.innerHeight - 8
      ? title : wrap;
    window.scrollBy(0, top.getBoundingClientRect().top - 4);
    var under = head ? head.getBoundingClientRect().height : 0;
    wrap.scrollTop += row.getBoundingClientRect().top - wrap.getBoundingClientRect().top - wrap.clientTop - under;
  }

  function landOnTarget() {
    var row = targetRow();
    if (row) window.requestAnimationFrame(function () { land(row); });
  }

  function markScrolling() {
    var wraps = document.querySelectorAll('.table-wrap');
    for (var i = 0; i < wraps.length; i++) {
      var wrap = wraps[i];
      var wide = wrap.scrollWidth > wrap.clientWidth + 1;
      wrap.classList.toggle('scrolls-x', wide);
      var note = wrap.previousElementSibling;
      if (!note || !note.classList.contains('scroll-hint')) {
        if (!wide) continue;
        note = document.createElement('p');
        note.className = 'scroll-hint';
        note.textContent = HINT;
        wrap.parentNode.insertBefore(note, wrap);
      }
      note.hidden = !wide;
    }
  }

  var resizing = 0;
  window.addEventListener('resize', function () {
    clearTimeout(resizing);
    resizing = setTimeout(markScrolling, 150);
  });
  window.addEventListener('hashchange', landOnTarget);
  document.addEventListener('click', function (event) {
    var link = event.target.closest('a.row-link');
    // the same row's link twice gives no hashchange: land again after the browser's own scroll
    if (link && link.getAttribute('href') === window.location.hash) setTimeout(landOnTarget, 0);
  });
  markScrolling();
  landOnTarget();
  window.addEventListener('load', function () { markScrolling(); landOnTarget(); });
})();

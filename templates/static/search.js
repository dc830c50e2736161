// Conductor Atlas search glue: turns each search form into a combobox and shows what the core finds.
// The matching, the filters and their unit parsing live in the core (conductor_atlas.core.search);
// this file only loads the index (search-index.json, or search-index.js from a file), passes typed
// text to the core and builds the list.
// The build writes the index already prepared (core.search_prepare.prepare_index: lists only below the top
// level), so the parsed file is searched as it is and each keystroke is searched synchronously.
// Typed text and index text reach the page through textContent only, never as markup.
import {search} from '../js/conductor_atlas.core.search.js';
import {INDEX_FORMAT} from '../js/conductor_atlas.core.search_format.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';

// The site root: every search form carries it (data-root, relative to the page) from the build.
const FIRST_FORM = document.querySelector('form[data-search]');
const SITE_ROOT = new URL(FIRST_FORM ? FIRST_FORM.dataset.root : './', window.location.href);
const POPUP_LIMIT = 8;
const PAGE_LIMIT = 60;
const KIND_LABEL = {material: 'Material', table: 'Table', calculator: 'Calculator', page: 'Page', size: 'Size'};
const ANNOUNCE_PAUSE = 350;  // ms without typing before the live region reads the count

let indexPromise = null;

// A page opened from a file cannot fetch: there the build's search-index.js, a classic script
// holding the same index, hands it over through self.conductorAtlasSearchIndex.
function indexFromScript() {
  return new Promise((resolve, reject) => {
    if (self.conductorAtlasSearchIndex) { resolve(self.conductorAtlasSearchIndex); return; }
    const script = document.createElement('script');
    script.src = new URL('search-index.js', SITE_ROOT).href;
    script.onload = () => resolve(self.conductorAtlasSearchIndex || null);
    script.onerror = () => reject(new Error('search-index.js did not load'));
    document.head.appendChild(script);
  });
}

function indexFromServer() {
  return fetch(new URL('search-index.json', SITE_ROOT)).then((response) => {
    if (!response.ok) throw new Error('HTTP ' + response.status);
    return response.json();
  });
}

function loadIndex() {
  if (indexPromise === null) {
    indexPromise = (window.location.protocol === 'file:' ? indexFromScript() : indexFromServer())
      .then((data) => {
        if (data === null || data.format !== INDEX_FORMAT) {
          throw new Error('search-index.json is not in format ' + INDEX_FORMAT + '; rebuild the site');
        }
        return dict(data);  // the one dict of the index: a Transcrypt dict, as the core expects
      });
  }
  return indexPromise;
}

// A changed text goes into the text node already shown (no new node to style and lay out); empty
// text removes it, so :empty rules still hold.
function setText(node, text) {
  const first = node.firstChild;
  if (first !== null && first === node.lastChild && first.nodeType === Node.TEXT_NODE) {
    if (first.data === text) return;
    if (text !== '') { first.data = text; return; }
  } else if (first === null && text === '') {
    return;
  }
  node.textContent = text;
}

function setAttribute(node, name, value) {
  if (node.getAttribute(name) !== value) node.setAttribute(name, value);
}

function plural(n, word) {
  return n + ' ' + word + (n === 1 ? '' : 's');
}

class SearchBox {
  constructor(form) {
    this.form = form;
    this.mode = form.dataset.search === 'page' ? 'page' : 'popup';
    this.input = form.querySelector('input[name=q]');
    this.list = form.querySelector('.site-search-results');
    this.message = form.querySelector('.site-search-message');
    this.status = form.querySelector('[role=status]');
    this.results = [];
    this.active = -1;
    this.index = null;
    this.announceTimer = 0;
    this.announceText = '';
    this.announceAt = 0;
    this.pool = [];  // one <li> per result place, made once and refilled while typing
    this.shown = 0;  // how many of them are in the list
    this.input.setAttribute('role', 'combobox');
    this.input.setAttribute('aria-autocomplete', 'list');
    this.input.setAttribute('aria-expanded', 'false');
    this.input.setAttribute('aria-controls', this.list.id);
    this.list.setAttribute('role', 'listbox');
    this.input.addEventListener('input', () => this.run());
    this.input.addEventListener('focus', () => { this.ensureIndex().catch(() => {}); }, {once: true});
    this.input.addEventListener('keydown', (event) => this.onKey(event));
    this.input.addEventListener('blur', () => { if (this.mode === 'popup') this.close(); });
    // keep the focus in the input while a result is clicked
    this.list.addEventListener('mousedown', (event) => event.preventDefault());
    this.list.addEventListener('click', (event) => {
      const item = event.target.closest('[role=option]');
      if (item) this.open(this.pool.indexOf(item));
    });
    form.addEventListener('submit', (event) => {
      if (this.mode === 'page') { event.preventDefault(); this.open(this.active); }
    });
  }

  ensureIndex() {
    return loadIndex().then((index) => { this.index = index; return index; }, (problem) => {
      this.showMessage('The search index could not be loaded (' + String(problem && problem.message || problem)
        + '); the home page lists every material.');
      throw problem;
    });
  }

  run() {
    const text = this.input.value;
    if (this.index === null) {
      this.ensureIndex().then(() => { if (this.input.value === text) this.run(); }, () => {});
      return;
    }
    let outcome;
    try {
      outcome = search(this.index, text, this.mode === 'page' ? PAGE_LIMIT : POPUP_LIMIT);
    } catch (problem) {
      outcome = {results: [], total: 0, filters: [], note: '',
        errors: ['Search hit an internal problem: ' + String(problem && problem.message || problem)]};
    }
    this.show(outcome);
    if (this.mode === 'page') this.writeQuery(text);
  }

  show(outcome) {
    this.results = outcome.results;
    this.active = -1;
    this.input.removeAttribute('aria-activedescendant');
    const count = outcome.results.length;
    outcome.results.forEach((result, i) => this.fill(this.option(i), result));
    // places are added or dropped at the end only; the items and their text nodes are kept in the
    // pool, so typing again refills them in place
    while (this.shown < count) this.list.appendChild(this.pool[this.shown++]);
    while (this.shown > count) this.pool[--this.shown].remove();
    const lines = [];
    for (const problem of outcome.errors) lines.push(problem);
    for (const f of outcome.filters) lines.push('Filter: ' + f.text);
    if (outcome.note) lines.push(outcome.note);
    if (outcome.total > outcome.results.length) {
      lines.push('Showing ' + outcome.results.length + ' of ' + outcome.total
        + (this.mode === 'popup' ? '; Enter lists them all.' : '.'));
    }
    this.showMessage(lines.join(' '));
    this.message.classList.toggle('is-error', outcome.errors.length > 0);
    const empty = this.input.value.trim() === '';
    const hasResults = outcome.results.length > 0;
    if (this.list.hidden === hasResults) this.list.hidden = !hasResults;
    setAttribute(this.input, 'aria-expanded', hasResults ? 'true' : 'false');
    if (empty) this.showMessage('');
    this.announce(empty ? '' : (outcome.errors.length ? outcome.errors.join(' ')
      : plural(outcome.total, 'result') + (hasResults ? '. First: ' + outcome.results[0].title + '.' : '.')
        + (outcome.note ? ' ' + outcome.note : '')));
  }

  // The option element for result place i, made on first use (its id stays with the place).
  option(i) {
    if (i >= this.pool.length) {
      const item = document.createElement('li');
      item.id = this.list.id + '-' + i;
      item.setAttribute('role', 'option');
      item.setAttribute('aria-selected', 'false');
      for (const part of ['kind', 'title', 'snippet']) {
        const span = document.createElement('span');
        span.className = 'site-search-' + part;
        item.appendChild(span);
      }
      this.pool.push(item);
    }
    return this.pool[i];
  }

  // Only what differs from the place's previous result is written (DOM writes are the slow part).
  fill(item, result) {
    setAttribute(item, 'aria-selected', 'false');
    if (item.dataset.url !== result.url) item.dataset.url = result.url;
    const className = 'site-search-option kind-' + result.kind;
    if (item.className !== className) item.className = className;
    const parts = item.children;
    setText(parts[0], KIND_LABEL[result.kind] || result.kind);
    setText(parts[1], result.title);
    setText(parts[2], result.snippet);
  }

  showMessage(text) {
    setText(this.message, text);
    if (this.message.hidden !== (text === '')) this.message.hidden = text === '';
  }

  announce(text) {
    // wait for a pause in typing (ANNOUNCE_PAUSE without a new text) so a screen reader is not
    // flooded with counts; one timer, moved on when it fires early, not one per keystroke
    this.announceText = text;
    this.announceAt = performance.now();
    if (this.announceTimer === 0) this.announceTimer = window.setTimeout(() => this.announceLater(), ANNOUNCE_PAUSE);
  }

  announceLater() {
    const wait = this.announceAt + ANNOUNCE_PAUSE - performance.now();
    if (wait > 1) {
      this.announceTimer = window.setTimeout(() => this.announceLater(), wait);
      return;
    }
    this.announceTimer = 0;
    this.status.textContent = this.announceText;
  }

  move(step) {
    const count = this.results.length;
    if (count === 0) return;
    this.list.hidden = false;
    this.input.setAttribute('aria-expanded', 'true');
    let next = this.active + step;
    if (next < 0) next = count - 1;
    if (next >= count) next = 0;
    this.select(next);
  }

  select(i) {
    const options = this.list.querySelectorAll('[role=option]');
    options.forEach((node, k) => node.setAttribute('aria-selected', k === i ? 'true' : 'false'));
    this.active = i;
    if (i >= 0 && options[i]) {
      this.input.setAttribute('aria-activedescendant', options[i].id);
      options[i].scrollIntoView({block: 'nearest'});
    } else {
      this.input.removeAttribute('aria-activedescendant');
    }
  }

  open(i) {
    if (i < 0 || i >= this.results.length) return false;
    window.location.assign(new URL(this.results[i].url, SITE_ROOT).href);
    return true;
  }

  close() {
    if (this.mode !== 'popup') return;
    this.list.hidden = true;
    this.input.setAttribute('aria-expanded', 'false');
    this.select(-1);
  }

  clear() {
    this.input.value = '';
    this.show({results: [], total: 0, filters: [], errors: [], note: ''});
    this.status.textContent = 'Search cleared.';
    if (this.mode === 'page') this.writeQuery('');
  }

  onKey(event) {
    if (event.key === 'ArrowDown') {
      event.preventDefault();
      this.move(1);
    } else if (event.key === 'ArrowUp') {
      event.preventDefault();
      this.move(-1);
    } else if (event.key === 'Enter') {
      if (this.active >= 0) {
        event.preventDefault();
        this.open(this.active);
      }
      // otherwise the form goes to the search page (popup) or stays (page)
    } else if (event.key === 'Escape') {
      event.preventDefault();
      this.clear();
    } else if (event.key === 'Tab') {
      this.close();
    }
  }

  writeQuery(text) {
    const params = new URLSearchParams(window.location.search);
    if (text.trim() === '') params.delete('q'); else params.set('q', text);
    const query = params.toString();
    window.history.replaceState(null, '', window.location.pathname + (query ? '?' + query : ''));
  }
}

const boxes = Array.from(document.querySelectorAll('form[data-search]')).map((form) => new SearchBox(form));
for (const box of boxes) {
  if (box.mode === 'page') {
    const typed = new URLSearchParams(window.location.search).get('q');
    if (typed) box.input.value = typed;
    box.ensureIndex().then(() => box.run(), () => {});
  } else if (document.activeElement === box.input && box.input.value.trim() !== '') {
    box.run();  // typed while this script was loading (static/search-loader.js)
  }
}
document.documentElement.classList.add('search-ready');

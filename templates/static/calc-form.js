// Conductor Atlas calculator glue: reads the form, calls the transpiled Python core, writes results.
// The physics, the unit parsing and the number formatting all live in the core (conductor_atlas.core);
// this file only moves text between the page and the core.

// Plain JSON objects become Transcrypt dicts (keys(), get(), `in` work on them in the core).
function toPy(value) {
  if (Array.isArray(value)) return value.map(toPy);
  if (value !== null && typeof value === 'object') {
    const out = {};
    for (const key of Object.keys(value)) out[key] = toPy(value[key]);
    return dict(out);
  }
  return value;
}

function readCatalogue(form) {
  const holder = document.getElementById(form.dataset.catalogue);
  return toPy(JSON.parse(holder.textContent));
}

function fieldsOf(form) {
  return Array.from(form.querySelectorAll('input[name], select[name]'));
}

function visibleFields(form) {
  return fieldsOf(form).filter((input) => input.type !== 'hidden');
}

function fillFromQuery(form) {
  const params = new URLSearchParams(window.location.search);
  for (const input of visibleFields(form)) {
    if (params.has(input.name)) setValue(input, params.get(input.name));
  }
}

// A choice from an address is matched in any case ("Linear"); one the list does not hold is added as
// typed, so the core names the problem under the field instead of the list falling back silently.
function setValue(input, text) {
  if (input.tagName !== 'SELECT') { input.value = text; return; }
  const wanted = text.trim().toLowerCase();
  const match = Array.from(input.options).find((option) => option.value === wanted);
  if (!match) {
    const option = document.createElement('option');
    option.value = text;
    option.textContent = text;
    input.appendChild(option);
  }
  input.value = match ? wanted : text;
}

// The model field offers every model; those the material in use has no data for are marked not
// available, with the reason (the catalogue record's "models" lists the ones it has).
function showModels(view, catalogue, outcome) {
  const select = view.modelSelect;
  if (!select || !outcome.material || view.modelsFor === outcome.material) return;
  const record = catalogue.materials[outcome.material];
  if (!record || !record.models) return;
  select.dataset.modelsFor = outcome.material;
  view.modelsFor = outcome.material;
  for (const option of select.options) {
    if (!option.dataset.needs) continue;
    const has = record.models.includes(option.value);
    option.disabled = !has;
    option.textContent = option.dataset.label + (has ? '' : ' (not available: ' + option.dataset.needs + ')');
  }
}

function writeQuery(form) {
  const params = new URLSearchParams();
  for (const input of visibleFields(form)) {
    if (input.value.trim() !== '') params.set(input.name, input.value);
  }
  const query = params.toString();
  const search = query ? '?' + query : '';
  // the address already says this (the change event after a pause, or typing back to the same text):
  // replaceState is a same-document navigation, a few ms on a tablet, so it is skipped
  if (search === window.location.search) return;
  window.history.replaceState(null, '', window.location.pathname + search + window.location.hash);
}

// A field's label as the page shows it ("Cross-section"), or '' without one (a hidden field).
function labelOf(input) {
  const label = input.id ? document.querySelector('label[for="' + input.id + '"]') : null;
  return label ? label.textContent.trim() : '';
}

// The core's notes about one field begin with the field's name, as the command line's options do
// ("size: “10 ga” is read as 10 AWG …"); on the page the field is named by its label
// ("Cross-section: “10 ga” is read as …"), the words the person sees above the field.
function inFieldWords(view, text) {
  const colon = text.indexOf(': ');
  if (colon < 1) return text;
  const name = text.slice(0, colon);
  const field = view.fields.find((entry) => entry.visible && entry.name === name);
  return field && field.label ? field.label + text.slice(colon) : text;
}

// The page parts one form writes, found once: a calculator update then only compares and writes.
function viewOf(form) {
  const section = form.closest('section');
  const fields = fieldsOf(form).map((input) => ({
    input, name: input.name, visible: input.type !== 'hidden', label: labelOf(input),
    slot: document.getElementById(input.id + '-error'), message: null, shown: null, editing: false, timer: 0, due: 0}));
  // the key-result strip repeats some results (data-key-result): each mirrors its data-result cell
  const keyCells = Array.from(section.querySelectorAll('[data-key-result]'));
  const cells = Array.from(section.querySelectorAll('[data-result]')).map((cell) => ({
    cell, name: cell.dataset.result, text: null, value: null, low: null, high: null,
    mirrors: keyCells.filter((key) => key.dataset.keyResult === cell.dataset.result)}));
  return {
    form, fields, cells, inputs: null, state: null, general: null, warnings: [], model: null, sources: null,
    problemsNode: section.querySelector('.calc-problems'),
    warningsNode: section.querySelector('.calc-warnings'),
    modelNode: section.querySelector('[data-model]'), materialNode: section.querySelector('[data-material]'), used: null,
    sourcesNode: section.querySelector('[data-sources]'),
    busyNode: section.querySelector('[data-busy]'), busy: '', slow: false, ran: false, solveTimer: 0, solved: null, awaiting: null,
    // the model list, found once; modelsFor: the material its options were last marked for
    modelSelect: form.querySelector('select[name=model]'), modelsFor: null,
  };
}

// Change an element's text in place: its one text node takes the new characters, so no node is made
// or dropped (a new node needs its style and layout objects made again). Empty text removes the node,
// so :empty rules (a hidden problems line) still hold.
function setText(node, text) {
  const first = node.firstChild;
  if (text !== '' && first !== null && first === node.lastChild && first.nodeType === Node.TEXT_NODE) first.data = text;
  else node.textContent = text;
}

// In the narrow key-result strip a number keeps its unit on its line: "3.2243 µΩ·cm", never a
// lone "µΩ·cm" below (a no-break space after a digit).
const keepUnits = (text) => text.replace(/(\d) (?=\S)/g, '$1\u00a0');

const own = (object, key) => Object.prototype.hasOwnProperty.call(object, key);

// A field's message is judged when the person stops: on leaving the field, or after a pause in
// typing ("5" on the way to "50 m" is not an error yet). While the field is being typed in, a new
// message waits; a message that no longer holds goes at once. Results update on every keystroke.
const PAUSE_MS = 900;

function paint(field) {
  const text = field.editing && field.message !== field.shown ? '' : field.message;
  if (text === field.shown) return;
  field.shown = text;
  if (field.slot) setText(field.slot, text);
  if (text) field.input.setAttribute('aria-invalid', 'true'); else field.input.removeAttribute('aria-invalid');
}

// A keystroke only moves the field's deadline; its one timer re-arms itself until the deadline passes.
function typing(field) {
  field.editing = true;
  field.due = performance.now() + PAUSE_MS;
  if (!field.timer) field.timer = setTimeout(() => pause(field), PAUSE_MS);
}

function pause(field) {
  const wait = field.due - performance.now();
  if (wait > 1) { field.timer = setTimeout(() => pause(field), wait); return; }
  field.timer = 0;
  judge(field);
}

function judge(field) {
  clearTimeout(field.timer);
  field.timer = 0;
  field.editing = false;
  paint(field);
}

// Write only what differs from the last update: most of a form's results and messages stay the
// same while one field is typed in, and every DOM write costs more than the comparison.
function show(view, outcome) {
  const errors = outcome.errors;
  const general = [];
  const named = new Set();
  for (const field of view.fields) {
    if (!field.visible) continue;
    named.add(field.name);
    field.message = own(errors, field.name) ? errors[field.name] : '';
    paint(field);
  }
  for (const key of Object.keys(errors)) if (!named.has(key)) general.push(key + ': ' + errors[key]);
  for (const entry of view.cells) {
    const result = own(outcome.results, entry.name) ? outcome.results[entry.name] : null;
    const shown = result && Number.isFinite(result.value);
    const text = shown ? result.text : '—';
    const value = shown ? String(result.value) : null;
    if (text !== entry.text) {
      setText(entry.cell, text);
      if (entry.mirrors.length) {
        const kept = keepUnits(text);
        for (const mirror of entry.mirrors) setText(mirror, kept);
      }
      entry.text = text;
    }
    if (value !== entry.value) {
      if (value === null) delete entry.cell.dataset.value; else entry.cell.dataset.value = value;
      entry.value = value;
    }
    // a result computed over the material's recorded range (core.ranges) carries its ends
    const low = shown && Number.isFinite(result.low) ? String(result.low) : null;
    const high = shown && Number.isFinite(result.high) ? String(result.high) : null;
    if (low !== entry.low) {
      if (low === null) delete entry.cell.dataset.low; else entry.cell.dataset.low = low;
      entry.low = low;
    }
    if (high !== entry.high) {
      if (high === null) delete entry.cell.dataset.high; else entry.cell.dataset.high = high;
      entry.high = high;
    }
  }
  const problems = general.join(' · ');
  if (view.problemsNode && problems !== view.general) setText(view.problemsNode, problems);
  view.general = problems;
  if (view.warningsNode) showList(view.warningsNode, view.warnings, outcome.warnings.map((text) => inFieldWords(view, text)));
  showMaterials(view, outcome.used || []);
  const model = outcome.model ? 'Model: ' + outcome.model : '';
  if (view.modelNode && model !== view.model) setText(view.modelNode, model);
  view.model = model;
  const sources = outcome.sources && outcome.sources.length ? outcome.sources.join(', ') : '';
  if (view.sourcesNode && sources !== view.sources) showSources(view.sourcesNode, outcome.sources || []);
  view.sources = sources;
  const state = Object.keys(errors).length ? 'error' : 'ok';
  if (state !== view.state) view.form.dataset.state = state;
  view.state = state;
}

// The warnings as list items: an item whose text is unchanged is left alone, a changed one gets its
// new text in place, and items are added or dropped only at the end. ``shown`` is the texts shown.
function showList(node, shown, texts) {
  for (let i = 0; i < texts.length; i++) {
    if (i < shown.length) {
      if (shown[i] !== texts[i]) { setText(node.children[i], texts[i]); shown[i] = texts[i]; }
    } else {
      const item = document.createElement('li');
      item.textContent = texts[i];
      node.appendChild(item);
      shown.push(texts[i]);
    }
  }
  while (shown.length > texts.length) { node.lastElementChild.remove(); shown.pop(); }
}

// The sources a result used, each linked to its entry on the references page (as on material pages).
function showSources(node, keys) {
  node.replaceChildren();
  if (!keys.length) return;
  node.appendChild(document.createTextNode('Sources: '));
  keys.forEach((key, index) => {
    if (index > 0) node.appendChild(document.createTextNode(', '));
    const link = document.createElement('a');
    link.href = node.dataset.root + 'references/index.html#src-' + encodeURIComponent(key);
    link.textContent = key;
    node.appendChild(link);
  });
}

// The first result line: each material the results were computed for, linked to its page, with the
// note on how a trade word was read. outcome.used holds [id, name, class, note] lists.
function showMaterials(view, used) {
  const key = used.map((entry) => entry.join('\u0001')).join('\u0000');
  if (!view.materialNode || key === view.used) return;
  view.used = key;
  view.materialNode.replaceChildren();
  used.forEach(([id, name, klass, note], index) => {
    if (index > 0) view.materialNode.appendChild(document.createTextNode(' · '));
    view.materialNode.appendChild(document.createTextNode(index === 0 ? 'Material: ' : ''));
    const link = document.createElement('a');
    link.href = view.materialNode.dataset.root + 'materials/' + encodeURIComponent(id) + '/index.html';
    link.textContent = name;
    view.materialNode.appendChild(link);
    view.materialNode.appendChild(document.createTextNode(' (' + klass + ', id ' + id + ')'));
    if (note) {
      const small = document.createElement('span');
      small.className = 'material-note';
      small.textContent = note;
      view.materialNode.appendChild(small);
    }
  });
}

// One Transcrypt dict of inputs per form, refilled on each update: the core only reads it (the
// outcome keeps a copy), and making a fresh dict (eighteen hidden methods attached to an object
// that already has the fields) was about 40 % of a thin-film update in node.
function inputsOf(view) {
  if (view.inputs === null) view.inputs = dict({});
  for (const field of view.fields) view.inputs[field.name] = field.input.value;
  return view.inputs;
}

function run(view, catalogue, live) {
  const inputs = inputsOf(view);
  const started = performance.now();
  let outcome;
  try {
    outcome = calculate(view.form.dataset.calculator, inputs, catalogue);
  } catch (problem) {
    outcome = {results: {}, warnings: ['The calculator hit an internal problem: ' + String(problem && problem.message || problem)], errors: {}};
  }
  // the page's first update also compiles the core, so it does not count; nor does a solve the core
  // said was coming (live): the measure is for updates nobody predicted to be slow
  if (view.ran && !live) view.slow = performance.now() - started > SLOW_MS;
  view.ran = true;
  show(view, outcome);
  showModels(view, catalogue, outcome);
  afterRun(view, catalogue, outcome);
}

// Typing never waits for a solve. Before an update runs, the core says whether it would run the live
// filament solver (core.calculators.needs_live_solver: a bar size at a frequency; tens to hundreds of
// ms on a tablet): such an update waits for a pause in typing of SETTLE_MS and says so. A form whose
// last unpredicted update took longer than SLOW_MS is treated the same way (a fallback for anything
// slow the core does not predict; 50 ms is what browsers count as a long task, one that delays input,
// and every other update takes a few ms). The note is painted before the solve starts (the solve
// holds the page until it ends). The page's first update does not wait for a pause.
const SLOW_MS = 50;
const SETTLE_MS = 400;

function setBusy(view, text) {
  if (text === view.busy) return;
  view.busy = text;
  if (view.busyNode) setText(view.busyNode, text);
  if (text) view.form.dataset.solving = ''; else delete view.form.dataset.solving;
}

function wouldSolve(view, catalogue) {
  if (needsLiveSolver === null) return false;
  try {
    return !!needsLiveSolver(view.form.dataset.calculator, inputsOf(view), catalogue);
  } catch (problem) {
    return false;  // the update itself reports what went wrong
  }
}

function update(view, catalogue) {
  // the same inputs as the last update (e.g. the change event after typing): that update stands,
  // solved or still waiting for its pause
  const key = view.fields.map((field) => field.input.value).join('\u0000');
  if (key === view.solved) return;
  view.solved = key;
  clearTimeout(view.solveTimer);
  const live = wouldSolve(view, catalogue);
  if (!live && !view.slow) {
    run(view, catalogue, false);
    return;
  }
  const solve = () => {
    setBusy(view, 'Solving …');
    requestAnimationFrame(() => {
      view.solveTimer = setTimeout(() => run(view, catalogue, live), 0);
    });
  };
  if (!view.ran) { solve(); return; }
  setBusy(view, 'Solving when you pause typing …');
  view.solveTimer = setTimeout(solve, SETTLE_MS);
}

// The first run of a path through the core costs several times its later runs (the browser makes
// the code ready on first use): at ×4 CPU throttling the first keystroke that made a bar answer on
// the skin-effect page held the page 20-35 ms, against 5-15 ms for the next ones. So once the form
// has its first answer, the core's warm-up inputs for the calculator (core.calculators.warm_up_inputs:
// a bar size) go through the same calls a keystroke makes, and the outcome is dropped: nothing on
// the page changes. A warm-up that would solve is skipped, and a problem in it is ignored (the
// person's own updates report theirs).
function warmUp(view, catalogue) {
  if (warmUpInputs === null) return;
  const name = view.form.dataset.calculator;
  try {
    const inputs = warmUpInputs(name, inputsOf(view));
    if (inputs && !(needsLiveSolver && needsLiveSolver(name, inputs, catalogue))) calculate(name, inputs, catalogue);
  } catch (problem) {
    // nothing to show: the warm-up's outcome is never shown
  }
}

// Parts of the core a page loads only when a calculator first needs them (core.ac_part): the core
// leaves those results out and names the part in outcome.pending; the page loads the part's script
// (beside the page's calculator script), says so, and runs the update again. The service worker
// stores the part with the rest of the site, so it also loads offline after one visit.
const PART_SCRIPTS = {ac: 'calc-ac.classic.js'};
const PART_LOADING = 'Loading the AC calculations (skin depth, AC resistance) …';
const PART_MISSING = 'The AC calculations could not be loaded (no network, and the site is not stored on this '
  + 'device yet): AC results are not shown.';
const parts = {};  // name -> {state: 'loading' | 'ready' | 'failed', waiting: [callbacks]}
let scriptBase = null;

function loadPart(name, then) {
  let part = parts[name];
  if (!part || part.state === 'failed') {  // a part that failed is tried again on a later update
    part = parts[name] = {state: 'loading', waiting: []};
    const ended = (state) => {
      part.state = state;
      for (const waiting of part.waiting.splice(0)) waiting(state);
    };
    const script = document.createElement('script');
    script.src = new URL(PART_SCRIPTS[name], scriptBase || document.baseURI).href;
    script.onload = () => ended('ready');
    script.onerror = () => ended('failed');
    document.head.appendChild(script);
  }
  if (part.state === 'loading') part.waiting.push(then); else then(part.state);
}

function afterRun(view, catalogue, outcome) {
  const name = outcome.pending;
  if (!name) { setBusy(view, ''); return; }
  // loaded, yet still pending: the part's script did not run here (never load it in a loop)
  if (!own(PART_SCRIPTS, name) || (parts[name] && parts[name].state === 'ready')) { setBusy(view, PART_MISSING); return; }
  setBusy(view, PART_LOADING);
  if (view.awaiting === name) return;  // this form already waits for the part
  view.awaiting = name;
  loadPart(name, (state) => {
    view.awaiting = null;
    if (state !== 'ready') { setBusy(view, PART_MISSING); return; }
    view.solved = null;
    update(view, catalogue);
  });
}

// Start every calculator form of the page. `calculateWith(name, inputs, catalogue)` is the core's
// calculate (calc.js: all calculators) or one calculator alone (calc-resistance.js), `makeDict`
// the runtime's dict, `needsLiveSolverWith(name, inputs, catalogue)` the core's
// calculators.needs_live_solver (or one calculator's) and `warmUpInputsWith(name, inputs)` the
// core's calculators.warm_up_inputs: the entry scripts pass them, so this file imports nothing.
let calculate = null;
let dict = null;
let needsLiveSolver = null;
let warmUpInputs = null;

export function start(calculateWith, makeDict, needsLiveSolverWith, warmUpInputsWith) {
  calculate = calculateWith;
  dict = makeDict;
  needsLiveSolver = needsLiveSolverWith || null;
  warmUpInputs = warmUpInputsWith || null;
  // the page's calculator script, while it runs: the parts it loads later sit beside it
  if (document.currentScript && document.currentScript.src) scriptBase = document.currentScript.src;
  for (const form of document.querySelectorAll('form[data-calculator]')) {
    const catalogue = readCatalogue(form);
    fillFromQuery(form);
    const view = viewOf(form);
    // The address follows the inputs, 250 ms after the last keystroke (replaceState is costly on
    // tablets). A keystroke only moves the deadline; the one timer re-arms itself until it passes.
    let timer = 0;
    let due = 0;
    const flush = () => {
      const wait = due - performance.now();
      if (wait > 1) { timer = setTimeout(flush, wait); return; }
      timer = 0;
      writeQuery(form);
    };
    const remember = () => { due = performance.now() + 250; if (!timer) timer = setTimeout(flush, 250); };
    const fieldOf = (target) => view.fields.find((field) => field.input === target);
    form.addEventListener('input', (event) => {
      const field = fieldOf(event.target);
      if (field) typing(field);
      update(view, catalogue);
      remember();
    });
    form.addEventListener('change', () => { update(view, catalogue); clearTimeout(timer); timer = 0; writeQuery(form); });
    form.addEventListener('focusout', (event) => { const field = fieldOf(event.target); if (field) judge(field); });
    form.addEventListener('submit', (event) => event.preventDefault());
    update(view, catalogue);
    warmUp(view, catalogue);
  }
  document.documentElement.classList.add('calc-ready');
}

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
    if (params.has(input.name)) input.value = params.get(input.name);
  }
}

function writeQuery(form) {
  const params = new URLSearchParams();
  for (const input of visibleFields(form)) {
    if (input.value.trim() !== '') params.set(input.name, input.value);
  }
  const query = params.toString();
  const url = window.location.pathname + (query ? '?' + query : '') + window.location.hash;
  window.history.replaceState(null, '', url);
}

function show(form, outcome) {
  const section = form.closest('section');
  const errors = outcome.errors;
  for (const input of fieldsOf(form)) {
    const slot = document.getElementById(input.id + '-error');
    const message = Object.prototype.hasOwnProperty.call(errors, input.name) ? errors[input.name] : '';
    if (slot) slot.textContent = message;
    if (message) input.setAttribute('aria-invalid', 'true'); else input.removeAttribute('aria-invalid');
  }
  for (const cell of section.querySelectorAll('[data-result]')) {
    const name = cell.dataset.result;
    const result = Object.prototype.hasOwnProperty.call(outcome.results, name) ? outcome.results[name] : null;
    if (result && Number.isFinite(result.value)) {
      cell.textContent = result.text;
      cell.dataset.value = String(result.value);
    } else {
      cell.textContent = '—';
      delete cell.dataset.value;
    }
  }
  const shown = new Set(visibleFields(form).map((input) => input.name));
  const general = Object.keys(errors).filter((field) => !shown.has(field)).map((field) => field + ': ' + errors[field]);
  const problems = section.querySelector('.calc-problems');
  if (problems) problems.textContent = general.join(' · ');
  const list = section.querySelector('.calc-warnings');
  if (list) {
    list.replaceChildren();
    for (const text of outcome.warnings) {
      const item = document.createElement('li');
      item.textContent = text;
      list.appendChild(item);
    }
  }
  const model = section.querySelector('[data-model]');
  if (model) model.textContent = outcome.model ? 'Model: ' + outcome.model : '';
  const sources = section.querySelector('[data-sources]');
  if (sources) sources.textContent = outcome.sources && outcome.sources.length ? 'Sources: ' + outcome.sources.join(', ') : '';
}

function run(form, catalogue) {
  const inputs = {};
  for (const input of fieldsOf(form)) inputs[input.name] = input.value;
  let outcome;
  try {
    outcome = calculate(form.dataset.calculator, dict(inputs), catalogue);
  } catch (problem) {
    outcome = {results: {}, warnings: ['The calculator hit an internal problem: ' + String(problem && problem.message || problem)], errors: {}};
  }
  show(form, outcome);
  form.dataset.state = Object.keys(outcome.errors).length ? 'error' : 'ok';
}

// Start every calculator form of the page. `calculateWith(name, inputs, catalogue)` is the core's
// calculate (calc.js: all calculators) or one calculator alone (calc-resistance.js), and `makeDict`
// the runtime's dict: the entry scripts pass both, so this file imports nothing.
let calculate = null;
let dict = null;

export function start(calculateWith, makeDict) {
  calculate = calculateWith;
  dict = makeDict;
  for (const form of document.querySelectorAll('form[data-calculator]')) {
    const catalogue = readCatalogue(form);
    fillFromQuery(form);
    // The address follows the inputs, but not on every keystroke: replaceState is costly on tablets.
    let pending = 0;
    const remember = () => { clearTimeout(pending); pending = setTimeout(() => writeQuery(form), 250); };
    form.addEventListener('input', () => { run(form, catalogue); remember(); });
    form.addEventListener('change', () => { run(form, catalogue); clearTimeout(pending); writeQuery(form); });
    form.addEventListener('submit', (event) => event.preventDefault());
    run(form, catalogue);
  }
  document.documentElement.classList.add('calc-ready');
}

// Conductor Atlas calculator glue: reads the form, calls the transpiled Python core, writes results.
// The physics, the unit parsing and the number formatting all live in the core (conductor_atlas.core);
// this file only moves text between the page and the core.
import {calculate} from '../js/conductor_atlas.core.calculators.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';

function readMaterial(form) {
  const holder = document.getElementById(form.dataset.material);
  return JSON.parse(holder.textContent);
}

function fieldsOf(form) {
  return Array.from(form.querySelectorAll('input[name]'));
}

function fillFromQuery(form) {
  const params = new URLSearchParams(window.location.search);
  for (const input of fieldsOf(form)) {
    if (params.has(input.name)) input.value = params.get(input.name);
  }
}

function writeQuery(form) {
  const params = new URLSearchParams();
  for (const input of fieldsOf(form)) {
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
  const list = section.querySelector('.calc-warnings');
  if (list) {
    list.replaceChildren();
    for (const text of outcome.warnings) {
      const item = document.createElement('li');
      item.textContent = text;
      list.appendChild(item);
    }
  }
}

function run(form, material) {
  const inputs = {};
  for (const input of fieldsOf(form)) inputs[input.name] = input.value;
  let outcome;
  try {
    outcome = calculate(form.dataset.calculator, dict(inputs), dict(material));
  } catch (problem) {
    outcome = {results: {}, warnings: ['The calculator hit an internal problem: ' + String(problem && problem.message || problem)], errors: {}};
  }
  show(form, outcome);
  form.dataset.state = Object.keys(outcome.errors).length ? 'error' : 'ok';
}

for (const form of document.querySelectorAll('form[data-calculator]')) {
  const material = readMaterial(form);
  fillFromQuery(form);
  form.addEventListener('input', () => { run(form, material); writeQuery(form); });
  form.addEventListener('submit', (event) => event.preventDefault());
  run(form, material);
}
document.documentElement.classList.add('calc-ready');

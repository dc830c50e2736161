// Conductor Atlas: the compare page. Every calculator as on the calculator pages, plus a chart of
// ρ(T) for the two materials being compared, drawn from the same core models the tables use. The AC
// part of the core (calc-ac.js) is in the same script.
import {calculate, needs_live_solver} from '../js/conductor_atlas.core.calculators.js';
import {find_material} from '../js/conductor_atlas.core.lookup.js';
import {resistivity_at} from '../js/conductor_atlas.core.material_models.js';
import {format_number} from '../js/conductor_atlas.core.numfmt.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';
import * as acPart from './calc-ac.js';
import {start} from './calc-form.js';

const SVG = 'http://www.w3.org/2000/svg';
const T_LOW = 20;     // K: the widest span any model in the data covers
const T_HIGH = 1300;  // K
const SAMPLES = 128;
const BOX = {width: 640, height: 360, left: 64, right: 16, top: 52, bottom: 48};

function curve(record) {
  // [T, ρ in µΩ·cm] where the auto model holds without a warning; null marks a gap
  const points = [];
  for (let i = 0; i <= SAMPLES; i++) {
    const t = T_LOW + (T_HIGH - T_LOW) * i / SAMPLES;
    let found = null;
    try { found = resistivity_at(record, t, 'auto'); } catch (problem) { found = null; }
    points.push(found && found.warnings.length === 0 ? [t, found.rho * 1e8] : null);
  }
  return points;
}

function niceTicks(lo, hi) {
  // 1-2-5 steps, at most 8 ticks covering [lo, hi]
  const span = hi - lo || Math.abs(hi) || 1;
  for (const exponent of [Math.floor(Math.log10(span)) - 1, Math.floor(Math.log10(span))]) {
    for (const m of [1, 2, 5, 10]) {
      const step = m * Math.pow(10, exponent);
      const first = Math.floor(lo / step) * step;
      const last = Math.ceil(hi / step) * step;
      if ((last - first) / step <= 7) {
        const ticks = [];
        for (let v = first; v <= last + step / 2; v += step) ticks.push(v);
        return ticks;
      }
    }
  }
  return [lo, hi];
}

function el(name, attrs, text) {
  const node = document.createElementNS(SVG, name);
  for (const [key, value] of Object.entries(attrs)) node.setAttribute(key, String(value));
  if (text !== undefined) node.textContent = text;
  return node;
}

function draw(figure, series) {
  const svg = figure.querySelector('svg');
  svg.replaceChildren();
  const all = series.flatMap((s) => s.points.filter((p) => p !== null));
  if (all.length < 2) { figure.hidden = true; return; }
  const xTicks = niceTicks(Math.min(...all.map((p) => p[0])), Math.max(...all.map((p) => p[0])));
  const yTicks = niceTicks(0, Math.max(...all.map((p) => p[1])));
  const x0 = xTicks[0], x1 = xTicks[xTicks.length - 1], y1 = yTicks[yTicks.length - 1];
  const px = (x) => BOX.left + (x - x0) / (x1 - x0) * (BOX.width - BOX.left - BOX.right);
  const py = (y) => BOX.height - BOX.bottom - y / y1 * (BOX.height - BOX.top - BOX.bottom);
  for (const x of xTicks) {
    svg.appendChild(el('line', {x1: px(x), x2: px(x), y1: py(0), y2: py(y1), class: 'chart-grid'}));
    svg.appendChild(el('text', {x: px(x), y: py(0) + 18, 'text-anchor': 'middle', class: 'chart-text'}, format_number(x, 4)));
  }
  for (const y of yTicks) {
    svg.appendChild(el('line', {x1: px(x0), x2: px(x1), y1: py(y), y2: py(y), class: 'chart-grid'}));
    svg.appendChild(el('text', {x: BOX.left - 8, y: py(y) + 4, 'text-anchor': 'end', class: 'chart-text'}, format_number(y, 4)));
  }
  svg.appendChild(el('text', {x: (BOX.left + BOX.width) / 2, y: BOX.height - 8, 'text-anchor': 'middle', class: 'chart-axis-title'}, 'Temperature (K)'));
  svg.appendChild(el('text', {x: 14, y: (BOX.top + BOX.height - BOX.bottom) / 2, 'text-anchor': 'middle', class: 'chart-axis-title',
    transform: `rotate(-90 14 ${(BOX.top + BOX.height - BOX.bottom) / 2})`}, 'Resistivity (µΩ·cm)'));
  series.forEach((s, index) => {
    let d = '';
    let pen = 'M';
    for (const p of s.points) {
      if (p === null) { pen = 'M'; continue; }
      d += `${pen}${px(p[0]).toFixed(2)},${py(p[1]).toFixed(2)} `;
      pen = 'L';
    }
    svg.appendChild(el('path', {d: d.trim(), fill: 'none', stroke: 'currentColor', class: `chart-line chart-series-${index} chart-dash-${index}`}));
    const row = 14 + index * 18;  // legend: one row per material, so long names never collide
    svg.appendChild(el('line', {x1: BOX.left + 8, x2: BOX.left + 36, y1: row, y2: row, stroke: 'currentColor',
      class: `chart-line chart-series-${index} chart-dash-${index}`}));
    svg.appendChild(el('text', {x: BOX.left + 42, y: row + 4, class: 'chart-text'}, s.name));
  });
  svg.setAttribute('aria-label', 'Resistivity against temperature of ' + series.map((s) => s.name).join(' and '));
  figure.hidden = false;
}

let drawnFor = null;  // the two material texts the chart shows: redraw only when they change

function chartFor(inputs, catalogue) {
  const figure = document.getElementById('compare-chart');
  if (!figure) return;
  const key = (inputs.material || '') + '\u0000' + (inputs.other || '');
  if (key === drawnFor) return;
  drawnFor = key;
  const series = [];
  for (const field of ['material', 'other']) {
    try {
      const record = find_material(catalogue, inputs[field] || '', field);
      series.push({name: record.name, points: curve(record)});
    } catch (problem) {
      figure.hidden = true;
      return;
    }
  }
  draw(figure, series);
}

// The chart follows the two materials once typing pauses (drawing 2 x 129 model points is several
// times a calculator update); the first one is drawn with the page's first results.
const CHART_PAUSE_MS = 300;
let chartTimer = 0;

start((name, inputs, catalogue) => {
  const outcome = calculate(name, inputs, catalogue);
  if (name === 'compare') {
    const wanted = {material: inputs.material, other: inputs.other};  // calc-form.js refills `inputs`
    clearTimeout(chartTimer);
    if (drawnFor === null) chartFor(wanted, catalogue);
    else chartTimer = setTimeout(() => chartFor(wanted, catalogue), CHART_PAUSE_MS);
  }
  return outcome;
}, dict, needs_live_solver);

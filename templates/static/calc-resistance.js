// Conductor Atlas: the resistance calculator alone, for material pages, so they load only the part of
// the core it uses (about 41 kB compressed instead of 58 kB for all calculators; see bench/).
import {calculate as calculateResistance} from '../js/conductor_atlas.core.calc_resistance.js';
import {add_error, new_outcome} from '../js/conductor_atlas.core.outcome.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';
import {start} from './calc-form.js';

start((name, inputs, catalogue) => {
  if (name === 'resistance') return calculateResistance(inputs, catalogue);
  const outcome = new_outcome(name, inputs);
  add_error(outcome, 'calculator', 'this page carries only the resistance calculator');
  return outcome;
}, dict);

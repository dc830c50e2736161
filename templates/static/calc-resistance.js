// Conductor Atlas: the resistance calculator alone, for material pages, so they load only the part of
// the core it uses; its AC part (calc-ac.js: skin depth, AC/DC ratio and the solvers under it) is
// loaded when a frequency is first typed (calc-form.js; sizes in bench/). A material page itself adds
// this script's twin only when its calculator is about to be used (calc-loader.js).
import {calculate as calculateResistance, needs_live_solver as resistanceNeedsLiveSolver} from '../js/conductor_atlas.core.calc_resistance.js';
import {add_error, new_outcome} from '../js/conductor_atlas.core.outcome.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';
import {start} from './calc-form.js';

start((name, inputs, catalogue) => {
  if (name === 'resistance') return calculateResistance(inputs, catalogue);
  const outcome = new_outcome(name, inputs);
  add_error(outcome, 'calculator', 'this page carries only the resistance calculator');
  return outcome;
}, dict, (name, inputs, catalogue) => name === 'resistance' && resistanceNeedsLiveSolver(inputs, catalogue));

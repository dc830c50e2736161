// Conductor Atlas: every calculator (calculator pages), with the AC part of the core (calc-ac.js)
// in the same script. The glue is calc-form.js.
import {calculate, needs_live_solver, warm_up_inputs} from '../js/conductor_atlas.core.calculators.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';
import * as acPart from './calc-ac.js';
import {start} from './calc-form.js';

start(calculate, dict, needs_live_solver, warm_up_inputs);

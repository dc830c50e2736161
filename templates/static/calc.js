// Conductor Atlas: every calculator (calculator pages, compare). The glue is calc-form.js.
import {calculate} from '../js/conductor_atlas.core.calculators.js';
import {dict} from '../js/org.transcrypt.__runtime__.js';
import {start} from './calc-form.js';

start(calculate, dict);

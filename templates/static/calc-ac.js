// Conductor Atlas: the AC part of the calculators (core.ac_part): the resistance calculator's frequency
// results, core.ac_layout and the solvers under it. Material pages load its classic twin
// (calc-ac.classic.js, linked to calc-resistance.classic.js: bundle.py) when a frequency is first typed;
// importing these modules registers their functions with core.ac_part. Pages with every calculator
// import it in their one script (calc.js, calc-compare.js).
import * as resistanceAc from '../js/conductor_atlas.core.calc_resistance_ac.js';

export const AC_PART = resistanceAc;

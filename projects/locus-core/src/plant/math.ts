import { create, expmDependencies, matrixDependencies, parseDependencies } from 'mathjs';

// A mathjs instance holding only what the engine uses (expression parsing and the matrix exponential of the
// zero-order hold), built with mathjs' own factory system: bundles that import the core (the element script)
// then leave the rest of mathjs out (about 100 KB gzip). Add a function's *Dependencies here before using it.
const math = create({ parseDependencies, expmDependencies, matrixDependencies });

/** mathjs `parse`: text → expression tree. */
export const parse = math.parse;
/** mathjs `expm`: matrix exponential (Padé with scaling and squaring). */
export const expm = math.expm;
/** mathjs `matrix`: a dense matrix from nested arrays. */
export const matrix = math.matrix;

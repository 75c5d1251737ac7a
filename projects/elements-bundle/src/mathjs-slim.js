// The element bundle's mathjs: only the functions @polewright/locus-core uses (expression parsing and the
// matrix exponential of the zero-order hold), built with mathjs' own factory system so that the rest of
// the library stays out of the script (about 100 KB gzip less). tsconfig.app.json maps "mathjs" here; the
// relative path below reaches the real package past that mapping. A core change that needs another mathjs
// function fails this build loudly (missing export) — add its *Dependencies here.
import { create, expmDependencies, matrixDependencies, parseDependencies } from '../../../node_modules/mathjs/lib/esm/index.js';

const math = create({ parseDependencies, expmDependencies, matrixDependencies });

export const parse = math.parse;
export const expm = math.expm;
export const matrix = math.matrix;

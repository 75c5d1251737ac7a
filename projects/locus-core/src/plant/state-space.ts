/** A single-input single-output state-space model ẋ = Ax + Bu, y = Cx + Du (matrices as arrays of rows). */
export interface StateSpace {
  readonly a: number[][];
  readonly b: number[];
  readonly c: number[];
  readonly d: number;
}


/** Figures read off a unit-step response. */
export interface StepFigures {
  readonly overshootPct: number | null;
  readonly riseTime: number | null;
  readonly settlingTime: number | null;
  /** Whether the response had entered the 2 % band for good before the end of the record. */
  readonly isSettled: boolean;
  readonly peak: { readonly time: number; readonly value: number };
}

/**
 * Percent overshoot, 10–90 % rise time and 2 % settling time of a step response with known final
 * value (the usual definitions, e.g. K. Ogata, "Modern Control Engineering", 5th ed., §5-3 — recalled
 * from memory). Crossing times are interpolated linearly between samples when `interpolate` is set
 * (continuous responses) and taken at the samples otherwise (sampled-data responses).
 */
export function stepFigures(time: readonly number[], output: readonly number[], finalValue: number | null, interpolate: boolean): StepFigures {
  const sign = finalValue !== null && finalValue < 0 ? -1 : 1;
  let peakIndex = 0;
  for (let k = 1; k < output.length; k++) if (sign * output[k] > sign * output[peakIndex]) peakIndex = k;
  const peak = { time: time[peakIndex], value: output[peakIndex] };
  const largest = Math.max(...output.map(Math.abs), 0);
  if (finalValue === null || Math.abs(finalValue) <= 1e-12 * Math.max(largest, 1e-300)) {
    return { overshootPct: null, riseTime: null, settlingTime: null, isSettled: finalValue !== null, peak };
  }
  const magnitude = Math.abs(finalValue);
  const overshootPct = Math.max(0, ((sign * peak.value - magnitude) / magnitude) * 100);
  const firstReach = (level: number): number | null => {
    for (let k = 0; k < output.length; k++) {
      if (sign * output[k] >= level * magnitude) {
        if (!interpolate || k === 0) return time[k];
        const a = sign * output[k - 1];
        const b = sign * output[k];
        return time[k - 1] + ((level * magnitude - a) / (b - a)) * (time[k] - time[k - 1]);
      }
    }
    return null;
  };
  const t10 = firstReach(0.1);
  const t90 = firstReach(0.9);
  const riseTime = t10 !== null && t90 !== null ? t90 - t10 : null;
  const band = 0.02 * magnitude;
  let last = -1;
  for (let k = output.length - 1; k >= 0; k--) {
    if (Math.abs(output[k] - finalValue) > band) {
      last = k;
      break;
    }
  }
  let settlingTime: number;
  const isSettled = last < output.length - 1;
  if (last < 0) settlingTime = time[0];
  else if (!isSettled) settlingTime = time[last];
  else if (!interpolate) settlingTime = time[last + 1];
  else {
    const a = Math.abs(output[last] - finalValue);
    const b = Math.abs(output[last + 1] - finalValue);
    settlingTime = time[last] + ((a - band) / (a - b)) * (time[last + 1] - time[last]);
  }
  return { overshootPct, riseTime, settlingTime: isSettled ? settlingTime : null, isSettled, peak };
}

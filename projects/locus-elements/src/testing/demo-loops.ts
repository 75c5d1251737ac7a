import type { Plant } from '@polewright/locus-core';

/**
 * Test models for the component specs: plants of the invented demo company's loops, copied from
 * demo/scenario.json (Quillfield Conveyor Works; every number there is made up for the demo).
 */
export const DEMO_PLANTS = {
  /** Line 3 belt speed: PI zero, drive lag, torsional mode (s, degree 4). */
  beltSpeed: { expression: '9.5*(s+1.5)/(s*(s+0.9)*(s^2+3.2*s+52))' },
  /** Hoist 2 hook position: triple pole at the origin, double lead zero; conditionally stable (s, degree 5). */
  hoistPosition: { expression: '(s+0.6)^2/(s^3*(s+4.5)*(s+11))' },
  /** Slitter web tension: complex zero pair below a lightly damped pole pair (s, degree 5). */
  webTension: { expression: '3.1*(s^2+1.1*s+6.2)/(s*(s+1.8)*(s^2+0.7*s+12.5)*(s+14))' },
  /** Tug charger current loop sampled at 20 kHz (z, degree 3). */
  chargerCurrent: { expression: '0.0041*(z+0.83)/((z-1)*(z^2-1.62*z+0.69))', domain: 'z', sampleTime: 5e-5 },
} as const satisfies Record<string, Plant>;

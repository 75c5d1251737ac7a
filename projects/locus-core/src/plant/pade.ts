/**
 * Padé approximant of the dead time e^{−sT} of order q (numerator and denominator both of degree q),
 * highest power first: coefficients c_k = (2q−k)!·q! / ((2q)!·k!·(q−k)!) of (sT)^k, with alternating
 * signs in the numerator (G. A. Baker, P. Graves-Morris, "Padé Approximants", 2nd ed., 1996, §1.2).
 * Example: pade(1, 1) = { numerator: [−0.5, 1], denominator: [0.5, 1] }, i.e. (1 − s/2)/(1 + s/2).
 */
export function pade(deadTime: number, order: number): { numerator: number[]; denominator: number[] } {
  const c: number[] = [1];
  for (let k = 1; k <= order; k++) {
    // c_k / c_{k−1} = (q − k + 1) / (k·(2q − k + 1))
    c.push((c[k - 1] * (order - k + 1)) / (k * (2 * order - k + 1)));
  }
  const numerator: number[] = [];
  const denominator: number[] = [];
  for (let k = order; k >= 0; k--) {
    const coefficient = c[k] * deadTime ** k;
    denominator.push(coefficient);
    numerator.push(k % 2 === 0 ? coefficient : -coefficient);
  }
  return { numerator, denominator };
}

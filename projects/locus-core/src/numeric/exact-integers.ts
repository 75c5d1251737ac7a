/**
 * The given doubles as exact integers after one common power-of-two scaling: every finite double is
 * m·2^e with an integer m, so multiplying all of them by 2^(−min e) makes each an integer without any
 * rounding. Signs and ratios are preserved exactly.
 * Example: exactIntegers([0.5, 3]) = [1n, 6n].
 */
export function exactIntegers(values: readonly number[]): bigint[] {
  const parts = values.map(decompose);
  let shift = Infinity;
  for (const p of parts) if (p.mantissa !== 0n) shift = Math.min(shift, p.exponent);
  if (shift === Infinity) return values.map(() => 0n);
  return parts.map((p) => (p.mantissa === 0n ? 0n : p.mantissa << BigInt(p.exponent - shift)));
}

/** A finite double as mantissa·2^exponent with an integer (signed) mantissa. */
function decompose(value: number): { mantissa: bigint; exponent: number } {
  if (value === 0) return { mantissa: 0n, exponent: 0 };
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, value);
  const high = view.getUint32(0);
  const low = view.getUint32(4);
  const biased = (high >>> 20) & 0x7ff;
  let mantissa = (BigInt(high & 0xfffff) << 32n) | BigInt(low);
  let exponent: number;
  if (biased === 0) exponent = -1074; // subnormal
  else {
    mantissa |= 1n << 52n;
    exponent = biased - 1075;
  }
  while (mantissa !== 0n && (mantissa & 1n) === 0n) {
    mantissa >>= 1n;
    exponent++;
  }
  return { mantissa: value < 0 ? -mantissa : mantissa, exponent };
}

import type { MathNode } from 'mathjs';
import { parse } from './math';
import { ValidationError } from '../errors';
import { add, multiply, power, scale, type Polynomial } from '../polynomial/polynomial';
import { MAX_DEGREE } from './limits';

/** Longest expression accepted, in characters. */
export const MAX_EXPRESSION_LENGTH = 4000;

/** A rational function as numerator and denominator coefficients, highest power first. */
interface Rational {
  readonly num: number[];
  readonly den: number[];
}

/**
 * Parses a rational expression in one variable (`s` or `z`) into numerator and denominator
 * coefficients, highest power first. mathjs parses the text; the tree is then multiplied out with the
 * engine's own polynomial arithmetic (mathjs' symbolic `rationalize` takes exponential time on powers
 * such as (s+1)^8, so it is not used). Sums over one identical denominator are added without growing it.
 * Example: parseExpression("4*(s+2)/(s*(s+1))", "s", "/plant/expression") gives numerator [4, 8] and
 * denominator [1, 1, 0].
 */
export function parseExpression(text: string, variable: 's' | 'z', pointer: string): { numerator: number[]; denominator: number[] } {
  if (text.trim() === '') throw ValidationError.at(pointer, `is empty; give a rational expression such as "2*(${variable}+1)/(${variable}*(${variable}+4))"`);
  if (text.length > MAX_EXPRESSION_LENGTH) throw ValidationError.at(pointer, `is longer than ${MAX_EXPRESSION_LENGTH} characters`);
  let node: MathNode;
  try {
    node = parse(text);
  } catch (error) {
    throw ValidationError.at(pointer, `cannot be parsed: ${(error as Error).message}`);
  }
  const result = rationalOf(node, variable, pointer);
  return { numerator: result.num, denominator: result.den };
}

function rationalOf(node: MathNode, variable: string, pointer: string): Rational {
  const n = node as MathNode & { type: string; value?: unknown; name?: string; op?: string; fn?: unknown; args?: MathNode[]; content?: MathNode };
  switch (n.type) {
    case 'ConstantNode': {
      const value = Number(n.value);
      if (!Number.isFinite(value)) throw ValidationError.at(pointer, `contains "${String(n.value)}", which is not a finite number`);
      return { num: [value], den: [1] };
    }
    case 'SymbolNode':
      if (n.name === variable) return { num: [1, 0], den: [1] };
      if (n.name === 'pi') return { num: [Math.PI], den: [1] };
      throw ValidationError.at(pointer, `uses "${n.name}", but the only variable of this plant is "${variable}" (numbers, ${variable}, + − * /, whole powers and parentheses are allowed)`);
    case 'ParenthesisNode':
      return rationalOf(n.content as MathNode, variable, pointer);
    case 'OperatorNode':
      return operator(n.fn as string, n.args as MathNode[], variable, pointer, n.op as string);
    case 'FunctionNode':
      throw ValidationError.at(pointer, `calls "${(n.fn as { name?: string })?.name ?? 'a function'}", but a plant must be a rational function of ${variable}; give dead time in the deadTime field`);
    default:
      throw ValidationError.at(pointer, `contains "${node.toString()}", which is not part of a rational function of ${variable}`);
  }
}

function operator(fn: string, args: MathNode[], variable: string, pointer: string, op: string): Rational {
  const parts = args.map((a) => rationalOf(a, variable, pointer));
  let out: Rational;
  switch (fn) {
    case 'unaryMinus':
      out = { num: scale(parts[0].num, -1), den: parts[0].den };
      break;
    case 'unaryPlus':
      out = parts[0];
      break;
    case 'add':
    case 'subtract': {
      const [a, b] = parts;
      const sign = fn === 'add' ? 1 : -1;
      out = sameCoefficients(a.den, b.den)
        ? { num: add(a.num, scale(b.num, sign)), den: a.den }
        : { num: add(multiply(a.num, b.den), scale(multiply(b.num, a.den), sign)), den: multiply(a.den, b.den) };
      break;
    }
    case 'multiply':
      out = { num: multiply(parts[0].num, parts[1].num), den: multiply(parts[0].den, parts[1].den) };
      break;
    case 'divide':
      if (parts[1].num.every((c) => c === 0)) throw ValidationError.at(pointer, 'divides by zero');
      out = { num: multiply(parts[0].num, parts[1].den), den: multiply(parts[0].den, parts[1].num) };
      break;
    case 'pow': {
      const exponent = parts[1];
      if (exponent.num.length !== 1 || exponent.den.length !== 1) throw ValidationError.at(pointer, `has a power whose exponent depends on ${variable}`);
      const k = exponent.num[0] / exponent.den[0];
      if (!Number.isInteger(k) || Math.abs(k) > MAX_DEGREE) throw ValidationError.at(pointer, `has the power ^${k}; only whole powers from −${MAX_DEGREE} to ${MAX_DEGREE} are allowed`);
      const base = parts[0];
      out = k >= 0 ? { num: power(base.num, k), den: power(base.den, k) } : { num: power(base.den, -k), den: power(base.num, -k) };
      break;
    }
    default:
      throw ValidationError.at(pointer, `uses the operator "${op}", which a rational function of ${variable} does not allow`);
  }
  if (out.num.length - 1 > 2 * MAX_DEGREE || out.den.length - 1 > 2 * MAX_DEGREE) {
    throw ValidationError.at(pointer, `multiplies out beyond degree ${MAX_DEGREE}`);
  }
  return { num: trimLeading(out.num), den: trimLeading(out.den) };
}

function trimLeading(p: Polynomial): number[] {
  let i = 0;
  while (i < p.length - 1 && p[i] === 0) i++;
  return p.slice(i);
}

function sameCoefficients(p: Polynomial, q: Polynomial): boolean {
  return p.length === q.length && p.every((c, i) => c === q[i]);
}

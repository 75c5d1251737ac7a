import { ValidationError } from '@polewright/locus-core';

/**
 * One plain sentence for an error met while reading or computing a loop, for display in an element.
 * A core `ValidationError` names each field at fault by its path (`plant › expression …`).
 * Example: describeError(ValidationError.at('/plant/expression', 'must be a string'))
 * = 'Model not accepted: plant › expression must be a string.'
 */
export function describeError(error: unknown): string {
  if (error instanceof ValidationError) {
    const parts = error.issues.map((issue) => {
      const path = fieldPath(issue.pointer);
      return path ? `${path} ${issue.detail}` : issue.detail;
    });
    const what = error.issues.every((issue) => issue.pointer.startsWith('/targets')) ? 'Targets' : 'Model';
    return `${what} not accepted: ${sentence(parts.join('; '))}`;
  }
  if (error instanceof Error) return sentence(error.message || error.name);
  return sentence(String(error));
}

/** The JSON Pointer `/plant/denominator/0` as the readable path `plant › denominator › 0`. */
export function fieldPath(pointer: string): string {
  return pointer
    .split('/')
    .filter((part) => part !== '')
    .map((part) => part.replace(/~1/g, '/').replace(/~0/g, '~'))
    .join(' › ');
}

function sentence(text: string): string {
  const trimmed = text.trim();
  return /[.!?]$/.test(trimmed) ? trimmed : `${trimmed}.`;
}

/**
 * The OpenAPI validator's (ajv's) messages in plain words, for the `detail` of each field at fault that
 * people read under their form fields: "must NOT have fewer than 1 characters" → "must not be empty".
 * A message it does not know is kept as it is.
 */
export function plainValidatorMessage(message: string): string {
  const text = message.trim();
  let m = /^must NOT have fewer than (\d+) (characters|items|properties)$/.exec(text);
  if (m) return m[1] === '1' ? (m[2] === 'characters' ? 'must not be empty' : `must have at least one ${m[2] === 'items' ? 'item' : 'property'}`) : `must have at least ${m[1]} ${m[2]}`;
  m = /^must NOT have more than (\d+) (characters|items|properties)$/.exec(text);
  if (m) return `must have at most ${m[1]} ${m[2]}`;
  m = /^must be (>=|<=|>|<) (-?[\d.e+-]+)$/.exec(text);
  if (m) return `must be ${{ '>=': 'at least', '<=': 'at most', '>': 'greater than', '<': 'less than' }[m[1] as '>=' | '<=' | '>' | '<']} ${m[2]}`;
  m = /^must have required property '([^']+)'$/.exec(text);
  if (m) return `needs "${m[1]}"`;
  m = /^must match format "([^"]+)"$/.exec(text);
  if (m) return FORMATS[m[1] as string] ?? `must be a valid ${m[1]}`;
  m = /^must be equal to one of the allowed values: (.+)$/.exec(text);
  if (m) return `must be one of ${m[1]}`;
  if (text === 'must NOT have additional properties') return 'holds a field this request does not take';
  if (text === 'must NOT have duplicate items') return 'must not repeat an item';
  return text;
}

const FORMATS: Record<string, string> = {
  email: 'must be an e-mail address',
  'date-time': 'must be a date and time (ISO 8601, e.g. 2026-12-31T23:59:00Z)',
  uuid: 'must be an id (UUID)',
};

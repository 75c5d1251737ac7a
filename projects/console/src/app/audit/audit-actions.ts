/** A family of audit actions: the prefix the API filters by and what it covers. */
export interface ActionFamily {
  readonly prefix: string;
  readonly label: string;
}

/** The families of actions the server records (server/src/**: recordAudit calls). */
export const ACTION_FAMILIES: readonly ActionFamily[] = [
  { prefix: 'api-key.', label: 'API keys' },
  { prefix: 'embed-token.', label: 'Embed tokens' },
  { prefix: 'model.', label: 'Models' },
  { prefix: 'session.', label: 'Sign-ins and sign-outs' },
  { prefix: 'user.', label: 'People' },
];

/** Every action the server records today, by family (offered as exact filters). */
export const KNOWN_ACTIONS: readonly string[] = [
  'api-key.created',
  'api-key.expiry-notice',
  'api-key.revoked',
  'api-key.used',
  'embed-token.created',
  'model.created',
  'model.deleted',
  'model.imported',
  'model.restored',
  'model.updated',
  'session.created',
  'session.failed',
  'session.revoked',
  'user.activated',
  'user.deactivated',
  'user.invited',
  'user.reactivated',
  'user.seeded',
  'user.update-self',
  'user.update-self.refused',
  'user.updated',
];

/** The suggestions for what was typed: families and exact actions containing the text. */
export function actionSuggestions(typed: string): { families: ActionFamily[]; actions: string[] } {
  const text = typed.trim().toLowerCase();
  const has = (value: string) => !text || value.toLowerCase().includes(text);
  return { families: ACTION_FAMILIES.filter((f) => has(f.prefix) || has(f.label)), actions: KNOWN_ACTIONS.filter(has) };
}

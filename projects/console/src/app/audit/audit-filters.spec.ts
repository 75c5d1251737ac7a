import { detailSummary } from './audit-detail';
import { actionSuggestions } from './audit-actions';
import { auditQuery, parseDay, urlParams } from './audit-filters';

describe('auditQuery (URL state → API query)', () => {
  it('turns days into local midnights, the last day included (the API’s `to` is exclusive)', () => {
    expect(auditQuery({ action: 'api-key.', actor: 'u-ada', from: '2026-12-01', to: '2026-12-02', page: 2, size: 25 })).toEqual({
      action: 'api-key.',
      actorId: 'u-ada',
      from: new Date(2026, 11, 1).toISOString(),
      to: new Date(2026, 11, 3).toISOString(),
      page: 2,
      pageSize: 25,
    });
  });

  it('leaves out what the URL has wrong instead of sending it', () => {
    expect(auditQuery({ from: '2026-02-30', to: 'yesterday', size: 5000, page: 0 })).toEqual({ action: undefined, actorId: undefined, from: undefined, to: undefined, page: 1, pageSize: 50 });
    expect(parseDay('2026-13-01')).toBeNull();
  });
});

describe('urlParams', () => {
  it('drops empty filters, the first page and the default page size, so a plain view has a plain URL', () => {
    expect(urlParams({ action: ' ', page: 1, size: 50 })).toEqual({ action: null, actor: null, from: null, to: null, page: null, size: null });
    expect(urlParams({ action: 'model.', page: 3, size: 25 })).toMatchObject({ action: 'model.', page: 3, size: 25 });
  });
});

describe('detailSummary', () => {
  it('lists key: value pairs, arrays as lists, null as a dash, long values cut', () => {
    expect(detailSummary({ name: 'Belt line nightly', scopes: ['models:read', 'compute'], expiresAt: null })).toBe('name: Belt line nightly · scopes: models:read, compute · expiresAt: —');
    expect(detailSummary({ comment: 'x'.repeat(60) })).toBe(`comment: ${'x'.repeat(47)}…`);
    expect(detailSummary(null)).toBe('');
  });
});

describe('actionSuggestions', () => {
  it('offers the families and the exact actions that contain the typed text', () => {
    const all = actionSuggestions('');
    expect(all.families.map((f) => f.prefix)).toEqual(['api-key.', 'embed-token.', 'model.', 'session.', 'user.']);
    const keys = actionSuggestions('key');
    expect(keys.families.map((f) => f.prefix)).toEqual(['api-key.']);
    expect(keys.actions).toEqual(['api-key.created', 'api-key.expiry-notice', 'api-key.revoked', 'api-key.used']);
  });
});

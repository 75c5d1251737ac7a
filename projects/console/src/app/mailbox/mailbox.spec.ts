import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { type NoticesSpy, problemBody, settle, setUpAdminScreen, tearDownAdminScreen } from '../testing/admin-fixtures';
import { Mailbox } from './mailbox';
import type { MailMessage } from './mailbox-api';
import { mailSegments } from './mail-text';

const INVITATION: MailMessage = {
  id: 'm-2',
  receivedAt: '2026-12-02T10:05:00.000Z',
  from: 'polewright@localhost',
  to: ['ines.intake@quillfield.example'],
  subject: 'You are invited to Polewright',
  text: [
    'Hello ines.intake,',
    '',
    'Open this link to choose your name and password:',
    '',
    'http://localhost:4300/invitations/pwi_Ab-c_9',
    '',
    'From a script: POST http://localhost:4300/api/v1/invitations/pwi_Ab-c_9/accept with {"name": "..."}',
  ].join('\n'),
};
const NOTICE: MailMessage = { id: 'm-1', receivedAt: '2026-12-01T07:00:00.000Z', from: 'polewright@localhost', to: ['ada.admin@quillfield.example'], subject: 'An API key expires soon', text: 'The key "Belt line nightly" expires on 2026-12-08. See https://docs.quillfield.example/keys.' };

describe('mailSegments', () => {
  it('makes an invitation link point at this console’s invitation page, whatever host the e-mail names', () => {
    const links = mailSegments(INVITATION.text).filter((s) => s.kind === 'link');
    expect(links).toEqual([{ kind: 'link', text: 'http://localhost:4300/invitations/pwi_Ab-c_9', href: '/invitations/pwi_Ab-c_9', invitation: true }]);
  });

  it('leaves API addresses as text, keeps other links, and does not swallow a full stop after a link', () => {
    const segments = mailSegments(NOTICE.text);
    expect(segments).toEqual([
      { kind: 'text', text: 'The key "Belt line nightly" expires on 2026-12-08. See ' },
      { kind: 'link', text: 'https://docs.quillfield.example/keys', href: 'https://docs.quillfield.example/keys', invitation: false },
      { kind: 'text', text: '.' },
    ]);
    expect(segments.map((s) => s.text).join('')).toBe(NOTICE.text);
    expect(mailSegments(INVITATION.text).map((s) => s.text).join('')).toBe(INVITATION.text);
  });
});

describe('Mailbox', { timeout: 30_000 }, () => {
  let http: HttpTestingController;
  let notices: NoticesSpy;
  let fixture: ComponentFixture<Mailbox>;

  beforeEach(() => {
    ({ http, notices } = setUpAdminScreen());
    fixture = TestBed.createComponent(Mailbox);
  });

  afterEach(() => tearDownAdminScreen(http));

  const el = () => fixture.nativeElement as HTMLElement;

  it('lists the messages newest first and shows the newest, its invitation link opening the console’s page', async () => {
    await settle(fixture);
    http.expectOne('/api/v1/dev/mailbox').flush({ items: [INVITATION, NOTICE] });
    await settle(fixture);
    const items = [...el().querySelectorAll('.list a[mat-list-item]')].map((a) => a.textContent ?? '');
    expect(items[0]).toContain('You are invited to Polewright');
    expect(items[0]).toContain('ines.intake@quillfield.example');
    expect(items[1]).toContain('An API key expires soon');
    expect(el().querySelector('#message-subject')?.textContent).toBe('You are invited to Polewright');
    const link = el().querySelector<HTMLAnchorElement>('[data-testid="mail-text"] a');
    expect(link?.getAttribute('href')).toBe('/invitations/pwi_Ab-c_9');
    expect(link?.textContent).toBe('http://localhost:4300/invitations/pwi_Ab-c_9');
    expect(el().querySelectorAll('[data-testid="mail-text"] a')).toHaveLength(1);
    expect(el().querySelector('[data-testid="mail-text"]')?.textContent).toContain('POST http://localhost:4300/api/v1/invitations/pwi_Ab-c_9/accept');

    (el().querySelectorAll<HTMLElement>('.list a[mat-list-item]')[1] as HTMLElement).click();
    await settle(fixture);
    expect(el().querySelector('#message-subject')?.textContent).toBe('An API key expires soon');
    expect(el().querySelector('[data-testid="mail-text"] a')?.getAttribute('href')).toBe('https://docs.quillfield.example/keys');
    expect(el().textContent).toContain('exists only on development servers without an SMTP server');
  });

  it('explains a server without a mailbox (404) instead of reporting an error', async () => {
    await settle(fixture);
    http.expectOne('/api/v1/dev/mailbox').flush(...problemBody(404, 'Not found', 'The development mailbox (production, or mail goes to SMTP_URL) was not found'));
    await settle(fixture);
    expect(notices.problem).not.toHaveBeenCalled();
    expect(el().querySelector('.absent')?.textContent).toContain('This server has no development mailbox');
    expect(el().querySelector('.dev-note')).not.toBeNull();
    expect(el().querySelector('.panes')).toBeNull();
  });

  it('says so when nothing was sent yet', async () => {
    await settle(fixture);
    http.expectOne('/api/v1/dev/mailbox').flush({ items: [] });
    await settle(fixture);
    expect(el().querySelector('.pwc-empty')?.textContent).toContain('No e-mail yet.');
  });
});

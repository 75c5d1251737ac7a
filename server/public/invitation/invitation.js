// The invitation page: reads the token from its own address, sends name and password to
// POST /api/v1/invitations/{token}/accept and shows the answer. Field problems of the API's problem+json
// (`errors[].pointer`) go to their field; anything else goes to the notice at the top.

/** The body fields of InvitationAccept (openapi/schemas/people.yaml) and the inputs that hold them. */
const FIELD_OF_POINTER = { '/name': 'name', '/password': 'password' };

/** What the page says about a link that cannot be used any more (the server puts the state in data-invitation). */
const CLOSED = {
  used: ['This invitation has been used already.', 'The account is set up: sign in with its e-mail and the password chosen then (POST /api/v1/sessions).'],
  expired: ['This invitation has expired.', 'Ask an admin of your Polewright server for a new invitation.'],
  unknown: ['This invitation link is not known.', 'Check that the whole link was copied from the e-mail, or ask an admin for a new invitation.'],
};

const main = document.querySelector('main');
const form = document.getElementById('accept-form');
const notice = document.getElementById('notice');
const submit = document.getElementById('submit');
const token = decodeURIComponent(location.pathname.split('/').filter(Boolean).pop() ?? '');
// relative to the page, so the server may live below a path prefix
const endpoint = new URL(`../api/v1/invitations/${encodeURIComponent(token)}/accept`, location.href);

function showNotice(title, detail) {
  document.getElementById('notice-title').textContent = title;
  document.getElementById('notice-detail').textContent = detail ?? '';
  notice.hidden = false;
}

function hideNotice() {
  notice.hidden = true;
}

function setFieldError(field, message) {
  const input = document.getElementById(field);
  document.getElementById(`${field}-error`).textContent = message;
  if (message) input.setAttribute('aria-invalid', 'true');
  else input.removeAttribute('aria-invalid');
}

function clearFieldErrors() {
  for (const field of ['name', 'password', 'confirmation']) setFieldError(field, '');
}

function focusFirstInvalid() {
  form.querySelector('[aria-invalid="true"]')?.focus();
}

/** A link that cannot be used: say why and take the form away. */
function closeForm(title, detail) {
  form.hidden = true;
  document.getElementById('lead').hidden = true;
  showNotice(title, detail);
  notice.focus();
}

/** Checks only what the API cannot: that both passwords agree, and that a name was typed. */
function localProblems(values) {
  const problems = {};
  if (!values.name.trim()) problems.name = 'Enter your name.';
  if (values.password !== values.confirmation) problems.confirmation = 'The two passwords do not match.';
  return problems;
}

function sentence(text) {
  const trimmed = String(text ?? '').trim();
  // the validator writes "must NOT have fewer than 10 characters"
  const plain = trimmed.replace(/\bNOT\b/g, 'not');
  return plain ? `${plain[0].toUpperCase()}${plain.slice(1)}${/[.!?]$/.test(plain) ? '' : '.'}` : plain;
}

/** Puts a problem+json answer on the page: field errors at their fields, the rest at the top. */
function showProblem(status, problem) {
  const others = [];
  for (const issue of Array.isArray(problem?.errors) ? problem.errors : []) {
    const field = FIELD_OF_POINTER[issue.pointer];
    if (field) setFieldError(field, sentence(issue.detail));
    else others.push(`${issue.pointer || 'body'}: ${issue.detail}`);
  }
  const title = problem?.title ?? `The server answered ${status}`;
  const detail = others.length > 0 ? others.join('; ') : problem?.errors?.length ? 'Please correct the fields marked below.' : problem?.detail;
  // an unknown, used or expired invitation: the form cannot succeed any more
  if (status === 404 || status === 409) closeForm(title, detail);
  else showNotice(title, detail);
  focusFirstInvalid();
}

function showReady(user) {
  form.hidden = true;
  hideNotice();
  document.getElementById('lead').hidden = true;
  document.getElementById('ready-email').textContent = user.email;
  document.getElementById('ready-request').textContent =
    `POST /api/v1/sessions\nContent-Type: application/json\n\n${JSON.stringify({ email: user.email, password: '…' }, null, 2)}`;
  const ready = document.getElementById('ready');
  ready.hidden = false;
  ready.focus();
}

async function acceptInvitation(event) {
  event.preventDefault();
  hideNotice();
  clearFieldErrors();
  const values = { name: form.elements.name.value, password: form.elements.password.value, confirmation: form.elements.confirmation.value };
  const problems = localProblems(values);
  if (Object.keys(problems).length > 0) {
    for (const [field, message] of Object.entries(problems)) setFieldError(field, message);
    showNotice('Some fields need a change.', 'Please correct the fields marked below.');
    focusFirstInvalid();
    return;
  }
  submit.disabled = true;
  form.setAttribute('aria-busy', 'true');
  try {
    const response = await fetch(endpoint, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Accept: 'application/json, application/problem+json' },
      body: JSON.stringify({ name: values.name.trim(), password: values.password }),
    });
    const body = await response.json().catch(() => null);
    if (response.ok && body?.user) showReady(body.user);
    else showProblem(response.status, body);
  } catch {
    showNotice('The server could not be reached.', 'Check your connection and try again.');
  } finally {
    submit.disabled = false;
    form.removeAttribute('aria-busy');
  }
}

const state = main.dataset.invitation;
if (state in CLOSED) closeForm(...CLOSED[state]);
else form.addEventListener('submit', acceptInvitation);

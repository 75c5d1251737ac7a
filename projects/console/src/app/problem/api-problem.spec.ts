import { HttpErrorResponse, HttpHeaders } from '@angular/common/http';
import { ApiProblem, problemSummary, toProblem } from './api-problem';

describe('toProblem', () => {
  it('keeps the title, detail, field errors and request id of a problem+json body', () => {
    const error = new HttpErrorResponse({
      status: 400,
      headers: new HttpHeaders({ 'Content-Type': 'application/problem+json' }),
      error: { type: 'urn:polewright:problem:invalid-request', title: 'Invalid request', status: 400, detail: 'The plant is not proper.', instance: '/api/v1/models', requestId: 'r-1', errors: [{ pointer: '/plant/expression', detail: 'more zeros than poles' }] },
    });
    const problem = toProblem(error);
    expect(problem).toBeInstanceOf(ApiProblem);
    expect(problem.status).toBe(400);
    expect(problem.title).toBe('Invalid request');
    expect(problem.detail).toBe('The plant is not proper.');
    expect(problem.errors).toEqual([{ pointer: '/plant/expression', detail: 'more zeros than poles' }]);
    expect(problem.requestId).toBe('r-1');
    expect(problem.hasFieldErrors).toBe(true);
  });

  it('reads a problem body that arrived as text (blob and text responses)', () => {
    const body = JSON.stringify({ title: 'Precondition failed', status: 412, detail: 'Revision 3 is current.' });
    const problem = toProblem(new HttpErrorResponse({ status: 412, error: body }));
    expect(problem.title).toBe('Precondition failed');
    expect(problem.detail).toBe('Revision 3 is current.');
    expect(problem.errors).toEqual([]);
  });

  it('says the server could not be reached when the request never got an answer', () => {
    const problem = toProblem(new HttpErrorResponse({ status: 0, statusText: 'Unknown Error', error: new ProgressEvent('error') }));
    expect(problem.status).toBe(0);
    expect(problem.title).toBe('Server not reachable');
    expect(problem.detail).toContain('Polewright server');
  });

  it('gives a 5xx without a problem body a generic title and the status text', () => {
    const problem = toProblem(new HttpErrorResponse({ status: 502, statusText: 'Bad Gateway', error: '<html>proxy</html>' }));
    expect(problem.title).toBe('Server error');
    expect(problem.detail).toBe('Bad Gateway');
  });

  it('wraps anything else without losing its message', () => {
    expect(toProblem(new TypeError('boom')).detail).toBe('boom');
    const same = new ApiProblem(409, 'Conflict', 'x');
    expect(toProblem(same)).toBe(same);
  });
});

describe('problemSummary', () => {
  it('joins title and detail, and quotes the request id of a server error', () => {
    expect(problemSummary(new ApiProblem(404, 'Not found', 'No model m-1.'))).toBe('Not found: No model m-1.');
    expect(problemSummary(new ApiProblem(500, 'Internal error', 'Something failed.', [], 'req-9'))).toBe('Internal error: Something failed. (request req-9)');
    expect(problemSummary(new ApiProblem(403, 'Forbidden', ''))).toBe('Forbidden');
  });
});

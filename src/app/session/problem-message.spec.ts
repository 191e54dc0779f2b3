import { HttpErrorResponse } from '@angular/common/http';
import { problemFieldErrors, problemMessage } from './problem-message';

describe('problemMessage', () => {
  it('reads the detail of a problem+json answer (RFC 9457)', () => {
    const error = new HttpErrorResponse({ status: 422, error: { title: 'x', detail: 'The device has 1 problem: /ratedPepW is required.' } });
    expect(problemMessage(error)).toBe('The device has 1 problem: /ratedPepW is required.');
  });

  it('explains a network failure instead of showing status 0', () => {
    expect(problemMessage(new HttpErrorResponse({ status: 0 }))).toMatch(/cannot be reached/);
  });

  it('hides server internals behind a generic sentence for a 5xx without detail', () => {
    expect(problemMessage(new HttpErrorResponse({ status: 502, error: '<html>bad gateway</html>' }))).toMatch(/on our side/);
  });

  it('maps field errors by JSON pointer', () => {
    const error = new HttpErrorResponse({ status: 422, error: { detail: 'd', errors: [{ pointer: '/model', message: 'is required' }] } });
    expect(problemFieldErrors(error)).toEqual({ '/model': 'is required' });
    expect(problemFieldErrors(new Error('x'))).toEqual({});
  });
});

import { createPrecheckLimiter } from './precheck-limiter';
import { Problem } from '../http/problem';

describe('createPrecheckLimiter', () => {
  it('allows perHour starts in any sliding hour, per person, then answers 429 with the wait', () => {
    let now = 0;
    const limiter = createPrecheckLimiter(2, () => now);
    limiter.take('a');
    now = 10 * 60_000;
    limiter.take('a');
    limiter.take('b'); // someone else has their own allowance
    now = 20 * 60_000;
    let refused: Problem | undefined;
    try {
      limiter.take('a');
    } catch (error) {
      refused = error as Problem;
    }
    expect(refused?.status).toBe(429);
    // The first start leaves the window 60 minutes after it: 40 minutes from now.
    expect(refused?.headers?.['Retry-After']).toBe(String(40 * 60));
    now = 60 * 60_000;
    expect(() => limiter.take('a')).not.toThrow();
  });
});

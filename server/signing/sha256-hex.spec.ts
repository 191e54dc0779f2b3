import { sha256Hex } from './sha256-hex';

describe('sha256Hex', () => {
  // FIPS 180-2, Appendix B.1 and B.2 example messages.
  it.each([
    ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    [
      'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    ],
  ])('%s', (message, digest) => {
    expect(sha256Hex(Buffer.from(message, 'ascii'))).toBe(digest);
  });

  it('rejects non-binary input', () => {
    expect(() => sha256Hex('abc' as unknown as Buffer)).toThrow(/^sha256Hex: /);
  });
});

import { createPrivateKey, X509Certificate } from 'node:crypto';
import { importPkcs12 } from './import-pkcs12';
import { buildOpensslFixture, type OpensslFixture } from './openssl-fixtures';

const der = (pem: string) => createPrivateKey(pem).export({ type: 'pkcs8', format: 'der' });

describe('importPkcs12 (files made by the openssl CLI)', () => {
  jest.setTimeout(30000);
  let fx: OpensslFixture;
  beforeAll(() => {
    fx = buildOpensslFixture();
  });

  it.each(
    ['modernP12', 'legacyP12'] as const,
  )('reads the key and certificate of a %s file', (which) => {
    const identity = importPkcs12(fx[which], fx.passphrase);
    expect(der(identity.privateKeyPem).equals(der(fx.keyPem))).toBe(true);
    expect(new X509Certificate(identity.certificatePem).fingerprint256).toBe(
      new X509Certificate(fx.certPem).fingerprint256,
    );
    expect(identity.chainPems).toBeUndefined();
  });

  it('returns the issuing CA as chain and the leaf as certificate', () => {
    const identity = importPkcs12(fx.chainedP12, fx.passphrase);
    expect(new X509Certificate(identity.certificatePem).subject).toContain(
      'CN=Uploaded Test Lab Signer',
    );
    expect(identity.chainPems).toHaveLength(1);
    expect(new X509Certificate(identity.chainPems![0]).fingerprint256).toBe(
      new X509Certificate(fx.caCertPem).fingerprint256,
    );
  });

  it('refuses a wrong passphrase and a file that is not PKCS#12', () => {
    expect(() => importPkcs12(fx.modernP12, 'wrong')).toThrow(
      /^importPkcs12: cannot open the file/,
    );
    expect(() => importPkcs12(Buffer.from('not a pkcs12 file'), fx.passphrase)).toThrow(RangeError);
    expect(() => importPkcs12(Buffer.alloc(0), fx.passphrase)).toThrow(/the file is empty/);
  });

  it('refuses a certificate outside its validity and one not allowed to sign', () => {
    const later = new Date(Date.now() + 90 * 24 * 3600 * 1000);
    expect(() => importPkcs12(fx.modernP12, fx.passphrase, { now: later })).toThrow(
      /is valid only from/,
    );
    expect(() => importPkcs12(fx.caOnlyP12, fx.passphrase)).toThrow(
      /key usage does not allow signing/,
    );
  });
});

import { execFileSync } from 'node:child_process';
import { createPrivateKey, X509Certificate } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { generateLabSigningIdentity } from './generate-lab-signing-identity';

// Checked with tools independent of node-forge: Node's X509Certificate and the openssl CLI.
describe('generateLabSigningIdentity', () => {
  const now = new Date('2025-03-10T12:00:00Z');
  const identity = generateLabSigningIdentity({
    labName: 'Kestrelmoor Radio Test Laboratory',
    country: 'GB',
    validityYears: 3,
    now,
  });
  const cert = new X509Certificate(identity.certificatePem);

  it('issues a self-signed certificate in the lab name that verifies with its own key', () => {
    expect(cert.subject).toContain('CN=Kestrelmoor Radio Test Laboratory');
    expect(cert.subject).toContain('O=Kestrelmoor Radio Test Laboratory');
    expect(cert.subject).toContain('C=GB');
    expect(cert.issuer).toBe(cert.subject);
    expect(cert.verify(cert.publicKey)).toBe(true);
    expect(cert.checkPrivateKey(createPrivateKey(identity.privateKeyPem))).toBe(true);
    expect(cert.ca).toBe(false);
  });

  it('uses a 3072-bit RSA key by default and the requested validity', () => {
    const key = createPrivateKey(identity.privateKeyPem);
    expect(key.asymmetricKeyType).toBe('rsa');
    expect(key.asymmetricKeyDetails?.modulusLength).toBe(3072);
    expect(new Date(cert.validTo).getUTCFullYear()).toBe(2028);
    expect(new Date(cert.validFrom).getTime()).toBeLessThanOrEqual(now.getTime());
    // RFC 5280 4.1.2.2: serial positive, at most 20 octets.
    expect(cert.serialNumber.length).toBeLessThanOrEqual(40);
    expect(parseInt(cert.serialNumber.slice(0, 2), 16)).toBeLessThan(0x80);
  });

  it('limits key usage to digitalSignature and nonRepudiation, critical, with SHA-256 (openssl)', () => {
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-cert-')), 'cert.pem');
    fs.writeFileSync(file, identity.certificatePem);
    const text = execFileSync(
      'openssl',
      ['x509', '-in', file, '-noout', '-text'],
      { encoding: 'utf8' },
    );
    expect(text).toMatch(/X509v3 Key Usage: critical\s+Digital Signature, Non Repudiation\s*\n/);
    expect(text).toMatch(/Signature Algorithm: sha256WithRSAEncryption/);
    expect(text).toMatch(/X509v3 Basic Constraints: critical\s+CA:FALSE/);
  });

  it('can make a 2048-bit key', () => {
    const small = generateLabSigningIdentity({ labName: 'Lab', keyBits: 2048 });
    expect(createPrivateKey(small.privateKeyPem).asymmetricKeyDetails?.modulusLength).toBe(2048);
  });

  it.each([
    [{ labName: '' }, /labName/],
    [{ labName: 'x'.repeat(65) }, /labName/],
    [{ labName: 'Lab', country: 'gb' }, /country/],
    [{ labName: 'Lab', validityYears: 0 }, /validityYears/],
    [{ labName: 'Lab', keyBits: 1024 as 2048 }, /keyBits/],
  ])('rejects %p', (options, message) => {
    expect(() => generateLabSigningIdentity(options)).toThrow(RangeError);
    expect(() => generateLabSigningIdentity(options)).toThrow(message);
  });
});

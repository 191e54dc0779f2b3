/**
 * Test support (not used in production): key pairs, certificates and PKCS#12 files made with the
 * openssl CLI, an implementation independent of node-forge, in a fresh temporary folder.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export interface OpensslFixture {
  dir: string;
  keyPem: string;
  certPem: string;
  /** PKCS#12 with OpenSSL 3 defaults: AES-256-CBC, PBKDF2, SHA-256 MAC. */
  modernP12: Buffer;
  /** PKCS#12 with the legacy algorithms: 3DES key and certificate bags, SHA-1 MAC. */
  legacyP12: Buffer;
  /** Leaf issued by a separate CA, exported with the CA certificate as chain. */
  chainedP12: Buffer;
  caCertPem: string;
  /** A certificate whose key usage is keyCertSign only (not allowed to sign documents). */
  caOnlyP12: Buffer;
  passphrase: string;
}

/** Builds all fixtures (about 1 s: four RSA 2048 keys). */
export function buildOpensslFixture(): OpensslFixture {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-p12-'));
  const openssl = (...args: string[]) => execFileSync('openssl', args, { cwd: dir, stdio: 'pipe' });
  const passphrase = 's3cret-Passphrase';
  const pass = `pass:${passphrase}`;
  const newKey = ['-newkey', 'rsa:2048', '-nodes'];
  const usage = 'keyUsage=critical,digitalSignature,nonRepudiation';
  const subj = '/CN=Uploaded Test Lab/O=Uploaded Test Lab/C=GB';
  const selfSigned = (key: string, cert: string, days: string, subject: string, ...ext: string[]) =>
    openssl('req', '-x509', ...newKey, '-keyout', key, '-out', cert, '-days', days, '-subj', subject,
      ...ext);
  selfSigned('key.pem', 'cert.pem', '30', subj, '-addext', usage);
  const exportKey = (key: string, cert: string, out: string, ...extra: string[]) =>
    openssl('pkcs12', '-export', '-inkey', key, '-in', cert, '-out', out, '-passout', pass,
      ...extra);
  exportKey('key.pem', 'cert.pem', 'modern.p12');
  const legacy = ['-certpbe', 'PBE-SHA1-3DES', '-keypbe', 'PBE-SHA1-3DES', '-macalg', 'sha1'];
  exportKey('key.pem', 'cert.pem', 'legacy.p12', ...legacy);
  const caExt = [
    ...['-addext', 'keyUsage=critical,keyCertSign,cRLSign'],
    ...['-addext', 'basicConstraints=critical,CA:TRUE'],
  ];
  selfSigned('ca.key', 'ca.pem', '60', '/CN=Test Lab Root CA/O=Uploaded Test Lab', ...caExt);
  const leafSubj = '/CN=Uploaded Test Lab Signer/O=Uploaded Test Lab';
  openssl('req', '-new', ...newKey, '-keyout', 'leaf.key', '-out', 'leaf.csr', '-subj', leafSubj);
  fs.writeFileSync(path.join(dir, 'leaf.ext'), `${usage}\nbasicConstraints=critical,CA:FALSE\n`);
  const ca = ['-CA', 'ca.pem', '-CAkey', 'ca.key', '-CAcreateserial'];
  const leafOut = ['-out', 'leaf.pem', '-days', '30', '-extfile', 'leaf.ext'];
  openssl('x509', '-req', '-in', 'leaf.csr', ...ca, ...leafOut);
  exportKey('leaf.key', 'leaf.pem', 'chained.p12', '-certfile', 'ca.pem');
  exportKey('ca.key', 'ca.pem', 'ca-only.p12');
  const read = (name: string) => fs.readFileSync(path.join(dir, name));
  return {
    dir,
    keyPem: read('key.pem').toString('utf8'),
    certPem: read('cert.pem').toString('utf8'),
    modernP12: read('modern.p12'),
    legacyP12: read('legacy.p12'),
    chainedP12: read('chained.p12'),
    caCertPem: read('ca.pem').toString('utf8'),
    caOnlyP12: read('ca-only.p12'),
    passphrase,
  };
}

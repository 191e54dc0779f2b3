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

function openssl(dir: string, args: string[]): void {
  execFileSync('openssl', args, { cwd: dir, stdio: 'pipe' });
}

/** Builds all fixtures (about 1 s: four RSA 2048 keys). */
export function buildOpensslFixture(): OpensslFixture {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-p12-'));
  const passphrase = 's3cret-Passphrase';
  const subj = '/CN=Uploaded Test Lab/O=Uploaded Test Lab/C=GB';
  const usage = 'keyUsage=critical,digitalSignature,nonRepudiation';
  openssl(dir, ['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', 'key.pem', '-out', 'cert.pem', '-days', '30', '-subj', subj, '-addext', usage]);
  openssl(dir, ['pkcs12', '-export', '-inkey', 'key.pem', '-in', 'cert.pem', '-out', 'modern.p12', '-passout', `pass:${passphrase}`]);
  openssl(dir, ['pkcs12', '-export', '-inkey', 'key.pem', '-in', 'cert.pem', '-out', 'legacy.p12', '-passout', `pass:${passphrase}`, '-certpbe', 'PBE-SHA1-3DES', '-keypbe', 'PBE-SHA1-3DES', '-macalg', 'sha1']);
  openssl(dir, ['req', '-x509', '-newkey', 'rsa:2048', '-nodes', '-keyout', 'ca.key', '-out', 'ca.pem', '-days', '60', '-subj', '/CN=Test Lab Root CA/O=Uploaded Test Lab', '-addext', 'keyUsage=critical,keyCertSign,cRLSign', '-addext', 'basicConstraints=critical,CA:TRUE']);
  openssl(dir, ['req', '-new', '-newkey', 'rsa:2048', '-nodes', '-keyout', 'leaf.key', '-out', 'leaf.csr', '-subj', '/CN=Uploaded Test Lab Signer/O=Uploaded Test Lab']);
  fs.writeFileSync(path.join(dir, 'leaf.ext'), `${usage}\nbasicConstraints=critical,CA:FALSE\n`);
  openssl(dir, ['x509', '-req', '-in', 'leaf.csr', '-CA', 'ca.pem', '-CAkey', 'ca.key', '-CAcreateserial', '-out', 'leaf.pem', '-days', '30', '-extfile', 'leaf.ext']);
  openssl(dir, ['pkcs12', '-export', '-inkey', 'leaf.key', '-in', 'leaf.pem', '-certfile', 'ca.pem', '-out', 'chained.p12', '-passout', `pass:${passphrase}`]);
  openssl(dir, ['pkcs12', '-export', '-inkey', 'ca.key', '-in', 'ca.pem', '-out', 'ca-only.p12', '-passout', `pass:${passphrase}`]);
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

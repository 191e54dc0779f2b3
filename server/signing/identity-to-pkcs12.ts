/**
 * Packs an identity into a PKCS#12 file in memory, the input format of @signpdf/signer-p12. The
 * file never leaves the process, so its password is random per call and the key derivation runs
 * one iteration (the protection at rest is private-key-encryption.ts, not this container).
 */
import { randomBytes } from 'node:crypto';
import forge from 'node-forge';
import type { LabSigningIdentity } from './lab-signing-identity';

export interface InMemoryPkcs12 {
  p12Der: Buffer;
  passphrase: string;
}

/**
 * Builds the PKCS#12 (RSA key in a shrouded key bag, certificate, then the chain). A key that
 * does not match the certificate throws a RangeError; unreadable PEM makes node-forge throw.
 * @example identityToPkcs12(identity).p12Der.length // about 3 kB for a 3072-bit key
 */
export function identityToPkcs12(identity: LabSigningIdentity): InMemoryPkcs12 {
  const key = forge.pki.privateKeyFromPem(identity.privateKeyPem) as forge.pki.rsa.PrivateKey;
  const cert = forge.pki.certificateFromPem(identity.certificatePem);
  const pub = cert.publicKey as forge.pki.rsa.PublicKey;
  if (!pub.n || !pub.n.equals(key.n) || !pub.e.equals(key.e)) {
    throw new RangeError('identityToPkcs12: the private key does not match the certificate');
  }
  const chain = (identity.chainPems ?? []).map((pem) => forge.pki.certificateFromPem(pem));
  const passphrase = randomBytes(18).toString('base64url');
  const asn1 = forge.pkcs12.toPkcs12Asn1(key, [cert, ...chain], passphrase, {
    algorithm: 'aes256',
    count: 1,
    useMac: false,
  });
  return { p12Der: Buffer.from(forge.asn1.toDer(asn1).getBytes(), 'binary'), passphrase };
}

/**
 * Reads a PKCS#12 file (RFC 7292) that a lab uploads with its own certificate: the private key
 * (shrouded or plain key bag), the certificate whose public key matches it, and any other
 * certificates as the chain. Both legacy (3DES, SHA-1 MAC) and current (AES-256, PBKDF2,
 * SHA-256 MAC) files are accepted, as node-forge reads both.
 */
import forge from 'node-forge';
import type { LabSigningIdentity } from './lab-signing-identity';

function keyUsageAllowsSigning(cert: forge.pki.Certificate): boolean {
  const usage = cert.getExtension('keyUsage') as { digitalSignature?: boolean; nonRepudiation?: boolean } | null;
  return !usage || usage.digitalSignature === true || usage.nonRepudiation === true;
}

/**
 * Returns the identity as PEM. Throws a RangeError when the passphrase is wrong or the file is
 * damaged, when it holds no RSA key or no matching certificate, when that certificate is outside
 * its validity at `now` (default: the current time), or when its key usage forbids signing.
 * @example importPkcs12(fs.readFileSync('lab.p12'), 'secret').certificatePem // '-----BEGIN CERTIFICATE-----...'
 */
export function importPkcs12(p12Der: Buffer | Uint8Array, passphrase: string, options: { now?: Date } = {}): LabSigningIdentity {
  if (!(p12Der instanceof Uint8Array) || p12Der.length === 0) throw new RangeError('importPkcs12: the file is empty');
  let p12: forge.pkcs12.Pkcs12Pfx;
  try {
    const asn1 = forge.asn1.fromDer(forge.util.createBuffer(Buffer.from(p12Der).toString('binary')));
    p12 = forge.pkcs12.pkcs12FromAsn1(asn1, false, passphrase);
  } catch (error) {
    throw new RangeError(`importPkcs12: cannot open the file (wrong passphrase or not PKCS#12): ${(error as Error).message}`);
  }
  const keyBags = [
    ...(p12.getBags({ bagType: forge.pki.oids.pkcs8ShroudedKeyBag })[forge.pki.oids.pkcs8ShroudedKeyBag] ?? []),
    ...(p12.getBags({ bagType: forge.pki.oids.keyBag })[forge.pki.oids.keyBag] ?? []),
  ];
  const key = keyBags.map((b) => b.key).find((k): k is forge.pki.rsa.PrivateKey => k !== undefined && k !== null && 'n' in k);
  if (!key) throw new RangeError('importPkcs12: the file holds no RSA private key');
  const certs = (p12.getBags({ bagType: forge.pki.oids.certBag })[forge.pki.oids.certBag] ?? [])
    .map((b) => b.cert)
    .filter((c): c is forge.pki.Certificate => c !== undefined && c !== null);
  const matches = (c: forge.pki.Certificate) => {
    const pub = c.publicKey as forge.pki.rsa.PublicKey;
    return pub.n !== undefined && pub.n.equals(key.n) && pub.e.equals(key.e);
  };
  const cert = certs.find(matches);
  if (!cert) throw new RangeError('importPkcs12: no certificate in the file matches the private key');
  const now = options.now ?? new Date();
  if (now < cert.validity.notBefore || now > cert.validity.notAfter) {
    throw new RangeError(`importPkcs12: the certificate is valid only from ${cert.validity.notBefore.toISOString()} to ${cert.validity.notAfter.toISOString()}`);
  }
  if (!keyUsageAllowsSigning(cert)) throw new RangeError('importPkcs12: the certificate key usage does not allow signing');
  const chain = certs.filter((c) => c !== cert).map((c) => forge.pki.certificateToPem(c));
  return {
    certificatePem: forge.pki.certificateToPem(cert),
    privateKeyPem: forge.pki.privateKeyInfoToPem(forge.pki.wrapRsaPrivateKey(forge.pki.privateKeyToAsn1(key))),
    ...(chain.length > 0 ? { chainPems: chain } : {}),
  };
}

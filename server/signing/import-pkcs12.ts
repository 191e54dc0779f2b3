/**
 * Reads a PKCS#12 file (RFC 7292) that a lab uploads with its own certificate: the private key
 * (shrouded or plain key bag), the certificate whose public key matches it, and any other
 * certificates as the chain. Both legacy (3DES, SHA-1 MAC) and current (AES-256, PBKDF2,
 * SHA-256 MAC) files are accepted, as node-forge reads both.
 */
import forge from 'node-forge';
import type { LabSigningIdentity } from './lab-signing-identity';

type KeyUsage = { digitalSignature?: boolean; nonRepudiation?: boolean } | null;

function keyUsageAllowsSigning(cert: forge.pki.Certificate): boolean {
  const usage = cert.getExtension('keyUsage') as KeyUsage;
  return !usage || usage.digitalSignature === true || usage.nonRepudiation === true;
}

function bagsOf(p12: forge.pkcs12.Pkcs12Pfx, bagType: string): forge.pkcs12.Bag[] {
  return p12.getBags({ bagType })[bagType] ?? [];
}

/**
 * Returns the identity as PEM. Throws a RangeError when the passphrase is wrong or the file is
 * damaged, when it holds no RSA key or no matching certificate, when that certificate is outside
 * its validity at `now` (default: the current time), or when its key usage forbids signing.
 * @example importPkcs12(fs.readFileSync('lab.p12'), 'secret')
 *   // { certificatePem: '-----BEGIN CERTIFICATE-----...', privateKeyPem: '...' }
 */
export function importPkcs12(
  p12Der: Buffer | Uint8Array,
  passphrase: string,
  options: { now?: Date } = {},
): LabSigningIdentity {
  const fail = (message: string) => new RangeError(`importPkcs12: ${message}`);
  if (!(p12Der instanceof Uint8Array) || p12Der.length === 0) throw fail('the file is empty');
  let p12: forge.pkcs12.Pkcs12Pfx;
  try {
    const der = forge.util.createBuffer(Buffer.from(p12Der).toString('binary'));
    p12 = forge.pkcs12.pkcs12FromAsn1(forge.asn1.fromDer(der), false, passphrase);
  } catch (error) {
    const reason = (error as Error).message;
    throw fail(`cannot open the file (wrong passphrase or not PKCS#12): ${reason}`);
  }
  const { oids } = forge.pki;
  const keyBags = [...bagsOf(p12, oids.pkcs8ShroudedKeyBag), ...bagsOf(p12, oids.keyBag)];
  const isRsa = (k: unknown): k is forge.pki.rsa.PrivateKey =>
    typeof k === 'object' && k !== null && 'n' in k;
  const key = keyBags.map((b) => b.key).find(isRsa);
  if (!key) throw fail('the file holds no RSA private key');
  const certs = bagsOf(p12, oids.certBag)
    .map((b) => b.cert)
    .filter((c): c is forge.pki.Certificate => c !== undefined && c !== null);
  const matches = (c: forge.pki.Certificate) => {
    const pub = c.publicKey as forge.pki.rsa.PublicKey;
    return pub.n !== undefined && pub.n.equals(key.n) && pub.e.equals(key.e);
  };
  const cert = certs.find(matches);
  if (!cert) throw fail('no certificate in the file matches the private key');
  const now = options.now ?? new Date();
  const { notBefore, notAfter } = cert.validity;
  if (now < notBefore || now > notAfter) {
    const period = `${notBefore.toISOString()} to ${notAfter.toISOString()}`;
    throw fail(`the certificate is valid only from ${period}`);
  }
  if (!keyUsageAllowsSigning(cert)) throw fail('the certificate key usage does not allow signing');
  const chain = certs.filter((c) => c !== cert).map((c) => forge.pki.certificateToPem(c));
  const keyInfo = forge.pki.wrapRsaPrivateKey(forge.pki.privateKeyToAsn1(key));
  return {
    certificatePem: forge.pki.certificateToPem(cert),
    privateKeyPem: forge.pki.privateKeyInfoToPem(keyInfo),
    ...(chain.length > 0 ? { chainPems: chain } : {}),
  };
}

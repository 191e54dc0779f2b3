/** SHA-256 (FIPS 180-4) of a file's bytes as lowercase hex, recorded to verify issued PDFs. */
import { createHash } from 'node:crypto';

/**
 * Hex digest of the bytes. Non-binary input throws a TypeError.
 * @example sha256Hex(Buffer.from('abc'))
 *   // 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'
 */
export function sha256Hex(bytes: Buffer | Uint8Array): string {
  if (!(bytes instanceof Uint8Array)) {
    throw new TypeError('sha256Hex: expected a Buffer or Uint8Array');
  }
  return createHash('sha256').update(bytes).digest('hex');
}

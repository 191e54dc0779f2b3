/**
 * Organization codes (2-8 upper-case letters or digits, printed in report numbers) made from a
 * name when the person signing up does not choose one: the initials, or the first letters of a
 * one-word name, then a random number when that is taken.
 */
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { Organization } from '../db/models';

/** "Harbour RF Test Lab" -> "HRTL"; "Acme" -> "ACME"; a name without letters or digits -> "ORG". */
export function proposeOrganizationCode(name: string): string {
  const words = name.toUpperCase().normalize('NFKD').replace(/[^A-Z0-9 ]/g, '').split(/\s+/).filter(Boolean);
  const initials = words.map((w) => w[0]).join('').slice(0, 5);
  const code = initials.length >= 2 ? initials : (words[0] ?? '').slice(0, 5);
  return code.length >= 2 ? code : 'ORG';
}

/** A code no organization has yet, from the proposal plus a random suffix when needed. */
export async function uniqueOrganizationCode(name: string, transaction: Transaction | null): Promise<string> {
  const base = proposeOrganizationCode(name);
  for (let attempt = 0; attempt < 20; attempt++) {
    const code = attempt === 0 ? base : `${base.slice(0, 5)}${crypto.randomInt(100, 1000)}`;
    if (!(await Organization.findOne({ where: { code }, transaction: transaction ?? undefined }))) return code;
  }
  // 20 taken random suffixes in a row would mean thousands of look-alike names; fall back to random.
  return `O${crypto.randomBytes(4).toString('hex').toUpperCase().slice(0, 7)}`;
}

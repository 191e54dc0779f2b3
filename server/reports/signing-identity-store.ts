import { Organization, SigningIdentity } from '../db/models';
import { decryptPrivateKey, encryptPrivateKey } from '../signing/private-key-encryption';
import { generateLabSigningIdentity } from '../signing/generate-lab-signing-identity';

/** The lab's active signing identity, generated on first use when the lab has none. */
export async function activeSigningIdentity(organizationId: string, masterKey: string) {
  let row = await SigningIdentity.findOne({ where: { organizationId, active: true } });
  if (!row) {
    const lab = (await Organization.findByPk(organizationId))!;
    const identity = generateLabSigningIdentity({ labName: lab.name });
    row = await SigningIdentity.create({
      organizationId,
      certificatePem: identity.certificatePem,
      encryptedPrivateKey: encryptPrivateKey(identity.privateKeyPem, masterKey, { context: organizationId }),
      source: 'generated',
    });
  }
  return { certificatePem: row.certificatePem, privateKeyPem: decryptPrivateKey(row.encryptedPrivateKey, masterKey, { context: organizationId }) };
}

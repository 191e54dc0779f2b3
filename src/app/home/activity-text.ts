import type { ActivityEntry } from './home-api';

/** What each audited action did, in our words (server's audit actions: server/audit/audit.ts callers). */
const PHRASES: Record<string, string> = {
  'create instrument': 'added an instrument to the register',
  'update instrument': 'changed an instrument record',
  'create client': 'added a client',
  'update client': 'changed a client record',
  'create device': 'registered a device',
  'update device': 'changed a device record',
  'create test-plan': 'built a test plan',
  'create test-run': 'started a run',
  'save-reading test-run': 'saved a reading',
  'set-instruments test-run': 'set the instruments of a run',
  'comment test-run': 'commented on a run',
  'run-submit test-run': 'sent a run for review',
  'run-return test-run': 'returned a run to the bench',
  'run-approve test-run': 'authorized a run',
  'run-issue test-run': 'issued a report',
  'run-revise test-run': 'reopened an issued run for correction',
  'report-withdraw report': 'withdrew a report',
  'copy rule-set': 'copied a rule set',
  'new-version rule-set': 'saved a new version of a rule set',
  'invite invitation': 'sent an invitation',
  'revoke invitation': 'withdrew an invitation',
  'invitation-accept invitation': 'accepted an invitation',
  'member-roles membership': 'changed a member’s roles',
  'member-remove membership': 'removed a member',
  'create api-key': 'made an API key',
  'revoke api-key': 'revoked an API key',
  'create auditor-grant': 'gave an auditor access',
  'revoke auditor-grant': 'revoked an auditor’s access',
  'sign-up organization': 'signed the lab up',
  'upload upload': 'uploaded a trace',
  'client-organization-create client': 'invited a client’s first administrator',
  'credit-adjust client': 'adjusted a client’s report credits',
  'credit-checkout credit-purchase': 'started a credit purchase',
  'credit-consume client': 'used a client’s report credit for a report',
  'credit-purchase-complete credit-purchase': 'recorded a paid credit purchase',
  'credit-refund client': 'returned a report credit to a client',
  'price-list-save credit-price-list': 'saved the credit price list',
  'update organization': 'changed the lab details printed on reports',
  'mail-settings-update organization': 'changed the e-mail settings',
  'password-reset user': 'reset a password',
  'password-reset-request user': 'asked for a password reset',
};

/**
 * A line for the recent-activity panel: who did what, e.g. "Imogen Varga added an instrument to
 * the register", and "You …" for the reader's own entries (`myUserId`). An unknown action is
 * still shown, as "action (entity)". Never throws.
 * @example activityText({ who: { userId: 'u2', displayName: 'Tomasz Ellery' }, action: 'run-submit', entity: 'test-run' }, 'u1') // 'Tomasz Ellery sent a run for review'
 */
export function activityText(entry: Pick<ActivityEntry, 'action' | 'entity'> & { who: { userId?: string; displayName: string | null } | null }, myUserId?: string): string {
  const mine = !!entry.who?.userId && entry.who.userId === myUserId;
  const who = mine ? 'You' : (entry.who?.displayName ?? (entry.who ? 'Someone' : 'Sidecheck'));
  const what = PHRASES[`${entry.action} ${entry.entity}`] ?? `${entry.action.replace(/-/g, ' ')} (${entry.entity.replace(/-/g, ' ')})`;
  return `${who} ${what}`;
}

/** Where an entry's thing can be opened on screen, or null. */
export function activityLink(entry: Pick<ActivityEntry, 'entity' | 'entityId'>): string[] | null {
  if (!entry.entityId) return null;
  const base: Record<string, string> = { 'test-run': '/runs', 'rule-set': '/rule-sets' };
  // Instruments and clients open on their lists: every lab role may read those, not every role edit.
  if (entry.entity === 'instrument') return ['/equipment'];
  if (entry.entity === 'client') return ['/clients'];
  return base[entry.entity] ? [base[entry.entity], entry.entityId] : null;
}

/** Which side of a sale the active organization is on: the lab that sells credits or the manufacturer that buys them. */
import type { BillingActor } from './billing-deps';

export type BillingSide = 'lab' | 'manufacturer';

/**
 * The kind of the active organization, from the caller's memberships (the router has already
 * checked that the caller belongs to it). Throws a TypeError when called without one.
 * @example billingSide(ctx) // 'manufacturer'
 */
export function billingSide(ctx: BillingActor): BillingSide {
  const membership = ctx.principal?.memberships.find((m) => m.organizationId === ctx.organizationId);
  if (!membership) throw new TypeError('billingSide: no membership in the active organization');
  return membership.kind;
}

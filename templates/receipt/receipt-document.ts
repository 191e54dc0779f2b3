/**
 * The plain data a receipt for report credits is printed from. The server fills it from the
 * completed purchase; nothing here reads a database.
 */

export interface ReceiptParty {
  name: string;
  addressLines: string[];
  email?: string;
  phone?: string;
}

export interface ReceiptLine {
  description: string;
  quantity: number;
  /** Price of one unit, in minor units of the receipt's currency. */
  unitPriceMinor: number;
}

export interface ReceiptDocument {
  receiptNumber: string;
  /** ISO 8601 date-time of the payment. */
  paidAt: string;
  /** ISO 8601 date-time the receipt was issued. */
  issuedAt: string;
  /** The lab that sells the credits. */
  seller: ReceiptParty;
  /** The lab's client that paid. */
  buyer: ReceiptParty & { contactName?: string };
  /** ISO 4217 code, upper case (one of CURRENCY_MINOR_UNITS). */
  currency: string;
  lines: ReceiptLine[];
  payment: { method: string; reference: string; paidBy?: string };
  /** Credits the client holds with the lab once this purchase is added. */
  balanceAfterCredits?: number;
}

/**
 * Total of the lines in minor units: Σ quantity · unitPriceMinor, in integers.
 * Throws a RangeError for no lines, or a quantity or price that is not a whole number >= 0.
 * @example receiptTotalMinor([{ description: '5 credits', quantity: 1, unitPriceMinor: 80000 }])
 *   // 80000
 */
export function receiptTotalMinor(lines: readonly ReceiptLine[]): number {
  if (lines.length === 0) {
    throw new RangeError('receiptTotalMinor: a receipt needs at least one line');
  }
  let total = 0;
  for (const line of lines) {
    const wholeQuantity = Number.isSafeInteger(line.quantity) && line.quantity >= 1;
    const wholePrice = Number.isSafeInteger(line.unitPriceMinor) && line.unitPriceMinor >= 0;
    if (!wholeQuantity || !wholePrice) {
      const what = 'needs a whole quantity >= 1 and price >= 0';
      throw new RangeError(`receiptTotalMinor: "${line.description}" ${what}`);
    }
    total += line.quantity * line.unitPriceMinor;
  }
  return total;
}

/** A receipt like the ones the server prints, with invented parties, for specs and previews. */
export function buildSampleReceipt(overrides: Partial<ReceiptDocument> = {}): ReceiptDocument {
  return {
    receiptNumber: 'KBRTL-R2026-0007',
    paidAt: '2026-11-24T10:15:00.000Z',
    issuedAt: '2026-11-24T10:15:02.000Z',
    seller: {
      name: 'Kestrel Bay Radio Test Laboratory',
      addressLines: ['Unit 4, Saltmarsh Technology Park', 'Port Kestrel KB7 2QT'],
      email: 'lab@kestrelbay.example',
    },
    buyer: {
      name: 'Halyard Marine Radio Works',
      addressLines: ['18 Chandlers Quay', 'Wendlebury Harbour WH3 9LP'],
      contactName: 'Delphine Okafor',
    },
    currency: 'GBP',
    lines: [{ description: 'Report credits, pack of 5', quantity: 1, unitPriceMinor: 80000 }],
    payment: {
      method: 'Card payment',
      reference: 'pi_sample_0001',
      paidBy: 'delphine.okafor@halyard-radio.example',
    },
    balanceAfterCredits: 8,
    ...overrides,
  };
}

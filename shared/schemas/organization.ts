import { email, text } from './common';

/** PUT /api/organization: the active organization's details as printed on its reports and receipts. */
export interface OrganizationDetailsBody {
  name: string;
  addressLines: string[];
  email: string | null;
  phone: string | null;
  accreditation: string | null;
}

export const organizationDetailsSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['name', 'addressLines', 'email', 'phone', 'accreditation'],
  properties: {
    name: text(200),
    addressLines: { type: 'array', minItems: 1, maxItems: 6, items: text(200) },
    email: { anyOf: [email, { type: 'null' }] },
    phone: { anyOf: [text(50), { type: 'null' }] },
    accreditation: { anyOf: [text(200), { type: 'null' }] },
  },
} as const;

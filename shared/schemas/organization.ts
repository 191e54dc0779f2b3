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

/** PUT /api/organization/mail-settings: a lab's choices for the e-mails it sends its clients. */
export interface MailSettingsBody {
  /** Attach the signed report PDF to the report-issued e-mail (otherwise the e-mail links to it). */
  attachPdfToEmail: boolean;
}

export const mailSettingsSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['attachPdfToEmail'],
  properties: { attachPdfToEmail: { type: 'boolean' } },
} as const;

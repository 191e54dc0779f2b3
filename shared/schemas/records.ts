import { TEST_KINDS } from '../rules/test-kind';
import { email, finite, isoDate, text, uuid } from './common';

export interface CreateClientBody {
  name: string;
  addressLines: string[];
  contactName: string;
  contactEmail: string;
  invoiceLater?: boolean;
}

export const createClientSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['name', 'addressLines', 'contactName', 'contactEmail'],
  properties: {
    name: text(200),
    addressLines: { type: 'array', maxItems: 6, items: text(200) },
    contactName: text(200),
    contactEmail: email,
    invoiceLater: { type: 'boolean' },
  },
} as const;

export interface CreateDeviceBody {
  clientId: string;
  manufacturer: string;
  model: string;
  serialNumber: string;
  firmware?: string;
  ratedPepW: number;
  emissionDesignator: string;
  frequencyMinHz: number;
  frequencyMaxHz: number;
  modes: ('USB' | 'LSB')[];
  receivedOn: string;
  condition?: string;
}

export const createDeviceSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['clientId', 'manufacturer', 'model', 'serialNumber', 'ratedPepW', 'emissionDesignator', 'frequencyMinHz', 'frequencyMaxHz', 'modes', 'receivedOn'],
  properties: {
    clientId: uuid,
    manufacturer: text(200),
    model: text(200),
    serialNumber: text(100),
    firmware: text(100, 0),
    ratedPepW: { type: 'number', exclusiveMinimum: 0, maximum: 1e6 },
    emissionDesignator: { type: 'string', pattern: '^[0-9HKMG]{4}[A-Z0-9]{3}$', maxLength: 7 },
    frequencyMinHz: finite(0, 3e11),
    frequencyMaxHz: finite(0, 3e11),
    modes: { type: 'array', minItems: 1, maxItems: 2, uniqueItems: true, items: { enum: ['USB', 'LSB'] } },
    receivedOn: isoDate,
    condition: text(500, 0),
  },
} as const;

export interface TestPointBody {
  kind: (typeof TEST_KINDS)[number];
  label: string;
  frequencyHz: number;
  sideband: 'USB' | 'LSB';
  powerLevel?: string;
}

export interface CreatePlanBody {
  deviceId: string;
  ruleSetId: string;
  name: string;
  testPoints: TestPointBody[];
}

export const createPlanSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['deviceId', 'ruleSetId', 'name', 'testPoints'],
  properties: {
    deviceId: uuid,
    ruleSetId: uuid,
    name: text(200),
    testPoints: {
      type: 'array',
      minItems: 1,
      maxItems: 200,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['kind', 'label', 'frequencyHz', 'sideband'],
        properties: {
          kind: { enum: [...TEST_KINDS] },
          label: text(200),
          frequencyHz: finite(1, 3e11),
          sideband: { enum: ['USB', 'LSB'] },
          powerLevel: text(100, 0),
        },
      },
    },
  },
} as const;

export const createRunSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['planId'],
  properties: { planId: uuid },
} as const;

export interface SaveReadingBody {
  values: Record<string, number | string | null>;
}

export const saveReadingSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['values'],
  properties: {
    values: {
      type: 'object',
      maxProperties: 50,
      propertyNames: { pattern: '^[A-Za-z][A-Za-z0-9]{0,63}$' },
      additionalProperties: { anyOf: [finite(-1e12, 1e12), text(500, 0), { type: 'null' }] },
    },
  },
} as const;

export const reasonSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['reason'],
  properties: { reason: text(2000, 3) },
} as const;

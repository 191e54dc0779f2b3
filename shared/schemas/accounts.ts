/**
 * Request bodies for people and access: sign-up, members, invitations, password reset, API keys
 * and auditor grants. The same schemas drive the client's forms and the server's validation.
 */
import { ROLES, type Role } from '../access/roles';
import { email, isoDate, text, uuid } from './common';

/** Passwords are checked for strength by the server (length 12-200, letters and a digit). */
const password = text(200);
/** Single-use tokens are 32 random bytes in base64url: exactly 43 characters. */
const token = { type: 'string', pattern: '^[A-Za-z0-9_-]{43}$' } as const;
const role = { type: 'string', enum: ROLES } as const;
/** A person's or an organization's name: not only spaces. */
const name = { ...text(200), pattern: '\\S' } as const;

export interface SignUpBody {
  labName: string;
  /** 2-8 letters or digits, printed in report numbers; made from the name when left out. */
  labCode?: string;
  /** Postal address, one line per item. */
  address: string[];
  name: string;
  email: string;
  password: string;
}

export const signUpSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['labName', 'address', 'name', 'email', 'password'],
  properties: {
    labName: name,
    labCode: { type: 'string', pattern: '^[A-Za-z0-9]{2,8}$' },
    address: { type: 'array', minItems: 1, maxItems: 6, items: text(200) },
    name,
    email,
    password,
  },
} as const;

export interface SetRolesBody {
  roles: Role[];
}

export const setRolesSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['roles'],
  properties: { roles: { type: 'array', minItems: 1, maxItems: ROLES.length, uniqueItems: true, items: role } },
} as const;

export interface CreateInvitationBody {
  email: string;
  role: Role;
}

export const createInvitationSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['email', 'role'],
  properties: { email, role },
} as const;

export interface ClientInvitationBody {
  /** Defaults to the client's contact e-mail. */
  email?: string;
}

export const clientInvitationSchema = {
  type: 'object',
  additionalProperties: false,
  properties: { email },
} as const;

export interface AcceptInvitationBody {
  token: string;
  /** Required when the e-mail address has no account yet. */
  name?: string;
  /** Required when the e-mail address has no account yet. */
  password?: string;
}

export const acceptInvitationSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['token'],
  properties: { token, name, password },
} as const;

export interface PasswordResetRequestBody {
  email: string;
}

export const passwordResetRequestSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['email'],
  properties: { email },
} as const;

export interface PasswordResetCompleteBody {
  token: string;
  password: string;
}

export const passwordResetCompleteSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['token', 'password'],
  properties: { token, password },
} as const;

export interface CreateApiKeyBody {
  name: string;
}

export const createApiKeySchema = {
  type: 'object',
  additionalProperties: false,
  required: ['name'],
  properties: { name: { ...text(100), pattern: '\\S' } },
} as const;

export const AUDITOR_SCOPES = ['all', 'client', 'device'] as const;
export type AuditorScope = (typeof AUDITOR_SCOPES)[number];

export interface CreateAuditorGrantBody {
  email: string;
  /** all: every issued report of the lab; client: those of one client; device: those of one device. */
  scope: AuditorScope;
  clientId?: string;
  deviceId?: string;
  /** Last day of access (inclusive). */
  expiresOn: string;
  note?: string;
}

export const createAuditorGrantSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['email', 'scope', 'expiresOn'],
  properties: {
    email,
    scope: { type: 'string', enum: AUDITOR_SCOPES },
    clientId: uuid,
    deviceId: uuid,
    expiresOn: isoDate,
    note: text(500),
  },
} as const;

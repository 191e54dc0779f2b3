import { email, text } from './common';

export interface SignInBody {
  email: string;
  password: string;
}

export const signInSchema = {
  type: 'object',
  additionalProperties: false,
  required: ['email', 'password'],
  properties: { email: text(254), password: text(200) },
} as const;

export const emailOnlySchema = { type: 'object', additionalProperties: false, required: ['email'], properties: { email } } as const;

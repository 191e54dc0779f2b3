/** Building blocks for the JSON Schemas shared by the client's forms and the server's validation. */
export const text = (maxLength = 200, minLength = 1) => ({ type: 'string', minLength, maxLength }) as const;
export const uuid = { type: 'string', format: 'uuid' } as const;
export const isoDate = { type: 'string', format: 'date' } as const;
export const email = { type: 'string', format: 'email', maxLength: 254 } as const;
/** JSON cannot carry NaN or Infinity; the bounds keep physically absurd numbers out. */
export const finite = (minimum = -1e12, maximum = 1e12) => ({ type: 'number', minimum, maximum }) as const;

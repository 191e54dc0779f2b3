/**
 * The body of POST /runs/:id/cases/:caseId/comments. Kept beside the route until it moves to
 * shared/schemas with the other payloads; the client's comment box uses the same 4000-character cap.
 */
export const COMMENT_MAX_LENGTH = 4000;

export interface CommentBody {
  body: string;
}

export const commentBodySchema = {
  type: 'object',
  additionalProperties: false,
  required: ['body'],
  // A comment of only spaces says nothing: at least one visible character.
  properties: { body: { type: 'string', minLength: 1, maxLength: COMMENT_MAX_LENGTH, pattern: '\\S' } },
} as const;

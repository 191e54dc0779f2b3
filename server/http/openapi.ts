/**
 * The OpenAPI 3.1 document, generated from the route table and the same JSON Schemas the router
 * validates with, so it cannot drift from what the API accepts.
 */
import type { RouteDef } from './route';

const PROBLEM = {
  type: 'object',
  properties: { type: { type: 'string' }, title: { type: 'string' }, status: { type: 'integer' }, detail: { type: 'string' }, code: { type: 'string' }, errors: { type: 'array', items: { type: 'object', properties: { pointer: { type: 'string' }, message: { type: 'string' } } } } },
};

export function buildOpenApi(routes: RouteDef[], version: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of routes) {
    const path = '/api' + r.path.replace(/:([A-Za-z]+)/g, '{$1}');
    const params = [...r.path.matchAll(/:([A-Za-z]+)/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string' } }));
    const security =
      r.access.kind === 'public' ? [] : r.access.kind === 'member-or-api-key' ? [{ bearer: [] }, { apiKey: [] }] : [{ bearer: [] }];
    const roles = r.access.kind === 'member' || r.access.kind === 'member-or-api-key' ? r.access.roles : [];
    paths[path] ??= {};
    paths[path][r.method] = {
      summary: r.summary,
      description: roles.length ? `Roles: ${roles.join(', ')}. The active organization is named by the X-Organization-Id header.` : undefined,
      parameters: [
        ...params,
        ...(roles.length ? [{ name: 'X-Organization-Id', in: 'header', required: false, schema: { type: 'string', format: 'uuid' } }] : []),
      ],
      security,
      ...(r.bodySchema ? { requestBody: { required: true, content: { 'application/json': { schema: r.bodySchema } } } } : {}),
      responses: {
        '2XX': { description: 'Success' },
        '4XX': { description: 'A problem the caller can fix', content: { 'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } } } },
      },
    };
  }
  return {
    openapi: '3.1.0',
    info: { title: 'Sidecheck API', version, description: 'Compliance testing of HF SSB transmitters: records, readings, results, reports.' },
    servers: [{ url: '/' }],
    components: {
      securitySchemes: {
        bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' },
        apiKey: { type: 'apiKey', in: 'header', name: 'X-Api-Key' },
      },
      schemas: { Problem: PROBLEM },
    },
    paths,
  };
}

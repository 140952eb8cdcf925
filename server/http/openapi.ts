import { z } from 'zod';
import { documentedEndpoints } from './endpoint';
import { uploadRequestBody } from './upload';

/** GET /api/openapi.json — built from the endpoints as they are registered. */
export function openApiDocument() {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const e of documentedEndpoints) {
    const path = e.path.replace(/:(\w+)/g, '{$1}');
    const parameters = [...path.matchAll(/\{(\w+)\}/g)].map((m) => ({ name: m[1], in: 'path', required: true, schema: { type: 'string' } }));
    if (e.query) {
      const schema = z.toJSONSchema(e.query, { io: 'input', unrepresentable: 'any' }) as { properties?: Record<string, unknown>; required?: string[] };
      for (const [name, s] of Object.entries(schema.properties ?? {})) {
        parameters.push({ name, in: 'query', required: schema.required?.includes(name) ?? false, schema: s as { type: string } });
      }
    }
    (paths[path] ??= {})[e.method] = {
      summary: e.summary,
      'x-nestkeeper-access': e.access,
      ...(e.access === 'public' ? { security: [] } : e.access === 'if-signed-in' ? { security: [{}, { bearer: [] }, { session: [] }] } : {}),
      ...(parameters.length ? { parameters } : {}),
      ...(e.upload
        ? { requestBody: uploadRequestBody(e.upload, e.body) }
        : e.body
          ? { requestBody: { required: true, content: { 'application/json': { schema: z.toJSONSchema(e.body, { io: 'input', unrepresentable: 'any' }) } } } }
          : {}),
      responses: { default: { description: 'JSON body, or `{error: {code, message, details?}}`' } },
    };
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Nestkeeper API',
      version: '0.1.0',
      description: 'Fleet register, calibration calendar, bookings, checks, incidents and rentals for portable metrology kit.',
    },
    components: {
      securitySchemes: {
        bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' },
        session: { type: 'apiKey', in: 'cookie', name: 'nk_session' },
      },
    },
    security: [{ bearer: [] }, { session: [] }],
    paths,
  };
}

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';
import { MATRIX } from './matrix';

interface OpenApiDocument {
  paths: Record<string, Record<string, { requestBody?: { content: Record<string, { schema: unknown }> } }>>;
}

describe('OpenAPI document of the event workspace', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/docs-json lists every route of the matrix, and every body-taking one with its schema', async () => {
    const doc = (await t.get('/api/docs-json').expect(200)).body as OpenApiDocument;
    const missing: string[] = [];
    const withoutBody: string[] = [];
    const bodyless = new Set([
      'POST /api/events/:eventId/restore',
      'POST /api/fits/:fitId/review-request',
      'POST /api/fits/:fitId/stream-ticket',
    ]);
    for (const { route } of MATRIX) {
      const [method = '', path = ''] = route.split(' ');
      // A row may name a query (`?archived=true`); the document lists the path alone.
      const openApiPath = (path.split('?')[0] ?? '').replace(/:(\w+)/g, '{$1}');
      const operation = doc.paths[openApiPath]?.[method.toLowerCase()];
      if (!operation) {
        missing.push(route);
        continue;
      }
      if ((method === 'POST' || method === 'PATCH') && !bodyless.has(route) && !operation.requestBody)
        withoutBody.push(route);
    }
    expect(missing).toEqual([]);
    expect(withoutBody).toEqual([]);
  });
});

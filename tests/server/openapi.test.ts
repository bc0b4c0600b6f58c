import request from 'supertest';
import { createTestApp, type TestApp } from './helpers/test-app';
import { routeCases } from './routes/route-cases';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
});

describe('GET /api/openapi.json', () => {
  it('is an OpenAPI 3.1 document that anyone may read', async () => {
    const response = await request(testApp.app).get('/api/openapi.json').expect(200);
    expect(response.body.openapi).toBe('3.1.0');
    expect(response.body.components.securitySchemes).toEqual(
      expect.objectContaining({ accessToken: expect.objectContaining({ scheme: 'bearer' }) }),
    );
  });

  it.each(routeCases.filter((route) => !route.undocumented).map((route) => [route.method.toUpperCase(), route.template, route] as const))(
    'documents %s %s, as the role matrix calls it',
    async (_method, template, route) => {
      const response = await request(testApp.app).get('/api/openapi.json').expect(200);
      const operation = response.body.paths[template]?.[route.method];
      expect(operation).toEqual(expect.objectContaining({ summary: expect.any(String), responses: expect.any(Object) }));
      for (const name of template.match(/\{(\w+)\}/g) ?? []) {
        expect(operation.parameters).toEqual(expect.arrayContaining([expect.objectContaining({ in: 'path', name: name.slice(1, -1) })]));
      }
    },
  );

  it('describes the row edit body and the revision detail from the shared schemas', async () => {
    const response = await request(testApp.app).get('/api/openapi.json').expect(200);
    const patch = response.body.paths['/api/crafts/{craftId}/revisions/{revisionId}/parameters/{key}'].patch;
    const body = patch.requestBody.content['application/json'].schema;
    expect(JSON.stringify(body)).toContain('"version"');
    expect(Object.keys(patch.responses)).toEqual(expect.arrayContaining(['200', '400', '403', '404', '409']));
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import type { RunningServer } from '../../server/index.js';

describe('API documentation', () => {
  let server: RunningServer;
  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });

  it('when the OpenAPI document is fetched, then it describes every station and record route with the run schema from zod', async () => {
    const response = await request(server.url).get('/api/openapi.json').expect(200);
    const spec = response.body;
    expect(spec.openapi).toBe('3.1.0');
    expect(Object.keys(spec.paths)).toEqual(expect.arrayContaining([
      '/api/v1/products', '/api/v1/products/{code}/test-plan', '/api/v1/stations/me', '/api/v1/test-runs',
      '/api/v1/motors', '/api/v1/motors/{serial}', '/api/v1/lots', '/api/v1/lots/{code}', '/api/v1/holds/{id}/release',
    ]));
    const runDocument = spec.components.schemas.TestRunDocument;
    expect(runDocument.required).toEqual(expect.arrayContaining(['runId', 'serial', 'product', 'station', 'lot', 'startedAt', 'finishedAt', 'results']));
    expect(runDocument.additionalProperties).toBe(false);
    expect(runDocument.properties.results.items.properties.value.type).toBe('number');
    expect(spec.paths['/api/v1/test-runs'].post.requestBody.content['application/json'].schema).toEqual({ $ref: '#/components/schemas/TestRunDocument' });
    expect(spec.paths['/api/v1/motors'].get.parameters.map((p: { name: string }) => p.name)).toEqual(expect.arrayContaining(['status', 'cursor', 'sort', 'order', 'serialPrefix']));
    expect(spec.components.securitySchemes.stationToken.flows.clientCredentials.tokenUrl).toBe(`${server.config.oidc.issuer}/token`);
  });

  it('when the OpenAPI document is fetched, then the result-upload routes are in it with the multipart form and the report from zod', async () => {
    const spec = (await request(server.url).get('/api/openapi.json').expect(200)).body;
    expect(spec.paths['/api/v1/uploads'].get.parameters.map((p: { name: string }) => p.name)).toEqual(['limit']);
    const post = spec.paths['/api/v1/uploads'].post;
    expect(post.requestBody.content['multipart/form-data'].schema).toEqual({ $ref: '#/components/schemas/UploadForm' });
    expect(Object.keys(post.responses).sort()).toEqual(['200', '201', '202', '400', '413', '422']);
    expect(post.responses['201'].content['application/json'].schema).toEqual({ $ref: '#/components/schemas/UploadReport' });
    const form = spec.components.schemas.UploadForm;
    expect(form.required).toEqual(expect.arrayContaining(['file', 'format']));
    expect(form.properties.file).toMatchObject({ type: 'string', format: 'binary' });
    expect(form.properties.format.enum).toEqual(['long', 'wide']);
    expect(form.properties.delimiter.enum).toEqual(expect.arrayContaining(['comma', 'semicolon', 'tab']));
    expect(form.properties.decimal.enum).toEqual(['.', ',']);
    const report = spec.paths['/api/v1/uploads/{id}'].get;
    expect(report.parameters.map((p: { name: string; in: string }) => `${p.in}:${p.name}`)).toEqual(['path:id', 'query:problems', 'query:runs']);
    expect(report.responses['200'].content['application/json'].schema).toEqual({ $ref: '#/components/schemas/UploadReport' });
    const commit = spec.paths['/api/v1/uploads/{id}/commit'].post;
    expect(Object.keys(commit.responses).sort()).toEqual(['200', '202', '404', '409']);
    expect(spec.components.schemas.UploadReport.properties.status.enum).toEqual(['checking', 'dry-run', 'committing', 'committed', 'failed']);
    expect(spec.components.schemas.UploadReport.required).toEqual(expect.arrayContaining(['problems', 'runList', 'problemsTotal']));
    expect(spec.components.schemas.UploadList.properties.items.items).toEqual({ $ref: '#/components/schemas/UploadSummary' });
  });

  it('when the docs page is opened, then it loads its renderer from our own origin only', async () => {
    const page = await request(server.url).get('/api/docs').expect(200).expect('content-type', /html/);
    expect(page.text).toContain('<script src="/api/docs/render.js"></script>');
    expect(page.text).not.toMatch(/https?:\/\//);
    const script = await request(server.url).get('/api/docs/render.js').expect(200).expect('content-type', /javascript/);
    expect(script.text).toContain("fetch('/api/openapi.json')");
  });
});

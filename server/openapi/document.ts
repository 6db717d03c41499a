import { z } from 'zod';
import '../schemas/test-run.js';
import '../routes/v1/request-schemas.js';
import './response-schemas.js';
import '../routes/v1/upload-request-schemas.js';
import './upload-response-schemas.js';

/**
 * The OpenAPI 3.1 description of the station and record API, generated from the same zod schemas
 * the routes validate with (each registered by its `.meta({ id })`), so the two cannot disagree.
 */
type Operation = {
  summary: string; security: string; query?: string; body?: string;
  /** A multipart/form-data body (a file upload) instead of JSON. */
  form?: string;
  responses: Record<string, { description: string; schema?: string }>;
  params?: string[];
};

const ref = (id: string) => ({ $ref: `#/components/schemas/${id}` });
const problem = (description: string) => ({ description, schema: 'Error' });
const readers = 'signed-in people with motors:read, or a client with scope records:read';
const uploaders = 'signed-in people with uploads:commit (quality, admin)';

const operations: Record<string, Record<string, Operation>> = {
  '/api/v1/products': { get: { summary: 'Products a stand can test', security: `${readers} or test-runs:write`, responses: { 200: { description: 'products', schema: 'ProductList' } } } },
  '/api/v1/products/{code}/test-plan': { get: {
    summary: 'Characteristics with units and the limits in force', security: `${readers} or test-runs:write`, params: ['code'], query: 'TestPlanQuery',
    responses: { 200: { description: 'the plan', schema: 'TestPlan' }, 404: problem('unknown product') },
  } },
  '/api/v1/stations/me': { get: {
    summary: 'The station bound to the calling client', security: 'client with scope test-runs:write',
    responses: { 200: { description: 'the station', schema: 'Station' }, 404: problem('client bound to no station') },
  } },
  '/api/v1/test-runs': { post: {
    summary: 'Store one test run (idempotent per runId)', security: 'client with scope test-runs:write', body: 'TestRunDocument',
    responses: {
      201: { description: 'stored and judged', schema: 'TestRunResponse' }, 200: { description: 'identical retry: the first answer', schema: 'TestRunResponse' },
      403: problem('token station differs from station, or scope missing'), 409: problem('runId reused with another body'), 413: problem('a waveform above 500k samples per channel, or a body above 64 MB'), 422: problem('invalid fields, each named'),
    },
  } },
  '/api/v1/motors': { get: { summary: 'Motors, keyset-paged', security: readers, query: 'MotorListQuery', responses: { 200: { description: 'one page', schema: 'MotorList' } } } },
  '/api/v1/motors/{serial}': { get: {
    summary: 'Motor record: runs, results, holds, notes, audit', security: readers, params: ['serial'],
    responses: { 200: { description: 'the record', schema: 'MotorRecord' }, 404: problem('unknown serial') },
  } },
  '/api/v1/motors/{serial}/rework-notes': { post: {
    summary: 'Record rework or request a retest (audited)', security: 'rework:record or retest:request, by action', params: ['serial'], body: 'ReworkNoteBody',
    responses: { 201: { description: 'recorded', schema: 'ReworkNote' }, 404: problem('unknown serial') },
  } },
  '/api/v1/motors/{serial}/holds': { post: {
    summary: 'Hold a motor (audited)', security: 'holds:place', params: ['serial'], body: 'ReasonBody',
    responses: { 201: { description: 'placed', schema: 'Hold' }, 404: problem('unknown serial'), 409: problem('the motor already has an active manual hold (field serial)') },
  } },
  '/api/v1/lots': { get: { summary: 'Lots with counts by status', security: 'lots:read or records:read', query: 'LotListQuery', responses: { 200: { description: 'one page', schema: 'LotList' } } } },
  '/api/v1/lots/{code}': { get: {
    summary: 'Lot with component lots, holds and motors', security: 'lots:read or records:read', params: ['code'],
    responses: { 200: { description: 'the lot', schema: 'LotRecord' }, 404: problem('unknown lot') },
  } },
  '/api/v1/lots/{code}/holds': { post: {
    summary: 'Hold a lot (audited)', security: 'holds:place', params: ['code'], body: 'ReasonBody',
    responses: { 201: { description: 'placed', schema: 'Hold' }, 404: problem('unknown lot'), 409: problem('the lot already has an active manual hold (field code)') },
  } },
  '/api/v1/holds/{id}/release': { post: {
    summary: 'Release a hold (audited)', security: 'holds:release', params: ['id'], body: 'ReasonBody',
    responses: { 200: { description: 'released', schema: 'Hold' }, 404: problem('unknown hold'), 409: problem('already released') },
  } },
  '/api/v1/uploads': {
    post: {
      summary: 'Check a CSV or XLSX file of runs: a dry run, nothing is stored', security: uploaders, form: 'UploadForm',
      responses: {
        201: { description: 'checked: the report', schema: 'UploadReport' },
        200: { description: 'this file was sent before with the same options: that upload', schema: 'UploadReport' },
        202: { description: 'a file of 100,000 rows or more, checked in the background: poll GET /api/v1/uploads/{id}', schema: 'UploadReport' },
        400: problem('not one file in the field file'), 413: problem('the file is above 128 MB'),
        422: problem('an option, the header or the CSV structure is wrong, named by field or by row and column'),
      },
    },
    get: { summary: 'The latest uploads, newest first', security: uploaders, query: 'UploadListQuery', responses: { 200: { description: 'uploads', schema: 'UploadList' } } },
  },
  '/api/v1/uploads/{id}': { get: {
    summary: 'One upload with the first problems and runs of its report', security: uploaders, params: ['id'], query: 'UploadReportQuery',
    responses: { 200: { description: 'the upload', schema: 'UploadReport' }, 404: problem('unknown upload') },
  } },
  '/api/v1/uploads/{id}/commit': { post: {
    summary: 'Store every valid run of a checked upload through ingest, in the background (audited)', security: uploaders, params: ['id'],
    responses: {
      202: { description: 'committing: poll GET /api/v1/uploads/{id} until status is committed or failed', schema: 'UploadReport' },
      200: { description: 'committed before: that result', schema: 'UploadReport' },
      404: problem('unknown upload'), 409: problem('still being checked, or no finished dry run'),
    },
  } },
};

function componentSchemas(io: 'input' | 'output'): Record<string, object> {
  const { schemas } = z.toJSONSchema(z.globalRegistry, { uri: (id) => `#/components/schemas/${id}`, io, unrepresentable: 'any' });
  return Object.fromEntries(Object.entries(schemas).map(([id, { $schema: _s, $id: _i, ...schema }]) => [id, schema]));
}

function queryParameters(schema: Record<string, unknown> | undefined) {
  const properties = (schema?.properties ?? {}) as Record<string, object>;
  const required = new Set((schema?.required ?? []) as string[]);
  return Object.entries(properties).map(([name, property]) => ({ name, in: 'query', required: required.has(name), schema: property }));
}

/** tokenUrl: the identity provider's token endpoint, where stands get their access tokens. */
export function buildOpenApiDocument(tokenUrl: string) {
  const inputs = componentSchemas('input');
  const paths = Object.fromEntries(Object.entries(operations).map(([path, methods]) => [path, Object.fromEntries(
    Object.entries(methods).map(([method, op]) => [method, {
      summary: op.summary,
      description: `Who may call: ${op.security}.`,
      parameters: [
        ...(op.params ?? []).map((name) => ({ name, in: 'path', required: true, schema: { type: 'string' } })),
        ...queryParameters(op.query ? inputs[op.query] as Record<string, unknown> : undefined),
      ],
      ...(op.body ? { requestBody: { required: true, content: { 'application/json': { schema: ref(op.body) } } } } : {}),
      ...(op.form ? { requestBody: { required: true, content: { 'multipart/form-data': { schema: ref(op.form) } } } } : {}),
      responses: Object.fromEntries(Object.entries(op.responses).map(([status, r]) => [status, {
        description: r.description, ...(r.schema ? { content: { 'application/json': { schema: ref(r.schema) } } } : {}),
      }])),
    }]),
  )]));
  return {
    openapi: '3.1.0',
    info: { title: 'Fluxtrail station and record API', version: '1.0.0', description: 'Test stands post runs with OAuth2 client-credentials tokens; people read records and upload result files with their session.' },
    components: {
      schemas: { ...componentSchemas('output'), ...Object.fromEntries(['TestRunDocument', 'ReasonBody', 'ReworkNoteBody', 'UploadForm'].map((id) => [id, inputs[id]])) },
      securitySchemes: {
        stationToken: { type: 'oauth2', flows: { clientCredentials: { tokenUrl, scopes: { 'test-runs:write': 'post test runs', 'records:read': 'read records' } } } },
        session: { type: 'apiKey', in: 'cookie', name: 'fluxtrail.sid' },
      },
    },
    security: [{ stationToken: [] }, { session: [] }],
    paths,
  };
}

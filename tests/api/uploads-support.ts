// Helpers for the result-upload tests: files written the way a plant would write them, a
// multipart post as the browser sends it, and a poll for a background commit.
import request from 'supertest';
import ExcelJS from 'exceljs';
import { expect } from 'vitest';
import type { PlantFixture } from '../factories.js';
import { uploadReportSchema } from '../../server/openapi/upload-response-schemas.js';

export type UploadFields = { format: 'long' | 'wide'; delimiter?: 'comma' | 'semicolon' | 'tab'; decimal?: '.' | ',' };

/** An ISO 8601 time with a +01:00 offset, `minutesAgo` before now. */
export function plantTime(minutesAgo: number): string {
  const at = new Date(Date.now() - minutesAgo * 60_000 + 3_600_000);
  return `${at.toISOString().slice(0, 19)}+01:00`;
}

export type RunSpec = { serial: string; startedAt: string; finishedAt: string; values: Record<string, number | string> };

/** One run's columns in the order of runFields. */
export const runColumns = ['serial', 'product', 'lot', 'station', 'startedAt', 'finishedAt', 'operatorBadge', 'programVersion'];
const runCells = (plant: PlantFixture, run: RunSpec) => [run.serial, plant.product.code, plant.lot.code, plant.station.code, run.startedAt, run.finishedAt, 'B-2207', 'eol-pmsm 3.1.4'];

/** Passing demo values of every characteristic, with overrides. */
export function demoValues(plant: PlantFixture, overrides: Record<string, number | string> = {}): Record<string, number | string> {
  return { ...Object.fromEntries(plant.product.characteristics.map((c) => [c.code, c.demoValue])), ...overrides };
}

/** Long format: a row per measurement. Numbers are written with `decimal`, text is written as given. */
export function longCsv(plant: PlantFixture, runs: RunSpec[], delimiter = ',', decimal = '.'): string {
  const unitOf = new Map(plant.product.characteristics.map((c) => [c.code, c.unit]));
  const lines = [[...runColumns, 'characteristic', 'value', 'unit'].join(delimiter)];
  for (const run of runs) {
    for (const [code, value] of Object.entries(run.values)) {
      const text = typeof value === 'number' ? String(value).replace('.', decimal) : value;
      lines.push([...runCells(plant, run), code, text, unitOf.get(code) ?? '?'].map((cell) => quote(cell, delimiter)).join(delimiter));
    }
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** Wide format: a row per run, a column `code [unit]` per characteristic. */
export function wideRows(plant: PlantFixture, runs: RunSpec[]): Array<Array<string | number>> {
  const header = [...runColumns, ...plant.product.characteristics.map((c) => `${c.code} [${c.unit}]`)];
  return [header, ...runs.map((run) => [...runCells(plant, run), ...plant.product.characteristics.map((c) => run.values[c.code] ?? '')])];
}

export function wideCsv(plant: PlantFixture, runs: RunSpec[]): string {
  return `${wideRows(plant, runs).map((row) => row.map((cell) => quote(String(cell), ',')).join(',')).join('\r\n')}\r\n`;
}

export async function wideXlsx(plant: PlantFixture, runs: RunSpec[]): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet('Runs');
  for (const row of wideRows(plant, runs)) sheet.addRow(row);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

function quote(cell: string, delimiter: string): string {
  return cell.includes(delimiter) || cell.includes('"') || /[\r\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell;
}

/** Every successful answer of the upload routes is the report the OpenAPI document describes. */
export function expectReport(response: { status: number; body: unknown }) {
  if (response.status < 300) uploadReportSchema.strict().parse(response.body);
}

/** POST /api/v1/uploads as multipart form data. */
export function postUpload(appUrl: string, cookie: string, file: { bytes: Buffer | string; name: string }, fields: UploadFields) {
  const req = request(appUrl).post('/api/v1/uploads').set('cookie', cookie).set('x-fluxtrail-csrf', '1')
    .field('format', fields.format).field('delimiter', fields.delimiter ?? 'comma').field('decimal', fields.decimal ?? '.').field('mode', 'dry-run');
  return req.attach('file', Buffer.isBuffer(file.bytes) ? file.bytes : Buffer.from(file.bytes, 'utf8'), file.name).expect(expectReport);
}

/** Commits an upload and polls it until the background pass has ended. */
export async function commitAndWait(appUrl: string, cookie: string, id: number) {
  const started = await request(appUrl).post(`/api/v1/uploads/${id}/commit`).set('cookie', cookie).set('x-fluxtrail-csrf', '1').expect(expectReport);
  expect([200, 202]).toContain(started.status);
  for (let i = 0; i < 200; i++) {
    const view = await request(appUrl).get(`/api/v1/uploads/${id}`).set('cookie', cookie).expect(200).expect(expectReport);
    if (view.body.status === 'committed' || view.body.status === 'failed') return { started, view: view.body };
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`upload ${id} did not finish committing`);
}

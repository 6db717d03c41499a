import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { RunningServer } from '../../server/index.js';
import { claimNextExportJob, runExportJob } from '../../server/jobs/export-jobs.js';
import { startApiServer } from '../support/api-server.js';
import { controlCharacterReason, injectionBadges, seedPlant, signedIn, type Agent, type Seeded } from './evidence-seed.js';
import { parseCsv, sha256, unzip } from './evidence-zip.js';

// The stored reason as a worksheet holds it: ECMA-376's _xHHHH_ for what XML 1.0 cannot carry.
const reasonInWorkbook = 'Retested quietly_x0007_ (bell)_x000D_\nsee _x005F_x0041_ in the log_xFFFF_';

type DbRun = { id: number; run_uuid: string; serial: string; product: string; attempt: number; started_at: Date; station: string; operator_badge: string; revision: number; verdict: string };

// supertest hands the parser the raw response stream, typed as its Response.
const binaryParser = (res: Response, done: (err: Error | null, body: Buffer) => void) => {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
};

describe('evidence pack contents', () => {
  let server: RunningServer;
  let auditor: Agent;
  let seeded: Seeded;
  let files: Map<string, Buffer>;
  let zipBytes: Buffer;
  let status: { id: number; status: string; sha256: string; rows: number; sizeBytes: number };
  let workbook: ExcelJS.Workbook;
  let runs: DbRun[];
  const filter = { lots: ['LOT-A', 'LOT-C'] };

  beforeAll(async () => {
    server = await startApiServer();
    seeded = await seedPlant(server.db);
    auditor = await signedIn(server.url, 'auditor');
    const created = await auditor.post('/api/v1/evidence-packs', filter).expect(202);
    const job = await claimNextExportJob(server.db, 'test-worker');
    expect(job?.id).toBe(created.body.id);
    // A row cap of 3 (header + 2) forces every long sheet onto numbered continuation sheets.
    expect(await runExportJob(server.db, job!, { dataDir: server.config.dataDir, sheetRowCap: 3 })).toBe('done');
    status = (await auditor.get(`/api/v1/evidence-packs/${created.body.id}`).expect(200)).body;
    const download = await auditor.get(`/api/v1/evidence-packs/${created.body.id}/download`).buffer(true).parse(binaryParser).expect(200);
    expect(download.headers['content-disposition']).toBe(`attachment; filename="fluxtrail-evidence-pack-${status.id}.zip"`);
    zipBytes = download.body as Buffer;
    files = await unzip(zipBytes);
    workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(files.get(`fluxtrail-pack-${status.id}-workbook.xlsx`)! as unknown as ArrayBuffer);
    runs = await server.db({ r: 'test_runs' }).join({ m: 'motors' }, 'm.id', 'r.motor_id').join({ p: 'products' }, 'p.id', 'm.product_id')
      .join({ s: 'stations' }, 's.id', 'r.station_id').join({ ls: 'limit_sets' }, 'ls.id', 'r.limit_set_id').join({ l: 'lots' }, 'l.id', 'm.lot_id')
      .whereIn('l.code', filter.lots).orderBy('r.id')
      .select('r.id', 'r.run_uuid', 'm.serial', { product: 'p.code' }, 'r.attempt', 'r.started_at', { station: 's.code' }, 'r.operator_badge', 'ls.revision', 'r.verdict');
  }, 60_000);
  afterAll(async () => { await server.stop(); });

  it('when the pack is downloaded, then the bytes are exactly the file whose SHA-256 and size are shown', () => {
    expect(status.status).toBe('done');
    expect(sha256(zipBytes)).toBe(status.sha256);
    expect(zipBytes.length).toBe(status.sizeBytes);
    expect([...files.keys()].sort()).toEqual([`fluxtrail-pack-${status.id}-measurements.csv`, `fluxtrail-pack-${status.id}-workbook.xlsx`, 'manifest.json'].sort());
  });

  it('when the manifest is read, then every other file matches its SHA-256 and the counts match the database', async () => {
    const manifest = JSON.parse(files.get('manifest.json')!.toString('utf8'));
    expect(manifest.files).toHaveLength(2);
    for (const entry of manifest.files) {
      expect(sha256(files.get(entry.name)!)).toBe(entry.sha256);
      expect(files.get(entry.name)!.length).toBe(entry.bytes);
    }
    const version = JSON.parse(readFileSync('package.json', 'utf8')).version;
    const measured = await server.db('measurements').whereIn('run_id', runs.map((r) => r.id)).count({ n: '*' }).first();
    expect(manifest).toMatchObject({
      packId: status.id, madeBy: { name: 'Helen Marsh', role: 'auditor' }, fluxtrailVersion: version, filter,
      counts: { motors: 6, testRuns: runs.length, measurements: Number(measured!.n), csvRows: Number(measured!.n), products: ['DC-40', 'PM-150'] },
    });
    expect(manifest.notes.csvInjection).toMatch(/single quote.*OWASP/);
    expect(manifest.notes.workbookText).toMatch(/_xHHHH_ \(ECMA-376 ST_Xstring\)/);
  });

  it('when the CSV is read, then it has one line per measurement matching the database, with formula-like text quoted', async () => {
    const rows = parseCsv(files.get(`fluxtrail-pack-${status.id}-measurements.csv`)!.toString('utf8'));
    expect(rows[0]).toEqual(['serial', 'run_id', 'attempt', 'characteristic', 'value', 'unit', 'lsl', 'usl', 'verdict', 'station', 'operator_badge', 'started_at_utc']);
    // Product by product (code order), each product's runs by id, each run's results in test-plan order.
    const expected = await server.db({ ms: 'measurements' }).join({ c: 'characteristics' }, 'c.id', 'ms.characteristic_id')
      .join({ p: 'products' }, 'p.id', 'c.product_id')
      .whereIn('ms.run_id', runs.map((r) => r.id)).orderBy([{ column: 'p.code' }, { column: 'ms.run_id' }, { column: 'c.sort_order' }])
      .select('ms.run_id', 'c.code', 'c.unit', 'ms.value', 'ms.lsl', 'ms.usl', 'ms.verdict');
    const byId = new Map(runs.map((r) => [r.id, r]));
    const quoteIfFormula = (text: string) => (/^[=+\-@]/.test(text) ? `'${text}` : text);
    expect(rows.slice(1)).toEqual(expected.map((m) => {
      const run = byId.get(Number(m.run_id))!;
      return [run.serial, run.run_uuid, String(run.attempt), m.code, String(m.value), m.unit, String(m.lsl), String(m.usl), m.verdict,
        run.station, quoteIfFormula(run.operator_badge), new Date(run.started_at).toISOString()];
    }));
    const badges = new Set(rows.slice(1).map((r) => r[10]));
    for (const attempt of injectionBadges.slice(0, 3)) expect(badges).toContain(`'${attempt}`);
  });

  it('when the workbook is read back, then a long sheet continues on numbered sheets and every results row matches its run', () => {
    const names = workbook.worksheets.map((w) => w.name);
    // Each group is its base name followed by (2), (3), … with no gaps, in the documented order.
    const groups = names.reduce<Array<{ base: string; parts: number }>>((acc, name) => {
      const match = /^(.*) \((\d+)\)$/.exec(name);
      if (match && acc.at(-1)?.base === match[1]) { expect(Number(match[2])).toBe(acc.at(-1)!.parts + 1); acc.at(-1)!.parts += 1; }
      else acc.push({ base: name, parts: 1 });
      return acc;
    }, []);
    expect(groups.map((g) => g.base)).toEqual(['Summary', 'Motors', 'Results DC-40', 'Results PM-150', 'Limits', 'Stations', 'Holds',
      ...(names.includes('Signals') ? ['Signals'] : []), 'Audit extract']);
    expect(names).toEqual(expect.arrayContaining(['Motors (3)', 'Results PM-150 (2)', 'Results PM-150 (3)']));
    expect(names).not.toContain('Motors (4)');
    expect(names).not.toContain('Results PM-150 (4)');
    expect(names).not.toContain('Results DC-40 (2)');
    for (const product of ['PM-150', 'DC-40']) {
      const sheets = workbook.worksheets.filter((w) => w.name === `Results ${product}` || w.name.startsWith(`Results ${product} (`));
      const rows = sheets.flatMap((w) => w.getSheetValues().slice(2).map((values) => (values as ExcelJS.CellValue[]).slice(1)));
      const expected = runs.filter((r) => r.product === product);
      expect(rows.map((r) => [r[0], r[1], r[2], (r[3] as Date).toISOString(), r[4], r[6], r[8], r[9]]))
        .toEqual(expected.map((r) => [r.serial, r.run_uuid, r.attempt, new Date(r.started_at).toISOString(), r.station, r.operator_badge, r.revision, r.verdict]));
      const header = sheets[0].getRow(1).values as ExcelJS.CellValue[];
      expect(header.slice(1, 11)).toEqual(['Serial', 'Run', 'Attempt', 'Started (UTC)', 'Station', 'Calibration due', 'Operator badge', 'Program version', 'Limit revision', 'Verdict']);
      const chars = product === 'PM-150' ? seeded.pm.chars : seeded.dc.chars;
      expect(header.slice(11).filter((h) => !String(h).endsWith('verdict'))).toHaveLength(chars.length);
    }
    expect(workbook.getWorksheet('Results PM-150')!.getRow(1).getCell(11).value).toBe('bemf.ke [V/krpm]');
  });

  it('when measured values are compared, then each characteristic column holds the stored value and verdict', async () => {
    const sheet = workbook.getWorksheet('Results PM-150')!;
    const row = sheet.getRow(2);
    const run = runs.find((r) => r.run_uuid === row.getCell(2).value)!;
    const stored = await server.db('measurements').where({ run_id: run.id }).orderBy('characteristic_id');
    seeded.pm.chars.forEach((c, index) => {
      const m = stored.find((s) => s.characteristic_id === c.id);
      expect(row.getCell(11 + index * 2).value).toBe(m.value);
      expect(row.getCell(12 + index * 2).value).toBe(m.verdict);
      expect(row.getCell(11 + index * 2).numFmt).toBe('0.000###');
    });
    expect(row.getCell(4).numFmt).toBe('yyyy-mm-dd hh:mm:ss');
  });

  it('when formula-like operator badges are read back, then they are plain string cells with no formula', () => {
    const cells = workbook.worksheets.filter((w) => w.name.startsWith('Results PM-150'))
      .flatMap((w) => w.getColumn(7).values.slice(2).map((_, i) => w.getRow(i + 2).getCell(7)));
    for (const attempt of injectionBadges) {
      const cell = cells.find((c) => c.value === attempt);
      expect(cell, attempt).toBeDefined();
      expect(cell!.type).toBe(ExcelJS.ValueType.String);
      expect(cell!.formula).toBeUndefined();
    }
  });

  it('when the workbook\'s parts are listed, then Summary is the first tab yet its sheet is the last one in the zip, and no cell holds a formula', async () => {
    const parts = await unzip(files.get(`fluxtrail-pack-${status.id}-workbook.xlsx`)!);
    const sheetParts = [...parts.keys()].filter((name) => name.startsWith('xl/worksheets/sheet'));
    expect(sheetParts).toHaveLength(workbook.worksheets.length);
    expect(sheetParts.at(-1)).toBe('xl/worksheets/sheet1.xml');
    expect(parts.get('xl/workbook.xml')!.toString('utf8')).toMatch(/<sheets><sheet sheetId="1" name="Summary"/);
    for (const name of sheetParts) expect(parts.get(name)!.toString('utf8'), name).not.toMatch(/<f[ >]/);
  });

  it('when the sheets are inspected, then headers are frozen and carry an autofilter', () => {
    for (const sheet of workbook.worksheets) {
      expect(sheet.views[0], sheet.name).toMatchObject({ state: 'frozen', ySplit: 1 });
      expect(sheet.autoFilter, sheet.name).toBeTruthy();
      expect(sheet.getRow(1).font?.bold, sheet.name).toBe(true);
    }
  });

  it('when Motors, Limits, Stations, Holds and Audit extract are read, then they match the database for the pack only', async () => {
    const values = (prefix: string) => workbook.worksheets.filter((w) => w.name === prefix || w.name.startsWith(`${prefix} (`))
      .flatMap((w) => w.getSheetValues().slice(2).map((v) => (v as ExcelJS.CellValue[]).slice(1)));
    const motors = values('Motors');
    expect(motors.map((m) => m[0])).toEqual(['DC40-0001', 'DC40-0002', 'PM150-0001', 'PM150-0002', 'PM150-0003', 'PM150-0004']);
    expect(motors.find((m) => m[0] === 'PM150-0002')).toEqual(expect.arrayContaining(['PM-150', 'LOT-A', 'passed', 'no', 2]));
    const limits = values('Limits');
    expect(limits).toHaveLength(3 + 3 + 2); // PM-150 revisions 1 and 2 (3 limits each), DC-40 revision 1 (2 limits)
    expect(limits.find((l) => l[0] === 'PM-150' && l[1] === 1 && l[8] === 'bemf.ke')).toEqual(expect.arrayContaining(['PM-150', 1, 'approved', 'Quinn Author', 'Avery Approver', 'bemf.ke', 'V/krpm', 20, 25, 30]));
    const stations = values('Stations');
    expect(stations.map((s) => [s[0], s[7]])).toEqual([['EOL-1', 'CAL-EOL-1-1'], ['EOL-1', 'CAL-EOL-1-2'], ['EOL-2', 'CAL-EOL-2-1'], ['EOL-2', 'CAL-EOL-2-2']]);
    const holds = values('Holds');
    expect(holds.map((h) => [h[1], h[2], h[4]])).toEqual([['motor', 'PM150-0003', 'Noise at run-up; listen again']]);
    expect(controlCharacterReason).toContain('\u0007');
    expect(holds[0][9]).toBe(reasonInWorkbook);
    const audit = values('Audit extract');
    const expectedEvents = await server.db('audit_events')
      .where((q) => q.where({ entity_type: 'motor', entity_id: 'PM150-0003' }).orWhere({ entity_type: 'motor', entity_id: 'DC40-0002' })
        .orWhere({ entity_type: 'station', entity_id: 'EOL-1' }).orWhere({ entity_type: 'limit_set', entity_id: String(seeded.revisions.pmRev2.id) }))
      .orderBy('id').select('id', 'hash');
    expect(audit.map((a) => [a[0], a[10]]).sort()).toEqual(expectedEvents.map((e) => [Number(e.id), e.hash]).sort());
    expect(audit.find((a) => a[7] === '=cmd|calc')).toBeDefined();
  });

  it('when the Summary sheet is read, then it names who, when, the counts and the CSV hash', () => {
    const summary = Object.fromEntries(workbook.worksheets.filter((w) => w.name.startsWith('Summary'))
      .flatMap((w) => w.getSheetValues().slice(2).map((v) => [(v as ExcelJS.CellValue[])[1], (v as ExcelJS.CellValue[])[2]])));
    const manifest = JSON.parse(files.get('manifest.json')!.toString('utf8'));
    const csvEntry = manifest.files.find((f: { name: string }) => f.name.endsWith('.csv'));
    expect(summary).toMatchObject({
      'Evidence pack': status.id, 'Made by': 'Helen Marsh', Role: 'auditor', Lots: 'LOT-A, LOT-C', Motors: 6,
      'Motors passed': 5, 'Motors failed': 1, 'Test runs': runs.length, 'Runs failed': 2, 'CSV SHA-256': csvEntry.sha256,
    });
  });

  it('when LibreOffice opens the workbook headless, then it converts the first sheet to CSV', () => {
    const dir = mkdtempSync(join(tmpdir(), 'fluxtrail-lo-'));
    try {
      const xlsx = join(dir, 'pack.xlsx');
      writeFileSync(xlsx, files.get(`fluxtrail-pack-${status.id}-workbook.xlsx`)!);
      execFileSync('/usr/bin/libreoffice', ['--headless', `-env:UserInstallation=file://${join(dir, 'profile')}`,
        '--convert-to', 'csv:Text - txt - csv (StarCalc):44,34,76,1', '--outdir', dir, xlsx], { timeout: 60_000, stdio: 'pipe' });
      expect(readdirSync(dir)).toContain('pack.csv');
      const rows = parseCsv(readFileSync(join(dir, 'pack.csv'), 'utf8'));
      expect(rows[0]).toEqual(['Item', 'Value']);
      expect(rows[1]).toEqual(['Evidence pack', String(status.id)]);
      expect(rows[2]).toEqual(['Made by', 'Helen Marsh']);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);

  it('when LibreOffice converts every sheet, then each one reads back with the values exceljs sees', () => {
    const dir = mkdtempSync(join(tmpdir(), 'fluxtrail-lo-'));
    try {
      const xlsx = join(dir, 'pack.xlsx');
      writeFileSync(xlsx, files.get(`fluxtrail-pack-${status.id}-workbook.xlsx`)!);
      // Token 12 = -1: one CSV per sheet, named pack-<sheet>.csv (LibreOffice 7.2 and later).
      execFileSync('/usr/bin/libreoffice', ['--headless', `-env:UserInstallation=file://${join(dir, 'profile')}`,
        '--convert-to', 'csv:Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false,false,false,-1', '--outdir', dir, xlsx], { timeout: 60_000, stdio: 'pipe' });
      const sheetFile = (name: string) => parseCsv(readFileSync(join(dir, `pack-${name}.csv`), 'utf8'));
      for (const sheet of workbook.worksheets) {
        const fromLibreOffice = sheetFile(sheet.name);
        expect(fromLibreOffice[0], sheet.name).toEqual((sheet.getRow(1).values as ExcelJS.CellValue[]).slice(1).map(String));
        expect(fromLibreOffice.length, sheet.name).toBe(sheet.rowCount);
      }
      const results = sheetFile('Results PM-150');
      const first = workbook.getWorksheet('Results PM-150')!.getRow(2);
      expect(results[1].slice(0, 3)).toEqual([first.getCell(1).value, first.getCell(2).value, String(first.getCell(3).value)]);
      expect(workbook.worksheets.filter((w) => w.name.startsWith('Audit extract')).flatMap((w) => sheetFile(w.name).map((r) => r[7]))).toContain('=cmd|calc');
      expect(sheetFile('Holds')[1][9]).toBe(reasonInWorkbook);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 90_000);
});

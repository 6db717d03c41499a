// Reading a downloaded pack back in the tests: unzip (yauzl), parse the CSV, hash bytes.
import yauzl from 'yauzl';
import { createHash } from 'node:crypto';

export const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

/** Every entry of a zip held in memory, by name. */
export function unzip(zip: Buffer): Promise<Map<string, Buffer>> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(zip, { lazyEntries: true }, (error, file) => {
      if (error || !file) return reject(error ?? new Error('no zip'));
      const entries = new Map<string, Buffer>();
      file.on('entry', (entry: yauzl.Entry) => {
        file.openReadStream(entry, (streamError, stream) => {
          if (streamError || !stream) return reject(streamError ?? new Error('no stream'));
          const chunks: Buffer[] = [];
          stream.on('data', (chunk: Buffer) => chunks.push(chunk));
          stream.on('end', () => { entries.set(entry.fileName, Buffer.concat(chunks)); file.readEntry(); });
        });
      });
      file.on('end', () => resolve(entries));
      file.on('error', reject);
      file.readEntry();
    });
  });
}

/** RFC 4180 fields: quoted fields may hold commas, doubled quotes and line breaks. */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') { field += '"'; i++; }
      else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ',') { row.push(field); field = ''; }
    else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      row.push(field); rows.push(row); row = []; field = '';
    } else field += ch;
  }
  if (field !== '' || row.length > 0) { row.push(field); rows.push(row); }
  return rows;
}

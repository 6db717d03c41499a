// U+202F (narrow no-break space) between value and unit keeps "12.4 MΩ" on one line.
const unitGap = '\u202f';

type NumberFormat = {
  /** Fixed number of decimals; omit to show up to `maxDigits`. */
  digits?: number;
  maxDigits?: number;
  unit?: string;
};

const placeholder = '—';

export function formatNumber(value: number | null | undefined, { digits, maxDigits = 3, unit }: NumberFormat = {}): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return placeholder;
  const text = value.toLocaleString('en-US', {
    minimumFractionDigits: digits ?? 0,
    maximumFractionDigits: digits ?? maxDigits,
    useGrouping: Math.abs(value) >= 10_000,
  });
  return unit ? `${text}${unitGap}${unit}` : text;
}

/** A ratio 0…1 as a percentage, e.g. 0.9734 → "97.3 %". */
export function formatPercent(ratio: number | null | undefined, digits = 1): string {
  if (ratio === null || ratio === undefined || !Number.isFinite(ratio)) return placeholder;
  return formatNumber(ratio * 100, { digits, unit: '%' });
}

export function formatCount(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return placeholder;
  return Math.round(value).toLocaleString('en-US');
}

const pad = (part: number) => String(part).padStart(2, '0');

function toDate(value: string | number | Date): Date | undefined {
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? undefined : date;
}

/** Local calendar date, year first so it sorts and reads the same on every site: "2026-12-01". */
export function formatDate(value: string | number | Date | null | undefined): string {
  const date = value === null || value === undefined ? undefined : toDate(value);
  if (!date) return placeholder;
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** Local date and time to the second: "2026-12-01 14:03:22". */
export function formatDateTime(value: string | number | Date | null | undefined): string {
  const date = value === null || value === undefined ? undefined : toDate(value);
  if (!date) return placeholder;
  return `${formatDate(date)} ${pad(date.getHours())}:${pad(date.getMinutes())}:${pad(date.getSeconds())}`;
}

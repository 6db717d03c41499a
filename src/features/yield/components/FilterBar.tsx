import type { BoardFilterKey } from '../hooks/use-yield-board-params';

type FilterBarProps = {
  values: Record<BoardFilterKey, string>;
  /** The range the server used, shown when the URL leaves the dates open. */
  range: { from: string; to: string } | null;
  products: string[];
  lines: string[];
  onChange: (changes: Partial<Record<BoardFilterKey, string>>) => void;
};

const fieldClass = 'h-9 rounded-md border border-graphite-300 bg-white px-2 text-sm text-graphite-900';

/** Date range and product/line filters; every value lives in the URL so a view can be shared. */
export function FilterBar({ values, range, products, lines, onChange }: FilterBarProps) {
  return (
    <form className="mb-4 flex flex-wrap items-end gap-3" onSubmit={(e) => e.preventDefault()} aria-label="Yield board filters">
      <label className="flex flex-col text-xs text-graphite-600">
        From (production day)
        <input type="date" className={fieldClass} value={values.from || range?.from || ''} max={values.to || range?.to} onChange={(e) => onChange({ from: e.target.value })} />
      </label>
      <label className="flex flex-col text-xs text-graphite-600">
        To
        <input type="date" className={fieldClass} value={values.to || range?.to || ''} min={values.from || range?.from} onChange={(e) => onChange({ to: e.target.value })} />
      </label>
      <label className="flex flex-col text-xs text-graphite-600">
        Product
        <select className={fieldClass} value={values.product} onChange={(e) => onChange({ product: e.target.value })}>
          <option value="">All products</option>
          {withCurrent(products, values.product).map((code) => <option key={code} value={code}>{code}</option>)}
        </select>
      </label>
      <label className="flex flex-col text-xs text-graphite-600">
        Line
        <select className={fieldClass} value={values.line} onChange={(e) => onChange({ line: e.target.value })}>
          <option value="">All lines</option>
          {withCurrent(lines, values.line).map((line) => <option key={line} value={line}>{line}</option>)}
        </select>
      </label>
      {Object.values(values).some(Boolean)
        ? <button type="button" className="h-9 px-2 text-sm text-graphite-600 hover:underline" onClick={() => onChange({ from: '', to: '', product: '', line: '' })}>Last 30 days, everything</button>
        : null}
    </form>
  );
}

// A shared link may name a product with no motors in the range; keep it selectable.
function withCurrent(options: string[], current: string): string[] {
  return current && !options.includes(current) ? [current, ...options] : options;
}

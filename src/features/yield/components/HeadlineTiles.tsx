import { formatCount, formatPercent } from '../../../lib/format';
import type { YieldHeadline } from '../api/get-yield-headline';
import type { YieldGroup } from '../api/yield-schemas';
import { definitions } from './definitions';

type TileProps = { label: string; value: string; definition: string; tone?: 'below' | 'plain' };

function Tile({ label, value, definition, tone = 'plain' }: TileProps) {
  return (
    <div className="rounded-md border border-paper-300 bg-paper-50 px-3 py-2" title={definition}>
      <p className="text-xs text-graphite-500">{label}</p>
      <p className={`figures text-2xl font-semibold ${tone === 'below' ? 'text-fail-ink' : 'text-graphite-950'}`}>
        {value}
        {tone === 'below' ? <span className="ml-1 align-middle text-xs font-normal" aria-label="below target">▼ below target</span> : null}
      </p>
    </div>
  );
}

function PeriodTiles({ heading, period, target }: { heading: string; period: YieldGroup; target: number }) {
  const below = period.firstPassYield !== null && period.firstPassYield < target;
  return (
    <div className="min-w-0 flex-1">
      <h2 className="mb-1 text-xs font-semibold uppercase tracking-wide text-graphite-600">{heading}</h2>
      <div className="grid grid-cols-3 gap-2">
        <Tile label="First-pass yield" value={formatPercent(period.firstPassYield)} definition={definitions.firstPassYield} tone={below ? 'below' : 'plain'} />
        <Tile label="Final yield" value={formatPercent(period.finalYield)} definition={definitions.finalYield} />
        <Tile label="Motors tested" value={formatCount(period.tested)} definition={definitions.tested} />
      </div>
    </div>
  );
}

/** Today and this week at a glance, with what is stopped right now. */
export function HeadlineTiles({ headline }: { headline: YieldHeadline }) {
  return (
    <div className="mb-4 flex flex-wrap gap-4" data-testid="yield-headline">
      <PeriodTiles heading={`Today · ${headline.today.key}`} period={headline.today} target={headline.firstPassTarget} />
      <PeriodTiles heading={`This week · ${headline.week.key}`} period={headline.week} target={headline.firstPassTarget} />
      <div className="min-w-0">
        <h2 className="mb-1 text-xs font-semibold uppercase tracking-wide text-graphite-600">Now</h2>
        <div className="grid grid-cols-2 gap-2">
          <Tile label="Motors on hold" value={formatCount(headline.motorsOnHold)} definition={definitions.onHold} />
          <Tile label="Open signals" value={headline.openSignals === null ? '—' : formatCount(headline.openSignals)} definition={definitions.openSignals} />
        </div>
      </div>
    </div>
  );
}

import { formatNumber } from '../../../lib/format';
import type { Measurement } from '../api/motor-schemas';
import type { BackEmfSummary } from '../api/raw-data-schemas';
import { PanelHeading, RawDataFigure, resultFor } from './RawDataFigure';

type ResolverOffsetPanelProps = { resolver: NonNullable<BackEmfSummary['resolver']>; results: readonly Measurement[] };

/** The resolver offset with its limit and, because the number depends on it, the convention in words. */
export function ResolverOffsetPanel({ resolver, results }: ResolverOffsetPanelProps) {
  return (
    <section aria-label="Resolver offset" className="space-y-2">
      <PanelHeading>Resolver offset</PanelHeading>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 text-sm md:grid-cols-4">
        <RawDataFigure label="Offset" result={resultFor(results, 'resolver_offset')}>
          {formatNumber(resolver.offsetDeg, { digits: 2, unit: '° el' })}
        </RawDataFigure>
        <RawDataFigure label="Spread over the record">{formatNumber(resolver.spreadDeg, { digits: 2, unit: '° el' })}</RawDataFigure>
        <RawDataFigure label="Resolver pole pairs">{resolver.resolverPolePairs}</RawDataFigure>
      </dl>
      <p className="max-w-3xl text-xs text-graphite-600">
        θ = 0 where the U-phase line-to-neutral back-EMF crosses zero going positive, so u_uv leads it by 30°;
        offset = resolver angle (in motor electrical degrees) − θ, wrapped to (−180°, 180°].
      </p>
    </section>
  );
}

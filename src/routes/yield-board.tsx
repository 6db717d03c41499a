import { ErrorNote } from '../components/ErrorNote';
import { PageHeader } from '../components/PageHeader';
import { LoadingScreen } from '../components/Spinner';
import { useYield } from '../features/yield/api/get-yield';
import { useYieldHeadline } from '../features/yield/api/get-yield-headline';
import { DailyTrend } from '../features/yield/components/DailyTrend';
import { definitions } from '../features/yield/components/definitions';
import { DrillList } from '../features/yield/components/DrillList';
import { FilterBar } from '../features/yield/components/FilterBar';
import { GroupYieldChart } from '../features/yield/components/GroupYieldChart';
import { HeadlineTiles } from '../features/yield/components/HeadlineTiles';
import { ParetoPanel } from '../features/yield/components/ParetoPanel';
import { useYieldBoardParams } from '../features/yield/hooks/use-yield-board-params';

export default function YieldBoardRoute() {
  const { values, filter, drill, update, openDrill } = useYieldBoardParams();
  const headline = useYieldHeadline({ product: filter.product, line: filter.line });
  const days = useYield(filter, 'day');
  const lines = useYield(filter, 'line');
  const stations = useYield(filter, 'station');
  const productOptions = useYield({ from: filter.from, to: filter.to }, 'product');
  const lineOptions = useYield({ from: filter.from, to: filter.to, product: filter.product }, 'line');
  const target = headline.data?.firstPassTarget ?? 0.95;
  const failed = [headline, days, lines, stations].find((q) => q.isError);

  return (
    <section>
      <PageHeader
        title="Yield board"
        description={
          <>
            Each motor counts once, on the day, shift, line and station of its <span title={definitions.firstPassYield} className="cursor-help underline decoration-dotted">first test</span>.
            {headline.data ? <> Plant time: <span className="figures">{headline.data.timeZone}</span>.</> : null}
          </>
        }
      />
      <FilterBar
        values={values}
        range={days.data ? { from: days.data.from, to: days.data.to } : null}
        products={productOptions.data?.groups.map((g) => g.key) ?? []}
        lines={lineOptions.data?.groups.map((g) => g.key) ?? []}
        onChange={update}
      />
      {failed ? <ErrorNote error={failed.error} title="Could not load the yield board" /> : null}
      {headline.data ? <HeadlineTiles headline={headline.data} /> : null}
      {days.isPending ? <LoadingScreen label="Counting motors…" /> : null}
      {drill ? <div className="mb-4"><DrillList filter={filter} drill={drill} onClose={() => openDrill(null)} /></div> : null}
      {days.data ? (
        <div className="grid gap-4">
          <DailyTrend days={days.data.groups} target={target} onPick={(key) => openDrill({ groupBy: 'day', key })} />
          <div className="grid gap-4 lg:grid-cols-2">
            <GroupYieldChart title="Yield by line" groups={lines.data?.groups ?? []} target={target} onPick={(key) => openDrill({ groupBy: 'line', key })} />
            <GroupYieldChart title="Yield by station" groups={stations.data?.groups ?? []} target={target} onPick={(key) => openDrill({ groupBy: 'station', key })} />
          </div>
          <ParetoPanel
            entries={days.data.pareto}
            selected={drill && 'characteristic' in drill ? drill.characteristic : null}
            onPick={(characteristic) => openDrill({ characteristic })}
          />
        </div>
      ) : null}
    </section>
  );
}

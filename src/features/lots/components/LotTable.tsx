import { Link, useNavigate } from 'react-router-dom';
import { StatusShape } from '../../../components/StatusShape';
import { formatDate } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import type { LotListItem } from '../api/get-lots';
import { LotCountsSummary } from './LotCountsSummary';

/** Lots newest first with their motor counts; a lot with an active hold says so in words. */
export function LotTable({ lots }: { lots: LotListItem[] }) {
  const navigate = useNavigate();
  return (
    <div className="overflow-x-auto rounded-lg border border-paper-300 bg-white">
      <table aria-label="Lots" className="w-full text-sm">
        <thead className="bg-paper-200 text-left text-xs uppercase tracking-wider text-graphite-600">
          <tr>
            <th scope="col" className="px-4 py-2 font-medium">Lot</th>
            <th scope="col" className="px-4 py-2 font-medium">Product</th>
            <th scope="col" className="px-4 py-2 font-medium">Created</th>
            <th scope="col" className="px-4 py-2 font-medium">Motors</th>
            <th scope="col" className="px-4 py-2 font-medium">Hold</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-paper-200">
          {lots.map((lot) => (
            <tr key={lot.code} onClick={() => navigate(paths.lot.href(lot.code))} className="cursor-pointer hover:bg-copper-50">
              <td className="px-4 py-2">
                <Link to={paths.lot.href(lot.code)} className="figures font-medium text-copper-700 hover:underline">
                  {lot.code}
                </Link>
              </td>
              <td className="figures px-4 py-2">{lot.product}</td>
              <td className="figures px-4 py-2 text-graphite-600">{formatDate(lot.createdAt)}</td>
              <td className="px-4 py-2">
                <LotCountsSummary counts={lot.counts} />
              </td>
              <td className="px-4 py-2">
                {lot.activeHolds > 0 ? (
                  <span className="inline-flex items-center gap-1.5 font-semibold text-hold-ink">
                    <StatusShape kind="hold" className="h-3 w-3 text-hold" />
                    Lot held{lot.activeHolds > 1 ? ` (${lot.activeHolds})` : ''}
                  </span>
                ) : (
                  <span className="text-graphite-400">—</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

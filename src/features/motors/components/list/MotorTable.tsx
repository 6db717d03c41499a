import { flexRender, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useNavigate } from 'react-router-dom';
import { paths } from '../../../../lib/paths';
import type { MotorListItem, MotorSortKey, SortOrder } from '../../api/get-motors';
import { motorColumns } from './motor-columns';

type MotorTableProps = {
  rows: MotorListItem[];
  sort: MotorSortKey;
  order: SortOrder;
  onSortChange: (sort: MotorSortKey, order: SortOrder) => void;
  loading: boolean;
};

const sortMark = { asc: ' ▲', desc: ' ▼' } as const;

/** One page of motors. Paging and sorting happen on the server; this table only shows what it was sent. */
export function MotorTable({ rows, sort, order, onSortChange, loading }: MotorTableProps) {
  const navigate = useNavigate();
  const sorting: SortingState = [{ id: sort, desc: order === 'desc' }];
  const table = useReactTable({
    data: rows,
    columns: motorColumns,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
    manualSorting: true,
    enableSortingRemoval: false,
    state: { sorting },
    onSortingChange: (updater) => {
      const [next] = typeof updater === 'function' ? updater(sorting) : updater;
      if (next) onSortChange(next.id === 'serial' ? 'serial' : 'lastTestedAt', next.desc ? 'desc' : 'asc');
    },
  });

  return (
    <div className="overflow-x-auto rounded-lg border border-paper-300 bg-white">
      <table aria-label="Motors" aria-busy={loading} className={`w-full text-sm ${loading ? 'opacity-60' : ''}`}>
        <thead className="bg-paper-200 text-left text-xs uppercase tracking-wider text-graphite-600">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    className="px-4 py-2 font-medium"
                  >
                    {header.column.getCanSort() ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="uppercase tracking-wider hover:text-graphite-950">
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        {sorted ? sortMark[sorted] : ''}
                      </button>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody className="divide-y divide-paper-200">
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              onClick={() => navigate(paths.motorRecord.href(row.original.serial))}
              className="cursor-pointer hover:bg-copper-50"
            >
              {row.getVisibleCells().map((cell) => (
                <td key={cell.id} className="px-4 py-2">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

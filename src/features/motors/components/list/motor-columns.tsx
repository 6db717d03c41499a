import { createColumnHelper } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { MotorStatusBadge } from '../../../../components/MotorStatusBadge';
import { formatDateTime } from '../../../../lib/format';
import { paths } from '../../../../lib/paths';
import type { MotorListItem } from '../../api/get-motors';

const column = createColumnHelper<MotorListItem>();

/** Only serial and last-tested sort: the server keeps keyset indexes for exactly those two. */
export const motorColumns = [
  column.accessor('serial', {
    header: 'Serial',
    enableSorting: true,
    cell: (info) => (
      <Link to={paths.motorRecord.href(info.getValue())} className="figures font-medium text-copper-700 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('product', { header: 'Product', enableSorting: false, cell: (info) => <span className="figures">{info.getValue()}</span> }),
  column.accessor('lot', { header: 'Lot', enableSorting: false, cell: (info) => <span className="figures">{info.getValue()}</span> }),
  column.accessor('status', {
    header: 'Status',
    enableSorting: false,
    cell: (info) => <MotorStatusBadge status={info.getValue()} />,
  }),
  column.accessor('lastTestedAt', {
    header: 'Last tested',
    enableSorting: true,
    cell: (info) => <span className="figures text-graphite-700">{formatDateTime(info.getValue())}</span>,
  }),
];

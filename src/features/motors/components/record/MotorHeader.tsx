import { Link } from 'react-router-dom';
import { MotorStatusBadge } from '../../../../components/MotorStatusBadge';
import { paths } from '../../../../lib/paths';
import type { MotorRecord } from '../../api/motor-schemas';

/** Who the motor is: serial, product, lot with its component lots, and its status now. */
export function MotorHeader({ record }: { record: MotorRecord }) {
  return (
    <header className="mb-6 border-b border-paper-300 pb-4">
      <p className="text-xs font-medium uppercase tracking-wider text-graphite-500">Motor record</p>
      <div className="mt-1 flex flex-wrap items-center gap-4">
        <h1 className="figures text-3xl font-semibold text-graphite-950">{record.serial}</h1>
        <MotorStatusBadge status={record.status} size="md" />
      </div>
      <dl className="mt-3 flex flex-wrap gap-x-8 gap-y-2 text-sm">
        <div>
          <dt className="text-xs uppercase tracking-wider text-graphite-500">Product</dt>
          <dd>
            {record.product.name} <span className="figures text-graphite-500">{record.product.code}</span>{' '}
            <span className="text-graphite-500">· {record.product.motorKind}</span>
          </dd>
        </div>
        <div>
          <dt className="text-xs uppercase tracking-wider text-graphite-500">Lot</dt>
          <dd>
            <Link to={paths.lot.href(record.lot.code)} className="figures text-copper-700 hover:underline">
              {record.lot.code}
            </Link>
          </dd>
        </div>
        <div>
          <dt className="text-xs uppercase tracking-wider text-graphite-500">Component lots</dt>
          <dd>
            {record.lot.components.length === 0 ? (
              '—'
            ) : (
              <ul className="flex flex-wrap gap-x-4">
                {record.lot.components.map((component) => (
                  <li key={`${component.kind}:${component.supplierLotCode}`}>
                    <span className="text-graphite-500">{component.kind}</span>{' '}
                    <span className="figures">{component.supplierLotCode}</span>
                  </li>
                ))}
              </ul>
            )}
          </dd>
        </div>
      </dl>
    </header>
  );
}

import { useState } from 'react';
import { Button } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import type { Characteristic } from '../api/setup-schemas';
import { CharacteristicForm } from './CharacteristicForm';
import { HighVoltageNote } from './HighVoltageNote';

type CharacteristicsTableProps = { productCode: string; characteristics: Characteristic[]; canManage: boolean };

/** The product's characteristics in test order; one row at a time opens for editing. */
export function CharacteristicsTable({ productCode, characteristics, canManage }: CharacteristicsTableProps) {
  const [editing, setEditing] = useState<string | 'new' | null>(null);
  const close = () => setEditing(null);
  return (
    <div className="space-y-3">
      <HighVoltageNote characteristics={characteristics} />
      {characteristics.length === 0 ? (
        <EmptyState title="No characteristics yet">Add what the end-of-line stand measures for this product.</EmptyState>
      ) : (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Characteristics of {productCode}</caption>
          <thead className="border-b border-paper-300 text-xs uppercase tracking-wide text-graphite-500">
            <tr><th className="py-2">Code</th><th>Name</th><th>Unit</th><th>Test step</th><th>SPC</th><th>Subgroups</th><th><span className="sr-only">Actions</span></th></tr>
          </thead>
          <tbody>
            {characteristics.map((c) => editing === c.code ? (
              <tr key={c.code}><td colSpan={7} className="py-2"><CharacteristicForm productCode={productCode} characteristic={c} onDone={close} /></td></tr>
            ) : (
              <tr key={c.code} className="border-b border-paper-200">
                <td className="figures py-2">{c.code}</td>
                <td>{c.name}{c.derived ? <span className="ml-2 text-xs text-graphite-500">(computed)</span> : null}</td>
                <td>{c.unit}</td>
                <td>{c.testStep}</td>
                <td>{c.spcEnabled ? 'on' : 'off'}</td>
                <td>{c.subgroupMode}{c.subgroupSize ? ` of ${c.subgroupSize}` : ''}</td>
                <td className="text-right">
                  {canManage ? <Button size="sm" variant="quiet" aria-label={`Edit ${c.code}`} onClick={() => setEditing(c.code)}>Edit</Button> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canManage && editing === 'new' ? <CharacteristicForm productCode={productCode} onDone={close} /> : null}
      {canManage && editing !== 'new' ? <Button size="sm" variant="secondary" onClick={() => setEditing('new')}>Add a characteristic</Button> : null}
    </div>
  );
}

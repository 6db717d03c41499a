import { useState } from 'react';
import { PageHeader } from '../components/PageHeader';
import { useCan } from '../features/auth/use-can';
import type { PackFilter } from '../features/evidence/api/pack-schemas';
import { ComponentLotTrace } from '../features/evidence/components/ComponentLotTrace';
import { PackForm } from '../features/evidence/components/PackForm';
import { PackList } from '../features/evidence/components/PackList';

export default function EvidencePacksRoute() {
  const canCreate = useCan('evidence:create');
  const [draft, setDraft] = useState<{ filter: PackFilter; n: number } | undefined>();
  return (
    <div className="grid gap-6">
      <PageHeader title="Evidence packs" description="A zip of the workbook, a long-format CSV and a manifest with SHA-256 hashes, built in the background." />
      {canCreate ? <PackForm key={draft?.n ?? 0} draft={draft?.filter} /> : null}
      <ComponentLotTrace onBuildPack={canCreate ? (filter) => setDraft((d) => ({ filter, n: (d?.n ?? 0) + 1 })) : undefined} />
      <section aria-labelledby="pack-list-title">
        <h2 id="pack-list-title" className="mb-2 text-base font-semibold text-graphite-900">Packs</h2>
        <PackList canCreate={canCreate} />
      </section>
    </div>
  );
}

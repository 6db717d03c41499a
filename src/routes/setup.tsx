import { useSearchParams } from 'react-router-dom';
import { PageHeader } from '../components/PageHeader';
import { LimitRevisionsSection } from '../features/setup/components/LimitRevisionsSection';
import { ProductsSection } from '../features/setup/components/ProductsSection';
import { SetupTabs, setupSections, type SetupSectionId } from '../features/setup/components/SetupTabs';
import { StationClientsSection } from '../features/setup/components/StationClientsSection';
import { StationsSection } from '../features/setup/components/StationsSection';
import { ResultUploadsSection } from '../features/uploads/components/ResultUploadsSection';
import { ShiftCalendarSection } from '../features/setup/components/ShiftCalendarSection';
import { useCan } from '../features/auth/use-can';

const isSection = (value: string | null): value is SetupSectionId => setupSections.some((s) => s.id === value);

/** Setup: products, limit revisions, stations and their clients. Section and product live in the URL. */
export default function SetupRoute() {
  const [params, setParams] = useSearchParams();
  const raw = params.get('section');
  const section: SetupSectionId = isSection(raw) ? raw : 'products';
  const productCode = params.get('product') ?? undefined;
  const update = (changes: Record<string, string>) =>
    setParams((current) => {
      const next = new URLSearchParams(current);
      for (const [key, value] of Object.entries(changes)) next.set(key, value);
      return next;
    });
  const selectProduct = (code: string) => update({ product: code });
  const canEditShifts = useCan('stations:manage');

  return (
    <section>
      <PageHeader title="Setup" description="Products and their characteristics, limit revisions with two-person approval, stations and their calibration." />
      <SetupTabs current={section} onChange={(id) => update({ section: id })} />
      <div role="tabpanel" id={`setup-panel-${section}`} aria-labelledby={`setup-tab-${section}`}>
        {section === 'products' ? <ProductsSection productCode={productCode} onSelectProduct={selectProduct} /> : null}
        {section === 'limits' ? <LimitRevisionsSection productCode={productCode} onSelectProduct={selectProduct} /> : null}
        {section === 'stations' ? <StationsSection /> : null}
        {section === 'clients' ? <StationClientsSection /> : null}
        {section === 'uploads' ? <ResultUploadsSection /> : null}
        {section === 'shifts' ? <ShiftCalendarSection canEdit={canEditShifts} /> : null}
      </div>
    </section>
  );
}

import type { KeyboardEvent } from 'react';

export const setupSections = [
  { id: 'products', label: 'Products & characteristics' },
  { id: 'limits', label: 'Limit revisions' },
  { id: 'stations', label: 'Stations & calibration' },
  { id: 'clients', label: 'Station clients' },
  { id: 'uploads', label: 'Result uploads' },
  { id: 'shifts', label: 'Shift calendar' },
] as const;
export type SetupSectionId = (typeof setupSections)[number]['id'];

type SetupTabsProps = { current: SetupSectionId; onChange: (id: SetupSectionId) => void };

/** A tab list with arrow-key movement, as screen-reader users expect from role="tab". */
export function SetupTabs({ current, onChange }: SetupTabsProps) {
  const move = (event: KeyboardEvent, index: number) => {
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (step === 0) return;
    const next = setupSections[(index + step + setupSections.length) % setupSections.length];
    onChange(next.id);
    document.getElementById(`setup-tab-${next.id}`)?.focus();
  };
  return (
    <div role="tablist" aria-label="Setup sections" className="mb-4 flex flex-wrap gap-1 border-b border-paper-300">
      {setupSections.map((section, index) => {
        const selected = section.id === current;
        return (
          <button key={section.id} id={`setup-tab-${section.id}`} type="button" role="tab" aria-selected={selected}
            aria-controls={`setup-panel-${section.id}`} tabIndex={selected ? 0 : -1}
            onClick={() => onChange(section.id)} onKeyDown={(event) => move(event, index)}
            className={`-mb-px border-b-2 px-4 py-2 text-sm font-medium ${selected ? 'border-copper-600 text-graphite-950' : 'border-transparent text-graphite-500 hover:text-graphite-800'}`}>
            {section.label}
          </button>
        );
      })}
    </div>
  );
}

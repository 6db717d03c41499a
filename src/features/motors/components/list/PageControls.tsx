import { Button } from '../../../../components/Button';

type PageControlsProps = {
  pageNumber: number;
  canGoBack: boolean;
  onFirstPage: boolean;
  nextCursor: string | null | undefined;
  onPrevious: () => void;
  onNext: (cursor: string) => void;
  onFirst: () => void;
};

/** Keyset paging moves one page at a time: there is no total and no "jump to page 4,000". */
export function PageControls({ pageNumber, canGoBack, onFirstPage, nextCursor, onPrevious, onNext, onFirst }: PageControlsProps) {
  return (
    <nav aria-label="Pages" className="mt-3 flex items-center justify-end gap-2">
      {onFirstPage || canGoBack ? (
        <span className="mr-2 text-sm text-graphite-500">
          Page <span className="figures">{pageNumber}</span>
        </span>
      ) : (
        <Button variant="secondary" onClick={onFirst}>
          First page
        </Button>
      )}
      <Button variant="secondary" disabled={!canGoBack} onClick={onPrevious}>
        Previous
      </Button>
      <Button variant="secondary" disabled={!nextCursor} onClick={() => nextCursor && onNext(nextCursor)}>
        Next
      </Button>
    </nav>
  );
}

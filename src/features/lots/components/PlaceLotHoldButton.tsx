import { useState } from 'react';
import { Button } from '../../../components/Button';
import { usePlaceLotHold } from '../api/place-lot-hold';
import { ReasonDialog } from './ReasonDialog';

/** Holds the whole lot: none of its motors may ship until the hold is released. */
export function PlaceLotHoldButton({ lotCode }: { lotCode: string }) {
  const [open, setOpen] = useState(false);
  const place = usePlaceLotHold();
  const close = () => {
    setOpen(false);
    place.reset();
  };

  return (
    <>
      <Button variant="danger" onClick={() => setOpen(true)}>
        Hold this lot
      </Button>
      <ReasonDialog
        open={open}
        title={`Hold lot ${lotCode}`}
        hint="What was found, so the people who release the hold know what to check."
        submitLabel="Place hold"
        pending={place.isPending}
        error={place.error}
        onSubmit={(reason) => place.mutate({ code: lotCode, reason }, { onSuccess: close })}
        onClose={close}
      />
    </>
  );
}

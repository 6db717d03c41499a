import { useEffect, useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../../components/Button';

type SerialScanFieldProps = {
  onScan: (serial: string) => void;
  /** Changes after every answer, so the field takes focus back for the next scan. */
  answerKey: string;
  busy: boolean;
};

const isTypingTarget = (element: Element | null) =>
  element instanceof HTMLInputElement || element instanceof HTMLTextAreaElement || element instanceof HTMLSelectElement;

/**
 * The serial field keeps the focus, because a keyboard-wedge scanner types wherever the focus is:
 * it takes focus on load, after each answer, when the window comes back, and when a key is typed
 * while a button (not another field or a dialog) has the focus.
 */
export function SerialScanField({ onScan, answerKey, busy }: SerialScanFieldProps) {
  const inputRef = useRef<HTMLInputElement>(null);
  const [serial, setSerial] = useState('');

  useEffect(() => {
    inputRef.current?.focus();
  }, [answerKey]);

  useEffect(() => {
    const refocus = () => inputRef.current?.focus();
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.ctrlKey || event.metaKey || event.altKey || event.key.length !== 1) return;
      if (isTypingTarget(document.activeElement) || document.querySelector('dialog[open]')) return;
      refocus();
    };
    window.addEventListener('focus', refocus);
    window.addEventListener('keydown', onKeyDown);
    return () => {
      window.removeEventListener('focus', refocus);
      window.removeEventListener('keydown', onKeyDown);
    };
  }, []);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const scanned = serial.trim();
    if (scanned) onScan(scanned);
    setSerial('');
    inputRef.current?.focus();
  };

  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3">
      <label className="min-w-0 flex-1">
        <span className="block text-lg font-medium text-graphite-700">Serial</span>
        <input
          ref={inputRef}
          value={serial}
          onChange={(event) => setSerial(event.target.value)}
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          enterKeyHint="search"
          placeholder="Scan or type a serial"
          className="figures mt-1 h-16 w-full rounded-md border-2 border-graphite-400 bg-white px-4 text-3xl text-graphite-950 placeholder:text-xl placeholder:text-graphite-300 focus:border-copper-500"
        />
      </label>
      <Button type="submit" size="glove" disabled={busy}>
        {busy ? 'Looking up…' : 'Look up'}
      </Button>
    </form>
  );
}

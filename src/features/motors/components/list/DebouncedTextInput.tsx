import { useEffect, useRef, useState, type InputHTMLAttributes } from 'react';

type DebouncedTextInputProps = Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'onChange'> & {
  value: string;
  onCommit: (value: string) => void;
  delayMs?: number;
};

/**
 * A text field that reports its value only after typing pauses, so a prefix filter over
 * a quarter of a million motors sends one request per pause instead of one per key.
 */
export function DebouncedTextInput({ value, onCommit, delayMs = 300, ...inputProps }: DebouncedTextInputProps) {
  const [draft, setDraft] = useState(value);
  const committed = useRef(value);
  const onCommitRef = useRef(onCommit);

  useEffect(() => {
    onCommitRef.current = onCommit;
  }, [onCommit]);

  // The URL changed from outside (Clear filters, Back): show the new value.
  useEffect(() => {
    if (value !== committed.current) {
      committed.current = value;
      setDraft(value);
    }
  }, [value]);

  useEffect(() => {
    if (draft === committed.current) return;
    const timer = setTimeout(() => {
      committed.current = draft;
      onCommitRef.current(draft);
    }, delayMs);
    return () => clearTimeout(timer);
  }, [draft, delayMs]);

  return <input {...inputProps} value={draft} onChange={(event) => setDraft(event.target.value)} />;
}

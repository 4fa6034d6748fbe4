import { useContext, useEffect, useId, useRef, useState } from 'react';
import { InvalidFieldsContext } from './invalid-fields';
import { TextField } from '@/features/ui/components/text-field';

type Props = {
  label: string;
  value: number | null | undefined;
  /** Checks a candidate value; returns the message to show beside the field, or null. */
  validate(value: number | null): string | null;
  /**
   * Called with every valid value, and with null when emptied or when the text is not a valid value (the
   * draft then holds nothing rather than the last valid prefix typed: "500" had kept 50); the invalid text
   * stays in the field with its error, and the capture step is told (InvalidFieldsContext).
   */
  onCommit(value: number | null): void;
  hint?: string;
  testID?: string;
  placeholder?: string;
};

function parse(raw: string): number | null {
  const t = raw.trim().replace(',', '.');
  if (t === '') return null;
  return /^-?\d+(\.\d+)?$/.test(t) ? Number(t) : Number.NaN;
}

/** A decimal input that writes to the draft only what is valid, and accepts a decimal comma. */
export function NumberField({ label, value, validate, onCommit, hint, testID, placeholder }: Props) {
  const [raw, setRaw] = useState(value == null ? '' : String(value));
  const [error, setError] = useState<string | null>(null);
  const report = useContext(InvalidFieldsContext);
  const id = useId();
  useEffect(() => {
    report?.(id, error ? label : null, testID);
  }, [report, id, error, label, testID]);
  useEffect(() => () => report?.(id, null), [report, id]);
  // A newer value from elsewhere (a merge with another phone's save) replaces the text; the value this
  // field wrote itself (null for text that is not kept) leaves the text as typed.
  const written = useRef<number | null>(value ?? null);
  useEffect(() => {
    if ((value ?? null) === written.current) return;
    written.current = value ?? null;
    setRaw((current) => (parse(current) === (value ?? null) ? current : value == null ? '' : String(value)));
  }, [value]);
  return (
    <TextField
      label={label}
      testID={testID}
      value={raw}
      hint={hint}
      placeholder={placeholder}
      inputMode="decimal"
      keyboardType="decimal-pad"
      error={error ?? undefined}
      onChangeText={(text) => {
        setRaw(text);
        const n = parse(text);
        const message = Number.isNaN(n) ? `${label} must be a number.` : validate(n);
        setError(message);
        written.current = message ? null : n;
        onCommit(written.current);
      }}
    />
  );
}

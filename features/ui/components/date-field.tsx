import { TextField } from './text-field';

export type DateFieldProps = {
  label: string;
  /** YYYY-MM-DD, or '' while empty. */
  value: string;
  onChange(value: string): void;
  onBlur?(): void;
  error?: string | false;
  hint?: string;
  testID?: string;
  min?: string;
  max?: string;
};

/** Native: typed as YYYY-MM-DD (no date picker module is installed). The web sibling opens the browser's picker. */
export function DateField({ label, value, onChange, onBlur, error, hint, testID }: DateFieldProps) {
  return (
    <TextField
      label={label}
      testID={testID}
      value={value}
      onChangeText={onChange}
      onBlur={onBlur}
      inputMode="numeric"
      hint={hint ?? 'Year-month-day, for example 2026-09-14.'}
      error={error}
    />
  );
}

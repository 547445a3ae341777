import { useState } from 'react';

import { TextField } from '@/components/ui/TextField';

/** Props of {@link NumberField}. */
export interface NumberFieldProps {
  label: string;
  /** Unit shown in the field, e.g. "m", "kg". */
  unit?: string;
  hint?: string;
  /** The error message from the form (zod), shown beside the field. */
  error?: string;
  value: number | undefined;
  /** Empty → undefined; not a number → NaN (the schema then reports it). */
  onChange: (value: number | undefined) => void;
  onBlur?: () => void;
}

/** People read "expected number, received NaN" badly: say it plainly. */
function plainError(message: string | undefined): string | undefined {
  if (!message) return undefined;
  if (/expected number, received (NaN|string)/i.test(message)) return 'Enter a number, e.g. 1.75.';
  if (/expected number, received undefined/i.test(message)) return 'Required.';
  return message;
}

/** A decimal number input that keeps what the person typed ("1." stays "1.") while reporting the parsed value. */
export function NumberField({ label, unit, hint, error, value, onChange, onBlur }: NumberFieldProps) {
  const [text, setText] = useState(value === undefined || Number.isNaN(value) ? '' : String(value));
  return (
    <TextField
      label={label}
      unit={unit}
      hint={hint}
      error={plainError(error)}
      value={text}
      inputMode="decimal"
      autoComplete="off"
      onChangeText={(t) => {
        setText(t);
        const trimmed = t.trim().replace(',', '.');
        onChange(trimmed === '' ? undefined : Number(trimmed));
      }}
      onBlur={onBlur}
    />
  );
}

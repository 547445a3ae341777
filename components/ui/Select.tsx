import { colors, fonts, layout, radii, spacing } from '@/components/theme';

import { FieldFrame } from './FieldFrame';

/** One choice of a {@link Select}. */
export interface SelectOption<V extends string> {
  value: V;
  label: string;
}

/** Props of {@link Select}. */
export interface SelectProps<V extends string> {
  /** Visible label and accessible name (`getByLabel(label)` finds the control). */
  label: string;
  options: readonly SelectOption<V>[];
  /** Selected value; `''` selects the placeholder. */
  value: V | '';
  onChange: (value: V | '') => void;
  /** Text of an empty first option (e.g. "Anyone"); omit to force a choice. */
  placeholder?: string;
  error?: string;
  hint?: string;
  disabled?: boolean;
}

/**
 * A drop-down for longer lists. The app targets the web only (app.json `platforms: ["web"]`), so this
 * renders the browser's own `<select>`: keyboard, screen reader and phone pickers come for free.
 * Add a `Select.native.tsx` sibling if a native target is ever added.
 */
export function Select<V extends string>({ label, options, value, onChange, placeholder, error, hint, disabled }: SelectProps<V>) {
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      <select
        aria-label={label}
        aria-invalid={!!error}
        disabled={disabled}
        value={value}
        onChange={(e) => onChange(e.target.value as V | '')}
        style={{
          minHeight: layout.touchTarget,
          borderRadius: radii.md,
          border: `1px solid ${error ? colors.danger : colors.border}`,
          backgroundColor: colors.raised,
          color: colors.text,
          fontFamily: fonts.regular,
          fontSize: 15,
          padding: `0 ${spacing.md}px`,
          colorScheme: 'dark',
        }}
      >
        {placeholder !== undefined ? <option value="">{placeholder}</option> : null}
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldFrame>
  );
}

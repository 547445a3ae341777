import { Text } from './Text';

/** Props of {@link FieldMessage}. */
export interface FieldMessageProps {
  /** The field's error; shown in red and announced. Wins over `hint`. */
  error?: string;
  /** Quiet help text shown when there is no error. */
  hint?: string;
}

/** The line under a form field: its error, else its hint, else nothing. */
export function FieldMessage({ error, hint }: FieldMessageProps) {
  if (error) {
    return (
      <Text variant="caption" tone="danger" role="alert">
        {error}
      </Text>
    );
  }
  if (hint) {
    return (
      <Text variant="caption" tone="muted">
        {hint}
      </Text>
    );
  }
  return null;
}

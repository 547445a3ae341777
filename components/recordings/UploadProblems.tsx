import { View } from 'react-native';

import { errorMessage } from '@/components/api/client';
import type { UploadOutcome } from '@/components/api/use-uploads';
import { Text } from '@/components/ui/Text';

/** Props of {@link UploadProblems}. */
export interface UploadProblemsProps {
  /** The upload request's failure (null when it did not fail). */
  error: unknown;
  /** What the server answered: a rejected file carries its row errors. */
  outcome: { ok: true } | Extract<UploadOutcome, { ok: false }> | undefined;
  /** How many row errors to list under the message. */
  maxRows: number;
}

/** Why a recording upload did not go in: the request failed, or the file was rejected, row by row. */
export function UploadProblems({ error, outcome, maxRows }: UploadProblemsProps) {
  return (
    <>
      {error ? <Text tone="danger" role="alert">{errorMessage(error)}</Text> : null}
      {outcome && !outcome.ok ? (
        <View role="alert">
          <Text tone="danger">{outcome.message}</Text>
          {outcome.result.upload.errors.slice(0, maxRows).map((e, i) => (
            <Text key={i} variant="caption" tone="danger">{`${e.row > 0 ? `row ${e.row}` : 'file'}${e.column ? `, ${e.column}` : ''}: ${e.reason}`}</Text>
          ))}
        </View>
      ) : null}
    </>
  );
}

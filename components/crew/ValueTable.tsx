import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { colors, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** One column of a {@link ValueTable}. */
export interface ValueColumn<R> {
  /** Header text, with the unit in brackets when it has one. */
  header: string;
  /** Cell content: a string renders as tabular text. */
  cell: (row: R) => ReactNode;
  /** Right-align (numbers); default false. */
  numeric?: boolean;
  /** Minimum width, px; default 90. */
  minWidth?: number;
}

/** Props of {@link ValueTable}. */
export interface ValueTableProps<R> {
  /** Accessible name of the table. */
  label: string;
  columns: readonly ValueColumn<R>[];
  rows: readonly R[];
  rowKey: (row: R) => string;
  /** Highlight a row: `changed` tints it (comparison), `danger` marks an error. */
  rowTone?: (row: R) => 'changed' | 'danger' | undefined;
}

/** A compact table with ARIA roles that scrolls sideways on a phone instead of squashing columns. */
export function ValueTable<R>({ label, columns, rows, rowKey, rowTone }: ValueTableProps<R>) {
  return (
    <ScrollView horizontal contentContainerStyle={styles.scroll}>
      <View role="table" aria-label={label} style={styles.table}>
        <View role="row" style={[styles.row, styles.head]}>
          {columns.map((c) => (
            <View key={c.header} role="columnheader" style={[styles.cell, { minWidth: c.minWidth ?? 90 }]}>
              <Text variant="overline" tone="muted" style={c.numeric && styles.right}>
                {c.header}
              </Text>
            </View>
          ))}
        </View>
        {rows.map((r) => {
          const tone = rowTone?.(r);
          return (
            <View key={rowKey(r)} role="row" style={[styles.row, tone === 'changed' && styles.changed, tone === 'danger' && styles.danger]}>
              {columns.map((c) => {
                const content = c.cell(r);
                return (
                  <View key={c.header} role="cell" style={[styles.cell, { minWidth: c.minWidth ?? 90 }]}>
                    {typeof content === 'string' ? (
                      <Text variant="numeric" style={c.numeric && styles.right}>
                        {content}
                      </Text>
                    ) : (
                      content
                    )}
                  </View>
                );
              })}
            </View>
          );
        })}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flexGrow: 1 },
  table: { flexGrow: 1, minWidth: '100%' },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border },
  head: { borderBottomColor: colors.borderStrong },
  changed: { backgroundColor: colors.accentTint },
  danger: { backgroundColor: colors.dangerTint },
  cell: { flex: 1, paddingVertical: spacing.sm, paddingHorizontal: spacing.sm, justifyContent: 'center' },
  right: { textAlign: 'right' },
});

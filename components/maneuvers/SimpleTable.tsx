import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';

import { colors, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** One column of a {@link SimpleTable}. */
export interface TableColumn<R> {
  /** Header text. */
  header: string;
  /** Cell content for a row (a string is rendered as numeric text). */
  cell: (row: R) => ReactNode;
  /** Right-align (numbers); default false. */
  numeric?: boolean;
  /** Minimum width in px; default 90. */
  minWidth?: number;
  /** Share of the spare width; default 1. */
  flex?: number;
}

/** Props of {@link SimpleTable}. */
export interface SimpleTableProps<R> {
  /** Accessible name of the table. */
  label: string;
  columns: readonly TableColumn<R>[];
  rows: readonly R[];
  rowKey: (row: R, index: number) => string;
  /** Highlight a row (e.g. over the limit). */
  rowTone?: (row: R) => 'danger' | undefined;
  testID?: string;
}

/**
 * A compact data table with ARIA table roles; scrolls sideways on a phone rather than squashing
 * columns.
 */
export function SimpleTable<R>({ label, columns, rows, rowKey, rowTone, testID }: SimpleTableProps<R>) {
  return (
    <ScrollView horizontal contentContainerStyle={styles.scroll} testID={testID}>
      <View role="table" aria-label={label} style={styles.table}>
        <View role="row" style={[styles.row, styles.headRow]}>
          {columns.map((c) => (
            <View key={c.header} role="columnheader" style={[styles.cell, { minWidth: c.minWidth ?? 90, flex: c.flex ?? 1 }]}>
              <Text variant="overline" tone="muted" style={c.numeric && styles.right}>
                {c.header}
              </Text>
            </View>
          ))}
        </View>
        {rows.map((r, i) => (
          <View key={rowKey(r, i)} role="row" style={[styles.row, rowTone?.(r) === 'danger' && styles.dangerRow]}>
            {columns.map((c) => {
              const content = c.cell(r);
              return (
                <View key={c.header} role="cell" style={[styles.cell, { minWidth: c.minWidth ?? 90, flex: c.flex ?? 1 }]}>
                  {typeof content === 'string' || typeof content === 'number' ? (
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
        ))}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flexGrow: 1 },
  table: { flexGrow: 1, minWidth: '100%' },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border },
  headRow: { borderBottomColor: colors.borderStrong },
  dangerRow: { backgroundColor: colors.dangerTint },
  cell: { paddingVertical: spacing.sm, paddingHorizontal: spacing.sm, justifyContent: 'center' },
  right: { textAlign: 'right' },
});

import { type ReactNode, useState } from 'react';
import { type NativeScrollEvent, type NativeSyntheticEvent, ScrollView, StyleSheet, View, type ViewStyle } from 'react-native';

import { colors, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

/** One column of a {@link DataTable}. */
export interface DataColumn<R> {
  /** Header text, with the unit in brackets when it has one. */
  header: string;
  /** Cell content: a string or number renders as tabular text. */
  cell: (row: R) => ReactNode;
  /** Right-align (numbers); default false. */
  numeric?: boolean;
  /** Minimum width, px; default 90. */
  minWidth?: number;
  /** Share of the spare width; default 1. */
  flex?: number;
}

/** Props of {@link DataTable}. */
export interface DataTableProps<R> {
  /** Accessible name of the table. */
  label: string;
  columns: readonly DataColumn<R>[];
  rows: readonly R[];
  rowKey: (row: R, index: number) => string;
  /** Highlight a row: `changed` tints it (comparisons), `danger` marks an error or a limit crossed. */
  rowTone?: (row: R) => 'changed' | 'danger' | undefined;
  /** Shown in place of the table when there are no rows (a sentence saying what that means). */
  empty?: ReactNode;
  testID?: string;
}

/**
 * A compact data table with ARIA table roles; scrolls sideways on a phone rather than squashing
 * columns, and then says so: a hint line above and a fade on the edge that has more columns.
 */
export function DataTable<R>({ label, columns, rows, rowKey, rowTone, empty, testID }: DataTableProps<R>) {
  const width = (c: DataColumn<R>) => ({ minWidth: c.minWidth ?? 90, flex: c.flex ?? 1 });
  const [box, setBox] = useState(0);
  const [content, setContent] = useState(0);
  const [offset, setOffset] = useState(0);
  const overflow = content - box > 2;
  const moreRight = overflow && offset < content - box - 2;
  const moreLeft = overflow && offset > 2;
  const onScroll = (e: NativeSyntheticEvent<NativeScrollEvent>) => setOffset(e.nativeEvent.contentOffset.x);
  if (rows.length === 0 && empty !== undefined) return <>{empty}</>;
  return (
    <View>
      {overflow ? (
        <Text variant="caption" tone="muted" style={styles.hint} testID={testID ? `${testID}-scroll-hint` : undefined}>
          {moreRight ? 'More columns → swipe or scroll sideways' : '← More columns on the left'}
        </Text>
      ) : null}
      <View>
    <ScrollView
      horizontal
      contentContainerStyle={styles.scroll}
      testID={testID}
      onLayout={(e) => setBox(e.nativeEvent.layout.width)}
      onContentSizeChange={(w) => setContent(w)}
      onScroll={onScroll}
      scrollEventThrottle={50}
    >
      <View role="table" aria-label={label} style={styles.table}>
        <View role="row" style={[styles.row, styles.head]}>
          {columns.map((c) => (
            <View key={c.header} role="columnheader" style={[styles.cell, width(c)]}>
              <Text variant="overline" tone="muted" style={c.numeric && styles.right}>
                {c.header}
              </Text>
            </View>
          ))}
        </View>
        {rows.map((r, i) => {
          const tone = rowTone?.(r);
          return (
            <View key={rowKey(r, i)} role="row" style={[styles.row, tone === 'changed' && styles.changed, tone === 'danger' && styles.danger]}>
              {columns.map((c) => {
                const content = c.cell(r);
                return (
                  <View key={c.header} role="cell" style={[styles.cell, width(c)]}>
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
          );
        })}
      </View>
    </ScrollView>
        {moreRight ? <View pointerEvents="none" style={[styles.fade, styles.fadeRight]} /> : null}
        {moreLeft ? <View pointerEvents="none" style={[styles.fade, styles.fadeLeft]} /> : null}
      </View>
    </View>
  );
}

/** react-native-web takes a CSS background image on a View; the native types do not list it. */
function webGradient(direction: string): ViewStyle {
  return { backgroundImage: `linear-gradient(${direction}, rgba(21, 34, 50, 0), ${colors.surface})` } as ViewStyle;
}

const styles = StyleSheet.create({
  scroll: { flexGrow: 1 },
  table: { flexGrow: 1, minWidth: '100%' },
  row: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border },
  head: { borderBottomColor: colors.borderStrong },
  changed: { backgroundColor: colors.accentTint },
  danger: { backgroundColor: colors.dangerTint },
  cell: { paddingVertical: spacing.sm, paddingHorizontal: spacing.sm, justifyContent: 'center' },
  right: { textAlign: 'right' },
  hint: { paddingHorizontal: spacing.sm, paddingTop: spacing.xs },
  // a soft edge over the cut-off columns (web draws the gradient; elsewhere a plain shade)
  fade: { position: 'absolute', top: 0, bottom: 0, width: 28 },
  fadeRight: { right: 0, ...webGradient('to right') },
  fadeLeft: { left: 0, ...webGradient('to left') },
});

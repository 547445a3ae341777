import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';

import { colors, layout, radii, spacing } from '@/components/theme';
import { Icon } from '@/components/ui/Icon';
import { useScreenHead } from '@/components/ui/Screen';
import { Text } from '@/components/ui/Text';

import { useIsWide } from './use-is-wide';

/** Props of {@link SplitView}. */
export interface SplitViewProps {
  /** The list pane (rows, filters, a header). Scrolls on its own. */
  list: ReactNode;
  /** The detail of the selected item, or null when nothing is selected. Scrolls on its own. */
  detail: ReactNode | null;
  /** Label of the phone back bar above the detail: the list's name (e.g. "People"). */
  detailTitle?: string;
  /** Called by the phone back bar: clear the selection. */
  onCloseDetail: () => void;
  /** What the detail pane shows on wide screens when nothing is selected (usually an EmptyState). */
  placeholder?: ReactNode;
  /** Accessible names of the two panes; defaults "List" and "Details". */
  listLabel?: string;
  detailLabel?: string;
}

/**
 * List and detail: side by side at ≥ 1024 px (list column 380 px, detail fills the rest); on phones
 * the list shows until something is selected, then the detail replaces it with a back bar.
 * The wide detail pane pads its content; detail components add no outer padding of their own.
 * Selection state stays with the caller, so a screen can keep it in its own state or the URL.
 */
export function SplitView({ list, detail, detailTitle, onCloseDetail, placeholder, listLabel = 'List', detailLabel = 'Details' }: SplitViewProps) {
  const wide = useIsWide();
  const screenHead = useScreenHead();
  if (wide) {
    return (
      <View style={styles.row}>
        <ScrollView style={styles.listPane} contentContainerStyle={styles.paneContent} aria-label={listLabel} role="region">
          {list}
        </ScrollView>
        <ScrollView style={styles.detailPane} contentContainerStyle={styles.detailContent} aria-label={detailLabel} role="region">
          {detail ?? placeholder ?? null}
        </ScrollView>
      </View>
    );
  }
  if (detail) {
    return (
      <View style={styles.fill}>
        <Pressable
          role="button"
          aria-label="Back to the list"
          onPress={onCloseDetail}
          style={styles.back}
        >
          <Icon name="chevron-left" size={20} color={colors.accent} />
          <Text variant="label" tone="accent" numberOfLines={1} style={styles.backText}>
            {detailTitle ?? 'Back'}
          </Text>
        </Pressable>
        <ScrollView style={styles.fill} contentContainerStyle={styles.phoneContent} aria-label={detailLabel} role="region">
          {detail}
        </ScrollView>
      </View>
    );
  }
  return (
    <ScrollView style={styles.fill} contentContainerStyle={styles.phoneContent} aria-label={listLabel} role="region">
      {screenHead}
      {list}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1, minHeight: 0 },
  row: { flex: 1, minHeight: 0, flexDirection: 'row', gap: spacing.lg },
  listPane: {
    width: layout.listColumnWidth,
    flexGrow: 0,
    flexShrink: 0,
  },
  detailPane: {
    flex: 1,
    backgroundColor: colors.surface,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: colors.border,
  },
  paneContent: { padding: spacing.xs, gap: spacing.md, flexGrow: 1 },
  detailContent: { padding: spacing.xl, gap: spacing.lg, flexGrow: 1 },
  phoneContent: { gap: spacing.md, paddingBottom: spacing.xl },
  back: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, minHeight: 40, alignSelf: 'flex-start', paddingRight: spacing.md, marginBottom: spacing.sm },
  backText: { fontFamily: 'Inter_600SemiBold' },
});

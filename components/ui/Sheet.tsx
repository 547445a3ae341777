import type { ReactNode } from 'react';
import { Modal, Pressable, ScrollView, StyleSheet, View } from 'react-native';

import { useIsWide } from '@/components/layout/use-is-wide';
import { colors, layout, radii, spacing } from '@/components/theme';

import { Icon } from './Icon';
import { Text } from './Text';

/** Props of {@link Sheet}. */
export interface SheetProps {
  /** Whether the sheet is open. */
  visible: boolean;
  /** Called on the close button, the backdrop and the Escape key. */
  onClose: () => void;
  /** Heading and the dialog's accessible name. */
  title: string;
  children: ReactNode;
  /** Optional bottom row (e.g. Cancel / Save buttons), kept visible while the body scrolls. */
  footer?: ReactNode;
  /** `form` (default): one form's width on wide screens; `wide`: up to the content width, for side-by-side comparisons. */
  size?: 'form' | 'wide';
}

/**
 * A modal for editing one thing: slides up from the bottom on phones, a centred dialog on wide screens.
 * Exposed as role "dialog" named by `title`.
 */
export function Sheet({ visible, onClose, title, children, footer, size = 'form' }: SheetProps) {
  const wide = useIsWide();
  return (
    <Modal visible={visible} transparent animationType={wide ? 'fade' : 'slide'} onRequestClose={onClose}>
      <View style={[styles.backdrop, wide ? styles.backdropWide : styles.backdropPhone]}>
        <Pressable style={StyleSheet.absoluteFill} onPress={onClose} aria-label="Close" role="button" />
        <View role="dialog" aria-modal aria-label={title} style={[styles.panel, wide ? styles.panelWide : styles.panelPhone, wide && size === 'wide' && styles.panelWider]}>
          <View style={styles.head}>
            <Text variant="heading" role="heading" aria-level={2} style={styles.title}>
              {title}
            </Text>
            <Pressable role="button" aria-label="Close" onPress={onClose} style={styles.close} hitSlop={8}>
              <Icon name="x" size={20} color={colors.muted} />
            </Pressable>
          </View>
          <ScrollView contentContainerStyle={styles.body} keyboardShouldPersistTaps="handled">
            {children}
          </ScrollView>
          {footer ? <View style={styles.footer}>{footer}</View> : null}
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  backdrop: { flex: 1, backgroundColor: colors.scrim },
  backdropPhone: { justifyContent: 'flex-end' },
  backdropWide: { justifyContent: 'center', alignItems: 'center', padding: spacing.xl },
  panel: { backgroundColor: colors.surface, borderColor: colors.border, borderWidth: 1, maxHeight: '92%' },
  panelPhone: { borderTopLeftRadius: radii.lg + 4, borderTopRightRadius: radii.lg + 4, borderBottomWidth: 0 },
  panelWide: { width: '100%', maxWidth: layout.formMaxWidth, borderRadius: radii.lg },
  panelWider: { maxWidth: layout.maxContentWidth - 2 * spacing.xl },
  head: {
    flexDirection: 'row',
    alignItems: 'center',
    paddingHorizontal: spacing.xl,
    paddingTop: spacing.lg,
    paddingBottom: spacing.sm,
  },
  title: { flex: 1 },
  close: { padding: spacing.xs, borderRadius: radii.sm },
  body: { paddingHorizontal: spacing.xl, paddingBottom: spacing.xl, paddingTop: spacing.sm, gap: spacing.lg },
  footer: {
    flexDirection: 'row',
    justifyContent: 'flex-end',
    gap: spacing.sm,
    paddingHorizontal: spacing.xl,
    paddingVertical: spacing.md,
    borderTopWidth: 1,
    borderTopColor: colors.border,
  },
});

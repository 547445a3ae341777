import { colors } from '@/components/theme';

/**
 * Paints the browser page itself in the app background, so no white shows before the fonts load,
 * behind overscroll, or around modals. No-op outside a browser.
 */
export function paintPageBackground(): void {
  if (typeof document === 'undefined') return;
  document.documentElement.style.backgroundColor = colors.background;
  document.documentElement.style.colorScheme = 'dark';
  document.body.style.backgroundColor = colors.background;
}

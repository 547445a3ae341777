import { colors } from '@/components/theme';

// Keyboard focus only (:focus-visible), so a mouse click leaves no ring but Tab always shows one.
const PAGE_CSS = `
html, body { background-color: ${colors.background}; color-scheme: dark; }
:focus-visible { outline: 2px solid ${colors.accent} !important; outline-offset: 2px; }
input:focus-visible, textarea:focus-visible { outline: none !important; }
`;

/**
 * Page-level styles React Native Web has no prop for: the page background (no white before the
 * fonts load or behind overscroll) and one amber keyboard-focus ring for every control. No-op
 * outside a browser; safe to call more than once.
 */
export function applyPageStyles(): void {
  if (typeof document === 'undefined' || document.getElementById('holonaut-page-styles')) return;
  const style = document.createElement('style');
  style.id = 'holonaut-page-styles';
  style.textContent = PAGE_CSS;
  document.head.appendChild(style);
}

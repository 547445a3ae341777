import { colors } from '@/components/theme';

// Keyboard focus only (:focus-visible), so a mouse click leaves no ring but Tab always shows one.
const PAGE_CSS = `
html, body { background-color: ${colors.background}; color-scheme: dark; }
:focus-visible { outline: 2px solid ${colors.accent} !important; outline-offset: 2px; }
input:focus-visible, textarea:focus-visible { outline: none !important; }
input[type=file]::file-selector-button {
  font: inherit; font-weight: 600; color: ${colors.text}; background-color: ${colors.surface};
  border: 1px solid ${colors.borderStrong}; border-radius: 8px; padding: 6px 12px; margin-right: 12px; cursor: pointer;
}
`;

/**
 * Page-level styles React Native Web has no prop for: the page background (no white before the
 * fonts load or behind overscroll), one amber keyboard-focus ring for every control, and the file
 * input's button in the app's secondary-button look instead of the browser's grey. No-op
 * outside a browser; safe to call more than once.
 */
export function applyPageStyles(): void {
  if (typeof document === 'undefined' || document.getElementById('holonaut-page-styles')) return;
  const style = document.createElement('style');
  style.id = 'holonaut-page-styles';
  style.textContent = PAGE_CSS;
  document.head.appendChild(style);
}

/** The design tokens in one import: `import { colors, gaps, spacing, radii, fonts, typeScale, layout } from '@/components/theme'`. */
export { type ColorName, colors } from './colors';
export { gaps } from './gaps';
export { layout, radii, spacing } from './spacing';
export { fonts, typeScale, type TypeVariant } from './typography';

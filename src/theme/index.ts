/**
 * Headwater's look (docs/screens.md, "Labels and looks"): calm, high contrast
 * for a bright equipment room, one accent colour, a legible text face and a
 * monospaced face for codes, channels, frequencies and table figures.
 * Colours live in ./colors.ts (pure, so their contrast is unit-tested).
 */
import { Platform, type TextStyle } from 'react-native';
import { colors } from './colors';

export { colors };

/**
 * Family names the shipped font files (fonts/) are registered under by
 * `useFonts` in app/_layout.tsx.
 */
export const FONT_NAMES = {
  text: 'Atkinson-Regular',
  textBold: 'Atkinson-Bold',
  mono: 'PlexMono-Regular',
  monoBold: 'PlexMono-SemiBold',
} as const;

// On the web a CSS fallback list keeps text readable if a shipped face fails
// to load; native platforms take exactly one registered family name.
const family = (name: string, fallback: string): string =>
  Platform.OS === 'web' ? `${name}, ${fallback}` : name;

export const fonts = {
  text: family(FONT_NAMES.text, 'system-ui, sans-serif'),
  textBold: family(FONT_NAMES.textBold, 'system-ui, sans-serif'),
  mono: family(FONT_NAMES.mono, 'ui-monospace, monospace'),
  monoBold: family(FONT_NAMES.monoBold, 'ui-monospace, monospace'),
} as const;

/** Spacing steps in px; layouts use these, never ad hoc numbers. */
export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radius = { sm: 4, md: 8, lg: 12, pill: 999 } as const;

/** Smallest touch target (docs/screens.md: touch targets >= 44 px). */
export const TOUCH_MIN = 44;

/** Type scale: sizes stay readable at arm's length (body 17 px). */
export const type = {
  title: { fontFamily: fonts.textBold, fontSize: 26, lineHeight: 32, color: colors.ink },
  heading: { fontFamily: fonts.textBold, fontSize: 20, lineHeight: 26, color: colors.ink },
  label: { fontFamily: fonts.textBold, fontSize: 15, lineHeight: 20, color: colors.ink },
  body: { fontFamily: fonts.text, fontSize: 17, lineHeight: 24, color: colors.ink },
  small: { fontFamily: fonts.text, fontSize: 15, lineHeight: 20, color: colors.inkMuted },
  /** Codes, channels, frequencies. */
  code: { fontFamily: fonts.mono, fontSize: 16, lineHeight: 22, color: colors.ink },
  /** Numbers that must line up (tables, counts). */
  figure: { fontFamily: fonts.mono, fontSize: 16, lineHeight: 22, color: colors.ink, fontVariant: ['tabular-nums'] },
} satisfies Record<string, TextStyle>;

export const theme = { colors, fonts, space, radius, type, TOUCH_MIN } as const;
export type Theme = typeof theme;

import { Platform } from 'react-native';

/**
 * ARIA attributes that react-native-web passes to the DOM but React Native's
 * types do not list (aria-current, aria-invalid, aria-sort). Returns nothing
 * on native, where they have no meaning.
 */
export function webAria(attributes: Record<`aria-${string}`, string | boolean | undefined>): object {
  if (Platform.OS !== 'web') return {};
  const out: Record<string, string | boolean> = {};
  for (const [k, v] of Object.entries(attributes)) if (v !== undefined && v !== false) out[k] = v;
  return out;
}

/** Props for a heading of the given level (an <hN> on the web, a header on native). */
export function heading(level: 1 | 2 | 3 | 4) {
  return { accessibilityRole: 'header' as const, ...webAria({ 'aria-level': String(level) }) };
}

/**
 * Colours picked for this project. Text and status colours are checked against
 * the WCAG 2.1 contrast minimum of 4.5:1 (success criterion 1.4.3) on the
 * backgrounds they are drawn on; see colors.test.ts.
 */
export const colors = {
  /** Page background behind cards. */
  canvas: '#F3F5F4',
  /** Cards, bars, fields. */
  surface: '#FFFFFF',
  /** Slightly sunk surface: table header, selected nav row. */
  sunken: '#E6EBEA',
  ink: '#15201E',
  inkMuted: '#4A5754',
  line: '#C4CECB',
  lineStrong: '#7A8885',
  /** The one accent: a deep river green-blue, for actions and the current place. */
  accent: '#0E5A63',
  accentInk: '#FFFFFF',
  accentSoft: '#DCECEC',
  focus: '#C26A00',
  /**
   * Drawn data that is not an action (reserve feed lines, main-station marks,
   * chart bars), so the accent keeps its one meaning: press here, you are here.
   */
  mark: '#3F4A8E',
  markInk: '#FFFFFF',
  /** A light tint of `mark`: the fill of drawn data areas (grouped sites on the map). */
  markSoft: '#E3E5F3',
  /** Status colours come second to words and shapes (docs/screens.md). */
  good: '#1F6B34',
  goodSoft: '#E1F0E4',
  warn: '#8A5200',
  warnSoft: '#FBEFD9',
  bad: '#A4262C',
  badSoft: '#F9E3E3',
} as const;

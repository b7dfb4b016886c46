/**
 * Sheetsmith's visual identity, defined once. Every colour, size and font name used by the app comes from here.
 *
 * The look is a workbench: warm pattern-paper backgrounds, charcoal ink for lines and text, and the colours of
 * stacked foam sheets (ember, sand, sage, slate) used as accents. The mark is a stack of four bars whose heights
 * follow the common sheet thicknesses 2, 4, 6 and 10 mm.
 */
import type { TextStyle } from 'react-native';

/** Named colours. `foam*` are the sheet-stack accents; contrast of ink on paper is well above 7:1. */
export const palette = {
  paper: '#F5EFE4',
  sheet: '#FFFCF6',
  sheetSunk: '#EFE6D7',
  rule: '#DCD0BD',
  ruleStrong: '#B9AA93',
  ink: '#2A2420',
  inkSoft: '#5E544B',
  inkFaint: '#8A7E72',
  ember: '#B4501C',
  emberDeep: '#8E3C12',
  emberWash: '#F7E3D4',
  sand: '#D9B36C',
  sage: '#7E9A6E',
  slate: '#44606B',
  bench: '#2F2925',
  benchLine: '#4A413A',
  onBench: '#F3EADB',
  onBenchSoft: '#BDB0A0',
  danger: '#A52A1E',
  dangerWash: '#FBE4E0',
  caution: '#8A5A00',
  cautionWash: '#FBF0D2',
  ok: '#3E6E36',
} as const;

/** Layered-foam stripe used by the mark and the edge of cards: [colour, height in px] from top to bottom. */
export const foamStack: ReadonlyArray<readonly [string, number]> = [
  [palette.sand, 2],
  [palette.sage, 4],
  [palette.slate, 6],
  [palette.ember, 10],
];

/** Font family names as registered with expo-font in app/_layout.tsx. */
export const fonts = {
  body: 'Archivo-Regular',
  bodyStrong: 'Archivo-SemiBold',
  display: 'Archivo-ExtraBold',
  mono: 'DMMono-Regular',
  monoStrong: 'DMMono-Medium',
} as const;

/** Spacing steps in px, on a 4 px grid. */
export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

/** Corner radii in px. Small on purpose: cut foam has crisp edges. */
export const radius = { sm: 3, md: 6, lg: 10, pill: 999 } as const;

/** Type scale (a 1.2 ratio from a 16 px body), with the family that carries each weight. */
export const type = {
  display: { fontFamily: fonts.display, fontSize: 33, lineHeight: 38, letterSpacing: -0.5, color: palette.ink },
  title: { fontFamily: fonts.display, fontSize: 23, lineHeight: 28, letterSpacing: -0.2, color: palette.ink },
  heading: { fontFamily: fonts.bodyStrong, fontSize: 19, lineHeight: 24, color: palette.ink },
  body: { fontFamily: fonts.body, fontSize: 16, lineHeight: 24, color: palette.ink },
  bodyStrong: { fontFamily: fonts.bodyStrong, fontSize: 16, lineHeight: 24, color: palette.ink },
  small: { fontFamily: fonts.body, fontSize: 14, lineHeight: 20, color: palette.inkSoft },
  label: { fontFamily: fonts.bodyStrong, fontSize: 14, lineHeight: 18, color: palette.ink },
  mono: { fontFamily: fonts.mono, fontSize: 13, lineHeight: 18, color: palette.inkSoft },
  overline: {
    fontFamily: fonts.monoStrong,
    fontSize: 12,
    lineHeight: 16,
    letterSpacing: 1.2,
    textTransform: 'uppercase',
    color: palette.inkFaint,
  },
} as const satisfies Record<string, TextStyle>;

/** Window width in px at which the navigation moves from the top bar to a side bar. */
export const wideLayoutMinWidth = 1024;

/** Widest the reading column gets, in px, so lines stay readable on a large screen. */
export const contentMaxWidth = 760;

/** Smallest touch target in px (common practice for touch screens, about 9 mm). */
export const minTouchTarget = 44;

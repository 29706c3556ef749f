/**
 * Sphereline's visual language in one place: a warm paper ground, deep teal ink, and three verdict
 * colours chosen to read apart for common colour-vision deficiencies and never alone: every verdict
 * also carries a glyph and a word.
 */
export const colors = {
  paper: '#F4F1E8',
  card: '#FFFFFF',
  ink: '#16302C',
  inkSoft: '#3E524E',
  muted: '#66736F',
  line: '#D8D1C1',
  lineStrong: '#B9B09C',
  accent: '#1F6B61',
  accentSoft: '#DCEBE6',
  accentInk: '#FFFFFF',
  amber: '#B8741F',
  amberSoft: '#F6E6CC',
  danger: '#9E3B26',
  dangerSoft: '#F7E1DA',
  rail: '#16302C',
  railInk: '#E9E4D6',
  railActive: '#2C5A53',
} as const;

/** Verdicts and review statuses: colour + glyph + word (see components/ui/verdict-badge.tsx). */
export const verdictColors = {
  labile: { fg: '#B04A30', bg: '#F8E3DB' },
  intermediate: { fg: '#8A6A0E', bg: '#F5EBC9' },
  inert: { fg: '#2F4377', bg: '#DFE5F3' },
} as const;

export const spacing = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;

export const radius = { sm: 6, md: 10, lg: 16, pill: 999 } as const;

/**
 * Atkinson Hyperlegible Next for text and Atkinson Hyperlegible Mono for values (SIL Open Font
 * License): letterforms drawn to be told apart (l, 1, I; 0, O), which formulas and rate constants
 * need, and no company's brand.
 */
export const fonts = {
  body: 'AtkinsonNext',
  strong: 'AtkinsonNext-SemiBold',
  mono: 'AtkinsonMono',
} as const;

/** Font files from the registry's font packages, bundled into the app by the web export (never fetched from elsewhere). */
export const fontFiles = {
  [fonts.body]: require('@expo-google-fonts/atkinson-hyperlegible-next/400Regular/AtkinsonHyperlegibleNext_400Regular.ttf'),
  [fonts.strong]: require('@expo-google-fonts/atkinson-hyperlegible-next/600SemiBold/AtkinsonHyperlegibleNext_600SemiBold.ttf'),
  [fonts.mono]: require('@expo-google-fonts/atkinson-hyperlegible-mono/500Medium/AtkinsonHyperlegibleMono_500Medium.ttf'),
};

export const typeScale = {
  caption: { fontSize: 12, lineHeight: 16 },
  body: { fontSize: 15, lineHeight: 22 },
  lead: { fontSize: 17, lineHeight: 25 },
  title: { fontSize: 22, lineHeight: 28 },
  display: { fontSize: 30, lineHeight: 36 },
} as const;

/** Width at which the side rail replaces the bottom bar and list/detail sit side by side. */
export const WIDE_BREAKPOINT_PX = 1024;

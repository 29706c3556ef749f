/**
 * Sphereline's visual language in one place: a warm paper ground and deep teal ink. Colour carries
 * three separate meanings and no token serves two of them:
 * - the science (verdicts, routes) gets the strongest colours;
 * - hazards, and only hazards, are amber;
 * - review and bookkeeping states are quiet (ink tones and the slate "notice"), never louder than a verdict.
 * Every text pair meets WCAG 2.2 AA (4.5:1, SC 1.4.3) and every glyph or control outline 3:1 (SC 1.4.11);
 * tests/components/ui/contrast.test.ts computes the ratios.
 */
export const colors = {
  paper: '#F4F1E8',
  card: '#FFFFFF',
  ink: '#16302C',
  inkSoft: '#3E524E',
  muted: '#5C6965',
  /** Hairlines that only decorate (card edges, dividers). */
  line: '#D8D1C1',
  /** Outlines that identify a control (fields, chips, quiet buttons): 3:1 against card and paper. */
  lineStrong: '#8C836E',
  accent: '#1F6B61',
  accentSoft: '#DCEBE6',
  accentInk: '#FFFFFF',
  /** Safety hazards only (the caution box and its triangle). */
  hazard: '#945309',
  hazardSoft: '#FBEBD0',
  /** Something waits for a person (changes requested, a pending revision, a stale copy): quiet slate. */
  notice: '#4D5B7C',
  noticeSoft: '#E6E9F1',
  /**
   * Older names of the notice colour, kept for the library screens until they move to `notice`;
   * despite the name they are no longer amber (amber is for hazards alone).
   */
  amber: '#4D5B7C',
  amberSoft: '#E6E9F1',
  danger: '#9E3B26',
  dangerSoft: '#F7E1DA',
  rail: '#16302C',
  railInk: '#E9E4D6',
  railActive: '#2C5A53',
  /** Secondary text on the rail (hints, the tag line), readable on the rail and its active item. */
  railInkSoft: '#C5CCC4',
} as const;

/**
 * Verdicts: a scale from quick to locked that reads as chemistry, not as good or bad. Labile is a light
 * open cyan, inert a deep navy (the ends, set apart by hue and by lightness), intermediate a violet
 * between them. Red and amber are left out on purpose: a labile complex is not a danger. Colour is
 * never alone: every verdict also carries a glyph and a word (components/ui/verdict-badge.tsx).
 */
export const verdictColors = {
  labile: { fg: '#0A6A86', bg: '#DDEFF4' },
  intermediate: { fg: '#6A4A9C', bg: '#ECE6F5' },
  inert: { fg: '#1F3566', bg: '#E4E9F4' },
} as const;

/** Electron-transfer routes (components/route/route-badge.tsx): word + colour, never colour alone. */
export const routeColors = {
  'inner-sphere': { fg: '#1F6B61', bg: '#DCEBE6' },
  'outer-sphere': { fg: '#5A3F86', bg: '#E9E1F3' },
  either: { fg: '#4D5B7C', bg: '#E6E9F1' },
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

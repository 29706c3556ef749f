import { colors, routeColors, verdictColors } from '@/components/ui/theme';
import { STATUS_LOOKS, type ReviewStatus } from '@/components/ui/verdict-badge';

/**
 * Contrast of the theme's colour pairs against WCAG 2.2 level AA:
 * - SC 1.4.3 Contrast (Minimum): text at least 4.5:1 (we hold large text to the same bar);
 * - SC 1.4.11 Non-text Contrast: glyphs and the outlines that identify a control at least 3:1.
 * The ratio and the relative luminance are written out here from the WCAG 2.2 definitions
 * ("contrast ratio" and "relative luminance", W3C Recommendation, 2023), not taken from the app.
 */
function channel(value8bit: number): number {
  const c = value8bit / 255;
  // WCAG 2.2 "relative luminance": sRGB linearisation with the 0.04045 threshold.
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function relativeLuminance(hex: string): number {
  const match = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) throw new Error(`not a #RRGGBB colour: ${hex}`);
  const [r, g, b] = [match[1], match[2], match[3]].map((part) => channel(parseInt(part as string, 16)));
  return 0.2126 * (r as number) + 0.7152 * (g as number) + 0.0722 * (b as number);
}

function contrastRatio(a: string, b: string): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (light + 0.05) / (dark + 0.05);
}

const TEXT_AA = 4.5; // WCAG 2.2 SC 1.4.3
const NON_TEXT_AA = 3; // WCAG 2.2 SC 1.4.11

describe('the contrast formula itself', () => {
  it('gives 21:1 for black on white and 1:1 for a colour on itself (WCAG 2.2, definition of contrast ratio)', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 5);
    expect(contrastRatio('#FFFFFF', '#000000')).toBeCloseTo(21, 5);
    expect(contrastRatio('#16302C', '#16302C')).toBeCloseTo(1, 5);
  });

  it('puts #767676 on white just above 4.5:1 and #777777 just below (common practice: the lightest AA grey on white)', () => {
    expect(contrastRatio('#767676', '#FFFFFF')).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio('#777777', '#FFFFFF')).toBeLessThan(4.5);
  });
});

type Pair = [name: string, foreground: string, background: string];

// Text colours on every ground they are used on.
const textPairs: Pair[] = [
  ...(['ink', 'inkSoft', 'muted', 'accent', 'danger', 'notice', 'hazard'] as const).flatMap((tone): Pair[] => [
    [`${tone} text on card`, colors[tone], colors.card],
    [`${tone} text on paper`, colors[tone], colors.paper],
  ]),
  ['button text on accent', colors.accentInk, colors.accent],
  ['accent text on accentSoft', colors.accent, colors.accentSoft],
  ['ink on accentSoft', colors.ink, colors.accentSoft],
  ['danger text on dangerSoft', colors.danger, colors.dangerSoft],
  ['hazard title on hazardSoft', colors.hazard, colors.hazardSoft],
  ['ink text on hazardSoft', colors.ink, colors.hazardSoft],
  ['notice text on noticeSoft', colors.notice, colors.noticeSoft],
  ['ink text on noticeSoft', colors.ink, colors.noticeSoft],
  ['rail text on the rail', colors.railInk, colors.rail],
  ['rail text on the active rail item', colors.railInk, colors.railActive],
  ['rail hint on the rail', colors.railInkSoft, colors.rail],
  ['rail hint on the active rail item', colors.railInkSoft, colors.railActive],
  ['focus ring on the rail', colors.railInk, colors.rail],
  ...(Object.keys(verdictColors) as (keyof typeof verdictColors)[]).flatMap((verdict): Pair[] => [
    [`${verdict} word on its badge`, verdictColors[verdict].fg, verdictColors[verdict].bg],
    [`${verdict} word on card`, verdictColors[verdict].fg, colors.card],
    [`${verdict} word on paper`, verdictColors[verdict].fg, colors.paper],
    // The lability scale writes the neighbours' labels (muted) over the verdict bands.
    [`muted label on the ${verdict} band`, colors.muted, verdictColors[verdict].bg],
  ]),
  ...(Object.keys(routeColors) as (keyof typeof routeColors)[]).map((route): Pair => [
    `${route} word on its badge`,
    routeColors[route].fg,
    routeColors[route].bg,
  ]),
  ...(Object.keys(STATUS_LOOKS) as ReviewStatus[]).flatMap((status): Pair[] => {
    const look = STATUS_LOOKS[status];
    const fill = typeof look.frame.backgroundColor === 'string' && look.frame.backgroundColor !== 'transparent' ? look.frame.backgroundColor : null;
    return fill
      ? [[`${status} status word on its pill`, look.textColor, fill]]
      : [
          [`${status} status word on card`, look.textColor, colors.card],
          [`${status} status word on paper`, look.textColor, colors.paper],
        ];
  }),
];

// Glyphs and the outlines that identify a control.
const nonTextPairs: Pair[] = [
  ['control outline on card', colors.lineStrong, colors.card],
  ['control outline on paper', colors.lineStrong, colors.paper],
  ['accent (selected chip, primary button) on paper', colors.accent, colors.paper],
  ['hazard triangle on hazardSoft', colors.hazard, colors.hazardSoft],
  ...(Object.keys(verdictColors) as (keyof typeof verdictColors)[]).map((verdict): Pair => [
    `${verdict} marker on its band`,
    verdictColors[verdict].fg,
    verdictColors[verdict].bg,
  ]),
];

describe('theme colours against WCAG 2.2 AA', () => {
  it.each(textPairs)('%s: at least 4.5:1 (SC 1.4.3)', (_name, foreground, background) => {
    expect(contrastRatio(foreground, background)).toBeGreaterThanOrEqual(TEXT_AA);
  });

  it.each(nonTextPairs)('%s: at least 3:1 (SC 1.4.11)', (_name, foreground, background) => {
    expect(contrastRatio(foreground, background)).toBeGreaterThanOrEqual(NON_TEXT_AA);
  });
});

describe('colour meanings kept apart', () => {
  const amberLike = (hex: string) => {
    const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
    // Orange-yellow hues: red high, green in between, blue lowest (common practice: hue 25°–50°).
    const max = Math.max(r, g, b);
    const min = Math.min(r, g, b);
    if (max - min < 40 || max !== r || min !== b) return false;
    const hue = (60 * (g - b)) / (max - min);
    return hue >= 25 && hue <= 50;
  };
  const redLike = (hex: string) => {
    const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
    const max = Math.max(r, g, b);
    const min = Math.min(r, g, b);
    if (max - min < 40 || max !== r) return false;
    const hue = (60 * (g - b)) / (max - min);
    return hue > -20 && hue < 25;
  };

  it('the hazard colour is amber and no verdict, route or status colour is', () => {
    expect(amberLike(colors.hazard)).toBe(true);
    for (const palette of [...Object.values(verdictColors), ...Object.values(routeColors)]) expect(amberLike(palette.fg)).toBe(false);
    for (const look of Object.values(STATUS_LOOKS)) expect(amberLike(look.textColor)).toBe(false);
    expect(amberLike(colors.notice)).toBe(false);
  });

  it('labile is not drawn in red, the colour of danger', () => {
    expect(redLike(colors.danger)).toBe(true);
    expect(redLike(verdictColors.labile.fg)).toBe(false);
    expect(redLike(verdictColors.labile.bg)).toBe(false);
  });

  it('the three verdicts have three different hues', () => {
    const fgs = Object.values(verdictColors).map((palette) => palette.fg);
    expect(new Set(fgs).size).toBe(3);
  });

  it('no status pill is filled with a solid colour (statuses stay quieter than the verdict)', () => {
    for (const look of Object.values(STATUS_LOOKS)) {
      const fill = look.frame.backgroundColor;
      expect(fill === 'transparent' || fill === colors.noticeSoft).toBe(true);
    }
  });
});

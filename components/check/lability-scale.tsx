import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText, TSpan } from 'react-native-svg';

import { FIVE_MINUTE_LOG_K, ONE_MINUTE_LOG_K } from '@/lib/chem/verdict-bands';
import { formatPowerOfTen } from '@/lib/chem/number-format';
import type { Verdict } from '@/lib/chem/types';
import { colors, fonts, verdictColors } from '@/components/ui/theme';

export interface LabilityNeighbour {
  label: string;
  /** log10 k (s⁻¹). */
  logK: number;
  /** Measured (library) rather than predicted: drawn as a filled dot. */
  measured: boolean;
}

export interface LabilityScaleProps {
  /** log10 of the exchange rate constant k (s⁻¹) of this complex. */
  logK: number;
  verdict: Verdict;
  /** Name shown above the marker, e.g. a display formula. */
  label: string;
  neighbours?: LabilityNeighbour[];
  /** log10 k limits of the intermediate band; defaults to the lability engine's band. */
  intermediateBand?: [number, number];
}

export const SCALE_MIN_LOG_K = -10;
export const SCALE_MAX_LOG_K = 10;
// Intermediate: t½ from one to five minutes (lib/chem/verdict-bands.ts).
const DEFAULT_BAND: [number, number] = [FIVE_MINUTE_LOG_K, ONE_MINUTE_LOG_K];

// Vertical layout (px). The width follows the container, so text keeps its size at any width.
const DEFAULT_WIDTH = 340;
const HEIGHT = 136;
const PAD_X = 26;
const MARKER_LABEL_Y = 15;
const ROW_ABOVE_Y = 36;
const BAND_TOP = 42;
const AXIS_Y = 72;
/** Neighbour dots sit low in the band, clear of the band captions. */
const NEIGHBOUR_DOT_Y = AXIS_Y - 13;
const ROW_BELOW_Y = 87;
const DECADE_LABEL_Y = 108;
const MINUTE_LABEL_Y = 128;
const LABEL_FONT = 12;
const CHAR_W = LABEL_FONT * 0.58;
const MAX_LABEL_CHARS = 16;
const MAX_MARKER_CHARS = 28;
const LABEL_SHIFTS = [0, -14, 14, -28, 28];

interface Interval {
  from: number;
  to: number;
}

interface PlacedNeighbour extends LabilityNeighbour {
  x: number;
  clamped: 'low' | 'high' | null;
  row: 'above' | 'below' | null;
  text: string;
  textX: number;
}

function clampLogK(logK: number): { value: number; clamped: 'low' | 'high' | null } {
  if (logK < SCALE_MIN_LOG_K) return { value: SCALE_MIN_LOG_K, clamped: 'low' };
  if (logK > SCALE_MAX_LOG_K) return { value: SCALE_MAX_LOG_K, clamped: 'high' };
  return { value: logK, clamped: null };
}

function shorten(text: string, maxChars = MAX_LABEL_CHARS): string {
  return text.length > maxChars ? `${text.slice(0, maxChars - 1)}…` : text;
}

/** Keeps a centred label of the given width inside the drawing. */
function labelCentre(x: number, textWidth: number, width: number): number {
  return Math.min(Math.max(x, 4 + textWidth / 2), width - 4 - textWidth / 2);
}

function overlaps(interval: Interval, taken: readonly Interval[]): boolean {
  return taken.some((other) => interval.from < other.to + 4 && interval.to > other.from - 4);
}

/** Neighbour labels alternate above and below the band; a label with no free room keeps only its tick. */
function placeNeighbours(neighbours: readonly LabilityNeighbour[], xOf: (logK: number) => number, width: number, reserved: { above: Interval[]; below: Interval[] }): PlacedNeighbour[] {
  const taken = { above: [...reserved.above], below: [...reserved.below] };
  const sorted = [...neighbours].sort((a, b) => a.logK - b.logK);
  return sorted.map((neighbour, index) => {
    const { value, clamped } = clampLogK(neighbour.logK);
    const x = xOf(value);
    const text = shorten(neighbour.label);
    const textWidth = text.length * CHAR_W;
    const preferred: ('above' | 'below')[] = index % 2 === 0 ? ['above', 'below'] : ['below', 'above'];
    // A label may slide a little sideways off its tick before it gives up its place.
    for (const shift of LABEL_SHIFTS) {
      const textX = labelCentre(x + shift, textWidth, width);
      const interval = { from: textX - textWidth / 2, to: textX + textWidth / 2 };
      for (const row of preferred) {
        if (!overlaps(interval, taken[row])) {
          taken[row].push(interval);
          return { ...neighbour, x, clamped, row, text, textX };
        }
      }
    }
    return { ...neighbour, x, clamped, row: null, text, textX: x };
  });
}

function describeScale(label: string, logK: number, verdict: Verdict, neighbours: readonly LabilityNeighbour[]): string {
  const head = `${label}: k ≈ ${formatPowerOfTen(logK)} s⁻¹, ${verdict}; one-minute line at k ≈ ${formatPowerOfTen(ONE_MINUTE_LOG_K)} s⁻¹`;
  if (neighbours.length === 0) return head;
  const around = neighbours.map((n) => `${n.label} (k ≈ ${formatPowerOfTen(n.logK)} s⁻¹, ${n.measured ? 'measured' : 'predicted'})`).join(', ');
  return `${head}; nearby: ${around}`;
}

/** "10" with a raised, smaller exponent as a second run of the same text. */
function PowerOfTen({ x, exponent }: { x: number; exponent: number }) {
  const exponentText = exponent < 0 ? `−${Math.abs(exponent)}` : String(exponent);
  return (
    <SvgText testID="decade-label" x={x} y={DECADE_LABEL_Y} fontSize={LABEL_FONT} fontFamily={fonts.mono} fill={colors.muted} textAnchor="middle">
      <TSpan>10</TSpan>
      <TSpan dy={-5} fontSize={LABEL_FONT}>{exponentText}</TSpan>
    </SvgText>
  );
}

/** Arrow beyond the end of the axis: the value lies off the scale in that direction. */
function ClampArrow({ x, side, color, y }: { x: number; side: 'low' | 'high'; color: string; y: number }) {
  const direction = side === 'low' ? -1 : 1;
  const tip = x + direction * 16;
  return (
    <Path
      testID="clamp-arrow"
      d={`M ${x + direction * 4} ${y} L ${tip} ${y} M ${tip - direction * 5} ${y - 4} L ${tip} ${y} L ${tip - direction * 5} ${y + 4}`}
      stroke={color}
      strokeWidth={1.8}
      strokeLinecap="round"
      fill="none"
    />
  );
}

/** Horizontal log k scale (10⁻¹⁰ to 10¹⁰ s⁻¹) with the one-minute line, verdict bands, this complex and its neighbours. */
export function LabilityScale({ logK, verdict, label, neighbours = [], intermediateBand = DEFAULT_BAND }: LabilityScaleProps) {
  const [width, setWidth] = useState(DEFAULT_WIDTH);
  const onLayout = (event: LayoutChangeEvent) => {
    const measured = Math.round(event.nativeEvent.layout.width);
    if (measured > 0 && Math.abs(measured - width) > 1) setWidth(measured);
  };

  const span = SCALE_MAX_LOG_K - SCALE_MIN_LOG_K;
  const xOf = (value: number) => PAD_X + ((value - SCALE_MIN_LOG_K) / span) * (width - 2 * PAD_X);
  const [bandLow, bandHigh] = intermediateBand;
  const bandLowX = xOf(clampLogK(bandLow).value);
  const bandHighX = xOf(clampLogK(bandHigh).value);
  const minuteX = xOf(ONE_MINUTE_LOG_K);
  const leftEnd = xOf(SCALE_MIN_LOG_K);
  const rightEnd = xOf(SCALE_MAX_LOG_K);

  const self = clampLogK(logK);
  const markerX = xOf(self.value);
  const markerColor = verdictColors[verdict].fg;
  const markerText = shorten(label, MAX_MARKER_CHARS);
  const markerTextX = labelCentre(markerX, markerText.length * 7, width);
  const placed = placeNeighbours(neighbours, xOf, width, {
    above: [{ from: markerX - 3, to: markerX + 3 }],
    below: [{ from: minuteX - 2, to: minuteX + 2 }],
  });

  // A label ("10" and a two-digit exponent at 12 px) needs about 40 px; thin the labels to keep them apart.
  const pxPerDecade = (width - 2 * PAD_X) / span;
  const decadeStep = [2, 5, 10].find((step) => step * pxPerDecade >= 44) ?? 10;
  const decades: number[] = [];
  for (let exponent = SCALE_MIN_LOG_K; exponent <= SCALE_MAX_LOG_K; exponent++) decades.push(exponent);
  const minuteLabelX = labelCentre(minuteX, 62, width);

  return (
    <View
      accessible
      accessibilityRole="image"
      accessibilityLabel={describeScale(label, logK, verdict, neighbours)}
      onLayout={onLayout}
      style={styles.frame}
      testID="lability-scale"
    >
      <Svg width={width} height={HEIGHT} viewBox={`0 0 ${width} ${HEIGHT}`}>
        {/* Verdict bands: slow (inert) on the left, fast (labile) on the right */}
        <Rect testID="band-inert" x={leftEnd} y={BAND_TOP} width={Math.max(0, bandLowX - leftEnd)} height={AXIS_Y - BAND_TOP} fill={verdictColors.inert.bg} />
        <Rect testID="band-intermediate" x={bandLowX} y={BAND_TOP} width={Math.max(0, bandHighX - bandLowX)} height={AXIS_Y - BAND_TOP} fill={verdictColors.intermediate.bg} />
        <Rect testID="band-labile" x={bandHighX} y={BAND_TOP} width={Math.max(0, rightEnd - bandHighX)} height={AXIS_Y - BAND_TOP} fill={verdictColors.labile.bg} />
        <SvgText x={markerX < leftEnd + 40 ? markerX + 8 : leftEnd + 5} y={BAND_TOP + 11} fontSize={LABEL_FONT} fontFamily={fonts.strong} fill={verdictColors.inert.fg}>inert</SvgText>
        <SvgText x={markerX > rightEnd - 44 ? markerX - 8 : rightEnd - 5} y={BAND_TOP + 11} fontSize={LABEL_FONT} fontFamily={fonts.strong} fill={verdictColors.labile.fg} textAnchor="end">labile</SvgText>

        {/* Axis with a tick per decade, labelled every second decade */}
        <Line x1={leftEnd} y1={AXIS_Y} x2={rightEnd} y2={AXIS_Y} stroke={colors.ink} strokeWidth={1.2} />
        {decades.map((exponent) => {
          const x = xOf(exponent);
          // Every second decade where there is room, else every fifth, so labels (12 px) never touch.
          const labelled = exponent % decadeStep === 0;
          return (
            <G key={exponent}>
              <Line x1={x} y1={AXIS_Y} x2={x} y2={AXIS_Y + (labelled ? 6 : 3)} stroke={colors.ink} strokeWidth={1} />
              {labelled ? <PowerOfTen x={x} exponent={exponent} /> : null}
            </G>
          );
        })}
        <SvgText x={rightEnd} y={HEIGHT - 2} fontSize={LABEL_FONT} fontFamily={fonts.body} fill={colors.muted} textAnchor="end">k / s⁻¹</SvgText>

        {/* Taube's one-minute line */}
        <G testID="one-minute">
          <Line testID="one-minute-line" x1={minuteX} y1={BAND_TOP - 4} x2={minuteX} y2={AXIS_Y + 8} stroke={colors.ink} strokeWidth={1.2} strokeDasharray="3 3" />
          {/* resumes below the decade labels so it never crosses 10⁻² */}
          <Line x1={minuteX} y1={DECADE_LABEL_Y + 4} x2={minuteX} y2={MINUTE_LABEL_Y - 11} stroke={colors.ink} strokeWidth={1.2} strokeDasharray="3 3" />
          <SvgText x={minuteLabelX} y={MINUTE_LABEL_Y} fontSize={LABEL_FONT} fontFamily={fonts.body} fill={colors.ink} textAnchor="middle">t½ = 1 min</SvgText>
        </G>

        {/* Neighbours: small ticks, filled dot when measured, open when predicted */}
        {placed.map((neighbour, index) => (
          <G key={`${neighbour.label}-${index}`} testID="lability-neighbour">
            <Line x1={neighbour.x} y1={NEIGHBOUR_DOT_Y} x2={neighbour.x} y2={AXIS_Y} stroke={colors.inkSoft} strokeWidth={1} />
            <Circle cx={neighbour.x} cy={NEIGHBOUR_DOT_Y} r={2.6} fill={neighbour.measured ? colors.inkSoft : colors.card} stroke={colors.inkSoft} strokeWidth={1} />
            {neighbour.clamped ? <ClampArrow x={neighbour.x} side={neighbour.clamped} color={colors.inkSoft} y={NEIGHBOUR_DOT_Y} /> : null}
            {neighbour.row ? (
              <SvgText testID="lability-neighbour-label" x={neighbour.textX} y={neighbour.row === 'above' ? ROW_ABOVE_Y : ROW_BELOW_Y} fontSize={LABEL_FONT} fontFamily={fonts.body} fill={colors.inkSoft} textAnchor="middle">
                {neighbour.text}
              </SvgText>
            ) : null}
          </G>
        ))}

        {/* This complex */}
        <G testID="lability-marker">
          <Line testID="lability-marker-stem" x1={markerX} y1={MARKER_LABEL_Y + 5} x2={markerX} y2={AXIS_Y} stroke={markerColor} strokeWidth={2} />
          <Circle cx={markerX} cy={AXIS_Y} r={5.5} fill={markerColor} stroke={colors.card} strokeWidth={1.5} />
          {self.clamped ? <ClampArrow x={markerX} side={self.clamped} color={markerColor} y={AXIS_Y} /> : null}
          <SvgText x={markerTextX} y={MARKER_LABEL_Y} fontSize={12} fontFamily={fonts.strong} fill={markerColor} textAnchor="middle">
            {markerText}
          </SvgText>
        </G>
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { width: '100%', height: HEIGHT },
});

import { View, StyleSheet } from 'react-native';
import Svg, { G, Line, Path, Rect, Text as SvgText, TSpan } from 'react-native-svg';

import { formatInteger } from '@/lib/chem/number-format';
import { fillOrbitals, levelElectrons, type OrbitalFilling, type OrbitalLevel } from '@/lib/chem/orbital-filling';
import type { Geometry, SpinState } from '@/lib/chem/types';
import { colors, fonts } from '@/components/ui/theme';

export interface OrbitalDiagramProps {
  dElectrons: number;
  geometry: Geometry;
  spinState: SpinState | null;
  /** Estimated Δo (cm⁻¹); shown beside the octahedral splitting arrow when known. */
  deltaOcm?: number | null;
}

// Drawing units (the SVG scales to its container through the viewBox).
const VIEW_W = 360;
/**
 * Text size in drawing units: the drawing scales with its frame, and 14 units stay at least 12 px down
 * to a frame of 310 px (a 390 px phone's card).
 */
const TEXT = 14;
const VIEW_H = 232;
const CENTRE_X = 214;
const MID_Y = 122;
const MAX_SPREAD = 150;
/** Octahedral and tetrahedral share a scale so Δt is visibly ~4/9 of Δo. */
const MAX_PX_PER_DQ = 15;
const MIN_LEVEL_GAP = 36;
const BAR_W = 30;
const BAR_GAP = 9;
const ARROW_LEN = 17;
const ARROW_BARB = 5;

/** How each level label is drawn: main letter plus a lowered subscript (no Unicode subscript g exists). */
const LEVEL_LABELS: Record<string, { main: string; sub: string; spoken: string }> = {
  t2g: { main: 't', sub: '2g', spoken: 't2g' },
  eg: { main: 'e', sub: 'g', spoken: 'eg' },
  e: { main: 'e', sub: '', spoken: 'e' },
  t2: { main: 't', sub: '2', spoken: 't2' },
  'dxz-dyz': { main: 'd', sub: 'xz, yz', spoken: 'dxz,dyz' },
  dz2: { main: 'd', sub: 'z²', spoken: 'dz2' },
  dxy: { main: 'd', sub: 'xy', spoken: 'dxy' },
  'dx2-y2': { main: 'd', sub: 'x²−y²', spoken: 'dx2-y2' },
  d: { main: 'd', sub: '', spoken: 'd' },
};

const GEOMETRY_WORDS: Record<Geometry, string> = {
  linear: 'Linear',
  'trigonal-planar': 'Trigonal-planar',
  tetrahedral: 'Tetrahedral',
  'square-planar': 'Square-planar',
  'trigonal-bipyramidal': 'Trigonal-bipyramidal',
  'square-pyramidal': 'Square-pyramidal',
  octahedral: 'Octahedral',
  'pentagonal-bipyramidal': 'Pentagonal-bipyramidal',
  'square-antiprismatic': 'Square-antiprismatic',
  'tricapped-trigonal-prismatic': 'Tricapped-trigonal-prismatic',
  sandwich: 'Sandwich',
  'bent-sandwich': 'Bent sandwich',
  'half-sandwich': 'Half-sandwich',
  other: 'Other geometry,',
};

/** "Octahedral d6 low spin: t2g 6, eg 0" — what a screen reader says instead of the picture. */
export function describeOrbitalDiagram(dElectrons: number, geometry: Geometry, spinState: SpinState | null, filling: OrbitalFilling): string {
  const spin = spinState === null || dElectrons === 0 || dElectrons === 10 ? '' : ` ${spinState} spin`;
  const head = `${GEOMETRY_WORDS[geometry]} d${dElectrons}${spin}`;
  if (filling.scheme === 'degenerate') {
    const fill = dElectrons === 0 ? 'all empty' : dElectrons === 10 ? 'all filled' : `${dElectrons} electrons, ${filling.unpairedElectrons} unpaired`;
    return `${head}: five d orbitals shown unsplit, ${fill}`;
  }
  return `${head}: ${filling.levels.map((level) => `${LEVEL_LABELS[level.id]?.spoken ?? level.id} ${levelElectrons(level)}`).join(', ')}`;
}

/** y of each level: energies to pixels, then pushed apart so electrons and labels never collide. */
function levelYs(levels: readonly OrbitalLevel[]): { ys: number[]; barycentreY: number } {
  const energies = levels.map((level) => level.energyDq);
  const low = Math.min(...energies);
  const high = Math.max(...energies);
  const pxPerDq = high > low ? Math.min(MAX_SPREAD / (high - low), MAX_PX_PER_DQ) : 0;
  const middle = (high + low) / 2;
  const toY = (energy: number) => MID_Y - (energy - middle) * pxPerDq;
  const ys: number[] = [];
  for (const energy of energies) {
    const natural = toY(energy);
    const previous = ys[ys.length - 1];
    ys.push(previous !== undefined && previous - natural < MIN_LEVEL_GAP ? previous - MIN_LEVEL_GAP : natural);
  }
  return { ys, barycentreY: toY(0) };
}

function formatWavenumber(cm: number): string {
  // Estimates are good to a few per cent: show hundreds, grouped as every quantity is (number-format).
  return formatInteger(Math.round(cm / 100) * 100);
}

function UpElectron({ x, baseY }: { x: number; baseY: number }) {
  const top = baseY - ARROW_LEN;
  return <Path testID="electron-up" d={`M ${x} ${baseY} L ${x} ${top} L ${x - ARROW_BARB} ${top + ARROW_BARB + 1}`} stroke={colors.accent} strokeWidth={1.8} strokeLinecap="round" strokeLinejoin="round" fill="none" />;
}

function DownElectron({ x, baseY }: { x: number; baseY: number }) {
  const top = baseY - ARROW_LEN;
  return <Path testID="electron-down" d={`M ${x} ${top} L ${x} ${baseY} L ${x + ARROW_BARB} ${baseY - ARROW_BARB - 1}`} stroke={colors.accent} strokeWidth={1.8} strokeLinecap="round" strokeLinejoin="round" fill="none" />;
}

function SubscriptLabel({ x, y, main, sub, anchor = 'start', size = 15 }: { x: number; y: number; main: string; sub: string; anchor?: 'start' | 'end'; size?: number }) {
  // One text with a lowered, smaller run: the renderer places the subscript right after the letter.
  return (
    <SvgText x={x} y={y} fontSize={size} fontFamily={fonts.body} fill={colors.ink} textAnchor={anchor}>
      <TSpan>{main}</TSpan>
      {sub ? <TSpan dy={size * 0.3} fontSize={Math.max(TEXT, size * 0.8)}>{sub}</TSpan> : null}
    </SvgText>
  );
}

function LevelGroup({ level, y, labelBelow }: { level: OrbitalLevel; y: number; labelBelow: boolean }) {
  const count = level.occupancy.length;
  const groupWidth = count * BAR_W + (count - 1) * BAR_GAP;
  const left = CENTRE_X - groupWidth / 2;
  const label = LEVEL_LABELS[level.id] ?? { main: level.label, sub: '', spoken: level.label };
  return (
    <G testID={`orbital-level-${level.id}`}>
      {level.occupancy.map((electrons, index) => {
        const barX = left + index * (BAR_W + BAR_GAP);
        const baseY = y - 3;
        return (
          <G key={index}>
            <Rect testID="orbital-bar" x={barX} y={y - 1.5} width={BAR_W} height={3} rx={1.5} fill={colors.ink} />
            {electrons >= 1 ? <UpElectron x={barX + BAR_W / 2 - 4.5} baseY={baseY} /> : null}
            {electrons >= 2 ? <DownElectron x={barX + BAR_W / 2 + 4.5} baseY={baseY} /> : null}
          </G>
        );
      })}
      {labelBelow ? (
        <SvgText x={CENTRE_X} y={y + 20} fontSize={TEXT} fontFamily={fonts.body} fill={colors.inkSoft} textAnchor="middle">
          five d orbitals, unsplit
        </SvgText>
      ) : (
        <SubscriptLabel x={left + groupWidth + 10} y={y + 4} main={label.main} sub={label.sub} />
      )}
    </G>
  );
}

/** Split arrow (double-headed) between two levels with its symbol and, when known, the value. */
const ARROW_X = 126;

function SplittingArrow({ fromY, toY, symbolSub, value }: { fromY: number; toY: number; symbolSub: string; value: string | null }) {
  const x = ARROW_X;
  const head = 5;
  const midY = (fromY + toY) / 2;
  return (
    <G testID="splitting-arrow">
      <Line x1={x} y1={fromY - 1} x2={x} y2={toY + 1} stroke={colors.inkSoft} strokeWidth={1.3} />
      <Path d={`M ${x - head} ${toY + head + 1} L ${x} ${toY} L ${x + head} ${toY + head + 1}`} stroke={colors.inkSoft} strokeWidth={1.3} fill="none" />
      <Path d={`M ${x - head} ${fromY - head - 1} L ${x} ${fromY} L ${x + head} ${fromY - head - 1}`} stroke={colors.inkSoft} strokeWidth={1.3} fill="none" />
      <SubscriptLabel x={x - 8} y={value ? midY - 12 : midY + 4} main="Δ" sub={symbolSub} anchor="end" size={16} />
      {value ? (
        <SvgText testID="splitting-value" x={x - 8} y={midY + 4} fontSize={TEXT} fontFamily={fonts.mono} fill={colors.inkSoft} textAnchor="end">
          {value}
        </SvgText>
      ) : null}
    </G>
  );
}

/** d-orbital splitting diagram with the electrons filled in (crystal-field picture). */
export function OrbitalDiagram({ dElectrons, geometry, spinState, deltaOcm = null }: OrbitalDiagramProps) {
  // d0 and d10 gain nothing from a split picture: show the five orbitals as one set.
  const drawnGeometry: Geometry = dElectrons === 0 || dElectrons === 10 ? 'other' : geometry;
  const filling = fillOrbitals(dElectrons, drawnGeometry, spinState);
  const { ys, barycentreY } = levelYs(filling.levels);
  const lowestY = ys[0] ?? MID_Y;
  const highestY = ys[ys.length - 1] ?? MID_Y;
  const degenerate = filling.scheme === 'degenerate';

  let arrow: { symbolSub: string; value: string | null } | null = null;
  if (filling.scheme === 'octahedral') {
    arrow = { symbolSub: 'o', value: deltaOcm !== null && Number.isFinite(deltaOcm) && deltaOcm > 0 ? `≈ ${formatWavenumber(deltaOcm)} cm⁻¹` : null };
  } else if (filling.scheme === 'tetrahedral') {
    arrow = { symbolSub: 't', value: null };
  }

  return (
    <View
      accessible
      accessibilityRole="image"
      accessibilityLabel={describeOrbitalDiagram(dElectrons, geometry, spinState, filling)}
      style={styles.frame}
      testID="orbital-diagram"
    >
      <Svg width="100%" height="100%" viewBox={`0 0 ${VIEW_W} ${VIEW_H}`}>
        {/* Energy axis */}
        <Line x1={18} y1={VIEW_H - 14} x2={18} y2={22} stroke={colors.lineStrong} strokeWidth={1.2} />
        <Path d={`M 14 28 L 18 20 L 22 28`} stroke={colors.lineStrong} strokeWidth={1.2} fill="none" />
        <SvgText x={26} y={26} fontSize={TEXT} fontFamily={fonts.body} fill={colors.muted}>E</SvgText>

        {/* Barycentre: the mean energy the split sets keep */}
        {!degenerate ? (
          <G testID="barycentre">
            <Line x1={arrow ? ARROW_X + 8 : 30} y1={barycentreY} x2={VIEW_W - 8} y2={barycentreY} stroke={colors.lineStrong} strokeWidth={1} strokeDasharray="5 4" />
            <SvgText x={VIEW_W - 8} y={barycentreY + 13} fontSize={TEXT} fontFamily={fonts.body} fill={colors.muted} textAnchor="end">barycentre</SvgText>
          </G>
        ) : null}

        {arrow ? <SplittingArrow fromY={lowestY} toY={highestY} symbolSub={arrow.symbolSub} value={arrow.value} /> : null}

        {filling.levels.map((level, index) => (
          <LevelGroup key={level.id} level={level} y={ys[index] ?? MID_Y} labelBelow={degenerate} />
        ))}

        <SvgText x={30} y={VIEW_H - 10} fontSize={TEXT} fontFamily={fonts.body} fill={colors.muted}>
          {`d${dElectrons}${spinState !== null && dElectrons > 0 && dElectrons < 10 ? ` · ${spinState} spin` : ''}`}
        </SvgText>
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { width: '100%', maxWidth: 560, aspectRatio: VIEW_W / VIEW_H },
});

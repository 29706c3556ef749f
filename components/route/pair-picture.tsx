import Svg, { Circle, G, Line, Path, Text as SvgText } from 'react-native-svg';
import { View, StyleSheet } from 'react-native';
import type { RouteKind } from '@/lib/chem/route-types';
import { roman } from '@/components/ui/format';
import { colors, fonts } from '@/components/ui/theme';

export interface PairPictureProps {
  route: RouteKind;
  oxidant: { metal: string; oxidationState: number; coordinationNumber: number };
  reductant: { metal: string; oxidationState: number; coordinationNumber: number };
  /** The ligand that would bridge (label and bridging atom), when inner-sphere. */
  bridge: { label: string; atom: string } | null;
}

const W = 360;
const H = 170;
const R = 52;

/** Ligand positions around a centre, skipping the one that faces the partner when it bridges. */
function ligandDots(cx: number, cy: number, count: number, skipAngle: number | null) {
  const dots: { x: number; y: number }[] = [];
  const n = Math.max(count, 1);
  for (let i = 0; i < n; i += 1) {
    const angle = (2 * Math.PI * i) / n + (skipAngle ?? 0);
    if (skipAngle !== null && i === 0) continue;
    dots.push({ x: cx + R * 0.72 * Math.cos(angle), y: cy + R * 0.72 * Math.sin(angle) });
  }
  return dots;
}

/**
 * Two coordination spheres: touching through a bridging ligand (inner-sphere), or apart with the
 * electron crossing both outer spheres (outer-sphere). Drawn by us; not to scale.
 */
export function PairPicture({ route, oxidant, reductant, bridge }: PairPictureProps) {
  const inner = route === 'inner-sphere' && bridge !== null;
  const gap = inner ? 2 * R + 26 : 2 * R + 70;
  const leftX = W / 2 - gap / 2;
  const rightX = W / 2 + gap / 2;
  const cy = 82;
  const label = inner
    ? `inner-sphere through ${bridge.label}`
    : route === 'outer-sphere'
      ? 'outer-sphere: no shared ligand'
      : 'either route possible';
  const partner = (x: number, who: PairPictureProps['oxidant'], facing: number | null, tint: string) => (
    <G>
      <Circle cx={x} cy={cy} r={R} fill={tint} stroke={colors.lineStrong} strokeWidth={1.5} />
      {ligandDots(x, cy, who.coordinationNumber, facing).map((dot, index) => (
        <Circle key={index} cx={dot.x} cy={dot.y} r={5} fill={colors.inkSoft} opacity={0.55} />
      ))}
      <SvgText x={x} y={cy + 5} fontSize={15} fontFamily={fonts.strong} fill={colors.ink} textAnchor="middle">
        {`${who.metal}(${roman(who.oxidationState)})`}
      </SvgText>
    </G>
  );
  return (
    <View style={styles.frame} accessible accessibilityRole="image" accessibilityLabel={`Picture of the pair: ${label}`} testID="pair-picture">
      <Svg width="100%" height="100%" viewBox={`0 0 ${W} ${H}`}>
        {partner(leftX, oxidant, inner ? 0 : null, '#E6EEF7')}
        {partner(rightX, reductant, inner ? Math.PI : null, '#F7EBE3')}
        {inner ? (
          <G testID="bridge">
            <Line x1={leftX + R * 0.55} y1={cy} x2={rightX - R * 0.55} y2={cy} stroke={colors.accent} strokeWidth={3} />
            <Circle cx={W / 2} cy={cy} r={13} fill={colors.accent} />
            <SvgText x={W / 2} y={cy + 4.5} fontSize={12} fontFamily={fonts.strong} fill={colors.card} textAnchor="middle">
              {bridge.atom}
            </SvgText>
          </G>
        ) : (
          <G>
            <Path
              d={`M ${rightX - R - 6} ${cy - 14} Q ${W / 2} ${cy - 44} ${leftX + R + 6} ${cy - 14}`}
              stroke={colors.accent}
              strokeWidth={2}
              strokeDasharray="5 4"
              fill="none"
            />
            <Path d={`M ${leftX + R + 6} ${cy - 14} l 9 -2 l -4 8 z`} fill={colors.accent} />
            <SvgText x={W / 2} y={cy - 34} fontSize={12} fontFamily={fonts.mono} fill={colors.accent} textAnchor="middle">
              e⁻
            </SvgText>
          </G>
        )}
        <SvgText x={leftX} y={H - 8} fontSize={12} fontFamily={fonts.body} fill={colors.muted} textAnchor="middle">
          oxidant
        </SvgText>
        <SvgText x={rightX} y={H - 8} fontSize={12} fontFamily={fonts.body} fill={colors.muted} textAnchor="middle">
          reductant
        </SvgText>
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({ frame: { width: '100%', maxWidth: 480, aspectRatio: W / H, alignSelf: 'center' } });

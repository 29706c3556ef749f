import { StyleSheet, View } from 'react-native';
import Svg, { Circle, G, Line, Path, Text as SvgText } from 'react-native-svg';
import type { Mechanism, MechanismClass } from '@/lib/chem/mechanism';
import { CHECKED_MARKER, type Classification } from '@/lib/chem/types';
import { BulletList } from '@/components/ui/bullet-list';
import { Card } from '@/components/ui/card';
import { AppText } from '@/components/ui/text';
import { colors, fonts, spacing } from '@/components/ui/theme';

const CLASS_NAMES: Record<MechanismClass, string> = {
  D: 'dissociative',
  Id: 'dissociative interchange',
  I: 'interchange',
  Ia: 'associative interchange',
  A: 'associative',
};

const CONFIDENCE_WORDS = { high: 'high confidence', medium: 'medium confidence', low: 'low confidence' } as const;

/** How a ligand comes on or off: the class, what it rests on, and a small picture of the path. */
export function MechanismCard({ result }: { result: Classification }) {
  const mechanism = result.mechanism;
  return (
    <Card title="How ligands come on and off" testID="mechanism-card">
      <View style={styles.head}>
        <AppText variant="display" tone="accent" testID="mechanism-class">{mechanism.class}</AppText>
        <View style={styles.headText}>
          <AppText variant="lead">{CLASS_NAMES[mechanism.class]}</AppText>
          <AppText tone="soft" testID="mechanism-evidence">
            {mechanism.evidence === 'measured'
              ? `measured · ΔV‡ = ${signed(mechanism.activationVolume ?? 0)} cm³ mol⁻¹${mechanism.activationEntropy !== undefined ? ` · ΔS‡ = ${signed(mechanism.activationEntropy)} J K⁻¹ mol⁻¹` : ''}`
              : 'from the trend that applies'}
            {` · ${CONFIDENCE_WORDS[mechanism.confidence]}`}
          </AppText>
          {mechanism.source ? <AppText variant="caption" tone="muted">{mechanism.source}</AppText> : null}
          {mechanism.checked ? <AppText variant="caption" tone="soft">{CHECKED_MARKER[mechanism.checked]}</AppText> : null}
        </View>
      </View>
      <PathwayPicture mechanism={mechanism} coordinationNumber={result.coordinationNumber} />
      <AppText variant="caption" style={styles.mono} testID="mechanism-rate-law">{mechanism.rateLaw}</AppText>
      <BulletList items={mechanism.reasons} testID="mechanism-reasons" />
      {mechanism.assistedPaths?.map((path) => (
        <View key={path.kind} style={styles.path} testID={`mechanism-${path.kind}`}>
          <AppText variant="label" tone="accent">{path.kind === 'base-hydrolysis' ? 'Base hydrolysis' : 'Acid-catalysed aquation'}</AppText>
          <AppText variant="caption" style={styles.mono}>{path.rateLaw}</AppText>
          <AppText tone="soft">{path.text}</AppText>
        </View>
      ))}
    </Card>
  );
}

function signed(value: number): string {
  return `${value < 0 ? '−' : '+'}${Math.abs(value).toFixed(1)}`;
}

const VIEW_W = 330;
const VIEW_H = 118;
const BOND = 22;

/** A metal with `bonds` spokes; `dashed` spokes drawn half-made (interchange), `extra` labelled ligands. */
function Centre({ x, bonds, entering, leaving, label }: { x: number; bonds: number; entering: 'none' | 'bound' | 'partial' | 'outside'; leaving: 'bound' | 'partial' | 'gone'; label: string }) {
  const y = 52;
  const spokes = Math.max(bonds, 1);
  const angles = Array.from({ length: spokes }, (_, index) => (Math.PI * 2 * index) / spokes - Math.PI / 2);
  return (
    <G>
      {angles.map((angle, index) => (
        <Line key={index} x1={x} y1={y} x2={x + BOND * Math.cos(angle)} y2={y + BOND * Math.sin(angle)} stroke={colors.inkSoft} strokeWidth={2} />
      ))}
      {/* Leaving ligand X to the right, entering Y to the left. */}
      {leaving !== 'gone' ? (
        <G>
          <Line x1={x} y1={y} x2={x + BOND + 6} y2={y + 18} stroke={colors.danger} strokeWidth={2} strokeDasharray={leaving === 'partial' ? '3,3' : undefined} />
          <SvgText x={x + BOND + 10} y={y + 28} fontSize={12} fill={colors.danger} fontFamily={fonts.strong}>X</SvgText>
        </G>
      ) : null}
      {entering === 'bound' || entering === 'partial' ? (
        <G>
          <Line x1={x} y1={y} x2={x - BOND - 6} y2={y + 18} stroke={colors.accent} strokeWidth={2} strokeDasharray={entering === 'partial' ? '3,3' : undefined} />
          <SvgText x={x - BOND - 18} y={y + 28} fontSize={12} fill={colors.accent} fontFamily={fonts.strong}>Y</SvgText>
        </G>
      ) : entering === 'outside' ? (
        <SvgText x={x - BOND - 22} y={y + 28} fontSize={12} fill={colors.accent} fontFamily={fonts.strong}>+Y</SvgText>
      ) : null}
      <Circle cx={x} cy={y} r={9} fill={colors.accentSoft} stroke={colors.accent} strokeWidth={2} />
      <SvgText x={x} y={y + 4} fontSize={10} textAnchor="middle" fill={colors.ink} fontFamily={fonts.strong}>M</SvgText>
      <SvgText x={x} y={108} fontSize={11} textAnchor="middle" fill={colors.inkSoft} fontFamily={fonts.body}>{label}</SvgText>
    </G>
  );
}

function Arrow({ x }: { x: number }) {
  return <Path d={`M ${x - 14} 52 L ${x + 10} 52 M ${x + 4} 47 L ${x + 10} 52 L ${x + 4} 57`} stroke={colors.muted} strokeWidth={1.6} fill="none" />;
}

/** Reactant → intermediate or transition state → product, drawn for the class. */
function PathwayPicture({ mechanism, coordinationNumber }: { mechanism: Mechanism; coordinationNumber: number }) {
  const n = coordinationNumber;
  const others = Math.max(n - 1, 1);
  const middle =
    mechanism.class === 'A'
      ? { bonds: others, entering: 'bound' as const, leaving: 'bound' as const, label: `${n + 1}-coordinate` }
      : mechanism.class === 'D'
        ? { bonds: others, entering: 'outside' as const, leaving: 'gone' as const, label: `${n - 1}-coordinate` }
        : { bonds: others, entering: 'partial' as const, leaving: 'partial' as const, label: mechanism.class === 'Ia' ? 'Y bonds first' : mechanism.class === 'Id' ? 'X loosens first' : 'both halfway' };
  return (
    <View testID="mechanism-picture" accessibilityRole="image" accessibilityLabel={`Pathway: ${CLASS_NAMES[mechanism.class]}, ${middle.label}`}>
      <Svg width="100%" height={VIEW_H} viewBox={`0 0 ${VIEW_W} ${VIEW_H}`}>
        <Centre x={52} bonds={others} entering="outside" leaving="bound" label={`${n}-coordinate`} />
        <Arrow x={112} />
        <Centre x={168} {...middle} />
        <Arrow x={226} />
        <Centre x={282} bonds={others} entering="bound" leaving="gone" label="product" />
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', gap: spacing.md, alignItems: 'center' },
  headText: { flex: 1, gap: 2 },
  path: { gap: 2, paddingTop: spacing.xs },
  mono: { fontFamily: fonts.mono, fontSize: 13, lineHeight: 19 },
});

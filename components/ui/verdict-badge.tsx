import { StyleSheet, View, type ViewStyle } from 'react-native';
import Svg, { Circle, Path } from 'react-native-svg';

import type { Verdict } from '@/lib/chem/types';
import { VERDICT_DEFINITIONS } from '@/lib/chem/verdict-bands';
import { AppText } from './text';
import { colors, radius, spacing, verdictColors } from './theme';

/**
 * Verdict glyphs (ours): a coordination sphere drawn as a ring.
 * labile — the ring is wide open (ligands come and go);
 * intermediate — the gap is half closed;
 * inert — the ring is closed around a solid core.
 */
export function VerdictGlyph({ verdict, color, size = 16 }: { verdict: Verdict; color: string; size?: number }) {
  const stroke = { stroke: color, strokeWidth: 2.2, strokeLinecap: 'round' as const, fill: 'none' };
  return (
    <Svg width={size} height={size} viewBox="0 0 20 20" testID={`verdict-glyph-${verdict}`}>
      {verdict === 'labile' ? (
        // Arc from 40° to 320° round the bottom: a 80° opening on the right.
        <Path d="M 15.36 5.5 A 7 7 0 1 0 15.36 14.5" {...stroke} />
      ) : null}
      {verdict === 'intermediate' ? (
        <>
          <Path d="M 16.58 7.6 A 7 7 0 1 0 16.58 12.4" {...stroke} />
          <Circle cx={10} cy={10} r={2} fill={color} />
        </>
      ) : null}
      {verdict === 'inert' ? (
        <>
          <Circle cx={10} cy={10} r={7} {...stroke} />
          <Circle cx={10} cy={10} r={3.4} fill={color} />
        </>
      ) : null}
    </Svg>
  );
}

const VERDICT_WORDS: Record<Verdict, string> = { labile: 'labile', intermediate: 'intermediate', inert: 'inert' };

/** Verdict as colour + glyph + word, never colour alone. */
export function VerdictBadge({ verdict, size = 'md' }: { verdict: Verdict; size?: 'sm' | 'md' }) {
  const palette = verdictColors[verdict];
  const small = size === 'sm';
  return (
    <View
      accessible
      accessibilityRole="image"
      accessibilityLabel={`Verdict: ${VERDICT_WORDS[verdict]}`}
      accessibilityHint={VERDICT_DEFINITIONS[verdict]}
      style={[styles.badge, small ? styles.badgeSmall : null, { backgroundColor: palette.bg, borderColor: palette.fg }]}
      testID="verdict-badge"
    >
      <VerdictGlyph verdict={verdict} color={palette.fg} size={small ? 13 : 16} />
      <AppText variant="label" style={[{ color: palette.fg }, small ? styles.wordSmall : null]}>
        {VERDICT_WORDS[verdict]}
      </AppText>
    </View>
  );
}

export type ReviewStatus = 'draft' | 'in-review' | 'accepted' | 'returned' | 'declined' | 'retired';

interface StatusLook {
  word: string;
  frame: ViewStyle;
  textColor: string;
  strike?: boolean;
}

// Each status differs in outline, corner and glyph as well as colour, so none relies on colour alone. The
// looks stay quiet (no solid fills, ink tones): in a list row the verdict, not the bookkeeping, leads.
export const STATUS_LOOKS: Record<ReviewStatus, StatusLook> = {
  draft: { word: 'Draft', frame: { borderStyle: 'dashed', borderColor: colors.lineStrong, backgroundColor: 'transparent', borderRadius: radius.pill }, textColor: colors.inkSoft },
  'in-review': { word: 'In review', frame: { borderStyle: 'dotted', borderColor: colors.lineStrong, backgroundColor: 'transparent', borderRadius: radius.pill }, textColor: colors.inkSoft },
  accepted: { word: 'Accepted', frame: { borderStyle: 'solid', borderColor: colors.line, backgroundColor: 'transparent', borderRadius: radius.pill }, textColor: colors.accent },
  returned: { word: 'Returned', frame: { borderStyle: 'solid', borderColor: colors.notice, backgroundColor: colors.noticeSoft, borderRadius: radius.sm }, textColor: colors.notice },
  declined: { word: 'Declined', frame: { borderStyle: 'solid', borderColor: colors.line, backgroundColor: 'transparent', borderRadius: 2, borderLeftWidth: 3, borderLeftColor: colors.danger }, textColor: colors.danger },
  retired: { word: 'Retired', frame: { borderStyle: 'solid', borderColor: colors.line, backgroundColor: 'transparent', borderRadius: radius.sm }, textColor: colors.muted, strike: true },
};

function StatusGlyph({ status, color }: { status: ReviewStatus; color: string }) {
  const stroke = { stroke: color, strokeWidth: 1.8, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const, fill: 'none' };
  return (
    <Svg width={12} height={12} viewBox="0 0 12 12" testID={`status-glyph-${status}`}>
      {status === 'draft' ? <Path d="M 2 10 L 3 7 L 8.5 1.5 L 10.5 3.5 L 5 9 Z" {...stroke} strokeWidth={1.4} /> : null}
      {status === 'in-review' ? <Path d="M 1.5 6 L 10 6 M 6.5 2.5 L 10 6 L 6.5 9.5" {...stroke} /> : null}
      {status === 'accepted' ? <Path d="M 1.8 6.4 L 4.6 9.2 L 10.2 2.8" {...stroke} /> : null}
      {status === 'returned' ? <Path d="M 3 11 L 3 1.5 L 9.5 3.6 L 3 5.8" {...stroke} strokeWidth={1.5} /> : null}
      {status === 'declined' ? <Path d="M 2.5 2.5 L 9.5 9.5 M 9.5 2.5 L 2.5 9.5" {...stroke} /> : null}
      {status === 'retired' ? <Path d="M 2 6 L 10 6" {...stroke} /> : null}
    </Svg>
  );
}

/** Review status of a library entry: shape, outline and glyph differ per status, plus the word. */
export function StatusPill({ status }: { status: ReviewStatus }) {
  const look = STATUS_LOOKS[status];
  return (
    <View accessible accessibilityRole="image" accessibilityLabel={`Status: ${look.word}`} style={[styles.pill, look.frame]} testID={`status-pill-${status}`}>
      <StatusGlyph status={status} color={look.textColor} />
      <AppText variant="caption" style={[styles.pillWord, { color: look.textColor }, look.strike ? styles.strike : null]}>
        {look.word}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: spacing.xs + 2,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.xs + 1,
    borderRadius: radius.pill,
    borderWidth: 1,
  },
  badgeSmall: { paddingHorizontal: spacing.sm, paddingVertical: 2, gap: spacing.xs },
  wordSmall: { fontSize: 11, lineHeight: 14 },
  pill: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: spacing.xs,
    paddingHorizontal: spacing.sm + 2,
    paddingVertical: 3,
    borderWidth: 1,
  },
  pillWord: { fontSize: 12 },
  strike: { textDecorationLine: 'line-through' },
});

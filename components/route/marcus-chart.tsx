import Svg, { Line, Rect, Text as SvgText, Circle, Path } from 'react-native-svg';
import { StyleSheet, View } from 'react-native';
import { superscript } from '@/components/ui/format';
import { formatPowerOfTen } from '@/lib/chem/number-format';
import { colors, fonts } from '@/components/ui/theme';

const W = 360;
const H = 104;
const PAD = 24;
/**
 * Text size in drawing units: the drawing scales with its frame, and 14 units stay at least 12 px down
 * to a frame of 310 px (a 390 px phone's card).
 */
const TEXT = 14;

/**
 * Predicted and observed k12 on a log axis, with the ±1 log-unit window in which an observation
 * counts as consistent with the outer-sphere prediction.
 */
export function MarcusChart({ predictedLogK, observedLogK, windowLog = 1 }: {
  predictedLogK: number;
  observedLogK: number | null;
  windowLog?: number;
}) {
  const values = [predictedLogK, ...(observedLogK === null ? [] : [observedLogK])];
  const lo = Math.floor(Math.min(...values) - 2);
  const hi = Math.ceil(Math.max(...values) + 2);
  const x = (log: number) => PAD + ((log - lo) / (hi - lo)) * (W - 2 * PAD);
  const axisY = 58;
  // Tick labels at least 40 units apart (in the 360-wide drawing), so they never touch at any width.
  const step = Math.max(1, Math.ceil(40 / ((W - 2 * PAD) / (hi - lo))));
  const ticks: number[] = [];
  for (let t = lo; t <= hi; t += step) ticks.push(t);
  const description =
    `Predicted k12 ≈ ${formatPowerOfTen(predictedLogK)} M⁻¹ s⁻¹` +
    (observedLogK === null ? '' : `, observed ${formatPowerOfTen(observedLogK)} M⁻¹ s⁻¹`);
  return (
    <View style={styles.frame} accessible accessibilityRole="image" accessibilityLabel={description} testID="marcus-chart">
      <Svg width="100%" height="100%" viewBox={`0 0 ${W} ${H}`}>
        <Rect
          x={x(predictedLogK - windowLog)}
          y={axisY - 20}
          width={x(predictedLogK + windowLog) - x(predictedLogK - windowLog)}
          height={20}
          fill={colors.accentSoft}
        />
        <Line x1={PAD} y1={axisY} x2={W - PAD} y2={axisY} stroke={colors.ink} strokeWidth={1} />
        {ticks.map((t) => (
          <SvgText key={t} x={x(t)} y={axisY + 18} fontSize={TEXT} fontFamily={fonts.body} fill={colors.muted} textAnchor="middle">
            {`10${superscript(String(t))}`}
          </SvgText>
        ))}
        <Path d={`M ${x(predictedLogK)} ${axisY - 2} l -6 -12 h 12 z`} fill={colors.accent} />
        <SvgText x={x(predictedLogK)} y={axisY - 26} fontSize={TEXT} fontFamily={fonts.strong} fill={colors.accent} textAnchor="middle">
          predicted
        </SvgText>
        {observedLogK !== null ? (
          <>
            <Circle cx={x(observedLogK)} cy={axisY} r={6} fill={colors.notice} stroke={colors.card} strokeWidth={1.5} />
            <SvgText x={x(observedLogK)} y={axisY + 34} fontSize={TEXT} fontFamily={fonts.strong} fill={colors.notice} textAnchor="middle">
              observed
            </SvgText>
          </>
        ) : null}
        <SvgText x={W - PAD} y={H - 2} fontSize={TEXT} fontFamily={fonts.body} fill={colors.muted} textAnchor="end">
          k12 / M⁻¹ s⁻¹
        </SvgText>
      </Svg>
    </View>
  );
}

const styles = StyleSheet.create({ frame: { width: '100%', maxWidth: 520, aspectRatio: W / H } });

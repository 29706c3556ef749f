import { View } from 'react-native';
import Svg, { Circle, G, Line, Rect, Text as SvgText } from 'react-native-svg';
import { colors, fonts } from '@/components/ui/theme';

const SIZE = 170;
const MID = SIZE / 2;
const ARM = 44;
/** Site 0 left, 1 top, 2 right, 3 bottom: 0 trans to 2, 1 trans to 3. */
const SITE_XY: [number, number][] = [
  [MID - ARM, MID],
  [MID, MID - ARM],
  [MID + ARM, MID],
  [MID, MID + ARM],
];

export interface SquareComplexProps {
  metal: string;
  /** Ligand ids round the square, sites 0–3. */
  sites: readonly string[];
  /** The site the entering ligand just took (drawn in the accent colour). */
  enteredSite?: number;
  /** The site of the trans director (drawn with a ring and a "trans" tag). */
  directorSite?: number;
  label: string;
  testID?: string;
}

/** One square-planar complex with its four ligands in place. */
export function SquareComplex({ metal, sites, enteredSite, directorSite, label, testID }: SquareComplexProps) {
  return (
    <View testID={testID} role="img" accessibilityLabel={`${label}: ${sites.map((id, site) => `${id} at ${['left', 'top', 'right', 'bottom'][site]}`).join(', ')}`}>
      <Svg width={SIZE} height={SIZE} viewBox={`0 0 ${SIZE} ${SIZE}`}>
        <Rect x={MID - ARM} y={MID - ARM} width={ARM * 2} height={ARM * 2} fill="none" stroke={colors.line} strokeDasharray="4,4" transform={`rotate(45 ${MID} ${MID})`} />
        {SITE_XY.map(([x, y], site) => (
          <Line key={`bond-${site}`} x1={MID} y1={MID} x2={x} y2={y} stroke={site === enteredSite ? colors.accent : colors.inkSoft} strokeWidth={site === enteredSite ? 3 : 2} />
        ))}
        <Circle cx={MID} cy={MID} r={15} fill={colors.accentSoft} stroke={colors.accent} strokeWidth={2} />
        <SvgText x={MID} y={MID + 5} fontSize={13} textAnchor="middle" fill={colors.ink} fontFamily={fonts.strong}>{metal}</SvgText>
        {SITE_XY.map(([x, y], site) => (
          <G key={`ligand-${site}`}>
            {site === directorSite ? <Circle cx={x} cy={y} r={19} fill={colors.card} stroke={colors.notice} strokeWidth={2} strokeDasharray="3,2" /> : <Circle cx={x} cy={y} r={17} fill={colors.card} />}
            <SvgText x={x} y={y + 4} fontSize={sites[site] && sites[site].length > 4 ? 9 : 11} textAnchor="middle" fill={site === enteredSite ? colors.accent : colors.ink} fontFamily={fonts.strong}>
              {sites[site]}
            </SvgText>
            {site === directorSite ? (
              <SvgText x={x} y={y + (site === 1 ? -23 : 31)} fontSize={9} textAnchor="middle" fill={colors.notice} fontFamily={fonts.body}>trans director</SvgText>
            ) : null}
          </G>
        ))}
      </Svg>
    </View>
  );
}

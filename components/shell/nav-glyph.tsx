import Svg, { Circle, Line, Path, Rect } from 'react-native-svg';

export type NavGlyphName = 'check' | 'route' | 'library' | 'review' | 'account';

/** Small line drawings of our own for the navigation (one coordination sphere, a bridged pair …). */
export function NavGlyph({ name, color, size = 22 }: { name: NavGlyphName; color: string; size?: number }) {
  const stroke = { stroke: color, strokeWidth: 1.8, fill: 'none' } as const;
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24">
      {name === 'check' && (
        <>
          <Circle cx={12} cy={12} r={8.5} {...stroke} />
          <Circle cx={12} cy={12} r={2.6} fill={color} />
          <Circle cx={12} cy={3.5} r={1.4} fill={color} />
          <Circle cx={12} cy={20.5} r={1.4} fill={color} />
        </>
      )}
      {name === 'route' && (
        <>
          <Circle cx={6} cy={12} r={4.5} {...stroke} />
          <Circle cx={18} cy={12} r={4.5} {...stroke} />
          <Line x1={10.5} y1={12} x2={13.5} y2={12} {...stroke} />
        </>
      )}
      {name === 'library' && (
        <>
          <Rect x={4} y={4} width={4} height={16} rx={1} {...stroke} />
          <Rect x={10} y={4} width={4} height={16} rx={1} {...stroke} />
          <Path d="M16.5 5.5 L20 4.6 L23 19 L19.6 19.9 Z" {...stroke} />
        </>
      )}
      {name === 'review' && (
        <>
          <Rect x={3.5} y={3.5} width={17} height={17} rx={3} {...stroke} />
          <Path d="M8 12.5 L11 15.5 L16.5 9" {...stroke} />
        </>
      )}
      {name === 'account' && (
        <>
          <Circle cx={12} cy={8.5} r={4} {...stroke} />
          <Path d="M4.5 20.5 C5.5 15.5 18.5 15.5 19.5 20.5" {...stroke} />
        </>
      )}
    </Svg>
  );
}

/**
 * Small shapes that carry a status before its colour does (docs/screens.md:
 * status in words and shape first, colour second). Each shape is used for one
 * meaning only:
 *   solid    filled disc                 on air, passing
 *   half     disc, left half filled      on reserve, partly
 *   cross    square with a cross          off air, failed
 *   triangle triangle with a bar          needs attention, caution
 *   ring     hollow circle                neutral, unknown, not yet run
 */
import Svg, { Circle, Path, Rect } from 'react-native-svg';

export type ShapeName = 'solid' | 'half' | 'cross' | 'triangle' | 'ring';

export function StatusShape({ shape, color, size = 14 }: { shape: ShapeName; color: string; size?: number }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 16 16" accessibilityElementsHidden importantForAccessibility="no-hide-descendants" aria-hidden>
      {shape === 'solid' && <Circle cx={8} cy={8} r={6.5} fill={color} />}
      {shape === 'half' && (
        <>
          <Circle cx={8} cy={8} r={6} fill="none" stroke={color} strokeWidth={2} />
          <Path d="M8 2a6 6 0 0 0 0 12z" fill={color} />
        </>
      )}
      {shape === 'cross' && (
        <>
          <Rect x={1.5} y={1.5} width={13} height={13} rx={1.5} fill="none" stroke={color} strokeWidth={2} />
          <Path d="M5 5l6 6M11 5l-6 6" stroke={color} strokeWidth={2} strokeLinecap="round" />
        </>
      )}
      {shape === 'triangle' && (
        <>
          <Path d="M8 1.8 14.8 14H1.2z" fill="none" stroke={color} strokeWidth={1.8} strokeLinejoin="round" />
          <Path d="M8 6.2v3.6" stroke={color} strokeWidth={1.8} strokeLinecap="round" />
          <Circle cx={8} cy={11.8} r={1} fill={color} />
        </>
      )}
      {shape === 'ring' && <Circle cx={8} cy={8} r={6} fill="none" stroke={color} strokeWidth={2} />}
    </Svg>
  );
}

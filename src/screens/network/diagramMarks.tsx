/** Legend entries for the marks the network diagram draws besides feed lines (same shapes as ./diagramPaths.ts). */
import Svg, { Circle, Path, Text as SvgText } from 'react-native-svg';
import type { LegendMark } from '@/src/components/charts/FeedLegend';
import { colors, fonts } from '@/src/theme';
import { crossShape, halfShape, ringShape, siteShape } from './diagramPaths';

const sample = (children: React.ReactNode) => (
  <Svg width={28} height={24} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
    {children}
  </Svg>
);

export const DIAGRAM_MARKS: LegendMark[] = [
  { key: 'land', label: 'land (shaded, with its coastline)', sample: sample(<Path d="M3 20L6 6L15 3L25 8L22 21Z" fill={colors.sunken} stroke={colors.line} strokeWidth={1} />) },
  { key: 'origin', label: 'origin (filled square)', sample: sample(<Path d={siteShape('origin', 14, 12, 5)} fill={colors.ink} />) },
  { key: 'main', label: 'main station (diamond)', sample: sample(<Path d={siteShape('main', 14, 12, 5)} fill={colors.mark} stroke={colors.ink} strokeWidth={1.2} />) },
  {
    key: 'group',
    label: 'nearby sites drawn together (circle with a double outline holding their number; zoom in or tap it to separate them)',
    sample: sample(
      <>
        <Circle cx={14} cy={12} r={10} fill={colors.accentSoft} stroke={colors.accent} strokeWidth={3} />
        <Circle cx={14} cy={12} r={10} fill="none" stroke={colors.surface} strokeWidth={1} />
        <SvgText x={14} y={16} fontSize={10} fontWeight="bold" fontFamily={fonts.text} textAnchor="middle" fill={colors.ink}>
          12
        </SvgText>
      </>,
    ),
  },
  { key: 'relay', label: 'relay (open circle)', sample: sample(<Path d={siteShape('relay', 14, 12, 4)} fill={colors.surface} stroke={colors.ink} strokeWidth={1.5} />) },
  {
    key: 'off',
    label: 'off air under the failure set (cross)',
    sample: sample(
      <>
        <Path d={siteShape('relay', 14, 12, 4)} fill={colors.surface} stroke={colors.ink} strokeWidth={1.5} />
        <Path d={crossShape(14, 12, 8)} stroke={colors.bad} strokeWidth={3} strokeLinecap="round" />
      </>,
    ),
  },
  {
    key: 'reserve',
    label: 'on reserve under the failure set (half-filled ring)',
    sample: sample(
      <>
        <Path d={ringShape(14, 12, 8)} fill={colors.surface} stroke={colors.warn} strokeWidth={2} />
        <Path d={halfShape(14, 12, 8)} fill={colors.warn} />
        <Path d={siteShape('relay', 14, 12, 4)} fill={colors.surface} stroke={colors.ink} strokeWidth={1.5} />
      </>,
    ),
  },
];

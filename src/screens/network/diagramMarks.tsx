/**
 * The diagram's marks as SVG (site roles, failure marks), shared by the SVG
 * drawing (./NetworkDiagram.tsx), the schematic (./SchematicView.tsx) and the
 * legend entries below; the canvas painter (./paintGeo.ts) takes the same
 * styles from ./markStyle.ts.
 */
import type { SiteRole } from '@/shared/schemas/network';
import Svg, { Circle, Path, Text as SvgText } from 'react-native-svg';
import type { LegendMark } from '@/src/components/charts/FeedLegend';
import { colors, fonts } from '@/src/theme';
import { crossShape, halfShape, ringShape, siteShape } from './diagramPaths';
import { FAIL_MARK, GROUP_MARK, ROLE_MARK } from './markStyle';

/** Site marks of one role, `d` from siteShape (one path for them all). */
export function SvgRole({ role, d }: { role: SiteRole; d: string }) {
  return d ? <Path d={d} fill={ROLE_MARK[role].fill} stroke={ROLE_MARK[role].stroke} strokeWidth={ROLE_MARK[role].width} /> : null;
}

/** On reserve: rings (ringShape) with their left halves filled (halfShape). */
export function SvgReserve({ ring, half }: { ring: string; half: string }) {
  if (!ring) return null;
  return (
    <>
      <Path d={ring} fill={colors.surface} stroke={FAIL_MARK.reserveStroke} strokeWidth={FAIL_MARK.reserveWidth} />
      <Path d={half} fill={FAIL_MARK.reserveStroke} />
    </>
  );
}

/** Off air: crosses (crossShape). */
export function SvgOff({ d }: { d: string }) {
  return d ? <Path d={d} stroke={FAIL_MARK.offStroke} strokeWidth={FAIL_MARK.offWidth} strokeLinecap="round" fill="none" /> : null;
}

const sample = (children: React.ReactNode) => (
  <Svg width={28} height={24} aria-hidden accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
    {children}
  </Svg>
);

const relay = <SvgRole role="relay" d={siteShape('relay', 14, 12, 4)} />;

export const DIAGRAM_MARKS: LegendMark[] = [
  { key: 'land', label: 'land (shaded, with its coastline)', sample: sample(<Path d="M3 20L6 6L15 3L25 8L22 21Z" fill={colors.sunken} stroke={colors.line} strokeWidth={1} />) },
  { key: 'origin', label: 'origin (filled square)', sample: sample(<SvgRole role="origin" d={siteShape('origin', 14, 12, 5)} />) },
  { key: 'main', label: 'main station (diamond)', sample: sample(<SvgRole role="main" d={siteShape('main', 14, 12, 5)} />) },
  {
    key: 'group',
    label: 'nearby sites drawn together (circle with a double outline holding their number; zoom in or tap it to separate them)',
    sample: sample(
      <>
        <Circle cx={14} cy={12} r={10} fill={GROUP_MARK.fill} stroke={GROUP_MARK.outer} strokeWidth={GROUP_MARK.outerWidth} />
        <Circle cx={14} cy={12} r={10} fill="none" stroke={GROUP_MARK.inner} strokeWidth={GROUP_MARK.innerWidth} />
        <SvgText x={14} y={16} fontSize={10} fontWeight="bold" fontFamily={fonts.text} textAnchor="middle" fill={colors.ink}>
          12
        </SvgText>
      </>,
    ),
  },
  { key: 'relay', label: 'relay (open circle)', sample: sample(relay) },
  {
    key: 'off',
    label: 'off air under the failure set (cross)',
    sample: sample(
      <>
        {relay}
        <SvgOff d={crossShape(14, 12, 8)} />
      </>,
    ),
  },
  {
    key: 'reserve',
    label: 'on reserve under the failure set (half-filled ring)',
    sample: sample(
      <>
        <SvgReserve ring={ringShape(14, 12, 8)} half={halfShape(14, 12, 8)} />
        {relay}
      </>,
    ),
  },
];

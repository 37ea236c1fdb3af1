/**
 * Navigation and action icons, drawn for Headwater with react-native-svg on a
 * 24 x 24 grid, stroked so they stay crisp at any size. Icons always sit next
 * to a text label (docs/screens.md: icons with labels); they are hidden from
 * screen readers so the label is read once.
 */
import Svg, { Circle, Path } from 'react-native-svg';
import { colors } from '@/src/theme';

export type IconName = 'home' | 'reach' | 'network' | 'resilience' | 'inventory' | 'checks' | 'people' | 'calculator' | 'more' | 'signOut' | 'close' | 'retry' | 'mail';

interface Shape {
  paths: string[];
  dashed?: string[];
  dots?: Array<[number, number, number]>;
  rings?: Array<[number, number, number]>;
}

const SHAPES: Record<IconName, Shape> = {
  // A house: roof, walls, door.
  home: { paths: ['M3 11.5 12 4l9 7.5', 'M5.5 10v10h13V10', 'M10 20v-5.5h4V20'] },
  // A mast sending on one side and silent (crossed) on the other.
  reach: { paths: ['M12 10v11', 'M9 21l3-11 3 11', 'M7.6 5.2a6 6 0 0 0 0 7.6', 'M5 2.8a9.5 9.5 0 0 0 0 12.4', 'M16 5.5l4 4', 'M20 5.5l-4 4'] },
  // Three sites joined by feeds.
  network: { paths: ['M7.3 7.4 10.6 15', 'M16.7 7.4 13.4 15', 'M7.7 5.5h8.6'], rings: [[5.5, 5.5, 2.3], [18.5, 5.5, 2.3], [12, 18, 2.3]] },
  // A main path below and a reserve path (dashed) bridging over it.
  resilience: { paths: ['M3 18h18'], dashed: ['M5 18C5 5 19 5 19 18'], dots: [[5, 18, 2.2], [19, 18, 2.2]] },
  // A list of records.
  inventory: { paths: ['M9 6h11', 'M9 12h11', 'M9 18h11', 'M4 4.5h2.5V7H4z', 'M4 10.5h2.5V13H4z', 'M4 16.5h2.5V19H4z'] },
  // A clipboard with a tick.
  checks: { paths: ['M8 4.5H6v16h12v-16h-2', 'M9 3h6v3H9z', 'M8.8 13.2l2.3 2.3 4.2-4.6'] },
  // Two people.
  people: { paths: ['M2.5 20c0-3.6 2.7-6 6-6s6 2.4 6 6', 'M14.5 14.3c.6-.2 1.3-.3 2-.3 3 0 5 2.4 5 6'], rings: [[8.5, 8, 3.2], [16.5, 8.5, 2.6]] },
  calculator: { paths: ['M5 3h14v18H5z', 'M8 6.5h8v3H8z', 'M8.5 13h1', 'M11.5 13h1', 'M14.5 13h1', 'M8.5 16.5h1', 'M11.5 16.5h1', 'M14.5 16.5h1'] },
  more: { paths: [], dots: [[5, 12, 2], [12, 12, 2], [19, 12, 2]] },
  // Leaving through a door.
  signOut: { paths: ['M10 4H5v16h5', 'M14 8l4 4-4 4', 'M18 12H9'] },
  close: { paths: ['M6 6l12 12', 'M18 6 6 18'] },
  retry: { paths: ['M19 12a7 7 0 1 1-2.05-4.95', 'M19 4v4.5h-4.5'] },
  // an envelope: notices by mail
  mail: { paths: ['M3 6h18v12H3z', 'M3 6.5l9 6.5 9-6.5'] },
};

export interface IconProps {
  name: IconName;
  /** Edge length in px (default 24). */
  size?: number;
  color?: string;
  /** Stroke width in grid units (default 2). */
  weight?: number;
}

export function Icon({ name, size = 24, color = colors.ink, weight = 2 }: IconProps) {
  const shape = SHAPES[name];
  const stroke = { stroke: color, strokeWidth: weight, strokeLinecap: 'round' as const, strokeLinejoin: 'round' as const, fill: 'none' };
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" accessibilityElementsHidden importantForAccessibility="no-hide-descendants" aria-hidden>
      {shape.paths.map((d) => (
        <Path key={d} d={d} {...stroke} />
      ))}
      {shape.dashed?.map((d) => (
        <Path key={d} d={d} {...stroke} strokeDasharray="3 2.4" strokeLinecap="butt" />
      ))}
      {shape.rings?.map(([cx, cy, r]) => (
        <Circle key={`r${cx},${cy}`} cx={cx} cy={cy} r={r} {...stroke} />
      ))}
      {shape.dots?.map(([cx, cy, r]) => (
        <Circle key={`d${cx},${cy}`} cx={cx} cy={cy} r={r} fill={color} />
      ))}
    </Svg>
  );
}

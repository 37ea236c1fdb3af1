/**
 * The engineer's calculator: channels and frequencies, distance and bearing on WGS84, and
 * free-space screening figures. Worked out on this device with the shared RF library; only
 * the site search asks the server.
 */
import { useState } from 'react';
import { Columns } from '@/src/components/layout/Columns';
import { Screen } from '@/src/components/layout/Screen';
import { ScreeningCaution } from '../ScreeningCaution';
import { ChannelCalculator } from './ChannelCalculator';
import { HorizonCalculator } from './HorizonCalculator';
import { LinkCalculator } from './LinkCalculator';
import { PathCalculator, type PathHandOver } from './PathCalculator';
import type { HorizonText, LinkText } from './sums';

export function CalculatorScreen() {
  const [link, setLink] = useState<LinkText>({ frequencyMHz: '', distanceKm: '', power: '', powerUnit: 'W', reference: 'erp' });
  const [horizon, setHorizon] = useState<HorizonText>({ height1M: '', height2M: '', distanceKm: '', frequencyMHz: '' });

  const handOver = ({ distanceKm, heightsM }: PathHandOver) => {
    const d = String(distanceKm);
    setLink((l) => ({ ...l, distanceKm: d }));
    setHorizon((h) => ({ ...h, distanceKm: d, ...(heightsM ? { height1M: String(heightsM[0]), height2M: String(heightsM[1]) } : {}) }));
  };

  return (
    <Screen title="Calculator" subtitle="Channels, paths and free-space figures, worked out on this device" testID="calculator-screen">
      <ScreeningCaution />
      <Columns max={2}>
        <ChannelCalculator />
        <PathCalculator onHandOver={handOver} />
      </Columns>
      <Columns max={2}>
        <LinkCalculator value={link} onChange={setLink} />
        <HorizonCalculator value={horizon} onChange={setHorizon} />
      </Columns>
    </Screen>
  );
}

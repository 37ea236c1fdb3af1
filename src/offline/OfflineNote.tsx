/**
 * The line a screen shows when its answer came from the offline copy: which
 * network version it is and when this device fetched it, so nobody mistakes
 * it for the live network.
 */
import { WarningBox } from '@/src/components/WarningBox';
import { offlineLine } from './offlineLine';

export function OfflineNote({ networkVersion, fetchedAt }: { networkVersion: number; fetchedAt: string }) {
  return (
    <WarningBox title={offlineLine(networkVersion, fetchedAt)} testID="offline-note">
      Worked out on this device from its stored copy of the network. Changes made since then are not in it, and nothing can be changed until the connection returns.
    </WarningBox>
  );
}

/** Plain-English sentences for failed feed checks, one per check. */
import type { FeedCheck } from '@/shared/schemas/checks';

const n = (v: number | null | undefined, places = 1) => (v === null || v === undefined ? '?' : v.toFixed(places));

export function failureSentence(feed: string, c: FeedCheck): string {
  switch (c.name) {
    case 'field-strength':
      if (c.value === null) return `Feed ${feed}: no usable field strength: ${c.note}.`;
      return `Feed ${feed}: free-space field strength ${n(c.value)} dBµV/m is ${n((c.limit ?? 0) - c.value)} dB below the planning minimum of ${n(c.limit)} dBµV/m; even in free space the off-air feed is too weak.`;
    case 'horizon':
      return `Feed ${feed}: the path is ${n(c.value)} km long, beyond the ${n(c.limit)} km radio horizon of the two antennas (k = 4/3, smooth earth); there is no line of sight.`;
    case 'clearance':
      return `Feed ${feed}: the microwave path lacks ${n(-(c.value ?? 0))} m of clearance at mid-path over earth bulge plus 0.6 of the first Fresnel zone, even over a smooth earth.`;
    case 'channel-clash':
      return `Feed ${feed}: the relay receives and transmits on overlapping channels (${n(c.value, 3)} MHz apart) and is not declared an on-channel repeater.`;
    case 'bearing-record':
      return `Feed ${feed}: the recorded receive bearing is ${n(c.value)}° off the computed bearing to the source site (more than ${n(c.limit, 0)}°); check the record or the antenna.`;
    default:
      return `Feed ${feed}: check ${c.name} failed: ${c.note}.`;
  }
}

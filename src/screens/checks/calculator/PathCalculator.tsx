/**
 * Distance and bearings between two points on WGS84, each end picked from the site list or
 * typed as latitude and longitude. The path can be handed to the sums below.
 */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { SitePosition } from '@/src/api/schemas';
import { Button } from '@/src/components/Button';
import { Card } from '@/src/components/Card';
import { TextField } from '@/src/components/TextField';
import { colors, space, type } from '@/src/theme';
import { FigureList } from '../FigureList';
import { fixed, formatBearing, formatFigure } from '@/shared/format';
import { visibleError } from './input';
import { Result } from './Result';
import { SitePicker } from './SitePicker';
import { pathBetween, readPosition, type PositionText } from './sums';
import { useTouched } from './useTouched';

export interface PathHandOver {
  distanceKm: number;
  /** Ground plus mast height of each end, when both sites were picked and record them. */
  heightsM: [number, number] | null;
}

interface End {
  text: PositionText;
  site: SitePosition | null;
}

const EMPTY: End = { text: { lat: '', lon: '' }, site: null };
const topOf = (s: SitePosition | null) => (s && s.groundHeightM != null && s.mastHeightM != null ? s.groundHeightM + s.mastHeightM : null);

const AXES = [
  { key: 'lat', word: 'Latitude', placeholder: '52.1 or 52.1 N' },
  { key: 'lon', word: 'Longitude', placeholder: '-3.4 or 3.4 W' },
] as const;

function EndFields({ name, end, onChange }: { name: 'A' | 'B'; end: End; onChange: (next: End) => void }) {
  const { touched, touch } = useTouched<'lat' | 'lon'>();
  const { errors } = readPosition(end.text, name);
  return (
    <View style={styles.end}>
      <Text style={styles.endTitle}>{`End ${name}`}</Text>
      <SitePicker end={name} onPick={(s) => onChange({ site: s, text: { lat: String(s.lat), lon: String(s.lon) } })} />
      {end.site ? <Text style={styles.picked} testID={`calc-picked-${name}`}>{`Site ${end.site.name} (${end.site.code})`}</Text> : null}
      <View style={styles.pair}>
        {AXES.map(({ key, word, placeholder }) => (
          <View style={styles.half} key={key}>
            <TextField
              label={`${word} of ${name}`}
              value={end.text[key]}
              onChangeText={(value) => onChange({ site: null, text: { ...end.text, [key]: value } })}
              onBlur={() => touch(key)}
              error={visibleError(end.text[key], touched(key), errors[key])}
              placeholder={placeholder}
              mono
              keyboardType="numbers-and-punctuation"
              testID={`calc-${key}-${name}`}
            />
          </View>
        ))}
      </View>
    </View>
  );
}

export function PathCalculator({ onHandOver }: { onHandOver: (path: PathHandOver) => void }) {
  const [a, setA] = useState<End>(EMPTY);
  const [b, setB] = useState<End>(EMPTY);
  const { position: pa, errors: ea } = readPosition(a.text, 'A');
  const { position: pb, errors: eb } = readPosition(b.text, 'B');
  const path = pa && pb ? pathBetween(pa, pb) : null;
  // Red only for something typed wrong; an end not filled in yet is a prompt, not an error.
  const typedWrong = (a.text.lat.trim() !== '' && !!ea.lat) || (a.text.lon.trim() !== '' && !!ea.lon) || (b.text.lat.trim() !== '' && !!eb.lat) || (b.text.lon.trim() !== '' && !!eb.lon);
  const hA = topOf(a.site);
  const hB = topOf(b.site);
  const heights: [number, number] | null = hA !== null && hB !== null ? [hA, hB] : null;

  return (
    <Card title="Distance and bearing" testID="calc-path">
      <EndFields name="A" end={a} onChange={setA} />
      <EndFields name="B" end={b} onChange={setB} />
      {path ? (
        <>
          <FigureList
            testID="calc-path-figures"
            items={[
              { label: 'Distance (WGS84)', value: formatFigure(path.distanceKm, 'km'), testID: 'calc-distance' },
              { label: 'Bearing A → B', value: formatBearing(path.bearingAtoBDeg), hint: 'at A, from true north', testID: 'calc-bearing-ab' },
              { label: 'Reverse bearing B → A', value: formatBearing(path.bearingBtoADeg), hint: 'at B, from true north', testID: 'calc-bearing-ba' },
            ]}
          />
          <Button
            label={heights ? 'Use this path and the two mast tops below' : 'Use this distance below'}
            variant="secondary"
            onPress={() => onHandOver({ distanceKm: Number(fixed(path.distanceKm, 3)), heightsM: heights })}
            testID="calc-use-path"
          />
          {heights ? <Text style={styles.muted}>{`Mast tops above sea level: A ${heights[0]} m, B ${heights[1]} m (ground + mast).`}</Text> : null}
        </>
      ) : (
        <Result
          testID="calc-path-result"
          state={typedWrong ? 'invalid' : 'prompt'}
          text={typedWrong ? 'No distance: see the messages above.' : 'Pick or type both ends to see the distance and bearings.'}
        />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  end: { gap: space.sm, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  endTitle: { ...type.label, fontSize: 17 },
  picked: { ...type.body, fontSize: 16, color: colors.accent },
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  half: { flexGrow: 1, flexBasis: 150 },
  muted: { ...type.small },
});

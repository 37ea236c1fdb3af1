/** Radio horizon of two antennas (k = 4/3) and, for a path, earth bulge and F1 at mid-path. */
import { StyleSheet, View } from 'react-native';
import { Card } from '@/src/components/Card';
import { TextField } from '@/src/components/TextField';
import { space } from '@/src/theme';
import { FigureList, type FigureItem } from '../FigureList';
import { fixed, formatFigure } from '@/shared/format';
import { visibleError } from './input';
import { Result } from './Result';
import { horizonFigures, type HorizonText } from './sums';
import { useTouched } from './useTouched';

type Key = keyof HorizonText;

export function HorizonCalculator({ value, onChange }: { value: HorizonText; onChange: (next: HorizonText) => void }) {
  const { touched, touch } = useTouched<Key>();
  const { figures, errors } = horizonFigures(value);
  const set = (patch: Partial<HorizonText>) => onChange({ ...value, ...patch });
  const err = (k: Key) => visibleError(value[k], touched(k), errors[k]);
  const anyError = (['height1M', 'height2M', 'distanceKm', 'frequencyMHz'] as const).some((k) => err(k));

  const items: FigureItem[] = [];
  if (figures) {
    items.push(
      { label: 'Horizon of antenna 1', value: formatFigure(figures.horizon1Km, 'km'), testID: 'calc-horizon-1' },
      { label: 'Horizon of antenna 2', value: formatFigure(figures.horizon2Km, 'km'), testID: 'calc-horizon-2' },
      { label: 'Line-of-sight limit', value: formatFigure(figures.pathHorizonKm, 'km'), hint: 'sum of the two, k = 4/3, smooth earth', testID: 'calc-horizon' },
    );
    const mid = figures.midPath;
    if (mid) {
      items.push(
        {
          label: 'Path against horizon',
          value: mid.withinHorizon ? 'within' : 'beyond',
          hint: `${formatFigure(mid.distanceKm, 'km')} path, ${formatFigure(Math.abs(figures.pathHorizonKm - mid.distanceKm), 'km')} ${mid.withinHorizon ? 'to spare' : 'too long'}`,
          testID: 'calc-within-horizon',
        },
        { label: 'Earth bulge at mid-path', value: formatFigure(mid.earthBulgeM, 'm'), hint: 'k = 4/3', testID: 'calc-bulge' },
      );
      if (mid.fresnelF1M !== null) {
        items.push({ label: 'F1 at mid-path', value: formatFigure(mid.fresnelF1M, 'm'), hint: `0.6 F1 = ${fixed(0.6 * mid.fresnelF1M, 1)} m (ITU-R P.530)`, testID: 'calc-f1' });
      }
    }
  }

  return (
    <Card title="Radio horizon, earth bulge and Fresnel zone" testID="calc-horizon-card">
      <View style={styles.pair}>
        <View style={styles.half}>
          <TextField label="Height of antenna 1 (m)" value={value.height1M} onChangeText={(height1M) => set({ height1M })} onBlur={() => touch('height1M')} error={err('height1M')} mono keyboardType="decimal-pad" testID="calc-height-1" />
        </View>
        <View style={styles.half}>
          <TextField label="Height of antenna 2 (m)" value={value.height2M} onChangeText={(height2M) => set({ height2M })} onBlur={() => touch('height2M')} error={err('height2M')} mono keyboardType="decimal-pad" testID="calc-height-2" />
        </View>
      </View>
      <View style={styles.pair}>
        <View style={styles.half}>
          <TextField label="Path length (km)" value={value.distanceKm} onChangeText={(distanceKm) => set({ distanceKm })} onBlur={() => touch('distanceKm')} error={err('distanceKm')} hint="Optional: for bulge and F1" mono keyboardType="decimal-pad" testID="calc-path-length" />
        </View>
        <View style={styles.half}>
          <TextField label="F1 frequency (MHz)" value={value.frequencyMHz} onChangeText={(frequencyMHz) => set({ frequencyMHz })} onBlur={() => touch('frequencyMHz')} error={err('frequencyMHz')} hint="Optional: for the Fresnel zone" mono keyboardType="decimal-pad" testID="calc-f1-frequency" />
        </View>
      </View>
      {figures ? (
        <FigureList items={items} testID="calc-horizon-figures" />
      ) : (
        <Result testID="calc-horizon-result" state={anyError ? 'invalid' : 'prompt'} text={anyError ? 'No figures: see the messages above.' : 'Enter two antenna heights above the smooth earth (ground + antenna height above sea level for a screening bound).'} />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  half: { flexGrow: 1, flexBasis: 150 },
});

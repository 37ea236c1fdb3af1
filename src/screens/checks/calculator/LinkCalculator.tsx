/** Free-space loss and field strength for a frequency, a distance and a transmitter power. */
import { StyleSheet, View } from 'react-native';
import { Card } from '@/src/components/Card';
import { Choice } from '@/src/components/Choice';
import { TextField } from '@/src/components/TextField';
import { space } from '@/src/theme';
import { FigureList } from '../FigureList';
import { fixed, formatFigure, formatWatts } from '@/shared/format';
import type { PowerReference, PowerUnit } from './input';
import { visibleError } from './input';
import { Result } from './Result';
import { linkFigures, type LinkText } from './sums';
import { useTouched } from './useTouched';

const UNITS: readonly { value: PowerUnit; label: string }[] = [
  { value: 'W', label: 'W' },
  { value: 'dBW', label: 'dBW' },
  { value: 'dBm', label: 'dBm' },
];
const REFERENCES: readonly { value: PowerReference; label: string }[] = [
  { value: 'erp', label: 'e.r.p. (dipole)' },
  { value: 'eirp', label: 'e.i.r.p. (isotropic)' },
];

const dbwAndWatts = (dbw: number) => `${formatFigure(dbw, 'dBW')} (${formatWatts(10 ** (dbw / 10))})`;

export function LinkCalculator({ value, onChange }: { value: LinkText; onChange: (next: LinkText) => void }) {
  const { touched, touch } = useTouched<'frequencyMHz' | 'distanceKm' | 'power'>();
  const { figures, errors } = linkFigures(value);
  const set = (patch: Partial<LinkText>) => onChange({ ...value, ...patch });
  const err = (k: 'frequencyMHz' | 'distanceKm' | 'power') => visibleError(value[k], touched(k), errors[k]);
  const anyError = err('frequencyMHz') || err('distanceKm') || err('power');

  return (
    <Card title="Free-space loss and field strength" testID="calc-link">
      <View style={styles.pair}>
        <View style={styles.half}>
          <TextField label="Link frequency (MHz)" value={value.frequencyMHz} onChangeText={(frequencyMHz) => set({ frequencyMHz })} onBlur={() => touch('frequencyMHz')} error={err('frequencyMHz')} mono keyboardType="decimal-pad" testID="calc-link-frequency" />
        </View>
        <View style={styles.half}>
          <TextField label="Distance (km)" value={value.distanceKm} onChangeText={(distanceKm) => set({ distanceKm })} onBlur={() => touch('distanceKm')} error={err('distanceKm')} mono keyboardType="decimal-pad" testID="calc-link-distance" />
        </View>
      </View>
      <TextField label={`Transmitter power (${value.powerUnit})`} value={value.power} onChangeText={(power) => set({ power })} onBlur={() => touch('power')} error={err('power')} mono keyboardType="numbers-and-punctuation" testID="calc-link-power" />
      <Choice label="Power unit" options={UNITS} value={value.powerUnit} onChange={(powerUnit) => set({ powerUnit })} testID="calc-power-unit" />
      <Choice label="Power given as" options={REFERENCES} value={value.reference} onChange={(reference) => set({ reference })} testID="calc-power-reference" />
      {figures ? (
        <FigureList
          testID="calc-link-figures"
          items={[
            { label: 'Free-space loss', value: formatFigure(figures.lossDb, 'dB'), hint: 'ITU-R P.525', testID: 'calc-loss' },
            { label: 'Field strength', value: formatFigure(figures.fieldDbUvPerM, 'dBuV/m'), hint: value.reference === 'erp' ? 'free space, P.1546 Annex 5' : 'free space, P.525', testID: 'calc-field' },
            { label: 'e.r.p.', value: dbwAndWatts(figures.erpDbw), testID: 'calc-erp' },
            { label: 'e.i.r.p.', value: dbwAndWatts(figures.eirpDbw), hint: 'e.r.p. + 2.15 dB (ITU-R BS.561)', testID: 'calc-eirp' },
            { label: 'Power flux density', value: `${fixed(figures.pfdDbWPerM2, 1)} dBW/m²`, testID: 'calc-pfd' },
          ]}
        />
      ) : (
        <Result testID="calc-link-result" state={anyError ? 'invalid' : 'prompt'} text={anyError ? 'No figures: see the messages above.' : 'Enter a frequency, a distance and a power to see the loss and the field strength.'} />
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  half: { flexGrow: 1, flexBasis: 150 },
});

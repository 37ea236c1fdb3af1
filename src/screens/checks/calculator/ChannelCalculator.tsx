/** Channel or DAB block to centre frequency and edges, and a frequency back to its channel. */
import { useState } from 'react';
import type { Band } from '@/shared/rf/bands';
import { Card } from '@/src/components/Card';
import { Choice } from '@/src/components/Choice';
import { TextField } from '@/src/components/TextField';
import { visibleError } from './input';
import { Result } from './Result';
import { BAND_CHOICES, bandLabel, channelAt, channelOf, channelWords } from './sums';
import { useTouched } from './useTouched';

export function ChannelCalculator() {
  const [band, setBand] = useState<Band>('uhf-tv');
  const [channel, setChannel] = useState('');
  const [frequency, setFrequency] = useState('');
  const { touched, touch } = useTouched<'channel' | 'frequency'>();
  const hint = BAND_CHOICES.find((b) => b.value === band)?.channelHint;

  const fromChannel = channelOf(band, channel);
  const fromFrequency = channelAt(band, frequency);
  const channelError = visibleError(channel, touched('channel'), fromChannel.ok ? null : fromChannel.error);
  const frequencyError = visibleError(frequency, touched('frequency'), fromFrequency.ok ? null : fromFrequency.error);

  return (
    <Card title="Channel and frequency" testID="calc-channels">
      <Choice label="Band" options={BAND_CHOICES} value={band} onChange={setBand} testID="calc-band" />
      <TextField
        label="Channel"
        value={channel}
        onChangeText={setChannel}
        onBlur={() => touch('channel')}
        hint={hint}
        error={channelError}
        mono
        autoCapitalize="characters"
        autoCorrect={false}
        testID="calc-channel-input"
      />
      <Result
        testID="calc-frequency"
        state={fromChannel.ok ? 'answer' : channelError ? 'invalid' : 'prompt'}
        text={fromChannel.ok ? channelWords(fromChannel.value) : channelError ? 'No frequency: see the message under Channel.' : `Enter a ${bandLabel(band)} ${band === 'dab' ? 'block' : band === 'fm' ? 'frequency' : 'channel'} to see its centre frequency.`}
      />
      <TextField
        label="Frequency to look up (MHz)"
        value={frequency}
        onChangeText={setFrequency}
        onBlur={() => touch('frequency')}
        hint={`Any frequency; the ${bandLabel(band)} channel that holds it is named`}
        error={frequencyError}
        mono
        keyboardType="decimal-pad"
        testID="calc-frequency-input"
      />
      <Result
        testID="calc-channel"
        state={fromFrequency.ok ? 'answer' : frequencyError ? 'invalid' : 'prompt'}
        text={fromFrequency.ok ? channelWords(fromFrequency.value) : frequencyError ? 'No channel: see the message under Frequency to look up.' : `Enter a frequency to find its ${bandLabel(band)} channel.`}
      />
    </Card>
  );
}

/**
 * My notices (everyone signed in): mail me about everything, or about the
 * services and sites I choose, when a fault or planned work reaches them.
 */
import { useEffect, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useNoticeActions, useSubscription } from '@/src/api/queries/notices';
import { useServiceNames } from '@/src/api/queries/serviceNames';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { Screen } from '@/src/components/layout/Screen';
import { Section } from '@/src/components/layout/Section';
import { describeError, ErrorState, LoadingState } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { space, type } from '@/src/theme';
import { choiceText, parseCodes } from './codes';

type Scope = 'everything' | 'chosen';

export function MyNoticesScreen() {
  const sub = useSubscription();
  const services = useServiceNames();
  const actions = useNoticeActions();
  const [scope, setScope] = useState<Scope>('chosen');
  const [chosenServices, setChosenServices] = useState<string[]>([]);
  const [sites, setSites] = useState('');
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  useEffect(() => {
    if (!sub.data) return;
    setScope(sub.data.everything ? 'everything' : 'chosen');
    setChosenServices(sub.data.services);
    setSites(sub.data.sites.join(', '));
  }, [sub.data]);

  const run = async (what: () => Promise<void>, done: string) => {
    setBusy(true);
    setMessage(null);
    try {
      await what();
      setMessage(done);
    } catch (e) {
      setMessage(describeError(e));
    } finally {
      setBusy(false);
    }
  };
  const save = () =>
    run(
      () => actions.subscribe(scope === 'everything' ? { everything: true, services: [], sites: [] } : { everything: false, services: chosenServices, sites: parseCodes(sites) }),
      'Saved. Notices go to your sign-in address.',
    );
  const toggle = (code: string) => setChosenServices((list) => (list.includes(code) ? list.filter((c) => c !== code) : [...list, code]));

  return (
    <Screen title="My notices" subtitle="Mail when a fault or planned work reaches what you look after" testID="my-notices">
      {!sub.data ? (
        sub.error ? <ErrorState what="your notices" error={sub.error} onRetry={() => void sub.mutate()} /> : <LoadingState what="your notices" />
      ) : (
        <>
          <Section title="Now" testID="my-notices-now">
            <Text style={type.body}>
              {choiceText(sub.data)} — to {sub.data.email}
            </Text>
          </Section>
          <Section title="Change">
            <View style={styles.form}>
              <Choice<Scope>
                label="Tell me about"
                options={[
                  { value: 'everything', label: 'Everything' },
                  { value: 'chosen', label: 'Chosen services and sites' },
                ]}
                value={scope}
                onChange={setScope}
                testID="my-notices-scope"
              />
              {scope === 'chosen' ? (
                <>
                  <Text style={type.label}>Services</Text>
                  <View style={styles.wrap}>
                    {[...(services.data ?? new Map<string, string>()).entries()].map(([code, name]) => (
                      <Button
                        key={code}
                        label={`${chosenServices.includes(code) ? '✓ ' : ''}${name} (${code})`}
                        variant={chosenServices.includes(code) ? 'primary' : 'secondary'}
                        onPress={() => toggle(code)}
                        accessibilityLabel={`${chosenServices.includes(code) ? 'Chosen' : 'Not chosen'}: ${name}`}
                      />
                    ))}
                  </View>
                  <TextField label="Site codes" hint="Separated by commas or spaces" value={sites} onChangeText={setSites} mono autoCapitalize="characters" testID="my-notices-sites" />
                </>
              ) : null}
              <View style={styles.wrap}>
                <Button label="Save" onPress={() => void save()} busy={busy} testID="my-notices-save" />
                <Button label="Stop all my notices" variant="danger" onPress={() => void run(() => actions.unsubscribe(), 'You get no notices now.')} disabled={busy} />
              </View>
              {message ? (
                <Text style={type.body} accessibilityLiveRegion="polite" testID="my-notices-message">
                  {message}
                </Text>
              ) : null}
            </View>
          </Section>
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  form: { maxWidth: 640, gap: space.md },
  wrap: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

/** Outside contacts (admins): broadcasters' desks and site owners who never sign in, with their notice choice. */
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { contactInputSchema } from '@/shared/schemas/notices';
import { useContacts, useNoticeActions } from '@/src/api/queries/notices';
import { Button } from '@/src/components/Button';
import { Choice } from '@/src/components/Choice';
import { Section } from '@/src/components/layout/Section';
import { describeError, EmptyState, ErrorState, LoadingState } from '@/src/components/states';
import { TextField } from '@/src/components/TextField';
import { colors, space, type } from '@/src/theme';
import { AdminOnly, useIsNoticeAdmin } from './AdminOnly';
import { choiceText, parseCodes } from './codes';

function AddContact() {
  const actions = useNoticeActions();
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [organisation, setOrganisation] = useState('');
  const [scope, setScope] = useState<'everything' | 'chosen'>('chosen');
  const [services, setServices] = useState('');
  const [sites, setSites] = useState('');
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const add = async () => {
    const input = { name, email, organisation, everything: scope === 'everything', services: scope === 'everything' ? [] : parseCodes(services), sites: scope === 'everything' ? [] : parseCodes(sites) };
    const checked = contactInputSchema.safeParse(input);
    if (!checked.success) return setMessage(checked.error.issues[0].message);
    setBusy(true);
    try {
      await actions.addContact(input);
      setMessage(`Added ${name}.`);
      setName('');
      setEmail('');
      setOrganisation('');
    } catch (e) {
      setMessage(describeError(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <View style={styles.form}>
      <TextField label="Name" value={name} onChangeText={setName} />
      <TextField label="Email" value={email} onChangeText={setEmail} autoCapitalize="none" keyboardType="email-address" />
      <TextField label="Organisation" value={organisation} onChangeText={setOrganisation} />
      <Choice label="Tell them about" options={[{ value: 'everything', label: 'Everything' }, { value: 'chosen', label: 'Chosen services and sites' }]} value={scope} onChange={setScope} />
      {scope === 'chosen' ? (
        <>
          <TextField label="Service codes" hint="Separated by commas or spaces" value={services} onChangeText={setServices} mono autoCapitalize="characters" />
          <TextField label="Site codes" hint="Separated by commas or spaces" value={sites} onChangeText={setSites} mono autoCapitalize="characters" />
        </>
      ) : null}
      <Button label="Add contact" onPress={() => void add()} busy={busy} />
      {message ? (
        <Text style={type.body} accessibilityLiveRegion="polite">
          {message}
        </Text>
      ) : null}
    </View>
  );
}

export function ContactsScreen() {
  const contacts = useContacts(useIsNoticeAdmin());
  const actions = useNoticeActions();
  return (
    <AdminOnly title="Outside contacts" subtitle="People told by mail who never sign in" testID="contacts">
      <Section title="Contacts" note={contacts.data ? `${contacts.data.items.length}` : undefined}>
        {!contacts.data ? (
          contacts.error ? <ErrorState what="the contacts" error={contacts.error} onRetry={() => void contacts.mutate()} /> : <LoadingState what="the contacts" />
        ) : contacts.data.items.length === 0 ? (
          <EmptyState title="No contacts" message="Add one below." />
        ) : (
          contacts.data.items.map((c) => (
            <View key={c.id} style={styles.row}>
              <View style={styles.text}>
                <Text style={type.label}>
                  {c.name}
                  {c.organisation ? `, ${c.organisation}` : ''}
                </Text>
                <Text style={type.small}>
                  {c.email}: {choiceText(c)}
                </Text>
              </View>
              <Button label="Remove" variant="danger" onPress={() => void actions.removeContact(c.id)} accessibilityLabel={`Remove ${c.name}`} />
            </View>
          ))
        )}
      </Section>
      <Section title="Add a contact">
        <AddContact />
      </Section>
    </AdminOnly>
  );
}

const styles = StyleSheet.create({
  form: { maxWidth: 640, gap: space.md },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md, paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line },
  text: { flex: 1, minWidth: 200 },
});

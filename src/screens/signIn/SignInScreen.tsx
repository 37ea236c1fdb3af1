/**
 * Sign in with email and password. Shows the form and, after a refusal, one
 * plain message; nothing else. On success goes to `next` (a same-origin path,
 * see src/session/nextPath.ts) or Home. After a sign-in with a temporary
 * password (set by an admin) the person chooses a new one first: the session
 * starts only with the token the change hands back.
 */
import Head from 'expo-router/head';
import { Redirect, useLocalSearchParams } from 'expo-router';
import { useRef, useState } from 'react';
import { KeyboardAvoidingView, Platform, ScrollView, StyleSheet, Text, View, type TextInput } from 'react-native';
import { api } from '@/shared/api';
import { parseAnswer, request } from '@/src/api/client';
import { loginAnswerSchema, type LoginAnswer } from '@/src/api/schemas';
import { changePasswordWith } from '@/src/api/queries/ownAccount';
import { ChangePasswordForm } from '@/src/components/account/ChangePasswordForm';
import { Button } from '@/src/components/Button';
import { BrandMark } from '@/src/components/nav/BrandMark';
import { LoadingState } from '@/src/components/states';
import { StatusShape } from '@/src/components/StatusShape';
import { TextField } from '@/src/components/TextField';
import { heading } from '@/src/components/webAria';
import { safeNextPath } from '@/src/session/nextPath';
import { useSession } from '@/src/session/SessionProvider';
import { colors, radius, space, type } from '@/src/theme';
import { checkSignInFields, signInFailureMessage, type SignInFieldErrors } from './signInErrors';

export function SignInScreen() {
  const session = useSession();
  const params = useLocalSearchParams<{ next?: string }>();
  const next = safeNextPath(params.next);

  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [fieldErrors, setFieldErrors] = useState<SignInFieldErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [sending, setSending] = useState(false);
  /** signed in with a temporary password: the new one must be chosen before the session starts */
  const [pending, setPending] = useState<LoginAnswer | null>(null);
  const passwordRef = useRef<TextInput>(null);

  if (session.status === 'restoring') return <LoadingState what="your session" />;
  // Also the way out after a successful sign-in: the session changes and this redirects.
  if (session.status === 'signedIn') return <Redirect href={next} />;

  async function submit() {
    if (sending) return;
    const errors = checkSignInFields(email, password);
    setFieldErrors(errors);
    setFailure(null);
    if (errors.email || errors.password) return;
    setSending(true);
    try {
      const answer = parseAnswer(loginAnswerSchema, api.login, await request(api.login, { method: 'POST', body: { email: email.trim(), password } }));
      if (answer.user.mustChangePassword) {
        setPending(answer);
        setSending(false);
        return;
      }
      session.signIn(answer.token, answer.user);
    } catch (e) {
      setFailure(signInFailureMessage(e));
      setPassword('');
      setSending(false);
    }
  }

  if (pending) {
    return (
      <KeyboardAvoidingView style={styles.page} behavior={Platform.OS === 'ios' ? 'padding' : undefined}>
        <Head>
          <title>Choose a new password · Headwater</title>
        </Head>
        <ScrollView contentContainerStyle={styles.scroll} keyboardShouldPersistTaps="handled" role="main">
          <View style={styles.card} testID="must-change-password">
            <BrandMark size={32} />
            <Text style={styles.title} {...heading(1)}>
              Choose a new password
            </Text>
            <Text style={styles.lead}>
              {`${pending.user.email} has a temporary password set by an admin. Choose your own before going on; the temporary one then stops working.`}
            </Text>
            <ChangePasswordForm
              currentLabel="Temporary password"
              submitLabel="Save and continue"
              onSubmit={async (current, next) => {
                const answer = await changePasswordWith(pending.token, current, next);
                session.signIn(answer.token, answer.user);
              }}
              onCancel={() => {
                setPending(null);
                setPassword('');
              }}
              testID="forced-change"
            />
          </View>
        </ScrollView>
      </KeyboardAvoidingView>
    );
  }

  return (
    <KeyboardAvoidingView style={styles.page} behavior={Platform.OS === 'ios' ? 'padding' : undefined}>
      <Head>
        <title>Sign in · Headwater</title>
      </Head>
      <ScrollView contentContainerStyle={styles.scroll} keyboardShouldPersistTaps="handled" role="main">
        <View style={styles.card} role="form" aria-label="Sign in">
          <BrandMark size={32} />
          <Text style={styles.title} {...heading(1)}>
            Sign in
          </Text>
          {failure ? (
            <View style={styles.failure} accessibilityRole="alert" accessibilityLiveRegion="assertive" testID="sign-in-error">
              <StatusShape shape="cross" color={colors.bad} size={18} />
              <Text style={styles.failureText}>{failure}</Text>
            </View>
          ) : null}
          <TextField
            label="Email"
            value={email}
            onChangeText={setEmail}
            error={fieldErrors.email}
            keyboardType="email-address"
            autoCapitalize="none"
            autoCorrect={false}
            autoComplete="email"
            textContentType="username"
            returnKeyType="next"
            onSubmitEditing={() => passwordRef.current?.focus()}
            testID="sign-in-email"
          />
          <TextField
            ref={passwordRef}
            label="Password"
            value={password}
            onChangeText={setPassword}
            error={fieldErrors.password}
            secureTextEntry
            autoCapitalize="none"
            autoComplete="current-password"
            textContentType="password"
            returnKeyType="go"
            onSubmitEditing={() => void submit()}
            testID="sign-in-password"
          />
          <Button label="Sign in" onPress={() => void submit()} busy={sending} testID="sign-in-submit" />
        </View>
      </ScrollView>
    </KeyboardAvoidingView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.canvas },
  scroll: { flexGrow: 1, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  card: {
    width: '100%',
    maxWidth: 420,
    backgroundColor: colors.surface,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.xl,
    gap: space.lg,
  },
  title: { ...type.title },
  lead: { ...type.body },
  failure: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    padding: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderLeftWidth: 6,
    borderColor: colors.bad,
    backgroundColor: colors.badSoft,
  },
  failureText: { ...type.body, color: colors.bad, flexShrink: 1 },
});

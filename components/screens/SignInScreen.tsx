/** Sign-in: email and password for a session; the guard in app/_layout.tsx moves on from here. */
import { useRef, useState } from 'react';
import { ScrollView, StyleSheet, type TextInput, View } from 'react-native';

import { BrandMark } from '@/components/shell/BrandMark';
import { AppText } from '@/components/ui/AppText';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { TextField } from '@/components/ui/TextField';
import { colors, layout, radius, space } from '@/constants/theme';
import { useLogin } from '@/hooks/api/auth';
import { ApiError } from '@/hooks/api/client';
import { useSession } from '@/hooks/session/SessionProvider';
import { useDocumentTitle } from '@/hooks/useDocumentTitle';

/**
 * The server words its refusals for people (wrong password, disabled account, too many
 * attempts); the client adds its own only for a dropped connection or an unexpected failure.
 */
function signInMessage(error: unknown): string {
  return error instanceof ApiError ? error.message : 'Sign-in failed. Try again.';
}

export function SignInScreen() {
  const { state, signIn } = useSession();
  const login = useLogin();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [missing, setMissing] = useState<{ email?: string; password?: string }>({});
  const passwordRef = useRef<TextInput>(null);
  useDocumentTitle('Sign in');
  const expired = state.status === 'signed-out' && state.reason === 'expired';

  const submit = () => {
    const trimmed = email.trim();
    const problems = {
      email: trimmed ? undefined : 'Enter your email address.',
      password: password ? undefined : 'Enter your password.',
    };
    setMissing(problems);
    if (problems.email || problems.password || login.isPending) return;
    login.mutate({ email: trimmed, password }, { onSuccess: (session) => signIn(session) });
  };

  return (
    <ScrollView
      style={styles.page}
      contentContainerStyle={styles.content}
      keyboardShouldPersistTaps="handled"
      role="main"
    >
      <View style={styles.column}>
        <View style={styles.brand}>
          <BrandMark size="large" />
          <AppText tone="muted">Flow data historian for differential-pressure meter runs</AppText>
        </View>

        <View style={styles.card}>
          <AppText variant="title" role="heading" aria-level={1}>
            Sign in
          </AppText>
          {expired && !login.error ? <Notice>Your session has ended. Sign in again to carry on.</Notice> : null}
          {login.error ? (
            <Notice tone="error" testID="sign-in-error">
              {signInMessage(login.error)}
            </Notice>
          ) : null}
          <TextField
            label="Email"
            testID="sign-in-email"
            value={email}
            onChangeText={setEmail}
            error={missing.email}
            autoCapitalize="none"
            autoCorrect={false}
            autoComplete="email"
            inputMode="email"
            keyboardType="email-address"
            returnKeyType="next"
            onSubmitEditing={() => passwordRef.current?.focus()}
            autoFocus
          />
          <TextField
            ref={passwordRef}
            label="Password"
            testID="sign-in-password"
            value={password}
            onChangeText={setPassword}
            error={missing.password}
            secureTextEntry
            autoComplete="current-password"
            returnKeyType="go"
            onSubmitEditing={submit}
          />
          <Button testID="sign-in-submit" label="Sign in" variant="primary" onPress={submit} busy={login.isPending} />
        </View>

        <AppText variant="caption" tone="muted" style={styles.footer}>
          Tallyrun supports, but does not replace, licensed measurement practice and local codes.
        </AppText>
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.background },
  content: { flexGrow: 1, justifyContent: 'center', padding: space.lg },
  column: { width: '100%', maxWidth: layout.formMaxWidth, alignSelf: 'center', gap: space.xl },
  brand: { gap: space.sm },
  card: {
    gap: space.lg,
    padding: space.xl,
    backgroundColor: colors.surface,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.md,
  },
  footer: { textAlign: 'center' },
});

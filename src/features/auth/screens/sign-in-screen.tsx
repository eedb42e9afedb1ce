import { useRef } from 'react';
import { Redirect, type Href } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View, type TextInput } from 'react-native';
import { applyServerErrors } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Loading } from '@/components/ui/loading';
import { space } from '@/theme';
import { AuthFrame } from '../components/auth-frame';
import { signInFormSchema, type SignInFormValues } from '../forms';
import { safeNext, useSession, useSignIn } from '@/lib/session';
import { TextField } from '@/components/ui/text-field';

const initialValues: SignInFormValues = { email: '', password: '' };

export function SignInScreen({ next }: { next?: string | string[] }) {
  const session = useSession();
  const signIn = useSignIn();
  const passwordRef = useRef<TextInput>(null);

  if (session.isPending) return <Loading fill label="Checking your session…" />;
  // Signed in (already, or just now): straight on to where they were going.
  if (session.data) return <Redirect href={safeNext(next) as Href} />;

  return (
    <AuthFrame testID="sign-in-screen">
      <Formik
        initialValues={initialValues}
        validationSchema={signInFormSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          try {
            await signIn.mutateAsync({ email: values.email.trim(), password: values.password });
          } catch (e) {
            applyServerErrors(e, ['email', 'password'], helpers);
          }
        }}
      >
        {(f) => (
          <Card style={styles.card}>
            <View style={styles.heading}>
              <AppText variant="title" role="heading" aria-level={1}>
                Sign in
              </AppText>
              <AppText variant="small">Use the e-mail address your administrator invited.</AppText>
            </View>
            {typeof f.status === 'string' ? <Banner kind="due" title="Not signed in" message={f.status} testID="sign-in-form-error" /> : null}
            <TextField
              label="E-mail"
              value={f.values.email}
              onChangeText={f.handleChange('email')}
              onBlur={f.handleBlur('email')}
              error={f.touched.email ? f.errors.email : undefined}
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
              value={f.values.password}
              onChangeText={f.handleChange('password')}
              onBlur={f.handleBlur('password')}
              error={f.touched.password ? f.errors.password : undefined}
              secureTextEntry
              revealable
              autoComplete="current-password"
              textContentType="password"
              returnKeyType="go"
              onSubmitEditing={() => f.handleSubmit()}
              testID="sign-in-password"
            />
            <Button title="Sign in" busyTitle="Signing in…" busy={f.isSubmitting} onPress={() => f.handleSubmit()} block testID="sign-in-submit" />
          </Card>
        )}
      </Formik>
      <AppText variant="small" style={styles.note}>
        New to Toolgate? Your administrator sends an invitation e-mail with a link to choose your password. Forgot it? Ask them for a new
        invitation.
      </AppText>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, padding: space.xl },
  heading: { gap: space.xs, marginBottom: space.sm },
  note: { paddingHorizontal: space.xs },
});

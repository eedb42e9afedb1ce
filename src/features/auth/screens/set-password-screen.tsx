import { Redirect } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { applyServerErrors } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/theme';
import { AuthFrame } from '../components/auth-frame';
import { PASSWORD_MIN, setPasswordFormSchema, type SetPasswordFormValues } from '../forms';
import { useSession, useSetPassword } from '@/lib/session';

const initialValues: SetPasswordFormValues = { password: '', confirm: '' };

/** Landing page of the invitation e-mail: `/set-password?token=...`. */
export function SetPasswordScreen({ token }: { token?: string }) {
  const setPassword = useSetPassword();
  const session = useSession();

  if (setPassword.isSuccess && session.data) return <Redirect href="/inbox" />;

  if (!token) {
    return (
      <AuthFrame testID="set-password-screen">
        <Banner
          kind="due"
          title="This link is incomplete"
          message="Open the link from your invitation e-mail again, the whole of it. If it still fails, ask your administrator for a new invitation."
          testID="set-password-no-token"
        />
        <Button title="Go to sign-in" href="/sign-in" variant="secondary" icon="chevron-left" />
      </AuthFrame>
    );
  }

  return (
    <AuthFrame testID="set-password-screen">
      <Formik
        initialValues={initialValues}
        validationSchema={setPasswordFormSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          try {
            await setPassword.mutateAsync({ token, password: values.password });
          } catch (e) {
            applyServerErrors(e, ['password'], helpers);
          }
        }}
      >
        {(f) => (
          <Card style={styles.card}>
            <View style={styles.heading}>
              <AppText variant="title" role="heading" aria-level={1}>
                Choose your password
              </AppText>
              <AppText variant="small">
                At least {PASSWORD_MIN} characters. A short sentence is easy to remember and hard to guess.
              </AppText>
            </View>
            {typeof f.status === 'string' ? <Banner kind="due" title="Password not set" message={f.status} testID="set-password-form-error" /> : null}
            <TextField
              label="New password"
              value={f.values.password}
              onChangeText={f.handleChange('password')}
              onBlur={f.handleBlur('password')}
              error={f.touched.password ? f.errors.password : undefined}
              secureTextEntry
              revealable
              autoComplete="new-password"
              textContentType="newPassword"
              testID="set-password-password"
            />
            <TextField
              label="Same password again"
              value={f.values.confirm}
              onChangeText={f.handleChange('confirm')}
              onBlur={f.handleBlur('confirm')}
              error={f.touched.confirm ? f.errors.confirm : undefined}
              secureTextEntry
              revealable
              autoComplete="new-password"
              onSubmitEditing={() => f.handleSubmit()}
              testID="set-password-confirm"
            />
            <Button title="Set password and sign in" busyTitle="Saving…" busy={f.isSubmitting} onPress={() => f.handleSubmit()} block testID="set-password-submit" />
          </Card>
        )}
      </Formik>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.sm, padding: space.xl },
  heading: { gap: space.xs, marginBottom: space.sm },
});

import { useState } from 'react';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import type { User } from '@shared/schemas/users';
import { applyServerErrors } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Screen } from '@/components/ui/screen';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/theme';
import { UserRoleFields } from '../components/user-fields';
import { toUserPayload, userFormSchema, type UserFormValues } from '../forms';
import { useCreateUser } from '../hooks';

const blank: UserFormValues = { name: '', email: '', role: 'designer', brandIds: [], factoryId: null, timeZone: 'UTC' };
const fields = ['name', 'email', 'role', 'brandIds', 'factoryId', 'timeZone'] as const;

export function UserCreateScreen() {
  const create = useCreateUser();
  const [invited, setInvited] = useState<User | null>(null);

  return (
    <Screen title="Invite a user" eyebrow="Admin" back={{ href: '/admin/users', label: 'Users' }} width="form" testID="user-create">
      {invited ? (
        <Banner kind="go" title={`Invitation sent to ${invited.email}`} testID="user-invited">
          <AppText variant="body">
            {invited.name} gets an e-mail with a link to choose a password. The link works for 7 days.
          </AppText>
          <View style={styles.row}>
            <Button title="Open user" variant="secondary" href={{ pathname: '/admin/users/[id]', params: { id: invited.id } }} />
            <Button title="Back to users" variant="quiet" href="/admin/users" />
          </View>
        </Banner>
      ) : null}
      <Formik
        initialValues={blank}
        validationSchema={userFormSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          setInvited(null);
          try {
            const user = await create.mutateAsync(toUserPayload({ ...values, email: values.email.trim() }));
            setInvited(user);
            helpers.resetForm();
          } catch (e) {
            applyServerErrors(e, fields, helpers);
          }
        }}
      >
        {(f) => (
          <Card style={styles.card}>
            {typeof f.status === 'string' ? <Banner kind="due" title="Not invited" message={f.status} testID="user-create-error" /> : null}
            <TextField
              label="Full name"
              value={f.values.name}
              onChangeText={f.handleChange('name')}
              onBlur={f.handleBlur('name')}
              error={f.touched.name || f.submitCount ? f.errors.name : undefined}
              autoComplete="off"
              testID="user-name"
            />
            <TextField
              label="E-mail"
              value={f.values.email}
              onChangeText={f.handleChange('email')}
              onBlur={f.handleBlur('email')}
              error={f.touched.email || f.submitCount ? f.errors.email : undefined}
              keyboardType="email-address"
              autoCapitalize="none"
              autoCorrect={false}
              autoComplete="off"
              hint="The invitation goes to this address."
              testID="user-email"
            />
            <UserRoleFields f={f} />
            <Button title="Send invitation" icon="mail" busy={f.isSubmitting} busyTitle="Sending…" onPress={() => f.handleSubmit()} block testID="user-create-submit" />
          </Card>
        )}
      </Formik>
    </Screen>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.xs, padding: space.xl },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.sm },
});

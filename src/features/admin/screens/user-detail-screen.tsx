import { useState } from 'react';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';
import { roleLabels, type User } from '@shared/schemas/users';
import { applyServerErrors, toUserMessage } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmBox } from '@/components/ui/confirm-box';
import { DetailRow } from '@/components/ui/detail-row';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { TextField } from '@/components/ui/text-field';
import { useSession } from '@/lib/session';
import { space } from '@/theme';
import { UserRoleFields } from '../components/user-fields';
import { toUserPayload, userEditFormSchema, type UserEditFormValues } from '../forms';
import { useUpdateUser, useUser } from '../hooks';
import { UserStatus } from '../components/user-status';

const back = { href: '/admin/users' as const, label: 'Users' };
const fields = ['name', 'role', 'brandIds', 'factoryId', 'timeZone'] as const;

export function UserDetailScreen({ userId }: { userId: string }) {
  const user = useUser(userId);
  if (user.isPending) return <Loading fill label="Loading user…" />;
  if (user.isError) {
    return (
      <Screen title="User" eyebrow="Admin" back={back}>
        <ErrorState error={user.error} onRetry={() => void user.refetch()} />
      </Screen>
    );
  }
  if (!user.data) {
    return (
      <Screen title="User not found" eyebrow="Admin" back={back}>
        <EmptyState icon="search" title="No such user" body="The link may be old. Find the person in the user list." action={{ title: 'Open users', href: '/admin/users' }} />
      </Screen>
    );
  }
  return <UserDetail user={user.data} />;
}

function UserDetail({ user }: { user: User }) {
  const { data: me } = useSession();
  const update = useUpdateUser(user.id);
  const [saved, setSaved] = useState(false);
  const isSelf = me?.id === user.id;
  const initial: UserEditFormValues = {
    name: user.name,
    role: user.role,
    brandIds: user.brandIds,
    factoryId: user.factoryId,
    timeZone: user.timeZone,
  };

  return (
    <Screen title={user.name} eyebrow={roleLabels[user.role]} back={back} testID="user-detail">
      <Card padded={false}>
        <View style={styles.details}>
          <DetailRow label="E-mail" value={user.email} testID="user-detail-email" />
          <DetailRow label="Status" value={<UserStatus user={user} />} />
          <DetailRow label="Added" value={user.createdAt.slice(0, 10)} mono divider={false} />
        </View>
      </Card>
      {user.invitationPending && user.active ? (
        <Banner kind="due" title="Invitation not used yet" message="This person has not chosen a password. The link in their e-mail works for 7 days from the invitation." />
      ) : null}

      <Section title="Role and assignments">
        <Formik
          initialValues={initial}
          enableReinitialize
          validationSchema={userEditFormSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            setSaved(false);
            try {
              await update.mutateAsync(toUserPayload(values));
              setSaved(true);
            } catch (e) {
              applyServerErrors(e, fields, helpers);
            }
          }}
        >
          {(f) => (
            <Card style={styles.form}>
              {saved && !f.dirty ? <Banner kind="go" title="Changes saved" testID="user-saved" /> : null}
              {typeof f.status === 'string' ? <Banner kind="due" title="Not saved" message={f.status} testID="user-save-error" /> : null}
              {isSelf ? <Banner kind="info" message="This is you. You cannot remove your own administrator role." /> : null}
              <TextField
                label="Full name"
                value={f.values.name}
                onChangeText={f.handleChange('name')}
                onBlur={f.handleBlur('name')}
                error={f.touched.name || f.submitCount ? f.errors.name : undefined}
                testID="user-name"
              />
              <UserRoleFields f={f} />
              <Button title="Save changes" icon="check" busy={f.isSubmitting} busyTitle="Saving…" disabled={!f.dirty} onPress={() => f.handleSubmit()} testID="user-save" />
            </Card>
          )}
        </Formik>
      </Section>

      <Section title="Access">{isSelf ? <AppText variant="small">You cannot deactivate your own account.</AppText> : <AccessControl user={user} />}</Section>
    </Screen>
  );
}

function AccessControl({ user }: { user: User }) {
  const update = useUpdateUser(user.id);
  const [asking, setAsking] = useState(false);
  const deactivating = user.active;

  if (asking) {
    return (
      <ConfirmBox
        title={deactivating ? `Deactivate ${user.name}?` : `Reactivate ${user.name}?`}
        message={
          deactivating
            ? 'They are signed out at once and cannot sign in again until reactivated. Their sign-offs and history stay as they are.'
            : 'They can sign in again with their password, with the role and assignments shown above.'
        }
        confirmTitle={deactivating ? 'Deactivate' : 'Reactivate'}
        tone={deactivating ? 'due' : 'info'}
        busy={update.isPending}
        onConfirm={() => update.mutate({ active: !user.active }, { onSuccess: () => setAsking(false) })}
        onCancel={() => {
          update.reset();
          setAsking(false);
        }}
        testID="user-access-confirm"
      />
    );
  }
  return (
    <Card>
      {update.isError ? <Banner kind="due" message={toUserMessage(update.error)} /> : null}
      <AppText variant="body">
        {deactivating ? 'Active: can sign in and act in their role.' : 'Deactivated: cannot sign in. Their history is kept.'}
      </AppText>
      <Button
        title={deactivating ? 'Deactivate…' : 'Reactivate…'}
        icon={deactivating ? 'inactive' : 'refresh'}
        variant="secondary"
        onPress={() => setAsking(true)}
        testID="user-access-toggle"
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  details: { paddingHorizontal: space.lg },
  form: { gap: space.xs, padding: space.xl },
});

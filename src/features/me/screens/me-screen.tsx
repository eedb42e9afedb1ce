import { StyleSheet, View } from 'react-native';
import { roleLabels } from '@shared/schemas/users';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DetailRow } from '@/components/ui/detail-row';
import { ListRow } from '@/components/ui/list-row';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { toUserMessage } from '@/api/errors';
import { useSession, useSignOut } from '@/lib/session';
import { space } from '@/theme';

export function MeScreen() {
  const { data: me } = useSession();
  const signOut = useSignOut();
  if (!me) return <Loading fill />;
  const isToolmaker = me.role === 'toolmaker';
  return (
    <Screen title={me.name} eyebrow={roleLabels[me.role]} testID="me-screen">
      <Card padded={false}>
        <View style={styles.details}>
          <DetailRow label="Name" value={me.name} testID="me-name" />
          <DetailRow label="Role" value={roleLabels[me.role]} testID="me-role" />
          <DetailRow label="E-mail" value={me.email} testID="me-email" />
          {isToolmaker ? (
            <DetailRow label="Factory" value={me.factoryName ?? ''} testID="me-factory" />
          ) : (
            <DetailRow label="Brands" value={me.brandNames.length ? me.brandNames.join(', ') : me.role === 'admin' ? 'All (administrator)' : ''} testID="me-brands" />
          )}
          <DetailRow label="Time zone" value={me.timeZone} mono divider={false} testID="me-time-zone" />
        </View>
      </Card>
      {me.role === 'admin' ? (
        <Section title="Administration" description="People, roles, brands and factories.">
          <Card padded={false}>
            <ListRow title="Open administration" subtitle="Users, brands, factories" leadingIcon="shield" href="/admin" divider={false} testID="me-admin-link" />
          </Card>
        </Section>
      ) : null}
      <Section title="Session">
        {signOut.isError ? <Banner kind="due" message={toUserMessage(signOut.error)} /> : null}
        <Button title="Sign out" icon="sign-out" variant="secondary" busy={signOut.isPending} busyTitle="Signing out…" onPress={() => signOut.mutate()} testID="sign-out" />
      </Section>
    </Screen>
  );
}

const styles = StyleSheet.create({
  details: { paddingHorizontal: space.lg },
});

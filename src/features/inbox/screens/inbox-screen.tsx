import { StyleSheet, View } from 'react-native';
import { useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/schemas/users';
import { workflowQueries } from '@/api/workflow';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { usableZone } from '@/lib/requests/workflow-format';
import { useSession } from '@/lib/session';
import { colors, space } from '@/theme';
import { InboxRow } from '../components/inbox-row';

const emptyBody: Record<Role, string> = {
  designer: 'Your drafts wait here to be signed and submitted, and first samples of your changes wait here to be accepted.',
  engineer: 'Requests arrive here for engineering review, for the cut to be recorded and for first samples to be accepted.',
  brand_lead: 'Changes to your brands\u2019 tools arrive here when they need your approval.',
  toolmaker: 'Changes cleared to cut on your factory\u2019s tools arrive here for the cut and the first samples to be recorded.',
  admin: 'An administrator signs nothing; requests wait here for the people whose role signs them.',
};

/** What waits for my signature: overdue first, then the oldest; the ones that cannot be undone marked. */
export function InboxScreen() {
  const session = useSession();
  const me = session.data;
  const zone = usableZone(me?.timeZone);
  const q = useQuery(workflowQueries.inbox());
  const meta = q.data?.meta;
  const subtitle = !meta
    ? 'What waits for your signature'
    : meta.total === 0
      ? 'What waits for your signature'
      : `${meta.total} ${meta.total === 1 ? 'request waits' : 'requests wait'} for you${meta.overdue ? ` · ${meta.overdue} overdue` : ''}`;
  return (
    <Screen
      title="Inbox"
      subtitle={subtitle}
      actions={
        q.data && q.data.data.length > 0 ? (
          <Button title="Refresh" icon="refresh" variant="secondary" busy={q.isFetching} busyTitle="Refreshing…" onPress={() => void q.refetch()} testID="inbox-refresh" />
        ) : null
      }
      testID="inbox-screen"
    >
      {q.isPending ? (
        <Loading label="Loading what waits for you…" />
      ) : q.isError ? (
        <ErrorState error={q.error} onRetry={() => void q.refetch()} testID="inbox-error" />
      ) : q.data.data.length === 0 ? (
        <EmptyState
          icon="inbox"
          title="Nothing waits for you"
          body={me ? emptyBody[me.role] : 'Change requests arrive here when they reach a stage your role signs.'}
          action={{ title: 'See all requests', href: '/requests', icon: 'requests' }}
          testID="inbox-empty"
        />
      ) : (
        <>
          {meta && meta.overdue > 0 ? (
            <View style={styles.overdue} testID="inbox-overdue">
              <Icon name="alert" size={18} color={colors.due} />
              <AppText variant="label" tone="due">
                {meta.overdue} overdue: {meta.overdue === 1 ? 'it is' : 'they are'} listed first.
              </AppText>
            </View>
          ) : null}
          <Card padded={false} testID="inbox-list">
            {q.data.data.map((item, i) => (
              <InboxRow key={item.id} item={item} divider={i < q.data.data.length - 1} timeZone={zone} now={new Date()} />
            ))}
          </Card>
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  overdue: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});

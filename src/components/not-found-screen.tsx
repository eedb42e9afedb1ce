import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';

export function NotFoundScreen() {
  return (
    <Screen width="form" testID="not-found-screen">
      <EmptyState
        icon="search"
        title="No page at this address"
        body="The link may be mistyped, or the record was moved. Start again from your inbox."
        action={{ title: 'Go to the inbox', href: '/inbox', icon: 'inbox' }}
        testID="not-found"
      />
    </Screen>
  );
}

import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';

/** What waits for my signature. Placeholder until change requests exist. */
export function InboxScreen() {
  return (
    <Screen title="Inbox" subtitle="What waits for your signature" testID="inbox-screen">
      <EmptyState
        icon="inbox"
        title="Nothing waits for you"
        body="Change requests arrive here when they reach a stage your role signs: design intent, engineering review, brand approval, the cut or first samples."
        testID="inbox-empty"
      />
    </Screen>
  );
}

import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';

/** Every change request you may see. Placeholder until change requests exist. */
export function RequestListScreen() {
  return (
    <Screen title="Requests" subtitle="Changes proposed to tools" testID="requests-screen">
      <EmptyState
        icon="requests"
        title="No change requests yet"
        body="Change requests arrive here when a designer proposes a change to a tool. Each one shows its stage and who signs next."
        testID="requests-empty"
      />
    </Screen>
  );
}

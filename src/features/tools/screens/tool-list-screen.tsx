import { EmptyState } from '@/components/ui/empty-state';
import { Screen } from '@/components/ui/screen';

/** The tool register. Placeholder until tools exist. */
export function ToolListScreen() {
  return (
    <Screen title="Tools" subtitle="Molds, where they sit and how much life they have left" testID="tools-screen">
      <EmptyState
        icon="tool"
        title="No tools registered yet"
        body="Tools arrive here when they are entered in the register, with their factory, mold class, shot count and revisions."
        testID="tools-empty"
      />
    </Screen>
  );
}

import type { RequestState } from '@shared/domain/lifecycle';
import { StatusPill } from '@/components/ui/status-pill';
import { stateLook } from '@/lib/requests/status';

/** The request's state as a word with an icon (never colour alone). */
export function RequestStatusPill({ status, testID }: { status: RequestState; testID?: string }) {
  const look = stateLook(status);
  return <StatusPill label={look.label} icon={look.icon} tone={look.tone} testID={testID} />;
}

/** The marker for a change that cannot be undone: the reserved colour, always with the words and the icon. */
export function CannotUndoPill({ testID }: { testID?: string }) {
  return <StatusPill label="Cannot be undone" icon="irreversible" tone="irreversible" testID={testID} />;
}

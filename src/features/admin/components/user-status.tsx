import type { User } from '@shared/schemas/users';
import { StatusPill } from '@/components/ui/status-pill';

/** Active / Invited (no password yet) / Deactivated, as a word with an icon. */
export function UserStatus({ user }: { user: User }) {
  if (!user.active) return <StatusPill label="Deactivated" icon="inactive" tone="neutral" testID={`user-status-${user.id}`} />;
  if (user.invitationPending) return <StatusPill label="Invited" icon="mail" tone="due" testID={`user-status-${user.id}`} />;
  return <StatusPill label="Active" icon="done" tone="go" testID={`user-status-${user.id}`} />;
}

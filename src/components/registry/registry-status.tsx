// Word + icon + tone for every registry state (colour is never the only signal).
import { productStatusLabels, toolStatusLabels, type ProductStatus, type ToolRetention, type ToolStatus } from '@shared/schemas/registry';
import type { IconName } from '@/components/ui/icon';
import { StatusPill } from '@/components/ui/status-pill';
import { daysPhrase, formatDay } from '@/lib/registry-format';
import type { Tone } from '@/theme';

export const toolStatusLook: Record<ToolStatus, { icon: IconName; tone: Tone }> = {
  active: { icon: 'play', tone: 'go' },
  idle: { icon: 'pause', tone: 'neutral' },
  in_change: { icon: 'edit', tone: 'info' },
  retained: { icon: 'archive', tone: 'neutral' },
  disposed: { icon: 'scrap', tone: 'neutral' },
};

export function ToolStatusPill({ status, testID }: { status: ToolStatus; testID?: string }) {
  const look = toolStatusLook[status];
  return <StatusPill label={toolStatusLabels[status]} icon={look.icon} tone={look.tone} testID={testID} />;
}

export const productStatusLook: Record<ProductStatus, { icon: IconName; tone: Tone }> = {
  in_line: { icon: 'product', tone: 'go' },
  reissue_planned: { icon: 'refresh', tone: 'info' },
  retired: { icon: 'inactive', tone: 'neutral' },
};

export function ProductStatusPill({ status, testID }: { status: ProductStatus; testID?: string }) {
  const look = productStatusLook[status];
  return <StatusPill label={productStatusLabels[status]} icon={look.icon} tone={look.tone} testID={testID} />;
}

/** "Can be made" / "Cannot be made": the answer to "can it still be made?". */
export function MakeablePill({ canBeMade, testID }: { canBeMade: boolean; testID?: string }) {
  return canBeMade ? (
    <StatusPill label="Can be made" icon="done" tone="go" testID={testID} />
  ) : (
    <StatusPill label="Cannot be made" icon="alert" tone="due" testID={testID} />
  );
}

export interface RetentionLook {
  label: string;
  icon: IconName;
  tone: Tone;
  /** Needs a keep-or-scrap decision soon (or already late). */
  due: boolean;
}

/** The keep-or-scrap state of a tool in a few words. */
export function retentionLook(r: ToolRetention, status?: ToolStatus, short = false): RetentionLook {
  if (r.state === 'overdue') return { label: short ? `Overdue since ${formatDay(r.dueOn)}` : `Decision overdue since ${formatDay(r.dueOn)}`, icon: 'clock', tone: 'due', due: true };
  if (r.state === 'due_soon') return { label: `${short ? 'Due' : 'Decision due'} ${daysPhrase(r.daysLeft ?? 0)}`, icon: 'clock', tone: 'due', due: true };
  if (r.decision?.decision === 'scrap') return { label: 'Scrapped', icon: 'scrap', tone: 'neutral', due: false };
  if (r.decision?.decision === 'sell') return { label: 'Sold', icon: 'tag', tone: 'neutral', due: false };
  if (r.state === 'decided' || status === 'disposed') return { label: 'Disposed', icon: 'scrap', tone: 'neutral', due: false };
  if (r.decision?.decision === 'keep_until' && r.dueOn) return { label: `Kept; decide by ${formatDay(r.dueOn)}`, icon: 'archive', tone: 'neutral', due: false };
  if (r.state === 'no_date') return { label: 'No run or build date', icon: 'calendar', tone: 'neutral', due: false };
  return { label: `Decide by ${formatDay(r.dueOn)}`, icon: 'calendar', tone: 'neutral', due: false };
}

/** A pill for the retention state; `onlyWhenDue` shows nothing unless a decision is due or late. */
export function RetentionMarker({ retention, status, onlyWhenDue, testID }: { retention: ToolRetention; status?: ToolStatus; onlyWhenDue?: boolean; testID?: string }) {
  const look = retentionLook(retention, status);
  if (onlyWhenDue && !look.due) return null;
  return <StatusPill label={look.label} icon={look.icon} tone={look.tone} testID={testID} />;
}

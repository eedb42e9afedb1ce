import type { RequestSummary } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { RequestRowFrame } from '@/components/requests/request-row-frame';
import { formatDay } from '@/lib/requests/format';

/** One request in the list: the shared row plus brand, author and last change. */
export function RequestRow({ r, divider }: { r: RequestSummary; divider: boolean }) {
  return (
    <RequestRowFrame
      r={r}
      href={{ pathname: '/requests/[id]', params: { id: r.id } }}
      divider={divider}
      testID={`request-row-${r.ref}`}
      accessibilityLabel={`${r.ref} ${r.title}`}
    >
      <AppText variant="small" tone="faint">
        {r.brand.name} · {r.submitter.name} · {formatDay(r.updatedAt)}
      </AppText>
    </RequestRowFrame>
  );
}

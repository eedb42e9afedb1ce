import type { RequestDetail } from '@shared/schemas/change-requests';
import { WorkflowPanel } from '@/features/workflow/components/workflow-panel';

/**
 * The sign-off workflow on the request detail (right under the header summary, before the images):
 * who it waits for, the actions of the caller's role (`request.permissions.actions`) and the
 * sign-off timeline. The panel lives in src/features/workflow.
 */
export function RequestActionsSlot({ request }: { request: RequestDetail }) {
  return <WorkflowPanel request={request} />;
}

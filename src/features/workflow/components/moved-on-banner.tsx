import type { RequestDetail } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { stateLook } from '@/lib/requests/status';
import { decisionLook } from '@/lib/requests/workflow-look';

/**
 * Shown when the server refused because the request moved on (409): someone acted first. The
 * screen already shows the fresh copy the server sent; this says what changed, in words.
 */
export function MovedOnBanner({ request, message, testID = 'moved-on' }: { request: RequestDetail | null; message: string; testID?: string }) {
  const last = request?.signOffs?.[request.signOffs.length - 1];
  const words = request
    ? `It is now “${stateLook(request.status).label}”.${
        last ? ` Last step: ${decisionLook[last.decision].word.toLowerCase()} by ${last.signer.printedName} (${last.roleLabel}).` : ''
      } Your signature was not recorded: check the request as it is now, then act again if you still need to.`
    : message;
  return (
    <Banner kind="due" icon="refresh" title="Someone acted on this request first" testID={testID}>
      <AppText variant="body" testID={`${testID}-text`}>
        {words}
      </AppText>
    </Banner>
  );
}

import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { RequestAction } from '@shared/domain/lifecycle';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { SignOff } from '@shared/schemas/sign-offs';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { Section } from '@/components/ui/section';
import { useSession } from '@/lib/session';
import { colors, space } from '@/theme';
import { andList, dueWords, usableZone } from '@/lib/requests/workflow-format';
import { actionIcon, actionLabel, actionVariant, doneWords } from '@/lib/requests/workflow-look';
import { ActionForm } from './action-form';
import type { RenderImages } from './record-cut-fields';
import { MovedOnBanner } from './moved-on-banner';
import { SignOffTimeline } from './sign-off-timeline';

/** The brand lead's decisions live on their own screen (ticks, tool code, password). */
const ON_SIGN_SCREEN: readonly RequestAction[] = ['approve', 'return', 'decline'];

/**
 * On the request detail: who the request waits for and by when, the actions the caller may take
 * now (each opening its form with the meaning of the signature), then the sign-off timeline.
 */
export function WorkflowPanel({ request: r, renderImages }: { request: RequestDetail; renderImages: RenderImages }) {
  const [open, setOpen] = useState<RequestAction | null>(null);
  const [done, setDone] = useState<{ action: RequestAction; signOff: SignOff } | null>(null);
  const [movedOn, setMovedOn] = useState<{ current: RequestDetail | null; message: string } | null>(null);
  const actions = r.permissions.actions;
  const inline = actions.filter((a) => !ON_SIGN_SCREEN.includes(a));
  const toSignScreen = actions.some((a) => ON_SIGN_SCREEN.includes(a));
  // A form stays open only while its action is still allowed (the request may have moved on).
  const openNow = open && inline.includes(open) ? open : null;

  return (
    <View style={styles.wrap} testID="workflow">
      <Section title="Next step" testID="workflow-next">
        <Card>
          <WaitingLine r={r} />
          {r.workflow?.changedSinceLastSignOff ? (
            <Banner kind="due" icon="history" title="Changed since the last sign-off" testID="workflow-changed">
              <AppText variant="body">The request was edited after it was last signed: earlier signatures were given for an earlier version.</AppText>
            </Banner>
          ) : null}
          {done ? (
            <Banner kind="go" title={doneTitle(done.action, r)} testID="workflow-done">
              {done.signOff.isSignature ? <AppText variant="body">Your signature says: “{done.signOff.meaning}”</AppText> : null}
            </Banner>
          ) : null}
          {movedOn ? <MovedOnBanner request={movedOn.current} message={movedOn.message} testID="workflow-moved-on" /> : null}
          {openNow ? (
            <ActionForm
              key={openNow}
              request={r}
              action={openNow}
              onDone={(res) => {
                setOpen(null);
                setMovedOn(null);
                setDone({ action: openNow, signOff: res.signOff });
              }}
              onMovedOn={(current, message) => {
                setOpen(null);
                setDone(null);
                setMovedOn({ current, message });
              }}
              onCancel={() => setOpen(null)}
              renderImages={renderImages}
            />
          ) : actions.length ? (
            <View style={styles.buttons} testID="workflow-actions">
              {toSignScreen ? (
                <Button
                  title={r.irreversible ? 'Review and sign the cut' : 'Review and sign'}
                  icon="sign"
                  iconRight="chevron-right"
                  href={{ pathname: '/requests/[id]/sign', params: { id: r.id } }}
                  testID="workflow-open-sign"
                />
              ) : null}
              {inline.map((a) => (
                <Button
                  key={a}
                  title={actionLabel(a)}
                  icon={actionIcon(a)}
                  variant={a === 'withdraw' ? 'quiet' : actionVariant(a, r.impact.irreversible)}
                  onPress={() => {
                    setDone(null);
                    setMovedOn(null);
                    setOpen(a);
                  }}
                  testID={`workflow-action-${a}`}
                />
              ))}
            </View>
          ) : (
            <AppText variant="small" testID="workflow-nothing">
              {r.workflow?.waitingFor.length ? 'Nothing here waits for your signature.' : 'Nothing more to sign: this request is finished.'}
            </AppText>
          )}
        </Card>
      </Section>
      <SignOffTimeline request={r} />
    </View>
  );
}

/** What the finished step did; closing names the tool's new revision. */
function doneTitle(action: RequestAction, r: RequestDetail) {
  if (action === 'accept_samples' && r.status === 'closed') return `First samples accepted: the request is done and tool ${r.tool.code} is now at revision ${r.tool.currentRevision}.`;
  if (action === 'accept_samples') return 'First samples accepted: the request waits for the other acceptance.';
  return doneWords[action];
}

/** "Waits for a brand lead of the request's brand · Overdue by 2 days". */
function WaitingLine({ r }: { r: RequestDetail }) {
  const me = useSession().data;
  const w = r.workflow;
  if (!w || w.waitingFor.length === 0) return null;
  const both = r.status === 'samples_review';
  // The caller is among those waited for when they may take one of the awaited actions now.
  const isMe = (x: (typeof w.waitingFor)[number]) => x.role === me?.role && x.actions.some((a) => r.permissions.actions.includes(a));
  const whos = w.waitingFor.map((x) => (isMe(x) ? `you (${x.who})` : x.who));
  const who = both ? andList(whos) : whos.length <= 1 ? (whos[0] ?? '') : `${whos.slice(0, -1).join(', ')} or ${whos[whos.length - 1]}`;
  const due = dueWords(w.stageDueAt, new Date(), usableZone(me?.timeZone));
  const accepted = w.acceptedByRoles.map((x) => (x === 'designer' ? 'the designer' : 'the tooling engineer'));
  return (
    <View style={styles.waiting} testID="workflow-waiting">
      <View style={styles.line}>
        <Icon name="people" size={18} color={colors.inkSoft} />
        <AppText variant="body" style={styles.flex}>
          Waits for {who}
          {both && accepted.length ? ` (accepted so far by ${andList(accepted)})` : ''}.
        </AppText>
      </View>
      {due ? (
        <View style={styles.line} testID="workflow-due">
          <Icon name={due.overdue ? 'alert' : 'clock'} size={18} color={due.overdue ? colors.due : colors.inkSoft} />
          <AppText variant={due.overdue ? 'bodyStrong' : 'body'} tone={due.overdue ? 'due' : 'soft'}>
            {due.text}
          </AppText>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  waiting: { gap: space.xs },
  line: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  flex: { flex: 1 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

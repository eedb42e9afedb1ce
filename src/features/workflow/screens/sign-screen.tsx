import { useState, type ReactNode } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Pressable, StyleSheet, View } from 'react-native';
import type { RequestAction, RequestState } from '@shared/domain/lifecycle';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { TakeActionInput, TakeActionResponse } from '@shared/schemas/request-actions';
import { roleLabels } from '@shared/schemas/users';
import { isApiError } from '@/api/errors';
import { requestQueries } from '@/api/requests';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ConfirmBox } from '@/components/ui/confirm-box';
import { DetailRow } from '@/components/ui/detail-row';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { TextField } from '@/components/ui/text-field';
import { CannotUndoPill, RequestStatusPill } from '@/components/requests/request-status';
import { stateLook } from '@/lib/requests/status';
import { useSession } from '@/lib/session';
import { colors, fonts, radii, space, touch } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { andList, dueWords, usableZone } from '@/lib/requests/workflow-format';
import { meaningFor } from '../facts';
import { useIntentKey, useTakeAction } from '../hooks';
import { doneWords } from '@/lib/requests/workflow-look';
import { refusalOf, type FieldErrors } from '../components/action-form';
import { MeaningBox } from '../components/meaning-box';
import { MovedOnBanner } from '../components/moved-on-banner';

type Decision = Extract<RequestAction, 'approve' | 'return' | 'decline'>;

/**
 * The brand lead's sign-off, phone first. For a change that cannot be undone: the loud warning,
 * a tick for every product the cut ends, the tool code typed, the password entered again, and
 * the meaning of the signature in words; Approve stays off until all of it is there. For a change
 * that can be undone, a plain confirm. Decline and Send back need a reason.
 */
export function SignScreen({ requestId, numbers }: { requestId: string; numbers: ReactNode }) {
  const q = useQuery({ ...requestQueries.detail(requestId), enabled: !!requestId });
  const wide = useWide();
  const back = { href: { pathname: '/requests/[id]', params: { id: requestId } } as const, label: 'Request' };
  const [done, setDone] = useState<{ action: Decision; res: TakeActionResponse } | null>(null);
  const [movedOn, setMovedOn] = useState<{ current: RequestDetail | null; message: string } | null>(null);

  if (q.isPending) return <Loading fill label="Loading the request…" />;
  if (q.isError) {
    const missing = isApiError(q.error) && q.error.status === 404;
    return (
      <Screen title="Sign-off" back={back} width="form" testID="sign-screen">
        {missing ? (
          <EmptyState icon="search" title="No such request, or not yours to see" body="The link may be old, or the request belongs to a brand you do not sign for." action={{ title: 'Open the inbox', href: '/inbox' }} />
        ) : (
          <ErrorState error={q.error} onRetry={() => void q.refetch()} />
        )}
      </Screen>
    );
  }
  const r = q.data;
  const wideScreen = wide;
  const header = { title: 'Your sign-off', eyebrow: `${r.ref} · ${r.tool.code}`, back, testID: 'sign-screen' } as const;

  if (done) {
    return (
      <Screen {...header} width="form">
        <Banner
          kind="go"
          title={done.action === 'approve' ? `Approved and signed: ${r.tool.factory.name} may now cut tool ${r.tool.code}.` : doneWords[done.action]}
          testID="sign-done"
        >
          <AppText variant="body">Your signature says: “{done.res.signOff.meaning}”</AppText>
          <AppText variant="small">The request is now “{stateLook(done.res.request.status).label}”. Everyone who acts next has been sent an e-mail.</AppText>
        </Banner>
        <View style={styles.row}>
          <Button title="Open the request" icon="requests" href={{ pathname: '/requests/[id]', params: { id: r.id } }} testID="sign-done-open" />
          <Button title="Back to the inbox" icon="inbox" variant="secondary" href="/inbox" testID="sign-done-inbox" />
        </View>
      </Screen>
    );
  }

  const mine = r.permissions.actions.filter((a): a is Decision => a === 'approve' || a === 'return' || a === 'decline');
  if (mine.length === 0) {
    return (
      <Screen {...header} width="form">
        {movedOn ? <MovedOnBanner request={movedOn.current} message={movedOn.message} testID="sign-moved-on" /> : null}
        <EmptyState
          icon="done"
          title="Nothing to sign here"
          body={`This request is “${stateLook(r.status).label}”: it does not wait for your sign-off now.`}
          action={{ title: 'Open the request', href: { pathname: '/requests/[id]', params: { id: r.id } } }}
          testID="sign-nothing"
        />
      </Screen>
    );
  }

  return (
    <Screen {...header} width={wideScreen ? 'full' : 'content'}>
      {movedOn ? <MovedOnBanner request={movedOn.current} message={movedOn.message} testID="sign-moved-on" /> : null}
      <SignForm
        key={r.version}
        r={r}
        mine={mine}
        numbers={numbers}
        onDone={(action, res) => {
          setMovedOn(null);
          setDone({ action, res });
        }}
        onMovedOn={(current, message) => setMovedOn({ current, message })}
      />
    </Screen>
  );
}

function Summary({ r }: { r: RequestDetail }) {
  const me = useSession().data;
  const due = dueWords(r.workflow?.stageDueAt ?? null, new Date(), usableZone(me?.timeZone));
  return (
    <Card testID="sign-summary">
      <View style={styles.pills}>
        <RequestStatusPill status={r.status} />
        {r.irreversible ? <CannotUndoPill /> : null}
        {due ? (
          <View style={styles.due}>
            <Icon name={due.overdue ? 'alert' : 'clock'} size={16} color={due.overdue ? colors.due : colors.inkSoft} />
            <AppText variant={due.overdue ? 'label' : 'small'} tone={due.overdue ? 'due' : 'soft'} testID="sign-due">
              {due.text}
            </AppText>
          </View>
        ) : null}
      </View>
      <AppText variant="heading" testID="sign-title">
        {r.title}
      </AppText>
      <View>
        <DetailRow
          label="Tool"
          value={
            <View style={styles.inline}>
              <AppText variant="monoStrong">{r.tool.code}</AppText>
              <AppText variant="body">{r.tool.name}</AppText>
              <AppText variant="small">revision {r.tool.currentRevision}</AppText>
            </View>
          }
        />
        <DetailRow
          label="For the product"
          value={
            r.derivativeProduct ? (
              <View style={styles.inline}>
                <AppText variant="monoStrong">{r.derivativeProduct.sku}</AppText>
                <AppText variant="body">{r.derivativeProduct.name}</AppText>
              </View>
            ) : (
              'Not decided'
            )
          }
        />
        <DetailRow label="Written by" value={r.submitter.name} />
        <DetailRow label="Cut at" value={r.tool.factory.name} divider={false} />
      </View>
      {r.reason ? (
        <AppText variant="small" numberOfLines={6}>
          {r.reason}
        </AppText>
      ) : null}
      <Button title="Read the whole request" variant="quiet" icon="requests" href={{ pathname: '/requests/[id]', params: { id: r.id } }} testID="sign-read-more" />
    </Card>
  );
}

function SignForm({
  r,
  mine,
  numbers,
  onDone,
  onMovedOn,
}: {
  r: RequestDetail;
  mine: readonly Decision[];
  /** The numbers behind the change, beside the form (composed by the route). */
  numbers: ReactNode;
  onDone: (action: Decision, res: TakeActionResponse) => void;
  onMovedOn: (current: RequestDetail | null, message: string) => void;
}) {
  const me = useSession().data;
  const wide = useWide();
  const take = useTakeAction(r.id);
  const keys = { approve: useIntentKey(), return: useIntentKey(), decline: useIntentKey() };
  const guard = r.workflow?.guard ?? null;
  const ended = guard?.endedProducts ?? [];
  const [ticked, setTicked] = useState<ReadonlySet<string>>(new Set());
  const [toolCode, setToolCode] = useState('');
  const [password, setPassword] = useState('');
  const [comment, setComment] = useState('');
  const [reason, setReason] = useState('');
  const [target, setTarget] = useState<RequestState>('engineering_review');
  const [askDecline, setAskDecline] = useState(false);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<{ at: 'approve' | 'other'; message: string } | null>(null);
  const [pending, setPending] = useState<Decision | null>(null);

  const codeMatches = toolCode.trim().toUpperCase() === r.tool.code.trim().toUpperCase();
  const missing: string[] = [];
  if (guard) {
    const left = ended.filter((p) => !ticked.has(p.id)).length;
    if (left) missing.push(`tick ${left === 1 ? 'one more product' : `${left} more products`}`);
    if (!codeMatches) missing.push(`type the tool code ${r.tool.code}`);
    if (!password) missing.push('enter your password');
  }
  const ready = missing.length === 0;

  const send = (action: Decision, input: TakeActionInput, fieldsOf: readonly string[]) => {
    setErrors({});
    setFormError(null);
    setPending(action);
    take.mutate(
      { input, key: keys[action].key },
      {
        onSuccess: (res) => {
          keys[action].renew();
          onDone(action, res);
        },
        onError: (e) => {
          const refusal = refusalOf(e, fieldsOf);
          if (refusal.movedOn) {
            keys[action].renew();
            onMovedOn(refusal.current, refusal.message);
            return;
          }
          // A reason refused for decline or send back belongs on the reason field.
          const fields = { ...refusal.fields };
          if (action !== 'approve' && fields.comment) {
            fields.reason = fields.comment;
            delete fields.comment;
          }
          setErrors(fields);
          // The fields may be far above the button on a phone: say it beside the button too.
          const message = refusal.message ?? (isApiError(e) ? e.message : null);
          if (message) setFormError({ at: action === 'approve' ? 'approve' : 'other', message });
        },
        onSettled: () => setPending(null),
      },
    );
  };

  const approve = () => {
    if (!ready) return;
    const input: TakeActionInput = { action: 'approve', version: r.version, ...(comment.trim() ? { comment: comment.trim() } : {}) };
    if (guard) {
      input.confirmedProductIds = ended.filter((p) => ticked.has(p.id)).map((p) => p.id);
      input.typedToolCode = toolCode.trim();
      input.password = password;
    }
    send('approve', input, ['confirmedProductIds', 'typedToolCode', 'password', 'comment']);
  };
  const other = (action: 'return' | 'decline') => {
    if (!reason.trim()) {
      setErrors({ reason: action === 'decline' ? 'Say why it is declined: the designer and the engineer read it' : 'Say what should change' });
      setAskDecline(false);
      return;
    }
    const input: TakeActionInput = { action, version: r.version, comment: reason.trim(), ...(action === 'return' ? { target: target as 'engineering_review' | 'draft' } : {}) };
    send(action, input, ['comment', 'target']);
  };

  const toggle = (id: string) =>
    setTicked((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  return (
    <View style={wide ? styles.columns : styles.form}>
      <View style={wide ? styles.left : styles.form}>
        <Summary r={r} />
        {numbers}
      </View>
      <View style={wide ? styles.right : styles.form}>
        {mine.includes('approve') ? (
          <Section title={guard ? 'Approve the cut' : 'Approve the change'} testID="sign-approve-section">
            {guard ? (
              <>
                <Banner kind="irreversible" icon="irreversible" title="This cut cannot be undone" testID="sign-warning">
                  <AppText variant="body">
                    {guard.removesSteel ? `Steel taken out of tool ${guard.toolCode} cannot be put back.` : `Welding changes the steel of tool ${guard.toolCode} for good.`}{' '}
                    {ended.length
                      ? `Once the factory cuts, ${ended.length === 1 ? 'this product' : `these ${ended.length} products`} can no longer be made from this tool.`
                      : 'No product in line or planned needs the parts it changes.'}
                  </AppText>
                </Banner>
                {ended.length ? (
                  <View style={styles.group} role="group" aria-label="Products this cut ends" testID="sign-products">
                    <AppText variant="bodyStrong">Tick each product this cut ends</AppText>
                    {ended.map((p) => {
                      const on = ticked.has(p.id);
                      return (
                        <Pressable
                          key={p.id}
                          role="checkbox"
                          aria-checked={on}
                          accessibilityLabel={`${p.sku} ${p.name} can no longer be made from tool ${guard.toolCode}`}
                          onPress={() => toggle(p.id)}
                          style={({ pressed }) => [styles.tick, on && styles.tickOn, pressed && styles.pressed]}
                          testID={`sign-product-${p.sku}`}
                        >
                          <View style={[styles.box, on && styles.boxOn]}>{on ? <Icon name="check" size={16} color={colors.onColour} strokeWidth={3} /> : null}</View>
                          <View style={styles.tickText}>
                            <AppText variant="monoStrong">{p.sku}</AppText>
                            <AppText variant="bodyStrong">{p.name}</AppText>
                            <AppText variant="small">can no longer be made from {guard.toolCode}</AppText>
                          </View>
                        </Pressable>
                      );
                    })}
                    <View style={styles.slot}>
                      {errors.confirmedProductIds ? (
                        <View style={styles.errorRow} role="alert">
                          <Icon name="alert" size={16} color={colors.due} />
                          <AppText variant="small" tone="due" style={styles.errorText} testID="sign-products-error">
                            {errors.confirmedProductIds}
                          </AppText>
                        </View>
                      ) : (
                        <AppText variant="small" tone="faint" testID="sign-products-count">
                          {ticked.size} of {ended.length} ticked
                        </AppText>
                      )}
                    </View>
                  </View>
                ) : null}
                <TextField
                  label="Type the tool code to confirm"
                  hint={codeMatches ? 'The tool code matches.' : `Type ${guard.toolCode}, as stamped on the tool.`}
                  value={toolCode}
                  onChangeText={setToolCode}
                  error={errors.typedToolCode}
                  mono
                  leadingIcon={codeMatches ? 'check' : 'tool'}
                  autoCapitalize="characters"
                  autoCorrect={false}
                  autoComplete="off"
                  testID="sign-tool-code"
                />
                <TextField
                  label="Your password"
                  hint="Enter your password again: it is your signature on this cut."
                  value={password}
                  onChangeText={setPassword}
                  error={errors.password}
                  secureTextEntry
                  revealable
                  autoComplete="current-password"
                  leadingIcon="lock"
                  testID="sign-password"
                />
              </>
            ) : null}
            <TextField
              label="Comment (optional)"
              hint="Kept with your signature and sent to the people who act next."
              value={comment}
              onChangeText={setComment}
              error={errors.comment}
              multiline
              testID="sign-comment"
            />
            <MeaningBox
              meaning={meaningFor(r, 'approve', me?.role)}
              signerName={me?.name ?? ''}
              roleLabel={me ? roleLabels[me.role] : ''}
              irreversible={!!guard}
              testID="sign-meaning"
            />
            {formError?.at === 'approve' ? <Banner kind="due" message={formError.message} testID="sign-error" /> : null}
            {!ready ? (
              <AppText variant="small" tone="soft" testID="sign-missing">
                To approve, {andList(missing)}.
              </AppText>
            ) : null}
            <Button
              title={guard ? 'Approve: cut cannot be undone' : 'Approve the change'}
              icon={guard ? 'irreversible' : 'done'}
              variant={guard ? 'irreversible' : 'primary'}
              block
              disabled={!ready || (!!pending && pending !== 'approve')}
              busy={pending === 'approve'}
              busyTitle="Signing…"
              onPress={approve}
              testID="sign-approve"
            />
          </Section>
        ) : null}

        {mine.includes('return') || mine.includes('decline') ? (
          <Section title="Or decide otherwise" description="Send it back for changes, or decline it. Either needs a reason." testID="sign-other">
            <Card>
              <TextField
                label="Reason"
                hint="Required: the designer and the engineer read it in the mail and the record."
                value={reason}
                onChangeText={setReason}
                error={errors.reason}
                multiline
                testID="sign-reason"
              />
              {mine.includes('return') ? (
                <ChoiceGroup
                  label="Send it back to"
                  options={[
                    { value: 'engineering_review' as RequestState, label: 'The tooling engineer', hint: 'To check the cut items or the estimate again' },
                    { value: 'draft' as RequestState, label: 'The designer', hint: 'To change the design or the request' },
                  ]}
                  value={target}
                  onChange={setTarget}
                  error={errors.target}
                  testID="sign-target"
                />
              ) : null}
              {formError?.at === 'other' ? <Banner kind="due" message={formError.message} testID="sign-other-error" /> : null}
              {askDecline ? (
                <ConfirmBox
                  title="Decline this change?"
                  message={`The request ends as “Turned down” and tool ${r.tool.code} stays as it is. A new request is needed to try again.`}
                  confirmTitle="Decline"
                  cancelTitle="Keep it open"
                  tone="due"
                  busy={pending === 'decline'}
                  onConfirm={() => other('decline')}
                  onCancel={() => setAskDecline(false)}
                  testID="sign-decline-box"
                />
              ) : (
                <View style={styles.row}>
                  {mine.includes('return') ? (
                    <Button
                      title="Send back"
                      icon="returned"
                      variant="secondary"
                      busy={pending === 'return'}
                      disabled={!!pending && pending !== 'return'}
                      onPress={() => other('return')}
                      testID="sign-return"
                    />
                  ) : null}
                  {mine.includes('decline') ? (
                    <Button title="Decline" icon="stop" variant="secondary" disabled={!!pending} onPress={() => setAskDecline(true)} testID="sign-decline" />
                  ) : null}
                </View>
              )}
            </Card>
          </Section>
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.xl },
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xl },
  left: { flex: 1, minWidth: 0, gap: space.xl },
  right: { width: 460, gap: space.xl },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  pills: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  due: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  inline: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.sm },
  group: { gap: space.sm },
  tick: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    minHeight: touch + 12,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.irreversible,
    backgroundColor: colors.card,
  },
  tickOn: { borderWidth: 2, padding: space.md - 1, backgroundColor: colors.irreversibleWash },
  pressed: { backgroundColor: colors.steelWash },
  box: { width: 26, height: 26, borderRadius: 5, borderWidth: 2, borderColor: colors.irreversible, alignItems: 'center', justifyContent: 'center' },
  boxOn: { backgroundColor: colors.irreversible },
  tickText: { flex: 1, gap: 2 },
  slot: { minHeight: 24 },
  errorRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs },
  errorText: { flex: 1, fontFamily: fonts.sansMedium },
});

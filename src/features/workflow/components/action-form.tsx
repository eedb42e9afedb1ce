import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { checkSubmission, type RequestAction, type RequestState } from '@shared/domain/lifecycle';
import { parseCents } from '@shared/domain/money';
import type { RequestDetail } from '@shared/schemas/change-requests';
import type { TakeActionInput, TakeActionResponse } from '@shared/schemas/request-actions';
import { roleLabels } from '@shared/schemas/users';
import { isApiError, toUserMessage } from '@/api/errors';
import { currentOf, isMovedOn } from '@/api/workflow';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { TextField } from '@/components/ui/text-field';
import { useSession } from '@/lib/session';
import { space } from '@/theme';
import { todayIn, usableZone } from '@/lib/requests/workflow-format';
import { factsOf, meaningFor, needsOf } from '../facts';
import { useIntentKey, useTakeAction, useToolCurrency } from '../hooks';
import { actionIcon, actionLabel, actionVariant } from '@/lib/requests/workflow-look';
import { MeaningBox } from './meaning-box';
import { RecordCutFields, type CutValues, type RenderImages } from './record-cut-fields';

export type FieldErrors = Record<string, string>;

/** Server fieldErrors to one message per key; dotted keys ("cut.cutOn") are kept as they are. */
export function fieldMessages(fieldErrors: Record<string, string[]> | undefined): FieldErrors {
  const out: FieldErrors = {};
  for (const [k, v] of Object.entries(fieldErrors ?? {})) if (v[0]) out[k] = v[0];
  return out;
}

/** The refusal of a taken action, sorted for the screen: moved on (409), field messages (400), or words. */
export function refusalOf(e: unknown, knownFields: readonly string[]) {
  if (isMovedOn(e)) return { movedOn: true as const, current: currentOf(e), message: toUserMessage(e) };
  const fields = isApiError(e) ? fieldMessages(e.fieldErrors) : {};
  const onFields = Object.fromEntries(Object.entries(fields).filter(([k]) => knownFields.some((f) => k === f || k.startsWith(`${f}.`))));
  const elsewhere = Object.keys(fields).length > Object.keys(onFields).length || Object.keys(onFields).length === 0;
  return { movedOn: false as const, fields: onFields, message: elsewhere ? toUserMessage(e) : null };
}

const reasonLabels: Partial<Record<RequestAction, string>> = {
  return_to_draft: 'What should the designer change?',
  return: 'What should change?',
  decline: 'Why is it declined?',
  rework: 'What does not match?',
  withdraw: 'Why is it withdrawn?',
};

export interface ActionFormProps {
  request: RequestDetail;
  action: RequestAction;
  onDone: (res: TakeActionResponse) => void;
  /** The request moved on (someone acted first); the cache already holds the fresh copy. */
  onMovedOn: (current: RequestDetail | null, message: string) => void;
  onCancel: () => void;
  /** Shows the request's images (the first-sample photos of a recorded cut). */
  renderImages?: RenderImages;
  testID?: string;
}

/**
 * One action on the request detail, inline: the meaning of the signature in words before signing,
 * the fields the action needs (a reason, the re-test note, the cut report), and the button. The
 * rules of what is missing are the shared lifecycle's (the server applies the same ones).
 */
export function ActionForm({ request: r, action, onDone, onMovedOn, onCancel, renderImages, testID = `action-${action}` }: ActionFormProps) {
  const me = useSession().data;
  const zone = usableZone(me?.timeZone);
  const need = needsOf(r, action);
  const take = useTakeAction(r.id);
  const intent = useIntentKey();
  const currency = useToolCurrency(r.tool.id, need.cutReport);
  const [comment, setComment] = useState('');
  const [retestNote, setRetestNote] = useState('');
  const [target, setTarget] = useState<RequestState | null>(need.targets[0] ?? null);
  const [cut, setCut] = useState<CutValues>({ cost: '', cutOn: todayIn(zone), note: '' });
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const meaning = meaningFor(r, action, me?.role, target ?? undefined);
  const submit = () => {
    const sent = { comment: comment.trim(), retestNote: retestNote.trim() };
    const found: FieldErrors = fieldMessages(checkSubmission(action, sent, factsOf(r)) ?? undefined);
    // The fuller report (currency, mold trial, shot reading, first article) is asked for by the server,
    // which names each missing field; the form sends what it collects so far.
    let report: Partial<NonNullable<TakeActionInput['cut']>> | undefined;
    if (need.cutReport) {
      let cents: number | null = null;
      try {
        cents = parseCents(cut.cost, currency);
        if (cents < 0) found['cut.actualCostCents'] = 'The cost cannot be negative';
      } catch {
        found['cut.actualCostCents'] = cut.cost.trim() ? `Enter an amount like 1,250.00 (${currency})` : 'Enter what the change actually cost';
      }
      if (!/^\d{4}-\d{2}-\d{2}$/.test(cut.cutOn.trim())) found['cut.cutOn'] = 'Use a date like 2027-03-31';
      else if (cut.cutOn.trim() > todayIn(zone)) found['cut.cutOn'] = 'The cut cannot be dated in the future';
      if (cents !== null) report = { actualCostCents: cents, cutOn: cut.cutOn.trim(), note: cut.note.trim() };
    }
    setErrors(found);
    setFormError(null);
    if (Object.keys(found).length) return;
    const input: TakeActionInput = {
      action,
      version: r.version,
      ...(sent.comment ? { comment: sent.comment } : {}),
      ...(need.retestNote && sent.retestNote ? { retestNote: sent.retestNote } : {}),
      ...(report ? { cut: report as NonNullable<TakeActionInput['cut']> } : {}),
      ...(need.targets.length && target ? { target: target as 'engineering_review' | 'draft' } : {}),
    };
    take.mutate(
      { input, key: intent.key },
      {
        onSuccess: (res) => {
          intent.renew();
          onDone(res);
        },
        onError: (e) => {
          const refusal = refusalOf(e, ['comment', 'retestNote', 'cut', 'target']);
          if (refusal.movedOn) {
            intent.renew();
            onMovedOn(refusal.current, refusal.message);
            return;
          }
          setErrors(refusal.fields);
          setFormError(refusal.message);
        },
      },
    );
  };

  const reasonLabel = reasonLabels[action];
  return (
    <View style={styles.form} testID={testID}>
      <AppText variant="heading">{actionLabel(action)}</AppText>
      {need.retestNote ? <RetestReminder r={r} /> : null}
      {need.targets.length ? (
        <ChoiceGroup
          label="Send it back to"
          options={need.targets.map((t) => ({ value: t, label: t === 'draft' ? 'The designer' : 'The tooling engineer' }))}
          value={target}
          onChange={setTarget}
          testID={`${testID}-target`}
        />
      ) : null}
      {need.cutReport ? <RecordCutFields r={r} values={cut} onChange={setCut} errors={errors} currency={currency} renderImages={renderImages} testID={`${testID}-cut`} /> : null}
      {need.retestNote ? (
        <TextField
          label="Re-test note"
          hint="Which lab tested the changed toy, against which rules, and the report number."
          value={retestNote}
          onChangeText={setRetestNote}
          error={errors.retestNote}
          multiline
          testID={`${testID}-retest`}
        />
      ) : null}
      {need.cutReport && !need.comment ? null : (
        <TextField
          label={need.comment ? (reasonLabel ?? 'Reason') : 'Comment (optional)'}
          hint={need.comment ? 'Required: the next person reads it in the mail and the record.' : 'Kept with your signature.'}
          value={comment}
          onChangeText={setComment}
          error={errors.comment}
          multiline
          testID={`${testID}-comment`}
        />
      )}
      <MeaningBox meaning={meaning} signerName={me?.name ?? ''} roleLabel={me ? roleLabels[me.role] : ''} testID={`${testID}-meaning`} />
      {formError ? <Banner kind="due" message={formError} testID={`${testID}-error`} /> : null}
      <View style={styles.buttons}>
        <Button
          title={actionLabel(action)}
          icon={actionIcon(action)}
          variant={actionVariant(action, r.impact.irreversible)}
          busy={take.isPending}
          busyTitle="Signing…"
          onPress={submit}
          testID={`${testID}-confirm`}
        />
        <Button title="Cancel" variant="quiet" onPress={onCancel} disabled={take.isPending} testID={`${testID}-cancel`} />
      </View>
    </View>
  );
}

/** Before accepting flagged samples: the usual cautions, deferring to accredited labs. */
function RetestReminder({ r }: { r: RequestDetail }) {
  const titles = r.safety.cautions.map((c) => c.title.toLowerCase());
  return (
    <Banner kind="due" icon="warning" title="Safety: a re-test is required before this closes" testID="retest-reminder">
      <AppText variant="body">
        {titles.length ? `The change carries safety flags (${titles.join('; ')}). ` : ''}Accept the samples only after the changed toy has passed the
        small-parts, sharp point and edge, and use-and-abuse tests for its age grade that apply.
      </AppText>
      <AppText variant="small">{r.safety.closing}</AppText>
    </Banner>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.sm },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
});

import { useState } from 'react';
import { Formik, type FormikProps } from 'formik';
import { StyleSheet, View } from 'react-native';
import { retentionDecisionLabels, retentionDecisions, type RetentionDecision, type ToolDetail } from '@shared/schemas/registry';
import { applyServerErrors, isApiError } from '@/api/errors';
import { retentionLook } from '@/components/registry/registry-status';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ConfirmBox } from '@/components/ui/confirm-box';
import { Icon } from '@/components/ui/icon';
import { StatusPill } from '@/components/ui/status-pill';
import { TextField } from '@/components/ui/text-field';
import { daysPhrase, formatDay, formatMoment } from '@/lib/registry-format';
import { colors, space } from '@/theme';
import { Figure, FigureRow, Stacked } from './figures';
import { retentionFormSchema, toRetentionPayload, type RetentionFormValues } from '../forms';
import { useRecordRetention } from '../hooks';

const decisionHints: Record<RetentionDecision, string> = {
  keep_until: 'Keep it stored; the decision falls due again on that date',
  scrap: 'The tool is destroyed; its record stays, read-only',
  sell: 'The tool leaves the company; its record stays, read-only',
};

interface Props {
  tool: ToolDetail;
  canEdit: boolean;
  /** Refetch the tool (after someone else changed it). */
  onReload: () => void;
}

/** When the keep-or-scrap decision falls due, what was decided, and (engineers, admins) recording one. */
export function RetentionCard({ tool, canEdit, onReload }: Props) {
  const r = tool.retention;
  const look = retentionLook(r, tool.status);
  const [recording, setRecording] = useState(false);
  const d = r.decision;
  return (
    <Card accent={look.due ? 'due' : undefined} testID="tool-retention">
      <View style={styles.head}>
        <Icon name="calendar" size={20} color={colors.inkSoft} />
        <AppText variant="heading" role="heading" aria-level={2}>
          Keep or scrap
        </AppText>
      </View>
      <StatusPill label={look.label} icon={look.icon} tone={look.tone} testID="tool-retention-state" />
      <FigureRow>
        {r.dueOn ? (
          <Figure
            label="Decision due"
            testID="tool-retention-due"
            value={
              <>
                <AppText variant="monoStrong">{formatDay(r.dueOn)}</AppText>
                {r.daysLeft !== null ? <AppText variant="small">{daysPhrase(r.daysLeft)}</AppText> : null}
              </>
            }
          />
        ) : null}
        <Figure label="Last run" value={tool.lastRunDate ? formatDay(tool.lastRunDate) : 'Never run'} />
        <Figure label="Retention period" value={`${r.years} years`} mono={false} />
      </FigureRow>
      {d ? (
        <Stacked label="Decision" testID="tool-retention-decision">
          <AppText variant="bodyStrong">
            {d.decision === 'keep_until' && d.keepUntil ? `Keep until ${formatDay(d.keepUntil)}` : retentionDecisionLabels[d.decision]}
          </AppText>
          <AppText variant="small">{`Recorded by ${d.decidedBy?.name ?? 'unknown'} · ${formatMoment(d.decidedAt)}`}</AppText>
          {d.note ? <AppText variant="body">{`“${d.note}”`}</AppText> : null}
        </Stacked>
      ) : (
        <AppText variant="small">{`The decision falls due ${r.years} years after the last run (or the build date for a tool that never ran).`}</AppText>
      )}
      {canEdit && !tool.readOnly ? (
        recording ? (
          <DecisionForm tool={tool} onDone={() => setRecording(false)} onReload={onReload} />
        ) : (
          <Button title="Record a decision…" icon="calendar" variant="secondary" onPress={() => setRecording(true)} testID="tool-retention-record" />
        )
      ) : null}
    </Card>
  );
}

function DecisionForm({ tool, onDone, onReload }: { tool: ToolDetail; onDone: () => void; onReload: () => void }) {
  const record = useRecordRetention(tool.id);
  const [step, setStep] = useState<'form' | 'confirm'>('form');
  const [stale, setStale] = useState(false);
  const initial: RetentionFormValues = { decision: '', keepUntil: '', note: '' };
  // Products this tool still molds for: scrapping or selling it ends them.
  const current = tool.revisions.find((r) => r.isCurrent);
  const ended = (current?.products ?? []).filter((p) => p.status !== 'retired' && p.moldableFromThisTool);

  if (stale) {
    return (
      <Banner kind="due" title="Someone else changed this tool" message="Nothing was recorded. Reload to see their version, then decide again." testID="tool-retention-stale">
        <Button title="Reload the tool" icon="refresh" variant="secondary" onPress={() => { setStale(false); onReload(); onDone(); }} testID="tool-retention-reload" />
      </Banner>
    );
  }

  return (
    <Formik
      initialValues={initial}
      validationSchema={retentionFormSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await record.mutateAsync(toRetentionPayload(values, tool.version));
          onDone();
        } catch (e) {
          if (isApiError(e) && e.code === 'stale_version') return setStale(true);
          setStep('form');
          applyServerErrors(e, ['decision', 'keepUntil', 'note'], helpers);
        }
      }}
    >
      {(f) =>
        step === 'confirm' ? (
          <ConfirmStep f={f} tool={tool} endedNames={ended.map((p) => `${p.name} (${p.sku})`)} onBack={() => setStep('form')} />
        ) : (
          <View style={styles.form} testID="tool-retention-form">
            {typeof f.status === 'string' ? <Banner kind="due" title="Not recorded" message={f.status} /> : null}
            <ChoiceGroup<RetentionDecision>
              label="Decision"
              options={retentionDecisions.map((v) => ({ value: v, label: retentionDecisionLabels[v], hint: decisionHints[v] }))}
              value={f.values.decision || null}
              onChange={(v) => void f.setFieldValue('decision', v)}
              error={f.submitCount || f.touched.decision ? f.errors.decision : undefined}
              testID="tool-retention-decision-choice"
            />
            {f.values.decision === 'keep_until' ? (
              <TextField
                label="Keep until"
                mono
                placeholder="YYYY-MM-DD"
                value={f.values.keepUntil}
                onChangeText={f.handleChange('keepUntil')}
                onBlur={f.handleBlur('keepUntil')}
                error={f.submitCount || f.touched.keepUntil ? f.errors.keepUntil : undefined}
                testID="tool-retention-keep-until"
              />
            ) : null}
            <TextField
              label="Why"
              multiline
              placeholder="e.g. keep for a possible anniversary reissue"
              value={f.values.note}
              onChangeText={f.handleChange('note')}
              onBlur={f.handleBlur('note')}
              error={f.submitCount || f.touched.note ? f.errors.note : undefined}
              testID="tool-retention-note"
            />
            <View style={styles.buttons}>
              <Button
                title="Continue"
                iconRight="arrow-right"
                onPress={async () => {
                  const errors = await f.validateForm();
                  if (Object.keys(errors).length === 0) setStep('confirm');
                  else void f.setTouched({ decision: true, keepUntil: true, note: true });
                }}
                testID="tool-retention-continue"
              />
              <Button title="Cancel" variant="secondary" onPress={onDone} />
            </View>
          </View>
        )
      }
    </Formik>
  );
}

function ConfirmStep({ f, tool, endedNames, onBack }: { f: FormikProps<RetentionFormValues>; tool: ToolDetail; endedNames: string[]; onBack: () => void }) {
  const v = f.values;
  if (v.decision === 'keep_until') {
    return (
      <ConfirmBox
        title={`Keep ${tool.code} until ${formatDay(v.keepUntil)}?`}
        message="The tool stays in storage and the keep-or-scrap decision falls due again on that date. You can record another decision before then."
        confirmTitle="Record keep decision"
        cancelTitle="Back"
        tone="info"
        busy={f.isSubmitting}
        onConfirm={() => void f.submitForm()}
        onCancel={onBack}
        testID="tool-retention-confirm"
      />
    );
  }
  const verb = v.decision === 'scrap' ? 'Scrap' : 'Sell';
  const ends = endedNames.length
    ? ` Products that need this tool can no longer be made from it: ${endedNames.join(', ')}.`
    : ' No product in the line needs this tool now.';
  return (
    <ConfirmBox
      title={`${verb} ${tool.code}? This cannot be undone.`}
      message={`The tool is marked disposed and its record becomes read-only: no edits, no changes.${ends}`}
      confirmTitle={v.decision === 'scrap' ? `Scrap ${tool.code}` : `Record sale of ${tool.code}`}
      cancelTitle="Back"
      tone="irreversible"
      busy={f.isSubmitting}
      onConfirm={() => void f.submitForm()}
      onCancel={onBack}
      testID="tool-retention-confirm"
    />
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  form: { gap: space.xs },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

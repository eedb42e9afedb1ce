import { useMemo, useState } from 'react';
import { Formik, type FormikProps } from 'formik';
import { StyleSheet, View, type ViewStyle } from 'react-native';
import { AREA_UNIT_LABELS, FORCE_UNIT_LABELS } from '@shared/domain/clamp-force';
import { clampFactors, clampFactorsForResin } from '@shared/domain/data/clamp-factors';
import { findResin, resins } from '@shared/domain/data/resins';
import { formatCount } from '@shared/domain/decimal';
import { formatCentsPlain } from '@shared/domain/money';
import { computeRequestNumbers, type Sourced } from '@shared/domain/request-numbers';
import { SHRINK_CONVENTIONS } from '@shared/domain/shrinkage';
import type { RequestNumbers } from '@shared/schemas/numbers';
import { firstMessages, isApiError, toUserMessage } from '@/api/errors';
import { isStaleNumbersError } from '@/api/numbers';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Section } from '@/components/ui/section';
import { TextField } from '@/components/ui/text-field';
import { colors, space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import {
  formCurrency,
  numbersFormSchema,
  serverFieldMap,
  toFormValues,
  toLiveInputs,
  toNumbersPayload,
  type NumbersFormField,
  type NumbersFormValues,
} from '../forms';
import { useSaveNumbers } from '../hooks';
import { NumbersCard, verdictOf } from './numbers-card';

export interface EstimateFormProps {
  numbers: RequestNumbers;
  /** Called after a save, or when the engineer cancels. */
  onDone: () => void;
  testID?: string;
}

type F = FormikProps<NumbersFormValues>;

function Field({
  f,
  name,
  label,
  hint,
  mono = true,
  keyboard = 'decimal-pad',
}: {
  f: F;
  name: NumbersFormField;
  label: string;
  hint?: string;
  mono?: boolean;
  keyboard?: 'decimal-pad' | 'number-pad' | 'default';
}) {
  const error = f.touched[name] || f.submitCount ? (f.errors[name] as string | undefined) : undefined;
  return (
    <TextField
      label={label}
      value={String(f.values[name] ?? '')}
      onChangeText={(v) => void f.setFieldValue(name, v)}
      onBlur={f.handleBlur(name)}
      error={error}
      hint={hint}
      mono={mono}
      keyboardType={keyboard}
      autoCapitalize="none"
      autoCorrect={false}
      testID={`estimate-${name}`}
    />
  );
}

/** "Empty: 3.25 from the product" hints for fields that fall back to the registry. */
function fallbackHint(s: Sourced<number>, currency: string, what: string): string | undefined {
  if (s.from === 'product' && s.value !== null) return `Empty: ${formatCentsPlain(s.value, currency)} ${what}`;
  return undefined;
}

/**
 * The tooling engineer's estimate and plan. Every change recomputes the figures at once with the
 * same shared function the server uses (nothing is saved until "Save the numbers"). Money is typed
 * as "12,500.00"; empty price and volume fields take the derivative product's values.
 */
export function EstimateForm({ numbers, onDone, testID = 'estimate-form' }: EstimateFormProps) {
  const wide = useWide();
  const save = useSaveNumbers(numbers.requestId);
  const [stale, setStale] = useState<string | null>(null);
  const facts = numbers.facts;
  const currency = numbers.result.currency;
  const initial = useMemo(() => toFormValues(numbers.inputs, currency), [numbers.inputs, currency]);
  const partResin = facts.parts.map((p) => findResin(p.resin.trim().toLowerCase())).find(Boolean);

  return (
    <Formik<NumbersFormValues>
      initialValues={initial}
      enableReinitialize
      validationSchema={numbersFormSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        setStale(null);
        try {
          await save.mutateAsync({ version: numbers.version, ...toNumbersPayload(values, currency) });
          onDone();
        } catch (e) {
          if (isStaleNumbersError(e)) {
            setStale(`${e.apiError.message} The form now shows the saved figures; enter your changes again.`);
            return;
          }
          if (isApiError(e) && e.fieldErrors) {
            const messages = firstMessages(e.fieldErrors);
            const onFields: Record<string, string> = {};
            for (const [k, m] of Object.entries(messages)) if (serverFieldMap[k]) onFields[serverFieldMap[k]!] = m;
            helpers.setErrors(onFields);
            helpers.setStatus(Object.keys(onFields).length < Object.keys(messages).length || !Object.keys(onFields).length ? e.message : undefined);
            return;
          }
          helpers.setStatus(toUserMessage(e));
        }
      }}
    >
      {(f) => <Body f={f} numbers={numbers} wide={wide} stale={stale} partResinId={partResin?.id ?? null} onCancel={onDone} testID={testID} />}
    </Formik>
  );
}

function Body({ f, numbers, wide, stale, partResinId, onCancel, testID }: { f: F; numbers: RequestNumbers; wide: boolean; stale: string | null; partResinId: string | null; onCancel: () => void; testID: string }) {
  const facts = numbers.facts;
  const fallbackCurrency = numbers.result.currency;
  // Recomputed on every keystroke with the shared function: the figures follow the form at once.
  const live = useMemo(() => computeRequestNumbers(toLiveInputs(f.values, fallbackCurrency), facts), [f.values, fallbackCurrency, facts]);
  const changed = f.dirty;
  const c = formCurrency(f.values, fallbackCurrency);
  const plan = live.plan;
  const d = facts.derivative;
  const verdict = verdictOf(live);

  const resinForFactors = (f.values.dimensionOn && f.values.resinId) || partResinId;
  const factorOptions = (resinForFactors ? [...clampFactorsForResin(resinForFactors), ...clampFactors.filter((x) => x.resinIds.length === 0)] : clampFactors).map((x) => ({
    value: x.id,
    label: `${x.resinLabel}: ${x.min === x.max ? x.min : `${x.min}–${x.max}`} ${x.unit === 'psi' || x.unit === 'bar' ? x.unit : x.unit.replace(/_/g, ' ').replace(' per ', '/')}`,
    hint: x.source.split(',')[0],
  }));

  const form = (
    <Card style={styles.formCard} testID={testID}>
      {stale ? <Banner kind="due" title="Someone saved these numbers first" message={stale} testID={`${testID}-stale`} /> : null}
      {typeof f.status === 'string' ? <Banner kind="due" title="Not saved" message={f.status} testID={`${testID}-error`} /> : null}

      <Section title="Estimate" description={`Amounts in ${c}, like 12,500.00.`}>
        <Field f={f} name="modificationCost" label="Cost of the cut" />
        <View style={styles.pair}>
          <View style={styles.half}>
            <Field f={f} name="leadDays" label="Lead time, days" keyboard="number-pad" />
          </View>
          <View style={styles.half}>
            <Field f={f} name="trialRoundsExpected" label="Trial rounds expected" keyboard="number-pad" />
          </View>
        </View>
        <Field f={f} name="newInsertCost" label="New insert instead (keeps the current one)" hint={facts.ended.length ? 'Keeps the ended products alive' : undefined} />
        <Field f={f} name="duplicateToolCost" label="Duplicate tool instead" hint={facts.ended.length ? 'Keeps the ended products alive' : undefined} />
      </Section>

      <Section title={d ? `Plan for ${d.sku} ${d.name}` : 'Plan'} description="Empty fields take the derivative product's values.">
        <View style={styles.pair}>
          <View style={styles.half}>
            <Field
              f={f}
              name="plannedUnits"
              label="Planned units"
              keyboard="number-pad"
              hint={d && d.plannedUnits > 0 ? `Empty: ${formatCount(d.plannedUnits)} from the product` : undefined}
            />
          </View>
          <View style={styles.half}>
            <Field f={f} name="partsPerUnit" label="Parts per unit" keyboard="number-pad" hint="Empty: the bill of parts, else 1" />
          </View>
        </View>
        <View style={styles.pair}>
          <View style={styles.half}>
            <Field f={f} name="scrapPercent" label="Scrap, %" hint="3 means 3 %" />
          </View>
          <View style={styles.half}>
            <Field f={f} name="currency" label="Currency" keyboard="default" hint={`Empty: ${plan.currency}`} />
          </View>
        </View>
      </Section>

      <Section title="Prices per unit" description="FOB to retail, for the build-up and the break-even.">
        <Field f={f} name="fob" label="FOB" hint={fallbackHint(plan.fobCents, c, 'from the product')} />
        <View style={styles.pair}>
          <View style={styles.half}>
            <Field f={f} name="freight" label="Freight" hint="Empty counts as 0" />
          </View>
          <View style={styles.half}>
            <Field f={f} name="dutyPercent" label="Duty, % of FOB" hint="Empty counts as 0" />
          </View>
        </View>
        <Field f={f} name="wholesale" label="Wholesale" hint={fallbackHint(plan.wholesaleCents, c, 'from the product')} />
        <Field f={f} name="retail" label="Retail" hint={fallbackHint(plan.retailCents, c, 'from the product')} />
      </Section>

      <Section title="Engineering checks" description="Optional: when the change moves a dimension or the projected area.">
        <ChoiceGroup<'on' | 'off'>
          label="Dimension change"
          options={[
            { value: 'off', label: 'No check' },
            { value: 'on', label: 'Check the steel size' },
          ]}
          value={f.values.dimensionOn ? 'on' : 'off'}
          onChange={(v) => void f.setFieldValue('dimensionOn', v === 'on')}
          testID="estimate-dimensionOn"
        />
        {f.values.dimensionOn ? (
          <View style={styles.sub}>
            <View style={styles.pair}>
              <View style={styles.half}>
                <Field f={f} name="oldPartMm" label="Part now, mm" />
              </View>
              <View style={styles.half}>
                <Field f={f} name="newPartMm" label="Part after, mm" />
              </View>
            </View>
            <ChoiceGroup
              label="Resin"
              options={resins.map((r) => ({ value: r.id, label: r.id.toUpperCase().replace(/_/g, ' '), hint: `${r.shrinkMin}–${r.shrinkMax}` }))}
              value={f.values.resinId || null}
              onChange={(v) => void f.setFieldValue('resinId', v)}
              error={f.submitCount ? (f.errors.resinId as string | undefined) : undefined}
              testID="estimate-resinId"
            />
            <Field f={f} name="shrinkPercent" label="Datasheet shrink, %" hint="Empty: the middle of the resin's published range" />
            <ChoiceGroup
              label="Convention"
              options={(['astm_d955', 'shop_shortcut'] as const).map((k) => ({ value: k, label: SHRINK_CONVENTIONS[k].label, code: SHRINK_CONVENTIONS[k].formula }))}
              value={f.values.convention}
              onChange={(v) => void f.setFieldValue('convention', v)}
              testID="estimate-convention"
            />
            <ChoiceGroup
              label="The dimension is formed by"
              options={[
                { value: 'recess', label: 'A pocket in the steel', hint: 'outside sizes, rib depths' },
                { value: 'protrusion', label: 'Steel standing up', hint: 'holes on core pins, slots' },
              ]}
              value={f.values.formedBy}
              onChange={(v) => void f.setFieldValue('formedBy', v)}
              testID="estimate-formedBy"
            />
          </View>
        ) : null}
        <ChoiceGroup<'on' | 'off'>
          label="Clamp force"
          options={[
            { value: 'off', label: 'No check' },
            { value: 'on', label: 'Check the press' },
          ]}
          value={f.values.clampOn ? 'on' : 'off'}
          onChange={(v) => void f.setFieldValue('clampOn', v === 'on')}
          testID="estimate-clampOn"
        />
        {f.values.clampOn ? (
          <View style={styles.sub}>
            <View style={styles.pair}>
              <View style={styles.half}>
                <Field f={f} name="projectedArea" label="Projected area, all cavities + runner" />
              </View>
              <View style={styles.half}>
                <ChoiceGroup
                  label="Area unit"
                  options={(['cm2', 'in2'] as const).map((u) => ({ value: u, label: AREA_UNIT_LABELS[u] }))}
                  value={f.values.areaUnit}
                  onChange={(v) => void f.setFieldValue('areaUnit', v)}
                  testID="estimate-areaUnit"
                />
              </View>
            </View>
            <ChoiceGroup
              label="Clamp factor"
              options={factorOptions}
              value={f.values.factorId || null}
              onChange={(v) => void f.setFieldValue('factorId', v)}
              error={f.submitCount ? (f.errors.factorId as string | undefined) : undefined}
              hint="Rules of thumb that differ about 2x between sources."
              testID="estimate-factorId"
            />
            <View style={styles.pair}>
              <View style={styles.half}>
                <Field f={f} name="factor" label="Factor used" hint="Empty: the upper end of the range" />
              </View>
              <View style={styles.half}>
                <Field f={f} name="safetyFactor" label="Safety factor" hint="1.1 = 10 % margin (common practice, no published source)" />
              </View>
            </View>
            <View style={styles.pair}>
              <View style={styles.half}>
                <Field f={f} name="pressTonnage" label="Press rating" hint="From the nameplate; empty if not known" />
              </View>
              <View style={styles.half}>
                <ChoiceGroup
                  label="Press unit"
                  options={(['short_tons', 'tonnes_force', 'kn'] as const).map((u) => ({ value: u, label: FORCE_UNIT_LABELS[u] }))}
                  value={f.values.pressUnit}
                  onChange={(v) => void f.setFieldValue('pressUnit', v)}
                  testID="estimate-pressUnit"
                />
              </View>
            </View>
          </View>
        ) : null}
      </Section>

      {!wide ? (
        <View style={styles.liveLine} testID={`${testID}-live-verdict`} role="status">
          <AppText variant="caption">{changed ? 'Now, not saved yet' : 'Saved figures'}</AppText>
          <AppText variant="bodyStrong">{verdict.sentence}</AppText>
        </View>
      ) : null}
      <View style={styles.actions}>
        <Button title="Save the numbers" icon="save" busy={f.isSubmitting} busyTitle="Saving…" onPress={() => f.handleSubmit()} testID={`${testID}-save`} />
        <Button title="Cancel" variant="quiet" onPress={onCancel} disabled={f.isSubmitting} testID={`${testID}-cancel`} />
      </View>
    </Card>
  );

  const card = <NumbersCard result={live} facts={facts} live={changed} compact testID="numbers-live" />;
  if (wide) {
    return (
      <View style={styles.wideRow}>
        <View style={styles.wideForm}>{form}</View>
        <View style={styles.wideCard}>{card}</View>
      </View>
    );
  }
  return (
    <View style={styles.stack}>
      {card}
      {form}
    </View>
  );
}

const styles = StyleSheet.create({
  formCard: { gap: space.lg },
  pair: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  half: { flexGrow: 1, flexBasis: 180 },
  sub: { gap: space.sm, paddingLeft: space.md, borderLeftWidth: 2, borderLeftColor: colors.steelLight },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  liveLine: { gap: space.xxs, padding: space.md, backgroundColor: colors.steelWash, borderRadius: 6 },
  wideRow: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  wideForm: { flex: 3, minWidth: 0 },
  // The live figures stay in view while the form scrolls (web).
  wideCard: { flex: 2, minWidth: 0, ...({ position: 'sticky', top: space.lg } as unknown as ViewStyle) },
  stack: { gap: space.lg },
});

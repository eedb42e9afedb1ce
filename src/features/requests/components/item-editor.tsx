import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { getIn, type FormikProps } from 'formik';
import { steelActionLabels, steelDirection, undoPathLabels, checkItemConsistency } from '@shared/domain/steel-direction';
import {
  itemMethodLabels,
  itemMethods,
  partEffectHints,
  partEffectLabels,
  partEffects,
  safetyFlagLabels,
  safetyFlags,
  sizeUnitLabels,
  sizeUnits,
  type ImageRole,
  type ItemMethod,
  type PartEffect,
  type SafetyFlag,
  type SizeUnit,
} from '@shared/schemas/change-items';
import type { ImpactContext } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { ConfirmBox } from '@/components/ui/confirm-box';
import { TextField } from '@/components/ui/text-field';
import { space } from '@/theme';
import type { ItemFormValues, RegionFormValues, RequestFormValues } from '../forms';
import type { CompareImage } from './image-compare';
import { SteelLine } from './impact-panel';
import { RegionEditor } from './region-editor';

/** The error at a path once the field was touched or the form was sent. */
export function errorAt(f: FormikProps<RequestFormValues>, path: string): string | undefined {
  const e: unknown = getIn(f.errors, path);
  if (typeof e !== 'string') return undefined;
  return getIn(f.touched, path) || f.submitCount > 0 ? e : undefined;
}

export interface ItemEditorProps {
  f: FormikProps<RequestFormValues>;
  index: number;
  item: ItemFormValues;
  context: ImpactContext | undefined;
  contextLoading: boolean;
  images: Record<ImageRole, CompareImage | null>;
  disabled?: boolean;
  onRemove: () => void;
}

/** One cut item: the part, what happens to it, how, the size, a note, safety flags and a mark on the image. */
export function ItemEditor({ f, index, item, context, contextLoading, images, disabled, onRemove }: ItemEditorProps) {
  const [asking, setAsking] = useState(false);
  const base = `items.${index}`;
  const tid = `item-${index + 1}`;
  const set = (field: keyof ItemFormValues, v: unknown) => {
    void f.setFieldValue(`${base}.${field}`, v);
    void f.setFieldTouched(`${base}.${field}`, true, false);
  };
  const problem = item.effect && item.method ? checkItemConsistency({ effect: item.effect, method: item.method }) : null;
  const direction = item.effect && item.method ? steelDirection({ effect: item.effect, method: item.method }) : null;
  const regionErrors = (['x', 'y', 'w', 'h'] as const).reduce<Partial<Record<'x' | 'y' | 'w' | 'h', string>>>((acc, k) => {
    const e = errorAt(f, `${base}.region.${k}`) ?? (getIn(f.errors, `${base}.region.${k}`) as string | undefined);
    if (typeof e === 'string') acc[k] = e;
    return acc;
  }, {});

  return (
    <Card accent={direction?.irreversible ? 'irreversible' : undefined} testID={tid}>
      <View style={styles.head}>
        <AppText variant="heading" role="heading" aria-level={3} style={styles.grow}>
          Cut item {index + 1}
        </AppText>
        {!disabled && !asking ? <Button title="Remove" variant="quiet" icon="trash" onPress={() => setAsking(true)} accessibilityLabel={`Remove cut item ${index + 1}`} testID={`${tid}-remove`} /> : null}
      </View>
      {asking ? (
        <ConfirmBox
          title={`Remove cut item ${index + 1}?`}
          message="Its part, method, size, note and mark go with it. Nothing is sent until you save."
          confirmTitle="Remove item"
          cancelTitle="Keep it"
          tone="due"
          onConfirm={() => {
            setAsking(false);
            onRemove();
          }}
          onCancel={() => setAsking(false)}
          testID={`${tid}-remove-confirm`}
        />
      ) : null}

      {context ? (
        <ChoiceGroup<string>
          label="Part"
          options={context.parts.map((p) => ({ value: p.id, label: p.name, hint: `${p.resin ?? 'resin not recorded'} · ${p.cavitiesPerShot} ${p.cavitiesPerShot === 1 ? 'cavity' : 'cavities'} per shot` }))}
          value={item.partId || null}
          onChange={(v) => set('partId', v)}
          disabled={disabled}
          error={errorAt(f, `${base}.partId`)}
          hint={context.parts.length === 0 ? `Tool ${context.tool.code} has no parts recorded yet: ask the tooling engineer to add them.` : undefined}
          testID={`${tid}-part`}
        />
      ) : (
        <View style={styles.placeholder}>
          <AppText variant="label">Part</AppText>
          <AppText variant="small" tone={errorAt(f, `${base}.partId`) ? 'due' : 'soft'}>
            {contextLoading ? 'Loading the parts of this tool…' : 'Pick the tool first: its parts appear here.'}
          </AppText>
        </View>
      )}

      <ChoiceGroup<PartEffect>
        label="What happens to the part"
        options={partEffects.map((e) => ({ value: e, label: partEffectLabels[e], hint: partEffectHints[e] }))}
        value={item.effect}
        onChange={(v) => set('effect', v)}
        disabled={disabled}
        error={errorAt(f, `${base}.effect`)}
        testID={`${tid}-effect`}
      />
      <ChoiceGroup<ItemMethod>
        label="How the toolmaker makes it"
        options={itemMethods.map((m) => ({ value: m, label: itemMethodLabels[m] }))}
        value={item.method}
        onChange={(v) => set('method', v)}
        disabled={disabled}
        // The contradiction shows as soon as both are picked, touched or not.
        error={problem ?? errorAt(f, `${base}.method`)}
        testID={`${tid}-method`}
      />

      {direction && !problem ? (
        <View style={styles.steel} testID={`${tid}-steel`}>
          <SteelLine steelAction={steelActionLabels[direction.steelAction]} undo={undoPathLabels[direction.undoPath]} irreversible={direction.irreversible} />
          <AppText variant="small">{direction.why}</AppText>
        </View>
      ) : null}

      <View style={styles.sizeRow}>
        <View style={styles.sizeField}>
          <TextField
            label="Size or depth"
            value={item.size}
            onChangeText={(v) => void f.setFieldValue(`${base}.size`, v)}
            onBlur={() => void f.setFieldTouched(`${base}.size`, true)}
            placeholder="0.8"
            keyboardType="decimal-pad"
            mono
            disabled={disabled}
            error={errorAt(f, `${base}.size`)}
            testID={`${tid}-size`}
          />
        </View>
        <View style={styles.unitField}>
          <ChoiceGroup<SizeUnit>
            label="Unit"
            options={sizeUnits.map((u) => ({ value: u, label: u }))}
            value={item.unit}
            onChange={(v) => set('unit', v)}
            disabled={disabled}
            hint={sizeUnitLabels[item.unit]}
            testID={`${tid}-unit`}
          />
        </View>
      </View>

      <TextField
        label="Note for the toolmaker"
        value={item.note}
        onChangeText={(v) => void f.setFieldValue(`${base}.note`, v)}
        onBlur={() => void f.setFieldTouched(`${base}.note`, true)}
        placeholder="Where exactly, how it blends in, which cavities"
        multiline
        disabled={disabled}
        error={errorAt(f, `${base}.note`)}
        testID={`${tid}-note`}
      />

      <ChoiceGroup<SafetyFlag>
        label="Safety"
        multiple
        options={safetyFlags.map((s) => ({ value: s, label: safetyFlagLabels[s] }))}
        value={item.safetyFlags}
        onChange={(v) => set('safetyFlags', v)}
        disabled={disabled}
        hint="Tick what could apply. A flagged change shows the safety cautions and needs a re-test before the request closes."
        testID={`${tid}-safety`}
      />

      <RegionEditor
        value={item.region}
        onChange={(r: RegionFormValues | null) => {
          void f.setFieldValue(`${base}.region`, r);
        }}
        images={images}
        errors={regionErrors}
        label={String(index + 1)}
        disabled={disabled}
        testID={`${tid}-region`}
      />
    </Card>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  grow: { flex: 1 },
  placeholder: { gap: space.xs, paddingBottom: space.lg },
  steel: { gap: space.xs, marginTop: -space.sm },
  sizeRow: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, alignItems: 'flex-start' },
  sizeField: { flexGrow: 1, flexBasis: 140 },
  unitField: { flexBasis: 140, flexGrow: 0 },
});

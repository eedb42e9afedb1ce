import type { FormikProps } from 'formik';
import { StyleSheet, View } from 'react-native';
import { moldClasses } from '@shared/domain/data/mold-classes';
import { ratedLifeFromClass } from '@shared/domain/tool-life';
import { constructionLabels, constructions, editableToolStatuses, toolStatusLabels, type ToolStatus } from '@shared/schemas/registry';
import { toUserMessage } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { Loading } from '@/components/ui/loading';
import { TextField } from '@/components/ui/text-field';
import { formatShots } from '@/lib/registry-format';
import { space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import type { ToolFormValues } from '../forms';
import { useBrands, useFactories } from '../hooks';

interface Props {
  f: FormikProps<ToolFormValues>;
  mode: 'create' | 'edit';
}

/** The tool form's fields, in four groups. Create adds the code; the code never changes after. */
export function ToolFields({ f, mode }: Props) {
  const wide = useWide();
  const brands = useBrands();
  const factories = useFactories();
  const err = (k: keyof ToolFormValues) => (f.touched[k] || f.submitCount > 0 ? f.errors[k] : undefined);
  const text = (k: keyof ToolFormValues) => ({
    value: String(f.values[k] ?? ''),
    onChangeText: f.handleChange(k),
    onBlur: f.handleBlur(k),
    error: err(k),
    testID: `tool-form-${k}`,
  });
  const pair = [styles.pair, wide && styles.pairWide];
  const classFigure = /^10[1-5]$/.test(f.values.moldClass) ? ratedLifeFromClass(Number(f.values.moldClass)) : null;
  const statusLocked = !(editableToolStatuses as readonly string[]).includes(f.values.status);

  return (
    <>
      <Card style={styles.group}>
        <AppText variant="heading" role="heading" aria-level={2}>
          The tool
        </AppText>
        {mode === 'create' ? (
          <TextField label="Tool code" mono autoCapitalize="characters" autoCorrect={false} placeholder="KB-T-0600" hint="Stamped in the steel; cannot be changed later" {...text('code')} />
        ) : null}
        <TextField label="Name" placeholder="Ranger Kite head" {...text('name')} />
        {brands.isPending ? (
          <Loading label="Loading brands…" />
        ) : brands.isError ? (
          <Banner kind="due" title="Brands did not load" message={toUserMessage(brands.error)} />
        ) : (
          <ChoiceGroup
            label="Brand"
            options={brands.data.map((b) => ({ value: b.id, label: b.name, code: b.code }))}
            value={f.values.brandId || null}
            onChange={(v) => void f.setFieldValue('brandId', v)}
            error={err('brandId')}
            testID="tool-form-brandId"
          />
        )}
        {factories.isPending ? (
          <Loading label="Loading factories…" />
        ) : factories.isError ? (
          <Banner kind="due" title="Factories did not load" message={toUserMessage(factories.error)} />
        ) : (
          <ChoiceGroup
            label="Factory (where the tool sits)"
            options={factories.data.map((x) => ({ value: x.id, label: x.name, hint: `${x.city}, ${x.country}` }))}
            value={f.values.factoryId || null}
            onChange={(v) => void f.setFieldValue('factoryId', v)}
            error={err('factoryId')}
            testID="tool-form-factoryId"
          />
        )}
        <ChoiceGroup
          label="Status"
          options={(statusLocked ? [f.values.status] : editableToolStatuses).map((s) => ({ value: s as ToolStatus, label: toolStatusLabels[s as ToolStatus] }))}
          value={f.values.status}
          onChange={(v) => void f.setFieldValue('status', v)}
          disabled={statusLocked}
          hint={statusLocked ? 'Set by a change request; it changes when the change is finished or withdrawn.' : '"Being changed" comes from a change request; "disposed" from a keep-or-scrap decision.'}
          error={err('status')}
          testID="tool-form-status"
        />
      </Card>

      <Card style={styles.group}>
        <AppText variant="heading" role="heading" aria-level={2}>
          Build and life
        </AppText>
        <ChoiceGroup
          label="Construction"
          options={constructions.map((c) => ({ value: c, label: constructionLabels[c] }))}
          value={f.values.construction || null}
          onChange={(v) => void f.setFieldValue('construction', v)}
          error={err('construction')}
          testID="tool-form-construction"
        />
        <ChoiceGroup
          label="Mold class (expected life)"
          options={moldClasses.map((c) => ({ value: String(c.moldClass), label: String(c.moldClass), hint: c.lifeText }))}
          value={f.values.moldClass || null}
          onChange={(v) => void f.setFieldValue('moldClass', v)}
          error={err('moldClass')}
          testID="tool-form-moldClass"
        />
        <View style={pair}>
          <View style={styles.cell}>
            <TextField
              label="Rated shots"
              mono
              keyboardType="number-pad"
              placeholder={classFigure ? formatShots(classFigure.ratedShots).replace(/,/g, '') : undefined}
              hint={mode === 'create' ? 'Leave empty to use the class figure' : 'From the class or the mold maker'}
              {...text('ratedShots')}
            />
          </View>
          <View style={styles.cell}>
            <TextField label="Shots run so far" mono keyboardType="number-pad" {...text('shotCount')} />
          </View>
        </View>
        <TextField
          label="Where the rated shots come from"
          multiline
          placeholder={classFigure ? classFigure.source : "e.g. the mold maker's quotation and its number"}
          hint={mode === 'create' ? 'Needed when you enter your own rated shots' : 'Change it with the figure'}
          {...text('ratedShotsSource')}
        />
        <View style={pair}>
          <View style={styles.cell}>
            <TextField label="Cavities" mono keyboardType="number-pad" {...text('cavityCount')} />
          </View>
          <View style={styles.cell}>
            <TextField label="Weight (kg)" mono keyboardType="decimal-pad" hint="Used for the lifting caution" {...text('weightKg')} />
          </View>
        </View>
        <View style={pair}>
          <View style={styles.cell}>
            <TextField label="Build cost" mono keyboardType="decimal-pad" placeholder="18500.00" {...text('buildCost')} />
          </View>
          <View style={styles.cellSmall}>
            <TextField label="Currency" mono autoCapitalize="characters" maxLength={3} {...text('currency')} />
          </View>
        </View>
      </Card>

      <Card style={styles.group}>
        <AppText variant="heading" role="heading" aria-level={2}>
          Dates and place
        </AppText>
        <View style={pair}>
          <View style={styles.cell}>
            <TextField label="Build date" mono placeholder="YYYY-MM-DD" {...text('buildDate')} />
          </View>
          <View style={styles.cell}>
            <TextField label="Last run" mono placeholder="YYYY-MM-DD" hint="Retention counts from here" {...text('lastRunDate')} />
          </View>
        </View>
        <TextField label="Storage location" placeholder="Bay C, rack 4" {...text('storageLocation')} />
      </Card>
    </>
  );
}

const styles = StyleSheet.create({
  group: { gap: space.xs, padding: space.xl },
  pair: { gap: space.xs },
  pairWide: { flexDirection: 'row', gap: space.lg },
  cell: { flex: 1 },
  cellSmall: { flex: 1, maxWidth: 140 },
});

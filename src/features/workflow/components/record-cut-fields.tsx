import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Attachment, AttachmentKind, RequestDetail } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { TextField } from '@/components/ui/text-field';
import { useWide } from '@/theme/use-wide';
import { space } from '@/theme';

/** What the host passes to show and add a request's images of one kind (the request images view). */
export interface ImagesSlotProps {
  requestKey: string;
  attachments: readonly Attachment[];
  uploadKinds: readonly AttachmentKind[];
  kinds: readonly AttachmentKind[];
  testID: string;
}
export type RenderImages = (p: ImagesSlotProps) => ReactNode;

export interface CutValues {
  /** As typed: "1,250.00" in the tool's currency. */
  cost: string;
  /** YYYY-MM-DD */
  cutOn: string;
  note: string;
}

/**
 * The cut as the engineer or the factory's toolmaker reports it: what it actually cost, the day
 * the tool was cut, a note, and the first-sample photos (sent at once, like every request image).
 */
export function RecordCutFields({
  r,
  values,
  onChange,
  errors,
  currency,
  renderImages,
  testID,
}: {
  r: RequestDetail;
  values: CutValues;
  onChange: (v: CutValues) => void;
  errors: Record<string, string>;
  currency: string;
  /** Shows the first-sample photos with picking and upload (composed by the route). */
  renderImages?: RenderImages;
  testID: string;
}) {
  const wide = useWide();
  const set = (k: keyof CutValues) => (text: string) => onChange({ ...values, [k]: text });
  const samples = r.attachments.filter((a) => a.kind === 'sample');
  const canAdd = r.permissions.uploadKinds.includes('sample');
  return (
    <View style={styles.wrap}>
      <View style={[styles.pair, wide && styles.pairWide]}>
        <View style={wide ? styles.half : undefined}>
          <TextField
            label={`Actual cost (${currency})`}
            hint="What the change cost in the end, e.g. 1,250.00"
            value={values.cost}
            onChangeText={set('cost')}
            error={errors['cut.actualCostCents'] ?? errors.cut}
            mono
            inputMode="decimal"
            testID={`${testID}-cost`}
          />
        </View>
        <View style={wide ? styles.half : undefined}>
          <TextField
            label="Date cut"
            hint="YYYY-MM-DD, not in the future"
            value={values.cutOn}
            onChangeText={set('cutOn')}
            error={errors['cut.cutOn']}
            mono
            leadingIcon="calendar"
            testID={`${testID}-date`}
          />
        </View>
      </View>
      <TextField
        label="Note on the cut (optional)"
        hint="What was done, anything the samples reviewers should look at."
        value={values.note}
        onChangeText={set('note')}
        error={errors['cut.note']}
        multiline
        testID={`${testID}-note`}
      />
      {renderImages && (canAdd || samples.length)
        ? renderImages({ requestKey: r.id, attachments: samples, uploadKinds: canAdd ? ['sample'] : [], kinds: ['sample'], testID: `${testID}-samples` })
        : null}
      {canAdd && samples.length === 0 ? (
        <AppText variant="small" tone="soft">
          Add photos of the first samples from the changed tool: the designer and the tooling engineer check them next.
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  pair: { gap: space.xs },
  pairWide: { flexDirection: 'row', gap: space.md },
  half: { flex: 1 },
});

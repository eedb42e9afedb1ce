import { StyleSheet, View } from 'react-native';
import { steelActionLabels, undoPathLabels } from '@shared/domain/steel-direction';
import { imageRoleLabels, itemMethodLabels, markShapeLabels, partEffectLabels, safetyFlagLabels } from '@shared/schemas/change-items';
import type { RequestItemDto } from '@shared/schemas/change-requests';
import { AppText } from '@/components/ui/app-text';
import { Card } from '@/components/ui/card';
import { StatusPill } from '@/components/ui/status-pill';
import { space } from '@/theme';
import { formatSize } from '@/lib/requests/format';
import { SteelLine } from './impact-panel';

/** The cut items of a request: what happens to the part, how, the steel action and undo path, and why. */
export function RequestItems({ items, testID = 'request-items' }: { items: readonly RequestItemDto[]; testID?: string }) {
  if (items.length === 0) {
    return (
      <AppText variant="body" tone="soft" testID={`${testID}-empty`}>
        No cut items yet.
      </AppText>
    );
  }
  return (
    <View style={styles.list} testID={testID}>
      {items.map((item, i) => (
        <Card key={item.id} accent={item.steel.irreversible ? 'irreversible' : undefined} testID={`${testID}-${i + 1}`}>
          <View style={styles.head}>
            <AppText variant="monoStrong">{i + 1}</AppText>
            <AppText variant="heading" style={styles.shrink}>
              {item.partName}
            </AppText>
            <AppText variant="mono">{formatSize(item.size, item.unit)}</AppText>
          </View>
          <View style={styles.facts}>
            <Fact label="Part" value={partEffectLabels[item.effect]} />
            <Fact label="Method" value={itemMethodLabels[item.method]} />
          </View>
          <SteelLine
            steelAction={steelActionLabels[item.steel.steelAction]}
            undo={undoPathLabels[item.steel.undoPath]}
            irreversible={item.steel.irreversible}
            testID={`${testID}-${i + 1}-steel`}
          />
          <AppText variant="small" testID={`${testID}-${i + 1}-why`}>
            {item.steel.why}
          </AppText>
          {item.note ? <AppText variant="body">{item.note}</AppText> : null}
          {item.safetyFlags.length > 0 || item.region ? (
            <View style={styles.pills}>
              {item.safetyFlags.map((f) => (
                <StatusPill key={f} label={safetyFlagLabels[f]} icon="warning" tone="due" />
              ))}
              {item.region ? (
                <StatusPill label={`${markShapeLabels[item.region.shape]} marked on the ${imageRoleLabels[item.region.imageRole].toLowerCase()}`} icon={item.region.shape === 'box' ? 'mark-box' : 'mark-circle'} tone="neutral" />
              ) : null}
            </View>
          ) : null}
        </Card>
      ))}
    </View>
  );
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.fact}>
      <AppText variant="caption">{label}</AppText>
      <AppText variant="body">{value}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  head: { flexDirection: 'row', alignItems: 'baseline', gap: space.sm },
  shrink: { flex: 1 },
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  fact: { gap: 2, minWidth: 140, flexShrink: 1 },
  pills: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

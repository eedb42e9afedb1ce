import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { space } from '@/theme';

export interface EndedProductLine {
  id: string;
  sku: string;
  name: string;
  plannedUnits?: number;
}

const units = (n: number) => `${n.toLocaleString('en-US')} planned ${n === 1 ? 'unit' : 'units'}`;

/**
 * The loud warning shown wherever a change that cannot be undone is shown or edited. It says so in
 * words and names every product the change ends, so nobody has to read the items to know.
 */
export function IrreversibleBanner({
  toolCode,
  ended,
  removesSteel = true,
  testID = 'irreversible-banner',
}: {
  toolCode: string;
  ended: readonly EndedProductLine[];
  /** False when the change only welds (adds) steel: the words differ, the warning does not. */
  removesSteel?: boolean;
  testID?: string;
}) {
  const what = removesSteel ? `Steel taken out of tool ${toolCode} cannot be put back` : `Welding changes the steel of tool ${toolCode} for good`;
  const message =
    ended.length === 0
      ? `${what}. No product in line or planned still needs the changed parts.`
      : `${what}, so ${ended.length === 1 ? 'this product' : `these ${ended.length} products`} can no longer be made from it:`;
  return (
    <Banner kind="irreversible" title="This change cannot be undone" message={message} testID={testID}>
      {ended.length > 0 ? (
        <View style={styles.list} testID={`${testID}-products`}>
          {ended.map((p) => (
            <View key={p.id} style={styles.row} testID={`${testID}-product-${p.sku}`}>
              <AppText variant="monoStrong">{p.sku}</AppText>
              <AppText variant="bodyStrong" style={styles.name}>
                {p.name}
              </AppText>
              {p.plannedUnits !== undefined && p.plannedUnits > 0 ? <AppText variant="small">{units(p.plannedUnits)}</AppText> : null}
            </View>
          ))}
        </View>
      ) : null}
    </Banner>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xs, marginTop: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.sm },
  name: { flexShrink: 1 },
});

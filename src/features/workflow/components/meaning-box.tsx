import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, radii, space } from '@/theme';

export interface MeaningBoxProps {
  /** The meaning of the signature, as the record will keep it; null for a step that signs nothing. */
  meaning: string | null;
  signerName: string;
  roleLabel: string;
  /** The reserved colour, for the approval of a change that cannot be undone. */
  irreversible?: boolean;
  testID?: string;
}

/** What the signature will say, shown BEFORE signing, with who signs. */
export function MeaningBox({ meaning, signerName, roleLabel, irreversible, testID = 'meaning' }: MeaningBoxProps) {
  return (
    <View style={[styles.box, irreversible && styles.loud]} testID={testID} role="note" aria-label="What your signature says">
      <View style={styles.head}>
        <Icon name="sign" size={20} color={irreversible ? colors.irreversible : colors.ink} strokeWidth={2} />
        <AppText variant="caption">{meaning ? 'What your signature says' : 'Not a signature'}</AppText>
      </View>
      {meaning ? (
        <AppText variant="bodyStrong" testID={`${testID}-text`}>
          “{meaning}”
        </AppText>
      ) : (
        <AppText variant="body" testID={`${testID}-text`}>
          Withdrawing is recorded in the request's history with your name and reason, but signs nothing.
        </AppText>
      )}
      <AppText variant="small" testID={`${testID}-signer`}>
        {meaning ? 'Signed' : 'Recorded'} as {signerName}, {roleLabel}. The record keeps the time and exactly what the request said at that moment.
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    gap: space.xs,
    padding: space.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steel,
    borderLeftWidth: 4,
    borderLeftColor: colors.ink,
    backgroundColor: colors.paper,
  },
  loud: { borderColor: colors.irreversible, borderLeftColor: colors.irreversible },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});

import { useEffect, useRef, useState } from 'react';
import { Platform, Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, radii, space, touch } from '@/theme';
import { formatInZone, formatUtc } from '@/lib/requests/workflow-format';

/**
 * A signing time in the viewer's zone. The UTC time the record keeps shows on hover (web title)
 * and on press (phones have no hover).
 */
export function SignedTime({ iso, timeZone, testID }: { iso: string; timeZone: string; testID?: string }) {
  const [showUtc, setShowUtc] = useState(false);
  const ref = useRef<View>(null);
  const local = formatInZone(iso, timeZone);
  const utc = formatUtc(iso);
  useEffect(() => {
    // react-native-web does not forward `title`; on the web the ref is the DOM element.
    if (Platform.OS !== 'web') return;
    const el = ref.current as unknown as { setAttribute?: (k: string, v: string) => void } | null;
    el?.setAttribute?.('title', utc);
  }, [utc]);
  return (
    <Pressable
      ref={ref}
      onPress={() => setShowUtc((v) => !v)}
      role="button"
      aria-expanded={showUtc}
      accessibilityLabel={`${local}. ${showUtc ? 'Hide' : 'Show'} the time in UTC`}
      testID={testID}
      style={({ pressed }) => [styles.time, pressed && styles.pressed]}
    >
      <View style={styles.row}>
        <Icon name="clock" size={16} color={colors.inkSoft} />
        <AppText variant="monoSmall" style={styles.local} testID={testID ? `${testID}-local` : undefined}>
          {local}
        </AppText>
      </View>
      {showUtc ? (
        <AppText variant="monoSmall" testID={testID ? `${testID}-utc` : undefined}>
          {utc}
        </AppText>
      ) : null}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  time: { alignSelf: 'flex-start', minHeight: touch, justifyContent: 'center', paddingHorizontal: space.xs, marginLeft: -space.xs, borderRadius: radii.sm },
  pressed: { backgroundColor: colors.steelWash },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  local: { color: colors.ink },
});

import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { AppText } from '@/components/ui/app-text';
import { Icon } from '@/components/ui/icon';
import { colors, fonts, layout, space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { Wordmark } from '@/components/wordmark';

const points = [
  { icon: 'tool' as const, text: 'Propose a change to a tool with before and after sculpts.' },
  { icon: 'irreversible' as const, text: 'See which cuts remove steel and which products they end.' },
  { icon: 'shield' as const, text: 'Sign off by role, with a record nobody can rewrite.' },
];

/** Frame for the signed-out screens: the product's name and purpose beside (wide) or above (phone) a form. */
export function AuthFrame({ children, testID }: { children: ReactNode; testID?: string }) {
  const wide = useWide();
  const insets = useSafeAreaInsets();
  if (wide) {
    return (
      <View style={styles.wideRoot} testID={testID}>
        <View style={styles.panel}>
          <Wordmark inverse />
          <View style={styles.points}>
            <AppText style={styles.claim}>Decide tool changes before the steel is cut.</AppText>
            {points.map((p) => (
              <View key={p.icon} style={styles.point}>
                <Icon name={p.icon} size={22} color="#C9D1D8" />
                <AppText style={styles.pointText}>{p.text}</AppText>
              </View>
            ))}
          </View>
          <AppText style={styles.footnote}>
            Toolgate records decisions. It does not replace a toolmaker&apos;s or a test lab&apos;s judgement.
          </AppText>
        </View>
        <ScrollView style={styles.formSide} contentContainerStyle={styles.formSideContent} keyboardShouldPersistTaps="handled">
          <View style={styles.formColumn}>{children}</View>
        </ScrollView>
      </View>
    );
  }
  return (
    <ScrollView
      style={styles.phoneRoot}
      contentContainerStyle={[styles.phoneContent, { paddingTop: insets.top + space.xl, paddingBottom: insets.bottom + space.xxl }]}
      keyboardShouldPersistTaps="handled"
      testID={testID}
    >
      <View style={styles.formColumn}>
        <Wordmark />
        <AppText variant="small" style={styles.phoneClaim}>
          Decide tool changes before the steel is cut.
        </AppText>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  panel: { width: 440, backgroundColor: colors.ink, padding: space.xxxl, justifyContent: 'space-between' },
  points: { gap: space.lg },
  claim: { fontFamily: fonts.sansSemiBold, fontSize: 26, lineHeight: 34, color: colors.onColour, marginBottom: space.md },
  point: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start' },
  pointText: { flex: 1, fontFamily: fonts.sans, fontSize: 16, lineHeight: 24, color: '#DCE2E7' },
  footnote: { fontFamily: fonts.sans, fontSize: 13, lineHeight: 19, color: '#AEB8C1' },
  formSide: { flex: 1 },
  formSideContent: { flexGrow: 1, justifyContent: 'center', padding: space.xxxl },
  formColumn: { width: '100%', maxWidth: layout.formMax, alignSelf: 'center', gap: space.lg },
  phoneRoot: { flex: 1, backgroundColor: colors.paper },
  phoneContent: { flexGrow: 1, paddingHorizontal: space.lg },
  phoneClaim: { marginTop: -space.sm },
});

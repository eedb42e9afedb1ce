import { StyleSheet, View } from 'react-native';
import { space, tones } from '@/theme';
import { AppText } from './app-text';
import { Button } from './button';
import { Icon } from './icon';

export interface ConfirmBoxProps {
  title: string;
  /** What will happen, in words. */
  message: string;
  confirmTitle: string;
  cancelTitle?: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
  /** 'irreversible' ONLY when the action cannot be undone; 'due' for weighty but reversible. */
  tone?: 'info' | 'due' | 'irreversible';
  testID?: string;
}

/**
 * An inline "are you sure" panel (works the same on the web, where native alerts do not exist).
 * Show it in place of the button that opened it.
 */
export function ConfirmBox({ title, message, confirmTitle, cancelTitle = 'Cancel', onConfirm, onCancel, busy, tone = 'due', testID }: ConfirmBoxProps) {
  const t = tones[tone];
  return (
    <View style={[styles.box, { borderColor: t.border, backgroundColor: t.bg }]} role="alertdialog" aria-label={title} testID={testID}>
      <View style={styles.head}>
        <Icon name={tone === 'irreversible' ? 'irreversible' : tone === 'due' ? 'warning' : 'info'} size={22} color={t.fg} strokeWidth={2} />
        <AppText variant="bodyStrong" style={[styles.title, { color: tone === 'info' ? undefined : t.fg }]}>
          {title}
        </AppText>
      </View>
      <AppText variant="body">{message}</AppText>
      <View style={styles.buttons}>
        <Button
          title={confirmTitle}
          onPress={onConfirm}
          busy={busy}
          variant={tone === 'irreversible' ? 'irreversible' : 'primary'}
          testID={testID ? `${testID}-confirm` : undefined}
        />
        <Button title={cancelTitle} onPress={onCancel} variant="secondary" disabled={busy} testID={testID ? `${testID}-cancel` : undefined} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 2, borderRadius: 10, padding: space.lg, gap: space.md },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  title: { flex: 1 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

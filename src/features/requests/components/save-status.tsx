import { StyleSheet, View } from 'react-native';
import { AppText, type TextTone } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Icon, type IconName } from '@/components/ui/icon';
import { colors, space } from '@/theme';
import { formatClock } from '@/lib/requests/format';
import type { SaveState } from '../use-request-draft';

const look = (s: SaveState, isNew: boolean): { icon: IconName; text: string; tone: TextTone } => {
  switch (s.kind) {
    case 'clean':
      return isNew ? { icon: 'info', text: 'Not saved yet. What you type is kept on this device until you save.', tone: 'soft' } : { icon: 'done', text: 'No unsaved changes.', tone: 'soft' };
    case 'pending':
      return isNew
        ? { icon: 'save', text: 'Kept on this device, not yet sent. Save the draft to send it.', tone: 'soft' }
        : { icon: 'clock', text: 'Changes kept on this device; saving in a moment.', tone: 'soft' };
    case 'saving':
      return { icon: 'upload', text: 'Saving…', tone: 'soft' };
    case 'saved':
      return { icon: 'done', text: `Saved at ${formatClock(s.at)}.`, tone: 'go' };
    case 'offline':
      return {
        icon: 'cloud-off',
        text: `Saved on this device, not yet sent. No connection${s.retryAt ? `: trying again at ${formatClock(s.retryAt)}` : ''}.`,
        tone: 'due',
      };
    case 'invalid':
      return { icon: 'alert', text: 'Saved on this device, not yet sent: fix the highlighted fields to send it.', tone: 'due' };
    case 'refused':
      return { icon: 'alert', text: 'Not saved: see the message above. What you typed is kept on this device.', tone: 'due' };
    case 'conflict':
      return { icon: 'alert', text: 'Not saved: this request changed elsewhere. Choose what to keep above.', tone: 'due' };
  }
};

/** Where the form stands, in words: saved, kept on this device, sending, or why not. */
export function SaveStatus({ state, isNew, onRetry, testID = 'request-save-state' }: { state: SaveState; isNew: boolean; onRetry: () => void; testID?: string }) {
  const l = look(state, isNew);
  const colour = l.tone === 'go' ? colors.go : l.tone === 'due' ? colors.due : colors.inkSoft;
  return (
    <View style={styles.row} role="status" testID={testID}>
      <Icon name={l.icon} size={18} color={colour} />
      <AppText variant="small" tone={l.tone} style={styles.text} testID={`${testID}-text`}>
        {l.text}
      </AppText>
      {state.kind === 'offline' ? <Button title="Try now" variant="quiet" icon="refresh" onPress={onRetry} testID={`${testID}-retry`} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 32 },
  text: { flex: 1 },
});

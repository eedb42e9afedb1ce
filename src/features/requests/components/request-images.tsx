import { useState } from 'react';
import { Image, Platform, StyleSheet, View } from 'react-native';
import type { Attachment, AttachmentKind } from '@shared/schemas/change-requests';
import { toUserMessage } from '@/api/errors';
import { attachmentSrc } from '@/api/requests';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { colors, fonts, radii, space } from '@/theme';
import { formatBytes } from '@/lib/requests/format';
import { useDeleteAttachment } from '../hooks';
import { pickImages } from '../pick-images';
import { NEW_REQUEST, uploadQueue, type QueuedUpload } from '../upload-queue';
import { useUploads } from '../use-uploads';

const kindWords: Record<AttachmentKind, { title: string; hint: string; add: string }> = {
  before: { title: 'Before', hint: 'The part or sculpt as it is now.', add: 'Add before image' },
  after: { title: 'After', hint: 'The part or sculpt as it should be after the change.', add: 'Add after image' },
  sample: { title: 'First samples', hint: 'Photos of parts molded from the changed tool.', add: 'Add sample photo' },
  other: { title: 'Other', hint: 'Drawings, references.', add: 'Add other image' },
};

export interface RequestImagesProps {
  /** The request id, or "new" before the first save. */
  requestKey: string;
  attachments: readonly Attachment[];
  /** Kinds the user may add and remove now (empty: read-only). */
  uploadKinds: readonly AttachmentKind[];
  /** Kinds shown even when empty (others appear only when they hold files). */
  kinds?: readonly AttachmentKind[];
  testID?: string;
}

/** Images of a request by kind, with picking, a progress bar per file, refusals in words, and removal. */
export function RequestImages({ requestKey, attachments, uploadKinds, kinds = ['before', 'after'], testID = 'request-images' }: RequestImagesProps) {
  const queued = useUploads(requestKey);
  const shown = (['before', 'after', 'sample', 'other'] as const).filter(
    (k) => kinds.includes(k) || (uploadKinds.includes(k) && k === 'sample') || attachments.some((a) => a.kind === k) || queued.some((q) => q.kind === k),
  );
  return (
    <View style={styles.wrap} testID={testID}>
      {requestKey === NEW_REQUEST && queued.length > 0 ? (
        <AppText variant="small" tone="soft" testID={`${testID}-held-note`}>
          Photos are sent as soon as the draft is saved for the first time. Keep this page open until then.
        </AppText>
      ) : null}
      {shown.map((kind) => (
        <KindGroup
          key={kind}
          kind={kind}
          requestKey={requestKey}
          attachments={attachments.filter((a) => a.kind === kind)}
          queued={queued.filter((q) => q.kind === kind)}
          editable={uploadKinds.includes(kind)}
          testID={`${testID}-${kind}`}
        />
      ))}
    </View>
  );
}

function KindGroup({
  kind,
  requestKey,
  attachments,
  queued,
  editable,
  testID,
}: {
  kind: AttachmentKind;
  requestKey: string;
  attachments: readonly Attachment[];
  queued: readonly QueuedUpload[];
  editable: boolean;
  testID: string;
}) {
  const [pickError, setPickError] = useState<string | null>(null);
  const words = kindWords[kind];
  const add = async (source: 'library' | 'camera') => {
    setPickError(null);
    const res = await pickImages(source);
    if (res.ok) uploadQueue.add(requestKey, kind, res.files);
    else if (res.message) setPickError(res.message);
  };
  const empty = attachments.length === 0 && queued.length === 0;
  return (
    <View style={styles.group} testID={testID}>
      <View style={styles.groupHead}>
        <View style={styles.groupTitles}>
          <AppText variant="bodyStrong">{words.title}</AppText>
          <AppText variant="small">{words.hint}</AppText>
        </View>
      </View>
      {empty ? (
        <AppText variant="small" tone="faint" testID={`${testID}-empty`}>
          No {words.title.toLowerCase()} image yet.
        </AppText>
      ) : null}
      {attachments.map((a) => (
        <StoredRow key={a.id} a={a} requestId={requestKey} editable={editable} testID={`${testID}-file-${a.filename}`} />
      ))}
      {queued.map((q) => (
        <QueuedRow key={q.key} q={q} testID={`${testID}-queued-${q.fileName}`} />
      ))}
      {pickError ? <Banner kind="due" message={pickError} /> : null}
      {editable ? (
        <View style={styles.addRow}>
          <Button title={words.add} icon="upload" variant="secondary" onPress={() => void add('library')} testID={`${testID}-add`} />
          {Platform.OS !== 'web' ? <Button title="Take photo" icon="camera" variant="secondary" onPress={() => void add('camera')} testID={`${testID}-camera`} /> : null}
        </View>
      ) : null}
    </View>
  );
}

function Thumb({ uri }: { uri: string | null }) {
  return (
    <View style={styles.thumb}>
      {uri ? <Image source={{ uri }} style={styles.thumbImage} resizeMode="cover" /> : <Icon name="image" size={24} color={colors.steel} />}
    </View>
  );
}

function StoredRow({ a, requestId, editable, testID }: { a: Attachment; requestId: string; editable: boolean; testID: string }) {
  const del = useDeleteAttachment(requestId);
  const [asking, setAsking] = useState(false);
  return (
    <View style={styles.row} testID={testID}>
      <Thumb uri={attachmentSrc(a, 'thumbnail')} />
      <View style={styles.rowText}>
        <AppText variant="label" numberOfLines={1}>
          {a.filename}
        </AppText>
        <View style={styles.statusLine}>
          <Icon name="done" size={16} color={colors.go} />
          <AppText variant="small">
            Sent · {formatBytes(a.size)}
            {a.width && a.height ? ` · ${a.width} × ${a.height}` : ''}
          </AppText>
        </View>
        {del.isError ? (
          <AppText variant="small" tone="due">
            {toUserMessage(del.error)}
          </AppText>
        ) : null}
        {editable && asking ? (
          <View style={styles.confirm}>
            <Button title="Remove image" variant="secondary" icon="trash" busy={del.isPending} onPress={() => del.mutate(a.id)} testID={`${testID}-remove-confirm`} />
            <Button title="Keep" variant="quiet" onPress={() => setAsking(false)} />
          </View>
        ) : null}
      </View>
      {editable && !asking ? (
        <Button title="Remove" variant="quiet" icon="trash" onPress={() => setAsking(true)} accessibilityLabel={`Remove ${a.filename}`} testID={`${testID}-remove`} />
      ) : null}
    </View>
  );
}

function QueuedRow({ q, testID }: { q: QueuedUpload; testID: string }) {
  const failed = q.status === 'failed';
  const status =
    q.status === 'held'
      ? 'Waits for the first save'
      : q.status === 'waiting'
        ? 'Waiting to send'
        : q.status === 'sending'
          ? `Sending… ${Math.round(q.progress * 100)} %`
          : 'Not sent';
  return (
    <View style={[styles.row, failed && styles.rowFailed]} testID={testID}>
      <Thumb uri={q.previewUri} />
      <View style={styles.rowText}>
        <AppText variant="label" numberOfLines={1}>
          {q.fileName}
        </AppText>
        <View style={styles.statusLine}>
          <Icon name={failed ? 'alert' : q.status === 'held' ? 'clock' : 'upload'} size={16} color={failed ? colors.due : colors.inkSoft} />
          <AppText variant="small" tone={failed ? 'due' : 'soft'} testID={`${testID}-status`}>
            {status}
            {q.size ? ` · ${formatBytes(q.size)}` : ''}
          </AppText>
        </View>
        {q.status === 'sending' || q.status === 'waiting' ? (
          <View style={styles.bar} role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(q.progress * 100)} testID={`${testID}-progress`}>
            <View style={[styles.barFill, { width: `${Math.round(q.progress * 100)}%` }]} />
          </View>
        ) : null}
        {failed && q.error ? (
          <AppText variant="small" tone="due" style={styles.errorText} testID={`${testID}-error`}>
            {q.error}
          </AppText>
        ) : null}
        {failed ? (
          <View style={styles.confirm}>
            <Button title="Try again" variant="secondary" icon="refresh" onPress={() => uploadQueue.retry(q.key)} testID={`${testID}-retry`} />
            <Button title="Remove" variant="quiet" onPress={() => uploadQueue.remove(q.key)} testID={`${testID}-drop`} />
          </View>
        ) : null}
      </View>
      {!failed ? (
        <Button title="Cancel" variant="quiet" onPress={() => uploadQueue.remove(q.key)} accessibilityLabel={`Cancel ${q.fileName}`} testID={`${testID}-cancel`} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  group: { gap: space.sm },
  groupHead: { flexDirection: 'row', alignItems: 'flex-end', gap: space.md },
  groupTitles: { flex: 1, gap: 2 },
  row: {
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: space.md,
    padding: space.sm,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: colors.steelLight,
    backgroundColor: colors.card,
  },
  rowFailed: { borderColor: colors.due, backgroundColor: colors.dueWash },
  rowText: { flex: 1, gap: space.xxs, minWidth: 0 },
  statusLine: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  errorText: { fontFamily: fonts.sansMedium },
  thumb: {
    width: 64,
    height: 64,
    borderRadius: radii.sm,
    backgroundColor: colors.steelWash,
    alignItems: 'center',
    justifyContent: 'center',
    overflow: 'hidden',
  },
  thumbImage: { width: 64, height: 64 },
  bar: { height: 6, borderRadius: 3, backgroundColor: colors.steelLight, overflow: 'hidden', marginTop: space.xs },
  barFill: { height: '100%', backgroundColor: colors.go },
  confirm: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.xs },
  addRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

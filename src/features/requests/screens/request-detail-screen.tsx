import { useState, type ReactNode } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';
import type { Attachment, AttachmentKind, RequestDetail } from '@shared/schemas/change-requests';
import { attachmentSrc } from '@/api/requests';
import { AppText } from '@/components/ui/app-text';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { DetailRow } from '@/components/ui/detail-row';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { isApiError } from '@/api/errors';
import { colors, radii, space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { formatDay } from '@/lib/requests/format';
import { useRequest } from '../hooks';
import { compareImageOf, mainAttachment, marksOf } from '../images';
import { ImageCompare } from '../components/image-compare';
import { ImpactPanel } from '../components/impact-panel';
import { IrreversibleBanner } from '../components/irreversible-banner';
import { RequestImages } from '../components/request-images';
import { RequestItems } from '../components/request-items';
import { CannotUndoPill, RequestStatusPill } from '@/components/requests/request-status';
import { SafetyCautions } from '../components/safety-cautions';
import { CutSheetDownload } from '../components/cut-sheet-download';
import { stateLook } from '@/lib/requests/status';

const back = { href: '/requests' as const, label: 'Requests' };

export interface RequestDetailScreenProps {
  requestId: string;
  /** The sign-off workflow (who it waits for, the caller's actions, the timeline), right under the summary. */
  renderActions?: (r: RequestDetail) => ReactNode;
  /** The numbers behind the change, after the cut items and what the change ends. */
  renderNumbers?: (r: RequestDetail) => ReactNode;
}

export function RequestDetailScreen({ requestId, renderActions, renderNumbers }: RequestDetailScreenProps) {
  const r = useRequest(requestId);
  if (r.isPending) return <Loading fill label="Loading the request…" />;
  if (r.isError) {
    const missing = isApiError(r.error) && r.error.status === 404;
    return (
      <Screen title={missing ? 'Request not found' : 'Request'} back={back} testID="request-detail">
        {missing ? (
          <EmptyState
            icon="search"
            title="No such request, or not yours to see"
            body="The link may be old, or the request belongs to a brand or factory you do not work with."
            action={{ title: 'Open requests', href: '/requests' }}
          />
        ) : (
          <ErrorState error={r.error} onRetry={() => void r.refetch()} />
        )}
      </Screen>
    );
  }
  return <Detail r={r.data} workflow={renderActions?.(r.data)} numbers={renderNumbers?.(r.data)} />;
}

function Detail({ r, workflow, numbers }: { r: RequestDetail; workflow: ReactNode; numbers: ReactNode }) {
  const wide = useWide();
  const canEdit = r.permissions.canEdit || r.permissions.canEditItems;
  const look = stateLook(r.status);
  return (
    <Screen
      title={r.title}
      eyebrow={`${r.ref} · ${r.tool.code}`}
      back={back}
      actions={
        canEdit ? (
          <Button
            title={r.permissions.canEdit ? 'Edit draft' : 'Edit cut items'}
            icon="edit"
            variant="secondary"
            href={{ pathname: '/requests/[id]/edit', params: { id: r.id } }}
            testID="request-edit"
          />
        ) : null
      }
      testID="request-detail"
    >
      <View style={styles.pills}>
        <RequestStatusPill status={r.status} testID="request-detail-status" />
        {r.irreversible ? <CannotUndoPill testID="request-detail-irreversible" /> : null}
        <AppText variant="small">{look.description}</AppText>
      </View>

      {r.impact.irreversible ? <IrreversibleBanner toolCode={r.tool.code} ended={r.impact.endedProducts} removesSteel={r.impact.removesSteel} testID="request-banner" /> : null}

      <Card padded={false}>
        <View style={styles.details}>
          <DetailRow
            label="Tool"
            value={
              <View style={styles.inline}>
                <AppText variant="monoStrong">{r.tool.code}</AppText>
                <AppText variant="body">{r.tool.name}</AppText>
                <AppText variant="small">revision {r.tool.currentRevision}</AppText>
              </View>
            }
            testID="request-detail-tool"
          />
          <DetailRow
            label="For the product"
            value={
              r.derivativeProduct ? (
                <View style={styles.inline}>
                  <AppText variant="monoStrong">{r.derivativeProduct.sku}</AppText>
                  <AppText variant="body">{r.derivativeProduct.name}</AppText>
                </View>
              ) : (
                'Not decided yet'
              )
            }
            testID="request-detail-derivative"
          />
          <DetailRow label="Written by" value={r.submitter.name} testID="request-detail-submitter" />
          <DetailRow label="Brand · factory" value={`${r.brand.name} · ${r.tool.factory.name}`} />
          <DetailRow label="Target date" value={r.targetDate ? formatDay(r.targetDate) : ''} mono />
          <DetailRow label="Last changed" value={formatDay(r.updatedAt)} mono divider={false} />
        </View>
      </Card>

      {r.reason ? (
        <Section title="Why">
          <AppText variant="body" testID="request-detail-reason">
            {r.reason}
          </AppText>
        </Section>
      ) : null}

      {workflow}

      <Section title="Cut sheet" description="The printable sheet for the toolroom.">
        <CutSheetDownload requestId={r.id} cleared={['cut_authorized', 'samples_review', 'closed'].includes(r.status)} testID="request-detail-cut-sheet" />
      </Section>

      <Section title="Images" description="Before and after, with the places the cut items mark.">
        <Compare r={r} />
        <RequestImages
          requestKey={r.id}
          attachments={r.attachments}
          uploadKinds={detailUploadKinds(r)}
          kinds={detailUploadKinds(r).filter((k) => k === 'before' || k === 'after')}
          testID="request-detail-images"
        />
      </Section>

      <View style={[styles.columns, wide && styles.columnsWide]}>
        <View style={wide ? styles.column : undefined}>
          <Section title={`Cut items (${r.items.length})`}>
            <RequestItems items={r.items} />
          </Section>
        </View>
        <View style={wide ? styles.column : undefined}>
          <Section title="What the change ends">
            <Card>
              <ImpactPanel impact={r.impact} toolCode={r.tool.code} withBanner={false} withItems={false} testID="request-impact" />
            </Card>
          </Section>
        </View>
      </View>

      {numbers}

      <SafetyCautions review={r.safety} retestNote={r.retestNote} testID="request-safety" />
    </Screen>
  );
}

/** Sample photos belong to the factory stages; "other" files are shown only when there are some. */
function detailUploadKinds(r: RequestDetail): AttachmentKind[] {
  const sampleStage = r.status === 'cut_authorized' || r.status === 'samples_review';
  return r.permissions.uploadKinds.filter((k) => (k === 'sample' ? sampleStage : k !== 'other'));
}

/** The compare view, with a choice of picture when a kind has several. */
function Compare({ r }: { r: RequestDetail }) {
  const [beforeId, setBeforeId] = useState<string | null>(null);
  const [afterId, setAfterId] = useState<string | null>(null);
  const pick = (kind: 'before' | 'after', id: string | null) => (id ? r.attachments.find((a) => a.id === id) : undefined) ?? mainAttachment(r.attachments, kind);
  const before = pick('before', beforeId);
  const after = pick('after', afterId);
  const befores = r.attachments.filter((a) => a.kind === 'before');
  const afters = r.attachments.filter((a) => a.kind === 'after');
  if (!before && !after) {
    return (
      <AppText variant="body" tone="soft" testID="image-compare-none">
        No before or after image yet.
      </AppText>
    );
  }
  return (
    <View style={styles.compare}>
      <ImageCompare before={before ? compareImageOf(before) : null} after={after ? compareImageOf(after) : null} marks={marksOf(r.items)} />
      {befores.length > 1 ? <Chooser label="Before image" list={befores} selected={before?.id ?? null} onPick={setBeforeId} /> : null}
      {afters.length > 1 ? <Chooser label="After image" list={afters} selected={after?.id ?? null} onPick={setAfterId} /> : null}
    </View>
  );
}

function Chooser({ label, list, selected, onPick }: { label: string; list: readonly Attachment[]; selected: string | null; onPick: (id: string) => void }) {
  return (
    <View style={styles.chooser}>
      <AppText variant="small">{label} to compare:</AppText>
      <View style={styles.thumbs}>
        {list.map((a) => (
          <Pressable
            key={a.id}
            role="radio"
            aria-checked={a.id === selected}
            accessibilityLabel={a.filename}
            onPress={() => onPick(a.id)}
            style={[styles.thumb, a.id === selected && styles.thumbOn]}
          >
            <Image source={{ uri: attachmentSrc(a, 'thumbnail') }} style={styles.thumbImage} resizeMode="cover" />
          </Pressable>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  pills: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, marginTop: -space.md },
  details: { paddingHorizontal: space.lg },
  inline: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.sm },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { flex: 1, minWidth: 0 },
  compare: { gap: space.md },
  chooser: { gap: space.xs },
  thumbs: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  thumb: { width: 56, height: 56, borderRadius: radii.sm, borderWidth: 2, borderColor: 'transparent', overflow: 'hidden' },
  thumbOn: { borderColor: colors.ink },
  thumbImage: { width: '100%', height: '100%' },
});

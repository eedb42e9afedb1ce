import { useMemo, useRef, useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { router } from 'expo-router';
import { useFormik } from 'formik';
import { editableRequestFields, type EditableRequestField, type RequestDetail } from '@shared/schemas/change-requests';
import { productStatusLabels } from '@shared/schemas/registry';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ChoiceGroup } from '@/components/ui/choice-group';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { TextField } from '@/components/ui/text-field';
import { useSession } from '@/lib/session';
import { colors, space } from '@/theme';
import { useWide } from '@/theme/use-wide';
import { formatClock, formatUnits } from '@/lib/requests/format';
import {
  emptyItem,
  liveImpact,
  liveSafety,
  validateRequestForm,
  yupToFormErrors,
  type DerivativeMode,
  type RequestFormValues,
  type ToolChoice,
} from '../forms';
import { useImpactContext, useRequest } from '../hooks';
import { roleImage } from '../images';
import { ImpactPanel } from '../components/impact-panel';
import { IrreversibleBanner } from '../components/irreversible-banner';
import { errorAt, ItemEditor } from '../components/item-editor';
import { ProductPicker, ToolPicker } from '../components/pickers';
import { RequestImages } from '../components/request-images';
import { SafetyCautions } from '../components/safety-cautions';
import { SaveStatus } from '../components/save-status';
import { NEW_REQUEST } from '../upload-queue';
import { useUploads } from '../use-uploads';
import { initialDraft, useRequestDraft } from '../use-request-draft';

// The live panel stays in view while the long form scrolls (web; the style exists only there).
const stickyWeb = Platform.OS === 'web' ? ({ position: 'sticky', top: space.lg, maxHeight: `calc(100vh - ${space.lg * 2}px)`, overflowY: 'auto' } as object) : null;

/** New request (no id) or edit of an existing one. */
export function RequestFormScreen({ requestId }: { requestId?: string }) {
  const { data: me } = useSession();
  const detail = useRequest(requestId ?? '', !!requestId);
  const back = requestId ? { href: { pathname: '/requests/[id]' as const, params: { id: requestId } }, label: 'Request' } : { href: '/requests' as const, label: 'Requests' };
  if (!me) return <Loading fill />;
  if (!requestId) {
    if (me.role !== 'designer') {
      return (
        <Screen title="New change request" back={back} testID="request-form">
          <EmptyState icon="shield" title="Designers write change requests" body="A designer proposes a change to a tool; the tooling engineer then checks every cut item. Open a request from the list to follow it." action={{ title: 'Open requests', href: '/requests' }} />
        </Screen>
      );
    }
    return <RequestForm key="new" userId={me.id} request={null} />;
  }
  if (detail.isPending) return <Loading fill label="Loading the request…" />;
  if (detail.isError) {
    return (
      <Screen title="Edit request" back={back} testID="request-form">
        <ErrorState error={detail.error} onRetry={() => void detail.refetch()} />
      </Screen>
    );
  }
  const r = detail.data;
  if (r.permissions.editableFields.length === 0) {
    return (
      <Screen title={`Edit ${r.ref}`} back={back} testID="request-form">
        <EmptyState
          icon="lock"
          title="Not editable now"
          body="The designer edits a request while it is a draft; the tooling engineer may change its cut items during engineering review. Everyone else reads it."
          action={{ title: 'Open the request', href: { pathname: '/requests/[id]', params: { id: r.id } } }}
        />
      </Screen>
    );
  }
  return <RequestForm key={r.id} userId={me.id} request={r} />;
}

function RequestForm({ userId, request }: { userId: string; request: RequestDetail | null }) {
  const wide = useWide();
  const [init] = useState(() => initialDraft({ userId, request }));
  const [restoredAt, setRestoredAt] = useState(init.restoredAt);
  const submitRef = useRef<(v: RequestFormValues) => Promise<void>>(async () => undefined);
  const f = useFormik<RequestFormValues>({
    initialValues: init.values,
    validate: async (v) => {
      try {
        await validateRequestForm(v);
        return {};
      } catch (e) {
        return yupToFormErrors(e);
      }
    },
    onSubmit: (v) => submitRef.current(v),
  });
  const editable: readonly EditableRequestField[] = request ? request.permissions.editableFields : editableRequestFields;
  const can = (field: EditableRequestField) => editable.includes(field);
  const draft = useRequestDraft({
    userId,
    request,
    f,
    editable,
    staleBase: init.staleBase,
    onCreated: (r) => router.replace({ pathname: '/requests/[id]', params: { id: r.id } }),
  });
  submitRef.current = draft.submit;

  const v = f.values;
  const context = useImpactContext(v.tool?.id ?? null);
  const impact = useMemo(() => liveImpact(v, context.data), [v, context.data]);
  const safety = useMemo(() => liveSafety(v), [v]);
  const requestKey = request?.id ?? NEW_REQUEST;
  const queued = useUploads(requestKey);
  const attachments = request?.attachments ?? [];
  const images = { before: roleImage(attachments, queued, 'before'), after: roleImage(attachments, queued, 'after') };
  const uploadKinds = request ? request.permissions.uploadKinds.filter((k) => k === 'before' || k === 'after') : (['before', 'after'] as const);
  const isNew = !request;
  const conflict = draft.state.kind === 'conflict' ? draft.state : null;

  const pickTool = (t: ToolChoice) => {
    if (t.id === v.tool?.id) return;
    void f.setValues({ ...v, tool: t, items: v.items.map((i) => ({ ...i, partId: '' })), movedProductIds: [] });
  };

  const statusBlock = (
    <View style={styles.notices}>
      {restoredAt && draft.state.kind !== 'conflict' ? (
        <Banner kind="info" title={isNew ? 'Restored what you started' : 'Restored your unsent changes'} testID="request-restored">
          <AppText variant="body">
            {isNew ? 'This request was typed on this device at ' : 'These changes were typed on this device at '}
            {formatClock(restoredAt)} and have not been sent yet.
          </AppText>
          <Button
            title={isNew ? 'Start over' : 'Discard them'}
            variant="quiet"
            onPress={() => {
              draft.discardLocal();
              setRestoredAt(null);
            }}
            testID="request-restored-discard"
          />
        </Banner>
      ) : null}
      {conflict ? (
        <Banner kind="due" title="This request changed while you were editing" testID="request-conflict">
          <AppText variant="body">
            {`${conflict.current ? conflict.current.ref : 'It'} was saved elsewhere since you opened it: by someone else, or by you in another tab or on another device. `}
            Nothing of yours was sent or lost: your text is still in the form. Load their version (your text stays in sight to copy from), or keep
            yours and save it over theirs.
          </AppText>
          <View style={styles.buttons}>
            <Button title="Load their version" icon="refresh" variant="secondary" onPress={() => draft.resolveConflict('theirs')} testID="request-conflict-theirs" />
            <Button title="Keep mine and save it" variant="secondary" onPress={() => draft.resolveConflict('mine')} testID="request-conflict-mine" />
          </View>
        </Banner>
      ) : null}
      {draft.unsentCopy ? <UnsentCopy values={draft.unsentCopy} onDismiss={draft.dismissUnsent} /> : null}
      {draft.state.kind === 'refused' ? <Banner kind="due" title="Not saved" message={draft.state.message} testID="request-refused" /> : null}
      {request && !can('title') && can('items') ? (
        <Banner
          kind="info"
          title="Engineering review"
          message="You may change the cut items, the products moved to the new revision and the reason. The designer's other fields are shown for reference."
        />
      ) : null}
    </View>
  );

  const changeFields = (
    <Section title="The change">
      <Card style={styles.card}>
        <ToolPicker value={v.tool} onChange={pickTool} locked={!!request} error={errorAt(f, 'tool') ?? (f.submitCount > 0 && !v.tool ? 'Pick the tool to change' : undefined)} />
        <TextField
          label="Title"
          value={v.title}
          onChangeText={f.handleChange('title')}
          onBlur={f.handleBlur('title')}
          placeholder="Raised visor ridge on the Kite head"
          disabled={!can('title')}
          error={errorAt(f, 'title')}
          testID="request-title"
        />
        <TextField
          label="Why"
          value={v.reason}
          onChangeText={f.handleChange('reason')}
          onBlur={f.handleBlur('reason')}
          placeholder="What the change is for and why this tool"
          multiline
          disabled={!can('reason')}
          error={errorAt(f, 'reason')}
          testID="request-reason"
        />
        <ChoiceGroup<DerivativeMode>
          label="For the product"
          options={[
            { value: 'none', label: 'Not decided yet' },
            { value: 'existing', label: 'An existing product' },
            { value: 'new', label: 'A new product' },
          ]}
          value={v.derivativeMode}
          onChange={(m) => void f.setFieldValue('derivativeMode', m)}
          disabled={!can('derivativeProductId')}
          hint={v.derivativeMode === 'new' ? 'Created in the tool’s brand, in the line with 0 planned units, when you save.' : undefined}
          testID="request-derivative-mode"
        />
        {v.derivativeMode === 'existing' ? (
          <ProductPicker
            value={v.derivative}
            onChange={(p) => void f.setFieldValue('derivative', p)}
            disabled={!can('derivativeProductId')}
            error={errorAt(f, 'derivative')}
          />
        ) : null}
        {v.derivativeMode === 'new' ? (
          <View style={styles.twoCols}>
            <View style={styles.skuCol}>
              <TextField
                label="New SKU"
                value={v.newDerivative.sku}
                onChangeText={(s) => void f.setFieldValue('newDerivative.sku', s.toUpperCase())}
                onBlur={f.handleBlur('newDerivative.sku')}
                placeholder="SR-1003"
                autoCapitalize="characters"
                autoCorrect={false}
                mono
                disabled={!can('derivativeProductId')}
                error={errorAt(f, 'newDerivative.sku')}
                testID="request-new-sku"
              />
            </View>
            <View style={styles.nameCol}>
              <TextField
                label="New product name"
                value={v.newDerivative.name}
                onChangeText={(s) => void f.setFieldValue('newDerivative.name', s)}
                onBlur={f.handleBlur('newDerivative.name')}
                placeholder="Storm Kite"
                disabled={!can('derivativeProductId')}
                error={errorAt(f, 'newDerivative.name')}
                testID="request-new-name"
              />
            </View>
          </View>
        ) : null}
        <TextField
          label="Target date"
          value={v.targetDate}
          onChangeText={f.handleChange('targetDate')}
          onBlur={f.handleBlur('targetDate')}
          placeholder="2027-03-31"
          hint="When the changed tool should make parts (YYYY-MM-DD). Optional."
          mono
          leadingIcon="calendar"
          disabled={!can('targetDate')}
          error={errorAt(f, 'targetDate')}
          testID="request-target-date"
        />
      </Card>
    </Section>
  );

  const imageFields = (
    <Section title="Images" description="Before and after sculpt images. Several at once is fine: they are sent one after another.">
      <Card style={styles.card}>
        <RequestImages requestKey={requestKey} attachments={attachments} uploadKinds={uploadKinds} testID="request-form-images" />
      </Card>
    </Section>
  );

  const itemFields = (
    <Section title={`Cut items (${v.items.length})`} description="One item per change to one part. Say what happens to the part and how the toolmaker makes it.">
      {typeof f.errors.items === 'string' ? <Banner kind="due" message={f.errors.items} /> : null}
      {v.items.map((item, index) => (
        <ItemEditor
          key={item.key}
          f={f}
          index={index}
          item={item}
          context={context.data && context.data.tool.id === v.tool?.id ? context.data : undefined}
          contextLoading={context.isFetching}
          images={images}
          disabled={!can('items')}
          onRemove={() =>
            void f.setFieldValue(
              'items',
              v.items.filter((x) => x.key !== item.key),
            )
          }
        />
      ))}
      {can('items') ? (
        <Button title="Add a cut item" icon="plus" variant="secondary" onPress={() => void f.setFieldValue('items', [...v.items, emptyItem()])} testID="request-add-item" />
      ) : null}
    </Section>
  );

  const movable = context.data && context.data.tool.id === v.tool?.id ? context.data.products.filter((p) => p.status !== 'retired') : [];
  const endedIds = new Set(impact?.endedProducts.map((p) => p.id));
  const movedFields =
    movable.length > 0 ? (
      <Section title="Products moved to the new revision" description="Tick a product that will be built from the changed parts after the change, so the change does not end it.">
        <Card style={styles.card}>
          <ChoiceGroup<string>
            label="Move to the new revision"
            multiple
            options={movable.map((p) => ({
              value: p.id,
              label: `${p.sku} ${p.name}`,
              hint: `${productStatusLabels[p.status]}${p.plannedUnits ? ` · ${formatUnits(p.plannedUnits)} planned` : ''}${endedIds.has(p.id) ? ' · ended by this change unless moved' : ''}`,
            }))}
            value={v.movedProductIds}
            onChange={(ids) => void f.setFieldValue('movedProductIds', ids)}
            disabled={!can('movedProductIds')}
            error={errorAt(f, 'movedProductIds')}
            testID="request-moved"
          />
        </Card>
      </Section>
    ) : null;

  const impactBlock = (
    <View style={styles.impact} testID="request-live-impact">
      {impact ? (
        <ImpactPanel impact={impact} toolCode={v.tool?.code ?? ''} withBanner={wide} testID="form-impact" />
      ) : (
        <AppText variant="body" tone="soft" testID="form-impact-empty">
          {context.isFetching ? 'Loading the products made from this tool…' : 'Pick the tool and add cut items: what the change ends appears here as you type.'}
        </AppText>
      )}
      <SafetyCautions review={safety} testID="form-safety" />
    </View>
  );

  const saveBar = (
    <Card style={styles.saveBar}>
      <SaveStatus state={draft.state} isNew={isNew} onRetry={draft.retryNow} />
      <View style={styles.buttons}>
        <Button
          title={isNew ? 'Save draft' : 'Save now'}
          icon="save"
          busy={draft.state.kind === 'saving' || f.isSubmitting}
          busyTitle="Saving…"
          disabled={!!conflict}
          onPress={() => void f.submitForm()}
          testID="request-save"
        />
        {request ? (
          <Button
            title="Back to the request"
            variant="secondary"
            onPress={() => (router.canGoBack() ? router.back() : router.replace({ pathname: '/requests/[id]', params: { id: request.id } }))}
            testID="request-done"
          />
        ) : null}
      </View>
      {f.submitCount > 0 && !f.isValid ? (
        <AppText variant="small" tone="due" testID="request-form-invalid">
          Not sent yet. Check {errorSummary(f.errors)}: the messages are beside the fields.
        </AppText>
      ) : null}
    </Card>
  );

  const title = request ? `Edit ${request.ref}` : 'New change request';
  const back = request ? { href: { pathname: '/requests/[id]' as const, params: { id: request.id } }, label: request.ref } : { href: '/requests' as const, label: 'Requests' };

  if (wide) {
    return (
      <Screen title={title} eyebrow={request ? request.tool.code : 'Requests'} back={back} width="full" testID="request-form">
        <View style={styles.split}>
          <View style={styles.formCol}>
            {statusBlock}
            {changeFields}
            {imageFields}
            {itemFields}
            {movedFields}
            {saveBar}
          </View>
          <View style={styles.panelCol}>
            <View style={[styles.sticky, stickyWeb]}>
              <Card style={styles.card}>
                <AppText variant="heading" role="heading" aria-level={2}>
                  What the change ends
                </AppText>
                {impactBlock}
              </Card>
              <SaveStatus state={draft.state} isNew={isNew} onRetry={draft.retryNow} testID="request-save-state-side" />
            </View>
          </View>
        </View>
      </Screen>
    );
  }
  return (
    <Screen title={title} eyebrow={request ? request.tool.code : 'Requests'} back={back} width="content" testID="request-form">
      {statusBlock}
      {impact?.irreversible ? <IrreversibleBanner toolCode={v.tool?.code ?? ''} ended={impact.endedProducts} removesSteel={impact.removesSteel} testID="request-form-banner" /> : null}
      {changeFields}
      {imageFields}
      {itemFields}
      {movedFields}
      <Section title="What the change ends">
        <Card style={styles.card}>{impactBlock}</Card>
      </Section>
      {saveBar}
    </Screen>
  );
}

const fieldNames: Record<string, string> = {
  tool: 'the tool',
  title: 'the title',
  reason: 'the reason',
  derivative: 'the product',
  newDerivative: 'the new product',
  targetDate: 'the target date',
  movedProductIds: 'the moved products',
};

/** "the title and cut item 2", from Formik's errors. */
function errorSummary(errors: Record<string, unknown>): string {
  const names: string[] = [];
  for (const [key, value] of Object.entries(errors)) {
    if (key === 'items' && Array.isArray(value)) value.forEach((e, i) => e && names.push(`cut item ${i + 1}`));
    else if (key === 'items') names.push('the cut items');
    else names.push(fieldNames[key] ?? key);
  }
  if (names.length <= 1) return names[0] ?? 'the form';
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** What the person had typed when they loaded someone else's version: kept in sight to copy from. */
function UnsentCopy({ values, onDismiss }: { values: RequestFormValues; onDismiss: () => void }) {
  return (
    <Card accent="due" testID="request-unsent-copy">
      <AppText variant="bodyStrong">Your text that was not sent</AppText>
      <AppText variant="small">The form now shows the saved version. Copy anything you still need from here.</AppText>
      <AppText variant="label">Title</AppText>
      <AppText variant="body" selectable>
        {values.title || '—'}
      </AppText>
      {values.reason ? (
        <>
          <AppText variant="label">Why</AppText>
          <AppText variant="body" selectable>
            {values.reason}
          </AppText>
        </>
      ) : null}
      {values.items.map((i, n) =>
        i.note || i.size ? (
          <View key={i.key}>
            <AppText variant="label">Cut item {n + 1}</AppText>
            <AppText variant="body" selectable>
              {[i.size ? `${i.size} ${i.unit}` : '', i.note].filter(Boolean).join(' · ')}
            </AppText>
          </View>
        ) : null,
      )}
      <Button title="Hide my old text" variant="quiet" onPress={onDismiss} testID="request-unsent-dismiss" />
    </Card>
  );
}

const styles = StyleSheet.create({
  notices: { gap: space.md },
  card: { gap: space.xs, padding: space.lg },
  twoCols: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md },
  skuCol: { flexBasis: 160, flexGrow: 1 },
  nameCol: { flexBasis: 220, flexGrow: 2 },
  impact: { gap: space.lg },
  saveBar: { gap: space.sm, padding: space.lg, borderColor: colors.steel },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  split: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xl, width: '100%', maxWidth: 1240, alignSelf: 'center' },
  formCol: { flex: 3, minWidth: 0, gap: space.lg, maxWidth: 720 },
  panelCol: { flex: 2, minWidth: 340, maxWidth: 460, alignSelf: 'stretch' },
  sticky: { gap: space.sm },
});

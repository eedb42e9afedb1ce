import { useMemo, useState } from 'react';
import { router } from 'expo-router';
import { Formik, type FormikHelpers } from 'formik';
import { StyleSheet, View } from 'react-native';
import type { Tool } from '@shared/schemas/registry';
import { ApiError, applyServerErrors, isApiError } from '@/api/errors';
import { AppText } from '@/components/ui/app-text';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Screen } from '@/components/ui/screen';
import { space } from '@/theme';
import { ToolFields } from '../components/tool-fields';
import {
  emptyToolForm,
  toCreateToolPayload,
  toolCreateFormSchema,
  toolEditFormSchema,
  toolFormFrom,
  toolServerFieldMap,
  toUpdateToolPayload,
  type ToolFormValues,
} from '../forms';
import { useCanEditRegistry, useCreateTool, useTool, useUpdateTool } from '../hooks';
import { markToolSaved } from '../saved-flash';
import { useEditSnapshot } from '@/lib/use-edit-snapshot';

const formFields = Object.keys(emptyToolForm);

/** Server field errors onto the form's fields (buildCostCents -> buildCost), the rest into the status. */
function applyToolErrors(e: unknown, helpers: FormikHelpers<ToolFormValues>) {
  if (isApiError(e) && e.fieldErrors) {
    const mapped = Object.fromEntries(Object.entries(e.fieldErrors).map(([k, v]) => [toolServerFieldMap[k] ?? k, v]));
    return applyServerErrors(new ApiError(e.status, e.code, e.message, mapped), formFields, helpers);
  }
  applyServerErrors(e, formFields, helpers);
}

function NotForYou({ title }: { title: string }) {
  return (
    <Screen title={title} back={{ href: '/tools', label: 'Tools' }}>
      <Banner kind="info" icon="lock" title="Only tooling engineers and administrators edit the register" message="Ask the tooling engineer to make the change." />
    </Screen>
  );
}

export function ToolEditScreen({ toolId }: { toolId: string }) {
  const canEdit = useCanEditRegistry();
  const tool = useTool(toolId);
  const { snapshot, reloading, reload } = useEditSnapshot(tool);
  if (!canEdit) return <NotForYou title="Edit tool" />;
  if (tool.isError && !snapshot) {
    return (
      <Screen title="Edit tool" back={{ href: '/tools', label: 'Tools' }}>
        <ErrorState error={tool.error} onRetry={() => void tool.refetch()} />
      </Screen>
    );
  }
  if (!snapshot) return <Loading fill label="Loading tool…" />;
  return <ToolEditForm key={snapshot.version} tool={snapshot} onReload={() => void reload()} reloading={reloading} />;
}

function ToolEditForm({ tool, onReload, reloading }: { tool: Tool; onReload: () => void; reloading: boolean }) {
  const update = useUpdateTool(tool.id);
  const [stale, setStale] = useState(false);
  const initial = useMemo(() => toolFormFrom(tool), [tool]);
  const detail = { pathname: '/tools/[id]' as const, params: { id: tool.id } };
  const leave = () => (router.canGoBack() ? router.back() : router.replace(detail));

  if (tool.readOnly) {
    return (
      <Screen title={`Edit ${tool.code}`} back={{ href: detail, label: tool.name }}>
        <Banner kind="info" icon="lock" title="Disposed: this record is read-only" message="A scrapped or sold tool stays on record as it was and cannot be edited." />
      </Screen>
    );
  }

  return (
    <Screen eyebrow={tool.code} title="Edit tool" back={{ href: detail, label: tool.name }} width="content" testID="tool-edit-screen">
      <Formik
        initialValues={initial}
        validationSchema={toolEditFormSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          try {
            await update.mutateAsync(toUpdateToolPayload(initial, values, tool.version));
            markToolSaved(tool.id);
            leave();
          } catch (e) {
            if (isApiError(e) && e.code === 'stale_version') return setStale(true);
            applyToolErrors(e, helpers);
          }
        }}
      >
        {(f) => (
          <View style={styles.form}>
            {stale ? (
              <Banner kind="due" title="Someone else changed this tool" testID="tool-edit-stale">
                <AppText variant="body">Your changes were not saved. Reload to see the current version, then make your changes again.</AppText>
                <Button title="Reload the tool" icon="refresh" variant="secondary" busy={reloading} onPress={onReload} testID="tool-edit-reload" />
              </Banner>
            ) : null}
            {typeof f.status === 'string' ? <Banner kind="due" title="Not saved" message={f.status} testID="tool-edit-error" /> : null}
            <ToolFields f={f} mode="edit" />
            {f.submitCount > 0 && !f.isValid ? <Banner kind="due" message="Some fields need attention: see the messages above." /> : null}
            <View style={styles.buttons}>
              <Button title="Save changes" icon="check" busy={f.isSubmitting} busyTitle="Saving…" disabled={!f.dirty || stale} onPress={() => f.handleSubmit()} testID="tool-edit-save" />
              <Button title="Cancel" variant="secondary" onPress={leave} />
            </View>
          </View>
        )}
      </Formik>
    </Screen>
  );
}

export function ToolCreateScreen() {
  const canEdit = useCanEditRegistry();
  const create = useCreateTool();
  if (!canEdit) return <NotForYou title="New tool" />;
  return (
    <Screen eyebrow="Tools" title="New tool" back={{ href: '/tools', label: 'Tools' }} width="content" testID="tool-create-screen">
      <Formik
        initialValues={emptyToolForm}
        validationSchema={toolCreateFormSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          try {
            const tool = await create.mutateAsync(toCreateToolPayload(values));
            router.replace({ pathname: '/tools/[id]', params: { id: tool.id } });
          } catch (e) {
            applyToolErrors(e, helpers);
          }
        }}
      >
        {(f) => (
          <View style={styles.form}>
            {typeof f.status === 'string' ? <Banner kind="due" title="Not saved" message={f.status} testID="tool-create-error" /> : null}
            <ToolFields f={f} mode="create" />
            {f.submitCount > 0 && !f.isValid ? <Banner kind="due" message="Some fields need attention: see the messages above." /> : null}
            <View style={styles.buttons}>
              <Button title="Add tool" icon="plus" busy={f.isSubmitting} busyTitle="Adding…" onPress={() => f.handleSubmit()} testID="tool-create-save" />
              <Button title="Cancel" variant="secondary" onPress={() => (router.canGoBack() ? router.back() : router.replace('/tools'))} />
            </View>
          </View>
        )}
      </Formik>
    </Screen>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.lg },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
